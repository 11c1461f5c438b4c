package lab

import (
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// TestCatalogStandards checks each test's ASTM designation against the
// standards named in the issue and the brief: D2216 moisture content, D6913
// sieve, D7928 hydrometer, D4318 Atterberg limits, D2435 one-dimensional
// consolidation, D2166 unconfined compression, D2850 UU triaxial, D698
// standard and D1557 modified compaction, D1883 CBR, D5084 flexible-wall
// hydraulic conductivity, D3385 double-ring infiltration (the designations
// as the standards' titles give them; from memory).
func TestCatalogStandards(t *testing.T) {
	want := map[string]string{
		ItemMoisture:      "ASTM D2216",
		ItemSieve:         "ASTM D6913",
		ItemHydrometer:    "ASTM D7928",
		ItemAtterberg:     "ASTM D4318",
		ItemConsolidation: "ASTM D2435",
		ItemUCS:           "ASTM D2166",
		ItemUU:            "ASTM D2850",
		ItemProctor:       "ASTM D698",
		ItemProctorMod:    "ASTM D1557",
		ItemCBR:           "ASTM D1883",
		ItemPermeability:  "ASTM D5084",
		ItemInfiltration:  "ASTM D3385",
		ItemAnalytical:    "the site's analytical list",
	}
	got := map[string]string{}
	for _, c := range Catalog() {
		got[c.Item] = c.Standard
		if !(strings.HasPrefix(c.Item, "lab-") || c.Item == ItemInfiltration) || c.Name == "" || c.Key == "" {
			t.Errorf("catalogue entry %+v", c)
		}
	}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("catalogue standards %v, want %v", got, want)
	}
}

// TestDefaultProgram checks the default shares, which are common practice:
// moisture on every sample, sieve on 1 in 3, Atterberg on 1 in 4,
// consolidation on 1 in 10 tube samples.
func TestDefaultProgram(t *testing.T) {
	p := Default()
	if err := p.Check(); err != nil {
		t.Fatal(err)
	}
	share := func(k Kind, key string) float64 {
		for _, x := range p.PerSample[k] {
			if x.Key == key {
				return x.Share
			}
		}
		return 0
	}
	tests := []struct {
		kind Kind
		key  string
		want float64
	}{
		{SplitBarrel, "moisture", 1},      // common practice
		{SplitBarrel, "sieve", 1.0 / 3},   // common practice
		{SplitBarrel, "atterberg", 0.25},  // common practice
		{SplitBarrel, "hydrometer", 0.1},  // common practice: classification (ASTM D2487) needs only sieve and limits
		{SplitBarrel, "consolidation", 0}, // disturbed samples are not consolidated (ASTM D2435 needs an intact specimen)
		{Bag, "moisture", 1},              // common practice
		{Tube, "consolidation", 0.1},      // common practice
		{Tube, "ucs", 0.25},               // common practice
		{Tube, "uu", 0.1},                 // common practice
	}
	for _, tc := range tests {
		if got := share(tc.kind, tc.key); got != tc.want {
			t.Errorf("default %s on %s: share %g, want %g", tc.key, tc.kind, got, tc.want)
		}
	}
	if !strings.Contains(p.Source, "common practice") {
		t.Errorf("default source %q does not say common practice", p.Source)
	}
	// Default hands out a fresh copy each time.
	p.PerSample[Tube] = nil
	if len(Default().PerSample[Tube]) == 0 {
		t.Error("changing one default program changed the next")
	}
}

func amounts(qs []sdk.Quantity) map[string]float64 {
	out := map[string]float64{}
	for _, q := range qs {
		out[q.Item] = q.Amount
	}
	return out
}

