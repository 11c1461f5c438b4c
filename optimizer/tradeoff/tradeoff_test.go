package tradeoff

import (
	"bytes"
	"context"
	"encoding/json"
	"flag"
	"math"
	"os/exec"
	"strconv"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/mip/miptest"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// demoInput loads a demo scenario with its rate book and the built-in rigs
// in-process (they are plain Go and safe for concurrent calls).
func demoInput(t testing.TB, name string) plan.Input {
	t.Helper()
	sc, err := scenarios.LoadDemo(name, nil)
	if err != nil {
		t.Fatal(err)
	}
	return scenarioInput(t, sc)
}

// scenarioInput is sc with its rate book and the built-in rigs
// in-process.
func scenarioInput(t testing.TB, sc *scenarios.Scenario) plan.Input {
	t.Helper()
	rb, err := ratebooks.Open(sc.RateBook)
	if err != nil {
		t.Fatal(err)
	}
	rigs := map[string]sdk.Rig{}
	for _, n := range builtin.Names() {
		r, err := builtin.New(n)
		if err != nil {
			t.Fatal(err)
		}
		rigs[n] = r
	}
	return plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}
}

var long = flag.Bool("long", false, "also run the slow demo (midrise) in the frontier test")

// analyzer starts an analysis with small sweeps, to keep tests short.
func analyzer(t testing.TB, name string) *Analyzer {
	t.Helper()
	a, err := New(context.Background(), Config{Input: demoInput(t, name), FrontierPoints: 4, BudgetPoints: 4})
	if err != nil {
		t.Fatal(err)
	}
	return a
}

// TestFrontierMonotoneAndFeasible: the least cost with T ≤ D never rises
// as D grows (a plan within D days is within D+1; Haimes et al. 1971), up
// to the gap each solve reports, and every frontier plan meets every rule
// by the plan's own rule checks and finishes within its day limit.
func TestFrontierMonotoneAndFeasible(t *testing.T) {
	demos := []string{"hillside", "wetlot"}
	if *long {
		demos = append(demos, "midrise")
	}
	checked := 0
	defer func() {
		if checked == 0 {
			t.Error("no demo had a trade-off between cost and days to check")
		}
	}()
	for _, name := range demos {
		t.Run(name, func(t *testing.T) {
			a := analyzer(t, name)
			f, err := a.Frontier(context.Background())
			if err != nil {
				t.Fatal(err)
			}
			if len(f.Swept) < 2 {
				if f.FastestBound < f.FastestDays {
					t.Fatalf("the first stage stopped at %d days with bound %d: no sweep", f.FastestDays, f.FastestBound)
				}
				t.Skipf("the fastest plan takes as long as the cheapest (%d days, proven): no trade-off in this demo", f.CheapestDays)
			}
			checked++
			for i, p := range f.Swept {
				if !p.Feasible {
					t.Fatalf("D=%d: no plan (%s)", p.MaxDays, p.Status)
				}
				if p.FieldDays > p.MaxDays {
					t.Errorf("D=%d: plan takes %d days", p.MaxDays, p.FieldDays)
				}
				for _, r := range p.Plan().Rules {
					if !r.Met {
						t.Errorf("D=%d: rule not met: %s %s (%s, %s)", p.MaxDays, r.Zone, r.Rule, r.Required, r.Achieved)
					}
				}
				if i == 0 {
					continue
				}
				prev := f.Swept[i-1]
				// cost(D) ≤ optimum(D) + gap·cost(D) ≤ optimum(D−1) + gap·cost(D)
				// ≤ cost(D−1) + gap·cost(D); cents for rounding.
				if tol := p.OptimalityGap*p.PricedCost + 0.05*float64(p.MaxDays) + 0.05; p.PricedCost > prev.PricedCost+tol {
					t.Errorf("cost rises from %.2f at D=%d to %.2f at D=%d (tolerance %.2f)", prev.PricedCost, prev.MaxDays, p.PricedCost, p.MaxDays, tol)
				}
				if p.BoundCost > p.PricedCost+0.01 {
					t.Errorf("D=%d: bound %.2f above the plan's cost %.2f", p.MaxDays, p.BoundCost, p.PricedCost)
				}
			}
			for i := 1; i < len(f.Points); i++ {
				if !(f.Points[i].FieldDays > f.Points[i-1].FieldDays && f.Points[i].PricedCost < f.Points[i-1].PricedCost) {
					t.Errorf("frontier points %d and %d do not trade days for cost: %+v / %+v", i-1, i, f.Points[i-1].Summary.PricedCost, f.Points[i].Summary.PricedCost)
				}
			}
		})
	}
}

