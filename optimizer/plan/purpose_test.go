package plan

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/scenarios"
)

// purposeSite has a parking lot, a detention pond and a building over a
// soft corner, explored by borings only (invented test data).
const purposeSite = `units: ft
name: purposes
boundary:
  polygon: [[0, 0], [600, 0], [600, 300], [0, 300]]
zones:
  - id: LOT
    use: pavement
    polygon: [[0, 0], [200, 0], [200, 300], [0, 300]]
    ground: {surface: firm}
    rules: {max_spacing: 150, min_depth: 10, methods: [boring]}
  - id: POND
    use: open
    purpose: [pond]
    polygon: [[200, 0], [400, 0], [400, 300], [200, 300]]
    ground: {surface: firm}
    rules: {max_spacing: 150, min_depth: 15, methods: [boring]}
  - id: SOFT
    use: structure
    purpose: [foundation, soft_ground]
    polygon: [[400, 0], [600, 0], [600, 300], [400, 300]]
    structure: {stories: 2, load_class: light}
    ground: {surface: firm, groundwater_depth: 8}
    rules: {max_spacing: 150, min_depth: {from: stories}, methods: [boring]}
rigs: [tire-drill]
rate_book: valley-2026
yard_miles: 20
`

// TestLabByPurpose: a pavement zone gets compaction (ASTM D698) and CBR
// (ASTM D1883) tests, a pond permeability (ASTM D5084) and infiltration
// (ASTM D3385) tests, a soft zone tube samples between the SPT samples and
// consolidation (ASTM D2435) on them (the programs' shares are common
// practice; the tubes between SPT samples are the TxDOT LRFD Geotechnical
// Manual's, 2024). Sampling follows the default schedule, every 2.5 ft to
// 10 ft then every 5 ft (common practice; ASTM D1586 sets no interval).
func TestLabByPurpose(t *testing.T) {
	sc, err := scenarios.Parse([]byte(purposeSite), "purposes.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	p, err := Run(context.Background(), scenarioInput(t, sc), Options{})
	if err != nil {
		t.Fatal(err)
	}
	qty := map[string]float64{}
	for _, l := range p.Estimate {
		qty[l.Item] = l.Quantity
	}
	for _, item := range []string{"lab-proctor", "lab-cbr", "lab-permeability", "field-infiltration", "lab-consolidation", "tube-sample"} {
		if qty[item] < 1 {
			t.Errorf("no %s in the estimate: %v", item, qty)
		}
	}
	// SPT samples follow the schedule: each boring's count from
	// sdk.SampleDepths on the default schedule; tubes one fewer per boring
	// in the soft zone.
	wantSPT, wantTubes := 0, 0
	byZone := map[string]int{}
	for _, pt := range p.Points {
		if pt.Method != string(sdk.Boring) {
			continue
		}
		if pt.Sampling != "every 2.5 ft to 10 ft, then every 5 ft" {
			t.Errorf("%s: sampling %q", pt.ID, pt.Sampling)
		}
		n := len(sdk.SampleDepths(pt.DepthFt, sdk.DefaultSampleSchedule()))
		wantSPT += n
		if pt.Zone == "SOFT" {
			wantTubes += n - 1
		}
		byZone[pt.Zone]++
	}
	if qty["spt-sample"] != float64(wantSPT) || qty["tube-sample"] != float64(wantTubes) {
		t.Errorf("spt-sample %g, tube-sample %g; want %d and %d from the schedule", qty["spt-sample"], qty["tube-sample"], wantSPT, wantTubes)
	}
	// Proctor and CBR on 1 in 3 bulk samples, one a boring in the lot;
	// permeability on 1 in 2 in the pond (common practice).
	if want := float64((byZone["LOT"] + 2) / 3); qty["lab-cbr"] != want {
		t.Errorf("lab-cbr %g, want ⌈%d/3⌉ = %g", qty["lab-cbr"], byZone["LOT"], want)
	}
	// The soft zone is a two-story light building: 3·2^0.7 m = 16 ft by
	// Sowers, raised to the 25 ft building minimum (common practice).
	for _, pt := range p.Points {
		if pt.Zone == "SOFT" && pt.DepthFt < 25 {
			t.Errorf("%s: %g ft, under the 25 ft building minimum", pt.ID, pt.DepthFt)
		}
	}
	// The stakeout jobs carry each boring's schedule for the field crew.
	in := scenarioInput(t, sc)
	jobs, _, err := ScheduleInputs(context.Background(), p, sc, in.RateBook, in.Rigs)
	if err != nil {
		t.Fatal(err)
	}
	for _, j := range jobs {
		if j.Method == string(sdk.Boring) && j.Sampling != "every 2.5 ft to 10 ft, then every 5 ft" {
			t.Errorf("job %s: sampling %q", j.ID, j.Sampling)
		}
	}
	got := map[string]string{}
	for _, l := range p.Lab {
		got[l.Zone] = l.Program
		if !strings.Contains(l.Basis, "common practice") {
			t.Errorf("%s: basis %q", l.Zone, l.Basis)
		}
	}
	if got["LOT"] != "pavement" || got["POND"] != "pond" || got["SOFT"] != "foundation+soft_ground" {
		t.Errorf("lab programs %v", got)
	}
}

// TestCautions: the overhead-line caution gives OSHA 29 CFR 1926.1408
// Table A by voltage (seen), not a single 20 ft, and the utilities caution
// no longer cites the ASTM D420-18 clause that could not be confirmed.
func TestCautions(t *testing.T) {
	all := strings.Join(Cautions, "\n")
	for _, s := range []string{"1926.1408 Table A", "over 350 to 500 kV 25 ft", "over 750 to 1,000 kV 45 ft", "1926.651(b)"} {
		if !strings.Contains(all, s) {
			t.Errorf("cautions lack %q", s)
		}
	}
	for _, s := range []string{"at least 20 ft;", "§1.3.1"} {
		if strings.Contains(all, s) {
			t.Errorf("cautions still say %q", s)
		}
	}
}

// TestCautionsFit: the utilities, overhead-line and review cautions print
// with every plan; the test-pit caution only with test pits, the waste
// caution only on a site with an environmental zone.
func TestCautionsFit(t *testing.T) {
	pit := []Point{{ID: "B-1", Method: "boring"}, {ID: "TP-1", Method: "test_pit"}}
	noPit := []Point{{ID: "B-1", Method: "boring"}, {ID: "S-1", Method: "cpt"}}
	env := &scenarios.Scenario{Zones: []scenarios.Zone{{ID: "A", Use: scenarios.UseStructure}, {ID: "E", Use: scenarios.UseEnvironmental}}}
	dry := &scenarios.Scenario{Zones: []scenarios.Zone{{ID: "A", Use: scenarios.UseStructure}}}
	for _, c := range []struct {
		name      string
		sc        *scenarios.Scenario
		pts       []Point
		pits, idw bool
	}{
		{"borings and CPT, no environmental zone", dry, noPit, false, false},
		{"a test pit", dry, pit, true, false},
		{"an environmental zone", env, noPit, false, true},
		{"both", env, pit, true, true},
	} {
		got := planCautions(c.sc, c.pts)
		all := strings.Join(got, "\n")
		for _, s := range []string{"one-call notice", "1926.1408 Table A", "licensed professional"} {
			if !strings.Contains(all, s) {
				t.Errorf("%s: cautions lack %q", c.name, s)
			}
		}
		if has := strings.Contains(all, "Test pits:"); has != c.pits {
			t.Errorf("%s: test-pit caution shown %v, want %v", c.name, has, c.pits)
		}
		if has := strings.Contains(all, "investigation-derived waste"); has != c.idw {
			t.Errorf("%s: waste caution shown %v, want %v", c.name, has, c.idw)
		}
		if want := 3 + map[bool]int{true: 1}[c.pits] + map[bool]int{true: 1}[c.idw]; len(got) != want {
			t.Errorf("%s: %d cautions, want %d", c.name, len(got), want)
		}
	}
}

// TestShallowBuildingWarning: a structure zone stated shallower than the
// common-practice least depth for buildings (about 20–25 ft or to
// refusal) is flagged; at 20 ft, or with rock above the depth, it is not.
func TestShallowBuildingWarning(t *testing.T) {
	zone := func(depth, rock float64) scenarios.Zone {
		return scenarios.Zone{ID: "B", Use: scenarios.UseStructure, Rules: scenarios.Rules{MinDepthFt: depth}, Ground: scenarios.Ground{RockFt: rock}}
	}
	sc := &scenarios.Scenario{Zones: []scenarios.Zone{zone(10, 0), zone(20, 0), zone(10, 8),
		{ID: "P", Use: scenarios.UsePavement, Rules: scenarios.Rules{MinDepthFt: 5}}}}
	w := shallowBuildingWarnings(sc)
	if len(w) != 1 || !strings.Contains(w[0], "10.0 ft deep") || !strings.Contains(w[0], "common practice") {
		t.Errorf("warnings %q, want one for the 10-ft structure", w)
	}
}
