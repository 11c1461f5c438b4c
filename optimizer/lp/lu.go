package lp

import "math"

// luFactor holds a sparse LU factorization of the basis matrix B and the
// updates for the basis changes since: Forrest–Tomlin (1972) updates of U
// with row etas (the default, useFT), or a product-form eta file
// (Dantzig & Orchard-Hays 1954; Maros 2003, ch. 8).
//
// The factorization is left-looking (Gilbert & Peierls 1988): columns of
// B are taken in order of increasing count (so the logical unit columns
// come first and stay trivial), each is reduced by those earlier L
// columns that its nonzeros reach (found through a min-heap of pivot
// indices, so the work is proportional to the arithmetic rather than to
// m²), and its pivot row is chosen by threshold partial pivoting — among
// the entries within pivotRelTol of the largest, the one in the row of
// least count, a Markowitz-style tie break that limits fill (Markowitz
// 1957; Suhl & Suhl 1990 use the same threshold idea).
//
// With pivot k in row prow[k] and basis position pcol[k]:
//
//	B[:, pcol[k]] = Σ_{j≤k} U[j,k] · L̃_j,   L̃_j = e_{prow[j]} + L_j
//
// where L_j has entries only in rows pivoted after j. FTRAN solves
// L̃ v = a forward, applies the row etas, and solves U t = v backward in
// the triangular order ord; BTRAN solves the transposes in reverse. Both
// L and U are stored by columns, which serves FTRAN as scatter (axpy,
// skipping zero multipliers) and BTRAN as gather (dot).
type luFactor struct {
	m    int
	prow []int // pivot k → row
	pcol []int // pivot k → basis position

	lStart []int
	lIdx   []int // row index
	lVal   []float64

	// U by columns: column k (a pivot index) holds its off-diagonal
	// entries (row pivot index j, value) in uIdx/uVal[uBeg[k]:uEnd[k]].
	// A Forrest–Tomlin update appends the new column at the end of the
	// storage and zeroes eliminated entries in place.
	uBeg, uEnd []int
	uIdx       []int
	uVal       []float64
	uDiag      []float64

	// Triangular order of U: ord lists the pivots so that every entry
	// (j, k) of U has posOf[j] < posOf[k]; a Forrest–Tomlin update
	// appends the replaced pivot and leaves −1 at its old place (so an
	// update costs nothing in m). pivOfPos maps a basis position to its
	// pivot.
	ord, posOf, pivOfPos []int

	// Forrest–Tomlin row etas: eta e replaces row rPiv[e] (a pivot) of
	// the transformed system by itself minus Σ r_j · row j over
	// rIdx/rVal[rStart[e]:rStart[e+1]].
	rPiv, rStart, rIdx []int
	rVal               []float64

	// Spike of the last FTRAN made with wantSpike: L̃⁻¹a after the row
	// etas, by pivot, for the next update.
	wantSpike bool
	spikeIdx  []int
	spikeVal  []float64
	rwork     []float64 // by pivot, kept zero
	broken    bool      // an update failed its stability check

	// Eta file: each eta replaces basis position etaPos[e]; its column is
	// the FTRAN'd entering column with pivot etaPiv[e] at that position
	// and off-pivot entries etaIdx/etaVal[etaStart[e]:etaStart[e+1]].
	etaPos   []int
	etaPiv   []float64
	etaStart []int
	etaIdx   []int
	etaVal   []float64

	// Row-wise copies for the hypersparse solves (lu_sparse.go). lPiv
	// holds the pivot of each L entry's row. L by rows: the entries of
	// row prow[j] are (column pivot lrPiv[t], lrVal[t]) over
	// t ∈ [lrStart[j], lrStart[j+1]). U by rows: row j (a pivot) holds
	// its off-diagonal entries (column pivot urPiv[t], urVal[t]) over
	// [urBeg[j], urEnd[j]), with room up to urLim[j]; the Forrest–Tomlin
	// update keeps it equal to the column-wise U.
	lPiv                []int
	lrStart, lrPiv      []int
	lrVal               []float64
	urBeg, urEnd, urLim []int
	urPiv               []int
	urVal               []float64

	// Scratch of the hypersparse solves: depth-first search state by
	// pivot (visited, stack, pstack), its topological output (topo) and
	// the list of visited nodes; sw (by pivot) and inP are kept zero.
	visited       []bool
	inP           []bool
	topo          []int
	stack, pstack []int
	visList       []int
	leaves        []int
	starts, pList []int
	sw            []float64

	lNZ    []int   // pivots whose L column is not empty, in order
	cIdx   [][]int // the basis columns during factor
	base   luBase  // the factorization before updates, for restore
	cVal   [][]float64
	mark   []bool // row touched in the current column
	nzList []int
	heap   []int

	work    []float64 // length m, kept zero between uses
	work2   []float64
	rowPiv  []int // row → pivot index, -1 while unpivoted
	rowCnt  []int
	order   []int
	nnzBase int // nonzeros of L and U after the last factorization
}

