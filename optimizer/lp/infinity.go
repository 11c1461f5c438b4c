package lp

import "math"

// Infinity is the magnitude from which a bound counts as infinite: a
// column or row bound v with v ≥ Infinity is +∞ and one with
// v ≤ −Infinity is −∞. Many model writers use 1e30 (or 1e20) for "no
// bound"; 1e20 is the threshold of CPLEX's CPX_INFBOUND and of HiGHS's
// infinite_bound option (both from memory), so a model reads the same
// here as there.
const Infinity = 1e20

// MaxFinite is the largest magnitude accepted for a finite bound, cost or
// coefficient (1e15, the default of HiGHS's large_matrix_value option,
// from memory). The simplex works with absolute tolerances near 1e-9, so
// values beyond it lose every digit that a tolerance could tell apart;
// Validate refuses them rather than risk a wrong optimum. A bound meant
// as "none" should be written as ±Infinity or beyond.
const MaxFinite = 1e15

// NormBound returns v with magnitudes of Infinity and beyond made ±Inf.
func NormBound(v float64) float64 {
	switch {
	case v >= Infinity:
		return math.Inf(1)
	case v <= -Infinity:
		return math.Inf(-1)
	}
	return v
}

// normBounds returns a copy of v through NormBound.
func normBounds(v []float64) []float64 {
	out := make([]float64, len(v))
	for k, x := range v {
		out[k] = NormBound(x)
	}
	return out
}
