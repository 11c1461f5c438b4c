package candidates

import (
	"fmt"
	"math"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// benchSite is an invented square site of the given acreage (43,560 ft² an
// acre) with one 100-ft square spacing rule, a building pad with its own
// 50-ft rule, and a pond as a no-go area — demo geometry, not a real site.
func benchSite(acres float64) ([]ZoneInput, []geom.Polygon) {
	side := math.Sqrt(acres * 43560)
	pad := side / 4
	zones := []ZoneInput{
		{ID: "site", Polygon: geom.Polygon{{X: 0, Y: 0}, {X: side, Y: 0}, {X: side, Y: side}, {X: 0, Y: side}}, SpacingFt: 100},
		{ID: "pad", Polygon: square(side/8, side/8, side/8+pad, side/8+pad), SpacingFt: 50, Corners: true},
	}
	pond := square(side*0.6, side*0.6, side*0.8, side*0.7)
	return zones, []geom.Polygon{pond}
}

func BenchmarkGenerate(b *testing.B) {
	for _, tc := range []struct {
		acres float64
		opt   Options
		name  string
	}{
		{1, Options{}, ""}, {10, Options{}, ""}, {100, Options{}, ""}, {1000, Options{}, ""},
		{100, Options{CellFraction: 0.125}, ",cells=s/8"},
	} {
		b.Run(fmt.Sprintf("acres=%g%s", tc.acres, tc.name), func(b *testing.B) {
			zones, noGo := benchSite(tc.acres)
			var l *Layout
			for b.Loop() {
				var err error
				if l, err = Generate(zones, noGo, tc.opt); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(len(l.Candidates)), "candidates")
			b.ReportMetric(float64(len(l.Cells)+len(l.Uncoverable)), "cells")
			b.ReportMetric(float64(len(l.RowCells)), "rows")
		})
	}
}
