package mip

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// gmiRoundsFor solves the LP relaxation of p and derives two rounds of
// Gomory mixed-integer cuts (the second from the LP with the first
// round's cuts added, so logicals of cut rows are substituted too). It
// returns every candidate cut, selected or not.
func gmiRoundsFor(t *testing.T, p *Problem) []cut {
	t.Helper()
	s, err := lp.New(&p.LP, lp.Options{})
	if err != nil {
		t.Fatal(err)
	}
	g := newGMIState(&p.LP)
	var all []cut
	for round := 0; round < 2; round++ {
		r, err := s.Solve()
		if err != nil {
			t.Fatal(err)
		}
		if r.Status != lp.Optimal {
			return all
		}
		cands := gmiCandidates(s, g, p.Integer, r.X, p.LP.ColLo, p.LP.ColUp)
		for _, c := range cands {
			act := 0.0
			for k, j := range c.cols {
				act += c.vals[k] * r.X[j]
			}
			if act >= c.rhs {
				t.Errorf("a candidate cut does not cut off the LP point: %v ≥ %v", act, c.rhs)
			}
		}
		all = append(all, cands...)
		sel := selectCuts(cands, 5)
		if len(sel) == 0 {
			return all
		}
		lo, up, start := []float64{}, []float64{}, []int{0}
		var cols []int
		var vals []float64
		for _, c := range sel {
			lo, up = append(lo, c.rhs), append(up, math.Inf(1))
			cols, vals = append(cols, c.cols...), append(vals, c.vals...)
			start = append(start, len(cols))
		}
		if err := s.AddRows(lo, up, start, cols, vals); err != nil {
			t.Fatal(err)
		}
		g.cuts = append(g.cuts, sel...)
	}
	return all
}

// bruteMinCut returns, over every feasible point of p (integer columns
// enumerated over their bounded ranges, continuous ones by an LP for each
// integer assignment), the least value of π x for cut c: an independent
// check by exhaustion. ok is false when p has no feasible point.
func bruteMinCut(t *testing.T, p *Problem, c cut) (float64, bool) {
	q := &p.LP
	n := q.NumCols
	pi := make([]float64, n)
	for k, j := range c.cols {
		pi[j] = c.vals[k]
	}
	x := make([]float64, n)
	best, found := math.Inf(1), false
	var rec func(j int)
	rec = func(j int) {
		if j == n {
			sub := *q
			sub.ColLo = append([]float64(nil), q.ColLo...)
			sub.ColUp = append([]float64(nil), q.ColUp...)
			sub.Obj = make([]float64, n)
			for k := 0; k < n; k++ {
				if p.Integer[k] {
					sub.ColLo[k], sub.ColUp[k] = x[k], x[k]
				}
				sub.Obj[k] = pi[k]
			}
			r, err := lp.Solve(&sub, lp.Options{})
			if err != nil {
				t.Fatal(err)
			}
			if r.Status == lp.Optimal {
				found = true
				best = math.Min(best, r.Obj)
			}
			return
		}
		if !p.Integer[j] {
			rec(j + 1)
			return
		}
		for v := q.ColLo[j]; v <= q.ColUp[j]; v++ {
			x[j] = v
			rec(j + 1)
		}
	}
	rec(0)
	return best, found
}

// TestGomoryCutsValid: on random small MIPs (invented data: general
// rows, integer and continuous columns with small bounds) every Gomory
// mixed-integer cut of two rounds holds at every feasible point, found by
// brute force; and the cuts are not idle: many are generated, each cuts
// off the LP point it came from.
func TestGomoryCutsValid(t *testing.T) {
	rng := rand.New(rand.NewPCG(21, 4))
	total, problems := 0, 0
	for trial := 0; trial < 60 && problems < 25; trial++ {
		p := randomGeneralMIP(rng, 2+rng.IntN(4), 3+rng.IntN(4))
		cuts := gmiRoundsFor(t, p)
		if len(cuts) == 0 {
			continue
		}
		problems++
		for k, c := range cuts {
			least, feasible := bruteMinCut(t, p, c)
			if !feasible {
				break // no feasible point: every cut is valid
			}
			if least < c.rhs-1e-7*math.Max(1, math.Abs(c.rhs)) {
				t.Errorf("trial %d cut %d: a feasible point has π x = %v below the right-hand side %v", trial, k, least, c.rhs)
			}
		}
		total += len(cuts)
	}
	if problems < 10 || total < 20 {
		t.Errorf("only %d cuts on %d problems: the generator is nearly idle", total, problems)
	}
	t.Logf("%d cuts on %d problems checked", total, problems)
}

