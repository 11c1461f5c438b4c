package tradeoff

import (
	"context"
	"fmt"
	"math"
	"slices"
	"sort"

	"github.com/rigmix/rigmix/optimizer/lp"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/scenarios"
)

// Relaxation is the cheapest plan re-solved with one rule relaxed.
type Relaxation struct {
	Change string  `json:"change"`
	Cost   float64 `json:"cost"`
	// Cost is the relaxed plan's priced cost (Summary.PricedCost); Saving
	// is the cheapest plan's priced cost less Cost. Both are found to the
	// stated gap, so a saving may read up to that gap below zero.
	Saving float64 `json:"saving"`
	// MaxSaving is the most the relaxation can save, proven: the
	// cheapest plan's cost less the relaxed solve's bound.
	MaxSaving float64 `json:"max_saving"`
	Gap       float64 `json:"optimality_gap"`
	Status    string  `json:"status"`
	Note      string  `json:"note,omitempty"`
	Feasible  bool    `json:"feasible"`
}

// RuleCost is what one rule of one zone costs.
type RuleCost struct {
	Zone     string      `json:"zone"`
	Rule     string      `json:"rule"`
	Required string      `json:"required"`
	Step     *Relaxation `json:"step,omitempty"`
	Dropped  *Relaxation `json:"dropped,omitempty"`
	// LPEstimate is the LP relaxation's price of the one-step relaxation,
	// from its duals (LPMeaning says how); nil where the model has no row
	// for the rule.
	LPEstimate *float64 `json:"lp_estimate,omitempty"`
	LPMeaning  string   `json:"lp_meaning,omitempty"`
}

// Top is the larger of the step's and the drop's saving.
func (r RuleCost) Top() float64 {
	t := math.Inf(-1)
	for _, x := range []*Relaxation{r.Step, r.Dropped} {
		if x != nil && x.Feasible {
			t = math.Max(t, x.Saving)
		}
	}
	return t
}

// Relaxation steps (the "one step"; our choice of sizes).
const (
	SpacingStep = 1.25 // spacing × 1.25
	DepthStep   = 0.90 // depth × 0.9
	ShareStep   = 0.1  // share − 0.1
	PointsStep  = 1    // minimum points − 1
)

