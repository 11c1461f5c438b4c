package tradeoff

import (
	"context"
	"testing"

	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// BenchmarkAnalyze runs the whole trade-off analysis — alternatives with
// every demo rate book, frontier, budget curve and rule costs — with the
// default settings on each demo scenario. The target is under 30 s each on
// the 2-core reference machine; figures are recorded in README.md.
//
//	go test ./optimizer/tradeoff -run '^$' -bench Analyze -benchtime 1x
func BenchmarkAnalyze(b *testing.B) {
	var books []*ratebooks.RateBook
	for _, n := range ratebooks.Demos() {
		rb, err := ratebooks.Open(n)
		if err != nil {
			b.Fatal(err)
		}
		books = append(books, rb)
	}
	for _, name := range scenarios.Demos() {
		b.Run(name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				an, err := Analyze(context.Background(), Config{Input: demoInput(b, name), RateBooks: books})
				if err != nil {
					b.Fatal(err)
				}
				b.ReportMetric(float64(len(an.RuleCosts)), "rules")
				b.ReportMetric(float64(len(an.Frontier.Swept)), "frontier-solves")
			}
		})
	}
}
