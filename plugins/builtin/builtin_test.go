package builtin

import (
	"context"
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/rules"
	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
)

func TestNames(t *testing.T) {
	want := []string{"cpt-rig", "excavator", "tire-drill", "track-drill"} // items.md
	if got := Names(); !reflect.DeepEqual(got, want) {
		t.Errorf("Names() = %v, want %v", got, want)
	}
	for _, n := range want {
		r, err := New(n)
		if err != nil {
			t.Fatal(err)
		}
		info, err := rigtest.Serve(t, r).Describe(context.Background())
		if err != nil {
			t.Fatal(err)
		}
		if info.Name != n {
			t.Errorf("New(%q) describes itself as %q", n, info.Name)
		}
		if err := sdk.CheckInfo(info); err != nil {
			t.Error(err)
		}
	}
	if _, err := New("drill"); err == nil || !strings.Contains(err.Error(), "tire-drill") {
		t.Errorf("New(unknown): error %v, want one listing the built-in rigs", err)
	}
	if err := Serve("no-such-rig"); err == nil {
		t.Error("Serve(unknown) returned nil")
	}
}

// The brief's trade facts, compared between rigs (common practice): the
// tire rig sets up and moves faster than the track rig, and mobilizes
// quicker; the track rig reaches ground the tire rig cannot.
func TestTireAgainstTrack(t *testing.T) {
	ctx := context.Background()
	tire, _ := New("tire-drill")
	track, _ := New("track-drill")
	tire, track = rigtest.Serve(t, tire), rigtest.Serve(t, track)
	site := sdk.Site{ID: "B", Method: sdk.Boring, DepthFt: 40, Surface: sdk.Firm}
	a1 := rigtest.Assess(t, tire, site)[0]
	a2 := rigtest.Assess(t, track, site)[0]
	if !(a1.Hours.Total() < a2.Hours.Total()) {
		t.Errorf("tire rig %g h on a point, track rig %g h: want the tire rig quicker", a1.Hours.Total(), a2.Hours.Total())
	}
	legs := sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 500, Surface: sdk.Firm}}}
	m1, _ := tire.Moves(ctx, legs)
	m2, _ := track.Moves(ctx, legs)
	if !(m1.Hours[0] < m2.Hours[0]) {
		t.Errorf("moves: tire %v, track %v; want tire faster", m1.Hours, m2.Hours)
	}
	mob1, _ := tire.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 30})
	mob2, _ := track.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 30})
	if !(mob1.Hours < mob2.Hours) {
		t.Errorf("mobilize: tire %g h, track %g h; want tire quicker", mob1.Hours, mob2.Hours)
	}
	soft := site
	soft.Surface = sdk.Soft
	if rigtest.Assess(t, tire, soft)[0].Feasible || !rigtest.Assess(t, track, soft)[0].Feasible {
		t.Error("soft ground: want the track rig only")
	}
	// On wet open ground a tire-mounted rig bogs down, so a track-mounted
	// rig is sent (common practice).
	wet := site
	wet.Surface = sdk.Wet
	if a := rigtest.Assess(t, tire, wet)[0]; a.Feasible || !strings.Contains(a.Reason, "wet ground") {
		t.Errorf("wet ground: tire rig %+v, want it refused for wet ground", a)
	}
	if !rigtest.Assess(t, track, wet)[0].Feasible {
		t.Error("wet ground: the track rig refused it")
	}
	// The track rig is slower but climbs slopes the tire rig cannot
	// (common practice).
	steep := site
	steep.SlopePct = 20
	if rigtest.Assess(t, tire, steep)[0].Feasible || !rigtest.Assess(t, track, steep)[0].Feasible {
		t.Error("20 % slope: want the track rig only")
	}
}

// TestDepthIntoRock: a rule that asks for depth into rock (to rock plus a
// core length, common practice; rules.ToRockDepth) is met by coring the
// rock part of a boring (ASTM D2113); a CPT meets refusal at rock and a
// pit cannot be dug into it.
func TestDepthIntoRock(t *testing.T) {
	depth, _, err := rules.ToRockDepth(30, 10)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		rig      string
		method   sdk.Method
		feasible bool
		why      string
	}{
		{"tire-drill", sdk.Boring, true, ""},
		{"track-drill", sdk.Boring, true, ""},
		{"cpt-rig", sdk.CPT, false, "refusal"},
		{"excavator", sdk.TestPit, false, "cannot dig rock"},
	} {
		r, _ := New(tc.rig)
		r = rigtest.Serve(t, r)
		d := depth
		if tc.method == sdk.TestPit {
			d = 8 // within the excavator's reach, below rock at 5 ft
		}
		rock := 30.0
		if tc.method == sdk.TestPit {
			rock = 5
		}
		a := rigtest.Assess(t, r, sdk.Site{ID: "R", Method: tc.method, DepthFt: d, RockFt: rock, Surface: sdk.Firm})[0]
		if a.Feasible != tc.feasible || !strings.Contains(a.Reason, tc.why) {
			t.Errorf("%s: feasible %v (%q), want %v (%q)", tc.rig, a.Feasible, a.Reason, tc.feasible, tc.why)
			continue
		}
		if !a.Feasible {
			continue
		}
		core, _ := rigtest.Amount(a.Quantities, "rock-core")
		soil, _ := rigtest.Amount(a.Quantities, "drill-0-50")
		if core != 10 || soil != 30 {
			t.Errorf("%s: %g ft of soil drilling and %g ft of core, want 30 and 10", tc.rig, soil, core)
		}
	}
}

