package model

import (
	"context"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// meetsRows reports whether x meets every row and bound of the program
// (to 1e-6) and is integral where the program asks.
func meetsRows(t *testing.T, m *Model, x []float64) bool {
	t.Helper()
	p := &m.Problem.LP
	act := make([]float64, p.NumRows)
	for j := 0; j < p.NumCols; j++ {
		if x[j] < p.ColLo[j]-1e-6 || x[j] > p.ColUp[j]+1e-6 {
			t.Logf("column %s = %g outside [%g, %g]", m.Problem.ColNames[j], x[j], p.ColLo[j], p.ColUp[j])
			return false
		}
		if m.Problem.Integer[j] && math.Abs(x[j]-math.Round(x[j])) > 1e-9 {
			t.Logf("column %s = %g is not whole", m.Problem.ColNames[j], x[j])
			return false
		}
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			act[p.RowIndex[k]] += p.Value[k] * x[j]
		}
	}
	for i, a := range act {
		if a < p.RowLo[i]-1e-6 || a > p.RowUp[i]+1e-6 {
			t.Logf("row %s = %g outside [%g, %g]", m.Problem.RowNames[i], a, p.RowLo[i], p.RowUp[i])
			return false
		}
	}
	return true
}

// TestSplitCrewsGivesAFasterPlan: sharing an optimal plan's work among a
// rig's three crews gives column values (StartFor) that meet every row of
// the program, on the same points, finishing no later; and StartFor of the
// optimal plan's own options reproduces its cost.
func TestSplitCrewsGivesAFasterPlan(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 8))
	checked := 0
	for i := 0; i < 40; i++ {
		s := randomSpec(rng)
		if len(s.Rigs) > 2 {
			continue // randomSpec added a crew; add ours below
		}
		s.Required = make([]bool, s.NumPoints)
		for p := range s.Required {
			s.Required[p] = true // every point worked: work to share
		}
		for k := 2; k <= 3; k++ {
			c := s.Rigs[0]
			c.Name, c.Unit = "r"+string(rune('0'+k)), k
			s.Rigs = append(s.Rigs[:k-1], append([]Rig{c}, s.Rigs[k-1:]...)...)
		}
		// Rig 1 moved to index 3: renumber its options, and give crews
		// 2 and 3 the options of crew 1.
		var opts []Option
		for _, op := range s.Options {
			if op.Rig == 1 {
				op.Rig = 3
			}
			opts = append(opts, op)
		}
		s.Options = nil
		for p := 0; p < s.NumPoints; p++ {
			for r := 0; r < 4; r++ {
				for _, op := range opts {
					src := r
					if r == 1 || r == 2 {
						src = 0
					}
					if op.Point == p && op.Rig == src {
						op.Rig = r
						s.Options = append(s.Options, op)
					}
				}
			}
		}
		m, err := Build(s)
		if err != nil {
			continue
		}
		res, err := mip.Solve(context.Background(), m.Problem, mip.Options{})
		if err != nil || res.X == nil {
			continue
		}
		sol := m.Decode(res.X)
		own := m.StartFor(sol.Chosen)
		if !meetsRows(t, m, own) {
			t.Fatalf("case %d: StartFor of the optimal plan breaks a row", i)
		}
		// Up to one cent: the engine's feasibility tolerance, applied to
		// scaled rows, can let a cents column sit one unit under its
		// exact ceiling on a random model (seen once, case 13; the plan
		// tests hold the estimate to the objective within half a cent on
		// every demo and generated site).
		if got := m.Decode(own).Cost; math.Abs(got-sol.Cost) > 0.01+1e-6 {
			t.Errorf("case %d: StartFor of the optimal plan costs %.4f, the plan %.4f", i, got, sol.Cost)
		}
		split := m.StartFor(m.SplitCrews(sol.Chosen))
		if !meetsRows(t, m, split) {
			t.Fatalf("case %d: the plan shared among crews breaks a row", i)
		}
		if f := m.Decode(split).Finish; f > sol.Finish {
			t.Errorf("case %d: shared among crews the plan finishes in %d days, alone in %d", i, f, sol.Finish)
		}
		checked++
	}
	if checked < 10 {
		t.Fatalf("only %d cases checked", checked)
	}
}
