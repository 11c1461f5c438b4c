package mip

import (
	"math"
	"sort"
)

// presolved holds a reduced problem and what is needed to map its
// solutions back to the original columns. Only reductions that keep at
// least one optimal solution are applied, so the optimum of the reduced
// problem plus objShift is the optimum of the original.
type presolved struct {
	orig *Problem
	red  *Problem
	// colMap[k] is the original column of reduced column k.
	colMap []int
	// value of every original column that was removed (fixed).
	fixed   []float64
	removed []bool
	// objShift is the objective constant contributed by removed columns
	// (ObjOffset of the original is not included).
	objShift   float64
	infeasible bool
	// setCover is true when the reduced problem is a pure set-covering
	// problem: every row Σ x_j ≥ 1 with unit coefficients, every column
	// binary with nonnegative cost.
	setCover bool
	// Counts of reductions, for tests and messages.
	rowsRemoved, colsRemoved int
}

// postsolve maps a solution of the reduced problem to the original space.
func (ps *presolved) postsolve(xr []float64) []float64 {
	x := make([]float64, ps.orig.LP.NumCols)
	copy(x, ps.fixed)
	for k, j := range ps.colMap {
		x[j] = xr[k]
	}
	return x
}

// reduce maps a solution of the original problem to the reduced space; nil
// when x has the wrong length.
func (ps *presolved) reduce(x []float64) []float64 {
	if len(x) != ps.orig.LP.NumCols {
		return nil
	}
	xr := make([]float64, len(ps.colMap))
	for k, j := range ps.colMap {
		xr[k] = x[j]
	}
	return xr
}

// agrees reports whether x gives every column presolve removed the value
// presolve fixed it at (within the integrality tolerance), so that x is a
// solution of the reduced problem exactly when its reduction is.
func (ps *presolved) agrees(x []float64) bool {
	for j, rm := range ps.removed {
		if rm && math.Abs(x[j]-ps.fixed[j]) > intTol {
			return false
		}
	}
	return true
}

// presolve work state: a doubly indexed copy of the matrix with live
// flags. Rows are kept by column lists and column lists by rows.
type psWork struct {
	m, n       int
	cost       []float64
	colLo      []float64
	colUp      []float64
	rowLo      []float64
	rowUp      []float64
	integer    []bool
	colRows    [][]int
	colVals    [][]float64
	rowCols    [][]int
	rowVals    [][]float64
	colAlive   []bool
	rowAlive   []bool
	fixed      []float64
	shift      float64
	infeasible bool
	// Rows that still list a removed column: fixCol only marks them, and
	// compact drops the dead entries before the row lists are read again.
	// Removing a column from each of its rows at once costs the length
	// of the row every time, which made presolve quadratic on models with
	// long rows (a rig's days row lists every option of the rig) where
	// many columns are fixed.
	dirty     []bool
	dirtyRows []int
}

const psTol = 1e-9

// presolve reduces p. The general rules (exact for any MIP): rounding of
// integer column bounds, removal of fixed and empty columns, of empty
// and free rows, of rows that their activity bounds make redundant,
// singleton rows turned into column bounds. When the problem is set
// covering it also applies, repeatedly, the reductions of Beasley (1987,
// EJOR 31:85–93, §2): a row whose column set contains another row's is
// dropped; a column whose rows are a subset of a no more expensive
// column's rows is dropped (ties keep the lower index); a column whose cost is at least the sum over
// its rows of the cheapest other live column covering the row is
// dropped; a row covered by one column only fixes that column to 1.
func presolve(p *Problem) *presolved {
	q := &p.LP
	m, n := q.NumRows, q.NumCols
	w := &psWork{
		m: m, n: n,
		cost:     append([]float64(nil), q.Obj...),
		colLo:    append([]float64(nil), q.ColLo...),
		colUp:    append([]float64(nil), q.ColUp...),
		rowLo:    append([]float64(nil), q.RowLo...),
		rowUp:    append([]float64(nil), q.RowUp...),
		integer:  p.Integer,
		colRows:  make([][]int, n),
		colVals:  make([][]float64, n),
		rowCols:  make([][]int, m),
		rowVals:  make([][]float64, m),
		colAlive: make([]bool, n),
		rowAlive: make([]bool, m),
		fixed:    make([]float64, n),
		dirty:    make([]bool, m),
	}
	for j := 0; j < n; j++ {
		w.colAlive[j] = true
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			if q.Value[k] == 0 {
				continue
			}
			i := q.RowIndex[k]
			w.colRows[j] = append(w.colRows[j], i)
			w.colVals[j] = append(w.colVals[j], q.Value[k])
			w.rowCols[i] = append(w.rowCols[i], j)
			w.rowVals[i] = append(w.rowVals[i], q.Value[k])
		}
	}
	for i := range w.rowAlive {
		w.rowAlive[i] = true
	}
	for j := 0; j < n; j++ {
		if w.integer[j] {
			w.colLo[j] = math.Ceil(w.colLo[j] - 1e-9)
			w.colUp[j] = math.Floor(w.colUp[j] + 1e-9)
			if w.colLo[j] > w.colUp[j] {
				w.infeasible = true
			}
		}
	}
	for pass := 0; pass < 50 && !w.infeasible; pass++ {
		changed := w.generalPass()
		if w.infeasible {
			break
		}
		if w.isSetCover() {
			if w.coverPass() {
				changed = true
			}
		}
		if !changed {
			break
		}
	}
	return w.build(p)
}

