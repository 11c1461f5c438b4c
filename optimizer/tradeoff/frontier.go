package tradeoff

import (
	"context"
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
)

// FrontierPoint is the least-cost plan found with finish T ≤ MaxDays.
type FrontierPoint struct {
	MaxDays int `json:"max_days"` // the ε bound D on the finish
	// BoundCost is the proven lower bound on the cost of any plan with
	// T ≤ MaxDays (the solver's bound less the days tie-break).
	BoundCost float64 `json:"bound_cost"`
	Summary
}

// Frontier is the cost–days trade-off by the ε-constraint method (see the
// package comment).
type Frontier struct {
	Method   string  `json:"method"`
	Currency string  `json:"currency"`
	GapRel   float64 `json:"gap_rel"`
	// FastestDays is the least finish found; FastestBound the proven
	// lower bound on it (equal when proven).
	FastestDays  int `json:"fastest_days"`
	FastestBound int `json:"fastest_bound"`
	CheapestDays int `json:"cheapest_days"`
	// Swept holds every solve, by ascending day limit, as solved.
	Swept []FrontierPoint `json:"swept"`
	// Points are the non-dominated plans, by ascending days (so by
	// descending cost).
	Points []FrontierPoint `json:"points"`
	// Balanced indexes Points: the compromise pick (package comment).
	Balanced int `json:"balanced"`
}

// Frontier computes the cost–days frontier (once; later calls return it).
func (a *Analyzer) Frontier(ctx context.Context) (*Frontier, error) {
	if a.frontier != nil {
		return a.frontier, nil
	}
	pr := a.pr
	cheap := a.cheapest
	f := &Frontier{Method: "epsilon-constraint (Haimes et al. 1971; Chankong & Haimes 1983)", GapRel: a.st.GapRel, CheapestDays: cheap.sum.FieldDays, Currency: pr.In.RateBook.Currency}

	// Stage one of the fastest plan: the least finish alone.
	fast, err := variant(pr, func(s *model.Spec) { s.MinimizeDays = true })
	if err != nil {
		return nil, err
	}
	res, err := mip.Solve(ctx, fast.Model.Problem, a.st.mip())
	if err != nil {
		return nil, err
	}
	if res.X == nil {
		return nil, fmt.Errorf("tradeoff: no plan found when minimizing field days (solver: %s)", res.Status)
	}
	f.FastestDays = int(math.Round(res.Obj))
	f.FastestBound = int(math.Ceil(res.Bound - 1e-6))
	if f.FastestDays > f.CheapestDays {
		// The node limit stopped stage one above the cheapest plan's finish.
		f.FastestDays = f.CheapestDays
	}

	ds := sweepDays(f.FastestDays, f.CheapestDays, a.cfg.FrontierPoints)
	jobs := make([]func(context.Context) (FrontierPoint, error), len(ds))
	for k, d := range ds {
		d := d
		jobs[k] = func(ctx context.Context) (FrontierPoint, error) {
			if d == f.CheapestDays {
				// The cheapest plan finishes in d days, so it is also the
				// least-cost plan with T ≤ d.
				return FrontierPoint{MaxDays: d, BoundCost: boundCost(cheap.res, pr.Spec, d), Summary: relabel(cheap.sum, d)}, nil
			}
			v, err := variant(pr, func(s *model.Spec) { s.MaxDays = float64(d) })
			if err != nil {
				return FrontierPoint{}, err
			}
			o, err := solveVariant(ctx, v, a.st, a.cfg.FeatureDiameterFt, "")
			if err != nil {
				return FrontierPoint{}, err
			}
			return FrontierPoint{MaxDays: d, BoundCost: boundCost(o.res, v.Spec, d), Summary: relabel(o.sum, d)}, nil
		}
	}
	f.Swept, err = runAll(ctx, a.st.Workers, jobs)
	if err != nil {
		return nil, err
	}
	f.Points = nonDominated(f.Swept)
	f.Balanced = balanced(f.Points)
	a.frontier = f
	return f, nil
}

func relabel(s Summary, d int) Summary {
	s.Label = fmt.Sprintf("T ≤ %d days", d)
	s.Note = ""
	return s
}

// boundCost is a proven lower bound on the cost of any plan finishing
// within d days: the solver's bound is on cost + w·T, and w·T ≤ w·d.
func boundCost(res *mip.Result, s *model.Spec, d int) float64 {
	if math.IsInf(res.Bound, 0) || math.IsNaN(res.Bound) {
		return 0
	}
	return roundTo(res.Bound-s.DaysWeight*float64(d), 2)
}

// sweepDays lists the day limits from lo to hi, every one when they fit in
// n, else n spread evenly with both ends.
func sweepDays(lo, hi, n int) []int {
	if hi < lo {
		return []int{hi}
	}
	if hi-lo+1 <= n {
		out := make([]int, 0, hi-lo+1)
		for d := lo; d <= hi; d++ {
			out = append(out, d)
		}
		return out
	}
	var out []int
	for k := 0; k < n; k++ {
		d := lo + int(math.Round(float64(k)*float64(hi-lo)/float64(n-1)))
		if len(out) == 0 || out[len(out)-1] != d {
			out = append(out, d)
		}
	}
	return out
}

// nonDominated keeps the plans no other plan beats on both days and cost
// (ties: the earlier day limit is kept), by ascending days. A plan found at
// a lower day limit is feasible for every higher one; the sweep keeps what
// was found, and the filter drops a later, dearer plan that the node limit
// left behind an earlier one.
func nonDominated(pts []FrontierPoint) []FrontierPoint {
	var out []FrontierPoint
	for i, p := range pts {
		if !p.Feasible {
			continue
		}
		dom := false
		for j, q := range pts {
			if i == j || !q.Feasible {
				continue
			}
			noWorse := q.FieldDays <= p.FieldDays && q.TotalCost <= p.TotalCost
			better := q.FieldDays < p.FieldDays || q.TotalCost < p.TotalCost
			if noWorse && (better || j < i) {
				dom = true
				break
			}
		}
		if !dom {
			out = append(out, p)
		}
	}
	// Ascending days (the sweep order already is, up to equal days).
	for i := 1; i < len(out); i++ {
		for j := i; j > 0 && out[j].FieldDays < out[j-1].FieldDays; j-- {
			out[j], out[j-1] = out[j-1], out[j]
		}
	}
	return out
}

// balanced is the index of the point nearest the ideal (least cost, fewest
// days) with both objectives scaled to [0, 1] over the points; ties go to
// the fewer days.
func balanced(pts []FrontierPoint) int {
	if len(pts) <= 1 {
		return 0
	}
	minC, maxC := math.Inf(1), math.Inf(-1)
	minD, maxD := math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		minC, maxC = math.Min(minC, p.TotalCost), math.Max(maxC, p.TotalCost)
		minD, maxD = math.Min(minD, float64(p.FieldDays)), math.Max(maxD, float64(p.FieldDays))
	}
	scale := func(v, lo, hi float64) float64 {
		if hi <= lo {
			return 0
		}
		return (v - lo) / (hi - lo)
	}
	best, bestD := 0, math.Inf(1)
	for i, p := range pts {
		dc := scale(p.TotalCost, minC, maxC)
		dd := scale(float64(p.FieldDays), minD, maxD)
		if d := math.Hypot(dc, dd); d < bestD-1e-12 {
			best, bestD = i, d
		}
	}
	return best
}