// handSpec is a tiny problem with a frontier worked by hand: four required
// points of 5 h each, 10-h days, and two rigs. Rig A: mobilization 1,000,
// 200 a day. Rig B: mobilization 3,000, 200 a day. Each point costs 100.
//
//	A alone: 20 h → 2 days; 1,000 + 400 + 2·200 = 1,800
//	B alone: 2 days; 3,000 + 400 + 400        = 3,800 (dominated by A)
//	A and B, two points each: 1 day each; 4,000 + 400 + 200 + 200 = 4,800
//	A and B, three and one: 2 days: dearer than A alone
//
// So the fastest plan takes 1 day for 4,800 and the cheapest 2 days for
// 1,800; the frontier is {(1, 4,800), (2, 1,800)}.
func handSpec() *model.Spec {
	s := &model.Spec{NumPoints: 4, PointZone: []int{0, 0, 0, 0}, Required: []bool{true, true, true, true},
		Zones:       []model.Zone{{Name: "z"}},
		Rigs:        []model.Rig{{Name: "A", MobCost: 1000, DayCost: 200}, {Name: "B", MobCost: 3000, DayCost: 200}},
		HoursPerDay: 10, DaysWeight: 0.01,
	}
	for p := 0; p < 4; p++ {
		for r := 0; r < 2; r++ {
			s.Options = append(s.Options, model.Option{Point: p, Rig: r, Cost: 100, Hours: 5, Label: "o"})
		}
	}
	return s
}

func TestEpsilonConstraintHandCase(t *testing.T) {
	s := handSpec()
	m, err := model.Build(s)
	if err != nil {
		t.Fatal(err)
	}
	cheap, err := mip.Solve(context.Background(), m.Problem, mip.Options{})
	if err != nil {
		t.Fatal(err)
	}
	sf, err := EpsilonConstraint(context.Background(), s, cheap, Settings{GapRel: 1e-9, NodeLimit: -1}, 10)
	if err != nil {
		t.Fatal(err)
	}
	if sf.FastestDays != 1 || sf.FastestBound != 1 {
		t.Fatalf("fastest %d days (bound %d), want 1 (worked by hand)", sf.FastestDays, sf.FastestBound)
	}
	want := map[int]struct {
		days int
		cost float64
	}{1: {1, 4800}, 2: {2, 1800}} // worked by hand above
	if len(sf.Points) != len(want) {
		t.Fatalf("%d sweep points, want %d", len(sf.Points), len(want))
	}
	for _, p := range sf.Points {
		w := want[p.MaxDays]
		if p.Sol.Finish != w.days || math.Abs(p.Sol.Cost-w.cost) > 1e-6 {
			t.Errorf("D=%d: %d days, cost %.2f; want %d days, %.2f", p.MaxDays, p.Sol.Finish, p.Sol.Cost, w.days, w.cost)
		}
	}
}

