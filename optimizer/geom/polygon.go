package geom

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// BoundaryTolFt is the distance, in feet, within which a point counts as
// lying on a polygon's boundary. A stakeout is good to a few tenths of a
// foot, so a micro-foot tolerance only absorbs floating-point rounding in
// site coordinates of up to some hundreds of miles.
const BoundaryTolFt = 1e-6

// DefaultCornerTurnDeg is the turn, in degrees, that makes a vertex a corner
// for Corners. 20° keeps the corners of buildings and parcels and drops the
// slight bends of digitized curves (common practice).
const DefaultCornerTurnDeg = 20

// ErrNotSimple is wrapped by every error IsSimple returns.
var ErrNotSimple = errors.New("geom: polygon is not simple")

// Segment is the straight line from A to B.
type Segment struct {
	A, B Point
}

// Len returns the segment's length in feet.
func (s Segment) Len() float64 { return math.Hypot(s.B.X-s.A.X, s.B.Y-s.A.Y) }

// Sub returns a − b.
func (a Point) Sub(b Point) Point { return Point{a.X - b.X, a.Y - b.Y} }

// Add returns a + b.
func (a Point) Add(b Point) Point { return Point{a.X + b.X, a.Y + b.Y} }

// Scale returns k·a.
func (a Point) Scale(k float64) Point { return Point{k * a.X, k * a.Y} }

// Dist returns the distance from a to b in feet.
func (a Point) Dist(b Point) float64 { return math.Hypot(a.X-b.X, a.Y-b.Y) }

// cross returns the z component of (b−a)×(c−a): positive when a, b, c turn
// counter-clockwise.
func cross(a, b, c Point) float64 {
	return (b.X-a.X)*(c.Y-a.Y) - (b.Y-a.Y)*(c.X-a.X)
}

// SignedArea returns the polygon's area by the shoelace formula (Gauss's
// area formula), positive for a counter-clockwise ring:
//
//	A = ½ Σ (xᵢ yᵢ₊₁ − xᵢ₊₁ yᵢ)
//
// Coordinates are taken relative to the first vertex, which leaves the sum
// unchanged and keeps rounding small for sites far from the frame origin.
func (p Polygon) SignedArea() float64 {
	if len(p) < 3 {
		return 0
	}
	o := p[0]
	var s float64
	for i := 1; i+1 < len(p); i++ {
		a, b := p[i].Sub(o), p[i+1].Sub(o)
		s += a.X*b.Y - b.X*a.Y
	}
	return s / 2
}

// Area returns the absolute shoelace area in square feet.
func (p Polygon) Area() float64 { return math.Abs(p.SignedArea()) }

// Perimeter returns the length of the closed ring in feet.
func (p Polygon) Perimeter() float64 {
	var s float64
	for i := range p {
		s += p[i].Dist(p[(i+1)%len(p)])
	}
	return s
}

// Centroid returns the centre of area: the area-weighted mean of the
// centroids of the triangles fanned from vertex 0 (signed areas, so it
// holds for concave rings). A ring with no
// area returns the mean of its vertices; an empty ring the zero point.
func (p Polygon) Centroid() Point {
	if len(p) == 0 {
		return Point{}
	}
	o := p[0]
	var a2, cx, cy float64
	for i := 1; i+1 < len(p); i++ {
		a, b := p[i].Sub(o), p[i+1].Sub(o)
		c := a.X*b.Y - b.X*a.Y
		a2 += c
		cx += (a.X + b.X) * c
		cy += (a.Y + b.Y) * c
	}
	if a2 == 0 {
		var m Point
		for _, v := range p {
			m = m.Add(v)
		}
		return m.Scale(1 / float64(len(p)))
	}
	return Point{o.X + cx/(3*a2), o.Y + cy/(3*a2)}
}

// Bounds returns the smallest axis-aligned rectangle holding every vertex.
// An empty polygon gives the zero Rect.
func (p Polygon) Bounds() Rect {
	if len(p) == 0 {
		return Rect{}
	}
	r := Rect{p[0], p[0]}
	for _, v := range p[1:] {
		r.Min.X = math.Min(r.Min.X, v.X)
		r.Min.Y = math.Min(r.Min.Y, v.Y)
		r.Max.X = math.Max(r.Max.X, v.X)
		r.Max.Y = math.Max(r.Max.Y, v.Y)
	}
	return r
}

// Edges returns the ring's edges; edge i runs from vertex i to vertex i+1
// (the last closes the ring back to vertex 0).
func (p Polygon) Edges() []Segment {
	e := make([]Segment, len(p))
	for i := range p {
		e[i] = Segment{p[i], p[(i+1)%len(p)]}
	}
	return e
}

