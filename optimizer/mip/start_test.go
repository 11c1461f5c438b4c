package mip

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"
)

// A start (Options.Start) changes how soon a good solution is known,
// never the optimum: on random small MIPs checked by brute force (gonum's
// simplex for the continuous part), solving from the optimal solution, from
// a random point and from a start of the wrong length all end at the
// brute-force optimum, and a feasible start is the first incumbent
// reported.
func TestStartNeverChangesOptimum(t *testing.T) {
	rng := rand.New(rand.NewPCG(77, 5))
	feasibleStarts := 0
	for trial := 0; trial < 80; trial++ {
		p := randomGeneralMIP(rng, 1+rng.IntN(5), 2+rng.IntN(5))
		want := bruteMIP(t, p)
		if math.IsInf(want, 1) {
			continue
		}
		base, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		n := p.LP.NumCols
		random := make([]float64, n)
		for j := range random {
			lo, up := math.Max(p.LP.ColLo[j], -5), math.Min(p.LP.ColUp[j], 5)
			random[j] = lo + rng.Float64()*(up-lo)
		}
		starts := []struct {
			name  string
			x     []float64
			first bool // the first incumbent reported must be the start's objective
		}{
			{"optimal", base.X, true},
			{"random", random, false},
			{"short", base.X[:n-1], false},
		}
		for _, st := range starts {
			first := math.NaN()
			res, err := Solve(context.Background(), p, Options{Start: st.x, Progress: func(pr Progress) {
				if math.IsNaN(first) && !math.IsInf(pr.Incumbent, 1) {
					first = pr.Incumbent
				}
			}})
			if err != nil {
				t.Fatalf("trial %d, %s start: %v", trial, st.name, err)
			}
			if res.Status != Optimal || math.Abs(res.Obj-want) > 1e-6*math.Max(1, math.Abs(want)) {
				t.Fatalf("trial %d, %s start: %v obj %v; brute force optimum %v", trial, st.name, res.Status, res.Obj, want)
			}
			if v, ok := checkFeasible(p, res.X); !ok || math.Abs(v-res.Obj) > 1e-6*math.Max(1, math.Abs(v)) {
				t.Fatalf("trial %d, %s start: X infeasible or objective %v ≠ %v", trial, st.name, v, res.Obj)
			}
			if st.first {
				feasibleStarts++
				if math.Abs(first-want) > 1e-6*math.Max(1, math.Abs(want)) {
					t.Fatalf("trial %d: first incumbent %v, want the start's objective %v", trial, first, want)
				}
			}
		}
	}
	if feasibleStarts < 20 {
		t.Errorf("only %d feasible instances; the generator changed", feasibleStarts)
	}
}

// A feasible start is an answer even when the search stops at once: with
// the context cancelled before the solve, the result is the start's
// objective.
func TestStartIsKeptWhenInterrupted(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 9))
	checked := 0
	for trial := 0; trial < 40; trial++ {
		p := randomGeneralMIP(rng, 2+rng.IntN(4), 3+rng.IntN(4))
		base, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if base.X == nil {
			continue
		}
		ctx, cancel := context.WithCancel(context.Background())
		cancel()
		res, err := Solve(ctx, p, Options{Start: base.X})
		if err != nil {
			t.Fatal(err)
		}
		// Presolve alone may settle a tiny problem (status Optimal).
		if (res.Status != Interrupted && res.Status != Optimal) || res.X == nil || math.Abs(res.Obj-base.Obj) > 1e-9*math.Max(1, math.Abs(base.Obj)) {
			t.Fatalf("trial %d: %v obj %v; want interrupted with the start's objective %v", trial, res.Status, res.Obj, base.Obj)
		}
		checked++
	}
	if checked < 10 {
		t.Errorf("only %d feasible instances", checked)
	}
}
