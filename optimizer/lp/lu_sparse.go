package lp

import "math"

// Hypersparse FTRAN and BTRAN.
//
// In the LPs of plan models most right-hand sides of the triangular
// solves (a column of A, a unit vector) and most results are very
// sparse, while a pass over all m pivots costs O(m) whatever the
// sparsity. Following Gilbert & Peierls (1988), each triangular solve
// first finds, by depth-first search from the nonzeros of the
// right-hand side over the graph of the triangular factor, the set of
// entries that can become nonzero, in topological order, and then does
// the arithmetic on those alone; the work is proportional to the
// arithmetic. Hall & McKinnon ("Hyper-sparsity in the revised simplex
// method and how to exploit it", Comput. Optim. Appl. 32, 2005, from
// memory) use this when the result is expected to be sparse and the
// ordinary pass otherwise; here the search gives up, and the dense pass
// takes over, once it has visited more than hyperFrac·m nodes.
//
// BTRAN scatters along the rows of U and L, so both factors are also
// kept by rows (buildRows); the Forrest–Tomlin update maintains the
// row-wise U (updateFT).

// hyperFrac is the result density above which the dense pass is used.
// Hall & McKinnon (2005, from memory) switch near 10%; 0.1 measured
// well on the plan models.
const hyperFrac = 0.1

// hyperLimit is the largest reach (in nodes) handled by the sparse
// solves.
func (f *luFactor) hyperLimit() int { return int(hyperFrac * float64(f.m)) }

// buildRows builds the row-wise copies of L and U after a factorization.
func (f *luFactor) buildRows() {
	m := f.m
	if len(f.visited) != m {
		f.visited = make([]bool, m)
		f.inP = make([]bool, m)
		f.topo = make([]int, 2*m)
		f.stack = make([]int, m)
		f.pstack = make([]int, m)
		f.sw = make([]float64, m)
	}
	// L: the pivot of each entry's row, and the transpose.
	f.lPiv = f.lPiv[:0]
	for _, i := range f.lIdx {
		f.lPiv = append(f.lPiv, f.rowPiv[i])
	}
	f.lrStart = resizeInts(f.lrStart, m+1)
	for j := range f.lrStart {
		f.lrStart[j] = 0
	}
	for _, j := range f.lPiv {
		f.lrStart[j+1]++
	}
	for j := 0; j < m; j++ {
		f.lrStart[j+1] += f.lrStart[j]
	}
	f.lrPiv = resizeInts(f.lrPiv, len(f.lIdx))
	f.lrVal = resizeFloats(f.lrVal, len(f.lIdx))
	next := f.stack // scratch, length m
	copy(next, f.lrStart[:m])
	for k := 0; k < m; k++ {
		for t := f.lStart[k]; t < f.lStart[k+1]; t++ {
			j := f.lPiv[t]
			f.lrPiv[next[j]] = k
			f.lrVal[next[j]] = f.lVal[t]
			next[j]++
		}
	}
	// U by rows, with room for the entries Forrest–Tomlin updates add.
	f.urBeg = resizeInts(f.urBeg, m)
	f.urEnd = resizeInts(f.urEnd, m)
	f.urLim = resizeInts(f.urLim, m)
	cnt := next
	for j := range cnt {
		cnt[j] = 0
	}
	for k := 0; k < m; k++ {
		for t := f.uBeg[k]; t < f.uEnd[k]; t++ {
			cnt[f.uIdx[t]]++
		}
	}
	pos := 0
	for j := 0; j < m; j++ {
		f.urBeg[j] = pos
		f.urEnd[j] = pos
		pos += cnt[j] + cnt[j]/2 + 2
		f.urLim[j] = pos
	}
	f.urPiv = resizeInts(f.urPiv, pos)
	f.urVal = resizeFloats(f.urVal, pos)
	for k := 0; k < m; k++ {
		for t := f.uBeg[k]; t < f.uEnd[k]; t++ {
			j := f.uIdx[t]
			f.urPiv[f.urEnd[j]] = k
			f.urVal[f.urEnd[j]] = f.uVal[t]
			f.urEnd[j]++
		}
	}
}

func resizeInts(s []int, n int) []int {
	if cap(s) < n {
		return make([]int, n)
	}
	return s[:n]
}

