package mip

import (
	"context"
	"flag"
	"fmt"
	"math/rand/v2"
	"os/exec"
	"testing"
	"time"
)

var stressN = flag.Int("stress", 0, "cross-check this many extra random problems with CBC (long)")

// TestStressAgainstCBC cross-checks optimal values with CBC (independent
// solver) on many random plan-like, general and covering problems of
// moderate size. Runs only with -stress N.
func TestStressAgainstCBC(t *testing.T) {
	if *stressN == 0 {
		t.Skip("run with -stress N")
	}
	if _, err := exec.LookPath("cbc"); err != nil {
		t.Skip("cbc is not on PATH")
	}
	dir := t.TempDir()
	rng := rand.New(rand.NewPCG(99, 1))
	for k := 0; k < *stressN; k++ {
		var p *Problem
		switch k % 4 {
		case 3:
			p = randomGeneralMIP(rng, 5+rng.IntN(15), 8+rng.IntN(20))
			for j := range p.LP.ColUp {
				if rng.IntN(2) == 0 {
					p.LP.ColUp[j] += float64(rng.IntN(20))
				}
				p.LP.Obj[j] += 0.25 * float64(rng.IntN(4))
			}
		case 0:
			p = planLikeMIP(rng, 20+rng.IntN(80), 2+rng.IntN(3))
		case 1:
			p = randomGeneralMIP(rng, 5+rng.IntN(15), 8+rng.IntN(20))
		default:
			m, n := 30+rng.IntN(40), 60+rng.IntN(100)
			cost := make([]float64, n)
			rows := make([][]int, n)
			for j := range cost {
				cost[j] = float64(1 + rng.IntN(5))
				for i := 0; i < m; i++ {
					if rng.IntN(10) == 0 {
						rows[j] = append(rows[j], i)
					}
				}
			}
			p = SetCoverRows(m, cost, rows)
		}
		p.Name = fmt.Sprintf("stress%d", k)
		for _, th := range []int{1, 2} {
			res, err := Solve(context.Background(), p, Options{TimeLimit: 60 * time.Second, Threads: th})
			if err != nil {
				t.Fatalf("%s: %v", p.Name, err)
			}
			if th == 1 {
				file := writeMPSFile(t, dir, p.Name, p)
				ext := runCBC(t, file, 120*time.Second)
				switch ext.status {
				case "optimal":
					if res.Status != Optimal || !sameObj(res.Obj, ext.obj) {
						t.Errorf("%s: CBC optimum %v; we say %v %v", p.Name, ext.obj, res.Status, res.Obj)
					}
				case "infeasible":
					if res.Status != Infeasible {
						t.Errorf("%s: CBC infeasible; we say %v %v", p.Name, res.Status, res.Obj)
					}
				}
			}
			if res.X != nil {
				if v, ok := checkFeasible(p, res.X); !ok || !sameObj(v, res.Obj) {
					t.Errorf("%s threads %d: X infeasible or objective %v ≠ %v", p.Name, th, v, res.Obj)
				}
			}
			if res.Elapsed > 5*time.Second {
				t.Logf("%s threads %d: %v in %v, %d nodes", p.Name, th, res.Status, res.Elapsed, res.Nodes)
			}
		}
	}
}
