package main

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
)

func TestHandCrewThroughHarness(t *testing.T) {
	r := sdk.TestRig(t, handCrew{})
	ctx := context.Background()
	if _, err := r.Describe(ctx); err != nil {
		t.Fatal(err)
	}
	resp, err := r.Assess(ctx, sdk.AssessRequest{Sites: []sdk.Site{
		{ID: "HA-1", Method: sdk.Boring, DepthFt: 8, Surface: sdk.Soft, SlopePct: 35},
		{ID: "DCP-1", Method: sdk.Probe, DepthFt: 3, Surface: sdk.Wet},
		{ID: "HA-deep", Method: sdk.Boring, DepthFt: 12},
		{ID: "DCP-deep", Method: sdk.Probe, DepthFt: 7},
		{ID: "CPT", Method: sdk.CPT, DepthFt: 5},
		{ID: "steep", Method: sdk.Probe, DepthFt: 3, SlopePct: 45},
	}})
	if err != nil {
		t.Fatal(err)
	}
	a := resp.Answers
	if !a[0].Feasible || a[0].Quantities[0].Item != "hand-auger" || a[0].Quantities[0].Amount != 8 {
		t.Errorf("8-ft hand auger: %+v", a[0])
	}
	if !a[1].Feasible || a[1].Quantities[0].Item != "dcp-probe" || a[1].Quantities[0].Amount != 1 {
		t.Errorf("DCP: %+v", a[1])
	}
	for i, want := range map[int]string{2: "beyond the 10 ft", 3: "beyond the 6 ft", 4: `does not perform "cpt"`, 5: "slope 45 %"} {
		if a[i].Feasible || !strings.Contains(a[i].Reason, want) {
			t.Errorf("%s: feasible=%v reason %q, want %q", a[i].ID, a[i].Feasible, a[i].Reason, want)
		}
	}
	m, err := r.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 70})
	if err != nil || len(m.Quantities) != 2 || m.Quantities[1].Amount != 40 {
		t.Errorf("mobilize 70 mi: %+v %v; want 40 mi of mob-mileage (20 beyond 50, round trip)", m, err)
	}
}
