package geom_test

import (
	"fmt"

	"github.com/rigmix/rigmix/optimizer/geom"
)

func ExamplePolygon_Area() {
	// An L-shaped building pad: a 20 × 10 ft bar with a 10 × 20 ft bar on
	// its west end (shoelace formula, hand computation: 400 ft²).
	pad := geom.Polygon{{X: 0, Y: 0}, {X: 20, Y: 0}, {X: 20, Y: 10}, {X: 10, Y: 10}, {X: 10, Y: 30}, {X: 0, Y: 30}}
	fmt.Println(pad.Area(), pad.IsSimple() == nil, pad.Contains(geom.Point{X: 15, Y: 20}))
	// Output: 400 true false
}

func ExampleCoveringRadius() {
	fmt.Printf("%.2f %.2f\n", geom.CoveringRadius(geom.Square, 100), geom.CoveringRadius(geom.Triangular, 100))
	// Output: 70.71 57.74
}
