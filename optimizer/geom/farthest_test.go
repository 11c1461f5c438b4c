package geom

import (
	"math"
	"math/rand/v2"
	"testing"
)

// rotated returns p turned by deg degrees about the origin.
func rotated(p Polygon, deg float64) Polygon {
	s, c := math.Sincos(deg * math.Pi / 180)
	out := make(Polygon, len(p))
	for i, v := range p {
		out[i] = Point{c*v.X - s*v.Y, s*v.X + c*v.Y}
	}
	return out
}

// sampledFarthest is the independent check: the largest distance to the
// nearest site over a dense square grid of step h on the ground, plus
// points every h along every ground edge.
func sampledFarthest(g Ground, sites []Point, h float64) float64 {
	best := 0.0
	try := func(q Point) {
		if !g.Contains(q) {
			return
		}
		d := math.Inf(1)
		for _, s := range sites {
			d = math.Min(d, q.Dist(s))
		}
		best = math.Max(best, d)
	}
	b := g.Outline.Bounds()
	for y := b.Min.Y; y <= b.Max.Y+1e-9; y += h {
		for x := b.Min.X; x <= b.Max.X+1e-9; x += h {
			try(Point{x, y})
		}
	}
	for _, e := range g.edges() {
		n := int(math.Ceil(e.Len()/h)) + 1
		for k := 0; k <= n; k++ {
			t := float64(k) / float64(n)
			try(Point{e.A.X + t*(e.B.X-e.A.X), e.A.Y + t*(e.B.Y-e.A.Y)})
		}
	}
	return best
}

func TestFarthestHandWorked(t *testing.T) {
	sq := Polygon{{0, 0}, {100, 0}, {100, 100}, {0, 100}}
	// A lattice laid well past the square, so the square's edges do not
	// matter and the farthest ground is the lattice's own hole.
	lattice := func(kind string, s float64) []Point {
		return Lattice(kind, Rect{Point{-3 * s, -3 * s}, Point{100 + 3*s, 100 + 3*s}}, s, Point{0.5, 0.25})
	}
	strip := Polygon{{0, 0}, {900, 0}, {900, 40}, {0, 40}}
	tests := []struct {
		name  string
		g     Ground
		sites []Point
		want  float64
		// source of the expected value
		why string
	}{
		{"square, one centre point", Ground{Outline: sq}, []Point{{50, 50}}, 50 * math.Sqrt2,
			"plane geometry: the corners of a square of side a are a/√2 from its centre"},
		{"square lattice s=20", Ground{Outline: sq}, lattice(Square, 20), 20 / math.Sqrt2,
			"covering radius of the square lattice, s/√2 (half a square's diagonal)"},
		{"triangular lattice s=20", Ground{Outline: sq}, lattice(Triangular, 20), 20 / math.Sqrt(3),
			"covering radius of the triangular lattice, s/√3 (circumradius of the equilateral triangle)"},
		{"strip with two end points", Ground{Outline: strip}, []Point{{0, 20}, {900, 20}}, math.Hypot(450, 20),
			"Pythagoras: the middle of a long edge is 450 ft along and 20 ft across from each end point"},
		{"square, corner point", Ground{Outline: sq}, []Point{{0, 0}}, 100 * math.Sqrt2,
			"the opposite corner, the diagonal a√2"},
		{"hole takes the far half", Ground{Outline: sq, Holes: []Polygon{{{50, -10}, {110, -10}, {110, 110}, {50, 110}}}},
			[]Point{{0, 50}}, math.Hypot(50, 50), "the ground is the west half; its farthest spots are (50, 0) and (50, 100), on the hole's edge"},
		{"site outside the ground", Ground{Outline: sq}, []Point{{-100, 50}}, math.Hypot(200, 50),
			"the far corners (100, 0) and (100, 100)"},
	}
	for _, tc := range tests {
		for _, deg := range []float64{0, 4, 30, 45, 90} {
			g := Ground{Outline: rotated(tc.g.Outline, deg)}
			for _, h := range tc.g.Holes {
				g.Holes = append(g.Holes, rotated(h, deg))
			}
			sites := rotated(tc.sites, deg)
			got := Farthest(g, sites)
			if math.Abs(got.Dist-tc.want) > 1e-6 {
				t.Errorf("%s at %g°: farthest %.6f ft, want %.6f (%s)", tc.name, deg, got.Dist, tc.want, tc.why)
			}
			if !g.Contains(got.At) {
				t.Errorf("%s at %g°: farthest spot %v is not on the ground", tc.name, deg, got.At)
			}
			if d := got.At.Dist(sites[got.Site]); math.Abs(d-got.Dist) > 1e-6 || got.Site != nearestSite(got.At, sites) && math.Abs(d-got.At.Dist(sites[nearestSite(got.At, sites)])) > 1e-6 {
				t.Errorf("%s at %g°: spot %v is %.6f ft from site %d, reported %.6f", tc.name, deg, got.At, d, got.Site, got.Dist)
			}
		}
	}
	if s := Farthest(Ground{Outline: sq}, nil); !math.IsInf(s.Dist, 1) {
		t.Errorf("no sites: farthest %v, want +Inf", s.Dist)
	}
}

