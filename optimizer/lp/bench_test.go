package lp

import (
	"path/filepath"
	"testing"
	"time"
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
			c0 := processCPU()
			for b.Loop() {
				r, err := Solve(p, Options{})
				if err != nil || r.Status != Optimal {
					b.Fatalf("%v %v", r.Status, err)
				}
				iters = r.Iterations
			}
			b.ReportMetric(float64(processCPU()-c0)/1e6/float64(b.N), "cpu-ms/op")
			b.ReportMetric(float64(iters), "iters")
		})
	}
}

// BenchmarkSCPWarm re-solves after fixing the five most fractional
// columns of the LP optimum (alternately to 0 and 1), as a branch and
// bound dive does, starting from the optimal basis each time. When the
// LP optimum is integral (scp41), five columns at 1 are fixed to 0.
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
			fix, val := benchFixings(r.X)
			iters := 0
			var cpu time.Duration
			for b.Loop() {
				b.StopTimer()
				for _, j := range fix {
					s.SetColBounds(j, 0, 1)
				}
				if err := s.SetBasis(base); err != nil {
					b.Fatal(err)
				}
				b.StartTimer()
				c0 := processCPU()
				for k, j := range fix {
					s.SetColBounds(j, val[k], val[k])
				}
				r, err := s.Solve()
				cpu += processCPU() - c0
				if err != nil {
					b.Fatal(err)
				}
				iters = r.Iterations
			}
			b.ReportMetric(float64(cpu)/1e6/float64(b.N), "cpu-ms/op")
			b.ReportMetric(float64(iters), "iters")
		})
	}
}

// benchFixings picks the five most fractional columns of x, fixed
// alternately to 0 and 1, or, if x has none, five columns at 1 fixed to 0.
func benchFixings(x []float64) (fix []int, val []float64) {
	used := make([]bool, len(x))
	for len(fix) < 5 {
		j, best := -1, 1e-6
		for jj, v := range x {
			if d := min(v, 1-v); !used[jj] && d > best {
				j, best = jj, d
			}
		}
		if j < 0 {
			break
		}
		used[j] = true
		fix = append(fix, j)
		val = append(val, float64(len(fix)%2))
	}
	if len(fix) > 0 {
		return fix, val
	}
	for j, v := range x {
		if v > 0.5 && len(fix) < 5 {
			fix = append(fix, j)
			val = append(val, 0)
		}
	}
	return fix, val
}

// BenchmarkSCPDive imitates a branch and bound dive: from the LP optimum,
// repeatedly fix the first fractional column (alternately to 0 and 1) and
// re-solve warm without restoring the basis, up to 30 times or until
// the LP is infeasible or integral. Reported per re-solve.
func BenchmarkSCPDive(b *testing.B) {
	dir := scpDir(b)
	for _, name := range benchSCP {
		p := readSCP(b, filepath.Join(dir, name+".txt"))
		b.Run(name, func(b *testing.B) {
			var cpu time.Duration
			solves, iters := 0, 0
			for b.Loop() {
				s, err := New(p, Options{})
				if err != nil {
					b.Fatal(err)
				}
				r, err := s.Solve()
				if err != nil {
					b.Fatal(err)
				}
				c0 := processCPU()
				for d := 0; d < 30 && r.Status == Optimal; d++ {
					j := -1
					for jj, x := range r.X {
						if x > 1e-6 && x < 1-1e-6 {
							j = jj
							break
						}
					}
					if j < 0 {
						break
					}
					v := float64(d % 2)
					s.SetColBounds(j, v, v)
					if r, err = s.Solve(); err != nil {
						b.Fatal(err)
					}
					solves++
					iters += r.Iterations
				}
				cpu += processCPU() - c0
			}
			if solves > 0 {
				b.ReportMetric(float64(cpu)/1e6/float64(solves), "cpu-ms/resolve")
				b.ReportMetric(float64(iters)/float64(solves), "iters/resolve")
			}
		})
	}
}
