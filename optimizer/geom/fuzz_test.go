package geom

import (
	"math"
	"testing"
)

// polygonFromBytes reads up to 12 vertices from pairs of bytes (signed,
// with a quarter-foot fraction from the spare bits of the first byte's
// pair) and the rest as probe points.
func polygonFromBytes(data []byte) (Polygon, []Point) {
	n := 0
	if len(data) > 0 {
		n = int(data[0]) % 13
		data = data[1:]
	}
	var p Polygon
	for len(data) >= 2 && len(p) < n {
		p = append(p, Point{float64(int8(data[0])), float64(int8(data[1]))})
		data = data[2:]
	}
	var probes []Point
	for len(data) >= 2 {
		probes = append(probes, Point{float64(int8(data[0])) / 2, float64(int8(data[1])) / 2})
		data = data[2:]
	}
	return p, probes
}

func FuzzPolygon(f *testing.F) {
	f.Add([]byte{4, 0, 0, 30, 0, 30, 20, 0, 20, 5, 5, 60, 2})
	f.Add([]byte{4, 0, 0, 2, 2, 2, 0, 0, 2, 1, 1})
	f.Add([]byte{6, 0, 0, 20, 0, 20, 10, 10, 10, 10, 30, 0, 30, 30, 40, 20, 20})
	f.Add([]byte{3, 0, 0, 1, 1, 2, 2})
	f.Add([]byte{8, 0, 0, 100, 0, 100, 100, 80, 100, 80, 20, 20, 20, 20, 100, 0, 100, 50, 50, 10, 90})
	f.Fuzz(func(t *testing.T, data []byte) {
		p, probes := polygonFromBytes(data)
		err := p.IsSimple()
		if a := p.Area(); !(a >= 0) {
			t.Fatalf("Area %v < 0 for %v", a, p)
		}
		_ = p.Perimeter()
		_ = p.Centroid()
		_ = p.Corners()
		_ = p.PointsAlongBoundary(5)
		for _, q := range probes {
			_ = p.Contains(q)
			_ = p.DistanceToBoundary(q)
		}
		if err != nil {
			return
		}
		if !(p.Area() > 0) {
			t.Fatalf("simple polygon %v with area %v", p, p.Area())
		}
		if !p.Inside(p) || !p.Overlaps(p) {
			t.Fatalf("simple polygon %v not inside or overlapping itself", p)
		}
		c := p.Bounds()
		s := math.Max(c.Width(), c.Height()) / 9
		for _, kind := range []string{Square, Triangular} {
			for _, q := range p.Lattice(kind, s, Point{0.3, -0.7}) {
				if !p.Contains(q) {
					t.Fatalf("%s lattice point %v outside simple polygon %v", kind, q, p)
				}
			}
		}
		tiles := 0.0
		for _, c := range SquareLattice(c.Expand(s), s, c.Min) {
			tiles += p.ClipToRect(Rect{c, Point{c.X + s, c.Y + s}}).Area()
		}
		if !near(tiles, p.Area(), 1e-9*p.Area()) {
			t.Fatalf("clipped tiles sum to %v, area %v, polygon %v", tiles, p.Area(), p)
		}
		for _, q := range p.PointsAlongBoundary(3) {
			if !p.Contains(q) {
				t.Fatalf("boundary point %v not contained in %v", q, p)
			}
		}
		if q, ok := p.interiorPoint(); !ok || !p.Contains(q) {
			t.Fatalf("interior point %v (ok %v) not in %v", q, ok, p)
		}
	})
}

