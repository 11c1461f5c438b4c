package lp

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	glp "gonum.org/v1/gonum/optimize/convex/lp"
)

// toGonumStandard rewrites p as min c'ᵀu s.t. A'u = b', u ≥ 0 for
// gonum's lp.Simplex, returning also the constant objective term:
// a column with a finite lower bound is shifted (x = l + u, plus
// u + w = up − l when boxed), one with only an upper bound is mirrored
// (x = up − u), a free one is split (x = u⁺ − u⁻); a row gets a surplus
// or slack variable, a ranged row both a surplus and its bound row.
func toGonumStandard(p *Problem) (c []float64, a *mat.Dense, b []float64, c0 float64) {
	type term struct {
		v    int
		coef float64
	}
	var rows [][]term
	var rhs []float64
	nv := 0
	newVar := func(cost float64) int { c = append(c, cost); nv++; return nv - 1 }
	// Expression of x_j: const + Σ coef·u.
	xConst := make([]float64, p.NumCols)
	xTerms := make([][]term, p.NumCols)
	for j := 0; j < p.NumCols; j++ {
		lo, up, cj := p.ColLo[j], p.ColUp[j], p.Obj[j]
		switch {
		case !math.IsInf(lo, -1):
			u := newVar(cj)
			xConst[j] = lo
			xTerms[j] = []term{{u, 1}}
			if !math.IsInf(up, 1) {
				w := newVar(0)
				rows = append(rows, []term{{u, 1}, {w, 1}})
				rhs = append(rhs, up-lo)
			}
		case !math.IsInf(up, 1):
			u := newVar(-cj)
			xConst[j] = up
			xTerms[j] = []term{{u, -1}}
		default:
			u1, u2 := newVar(cj), newVar(-cj)
			xTerms[j] = []term{{u1, 1}, {u2, -1}}
		}
		c0 += cj * xConst[j]
	}
	rowTerms := make([][]term, p.NumRows)
	rowConst := make([]float64, p.NumRows)
	for j := 0; j < p.NumCols; j++ {
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			i, v := p.RowIndex[k], p.Value[k]
			rowConst[i] += v * xConst[j]
			for _, t := range xTerms[j] {
				rowTerms[i] = append(rowTerms[i], term{t.v, v * t.coef})
			}
		}
	}
	for i := 0; i < p.NumRows; i++ {
		lo, up := p.RowLo[i]-rowConst[i], p.RowUp[i]-rowConst[i]
		rt := rowTerms[i]
		switch {
		case p.RowLo[i] == p.RowUp[i]:
			rows = append(rows, rt)
			rhs = append(rhs, lo)
		case !math.IsInf(lo, -1) && !math.IsInf(up, 1):
			r, w := newVar(0), newVar(0)
			rows = append(rows, append(append([]term(nil), rt...), term{r, -1}))
			rhs = append(rhs, lo)
			rows = append(rows, []term{{r, 1}, {w, 1}})
			rhs = append(rhs, up-lo)
		case !math.IsInf(lo, -1):
			r := newVar(0)
			rows = append(rows, append(append([]term(nil), rt...), term{r, -1}))
			rhs = append(rhs, lo)
		case !math.IsInf(up, 1):
			r := newVar(0)
			rows = append(rows, append(append([]term(nil), rt...), term{r, 1}))
			rhs = append(rhs, up)
		}
	}
	a = mat.NewDense(len(rows), nv, nil)
	for i, rt := range rows {
		for _, t := range rt {
			a.Set(i, t.v, a.At(i, t.v)+t.coef)
		}
	}
	return c, a, rhs, c0
}

// randomLP draws an LP with a mix of bound types. Most rows are built
// around a random point x0, so most instances are feasible; with
// probability pShift a row is moved away from x0, which makes some
// instances infeasible.
func randomLP(rng *rand.Rand, m, n int, density, pShift float64) *Problem {
	a := make([][]float64, m)
	for i := range a {
		a[i] = make([]float64, n)
		for j := range a[i] {
			if rng.Float64() < density {
				a[i][j] = float64(rng.IntN(19) - 9)
			}
		}
		if j := rng.IntN(n); a[i][j] == 0 {
			a[i][j] = float64(1 + rng.IntN(5))
		}
	}
	for j := 0; j < n; j++ {
		if i := rng.IntN(m); a[i][j] == 0 {
			a[i][j] = -float64(1 + rng.IntN(5))
		}
	}
	obj := make([]float64, n)
	colLo, colUp, x0 := make([]float64, n), make([]float64, n), make([]float64, n)
	for j := 0; j < n; j++ {
		obj[j] = float64(rng.IntN(21) - 7)
		l := float64(rng.IntN(5) - 2)
		u := l + float64(1+rng.IntN(6))
		switch k := rng.IntN(20); {
		case k < 9:
			colLo[j], colUp[j] = 0, inf
			x0[j] = float64(rng.IntN(4))
		case k < 15:
			colLo[j], colUp[j] = l, u
			x0[j] = l + rng.Float64()*(u-l)
		case k < 17:
			colLo[j], colUp[j] = -inf, inf
			x0[j] = rng.Float64()*6 - 3
		case k < 19:
			colLo[j], colUp[j] = -inf, u
			x0[j] = u - float64(rng.IntN(3))
		default:
			colLo[j], colUp[j] = l, l
			x0[j] = l
		}
	}
	rowLo, rowUp := make([]float64, m), make([]float64, m)
	for i := 0; i < m; i++ {
		act := 0.0
		for j := 0; j < n; j++ {
			act += a[i][j] * x0[j]
		}
		act = math.Round(act)
		if rng.Float64() < pShift {
			act += float64(rng.IntN(41) - 20)
		}
		switch k := rng.IntN(10); {
		case k < 4:
			rowLo[i], rowUp[i] = -inf, act+float64(rng.IntN(5))
		case k < 7:
			rowLo[i], rowUp[i] = act-float64(rng.IntN(5)), inf
		case k < 9:
			rowLo[i], rowUp[i] = act-float64(rng.IntN(4)), act+float64(rng.IntN(4))
		default:
			rowLo[i], rowUp[i] = act, act
		}
	}
	return dense(obj, a, rowLo, rowUp, colLo, colUp)
}

