package scenarios

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/rules"
)

// oneZone is a scenario with a single zone, written in unit ("ft" or "m")
// over a 400 × 300 boundary (in that unit); zone is the zone's YAML body
// (indented 4 spaces) and top is added at the top level.
func oneZone(unit, zone, top string) []byte {
	return []byte("units: " + unit + `
name: t
boundary:
  polygon: [[0, 0], [400, 0], [400, 300], [0, 300]]
zones:
  - id: A
` + zone + `
rigs: [tire-drill]
yard_miles: 20
` + top)
}

// structureZone is a w × h structure zone of the given stories and load
// class, with the rules line given.
func structureZone(w, h, stories, class, ground, rulesYAML string) string {
	return `    use: structure
    polygon: [[10, 10], [` + w + `, 10], [` + w + `, ` + h + `], [10, ` + h + `]]
    structure: {stories: ` + stories + `, load_class: ` + class + `}
    ground: ` + ground + `
    rules: ` + rulesYAML
}

func openZone(ground, rulesYAML string) string {
	return `    use: open
    polygon: [[10, 10], [210, 10], [210, 210], [10, 210]]
    ground: ` + ground + `
    rules: ` + rulesYAML
}

func mustZone(t *testing.T, data []byte) Zone {
	t.Helper()
	s, err := Parse(data, "t.yaml", nil)
	if err != nil {
		t.Fatalf("%v\n%s", err, data)
	}
	return s.Zones[0]
}

const navfac = "preset navfac-closely-spaced-footings: NAVFAC DM-7.01 / UFC 3-220-10N, Table 6"

func TestPresetFillsRules(t *testing.T) {
	z := mustZone(t, oneZone("ft", openZone("{surface: firm}", "{preset: navfac-closely-spaced-footings, min_depth: 30}"), ""))
	r := z.Rules
	// NAVFAC DM-7.01 / UFC 3-220-10N Table 6: about 50 ft both ways.
	if r.MaxSpacingFt != 50 || r.Lattice != Square || r.MinDepthFt != 30 || r.Preset != "navfac-closely-spaced-footings" {
		t.Errorf("rules %+v", r)
	}
	if r.Origins["max_spacing"] != navfac || r.Origins["lattice"] != navfac || r.Origins["min_depth"] != OriginScenario {
		t.Errorf("origins %v", r.Origins)
	}
	if !strings.Contains(r.Source, "NAVFAC DM-7.01") {
		t.Errorf("source %q does not name the preset's source", r.Source)
	}

	// The file's own numbers win; the preset fills the rest.
	z = mustZone(t, oneZone("ft", openZone("{surface: firm}", "{preset: ufgs-unknown-site, max_spacing: 150, lattice: triangular, source: client}"), ""))
	r = z.Rules
	// UFGS 4-159-01: about 200 ft centres, borings at least 30 ft deep.
	if r.MaxSpacingFt != 150 || r.Lattice != Triangular || r.MinDepthFt != 30 || r.Source != "client" {
		t.Errorf("rules %+v", r)
	}
	want := map[string]string{
		"max_spacing": OriginScenario,
		"lattice":     OriginScenario,
		"min_depth":   "preset ufgs-unknown-site: UFGS 4-159-01",
	}
	for k, v := range want {
		if r.Origins[k] != v {
			t.Errorf("origin of %s = %q, want %q", k, r.Origins[k], v)
		}
	}

	// One boring per 2,500 ft² of building area (common practice): the
	// preset gives an area rule and no spacing, so no lattice applies. It
	// sets no count, so the NAVFAC footprint minimum for 10,000 ft² (3)
	// still applies.
	z = mustZone(t, oneZone("ft", structureZone("110", "110", "2", "light", "{surface: firm}", "{preset: common-building-density, min_depth: 20}"), ""))
	if z.Rules.AreaPerPointFt2 != 2500 || z.Rules.Origins["area_per_point"] != "preset common-building-density: common practice" ||
		z.Rules.Origins["lattice"] != "" || z.Rules.MinPoints != 3 {
		t.Errorf("density preset: %+v", z.Rules)
	}

	// A count preset is enough for a zone's point rule, and brings corners.
	z = mustZone(t, oneZone("ft", openZone("{surface: firm}", "{preset: navfac-low-load-warehouse, min_depth: 20}"), ""))
	if z.Rules.MinPoints != 4 || !z.Rules.Corners || z.Rules.Lattice != Triangular || z.Rules.Origins["lattice"] != "" {
		t.Errorf("warehouse preset: %+v", z.Rules)
	}
}

