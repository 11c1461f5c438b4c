package tradeoff

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// withLargePaths runs f with every model counted as large (localMinCols
// 0), so the localized rule costs and the limited covering solves run on
// inputs small enough to solve whole as well.
func withLargePaths(t *testing.T, f func()) {
	t.Helper()
	old := localMinCols
	localMinCols = 0
	defer func() { localMinCols = old }()
	f()
}

// TestLocalizedRuleCostsBracketWholeSite: on the generated 10-acre site
// (invented data, scenarios/sitegen), every rule cost is found twice — by
// whole-site re-solves and by the localized re-solve of the relaxed zone.
// The two routes must agree where each is proven: a localized plan is a
// plan of the relaxed site, so its saving cannot exceed the whole-site
// solve's proven most (MaxSaving, from the branch-and-bound bound), and
// the whole-site plan's saving cannot exceed the localized result's
// proven most (from the whole site's LP bound). A localized result that
// calls itself the whole-site answer ("optimal") must be within both
// gaps of the whole-site one, and every other one must say it is
// localized.
func TestLocalizedRuleCostsBracketWholeSite(t *testing.T) {
	ctx := context.Background()
	in := generatedInput(t, sitegen.Site(10, 1))
	run := func() map[string]*Relaxation {
		a, err := New(ctx, Config{Input: in})
		if err != nil {
			t.Fatal(err)
		}
		rc, err := a.RuleCosts(ctx)
		if err != nil {
			t.Fatal(err)
		}
		out := map[string]*Relaxation{}
		for _, r := range rc {
			for _, x := range []*Relaxation{r.Step, r.Dropped} {
				if x != nil {
					out[r.Zone+" "+r.Rule+" "+x.Change] = x
				}
			}
		}
		return out
	}
	whole := run()
	var local map[string]*Relaxation
	withLargePaths(t, func() { local = run() })
	if len(local) != len(whole) || len(whole) < 10 {
		t.Fatalf("%d localized relaxations, %d whole-site ones; want the same, at least 10", len(local), len(whole))
	}
	localized := 0
	for k, w := range whole {
		l := local[k]
		if l == nil {
			t.Errorf("%s: no localized result", k)
			continue
		}
		if !w.Feasible || !l.Feasible {
			continue
		}
		if strings.HasPrefix(l.Status, "localized") {
			localized++
			if !strings.Contains(l.Note, "only this zone re-planned") {
				t.Errorf("%s: localized result without saying so: %q", k, l.Note)
			}
		}
		if l.Saving > l.MaxSaving+0.05 {
			t.Errorf("%s: localized saving %.2f above its own proven most %.2f", k, l.Saving, l.MaxSaving)
		}
		if l.Saving > w.MaxSaving+0.05 {
			t.Errorf("%s: localized saving %.2f above the whole site's proven most %.2f", k, l.Saving, w.MaxSaving)
		}
		if w.Saving > l.MaxSaving+0.05 {
			t.Errorf("%s: whole-site saving %.2f above the localized proven most %.2f", k, w.Saving, l.MaxSaving)
		}
		if l.Status == "optimal" {
			tol := l.Gap*l.Cost + w.Gap*w.Cost + 0.05
			if d := l.Cost - w.Cost; d > tol || -d > tol {
				t.Errorf("%s: localized cost %.2f called whole-site, whole-site cost %.2f (tolerance %.2f)", k, l.Cost, w.Cost, tol)
			}
		}
	}
	t.Logf("%d of %d relaxations localized", localized, len(local))
	if localized == 0 {
		return
	}
	// The text table marks every localized saving as a least one.
	var rules []RuleCost
	for k, x := range local {
		rules = append(rules, RuleCost{Zone: k, Rule: "r", Step: x})
	}
	var b strings.Builder
	if err := WriteRuleCostsText(&b, rules, 0); err != nil {
		t.Fatal(err)
	}
	if n := strings.Count(b.String(), "≥ "); n != localized {
		t.Errorf("%d savings marked ≥ in the text, %d localized", n, localized)
	}
	if !strings.Contains(b.String(), "only that zone re-planned") {
		t.Error("the text does not explain the ≥ mark")
	}
	b.Reset()
	if err := WriteRuleCostsCSV(&b, rules); err != nil {
		t.Fatal(err)
	}
	if n := strings.Count(b.String(), localizedCSVMark); n != localized {
		t.Errorf("%d changes marked localized in the CSV, %d localized", n, localized)
	}
}

// TestLargeBudgetCurve: the budget curve's large-site path (starts from a
// lower budget's plan, node limit largeCoverNodeLimit), forced on the
// wetlot demo, keeps the curve's guarantees — within budget, coverage
// never falling as the budget grows, the full budget covering all the
// reachable ground — states its node limit, and gives the same bytes on
// one worker as on two.
func TestLargeBudgetCurve(t *testing.T) {
	withLargePaths(t, func() {
		run := func(workers int) *BudgetCurve {
			a, err := New(context.Background(), Config{Input: demoInput(t, "wetlot"), FrontierPoints: 4, BudgetPoints: 5, Settings: Settings{Workers: workers}})
			if err != nil {
				t.Fatal(err)
			}
			bc, err := a.BudgetCurve(context.Background())
			if err != nil {
				t.Fatal(err)
			}
			return bc
		}
		bc := run(2)
		if bc.NodeLimit != largeCoverNodeLimit {
			t.Errorf("node limit %d stated, want %d", bc.NodeLimit, largeCoverNodeLimit)
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
		if full := bc.Points[bc.Full]; full.WeightedCoveredPct < 100-1e-9 {
			t.Errorf("full budget covers %.2f%%", full.WeightedCoveredPct)
		}
		one := run(1)
		for i := range bc.Points {
			p, q := bc.Points[i], one.Points[i]
			if p.PricedCost != q.PricedCost || p.WeightedCoveredPct != q.WeightedCoveredPct || p.Status != q.Status {
				t.Errorf("budget %.2f: two workers give %.2f / %.2f%% (%s), one gives %.2f / %.2f%% (%s)", p.Budget, p.PricedCost, p.WeightedCoveredPct, p.Status, q.PricedCost, q.WeightedCoveredPct, q.Status)
			}
		}
	})
}