// pivotRelTol is the threshold of threshold partial pivoting: a pivot
// must be at least this fraction of the largest candidate in its column.
// 0.1 is the common compromise between stability and sparsity (Duff,
// Erisman & Reid, Direct Methods for Sparse Matrices, 1986).
const pivotRelTol = 0.1

// singularTol: a reduced column whose largest entry is below this is
// taken as dependent on the columns before it.
const singularTol = 1e-9

func newLU(m int) *luFactor {
	return &luFactor{
		m:      m,
		work:   make([]float64, m),
		work2:  make([]float64, m),
		rowPiv: make([]int, m),
		rowCnt: make([]int, m),
	}
}

// colFunc returns the nonzeros of the column in basis position p.
type colFunc func(p int) (idx []int, val []float64)

// factor computes B = L̃U from the m basis columns. It returns the basis
// positions whose columns were found dependent, each paired with a row
// that no pivot took; the caller must put that row's logical into the
// position (the factorization already assumes the unit column e_row
// there).
func (f *luFactor) factor(col colFunc) (singPos, singRow []int) {
	m := f.m
	f.prow = f.prow[:0]
	f.pcol = f.pcol[:0]
	f.lStart = append(f.lStart[:0], 0)
	f.lIdx = f.lIdx[:0]
	f.lVal = f.lVal[:0]
	f.uBeg = f.uBeg[:0]
	f.uEnd = f.uEnd[:0]
	f.uIdx = f.uIdx[:0]
	f.uVal = f.uVal[:0]
	f.uDiag = f.uDiag[:0]
	f.clearEtas()

	for i := range f.rowCnt {
		f.rowCnt[i] = 0
		f.rowPiv[i] = -1
	}
	// Columns in order of increasing count, ties by position: a stable
	// counting sort (the counts are below m+1).
	// The columns are fetched once (col may be a closure over the
	// solver's matrix).
	if cap(f.cIdx) < m {
		f.cIdx = make([][]int, m)
		f.cVal = make([][]float64, m)
	}
	f.cIdx, f.cVal = f.cIdx[:m], f.cVal[:m]
	maxCnt := 0
	for p := 0; p < m; p++ {
		idx, val := col(p)
		f.cIdx[p], f.cVal[p] = idx, val
		for _, i := range idx {
			f.rowCnt[i]++
		}
		if len(idx) > maxCnt {
			maxCnt = len(idx)
		}
	}
	bucket := make([]int, maxCnt+2)
	for p := 0; p < m; p++ {
		bucket[len(f.cIdx[p])+1]++
	}
	for c := 1; c < len(bucket); c++ {
		bucket[c] += bucket[c-1]
	}
	if cap(f.order) < m {
		f.order = make([]int, m)
	}
	f.order = f.order[:m]
	for p := 0; p < m; p++ {
		n := len(f.cIdx[p])
		f.order[bucket[n]] = p
		bucket[n]++
	}

	w := f.work
	if len(f.mark) != m {
		f.mark = make([]bool, m)
	}
	mark := f.mark
	f.lNZ = f.lNZ[:0]
	for _, p := range f.order {
		idx, val := f.cIdx[p], f.cVal[p]
		if len(idx) == 1 && f.rowPiv[idx[0]] < 0 && math.Abs(val[0]) >= singularTol {
			// A singleton on an unpivoted row (a slack, mostly) pivots
			// at once, with empty L and U columns: the general path
			// below would do the same.
			i, k := idx[0], len(f.prow)
			f.uBeg = append(f.uBeg, len(f.uIdx))
			f.uEnd = append(f.uEnd, len(f.uIdx))
			f.rowPiv[i] = k
			f.prow = append(f.prow, i)
			f.pcol = append(f.pcol, p)
			f.uDiag = append(f.uDiag, val[0])
			f.lStart = append(f.lStart, len(f.lIdx))
			continue
		}
		nz := f.nzList[:0]
		heap := f.heap[:0]
		for k, i := range idx {
			w[i] = val[k]
			mark[i] = true
			nz = append(nz, i)
			if j := f.rowPiv[i]; j >= 0 && f.lStart[j+1] > f.lStart[j] {
				heap = heapPush(heap, j)
			}
		}
		k := len(f.prow)
		// Reduce by the earlier L columns in pivot order; a min-heap of
		// the pivots whose rows are nonzero gives that order while only
		// touching the pivots that matter (the column's reach, Gilbert &
		// Peierls 1988). Fill only appears in rows pivoted later than the
		// pivot being applied, so heap order stays valid.
		for len(heap) > 0 {
			var j int
			j, heap = heapPop(heap)
			v := w[f.prow[j]]
			if v == 0 {
				continue
			}
			for t := f.lStart[j]; t < f.lStart[j+1]; t++ {
				i := f.lIdx[t]
				if !mark[i] {
					mark[i] = true
					nz = append(nz, i)
					if jj := f.rowPiv[i]; jj >= 0 && f.lStart[jj+1] > f.lStart[jj] {
						heap = heapPush(heap, jj)
					}
				}
				w[i] -= v * f.lVal[t]
			}
		}
		f.heap = heap
		// Choose the pivot among unpivoted rows.
		maxAbs := 0.0
		for _, i := range nz {
			if f.rowPiv[i] < 0 {
				if a := math.Abs(w[i]); a > maxAbs {
					maxAbs = a
				}
			}
		}
		if maxAbs < singularTol {
			// Dependent column: clear w.
			for _, i := range nz {
				w[i] = 0
				mark[i] = false
			}
			f.nzList = nz
			singPos = append(singPos, p)
			continue
		}
		r := -1
		best := 0
		for _, i := range nz {
			if f.rowPiv[i] >= 0 {
				continue
			}
			a := math.Abs(w[i])
			if a < pivotRelTol*maxAbs {
				continue
			}
			if r < 0 || f.rowCnt[i] < best || (f.rowCnt[i] == best && (a > math.Abs(w[r]) || (a == math.Abs(w[r]) && i < r))) {
				r, best = i, f.rowCnt[i]
			}
		}
		piv := w[r]
		// U column: entries in rows pivoted earlier, by pivot index.
		f.uBeg = append(f.uBeg, len(f.uIdx))
		for _, i := range nz {
			if j := f.rowPiv[i]; j >= 0 && w[i] != 0 {
				f.uIdx = append(f.uIdx, j)
				f.uVal = append(f.uVal, w[i])
			}
		}
		w[r] = 0
		f.rowPiv[r] = k
		f.prow = append(f.prow, r)
		f.pcol = append(f.pcol, p)
		f.uDiag = append(f.uDiag, piv)
		f.uEnd = append(f.uEnd, len(f.uIdx))
		for _, i := range nz {
			if w[i] != 0 && f.rowPiv[i] < 0 {
				f.lIdx = append(f.lIdx, i)
				f.lVal = append(f.lVal, w[i]/piv)
			}
			w[i] = 0
			mark[i] = false
		}
		f.nzList = nz
		f.lStart = append(f.lStart, len(f.lIdx))
		if f.lStart[k+1] > f.lStart[k] {
			f.lNZ = append(f.lNZ, k)
		}
	}
	// Fill dependent positions with unit columns of unpivoted rows.
	if len(singPos) > 0 {
		for i := 0; i < m && len(singRow) < len(singPos); i++ {
			if f.rowPiv[i] >= 0 {
				continue
			}
			k := len(f.prow)
			f.rowPiv[i] = k
			f.prow = append(f.prow, i)
			f.pcol = append(f.pcol, singPos[len(singRow)])
			f.uDiag = append(f.uDiag, 1)
			f.uBeg = append(f.uBeg, len(f.uIdx))
			f.uEnd = append(f.uEnd, len(f.uIdx))
			f.lStart = append(f.lStart, len(f.lIdx))
			singRow = append(singRow, i)
		}
	}
	f.nnzBase = len(f.lIdx) + len(f.uIdx) + m
	if len(f.posOf) != m {
		f.posOf = make([]int, m)
		f.pivOfPos = make([]int, m)
		f.rwork = make([]float64, m)
	}
	f.ord = f.ord[:0]
	for k := 0; k < m; k++ {
		f.ord = append(f.ord, k)
		f.posOf[k] = k
		f.pivOfPos[f.pcol[k]] = k
	}
	f.buildRows()
	f.saveBase()
	f.broken = false
	return singPos, singRow
}

