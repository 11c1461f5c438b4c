package geom

import (
	"fmt"
	"math"
)

// Lattice kinds: the point patterns a spacing rule can refer to.
const (
	Square     = "square"     // points at the corners of squares of side s
	Triangular = "triangular" // points at the corners of equilateral triangles of side s
)

// MaxLatticePoints bounds the points one lattice call may produce
// (about 1 GB of points); asking for more is a caller bug and panics.
const MaxLatticePoints = 1 << 26

// ValidLattice reports whether kind names a lattice this package builds.
func ValidLattice(kind string) bool { return kind == Square || kind == Triangular }

// CoveringRadius returns the covering radius of a lattice of spacing s: the
// largest distance from any point of the plane to its nearest lattice
// point. For a square lattice it is half the diagonal of a square, s/√2;
// for a triangular lattice it is the circumradius of an equilateral
// triangle of side s, s/√3 (plane geometry: the farthest points from the
// lattice are the centres of its squares or triangles).
// It panics for an unknown kind.
func CoveringRadius(kind string, spacing float64) float64 {
	switch kind {
	case Square:
		return spacing / math.Sqrt2
	case Triangular:
		return spacing / math.Sqrt(3)
	}
	panic(fmt.Sprintf("geom: unknown lattice kind %q (want %q or %q)", kind, Square, Triangular))
}

// rowGeometry returns a lattice's row pitch and the x offset of odd rows.
func rowGeometry(kind string, s float64) (dy, oddOffset float64) {
	switch kind {
	case Square:
		return s, 0
	case Triangular:
		return s * math.Sqrt(3) / 2, s / 2
	}
	panic(fmt.Sprintf("geom: unknown lattice kind %q (want %q or %q)", kind, Square, Triangular))
}

// latticeRows calls fn for each lattice row whose height lies in [y0, y1],
// bottom to top, with the row's height and its x offset from origin.X.
// Bounds are widened by a billionth of the spacing so that lattice points
// landing on the edge by construction are not lost to rounding.
func latticeRows(kind string, s float64, origin Point, y0, y1 float64, fn func(y, xOff float64)) {
	dy, odd := rowGeometry(kind, s)
	eps := 1e-9 * s
	j0 := math.Ceil((y0 - eps - origin.Y) / dy)
	j1 := math.Floor((y1 + eps - origin.Y) / dy)
	for j := j0; j <= j1; j++ {
		off := 0.0
		if math.Mod(math.Abs(j), 2) == 1 {
			off = odd
		}
		fn(origin.Y+j*dy, off)
	}
}

// rowRange returns the first and last index i with x0 ≤ ox + i·s ≤ x1,
// widened by a billionth of the spacing.
func rowRange(s, ox, x0, x1 float64) (i0, i1 float64) {
	eps := 1e-9 * s
	return math.Ceil((x0 - eps - ox) / s), math.Floor((x1 + eps - ox) / s)
}

func checkLattice(kind string, spacing float64, r Rect) bool {
	if !ValidLattice(kind) {
		panic(fmt.Sprintf("geom: unknown lattice kind %q (want %q or %q)", kind, Square, Triangular))
	}
	if !(spacing > 0) || math.IsInf(spacing, 0) || !finite(r.Min) || !finite(r.Max) ||
		r.Min.X > r.Max.X || r.Min.Y > r.Max.Y {
		return false
	}
	if n := (r.Width()/spacing + 2) * (r.Height()/spacing + 2); n > MaxLatticePoints {
		panic(fmt.Sprintf("geom: a %g × %g ft area at %g ft spacing needs about %.3g lattice points, more than %d",
			r.Width(), r.Height(), spacing, n, MaxLatticePoints))
	}
	return true
}

// Lattice returns the points of the kind's lattice of the given spacing
// through origin that lie in the closed rectangle r, row by row from south
// to north and west to east within a row. A spacing that is not positive
// and finite gives no points.
func Lattice(kind string, r Rect, spacing float64, origin Point) []Point {
	if !checkLattice(kind, spacing, r) {
		return nil
	}
	var out []Point
	latticeRows(kind, spacing, origin, r.Min.Y, r.Max.Y, func(y, off float64) {
		ox := origin.X + off
		i0, i1 := rowRange(spacing, ox, r.Min.X, r.Max.X)
		for i := i0; i <= i1; i++ {
			out = append(out, Point{ox + i*spacing, y})
		}
	})
	return out
}

// SquareLattice returns the points origin + (i·s, j·s) within r, in the
// order of Lattice.
func SquareLattice(r Rect, spacing float64, origin Point) []Point {
	return Lattice(Square, r, spacing, origin)
}

// TriangularLattice returns the points of a triangular lattice within r:
// rows spaced s·√3/2 apart, points s apart along a row, odd rows shifted
// by s/2, so every point has six neighbours at distance s. Order as in
// Lattice.
func TriangularLattice(r Rect, spacing float64, origin Point) []Point {
	return Lattice(Triangular, r, spacing, origin)
}

// Lattice returns the points of the kind's lattice through origin that lie
// inside the polygon, in the order of the package-level Lattice. Each row
// is clipped by the scan-line spans of RowCrossings, so the cost is
// O(rows · vertices + points) rather than a point-in-polygon test per
// lattice point. Points strictly inside are always returned; points exactly
// on the boundary may or may not be (half-open rule), so callers that need
// the boundary add it with PointsAlongBoundary.
func (p Polygon) Lattice(kind string, spacing float64, origin Point) []Point {
	r := p.Bounds()
	if len(p) < 3 || !checkLattice(kind, spacing, r) {
		return nil
	}
	var out []Point
	var xs []float64
	latticeRows(kind, spacing, origin, r.Min.Y, r.Max.Y, func(y, off float64) {
		xs = p.RowCrossings(y, xs[:0])
		ox := origin.X + off
		for k := 0; k+1 < len(xs); k += 2 {
			i0, i1 := rowRange(spacing, ox, xs[k], xs[k+1])
			for i := i0; i <= i1; i++ {
				out = append(out, Point{ox + i*spacing, y})
			}
		}
	})
	return out
}

// CentredOrigin returns the origin of the kind's lattice of spacing s that
// centres its points in the box: as many rows and columns as fit, with
// equal margins, so that a strip narrower than s still gets a row down
// its middle.
func CentredOrigin(kind string, b Rect, s float64) Point {
	dy := s
	if kind == Triangular {
		dy = s * math.Sqrt(3) / 2
	}
	off := func(extent, step float64) float64 {
		m := math.Max(1, math.Ceil(extent/step-1e-9))
		return (extent - (m-1)*step) / 2
	}
	return Point{X: b.Min.X + off(b.Width(), s), Y: b.Min.Y + off(b.Height(), dy)}
}