func resizeFloats(s []float64, n int) []float64 {
	if cap(s) < n {
		return make([]float64, n)
	}
	return s[:n]
}

// reach returns the nodes reachable from starts in the graph whose node
// k has the successors adj[beg[k]:end[k]], in topological order (every
// node before its successors), by the iterative depth-first search of
// Gilbert & Peierls (1988). Starts without successors (in the plan
// models most of them: slack pivots) need no search: unless the search
// reaches them from another start, they go to the end of the order,
// which is topological for a node without successors. It gives up (ok
// false) once more than limit nodes are taken. The result lives in
// f.topo until the next call.
func (f *luFactor) reach(starts, beg, end, adj []int, limit int) (order []int, ok bool) {
	m := f.m
	top := m
	vis := f.visList[:0]
	leaves := f.leaves[:0]
	ok = true
search:
	for _, s := range starts {
		if f.visited[s] {
			continue
		}
		if beg[s] == end[s] {
			leaves = append(leaves, s)
			continue
		}
		if len(vis)+len(leaves) >= limit {
			ok = false
			break
		}
		f.visited[s] = true
		vis = append(vis, s)
		head := 0
		f.stack[0] = s
		f.pstack[0] = beg[s]
		for head >= 0 {
			k := f.stack[head]
			t, e := f.pstack[head], end[k]
			pushed := false
			for ; t < e; t++ {
				j := adj[t]
				if f.visited[j] {
					continue
				}
				if len(vis)+len(leaves) >= limit {
					ok = false
					break search
				}
				f.visited[j] = true
				vis = append(vis, j)
				if beg[j] == end[j] {
					// A leaf finishes at once.
					top--
					f.topo[top] = j
					continue
				}
				f.pstack[head] = t + 1
				head++
				f.stack[head] = j
				f.pstack[head] = beg[j]
				pushed = true
				break
			}
			if !pushed {
				head--
				top--
				f.topo[top] = k
			}
		}
	}
	n := m
	if ok {
		for _, k := range leaves {
			if !f.visited[k] {
				f.visited[k] = true
				vis = append(vis, k)
				f.topo[n] = k
				n++
			}
		}
	}
	for _, k := range vis {
		f.visited[k] = false
	}
	f.visList = vis
	f.leaves = leaves
	if !ok {
		return nil, false
	}
	return f.topo[top:n], true
}

// ftranSparse is ftran for a right-hand side a (by rows) that is zero
// outside the rows idx (no repeats). It returns, in idx's storage, the
// basis positions where the result (a, by positions) may be nonzero; a
// is zero elsewhere. hint, when not nil, carries the recent result
// density of the caller's kind of vector (Hall & McKinnon 2005 predict
// it the same way, from memory): above hyperFrac the search is not
// tried, and it is updated here.
func (f *luFactor) ftranSparse(a []float64, idx []int, hint *float64) []int {
	m := f.m
	if len(f.etaPos) > 0 {
		f.ftran(a)
		return nonzeros(a, idx[:0])
	}
	limit := f.hyperLimit()
	var order []int
	ok := false
	if len(idx) <= limit && (hint == nil || *hint <= hyperFrac) {
		starts := f.starts[:0]
		for _, i := range idx {
			starts = append(starts, f.rowPiv[i])
		}
		f.starts = starts
		order, ok = f.reach(starts, f.lStart[:m], f.lStart[1:], f.lPiv, limit)
	}
	if !ok {
		f.ftranL(a)
		f.ftranR(a)
		if f.wantSpike {
			f.saveSpike(a)
		}
		out := f.ftranUList(a, idx[:0])
		noteDensity(hint, len(out), m)
		return out
	}
	// L̃ v = a in topological order.
	for _, k := range order {
		v := a[f.prow[k]]
		if v == 0 {
			continue
		}
		for t := f.lStart[k]; t < f.lStart[k+1]; t++ {
			a[f.lIdx[t]] -= v * f.lVal[t]
		}
	}
	P := append(f.pList[:0], order...)
	// Forrest–Tomlin row etas, oldest first.
	for _, k := range P {
		f.inP[k] = true
	}
	for e, kp := range f.rPiv {
		r := f.prow[kp]
		v := a[r]
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			v -= f.rVal[t] * a[f.prow[f.rIdx[t]]]
		}
		a[r] = v
		if v != 0 && !f.inP[kp] {
			f.inP[kp] = true
			P = append(P, kp)
		}
	}
	for _, k := range P {
		f.inP[k] = false
	}
	f.pList = P
	if f.wantSpike {
		f.spikeIdx = f.spikeIdx[:0]
		f.spikeVal = f.spikeVal[:0]
		for _, k := range P {
			if v := a[f.prow[k]]; v != 0 {
				f.spikeIdx = append(f.spikeIdx, k)
				f.spikeVal = append(f.spikeVal, v)
			}
		}
	}
	// U t = v in topological order of U's column graph.
	order, ok = f.reach(P, f.uBeg, f.uEnd, f.uIdx, limit)
	if !ok {
		out := f.ftranUList(a, idx[:0])
		noteDensity(hint, len(out), m)
		return out
	}
	t := f.sw
	for _, k := range order {
		r := f.prow[k]
		v := a[r]
		if v == 0 {
			continue
		}
		a[r] = 0
		tk := v / f.uDiag[k]
		t[k] = tk
		for q := f.uBeg[k]; q < f.uEnd[k]; q++ {
			a[f.prow[f.uIdx[q]]] -= f.uVal[q] * tk
		}
	}
	out := idx[:0]
	for _, k := range order {
		if v := t[k]; v != 0 {
			t[k] = 0
			p := f.pcol[k]
			a[p] = v
			out = append(out, p)
		}
	}
	noteDensity(hint, len(out), m)
	return out
}

