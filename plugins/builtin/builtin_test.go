package builtin

import (
	"context"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/builtin/internal/rigtest"
	"github.com/rigmix/rigmix/plugins/sdk"
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