func (f *luFactor) clearEtas() {
	f.rPiv = f.rPiv[:0]
	f.rStart = append(f.rStart[:0], 0)
	f.rIdx = f.rIdx[:0]
	f.rVal = f.rVal[:0]
	f.etaPos = f.etaPos[:0]
	f.etaPiv = f.etaPiv[:0]
	f.etaStart = append(f.etaStart[:0], 0)
	f.etaIdx = f.etaIdx[:0]
	f.etaVal = f.etaVal[:0]
}

func (f *luFactor) numEtas() int { return len(f.etaPos) + len(f.rPiv) }

// needRefactor reports whether the eta file is due for a fresh
// factorization: after refactorLimit updates (Maros 2003 discusses
// the trade-off; a rule on the eta nonzero count measured no better on
// the OR-Library set-covering relaxations).
func (f *luFactor) needRefactor() bool {
	return f.numEtas() >= f.refactorLimit() || f.broken || len(f.uIdx) > 2*f.nnzBase+4*f.m
}

// refactorLimit is refactorEvery, four times that from bigBasisRows
// rows on: a factorization costs in proportion to the basis while the
// hypersparse solves after an update cost in proportion to the entries
// touched, so large bases pay for longer update sequences. Measured on
// the plan models (best of interleaved runs): the 38,218-row one took
// 2.3 s with 200, 2.9 s with 100 and about the same with 400; the
// 9,860-row one 0.39 s with 200 against 0.42 s with 100; the 3,401-row
// one gained nothing from 200, and the OR-Library set-covering
// relaxations (a few hundred rows) were faster with 50 than with 100.
func (f *luFactor) refactorLimit() int {
	if f.m >= bigBasisRows {
		return 4 * refactorEvery
	}
	return refactorEvery
}

