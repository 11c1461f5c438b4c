package lab

import (
	"reflect"
	"strings"
	"testing"
)

// TestPurposePrograms: each purpose's program runs the tests the purpose
// is explored for (common practice; each share's basis is in
// PurposeSource), and fewer hydrometers where fines are not the question.
func TestPurposePrograms(t *testing.T) {
	prog := func(ps ...Purpose) *Program {
		p, err := ForPurposes(ps)
		if err != nil {
			t.Fatal(err)
		}
		return p
	}
	// Ten borings of 8 SPT samples each.
	sampled := func(p *Program) Counts {
		var c Counts
		for i := 0; i < 10; i++ {
			pc, _ := p.Derived(Counts{SplitBarrel: 8}, true, true)
			c = c.Add(pc)
		}
		return c
	}
	for _, c := range []struct {
		name    string
		p       *Program
		want    map[string]float64 // items that must be there, with their counts
		without []string           // items that must not be
	}{
		// Pavement: 10 bulk samples; Proctor and CBR on ⌈10/3⌉ = 4
		// (ASTM D698, D1883; common practice); no hydrometer.
		{"pavement", prog(Pavement), map[string]float64{ItemProctor: 4, ItemCBR: 4, ItemSieve: 10 + 27, ItemMoisture: 90},
			[]string{ItemHydrometer, ItemConsolidation, ItemPermeability}},
		// Pond: permeability (ASTM D5084) on ⌈10/2⌉ = 5 bulk; infiltration
		// (ASTM D3385) at 5 points; hydrometer on all 10 bulk + ⌈80/3⌉.
		{"pond", prog(Pond), map[string]float64{ItemPermeability: 5, ItemInfiltration: 5, ItemHydrometer: 37},
			[]string{ItemCBR, ItemConsolidation}},
		// Soft ground: 7 tubes a boring between the 8 SPT samples (TxDOT
		// LRFD, 2024), 70 tubes; consolidation (ASTM D2435) on ⌈70/3⌉ = 24.
		{"soft ground", prog(SoftGround), map[string]float64{ItemConsolidation: 24, ItemUU: 24},
			[]string{ItemCBR, ItemPermeability}},
		// Environmental: the analytical list on two samples a point, 20.
		{"environmental", prog(Environmental), map[string]float64{ItemAnalytical: 20, ItemMoisture: 80},
			[]string{ItemSieve, ItemHydrometer}},
		// Foundation: the default program; hydrometer on 1 in 10: 8.
		{"foundation", prog(Foundation), map[string]float64{ItemHydrometer: 8, ItemSieve: 27},
			[]string{ItemProctor, ItemCBR, ItemPermeability}},
		// A pavement over soft ground gets both.
		{"pavement + soft ground", prog(Pavement, SoftGround), map[string]float64{ItemProctor: 4, ItemConsolidation: 24},
			nil},
	} {
		qs, err := Combine([]Part{{Label: c.name, Program: c.p, Counts: sampled(c.p)}})
		if err != nil {
			t.Fatal(err)
		}
		got := amounts(qs)
		for item, n := range c.want {
			if got[item] != n {
				t.Errorf("%s: %s = %g, want %g (all: %v)", c.name, item, got[item], n, got)
			}
		}
		for _, item := range c.without {
			if got[item] != 0 {
				t.Errorf("%s: %s = %g, want none", c.name, item, got[item])
			}
		}
		if !strings.Contains(c.p.Source, "common practice") {
			t.Errorf("%s: source %q does not say common practice", c.name, c.p.Source)
		}
	}
	// Fewer hydrometers: a pavement zone runs none, the default 1 in 10,
	// a pond 1 in 3 of its split-barrel samples and all its bulk samples.
	for _, c := range []struct {
		p    Purpose
		want float64
	}{{Pavement, 0}, {Foundation, 1.0 / 10}, {Pond, 1.0 / 3}} {
		if got := prog(c.p).share(SplitBarrel, "hydrometer"); got != c.want {
			t.Errorf("%s: hydrometer share %g, want %g", c.p, got, c.want)
		}
	}
}

func TestDerivedTubes(t *testing.T) {
	p, _ := ForPurposes([]Purpose{SoftGround})
	c, qs := p.Derived(Counts{SplitBarrel: 5}, true, true)
	if c.Tube != 4 || len(qs) != 1 || qs[0].Item != "tube-sample" || qs[0].Amount != 4 {
		t.Errorf("soft ground boring of 5 SPT: %+v, %+v; want 4 tubes between them (TxDOT LRFD, 2024)", c, qs)
	}
	if c, qs := p.Derived(Counts{Bag: 3}, true, false); c.Tube != 0 || qs != nil {
		t.Errorf("a pit gets no tubes: %+v %+v", c, qs)
	}
	if c, _ := Default().Derived(Counts{SplitBarrel: 5}, true, true); c != (Counts{SplitBarrel: 5}) {
		t.Errorf("the default program adds %+v", c)
	}
	var nilP *Program
	if c, _ := nilP.Derived(Counts{SplitBarrel: 5}, true, true); c != (Counts{SplitBarrel: 5}) {
		t.Errorf("nil program adds %+v", c)
	}
}

func TestForPurposes(t *testing.T) {
	if p, err := ForPurposes(nil); err != nil || !reflect.DeepEqual(p, Default()) {
		t.Errorf("no purpose: %+v, %v; want the default program", p, err)
	}
	if _, err := ForPurposes([]Purpose{"runway"}); err == nil || !strings.Contains(err.Error(), "pavement") {
		t.Errorf("unknown purpose: %v", err)
	}
	for _, p := range Purposes() {
		if PurposeSource(p) == "" {
			t.Errorf("%s has no basis", p)
		}
		if q, ok := ParsePurpose(string(p)); !ok || q != p {
			t.Errorf("ParsePurpose(%s)", p)
		}
	}
}

// TestCombineRoundsTotals: two zones' fractions add before rounding up.
func TestCombineRoundsTotals(t *testing.T) {
	pv, _ := ForPurposes([]Purpose{Pavement})
	qs, err := Combine([]Part{
		{Label: "L1", Program: pv, Counts: Counts{Bulk: 1}},
		{Label: "L2", Program: pv, Counts: Counts{Bulk: 1}},
	})
	if err != nil {
		t.Fatal(err)
	}
	if got := amounts(qs)[ItemProctor]; got != 1 {
		t.Errorf("2 bulk samples at 1 in 3: %g Proctor tests, want ⌈2/3⌉ = 1", got)
	}
	for _, q := range qs {
		if q.Item == ItemProctor && !(strings.Contains(q.Note, "L1:") && strings.Contains(q.Note, "L2:") && strings.Contains(q.Note, "ASTM D698")) {
			t.Errorf("note %q", q.Note)
		}
	}
}
