package mip

import (
	"math"
	"sort"
)

// Limits of the repair heuristic (common practice for weighted local
// search: a budget proportional to the problem size).
const (
	repairMovesPerVar = 20
	repairTabu        = 10
)

// repairSearch is a weighted-violation local search for a first feasible
// point of a general MIP before any LP is solved, in the spirit of the
// Feasibility Jump heuristic (Luteberget and Sartor 2023, Math. Prog.
// Comp. 15:365–388, from memory): start at the bound nearest zero; repeatedly take a
// violated row and move the one column of that row whose "jump" to the
// value that satisfies the row lowers the weighted violation the most
// (ties by objective); when no move helps, raise the row's weight. A
// feasible point found is then improved by lowering (raising) columns of
// positive (negative) cost as far as every row allows. The search is
// deterministic: no randomness, a fixed move budget.
type repairSearch struct {
	e        *engine
	x        []float64
	act      []float64
	w        []float64
	viol     []int // violated rows in a deterministic order
	pos      []int // position in viol, -1 if satisfied
	rowStart []int
	rowCol   []int
	rowVal   []float64
	lastMove []int
	costW    float64
}

func (rs *repairSearch) violation(i int, act float64) float64 {
	q := &rs.e.p.LP
	lo, up := q.RowLo[i], q.RowUp[i]
	tol := feasTol * 0.1
	if act < lo-tol*(1+math.Abs(lo)) {
		return lo - act
	}
	if act > up+tol*(1+math.Abs(up)) {
		return act - up
	}
	return 0
}

func (rs *repairSearch) setViolated(i int, v bool) {
	if v && rs.pos[i] < 0 {
		rs.pos[i] = len(rs.viol)
		rs.viol = append(rs.viol, i)
	} else if !v && rs.pos[i] >= 0 {
		k := rs.pos[i]
		last := rs.viol[len(rs.viol)-1]
		rs.viol[k] = last
		rs.pos[last] = k
		rs.viol = rs.viol[:len(rs.viol)-1]
		rs.pos[i] = -1
	}
}

// score is the change in weighted violation (plus a small objective
// term) when column j moves to v.
func (rs *repairSearch) score(j int, v float64) float64 {
	q := &rs.e.p.LP
	d := v - rs.x[j]
	s := rs.costW * q.Obj[j] * d
	for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
		i := q.RowIndex[k]
		a := rs.act[i]
		s += rs.w[i] * (rs.violation(i, a+q.Value[k]*d) - rs.violation(i, a))
	}
	return s
}

// need is the change of row i's activity that brings it back within its
// bounds: up to its lower bound, or down (negative) to its upper bound.
func (rs *repairSearch) need(i int) float64 {
	q := &rs.e.p.LP
	if rs.act[i] > q.RowUp[i] {
		return q.RowUp[i] - rs.act[i]
	}
	return q.RowLo[i] - rs.act[i]
}

// shift is the value column j takes to change its row's activity by
// delta·a (delta = need/a): x[j] + delta, rounded away from x[j] for an
// integer column so that the need is met, and clipped to its global
// bounds.
func (rs *repairSearch) shift(j int, delta float64) float64 {
	e := rs.e
	v := rs.x[j] + delta
	if e.p.Integer[j] {
		if delta > 0 {
			v = math.Ceil(v - 1e-9)
		} else {
			v = math.Floor(v + 1e-9)
		}
	}
	return math.Max(e.glo[j], math.Min(e.gup[j], v))
}

func (rs *repairSearch) move(j int, v float64) {
	q := &rs.e.p.LP
	d := v - rs.x[j]
	rs.x[j] = v
	for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
		i := q.RowIndex[k]
		rs.act[i] += q.Value[k] * d
		rs.setViolated(i, rs.violation(i, rs.act[i]) > 0)
	}
}

// repair runs the search from the bound nearest zero and offers any
// feasible point to the engine. It reports whether the incumbent
// improved.
func (e *engine) repair() bool { return e.repairFrom(nil) }