// RuleCosts re-solves the cheapest plan with every rule of every zone
// relaxed by one step and dropped, and returns the savings, largest first.
func (a *Analyzer) RuleCosts(ctx context.Context) ([]RuleCost, error) {
	pr := a.pr
	sc := pr.In.Scenario
	base := a.cheapest.sum.PricedCost
	duals, err := lp.Solve(&pr.Model.Problem.LP, lp.Options{})
	if err != nil || duals.Status != lp.Optimal {
		duals = nil // no LP estimates; the re-solves still stand
	}

	var rules []RuleCost
	type job struct {
		rule int
		step bool
		run  func(context.Context) (*Relaxation, error)
	}
	var jobs []job
	add := func(rc RuleCost) int { rules = append(rules, rc); return len(rules) - 1 }
	viaPrepare := func(z int, change string, edit func(*scenarios.Rules)) func(context.Context) (*Relaxation, error) {
		return func(ctx context.Context) (*Relaxation, error) {
			in := withZoneRules(pr.In, z, edit)
			v, err := plan.Prepare(ctx, in, a.cfg.PlanOptions)
			if err != nil {
				return &Relaxation{Change: change, Status: "not planned", Note: err.Error()}, nil
			}
			return a.relaxed(ctx, v, z, change, base)
		}
	}
	viaSpec := func(z int, change string, edit func(*model.Spec)) func(context.Context) (*Relaxation, error) {
		return func(ctx context.Context) (*Relaxation, error) {
			v, err := variant(pr, edit)
			if err != nil {
				return &Relaxation{Change: change, Status: "not planned", Note: err.Error()}, nil
			}
			return a.relaxed(ctx, v, z, change, base)
		}
	}
	setZone := func(z int, f func(*model.Zone)) func(*model.Spec) {
		return func(s *model.Spec) {
			zs := append([]model.Zone(nil), s.Zones...)
			f(&zs[z])
			s.Zones = zs
		}
	}

	for z, zn := range sc.Zones {
		r := zn.Rules
		if r.MaxSpacingFt > 0 {
			i := add(RuleCost{Zone: zn.ID, Rule: "max spacing", Required: fmt.Sprintf("%.0f ft", r.MaxSpacingFt)})
			s1 := r.MaxSpacingFt * SpacingStep
			jobs = append(jobs,
				job{i, true, viaPrepare(z, fmt.Sprintf("spacing %.0f → %.1f ft", r.MaxSpacingFt, s1), func(r *scenarios.Rules) { r.MaxSpacingFt = s1 })},
				job{i, false, viaPrepare(z, "no spacing rule", func(r *scenarios.Rules) { r.MaxSpacingFt, r.NoSpread = 0, true })})
		}
		if n := pr.ZoneMin[z]; n > 0 {
			i := add(RuleCost{Zone: zn.ID, Rule: "minimum points", Required: fmt.Sprintf("≥ %d", n)})
			cover := pr.CoverMin[z]
			cur := pr.Spec.Zones[z].MinCount
			for _, step := range []bool{true, false} {
				want := 0
				change := "no minimum"
				if step {
					want = n - PointsStep
					change = fmt.Sprintf("minimum %d → %d", n, want)
				}
				mc := max(want, cover)
				if mc == cur {
					// The program is the same: nothing to re-solve.
					jobs = append(jobs, job{i, step, func(context.Context) (*Relaxation, error) {
						return &Relaxation{Change: change, Cost: base, Feasible: true, Status: a.cheapest.sum.Status, Gap: a.cheapest.sum.OptimalityGap,
							MaxSaving: roundTo(base-boundCost(a.cheapest.res, pr.Spec, a.cheapest.sum.FieldDays), 2),
							Note:      fmt.Sprintf("the spacing rule alone needs %d points here: the same program", cover)}, nil
					}})
					continue
				}
				jobs = append(jobs, job{i, step, viaSpec(z, change, setZone(z, func(m *model.Zone) { m.MinCount = mc }))})
			}
			if duals != nil && pr.Model.NCol[z] >= 0 && cur == n && cover < n {
				// The reduced cost of the count column at its lower bound
				// is the LP's price of one point more; so of one fewer.
				v := roundTo(math.Max(0, duals.ReducedCost[pr.Model.NCol[z]]), 2)
				rules[i].LPEstimate = &v
				rules[i].LPMeaning = "LP reduced cost of the zone's point count: saving per point fewer (LP relaxation)"
			}
		}
		if r.MinDepthFt > 0 {
			i := add(RuleCost{Zone: zn.ID, Rule: "minimum depth", Required: fmt.Sprintf("%.1f ft", r.MinDepthFt)})
			d1 := r.MinDepthFt * DepthStep
			jobs = append(jobs, job{i, true, viaPrepare(z, fmt.Sprintf("depth %.1f → %.1f ft", r.MinDepthFt, d1), func(r *scenarios.Rules) { r.MinDepthFt = d1 })})
			// A point has some depth: with no rule it goes to the plan's
			// default depth for its method, which may be deeper, so a
			// dropped depth rule is not a relaxation and is not reported.
		}
		if r.SampledShare > 0 {
			i := add(RuleCost{Zone: zn.ID, Rule: "sampled share", Required: fmt.Sprintf("≥ %.0f%%", 100*r.SampledShare)})
			s1 := math.Max(0, r.SampledShare-ShareStep)
			jobs = append(jobs,
				job{i, true, viaSpec(z, fmt.Sprintf("share %.0f%% → %.0f%%", 100*r.SampledShare, 100*s1), setZone(z, func(m *model.Zone) { m.SampledShare = s1 }))},
				job{i, false, viaSpec(z, "no share rule", setZone(z, func(m *model.Zone) { m.SampledShare = 0 }))})
			if duals != nil && pr.Model.ShareRow[z] >= 0 {
				// The share acts through two places: the row s − share·n ≥ 0,
				// where ∂z/∂share = π·n (the sensitivity of an LP optimum to
				// a matrix entry, −π_i x_j; Chvátal, Linear Programming,
				// 1983, ch. 10 — from memory), and the lower bound
				// ⌈share·n_min⌉ of the sampled count s, priced by the
				// reduced cost of s. The step's estimate sums both.
				pi := math.Abs(duals.Dual[pr.Model.ShareRow[z]])
				nLP := duals.X[pr.Model.NCol[z]]
				nMin := float64(pr.Spec.Zones[z].MinCount)
				dlb := math.Ceil(r.SampledShare*nMin-1e-9) - math.Ceil(s1*nMin-1e-9)
				v := roundTo(pi*nLP*(r.SampledShare-s1)+math.Max(0, duals.ReducedCost[pr.Model.SCol[z]])*dlb, 2)
				rules[i].LPEstimate = &v
				rules[i].LPMeaning = "LP dual of the share row × points × step, plus the reduced cost of the sampled count × the drop in its lower bound (LP relaxation)"
			}
		}
		if len(r.Methods) > 0 && len(r.Methods) < 4 {
			names := ""
			for k, m := range r.Methods {
				if k > 0 {
					names += ", "
				}
				names += string(m)
			}
			i := add(RuleCost{Zone: zn.ID, Rule: "methods allowed", Required: names})
			jobs = append(jobs, job{i, false, viaPrepare(z, "every method allowed", func(r *scenarios.Rules) { r.Methods = nil })})
		}
	}

	runs := make([]func(context.Context) (*Relaxation, error), len(jobs))
	for k, j := range jobs {
		runs[k] = j.run
	}
	outs, err := runAll(ctx, a.st.Workers, runs)
	if err != nil {
		return nil, err
	}
	for k, j := range jobs {
		if j.step {
			rules[j.rule].Step = outs[k]
		} else {
			rules[j.rule].Dropped = outs[k]
		}
	}
	sort.SliceStable(rules, func(i, j int) bool { return rules[i].Top() > rules[j].Top()+0.005 })
	return rules, nil
}

