package mip

import (
	"container/heap"
	"context"
	"errors"
	"fmt"
	"math"
	"time"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// Tolerances of the search.
const (
	// intTol: a value within intTol of an integer counts as integral
	// (common practice; SCIP and CBC default to 1e-6).
	intTol = 1e-6
	// feasTol: a row or bound violated by at most feasTol·(1+|b|) is
	// satisfied when checking a candidate solution (common practice).
	feasTol = 1e-6
	// reliability: pseudocosts count as reliable after this many
	// observations per direction (Achterberg 2007, §5.3.4 uses 8; a
	// smaller value saves strong-branching LPs on covering problems).
	reliability = 4
	// sbIterLimit bounds the dual simplex iterations of one
	// strong-branching LP (Achterberg 2007, §5.3.4, common practice).
	sbIterLimit = 60
	// sbCandidates is the number of fractional candidates looked at by
	// strong branching, best by pseudocost score first; sbLookahead stops
	// after that many candidates without a better score (Achterberg
	// 2007, §5.3.4).
	sbCandidates = 12
	sbLookahead  = 4
	// maxStoredBases caps how many open nodes keep a warm-start basis;
	// the others restart from the basis in the solver, which is still
	// dual feasible since only bounds differ between nodes.
	maxStoredBases = 20000
)

// Solve solves p by LP-based branch and bound (Land and Doig 1960), see
// the package documentation. ctx cancellation ends the search with
// status Interrupted and the best solution so far.
func Solve(ctx context.Context, p *Problem, opt Options) (*Result, error) {
	start := time.Now()
	if err := p.Validate(); err != nil {
		return nil, err
	}
	p = p.normalized()
	if ctx == nil {
		ctx = context.Background()
	}
	gapRel := opt.GapRel
	if gapRel <= 0 {
		gapRel = 1e-9
	}
	res := &Result{Obj: math.Inf(1), Bound: math.Inf(-1), Gap: math.Inf(1)}
	ps := presolve(p)
	res.PresolveTime = time.Since(start)
	if ps.red != nil {
		res.PresolvedRows, res.PresolvedCols = ps.red.LP.NumRows, ps.red.LP.NumCols
	}
	if ps.infeasible {
		res.Status = Infeasible
		res.Bound = math.Inf(1)
		res.Elapsed = time.Since(start)
		return res, nil
	}
	e := &engine{
		ctx:       ctx,
		start:     start,
		opt:       opt,
		gapRel:    gapRel,
		ps:        ps,
		p:         ps.red,
		offset:    ps.objShift + p.ObjOffset,
		incObj:    math.Inf(1),
		lastBd:    math.Inf(-1),
		prunedMin: math.Inf(1),
	}
	if opt.TimeLimit > 0 {
		e.deadline = start.Add(opt.TimeLimit)
	}
	status, err := e.run()
	if err != nil {
		return nil, err
	}
	if status == Optimal {
		e.report() // the final bound
	}
	res.Status = status
	res.Nodes = e.nodes
	res.LPIterations = e.lpIter
	res.Cuts = e.cutsAdded
	if e.inc != nil {
		res.X = ps.postsolve(e.inc)
		res.Obj = e.incObj + e.offset
	}
	switch status {
	case Optimal:
		res.Bound = res.Obj
		if e.inc != nil {
			// Optimal within GapRel: report the proven bound.
			res.Bound = math.Min(res.Obj, e.globalBound()+e.offset)
		}
	case Infeasible:
		res.Bound = math.Inf(1)
	case Unbounded:
		res.Bound = math.Inf(-1)
	default:
		res.Bound = e.globalBound() + e.offset
		if e.inc != nil && res.Bound > res.Obj {
			res.Bound = res.Obj
		}
	}
	res.Gap = gap(res.Obj, res.Bound)
	res.Elapsed = time.Since(start)
	return res, nil
}

func gap(obj, bound float64) float64 {
	if math.IsInf(obj, 0) || math.IsInf(bound, 0) {
		return math.Inf(1)
	}
	g := (obj - bound) / math.Max(1, math.Abs(obj))
	if g < 0 {
		g = 0
	}
	return g
}

type boundChange struct {
	j      int
	lo, up float64
}

type node struct {
	bound   float64 // lower bound (parent LP value or better)
	changes []boundChange
	basis   *lp.Basis
	basis2  *lp.Basis // snapshot of the second solver (Threads ≥ 2)
	depth   int
	seq     int
	// branching that created the node, for pseudocost updates
	brVar   int // -1 at the root
	brDir   int // 0 down, 1 up
	brFrac  float64
	parentZ float64
}

// nodeQueue is a best-bound priority queue; ties go to the deeper node,
// then to the older one, so the order is deterministic.
type nodeQueue []*node

func (q nodeQueue) Len() int { return len(q) }
func (q nodeQueue) Less(a, b int) bool {
	if q[a].bound != q[b].bound {
		return q[a].bound < q[b].bound
	}
	if q[a].depth != q[b].depth {
		return q[a].depth > q[b].depth
	}
	return q[a].seq < q[b].seq
}
func (q nodeQueue) Swap(a, b int) { q[a], q[b] = q[b], q[a] }
func (q *nodeQueue) Push(x any)   { *q = append(*q, x.(*node)) }
func (q *nodeQueue) Pop() any {
	old := *q
	n := old[len(old)-1]
	old[len(old)-1] = nil
	*q = old[:len(old)-1]
	return n
}

type engine struct {
	ctx      context.Context
	start    time.Time
	deadline time.Time
	opt      Options
	gapRel   float64

	ps     *presolved
	p      *Problem
	offset float64 // added to reduced objective values to get original ones
	n, m   int
	cover  *coverData
	lr     *lagrangeResult // root Lagrangian multipliers (covering)

	s             *lp.Solver
	s2            *lp.Solver // second solver for parallel strong branching
	s2ok          bool       // s2 holds the optimal basis of the current node
	glo, gup      []float64  // global bounds (root, tightened by fixing)
	clo, cup      []float64  // bounds currently set in s
	touched       []int      // columns whose bounds in s differ from global
	isTouched     []bool
	gran          float64 // feasible objective values are multiples of gran (0: unknown)
	inc           []float64
	incObj        float64
	queue         nodeQueue
	seq           int
	nodes         int
	lpIter        int
	cutsAdded     int
	storedBases   int
	pcSum         [2][]float64 // pseudocost sums per unit change: 0 down, 1 up
	pcCnt         [2][]int
	pcAllSum      [2]float64
	pcAllCnt      [2]int
	lastBd        float64
	prunedMin     float64 // least bound of any region pruned by the gap rule
	curBound      float64 // bound of the node being processed
	stopStat      Status
	stopped       bool
	rootDone      bool
	lastDiveNode  int
	lastRinsNode  int
	rcFixedGlobal int
	rootLPObj     float64
	rootRC, rootX []float64
}

func (e *engine) globalBound() float64 {
	b := math.Min(e.incObj, e.prunedMin)
	if e.stopped || !e.rootDone {
		b = math.Min(b, e.curBound)
	}
	if len(e.queue) > 0 && e.queue[0].bound < b {
		b = e.queue[0].bound
	}
	b = e.roundBound(b)
	if !math.IsInf(e.incObj, 1) && e.incObj-b <= 1e-9*math.Max(1, math.Abs(e.incObj+e.offset)) {
		b = e.incObj
	}
	return b
}

// roundBound rounds a lower bound up to the objective granularity.
func (e *engine) roundBound(b float64) float64 {
	if e.gran > 0 && !math.IsInf(b, 0) {
		return math.Ceil(b/e.gran-1e-6) * e.gran
	}
	return b
}

// cutoffDelta: a node with bound ≥ incObj − delta cannot hold a solution
// better than the incumbent by more than the requested gap.
func (e *engine) canPrune(bound float64) bool {
	if math.IsInf(e.incObj, 1) {
		return false
	}
	scale := math.Max(1, math.Abs(e.incObj+e.offset))
	delta := e.gapRel * scale
	if e.gran > 0 {
		delta = math.Max(delta, e.gran-1e-6*scale)
	}
	if bound >= e.incObj-delta {
		// The pruned region's bound stays part of the proven bound.
		if bound < e.prunedMin {
			e.prunedMin = bound
		}
		return true
	}
	return false
}

// wouldPrune is canPrune without recording the bound, for heuristics
// that only stop a dive.
func (e *engine) wouldPrune(bound float64) bool {
	keep := e.prunedMin
	ok := e.canPrune(bound)
	e.prunedMin = keep
	return ok
}

func (e *engine) checkStop() bool {
	if e.stopped {
		return true
	}
	if err := e.ctx.Err(); err != nil {
		e.stopped, e.stopStat = true, Interrupted
		return true
	}
	if !e.deadline.IsZero() && time.Now().After(e.deadline) {
		e.stopped, e.stopStat = true, TimeLimit
		return true
	}
	if e.opt.NodeLimit > 0 && e.nodes >= e.opt.NodeLimit {
		e.stopped, e.stopStat = true, NodeLimit
		return true
	}
	if e.opt.WorkLimit > 0 && e.lpIter >= e.opt.WorkLimit {
		e.stopped, e.stopStat = true, WorkLimit
		return true
	}
	return false
}

func (e *engine) lpOptions(iterLimit int) lp.Options {
	return lp.Options{MaxIterations: iterLimit, Deadline: e.deadline, Context: e.ctx}
}

func (e *engine) report() {
	if e.opt.Progress == nil {
		return
	}
	b := e.globalBound() + e.offset
	inc := e.incObj + e.offset
	e.opt.Progress(Progress{Incumbent: inc, Bound: b, Gap: gap(inc, b), Nodes: e.nodes, Elapsed: time.Since(e.start)})
}

// setIncumbent records x (reduced space) if it is feasible and better.
func (e *engine) setIncumbent(x []float64) bool {
	obj, ok := e.evaluate(x)
	if !ok || obj >= e.incObj-1e-9*math.Max(1, math.Abs(obj)) {
		return false
	}
	e.inc = append([]float64(nil), x...)
	e.incObj = obj
	e.report()
	return true
}

// evaluate checks x against bounds, rows and integrality of the reduced
// problem and returns its objective. Integer columns are rounded first.
func (e *engine) evaluate(x []float64) (float64, bool) {
	q := &e.p.LP
	for j := 0; j < e.n; j++ {
		if e.p.Integer[j] {
			r := math.Round(x[j])
			if math.Abs(r-x[j]) > intTol {
				return 0, false
			}
			x[j] = r
		}
		if x[j] < q.ColLo[j]-feasTol*(1+math.Abs(q.ColLo[j])) || x[j] > q.ColUp[j]+feasTol*(1+math.Abs(q.ColUp[j])) {
			return 0, false
		}
	}
	act := make([]float64, e.m)
	obj := 0.0
	for j := 0; j < e.n; j++ {
		if x[j] == 0 {
			continue
		}
		obj += q.Obj[j] * x[j]
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			act[q.RowIndex[k]] += q.Value[k] * x[j]
		}
	}
	for i := 0; i < e.m; i++ {
		if act[i] < q.RowLo[i]-feasTol*(1+math.Abs(q.RowLo[i])) || act[i] > q.RowUp[i]+feasTol*(1+math.Abs(q.RowUp[i])) {
			return 0, false
		}
	}
	return obj, true
}

