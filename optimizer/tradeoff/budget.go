package tradeoff

import (
	"context"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/rigmix/rigmix/optimizer/model"
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

// maxCover solves the maximal covering form for a budget.
func (a *Analyzer) maxCover(ctx context.Context, budget float64, label string) (Summary, error) {
	cells := a.modelCells()
	if len(cells) == 0 {
		return Summary{Label: label, Status: "no coverage cells (no zone has a spacing rule)"}, nil
	}
	v, err := variant(a.pr, func(s *model.Spec) {
		s.MaximizeCoverage = true
		s.Budget = budget
		s.Cells = cells
	})
	if err != nil {
		return Summary{}, err
	}
	o, err := solveVariant(ctx, v, a.st, a.cfg.FeatureDiameterFt, label)
	if err != nil {
		return Summary{}, err
	}
	return o.sum, nil
}

// minimalProgram is the cheapest plan that places one point in every zone
// and the required points, keeping the sampled shares: the least a program
// can spend.
func (a *Analyzer) minimalProgram(ctx context.Context) (Summary, error) {
	v, err := variant(a.pr, func(s *model.Spec) {
		s.CoverRows = nil
		zs := append([]model.Zone(nil), s.Zones...)
		for z := range zs {
			zs[z].MinCount = 1
		}
		s.Zones = zs
	})
	if err != nil {
		return Summary{}, err
	}
	o, err := solveVariant(ctx, v, a.st, a.cfg.FeatureDiameterFt, "minimal program")
	if err != nil {
		return Summary{}, err
	}
	return o.sum, nil
}

// BudgetCurve sweeps budgets from the minimal program's cost to the
// cheapest full plan's cost (once; later calls return it).
func (a *Analyzer) BudgetCurve(ctx context.Context) (*BudgetCurve, error) {
	if a.budget != nil {
		return a.budget, nil
	}
	minimal, err := a.minimalProgram(ctx)
	if err != nil {
		return nil, err
	}
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
	// Budgets bound the priced cost; a cent at both ends allows the
	// rounding of PricedCost, so that the plans that set them fit them.
	lo := minimal.PricedCost + 0.01
	n := a.cfg.BudgetPoints
	budgets := make([]float64, n)
	for k := range budgets {
		budgets[k] = roundTo(lo+float64(k)*(full.PricedCost+0.01-lo)/float64(n-1), 2)
	}
	jobs := make([]func(context.Context) (Summary, error), n)
	for k, b := range budgets {
		b := b
		jobs[k] = func(ctx context.Context) (Summary, error) {
			return a.maxCover(ctx, b, fmt.Sprintf("budget %s", money(b)))
		}
	}
	sums, err := runAll(ctx, a.st.Workers, jobs)
	if err != nil {
		return nil, err
	}
	for k, s := range sums {
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

// money formats an amount with thousands separators and no cents.
func money(v float64) string {
	neg := v < 0
	s := strconv.FormatFloat(math.Round(math.Abs(v)), 'f', 0, 64)
	var b strings.Builder
	for i, c := range s {
		if i > 0 && (len(s)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(c)
	}
	if neg {
		return "-" + b.String()
	}
	return b.String()
}