// distToSegment returns the distance from q to the segment a–b.
func distToSegment(q, a, b Point) float64 {
	d := b.Sub(a)
	l2 := d.X*d.X + d.Y*d.Y
	if l2 == 0 {
		return q.Dist(a)
	}
	t := ((q.X-a.X)*d.X + (q.Y-a.Y)*d.Y) / l2
	t = math.Max(0, math.Min(1, t))
	return q.Dist(a.Add(d.Scale(t)))
}

// DistanceToBoundary returns the distance in feet from q to the nearest
// point of the ring (zero on the boundary, whether q is inside or out).
func (p Polygon) DistanceToBoundary(q Point) float64 {
	d := math.Inf(1)
	for i := range p {
		d = math.Min(d, distToSegment(q, p[i], p[(i+1)%len(p)]))
	}
	return d
}

// Contains reports whether q lies in the closed polygon: points within
// BoundaryTolFt of the boundary count as inside, so a boring staked on a
// zone's edge belongs to the zone. Off the boundary it applies the even–odd
// (crossing number) rule with half-open edges, which for a simple polygon
// is the same as the non-zero winding rule (the Jordan curve theorem). O(n) in the number of vertices.
func (p Polygon) Contains(q Point) bool {
	if len(p) == 0 {
		return false
	}
	in := false
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		if distToSegment(q, a, b) <= BoundaryTolFt {
			return true
		}
		if (a.Y > q.Y) != (b.Y > q.Y) {
			x := a.X + (q.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y)
			if q.X < x {
				in = !in
			}
		}
	}
	return in
}

// containsStrict reports whether q lies in the open interior: inside and
// farther than BoundaryTolFt from the boundary.
func (p Polygon) containsStrict(q Point) bool {
	return p.Contains(q) && p.DistanceToBoundary(q) > BoundaryTolFt
}

// Clean returns the ring with consecutive repeated vertices and a repeated
// closing vertex removed, as GeoJSON rings (RFC 7946 §3.1.6) repeat their
// first position at the end.
func (p Polygon) Clean() Polygon {
	out := make(Polygon, 0, len(p))
	for _, v := range p {
		if len(out) > 0 && out[len(out)-1] == v {
			continue
		}
		out = append(out, v)
	}
	for len(out) > 1 && out[len(out)-1] == out[0] {
		out = out[:len(out)-1]
	}
	return out
}

func fmtPt(p Point) string { return fmt.Sprintf("(%g, %g)", p.X, p.Y) }

// IsSimple reports, as a nil error, that the ring is a simple polygon: at
// least 3 distinct vertices, no zero-length edge, non-zero area, adjacent
// edges meeting only at their shared vertex, and no two other edges
// touching at all. The error wraps ErrNotSimple and names the edges at
// fault.
//
// Edges are swept in order of their least x and each is tested only against
// those whose x-range overlaps its own (a sort-and-sweep on bounding boxes),
// so a typical site outline takes O(n log n + k) for k box overlaps; the
// worst case is O(n²). Tests use exact floating-point orientation signs.
func (p Polygon) IsSimple() error {
	n := len(p)
	if n < 3 {
		return fmt.Errorf("%w: %d vertices, need at least 3", ErrNotSimple, n)
	}
	for i := range p {
		if !finite(p[i]) {
			return fmt.Errorf("%w: vertex %d is not a finite point", ErrNotSimple, i)
		}
		if p[i] == p[(i+1)%n] {
			return fmt.Errorf("%w: vertex %d %s repeats as vertex %d (zero-length edge %d)", ErrNotSimple, i, fmtPt(p[i]), (i+1)%n, i)
		}
	}
	type box struct {
		i          int
		minX, maxX float64
		minY, maxY float64
	}
	bs := make([]box, n)
	for i := range p {
		a, b := p[i], p[(i+1)%n]
		bs[i] = box{i, math.Min(a.X, b.X), math.Max(a.X, b.X), math.Min(a.Y, b.Y), math.Max(a.Y, b.Y)}
	}
	sort.Slice(bs, func(x, y int) bool {
		if bs[x].minX != bs[y].minX {
			return bs[x].minX < bs[y].minX
		}
		return bs[x].i < bs[y].i
	})
	for x := range bs {
		for y := x + 1; y < n && bs[y].minX <= bs[x].maxX; y++ {
			if bs[y].minY > bs[x].maxY || bs[y].maxY < bs[x].minY {
				continue
			}
			i, j := bs[x].i, bs[y].i
			if i > j {
				i, j = j, i
			}
			a, b := p[i], p[(i+1)%n]
			c, d := p[j], p[(j+1)%n]
			switch {
			case j == i+1 || (i == 0 && j == n-1):
				// Adjacent: they share one vertex; they fault only if
				// collinear and folding back over each other.
				var u, v, w Point // u→v→w with v shared
				if j == i+1 {
					u, v, w = a, b, d
				} else {
					u, v, w = c, a, b
				}
				if cross(u, v, w) == 0 {
					d1, d2 := v.Sub(u), w.Sub(v)
					if d1.X*d2.X+d1.Y*d2.Y < 0 {
						return fmt.Errorf("%w: edges %d %s–%s and %d %s–%s fold back over each other", ErrNotSimple,
							i, fmtPt(a), fmtPt(b), j, fmtPt(c), fmtPt(d))
					}
				}
			default:
				if segmentsTouch(a, b, c, d) {
					return fmt.Errorf("%w: edge %d %s–%s and edge %d %s–%s intersect", ErrNotSimple,
						i, fmtPt(a), fmtPt(b), j, fmtPt(c), fmtPt(d))
				}
			}
		}
	}
	// Checked last so that a symmetric bow-tie, whose two lobes cancel,
	// is reported by its crossing edges.
	if p.SignedArea() == 0 {
		return fmt.Errorf("%w: zero area (all vertices on one line)", ErrNotSimple)
	}
	return nil
}