func (e *engine) run() (Status, error) {
	q := &e.p.LP
	e.n, e.m = q.NumCols, q.NumRows
	e.curBound = math.Inf(-1)
	if e.n == 0 {
		e.inc = []float64{}
		e.incObj = 0
		e.rootDone = true
		return Optimal, nil
	}
	e.gran = objGranularity(e.p)
	if e.ps.setCover {
		e.cover = newCoverData(e.p)
	}
	var err error
	e.s, err = lp.New(q, e.lpOptions(0))
	if err != nil {
		return 0, fmt.Errorf("mip: %w", err)
	}
	if e.opt.Threads >= 2 {
		e.s2, err = lp.New(q, e.lpOptions(0))
		if err != nil {
			return 0, fmt.Errorf("mip: %w", err)
		}
	}
	e.glo = append([]float64(nil), q.ColLo...)
	e.gup = append([]float64(nil), q.ColUp...)
	e.clo = append([]float64(nil), q.ColLo...)
	e.cup = append([]float64(nil), q.ColUp...)
	e.isTouched = make([]bool, e.n)
	for d := 0; d < 2; d++ {
		e.pcSum[d] = make([]float64, e.n)
		e.pcCnt[d] = make([]int, e.n)
	}

	// Covering: Lagrangian bound and heuristic before the LP.
	if e.cover != nil {
		e.coverRoot()
		if e.stopped {
			return e.stopStat, nil
		}
		if e.inc != nil && e.canPrune(e.curBound) {
			e.rootDone = true
			return Optimal, nil
		}
	}

	// A start given by the caller (Options.Start).
	if e.opt.Start != nil {
		e.tryStart()
		if e.stopped {
			return e.stopStat, nil
		}
	}

	// General MIPs: a first feasible point before the LP (the root LP of
	// a large model can take long).
	if e.cover == nil && e.inc == nil {
		e.repair()
		if e.stopped {
			return e.stopStat, nil
		}
	}

	root := &node{bound: math.Inf(-1), brVar: -1}
	if e.curBound > root.bound {
		root.bound = e.curBound
	}
	st, err := e.search(root)
	if err != nil {
		return 0, err
	}
	return st, nil
}

