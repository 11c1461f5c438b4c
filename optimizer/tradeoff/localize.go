package tradeoff

import (
	"context"
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/lp"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/plan"
)

// localMinCols: a rule cost on a model with at least this many columns is
// found by a localized re-solve (localized). Every demo (at most a few
// hundred columns) and the 10-acre generated site stay below it and are
// solved whole, as before; the 100-acre generated site (about 1,900
// columns) is above it, where each whole-site re-solve of a relaxation
// takes seconds and a site has dozens of rules. Our choice.
var localMinCols = 1000

// localizedStatus begins the Status of a relaxation priced by re-planning
// its zone alone, without proof that the whole site could do no better.
const localizedStatus = "localized"

// carryPlan maps a plan x of model pr onto the columns of model v, built
// from the same site with one zone's rules changed. Option columns are
// matched by what they mean — the candidate's zone and position and the
// option's label — since a changed layout renumbers the candidates; every
// other column (rigs, days, finish, zone counts) by its name. Columns of
// v with no match are 0 (a column of x with no match in v is dropped; the
// engine repairs a start that then breaks a row).
func carryPlan(pr *plan.Prepared, x []float64, v *plan.Prepared) []float64 {
	key := func(p *plan.Prepared, o int) string {
		op := p.Spec.Options[o]
		c := p.Layout.Candidates[op.Point]
		return fmt.Sprintf("%d|%v|%v|%s", c.Zone, c.P.X, c.P.Y, op.Label)
	}
	isX := make([]bool, pr.Model.Problem.LP.NumCols)
	byKey := map[string]int{}
	for o := range pr.Spec.Options {
		j := pr.Model.XCol[o]
		isX[j] = true
		byKey[key(pr, o)] = j
	}
	byName := map[string]int{}
	for j, n := range pr.Model.Problem.ColNames {
		if !isX[j] {
			byName[n] = j
		}
	}
	out := make([]float64, v.Model.Problem.LP.NumCols)
	vx := make([]bool, len(out))
	for o := range v.Spec.Options {
		j := v.Model.XCol[o]
		vx[j] = true
		if i, ok := byKey[key(v, o)]; ok {
			out[j] = x[i]
		}
	}
	for j, n := range v.Model.Problem.ColNames {
		if vx[j] {
			continue
		}
		if i, ok := byName[n]; ok {
			out[j] = x[i]
		}
	}
	return out
}

// localized prices a relaxation of zone z's rules on a large site by
// re-planning zone z alone: every option column of every other zone is
// fixed where the cheapest plan has it, and the zone's own points, the
// rigs hired and their days are solved again (from the cheapest plan,
// which still meets the relaxed rules, as the start). Its plan meets every
// rule of the relaxed site, so the saving it shows is found, not assumed.
//
// The proven side comes from the whole relaxed site: its LP relaxation's
// optimum is a lower bound on every plan of it (weak duality; Chvátal,
// Linear Programming, 1983, ch. 5 — from memory), so MaxSaving is the
// base cost less that bound, and Gap is measured against it. When the
// localized plan lies within the analysis gap of that bound, it is the
// whole-site answer to that gap and is reported as such; otherwise the
// Relaxation says, in its Status and Note, that only the zone was
// re-planned and that the whole-site saving may be larger (up to
// MaxSaving).
//
// It returns nil (and no error) when it cannot settle the relaxation —
// no localized plan or no LP bound — and the caller solves the whole site.
func (a *Analyzer) localized(ctx context.Context, v *plan.Prepared, z int, change string, base float64) (*Relaxation, error) {
	start := carryPlan(a.pr, a.cheapest.res.X, v)
	fixed := make([]float64, len(start))
	copy(fixed, start)
	var res *mip.Result
	// The zone's plan is completed to the exact coverage rule as every
	// plan is: rows at the spots its cells missed, re-solved (other zones
	// stay fixed as in the cheapest plan, which meets their rules).
	for round := 0; ; round++ {
		full := v.Model.Problem
		sub := *full
		sub.LP.ColLo = append([]float64(nil), full.LP.ColLo...)
		sub.LP.ColUp = append([]float64(nil), full.LP.ColUp...)
		for o, op := range v.Spec.Options {
			if v.Spec.PointZone[op.Point] == z {
				continue
			}
			j := v.Model.XCol[o]
			x := math.Max(sub.LP.ColLo[j], math.Min(sub.LP.ColUp[j], math.Round(fixed[j])))
			sub.LP.ColLo[j], sub.LP.ColUp[j] = x, x
		}
		opt := a.st.mip()
		opt.Start = start
		var err error
		if res, err = mip.Solve(ctx, &sub, opt); err != nil {
			return nil, err
		}
		if res.X == nil {
			return nil, nil
		}
		next, rows, err := v.AddSpotRows(res.X)
		if err != nil {
			return nil, err
		}
		if rows == 0 {
			break
		}
		if round >= 40 || ctx.Err() != nil {
			return nil, nil
		}
		start = plan.MapStart(v.Model, next.Model, res.X)
		fixed = plan.MapStart(v.Model, next.Model, fixed)
		v = next
	}
	full := v.Model.Problem
	bnd, err := lp.Solve(&full.LP, lp.Options{})
	if err != nil || bnd.Status != lp.Optimal {
		return nil, nil
	}
	bound := bnd.Obj + full.ObjOffset
	sum, err := summarize(v, res, a.cfg.FeatureDiameterFt, change)
	if err != nil {
		return nil, err
	}
	gap := math.Max(0, (res.Obj-bound)/math.Max(1, math.Abs(res.Obj)))
	r := &Relaxation{Change: change, Feasible: true, Gap: roundTo(gap, 6), Cost: sum.PricedCost,
		Saving: roundTo(base-sum.PricedCost, 2),
		// As boundCost: the bound is on cost + w·T, and T is the plan's
		// finish.
		MaxSaving: roundTo(base-(bound-v.Spec.DaysWeight*float64(sum.FieldDays)), 2)}
	if gap <= a.st.GapRel {
		r.Status = "optimal"
		r.Note = fmt.Sprintf("zone re-planned with the other zones as in the cheapest plan; within %.2f%% of the whole site's LP bound, so the whole-site answer to the stated gap", 100*gap)
		return r, nil
	}
	r.Status = localizedStatus + " (" + res.Status.String() + ")"
	r.Note = fmt.Sprintf("only this zone re-planned, the other zones kept as in the cheapest plan: the saving found is one the whole site can have, and re-planning the whole site may save more, up to the proven most (whole-site LP bound; %.2f%% above it)", 100*gap)
	return r, nil
}
