package lp

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestAssignmentLP solves assignment LPs (n workers, n jobs, equality
// rows, every vertex degenerate — the textbook worst case for stalling,
// e.g. Chvátal 1983, ch. 3 on degeneracy) with costs drawn from a small
// range so that many optima tie, and checks them against glpsol and the
// KKT conditions. By the integrality of the assignment polytope (Birkhoff)
// the LP optimum is the assignment optimum.
func TestAssignmentLP(t *testing.T) {
	rng := rand.New(rand.NewPCG(12, 34))
	for _, n := range []int{8, 20, 40} {
		m := 2 * n
		obj := make([]float64, n*n)
		p := &Problem{NumRows: m, NumCols: n * n, Obj: obj,
			ColLo: make([]float64, n*n), ColUp: fill(n*n, inf),
			RowLo: fill(m, 1), RowUp: fill(m, 1)}
		p.ColStart = make([]int, n*n+1)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				k := i*n + j
				obj[k] = float64(1 + rng.IntN(30))
				p.RowIndex = append(p.RowIndex, i, n+j)
				p.Value = append(p.Value, 1, 1)
				p.ColStart[k+1] = len(p.RowIndex)
			}
		}
		r, err := Solve(p, Options{})
		if err != nil || r.Status != Optimal {
			t.Fatalf("n=%d: %v %v", n, r.Status, err)
		}
		checkKKT(t, p, r, 1e-7)
		if st, v, ok := glpsolSolve(t, p); ok && (st != Optimal || math.Abs(v-r.Obj) > 1e-7*math.Abs(v)) {
			t.Errorf("n=%d: %g, glpsol %v %g", n, r.Obj, st, v)
		}
		t.Logf("n=%d: optimum %g in %d iterations", n, r.Obj, r.Iterations)
	}
}
