package cptrig

import (
	"context"
	"math"
	"testing"

	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
)

var base = sdk.Site{Method: sdk.CPT, DepthFt: 50, Surface: sdk.Firm}

func TestFeasibility(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.Feasibility(t, r, base, []rigtest.Case{
		rigtest.C("firm", func(*sdk.Site) {}, ""),
		rigtest.C("wet", func(s *sdk.Site) { s.Surface = sdk.Wet }, "wet ground: cpt-rig works only on firm ground"),
		rigtest.C("slope at limit", func(s *sdk.Site) { s.SlopePct = 8 }, ""),
		rigtest.C("slope over limit", func(s *sdk.Site) { s.SlopePct = 9 }, "slope 9 % is steeper than the 8 %"),
		rigtest.C("clearance short", func(s *sdk.Site) { s.OverheadFt = 10 }, "overhead clearance 10 ft is less than the 12 ft"),
		// A cone cannot be pushed into rock: refusal (ASTM D5778 ends a
		// sounding at refusal; common practice).
		rigtest.C("rock below the bottom", func(s *sdk.Site) { s.RockFt = 60 }, ""),
		rigtest.C("rock at the bottom", func(s *sdk.Site) { s.RockFt = 50 }, ""),
		rigtest.C("refusal at rock", func(s *sdk.Site) { s.RockFt = 30 }, "rock at 30 ft: the cone meets refusal"),
		rigtest.C("groundwater does not matter", func(s *sdk.Site) { s.GroundwaterFt = 5 }, ""),
		rigtest.C("depth at limit", func(s *sdk.Site) { s.DepthFt = 100 }, ""),
		rigtest.C("depth limit", func(s *sdk.Site) { s.DepthFt = 110 }, "depth 110 ft is beyond the 100 ft"),
		rigtest.C("method not performed", func(s *sdk.Site) { s.Method = sdk.Boring }, `cpt-rig does not perform "boring"`),
	})
}

func TestQuantities(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "C-1", Method: sdk.CPT, DepthFt: 65, Surface: sdk.Firm, Environmental: true})[0]
	for item, want := range map[string]float64{"cpt-sounding": 65, "grout-boring": 65, "idw-drum": 1} {
		if got, _ := rigtest.Amount(a.Quantities, item); got != want {
			t.Errorf("%s = %g, want %g", item, got, want)
		}
	}
	if _, ok := rigtest.Amount(a.Quantities, "spt-sample"); ok {
		t.Error("a CPT sounding reports split-barrel samples")
	}
}

func TestPushRate(t *testing.T) {
	// ASTM D5778: 20 mm/s = 72 m/h = 236.2 ft/h.
	if math.Abs(PushFtPerHr-236.22) > 0.01 {
		t.Errorf("PushFtPerHr = %g, want 236.22", PushFtPerHr)
	}
	// Pushing alone can be no faster than the standard rate.
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "C", Method: sdk.CPT, DepthFt: 100, Surface: sdk.Firm})[0]
	if a.Hours.Advance < 100/PushFtPerHr {
		t.Errorf("advance %g h for 100 ft, faster than 20 mm/s", a.Hours.Advance)
	}
}

// Robertson's CPT notes: a 20–25 t truck does 600–800 ft a day. Check with
// 100-ft soundings 200 ft apart over a 10-h field day (common practice).
func TestDailyProduction(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "C", Method: sdk.CPT, DepthFt: 100, Surface: sdk.Firm})[0]
	mv, err := r.Moves(context.Background(), sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 200, Surface: sdk.Firm}}})
	if err != nil {
		t.Fatal(err)
	}
	perSounding := a.Hours.Total() + mv.Hours[0]
	ftPerDay := 10 / perSounding * 100
	if ftPerDay < 600 || ftPerDay > 800 {
		t.Errorf("%.0f ft a 10-h day (%.2f h a sounding), want 600–800 (Robertson)", ftPerDay, perSounding)
	}
}

func TestHoursGrowWithDepth(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.HoursGrow(t, r, base, []float64{5, 20, 50, 80, 100})
}
