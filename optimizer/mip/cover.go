package mip

import (
	"math"
	"sort"
)

// coverData is the set-covering view of a (reduced) problem:
// minimize Σ c_j x_j subject to Σ_{j covers i} x_j ≥ 1, x binary.
type coverData struct {
	m, n    int
	cost    []float64
	colRows [][]int
	rowCols [][]int
}

func newCoverData(p *Problem) *coverData {
	q := &p.LP
	cd := &coverData{m: q.NumRows, n: q.NumCols, cost: q.Obj,
		colRows: make([][]int, q.NumCols), rowCols: make([][]int, q.NumRows)}
	for j := 0; j < q.NumCols; j++ {
		cd.colRows[j] = q.RowIndex[q.ColStart[j]:q.ColStart[j+1]]
		for _, i := range cd.colRows[j] {
			cd.rowCols[i] = append(cd.rowCols[i], j)
		}
	}
	return cd
}

// greedy completes the partial cover sel (may be empty) by the rule of
// Chvátal (1979, Math. Oper. Res. 4:233–235): repeatedly take the allowed
// column with the least score[j] per newly covered row. Columns with
// allowed[j] false are never added (allowed nil: all). It returns the
// cover (sorted) or nil when the allowed columns cannot cover every row.
func (cd *coverData) greedy(sel []int, score []float64, allowed []bool) []int {
	covered := make([]int, cd.m)
	inSel := make([]bool, cd.n)
	out := append([]int(nil), sel...)
	uncov := cd.m
	for _, j := range sel {
		inSel[j] = true
		for _, i := range cd.colRows[j] {
			if covered[i] == 0 {
				uncov--
			}
			covered[i]++
		}
	}
	// newCov[j]: rows of j not yet covered.
	newCov := make([]int, cd.n)
	for j := 0; j < cd.n; j++ {
		if inSel[j] || (allowed != nil && !allowed[j]) {
			continue
		}
		for _, i := range cd.colRows[j] {
			if covered[i] == 0 {
				newCov[j]++
			}
		}
	}
	for uncov > 0 {
		best, bestRatio := -1, math.Inf(1)
		for j := 0; j < cd.n; j++ {
			if newCov[j] == 0 || inSel[j] || (allowed != nil && !allowed[j]) {
				continue
			}
			r := score[j] / float64(newCov[j])
			if r < bestRatio {
				best, bestRatio = j, r
			}
		}
		if best < 0 {
			return nil
		}
		inSel[best] = true
		out = append(out, best)
		for _, i := range cd.colRows[best] {
			if covered[i] == 0 {
				uncov--
				for _, k := range cd.rowCols[i] {
					newCov[k]--
				}
			}
			covered[i]++
		}
	}
	sort.Ints(out)
	return cd.improve(out)
}

// improve removes redundant columns (most expensive first) and then
// applies 1-opt exchanges: a chosen column is replaced by a cheaper
// unchosen one that covers every row only it covers. Repeats while the
// cost falls. The result is sorted.
func (cd *coverData) improve(sel []int) []int {
	covered := make([]int, cd.m)
	inSel := make([]bool, cd.n)
	for _, j := range sel {
		inSel[j] = true
		for _, i := range cd.colRows[j] {
			covered[i]++
		}
	}
	byCost := func() []int {
		var s []int
		for j := 0; j < cd.n; j++ {
			if inSel[j] {
				s = append(s, j)
			}
		}
		sort.SliceStable(s, func(a, b int) bool { return cd.cost[s[a]] > cd.cost[s[b]] })
		return s
	}
	drop := func() bool {
		any := false
		for _, j := range byCost() {
			red := true
			for _, i := range cd.colRows[j] {
				if covered[i] < 2 {
					red = false
					break
				}
			}
			if red {
				inSel[j] = false
				any = true
				for _, i := range cd.colRows[j] {
					covered[i]--
				}
			}
		}
		return any
	}
	drop()
	mark := make([]int, cd.m)
	stamp := 0
	for round := 0; round < 20; round++ {
		improved := false
		for _, j := range byCost() {
			if !inSel[j] {
				continue
			}
			stamp++
			var uniq []int
			for _, i := range cd.colRows[j] {
				if covered[i] == 1 {
					uniq = append(uniq, i)
					mark[i] = stamp
				}
			}
			if len(uniq) == 0 {
				continue
			}
			best, bestCost := -1, cd.cost[j]
			for _, k := range cd.rowCols[uniq[0]] {
				if inSel[k] || cd.cost[k] >= bestCost {
					continue
				}
				cnt := 0
				for _, i := range cd.colRows[k] {
					if mark[i] == stamp {
						cnt++
					}
				}
				if cnt == len(uniq) {
					best, bestCost = k, cd.cost[k]
				}
			}
			if best >= 0 {
				inSel[j] = false
				for _, i := range cd.colRows[j] {
					covered[i]--
				}
				inSel[best] = true
				for _, i := range cd.colRows[best] {
					covered[i]++
				}
				improved = true
			}
		}
		if drop() {
			improved = true
		}
		if !improved {
			break
		}
	}
	var out []int
	for j := 0; j < cd.n; j++ {
		if inSel[j] {
			out = append(out, j)
		}
	}
	return out
}