// tryStart maps Options.Start into the presolved space and keeps it as
// the incumbent when it is feasible there. A start that presolve cannot
// map (it gives a removed column another value than presolve fixed) or
// that breaks a row is where the repair search begins instead.
func (e *engine) tryStart() {
	x := e.ps.reduce(e.opt.Start)
	if x == nil {
		return
	}
	if e.ps.agrees(e.opt.Start) && e.setIncumbent(append([]float64(nil), x...)) {
		return
	}
	e.repairFrom(x)
}

// objGranularity returns g > 0 when every feasible objective value of p
// is a multiple of g: all objective coefficients of integer columns are
// integer multiples of g and continuous columns have zero cost.
func objGranularity(p *Problem) float64 {
	g := 0.0
	for j, c := range p.LP.Obj {
		if c == 0 {
			continue
		}
		if !p.Integer[j] {
			return 0
		}
		if c != math.Trunc(c) || math.Abs(c) > 1e9 {
			return 0
		}
		g = gcd(g, math.Abs(c))
	}
	return g
}

func gcd(a, b float64) float64 {
	for b != 0 {
		a, b = b, math.Mod(a, b)
	}
	return a
}

// coverRoot runs the Lagrangian bound and heuristic (Beasley 1990) and
// fixes columns by Lagrangian reduced costs.
func (e *engine) coverRoot() {
	cd := e.cover
	// Plain greedy first (Chvátal 1979).
	if c := cd.greedy(nil, cd.cost, nil); c != nil {
		e.setIncumbent(e.coverX(c))
	}
	lr := cd.lagrange(nil, e.incObj, e.gran, 3000, e.checkStop)
	if lr.best != nil {
		e.setIncumbent(e.coverX(lr.best))
	}
	if !math.IsInf(lr.bound, -1) && lr.bound > e.curBound {
		e.curBound = lr.bound
		e.report()
	}
	e.lr = lr
	e.lagrangeFix(lr)
}