// repairFrom runs the search from start (nil: the bound nearest zero),
// with integer columns rounded to the nearest integer and every column
// clipped to its global bounds. Started from an LP optimum it is an
// LP-guided repair: the rounded LP point usually breaks only a few rows
// (links and counts next to fractional columns), which the search fixes
// locally, and lower and improve then remove what rounding added.
func (e *engine) repairFrom(start []float64) bool {
	q := &e.p.LP
	n, m := e.n, e.m
	rs := &repairSearch{e: e, x: make([]float64, n), act: make([]float64, m), w: make([]float64, m),
		pos: make([]int, m), lastMove: make([]int, n)}
	cmax := 0.0
	for j := 0; j < n; j++ {
		lo, up := e.glo[j], e.gup[j]
		v := math.Max(lo, math.Min(up, 0))
		if start != nil {
			v = math.Max(lo, math.Min(up, start[j]))
		}
		if e.p.Integer[j] {
			v = math.Max(math.Ceil(lo), math.Min(math.Floor(up), math.Round(v)))
		}
		rs.x[j] = v
		cmax = math.Max(cmax, math.Abs(q.Obj[j]))
		rs.lastMove[j] = -repairTabu - 1
	}
	// The objective only breaks ties between moves of equal violation.
	rs.costW = 1e-3 / math.Max(1, cmax)
	rs.rowStart = make([]int, m+1)
	for _, i := range q.RowIndex[:q.ColStart[n]] {
		rs.rowStart[i+1]++
	}
	for i := 0; i < m; i++ {
		rs.rowStart[i+1] += rs.rowStart[i]
	}
	rs.rowCol = make([]int, q.ColStart[n])
	rs.rowVal = make([]float64, q.ColStart[n])
	next := append([]int(nil), rs.rowStart[:m]...)
	for j := 0; j < n; j++ {
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			i := q.RowIndex[k]
			rs.rowCol[next[i]] = j
			rs.rowVal[next[i]] = q.Value[k]
			next[i]++
			rs.act[i] += q.Value[k] * rs.x[j]
		}
	}
	for i := 0; i < m; i++ {
		rs.w[i] = 1
		rs.pos[i] = -1
		rs.setViolated(i, rs.violation(i, rs.act[i]) > 0)
	}
	budget := repairMovesPerVar * (n + m)
	for it := 0; it < budget && len(rs.viol) > 0; it++ {
		if it%1024 == 0 && e.checkStop() {
			return false
		}
		// Rotate through the violated rows deterministically.
		i := rs.viol[(it*7919)%len(rs.viol)]
		need := rs.need(i)
		best, bestScore := -1, math.Inf(1)
		var bestVal float64
		for k := rs.rowStart[i]; k < rs.rowStart[i+1]; k++ {
			j, a := rs.rowCol[k], rs.rowVal[k]
			if a == 0 || e.glo[j] == e.gup[j] {
				continue
			}
			v := rs.shift(j, need/a)
			if v == rs.x[j] {
				continue
			}
			s := rs.score(j, v)
			if it-rs.lastMove[j] <= repairTabu {
				s += 1e6 // tabu: only if nothing else moves
			}
			if s < bestScore {
				best, bestScore, bestVal = j, s, v
			}
		}
		if best < 0 {
			rs.w[i]++
			continue
		}
		if bestScore >= 0 {
			rs.w[i]++ // a local minimum: make this row count more
		}
		rs.move(best, bestVal)
		rs.lastMove[best] = it
	}
	if len(rs.viol) > 0 {
		return false
	}
	rs.lower()
	found := e.setIncumbent(append([]float64(nil), rs.x...))
	if rs.improve() {
		rs.lower()
		if e.setIncumbent(append([]float64(nil), rs.x...)) {
			found = true
		}
	}
	return found
}

// Limits of the improvement phase (common practice for 1-opt with
// repair: a short repair per trial, a few passes).
const (
	improveRepairMoves = 40
	improvePasses      = 3
)