// bigBasisRows is the basis size from which refactorLimit grows.
const bigBasisRows = 5000

// ftran overwrites a (indexed by rows, length m) with B⁻¹a indexed by
// basis positions.
func (f *luFactor) ftran(a []float64) {
	f.ftranL(a)
	f.ftranR(a)
	if f.wantSpike {
		f.saveSpike(a)
	}
	f.ftranU(a)
}

// ftranL solves L̃ v = a in place; pivots with an empty L column change
// nothing.
func (f *luFactor) ftranL(a []float64) {
	for _, k := range f.lNZ {
		v := a[f.prow[k]]
		if v == 0 {
			continue
		}
		for t := f.lStart[k]; t < f.lStart[k+1]; t++ {
			a[f.lIdx[t]] -= v * f.lVal[t]
		}
	}
}

// ftranR applies the Forrest–Tomlin row etas, oldest first.
func (f *luFactor) ftranR(a []float64) {
	for e, kp := range f.rPiv {
		r := f.prow[kp]
		v := a[r]
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			v -= f.rVal[t] * a[f.prow[f.rIdx[t]]]
		}
		a[r] = v
	}
}

// saveSpike keeps L̃⁻¹a after the row etas, by pivot, for the update.
func (f *luFactor) saveSpike(a []float64) {
	f.spikeIdx = f.spikeIdx[:0]
	f.spikeVal = f.spikeVal[:0]
	for k := 0; k < f.m; k++ {
		if v := a[f.prow[k]]; v != 0 {
			f.spikeIdx = append(f.spikeIdx, k)
			f.spikeVal = append(f.spikeVal, v)
		}
	}
}