// lagrangeFix fixes column j to 0 when L(u) + c̃_j (c̃_j ≥ 0) cannot beat
// the incumbent, and to 1 when L(u) − c̃_j (c̃_j < 0) cannot: the
// Lagrangian counterpart of reduced-cost fixing (Beasley 1990, §3).
func (e *engine) lagrangeFix(lr *lagrangeResult) {
	if lr.redc == nil || e.inc == nil {
		return
	}
	for j := 0; j < e.n; j++ {
		if e.glo[j] == e.gup[j] {
			continue
		}
		r := lr.redc[j]
		if r >= 0 && e.canPrune(lr.bound+r) {
			e.gup[j] = e.glo[j]
			e.rcFixedGlobal++
		} else if r < 0 && e.canPrune(lr.bound-r) {
			e.glo[j] = e.gup[j]
			e.rcFixedGlobal++
		}
	}
	for j := 0; j < e.n; j++ {
		if !e.isTouched[j] && (e.clo[j] != e.glo[j] || e.cup[j] != e.gup[j]) {
			e.setBounds(j, e.glo[j], e.gup[j])
			e.clo[j], e.cup[j] = e.glo[j], e.gup[j]
		}
	}
}

func (e *engine) coverX(sel []int) []float64 {
	x := make([]float64, e.n)
	for _, j := range sel {
		x[j] = 1
	}
	return x
}

