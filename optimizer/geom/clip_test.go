package geom

import (
	"math"
	"testing"
)

func TestClipToRect(t *testing.T) {
	// Hand computation (shoelace formula on the clipped pieces): the L is
	// a 20 × 10 bar on the bottom plus a 10 × 20 bar on its west end.
	u := Polygon{{0, 0}, {30, 0}, {30, 30}, {20, 30}, {20, 10}, {10, 10}, {10, 30}, {0, 30}}
	tests := []struct {
		name string
		p    Polygon
		r    Rect
		want float64
	}{
		{"L, box over the corner", lShape, Rect{Point{5, 5}, Point{15, 15}}, 75},           // 10×10 minus the 5×5 notch part
		{"L, box in the notch", lShape, Rect{Point{12, 12}, Point{18, 18}}, 0},             // no overlap
		{"L, box covering all", lShape, Rect{Point{-1, -1}, Point{40, 40}}, 400},           // whole L
		{"L, box across both bars", lShape, Rect{Point{5, 0}, Point{15, 30}}, 5*30 + 5*10}, // west bar part 5×30, east part 5×10
		{"U, band across both arms", u, Rect{Point{-5, 20}, Point{35, 25}}, 2 * 10 * 5},    // two separate pieces
		{"triangle, half", tri345, Rect{Point{0, 0}, Point{2, 3}}, 6 - 1.5},                // right of x=2 is a triangle 2 × 1.5 / 2
		{"rectangle, edge-touching box", rect30x20, Rect{Point{30, 0}, Point{40, 20}}, 0},
	}
	for _, tc := range tests {
		got := tc.p.ClipToRect(tc.r).Area()
		if !near(got, tc.want, 1e-9) {
			t.Errorf("%s: clipped area %v, want %v", tc.name, got, tc.want)
		}
	}
}

// TestClipTiling checks that the clipped areas over a tiling of the
// bounding box add up to the polygon's area — the property the coverage
// cells rely on.
func TestClipTiling(t *testing.T) {
	u := Polygon{{0, 0}, {300, 0}, {300, 300}, {200, 300}, {200, 100}, {100, 100}, {100, 300}, {0, 300}}
	star := Polygon{}
	for k := 0; k < 10; k++ {
		r := 100.0
		if k%2 == 1 {
			r = 40
		}
		a := float64(k) * math.Pi / 5
		star = append(star, Point{r * math.Cos(a), r * math.Sin(a)})
	}
	for _, p := range []Polygon{u, lShape, tri345, star, clockL} {
		b := p.Bounds()
		for _, s := range []float64{7, 23.5, 1000} {
			sum := 0.0
			for _, c := range SquareLattice(b.Expand(s), s, b.Min) {
				sum += p.ClipToRect(Rect{c, Point{c.X + s, c.Y + s}}).Area()
			}
			if !near(sum, p.Area(), 1e-9*p.Area()) {
				t.Errorf("tiles of %v over %v sum to %v, area %v", s, p[:3], sum, p.Area())
			}
		}
	}
}