func FuzzLattice(f *testing.F) {
	f.Add(0.0, 0.0, 100.0, 100.0, 10.0, 0.0, 0.0, false)
	f.Add(-3.5, 2.0, 50.0, 7.0, 3.3, 1.1, -9.0, true)
	f.Add(0.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, true)
	f.Fuzz(func(t *testing.T, x0, y0, w, h, s, ox, oy float64, tri bool) {
		for _, v := range []float64{x0, y0, w, h, s, ox, oy} {
			if math.IsNaN(v) || math.Abs(v) > 1e6 {
				return
			}
		}
		if w < 0 || h < 0 || s < 1e-3 || (w/s+2)*(h/s+2) > 1e5 {
			return
		}
		kind := Square
		if tri {
			kind = Triangular
		}
		r := Rect{Point{x0, y0}, Point{x0 + w, y0 + h}}
		pts := Lattice(kind, r, s, Point{ox, oy})
		tol := 1e-6 * (s + math.Abs(x0) + math.Abs(y0) + w + h + math.Abs(ox) + math.Abs(oy))
		for i, p := range pts {
			if !r.Expand(tol).Contains(p) {
				t.Fatalf("point %v outside %v", p, r)
			}
			if i > 0 && pts[i-1].Y == p.Y && !near(p.X-pts[i-1].X, s, tol) {
				t.Fatalf("row neighbours %v and %v not %v apart", pts[i-1], p, s)
			}
			if i > 0 && (pts[i-1].Y > p.Y || (pts[i-1].Y == p.Y && pts[i-1].X >= p.X)) {
				t.Fatalf("points %v, %v out of row order", pts[i-1], p)
			}
		}
		// Nothing missed: enumerate the lattice by brute force over an
		// index range wider than the rectangle and compare the counts
		// of points well inside (farther than tol from the edges).
		if w <= 2*tol || h <= 2*tol {
			return
		}
		inner := r.Expand(-tol)
		got := 0
		for _, p := range pts {
			if inner.Contains(p) {
				got++
			}
		}
		dy, odd := rowGeometry(kind, s)
		want := 0
		for j := math.Floor((y0-oy)/dy) - 1; j <= math.Ceil((y0+h-oy)/dy)+1; j++ {
			off := 0.0
			if math.Mod(math.Abs(j), 2) == 1 {
				off = odd
			}
			for i := math.Floor((x0-ox-off)/s) - 1; i <= math.Ceil((x0+w-ox-off)/s)+1; i++ {
				if inner.Contains(Point{ox + off + i*s, oy + j*dy}) {
					want++
				}
			}
		}
		if got != want {
			t.Fatalf("%d points well inside, brute force %d", got, want)
		}
	})
}

// FuzzPolygonPair checks Inside and Overlaps of two simple polygons
// against sampled points: a point strictly inside both forces Overlaps;
// Inside forces every sample of p into q; Overlaps is symmetric.
func FuzzPolygonPair(f *testing.F) {
	f.Add([]byte{4, 0, 0, 30, 0, 30, 20, 0, 20, 4, 10, 10, 40, 10, 40, 15, 10, 15})
	f.Add([]byte{4, 0, 0, 30, 0, 30, 20, 0, 20, 4, 30, 0, 40, 0, 40, 20, 30, 20})
	f.Add([]byte{3, 5, 5, 25, 5, 25, 25, 8, 0, 0, 30, 0, 30, 30, 20, 30, 20, 10, 10, 10, 10, 30, 0, 30})
	f.Fuzz(func(t *testing.T, data []byte) {
		p, _ := polygonFromBytes(data)
		skip := 1 + 2*len(p)
		if skip > len(data) {
			return
		}
		q, _ := polygonFromBytes(data[skip:])
		if p.IsSimple() != nil || q.IsSimple() != nil {
			return
		}
		ov := p.Overlaps(q)
		if ov != q.Overlaps(p) {
			t.Fatalf("Overlaps not symmetric for %v and %v", p, q)
		}
		in := p.Inside(q)
		if in && !ov {
			t.Fatalf("%v inside %v but not overlapping", p, q)
		}
		b := p.Bounds()
		s := math.Max(b.Width(), b.Height()) / 15
		for _, x := range p.Lattice(Square, s, Point{0.123, 0.456}) {
			if in && !q.Contains(x) {
				t.Fatalf("%v inside %v, yet its point %v is not in q", p, q, x)
			}
			if !ov && p.DistanceToBoundary(x) > 1e-6 && q.Contains(x) && q.DistanceToBoundary(x) > 1e-6 {
				t.Fatalf("%v and %v do not overlap, yet %v is inside both", p, q, x)
			}
		}
	})
}