// apply sets the node's bounds in the solver: global bounds intersected
// with the node's changes. It reports false when they conflict.
func (e *engine) apply(nd *node) bool {
	// Reset touched columns to global.
	want := make(map[int][2]float64, len(nd.changes))
	for _, c := range nd.changes {
		lo, up := math.Max(c.lo, e.glo[c.j]), math.Min(c.up, e.gup[c.j])
		if w, ok := want[c.j]; ok {
			lo, up = math.Max(lo, w[0]), math.Min(up, w[1])
		}
		if lo > up {
			return false
		}
		want[c.j] = [2]float64{lo, up}
	}
	var keep []int
	for _, j := range e.touched {
		if _, ok := want[j]; ok {
			keep = append(keep, j)
			continue
		}
		e.isTouched[j] = false
		if e.clo[j] != e.glo[j] || e.cup[j] != e.gup[j] {
			e.setBounds(j, e.glo[j], e.gup[j])
			e.clo[j], e.cup[j] = e.glo[j], e.gup[j]
		}
	}
	e.touched = keep
	for _, c := range nd.changes {
		w := want[c.j]
		if !e.isTouched[c.j] {
			e.isTouched[c.j] = true
			e.touched = append(e.touched, c.j)
		}
		if e.clo[c.j] != w[0] || e.cup[c.j] != w[1] {
			e.setBounds(c.j, w[0], w[1])
			e.clo[c.j], e.cup[c.j] = w[0], w[1]
		}
	}
	// Global bounds may have been tightened since the solver last saw
	// them for untouched columns: handled in lagrangeFix/rootFix which
	// write them through.
	return true
}

// setBounds changes the bounds of column j in the solver(s).
func (e *engine) setBounds(j int, lo, up float64) {
	e.s.SetColBounds(j, lo, up)
	if e.s2 != nil {
		e.s2.SetColBounds(j, lo, up)
	}
}

// solveNode solves the node LP; with a second solver it solves the same
// LP there at the same time, so that both start strong branching from
// the node's optimal basis.
func (e *engine) solveNode() (*lp.Result, error) {
	if e.s2 == nil {
		return e.solveLP(0)
	}
	var r2 *lp.Result
	var err2 error
	done := make(chan struct{})
	e.s2.SetOptions(e.lpOptions(0))
	go func() {
		r2, err2 = e.s2.Solve()
		close(done)
	}()
	r, err := e.solveLP(0)
	<-done
	e.s2ok = err2 == nil && r2 != nil && r2.Status == lp.Optimal
	if r2 != nil {
		e.lpIter += r2.Iterations
	}
	return r, err
}