// improve is a 1-opt local search with repair on a feasible point: for
// each column of positive cost (most expensive first), lower it by one
// unit and repair the rows this breaks with the cheapest fixing moves
// (a short budget, the lowered column kept down); keep the change when
// the result is feasible and cheaper, undo it otherwise. It reports
// whether the point improved.
func (rs *repairSearch) improve() bool {
	e := rs.e
	q := &e.p.LP
	order := make([]int, e.n)
	for j := range order {
		order[j] = j
	}
	sortByAbsCostDesc(order, q.Obj)
	cmax := 0.0
	for _, c := range q.Obj {
		cmax = math.Max(cmax, math.Abs(c))
	}
	big := 1e3 * math.Max(1, cmax)
	type undo struct {
		j int
		v float64
	}
	var log []undo
	mv := func(j int, v float64) {
		log = append(log, undo{j, rs.x[j]})
		rs.move(j, v)
	}
	improved := false
	stamp := make([]int, e.n)
	trial := 0
	for pass := 0; pass < improvePasses; pass++ {
		passImproved := false
		for _, j := range order {
			c := q.Obj[j]
			if c <= 0 || !e.p.Integer[j] || rs.x[j] <= e.glo[j] {
				continue
			}
			if trial%256 == 0 && e.checkStop() {
				return improved
			}
			trial++
			log = log[:0]
			delta := -c
			mv(j, rs.x[j]-1)
			stamp[j] = trial
			for k := 0; k < improveRepairMoves && len(rs.viol) > 0; k++ {
				i := rs.viol[0]
				need := rs.need(i)
				best, bestScore := -1, math.Inf(1)
				var bestVal float64
				for t := rs.rowStart[i]; t < rs.rowStart[i+1]; t++ {
					jj, a := rs.rowCol[t], rs.rowVal[t]
					if a == 0 || stamp[jj] == trial || e.glo[jj] == e.gup[jj] {
						continue
					}
					v := rs.shift(jj, need/a)
					if v == rs.x[jj] {
						continue
					}
					d := v - rs.x[jj]
					sc := q.Obj[jj] * d
					for u := q.ColStart[jj]; u < q.ColStart[jj+1]; u++ {
						r := q.RowIndex[u]
						sc += big * (rs.violation(r, rs.act[r]+q.Value[u]*d) - rs.violation(r, rs.act[r]))
					}
					if sc < bestScore {
						best, bestScore, bestVal = jj, sc, v
					}
				}
				if best < 0 {
					break
				}
				delta += q.Obj[best] * (bestVal - rs.x[best])
				stamp[best] = trial
				mv(best, bestVal)
			}
			if len(rs.viol) == 0 && delta < -1e-9*math.Max(1, math.Abs(c)) {
				improved, passImproved = true, true
				continue
			}
			for k := len(log) - 1; k >= 0; k-- {
				rs.move(log[k].j, log[k].v)
			}
		}
		if !passImproved {
			break
		}
	}
	return improved
}

// lower improves a feasible point: each column with positive cost is
// lowered (negative cost: raised) as far as all its rows and bounds
// allow, most expensive first, until nothing moves.
func (rs *repairSearch) lower() {
	e := rs.e
	q := &e.p.LP
	order := make([]int, e.n)
	for j := range order {
		order[j] = j
	}
	sortByAbsCostDesc(order, q.Obj)
	for pass := 0; pass < 5; pass++ {
		moved := false
		for _, j := range order {
			c := q.Obj[j]
			if c == 0 {
				continue
			}
			dir := -1.0
			limit := rs.x[j] - e.glo[j]
			if c < 0 {
				dir = 1
				limit = e.gup[j] - rs.x[j]
			}
			if limit <= 0 {
				continue
			}
			for k := q.ColStart[j]; k < q.ColStart[j+1] && limit > 0; k++ {
				i := q.RowIndex[k]
				a := q.Value[k] * dir // activity change per unit step
				switch {
				case a < 0 && !math.IsInf(q.RowLo[i], -1):
					limit = math.Min(limit, (rs.act[i]-q.RowLo[i])/-a)
				case a > 0 && !math.IsInf(q.RowUp[i], 1):
					limit = math.Min(limit, (q.RowUp[i]-rs.act[i])/a)
				}
			}
			if e.p.Integer[j] {
				limit = math.Floor(limit + 1e-9)
			}
			if limit <= 1e-12 || math.IsInf(limit, 1) {
				continue
			}
			rs.move(j, rs.x[j]+dir*limit)
			moved = true
		}
		if !moved {
			break
		}
	}
}

func sortByAbsCostDesc(order []int, c []float64) {
	sort.SliceStable(order, func(a, b int) bool { return math.Abs(c[order[a]]) > math.Abs(c[order[b]]) })
}