// TestSweepAndFilter checks the sweep of day limits and the dominance
// filter on values worked by hand.
func TestSweepAndFilter(t *testing.T) {
	for _, tc := range []struct {
		lo, hi, n int
		want      string
	}{
		{5, 8, 10, "5 6 7 8"},
		{5, 15, 3, "5 10 15"},
		{5, 15, 4, "5 8 12 15"}, // 5 + k·10/3 rounded
		{7, 7, 4, "7"},
	} {
		var parts []string
		for _, d := range sweepDays(tc.lo, tc.hi, tc.n) {
			parts = append(parts, strconv.Itoa(d))
		}
		if got := strings.Join(parts, " "); got != tc.want {
			t.Errorf("sweepDays(%d, %d, %d) = %s, want %s", tc.lo, tc.hi, tc.n, got, tc.want)
		}
	}
	pt := func(d, days int, cost float64) FrontierPoint {
		return FrontierPoint{MaxDays: d, Summary: Summary{Feasible: true, FieldDays: days, PricedCost: cost}}
	}
	// D=7 found a dearer plan than D=6 (a node limit can do that): it is
	// dominated; D=8's plan ties D=6 on days and is dearer.
	pts := []FrontierPoint{pt(5, 5, 100), pt(6, 6, 90), pt(7, 7, 95), pt(8, 6, 92), pt(9, 9, 80)}
	var got []string
	for _, p := range nonDominated(pts) {
		got = append(got, strconv.Itoa(p.MaxDays))
	}
	if strings.Join(got, " ") != "5 6 9" {
		t.Fatalf("non-dominated %v, want 5 6 9", got)
	}
	// Balanced: scaled to [0, 1], (5,100)→(0,1), (6,90)→(0.25,0.5),
	// (9,80)→(1,0); the nearest to (0,0) is D=6 (distance 0.56).
	if b := balanced(nonDominated(pts)); b != 1 {
		t.Fatalf("balanced index %d, want 1", b)
	}
}