// solveLP solves the current LP and accounts its iterations. When the
// simplex reports numerical trouble it is rebuilt once from scratch with
// the same bounds (a fresh factorization from the slack basis) and the
// LP solved again.
func (e *engine) solveLP(iterLimit int) (*lp.Result, error) {
	e.s.SetOptions(e.lpOptions(iterLimit))
	r, err := e.s.Solve()
	if r != nil {
		e.lpIter += r.Iterations
	}
	if err != nil && errors.Is(err, lp.ErrNumerical) {
		if s, err2 := lp.New(&e.p.LP, e.lpOptions(iterLimit)); err2 == nil {
			for j := 0; j < e.n; j++ {
				lo, up := e.s.ColBounds(j)
				s.SetColBounds(j, lo, up)
			}
			e.s = s
			r, err = e.s.Solve()
			if r != nil {
				e.lpIter += r.Iterations
			}
		}
	}
	if err != nil {
		return nil, fmt.Errorf("mip: LP relaxation: %w", err)
	}
	return r, nil
}

func (e *engine) pushNode(nd *node) {
	e.seq++
	nd.seq = e.seq
	if nd.basis != nil {
		e.storedBases++
	}
	heap.Push(&e.queue, nd)
}

func (e *engine) popNode() *node {
	nd := heap.Pop(&e.queue).(*node)
	if nd.basis != nil {
		e.storedBases--
	}
	return nd
}

func isFrac(v float64) bool {
	return math.Abs(v-math.Round(v)) > intTol
}

