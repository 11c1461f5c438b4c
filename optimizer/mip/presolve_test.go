package mip

import (
	"testing"

	"github.com/rigmix/rigmix/optimizer/lp"
)

type lpProblem = lp.Problem

// TestPresolveCoverRules checks the set-covering reductions on a small
// instance worked by hand (invented data). Columns 0..3 cover rows
// {0,1,2}, {1,2}, {0}, {1,2} at costs 1, 2, 5, 3. Rows 1 and 2 have the
// same columns, so row 2 goes; columns 1, 2 and 3 each cost at least the
// cheapest other column of their rows (column 0, cost 1) and are priced
// out (Beasley 1987); row 0 is then covered by column 0 alone, which is
// fixed to 1 and covers every row.
func TestPresolveCoverRules(t *testing.T) {
	p := SetCover([]float64{1, 2, 5, 3}, [][]int{{0, 1, 2}, {1, 2}, {0}, {1, 2}})
	ps := presolve(p)
	if ps.infeasible {
		t.Fatal("reported infeasible")
	}
	if ps.red.LP.NumCols != 0 || ps.red.LP.NumRows != 0 {
		t.Errorf("reduced problem has %d rows, %d columns; want 0, 0", ps.red.LP.NumRows, ps.red.LP.NumCols)
	}
	if ps.objShift != 1 {
		t.Errorf("objective shift %v, want 1", ps.objShift)
	}
	x := ps.postsolve(nil)
	if x[0] != 1 || x[1] != 0 || x[2] != 0 || x[3] != 0 {
		t.Errorf("postsolved x = %v, want [1 0 0 0]", x)
	}
}

// TestPresolveGeneral: singleton rows become bounds and the general rules
// leave a non-covering problem's optimum alone (hand-worked).
func TestPresolveGeneral(t *testing.T) {
	// min x0 + x1, 2 x0 ≥ 3 (x0 integer → x0 ≥ 2), x0 + x1 ≥ 2.5, x1 ∈ [0, 10].
	p := &Problem{Integer: []bool{true, false}}
	q := &p.LP
	q.NumRows, q.NumCols = 2, 2
	q.Obj = []float64{1, 1}
	q.ColLo = []float64{0, 0}
	q.ColUp = []float64{10, 10}
	q.RowLo = []float64{3, 2.5}
	q.RowUp = []float64{inf, inf}
	q.ColStart = []int{0, 2, 3}
	q.RowIndex = []int{0, 1, 1}
	q.Value = []float64{2, 1, 1}
	ps := presolve(p)
	if ps.red.LP.NumRows != 1 || ps.red.LP.ColLo[0] != 2 {
		t.Errorf("reduced: %d rows, x0 lower bound %v; want 1 row, 2", ps.red.LP.NumRows, ps.red.LP.ColLo[0])
	}
	if ps.setCover {
		t.Error("general problem taken for set covering")
	}
}
