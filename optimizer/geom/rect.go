package geom

import "math"

// Rect is an axis-aligned rectangle, closed on all sides: Min is its
// south-west corner and Max its north-east corner, in feet.
type Rect struct {
	Min, Max Point
}

// Contains reports whether q lies in the closed rectangle.
func (r Rect) Contains(q Point) bool {
	return r.Min.X <= q.X && q.X <= r.Max.X && r.Min.Y <= q.Y && q.Y <= r.Max.Y
}

// Expand returns r grown by dFt on every side (shrunk for negative dFt; a
// rectangle shrunk past nothing collapses onto its centre line).
func (r Rect) Expand(dFt float64) Rect {
	out := Rect{Point{r.Min.X - dFt, r.Min.Y - dFt}, Point{r.Max.X + dFt, r.Max.Y + dFt}}
	if out.Min.X > out.Max.X {
		m := (r.Min.X + r.Max.X) / 2
		out.Min.X, out.Max.X = m, m
	}
	if out.Min.Y > out.Max.Y {
		m := (r.Min.Y + r.Max.Y) / 2
		out.Min.Y, out.Max.Y = m, m
	}
	return out
}

// Intersects reports whether the closed rectangles share a point.
func (r Rect) Intersects(o Rect) bool {
	return r.Min.X <= o.Max.X && o.Min.X <= r.Max.X && r.Min.Y <= o.Max.Y && o.Min.Y <= r.Max.Y
}

// Width returns the east–west extent in feet.
func (r Rect) Width() float64 { return r.Max.X - r.Min.X }

// Height returns the north–south extent in feet.
func (r Rect) Height() float64 { return r.Max.Y - r.Min.Y }

// Area returns the rectangle's area in square feet.
func (r Rect) Area() float64 { return math.Max(0, r.Width()) * math.Max(0, r.Height()) }