// search runs the branch-and-bound loop from root: best-bound node
// selection with depth-first plunges.
func (e *engine) search(root *node) (Status, error) {
	var next *node = root
	rootSeen := false
	for {
		if e.checkStop() {
			if next != nil {
				e.curBound = math.Min(e.curBound, next.bound)
				if next.bound < e.curBound || e.curBound == math.Inf(-1) {
					e.curBound = next.bound
				}
				e.pushNode(next)
			}
			e.rootDone = rootSeen
			return e.stopStat, nil
		}
		if next == nil {
			for len(e.queue) > 0 && e.canPrune(e.queue[0].bound) {
				e.popNode()
			}
			if len(e.queue) == 0 {
				e.rootDone = true
				if e.inc == nil {
					return Infeasible, nil
				}
				return Optimal, nil
			}
			next = e.popNode()
		}
		nd := next
		next = nil
		if e.canPrune(nd.bound) {
			continue
		}
		e.curBound = nd.bound
		if !e.apply(nd) {
			continue
		}
		if nd.basis != nil {
			_ = e.s.SetBasis(nd.basis)
		}
		if nd.basis2 != nil && e.s2 != nil {
			_ = e.s2.SetBasis(nd.basis2)
		}
		e.nodes++
		r, err := e.solveNode()
		if err != nil {
			return 0, err
		}
		isRoot := !rootSeen
		rootSeen = true
		if isRoot && r.Status == lp.Optimal {
			if r, err = e.rootCuts(r); err != nil {
				return 0, err
			}
		}
		switch r.Status {
		case lp.Infeasible:
			continue
		case lp.Unbounded:
			if isRoot {
				e.rootDone = true
				return Unbounded, nil
			}
			return 0, fmt.Errorf("mip: LP relaxation of a node is unbounded while the root was bounded")
		case lp.TimeLimit, lp.Canceled, lp.IterationLimit:
			e.checkStop()
			if !e.stopped {
				e.stopped, e.stopStat = true, TimeLimit
				if r.Status == lp.Canceled {
					e.stopStat = Interrupted
				}
			}
			e.pushNode(nd)
			e.rootDone = true
			return e.stopStat, nil
		}
		z := r.Obj
		if nd.brVar >= 0 {
			e.updatePseudocost(nd.brVar, nd.brDir, nd.brFrac, z-nd.parentZ)
		}
		if z < nd.bound {
			z = nd.bound // parent bound is valid too
		}
		if isRoot {
			e.rootLPObj = z
			e.curBound = z
			e.rootRC = append([]float64(nil), r.ReducedCost...)
			e.rootX = append([]float64(nil), r.X...)
			e.report()
		}
		if e.canPrune(z) {
			continue
		}
		// Integral?
		fracs := 0
		for j := 0; j < e.n; j++ {
			if e.p.Integer[j] && isFrac(r.X[j]) {
				fracs++
			}
		}
		if fracs == 0 {
			x := append([]float64(nil), r.X...)
			if e.setIncumbent(x) {
				e.rootReducedCostFix()
			} else if _, ok := e.evaluate(append([]float64(nil), r.X...)); !ok && e.p.hasContinuous() {
				// The LP point is integral within intTol but rounding it
				// breaks a row by more than feasTol: re-solve the
				// continuous part with the integers fixed.
				for j := 0; j < e.n; j++ {
					if e.p.Integer[j] {
						x[j] = math.Round(r.X[j])
					}
				}
				if e.fixAndSolve(x) {
					e.rootReducedCostFix()
				}
			}
			// The node's LP optimum is integral: nothing below it can
			// be better.
			continue
		}
		// Heuristics.
		improved := false
		if isRoot || e.nodes-e.lastDiveNode >= 50 {
			e.lastDiveNode = e.nodes
			improved = e.heuristics(nd, r, isRoot)
		}
		if improved || isRoot {
			e.fixByIncumbent()
			if e.canPrune(z) {
				continue
			}
			if e.outsideBounds(r.X) {
				// Global fixing cut off this node's LP point: solve the
				// node again under the tightened bounds.
				next = &node{bound: z, depth: nd.depth, brVar: -1, changes: nd.changes}
				continue
			}
		}
		// Local reduced-cost fixing for the subtree.
		local := e.localFix(r, z)
		// Branching.
		j, downBound, upBound, fixes, infeasibleNode, err := e.branch(nd, r, z)
		if err != nil {
			return 0, err
		}
		if infeasibleNode {
			continue
		}
		if j < 0 {
			if len(fixes) == 0 {
				return 0, fmt.Errorf("mip: internal error: fractional LP solution with no branching candidate at node %d", e.nodes)
			}
			// Strong branching fixed variables and the node should be
			// re-solved: push it back with the tightened bounds.
			child := &node{bound: z, depth: nd.depth, brVar: -1, changes: appendChanges(nd.changes, append(local, fixes...))}
			next = child
			continue
		}
		base := appendChanges(nd.changes, append(local, fixes...))
		xj := r.X[j]
		fj := xj - math.Floor(xj)
		down := &node{bound: math.Max(z, downBound), depth: nd.depth + 1, brVar: j, brDir: 0, brFrac: fj, parentZ: z,
			changes: append(append([]boundChange(nil), base...), boundChange{j, e.glo[j], math.Floor(xj)})}
		up := &node{bound: math.Max(z, upBound), depth: nd.depth + 1, brVar: j, brDir: 1, brFrac: fj, parentZ: z,
			changes: append(append([]boundChange(nil), base...), boundChange{j, math.Ceil(xj), e.gup[j]})}
		var basis, basis2 *lp.Basis
		if e.storedBases < maxStoredBases {
			basis = e.s.Basis()
			if e.s2 != nil {
				basis2 = e.s2.Basis()
			}
		}
		down.basis, up.basis = basis, basis
		down.basis2, up.basis2 = basis2, basis2
		// Dive into the child with the better bound; ties: up (covering
		// problems profit from taking a column).
		first, second := up, down
		if down.bound < up.bound {
			first, second = down, up
		}
		if !e.canPrune(second.bound) {
			e.pushNode(second)
		}
		if e.canPrune(first.bound) {
			continue
		}
		// Plunge only while the child is not much worse than the best
		// open node.
		best := first.bound
		if len(e.queue) > 0 {
			best = math.Min(best, e.queue[0].bound)
		}
		limit := math.Inf(1)
		if !math.IsInf(e.incObj, 1) {
			limit = best + 0.5*(e.incObj-best)
		}
		if first.bound <= limit {
			first.basis, first.basis2 = nil, nil // the solvers' current bases are the parent's
			next = first
		} else {
			e.pushNode(first)
		}
		if b := e.globalBoundOpen(next); b > e.lastBd+1e-9 {
			e.lastBd = b
			e.report()
		}
	}
}