// fixCol removes column j at value v, moving its contribution into the
// row bounds and the objective constant.
func (w *psWork) fixCol(j int, v float64) {
	w.colAlive[j] = false
	w.fixed[j] = v
	w.shift += w.cost[j] * v
	for k, i := range w.colRows[j] {
		if !w.rowAlive[i] {
			continue
		}
		a := w.colVals[j][k] * v
		w.rowLo[i] -= a
		w.rowUp[i] -= a
		if !w.dirty[i] {
			w.dirty[i] = true
			w.dirtyRows = append(w.dirtyRows, i)
		}
	}
}

// compact drops removed columns from the rows fixCol marked, keeping the
// order of the others: one pass over each marked row.
func (w *psWork) compact() {
	for _, i := range w.dirtyRows {
		w.dirty[i] = false
		cols, vals := w.rowCols[i], w.rowVals[i]
		k := 0
		for t, j := range cols {
			if w.colAlive[j] {
				cols[k], vals[k] = j, vals[t]
				k++
			}
		}
		w.rowCols[i], w.rowVals[i] = cols[:k], vals[:k]
	}
	w.dirtyRows = w.dirtyRows[:0]
}

func (w *psWork) removeRow(i int) {
	w.rowAlive[i] = false
	for _, j := range w.rowCols[i] {
		rows, vals := w.colRows[j], w.colVals[j]
		for k, r := range rows {
			if r == i {
				w.colRows[j] = append(rows[:k:k], rows[k+1:]...)
				w.colVals[j] = append(vals[:k:k], vals[k+1:]...)
				break
			}
		}
	}
}

// generalPass applies the rules that are exact for every MIP. It reports
// whether anything changed.
func (w *psWork) generalPass() bool {
	changed := false
	for j := 0; j < w.n; j++ {
		if !w.colAlive[j] {
			continue
		}
		lo, up := w.colLo[j], w.colUp[j]
		if lo > up+psTol {
			w.infeasible = true
			return true
		}
		if up-lo <= psTol {
			w.fixCol(j, lo)
			changed = true
			continue
		}
		if len(w.colRows[j]) == 0 {
			c := w.cost[j]
			var v float64
			switch {
			case c > 0 && !math.IsInf(lo, -1):
				v = lo
			case c < 0 && !math.IsInf(up, 1):
				v = up
			case c == 0:
				v = math.Max(lo, math.Min(up, 0))
			default:
				continue // unbounded direction: leave it to the LP
			}
			w.fixCol(j, v)
			changed = true
		}
	}
	w.compact()
	for i := 0; i < w.m; i++ {
		if !w.rowAlive[i] {
			continue
		}
		lo, up := w.rowLo[i], w.rowUp[i]
		cols := w.rowCols[i]
		if len(cols) == 0 {
			if lo > 1e-7*(1+math.Abs(lo)) || up < -1e-7*(1+math.Abs(up)) {
				w.infeasible = true
				return true
			}
			w.removeRow(i)
			changed = true
			continue
		}
		if math.IsInf(lo, -1) && math.IsInf(up, 1) {
			w.removeRow(i)
			changed = true
			continue
		}
		if len(cols) == 1 {
			j, a := cols[0], w.rowVals[i][0]
			blo, bup := lo/a, up/a
			if a < 0 {
				blo, bup = bup, blo
			}
			if w.integer[j] {
				blo = math.Ceil(blo - 1e-9)
				bup = math.Floor(bup + 1e-9)
			}
			if blo > w.colLo[j] {
				w.colLo[j] = blo
			}
			if bup < w.colUp[j] {
				w.colUp[j] = bup
			}
			if w.colLo[j] > w.colUp[j]+psTol {
				w.infeasible = true
				return true
			}
			w.removeRow(i)
			changed = true
			continue
		}
		// Activity bounds.
		minAct, maxAct := 0.0, 0.0
		for k, j := range cols {
			a := w.rowVals[i][k]
			if a > 0 {
				minAct += a * w.colLo[j]
				maxAct += a * w.colUp[j]
			} else {
				minAct += a * w.colUp[j]
				maxAct += a * w.colLo[j]
			}
		}
		if minAct > up+1e-7*(1+math.Abs(up)) || maxAct < lo-1e-7*(1+math.Abs(lo)) {
			w.infeasible = true
			return true
		}
		if minAct >= lo-psTol && maxAct <= up+psTol {
			w.removeRow(i)
			changed = true
		}
	}
	return changed
}

