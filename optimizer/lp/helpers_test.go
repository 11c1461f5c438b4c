package lp

import (
	"math"
	"testing"
)

var inf = math.Inf(1)

// dense builds a Problem from a dense row-major matrix.
func dense(obj []float64, a [][]float64, rowLo, rowUp, colLo, colUp []float64) *Problem {
	m, n := len(a), len(obj)
	p := &Problem{NumRows: m, NumCols: n, Obj: obj, ColLo: colLo, ColUp: colUp, RowLo: rowLo, RowUp: rowUp}
	p.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		for i := 0; i < m; i++ {
			if a[i][j] != 0 {
				p.RowIndex = append(p.RowIndex, i)
				p.Value = append(p.Value, a[i][j])
			}
		}
		p.ColStart[j+1] = len(p.RowIndex)
	}
	return p
}

func fill(n int, v float64) []float64 {
	s := make([]float64, n)
	for i := range s {
		s[i] = v
	}
	return s
}

// checkKKT verifies an Optimal result against the optimality conditions
// of linear programming (e.g. Chvátal 1983, ch. 5 and 10): primal
// feasibility, dual feasibility of the reduced costs for the bound each
// variable rests on, complementary slackness, and equality of the primal
// objective with the dual objective Σ y_i b_i + Σ d_j l_j computed from
// the active bounds.
func checkKKT(t *testing.T, p *Problem, r *Result, tol float64) {
	t.Helper()
	scale := func(v float64) float64 { return tol * math.Max(1, math.Abs(v)) }
	obj := 0.0
	act := make([]float64, p.NumRows)
	for j := 0; j < p.NumCols; j++ {
		x := r.X[j]
		obj += p.Obj[j] * x
		if x < p.ColLo[j]-scale(p.ColLo[j]) || x > p.ColUp[j]+scale(p.ColUp[j]) {
			t.Errorf("x[%d] = %g outside [%g, %g]", j, x, p.ColLo[j], p.ColUp[j])
		}
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			act[p.RowIndex[k]] += p.Value[k] * x
		}
	}
	if math.Abs(obj-r.Obj) > scale(obj) {
		t.Errorf("Obj = %g, cᵀx = %g", r.Obj, obj)
	}
	dualObj := 0.0
	for i := 0; i < p.NumRows; i++ {
		if math.Abs(act[i]-r.RowActivity[i]) > scale(act[i]) {
			t.Errorf("RowActivity[%d] = %g, want %g", i, r.RowActivity[i], act[i])
		}
		if act[i] < p.RowLo[i]-scale(p.RowLo[i]) || act[i] > p.RowUp[i]+scale(p.RowUp[i]) {
			t.Errorf("row %d activity %g outside [%g, %g]", i, act[i], p.RowLo[i], p.RowUp[i])
		}
		y := r.Dual[i]
		switch {
		case y > tol:
			if math.IsInf(p.RowLo[i], -1) || act[i]-p.RowLo[i] > scale(p.RowLo[i])*10 {
				t.Errorf("row %d: dual %g > 0 but activity %g not at lower bound %g", i, y, act[i], p.RowLo[i])
			} else {
				dualObj += y * p.RowLo[i]
			}
		case y < -tol:
			if math.IsInf(p.RowUp[i], 1) || p.RowUp[i]-act[i] > scale(p.RowUp[i])*10 {
				t.Errorf("row %d: dual %g < 0 but activity %g not at upper bound %g", i, y, act[i], p.RowUp[i])
			} else {
				dualObj += y * p.RowUp[i]
			}
		default:
			dualObj += y * act[i]
		}
	}
	for j := 0; j < p.NumCols; j++ {
		d := r.ReducedCost[j]
		want := p.Obj[j]
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			want -= p.Value[k] * r.Dual[p.RowIndex[k]]
		}
		if math.Abs(d-want) > scale(want) {
			t.Errorf("ReducedCost[%d] = %g, c − Aᵀy gives %g", j, d, want)
		}
		x := r.X[j]
		switch {
		case d > tol:
			if math.IsInf(p.ColLo[j], -1) || x-p.ColLo[j] > scale(p.ColLo[j])*10 {
				t.Errorf("col %d: reduced cost %g > 0 but x = %g not at lower bound %g", j, d, x, p.ColLo[j])
			} else {
				dualObj += d * p.ColLo[j]
			}
		case d < -tol:
			if math.IsInf(p.ColUp[j], 1) || p.ColUp[j]-x > scale(p.ColUp[j])*10 {
				t.Errorf("col %d: reduced cost %g < 0 but x = %g not at upper bound %g", j, d, x, p.ColUp[j])
			} else {
				dualObj += d * p.ColUp[j]
			}
		default:
			dualObj += d * x
		}
	}
	if math.Abs(dualObj-obj) > 1e3*scale(obj) {
		t.Errorf("dual objective %g differs from primal objective %g", dualObj, obj)
	}
}