// ftranU finishes ftran: it solves U t = v (v in a, by rows) and applies
// the product-form eta file, leaving the result in a by positions.
func (f *luFactor) ftranU(a []float64) {
	// U t = v backward in triangular order, t into out (by position).
	out := f.work2
	for idx := len(f.ord) - 1; idx >= 0; idx-- {
		k := f.ord[idx]
		if k < 0 {
			continue
		}
		r := f.prow[k]
		v := a[r]
		if v == 0 {
			out[f.pcol[k]] = 0
			continue
		}
		a[r] = 0
		tk := v / f.uDiag[k]
		out[f.pcol[k]] = tk
		for t := f.uBeg[k]; t < f.uEnd[k]; t++ {
			a[f.prow[f.uIdx[t]]] -= f.uVal[t] * tk
		}
	}
	copy(a, out)
	// Product-form eta file, oldest first.
	for e := range f.etaPos {
		r := f.etaPos[e]
		zr := a[r]
		if zr == 0 {
			continue
		}
		zr /= f.etaPiv[e]
		a[r] = zr
		for t := f.etaStart[e]; t < f.etaStart[e+1]; t++ {
			a[f.etaIdx[t]] -= f.etaVal[t] * zr
		}
	}
}

// btran overwrites c (indexed by basis positions, length m) with the y
// (indexed by rows) that solves Bᵀy = c.
func (f *luFactor) btran(c []float64) {
	for e := len(f.etaPos) - 1; e >= 0; e-- {
		r := f.etaPos[e]
		v := c[r]
		for t := f.etaStart[e]; t < f.etaStart[e+1]; t++ {
			v -= f.etaVal[t] * c[f.etaIdx[t]]
		}
		c[r] = v / f.etaPiv[e]
	}
	// Uᵀ s = c in triangular order, s by pivot index.
	s := f.work2
	for _, k := range f.ord {
		if k < 0 {
			continue
		}
		v := c[f.pcol[k]]
		for t := f.uBeg[k]; t < f.uEnd[k]; t++ {
			v -= f.uVal[t] * s[f.uIdx[t]]
		}
		s[k] = v / f.uDiag[k]
	}
	// Transposed row etas, newest first.
	for e := len(f.rPiv) - 1; e >= 0; e-- {
		sk := s[f.rPiv[e]]
		if sk == 0 {
			continue
		}
		for t := f.rStart[e]; t < f.rStart[e+1]; t++ {
			s[f.rIdx[t]] -= f.rVal[t] * sk
		}
	}
	f.btranL(s, c)
}

// btranL finishes btran: it solves L̃ᵀ y = s (s by pivot) into c (by
// rows).
func (f *luFactor) btranL(s, c []float64) {
	// L̃ᵀ y = s, backward.
	for k := f.m - 1; k >= 0; k-- {
		v := s[k]
		for t := f.lStart[k]; t < f.lStart[k+1]; t++ {
			v -= f.lVal[t] * c[f.lIdx[t]]
		}
		c[f.prow[k]] = v
	}
}

// useFT selects the Forrest–Tomlin update; false falls back to the
// product-form eta file.
const useFT = true

// update records that basis position r now holds the column whose FTRAN
// is alpha (indexed by positions); with useFT the spike saved by that
// FTRAN is used instead. If the update fails its stability check the
// factorization is marked for refactorization (needRefactor).
func (f *luFactor) update(r int, alpha []float64) {
	if useFT {
		f.updateFT(r, alpha[r])
		return
	}
	f.etaPos = append(f.etaPos, r)
	f.etaPiv = append(f.etaPiv, alpha[r])
	for i, v := range alpha {
		if i != r && v != 0 {
			f.etaIdx = append(f.etaIdx, i)
			f.etaVal = append(f.etaVal, v)
		}
	}
	f.etaStart = append(f.etaStart, len(f.etaIdx))
}

// heapPush and heapPop keep a binary min-heap of pivot indices.
func heapPush(h []int, v int) []int {
	h = append(h, v)
	i := len(h) - 1
	for i > 0 {
		p := (i - 1) / 2
		if h[p] <= v {
			break
		}
		h[i] = h[p]
		i = p
	}
	h[i] = v
	return h
}

func heapPop(h []int) (int, []int) {
	top := h[0]
	last := h[len(h)-1]
	h = h[:len(h)-1]
	n := len(h)
	if n == 0 {
		return top, h
	}
	i := 0
	for {
		c := 2*i + 1
		if c >= n {
			break
		}
		if c+1 < n && h[c+1] < h[c] {
			c++
		}
		if last <= h[c] {
			break
		}
		h[i] = h[c]
		i = c
	}
	h[i] = last
	return top, h
}