func TestFootprintMinimum(t *testing.T) {
	// NAVFAC DM-7.01 / UFC 3-220-10N Table 6: at least 2 borings under
	// 2,500 ft², at least 3 from 2,500 to 10,000 ft².
	tests := []struct {
		w, h string // corner opposite (10, 10)
		want int
	}{
		{"50", "50", 2},   // 1,600 ft²
		{"110", "110", 3}, // 10,000 ft²
		{"60", "60", 3},   // 2,500 ft²
	}
	for _, tc := range tests {
		z := mustZone(t, oneZone("ft", structureZone(tc.w, tc.h, "1", "light", "{surface: firm}", "{min_depth: 20}"), ""))
		if z.Rules.MinPoints != tc.want || !strings.HasPrefix(z.Rules.Origins["min_points"], "computed: NAVFAC DM-7.01") {
			t.Errorf("%s × %s: min points %d (%q), want %d", tc.w, tc.h, z.Rules.MinPoints, z.Rules.Origins["min_points"], tc.want)
		}
	}
	// Stated counts win, and over 10,000 ft² the rule does not apply.
	z := mustZone(t, oneZone("ft", structureZone("50", "50", "1", "light", "{surface: firm}", "{min_depth: 20, min_points: 5}"), ""))
	if z.Rules.MinPoints != 5 || z.Rules.Origins["min_points"] != OriginScenario {
		t.Errorf("stated count: %+v", z.Rules)
	}
	_, err := Parse(oneZone("ft", structureZone("120", "110", "1", "light", "{surface: firm}", "{min_depth: 20}"), ""), "t.yaml", nil)
	if err == nil || !strings.Contains(err.Error(), "asks for no points") {
		t.Errorf("11,000 ft² with no point rule: %v", err)
	}
}

