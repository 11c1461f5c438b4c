package model

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// bruteForce enumerates every choice of options (at most one per point) and
// returns the least objective over feasible choices, computing the days and
// mobilization each choice forces. It is an independent check of Build: it
// reads the Spec, not the built program.
func bruteForce(s *Spec) (best float64, ok bool) {
	byPoint := make([][]int, s.NumPoints)
	for o, op := range s.Options {
		byPoint[op.Point] = append(byPoint[op.Point], o)
	}
	choice := make([]int, s.NumPoints) // -1 none, else option index
	best = math.Inf(1)
	var rec func(p int)
	rec = func(p int) {
		if p == s.NumPoints {
			if v, feas := evaluate(s, choice); feas && v < best {
				best, ok = v, true
			}
			return
		}
		choice[p] = -1
		rec(p + 1)
		for _, o := range byPoint[p] {
			choice[p] = o
			rec(p + 1)
		}
	}
	rec(0)
	return best, ok
}

func evaluate(s *Spec, choice []int) (float64, bool) {
	explored := func(p int) bool { return choice[p] >= 0 }
	for _, row := range s.CoverRows {
		hit := false
		for _, p := range row {
			hit = hit || explored(p)
		}
		if !hit {
			return 0, false
		}
	}
	for p := range choice {
		if s.Required != nil && s.Required[p] && !explored(p) {
			return 0, false
		}
	}
	count := make([]int, len(s.Zones))
	sampled := make([]int, len(s.Zones))
	hours := make([]float64, len(s.Rigs))
	used := make([]bool, len(s.Rigs))
	cost := 0.0
	for p, o := range choice {
		if o < 0 {
			continue
		}
		op := s.Options[o]
		z := s.PointZone[p]
		count[z]++
		if op.Sampled {
			sampled[z]++
		}
		hours[op.Rig] += op.Hours
		used[op.Rig] = true
		cost += op.Cost
	}
	for z, zn := range s.Zones {
		if count[z] < zn.MinCount || float64(sampled[z]) < zn.SampledShare*float64(count[z])-1e-9 {
			return 0, false
		}
	}
	finish := 0.0
	for r, rg := range s.Rigs {
		if !used[r] {
			continue
		}
		d := math.Ceil((hours[r]+rg.MobHours)/s.HoursPerDay - 1e-9)
		cost += rg.MobCost + d*rg.DayCost
		finish = math.Max(finish, d)
	}
	if s.MaxDays > 0 && finish > s.MaxDays {
		return 0, false
	}
	if s.Budget > 0 && cost > s.Budget+1e-6 {
		return 0, false
	}
	return cost + s.DaysWeight*finish, true
}

func randomSpec(rng *rand.Rand) *Spec {
	s := &Spec{NumPoints: 3 + rng.IntN(4), HoursPerDay: 10, DaysWeight: 0.01}
	nz := 1 + rng.IntN(2)
	for z := 0; z < nz; z++ {
		s.Zones = append(s.Zones, Zone{Name: string(rune('A' + z)), MinCount: rng.IntN(3), SampledShare: []float64{0, 0, 1.0 / 3, 0.5}[rng.IntN(4)]})
	}
	for r := 0; r < 2; r++ {
		s.Rigs = append(s.Rigs, Rig{Name: string(rune('r' + r)), MobCost: float64(500 + rng.IntN(2000)), MobHours: float64(rng.IntN(6)), DayCost: float64(100 + rng.IntN(400))})
	}
	s.PointZone = make([]int, s.NumPoints)
	for p := range s.PointZone {
		s.PointZone[p] = rng.IntN(nz)
		for r := range s.Rigs {
			for _, sampled := range []bool{true, false} {
				if rng.IntN(3) == 0 {
					continue
				}
				s.Options = append(s.Options, Option{Point: p, Rig: r, Sampled: sampled,
					Cost: float64(200 + rng.IntN(800)), Hours: float64(2 + rng.IntN(8)), Label: "o"})
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
		want, feasible := bruteForce(s)
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
