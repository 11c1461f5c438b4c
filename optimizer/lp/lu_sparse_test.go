package lp

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// sparseBasis is an explicit basis for the LU tests: column p holds the
// nonzeros (idx[p], val[p]).
type sparseBasis struct {
	m   int
	idx [][]int
	val [][]float64
}

func (b *sparseBasis) col(p int) ([]int, []float64) { return b.idx[p], b.val[p] }

func (b *sparseBasis) clone() *sparseBasis {
	return &sparseBasis{m: b.m, idx: append([][]int(nil), b.idx...), val: append([][]float64(nil), b.val...)}
}

func (b *sparseBasis) dense() *mat.Dense {
	d := mat.NewDense(b.m, b.m, nil)
	for p := 0; p < b.m; p++ {
		for k, i := range b.idx[p] {
			d.Set(i, p, b.val[p][k])
		}
	}
	return d
}

// randSparseCol draws a column with 1 to maxNZ nonzeros in distinct rows,
// values in ±[0.5, 2.5).
func randSparseCol(rng *rand.Rand, m, maxNZ int) ([]int, []float64) {
	n := 1 + rng.IntN(maxNZ)
	seen := map[int]bool{}
	var idx []int
	var val []float64
	for len(idx) < n {
		i := rng.IntN(m)
		if seen[i] {
			continue
		}
		seen[i] = true
		v := 0.5 + 2*rng.Float64()
		if rng.IntN(2) == 0 {
			v = -v
		}
		idx = append(idx, i)
		val = append(val, v)
	}
	return idx, val
}

// randPlanLikeBasis draws a basis like those of the plan models: most
// positions hold the unit column of their row (a slack), the rest short
// random columns.
func randPlanLikeBasis(rng *rand.Rand, m int, structFrac float64) *sparseBasis {
	b := &sparseBasis{m: m, idx: make([][]int, m), val: make([][]float64, m)}
	for p := 0; p < m; p++ {
		if rng.Float64() < structFrac {
			b.idx[p], b.val[p] = randSparseCol(rng, m, 4)
		} else {
			b.idx[p], b.val[p] = []int{p}, []float64{1}
		}
	}
	return b
}

// sparseRHS draws a vector with nnz nonzeros and its index list.
func sparseRHS(rng *rand.Rand, m, nnz int) ([]float64, []int) {
	v := make([]float64, m)
	var idx []int
	for len(idx) < nnz {
		i := rng.IntN(m)
		if v[i] != 0 {
			continue
		}
		v[i] = rng.Float64()*2 - 1
		if v[i] == 0 {
			v[i] = 0.5
		}
		idx = append(idx, i)
	}
	return v, idx
}

// checkSolves compares, for a few right-hand sides, the hypersparse and
// the dense FTRAN and BTRAN of f with each other and with a dense LU
// solve of the explicit basis (gonum's mat.Dense.Solve, an independent
// implementation).
func checkSolves(t *testing.T, rng *rand.Rand, f *luFactor, b *sparseBasis, what string) {
	t.Helper()
	m := b.m
	B := b.dense()
	for _, nnz := range []int{1, 2, 5, m / 3, m} {
		if nnz < 1 || nnz > m {
			continue
		}
		for _, trans := range []bool{false, true} {
			rhs, idx := sparseRHS(rng, m, nnz)
			dense := append([]float64(nil), rhs...)
			sparse := append([]float64(nil), rhs...)
			// A density hint above hyperFrac forces the dense solve
			// behind the sparse interface; it must agree too.
			forced := append([]float64(nil), rhs...)
			hint := 1.0
			var out, outForced []int
			if trans {
				f.btran(dense)
				out = f.btranSparse(sparse, append([]int(nil), idx...), nil)
				outForced = f.btranSparse(forced, append([]int(nil), idx...), &hint)
			} else {
				f.ftran(dense)
				out = f.ftranSparse(sparse, append([]int(nil), idx...), nil)
				outForced = f.ftranSparse(forced, append([]int(nil), idx...), &hint)
			}
			if want := 0.75 + 0.25*float64(len(outForced))/float64(m); hint != want {
				t.Fatalf("%s: density hint %g, want %g", what, hint, want)
			}
			listedForced := make([]bool, m)
			for _, i := range outForced {
				listedForced[i] = true
			}
			for i := 0; i < m; i++ {
				if forced[i] != 0 && !listedForced[i] {
					t.Fatalf("%s (trans %v, nnz %d, forced dense): nonzero %d not listed", what, trans, nnz, i)
				}
				if forced[i] != dense[i] {
					t.Fatalf("%s (trans %v, nnz %d, forced dense): entry %d %g, dense %g", what, trans, nnz, i, forced[i], dense[i])
				}
			}
			if !trans {
				// Partial FTRAN of a few positions (the DSE weight
				// update's τ entries) must agree with the full one.
				targets := rng.Perm(m)[:min(m, 7)]
				part := make([]float64, m)
				if !f.ftranPartial(rhs, targets, part, m+1) {
					t.Fatalf("%s: ftranPartial refused", what)
				}
				for _, p := range targets {
					if d := math.Abs(part[p] - dense[p]); d > 1e-9*math.Max(1, math.Abs(dense[p])) {
						t.Fatalf("%s (nnz %d): partial FTRAN entry %d %g, full %g", what, nnz, p, part[p], dense[p])
					}
				}
				for i, x := range f.sw {
					if x != 0 {
						t.Fatalf("%s: scratch entry %d left at %g", what, i, x)
					}
				}
			}
			var x mat.VecDense
			var err error
			if trans {
				err = x.SolveVec(B.T(), mat.NewVecDense(m, append([]float64(nil), rhs...)))
			} else {
				err = x.SolveVec(B, mat.NewVecDense(m, append([]float64(nil), rhs...)))
			}
			if err != nil {
				t.Fatalf("%s: gonum solve: %v", what, err)
			}
			listed := make([]bool, m)
			for _, i := range out {
				if listed[i] {
					t.Fatalf("%s (trans %v, nnz %d): index %d listed twice", what, trans, nnz, i)
				}
				listed[i] = true
			}
			scale := 1.0
			for i := 0; i < m; i++ {
				scale = math.Max(scale, math.Abs(x.AtVec(i)))
			}
			for i := 0; i < m; i++ {
				if sparse[i] != 0 && !listed[i] {
					t.Fatalf("%s (trans %v, nnz %d): nonzero %d not listed", what, trans, nnz, i)
				}
				if d := math.Abs(sparse[i] - dense[i]); d > 1e-9*scale {
					t.Fatalf("%s (trans %v, nnz %d): entry %d sparse %g dense %g", what, trans, nnz, i, sparse[i], dense[i])
				}
				if d := math.Abs(sparse[i] - x.AtVec(i)); d > 1e-7*scale {
					t.Fatalf("%s (trans %v, nnz %d): entry %d sparse %g, gonum %g", what, trans, nnz, i, sparse[i], x.AtVec(i))
				}
			}
		}
	}
}

