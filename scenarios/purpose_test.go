package scenarios

import (
	"errors"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// TestSchoolMinimumDepth: a two-story school on 6-ft square footings gets
// borings at least to the building minimum, 25 ft (common practice: about
// 20–25 ft or to refusal, whatever the stress rule gives), where the ASCE
// (1972) stress rule alone gives 15 ft (D1 13 ft below a 2-ft-deep footing).
func TestSchoolMinimumDepth(t *testing.T) {
	z := mustZone(t, oneZone("ft", structureZone("200", "150", "2", "light", "{surface: firm, groundwater_depth: 15}",
		"{max_spacing: 50, min_depth: {from: footing, width: 6, bearing_pressure: 2500, foundation_depth: 2}}"), ""))
	if z.Rules.MinDepthFt < 25 {
		t.Errorf("two-story school: borings %.1f ft, want at least the 25 ft building minimum (common practice)", z.Rules.MinDepthFt)
	}
	o := z.Rules.Origins["min_depth"]
	if !strings.Contains(o, "raised from the rule's") || !strings.Contains(o, "common practice") {
		t.Errorf("origin %q does not give the basis of the minimum", o)
	}
}

func TestZonePurposes(t *testing.T) {
	for _, c := range []struct {
		zone string
		want []lab.Purpose
	}{
		{openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), []lab.Purpose{lab.General}},
		{structureZone("200", "150", "2", "light", "{surface: firm}", "{max_spacing: 50, min_depth: 30}"), []lab.Purpose{lab.Foundation}},
		{"    purpose: [pond, soft_ground]\n" + openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), []lab.Purpose{lab.Pond, lab.SoftGround}},
	} {
		if got := mustZone(t, oneZone("ft", c.zone, "")).Purposes; !reflect.DeepEqual(got, c.want) {
			t.Errorf("purposes %v, want %v", got, c.want)
		}
	}
	if got := PurposesOf(UsePavement); !reflect.DeepEqual(got, []lab.Purpose{lab.Pavement}) {
		t.Errorf("pavement zone: %v", got)
	}
}

func TestSampleSchedule(t *testing.T) {
	z := mustZone(t, oneZone("ft", openZone("{surface: firm}", "{max_spacing: 100, min_depth: 40, sample_schedule: [{to: 15, every: 2.5}, {every: 5}]}"), ""))
	want := []sdk.SampleBand{{ToFt: 15, EveryFt: 2.5}, {EveryFt: 5}}
	if !reflect.DeepEqual(z.Rules.SampleSchedule, want) || z.Rules.Origins["sample_schedule"] != OriginScenario {
		t.Errorf("schedule %v (origin %q), want %v", z.Rules.SampleSchedule, z.Rules.Origins["sample_schedule"], want)
	}
	// A metre file: bands converted exactly (1 ft = 0.3048 m).
	zm := mustZone(t, oneZone("m", openZone("{surface: firm}", "{max_spacing: 30, min_depth: 12, sample_schedule: [{to: 3.048, every: 0.762}, {every: 1.524}]}"), ""))
	if b := zm.Rules.SampleSchedule; len(b) != 2 || !near(b[0].ToFt, 10) || !near(b[0].EveryFt, 2.5) || !near(b[1].EveryFt, 5) {
		t.Errorf("metre schedule %v", b)
	}
	for _, c := range []struct{ rules, field, problem string }{
		{"{max_spacing: 100, min_depth: 40, sample_schedule: [{every: 2.5}, {to: 20, every: 5}]}", "zones[0].rules.sample_schedule[0].to", "missing"},
		{"{max_spacing: 100, min_depth: 40, sample_schedule: [{to: 10, every: 2.5}, {to: 8, every: 5}]}", "zones[0].rules.sample_schedule[1].to", "deeper than the band above"},
		{"{max_spacing: 100, min_depth: 40, sample_schedule: [{to: 10}]}", "zones[0].rules.sample_schedule[0].every", "missing"},
		{"{max_spacing: 100, min_depth: 40, sample_interval: 5, sample_schedule: [{every: 5}]}", "zones[0].rules.sample_schedule", "both"},
		{"{max_spacing: 100, min_depth: 40, sample_schedule: [{to: 10, evry: 2.5}]}", "zones[0].rules.sample_schedule[0].evry", "unknown key"},
	} {
		_, err := Parse(oneZone("ft", openZone("{surface: firm}", c.rules), ""), "t.yaml", nil)
		var fe *FieldError
		if !errors.As(err, &fe) || fe.Field != c.field || !strings.Contains(fe.Problem, c.problem) {
			t.Errorf("%s: %v, want %s: %s", c.rules, err, c.field, c.problem)
		}
	}
	_, err := Parse(oneZone("ft", "    purpose: [runway]\n"+openZone("{surface: firm}", "{max_spacing: 100, min_depth: 10}"), ""), "t.yaml", nil)
	var fe *FieldError
	if !errors.As(err, &fe) || fe.Field != "zones[0].purpose[0]" || !strings.Contains(fe.Hint, "pavement") {
		t.Errorf("unknown purpose: %v", err)
	}
}

func near(a, b float64) bool { d := a - b; return d < 1e-9 && d > -1e-9 }
