package candidates_test

import (
	"fmt"

	"github.com/rigmix/rigmix/optimizer/candidates"
	"github.com/rigmix/rigmix/optimizer/geom"
)

func ExampleGenerate() {
	// An invented 200 × 200 ft building pad with borings at most 100 ft
	// apart on a square pattern, and an 80-ft square no-go area (say, a
	// transformer pad) in its middle.
	pad := geom.Polygon{{X: 0, Y: 0}, {X: 200, Y: 0}, {X: 200, Y: 200}, {X: 0, Y: 200}}
	noGo := []geom.Polygon{{{X: 60, Y: 60}, {X: 140, Y: 60}, {X: 140, Y: 140}, {X: 60, Y: 140}}}
	l, err := candidates.Generate([]candidates.ZoneInput{{ID: "pad", Polygon: pad, SpacingFt: 100, Lattice: geom.Square}}, noGo, candidates.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	area := 0.0
	for _, c := range l.Cells {
		area += c.AreaFt2
	}
	fmt.Printf("radius %.1f ft, %d candidates, %d cells (%d uncoverable) of %.0f ft², %d covering rows\n",
		l.RadiusFt[0], len(l.Candidates), len(l.Cells), len(l.Uncoverable), area, len(l.RowCells))
	// Output: radius 70.7 ft, 28 candidates, 252 cells (4 uncoverable) of 39375 ft², 20 covering rows
}