// noteDensity updates a density estimate with a result of nnz nonzeros
// out of m, as an exponential average.
func noteDensity(hint *float64, nnz, m int) {
	if hint != nil {
		*hint = 0.75**hint + 0.25*float64(nnz)/float64(m)
	}
}

// ftranUList is the dense U solve of ftranU without the product-form
// etas (the caller checks there are none); it appends the positions
// of the nonzeros of the result to out, and needs no pass over all of a.
func (f *luFactor) ftranUList(a []float64, out []int) []int {
	w := f.sw // by position here; zero again on return
	for idx := len(f.ord) - 1; idx >= 0; idx-- {
		k := f.ord[idx]
		if k < 0 {
			continue
		}
		r := f.prow[k]
		v := a[r]
		if v == 0 {
			continue
		}
		a[r] = 0
		tk := v / f.uDiag[k]
		p := f.pcol[k]
		w[p] = tk
		out = append(out, p)
		for t := f.uBeg[k]; t < f.uEnd[k]; t++ {
			a[f.prow[f.uIdx[t]]] -= f.uVal[t] * tk
		}
	}
	for _, p := range out {
		a[p] = w[p]
		w[p] = 0
	}
	return out
}

// btranSparse is btran for a right-hand side c (by basis positions)
// that is zero outside the positions idx (no repeats). It returns, in
// idx's storage, the rows where the result (c, by rows) may be nonzero;
// c is zero elsewhere.
func (f *luFactor) btranSparse(c []float64, idx []int, hint *float64) []int {
	m := f.m
	limit := f.hyperLimit()
	if len(f.etaPos) > 0 || len(idx) > limit || (hint != nil && *hint > hyperFrac) {
		return f.btranDense(c, idx, hint)
	}
	starts := f.pivotsAt(idx)
	order, ok := f.reach(starts, f.urBeg, f.urEnd, f.urPiv, limit)
	if !ok {
		return f.btranDense(c, idx, hint)
	}
	// Uᵀ s = c, scattering along the rows of U.
	s := f.sw
	for _, k := range starts {
		p := f.pcol[k]
		s[k] = c[p]
		c[p] = 0
	}
	for _, k := range order {
		v := s[k]
		if v == 0 {
			continue
		}
		v /= f.uDiag[k]
		s[k] = v
		for t := f.urBeg[k]; t < f.urEnd[k]; t++ {
			s[f.urPiv[t]] -= f.urVal[t] * v
		}
	}
	P := append(f.pList[:0], order...)
	// Transposed row etas, newest first.
	for _, k := range P {
		f.inP[k] = true
	}
	for e := len(f.rPiv) - 1; e >= 0; e-- {
		sk := s[f.rPiv[e]]
		if sk == 0 {
			continue
		}
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			j := f.rIdx[t]
			s[j] -= f.rVal[t] * sk
			if !f.inP[j] {
				f.inP[j] = true
				P = append(P, j)
			}
		}
	}
	for _, k := range P {
		f.inP[k] = false
	}
	f.pList = P
	// L̃ᵀ y = s, scattering along the rows of L.
	order, ok = f.reach(P, f.lrStart[:m], f.lrStart[1:], f.lrPiv, limit)
	if !ok {
		f.btranL(s, c)
		for _, k := range P {
			s[k] = 0
		}
		out := nonzeros(c, idx[:0])
		noteDensity(hint, len(out), m)
		return out
	}
	out := idx[:0]
	for _, j := range order {
		v := s[j]
		if v == 0 {
			continue
		}
		s[j] = 0
		i := f.prow[j]
		c[i] = v
		out = append(out, i)
		for t := f.lrStart[j]; t < f.lrStart[j+1]; t++ {
			s[f.lrPiv[t]] -= f.lrVal[t] * v
		}
	}
	noteDensity(hint, len(out), m)
	return out
}