// isSetCover reports whether the live problem is pure set covering.
func (w *psWork) isSetCover() bool {
	any := false
	for j := 0; j < w.n; j++ {
		if !w.colAlive[j] {
			continue
		}
		any = true
		if !w.integer[j] || w.colLo[j] != 0 || w.colUp[j] != 1 || w.cost[j] < 0 {
			return false
		}
		for _, v := range w.colVals[j] {
			if v != 1 {
				return false
			}
		}
	}
	for i := 0; i < w.m; i++ {
		if w.rowAlive[i] && (w.rowLo[i] != 1 || !math.IsInf(w.rowUp[i], 1)) {
			return false
		}
	}
	return any
}

// coverPass applies the set-covering reductions once.
func (w *psWork) coverPass() bool {
	changed := false
	// Zero-cost columns can be taken: fix to 1 (their rows become
	// redundant in the next general pass).
	for j := 0; j < w.n; j++ {
		if w.colAlive[j] && w.cost[j] == 0 {
			w.fixCol(j, 1)
			changed = true
		}
	}
	if changed {
		return true
	}
	w.compact()
	// Row dominance: drop row i when another live row k has
	// cols(k) ⊆ cols(i); identical rows keep the lower index.
	rows := w.liveRows()
	sort.SliceStable(rows, func(a, b int) bool { return len(w.rowCols[rows[a]]) < len(w.rowCols[rows[b]]) })
	mark := make([]int, w.n)
	for j := range mark {
		mark[j] = -1
	}
	for a, k := range rows {
		if !w.rowAlive[k] {
			continue
		}
		for _, j := range w.rowCols[k] {
			mark[j] = k
		}
		// Candidates i ⊇ k: rows containing k's first (rarest) column.
		first := w.rowCols[k][0]
		for _, j := range w.rowCols[k] {
			if len(w.colRows[j]) < len(w.colRows[first]) {
				first = j
			}
		}
		for _, i := range append([]int(nil), w.colRows[first]...) {
			if i == k || !w.rowAlive[i] || len(w.rowCols[i]) < len(w.rowCols[k]) {
				continue
			}
			if len(w.rowCols[i]) == len(w.rowCols[k]) && i < k {
				continue // identical rows: keep the lower index
			}
			cnt := 0
			for _, j := range w.rowCols[i] {
				if mark[j] == k {
					cnt++
				}
			}
			if cnt == len(w.rowCols[k]) {
				w.removeRow(i)
				changed = true
			}
		}
		_ = a
	}
	// Column dominance: drop j when a live column k ≠ j covers every row
	// of j at no higher cost; among columns with equal rows and cost the
	// lowest index stays.
	colMark := make([]int, w.m)
	for i := range colMark {
		colMark[i] = -1
	}
	for j := 0; j < w.n; j++ {
		if !w.colAlive[j] || len(w.colRows[j]) == 0 {
			continue
		}
		rare := w.colRows[j][0]
		for _, i := range w.colRows[j] {
			colMark[i] = j
			if len(w.rowCols[i]) < len(w.rowCols[rare]) {
				rare = i
			}
		}
		for _, k := range w.rowCols[rare] {
			if k == j || !w.colAlive[k] || w.cost[k] > w.cost[j] || len(w.colRows[k]) < len(w.colRows[j]) {
				continue
			}
			if w.cost[k] == w.cost[j] && len(w.colRows[k]) == len(w.colRows[j]) && k > j {
				continue // identical twin: keep the lower index
			}
			cnt := 0
			for _, i := range w.colRows[k] {
				if colMark[i] == j {
					cnt++
				}
			}
			if cnt == len(w.colRows[j]) {
				w.fixCol(j, 0)
				changed = true
				break
			}
		}
	}
	w.compact()
	// Beasley's cost rule: drop j when
	// c_j ≥ Σ_{i ∈ rows(j)} min{c_k : k ≠ j live, k covers i}.
	for j := 0; j < w.n; j++ {
		if !w.colAlive[j] {
			continue
		}
		sum := 0.0
		for _, i := range w.colRows[j] {
			best := math.Inf(1)
			for _, k := range w.rowCols[i] {
				if k != j && w.colAlive[k] && w.cost[k] < best {
					best = w.cost[k]
				}
			}
			sum += best
			if sum > w.cost[j] {
				break
			}
		}
		if sum <= w.cost[j] {
			w.fixCol(j, 0)
			changed = true
		}
	}
	return changed
}

