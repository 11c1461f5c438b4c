package lp

import (
	"math"
	"math/rand/v2"
	"path/filepath"
	"testing"
)

// TestPrimalAlone runs the primal simplex (phase 1 and 2) from the slack
// basis on problems the dual simplex solves by default, and checks it
// against the dual result and the KKT conditions: random LPs (gonum is
// the oracle for those in TestRandomAgainstGonum) and OR-Library
// set-covering relaxations (Beasley 1987), whose LP optima glpsol
// confirms in TestSetCoveringLP.
func TestPrimalAlone(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 8))
	for k := 0; k < 100; k++ {
		p := randomLP(rng, 2+rng.IntN(15), 2+rng.IntN(20), 0.4, 0.1)
		dual, err := Solve(p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		s, _ := New(p, Options{})
		s.forcePrimal = true
		r, err := s.Solve()
		if err != nil {
			t.Fatalf("instance %d: %v", k, err)
		}
		sameOutcome(t, "primal vs dual", r, dual)
		if r.Status == Optimal {
			checkKKT(t, p, r, 1e-7)
		}
	}
	dir := scpDir(t)
	for _, name := range []string{"scp41", "scpe1"} {
		p := readSCP(t, filepath.Join(dir, name+".txt"))
		dual, _ := Solve(p, Options{})
		s, _ := New(p, Options{})
		s.forcePrimal = true
		r, err := s.Solve()
		if err != nil {
			t.Fatal(err)
		}
		if r.Status != Optimal || math.Abs(r.Obj-dual.Obj) > 1e-7*dual.Obj {
			t.Errorf("%s: primal %v %g, dual %g", name, r.Status, r.Obj, dual.Obj)
		}
		checkKKT(t, p, r, 1e-7)
		t.Logf("%s: primal %d iterations, dual %d", name, r.Iterations, dual.Iterations)
	}
}
