package lp

import (
	"errors"
	"math"
	"testing"
)

// TestLargeBoundsAreInfinite: the Chvátal chapter 2 LP (max 5x1+4x2+3x3,
// optimum 13; Chvátal, Linear Programming (1983), ch. 2, from memory)
// with 1e30 and 1e20 written for its infinite bounds keeps its optimum,
// through New and through SetColBounds / SetRowBounds; the maximization of
// x1 alone with x1 ≤ 1e30 and no row bounding it is unbounded.
func TestLargeBoundsAreInfinite(t *testing.T) {
	p := dense([]float64{-5, -4, -3},
		[][]float64{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}},
		fill(3, -1e30), []float64{5, 11, 8}, fill(3, 0), fill(3, 1e20))
	r, err := Solve(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if r.Status != Optimal || math.Abs(r.Obj+13) > 1e-9 {
		t.Fatalf("status %v objective %v, want optimal -13", r.Status, r.Obj)
	}
	s, err := New(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	s.SetColBounds(0, 0, 1e30)
	s.SetRowBounds(0, -1e25, 5)
	if lo, up := s.ColBounds(0); lo != 0 || !math.IsInf(up, 1) {
		t.Errorf("SetColBounds(0, 0, 1e30) gave [%v, %v], want [0, +Inf]", lo, up)
	}
	if r, err := s.Solve(); err != nil || r.Status != Optimal || math.Abs(r.Obj+13) > 1e-9 {
		t.Errorf("after SetColBounds: %v %v", r, err)
	}
	u := dense([]float64{-1, 0}, [][]float64{{1, -1}}, []float64{-1e30}, []float64{1}, []float64{0, 0}, []float64{1e30, 1e30})
	if r, err := Solve(u, Options{}); err != nil || r.Status != Unbounded {
		t.Errorf("max x1 with x1 - x2 ≤ 1 and bounds 1e30: %v %v, want unbounded", r, err)
	}
}

// TestValidateRanges: finite bounds beyond MaxFinite, coefficients and
// costs beyond MaxFinite and a lower bound of 1e30 (+∞) are refused.
func TestValidateRanges(t *testing.T) {
	for name, p := range map[string]*Problem{
		"bound 1e16":      dense([]float64{1}, [][]float64{{1}}, []float64{0}, []float64{1}, []float64{0}, []float64{1e16}),
		"row bound -1e16": dense([]float64{1}, [][]float64{{1}}, []float64{-1e16}, []float64{1}, []float64{0}, []float64{1}),
		"lower 1e30":      dense([]float64{1}, [][]float64{{1}}, []float64{0}, []float64{1}, []float64{1e30}, []float64{inf}),
		"coefficient":     dense([]float64{1}, [][]float64{{1e300}}, []float64{0}, []float64{1}, []float64{0}, []float64{1}),
		"cost":            dense([]float64{2e15}, [][]float64{{1}}, []float64{0}, []float64{1}, []float64{0}, []float64{1}),
	} {
		if err := p.Validate(); !errors.Is(err, ErrInvalid) {
			t.Errorf("%s: Validate = %v, want ErrInvalid", name, err)
		}
	}
	if err := dense([]float64{1e15}, [][]float64{{-1e15}}, []float64{-1e15}, []float64{1e15}, []float64{-1e15}, []float64{1e15}).Validate(); err != nil {
		t.Errorf("values of exactly 1e15: %v", err)
	}
}