func TestComputedDepth(t *testing.T) {
	const mFt = 1 / rules.MetersPerFoot
	tests := []struct {
		name     string
		data     []byte
		wantFt   float64
		tolFt    float64
		inOrigin string
	}{
		{
			// S = 5: 6·5^0.7 = 18.51 m heavy (Sowers, in Das; the formula from
			// memory, the value derived from it).
			name:   "stories heavy",
			data:   oneZone("m", structureZone("60", "60", "5", "heavy", "{surface: firm}", "{max_spacing: 20, min_depth: {from: stories}}"), ""),
			wantFt: 18.51 * mFt, tolFt: 0.005 * mFt, inOrigin: "computed: Sowers, in Das: D = 6·S^0.7 m",
		},
		{
			// S = 5: 3·5^0.7 = 9.26 m light (same, derived).
			name:   "stories light",
			data:   oneZone("m", structureZone("60", "60", "5", "light", "{surface: firm}", "{max_spacing: 20, min_depth: {from: stories}}"), ""),
			wantFt: 9.26 * mFt, tolFt: 0.005 * mFt, inOrigin: "S = 5; deeper than the 25 ft building minimum (common practice) → 9.26 m",
		},
		{
			// 2,500 kN on a 3 m × 2 m footing, 2:1 spread: D1 = 5.26 m below
			// the footing (published homework solution, SOURCES.md); D2 is
			// far deeper, so D1 governs. q = 2500 / 6 = 416.67 kPa. In a
			// structure zone the boring then goes to the 25 ft building
			// minimum (common practice: about 20–25 ft or to refusal).
			name: "footing 2:1",
			data: oneZone("m", structureZone("60", "60", "3", "light", "{surface: firm}",
				"{max_spacing: 20, min_depth: {from: footing, width: 2, length: 3, bearing_pressure: 416.6667}}"), ""),
			wantFt: 25, tolFt: 1e-9, inOrigin: "D1 5.26 m",
		},
		{
			// The same footing 1.5 m down adds 1.5 m below ground: 6.76 m,
			// 22.2 ft, still under the 25 ft building minimum (common
			// practice), which governs.
			name: "footing 2:1 founded 1.5 m down",
			data: oneZone("m", structureZone("60", "60", "3", "light", "{surface: firm, groundwater_depth: 3}",
				"{max_spacing: 20, min_depth: {from: footing, width: 3, length: 2, bearing_pressure: 416.6667, foundation_depth: 1.5, unit_weight: 18, sat_unit_weight: 20}}"), ""),
			wantFt: 25, tolFt: 1e-9, inOrigin: "groundwater at 3.00 m",
		},
		{
			// The same footing over rock at 4 m: the boring goes to refusal
			// above the minimum, then 3 m of core are not added here (the
			// stress rule gives the depth; rock cuts it) (common practice).
			name: "footing over shallow rock",
			data: oneZone("m", structureZone("60", "60", "3", "light", "{surface: firm, rock_depth: 4}",
				"{max_spacing: 20, min_depth: {from: footing, width: 2, length: 3, bearing_pressure: 416.6667}}"), ""),
			wantFt: 4 * mFt, tolFt: 1e-9, inOrigin: "to rock (refusal)",
		},
		{
			// GEC-5: at least 5 m below the lowest cut elevation.
			name: "cut gec5", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: cut, cut_depth: 15}}"), ""),
			wantFt: 15 + 5*mFt, tolFt: 1e-9, inOrigin: "FHWA GEC-5",
		},
		{
			// TxDOT LRFD Geotechnical Manual (2024): 15 ft below the cut bottom.
			name: "cut txdot", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: cut, cut_depth: 15, guide: txdot}}"), ""),
			wantFt: 30, tolFt: 1e-9, inOrigin: "TxDOT",
		},
		{
			// The deeper of TxDOT (the larger of the embankment height and
			// 20 ft; seen) and twice the height (AASHTO LRFD / FHWA GEC-5,
			// from memory): 12 ft high → max(20, 24) = 24 ft.
			name: "low embankment", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 12}}"), ""),
			wantFt: 24, tolFt: 1e-9, inOrigin: "from memory",
		},
		{
			// 8 ft high: TxDOT's 20 ft governs over 16 ft.
			name: "lower embankment", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 8}}"), ""),
			wantFt: 20, tolFt: 1e-9, inOrigin: "TxDOT LRFD Geotechnical Manual (2024): the larger of the embankment height and 20 ft (20.0 ft, governs)",
		},
		{
			// 32 ft high: twice the height, 64 ft (from memory), not TxDOT's 32 ft.
			name: "high embankment", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 32}}"), ""),
			wantFt: 64, tolFt: 1e-9, inOrigin: "64.0 ft",
		},
		{
			// guide: txdot takes the state rule alone (TxDOT LRFD, 2024; seen).
			name: "embankment txdot", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 32, guide: txdot}}"), ""),
			wantFt: 32, tolFt: 1e-9, inOrigin: "TxDOT",
		},
		{
			// guide: aashto takes twice the height alone (from memory).
			name: "embankment aashto", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 8, guide: aashto}}"), ""),
			wantFt: 16, tolFt: 1e-9, inOrigin: "twice the embankment height",
		},
		{
			// TxDOT: at least 20 ft below a cut wall base.
			name: "cut wall", data: oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: wall, base_depth: 5, wall: cut}}"), ""),
			wantFt: 25, tolFt: 1e-9, inOrigin: "cut wall base",
		},
		{
			// To rock plus the default 10 ft of core (common practice).
			name: "rock default core", data: oneZone("ft", openZone("{surface: firm, rock_depth: 40}", "{max_spacing: 100, min_depth: {from: rock}}"), ""),
			wantFt: 50, tolFt: 1e-9, inOrigin: "common practice",
		},
		{
			name: "rock metric core", data: oneZone("m", openZone("{surface: firm, rock_depth: 12}", "{max_spacing: 30, min_depth: {from: rock, core: 1.5}}"), ""),
			wantFt: 13.5 * mFt, tolFt: 1e-9, inOrigin: "13.50 m",
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			z := mustZone(t, tc.data)
			if math.Abs(z.Rules.MinDepthFt-tc.wantFt) > tc.tolFt {
				t.Errorf("depth %.4f ft, want %.4f ± %.4f", z.Rules.MinDepthFt, tc.wantFt, tc.tolFt)
			}
			if o := z.Rules.Origins["min_depth"]; !strings.HasPrefix(o, "computed: ") || !strings.Contains(o, tc.inOrigin) {
				t.Errorf("origin %q, want it to contain %q", o, tc.inOrigin)
			}
		})
	}
}