func TestRandomAgainstGonum(t *testing.T) {
	cases := []struct {
		name    string
		count   int
		mMax    int
		nMax    int
		density float64
	}{
		{"dense-small", 300, 8, 10, 0.6},
		{"sparse-medium", 40, 40, 60, 0.08},
	}
	for ci, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(2026, uint64(ci)))
			compared, agree := 0, 0
			counts := map[Status]int{}
			for k := 0; k < tc.count; k++ {
				m := 1 + rng.IntN(tc.mMax)
				n := 1 + rng.IntN(tc.nMax)
				if tc.name == "sparse-medium" {
					m, n = tc.mMax/2+rng.IntN(tc.mMax/2), tc.nMax/2+rng.IntN(tc.nMax/2)
				}
				p := randomLP(rng, m, n, tc.density, 0.15)
				r, err := Solve(p, Options{})
				if err != nil {
					t.Fatalf("instance %d: %v", k, err)
				}
				counts[r.Status]++
				if r.Status == Optimal {
					checkKKT(t, p, r, 1e-7)
				}
				// Independent oracle: gonum's dense Bland-rule simplex
				// (gonum.org/v1/gonum/optimize/convex/lp).
				c, a, b, c0 := toGonumStandard(p)
				if rr, cc := a.Dims(); rr > cc || rr == 0 {
					continue
				}
				f, _, gerr := glp.Simplex(c, a, b, 1e-10, nil)
				var want Status
				switch {
				case gerr == nil:
					want = Optimal
				case errors.Is(gerr, glp.ErrInfeasible):
					want = Infeasible
				case errors.Is(gerr, glp.ErrUnbounded):
					want = Unbounded
				default:
					continue // gonum could not decide (singular, zero row); no comparison
				}
				compared++
				if r.Status != want {
					t.Errorf("instance %d (%dx%d): status %v, gonum says %v", k, m, n, r.Status, want)
					continue
				}
				if want == Optimal && math.Abs(r.Obj-(f+c0)) > 1e-6*math.Max(1, math.Abs(r.Obj)) {
					t.Errorf("instance %d (%dx%d): objective %.10g, gonum %.10g", k, m, n, r.Obj, f+c0)
					continue
				}
				agree++
			}
			t.Logf("%s: %d instances, %d compared with gonum, %d agree; statuses %v", tc.name, tc.count, compared, agree, counts)
			if compared < tc.count/2 {
				t.Errorf("only %d of %d instances could be compared", compared, tc.count)
			}
		})
	}
}

// rescale returns p with row i multiplied by 10^ri and column j
// represented in units 10^cj times larger (x_j = 10^cj x'_j), exponents
// drawn from [−k, k]; the optimal value is unchanged.
func rescale(rng *rand.Rand, p *Problem, k int) *Problem {
	q := cloneProblem(p)
	q.Value = append([]float64(nil), p.Value...)
	rf := make([]float64, p.NumRows)
	for i := range rf {
		rf[i] = math.Pow(10, float64(rng.IntN(2*k+1)-k))
		q.RowLo[i] *= rf[i]
		q.RowUp[i] *= rf[i]
	}
	for j := 0; j < p.NumCols; j++ {
		cf := math.Pow(10, float64(rng.IntN(2*k+1)-k))
		q.Obj[j] *= cf
		q.ColLo[j] /= cf
		q.ColUp[j] /= cf
		for t := p.ColStart[j]; t < p.ColStart[j+1]; t++ {
			q.Value[t] *= rf[p.RowIndex[t]] * cf
		}
	}
	return q
}

// TestBadlyScaled solves random LPs whose rows and columns are rescaled
// by powers of 10 up to 10^±3 and compares with gonum's lp.Simplex on the
// unscaled original (the optimal value is invariant under the rescaling).
func TestBadlyScaled(t *testing.T) {
	rng := rand.New(rand.NewPCG(99, 1))
	compared := 0
	for k := 0; k < 150; k++ {
		p := randomLP(rng, 1+rng.IntN(10), 1+rng.IntN(12), 0.5, 0.15)
		q := rescale(rng, p, 5)
		c, a, b, c0 := toGonumStandard(p)
		if rr, cc := a.Dims(); rr > cc || rr == 0 {
			continue
		}
		f, _, gerr := glp.Simplex(c, a, b, 1e-10, nil)
		var want Status
		switch {
		case gerr == nil:
			want = Optimal
		case errors.Is(gerr, glp.ErrInfeasible):
			want = Infeasible
		case errors.Is(gerr, glp.ErrUnbounded):
			want = Unbounded
		default:
			continue
		}
		r, err := Solve(q, Options{})
		if err != nil {
			t.Fatalf("instance %d: %v", k, err)
		}
		compared++
		if r.Status != want {
			t.Errorf("instance %d: status %v, gonum on the unscaled problem says %v", k, r.Status, want)
			continue
		}
		if want == Optimal {
			if math.Abs(r.Obj-(f+c0)) > 1e-6*math.Max(1, math.Abs(r.Obj)) {
				t.Errorf("instance %d: objective %.10g, gonum %.10g", k, r.Obj, f+c0)
			}
			checkKKT(t, q, r, 1e-6)
		}
	}
	if compared < 100 {
		t.Errorf("only %d instances compared", compared)
	}
}