// TestQuantities works the program arithmetic by hand: n = ⌈Σ count · soil
// share · test share⌉ per item.
func TestQuantities(t *testing.T) {
	tests := []struct {
		name string
		prog *Program
		c    Counts
		want map[string]float64
	}{
		{
			// 12 split-barrel samples: 12 moisture, 4 sieve, ⌈1.2⌉ = 2
			// hydrometer (1 in 10), 3 Atterberg.
			name: "split-barrel only", prog: Default(), c: Counts{SplitBarrel: 12},
			want: map[string]float64{ItemMoisture: 12, ItemSieve: 4, ItemHydrometer: 2, ItemAtterberg: 3},
		},
		{
			// 13 + 10 tube: moisture 23; sieve ⌈23/3⌉ = 8; hydrometer
			// ⌈2.3⌉ = 3; Atterberg ⌈23/4⌉ = 6; consolidation 1; UCS ⌈2.5⌉ = 3; UU 1.
			name: "with tubes", prog: Default(), c: Counts{SplitBarrel: 13, Tube: 10},
			want: map[string]float64{ItemMoisture: 23, ItemSieve: 8, ItemHydrometer: 3, ItemAtterberg: 6,
				ItemConsolidation: 1, ItemUCS: 3, ItemUU: 1},
		},
		{
			// Nil program is the default.
			name: "nil is default", prog: nil, c: Counts{Bag: 4},
			want: map[string]float64{ItemMoisture: 4, ItemSieve: 2, ItemHydrometer: 1, ItemAtterberg: 1},
		},
		{
			name: "none", prog: None(), c: Counts{SplitBarrel: 40, Tube: 5, Bag: 9},
			want: map[string]float64{},
		},
		{
			name: "no samples", prog: Default(), c: Counts{},
			want: map[string]float64{},
		},
		{
			// Half the 12 split-barrel samples fine-grained, every tube fine:
			// hydrometer 6/10 + 12/10 = 1.8 → 2; Atterberg 6/4 + 12/4 = 4.5 → 5;
			// consolidation 1.2 → 2; UCS 3; UU 1.2 → 2.
			name: "fine share", prog: func() *Program { p := Default(); p.FineShare = 0.5; return p }(),
			c: Counts{SplitBarrel: 12, Tube: 12},
			want: map[string]float64{ItemMoisture: 24, ItemSieve: 8, ItemHydrometer: 2, ItemAtterberg: 5,
				ItemConsolidation: 2, ItemUCS: 3, ItemUU: 2},
		},
	}
	for _, tc := range tests {
		qs, err := tc.prog.Quantities(tc.c)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if got := amounts(qs); !reflect.DeepEqual(got, tc.want) {
			t.Errorf("%s: %v, want %v", tc.name, got, tc.want)
		}
		for i, q := range qs {
			if q.Unit != Unit || q.Note == "" {
				t.Errorf("%s: quantity %+v", tc.name, q)
			}
			if i > 0 && order(strings.TrimPrefix(q.Item, "lab-")) < order(strings.TrimPrefix(qs[i-1].Item, "lab-")) {
				t.Errorf("%s: %s after %s, want catalogue order", tc.name, q.Item, qs[i-1].Item)
			}
		}
	}
}

// TestExpected: the unrounded amounts are linear in the counts, so two
// borings' shares add up to the shares of both together, and rounding
// them up gives Quantities.
func TestExpected(t *testing.T) {
	p := Default()
	a, b := Counts{SplitBarrel: 7}, Counts{SplitBarrel: 5, Tube: 3}
	ea, _ := p.Expected(a)
	eb, _ := p.Expected(b)
	eab, _ := p.Expected(a.Add(b))
	sum := amounts(ea)
	for k, v := range amounts(eb) {
		sum[k] += v
	}
	whole := amounts(eab)
	if len(sum) != len(whole) {
		t.Fatalf("items %v and %v", sum, whole)
	}
	for k, v := range whole {
		if math.Abs(sum[k]-v) > 1e-9 {
			t.Errorf("%s: separately %g, together %g", k, sum[k], v)
		}
	}
	q, _ := p.Quantities(a.Add(b))
	for k, v := range amounts(q) {
		if v != math.Ceil(whole[k]-1e-9) {
			t.Errorf("%s: rounded %g, expected %g", k, v, whole[k])
		}
	}
	// 12 split-barrel + 3 tube: moisture exactly 15, UU 0.3.
	if whole[ItemMoisture] != 15 || math.Abs(whole[ItemUU]-0.3) > 1e-12 {
		t.Errorf("expected %v", whole)
	}
}

func TestQuantitiesNote(t *testing.T) {
	p := Default()
	p.FineShare = 0.5
	qs, err := p.Quantities(Counts{SplitBarrel: 12, Tube: 4})
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{
		"Moisture content (ASTM D2216): all of 12 split-barrel, all of 4 tube samples",
		"Atterberg limits) (ASTM D4318): 1 in 4 of 12 split-barrel (50 % fine-grained), 1 in 4 of 4 tube samples",
		"(ASTM D2435): 1 in 10 of 4 tube samples",
	} {
		found := false
		for _, q := range qs {
			found = found || strings.Contains(q.Note, want)
		}
		if !found {
			t.Errorf("no note contains %q", want)
		}
	}
}

