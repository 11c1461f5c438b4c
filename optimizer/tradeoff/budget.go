package tradeoff

import (
	"context"
	"fmt"
	"strconv"
	"strings"

	moneyfmt "github.com/rigmix/rigmix/internal/money"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/plan"
)

// BudgetPoint is the most coverage found for at most Budget.
type BudgetPoint struct {
	Budget float64 `json:"budget"`
	// FromLower is true when the plan is the one found for a lower budget,
	// which covered more than the solve at this budget found (a plan
	// within a lower budget fits this one too).
	FromLower bool `json:"from_lower_budget,omitempty"`
	Summary
}

// BudgetCurve is the budget–coverage curve of the maximal covering form.
type BudgetCurve struct {
	Method   string  `json:"method"`
	Currency string  `json:"currency"`
	GapRel   float64 `json:"gap_rel"`
	// MinimalBudget is the cost of the cheapest minimal program (one point
	// in every zone plus the required points); FullBudget the cost of the
	// cheapest plan that meets every rule.
	MinimalBudget float64       `json:"minimal_budget"`
	FullBudget    float64       `json:"full_budget"`
	Points        []BudgetPoint `json:"points"`
	// Full indexes the point at FullBudget; Knee the knee of the curve.
	Full int `json:"full"`
	Knee int `json:"knee"`
	// NodeLimit is set when the maximal covering solves ran under a node
	// limit other than the analysis's (largeCoverNodeLimit, on a large
	// site); each point's gap says how far from proven it is.
	NodeLimit int `json:"node_limit,omitempty"`
}

// cellsOf groups the layout's coverage cells by the set of candidates that
// cover them: cells with the same set are covered together, so one column
// with their summed weighted area is exact and keeps the program small.
func cellsOf(cells []cellLike) []model.Cell {
	idx := map[string]int{}
	var out []model.Cell
	for _, c := range cells {
		var b strings.Builder
		for _, p := range c.points {
			b.WriteString(strconv.Itoa(p))
			b.WriteByte(',')
		}
		k := b.String()
		// Candidates belong to one zone, so cells with the same set share
		// a zone and its weight.
		if i, ok := idx[k]; ok {
			out[i].AreaFt2 += c.area
			continue
		}
		idx[k] = len(out)
		out = append(out, model.Cell{AreaFt2: c.area, Weight: c.weight, Points: c.points})
	}
	return out
}

type cellLike struct {
	area, weight float64
	points       []int
}

func (a *Analyzer) modelCells() []model.Cell {
	cs := make([]cellLike, len(a.pr.Layout.Cells))
	for i, c := range a.pr.Layout.Cells {
		cs[i] = cellLike{area: c.AreaFt2, weight: c.Weight, points: c.CoveredBy}
	}
	return cellsOf(cs)
}

// largeCoverNodeLimit bounds the branch and bound of each maximal
// covering solve on a large site (localMinCols columns or more). Measured
// on the generated 100-acre site (2-core reference machine, 2026-12-01):
// a solve took 4–8 s at the root, most of it the root's sub-MIP
// heuristics, and every further node about 0.1 s; 400 nodes moved the
// proven bound by under 1 % of the coverage while the gap stayed at
// 2–10 % at low budgets, and one budget point reached the 60 s time
// limit, so its result depended on the machine. 20 nodes found the same
// plans as the root alone at the budgets tried. The root with a start
// (below) is what the curve can afford there: nine solves instead of
// minutes each. Every point still reports its proven gap, and the curve
// states the limit (BudgetCurve.NodeLimit). Our choice.
const largeCoverNodeLimit = 1

// budgetChains: on a large site the budget curve is solved in this many
// chains (every budgetChains-th budget, in increasing order), each solve
// starting from its chain's plan for the budget before; two keep the two
// workers of the reference machine busy.
const budgetChains = 2

// large reports whether the site is large enough for the restricted
// solves (localMinCols).
func (a *Analyzer) large() bool { return a.pr.Model.Problem.LP.NumCols >= localMinCols }

// coverOptions are the engine options of a maximal covering solve of v.
// On a large site the node limit is largeCoverNodeLimit and the solve
// starts from the plan of from (a plan of a lower budget, or the minimal
// program), which fits every higher budget; the engine searches around
// it at the root (RINS). A start never changes what is optimal.
func (a *Analyzer) coverOptions(v *plan.Prepared, from *outcome) mip.Options {
	opt := a.st.mip()
	if !a.large() {
		return opt
	}
	if opt.NodeLimit == 0 || opt.NodeLimit > largeCoverNodeLimit {
		opt.NodeLimit = largeCoverNodeLimit
	}
	if from != nil && from.res != nil && from.res.X != nil {
		opt.Start = byName(from.pr.Model.Problem.ColNames, from.res.X, v.Model.Problem.ColNames)
	}
	return opt
}

// byName maps x over the columns named from onto the columns named to
// (models built from the same layout name their columns alike); columns
// of to with no match are 0.
func byName(from []string, x []float64, to []string) []float64 {
	idx := make(map[string]int, len(from))
	for i, n := range from {
		idx[n] = i
	}
	out := make([]float64, len(to))
	for j, n := range to {
		if i, ok := idx[n]; ok {
			out[j] = x[i]
		}
	}
	return out
}

// maxCover solves the maximal covering form for a budget, starting (on a
// large site) from the plan of from.
func (a *Analyzer) maxCover(ctx context.Context, budget float64, label string, from *outcome) (*outcome, error) {
	cells := a.modelCells()
	if len(cells) == 0 {
		return &outcome{sum: Summary{Label: label, Status: "no coverage cells (no zone has a spacing rule)"}}, nil
	}
	v, err := variant(a.pr, func(s *model.Spec) {
		s.MaximizeCoverage = true
		s.Budget = budget
		s.Cells = cells
	})
	if err != nil {
		return nil, err
	}
	return solveWith(ctx, v, a.coverOptions(v, from), a.cfg.FeatureDiameterFt, label)
}

