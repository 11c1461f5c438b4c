package lp_test

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// The example LP of Chvátal, Linear Programming (1983), ch. 2:
// maximize 5x1 + 4x2 + 3x3 subject to 2x1 + 3x2 + x3 ≤ 5,
// 4x1 + x2 + 2x3 ≤ 11, 3x1 + 4x2 + 2x3 ≤ 8, x ≥ 0; optimum 13 at
// x = (2, 0, 1) with dual solution (1, 0, 1) (ch. 5). As a minimization
// of −5x1 − 4x2 − 3x3 the duals of the ≤ rows come out ≤ 0.
func Example() {
	inf := math.Inf(1)
	p := &lp.Problem{
		NumRows: 3, NumCols: 3,
		Obj:   []float64{-5, -4, -3},
		ColLo: []float64{0, 0, 0}, ColUp: []float64{inf, inf, inf},
		RowLo: []float64{-inf, -inf, -inf}, RowUp: []float64{5, 11, 8},
		// Columns of A, stored by column.
		ColStart: []int{0, 3, 6, 9},
		RowIndex: []int{0, 1, 2, 0, 1, 2, 0, 1, 2},
		Value:    []float64{2, 4, 3, 3, 1, 4, 1, 2, 2},
	}
	r, err := lp.Solve(p, lp.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v obj=%.4g x=%.4g y=%.4g\n", r.Status, r.Obj, r.X, r.Dual)
	// Output:
	// Optimal obj=-13 x=[2 0 1] y=[-1 0 -1]
}

// A branch and bound step: solve, tighten a bound, re-solve warm from the
// previous basis, and go back with a saved basis.
func ExampleSolver() {
	inf := math.Inf(1)
	// Hillier & Lieberman's Wyndor Glass LP (Introduction to Operations
	// Research, §3.1): max 3x1 + 5x2, x1 ≤ 4, 2x2 ≤ 12, 3x1 + 2x2 ≤ 18;
	// optimum 36 at (2, 6).
	p := &lp.Problem{
		NumRows: 1, NumCols: 2,
		Obj:   []float64{-3, -5},
		ColLo: []float64{0, 0}, ColUp: []float64{4, 6},
		RowLo: []float64{-inf}, RowUp: []float64{18},
		ColStart: []int{0, 1, 2}, RowIndex: []int{0, 0}, Value: []float64{3, 2},
	}
	s, _ := lp.New(p, lp.Options{})
	r, _ := s.Solve()
	fmt.Printf("root: %v %.4g x=%.4g\n", r.Status, r.Obj, r.X)
	root := s.Basis()
	s.SetColBounds(1, 0, 5) // branch x2 ≤ 5
	r, _ = s.Solve()
	fmt.Printf("x2≤5: %v %.4g x=%.4g\n", r.Status, r.Obj, r.X)
	s.SetColBounds(1, 0, 6)
	_ = s.SetBasis(root)
	r, _ = s.Solve()
	fmt.Printf("back: %v %.4g in %d iterations\n", r.Status, r.Obj, r.Iterations)
	// Output:
	// root: Optimal -36 x=[2 6]
	// x2≤5: Optimal -33 x=[2.667 5]
	// back: Optimal -36 in 0 iterations
}