// TestCutsKeepOptimum: with root cuts the engine still finds the
// optimum of random MIPs given by brute force (bruteMIP: enumeration with
// gonum's simplex for the continuous part, an independent LP code), as it
// does with cuts off.
func TestCutsKeepOptimum(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 15))
	cutsSeen, withCuts := 0, 0
	for trial := 0; trial < 60; trial++ {
		p := randomGeneralMIP(rng, 2+rng.IntN(5), 3+rng.IntN(5))
		want := bruteMIP(t, p)
		for _, noCuts := range []bool{false, true} {
			res, err := Solve(context.Background(), p, Options{noCuts: noCuts})
			if err != nil {
				t.Fatal(err)
			}
			if !noCuts {
				cutsSeen += res.Cuts
				if res.Cuts > 0 {
					withCuts++
				}
			}
			switch {
			case math.IsInf(want, 1):
				if res.Status != Infeasible {
					t.Errorf("trial %d (cuts off: %v): %v %v; brute force says infeasible", trial, noCuts, res.Status, res.Obj)
				}
			case res.Status != Optimal || !sameObj(res.Obj, want):
				t.Errorf("trial %d (cuts off: %v): %v %v; brute force optimum %v", trial, noCuts, res.Status, res.Obj, want)
			default:
				if v, ok := checkFeasible(p, res.X); !ok || !sameObj(v, res.Obj) {
					t.Errorf("trial %d: the point found is not feasible", trial)
				}
			}
		}
	}
	t.Logf("%d cuts on %d of 60 problems", cutsSeen, withCuts)
	if withCuts < 5 {
		t.Errorf("cuts were added on only %d problems", withCuts)
	}
}

// TestCutsUnderNodeLimit: a node limit (here 1, the root alone) does not
// stop the root's cuts, so the bound a root-only solve reports is the
// bound after cuts: the same number of cuts as without the limit.
func TestCutsUnderNodeLimit(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 15))
	checked := 0
	for trial := 0; trial < 60 && checked < 5; trial++ {
		p := randomGeneralMIP(rng, 2+rng.IntN(5), 3+rng.IntN(5))
		full, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if full.Cuts == 0 {
			continue
		}
		root, err := Solve(context.Background(), p, Options{NodeLimit: 1})
		if err != nil {
			t.Fatal(err)
		}
		if root.Status == NodeLimit && root.Cuts != full.Cuts {
			t.Errorf("trial %d: %d cuts under NodeLimit 1, %d without", trial, root.Cuts, full.Cuts)
		}
		checked++
	}
	if checked == 0 {
		t.Error("no problem with cuts")
	}
}

