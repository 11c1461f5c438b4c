package tradeoff_test

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/tradeoff"
)

// A 400 ft square explored on a 50 ft square grid: the chance of hitting a
// 20 ft buried tank is π·20²/(4·50²) ≈ 0.126 (Davis, Statistics and Data
// Analysis in Geology, ch. 5).
func ExampleHitProbability() {
	zone := geom.Polygon{{X: 0, Y: 0}, {X: 400, Y: 0}, {X: 400, Y: 400}, {X: 0, Y: 400}}
	var pts []geom.Point
	for x := 25.0; x < 400; x += 50 {
		for y := 25.0; y < 400; y += 50 {
			pts = append(pts, geom.Point{X: x, Y: y})
		}
	}
	h := tradeoff.HitProbability(zone, pts, 20)
	fmt.Printf("hit %.3f (closed form %.3f), miss %.3f\n", h.Probability, math.Pi*20*20/(4*50*50), 1-h.Probability)
	// Output: hit 0.126 (closed form 0.126), miss 0.874
}
