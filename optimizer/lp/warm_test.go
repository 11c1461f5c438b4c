package lp

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"
	"time"
)

func cloneProblem(p *Problem) *Problem {
	q := *p
	q.Obj = append([]float64(nil), p.Obj...)
	q.ColLo = append([]float64(nil), p.ColLo...)
	q.ColUp = append([]float64(nil), p.ColUp...)
	q.RowLo = append([]float64(nil), p.RowLo...)
	q.RowUp = append([]float64(nil), p.RowUp...)
	return &q
}

// sameOutcome checks a warm result against a cold solve of the same
// modified problem: same status, same optimal value.
func sameOutcome(t *testing.T, what string, warm, cold *Result) {
	t.Helper()
	if warm.Status != cold.Status {
		t.Errorf("%s: warm status %v, cold %v", what, warm.Status, cold.Status)
		return
	}
	if cold.Status == Optimal && math.Abs(warm.Obj-cold.Obj) > 1e-7*math.Max(1, math.Abs(cold.Obj)) {
		t.Errorf("%s: warm objective %.12g, cold %.12g", what, warm.Obj, cold.Obj)
	}
}

// TestWarmBranching imitates branch and bound: after an optimal solve,
// a fractional column's bounds are tightened to floor or ceiling and the
// LP is re-solved warm; the result must match a cold solve of the
// modified problem (the cold solve is the reference; both are checked
// for KKT).
func TestWarmBranching(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	warmIters, coldIters, branches := 0, 0, 0
	for k := 0; k < 60; k++ {
		p := randomLP(rng, 10+rng.IntN(20), 15+rng.IntN(25), 0.3, 0)
		s, err := New(p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		r, err := s.Solve()
		if err != nil {
			t.Fatal(err)
		}
		if r.Status != Optimal {
			continue
		}
		q := cloneProblem(p)
		for depth := 0; depth < 5; depth++ {
			// Branch on the most fractional column.
			j, frac := -1, 0.0
			for jj, x := range r.X {
				f := x - math.Floor(x)
				if d := math.Min(f, 1-f); d > 1e-6 && d > frac {
					j, frac = jj, d
				}
			}
			if j < 0 {
				break
			}
			lo, up := s.ColBounds(j)
			if rng.IntN(2) == 0 {
				up = math.Floor(r.X[j])
			} else {
				lo = math.Ceil(r.X[j])
			}
			s.SetColBounds(j, lo, up)
			q.ColLo[j], q.ColUp[j] = lo, up
			r, err = s.Solve()
			if err != nil {
				t.Fatal(err)
			}
			cold, err := Solve(q, Options{})
			if err != nil {
				t.Fatal(err)
			}
			sameOutcome(t, "branch", r, cold)
			if r.Status == Optimal {
				checkKKT(t, q, r, 1e-7)
			}
			warmIters += r.Iterations
			coldIters += cold.Iterations
			branches++
			if r.Status != Optimal {
				break
			}
		}
	}
	t.Logf("%d branchings: %d warm iterations, %d cold iterations", branches, warmIters, coldIters)
	if branches < 50 {
		t.Errorf("only %d branchings exercised", branches)
	}
	if warmIters >= coldIters {
		t.Errorf("warm starts took %d iterations, not fewer than cold %d", warmIters, coldIters)
	}
}

// TestBasisRestore: a snapshot taken at an optimum, restored after other
// solves with the original bounds, gives the same optimum in zero
// iterations.
func TestBasisRestore(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	done := 0
	for k := 0; k < 30; k++ {
		p := randomLP(rng, 15, 25, 0.3, 0)
		s, _ := New(p, Options{})
		r0, err := s.Solve()
		if err != nil || r0.Status != Optimal {
			continue
		}
		b := s.Basis()
		for j := 0; j < 3; j++ {
			v := p.ColLo[j] // fix at a finite bound, or 0 if there is none
			if math.IsInf(v, -1) {
				v = p.ColUp[j]
			}
			if math.IsInf(v, 1) {
				v = 0
			}
			s.SetColBounds(j, v, v)
		}
		if _, err := s.Solve(); err != nil {
			t.Fatal(err)
		}
		for j := 0; j < 3; j++ {
			s.SetColBounds(j, p.ColLo[j], p.ColUp[j])
		}
		if err := s.SetBasis(b); err != nil {
			t.Fatal(err)
		}
		r1, err := s.Solve()
		if err != nil {
			t.Fatal(err)
		}
		if r1.Status != Optimal || math.Abs(r1.Obj-r0.Obj) > 1e-9*math.Max(1, math.Abs(r0.Obj)) {
			t.Errorf("restored basis: %v %g, want Optimal %g", r1.Status, r1.Obj, r0.Obj)
		}
		if r1.Iterations != 0 {
			t.Errorf("restored optimal basis took %d iterations, want 0", r1.Iterations)
		}
		done++
	}
	if done < 10 {
		t.Errorf("only %d restores exercised", done)
	}
	other, _ := New(textbookCases[0].p, Options{})
	s, _ := New(textbookCases[0].p, Options{})
	if err := s.SetBasis(other.Basis()); err == nil {
		t.Error("SetBasis accepted a snapshot of another solver")
	}
}

// TestWarmObjectiveAndRows: objective changes (weighted-sum sweeps,
// re-solved by the primal simplex) and row bound changes (ε-constraint
// sweeps, by the dual simplex) against cold solves.
func TestWarmObjectiveAndRows(t *testing.T) {
	rng := rand.New(rand.NewPCG(17, 19))
	n := 0
	for k := 0; k < 40; k++ {
		p := randomLP(rng, 12, 20, 0.3, 0)
		s, _ := New(p, Options{})
		r, err := s.Solve()
		if err != nil || r.Status != Optimal {
			continue
		}
		q := cloneProblem(p)
		for step := 0; step < 4; step++ {
			j := rng.IntN(p.NumCols)
			c := float64(rng.IntN(21) - 7)
			s.SetObj(j, c)
			q.Obj[j] = c
			i := rng.IntN(p.NumRows)
			lo, up := s.RowBounds(i)
			if !math.IsInf(up, 1) {
				up += float64(rng.IntN(5) - 2)
			}
			if !math.IsInf(lo, -1) {
				lo = math.Min(lo+float64(rng.IntN(5)-2), up)
			}
			s.SetRowBounds(i, lo, up)
			q.RowLo[i], q.RowUp[i] = lo, up
			w, err := s.Solve()
			if err != nil {
				t.Fatal(err)
			}
			cold, err := Solve(q, Options{})
			if err != nil {
				t.Fatal(err)
			}
			sameOutcome(t, "objective/row change", w, cold)
			if w.Status == Optimal {
				checkKKT(t, q, w, 1e-7)
			}
			n++
		}
	}
	if n < 50 {
		t.Errorf("only %d re-solves exercised", n)
	}
}

func TestValidate(t *testing.T) {
	good := func() *Problem { return cloneProblem(textbookCases[0].p) }
	cases := []struct {
		name string
		edit func(p *Problem)
	}{
		{"obj length", func(p *Problem) { p.Obj = p.Obj[:2] }},
		{"colstart", func(p *Problem) { p.ColStart = []int{0, 1} }},
		{"row index", func(p *Problem) { p.RowIndex = append([]int(nil), p.RowIndex...); p.RowIndex[0] = 7 }},
		{"bounds", func(p *Problem) { p.ColLo[0] = 3; p.ColUp[0] = 1 }},
		{"nan", func(p *Problem) { p.Value = append([]float64(nil), p.Value...); p.Value[1] = math.NaN() }},
		{"lower +inf", func(p *Problem) { p.RowLo[0] = inf }},
	}
	for _, tc := range cases {
		p := good()
		tc.edit(p)
		if _, err := New(p, Options{}); err == nil {
			t.Errorf("%s: New accepted a malformed problem", tc.name)
		} else {
			t.Logf("%s: %v", tc.name, err)
		}
	}
	s, _ := New(good(), Options{})
	s.SetColBounds(1, math.Inf(1), math.Inf(1))
	if _, err := s.Solve(); err == nil {
		t.Error("Solve accepted a column with lower bound +Inf")
	}
	s.SetColBounds(1, 2, 1)
	if r, err := s.Solve(); err != nil || r.Status != Infeasible {
		t.Errorf("crossed column bounds: %v %v, want Infeasible", r, err)
	}
	if err := good().Validate(); err != nil {
		t.Errorf("valid problem rejected: %v", err)
	}
}

func TestLimits(t *testing.T) {
	p := kleeMinty(8)
	r, err := Solve(p, Options{MaxIterations: 1})
	if err != nil {
		t.Fatal(err)
	}
	if r.Status != IterationLimit {
		t.Errorf("status %v, want IterationLimit", r.Status)
	}
	s, _ := New(p, Options{MaxIterations: 1})
	s.SetOptions(Options{})
	r, _ = s.Solve()
	if r.Status != Optimal || math.Abs(r.Obj+math.Pow(5, 8)) > 1e-6 {
		t.Errorf("after lifting the limit: %v %g, want Optimal %g (Klee & Minty 1972)", r.Status, r.Obj, -math.Pow(5, 8))
	}
	// An optimal basis is reported Optimal even past the deadline.
	s2, _ := New(p, Options{})
	if r, _ := s2.Solve(); r.Status != Optimal {
		t.Fatalf("status %v", r.Status)
	}
	s2.SetOptions(Options{Deadline: time.Now().Add(-time.Second)})
	if r, _ := s2.Solve(); r.Status != Optimal || r.Iterations != 0 {
		t.Errorf("re-solve of an optimal basis past the deadline: %v after %d iterations, want Optimal after 0", r.Status, r.Iterations)
	}
	past := Options{Deadline: time.Now().Add(-time.Second)}
	if r, _ := Solve(p, past); r.Status != TimeLimit {
		t.Errorf("deadline in the past: status %v, want TimeLimit", r.Status)
	}
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	if r, _ := Solve(p, Options{Context: ctx}); r.Status != Canceled {
		t.Errorf("canceled context: status %v, want Canceled", r.Status)
	}
	ctx2, cancel2 := context.WithDeadline(context.Background(), time.Now().Add(-time.Second))
	defer cancel2()
	if r, _ := Solve(p, Options{Context: ctx2}); r.Status != TimeLimit {
		t.Errorf("expired context: status %v, want TimeLimit", r.Status)
	}
	for st, want := range map[Status]string{Optimal: "Optimal", Infeasible: "Infeasible", TimeLimit: "TimeLimit"} {
		if st.String() != want {
			t.Errorf("%d.String() = %q", int(st), st.String())
		}
	}
}

// TestDeterministic: two solves of the same input agree bit for bit.
func TestDeterministic(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	p := randomLP(rng, 30, 50, 0.2, 0)
	r1, _ := Solve(p, Options{})
	r2, _ := Solve(p, Options{})
	if r1.Obj != r2.Obj || r1.Iterations != r2.Iterations {
		t.Fatalf("two solves differ: %v/%d vs %v/%d", r1.Obj, r1.Iterations, r2.Obj, r2.Iterations)
	}
	for j := range r1.X {
		if r1.X[j] != r2.X[j] || r1.ReducedCost[j] != r2.ReducedCost[j] {
			t.Fatalf("x or d differ at %d", j)
		}
	}
}

// TestDegenerateShapes: problems without rows or without columns, and
// empty columns, which presolve in package mip can produce. The answers
// are evident from the data (each column on its own: minimize c_j x_j
// over [l_j, u_j]; a row without columns is feasible iff 0 lies in its
// bounds).
func TestDegenerateShapes(t *testing.T) {
	cases := []struct {
		name   string
		p      *Problem
		status Status
		obj    float64
	}{
		{"no rows", &Problem{NumCols: 3, Obj: []float64{1, -2, 0}, ColLo: []float64{-1, 0, -inf}, ColUp: []float64{4, 3, inf}, ColStart: []int{0, 0, 0, 0}}, Optimal, -1 - 6},
		{"no rows unbounded", &Problem{NumCols: 1, Obj: []float64{-1}, ColLo: []float64{0}, ColUp: []float64{inf}, ColStart: []int{0, 0}}, Unbounded, 0},
		{"no columns feasible", &Problem{NumRows: 2, RowLo: []float64{-1, -inf}, RowUp: []float64{1, 0}, ColStart: []int{0}}, Optimal, 0},
		{"no columns infeasible", &Problem{NumRows: 1, RowLo: []float64{1}, RowUp: []float64{inf}, ColStart: []int{0}}, Infeasible, 0},
		{"empty", &Problem{ColStart: []int{0}}, Optimal, 0},
	}
	for _, tc := range cases {
		r, err := Solve(tc.p, Options{})
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if r.Status != tc.status || (tc.status == Optimal && math.Abs(r.Obj-tc.obj) > 1e-12) {
			t.Errorf("%s: %v %g, want %v %g", tc.name, r.Status, r.Obj, tc.status, tc.obj)
		}
	}
}

// TestDualBoundAtLimit: a solve stopped by the iteration limit whose basis
// is dual feasible reports an objective that does not exceed the optimum
// (weak duality, e.g. Chvátal 1983, ch. 5).
func TestDualBoundAtLimit(t *testing.T) {
	rng := rand.New(rand.NewPCG(23, 29))
	checked := 0
	for k := 0; k < 80; k++ {
		p := randomLP(rng, 15+rng.IntN(15), 20+rng.IntN(20), 0.3, 0)
		full, err := Solve(p, Options{})
		if err != nil || full.Status != Optimal {
			continue
		}
		if !full.DualFeasible {
			t.Errorf("instance %d: optimal result not flagged dual feasible", k)
		}
		for lim := 1; lim < full.Iterations; lim += 2 {
			r, err := Solve(p, Options{MaxIterations: lim})
			if err != nil {
				t.Fatal(err)
			}
			if r.Status != IterationLimit || !r.DualFeasible {
				continue
			}
			checked++
			if r.Obj > full.Obj+1e-7*math.Max(1, math.Abs(full.Obj)) {
				t.Errorf("instance %d, limit %d: bound %g above the optimum %g", k, lim, r.Obj, full.Obj)
			}
		}
	}
	if checked < 50 {
		t.Errorf("only %d dual-feasible stops checked", checked)
	}
	t.Logf("%d dual-feasible iteration-limit stops checked", checked)
}
