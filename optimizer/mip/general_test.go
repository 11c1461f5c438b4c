package mip

import (
	"context"
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
	glp "gonum.org/v1/gonum/optimize/convex/lp"
)

// bruteMIP enumerates every integer assignment of a small bounded MIP;
// for each, the continuous part is solved with gonum's simplex
// (gonum.org/v1/gonum/optimize/convex/lp, an independent LP code). It
// returns the optimum (+Inf when infeasible).
func bruteMIP(t *testing.T, p *Problem) float64 {
	q := &p.LP
	n, m := q.NumCols, q.NumRows
	var ints, conts []int
	for j := 0; j < n; j++ {
		if p.Integer[j] {
			ints = append(ints, j)
		} else {
			conts = append(conts, j)
		}
	}
	dense := make([][]float64, m)
	for i := range dense {
		dense[i] = make([]float64, n)
	}
	for j := 0; j < n; j++ {
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			dense[q.RowIndex[k]][j] = q.Value[k]
		}
	}
	best := math.Inf(1)
	x := make([]float64, n)
	var rec func(k int)
	rec = func(k int) {
		if k < len(ints) {
			j := ints[k]
			for v := math.Ceil(q.ColLo[j]); v <= q.ColUp[j]; v++ {
				x[j] = v
				rec(k + 1)
			}
			return
		}
		base := p.ObjOffset
		for _, j := range ints {
			base += q.Obj[j] * x[j]
		}
		lo := make([]float64, m)
		up := make([]float64, m)
		for i := 0; i < m; i++ {
			a := 0.0
			for _, j := range ints {
				a += dense[i][j] * x[j]
			}
			lo[i], up[i] = q.RowLo[i]-a, q.RowUp[i]-a
		}
		if len(conts) == 0 {
			for i := 0; i < m; i++ {
				if lo[i] > 1e-9 || up[i] < -1e-9 {
					return
				}
			}
			best = math.Min(best, base)
			return
		}
		// G y ≤ h and A y = b over the continuous columns.
		var G [][]float64
		var h []float64
		var A [][]float64
		var b []float64
		row := func(i int, sign float64) []float64 {
			r := make([]float64, len(conts))
			for k, j := range conts {
				r[k] = sign * dense[i][j]
			}
			return r
		}
		for i := 0; i < m; i++ {
			// Equalities go in as two inequalities: gonum's Simplex
			// panics when equalities outnumber the variables.
			if !math.IsInf(up[i], 1) {
				G = append(G, row(i, 1))
				h = append(h, up[i])
			}
			if !math.IsInf(lo[i], -1) {
				G = append(G, row(i, -1))
				h = append(h, -lo[i])
			}
		}
		for k, j := range conts {
			r := make([]float64, len(conts))
			r[k] = 1
			G = append(G, r)
			h = append(h, q.ColUp[j])
			r = make([]float64, len(conts))
			r[k] = -1
			G = append(G, r)
			h = append(h, -q.ColLo[j])
		}
		c := make([]float64, len(conts))
		for k, j := range conts {
			c[k] = q.Obj[j]
		}
		toMat := func(rows [][]float64) mat.Matrix {
			if len(rows) == 0 {
				return nil
			}
			d := mat.NewDense(len(rows), len(conts), nil)
			for i, r := range rows {
				d.SetRow(i, r)
			}
			return d
		}
		var bb []float64
		if len(b) > 0 {
			bb = b
		}
		cNew, aNew, bNew := glp.Convert(c, toMat(G), h, toMat(A), bb)
		f, _, err := glp.Simplex(cNew, aNew, bNew, 1e-10, nil)
		if errors.Is(err, glp.ErrInfeasible) {
			return
		}
		if err != nil {
			t.Fatalf("gonum simplex: %v", err)
		}
		best = math.Min(best, base+f)
	}
	rec(0)
	return best
}

func TestRandomGeneralMIPVsBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(21, 4))
	optimal, infeasible := 0, 0
	for trial := 0; trial < 120; trial++ {
		p := randomGeneralMIP(rng, 1+rng.IntN(5), 2+rng.IntN(5))
		want := bruteMIP(t, p)
		res, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatalf("trial %d: %v", trial, err)
		}
		if math.IsInf(want, 1) {
			infeasible++
			if res.Status != Infeasible {
				t.Fatalf("trial %d: %v obj %v; brute force says infeasible", trial, res.Status, res.Obj)
			}
			continue
		}
		optimal++
		if res.Status != Optimal || math.Abs(res.Obj-want) > 1e-6*math.Max(1, math.Abs(want)) {
			t.Fatalf("trial %d: %v obj %v; brute force optimum %v", trial, res.Status, res.Obj, want)
		}
		if v, ok := checkFeasible(p, res.X); !ok || math.Abs(v-res.Obj) > 1e-6*math.Max(1, math.Abs(v)) {
			t.Fatalf("trial %d: X infeasible or objective %v ≠ %v", trial, v, res.Obj)
		}
	}
	t.Logf("%d optimal, %d infeasible instances", optimal, infeasible)
	if optimal < 20 || infeasible < 5 {
		t.Errorf("random generator gives too few cases of a kind: %d optimal, %d infeasible", optimal, infeasible)
	}
}
