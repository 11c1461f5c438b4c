package scenarios

import (
	"math"
	"sort"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// Private plane geometry for validation. The shared optimizer/geom package
// grows its own polygon functions in parallel; these few are kept here so
// the loader's checks do not depend on that work's timing, and are written
// for clear verdicts on user input rather than speed (polygons in scenario
// files have tens of vertices, so the O(n²) checks are cheap).

// onEdgeTolFt is how close, in feet, a point must be to an edge to count as
// on it. A thousandth of a foot is far below survey precision for site
// layouts and far above floating-point noise for coordinates under 10^7 ft.
const onEdgeTolFt = 1e-3

// signedArea is the shoelace area, positive for counter-clockwise rings.
func signedArea(p geom.Polygon) float64 {
	var s float64
	for i := range p {
		a, b := p[i], p[(i+1)%len(p)]
		s += a.X*b.Y - b.X*a.Y
	}
	return s / 2
}

func area(p geom.Polygon) float64 { return math.Abs(signedArea(p)) }

func cross(o, a, b geom.Point) float64 {
	return (a.X-o.X)*(b.Y-o.Y) - (a.Y-o.Y)*(b.X-o.X)
}

// distToSegment is the distance from p to segment ab.
func distToSegment(p, a, b geom.Point) float64 {
	dx, dy := b.X-a.X, b.Y-a.Y
	l2 := dx*dx + dy*dy
	t := 0.0
	if l2 > 0 {
		t = ((p.X-a.X)*dx + (p.Y-a.Y)*dy) / l2
		t = math.Max(0, math.Min(1, t))
	}
	return math.Hypot(p.X-(a.X+t*dx), p.Y-(a.Y+t*dy))
}

// onBoundary reports whether p lies on an edge of poly, within onEdgeTolFt.
func onBoundary(poly geom.Polygon, p geom.Point) bool {
	for i := range poly {
		if distToSegment(p, poly[i], poly[(i+1)%len(poly)]) <= onEdgeTolFt {
			return true
		}
	}
	return false
}

// strictlyInside reports whether p is inside poly and not on its boundary
// (even-odd ray casting).
func strictlyInside(poly geom.Polygon, p geom.Point) bool {
	if onBoundary(poly, p) {
		return false
	}
	in := false
	for i, j := 0, len(poly)-1; i < len(poly); j, i = i, i+1 {
		a, b := poly[i], poly[j]
		if (a.Y > p.Y) != (b.Y > p.Y) {
			x := a.X + (p.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y)
			if p.X < x {
				in = !in
			}
		}
	}
	return in
}

// insideOrOn reports whether p is inside poly or on its boundary.
func insideOrOn(poly geom.Polygon, p geom.Point) bool {
	return onBoundary(poly, p) || strictlyInside(poly, p)
}

// segmentsTouch reports whether closed segments ab and cd share a point
// (within onEdgeTolFt).
func segmentsTouch(a, b, c, d geom.Point) bool {
	// Bounding-box rejection first: most pairs of a ring's edges are far
	// apart, and this keeps the O(n²) simplicity check fast on long rings.
	if math.Max(a.X, b.X)+onEdgeTolFt < math.Min(c.X, d.X) || math.Max(c.X, d.X)+onEdgeTolFt < math.Min(a.X, b.X) ||
		math.Max(a.Y, b.Y)+onEdgeTolFt < math.Min(c.Y, d.Y) || math.Max(c.Y, d.Y)+onEdgeTolFt < math.Min(a.Y, b.Y) {
		return false
	}
	d1, d2 := cross(c, d, a), cross(c, d, b)
	d3, d4 := cross(a, b, c), cross(a, b, d)
	if ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0)) {
		return true
	}
	return distToSegment(a, c, d) <= onEdgeTolFt || distToSegment(b, c, d) <= onEdgeTolFt ||
		distToSegment(c, a, b) <= onEdgeTolFt || distToSegment(d, a, b) <= onEdgeTolFt
}

