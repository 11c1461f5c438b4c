package rules

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

func TestSquareCentreInfluence(t *testing.T) {
	const b = 10.0
	sq := Area{Shape: Square, WidthFt: b}
	// Square footing, Boussinesq at the centre (SOURCES: derived from the
	// Boussinesq solution): Δσ/q = 0.336 at z = B, given to 3 decimals.
	if got, _ := Influence(sq, Boussinesq, b); !near(got, 0.336, 0.0005) {
		t.Errorf("Δσ/q at z = B: %.5f, want 0.336 (Boussinesq, derived)", got)
	}
	for _, c := range []struct {
		method   StressMethod
		fraction float64
		wantB    float64 // depth in widths
		tolB     float64
		source   string
	}{
		{Boussinesq, 0.10, 2.09, 0.005, "Boussinesq solution, derived: 10 % at 2.09B"},
		{Boussinesq, 0.05, 3.02, 0.005, "Boussinesq solution, derived: 5 % at 3.02B"},
		{TwoToOne, 0.10, math.Sqrt(10) - 1, 1e-9, "2:1 method, derived: 10 % at (√10 − 1)B"},
		{TwoToOne, 0.10, 2.162, 0.0005, "2:1 method, derived: 2.162B"},
	} {
		z, err := DepthToLoadFraction(sq, c.method, c.fraction)
		if err != nil {
			t.Fatal(err)
		}
		if got := z / b; !near(got, c.wantB, c.tolB) {
			t.Errorf("%s %g: %.6fB, want %.6fB ± %g (%s)", c.method, c.fraction, got, c.wantB, c.tolB, c.source)
		}
	}
}

// pointLoadSum integrates Boussinesq's point-load solution,
// dΔσ = 3q z³ / (2π R⁵) dA, over a region by Gauss–Legendre quadrature —
// an independent check of the closed forms (gonum integrate/quad).
func rectangleByQuadrature(b, l, z float64) float64 {
	const n = 200
	inner := func(x float64) float64 {
		return quad.Fixed(func(y float64) float64 {
			r2 := x*x + y*y + z*z
			return 3 * z * z * z / (2 * math.Pi * r2 * r2 * math.Sqrt(r2))
		}, -l/2, l/2, n, quad.Legendre{}, 0)
	}
	return quad.Fixed(inner, -b/2, b/2, n, quad.Legendre{}, 0)
}

func circleByQuadrature(d, z float64) float64 {
	return quad.Fixed(func(r float64) float64 {
		r2 := r*r + z*z
		return 3 * z * z * z * r / (r2 * r2 * math.Sqrt(r2))
	}, 0, d/2, 200, quad.Legendre{}, 0)
}

func TestBoussinesqClosedFormsAgainstQuadrature(t *testing.T) {
	for _, z := range []float64{2, 5, 10, 20, 40} {
		rect := Area{Shape: Rectangle, WidthFt: 6, LengthFt: 15}
		got, _ := Influence(rect, Boussinesq, z)
		want := rectangleByQuadrature(6, 15, z) // Boussinesq (1885) point load, integrated numerically
		if !near(got, want, 1e-6) {
			t.Errorf("rectangle 6 × 15 ft, z = %g: Newmark %.8f, quadrature %.8f", z, got, want)
		}
		circ := Area{Shape: Circle, WidthFt: 12}
		got, _ = Influence(circ, Boussinesq, z)
		want = circleByQuadrature(12, z) // same point load over a disc
		if !near(got, want, 1e-6) {
			t.Errorf("circle 12 ft, z = %g: closed form %.8f, quadrature %.8f", z, got, want)
		}
		// A strip is the limit of a long rectangle (same Boussinesq solution).
		strip := Area{Shape: Strip, WidthFt: 6}
		got, _ = Influence(strip, Boussinesq, z)
		long, _ := Influence(Area{Shape: Rectangle, WidthFt: 6, LengthFt: 1e7}, Boussinesq, z)
		if !near(got, long, 1e-6) {
			t.Errorf("strip 6 ft, z = %g: %.8f, very long rectangle %.8f", z, got, long)
		}
	}
}

func TestCornerInfluenceBranch(t *testing.T) {
	// Where m²n² > m² + n² + 1 the tabulated arctangent needs π added;
	// atan2 must give a value continuous across that line. Newmark's
	// corner value tends to 1/4 as m, n → ∞ (a quarter of an infinite
	// loaded plane, Boussinesq).
	prev := 0.0
	for _, m := range []float64{0.1, 0.5, 1, 1.5, 1.6, 1.7, 2, 5, 50, 1e4} {
		got := CornerInfluence(m, m)
		if got < prev {
			t.Errorf("corner influence falls from %.6f to %.6f at m = n = %g", prev, got, m)
		}
		prev = got
	}
	if !near(prev, 0.25, 1e-6) {
		t.Errorf("corner influence at m = n = 1e4: %.8f, want 1/4", prev)
	}
}

func TestInfluenceNeverRises(t *testing.T) {
	areas := []Area{
		{Shape: Square, WidthFt: 8},
		{Shape: Rectangle, WidthFt: 8, LengthFt: 40},
		{Shape: Strip, WidthFt: 8},
		{Shape: Circle, WidthFt: 8},
	}
	for _, a := range areas {
		for _, m := range []StressMethod{TwoToOne, Boussinesq} {
			prev := 1.0
			for z := 0.0; z <= 400; z += 0.25 {
				got, err := Influence(a, m, z)
				if err != nil {
					t.Fatal(err)
				}
				if got > prev+1e-15 || got <= 0 || got > 1 {
					t.Fatalf("%s %s: Δσ/q = %.12f at z = %g after %.12f", a.Shape, m, got, z, prev)
				}
				prev = got
			}
		}
	}
}
