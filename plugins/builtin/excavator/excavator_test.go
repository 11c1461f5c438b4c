package excavator

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
)

var base = sdk.Site{Method: sdk.TestPit, DepthFt: 8, Surface: sdk.Firm}

func TestFeasibility(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.Feasibility(t, r, base, []rigtest.Case{
		rigtest.C("firm", func(*sdk.Site) {}, ""),
		rigtest.C("wet", func(s *sdk.Site) { s.Surface = sdk.Wet }, ""),
		rigtest.C("soft", func(s *sdk.Site) { s.Surface = sdk.Soft }, "soft ground: excavator works only on firm or wet ground"),
		rigtest.C("slope at limit", func(s *sdk.Site) { s.SlopePct = 20 }, ""),
		rigtest.C("slope over limit", func(s *sdk.Site) { s.SlopePct = 25 }, "slope 25 % is steeper than the 20 %"),
		rigtest.C("clearance short", func(s *sdk.Site) { s.OverheadFt = 12 }, "overhead clearance 12 ft is less than the 16 ft"),
		// A pit stops at groundwater (common practice).
		rigtest.C("pit to groundwater", func(s *sdk.Site) { s.GroundwaterFt = 8 }, ""),
		rigtest.C("pit below groundwater", func(s *sdk.Site) { s.GroundwaterFt = 6 }, "groundwater at 6 ft: a test pit stops at groundwater"),
		rigtest.C("pit into rock", func(s *sdk.Site) { s.RockFt = 5 }, "rock at 5 ft"),
		// Reach about 14 ft: between a backhoe's 2.5 m and a large
		// excavator's 5 m (published practice note).
		rigtest.C("reach", func(s *sdk.Site) { s.DepthFt = 14 }, ""),
		rigtest.C("beyond reach", func(s *sdk.Site) { s.DepthFt = 16 }, "depth 16 ft is beyond the 14 ft"),
		rigtest.C("method not performed", func(s *sdk.Site) { s.Method = sdk.Boring }, `excavator does not perform "boring"`),
	})
	if Info.Methods[0].MaxDepthFt < 2.5/0.3048 || Info.Methods[0].MaxDepthFt > 5/0.3048 {
		t.Errorf("pit depth %g ft outside 2.5–5 m (published practice note on test pit reach)", Info.Methods[0].MaxDepthFt)
	}
}

func TestProtection(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r,
		sdk.Site{ID: "shallow", Method: sdk.TestPit, DepthFt: 4.5, Surface: sdk.Firm},
		sdk.Site{ID: "five", Method: sdk.TestPit, DepthFt: 5, Surface: sdk.Firm},
		sdk.Site{ID: "deep", Method: sdk.TestPit, DepthFt: 12, Surface: sdk.Firm, Environmental: true},
	)
	// OSHA 29 CFR 1926.652(a)(1): a protective system from 5 ft deep.
	for i, want := range []float64{0, 1, 1} {
		if got, _ := rigtest.Amount(a[i].Quantities, "pit-protection"); got != want {
			t.Errorf("%s: pit-protection %g, want %g", a[i].ID, got, want)
		}
	}
	for _, ans := range a {
		if got, _ := rigtest.Amount(ans.Quantities, "pit-excavation"); got != ans.Hours.Total() {
			t.Errorf("%s: pit-excavation %g hr, want the %g hours on the point", ans.ID, got, ans.Hours.Total())
		}
	}
	if d, _ := rigtest.Amount(a[2].Quantities, "idw-drum"); d != 1 {
		t.Errorf("environmental pit: idw-drum %g, want 1", d)
	}
	if _, ok := rigtest.Amount(a[1].Quantities, "idw-drum"); ok {
		t.Error("idw-drum on a site that is not environmental")
	}
}

