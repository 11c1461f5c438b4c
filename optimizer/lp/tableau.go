package lp

import "fmt"

// VarStatus says where a variable of the computational form rests.
type VarStatus int8

const (
	// Basic: the variable is in the basis.
	Basic VarStatus = iota
	// AtLower: nonbasic at its lower bound (also a fixed variable).
	AtLower
	// AtUpper: nonbasic at its upper bound.
	AtUpper
	// Free: nonbasic free variable held at zero.
	Free
)

// VarStatus returns the status of variable k of the computational form
// (see TableauRow) in the current basis.
func (s *Solver) VarStatus(k int) VarStatus {
	if k < 0 || k >= s.n+s.m {
		panic(fmt.Sprintf("lp: variable index %d out of range [0, %d)", k, s.n+s.m))
	}
	switch s.stat[k] {
	case stBasic:
		return Basic
	case stLower:
		return AtLower
	case stUpper:
		return AtUpper
	}
	return Free
}

// BasicVar returns the variable in basis position p (0 ≤ p < NumRows).
func (s *Solver) BasicVar(p int) int {
	s.checkRow(p)
	return s.head[p]
}

// TableauRow writes row p of the simplex tableau of the current basis
// into alpha (length NumCols+NumRows), in the unscaled computational
// form: variables 0..n-1 are the columns x, variable n+i is the logical
// of row i, equal to −(A x)_i, and A x + s = 0. With v the vector of all
// n+m variables and B the basis,
//
//	v_BasicVar(p) + Σ_k alpha[k] v_k = 0
//
// where alpha is zero at every basic variable but the one of position p
// (where it is 1). It is meant for cutting planes (Gomory 1960) after an
// optimal Solve; the basis must be the one Solve ended with.
func (s *Solver) TableauRow(p int, alpha []float64) error {
	s.checkRow(p)
	if len(alpha) != s.n+s.m {
		return fmt.Errorf("%w: alpha has length %d, want %d", ErrInvalid, len(alpha), s.n+s.m)
	}
	if s.needFactor {
		if err := s.refactor(); err != nil {
			return err
		}
	}
	rho := make([]float64, s.m)
	rho[p] = 1
	s.lu.btran(rho) // ρ = e_pᵀ B'⁻¹ by rows, in the scaled space
	// Scaled variables: x'_j = x_j / c_j, s'_i = r_i s_i; the unscaled
	// coefficient of variable k is D_B α'_k / D_k with D_j = c_j and
	// D_{n+i} = 1/r_i.
	dim := func(k int) float64 {
		if k < s.n {
			return s.colScale[k]
		}
		return 1 / s.rowScale[k-s.n]
	}
	db := dim(s.head[p])
	for j := 0; j < s.n; j++ {
		if s.stat[j] == stBasic {
			alpha[j] = 0
			continue
		}
		v := 0.0
		for k := s.colStart[j]; k < s.colStart[j+1]; k++ {
			v += s.colVal[k] * rho[s.colRow[k]]
		}
		alpha[j] = db * v / dim(j)
	}
	for i := 0; i < s.m; i++ {
		k := s.n + i
		if s.stat[k] == stBasic {
			alpha[k] = 0
			continue
		}
		alpha[k] = db * rho[i] / dim(k)
	}
	alpha[s.head[p]] = 1
	return nil
}

// AddRows appends rows lo[k] ≤ Σ vals x_cols ≤ up[k], row k's entries
// being cols[start[k]:start[k+1]] and vals[start[k]:start[k+1]] (columns
// distinct within a row), and keeps the current basis with the new
// rows' logicals basic, so that the next Solve starts from the last
// optimum (dual feasible, a cut violated). Basis snapshots taken before
// no longer apply to this Solver (SetBasis returns ErrBasis).
func (s *Solver) AddRows(lo, up []float64, start, cols []int, vals []float64) error {
	k := len(lo)
	if len(up) != k || len(start) != k+1 || start[0] != 0 || start[k] != len(cols) || len(vals) != len(cols) {
		return fmt.Errorf("%w: AddRows: lengths of lo %d, up %d, start %d, cols %d, vals %d disagree", ErrInvalid, len(lo), len(up), len(start), len(cols), len(vals))
	}
	if k == 0 {
		return nil
	}
	n, m := s.n, s.m
	old := &s.prob
	count := make([]int, n+1)
	for _, j := range cols {
		if j < 0 || j >= n {
			return fmt.Errorf("%w: AddRows: column %d out of range [0, %d)", ErrInvalid, j, n)
		}
		count[j+1]++
	}
	p := Problem{
		NumRows: m + k, NumCols: n,
		Obj:   append([]float64(nil), old.Obj...),
		ColLo: append([]float64(nil), old.ColLo...),
		ColUp: append([]float64(nil), old.ColUp...),
		RowLo: append(append([]float64(nil), old.RowLo...), lo...),
		RowUp: append(append([]float64(nil), old.RowUp...), up...),
	}
	p.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		p.ColStart[j+1] = p.ColStart[j] + (old.ColStart[j+1] - old.ColStart[j]) + count[j+1]
	}
	nnz := p.ColStart[n]
	p.RowIndex = make([]int, nnz)
	p.Value = make([]float64, nnz)
	next := make([]int, n)
	for j := 0; j < n; j++ {
		t := p.ColStart[j]
		for q := old.ColStart[j]; q < old.ColStart[j+1]; q++ {
			p.RowIndex[t], p.Value[t] = old.RowIndex[q], old.Value[q]
			t++
		}
		next[j] = t
	}
	for r := 0; r < k; r++ {
		for q := start[r]; q < start[r+1]; q++ {
			j := cols[q]
			p.RowIndex[next[j]], p.Value[next[j]] = m+r, vals[q]
			next[j]++
		}
	}
	ns, err := New(&p, s.opt)
	if err != nil {
		return err
	}
	copy(ns.stat, s.stat)
	copy(ns.head, s.head)
	copy(ns.dse, s.dse)
	for r := 0; r < k; r++ {
		ns.stat[n+m+r] = stBasic
		ns.head[m+r] = n + m + r
		ns.dse[m+r] = 1
	}
	for j := range ns.stat {
		ns.fixNonbasic(j)
	}
	ns.needFactor = true
	ns.forcePrimal = s.forcePrimal
	*s = *ns
	return nil
}
