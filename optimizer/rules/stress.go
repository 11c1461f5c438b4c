package rules

import (
	"fmt"
	"math"
)

// Shape is the plan shape of a uniformly loaded area.
type Shape int

const (
	Rectangle Shape = iota + 1 // WidthFt × LengthFt
	Square                     // WidthFt × WidthFt
	Strip                      // WidthFt wide, infinitely long
	Circle                     // WidthFt is the diameter
)

func (s Shape) String() string {
	switch s {
	case Rectangle:
		return "rectangle"
	case Square:
		return "square"
	case Strip:
		return "strip"
	case Circle:
		return "circle"
	}
	return fmt.Sprintf("Shape(%d)", int(s))
}

// StressMethod is how the vertical stress increase under a loaded area is
// estimated.
type StressMethod int

const (
	// TwoToOne spreads the load at 2 vertical to 1 horizontal from every
	// edge: Δσ = qBL/((B+z)(L+z)) for a rectangle (Das, Principles of
	// Foundation Engineering, "2:1 method"). The same spread gives qB/(B+z)
	// for a strip and qD²/(D+z)² for a circle of diameter D (common
	// practice; the circle form reproduces the METU CE366 tank answer).
	TwoToOne StressMethod = iota + 1
	// Boussinesq integrates Boussinesq's point-load solution for an
	// elastic half-space over the loaded area, at the centre: Newmark's
	// closed form for the corner of a rectangle, superposed four times;
	// the closed forms for the centre line of a strip and the centre of a
	// circle.
	Boussinesq
)

func (m StressMethod) String() string {
	switch m {
	case TwoToOne:
		return "2:1"
	case Boussinesq:
		return "Boussinesq"
	}
	return fmt.Sprintf("StressMethod(%d)", int(m))
}

// Area is a uniformly loaded area at the foundation level.
type Area struct {
	Shape    Shape
	WidthFt  float64 // B: short side, side of a square, strip width, circle diameter
	LengthFt float64 // L: long side of a rectangle; ignored for other shapes
}

func (a Area) check() error {
	switch a.Shape {
	case Rectangle, Square, Strip, Circle:
	default:
		return badInput("Area.Shape", a.Shape, "rectangle, square, strip or circle")
	}
	if err := checkLength("Area.WidthFt", a.WidthFt, true); err != nil {
		return err
	}
	if a.Shape == Rectangle {
		return checkLength("Area.LengthFt", a.LengthFt, true)
	}
	return nil
}

func checkMethod(m StressMethod) error {
	if m != TwoToOne && m != Boussinesq {
		return badInput("method", m, "2:1 or Boussinesq")
	}
	return nil
}

// Influence returns Δσ/q, the vertical stress increase at depth zFt below
// the centre of the loaded area as a fraction of the uniform pressure q on
// it. It falls from 1 at z = 0 towards 0 with depth and never rises.
func Influence(a Area, m StressMethod, zFt float64) (float64, error) {
	if err := a.check(); err != nil {
		return 0, err
	}
	if err := checkMethod(m); err != nil {
		return 0, err
	}
	if err := checkLength("zFt", zFt, false); err != nil {
		return 0, err
	}
	return influence(a, m, zFt), nil
}

// influence is Influence for checked input.
func influence(a Area, m StressMethod, z float64) float64 {
	b := a.WidthFt
	l := a.LengthFt
	if a.Shape == Square {
		l = b
	}
	if z <= 0 {
		return 1
	}
	if m == TwoToOne {
		switch a.Shape {
		case Strip:
			return b / (b + z)
		case Circle:
			return b * b / ((b + z) * (b + z))
		}
		return b * l / ((b + z) * (l + z))
	}
	switch a.Shape {
	case Strip:
		// Flexible strip of width B, on its centre line: with
		// α = 2·atan(B/2z) the angle the strip subtends,
		// Δσ/q = (α + sin α)/π (Das, after Boussinesq).
		alpha := 2 * math.Atan(b/(2*z))
		return (alpha + math.Sin(alpha)) / math.Pi
	case Circle:
		// Centre of a flexible circle of radius R:
		// Δσ/q = 1 − (1/(1+(R/z)²))^{3/2}.
		r := b / 2 / z
		return 1 - math.Pow(1/(1+r*r), 1.5)
	}
	// Centre of a B × L rectangle: four rectangles of B/2 × L/2 meet there
	// with a corner each.
	return 4 * CornerInfluence(b/2/z, l/2/z)
}

// CornerInfluence is Newmark's (1935) influence value for the vertical
// stress under the corner of a uniformly loaded rectangle of sides mz and nz
// at depth z, from integrating Boussinesq's point-load solution:
//
//	I = 1/(4π) · [ 2mn√V/(V + m²n²) · (V + 1)/V + atan2(2mn√V, V − m²n²) ],
//	V = m² + n² + 1.
//
// atan2 takes the branch past π/2 that the tabulated form adds π for when
// m²n² > V. m and n must be positive.
func CornerInfluence(m, n float64) float64 {
	v := m*m + n*n + 1
	v1 := m * m * n * n
	sv := math.Sqrt(v)
	return (2*m*n*sv/(v+v1)*(v+1)/v + math.Atan2(2*m*n*sv, v-v1)) / (4 * math.Pi)
}
