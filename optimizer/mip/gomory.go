package mip

import (
	"math"
	"sort"
	"time"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// Gomory mixed-integer cuts at the root (Gomory 1960; in the form of
// Marchand, Martin, Weismantel and Wolsey 2002, §3, and Cornuéjols 2008,
// from memory). From a row of the optimal simplex tableau,
//
//	x_B + Σ a_k z_k = β,   z_k ≥ 0 the distance of nonbasic k from its bound,
//
// with x_B integer and f0 = β − ⌊β⌋ > 0, every mixed-integer point meets
//
//	Σ_{k int, f_k ≤ f0} f_k/f0 z_k + Σ_{k int, f_k > f0} (1−f_k)/(1−f0) z_k
//	  + Σ_{k cont, a_k > 0} a_k/f0 z_k + Σ_{k cont, a_k < 0} −a_k/(1−f0) z_k ≥ 1,
//
// f_k = a_k − ⌊a_k⌋. Row logicals are taken as continuous. The cut is
// written back in the columns (z through the bounds, a row's logical
// through its row) and kept only when it is numerically safe (small
// coefficients removed by relaxing with the bounds, dynamism at most
// gmiMaxDynamism, right-hand side relaxed by a relative 1e-11, well inside
// the LP feasibility tolerance) and
// efficacious: its violation by the LP point over its Euclidean norm is
// at least gmiMinEfficacy (Achterberg 2007, §8.9, for efficacy and
// parallelism). Of the candidates of a round, the most efficacious are
// added, skipping one nearly parallel (cosine above gmiMaxParallel) to a
// cut already chosen; rounds go on while the bound moves.
const (
	gmiRounds      = 8
	gmiMinFrac     = 0.005
	gmiMaxDynamism = 1e6
	gmiMinEfficacy = 1e-4
	gmiMaxParallel = 0.98
	gmiMaxAlpha    = 1e7 // skip tableau rows with larger entries
	gmiMaxRows     = 200 // tableau rows examined per round
)

// cut is π x ≥ π0 over the columns of the presolved problem.
type cut struct {
	cols []int
	vals []float64
	rhs  float64
	eff  float64
	norm float64
}

// gmiState holds the rows the cut generator substitutes logicals by: the
// problem's rows (row-wise) followed by the cuts added so far.
type gmiState struct {
	rowStart []int
	rowCol   []int
	rowVal   []float64
	m0       int
	cuts     []cut
}

func newGMIState(q *lp.Problem) *gmiState {
	g := &gmiState{m0: q.NumRows}
	g.rowStart = make([]int, q.NumRows+1)
	for _, i := range q.RowIndex {
		g.rowStart[i+1]++
	}
	for i := 0; i < q.NumRows; i++ {
		g.rowStart[i+1] += g.rowStart[i]
	}
	g.rowCol = make([]int, len(q.RowIndex))
	g.rowVal = make([]float64, len(q.RowIndex))
	next := append([]int(nil), g.rowStart[:q.NumRows]...)
	for j := 0; j < q.NumCols; j++ {
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			i := q.RowIndex[k]
			g.rowCol[next[i]], g.rowVal[next[i]] = j, q.Value[k]
			next[i]++
		}
	}
	return g
}

// row calls f for each entry of row i of the LP (a problem row or a cut).
func (g *gmiState) row(i int, f func(j int, v float64)) {
	if i < g.m0 {
		for k := g.rowStart[i]; k < g.rowStart[i+1]; k++ {
			f(g.rowCol[k], g.rowVal[k])
		}
		return
	}
	c := &g.cuts[i-g.m0]
	for k, j := range c.cols {
		f(j, c.vals[k])
	}
}