// relaxed solves a relaxed program and prices it against the base cost.
// When the relaxation leaves the program exactly as it was (a rule that
// never binds the candidates or options, such as allowing a method no
// offered rig performs), the engine would repeat the cheapest plan's solve
// step for step — it is deterministic — so that solve is reused.
//
// On a large site (localMinCols columns or more) the zone whose rule is
// relaxed is re-planned first with every other zone kept as the cheapest
// plan has it (see localized); the whole site is solved only when that
// cannot be shown to be the whole-site answer and the site is small.
func (a *Analyzer) relaxed(ctx context.Context, v *plan.Prepared, z int, change string, base float64) (*Relaxation, error) {
	if sameProblem(v.Model.Problem, a.pr.Model.Problem) {
		c := a.cheapest
		return &Relaxation{Change: change, Status: c.sum.Status, Feasible: true, Gap: c.sum.OptimalityGap, Cost: base,
			MaxSaving: roundTo(base-boundCost(c.res, a.pr.Spec, c.sum.FieldDays), 2),
			Note:      "the program is unchanged by this relaxation"}, nil
	}
	if a.pr.Model.Problem.LP.NumCols >= localMinCols {
		if r, err := a.localized(ctx, v, z, change, base); r != nil || err != nil {
			return r, err
		}
	}
	o, err := solveVariant(ctx, v, a.st, a.cfg.FeatureDiameterFt, change)
	if err != nil {
		return nil, err
	}
	r := &Relaxation{Change: change, Status: o.sum.Status, Feasible: o.sum.Feasible, Gap: o.sum.OptimalityGap}
	if !o.sum.Feasible {
		r.Note = "no plan found within the limits"
		return r, nil
	}
	r.Cost = o.sum.PricedCost
	r.Saving = roundTo(base-r.Cost, 2)
	r.MaxSaving = roundTo(base-boundCost(o.res, v.Spec, o.sum.FieldDays), 2)
	return r, nil
}

// withZoneRules copies the input with one zone's rules edited; the
// scenario and its zone list are copied, nothing is changed in place.
func withZoneRules(in plan.Input, z int, edit func(*scenarios.Rules)) plan.Input {
	sc := *in.Scenario
	sc.Zones = append([]scenarios.Zone(nil), sc.Zones...)
	r := sc.Zones[z].Rules
	edit(&r)
	sc.Zones[z].Rules = r
	in.Scenario = &sc
	return in
}

// sameProblem reports whether two programs are identical in every number
// the engine reads.
func sameProblem(p, q *mip.Problem) bool {
	return p.LP.NumRows == q.LP.NumRows && p.LP.NumCols == q.LP.NumCols && p.ObjOffset == q.ObjOffset &&
		slices.Equal(p.LP.Obj, q.LP.Obj) && slices.Equal(p.LP.ColLo, q.LP.ColLo) && slices.Equal(p.LP.ColUp, q.LP.ColUp) &&
		slices.Equal(p.LP.RowLo, q.LP.RowLo) && slices.Equal(p.LP.RowUp, q.LP.RowUp) &&
		slices.Equal(p.LP.ColStart, q.LP.ColStart) && slices.Equal(p.LP.RowIndex, q.LP.RowIndex) &&
		slices.Equal(p.LP.Value, q.LP.Value) && slices.Equal(p.Integer, q.Integer)
}