// segmentsCross reports whether ab and cd cross properly: each passes
// through the other's interior at a single point, with no endpoint on the
// other segment. Shared edges and touching corners do not cross.
func segmentsCross(a, b, c, d geom.Point) bool {
	d1, d2 := cross(c, d, a), cross(c, d, b)
	d3, d4 := cross(a, b, c), cross(a, b, d)
	if !(((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
		return false
	}
	return distToSegment(a, c, d) > onEdgeTolFt && distToSegment(b, c, d) > onEdgeTolFt &&
		distToSegment(c, a, b) > onEdgeTolFt && distToSegment(d, a, b) > onEdgeTolFt
}

// selfIntersection returns the indexes of the first two edges (edge i runs
// from vertex i to vertex i+1) that touch although they are not neighbours,
// or -1, -1 for a simple ring.
func selfIntersection(p geom.Polygon) (int, int) {
	n := len(p)
	// Sweep over edges sorted by their left end: only edges whose x-ranges
	// overlap are tested, so long rings of short edges cost about
	// O(n log n) rather than O(n²).
	type span struct {
		lo, hi float64
		i      int
	}
	spans := make([]span, n)
	for i := range p {
		a, b := p[i], p[(i+1)%n]
		spans[i] = span{math.Min(a.X, b.X), math.Max(a.X, b.X), i}
	}
	sort.Slice(spans, func(x, y int) bool {
		if spans[x].lo != spans[y].lo {
			return spans[x].lo < spans[y].lo
		}
		return spans[x].i < spans[y].i
	})
	bi, bj := -1, -1
	for x := range spans {
		for y := x + 1; y < n && spans[y].lo <= spans[x].hi+onEdgeTolFt; y++ {
			i, j := min(spans[x].i, spans[y].i), max(spans[x].i, spans[y].i)
			if j == i+1 || (i == 0 && j == n-1) {
				continue // neighbours share a vertex by construction
			}
			if segmentsTouch(p[i], p[(i+1)%n], p[j], p[(j+1)%n]) {
				// Report the first pair in index order, whatever the
				// sweep order, so messages are the same for every run.
				if bi < 0 || i < bi || (i == bi && j < bj) {
					bi, bj = i, j
				}
			}
		}
	}
	return bi, bj
}

// foldBack returns the index of the first vertex where the ring turns
// straight back on itself (its two edges overlap), or -1.
func foldBack(p geom.Polygon) int {
	n := len(p)
	for i := 0; i < n; i++ {
		a, b, c := p[i], p[(i+1)%n], p[(i+2)%n]
		if math.Abs(cross(a, b, c)) <= onEdgeTolFt*math.Hypot(c.X-b.X, c.Y-b.Y) &&
			(b.X-a.X)*(c.X-b.X)+(b.Y-a.Y)*(c.Y-b.Y) < 0 {
			return (i + 1) % n
		}
	}
	return -1
}

// interiorPoint returns a point strictly inside a simple polygon: the
// middle of the first span of a horizontal line through the polygon's
// vertical middle, moved off any vertex.
func interiorPoint(p geom.Polygon) (geom.Point, bool) {
	ys := make([]float64, len(p))
	for i, v := range p {
		ys[i] = v.Y
	}
	sort.Float64s(ys)
	// Try lines halfway between distinct vertex heights, widest gap first.
	type gap struct{ y, w float64 }
	var gaps []gap
	for i := 1; i < len(ys); i++ {
		if w := ys[i] - ys[i-1]; w > 0 {
			gaps = append(gaps, gap{(ys[i] + ys[i-1]) / 2, w})
		}
	}
	sort.SliceStable(gaps, func(i, j int) bool { return gaps[i].w > gaps[j].w })
	for _, g := range gaps {
		var xs []float64
		for i, j := 0, len(p)-1; i < len(p); j, i = i, i+1 {
			a, b := p[i], p[j]
			if (a.Y > g.y) != (b.Y > g.y) {
				xs = append(xs, a.X+(g.y-a.Y)*(b.X-a.X)/(b.Y-a.Y))
			}
		}
		sort.Float64s(xs)
		for k := 0; k+1 < len(xs); k += 2 {
			c := geom.Point{X: (xs[k] + xs[k+1]) / 2, Y: g.y}
			if strictlyInside(p, c) {
				return c, true
			}
		}
	}
	return geom.Point{}, false
}

// overlaps reports whether two simple polygons share interior area. Shared
// edges and touching corners are not overlap: neighbouring zones commonly
// share a property line.
func overlaps(a, b geom.Polygon) bool {
	for i := range a {
		for j := range b {
			if segmentsCross(a[i], a[(i+1)%len(a)], b[j], b[(j+1)%len(b)]) {
				return true
			}
		}
	}
	for _, pair := range [2][2]geom.Polygon{{a, b}, {b, a}} {
		p, q := pair[0], pair[1]
		for i := range p {
			if strictlyInside(q, p[i]) {
				return true
			}
			mid := geom.Point{X: (p[i].X + p[(i+1)%len(p)].X) / 2, Y: (p[i].Y + p[(i+1)%len(p)].Y) / 2}
			if strictlyInside(q, mid) {
				return true
			}
		}
		if c, ok := interiorPoint(p); ok && strictlyInside(q, c) {
			return true
		}
	}
	return false
}

// within reports whether polygon inner lies inside outer (touching the
// boundary allowed).
func within(inner, outer geom.Polygon) bool {
	for i := range inner {
		a, b := inner[i], inner[(i+1)%len(inner)]
		if !insideOrOn(outer, a) {
			return false
		}
		if !insideOrOn(outer, geom.Point{X: (a.X + b.X) / 2, Y: (a.Y + b.Y) / 2}) {
			return false
		}
		for j := range outer {
			if segmentsCross(a, b, outer[j], outer[(j+1)%len(outer)]) {
				return false
			}
		}
	}
	return true
}

// bbox returns the corners of the bounding box.
func bbox(p geom.Polygon) (lo, hi geom.Point) {
	lo, hi = p[0], p[0]
	for _, v := range p[1:] {
		lo.X, lo.Y = math.Min(lo.X, v.X), math.Min(lo.Y, v.Y)
		hi.X, hi.Y = math.Max(hi.X, v.X), math.Max(hi.Y, v.Y)
	}
	return lo, hi
}

// coveredBy reports whether the no-go areas leave no usable ground in the
// zone: every point of a 64 × 64 sampling grid over the zone that falls
// inside the zone also falls inside (or on) one of the areas. The grid
// samples a zone at 1/64 of its width, finer than any lattice the optimizer
// lays, so a zone that passes has room for at least one candidate point.
func coveredBy(zone geom.Polygon, areas []geom.Polygon) bool {
	if len(areas) == 0 {
		return false
	}
	const n = 64
	lo, hi := bbox(zone)
	sampled := 0
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			p := geom.Point{X: lo.X + (float64(i)+0.5)*(hi.X-lo.X)/n, Y: lo.Y + (float64(j)+0.5)*(hi.Y-lo.Y)/n}
			if !strictlyInside(zone, p) {
				continue
			}
			sampled++
			free := true
			for _, a := range areas {
				if insideOrOn(a, p) {
					free = false
					break
				}
			}
			if free {
				return false
			}
		}
	}
	return sampled > 0
}
