package mip

import (
	"context"
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
	"time"
)

func TestStatusString(t *testing.T) {
	for s, want := range map[Status]string{Optimal: "optimal", Infeasible: "infeasible", Unbounded: "unbounded",
		TimeLimit: "time limit", NodeLimit: "node limit", Interrupted: "interrupted", Status(42): "Status(42)"} {
		if s.String() != want {
			t.Errorf("%d: %q, want %q", int(s), s.String(), want)
		}
	}
}

func TestDeterministicAndProgress(t *testing.T) {
	dir := dataDir(t, "orlib-scp")
	p := loadORLib(t, dir, "scpe1")
	var runs [2]*Result
	var trace [2][]Progress
	for k := range runs {
		k := k
		res, err := Solve(context.Background(), p, Options{Progress: func(pr Progress) { trace[k] = append(trace[k], pr) }})
		if err != nil {
			t.Fatal(err)
		}
		runs[k] = res
	}
	a, b := *runs[0], *runs[1]
	a.Elapsed, b.Elapsed = 0, 0
	a.PresolveTime, b.PresolveTime = 0, 0
	if !reflect.DeepEqual(a, b) {
		t.Errorf("two runs differ:\n%+v\n%+v", a, b)
	}
	if len(trace[0]) == 0 || len(trace[0]) != len(trace[1]) {
		t.Fatalf("progress calls %d and %d", len(trace[0]), len(trace[1]))
	}
	for k, pr := range trace[0] {
		if pr.Bound > pr.Incumbent+1e-9 {
			t.Errorf("progress %d: bound %v above incumbent %v", k, pr.Bound, pr.Incumbent)
		}
		if k > 0 && (pr.Incumbent > trace[0][k-1].Incumbent || pr.Bound < trace[0][k-1].Bound-1e-9) {
			t.Errorf("progress %d: not monotone: %+v after %+v", k, pr, trace[0][k-1])
		}
		q := trace[1][k]
		if pr.Incumbent != q.Incumbent || pr.Bound != q.Bound || pr.Nodes != q.Nodes {
			t.Errorf("progress %d differs between runs: %+v vs %+v", k, pr, q)
		}
	}
	last := trace[0][len(trace[0])-1]
	if last.Incumbent != runs[0].Obj {
		t.Errorf("last progress incumbent %v, result %v", last.Incumbent, runs[0].Obj)
	}
}

