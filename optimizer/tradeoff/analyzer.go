package tradeoff

import (
	"context"
	"errors"
	"fmt"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/ratebooks"
)

// Config is what an analysis is made from.
type Config struct {
	// Input and PlanOptions are what plan.Prepare takes. Rule costs and
	// the rate-book comparison plan modified copies of Input again.
	// PlanOptions.Budget and MaxDays must be zero: the analysis sets its
	// own limits.
	Input       plan.Input
	PlanOptions plan.Options
	// RateBooks are further rate books to price the cheapest plan under
	// (the Input's own book is always the first row).
	RateBooks []*ratebooks.RateBook
	// Budget for the "most coverage within a budget" alternative; 0:
	// DefaultBudgetShare of the cheapest plan's cost.
	Budget float64
	// FeatureDiameterFt is the plan diameter of the buried feature whose
	// chance of a miss is reported; 0: DefaultFeatureDiameterFt.
	FeatureDiameterFt float64
	FrontierPoints    int // 0: DefaultFrontierPoints
	BudgetPoints      int // 0: DefaultBudgetPoints (at least 2)
	Settings
}

// Analyzer holds a prepared scenario and its cheapest plan, shared by the
// analyses; each analysis is computed once and kept.
type Analyzer struct {
	cfg      Config
	st       Settings
	pr       *plan.Prepared
	cheapest *outcome

	minimal  *outcome
	frontier *Frontier
	budget   *BudgetCurve
}

// New prepares the scenario and solves for the cheapest plan.
func New(ctx context.Context, cfg Config) (*Analyzer, error) {
	if cfg.PlanOptions.Budget != 0 || cfg.PlanOptions.MaxDays != 0 {
		return nil, errors.New("tradeoff: PlanOptions.Budget and MaxDays must be zero; the analysis sets its own limits")
	}
	pr, err := plan.Prepare(ctx, cfg.Input, cfg.PlanOptions)
	if err != nil {
		return nil, err
	}
	return FromPrepared(ctx, pr, cfg)
}

// FromPrepared starts an analysis from a prepared scenario (cfg.Input is
// taken from pr).
func FromPrepared(ctx context.Context, pr *plan.Prepared, cfg Config) (*Analyzer, error) {
	cfg.Input = pr.In
	if cfg.FeatureDiameterFt <= 0 {
		cfg.FeatureDiameterFt = DefaultFeatureDiameterFt
	}
	if cfg.FrontierPoints <= 0 {
		cfg.FrontierPoints = DefaultFrontierPoints
	}
	if cfg.FrontierPoints < 2 {
		cfg.FrontierPoints = 2
	}
	if cfg.BudgetPoints <= 0 {
		cfg.BudgetPoints = DefaultBudgetPoints
	}
	if cfg.BudgetPoints < 2 {
		cfg.BudgetPoints = 2
	}
	a := &Analyzer{cfg: cfg, st: cfg.Settings.withDefaults(), pr: pr}
	o, err := solveCheapest(ctx, pr, a.st, cfg.FeatureDiameterFt, "cheapest")
	if err != nil {
		return nil, err
	}
	if !o.sum.Feasible {
		return nil, &plan.ErrNoPlan{Status: o.res.Status, Why: " (trade-off analysis)"}
	}
	o.sum.Note = "least cost meeting every rule"
	a.cheapest = o
	// The rest of the analysis works on the model with the covering rows
	// the cheapest plan's exact check added.
	a.pr = o.pr
	return a, nil
}

// Prepared is the prepared scenario the analysis works on.
func (a *Analyzer) Prepared() *plan.Prepared { return a.pr }

// Cheapest is the cheapest plan's summary.
func (a *Analyzer) Cheapest() Summary { return a.cheapest.sum }

// Analysis is every trade-off of one scenario.
type Analysis struct {
	Scenario          string       `json:"scenario"`
	RateBook          string       `json:"rate_book"`
	GapRel            float64      `json:"gap_rel"`
	NodeLimit         int          `json:"node_limit"`
	FeatureDiameterFt float64      `json:"feature_diameter_ft"`
	Alternatives      []Summary    `json:"alternatives"`
	Frontier          *Frontier    `json:"frontier"`
	Budget            *BudgetCurve `json:"budget_curve"`
	RuleCosts         []RuleCost   `json:"rule_costs"`
}

