package geom

// ClipToRect returns the part of the polygon inside the rectangle, by the
// Sutherland–Hodgman algorithm (Sutherland and Hodgman, "Reentrant polygon
// clipping", Comm. ACM 17(1), 1974): the ring is clipped against each of
// the rectangle's four sides in turn. For a concave polygon whose
// intersection with the rectangle falls apart into pieces, the result is
// one ring joining the pieces by zero-width bridges along the rectangle's
// sides; its shoelace area is still the area of the intersection, which is
// what the coverage cells need. An empty result means no overlap of
// positive area (or a degenerate input).
func (p Polygon) ClipToRect(r Rect) Polygon {
	out := append(Polygon(nil), p...)
	type side struct {
		inside func(Point) bool
		cut    func(a, b Point) Point
	}
	atX := func(a, b Point, x float64) Point {
		return Point{x, a.Y + (x-a.X)*(b.Y-a.Y)/(b.X-a.X)}
	}
	atY := func(a, b Point, y float64) Point {
		return Point{a.X + (y-a.Y)*(b.X-a.X)/(b.Y-a.Y), y}
	}
	sides := []side{
		{func(q Point) bool { return q.X >= r.Min.X }, func(a, b Point) Point { return atX(a, b, r.Min.X) }},
		{func(q Point) bool { return q.X <= r.Max.X }, func(a, b Point) Point { return atX(a, b, r.Max.X) }},
		{func(q Point) bool { return q.Y >= r.Min.Y }, func(a, b Point) Point { return atY(a, b, r.Min.Y) }},
		{func(q Point) bool { return q.Y <= r.Max.Y }, func(a, b Point) Point { return atY(a, b, r.Max.Y) }},
	}
	var next Polygon
	for _, s := range sides {
		if len(out) == 0 {
			return nil
		}
		next = next[:0]
		for i := range out {
			a, b := out[(i+len(out)-1)%len(out)], out[i]
			ain, bin := s.inside(a), s.inside(b)
			switch {
			case ain && bin:
				next = append(next, b)
			case ain && !bin:
				next = append(next, s.cut(a, b))
			case !ain && bin:
				next = append(next, s.cut(a, b), b)
			}
		}
		out, next = next, out
	}
	if len(out) < 3 {
		return nil
	}
	return append(Polygon(nil), out...)
}