// btranDense is the dense BTRAN with the result's nonzero rows listed in
// idx's storage and the density noted in hint, the fallback of
// btranSparse.
func (f *luFactor) btranDense(c []float64, idx []int, hint *float64) []int {
	f.btran(c)
	out := nonzeros(c, idx[:0])
	noteDensity(hint, len(out), f.m)
	return out
}

// pivotsAt lists, in f.starts, the pivots of the basis positions given.
func (f *luFactor) pivotsAt(positions []int) []int {
	starts := f.starts[:0]
	for _, p := range positions {
		starts = append(starts, f.pivOfPos[p])
	}
	f.starts = starts
	return starts
}

// nonzeros appends the indices of the nonzero entries of v to out.
func nonzeros(v []float64, out []int) []int {
	for i, x := range v {
		if x != 0 {
			out = append(out, i)
		}
	}
	return out
}

// updateFT replaces the column of basis position p by the entering column
// whose spike the last FTRAN saved, after Forrest & Tomlin (1972): the
// spike becomes U's column for p's pivot kp, kp moves to the end of the
// triangular order, and row kp — now left of the diagonal — is
// eliminated by the rows after kp's old place, which is recorded as a
// row eta. The multipliers r solve rᵀU_sub = row kp, a triangular solve
// with Uᵀ whose right-hand side is row kp; it is done hypersparse along
// U's rows, so an update costs in proportion to the entries it touches.
// The new diagonal must equal α_r times the old one (the determinant
// identity det B' = α_r det B); if it does not, to a relative 1e-8, the
// update is refused and the caller must refactorize.
func (f *luFactor) updateFT(p int, alphaR float64) bool {
	kp := f.pivOfPos[p]
	op := f.posOf[kp]
	r := f.rwork
	// Row kp of U is the right-hand side; take it out of U's columns.
	starts := f.starts[:0]
	for t := f.urBeg[kp]; t < f.urEnd[kp]; t++ {
		k := f.urPiv[t]
		r[k] = f.urVal[t]
		starts = append(starts, k)
		f.removeColEntry(k, kp)
	}
	f.starts = starts
	// Empty the row by moving its start past its entries: the entries of
	// a row of the factorization stay intact for restore, and new entries
	// go into the room after them.
	f.urBeg[kp] = f.urEnd[kp]
	order, _ := f.reach(starts, f.urBeg, f.urEnd, f.urPiv, f.m+1)
	for _, k := range order {
		rk := r[k]
		if rk == 0 {
			continue
		}
		rk /= f.uDiag[k]
		r[k] = rk
		f.rIdx = append(f.rIdx, k)
		f.rVal = append(f.rVal, rk)
		for t := f.urBeg[k]; t < f.urEnd[k]; t++ {
			r[f.urPiv[t]] -= f.urVal[t] * rk
		}
	}
	// The old column kp leaves U's rows.
	for t := f.uBeg[kp]; t < f.uEnd[kp]; t++ {
		f.removeRowEntry(f.uIdx[t], kp)
	}
	// New column kp: the spike; its diagonal after the row eta.
	diag := 0.0
	f.uBeg[kp] = len(f.uIdx)
	for t, j := range f.spikeIdx {
		v := f.spikeVal[t]
		if j == kp {
			diag += v
			continue
		}
		diag -= r[j] * v
		f.uIdx = append(f.uIdx, j)
		f.uVal = append(f.uVal, v)
		f.appendRowEntry(j, kp, v)
	}
	f.uEnd[kp] = len(f.uIdx)
	for _, k := range order {
		r[k] = 0
	}
	f.rPiv = append(f.rPiv, kp)
	f.rStart = append(f.rStart, len(f.rIdx))
	want := f.uDiag[kp] * alphaR
	f.uDiag[kp] = diag
	f.ord[op] = -1
	f.posOf[kp] = len(f.ord)
	f.ord = append(f.ord, kp)
	if math.Abs(diag-want) > 1e-8*math.Max(1, math.Abs(want)) || diag == 0 {
		f.broken = true
		return false
	}
	return true
}

