package cli

import (
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/tradeoff"
	"github.com/rigmix/rigmix/scenarios"
)

// TestCautionsFitTheRun: schedule prints the plan's own cautions (every
// caution for a plan file that carries none); tradeoffs prints the
// test-pit caution only when an alternative digs a pit and the waste
// caution only on a site with an environmental zone.
func TestCautionsFitTheRun(t *testing.T) {
	if got := planCautions(&plan.Plan{Cautions: []string{"x"}}); len(got) != 1 || got[0] != "x" {
		t.Errorf("plan cautions %q", got)
	}
	if got := planCautions(&plan.Plan{}); len(got) != len(plan.Cautions) {
		t.Errorf("a plan without cautions gets %d, want all %d", len(got), len(plan.Cautions))
	}
	dry := &scenarios.Scenario{Zones: []scenarios.Zone{{ID: "A", Use: scenarios.UseStructure}}}
	env := &scenarios.Scenario{Zones: []scenarios.Zone{{ID: "A", Use: scenarios.UseStructure}, {ID: "E", Use: scenarios.UseEnvironmental}}}
	borings := &tradeoff.Analysis{Alternatives: []tradeoff.Summary{{PointsByMethod: map[string]int{"boring": 4}}}}
	pits := &tradeoff.Analysis{Alternatives: []tradeoff.Summary{{PointsByMethod: map[string]int{"boring": 4}}, {PointsByMethod: map[string]int{"test_pit": 1}}}}
	for _, c := range []struct {
		name     string
		sc       *scenarios.Scenario
		an       *tradeoff.Analysis
		pit, idw bool
	}{
		{"borings, dry site", dry, borings, false, false},
		{"an alternative with a pit", dry, pits, true, false},
		{"environmental zone", env, borings, false, true},
	} {
		all := strings.Join(tradeoffCautions(c.sc, c.an), "\n")
		if !strings.Contains(all, "one-call notice") || !strings.Contains(all, "licensed professional") {
			t.Errorf("%s: the always-cautions are missing", c.name)
		}
		if strings.Contains(all, "Test pits:") != c.pit || strings.Contains(all, "investigation-derived waste") != c.idw {
			t.Errorf("%s: cautions %q", c.name, all)
		}
	}
}
