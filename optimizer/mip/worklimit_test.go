package mip

import (
	"context"
	"math/rand/v2"
	"reflect"
	"runtime"
	"sync"
	"testing"
)

// workProblem is an invented random MIP (general rows, integer and
// continuous columns) whose search takes thousands of simplex iterations.
func workProblem() *Problem {
	return randomGeneralMIP(rand.New(rand.NewPCG(2, 17)), 20, 40)
}

// TestWorkLimitDeterministic: a solve stopped by WorkLimit gives the same
// result (status, point, objective, bound, nodes, iterations) on every
// run, also while other goroutines load every core; without the limit the
// same problem needs more work, so the limit really cut the search.
func TestWorkLimitDeterministic(t *testing.T) {
	full, err := Solve(context.Background(), workProblem(), Options{})
	if err != nil {
		t.Fatal(err)
	}
	limit := full.LPIterations / 3
	if full.Status != Optimal || limit < 100 {
		t.Fatalf("the test problem is too easy: %v after %d iterations", full.Status, full.LPIterations)
	}
	type outcome struct {
		Status          Status
		X               []float64
		Obj, Bound, Gap float64
		Nodes, LPIters  int
	}
	run := func() outcome {
		r, err := Solve(context.Background(), workProblem(), Options{WorkLimit: limit})
		if err != nil {
			t.Fatal(err)
		}
		return outcome{r.Status, r.X, r.Obj, r.Bound, r.Gap, r.Nodes, r.LPIterations}
	}
	first := run()
	if first.Status != WorkLimit || first.LPIters < limit || first.LPIters >= full.LPIterations {
		t.Fatalf("with WorkLimit %d: %v after %d iterations (the full solve took %d)", limit, first.Status, first.LPIters, full.LPIterations)
	}
	// Load every core while solving again.
	stop := make(chan struct{})
	var wg sync.WaitGroup
	for k := 0; k < runtime.NumCPU(); k++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			x := 0
			for {
				select {
				case <-stop:
					return
				default:
					for i := 0; i < 1e5; i++ {
						x += i
					}
				}
			}
		}()
	}
	second := run()
	close(stop)
	wg.Wait()
	if !reflect.DeepEqual(first, second) {
		t.Errorf("two solves with WorkLimit %d differ:\n%+v\n%+v", limit, first, second)
	}
}
