package tradeoff

import (
	"context"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// generatedInput loads a generated site (invented, scenarios/sitegen) with
// its rate book and the built-in rigs in-process.
func generatedInput(t testing.TB, data []byte) plan.Input {
	t.Helper()
	sc, err := scenarios.Parse(data, "generated.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	return scenarioInput(t, sc)
}

// BenchmarkAnalyzeGenerated runs the whole trade-off analysis with the
// default settings on generated sites of growing size and reports each
// stage's wall time (s per run): the cheapest plan (new), the frontier
// with the alternatives, the budget curve and the rule costs. The
// 1,000-acre site takes minutes; it runs only with -long.
//
//	go test ./optimizer/tradeoff -run '^$' -bench AnalyzeGenerated -benchtime 1x
func BenchmarkAnalyzeGenerated(b *testing.B) {
	sizes := []float64{10, 100}
	if *long {
		sizes = append(sizes, 1000)
	}
	for _, acres := range sizes {
		b.Run(fmtAcres(acres), func(b *testing.B) {
			in := generatedInput(b, sitegen.Site(acres, 1))
			stages := map[string]time.Duration{}
			runs := 0
			for b.Loop() {
				ctx := context.Background()
				t0 := time.Now()
				a, err := New(ctx, Config{Input: in})
				if err != nil {
					b.Fatal(err)
				}
				t1 := time.Now()
				if _, err := a.Alternatives(ctx); err != nil {
					b.Fatal(err)
				}
				t2 := time.Now()
				if _, err := a.BudgetCurve(ctx); err != nil {
					b.Fatal(err)
				}
				t3 := time.Now()
				rc, err := a.RuleCosts(ctx)
				if err != nil {
					b.Fatal(err)
				}
				t4 := time.Now()
				stages["new"] += t1.Sub(t0)
				stages["alternatives"] += t2.Sub(t1)
				stages["budget"] += t3.Sub(t2)
				stages["rules"] += t4.Sub(t3)
				runs++
				b.ReportMetric(float64(len(rc)), "rules")
			}
			for k, d := range stages {
				b.ReportMetric(d.Seconds()/float64(runs), k+"-s")
			}
		})
	}
}

func fmtAcres(a float64) string {
	switch a {
	case 10:
		return "acres=10"
	case 100:
		return "acres=100"
	}
	return "acres=1000"
}