// TestFootingUnits works one footing in a feet file and the same footing in
// a metre file, converted exactly: the depth must agree, so psf/pcf and
// kPa/kN/m³ are read in the right unit.
func TestFootingUnits(t *testing.T) {
	ft := mustZone(t, oneZone("ft", structureZone("200", "200", "2", "light", "{surface: firm, groundwater_depth: 12}",
		"{max_spacing: 100, min_depth: {from: footing, width: 14, bearing_pressure: 3000, foundation_depth: 4, unit_weight: 120, sat_unit_weight: 125, method: boussinesq}}"), ""))
	want, err := rules.ASCEDepth(rules.Load{Area: rules.Area{Shape: rules.Square, WidthFt: 14}, NetPressurePsf: 3000, FoundationDepthFt: 4},
		rules.Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: 12}, rules.Boussinesq)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(ft.Rules.MinDepthFt-want.BelowGroundFt) > 1e-9 {
		t.Errorf("ft file: %g ft, ASCEDepth gives %g ft", ft.Rules.MinDepthFt, want.BelowGroundFt)
	}
	m := rules.MetersPerFoot
	gw := rules.PcfPerKNPerM3 // kN/m³ per pcf is its inverse
	metric := oneZone("m", structureZone("60", "60", "2", "light", "{surface: firm, groundwater_depth: "+fmtNum(12*m)+"}",
		"{max_spacing: 30, min_depth: {from: footing, width: "+fmtNum(14*m)+", bearing_pressure: "+fmtNum(rules.PsfToKPa(3000))+
			", foundation_depth: "+fmtNum(4*m)+", unit_weight: "+fmtNum(120/gw)+", sat_unit_weight: "+fmtNum(125/gw)+", method: boussinesq}}"), "")
	mz := mustZone(t, metric)
	// The metre file uses γw = 9.81 kN/m³ (62.45 pcf) and the feet file
	// 62.4 pcf, so the depths differ a little below the water table.
	if d := math.Abs(mz.Rules.MinDepthFt - want.BelowGroundFt); d > 0.05 {
		t.Errorf("m file: %g ft, ft file %g ft", mz.Rules.MinDepthFt, want.BelowGroundFt)
	}
}