// Analyze runs every analysis.
func Analyze(ctx context.Context, cfg Config) (*Analysis, error) {
	a, err := New(ctx, cfg)
	if err != nil {
		return nil, err
	}
	return a.All(ctx)
}

// All runs every analysis on a started analyzer.
func (a *Analyzer) All(ctx context.Context) (*Analysis, error) {
	alts, err := a.Alternatives(ctx)
	if err != nil {
		return nil, err
	}
	if _, err := a.BudgetCurve(ctx); err != nil {
		return nil, err
	}
	rc, err := a.RuleCosts(ctx)
	if err != nil {
		return nil, err
	}
	return &Analysis{
		Scenario: a.pr.In.Scenario.Name, RateBook: a.pr.In.RateBook.Name,
		GapRel: a.st.GapRel, NodeLimit: a.st.NodeLimit, FeatureDiameterFt: a.cfg.FeatureDiameterFt,
		Alternatives: alts, Frontier: a.frontier, Budget: a.budget, RuleCosts: rc,
	}, nil
}

// Alternatives solves the scenario several ways and returns one row each:
// cheapest, fastest, balanced (from the frontier), most coverage within
// the budget, and the cheapest plan under each further rate book.
func (a *Analyzer) Alternatives(ctx context.Context) ([]Summary, error) {
	f, err := a.Frontier(ctx)
	if err != nil {
		return nil, err
	}
	rows := []Summary{a.cheapest.sum}
	if len(f.Points) > 0 {
		fast := f.Points[0].Summary
		fast.Label = "fastest"
		fast.Note = fmt.Sprintf("fewest field days found (%d; proven bound %d), then least cost", f.FastestDays, f.FastestBound)
		rows = append(rows, fast)
		bal := f.Points[f.Balanced].Summary
		bal.Label = "balanced"
		bal.Note = "frontier point nearest the ideal (least cost, fewest days), each scaled to [0, 1]"
		rows = append(rows, bal)
	}
	budget := a.cfg.Budget
	if budget <= 0 {
		budget = roundTo(DefaultBudgetShare*a.cheapest.sum.PricedCost, 0)
	}
	var from *outcome
	if a.large() {
		// The start of a large site's solve (coverOptions).
		if from, err = a.minimalProgram(ctx); err != nil {
			return nil, err
		}
	}
	co, err := a.maxCover(ctx, budget, "most coverage", from)
	if err != nil {
		return nil, err
	}
	cov := co.sum
	cov.Note = fmt.Sprintf("largest priority-weighted area covered for at most %s", money(budget))
	if a.large() {
		cov.Note += fmt.Sprintf(" (node limit %d on a site this large; the gap is against the proven bound)", a.coverOptions(a.pr, nil).NodeLimit)
	}
	rows = append(rows, cov)

	var jobs []func(context.Context) (Summary, error)
	seen := map[string]bool{a.pr.In.RateBook.Name: true}
	for _, rb := range a.cfg.RateBooks {
		if rb == nil || seen[rb.Name] {
			continue
		}
		seen[rb.Name] = true
		rb := rb
		jobs = append(jobs, func(ctx context.Context) (Summary, error) {
			in := a.pr.In
			in.RateBook = rb
			pr, err := plan.Prepare(ctx, in, a.cfg.PlanOptions)
			if err != nil {
				return Summary{}, fmt.Errorf("rate book %q: %w", rb.Name, err)
			}
			o, err := solveCheapest(ctx, pr, a.st, a.cfg.FeatureDiameterFt, "cheapest — "+rb.Name)
			if err != nil {
				return Summary{}, err
			}
			o.sum.Note = "least cost meeting every rule, priced under rate book " + rb.Name
			return o.sum, nil
		})
	}
	more, err := runAll(ctx, a.st.Workers, jobs)
	if err != nil {
		return nil, err
	}
	return append(rows, more...), nil
}
