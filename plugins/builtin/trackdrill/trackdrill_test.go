package trackdrill

import (
	"context"
	"testing"

	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
)

var base = sdk.Site{Method: sdk.Boring, DepthFt: 40, Surface: sdk.Firm}

func TestFeasibility(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.Feasibility(t, r, base, []rigtest.Case{
		rigtest.C("firm", func(*sdk.Site) {}, ""),
		// Tracks spread the load (common practice).
		rigtest.C("wet ground", func(s *sdk.Site) { s.Surface = sdk.Wet }, ""),
		rigtest.C("soft ground", func(s *sdk.Site) { s.Surface = sdk.Soft }, ""),
		rigtest.C("slope at limit", func(s *sdk.Site) { s.SlopePct = 30 }, ""),
		rigtest.C("slope over limit", func(s *sdk.Site) { s.SlopePct = 35 }, "slope 35 % is steeper than the 30 %"),
		rigtest.C("clearance for mast", func(s *sdk.Site) { s.OverheadFt = 22 }, ""),
		rigtest.C("clearance under mast", func(s *sdk.Site) { s.OverheadFt = 21 }, "overhead clearance 21 ft is less than the 22 ft"),
		rigtest.C("method not performed", func(s *sdk.Site) { s.Method = sdk.Probe }, `track-drill does not perform "probe"`),
		rigtest.C("depth limit", func(s *sdk.Site) { s.DepthFt = 151 }, "depth 151 ft is beyond the 150 ft"),
	})
}

func TestQuantities(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "B-1", Method: sdk.Boring, DepthFt: 75, Surface: sdk.Soft, Environmental: true})[0]
	// 75 ft: 50 in 0–50, 25 in 50–100 (plain arithmetic); samples by the
	// default schedule, every 2.5 ft to 10 ft then every 5 ft (common
	// practice): 2.5, 5, 7.5, 10, 15 … 75 = 4 + 13 = 17; grout the full depth.
	for item, want := range map[string]float64{"drill-0-50": 50, "drill-50-100": 25, "spt-sample": 17, "grout-boring": 75} {
		if got, _ := rigtest.Amount(a.Quantities, item); got != want {
			t.Errorf("%s = %g, want %g", item, got, want)
		}
	}
	if d, _ := rigtest.Amount(a.Quantities, "idw-drum"); d < 2 {
		t.Errorf("environmental 75-ft boring: %g drums, want cuttings drums plus decontamination water", d)
	}
}

func TestHoursGrowWithDepth(t *testing.T) {
	r := rigtest.Serve(t, New())
	s := base
	s.Surface = sdk.Wet
	rigtest.HoursGrow(t, r, s, []float64{3, 10, 30, 50, 51, 99, 101, 150})
}

func TestMobilize(t *testing.T) {
	r := rigtest.Serve(t, New())
	m, err := r.Mobilize(context.Background(), sdk.MobilizeRequest{DistanceMi: 20})
	if err != nil {
		t.Fatal(err)
	}
	if n, _ := rigtest.Amount(m.Quantities, "mob-track-rig"); n != 1 {
		t.Errorf("mob-track-rig = %g, want 1", n)
	}
	if _, ok := rigtest.Amount(m.Quantities, "mob-mileage"); ok {
		t.Error("mob-mileage reported within the first 50 mi")
	}
	// Two trips of 20 mi at 40 mph plus 1 h of loading and unloading each.
	if m.Hours != 3 {
		t.Errorf("mobilize hours %g, want 3", m.Hours)
	}
}