func TestDerivedBadInput(t *testing.T) {
	tests := []struct {
		name                 string
		data                 []byte
		field, problem, hint string
	}{
		{"unknown preset", oneZone("ft", openZone("{surface: firm}", "{preset: navfac-soft-strta, min_depth: 20}"), ""),
			"zones[0].rules.preset", `zone A: unknown preset "navfac-soft-strta"`, "did you mean navfac-soft-strata?"},
		{"stories without structure", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: stories}}"), ""),
			"zones[0].rules.min_depth.from", "zone A: depth rule from: stories is missing the number of stories", "use: structure"},
		{"footing without width", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: footing, bearing_pressure: 3000}}"), ""),
			"zones[0].rules.min_depth.width", "zone A: depth rule from: footing is missing width", "add width:"},
		{"footing without pressure", oneZone("m", openZone("{surface: firm}", "{max_spacing: 30, min_depth: {from: footing, width: 2}}"), ""),
			"zones[0].rules.min_depth.bearing_pressure", "zone A: depth rule from: footing is missing bearing_pressure", "kPa"},
		{"rectangle without length", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: footing, shape: rectangle, width: 6, bearing_pressure: 3000}}"), ""),
			"zones[0].rules.min_depth.length", "is missing length", ""},
		{"rock without rock depth", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: rock, core: 10}}"), ""),
			"zones[0].rules.min_depth.from", "zone A: depth rule from: rock is missing the depth to rock", "ground.rock_depth"},
		{"embankment without height", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment}}"), ""),
			"zones[0].rules.min_depth.height", "is missing height", ""},
		{"wall without kind", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: wall, base_depth: 4}}"), ""),
			"zones[0].rules.min_depth.wall", "is missing wall", "wall: fill"},
		{"key of another kind", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: embankment, height: 10, width: 3}}"), ""),
			"zones[0].rules.min_depth.width", "is not used with from: embankment", "takes guide, height"},
		{"unknown from", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: storeys}}"), ""),
			"zones[0].rules.min_depth.from", `unknown value "storeys"`, "did you mean stories?"},
		{"from missing", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {height: 3}}"), ""),
			"zones[0].rules.min_depth.from", "missing", "embankment"},
		{"misspelt depth key", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: footing, widht: 3}}"), ""),
			"zones[0].rules.min_depth.widht", "unknown key", "did you mean width?"},
		{"unknown method", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: footing, width: 3, bearing_pressure: 2000, method: newmark}}"), ""),
			"zones[0].rules.min_depth.method", `unknown method "newmark"`, "boussinesq"},
		{"light water", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: {from: footing, width: 3, bearing_pressure: 2000, sat_unit_weight: 60}}"), ""),
			"zones[0].rules.min_depth.sat_unit_weight", "more than the unit weight of water", ""},
		{"unknown lab program", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), "lab: defualt\n"),
			"lab", `unknown lab program "defualt"`, "did you mean default?"},
		{"lab share above one", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), "lab: {tube: {consolidation: 2}}\n"),
			"lab.tube.consolidation", "must be ≤ 1, got 2", "one in four"},
		{"lab unknown test", oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), "lab: {bag: {vane: 1}}\n"),
			"lab.bag.vane", "unknown key", "known: analytical"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Parse(tc.data, "t.yaml", nil)
			var fe *FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("error %v, want a *FieldError", err)
			}
			if fe.Field != tc.field || !strings.Contains(fe.Problem, tc.problem) || !strings.Contains(fe.Hint, tc.hint) {
				t.Errorf("got field %q problem %q hint %q\nwant field %q problem ~%q hint ~%q", fe.Field, fe.Problem, fe.Hint, tc.field, tc.problem, tc.hint)
			}
		})
	}
}

func TestLabBlock(t *testing.T) {
	base := openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}")
	load := func(top string) *lab.Program {
		t.Helper()
		s, err := Parse(oneZone("ft", base, top), "t.yaml", nil)
		if err != nil {
			t.Fatal(err)
		}
		return s.Lab
	}
	if p := load(""); p != nil {
		t.Errorf("no lab key: %+v, want nil (the default program)", p)
	}
	if p := load("lab: none\n"); p == nil || p.Name != "none" || len(p.PerSample) != 0 {
		t.Errorf("lab: none → %+v", p)
	}
	if p := load("lab: default\n"); p == nil || p.Name != "default" {
		t.Errorf("lab: default → %+v", p)
	}
	if p := load("lab: {program: none, bag: {moisture: 1}}\n"); p == nil || p.Name != "custom" || len(p.PerSample[lab.Bag]) != 1 || len(p.PerSample[lab.Tube]) != 0 {
		t.Errorf("none plus bag moisture → %+v", p)
	}
	p := load("lab: {fine_share: 0.5, tube: {consolidation: 0.2}, split_barrel: {sieve: 0}}\n")
	if p == nil || p.Name != "custom" || p.FineShare != 0.5 {
		t.Fatalf("custom program → %+v", p)
	}
	qs, err := p.Quantities(lab.Counts{SplitBarrel: 12, Tube: 10})
	if err != nil {
		t.Fatal(err)
	}
	got := map[string]float64{}
	for _, q := range qs {
		got[q.Item] = q.Amount
	}
	// Sieve only on the 10 tubes (⌈10/3⌉ = 4); consolidation on 1 in 5.
	if got[lab.ItemSieve] != 4 || got[lab.ItemConsolidation] != 2 {
		t.Errorf("custom program quantities %v", got)
	}
}
