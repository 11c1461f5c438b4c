package mip

import (
	"math"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// Limits of the LP-based heuristics (common practice).
const (
	diveMaxDepth   = 400
	diveIterFactor = 2 // a dive may use this many times the root LP's iterations, at least 2000
	rinsEvery      = 100
)

// heuristics runs the primal heuristics at a node with LP solution r and
// reports whether the incumbent improved: covering-specific LP-guided
// greedy completion and local improvement; for general MIPs rounding,
// the repair search started from the LP point and, at the root, RENS;
// fractional diving on the LP for both.
func (e *engine) heuristics(nd *node, r *lp.Result, isRoot bool) bool {
	improved := false
	if e.cover != nil {
		cd := e.cover
		// Take every column at 1 in the LP, complete greedily with cost
		// scaled by how far the LP is from taking the column.
		var sel []int
		sc := make([]float64, e.n)
		for j := 0; j < e.n; j++ {
			if r.X[j] > 1-intTol {
				sel = append(sel, j)
			}
			sc[j] = cd.cost[j]*(1-math.Min(1, r.X[j])) + 1e-9
		}
		if c := cd.greedy(sel, sc, nil); c != nil && e.setIncumbent(e.coverX(c)) {
			improved = true
		}
	} else {
		if e.round(r) {
			improved = true
		}
		if e.repairFrom(r.X) {
			improved = true
		}
		// At the root with an incumbent already (a start, or the repair
		// search before the LP), RINS searches around it first.
		if isRoot && e.inc != nil && e.rins(r) {
			improved = true
		}
		if isRoot && e.rens(r) {
			improved = true
		}
		if !isRoot && e.nodes-e.lastRinsNode >= rinsEvery && e.rins(r) {
			improved = true
		}
		if !isRoot && e.nodes-e.lastRinsNode >= rinsEvery {
			e.lastRinsNode = e.nodes
		}
	}
	if e.dive(r, isRoot) {
		improved = true
	}
	return improved
}

// round tries nearest rounding of the integer columns; with continuous
// columns present it fixes the rounded integers and solves the LP for
// the continuous ones.
func (e *engine) round(r *lp.Result) bool {
	x := append([]float64(nil), r.X...)
	for j := 0; j < e.n; j++ {
		if e.p.Integer[j] {
			x[j] = math.Max(e.clo[j], math.Min(e.cup[j], math.Round(x[j])))
		}
	}
	if !e.p.hasContinuous() {
		return e.setIncumbent(x)
	}
	if _, ok := e.evaluate(append([]float64(nil), x...)); ok {
		return e.setIncumbent(x)
	}
	return e.fixAndSolve(x)
}

// fixAndSolve fixes integer columns at the values in x, solves the LP in
// the continuous columns, restores the solver and records a feasible
// result.
func (e *engine) fixAndSolve(x []float64) bool {
	basis := e.s.Basis()
	for j := 0; j < e.n; j++ {
		if e.p.Integer[j] {
			e.s.SetColBounds(j, x[j], x[j])
		}
	}
	res, err := e.solveLP(0)
	for j := 0; j < e.n; j++ {
		if e.p.Integer[j] {
			e.s.SetColBounds(j, e.clo[j], e.cup[j])
		}
	}
	_ = e.s.SetBasis(basis)
	if err != nil || res.Status != lp.Optimal {
		return false
	}
	return e.setIncumbent(append([]float64(nil), res.X...))
}

// dive runs fractional diving (Achterberg 2007, §9.1.3): repeatedly
// bound the integer column that is closest to integral (for covering:
// the largest LP value, rounded up) and re-solve the LP, until the LP
// solution is integral, infeasible or no better than the incumbent.
func (e *engine) dive(r0 *lp.Result, isRoot bool) bool {
	basis := e.s.Basis()
	type saved struct {
		j      int
		lo, up float64
	}
	var undo []saved
	x := r0.X
	improved := false
	budget := 2000
	if isRoot {
		budget = max(budget, diveIterFactor*r0.Iterations)
	}
	used := 0
	for depth := 0; depth < diveMaxDepth && used < budget; depth++ {
		best, bestKey := -1, math.Inf(1)
		var bestVal float64
		fracs := 0
		for j := 0; j < e.n; j++ {
			if !e.p.Integer[j] || !isFrac(x[j]) {
				continue
			}
			fracs++
			f := x[j] - math.Floor(x[j])
			var key, v float64
			if e.cover != nil {
				key, v = 1-f, 1
			} else if f < 0.5 {
				key, v = f, math.Floor(x[j])
			} else {
				key, v = 1-f, math.Ceil(x[j])
			}
			if key < bestKey {
				best, bestKey, bestVal = j, key, v
			}
		}
		if fracs == 0 {
			if e.setIncumbent(append([]float64(nil), x...)) {
				improved = true
			}
			break
		}
		lo, up := e.s.ColBounds(best)
		undo = append(undo, saved{best, lo, up})
		if bestVal > x[best] {
			e.s.SetColBounds(best, bestVal, up)
		} else {
			e.s.SetColBounds(best, lo, bestVal)
		}
		res, err := e.solveLP(budget - used)
		if err != nil || res == nil {
			break
		}
		used += res.Iterations
		if res.Status == lp.Infeasible && used < budget {
			// Single backtrack (Achterberg 2007, §9.1): bound the column
			// the other way and try once more.
			if bestVal > x[best] {
				e.s.SetColBounds(best, lo, bestVal-1)
			} else {
				e.s.SetColBounds(best, bestVal+1, up)
			}
			res, err = e.solveLP(budget - used)
			if err != nil || res == nil {
				break
			}
			used += res.Iterations
		}
		if res.Status != lp.Optimal || e.wouldPrune(res.Obj) {
			break
		}
		x = res.X
		if e.checkStop() {
			break
		}
	}
	for k := len(undo) - 1; k >= 0; k-- {
		e.s.SetColBounds(undo[k].j, undo[k].lo, undo[k].up)
	}
	_ = e.s.SetBasis(basis)
	return improved
}
