package model

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// bruteMode enumerates every choice (at most one option per point) and
// returns the least objective of the mode the spec selects, computing the
// days and mobilization each choice forces. It is an independent check of
// Build: it reads the Spec's rules, not the built program. The cost mode
// minimizes cost plus DaysWeight·finish over plans meeting every rule;
// MinimizeDays minimizes the finish over plans
// meeting every rule; MaximizeCoverage drops the coverage rows and the
// counts, keeps shares, required points, the budget and the day limit, and
// minimizes −100·(weighted area covered)/(total) + 0.01·cost/budget.
func bruteMode(s *Spec) (best float64, ok bool) {
	byPoint := make([][]int, s.NumPoints)
	for o, op := range s.Options {
		byPoint[op.Point] = append(byPoint[op.Point], o)
	}
	choice := make([]int, s.NumPoints)
	best = math.Inf(1)
	var rec func(p int)
	rec = func(p int) {
		if p == s.NumPoints {
			if v, feas := evaluateMode(s, choice); feas && v < best {
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

func evaluateMode(s *Spec, choice []int) (float64, bool) {
	explored := func(p int) bool { return choice[p] >= 0 }
	if !s.MaximizeCoverage {
		for _, row := range s.CoverRows {
			hit := false
			for _, p := range row {
				hit = hit || explored(p)
			}
			if !hit {
				return 0, false
			}
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
	need := make([]float64, len(s.Pooled))
	addUses := func(us []Use, times float64) {
		for _, u := range us {
			need[u.Item] += u.Amount * times
		}
	}
	for p, o := range choice {
		if o < 0 {
			continue
		}
		op := s.Options[o]
		count[s.PointZone[p]]++
		if op.Sampled {
			sampled[s.PointZone[p]]++
		}
		hours[op.Rig] += op.Hours
		used[op.Rig] = true
		cost += op.Cost
		addUses(op.Uses, 1)
	}
	for z, zn := range s.Zones {
		if !s.MaximizeCoverage && count[z] < zn.MinCount {
			return 0, false
		}
		if float64(sampled[z]) < zn.SampledShare*float64(count[z])-1e-9 {
			return 0, false
		}
	}
	finish := 0.0
	for r, rg := range s.Rigs {
		if !used[r] {
			continue
		}
		// Every field day opens with the start-up allowance.
		d := math.Ceil((hours[r]+rg.MobHours)/(s.HoursPerDay-s.StartUpHours) - 1e-9)
		cost += rg.MobCost + d*rg.DayCost
		finish = math.Max(finish, d)
		addUses(rg.MobUses, 1)
		addUses(rg.DayUses, d)
	}
	// As an estimate prices them: whole units bought, or the total
	// extended and rounded up to the cent.
	for i, it := range s.Pooled {
		if it.Whole {
			cost += math.Ceil(need[i]-1e-9) * it.Price
		} else {
			cost += math.Ceil(100*need[i]*it.Price-1e-6) / 100
		}
	}
	if s.MaxDays > 0 && finish > s.MaxDays {
		return 0, false
	}
	if s.Budget > 0 && cost > s.Budget+1e-6 {
		return 0, false
	}
	switch {
	case s.MinimizeDays:
		return finish, true
	case s.MaximizeCoverage:
		var all, got float64
		for _, c := range s.Cells {
			w := c.Weight
			if w == 0 {
				w = 1
			}
			all += w * c.AreaFt2
			for _, p := range c.Points {
				if explored(p) {
					got += w * c.AreaFt2
					break
				}
			}
		}
		return -100*got/all + 0.01*cost/s.Budget, true
	}
	return cost + s.DaysWeight*finish, true
}

// TestModesAgainstBruteForce solves random small specs in the two extra
// modes and checks the engine's optimum against exhaustive enumeration.
func TestModesAgainstBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	solved := map[string]int{}
	for i := 0; i < 80; i++ {
		s := randomSpec(rng)
		mode := "days"
		if i%2 == 1 {
			mode = "cover"
			s.MaximizeCoverage = true
			s.Budget = float64(1500 + rng.IntN(4000))
			for k := 0; k < 4; k++ {
				c := Cell{AreaFt2: float64(100 + rng.IntN(900)), Weight: []float64{0, 1, 2, 0.5}[rng.IntN(4)]}
				c.Points = []int{rng.IntN(s.NumPoints), rng.IntN(s.NumPoints)}
				s.Cells = append(s.Cells, c)
			}
		} else {
			s.MinimizeDays = true
			if rng.IntN(2) == 0 {
				s.Budget = float64(3000 + rng.IntN(6000))
			}
		}
		want, feasible := bruteMode(s)
		m, err := Build(s)
		if err != nil {
			if feasible {
				t.Fatalf("case %d (%s): Build: %v, but brute force found %g", i, mode, err, want)
			}
			continue
		}
		res, err := mip.Solve(context.Background(), m.Problem, mip.Options{})
		if err != nil {
			t.Fatalf("case %d: %v", i, err)
		}
		if !feasible {
			if res.Status != mip.Infeasible {
				t.Fatalf("case %d (%s): brute force finds no plan; engine %s %g", i, mode, res.Status, res.Obj)
			}
			continue
		}
		if res.Status != mip.Optimal || math.Abs(res.Obj-want) > 1e-6*math.Max(1, math.Abs(want)) {
			t.Fatalf("case %d (%s): engine %s %.8f, brute force %.8f", i, mode, res.Status, res.Obj, want)
		}
		solved[mode]++
	}
	if solved["days"] < 10 || solved["cover"] < 10 {
		t.Fatalf("too few feasible cases to test anything: %v", solved)
	}
}

// TestMaxCoverHandCase: two points, each covering one cell; a budget that
// buys one point. The better cell (weight × area 2 × 300 against 1 × 400)
// must be chosen and the objective is −100·600/1000 plus the tie-break
// 0.01·cost/budget (arithmetic by hand).
func TestMaxCoverHandCase(t *testing.T) {
	s := &Spec{NumPoints: 2, PointZone: []int{0, 0}, HoursPerDay: 10,
		Zones:   []Zone{{Name: "z", MinCount: 2}}, // the count is dropped in this form
		Rigs:    []Rig{{Name: "r", MobCost: 100, DayCost: 0}},
		Options: []Option{{Point: 0, Rig: 0, Cost: 500, Hours: 2, Label: "a"}, {Point: 1, Rig: 0, Cost: 500, Hours: 2, Label: "b"}},
		Cells:   []Cell{{AreaFt2: 300, Weight: 2, Points: []int{0}}, {AreaFt2: 400, Weight: 1, Points: []int{1}}},
		Budget:  700, MaximizeCoverage: true,
	}
	m, err := Build(s)
	if err != nil {
		t.Fatal(err)
	}
	res, err := mip.Solve(context.Background(), m.Problem, mip.Options{})
	if err != nil || res.Status != mip.Optimal {
		t.Fatalf("%v %v", res.Status, err)
	}
	want := -100*600.0/1000 + 0.01*600/700
	if math.Abs(res.Obj-want) > 1e-9 {
		t.Fatalf("objective %.9f, want %.9f", res.Obj, want)
	}
	sol := m.Decode(res.X)
	if len(sol.Chosen) != 1 || sol.Chosen[0] != 0 {
		t.Fatalf("chosen %v, want option 0", sol.Chosen)
	}
	if _, err := Build(&Spec{NumPoints: 0, HoursPerDay: 10, MaximizeCoverage: true, Cells: s.Cells}); err == nil {
		t.Fatal("want an error for the maximal covering form without a budget")
	}
}