// removeColEntry removes the entry of row j from U's column k. A column
// still in the storage of the factorization is first copied to the end,
// so that restore finds the factorization intact.
func (f *luFactor) removeColEntry(k, j int) {
	if f.uBeg[k] < f.base.nU {
		nb := len(f.uIdx)
		f.uIdx = append(f.uIdx, f.uIdx[f.uBeg[k]:f.uEnd[k]]...)
		f.uVal = append(f.uVal, f.uVal[f.uBeg[k]:f.uEnd[k]]...)
		f.uBeg[k], f.uEnd[k] = nb, len(f.uIdx)
	}
	e := f.uEnd[k] - 1
	for t := f.uBeg[k]; t <= e; t++ {
		if f.uIdx[t] == j {
			f.uIdx[t], f.uVal[t] = f.uIdx[e], f.uVal[e]
			f.uEnd[k] = e
			return
		}
	}
}

// removeRowEntry removes the entry of column k from U's row j; like
// removeColEntry it first moves a row of the factorization's storage.
func (f *luFactor) removeRowEntry(j, k int) {
	if f.urBeg[j] < f.base.nR {
		f.moveRow(j)
	}
	e := f.urEnd[j] - 1
	for t := f.urBeg[j]; t <= e; t++ {
		if f.urPiv[t] == k {
			f.urPiv[t], f.urVal[t] = f.urPiv[e], f.urVal[e]
			f.urEnd[j] = e
			return
		}
	}
}

// appendRowEntry adds (column k, v) to U's row j, moving the row to the
// end of the storage with twice the room when it is full. (Writing into
// the room of a row of the factorization leaves its entries intact.)
func (f *luFactor) appendRowEntry(j, k int, v float64) {
	if f.urEnd[j] == f.urLim[j] {
		f.moveRow(j)
	}
	f.urPiv[f.urEnd[j]] = k
	f.urVal[f.urEnd[j]] = v
	f.urEnd[j]++
}

// moveRow copies U's row j to the end of the row storage with room for
// as many entries again (and 4).
func (f *luFactor) moveRow(j int) {
	n := f.urEnd[j] - f.urBeg[j]
	nb := len(f.urPiv)
	f.urPiv = append(f.urPiv, f.urPiv[f.urBeg[j]:f.urEnd[j]]...)
	f.urVal = append(f.urVal, f.urVal[f.urBeg[j]:f.urEnd[j]]...)
	for q := 0; q < n+4; q++ {
		f.urPiv = append(f.urPiv, 0)
		f.urVal = append(f.urVal, 0)
	}
	f.urBeg[j], f.urEnd[j], f.urLim[j] = nb, nb+n, nb+2*n+4
}

// luBase is what restore needs to return to the factorization after
// Forrest–Tomlin updates: the U pointers and diagonal as factor left
// them and the storage lengths then. Updates never write inside those
// lengths (removals move a column or row out first; appends go to the
// end or into a row's spare room), so the stored entries stay valid.
type luBase struct {
	uBeg, uEnd, urBeg, urEnd, urLim []int
	uDiag                           []float64
	nU, nR                          int
}

// saveBase records the factorization just computed.
func (f *luFactor) saveBase() {
	b := &f.base
	b.uBeg = append(b.uBeg[:0], f.uBeg...)
	b.uEnd = append(b.uEnd[:0], f.uEnd...)
	b.urBeg = append(b.urBeg[:0], f.urBeg...)
	b.urEnd = append(b.urEnd[:0], f.urEnd...)
	b.urLim = append(b.urLim[:0], f.urLim...)
	b.uDiag = append(b.uDiag[:0], f.uDiag...)
	b.nU, b.nR = len(f.uIdx), len(f.urPiv)
}