func (cd *coverData) costOf(sel []int) float64 {
	s := 0.0
	for _, j := range sel {
		s += cd.cost[j]
	}
	return s
}

// lagrangeResult is the outcome of the subgradient optimization.
type lagrangeResult struct {
	bound float64   // best Lagrangian lower bound L(u)
	u     []float64 // multipliers reaching it
	redc  []float64 // Lagrangian reduced costs c_j − Σ_{i∈j} u_i at u
	best  []int     // best cover found (nil if none better than ub)
	bestC float64
	iters int
}

// lagrange runs subgradient optimization of the Lagrangian relaxation of
// the covering rows, L(u) = Σ_i u_i + Σ_j min(0, c_j − Σ_{i∈j} u_i), with
// the step rule and the Lagrangian heuristic of Beasley (1990, Naval Res.
// Logist. 37:151–164): step t = f·(1.05·UB − L)/‖g‖², f halved after 30
// iterations without improvement, stop when f < 0.005; every few
// iterations the Lagrangian solution is completed to a cover greedily and
// improved. Only allowed columns (nil: all) take part (the others are
// fixed at 0). ub is the best known cover cost (+Inf if none); gran > 0
// says feasible costs are multiples of gran, which allows stopping when
// ⌈L⌉ reaches ub.
func (cd *coverData) lagrange(allowed []bool, ub, gran float64, maxIter int, stop func() bool) *lagrangeResult {
	m, n := cd.m, cd.n
	res := &lagrangeResult{bound: math.Inf(-1), bestC: ub}
	u := make([]float64, m)
	for i := 0; i < m; i++ {
		best := math.Inf(1)
		for _, j := range cd.rowCols[i] {
			if allowed != nil && !allowed[j] {
				continue
			}
			if r := cd.cost[j] / float64(len(cd.colRows[j])); r < best {
				best = r
			}
		}
		if math.IsInf(best, 1) {
			return res // a row no allowed column covers: infeasible
		}
		u[i] = best
	}
	redc := make([]float64, n)
	g := make([]float64, m)
	x := make([]bool, n)
	f := 2.0
	noImp := 0
	for it := 0; it < maxIter && f >= 0.005; it++ {
		res.iters = it + 1
		L := 0.0
		for i := 0; i < m; i++ {
			L += u[i]
		}
		for j := 0; j < n; j++ {
			if allowed != nil && !allowed[j] {
				x[j] = false
				redc[j] = math.Inf(1)
				continue
			}
			r := cd.cost[j]
			for _, i := range cd.colRows[j] {
				r -= u[i]
			}
			redc[j] = r
			x[j] = r < 0
			if r < 0 {
				L += r
			}
		}
		if L > res.bound+1e-9 {
			res.bound = L
			res.u = append(res.u[:0], u...)
			res.redc = append(res.redc[:0], redc...)
			noImp = 0
		} else {
			noImp++
			if noImp >= 30 {
				f /= 2
				noImp = 0
			}
		}
		if it%10 == 0 {
			// Lagrangian heuristic: start from the columns with negative
			// reduced cost, complete greedily by original cost.
			var sel []int
			for j := 0; j < n; j++ {
				if x[j] {
					sel = append(sel, j)
				}
			}
			if c := cd.greedy(sel, cd.cost, allowed); c != nil {
				if v := cd.costOf(c); v < res.bestC-1e-9 {
					res.bestC, res.best = v, c
				}
			}
			// And a greedy on the reduced costs clipped at a small value.
			sc := make([]float64, n)
			for j := range sc {
				sc[j] = math.Max(redc[j], 1e-3*cd.cost[j]+1e-6)
			}
			if c := cd.greedy(nil, sc, allowed); c != nil {
				if v := cd.costOf(c); v < res.bestC-1e-9 {
					res.bestC, res.best = v, c
				}
			}
			if stop != nil && stop() {
				break
			}
		}
		target := res.bestC
		if math.IsInf(target, 1) {
			target = 2*math.Abs(L) + 1
		}
		if gran > 0 && res.bound > target-gran+1e-6 {
			break // ⌈L⌉ ≥ UB: the cover is optimal
		}
		norm := 0.0
		for i := 0; i < m; i++ {
			s := 1.0
			for _, j := range cd.rowCols[i] {
				if x[j] {
					s--
				}
			}
			if u[i] == 0 && s < 0 {
				s = 0
			}
			g[i] = s
			norm += s * s
		}
		if norm == 0 {
			// x covers every row exactly once and is Lagrangian
			// optimal: it is an optimal cover of the allowed columns.
			var sel []int
			for j := 0; j < n; j++ {
				if x[j] {
					sel = append(sel, j)
				}
			}
			if v := cd.costOf(sel); v < res.bestC-1e-9 {
				res.bestC, res.best = v, sel
			}
			break
		}
		t := f * (1.05*target - L) / norm
		for i := 0; i < m; i++ {
			u[i] = math.Max(0, u[i]+t*g[i])
		}
	}
	return res
}