// TestFarthestTiltedStrip is the case that fooled cell centres: a strip
// 900 × 40 ft at 4° with two points 644 ft apart. Checked against dense
// sampling (1-ft grid and edges).
func TestFarthestTiltedStrip(t *testing.T) {
	strip := rotated(Polygon{{0, 0}, {900, 0}, {900, 40}, {0, 40}}, 4)
	sites := rotated([]Point{{128, 20}, {772, 20}}, 4)
	g := Ground{Outline: strip}
	got := Farthest(g, sites).Dist
	want := sampledFarthest(g, sites, 1)
	if got < want-1e-9 || got > want+1 {
		t.Fatalf("farthest %.3f ft; dense sampling %.3f ft", got, want)
	}
	// Hand check: midway between the points, on a long edge, is 322 ft
	// along and 20 ft across (the ends are only 128 ft along).
	if math.Abs(got-math.Hypot(322, 20)) > 1e-6 {
		t.Fatalf("farthest %.6f ft, want √(322² + 20²) = %.6f", got, math.Hypot(322, 20))
	}
}

// randomStar is a random simple polygon: vertices at sorted random angles
// around c with random radii in [r/3, r].
func randomStar(rng *rand.Rand, c Point, r float64, n int) Polygon {
	angles := make([]float64, n)
	for i := range angles {
		angles[i] = (float64(i) + 0.8*rng.Float64()) * 2 * math.Pi / float64(n)
	}
	p := make(Polygon, n)
	for i, a := range angles {
		rr := r * (1.0/3 + 2.0/3*rng.Float64())
		p[i] = Point{c.X + rr*math.Cos(a), c.Y + rr*math.Sin(a)}
	}
	return p
}

// TestFarthestAgainstSampling is the property test: on random star-shaped
// zones (concave), with random no-go holes and random sites inside and out,
// the exact farthest distance is never below what dense sampling finds,
// and exceeds it by no more than the sampling step.
func TestFarthestAgainstSampling(t *testing.T) {
	rng := rand.New(rand.NewPCG(13, 7))
	for trial := 0; trial < 60; trial++ {
		out := randomStar(rng, Point{0, 0}, 100, 3+rng.IntN(12))
		g := Ground{Outline: out}
		for k := rng.IntN(3); k > 0; k-- {
			c := Point{rng.Float64()*120 - 60, rng.Float64()*120 - 60}
			g.Holes = append(g.Holes, randomStar(rng, c, 10+30*rng.Float64(), 3+rng.IntN(6)))
		}
		n := 1 + rng.IntN(25)
		sites := make([]Point, n)
		for i := range sites {
			sites[i] = Point{rng.Float64()*240 - 120, rng.Float64()*240 - 120}
		}
		if trial%5 == 0 { // coincident and collinear sites
			sites = append(sites, sites[0], Point{sites[0].X + 10, sites[0].Y}, Point{sites[0].X + 20, sites[0].Y})
		}
		const h = 0.5
		got := Farthest(g, sites)
		want := sampledFarthest(g, sites, h)
		if got.Dist < want-1e-7 || got.Dist > want+h {
			t.Fatalf("trial %d: exact %.4f ft, dense sampling (step %g) %.4f ft", trial, got.Dist, h, want)
		}
		if !g.Contains(got.At) {
			t.Fatalf("trial %d: spot %v not on the ground", trial, got.At)
		}
		nd := got.At.Dist(sites[nearestSite(got.At, sites)])
		if math.Abs(nd-got.Dist) > 1e-6 {
			t.Fatalf("trial %d: spot %v is %.6f from its nearest site, reported %.6f", trial, got.At, nd, got.Dist)
		}
		// Each site's own maximum is no farther than the overall one and is
		// really nearest to that site.
		for i, s := range FarthestBySite(g, sites) {
			if s.Site < 0 {
				continue
			}
			if s.Dist > got.Dist+1e-9 {
				t.Fatalf("trial %d: site %d's farthest %.6f exceeds the overall %.6f", trial, i, s.Dist, got.Dist)
			}
			if nd := s.At.Dist(sites[nearestSite(s.At, sites)]); math.Abs(nd-s.Dist) > 1e-6 {
				t.Fatalf("trial %d: site %d's spot %v has nearest distance %.6f, reported %.6f", trial, i, s.At, nd, s.Dist)
			}
		}
	}
}

func TestNeighbourPairs(t *testing.T) {
	// A 3 × 3 square lattice in a square: the Voronoi regions are squares,
	// so the neighbours are the 12 lattice edges; diagonal points touch
	// only at a corner and are not neighbours (plane geometry).
	sq := Polygon{{0, 0}, {90, 0}, {90, 90}, {0, 90}}
	var sites []Point
	for y := 15.0; y < 90; y += 30 {
		for x := 15.0; x < 90; x += 30 {
			sites = append(sites, Point{x, y})
		}
	}
	pairs := NeighbourPairs(Ground{Outline: sq}, sites)
	if len(pairs) != 12 {
		t.Fatalf("got %d pairs %v, want the 12 lattice edges", len(pairs), pairs)
	}
	for _, p := range pairs {
		if d := sites[p[0]].Dist(sites[p[1]]); math.Abs(d-30) > 1e-9 {
			t.Errorf("pair %v is %.3f ft apart, want 30", p, d)
		}
	}
	// An L-shaped zone: two points in the two arms face each other only
	// across the notch, outside the ground, so they are not neighbours.
	l := Polygon{{0, 0}, {100, 0}, {100, 10}, {10, 10}, {10, 100}, {0, 100}}
	if got := NeighbourPairs(Ground{Outline: l}, []Point{{90, 5}, {5, 90}, {5, 5}}); len(got) != 2 {
		t.Errorf("L-shape pairs %v, want the two pairs through the corner point", got)
	}
}