// TestHypersparseSolves checks the hypersparse FTRAN/BTRAN against the
// dense passes and against gonum on random plan-like bases, also after
// many Forrest–Tomlin updates (which must keep the row-wise U equal to
// the column-wise one), and that restore returns the factorization.
func TestHypersparseSolves(t *testing.T) {
	for _, tc := range []struct {
		name       string
		m          int
		structFrac float64
		updates    int
	}{
		{"m60-mostly-slack", 60, 0.2, 40},
		{"m300-mostly-slack", 300, 0.1, 120},
		{"m300-half", 300, 0.5, 120},
		{"m120-all-struct", 120, 1, 60},
	} {
		t.Run(tc.name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(7, uint64(tc.m)))
			b := randPlanLikeBasis(rng, tc.m, tc.structFrac)
			f := newLU(tc.m)
			singPos, singRow := f.factor(b.col)
			for k, p := range singPos {
				b.idx[p], b.val[p] = []int{singRow[k]}, []float64{1}
			}
			checkSolves(t, rng, f, b, "fresh")
			base := b.clone()
			done := 0
			for tries := 0; done < tc.updates && tries < 20*tc.updates; tries++ {
				if f.needRefactor() {
					singPos, singRow := f.factor(b.col)
					for k, p := range singPos {
						b.idx[p], b.val[p] = []int{singRow[k]}, []float64{1}
					}
					base = b.clone()
				}
				ci, cv := randSparseCol(rng, tc.m, 3)
				a := make([]float64, tc.m)
				for k, i := range ci {
					a[i] = cv[k]
				}
				f.wantSpike = true
				list := f.ftranSparse(a, append([]int(nil), ci...), nil)
				f.wantSpike = false
				// Leave a position where the column has a usable pivot,
				// as the simplex does.
				var good []int
				for _, i := range list {
					if math.Abs(a[i]) >= 1e-2 {
						good = append(good, i)
					}
				}
				if len(good) == 0 {
					continue
				}
				p := good[rng.IntN(len(good))]
				ok := f.updateFT(p, a[p])
				b.idx[p], b.val[p] = ci, cv
				if !ok {
					// Refused as unstable: refactorize, as the simplex does.
					singPos, singRow := f.factor(b.col)
					for k, p := range singPos {
						b.idx[p], b.val[p] = []int{singRow[k]}, []float64{1}
					}
					base = b.clone()
				}
				done++
				checkSolves(t, rng, f, b, "after update")
			}
			// Dropping the updates must give back the last
			// factorization bit for bit: compare with a fresh one of
			// the basis it was made from.
			if base != nil {
				f.restore()
				g := newLU(tc.m)
				g.factor(base.col)
				for trial := 0; trial < 5; trial++ {
					rhs, idx := sparseRHS(rng, tc.m, 1+trial*tc.m/8)
					x1 := append([]float64(nil), rhs...)
					x2 := append([]float64(nil), rhs...)
					f.ftranSparse(x1, append([]int(nil), idx...), nil)
					g.ftranSparse(x2, append([]int(nil), idx...), nil)
					y1 := append([]float64(nil), rhs...)
					y2 := append([]float64(nil), rhs...)
					f.btranSparse(y1, append([]int(nil), idx...), nil)
					g.btranSparse(y2, append([]int(nil), idx...), nil)
					for i := range x1 {
						if x1[i] != x2[i] || y1[i] != y2[i] {
							t.Fatalf("restored factorization differs at %d: ftran %g vs %g, btran %g vs %g", i, x1[i], x2[i], y1[i], y2[i])
						}
					}
				}
			}
			if done < tc.updates/2 {
				t.Fatalf("only %d of %d updates made", done, tc.updates)
			}
		})
	}
}