// randomKnapsackMIP is an invented pure-binary problem with knapsack rows
// (positive and negative coefficients, ≤ and ≥ rows) and a random
// objective that pulls columns towards 1.
func randomKnapsackMIP(rng *rand.Rand, m, n int) *Problem {
	p := &Problem{Integer: make([]bool, n)}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj = make([]float64, n)
	q.ColLo = make([]float64, n)
	q.ColUp = make([]float64, n)
	q.RowLo = make([]float64, m)
	q.RowUp = make([]float64, m)
	q.ColStart = make([]int, n+1)
	a := make([][]float64, m)
	for i := range a {
		a[i] = make([]float64, n)
		for j := range a[i] {
			if rng.IntN(4) > 0 {
				a[i][j] = float64(1 + rng.IntN(12))
				if rng.IntN(5) == 0 {
					a[i][j] = -a[i][j]
				}
			}
		}
	}
	for j := 0; j < n; j++ {
		p.Integer[j] = true
		q.ColUp[j] = 1
		q.Obj[j] = -float64(1 + rng.IntN(10))
		for i := 0; i < m; i++ {
			if a[i][j] != 0 {
				q.RowIndex = append(q.RowIndex, i)
				q.Value = append(q.Value, a[i][j])
			}
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	for i := 0; i < m; i++ {
		sum := 0.0
		for _, v := range a[i] {
			sum += math.Abs(v)
		}
		q.RowLo[i], q.RowUp[i] = math.Inf(-1), math.Floor(sum*(0.2+0.4*rng.Float64()))
	}
	// Turn a few rows into ≥ rows by negating them.
	for i := 0; i < m; i += 3 {
		for j := 0; j < n; j++ {
			for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
				if q.RowIndex[k] == i {
					q.Value[k] = -q.Value[k]
				}
			}
		}
		q.RowLo[i], q.RowUp[i] = -q.RowUp[i], math.Inf(1)
	}
	return p
}

// TestKnapsackCoversValid: every knapsack cover cut derived from the LP
// point of random pure-binary knapsack problems holds at every feasible
// 0/1 point (all 2^n points enumerated), and the generator is not idle.
func TestKnapsackCoversValid(t *testing.T) {
	rng := rand.New(rand.NewPCG(31, 7))
	total := 0
	for trial := 0; trial < 40; trial++ {
		n := 6 + rng.IntN(7)
		p := randomKnapsackMIP(rng, 1+rng.IntN(3), n)
		q := &p.LP
		r, err := lp.Solve(q, lp.Options{})
		if err != nil || r.Status != lp.Optimal {
			t.Fatalf("trial %d: LP %v %v", trial, r, err)
		}
		cuts := knapsackCandidates(newGMIState(q), p.Integer, q.RowLo, q.RowUp, q.ColLo, q.ColUp, r.X)
		total += len(cuts)
		x := make([]float64, n)
		for mask := 0; mask < 1<<n; mask++ {
			for j := range x {
				x[j] = float64(mask >> j & 1)
			}
			if _, ok := checkFeasible(p, x); !ok {
				continue
			}
			for k, c := range cuts {
				act := 0.0
				for t, j := range c.cols {
					act += c.vals[t] * x[j]
				}
				if act < c.rhs-1e-9 {
					t.Fatalf("trial %d cut %d: feasible point %v has π x = %v < %v", trial, k, x, act, c.rhs)
				}
			}
		}
	}
	t.Logf("%d cover cuts checked", total)
	if total < 10 {
		t.Errorf("only %d cover cuts on 40 problems", total)
	}
}

// TestKnapsackMIPOptimum: with root cuts (Gomory and covers) the engine
// finds the optimum of random knapsack problems given by enumeration of
// all 0/1 points.
func TestKnapsackMIPOptimum(t *testing.T) {
	rng := rand.New(rand.NewPCG(32, 9))
	cuts := 0
	for trial := 0; trial < 30; trial++ {
		n := 6 + rng.IntN(7)
		p := randomKnapsackMIP(rng, 1+rng.IntN(4), n)
		best := math.Inf(1)
		x := make([]float64, n)
		for mask := 0; mask < 1<<n; mask++ {
			for j := range x {
				x[j] = float64(mask >> j & 1)
			}
			if v, ok := checkFeasible(p, x); ok && v < best {
				best = v
			}
		}
		res, err := Solve(context.Background(), p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		cuts += res.Cuts
		if res.Status != Optimal || !sameObj(res.Obj, best) {
			t.Errorf("trial %d: %v %v; enumeration gives %v", trial, res.Status, res.Obj, best)
		}
	}
	t.Logf("%d root cuts on 30 problems", cuts)
}
