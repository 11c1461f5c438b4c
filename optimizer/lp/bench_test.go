package lp

import (
	"path/filepath"
	"testing"
)

var benchSCP = []string{"scp41", "scpa1", "scpd1"}

// BenchmarkSCPCold solves OR-Library set-covering LP relaxations
// (Beasley 1987) from the slack basis.
func BenchmarkSCPCold(b *testing.B) {
	dir := scpDir(b)
	for _, name := range benchSCP {
		p := readSCP(b, filepath.Join(dir, name+".txt"))
		b.Run(name, func(b *testing.B) {
			iters := 0
			for b.Loop() {
				r, err := Solve(p, Options{})
				if err != nil || r.Status != Optimal {
					b.Fatalf("%v %v", r.Status, err)
				}
				iters = r.Iterations
			}
			b.ReportMetric(float64(iters), "iters")
		})
	}
}

// BenchmarkSCPWarm re-solves after fixing the five most fractional
// columns of the LP optimum (alternately to 0 and 1), as a branch and
// bound dive does, starting from the optimal basis each time.
func BenchmarkSCPWarm(b *testing.B) {
	dir := scpDir(b)
	for _, name := range benchSCP {
		p := readSCP(b, filepath.Join(dir, name+".txt"))
		b.Run(name, func(b *testing.B) {
			s, err := New(p, Options{})
			if err != nil {
				b.Fatal(err)
			}
			r, err := s.Solve()
			if err != nil || r.Status != Optimal {
				b.Fatal(r.Status, err)
			}
			base := s.Basis()
			var fix []int
			used := make([]bool, p.NumCols)
			for len(fix) < 5 {
				j, best := -1, 0.0
				for jj, x := range r.X {
					if d := min(x, 1-x); !used[jj] && d > best {
						j, best = jj, d
					}
				}
				if j < 0 {
					break
				}
				used[j] = true
				fix = append(fix, j)
			}
			iters := 0
			for b.Loop() {
				b.StopTimer()
				for _, j := range fix {
					s.SetColBounds(j, 0, 1)
				}
				if err := s.SetBasis(base); err != nil {
					b.Fatal(err)
				}
				b.StartTimer()
				for k, j := range fix {
					v := float64(k % 2)
					s.SetColBounds(j, v, v)
				}
				r, err := s.Solve()
				if err != nil {
					b.Fatal(err)
				}
				iters = r.Iterations
			}
			b.ReportMetric(float64(iters), "iters")
		})
	}
}
