package geom

import (
	"math"
	"math/rand/v2"
	"sort"
	"testing"
)

func TestLatticeCounts(t *testing.T) {
	r := Rect{Point{0, 0}, Point{100, 100}}
	// Hand counts. Square, s = 10 through (0,0): 11 × 11 points.
	// Triangular, s = 10: rows every 8.660 ft, j = 0…11 (11 · 8.660 =
	// 95.26 ≤ 100); even rows x = 0…100 (11 points), odd rows x = 5…95
	// (10 points): 6·11 + 6·10 = 126.
	// Square through (5,5): x, y ∈ {5, 15, …, 95}: 10 × 10.
	tests := []struct {
		name   string
		kind   string
		s      float64
		origin Point
		want   int
	}{
		{"square through the corner", Square, 10, Point{0, 0}, 121},
		{"triangular through the corner", Triangular, 10, Point{0, 0}, 126},
		{"square offset half", Square, 10, Point{5, 5}, 100},
		{"square origin far away", Square, 10, Point{-1e4, 3e4}, 121},
		{"zero spacing", Square, 0, Point{}, 0},
		{"NaN spacing", Triangular, math.NaN(), Point{}, 0},
	}
	for _, tc := range tests {
		pts := Lattice(tc.kind, r, tc.s, tc.origin)
		if len(pts) != tc.want {
			t.Errorf("%s: %d points, want %d", tc.name, len(pts), tc.want)
		}
		for _, p := range pts {
			if !r.Expand(1e-9).Contains(p) {
				t.Errorf("%s: point %v outside the rectangle", tc.name, p)
			}
		}
	}
	if n := len(SquareLattice(r, 10, Point{})); n != 121 {
		t.Errorf("SquareLattice: %d points", n)
	}
	if n := len(TriangularLattice(r, 10, Point{})); n != 126 {
		t.Errorf("TriangularLattice: %d points", n)
	}
}

// nearestNeighbours returns, for each point, the distance to its nearest
// other point, and how many others lie within (1+1e-9) of that distance,
// by brute force.
func nearestNeighbours(pts []Point) (dist []float64, count []int) {
	dist = make([]float64, len(pts))
	count = make([]int, len(pts))
	for i, p := range pts {
		d := math.Inf(1)
		for j, q := range pts {
			if j != i {
				d = math.Min(d, p.Dist(q))
			}
		}
		for j, q := range pts {
			if j != i && p.Dist(q) <= d*(1+1e-9) {
				count[i]++
			}
		}
		dist[i] = d
	}
	return dist, count
}

func TestLatticeSpacingAndOrder(t *testing.T) {
	r := Rect{Point{0, 0}, Point{60, 60}}
	for _, tc := range []struct {
		kind      string
		neighbors int // of a point well inside
	}{{Square, 4}, {Triangular, 6}} {
		pts := Lattice(tc.kind, r, 7.5, Point{1, 2})
		dist, count := nearestNeighbours(pts)
		for i, p := range pts {
			if !near(dist[i], 7.5, 1e-9) {
				t.Errorf("%s: point %v nearest neighbour at %v, want 7.5", tc.kind, p, dist[i])
			}
			if r.Expand(-10).Contains(p) && count[i] != tc.neighbors {
				t.Errorf("%s: interior point %v has %d nearest neighbours, want %d", tc.kind, p, count[i], tc.neighbors)
			}
		}
		// Deterministic order: rows south to north, west to east.
		if !sort.SliceIsSorted(pts, func(a, b int) bool {
			if pts[a].Y != pts[b].Y {
				return pts[a].Y < pts[b].Y
			}
			return pts[a].X < pts[b].X
		}) {
			t.Errorf("%s: points not in row order", tc.kind)
		}
	}
}

// bruteCoveringRadius samples a fundamental cell of the lattice on a fine
// grid and returns the largest distance from a sample to its nearest
// lattice point, searching a patch of lattice around the cell.
func bruteCoveringRadius(kind string, s float64) float64 {
	dy, _ := rowGeometry(kind, s)
	patch := Lattice(kind, Rect{Point{-3 * s, -3 * s}, Point{4 * s, 4 * s}}, s, Point{})
	const k = 400
	worst := 0.0
	for i := 0; i <= k; i++ {
		for j := 0; j <= k; j++ {
			// The parallelogram spanned by (s,0) and the next row's
			// offset point is a fundamental cell of either lattice.
			var q Point
			if kind == Square {
				q = Point{s * float64(i) / k, s * float64(j) / k}
			} else {
				q = Point{s*float64(i)/k + s/2*float64(j)/k, dy * float64(j) / k}
			}
			d := math.Inf(1)
			for _, p := range patch {
				d = math.Min(d, p.Dist(q))
			}
			worst = math.Max(worst, d)
		}
	}
	return worst
}

