package tiredrill

import (
	"context"
	"math"
	"testing"

	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
)

var base = sdk.Site{Method: sdk.Boring, DepthFt: 30, Surface: sdk.Firm}

func TestFeasibility(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.Feasibility(t, r, base, []rigtest.Case{
		rigtest.C("firm flat", func(*sdk.Site) {}, ""),
		// A drill truck bogs on wet or soft ground (common practice).
		rigtest.C("wet ground", func(s *sdk.Site) { s.Surface = sdk.Wet }, "wet ground: tire-drill works only on firm ground"),
		rigtest.C("soft ground", func(s *sdk.Site) { s.Surface = sdk.Soft }, "soft ground"),
		rigtest.C("slope at limit", func(s *sdk.Site) { s.SlopePct = 10 }, ""),
		rigtest.C("slope over limit", func(s *sdk.Site) { s.SlopePct = 11 }, "slope 11 % is steeper than the 10 %"),
		rigtest.C("clearance for mast", func(s *sdk.Site) { s.OverheadFt = 25 }, ""),
		rigtest.C("clearance under mast", func(s *sdk.Site) { s.OverheadFt = 20 }, "overhead clearance 20 ft is less than the 25 ft"),
		rigtest.C("method not performed", func(s *sdk.Site) { s.Method = sdk.CPT }, `tire-drill does not perform "cpt"`),
		rigtest.C("test pit not performed", func(s *sdk.Site) { s.Method = sdk.TestPit }, `does not perform "test_pit"`),
		rigtest.C("depth at limit", func(s *sdk.Site) { s.DepthFt = 150 }, ""),
		rigtest.C("depth limit", func(s *sdk.Site) { s.DepthFt = 160 }, "depth 160 ft is beyond the 150 ft"),
		rigtest.C("rock above bottom is cored", func(s *sdk.Site) { s.RockFt = 20 }, ""),
	})
}

func TestQuantities(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r,
		sdk.Site{ID: "B-60", Method: sdk.Boring, DepthFt: 60, Surface: sdk.Firm},
		sdk.Site{ID: "B-120", Method: sdk.Boring, DepthFt: 120, Surface: sdk.Firm, SampleIntervalFt: 10},
		sdk.Site{ID: "B-rock", Method: sdk.Boring, DepthFt: 60, RockFt: 40, Surface: sdk.Firm},
		sdk.Site{ID: "B-cont", Method: sdk.Boring, DepthFt: 20, SampleIntervalFt: 2, Surface: sdk.Firm},
	)
	// Band split is plain arithmetic. Sample counts: with no interval, the
	// default schedule, every 2.5 ft to 10 ft then every 5 ft (common
	// practice; ASTM D1586 sets no interval); with an interval, 2.5, 5,
	// then every interval (the 2.5-ft sample is common practice).
	tests := []struct {
		answer int
		item   string
		want   float64
	}{
		{0, "drill-0-50", 50}, {0, "drill-50-100", 10}, {0, "drill-100-150", 0},
		{0, "spt-sample", 14}, // 2.5, 5, 7.5, 10, 15 … 60
		{0, "grout-boring", 60},
		{0, "rock-core", 0},
		{0, "idw-drum", 0}, // not an environmental site
		{1, "drill-0-50", 50}, {1, "drill-50-100", 50}, {1, "drill-100-150", 20},
		{1, "spt-sample", 13}, // 2.5, 5, then 15, 25 … 115 (11)
		{1, "grout-boring", 120},
		// Rock at 40 ft: 40 ft of auger in the 0–50 band, 20 ft of core,
		// samples in soil only (2.5, 5, 7.5, 10, 15 … 40 = 10), grout the
		// full hole.
		{2, "drill-0-50", 40}, {2, "drill-50-100", 0}, {2, "rock-core", 20},
		{2, "spt-sample", 10}, {2, "grout-boring", 60},
		// Continuous sampling, 24-in barrels: every 2 ft to 20 ft = 10.
		{3, "spt-sample", 10},
	}
	for _, tc := range tests {
		got, _ := rigtest.Amount(a[tc.answer].Quantities, tc.item)
		if got != tc.want {
			t.Errorf("%s: %s = %g, want %g", a[tc.answer].ID, tc.item, got, tc.want)
		}
	}
	if a[2].Hours.Advance <= a[0].Hours.Advance {
		t.Errorf("coring 20 ft of rock (%g h) should take longer than augering it (%g h)", a[2].Hours.Advance, a[0].Hours.Advance)
	}
}

func TestHoursGrowWithDepth(t *testing.T) {
	r := rigtest.Serve(t, New())
	rigtest.HoursGrow(t, r, base, []float64{5, 10, 25, 50, 60, 100, 120, 150})
}

// USACE ETL 1110-1-171 (1996): about two 25-ft sampled hollow-stem borings
// a day on environmental work. With a 100-ft move to the next boring, a
// field day of 8 to 10 h (common practice) should hold between 1.5 and 2.5
// such borings.
func TestTwoSampledBoringsADay(t *testing.T) {
	r := rigtest.Serve(t, New())
	a := rigtest.Assess(t, r, sdk.Site{ID: "env", Method: sdk.Boring, DepthFt: 25, Surface: sdk.Firm, Environmental: true})[0]
	mv, err := r.Moves(context.Background(), sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 100, Surface: sdk.Firm}}})
	if err != nil {
		t.Fatal(err)
	}
	perBoring := a.Hours.Total() + mv.Hours[0]
	for _, day := range []float64{8, 10} {
		if n := day / perBoring; n < 1.5 || n > 2.5 {
			t.Errorf("%g-h day: %.2f borings of %.2f h, want about two (USACE ETL 1110-1-171)", day, n, perBoring)
		}
	}
	// Environmental: drums of cuttings (25 ft × 0.371 ft³/ft × 1.25 bulking
	// = 11.6 ft³ → 2 drums at 6.6 ft³) plus one of decontamination water.
	if d, _ := rigtest.Amount(a.Quantities, "idw-drum"); d != 3 {
		t.Errorf("idw-drum = %g, want 3", d)
	}
}

func TestMobilizeAndMoves(t *testing.T) {
	r := rigtest.Serve(t, New())
	ctx := context.Background()
	m, err := r.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 90})
	if err != nil {
		t.Fatal(err)
	}
	if n, _ := rigtest.Amount(m.Quantities, "mob-tire-rig"); n != 1 {
		t.Errorf("mob-tire-rig = %g, want 1", n)
	}
	// 90 mi one way: 40 mi beyond the first 50, both ways (items.md).
	if n, _ := rigtest.Amount(m.Quantities, "mob-mileage"); n != 80 {
		t.Errorf("mob-mileage = %g, want 80", n)
	}
	// Two trips of 90 mi at 45 mph plus 0.5 h at each end of each.
	if math.Abs(m.Hours-(2*2+2*0.5)) > 1e-9 {
		t.Errorf("mobilize hours %g, want 5", m.Hours)
	}
	mv, err := r.Moves(ctx, sdk.MovesRequest{Legs: []sdk.MoveLeg{
		{DistanceFt: 400, Surface: sdk.Firm}, {DistanceFt: 400, Surface: sdk.Wet}, {DistanceFt: 400, Surface: sdk.Firm, SlopePct: 5},
	}})
	if err != nil {
		t.Fatal(err)
	}
	if !(mv.Hours[0] > 0 && mv.Hours[1] > mv.Hours[0] && mv.Hours[2] > mv.Hours[0]) {
		t.Errorf("moves %v: wet and sloping legs should take longer than firm level", mv.Hours)
	}
}
