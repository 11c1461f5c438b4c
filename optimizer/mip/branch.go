package mip

import (
	"math"
	"sort"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// pseudocost returns the average objective gain per unit of change in
// direction d (0 down, 1 up) for column j, falling back to the mean over
// all columns with observations (Achterberg 2007, §5.3.2).
func (e *engine) pseudocost(j, d int) float64 {
	if j >= 0 && e.pcCnt[d][j] > 0 {
		return e.pcSum[d][j] / float64(e.pcCnt[d][j])
	}
	if e.pcAllCnt[d] == 0 {
		return 1
	}
	return e.pcAllSum[d] / float64(e.pcAllCnt[d])
}

func (e *engine) updatePseudocost(j, d int, frac, gain float64) {
	if j < 0 || math.IsInf(gain, 0) || math.IsNaN(gain) {
		return
	}
	dist := frac
	if d == 1 {
		dist = 1 - frac
	}
	if dist < 1e-9 {
		return
	}
	if gain < 0 {
		gain = 0
	}
	e.pcSum[d][j] += gain / dist
	e.pcCnt[d][j]++
	e.pcAllSum[d] += gain / dist
	e.pcAllCnt[d]++
}

// score is the product rule of Achterberg (2007, §5.3, eq. 5.2).
func score(down, up float64) float64 {
	const eps = 1e-6
	return math.Max(down, eps) * math.Max(up, eps)
}

type candidate struct {
	j        int
	frac     float64
	pcScore  float64
	reliable bool
}

// branch chooses the branching column by reliability branching
// (Achterberg, Koch and Martin 2005, Oper. Res. Lett. 33:42–54;
// Achterberg 2007, §5.3.4): pseudocost scores, with strong branching on
// the candidates whose pseudocosts are not yet reliable. It returns the
// column and the LP bounds of its two children. When strong branching
// proves one direction infeasible or hopeless it returns j = -1 with the
// bound change in fixes (the node is then solved again); when both are,
// infeasible is true.
func (e *engine) branch(nd *node, r *lp.Result, z float64) (j int, downBound, upBound float64, fixes []boundChange, infeasible bool, err error) {
	var cands []candidate
	avg := [2]float64{e.pseudocost(-1, 0), e.pseudocost(-1, 1)}
	for k := 0; k < e.n; k++ {
		if !e.p.Integer[k] || !isFrac(r.X[k]) || r.X[k] < e.clo[k] || r.X[k] > e.cup[k] {
			continue
		}
		f := r.X[k] - math.Floor(r.X[k])
		pd, pu := avg[0], avg[1]
		if e.pcCnt[0][k] > 0 {
			pd = e.pcSum[0][k] / float64(e.pcCnt[0][k])
		}
		if e.pcCnt[1][k] > 0 {
			pu = e.pcSum[1][k] / float64(e.pcCnt[1][k])
		}
		rel := e.pcCnt[0][k] >= reliability && e.pcCnt[1][k] >= reliability
		cands = append(cands, candidate{j: k, frac: f, pcScore: score(pd*f, pu*(1-f)), reliable: rel})
	}
	sort.SliceStable(cands, func(a, b int) bool { return cands[a].pcScore > cands[b].pcScore })
	best, bestScore := -1, -1.0
	bestDown, bestUp := z, z
	sbDone, noImprove := 0, 0
	var basis, basis2 *lp.Basis
	pre := map[int]*sbResult{}
	for ci, c := range cands {
		res := pre[ci]
		if res == nil && (c.reliable || sbDone >= sbCandidates || noImprove >= sbLookahead) {
			if c.pcScore > bestScore {
				best, bestScore = c.j, c.pcScore
				bestDown, bestUp = z, z
			}
			continue
		}
		if res == nil {
			if basis == nil {
				basis = e.s.Basis()
				if e.s2 != nil && e.s2ok {
					basis2 = e.s2.Basis()
				}
			}
			// With a second solver, evaluate the next unreliable
			// candidate at the same time; results are used in candidate
			// order, so the search does not depend on timing.
			next := -1
			if basis2 != nil && sbDone+1 < sbCandidates {
				for k := ci + 1; k < len(cands); k++ {
					if !cands[k].reliable {
						next = k
						break
					}
				}
			}
			var other *sbResult
			done := make(chan struct{})
			if next >= 0 {
				go func() {
					other = e.strongBranch(e.s2, basis2, cands[next].j, r.X[cands[next].j], z)
					close(done)
				}()
			} else {
				close(done)
			}
			res = e.strongBranch(e.s, basis, c.j, r.X[c.j], z)
			<-done
			if other != nil {
				pre[next] = other
			}
		}
		sbDone++
		e.lpIter += res.iters
		for d := 0; d < 2; d++ {
			if res.sol[d] != nil {
				e.setIncumbent(res.sol[d])
			}
		}
		if e.checkStop() {
			return c.j, z, z, nil, false, nil
		}
		obj, feasible, exact := res.obj, res.feasible, res.exact
		xj := r.X[c.j]
		lo, up := e.clo[c.j], e.cup[c.j]
		if feasible[0] {
			e.updatePseudocost(c.j, 0, c.frac, obj[0]-z)
		}
		if feasible[1] {
			e.updatePseudocost(c.j, 1, c.frac, obj[1]-z)
		}
		pruneDown := math.IsInf(obj[0], 1) || (exact[0] && e.canPrune(obj[0]))
		pruneUp := math.IsInf(obj[1], 1) || (exact[1] && e.canPrune(obj[1]))
		switch {
		case pruneDown && pruneUp:
			return -1, 0, 0, nil, true, nil
		case pruneDown:
			return -1, 0, 0, []boundChange{{c.j, math.Ceil(xj), up}}, false, nil
		case pruneUp:
			return -1, 0, 0, []boundChange{{c.j, lo, math.Floor(xj)}}, false, nil
		}
		s := score(obj[0]-z, obj[1]-z)
		if s > bestScore {
			best, bestScore = c.j, s
			bestDown, bestUp = z, z
			if exact[0] {
				bestDown = obj[0]
			}
			if exact[1] {
				bestUp = obj[1]
			}
			noImprove = 0
		} else {
			noImprove++
		}
	}
	// Child bounds come only from strong-branching LPs solved to
	// optimality; an iteration-limited value is an estimate.
	return best, bestDown, bestUp, nil, false, nil
}

// sbResult is the outcome of strong branching on one column.
type sbResult struct {
	obj             [2]float64 // child LP values (down, up); +Inf: infeasible
	feasible, exact [2]bool    // exact: solved to optimality
	sol             [2][]float64
	iters           int
}

// strongBranch solves the two children of column j on solver s with an
// iteration limit and restores s (bounds and basis) afterwards. It reads
// but never changes the engine, so two calls on two solvers may run at
// the same time.
func (e *engine) strongBranch(s *lp.Solver, basis *lp.Basis, j int, xj, z float64) *sbResult {
	res := &sbResult{}
	lo, up := e.clo[j], e.cup[j]
	s.SetOptions(e.lpOptions(sbIterLimit))
	for d := 0; d < 2; d++ {
		if d == 0 {
			s.SetColBounds(j, lo, math.Floor(xj))
		} else {
			s.SetColBounds(j, math.Ceil(xj), up)
		}
		r, err := s.Solve()
		s.SetColBounds(j, lo, up)
		_ = s.SetBasis(basis)
		if r != nil {
			res.iters += r.Iterations
		}
		if err != nil {
			// Numerical trouble in a strong-branching LP: no
			// information from this child.
			res.obj[d] = z
			continue
		}
		switch r.Status {
		case lp.Infeasible:
			res.obj[d] = math.Inf(1)
		case lp.Optimal:
			res.obj[d] = math.Max(r.Obj, z)
			res.feasible[d], res.exact[d] = true, true
			integral := true
			for k := 0; k < e.n; k++ {
				if e.p.Integer[k] && isFrac(r.X[k]) {
					integral = false
					break
				}
			}
			if integral {
				// An integral child solution is a feasible point.
				res.sol[d] = append([]float64(nil), r.X...)
			}
		default:
			// Iteration or time limit: the objective so far is an
			// estimate only, never used to prune.
			res.obj[d] = math.Max(r.Obj, z)
			res.feasible[d] = true
		}
	}
	return res
}