func TestCoveringRadius(t *testing.T) {
	// Plane geometry (SOURCES.md: square s/√2, triangular s/√3), checked
	// against a brute-force search over a fundamental cell. The triangular
	// cell's sample grid contains the deep holes (centroids of the
	// triangles) only approximately, so allow the sample pitch.
	for _, tc := range []struct {
		kind string
		s    float64
		want float64
	}{
		{Square, 100, 100 / math.Sqrt2},
		{Triangular, 100, 100 / math.Sqrt(3)},
		{Square, 35, 35 / math.Sqrt2},
		{Triangular, 35, 35 / math.Sqrt(3)},
	} {
		got := CoveringRadius(tc.kind, tc.s)
		if !near(got, tc.want, 1e-12*tc.s) {
			t.Errorf("CoveringRadius(%s, %v) = %v, want %v", tc.kind, tc.s, got, tc.want)
		}
		brute := bruteCoveringRadius(tc.kind, tc.s)
		if brute > got*(1+1e-12) || brute < got-tc.s/400 {
			t.Errorf("%s s=%v: brute-force covering radius %v, formula %v", tc.kind, tc.s, brute, got)
		}
	}
	defer func() {
		if recover() == nil {
			t.Error("CoveringRadius of an unknown kind did not panic")
		}
	}()
	CoveringRadius("hexagonal", 1)
}

func TestPolygonLattice(t *testing.T) {
	// Every lattice point of the bounding box that is strictly inside the
	// polygon by the point-in-polygon test must be produced by the
	// scan-line form, and everything it produces must be inside.
	u := Polygon{{0, 0}, {300, 0}, {300, 300}, {200, 300}, {200, 100}, {100, 100}, {100, 300}, {0, 300}}
	for _, p := range []Polygon{u, lShape, tri345, {{0, 0}, {97, 13}, {40, 71}, {55, 30}}} {
		for _, kind := range []string{Square, Triangular} {
			s := math.Sqrt(p.Area()) / 12
			o := Point{0.37 * s, 0.21 * s}
			got := p.Lattice(kind, s, o)
			want := 0
			for _, q := range Lattice(kind, p.Bounds(), s, o) {
				if p.Contains(q) && p.DistanceToBoundary(q) > 1e-9 {
					want++
				}
			}
			in := 0
			for _, q := range got {
				if !p.Contains(q) {
					t.Errorf("%s lattice point %v outside polygon %v", kind, q, p)
				}
				if p.DistanceToBoundary(q) > 1e-9 {
					in++
				}
			}
			if in != want {
				t.Errorf("%s lattice in %v: %d strictly inside, brute force %d", kind, p, in, want)
			}
		}
	}
}

func TestGrid(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	pts := make([]Point, 2000)
	for i := range pts {
		pts[i] = Point{rng.Float64() * 1000, rng.Float64() * 500}
	}
	for _, cell := range []float64{7, 50, 400, 0, 1e-9} {
		g := NewGrid(pts, cell)
		for k := 0; k < 200; k++ {
			q := Point{rng.Float64()*1200 - 100, rng.Float64()*700 - 100}
			r := rng.Float64() * 80
			got := g.WithinSorted(q, r, nil)
			var want []int
			for i, p := range pts {
				if p.Dist(q) <= r {
					want = append(want, i)
				}
			}
			if len(got) != len(want) {
				t.Fatalf("cell %v: query %v r %v: %d found, brute force %d", cell, q, r, len(got), len(want))
			}
			for i := range got {
				if got[i] != want[i] {
					t.Fatalf("cell %v: query %v r %v: found %v, brute force %v", cell, q, r, got, want)
				}
			}
		}
	}
	if got := NewGrid(nil, 10).WithinSorted(Point{}, 5, nil); len(got) != 0 {
		t.Errorf("empty grid found %v", got)
	}
}
