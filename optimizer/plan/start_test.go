package plan

import (
	"context"
	"math"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// feasible evaluates x against every bound, row and integrality of p.
func feasible(p *mip.Problem, x []float64) (float64, bool) {
	q := &p.LP
	if len(x) != q.NumCols {
		return 0, false
	}
	act := make([]float64, q.NumRows)
	obj := p.ObjOffset
	for j := 0; j < q.NumCols; j++ {
		if x[j] < q.ColLo[j]-1e-6 || x[j] > q.ColUp[j]+1e-6 || (p.Integer[j] && math.Abs(x[j]-math.Round(x[j])) > 1e-6) {
			return 0, false
		}
		obj += q.Obj[j] * x[j]
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			act[q.RowIndex[k]] += q.Value[k] * x[j]
		}
	}
	for i, a := range act {
		if a < q.RowLo[i]-1e-6*(1+math.Abs(q.RowLo[i])) || a > q.RowUp[i]+1e-6*(1+math.Abs(q.RowUp[i])) {
			return 0, false
		}
	}
	return obj, true
}

func generatedInput(t testing.TB, data []byte) Input {
	t.Helper()
	sc, err := scenarios.Parse(data, "generated.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	return scenarioInput(t, sc)
}

// TestStartSolutionIsAPlan: the start built from the zone covers meets
// every row of the full model, and on the demos, solved to proven
// optimality, the solve from the start ends at the same optimum as the
// solve without it.
func TestStartSolutionIsAPlan(t *testing.T) {
	cases := map[string]func(*testing.T) Input{
		"gen-10ac": func(t *testing.T) Input { return generatedInput(t, sitegen.Site(10, 3)) },
		"gen-2mi":  func(t *testing.T) Input { return generatedInput(t, sitegen.Corridor(2, 3)) },
		"midrise":  func(t *testing.T) Input { return demoInput(t, "midrise") },
		"wetlot":   func(t *testing.T) Input { return demoInput(t, "wetlot") },
		"hillside": func(t *testing.T) Input { return demoInput(t, "hillside") },
	}
	for _, name := range []string{"gen-10ac", "gen-2mi", "midrise", "wetlot", "hillside"} {
		t.Run(name, func(t *testing.T) {
			ctx := context.Background()
			pr, err := Prepare(ctx, cases[name](t), Options{})
			if err != nil {
				t.Fatal(err)
			}
			start := pr.StartSolution(ctx, 1e-3, 0)
			if start == nil {
				t.Fatal("no start solution")
			}
			sObj, ok := feasible(pr.Model.Problem, start)
			if !ok {
				t.Fatal("the start breaks a row, bound or integrality of the full model")
			}
			if name[:3] == "gen" {
				res, err := mip.Solve(ctx, pr.Model.Problem, mip.Options{GapRel: 0.01, Start: start, NodeLimit: 200})
				if err != nil || res.X == nil {
					t.Fatalf("solve from the start: %v %v", res.Status, err)
				}
				if res.Obj > sObj+1e-6 || res.Bound > sObj+1e-6 {
					t.Fatalf("solve from a start of %.2f ended at %.2f (bound %.2f)", sObj, res.Obj, res.Bound)
				}
				t.Logf("start %.2f, solve %.2f, bound %.2f", sObj, res.Obj, res.Bound)
				return
			}
			without, err := mip.Solve(ctx, pr.Model.Problem, mip.Options{})
			if err != nil || without.Status != mip.Optimal {
				t.Fatalf("solve without a start: %v %v", without.Status, err)
			}
			with, err := mip.Solve(ctx, pr.Model.Problem, mip.Options{Start: start})
			if err != nil || with.Status != mip.Optimal {
				t.Fatalf("solve with the start: %v %v", with.Status, err)
			}
			if math.Abs(with.Obj-without.Obj) > 1e-6*math.Max(1, math.Abs(without.Obj)) {
				t.Fatalf("optimum %.6f with the start, %.6f without", with.Obj, without.Obj)
			}
			if sObj < without.Obj-1e-6*math.Max(1, math.Abs(without.Obj)) {
				t.Fatalf("the start %.6f is below the proven optimum %.6f", sObj, without.Obj)
			}
			t.Logf("start %.2f, optimum %.2f (%.2f%% above)", sObj, without.Obj, 100*(sObj-without.Obj)/without.Obj)
		})
	}
}