// gmiCandidates derives a cut from every tableau row whose basic column
// is integer with a fractional value. s holds the optimal basis of the LP
// whose point is x; lo and up are the column bounds the cuts may rely on
// (valid for every solution the search must keep).
func gmiCandidates(s *lp.Solver, g *gmiState, integer []bool, x, lo, up []float64) []cut {
	n, m := s.NumCols(), s.NumRows()
	alpha := make([]float64, n+m)
	pi := make([]float64, n)
	// The rows of the most fractional basic columns, at most gmiMaxRows
	// (ties by position).
	type cand struct {
		p    int
		f0   float64
		dist float64
	}
	var rows []cand
	for p := 0; p < m; p++ {
		j := s.BasicVar(p)
		if j >= n || !integer[j] {
			continue
		}
		f0 := x[j] - math.Floor(x[j])
		if f0 < gmiMinFrac || f0 > 1-gmiMinFrac {
			continue
		}
		rows = append(rows, cand{p, f0, math.Abs(f0 - 0.5)})
	}
	sort.SliceStable(rows, func(a, b int) bool { return rows[a].dist < rows[b].dist })
	if len(rows) > gmiMaxRows {
		rows = rows[:gmiMaxRows]
	}
	var out []cut
	for _, rc := range rows {
		p, f0 := rc.p, rc.f0
		j := s.BasicVar(p)
		if s.TableauRow(p, alpha) != nil {
			return out
		}
		if c, ok := gmiCut(s, g, integer, x, lo, up, j, f0, alpha, pi); ok {
			out = append(out, c)
		}
	}
	return out
}

// gmiCut builds the cut of one tableau row (alpha, basic column jb with
// fractional part f0); pi is scratch of length n, returned zeroed.
func gmiCut(s *lp.Solver, g *gmiState, integer []bool, x, lo, up []float64, jb int, f0 float64, alpha, pi []float64) (cut, bool) {
	n := s.NumCols()
	defer func() {
		for j := range pi {
			pi[j] = 0
		}
	}()
	rhs := 1.0
	for k, ak := range alpha {
		if k == jb || ak == 0 {
			continue
		}
		if math.Abs(ak) > gmiMaxAlpha {
			return cut{}, false
		}
		var l, u float64 // bounds of variable k in the computational form
		isInt := false
		if k < n {
			l, u = s.ColBounds(k)
			isInt = integer[k] && l == math.Round(l) && (math.IsInf(u, 1) || u == math.Round(u))
		} else {
			rl, ru := s.RowBounds(k - n)
			l, u = -ru, -rl
		}
		if l == u {
			continue // fixed: z_k is 0
		}
		var a, sigma, bnd float64
		switch s.VarStatus(k) {
		case lp.AtLower:
			a, sigma, bnd = ak, 1, l
		case lp.AtUpper:
			a, sigma, bnd = -ak, -1, u
		default:
			return cut{}, false // a free nonbasic: no bound to measure from
		}
		if math.IsInf(bnd, 0) {
			return cut{}, false
		}
		var gk float64
		if isInt {
			fk := a - math.Floor(a)
			if fk <= f0 {
				gk = fk / f0
			} else {
				gk = (1 - fk) / (1 - f0)
			}
		} else if a >= 0 {
			gk = a / f0
		} else {
			gk = -a / (1 - f0)
		}
		if gk == 0 {
			continue
		}
		// g_k z_k = g_k σ (v_k − bnd).
		c := gk * sigma
		rhs += c * bnd
		if k < n {
			pi[k] += c
		} else {
			// v_k = −(row k−n) · x
			g.row(k-n, func(j int, v float64) { pi[j] -= c * v })
		}
	}
	// Remove tiny coefficients by relaxing with the bounds.
	maxAbs := 0.0
	for _, v := range pi {
		maxAbs = math.Max(maxAbs, math.Abs(v))
	}
	if maxAbs == 0 {
		return cut{}, false
	}
	var c cut
	minAbs := math.Inf(1)
	for j, v := range pi {
		switch {
		case v == 0:
		case math.Abs(v) < 1e-9*maxAbs:
			// π_j x_j ≤ π_j up_j (π_j > 0) or π_j lo_j (π_j < 0).
			b := up[j]
			if v < 0 {
				b = lo[j]
			}
			if math.IsInf(b, 0) {
				return cut{}, false
			}
			rhs -= v * b
		default:
			c.cols = append(c.cols, j)
			c.vals = append(c.vals, v)
			minAbs = math.Min(minAbs, math.Abs(v))
		}
	}
	if len(c.cols) == 0 || maxAbs/minAbs > gmiMaxDynamism || math.IsNaN(rhs) || math.IsInf(rhs, 0) {
		return cut{}, false
	}
	rhs -= 1e-11 * math.Max(1, math.Abs(rhs))
	act, norm := 0.0, 0.0
	for k, j := range c.cols {
		act += c.vals[k] * x[j]
		norm += c.vals[k] * c.vals[k]
	}
	c.rhs, c.norm = rhs, math.Sqrt(norm)
	c.eff = (rhs - act) / c.norm
	if c.eff < gmiMinEfficacy {
		return cut{}, false
	}
	return c, true
}

