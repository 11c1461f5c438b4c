package lp

import (
	"fmt"
	"math"
)

// Validate checks that p is well formed: slice lengths match NumRows and
// NumCols, ColStart is nondecreasing from 0, row indices are in range and
// not repeated within a column, no value is NaN, coefficients and costs
// are at most MaxFinite in magnitude, and every bound (read through
// NormBound, so that ±1e20 and beyond are infinite) is either infinite or
// at most MaxFinite in magnitude, every lower bound below +∞, every upper
// bound above −∞ and lower ≤ upper. The error wraps ErrInvalid and names
// the field and index at fault.
func (p *Problem) Validate() error {
	bad := func(format string, a ...any) error {
		return fmt.Errorf("%w: %s", ErrInvalid, fmt.Sprintf(format, a...))
	}
	if p.NumRows < 0 || p.NumCols < 0 {
		return bad("NumRows %d and NumCols %d must be ≥ 0", p.NumRows, p.NumCols)
	}
	m, n := p.NumRows, p.NumCols
	if len(p.Obj) != n {
		return bad("len(Obj) is %d, want NumCols = %d", len(p.Obj), n)
	}
	if len(p.ColLo) != n || len(p.ColUp) != n {
		return bad("len(ColLo) = %d and len(ColUp) = %d, want NumCols = %d", len(p.ColLo), len(p.ColUp), n)
	}
	if len(p.RowLo) != m || len(p.RowUp) != m {
		return bad("len(RowLo) = %d and len(RowUp) = %d, want NumRows = %d", len(p.RowLo), len(p.RowUp), m)
	}
	if len(p.ColStart) != n+1 {
		return bad("len(ColStart) is %d, want NumCols+1 = %d", len(p.ColStart), n+1)
	}
	if p.ColStart[0] != 0 {
		return bad("ColStart[0] is %d, want 0", p.ColStart[0])
	}
	for j := 0; j < n; j++ {
		if p.ColStart[j+1] < p.ColStart[j] {
			return bad("ColStart[%d] = %d is less than ColStart[%d] = %d", j+1, p.ColStart[j+1], j, p.ColStart[j])
		}
	}
	nnz := p.ColStart[n]
	if len(p.RowIndex) != nnz || len(p.Value) != nnz {
		return bad("len(RowIndex) = %d and len(Value) = %d, want ColStart[NumCols] = %d", len(p.RowIndex), len(p.Value), nnz)
	}
	seen := make([]int, m)
	for i := range seen {
		seen[i] = -1
	}
	for j := 0; j < n; j++ {
		if err := checkBounds("column", j, p.ColLo[j], p.ColUp[j]); err != nil {
			return err
		}
		if c := p.Obj[j]; math.IsNaN(c) || math.Abs(c) > MaxFinite {
			return bad("Obj[%d] is %v, want a number of magnitude at most %g", j, c, MaxFinite)
		}
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			i := p.RowIndex[k]
			if i < 0 || i >= m {
				return bad("RowIndex[%d] = %d (column %d) is outside [0, %d)", k, i, j, m)
			}
			if seen[i] == j {
				return bad("column %d has row %d twice (RowIndex[%d]); merge the entries", j, i, k)
			}
			seen[i] = j
			if v := p.Value[k]; math.IsNaN(v) || math.Abs(v) > MaxFinite {
				return bad("Value[%d] (row %d, column %d) is %v, want a number of magnitude at most %g", k, i, j, v, MaxFinite)
			}
		}
	}
	for i := 0; i < m; i++ {
		if err := checkBounds("row", i, p.RowLo[i], p.RowUp[i]); err != nil {
			return err
		}
	}
	return nil
}

func checkBounds(what string, k int, lo, up float64) error {
	lo, up = NormBound(lo), NormBound(up)
	switch {
	case math.IsNaN(lo) || math.IsNaN(up):
		return fmt.Errorf("%w: %s %d bounds [%v, %v] contain NaN", ErrInvalid, what, k, lo, up)
	case math.IsInf(lo, 1):
		return fmt.Errorf("%w: %s %d lower bound is +Inf, want finite or -Inf", ErrInvalid, what, k)
	case math.IsInf(up, -1):
		return fmt.Errorf("%w: %s %d upper bound is -Inf, want finite or +Inf", ErrInvalid, what, k)
	case !math.IsInf(lo, 0) && math.Abs(lo) > MaxFinite, !math.IsInf(up, 0) && math.Abs(up) > MaxFinite:
		return fmt.Errorf("%w: %s %d bounds [%v, %v]: a finite bound must be at most %g in magnitude (write ±%g or beyond for none)", ErrInvalid, what, k, lo, up, MaxFinite, Infinity)
	case lo > up:
		return fmt.Errorf("%w: %s %d lower bound %v exceeds upper bound %v", ErrInvalid, what, k, lo, up)
	}
	return nil
}
