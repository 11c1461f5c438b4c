package lp_test

import (
	"os"
	"path/filepath"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/lp"
	"github.com/rigmix/rigmix/optimizer/mip"
)

// planModels are whole-plan models written by the planner as free MPS;
// they are not in the repository (too large) and are read from
// /work/notes/models when present.
var planModels = []string{"gen-100ac", "gen-20mi", "gen-1000ac"}

const planModelDir = "/work/notes/models"

func readPlanModel(b *testing.B, name string) *lp.Problem {
	b.Helper()
	path := filepath.Join(planModelDir, name+".mps")
	f, err := os.Open(path)
	if err != nil {
		b.Skipf("plan model %s not found (%v); these benchmarks need the planner's MPS files in %s", name, err, planModelDir)
	}
	defer f.Close()
	p, err := mip.ReadMPS(f)
	if err != nil {
		b.Fatalf("%s: %v", path, err)
	}
	return &p.LP
}

// BenchmarkPlanModelRootLP solves the LP relaxation of whole-plan models
// from the slack basis and reports the iterations and the objective.
func BenchmarkPlanModelRootLP(b *testing.B) {
	for _, name := range planModels {
		b.Run(name, func(b *testing.B) {
			p := readPlanModel(b, name)
			var r *lp.Result
			c0 := lp.ProcessCPU()
			for b.Loop() {
				t0, c1 := time.Now(), lp.ProcessCPU()
				var err error
				r, err = lp.Solve(p, lp.Options{})
				if err != nil || r.Status != lp.Optimal {
					b.Fatalf("%s: status %v, err %v", name, r.Status, err)
				}
				b.Logf("%s: %d iterations, objective %.15g, wall %v, cpu %v", name, r.Iterations, r.Obj, time.Since(t0), lp.ProcessCPU()-c1)
			}
			b.ReportMetric(float64(lp.ProcessCPU()-c0)/1e6/float64(b.N), "cpu-ms/op")
			b.ReportMetric(float64(r.Iterations), "iters")
			b.ReportMetric(r.Obj, "obj")
		})
	}
}