func TestLimitsAndCancel(t *testing.T) {
	dir := dataDir(t, "orlib-scp")
	p := loadORLib(t, dir, "scpe2")
	check := func(name string, res *Result, want Status) {
		t.Helper()
		if res.Status != want {
			t.Fatalf("%s: status %v, want %v", name, res.Status, want)
		}
		if res.X != nil {
			if v, ok := checkFeasible(p, res.X); !ok || v != res.Obj {
				t.Errorf("%s: X infeasible or objective mismatch", name)
			}
		}
		if res.Bound > res.Obj+1e-9 || res.Bound > 5 {
			t.Errorf("%s: bound %v exceeds objective %v or the optimum 5", name, res.Bound, res.Obj)
		}
	}
	res, err := Solve(context.Background(), p, Options{NodeLimit: 3})
	if err != nil {
		t.Fatal(err)
	}
	check("node limit", res, NodeLimit)
	if res.Nodes > 3 {
		t.Errorf("node limit 3 but %d nodes", res.Nodes)
	}

	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	res, err = Solve(ctx, p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	check("cancelled", res, Interrupted)

	res, err = Solve(context.Background(), p, Options{TimeLimit: time.Nanosecond})
	if err != nil {
		t.Fatal(err)
	}
	check("time limit", res, TimeLimit)
}

func TestGapRel(t *testing.T) {
	dir := dataDir(t, "orlib-scp")
	p := loadORLib(t, dir, "scpe3")
	exact, err := Solve(context.Background(), p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	loose, err := Solve(context.Background(), p, Options{GapRel: 0.5})
	if err != nil {
		t.Fatal(err)
	}
	if loose.Status != Optimal || loose.Gap > 0.5 || loose.Obj < exact.Obj {
		t.Errorf("GapRel 0.5: %v gap %v obj %v (exact %v)", loose.Status, loose.Gap, loose.Obj, exact.Obj)
	}
	if loose.Bound > exact.Obj+1e-9 || math.Abs(loose.Gap-gap(loose.Obj, loose.Bound)) > 1e-12 {
		t.Errorf("GapRel 0.5: bound %v above the optimum %v or gap %v inconsistent", loose.Bound, exact.Obj, loose.Gap)
	}
	if loose.Nodes > exact.Nodes {
		t.Errorf("a looser gap took more nodes (%d > %d)", loose.Nodes, exact.Nodes)
	}
}

func TestSpecialProblems(t *testing.T) {
	// Empty problem.
	res, err := Solve(context.Background(), &Problem{LP: lpEmpty(), Integer: []bool{}, ObjOffset: 2.5}, Options{})
	if err != nil || res.Status != Optimal || res.Obj != 2.5 {
		t.Fatalf("empty problem: %+v %v", res, err)
	}
	// Unbounded: min -x, x ≥ 0 integer, x - y ≤ 3 with y free ≥ 0.
	p := &Problem{Integer: []bool{true, false}}
	p.LP.NumRows, p.LP.NumCols = 1, 2
	p.LP.Obj = []float64{-1, 0}
	p.LP.ColLo = []float64{0, 0}
	p.LP.ColUp = []float64{math.Inf(1), math.Inf(1)}
	p.LP.RowLo = []float64{math.Inf(-1)}
	p.LP.RowUp = []float64{3}
	p.LP.ColStart = []int{0, 1, 2}
	p.LP.RowIndex = []int{0, 0}
	p.LP.Value = []float64{1, -1}
	res, err = Solve(context.Background(), p, Options{})
	if err != nil || res.Status != Unbounded {
		t.Fatalf("unbounded problem: %+v %v", res, err)
	}
	// Invalid input is an error, not a panic.
	bad := SetCover([]float64{1}, [][]int{{0}})
	bad.LP.ColLo[0] = 5
	if _, err := Solve(context.Background(), bad, Options{}); err == nil {
		t.Fatal("Solve accepted an invalid problem")
	}
}

func lpEmpty() (q lpProblem) {
	q.ColStart = []int{0}
	q.Obj, q.ColLo, q.ColUp, q.RowLo, q.RowUp = []float64{}, []float64{}, []float64{}, []float64{}, []float64{}
	return q
}

// TestTwoThreadsDeterministic: with Threads 2 the result must not depend
// on timing (two runs agree exactly) and must reach the same optimum as
// one thread (OR-Library optimum from OPTIMA.tsv).
func TestTwoThreadsDeterministic(t *testing.T) {
	dir := dataDir(t, "orlib-scp")
	for _, name := range []string{"scpe2", "scp61"} {
		p := loadORLib(t, dir, name)
		want := orlibOptima(t, dir)[name]
		var runs [2]Result
		for k := range runs {
			res, err := Solve(context.Background(), p, Options{Threads: 2})
			if err != nil {
				t.Fatal(err)
			}
			res.Elapsed, res.PresolveTime = 0, 0
			runs[k] = *res
		}
		if !reflect.DeepEqual(runs[0], runs[1]) {
			t.Errorf("%s: two 2-thread runs differ: %v/%d nodes vs %v/%d nodes", name, runs[0].Obj, runs[0].Nodes, runs[1].Obj, runs[1].Nodes)
		}
		if runs[0].Status != Optimal || runs[0].Obj != want {
			t.Errorf("%s: 2 threads give %v %v, want optimal %v", name, runs[0].Status, runs[0].Obj, want)
		}
	}
}

// TestRepairFindsPlanLikePoint: on problems shaped like an exploration
// program model, the repair search must deliver a feasible incumbent
// before the root LP (the first progress report comes at node 0), and
// the final optimum must not be worse than that point.
func TestRepairFindsPlanLikePoint(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 8))
	for k := 0; k < 10; k++ {
		p := planLikeMIP(rng, 40+rng.IntN(60), 3)
		var first *Progress
		res, err := Solve(context.Background(), p, Options{Progress: func(pr Progress) {
			if first == nil {
				first = &pr
			}
		}})
		if err != nil {
			t.Fatal(err)
		}
		if first == nil || first.Nodes != 0 || math.IsInf(first.Incumbent, 1) {
			t.Fatalf("problem %d: first progress %+v; want an incumbent before the root LP", k, first)
		}
		if res.Status != Optimal || res.Obj > first.Incumbent+1e-9 {
			t.Errorf("problem %d: %v %v after a first point of %v", k, res.Status, res.Obj, first.Incumbent)
		}
		if _, ok := checkFeasible(p, res.X); !ok {
			t.Errorf("problem %d: X infeasible", k)
		}
	}
}