func finite(p Point) bool {
	return !math.IsNaN(p.X) && !math.IsNaN(p.Y) && !math.IsInf(p.X, 0) && !math.IsInf(p.Y, 0)
}

func sign(x float64) int {
	switch {
	case x > 0:
		return 1
	case x < 0:
		return -1
	}
	return 0
}

// onSeg reports whether q, known collinear with a–b, lies within its box.
func onSeg(a, b, q Point) bool {
	return math.Min(a.X, b.X) <= q.X && q.X <= math.Max(a.X, b.X) &&
		math.Min(a.Y, b.Y) <= q.Y && q.Y <= math.Max(a.Y, b.Y)
}

// segmentsTouch reports whether the closed segments a–b and c–d share any
// point (crossing, touching or overlapping); Cormen et al., Introduction to
// Algorithms, 3rd ed., §33.1, SEGMENTS-INTERSECT.
func segmentsTouch(a, b, c, d Point) bool {
	d1 := sign(cross(c, d, a))
	d2 := sign(cross(c, d, b))
	d3 := sign(cross(a, b, c))
	d4 := sign(cross(a, b, d))
	if d1*d2 < 0 && d3*d4 < 0 {
		return true
	}
	return (d1 == 0 && onSeg(c, d, a)) || (d2 == 0 && onSeg(c, d, b)) ||
		(d3 == 0 && onSeg(a, b, c)) || (d4 == 0 && onSeg(a, b, d))
}

// properCross reports whether a–b and c–d cross at one point interior to
// both.
func properCross(a, b, c, d Point) bool {
	d1 := sign(cross(c, d, a))
	d2 := sign(cross(c, d, b))
	d3 := sign(cross(a, b, c))
	d4 := sign(cross(a, b, d))
	return d1*d2 < 0 && d3*d4 < 0
}

// splitMidpoints returns, for every edge of p, the midpoints of the pieces
// into which the points where it meets other's boundary cut it. Between two
// consecutive meeting points an edge lies wholly inside or wholly outside
// other, so these midpoints sample every such piece.
func (p Polygon) splitMidpoints(other Polygon) []Point {
	var mids []Point
	var ts []float64
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		d := b.Sub(a)
		l2 := d.X*d.X + d.Y*d.Y
		if l2 == 0 {
			continue
		}
		ts = append(ts[:0], 0, 1)
		addT := func(q Point) {
			if distToSegment(q, a, b) <= BoundaryTolFt {
				ts = append(ts, ((q.X-a.X)*d.X+(q.Y-a.Y)*d.Y)/l2)
			}
		}
		for j := range other {
			c, e := other[j], other[(j+1)%len(other)]
			addT(c)
			if properCross(a, b, c, e) {
				// Intersection parameter along a–b.
				den := d.X*(e.Y-c.Y) - d.Y*(e.X-c.X)
				t := ((c.X-a.X)*(e.Y-c.Y) - (c.Y-a.Y)*(e.X-c.X)) / den
				ts = append(ts, t)
			}
		}
		sort.Float64s(ts)
		for k := 0; k+1 < len(ts); k++ {
			t0, t1 := math.Max(0, ts[k]), math.Min(1, ts[k+1])
			if t1-t0 <= 0 {
				continue
			}
			mids = append(mids, a.Add(d.Scale((t0+t1)/2)))
		}
	}
	return mids
}

// interiorPoint returns a point in the open interior of a simple polygon:
// the middle of the first span of a horizontal line drawn through the
// widest gap between vertex heights.
func (p Polygon) interiorPoint() (Point, bool) {
	ys := make([]float64, len(p))
	for i, v := range p {
		ys[i] = v.Y
	}
	sort.Float64s(ys)
	best, y := 0.0, 0.0
	for i := 0; i+1 < len(ys); i++ {
		if g := ys[i+1] - ys[i]; g > best {
			best, y = g, (ys[i]+ys[i+1])/2
		}
	}
	if best == 0 {
		return Point{}, false
	}
	xs := p.RowCrossings(y, nil)
	if len(xs) < 2 {
		return Point{}, false
	}
	return Point{(xs[0] + xs[1]) / 2, y}, true
}

