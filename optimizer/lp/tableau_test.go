package lp

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestTableauRow: for every basis position of an optimal basis the
// tableau row satisfies v_B + Σ alpha_k v_k = 0 at the optimal point
// (x, s = −A x), on random bounded LPs with badly scaled rows and columns
// (so the unscaling is exercised).
func TestTableauRow(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 9))
	for trial := 0; trial < 20; trial++ {
		m, n := 3+rng.IntN(8), 4+rng.IntN(10)
		a := make([][]float64, m)
		for i := range a {
			a[i] = make([]float64, n)
			rs := math.Pow(10, float64(rng.IntN(5)-2))
			for j := range a[i] {
				if rng.IntN(3) > 0 {
					a[i][j] = rs * float64(rng.IntN(19)-9) * math.Pow(10, float64(j%3-1))
				}
			}
		}
		obj := make([]float64, n)
		lo, up := make([]float64, n), make([]float64, n)
		for j := range obj {
			obj[j] = float64(rng.IntN(21) - 10)
			lo[j], up[j] = float64(-rng.IntN(3)), float64(1+rng.IntN(4))
		}
		rlo, rup := make([]float64, m), make([]float64, m)
		for i := range rlo {
			rlo[i], rup[i] = -float64(1+rng.IntN(10)), float64(1+rng.IntN(10))
		}
		p := dense(obj, a, rlo, rup, lo, up)
		s, err := New(p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		r, err := s.Solve()
		if err != nil || r.Status != Optimal {
			t.Fatalf("trial %d: %v %v", trial, r, err)
		}
		v := append(append([]float64(nil), r.X...), make([]float64, m)...)
		for i := 0; i < m; i++ {
			v[n+i] = -r.RowActivity[i]
		}
		alpha := make([]float64, n+m)
		for pos := 0; pos < m; pos++ {
			if err := s.TableauRow(pos, alpha); err != nil {
				t.Fatal(err)
			}
			b := s.BasicVar(pos)
			if s.VarStatus(b) != Basic || alpha[b] != 1 {
				t.Fatalf("trial %d position %d: basic variable %d has status %v, alpha %v", trial, pos, b, s.VarStatus(b), alpha[b])
			}
			sum, scale := 0.0, 0.0
			for k := range alpha {
				if k != b && s.VarStatus(k) == Basic && alpha[k] != 0 {
					t.Fatalf("trial %d: alpha nonzero at another basic variable %d", trial, k)
				}
				sum += alpha[k] * v[k]
				scale += math.Abs(alpha[k] * v[k])
			}
			if math.Abs(sum) > 1e-8*math.Max(1, scale) {
				t.Errorf("trial %d position %d: v_B + Σ alpha v = %g, want 0", trial, pos, sum)
			}
		}
	}
}

// TestAddRows: adding the row x1 + x3 ≤ 2 to the Chvátal chapter 2 LP
// (optimum 13 at (2, 0, 1); Chvátal 1983, ch. 2, from memory) and
// re-solving warm gives the optimum of the extended LP solved from
// scratch.
func TestAddRows(t *testing.T) {
	obj := []float64{-5, -4, -3}
	a := [][]float64{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}}
	p := dense(obj, a, fill(3, -inf), []float64{5, 11, 8}, fill(3, 0), fill(3, inf))
	s, err := New(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if r, err := s.Solve(); err != nil || math.Abs(r.Obj+13) > 1e-9 {
		t.Fatalf("%v %v", r, err)
	}
	if err := s.AddRows([]float64{-inf}, []float64{2}, []int{0, 2}, []int{0, 2}, []float64{1, 1}); err != nil {
		t.Fatal(err)
	}
	warm, err := s.Solve()
	if err != nil {
		t.Fatal(err)
	}
	full := dense(obj, append(a, []float64{1, 0, 1}), []float64{-inf, -inf, -inf, -inf}, []float64{5, 11, 8, 2}, fill(3, 0), fill(3, inf))
	cold, err := Solve(full, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if warm.Status != Optimal || cold.Status != Optimal || math.Abs(warm.Obj-cold.Obj) > 1e-9 || cold.Obj <= -13+1e-9 {
		t.Errorf("warm %v %v, cold %v %v (the cut must raise the minimum above -13)", warm.Status, warm.Obj, cold.Status, cold.Obj)
	}
	if s.NumRows() != 4 || len(warm.Dual) != 4 {
		t.Errorf("NumRows %d, duals %d; want 4", s.NumRows(), len(warm.Dual))
	}
}
