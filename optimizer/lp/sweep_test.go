package lp

import (
	"math"
	"math/rand/v2"
	"path/filepath"
	"testing"
	"time"
)

// TestSetCoveringWarmSweep alternates, on OR-Library set-covering LP
// relaxations (Beasley 1987), fixing the most fractional column (as a
// branch and bound dive does) with changing 50 costs (as a weighted-sum
// sweep does), re-solving warm each time; every warm result must match a
// cold solve of the same modified problem (status and value) and pass the
// KKT checks.
func TestSetCoveringWarmSweep(t *testing.T) {
	dir := scpDir(t)
	for _, name := range []string{"scp41", "scpe1"} {
		p := readSCP(t, filepath.Join(dir, name+".txt"))
		s, _ := New(p, Options{})
		r, _ := s.Solve()
		q := cloneProblem(p)
		rng := rand.New(rand.NewPCG(1, 1))
		var tw, tc time.Duration
		wi, ci := 0, 0
		for step := 0; step < 15; step++ {
			if step%3 == 2 {
				for k := 0; k < 50; k++ {
					j := rng.IntN(p.NumCols)
					c := float64(1 + rng.IntN(100))
					s.SetObj(j, c)
					q.Obj[j] = c
				}
			} else {
				j, best := -1, 0.0
				for jj, x := range r.X {
					if d := math.Min(x, 1-x); d > best && q.ColLo[jj] != q.ColUp[jj] {
						j, best = jj, d
					}
				}
				if j < 0 {
					j = rng.IntN(p.NumCols)
				}
				v := float64(rng.IntN(2))
				s.SetColBounds(j, v, v)
				q.ColLo[j], q.ColUp[j] = v, v
			}
			t0 := time.Now()
			var err error
			r, err = s.Solve()
			tw += time.Since(t0)
			if err != nil {
				t.Fatal(name, step, err)
			}
			t0 = time.Now()
			cold, err := Solve(q, Options{})
			tc += time.Since(t0)
			if err != nil {
				t.Fatal(err)
			}
			wi += r.Iterations
			ci += cold.Iterations
			sameOutcome(t, name, r, cold)
			if r.Status == Optimal {
				checkKKT(t, q, r, 1e-7)
			} else {
				break
			}
		}

		t.Logf("%s: warm %v (%d it), cold %v (%d it)", name, tw, wi, tc, ci)
	}
}