// restore drops every update since the last factorization, at a cost
// of O(m) instead of a new factorization of the same basis (which would
// give the same factors, bit for bit).
func (f *luFactor) restore() {
	b := &f.base
	copy(f.uBeg, b.uBeg)
	copy(f.uEnd, b.uEnd)
	copy(f.urBeg, b.urBeg)
	copy(f.urEnd, b.urEnd)
	copy(f.urLim, b.urLim)
	copy(f.uDiag, b.uDiag)
	f.uIdx, f.uVal = f.uIdx[:b.nU], f.uVal[:b.nU]
	f.urPiv, f.urVal = f.urPiv[:b.nR], f.urVal[:b.nR]
	f.ord = f.ord[:0]
	for k := 0; k < f.m; k++ {
		f.ord = append(f.ord, k)
		f.posOf[k] = k
	}
	f.clearEtas()
	f.broken = false
}

// ftranPartial sets out[p] = (B⁻¹a)_p for the basis positions p in
// targets only, leaving a and the rest of out untouched; a is by rows.
// It works backward from the targets: an entry of the U solve needs the
// entries along its row of U, those need the entries the row etas read,
// and all of them need the entries along their rows of L. Both needed
// sets are found by the depth-first search of reach over the row-wise
// factors and solved by dot products along the rows, so the work is
// that of the union of the BTRANs of the unit rows of the targets, done
// once. It reports false, having done nothing, when the product-form
// eta file is in use or the needed set exceeds limit nodes.
func (f *luFactor) ftranPartial(a []float64, targets []int, out []float64, limit int) bool {
	m := f.m
	if len(f.etaPos) > 0 {
		return false
	}
	starts := f.pivotsAt(targets)
	uOrder, ok := f.reach(starts, f.urBeg, f.urEnd, f.urPiv, limit)
	if !ok {
		return false
	}
	N := append(f.pList[:0], uOrder...)
	nU := len(N)
	for _, k := range N {
		f.inP[k] = true
	}
	for e := len(f.rPiv) - 1; e >= 0; e-- {
		if !f.inP[f.rPiv[e]] {
			continue
		}
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			if j := f.rIdx[t]; !f.inP[j] {
				f.inP[j] = true
				N = append(N, j)
			}
		}
	}
	f.pList = N
	// Most needed entries have an empty row of L (v_k = a_{prow[k]});
	// only the others need the search.
	starts = f.starts[:0]
	for _, k := range N {
		if f.lrStart[k] < f.lrStart[k+1] {
			starts = append(starts, k)
		}
	}
	f.starts = starts
	lOrder, ok := f.reach(starts, f.lrStart[:m], f.lrStart[1:], f.lrPiv, limit)
	if !ok {
		for _, k := range N {
			f.inP[k] = false
		}
		return false
	}
	v := f.sw
	for _, k := range N {
		v[k] = a[f.prow[k]]
	}
	// L̃ v = a: v_k = a_{prow[k]} − Σ L[prow[k], j] v_j, dependencies
	// (the successors in the search) first.
	for q := len(lOrder) - 1; q >= 0; q-- {
		k := lOrder[q]
		x := a[f.prow[k]]
		for t := f.lrStart[k]; t < f.lrStart[k+1]; t++ {
			x -= f.lrVal[t] * v[f.lrPiv[t]]
		}
		v[k] = x
	}
	// Row etas, oldest first, on the needed entries.
	for e, kp := range f.rPiv {
		if !f.inP[kp] {
			continue
		}
		x := v[kp]
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			x -= f.rVal[t] * v[f.rIdx[t]]
		}
		v[kp] = x
	}
	// U t = v along the rows of U, dependencies first; t overwrites v.
	uOrder = N[:nU]
	for q := nU - 1; q >= 0; q-- {
		k := uOrder[q]
		x := v[k]
		for t := f.urBeg[k]; t < f.urEnd[k]; t++ {
			x -= f.urVal[t] * v[f.urPiv[t]]
		}
		v[k] = x / f.uDiag[k]
	}
	for _, p := range targets {
		out[p] = v[f.pivOfPos[p]]
	}
	for _, k := range lOrder {
		v[k] = 0
	}
	for _, k := range N {
		v[k] = 0
		f.inP[k] = false
	}
	return true
}
