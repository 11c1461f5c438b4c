package lp

import (
	"math"
	"math/rand/v2"
	"testing"
)

// facilityLP builds the LP relaxation of a capacitated facility location
// model with aggregated big-M linking rows, the shape of rigmix's rig
// mobilization decisions (a rig is paid for once if it does any work):
//
//	min Σ_j f_j y_j + Σ_ij c_ij x_ij
//	Σ_j x_ij = d_i            (each demand met)
//	Σ_i x_ij − M_j y_j ≤ 0     (work only on a mobilized rig)
//	0 ≤ y_j ≤ 1, x ≥ 0
//
// with fixed costs in the thousands, unit costs in the tens and demands
// in the tens to hundreds, so coefficients span about five orders of
// magnitude. The data are random (seeded), not a published instance.
func facilityLP(rng *rand.Rand, nf, nc int) *Problem { // columns 0..nf-1 are the y_j
	n := nf + nf*nc
	m := nc + nf
	p := &Problem{NumRows: m, NumCols: n, Obj: make([]float64, n),
		ColLo: make([]float64, n), ColUp: make([]float64, n),
		RowLo: make([]float64, m), RowUp: make([]float64, m)}
	demand := make([]float64, nc)
	total := 0.0
	for i := range demand {
		demand[i] = float64(10 + rng.IntN(300))
		total += demand[i]
		p.RowLo[i], p.RowUp[i] = demand[i], demand[i]
	}
	p.ColStart = make([]int, n+1)
	col := 0
	add := func(cost, up float64, rows []int, vals []float64) {
		p.Obj[col], p.ColUp[col] = cost, up
		p.RowIndex = append(p.RowIndex, rows...)
		p.Value = append(p.Value, vals...)
		col++
		p.ColStart[col] = len(p.RowIndex)
	}
	capM := make([]float64, nf)
	for j := 0; j < nf; j++ {
		capM[j] = math.Round(total * (0.2 + 0.3*rng.Float64()))
		add(float64(2000+rng.IntN(8000)), 1, []int{nc + j}, []float64{-capM[j]})
	}
	for j := 0; j < nf; j++ {
		for i := 0; i < nc; i++ {
			add(float64(5+rng.IntN(60))+rng.Float64(), inf, []int{i, nc + j}, []float64{1, 1})
		}
	}
	for j := 0; j < nf; j++ {
		p.RowLo[nc+j], p.RowUp[nc+j] = -inf, 0
	}
	return p
}

// TestFacilityLocationLP checks such LPs against GLPK's glpsol (an
// independent solver) and the KKT conditions, cold and warm after the
// branching a mixed-integer search makes on the y_j.
func TestFacilityLocationLP(t *testing.T) {
	rng := rand.New(rand.NewPCG(31, 41))
	branches := 0
	for k := 0; k < 6; k++ {
		nf := 5 + rng.IntN(10)
		p := facilityLP(rng, nf, 20+rng.IntN(60))
		s, err := New(p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		r, err := s.Solve()
		if err != nil || r.Status != Optimal {
			t.Fatalf("instance %d: %v %v", k, r.Status, err)
		}
		checkKKT(t, p, r, 1e-7)
		if st, v, ok := glpsolSolve(t, p); ok && (st != Optimal || math.Abs(v-r.Obj) > 1e-6*math.Abs(v)) {
			t.Errorf("instance %d: %g, glpsol %v %g", k, r.Obj, st, v)
		}
		// Branch: close the most fractional facility, open the next.
		q := cloneProblem(p)
		for step := 0; step < 4; step++ {
			j, best := -1, 1e-6
			for jj := 0; jj < nf; jj++ {
				if q.ColLo[jj] == q.ColUp[jj] {
					continue
				}
				if d := math.Min(r.X[jj], 1-r.X[jj]); d > best {
					j, best = jj, d
				}
			}
			if j < 0 {
				break
			}
			branches++
			v := float64(step % 2)
			s.SetColBounds(j, v, v)
			q.ColLo[j], q.ColUp[j] = v, v
			r, err = s.Solve()
			if err != nil {
				t.Fatal(err)
			}
			st, gv, ok := glpsolSolve(t, q)
			if !ok {
				cold, _ := Solve(q, Options{})
				sameOutcome(t, "facility branch", r, cold)
			} else if st != r.Status || (st == Optimal && math.Abs(gv-r.Obj) > 1e-6*math.Abs(gv)) {
				t.Errorf("instance %d step %d: %v %g, glpsol %v %g", k, step, r.Status, r.Obj, st, gv)
			}
			if r.Status != Optimal {
				break
			}
			checkKKT(t, q, r, 1e-7)
		}
	}
	if branches < 10 {
		t.Errorf("only %d branchings exercised", branches)
	}
	t.Logf("%d warm re-solves after branching", branches)
}