// linkedCoverLP builds the LP relaxation of a covering model with
// disaggregated link rows, the shape of the plan models (a location is
// paid for once; each requirement is met by one of a few locations;
// x_ij ≤ y_j):
//
//	min Σ_j f_j y_j + Σ_ij c_ij x_ij
//	Σ_{j ∈ S_i} x_ij ≥ 1     (requirement i covered)
//	x_ij − y_j ≤ 0            (only at an opened location)
//	0 ≤ x, y ≤ 1
//
// The data are random (seeded), not a published instance; the checks
// are against glpsol and the KKT conditions.
func linkedCoverLP(rng *rand.Rand, nLoc, nReq, per int) *Problem {
	type arc struct{ req, loc int }
	var arcs []arc
	for i := 0; i < nReq; i++ {
		for _, j := range rng.Perm(nLoc)[:per] {
			arcs = append(arcs, arc{i, j})
		}
	}
	n := nLoc + len(arcs)
	m := nReq + len(arcs)
	p := &Problem{NumRows: m, NumCols: n, Obj: make([]float64, n),
		ColLo: make([]float64, n), ColUp: fill(n, 1),
		RowLo: make([]float64, m), RowUp: make([]float64, m), ColStart: make([]int, n+1)}
	for i := 0; i < nReq; i++ {
		p.RowLo[i], p.RowUp[i] = 1, math.Inf(1)
	}
	for a := range arcs {
		p.RowLo[nReq+a], p.RowUp[nReq+a] = math.Inf(-1), 0
	}
	// Columns: the y_j (in every link row of their arcs), then the x_ij.
	links := make([][]int, nLoc)
	for a, e := range arcs {
		links[e.loc] = append(links[e.loc], a)
	}
	for j := 0; j < nLoc; j++ {
		p.Obj[j] = float64(500 + rng.IntN(2000))
		for _, a := range links[j] {
			p.RowIndex = append(p.RowIndex, nReq+a)
			p.Value = append(p.Value, -1)
		}
		p.ColStart[j+1] = len(p.RowIndex)
	}
	for a, e := range arcs {
		col := nLoc + a
		p.Obj[col] = float64(10 + rng.IntN(90))
		p.RowIndex = append(p.RowIndex, e.req, nReq+a)
		p.Value = append(p.Value, 1, 1)
		p.ColStart[col+1] = len(p.RowIndex)
	}
	return p
}

// TestLinkedCoverLP solves linked covering LPs large enough (a few
// thousand rows) for the hypersparse solves, the partial FTRAN of the
// weight update and the doubled refactorization interval to carry the
// solve, and checks the optimum against glpsol (when installed) and the
// KKT conditions, and that a second solve agrees bit for bit.
func TestLinkedCoverLP(t *testing.T) {
	for _, tc := range []struct {
		nLoc, nReq, per int
	}{
		{60, 400, 4},
		{150, 1800, 3},
	} {
		rng := rand.New(rand.NewPCG(uint64(tc.nLoc), uint64(tc.nReq)))
		p := linkedCoverLP(rng, tc.nLoc, tc.nReq, tc.per)
		r, err := Solve(p, Options{})
		if err != nil || r.Status != Optimal {
			t.Fatalf("%d rows: %v %v", p.NumRows, r.Status, err)
		}
		checkKKT(t, p, r, 1e-7)
		r2, _ := Solve(p, Options{})
		if r2.Obj != r.Obj || r2.Iterations != r.Iterations {
			t.Errorf("%d rows: second solve %v/%d, first %v/%d", p.NumRows, r2.Obj, r2.Iterations, r.Obj, r.Iterations)
		}
		for j := range r.X {
			if r.X[j] != r2.X[j] {
				t.Fatalf("%d rows: second solve differs at x_%d", p.NumRows, j)
			}
		}
		// Independent solver: GLPK glpsol.
		ref := glpsolLP(t, p)
		if math.IsNaN(ref) {
			t.Logf("%d rows: LP %.6f in %d iterations (glpsol not on PATH, no cross-check)", p.NumRows, r.Obj, r.Iterations)
			continue
		}
		if math.Abs(r.Obj-ref) > 1e-6*math.Max(1, math.Abs(ref)) {
			t.Errorf("%d rows: LP value %.9g, glpsol %.9g", p.NumRows, r.Obj, ref)
		}
		t.Logf("%d rows: LP %.6f (glpsol %.6f) in %d iterations", p.NumRows, r.Obj, ref, r.Iterations)
	}
}