// TestSafetyPerPit: OSHA 29 CFR 1926.652(a)(1) asks for a protective
// system from 5 ft unless in stable rock; 1926.651(c)(2) a means of egress
// from 4 ft. Nobody enters a pit deeper than 4 ft without bracing or
// benching and a ladder (common practice). The protective system is one
// per pit whatever its depth, described with its OSHA clause.
func TestSafetyPerPit(t *testing.T) {
	r := rigtest.Serve(t, New())
	tests := []struct {
		depthFt    float64
		protection float64
		egress     bool
	}{
		{3.9, 0, false},
		{4, 0, true}, // 1926.651(c)(2): 4 ft or more
		{4.9, 0, true},
		{5, 1, true}, // 1926.652(a)(1): from 5 ft
		{9, 1, true},
		{14, 1, true}, // still one per pit at the rig's reach
	}
	var sites []sdk.Site
	for _, tc := range tests {
		sites = append(sites, sdk.Site{ID: "p", Method: sdk.TestPit, DepthFt: tc.depthFt, Surface: sdk.Firm})
	}
	answers := rigtest.Assess(t, r, sites...)
	for i, tc := range tests {
		a := answers[i]
		got, _ := rigtest.Amount(a.Quantities, "pit-protection")
		if got != tc.protection {
			t.Errorf("%g-ft pit: pit-protection %g, want %g", tc.depthFt, got, tc.protection)
		}
		for _, q := range a.Quantities {
			switch q.Item {
			case "pit-protection":
				if q.Unit != "each" || !strings.Contains(q.Note, "29 CFR 1926.652(a)(1)") {
					t.Errorf("%g-ft pit: protection %+v, want each, described with 1926.652(a)(1)", tc.depthFt, q)
				}
			case "pit-excavation":
				if has := strings.Contains(q.Note, "1926.651(c)(2)"); has != tc.egress {
					t.Errorf("%g-ft pit: egress in note %v, want %v (%q)", tc.depthFt, has, tc.egress, q.Note)
				}
			}
		}
	}
	if EgressDepthFt != 4 || ProtectionDepthFt != 5 {
		t.Errorf("egress from %g ft, protection from %g ft; OSHA 1926.651(c)(2) and 1926.652(a)(1) give 4 and 5", EgressDepthFt, ProtectionDepthFt)
	}
}

// TestBagSamplesMatchLab checks that the lab allowance counts a pit's bag
// samples as this rig takes them (optimizer/lab.PitBagSamples mirrors the
// rule, so the plan can count them without asking the rig).
func TestBagSamplesMatchLab(t *testing.T) {
	for _, interval := range []float64{0, 1, 2, 2.5, 3, 5, 7.5, 10} {
		for d := 0.5; d <= 14; d += 0.25 {
			if got, want := BagSamples(d, interval), lab.PitBagSamples(d, interval); got != want {
				t.Errorf("%g-ft pit every %g ft: excavator %d bag samples, lab counts %d", d, interval, got, want)
			}
		}
	}
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "p", Method: sdk.TestPit, DepthFt: 12, Surface: sdk.Firm})[0]
	// 2.5, 5, 10 ft (the default interval of 5 ft).
	if q := a.Quantities[0]; !strings.Contains(q.Note, "(3 bag samples)") {
		t.Errorf("12-ft pit note %q, want 3 bag samples", q.Note)
	}
}

func TestHoursGrowWithDepth(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.HoursGrow(t, r, base, []float64{2, 4, 4.9, 5, 8, 10, 14})
}

func TestMobilize(t *testing.T) {
	r := rigtest.Serve(t, New())
	m, err := r.Mobilize(context.Background(), sdk.MobilizeRequest{DistanceMi: 60})
	if err != nil {
		t.Fatal(err)
	}
	if n, _ := rigtest.Amount(m.Quantities, "mob-excavator"); n != 1 {
		t.Errorf("mob-excavator = %g", n)
	}
	if n, _ := rigtest.Amount(m.Quantities, "mob-mileage"); n != 20 {
		t.Errorf("mob-mileage = %g, want 20 (10 mi beyond 50, both ways)", n)
	}
}
