package tradeoff

import (
	"context"
	"errors"
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

// SpecPoint is one ε-constraint solve on a plain spec.
type SpecPoint struct {
	MaxDays int
	Model   *model.Model
	Result  *mip.Result
	Sol     model.Solution // decoded; zero when Result.X is nil
}

// SpecFrontier is the raw ε-constraint sweep of a spec.
type SpecFrontier struct {
	FastestDays, FastestBound int
	Points                    []SpecPoint // by ascending MaxDays
}

// EpsilonConstraint sweeps the day limit D over the integers from the
// least finish to the cheapest plan's finish (at most maxPoints of them,
// both ends kept) and solves min cost s.t. T ≤ D for each; s is not
// changed. cheapest is a solve of s itself (no day limit): its plan
// finishes in cheapestDays and is the least-cost plan with T ≤ that, so it
// stands for the last point. The least finish is found first by minimizing
// T alone (Spec.MinimizeDays).
func EpsilonConstraint(ctx context.Context, s *model.Spec, cheapest *mip.Result, st Settings, maxPoints int) (*SpecFrontier, error) {
	st = st.withDefaults()
	if cheapest == nil || cheapest.X == nil {
		return nil, errors.New("tradeoff: the ε-constraint sweep needs a solved cheapest plan")
	}
	base, err := model.Build(s)
	if err != nil {
		return nil, err
	}
	cheapestDays := base.Decode(cheapest.X).Finish
	fs := *s
	fs.MinimizeDays = true
	fm, err := model.Build(&fs)
	if err != nil {
		return nil, err
	}
	// On a large site every solve of the sweep starts from a plan that
	// meets its rows: the cheapest plan for the least finish (the same
	// columns; only the objective differs), the fastest plan for each
	// finish limit (it finishes within every limit of the sweep).
	large := base.Problem.LP.NumCols >= localMinCols
	opt := st.mip()
	if large {
		opt.Start = cheapest.X
	}
	// With several crews of a rig allowed, the cheapest plan shared among
	// the crews (model.SplitCrews) is a faster start.
	for _, rg := range s.Rigs {
		if rg.Unit > 1 {
			opt.Start = base.StartFor(base.SplitCrews(base.Decode(cheapest.X).Chosen))
			break
		}
	}
	res, err := mip.Solve(ctx, fm.Problem, opt)
	if err != nil {
		return nil, err
	}
	if res.X == nil {
		return nil, fmt.Errorf("tradeoff: no plan found when minimizing field days (solver: %s)", res.Status)
	}
	out := &SpecFrontier{FastestDays: int(math.Round(res.Obj)), FastestBound: int(math.Ceil(res.Bound - 1e-6))}
	if out.FastestDays > cheapestDays {
		// The node limit stopped the first stage above the cheapest finish.
		out.FastestDays = cheapestDays
	}
	ds := sweepDays(out.FastestDays, cheapestDays, maxPoints)
	jobs := make([]func(context.Context) (SpecPoint, error), len(ds))
	for k, d := range ds {
		d := d
		jobs[k] = func(ctx context.Context) (SpecPoint, error) {
			if d == cheapestDays {
				return SpecPoint{MaxDays: d, Model: base, Result: cheapest, Sol: base.Decode(cheapest.X)}, nil
			}
			v := *s
			v.MaxDays = float64(d)
			m, err := model.Build(&v)
			if err != nil {
				return SpecPoint{}, err
			}
			opt := st.mip()
			if large {
				opt.Start = res.X
			}
			r, err := mip.Solve(ctx, m.Problem, opt)
			if err != nil {
				return SpecPoint{}, err
			}
			p := SpecPoint{MaxDays: d, Model: m, Result: r}
			if r.X != nil {
				p.Sol = m.Decode(r.X)
			}
			return p, nil
		}
	}
	out.Points, err = runAll(ctx, st.Workers, jobs)
	if err != nil {
		return nil, err
	}
	return out, nil
}

// Frontier computes the cost–days frontier (once; later calls return it).
func (a *Analyzer) Frontier(ctx context.Context) (*Frontier, error) {
	if a.frontier != nil {
		return a.frontier, nil
	}
	pr := a.pr
	cheap := a.cheapest
	f := &Frontier{Method: "epsilon-constraint (Haimes et al. 1971; Chankong & Haimes 1983)", GapRel: a.st.GapRel, CheapestDays: cheap.sum.FieldDays, Currency: pr.In.RateBook.Currency}
	sf, err := EpsilonConstraint(ctx, pr.Spec, cheap.res, a.st, a.cfg.FrontierPoints)
	if err != nil {
		return nil, err
	}
	f.FastestDays, f.FastestBound = sf.FastestDays, sf.FastestBound
	// Each point's plan is completed to the exact coverage rule (rows at
	// the spots its cells missed, re-solved from it), as every plan is.
	done, err := runAll(ctx, a.st.Workers, func() []func(context.Context) (*outcome, error) {
		jobs := make([]func(context.Context) (*outcome, error), len(sf.Points))
		for k, p := range sf.Points {
			jobs[k] = func(ctx context.Context) (*outcome, error) {
				cp := *pr
				cp.Spec, cp.Model = p.Model.Spec, p.Model
				if p.Result.X == nil {
					return &outcome{pr: &cp, res: p.Result}, nil
				}
				opt := a.st.mip()
				opt.Start = p.Result.X
				cov, res, _, err := cp.CompleteCoverage(ctx, p.Result, opt)
				if err != nil {
					return nil, err
				}
				return &outcome{pr: cov, res: res}, nil
			}
		}
		return jobs
	}())
	if err != nil {
		return nil, err
	}
	for k, p := range sf.Points {
		p.Model, p.Result = done[k].pr.Model, done[k].res
		sum, err := summarize(done[k].pr, p.Result, a.cfg.FeatureDiameterFt, "")
		if err != nil {
			return nil, err
		}
		f.Swept = append(f.Swept, FrontierPoint{MaxDays: p.MaxDays, BoundCost: boundCost(p.Result, p.Model.Spec, p.MaxDays), Summary: relabel(sum, p.MaxDays)})
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
			noWorse := q.FieldDays <= p.FieldDays && q.PricedCost <= p.PricedCost
			better := q.FieldDays < p.FieldDays || q.PricedCost < p.PricedCost
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
		minC, maxC = math.Min(minC, p.PricedCost), math.Max(maxC, p.PricedCost)
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
		dc := scale(p.PricedCost, minC, maxC)
		dd := scale(float64(p.FieldDays), minD, maxD)
		if d := math.Hypot(dc, dd); d < bestD-1e-12 {
			best, bestD = i, d
		}
	}
	return best
}
