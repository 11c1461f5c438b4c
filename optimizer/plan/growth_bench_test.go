package plan

import (
	"context"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// BenchmarkPrepareGrowth times every stage before the search on generated
// sites (invented, scenarios/sitegen) of growing size: candidates and
// coverage cells with their row reduction, the rig calls, the zone
// covering numbers, the model build and the engine's presolve. Each stage
// is reported as a metric (ms per run) beside the number of candidates,
// so bench-growth.sh can fit how each grows; a step that grew like n²
// would show an exponent near 2 between sizes. The 1,000-acre case runs
// in a few seconds per iteration; use -benchtime 1x.
func BenchmarkPrepareGrowth(b *testing.B) {
	for _, tc := range []struct {
		name string
		site func() []byte
	}{
		{"acres=1", func() []byte { return sitegen.Site(1, 1) }},
		{"acres=10", func() []byte { return sitegen.Site(10, 1) }},
		{"acres=100", func() []byte { return sitegen.Site(100, 1) }},
		{"acres=1000", func() []byte { return sitegen.Site(1000, 1) }},
		{"miles=2", func() []byte { return sitegen.Corridor(2, 1) }},
		{"miles=20", func() []byte { return sitegen.Corridor(20, 1) }},
	} {
		b.Run(tc.name, func(b *testing.B) {
			in := generatedInput(b, tc.site())
			stages := map[string]time.Duration{}
			var pr *Prepared
			var presolve time.Duration
			runs := 0
			for b.Loop() {
				var err error
				pr, err = Prepare(context.Background(), in, Options{})
				if err != nil {
					b.Fatal(err)
				}
				for _, tm := range pr.Timings {
					stages[tm.Stage] += tm.Took
				}
				// A cancelled context stops the engine right after its
				// presolve (and the repair search that precedes the
				// first node), which is all that is timed here.
				ctx, cancel := context.WithCancel(context.Background())
				cancel()
				res, err := mip.Solve(ctx, pr.Model.Problem, mip.Options{})
				if err != nil {
					b.Fatal(err)
				}
				presolve += res.PresolveTime
				runs++
			}
			ms := func(d time.Duration) float64 { return float64(d) / float64(time.Millisecond) / float64(runs) }
			b.ReportMetric(float64(len(pr.Layout.Candidates)), "candidates")
			b.ReportMetric(float64(len(pr.Spec.CoverRows)), "cover-rows")
			b.ReportMetric(float64(pr.Model.Problem.LP.NumRows), "model-rows")
			for _, st := range []struct{ stage, metric string }{
				{"candidates and coverage cells", "cand-ms"},
				{"rig calls (one batch per rig)", "rigcalls-ms"},
				{"zone covering numbers", "cover-ms"},
				{"model build", "model-ms"},
			} {
				d, ok := stages[st.stage]
				if !ok {
					b.Fatalf("stage %q not timed", st.stage)
				}
				b.ReportMetric(ms(d), st.metric)
			}
			b.ReportMetric(ms(presolve), "presolve-ms")
		})
	}
}
