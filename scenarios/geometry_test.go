package scenarios

import (
	"math"
	"math/rand"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// pg builds a polygon from x, y pairs.
func pg(xy ...float64) geom.Polygon {
	p := make(geom.Polygon, len(xy)/2)
	for i := range p {
		p[i] = geom.Point{X: xy[2*i], Y: xy[2*i+1]}
	}
	return p
}

func sq(x0, y0, x1, y1 float64) geom.Polygon {
	return pg(x0, y0, x1, y0, x1, y1, x0, y1)
}

// Plane-geometry cases worked by hand.
func TestOverlaps(t *testing.T) {
	tests := []struct {
		name string
		a, b geom.Polygon
		want bool
	}{
		{"shared edge", sq(0, 0, 10, 10), sq(10, 0, 20, 10), false},
		{"shared corner", sq(0, 0, 10, 10), sq(10, 10, 20, 20), false},
		{"apart", sq(0, 0, 10, 10), sq(30, 0, 40, 10), false},
		{"crossing", sq(0, 0, 10, 10), sq(5, 5, 15, 15), true},
		{"identical", sq(0, 0, 10, 10), sq(0, 0, 10, 10), true},
		{"nested", sq(0, 0, 10, 10), sq(2, 2, 4, 4), true},
		{"cross shape", sq(0, 4, 10, 6), sq(4, 0, 6, 10), true},
		{"partial shared edge", sq(0, 0, 10, 10), sq(10, 5, 20, 15), false},
	}
	for _, tc := range tests {
		if got := overlaps(tc.a, tc.b); got != tc.want {
			t.Errorf("%s: overlaps = %v, want %v", tc.name, got, tc.want)
		}
		if got := overlaps(tc.b, tc.a); got != tc.want {
			t.Errorf("%s (swapped): overlaps = %v, want %v", tc.name, got, tc.want)
		}
	}
}

func TestWithinAndSimple(t *testing.T) {
	outer := pg(0, 0, 10, 0, 10, 10, 5, 5, 0, 10) // notched at the top
	if !within(sq(1, 1, 9, 4), outer) {
		t.Error("box below the notch should be within")
	}
	if within(sq(1, 1, 9, 6), outer) {
		t.Error("box reaching into the notch should not be within")
	}
	if within(sq(0, 0, 10, 10), sq(1, 1, 9, 9)) {
		t.Error("larger square within smaller")
	}
	if i, _ := selfIntersection(pg(0, 0, 10, 10, 10, 0, 0, 10)); i < 0 {
		t.Error("bow tie reported simple")
	}
	if i, _ := selfIntersection(outer); i >= 0 {
		t.Error("notched polygon reported self-intersecting")
	}
	if k := foldBack(pg(0, 0, 10, 0, 5, 0, 5, 5)); k < 0 {
		t.Error("fold-back not found")
	}
	if a := area(sq(0, 0, 3, 4)); a != 12 {
		t.Errorf("area = %g, want 12", a)
	}
	// Interior point of an L shape must be inside it.
	l := pg(0, 0, 10, 0, 10, 2, 2, 2, 2, 10, 0, 10)
	if p, ok := interiorPoint(l); !ok || !strictlyInside(l, p) {
		t.Errorf("interior point %v, %v", p, ok)
	}
}

func TestCoveredBy(t *testing.T) {
	zone := sq(0, 0, 100, 100)
	if !coveredBy(zone, []geom.Polygon{sq(-1, -1, 101, 101)}) {
		t.Error("zone inside a larger no-go not covered")
	}
	if !coveredBy(zone, []geom.Polygon{sq(0, 0, 50, 100), sq(50, 0, 100, 100)}) {
		t.Error("two halves together not covering")
	}
	if coveredBy(zone, []geom.Polygon{sq(0, 0, 90, 100)}) {
		t.Error("a 10 ft strip is left, but reported covered")
	}
	if coveredBy(zone, nil) {
		t.Error("no no-go areas cover nothing")
	}
}

// BenchmarkSimpleRing times the simplicity check on a 10,000-vertex ring,
// the most a polygon may have.
func BenchmarkSimpleRing(b *testing.B) {
	const n = 10000
	p := make(geom.Polygon, n)
	for i := range p {
		a := 2 * math.Pi * float64(i) / n
		p[i] = geom.Point{X: 1000 * math.Cos(a), Y: 1000 * math.Sin(a)}
	}
	for b.Loop() {
		if i, _ := selfIntersection(p); i >= 0 {
			b.Fatal("circle reported self-intersecting")
		}
	}
}

// TestSelfIntersectionSweep compares the sweep with the plain all-pairs
// check on seeded random rings, many of them self-intersecting.
func TestSelfIntersectionSweep(t *testing.T) {
	brute := func(p geom.Polygon) (int, int) {
		n := len(p)
		for i := 0; i < n; i++ {
			for j := i + 1; j < n; j++ {
				if j == i+1 || (i == 0 && j == n-1) {
					continue
				}
				if segmentsTouch(p[i], p[(i+1)%n], p[j], p[(j+1)%n]) {
					return i, j
				}
			}
		}
		return -1, -1
	}
	rng := rand.New(rand.NewSource(7))
	simple := 0
	for k := 0; k < 2000; k++ {
		n := 3 + rng.Intn(12)
		p := make(geom.Polygon, n)
		for i := range p {
			if k%2 == 0 { // star-shaped around the origin: often simple
				a := 2 * math.Pi * (float64(i) + rng.Float64()*0.9) / float64(n)
				r := 10 + 90*rng.Float64()
				p[i] = geom.Point{X: math.Round(r * math.Cos(a)), Y: math.Round(r * math.Sin(a))}
			} else { // random vertices on a coarse grid: touching cases
				p[i] = geom.Point{X: float64(rng.Intn(6)), Y: float64(rng.Intn(6))}
			}
		}
		gi, gj := selfIntersection(p)
		wi, wj := brute(p)
		if gi != wi || gj != wj {
			t.Fatalf("ring %v: sweep (%d, %d), all pairs (%d, %d)", p, gi, gj, wi, wj)
		}
		if gi < 0 {
			simple++
		}
	}
	if simple == 0 || simple == 2000 {
		t.Errorf("%d of 2000 rings simple; the test needs both kinds", simple)
	}
}