// globalBoundOpen is the bound over the open nodes plus the dive node.
func (e *engine) globalBoundOpen(next *node) float64 {
	b := math.Min(e.incObj, e.prunedMin)
	if next != nil {
		b = math.Min(b, next.bound)
	}
	if len(e.queue) > 0 {
		b = math.Min(b, e.queue[0].bound)
	}
	return e.roundBound(b)
}

func appendChanges(base, more []boundChange) []boundChange {
	if len(more) == 0 {
		return base
	}
	out := make([]boundChange, 0, len(base)+len(more))
	out = append(out, base...)
	return append(out, more...)
}

func (p *Problem) hasContinuous() bool {
	for _, v := range p.Integer {
		if !v {
			return true
		}
	}
	return false
}

// fixByIncumbent applies the global fixings that depend on the
// incumbent: reduced costs of the root LP and, for covering, Lagrangian
// reduced costs.
func (e *engine) fixByIncumbent() {
	e.rootReducedCostFix()
	if e.lr != nil {
		e.lagrangeFix(e.lr)
	}
}

// outsideBounds reports whether x violates the bounds now set in the
// solver.
func (e *engine) outsideBounds(x []float64) bool {
	for j := 0; j < e.n; j++ {
		if x[j] < e.clo[j]-intTol || x[j] > e.cup[j]+intTol {
			return true
		}
	}
	return false
}

// rootReducedCostFix fixes integer columns globally from the root LP's
// reduced costs when moving them off their bound would cost more than
// the gap to the incumbent (Achterberg 2007, §7.7; Beasley 1987, §3).
func (e *engine) rootReducedCostFix() {
	if e.rootRC == nil || e.inc == nil {
		return
	}
	changed := false
	for j := 0; j < e.n; j++ {
		if !e.p.Integer[j] || e.glo[j] == e.gup[j] {
			continue
		}
		d := e.rootRC[j]
		x := e.rootX[j]
		if d > 0 && math.Abs(x-e.p.LP.ColLo[j]) < intTol && !math.IsInf(e.glo[j], -1) {
			// x_j at lower: raising it by one costs at least d.
			if e.canPrune(e.rootLPObj + d) {
				e.gup[j] = e.glo[j]
				changed = true
			} else if k := math.Floor((e.incObj - e.rootLPObj) / d); k >= 0 && e.glo[j]+k < e.gup[j] {
				e.gup[j] = e.glo[j] + k
				changed = true
			}
		} else if d < 0 && math.Abs(x-e.p.LP.ColUp[j]) < intTol && !math.IsInf(e.gup[j], 1) {
			if e.canPrune(e.rootLPObj - d) {
				e.glo[j] = e.gup[j]
				changed = true
			}
		}
	}
	if changed {
		for j := 0; j < e.n; j++ {
			if !e.isTouched[j] && (e.clo[j] != e.glo[j] || e.cup[j] != e.gup[j]) {
				e.setBounds(j, e.glo[j], e.gup[j])
				e.clo[j], e.cup[j] = e.glo[j], e.gup[j]
			}
		}
	}
}

// localFix returns bound changes valid in the subtree of a node whose LP
// value is z: reduced-cost fixing with the node's reduced costs.
func (e *engine) localFix(r *lp.Result, z float64) []boundChange {
	if e.inc == nil {
		return nil
	}
	var out []boundChange
	for j := 0; j < e.n; j++ {
		if !e.p.Integer[j] || e.clo[j] == e.cup[j] {
			continue
		}
		d := r.ReducedCost[j]
		if d > 0 && math.Abs(r.X[j]-e.clo[j]) < intTol && e.canPrune(z+d) {
			out = append(out, boundChange{j, e.clo[j], e.clo[j]})
		} else if d < 0 && math.Abs(r.X[j]-e.cup[j]) < intTol && e.canPrune(z-d) {
			out = append(out, boundChange{j, e.cup[j], e.cup[j]})
		}
	}
	return out
}
