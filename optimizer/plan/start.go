package plan

import (
	"context"
	"time"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// startNodeLimit bounds the branch and bound of the restricted model that
// yields the start solution. A node limit, not a time limit, keeps the
// start the same on every machine.
const startNodeLimit = 100

// StartSolution returns a plan to start the solve from (a "MIP start"),
// or nil when it finds none.
//
// Why: on a large site the LP bound is close to the best plan (the zone
// covering numbers see to that), but a search that rounds the LP point
// column by column finds plans a few percent above it, because dropping a
// point means changing the zone's count too. The covering subproblems of
// coverNumbers already chose, for each zone, a least set of points that
// meets the spacing rule. The start solves the whole model restricted to
// those points — which method and rig explores each, the sampled shares,
// the rigs to hire and their days — a model a fraction of the size, and
// hands its best plan to the full solve, which can only improve on it.
// Every plan of the restricted model is a plan of the full one (it only
// forbids options), so the start never changes what is optimal.
//
// A zone whose cover is missing or holds fewer points than the zone's
// count rule asks for keeps all its points.
//
// The start is a vector over pr.Model's columns. A model built by
// model.Build from the same Spec with a budget, a deadline or
// MinimizeDays has the same columns in the same order, so the start may
// be passed to its solve too (mip.Options.Start repairs a start that
// breaks the added rows); the maximal covering form has other columns.
// gapRel and timeLimit bound the restricted solve (timeLimit 0: none; the
// node limit ends it anyway).
func (pr *Prepared) StartSolution(ctx context.Context, gapRel float64, timeLimit time.Duration) []float64 {
	spec, m := pr.Spec, pr.Model
	if pr.CoverSets == nil || spec.MaximizeCoverage {
		return nil
	}
	allowed := make([]bool, spec.NumPoints)
	restricted := false
	for z, set := range pr.CoverSets {
		if set == nil || len(set) < spec.Zones[z].MinCount {
			continue
		}
		restricted = true
		for _, p := range set {
			allowed[p] = true
		}
	}
	if !restricted {
		return nil
	}
	hasCover := make([]bool, len(spec.Zones))
	for z, set := range pr.CoverSets {
		hasCover[z] = set != nil && len(set) >= spec.Zones[z].MinCount
	}
	for p := range allowed {
		if !hasCover[spec.PointZone[p]] || (spec.Required != nil && spec.Required[p]) {
			allowed[p] = true
		}
	}
	sub := *m.Problem
	sub.LP.ColUp = append([]float64(nil), m.Problem.LP.ColUp...)
	for o, op := range spec.Options {
		if !allowed[op.Point] {
			sub.LP.ColUp[m.XCol[o]] = 0
		}
	}
	pr.oneCrew(sub.LP.ColUp)
	// Half the plan's gap: the restricted model's bound lies a little
	// above the full model's, so a start proven to half the gap is
	// usually within the whole gap of the full model's bound, and the full
	// solve ends at its root.
	res, err := mip.Solve(ctx, &sub, mip.Options{GapRel: gapRel / 2, NodeLimit: startNodeLimit, TimeLimit: timeLimit})
	if err != nil || res.X == nil {
		return nil
	}
	return res.X
}

// BestStart is the cheaper of StartSolution and the hand-laid baseline
// (baseline.go), which is a plan of the model too: starting from it, the
// solve can only end at a plan no dearer than the baseline.
func (pr *Prepared) BestStart(ctx context.Context, gapRel float64, timeLimit time.Duration) []float64 {
	start := pr.StartSolution(ctx, gapRel, timeLimit)
	hb := pr.baseline()
	if hb == nil || pr.Spec.MaximizeCoverage {
		return start
	}
	if start == nil || objective(pr.Model.Problem, hb.start) < objective(pr.Model.Problem, start) {
		return hb.start
	}
	return start
}

func objective(p *mip.Problem, x []float64) float64 {
	v := 0.0
	for j, c := range p.LP.Obj {
		v += c * x[j]
	}
	return v
}

// oneCrew bars every further crew (scenario rig_units) in a copy of the
// model's column upper bounds: a restricted solve that only seeks a start
// or a baseline's cost need not search the crews' symmetric choices, and
// its plans remain plans of the full model.
func (pr *Prepared) oneCrew(colUp []float64) {
	m := pr.Model
	for r, rd := range pr.Rigs {
		if rd.unit > 1 {
			colUp[m.YCol[r]], colUp[m.DCol[r]] = 0, 0
		}
	}
	for o, od := range pr.Options {
		if pr.Rigs[od.rig].unit > 1 {
			colUp[m.XCol[o]] = 0
		}
	}
}