func (w *psWork) liveRows() []int {
	var rows []int
	for i := 0; i < w.m; i++ {
		if w.rowAlive[i] {
			rows = append(rows, i)
		}
	}
	return rows
}

func (w *psWork) build(p *Problem) *presolved {
	ps := &presolved{orig: p, fixed: w.fixed, removed: make([]bool, w.n), objShift: w.shift, infeasible: w.infeasible}
	if w.infeasible {
		return ps
	}
	rowMap := make([]int, w.m)
	var rowNames []string
	mr := 0
	for i := 0; i < w.m; i++ {
		rowMap[i] = -1
		if w.rowAlive[i] {
			rowMap[i] = mr
			mr++
			if p.RowNames != nil {
				rowNames = append(rowNames, p.RowNames[i])
			}
		} else {
			ps.rowsRemoved++
		}
	}
	red := &Problem{Name: p.Name, RowNames: rowNames}
	rq := &red.LP
	rq.NumRows = mr
	for i := 0; i < w.m; i++ {
		if w.rowAlive[i] {
			rq.RowLo = append(rq.RowLo, w.rowLo[i])
			rq.RowUp = append(rq.RowUp, w.rowUp[i])
		}
	}
	rq.ColStart = []int{0}
	for j := 0; j < w.n; j++ {
		if !w.colAlive[j] {
			ps.removed[j] = true
			ps.colsRemoved++
			continue
		}
		ps.colMap = append(ps.colMap, j)
		rq.Obj = append(rq.Obj, w.cost[j])
		rq.ColLo = append(rq.ColLo, w.colLo[j])
		rq.ColUp = append(rq.ColUp, w.colUp[j])
		red.Integer = append(red.Integer, w.integer[j])
		if p.ColNames != nil {
			red.ColNames = append(red.ColNames, p.ColNames[j])
		}
		// Rows sorted ascending (colRows keeps the original order).
		for k, i := range w.colRows[j] {
			rq.RowIndex = append(rq.RowIndex, rowMap[i])
			rq.Value = append(rq.Value, w.colVals[j][k])
		}
		rq.ColStart = append(rq.ColStart, len(rq.RowIndex))
	}
	rq.NumCols = len(ps.colMap)
	if rq.Obj == nil {
		rq.Obj, rq.ColLo, rq.ColUp, red.Integer = []float64{}, []float64{}, []float64{}, []bool{}
	}
	if rq.RowLo == nil {
		rq.RowLo, rq.RowUp = []float64{}, []float64{}
	}
	if p.ColNames != nil && red.ColNames == nil {
		red.ColNames = []string{}
	}
	ps.red = red
	// Re-check set-cover structure on the result.
	ps.setCover = rq.NumCols > 0 && w.isSetCover()
	return ps
}