// selectCuts returns up to max cuts, the most efficacious first (ties by
// candidate order), skipping those nearly parallel to one already taken.
func selectCuts(cands []cut, max int) []cut {
	idx := make([]int, len(cands))
	for k := range idx {
		idx[k] = k
	}
	sort.SliceStable(idx, func(a, b int) bool { return cands[idx[a]].eff > cands[idx[b]].eff })
	var out []cut
	for _, k := range idx {
		if len(out) >= max {
			break
		}
		c := cands[k]
		parallel := false
		for _, d := range out {
			if cosine(c, d) > gmiMaxParallel {
				parallel = true
				break
			}
		}
		if !parallel {
			out = append(out, c)
		}
	}
	return out
}

func cosine(a, b cut) float64 {
	// Both have sorted column lists.
	dot := 0.0
	for i, k := 0, 0; i < len(a.cols) && k < len(b.cols); {
		switch {
		case a.cols[i] < b.cols[k]:
			i++
		case a.cols[i] > b.cols[k]:
			k++
		default:
			dot += a.vals[i] * b.vals[k]
			i++
			k++
		}
	}
	return dot / (a.norm * b.norm)
}

// rootCuts adds rounds of Gomory mixed-integer cuts and knapsack cover
// cuts (knapcover.go) to the root LP in
// the solver(s) and returns the LP result after the last round. The cuts
// live in the LP only: the problem e.p, on which heuristics and the
// feasibility checks work, keeps its rows.
func (e *engine) rootCuts(r *lp.Result) (*lp.Result, error) {
	if e.cover != nil || e.opt.subDepth > 0 || e.opt.noCuts {
		return r, nil
	}
	if e.inc != nil && e.wouldPrune(r.Obj) {
		// A start or a heuristic already meets the gap at the root.
		return r, nil
	}
	// The cut rounds may spend as many simplex iterations as the root LP
	// took (at least 1,000).
	budget := max(1000, r.Iterations)
	spent := 0
	g := newGMIState(&e.p.LP)
	perRound := max(10, min(100, g.m0/2))
	total := max(50, 2*g.m0)
	for round := 0; round < gmiRounds && len(g.cuts) < total; round++ {
		// The root node is already counted, so a node limit does not stop
		// its cuts; cancellation, the clock and the work limit do.
		if e.ctx.Err() != nil || (!e.deadline.IsZero() && time.Now().After(e.deadline)) ||
			(e.opt.WorkLimit > 0 && e.lpIter >= e.opt.WorkLimit) {
			break
		}
		cands := gmiCandidates(e.s, g, e.p.Integer, r.X, e.glo, e.gup)
		cands = append(cands, knapsackCandidates(g, e.p.Integer, e.p.LP.RowLo, e.p.LP.RowUp, e.glo, e.gup, r.X)...)
		sel := selectCuts(cands, min(perRound, total-len(g.cuts)))
		if len(sel) == 0 {
			break
		}
		lo := make([]float64, len(sel))
		up := make([]float64, len(sel))
		start := []int{0}
		var cols []int
		var vals []float64
		for k, c := range sel {
			lo[k], up[k] = c.rhs, math.Inf(1)
			cols = append(cols, c.cols...)
			vals = append(vals, c.vals...)
			start = append(start, len(cols))
		}
		if err := e.s.AddRows(lo, up, start, cols, vals); err != nil {
			break
		}
		if e.s2 != nil {
			if err := e.s2.AddRows(lo, up, start, cols, vals); err != nil {
				e.s2 = nil
			}
		}
		g.cuts = append(g.cuts, sel...)
		e.cutsAdded += len(sel)
		z0 := r.Obj
		nr, err := e.solveNode()
		if err != nil {
			return nil, err
		}
		r = nr
		spent += r.Iterations
		if r.Status != lp.Optimal {
			return r, nil
		}
		if r.Obj-z0 < 1e-6*math.Max(1, math.Abs(z0)) || spent >= budget {
			break
		}
	}
	return r, nil
}