// minimalProgram is the cheapest plan that places one point in every zone
// and the required points, keeping the sampled shares: the least a program
// can spend (solved once; later calls return it).
func (a *Analyzer) minimalProgram(ctx context.Context) (*outcome, error) {
	if a.minimal != nil {
		return a.minimal, nil
	}
	v, err := variant(a.pr, func(s *model.Spec) {
		s.CoverRows = nil
		zs := append([]model.Zone(nil), s.Zones...)
		for z := range zs {
			zs[z].MinCount = 1
		}
		s.Zones = zs
	})
	if err != nil {
		return nil, err
	}
	o, err := solveVariant(ctx, v, a.st, a.cfg.FeatureDiameterFt, "minimal program")
	if err != nil {
		return nil, err
	}
	a.minimal = o
	return o, nil
}

// BudgetCurve sweeps budgets from the minimal program's cost to the
// cheapest full plan's cost (once; later calls return it).
//
// On a large site the budgets are solved in budgetChains chains (every
// other budget, in increasing order), each solve starting from the plan
// its chain found for the budget before, so two workers stay busy and the
// result depends neither on the worker count nor on which finishes first.
func (a *Analyzer) BudgetCurve(ctx context.Context) (*BudgetCurve, error) {
	if a.budget != nil {
		return a.budget, nil
	}
	mo, err := a.minimalProgram(ctx)
	if err != nil {
		return nil, err
	}
	minimal := mo.sum
	if !minimal.Feasible {
		return nil, fmt.Errorf("tradeoff: no minimal program found (%s)", minimal.Status)
	}
	full := a.cheapest.sum
	bc := &BudgetCurve{
		Method:        "maximal covering (Church & ReVelle 1974), priority-weighted area, cost ≤ budget",
		GapRel:        a.st.GapRel,
		Currency:      a.pr.In.RateBook.Currency,
		MinimalBudget: minimal.PricedCost, FullBudget: full.PricedCost,
	}
	if a.large() {
		bc.NodeLimit = a.coverOptions(a.pr, nil).NodeLimit
	}
	// Budgets bound the priced cost; a cent at both ends allows the
	// rounding of PricedCost, so that the plans that set them fit them.
	lo := minimal.PricedCost + 0.01
	n := a.cfg.BudgetPoints
	budgets := make([]float64, n)
	for k := range budgets {
		budgets[k] = roundTo(lo+float64(k)*(full.PricedCost+0.01-lo)/float64(n-1), 2)
	}
	chains := n
	if a.large() {
		// A fixed count, not the worker count: which plan starts which
		// solve must not depend on the machine.
		chains = min(n, budgetChains)
	}
	outs := make([]*outcome, n)
	jobs := make([]func(context.Context) (struct{}, error), chains)
	for c := range jobs {
		c := c
		jobs[c] = func(ctx context.Context) (struct{}, error) {
			from := mo
			for k := c; k < n; k += chains {
				o, err := a.maxCover(ctx, budgets[k], fmt.Sprintf("budget %s", money(budgets[k])), from)
				if err != nil {
					return struct{}{}, err
				}
				outs[k] = o
				if o.res != nil && o.res.X != nil {
					from = o
				}
			}
			return struct{}{}, nil
		}
	}
	if _, err := runAll(ctx, a.st.Workers, jobs); err != nil {
		return nil, err
	}
	for k, o := range outs {
		s := o.sum
		p := BudgetPoint{Budget: roundTo(budgets[k], 2), Summary: s}
		// The cheapest full plan fits the full budget, and every plan
		// found for a lower budget fits a higher one: keep the best known.
		if k == n-1 && (!p.Feasible || full.WeightedCoveredPct > p.WeightedCoveredPct) {
			p.Summary = full
			p.Label = fmt.Sprintf("budget %s", money(p.Budget))
			p.Note = "the cheapest plan meeting every rule"
		}
		if k > 0 {
			prev := bc.Points[k-1]
			if prev.Feasible && (!p.Feasible || prev.WeightedCoveredPct > p.WeightedCoveredPct) {
				p.Summary, p.FromLower = prev.Summary, true
				p.Label = fmt.Sprintf("budget %s", money(p.Budget))
			}
		}
		bc.Points = append(bc.Points, p)
	}
	bc.Full = n - 1
	bc.Knee = knee(bc.Points)
	a.budget = bc
	return bc, nil
}

// knee is the index of the point farthest above the chord from the first
// to the last point, both axes scaled to [0, 1] (package comment).
func knee(pts []BudgetPoint) int {
	if len(pts) < 3 {
		return len(pts) - 1
	}
	x0, x1 := pts[0].Budget, pts[len(pts)-1].Budget
	y0, y1 := pts[0].WeightedCoveredPct, pts[len(pts)-1].WeightedCoveredPct
	if x1 <= x0 || y1 <= y0 {
		return len(pts) - 1
	}
	best, bestD := len(pts)-1, 0.0
	for i, p := range pts {
		x := (p.Budget - x0) / (x1 - x0)
		y := (p.WeightedCoveredPct - y0) / (y1 - y0)
		// Distance above the chord y = x, up to the constant 1/√2.
		if d := y - x; d > bestD+1e-12 {
			best, bestD = i, d
		}
	}
	return best
}

// money formats an amount for people: thousands separators and two
// decimals, as every text and table of rigmix does (internal/money).
func money(v float64) string { return moneyfmt.Format(v) }