// TestFrontierAndBudgetPointsAgreeWithCBC solves one frontier point (the
// fastest finish as a day limit) and one budget point of the maximal
// covering form with our engine to its stated gap, and with CBC to
// optimality; the engine's value must lie within its gap of CBC's.
func TestFrontierAndBudgetPointsAgreeWithCBC(t *testing.T) {
	cbc, err := exec.LookPath("cbc")
	if err != nil {
		t.Skip("cbc is not on PATH (install Debian's coinor-cbc); skipping the cross-check")
	}
	a := analyzer(t, "hillside")
	f, err := a.Frontier(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	budget := roundTo(0.6*a.Cheapest().PricedCost, 0)
	cells := a.modelCells()
	for _, tc := range []struct {
		name string
		edit func(*model.Spec)
	}{
		{"frontier T ≤ fastest", func(s *model.Spec) { s.MaxDays = float64(f.FastestDays) }},
		{"budget 60 percent of cheapest", func(s *model.Spec) { s.MaximizeCoverage, s.Budget, s.Cells = true, budget, cells }},
	} {
		t.Run(tc.name, func(t *testing.T) {
			v, err := variant(a.pr, tc.edit)
			if err != nil {
				t.Fatal(err)
			}
			res, err := mip.Solve(context.Background(), v.Model.Problem, a.st.mip())
			if err != nil || res.X == nil {
				t.Fatalf("engine: %v %v", res.Status, err)
			}
			want := miptest.CBCOptimum(t, cbc, v.Model.Problem)
			// The engine's value is feasible, so not below CBC's optimum;
			// and within its reported gap above it.
			tol := res.Gap*math.Max(1, math.Abs(res.Obj)) + 1e-6*math.Max(1, math.Abs(want))
			if res.Obj < want-1e-6*math.Max(1, math.Abs(want)) || res.Obj > want+tol {
				t.Fatalf("engine %.6f (gap %.2g), CBC %.6f", res.Obj, res.Gap, want)
			}
		})
	}
}

// TestBudgetCurve: coverage never falls as the budget grows (a plan within
// a budget fits every larger one), the last budget is the cheapest plan's
// cost with every rule met and all the reachable ground covered, and every
// plan keeps within its budget.
func TestBudgetCurve(t *testing.T) {
	a := analyzer(t, "wetlot")
	bc, err := a.BudgetCurve(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	if len(bc.Points) != 4 {
		t.Fatalf("%d points, want 4", len(bc.Points))
	}
	for i, p := range bc.Points {
		if !p.Feasible {
			t.Fatalf("budget %.2f: no plan (%s)", p.Budget, p.Status)
		}
		if p.PricedCost > p.Budget+0.05 {
			t.Errorf("budget %.2f: plan costs %.2f", p.Budget, p.PricedCost)
		}
		if i > 0 && p.WeightedCoveredPct < bc.Points[i-1].WeightedCoveredPct-1e-9 {
			t.Errorf("coverage falls from %.2f%% to %.2f%% as the budget grows", bc.Points[i-1].WeightedCoveredPct, p.WeightedCoveredPct)
		}
	}
	full := bc.Points[bc.Full]
	if math.Abs(bc.FullBudget-a.Cheapest().PricedCost) > 0.01 || full.WeightedCoveredPct < 100-1e-9 {
		t.Errorf("full budget %.2f (cheapest %.2f) covers %.2f%%", bc.FullBudget, a.Cheapest().PricedCost, full.WeightedCoveredPct)
	}
	if bc.Points[0].WeightedCoveredPct >= full.WeightedCoveredPct {
		t.Errorf("the minimal budget covers as much as the full one: no curve")
	}
}

// TestRuleCosts: a relaxed rule never makes the cheapest plan dearer, up to
// the gaps (relaxed optimum ≤ base optimum); no saving exceeds what the
// relaxed solve's bound allows; the list is sorted dearest first; and one
// saving is re-derived by an independent route — the scenario itself
// edited and planned from scratch with plan.Prepare.
func TestRuleCosts(t *testing.T) {
	a := analyzer(t, "hillside")
	rules, err := a.RuleCosts(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	base := a.Cheapest()
	if len(rules) < 10 {
		t.Fatalf("%d rules; the hillside demo has more", len(rules))
	}
	for i, r := range rules {
		for _, x := range []*Relaxation{r.Step, r.Dropped} {
			if x == nil || !x.Feasible {
				continue
			}
			// saving = base − relaxed ≥ base_opt − (relaxed_opt + gap·relaxed)
			// ≥ −gap·relaxed, plus the days tie-break and cents.
			tol := x.Gap*x.Cost + 0.01*30 + 0.05
			if x.Saving < -tol {
				t.Errorf("%s %s, %s: saving %.2f below −%.2f", r.Zone, r.Rule, x.Change, x.Saving, tol)
			}
			if x.Saving > x.MaxSaving+0.05 {
				t.Errorf("%s %s, %s: saving %.2f above the proven most %.2f", r.Zone, r.Rule, x.Change, x.Saving, x.MaxSaving)
			}
		}
		if i > 0 && r.Top() > rules[i-1].Top()+0.01 {
			t.Errorf("not sorted: %s %s (%.2f) after %s %s (%.2f)", r.Zone, r.Rule, r.Top(), rules[i-1].Zone, rules[i-1].Rule, rules[i-1].Top())
		}
	}
	if rules[0].Top() <= 0 {
		t.Fatalf("no rule costs anything; the top is %+v", rules[0])
	}
	// Independent route: the dearest "minimum points" step, planned again
	// from an edited scenario.
	for _, r := range rules {
		if r.Rule != "minimum points" || r.Step == nil || !r.Step.Feasible || r.Step.Saving <= 0 {
			continue
		}
		in := demoInput(t, "hillside")
		z := -1
		for k, zn := range in.Scenario.Zones {
			if zn.ID == r.Zone {
				z = k
			}
		}
		n := a.pr.ZoneMin[z]
		in = withZoneRules(in, z, func(ru *scenarios.Rules) { ru.MinPoints, ru.AreaPerPointFt2 = n-1, 0 })
		pr, err := plan.Prepare(context.Background(), in, plan.Options{})
		if err != nil {
			t.Fatal(err)
		}
		pr, res, _, err := pr.SolveCovered(context.Background(), mip.Options{GapRel: 1e-6})
		if err != nil || res.X == nil {
			t.Fatalf("re-plan: %v %v", res.Status, err)
		}
		saving := base.PricedCost - pr.Model.Decode(res.X).Cost
		tol := r.Step.Gap*r.Step.Cost + base.OptimalityGap*base.PricedCost + 1
		if math.Abs(saving-r.Step.Saving) > tol {
			t.Fatalf("%s minimum points %d → %d: analysis saves %.2f, re-planned scenario saves %.2f (tolerance %.2f)", r.Zone, n, n-1, r.Step.Saving, saving, tol)
		}
		return
	}
	t.Fatal("no minimum-points step with a saving to re-derive")
}

// TestAlternativesAndOutputs runs the alternatives on the smallest demo
// and checks the rows, that the outputs are the same bytes on a second run
// (one worker against two), and that JSON round-trips.
func TestAlternativesAndOutputs(t *testing.T) {
	run := func(workers int) (string, *Analysis) {
		in := demoInput(t, "hillside")
		other, err := ratebooks.Open("coastal-2026")
		if err != nil {
			t.Fatal(err)
		}
		an, err := Analyze(context.Background(), Config{Input: in, RateBooks: []*ratebooks.RateBook{other}, FrontierPoints: 4, BudgetPoints: 4,
			Settings: Settings{Workers: workers}})
		if err != nil {
			t.Fatal(err)
		}
		var b bytes.Buffer
		for _, f := range []func() error{
			func() error { return an.WriteText(&b) },
			func() error { return WriteAlternativesCSV(&b, an.Alternatives) },
			func() error { return WriteFrontierCSV(&b, an.Frontier) },
			func() error { return WriteFrontierSVG(&b, an.Frontier) },
			func() error { return WriteBudgetCSV(&b, an.Budget) },
			func() error { return WriteBudgetSVG(&b, an.Budget) },
			func() error { return WriteRuleCostsText(&b, an.RuleCosts, an.Alternatives[0].PricedCost) },
			func() error { return WriteRuleCostsCSV(&b, an.RuleCosts) },
			func() error { return json.NewEncoder(&b).Encode(an) },
		} {
			if err := f(); err != nil {
				t.Fatal(err)
			}
		}
		return b.String(), an
	}
	out1, an := run(1)
	out2, _ := run(2)
	if out1 != out2 {
		t.Fatal("outputs differ between one and two workers")
	}
	labels := []string{}
	for _, s := range an.Alternatives {
		labels = append(labels, s.Label)
	}
	if got := strings.Join(labels, "|"); got != "cheapest|fastest|balanced|most coverage|cheapest — coastal-2026" {
		t.Fatalf("rows %s", got)
	}
	cheap, fast, cov := an.Alternatives[0], an.Alternatives[1], an.Alternatives[3]
	if fast.FieldDays > cheap.FieldDays || fast.PricedCost < cheap.PricedCost-cheap.OptimalityGap*cheap.PricedCost {
		t.Errorf("fastest (%d days, %.2f) does not trade money for days against cheapest (%d days, %.2f)", fast.FieldDays, fast.PricedCost, cheap.FieldDays, cheap.PricedCost)
	}
	if cov.PricedCost > roundTo(DefaultBudgetShare*cheap.PricedCost, 0)+0.05 {
		t.Errorf("most coverage spends %.2f over its budget", cov.PricedCost)
	}
	if cheap.RulesMet != cheap.RulesTotal || cheap.LargestGapFt == nil || len(cheap.Miss) != len(an.Alternatives[0].Miss) {
		t.Errorf("cheapest row: %+v", cheap)
	}
	for _, s := range an.Alternatives {
		for _, m := range s.Miss {
			if m.MissProbability < 0 || m.MissProbability > 1 || math.Abs(m.MissProbability+m.Probability-1) > 1e-3 {
				t.Errorf("%s zone %s: miss %.4f, hit %.4f", s.Label, m.Zone, m.MissProbability, m.Probability)
			}
		}
	}
	if !strings.Contains(out1, "<svg") || !strings.Contains(out1, "field days") {
		t.Error("charts missing their axis labels")
	}
	var back Analysis
	if err := json.Unmarshal([]byte(out1[strings.Index(out1, `{"scenario"`):]), &back); err != nil {
		t.Fatalf("JSON does not read back: %v", err)
	}
}
