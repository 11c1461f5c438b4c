package model

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

func randomSpec(rng *rand.Rand) *Spec {
	s := &Spec{NumPoints: 3 + rng.IntN(4), HoursPerDay: 10, DaysWeight: 0.01}
	nz := 1 + rng.IntN(2)
	for z := 0; z < nz; z++ {
		s.Zones = append(s.Zones, Zone{Name: string(rune('A' + z)), MinCount: rng.IntN(3), SampledShare: []float64{0, 0, 1.0 / 3, 0.5}[rng.IntN(4)]})
	}
	for r := 0; r < 2; r++ {
		s.Rigs = append(s.Rigs, Rig{Name: string(rune('r' + r)), MobCost: float64(500 + rng.IntN(2000)), MobHours: float64(rng.IntN(6)), DayCost: float64(100 + rng.IntN(400))})
	}
	// Pooled items (as lab tests and logging hours): a third of a test per
	// point, a fractional number of hours per point and per field day.
	if rng.IntN(2) == 0 {
		s.StartUpHours = 0.5
	}
	s.Pooled = []Pooled{{Name: "lab", Price: 85, Whole: true}, {Name: "log", Price: 95.37}}
	s.Rigs[0].DayUses = []Use{{Item: 1, Amount: 0.25}}
	s.Rigs[1].MobUses = []Use{{Item: 1, Amount: 1.333}}
	s.PointZone = make([]int, s.NumPoints)
	for p := range s.PointZone {
		s.PointZone[p] = rng.IntN(nz)
		for r := range s.Rigs {
			for _, sampled := range []bool{true, false} {
				if rng.IntN(3) == 0 {
					continue
				}
				s.Options = append(s.Options, Option{Point: p, Rig: r, Sampled: sampled,
					Cost: float64(200 + rng.IntN(800)), Hours: float64(2+rng.IntN(8)) + 0.25*float64(rng.IntN(4)), Label: "o",
					Uses: []Use{{Item: 0, Amount: float64(rng.IntN(4)) / 3}, {Item: 1, Amount: 0.001 * float64(rng.IntN(3000))}}})
			}
		}
	}
	// Sometimes a second crew of rig 1: the same options, Unit 2 (the
	// model orders the crews; the brute force does not, so the optimum
	// must not change).
	if rng.IntN(2) == 0 {
		c := s.Rigs[1]
		c.Name, c.Unit = "s2", 2
		s.Rigs = append(s.Rigs, c)
		for _, op := range s.Options {
			if op.Rig == 1 {
				op.Rig = 2
				s.Options = append(s.Options, op)
			}
		}
	}
	for k := 0; k < 2; k++ {
		row := []int{rng.IntN(s.NumPoints), rng.IntN(s.NumPoints)}
		s.CoverRows = append(s.CoverRows, row)
	}
	return s
}

// TestBuildAgainstBruteForce solves random small specs with the engine and
// checks the optimum against exhaustive enumeration of the same rules.
func TestBuildAgainstBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	solved := 0
	for i := 0; i < 60; i++ {
		s := randomSpec(rng)
		want, feasible := bruteMode(s)
		m, err := Build(s)
		if err != nil {
			if feasible {
				t.Fatalf("case %d: Build: %v, but brute force found %g", i, err, want)
			}
			continue
		}
		res, err := mip.Solve(context.Background(), m.Problem, mip.Options{})
		if err != nil {
			t.Fatalf("case %d: solve: %v", i, err)
		}
		if !feasible {
			if res.Status != mip.Infeasible {
				t.Fatalf("case %d: brute force finds no plan; engine says %s with %g", i, res.Status, res.Obj)
			}
			continue
		}
		if res.Status != mip.Optimal || math.Abs(res.Obj-want) > 1e-6*math.Max(1, math.Abs(want)) {
			t.Fatalf("case %d: engine %s %.6f, brute force %.6f", i, res.Status, res.Obj, want)
		}
		sol := m.Decode(res.X)
		if got := sol.Cost + s.DaysWeight*float64(sol.Finish); math.Abs(got-want) > 1e-6*math.Max(1, want) {
			t.Fatalf("case %d: decoded cost %.4f + finish %d does not give %.4f", i, sol.Cost, sol.Finish, want)
		}
		solved++
	}
	if solved < 20 {
		t.Fatalf("only %d feasible random cases; the generator is too tight to test anything", solved)
	}
}

func TestBuildReportsUnexplorableRow(t *testing.T) {
	s := &Spec{NumPoints: 2, PointZone: []int{0, 0}, HoursPerDay: 10,
		Zones: []Zone{{Name: "east slope"}}, Rigs: []Rig{{Name: "r"}},
		Options:   []Option{{Point: 0, Rig: 0}},
		CoverRows: [][]int{{1}},
	}
	if _, err := Build(s); err == nil {
		t.Fatal("want an error for a coverage row no option can meet")
	}
}