// TestBoringDollarsPerFoot prices a boring through a built-in drill rig's
// quantities and a tiny rate book: at $15 per foot of drilling plus $15
// per sample with a sample every 2 ft, a boring costs $22.50 per foot, so
// $750 buys about 33 ft (common practice). Only the drilling and sample
// items are priced: the rig also reports grouting, which the rule of thumb
// leaves out.
func TestBoringDollarsPerFoot(t *testing.T) {
	book, err := ratebooks.Parse([]byte(`name: rule-of-thumb
title: Drilling and sampling at a rule-of-thumb price (test data)
currency: USD
effective: 2026-01-01
region: none
items:
  - {code: drill-0-50, description: drilling, unit: ft, unit_price: 15}
  - {code: spt-sample, description: sample, unit: each, unit_price: 15}
`), "test")
	if err != nil {
		t.Fatal(err)
	}
	r, _ := New("tire-drill")
	r = rigtest.Serve(t, r)
	cost := func(depthFt float64) float64 {
		a := rigtest.Assess(t, r, sdk.Site{ID: "B", Method: sdk.Boring, DepthFt: depthFt, Surface: sdk.Firm,
			SampleIntervalFt: sdk.ContinuousSampleIntervalFt})[0]
		if !a.Feasible {
			t.Fatalf("%g ft: %s", depthFt, a.Reason)
		}
		sum := 0.0
		for _, q := range a.Quantities {
			if q.Item != "drill-0-50" && q.Item != "spt-sample" {
				continue
			}
			it, ok := book.Price(q.Item)
			if !ok || it.Unit != q.Unit {
				t.Fatalf("%s: not priced per %s", q.Item, q.Unit)
			}
			sum += q.Amount * it.UnitPrice
		}
		return sum
	}
	// A sample every 2 ft: 30 ft gives 15 samples, 30 × 15 + 15 × 15 = 675.
	if c := cost(30); math.Abs(c/30-22.5) > 1e-9 {
		t.Errorf("30-ft boring: $%.2f, $%.2f a foot; want $22.50 a foot (common practice)", c, c/30)
	}
	// $750 buys about 33 ft: the deepest whole-foot boring within $750.
	best := 0.0
	for d := 1.0; d <= 50; d++ {
		if cost(d) <= 750 {
			best = d
		}
	}
	if best != 33 {
		t.Errorf("$750 buys %g ft, want about 33 ft (750 / 22.5 = 33.3; common practice)", best)
	}
}

// TestBoringAboutHalfADay: a typical boring takes about half a day (common
// practice): a 25–30 ft sampled boring on either built-in drill rig is
// 3 to 6 hours on the point.
func TestBoringAboutHalfADay(t *testing.T) {
	for _, n := range []string{"tire-drill", "track-drill"} {
		r, _ := New(n)
		r = rigtest.Serve(t, r)
		for _, d := range []float64{25, 30} {
			a := rigtest.Assess(t, r, sdk.Site{ID: "B", Method: sdk.Boring, DepthFt: d, Surface: sdk.Firm})[0]
			if h := a.Hours.Total(); h < 3 || h > 6 {
				t.Errorf("%s: %g-ft boring takes %.2f h, want 3–6 h (about half a day, common practice)", n, d, h)
			}
		}
	}
}

// Same input, same output: two batches give identical answers.
func TestDeterministic(t *testing.T) {
	for _, n := range Names() {
		r, _ := New(n)
		r = rigtest.Serve(t, r)
		var sites []sdk.Site
		for i, m := range []sdk.Method{sdk.Boring, sdk.CPT, sdk.TestPit, sdk.Probe} {
			sites = append(sites, sdk.Site{ID: string(m), Method: m, DepthFt: float64(5 + 7*i), Surface: sdk.Firm, Environmental: i%2 == 0})
		}
		a := rigtest.Assess(t, r, sites...)
		b := rigtest.Assess(t, r, sites...)
		if !reflect.DeepEqual(a, b) {
			t.Errorf("%s: answers differ between identical batches", n)
		}
	}
}