func TestSetAndCheck(t *testing.T) {
	p := Default()
	if err := p.Set(SplitBarrel, "ucs", 0.2); err != nil {
		t.Fatal(err)
	}
	if err := p.Set(SplitBarrel, "sieve", 0); err != nil {
		t.Fatal(err)
	}
	var keys []string
	for _, x := range p.PerSample[SplitBarrel] {
		keys = append(keys, x.Key)
	}
	if want := []string{"moisture", "hydrometer", "atterberg", "ucs"}; !reflect.DeepEqual(keys, want) {
		t.Errorf("after Set: %v, want %v", keys, want)
	}
	if err := p.Set(SplitBarrel, "vane", 1); err == nil || !strings.Contains(err.Error(), "moisture, sieve") {
		t.Errorf("unknown test: %v", err)
	}
	if err := p.Set("core", "moisture", 1); err == nil {
		t.Error("unknown kind accepted")
	}
	bad := []func(*Program){
		func(p *Program) { p.FineShare = 1.5 },
		func(p *Program) { p.FineShare = math.NaN() },
		func(p *Program) { p.PerSample[Tube][0].Share = -0.1 },
		func(p *Program) { p.PerSample[Tube] = append(p.PerSample[Tube], p.PerSample[Tube][0]) },
		func(p *Program) { p.PerSample["core"] = nil },
		func(p *Program) { p.PerSample[Bag][0].Item = "lab-proctor" },
	}
	for i, edit := range bad {
		q := Default()
		edit(q)
		if err := q.Check(); err == nil {
			t.Errorf("bad program %d passed Check", i)
		}
		if _, err := q.Quantities(Counts{SplitBarrel: 1}); err == nil {
			t.Errorf("bad program %d priced", i)
		}
	}
	if _, err := Default().Quantities(Counts{Tube: -1}); err == nil {
		t.Error("negative count accepted")
	}
	// Clone is deep.
	a := Default()
	b := a.Clone()
	b.PerSample[Tube][0].Share = 0.5
	if a.PerSample[Tube][0].Share != 1 {
		t.Error("Clone shares its slices")
	}
}

func TestCountsFromQuantities(t *testing.T) {
	qs := []sdk.Quantity{
		{Item: "drill-0-50", Unit: "ft", Amount: 50},
		{Item: "spt-sample", Unit: "each", Amount: 11},
		{Item: "tube-sample", Unit: "each", Amount: 2},
		{Item: "spt-sample", Unit: "each", Amount: 6},
	}
	if got := CountsFromQuantities(qs); got != (Counts{SplitBarrel: 17, Tube: 2}) {
		t.Errorf("CountsFromQuantities = %+v", got)
	}
	// A rig's own items count by the sample kind they tell; a soil core
	// is tested as a split-barrel sample (disturbed; common practice).
	qs = []sdk.Quantity{
		{Item: "sonic-core", Unit: "each", Amount: 9, SampleKind: sdk.SampleCore},
		{Item: "spt-sample", Unit: "each", Amount: 3},
		{Item: "push-tube", Unit: "each", Amount: 2, SampleKind: sdk.SampleTube},
		{Item: "pit-bag", Unit: "each", Amount: 4, SampleKind: sdk.SampleBag},
		{Item: "pit-bulk", Unit: "each", Amount: 1, SampleKind: sdk.SampleBulk},
		{Item: "core-sample", Unit: "each", Amount: 100}, // no kind: not samples
	}
	if got := CountsFromQuantities(qs); got != (Counts{SplitBarrel: 12, Tube: 2, Bag: 4, Bulk: 1}) {
		t.Errorf("CountsFromQuantities by kind = %+v", got)
	}
	for _, k := range sdk.SampleKinds() {
		if KindOfSample(k) == "" {
			t.Errorf("sample kind %q has no lab kind", k)
		}
	}
	if got := (Counts{1, 2, 3, 4, 5}).Add(Counts{10, 20, 30, 40, 50}); got != (Counts{11, 22, 33, 44, 55}) {
		t.Errorf("Add = %+v", got)
	}
}

func TestPitBagSamples(t *testing.T) {
	// Samples at 2.5 and 5 ft, then every interval (the built-in rigs'
	// rule; TxDOT LRFD Geotechnical Manual: every 5 ft from 5 ft; the
	// 2.5-ft sample is common practice). The excavator's own test checks
	// this count against the depths it samples.
	tests := []struct {
		depth, interval float64
		want            int
	}{
		{2, 0, 0},
		{2.5, 0, 1},
		{4.9, 5, 1},
		{5, 0, 2},
		{12, 0, 3},
		{14, 2.5, 5},
		{10, 2, 5},
		{0, 5, 0},
		{math.NaN(), 5, 0},
	}
	for _, tc := range tests {
		if got := PitBagSamples(tc.depth, tc.interval); got != tc.want {
			t.Errorf("PitBagSamples(%g, %g) = %d, want %d", tc.depth, tc.interval, got, tc.want)
		}
	}
}
