package mip

import (
	"context"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"
)

// dataDir finds ../shared/data relative to the directory holding go.mod.
func dataDir(t testing.TB, sub string) string {
	t.Helper()
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			break
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Skip("no go.mod above the package directory")
		}
		dir = parent
	}
	d := filepath.Join(dir, "..", "shared", "data", sub)
	if _, err := os.Stat(d); err != nil {
		t.Skipf("data set %s is absent (%v); skipping", d, err)
	}
	return d
}

// bruteCover enumerates every subset of columns (n ≤ 20) and returns the
// cheapest cover (+Inf if none): an independent check by exhaustion.
func bruteCover(m int, cost []float64, colRows [][]int) float64 {
	n := len(cost)
	best := math.Inf(1)
	for mask := 0; mask < 1<<n; mask++ {
		c := 0.0
		cov := make([]bool, m)
		for j := 0; j < n; j++ {
			if mask>>j&1 == 1 {
				c += cost[j]
				for _, i := range colRows[j] {
					cov[i] = true
				}
			}
		}
		ok := true
		for _, v := range cov {
			ok = ok && v
		}
		if ok && c < best {
			best = c
		}
	}
	return best
}

func TestRandomCoverVsBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := 0; trial < 150; trial++ {
		m, n := 2+rng.IntN(10), 2+rng.IntN(13)
		cost := make([]float64, n)
		rows := make([][]int, n)
		for j := range cost {
			cost[j] = float64(1 + rng.IntN(9))
			if trial%3 == 0 {
				cost[j] = 1
			}
			for i := 0; i < m; i++ {
				if rng.IntN(3) == 0 {
					rows[j] = append(rows[j], i)
				}
			}
		}
		want := bruteCover(m, cost, rows)
		p := SetCoverRows(m, cost, rows)
		res, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if math.IsInf(want, 1) {
			if res.Status != Infeasible {
				t.Fatalf("trial %d: status %v, want infeasible", trial, res.Status)
			}
			continue
		}
		if res.Status != Optimal || math.Abs(res.Obj-want) > 1e-6 {
			t.Fatalf("trial %d: status %v obj %v, want optimal %v", trial, res.Status, res.Obj, want)
		}
		if v, ok := checkFeasible(p, res.X); !ok || math.Abs(v-res.Obj) > 1e-6 {
			t.Fatalf("trial %d: returned X infeasible or wrong objective (%v vs %v)", trial, v, res.Obj)
		}
	}
}

// checkFeasible evaluates x against p in the original space.
func checkFeasible(p *Problem, x []float64) (float64, bool) {
	q := &p.LP
	if len(x) != q.NumCols {
		return 0, false
	}
	act := make([]float64, q.NumRows)
	obj := p.ObjOffset
	for j := 0; j < q.NumCols; j++ {
		if x[j] < q.ColLo[j]-1e-6 || x[j] > q.ColUp[j]+1e-6 {
			return 0, false
		}
		if p.Integer[j] && math.Abs(x[j]-math.Round(x[j])) > 1e-6 {
			return 0, false
		}
		obj += q.Obj[j] * x[j]
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			act[q.RowIndex[k]] += q.Value[k] * x[j]
		}
	}
	for i := range act {
		if act[i] < q.RowLo[i]-1e-6*(1+math.Abs(q.RowLo[i])) || act[i] > q.RowUp[i]+1e-6*(1+math.Abs(q.RowUp[i])) {
			return 0, false
		}
	}
	return obj, true
}