// RowCrossings appends to dst, sorted, the x where the horizontal line at
// height y crosses the ring's edges. Each edge counts over the half-open
// range of heights [min, max), so a line through a vertex is counted once
// and, for a simple polygon, the crossings pair up into the inside spans
// [x₀, x₁], [x₂, x₃], … (the scan-line form of the even–odd rule).
func (p Polygon) RowCrossings(y float64, dst []float64) []float64 {
	start := len(dst)
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		if (a.Y > y) != (b.Y > y) {
			dst = append(dst, a.X+(y-a.Y)*(b.X-a.X)/(b.Y-a.Y))
		}
	}
	sort.Float64s(dst[start:])
	return dst
}

// Inside reports whether all of p lies within the closed region of other
// (a shared boundary is allowed). Both must be simple. Every vertex of p is
// tested, then every piece into which other's boundary cuts p's edges, so a
// reflex corner of other poking through an edge of p is caught. O(n·m).
func (p Polygon) Inside(other Polygon) bool {
	if len(p) == 0 || len(other) < 3 {
		return false
	}
	for _, v := range p {
		if !other.Contains(v) {
			return false
		}
	}
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		for j := range other {
			if properCross(a, b, other[j], other[(j+1)%len(other)]) {
				return false
			}
		}
	}
	for _, m := range p.splitMidpoints(other) {
		if !other.Contains(m) {
			return false
		}
	}
	return true
}

// Overlaps reports whether the interiors of p and other share an area;
// touching along edges or at corners does not count. Both must be simple.
//
// If the boundaries cross, the interiors meet. Otherwise the interiors meet
// exactly when a vertex or an edge piece of one lies in the other's open
// interior, or — the remaining case, where each boundary lies outside the
// other's interior — when the two regions are the same, which an interior
// point of p settles. O(n·m).
func (p Polygon) Overlaps(other Polygon) bool {
	if len(p) < 3 || len(other) < 3 || !p.Bounds().Intersects(other.Bounds()) {
		return false
	}
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		for j := range other {
			if properCross(a, b, other[j], other[(j+1)%len(other)]) {
				return true
			}
		}
	}
	for _, v := range p {
		if other.containsStrict(v) {
			return true
		}
	}
	for _, v := range other {
		if p.containsStrict(v) {
			return true
		}
	}
	for _, m := range p.splitMidpoints(other) {
		if other.containsStrict(m) {
			return true
		}
	}
	for _, m := range other.splitMidpoints(p) {
		if p.containsStrict(m) {
			return true
		}
	}
	if q, ok := p.interiorPoint(); ok && other.containsStrict(q) {
		return true
	}
	return false
}

// Corners returns the vertices where the boundary turns by more than
// DefaultCornerTurnDeg, in ring order.
func (p Polygon) Corners() []Point { return p.CornersAbove(DefaultCornerTurnDeg) }

// CornersAbove returns the vertices where the boundary turns by more than
// turnDeg degrees (the angle between the incoming and outgoing edge
// directions, 0° for a straight run, 90° for a rectangle's corner), in ring
// order. Repeated vertices are skipped.
func (p Polygon) CornersAbove(turnDeg float64) []Point {
	q := p.Clean()
	n := len(q)
	if n < 3 {
		return nil
	}
	lim := turnDeg * math.Pi / 180
	var out []Point
	for i := range q {
		u, v, w := q[(i+n-1)%n], q[i], q[(i+1)%n]
		d1, d2 := v.Sub(u), w.Sub(v)
		turn := math.Atan2(math.Abs(d1.X*d2.Y-d1.Y*d2.X), d1.X*d2.X+d1.Y*d2.Y)
		if turn > lim {
			out = append(out, v)
		}
	}
	return out
}

// PointsAlongBoundary returns points around the ring no farther apart than
// stepFt along it: every vertex, and each edge cut into the fewest equal
// pieces no longer than stepFt. The points run in ring order from vertex 0.
// A step that is not positive and finite gives the vertices only.
func (p Polygon) PointsAlongBoundary(stepFt float64) []Point {
	var out []Point
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		out = append(out, a)
		l := a.Dist(b)
		if !(stepFt > 0) || math.IsInf(stepFt, 0) || l <= stepFt {
			continue
		}
		k := int(math.Ceil(l / stepFt))
		d := b.Sub(a)
		for j := 1; j < k; j++ {
			out = append(out, a.Add(d.Scale(float64(j)/float64(k))))
		}
	}
	return out
}
