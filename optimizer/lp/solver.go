package lp

import (
	"fmt"
	"math"
)

// Variable status in the computational form.
const (
	stBasic int8 = iota
	stLower      // nonbasic at its lower bound (also used for fixed)
	stUpper      // nonbasic at its upper bound
	stFree       // nonbasic free variable, held at zero
)

// Solver is a bounded-variable primal and dual simplex solver that keeps
// its basis between solves, so that a sequence of related problems
// (branching on bounds, sweeping a row bound or an objective weight) is
// solved warm.
//
// Internally the problem is put in the computational form of Koberstein
// (2005): one logical variable per row,
//
//	A x + s = 0,   ColLo ≤ x ≤ ColUp,   −RowUp ≤ s ≤ −RowLo,
//
// so that every row bound is a bound on a variable and the logical
// columns form the identity (the slack basis B = I).
//
// A Solver is not safe for concurrent use.
type Solver struct {
	m, n int
	prob Problem // private copy

	// Scaled copy of A by columns (R A C, Koberstein 2005), the
	// scaled costs C c, and the scale factors (powers of 2).
	colStart []int
	colRow   []int
	colVal   []float64
	obj      []float64
	rowScale []float64 // r_i
	colScale []float64 // c_j: x_j = c_j x'_j

	// CSR copy of the scaled A, for computing pivot rows from a sparse ρ.
	rowStart []int
	rowCol   []int
	rowVal   []float64

	lo, up []float64 // length n+m; logical bounds already negated
	cost   []float64 // current (possibly perturbed/shifted) costs, length n+m
	stat   []int8    // length n+m
	head   []int     // basis position → variable
	x      []float64 // length n+m
	d      []float64 // reduced costs, length n+m

	dse []float64 // dual steepest-edge weights by basis position

	lu         *luFactor
	dualFresh  bool  // rho and d are those of an optimal run just ended (result.go)
	factHead   []int // head when lu was last factorized
	needFactor bool
	opt        Options

	iters   int
	feasTol float64 // s.opt.feasTol(), cached for the hot loops
	// forcePrimal makes the first round use the primal simplex (tests).
	forcePrimal bool
	rng         uint64
	stopStat    Status

	// scratch
	rho, alpha, tau, rowAlpha, flipCol []float64
	rhoIdx                             []int

	// Sparse work of the dual simplex (dual.go): drho, alpha, tau and
	// flipCol are kept zero outside their index lists; infPos lists the
	// basis positions that may be primal infeasible (infIn marks them);
	// fcMark marks rows during the flip column's assembly.
	drho                    []float64
	alphaIdx, tauIdx, fcIdx []int
	infPos                  []int
	infVal                  []float64 // infeasibility by position, set by touchInf
	infIn, fcMark           []bool
	// Recent result densities of the solves by kind, which pick the
	// hypersparse or the dense solve (lu_sparse.go).
	hintRho, hintAlpha, hintTau, hintFlip float64
	rowMark                               []bool
	rowList                               []int
	candIdx, flipList, groupList          []int
	unit                                  []int // unit[i] == i
}

// NumRows returns the number of rows.
func (s *Solver) NumRows() int { return s.m }

// NumCols returns the number of structural columns.
func (s *Solver) NumCols() int { return s.n }

// New copies p into a new Solver with the slack basis. It returns an
// error wrapping ErrInvalid when p is malformed (see Problem.Validate).
func New(p *Problem, opt Options) (*Solver, error) {
	if p == nil {
		return nil, fmt.Errorf("%w: nil problem", ErrInvalid)
	}
	if err := p.Validate(); err != nil {
		return nil, err
	}
	m, n := p.NumRows, p.NumCols
	s := &Solver{m: m, n: n, opt: opt, feasTol: opt.feasTol()}
	s.prob = Problem{
		NumRows:  m,
		NumCols:  n,
		Obj:      append([]float64(nil), p.Obj...),
		ColLo:    normBounds(p.ColLo),
		ColUp:    normBounds(p.ColUp),
		RowLo:    normBounds(p.RowLo),
		RowUp:    normBounds(p.RowUp),
		ColStart: append([]int(nil), p.ColStart...),
		RowIndex: append([]int(nil), p.RowIndex...),
		Value:    append([]float64(nil), p.Value...),
	}
	s.rowScale, s.colScale = scaleFactors(p)
	nnz := p.ColStart[n]
	s.colStart = s.prob.ColStart
	s.colRow = s.prob.RowIndex
	s.colVal = make([]float64, nnz)
	s.obj = make([]float64, n)
	for j := 0; j < n; j++ {
		s.obj[j] = p.Obj[j] * s.colScale[j]
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			s.colVal[k] = p.Value[k] * s.rowScale[p.RowIndex[k]] * s.colScale[j]
		}
	}
	// Row-wise copy.
	s.rowStart = make([]int, m+1)
	for _, i := range p.RowIndex {
		s.rowStart[i+1]++
	}
	for i := 0; i < m; i++ {
		s.rowStart[i+1] += s.rowStart[i]
	}
	s.rowCol = make([]int, nnz)
	s.rowVal = make([]float64, nnz)
	next := append([]int(nil), s.rowStart[:m]...)
	for j := 0; j < n; j++ {
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			i := p.RowIndex[k]
			s.rowCol[next[i]] = j
			s.rowVal[next[i]] = s.colVal[k]
			next[i]++
		}
	}
	N := n + m
	s.lo = make([]float64, N)
	s.up = make([]float64, N)
	s.cost = make([]float64, N)
	s.stat = make([]int8, N)
	s.x = make([]float64, N)
	s.d = make([]float64, N)
	s.head = make([]int, m)
	s.dse = make([]float64, m)
	for j := 0; j < n; j++ {
		s.lo[j], s.up[j] = s.prob.ColLo[j]/s.colScale[j], s.prob.ColUp[j]/s.colScale[j]
	}
	for i := 0; i < m; i++ {
		s.lo[n+i], s.up[n+i] = -s.prob.RowUp[i]*s.rowScale[i], -s.prob.RowLo[i]*s.rowScale[i]
	}
	s.lu = newLU(m)
	s.rho = make([]float64, m)
	s.alpha = make([]float64, m)
	s.tau = make([]float64, m)
	s.flipCol = make([]float64, m)
	s.rowAlpha = make([]float64, N)
	s.rowMark = make([]bool, n)
	s.drho = make([]float64, m)
	s.infIn = make([]bool, m)
	s.infVal = make([]float64, m)
	s.fcMark = make([]bool, m)
	s.unit = make([]int, m)
	for i := range s.unit {
		s.unit[i] = i
	}
	s.slackBasis()
	return s, nil
}

// slackBasis makes every logical basic and puts every structural at the
// bound nearest zero (a free one at zero).
func (s *Solver) slackBasis() {
	for j := 0; j < s.n; j++ {
		s.stat[j] = s.nonbasicStatus(j, s.obj[j])
	}
	for i := 0; i < s.m; i++ {
		s.head[i] = s.n + i
		s.stat[s.n+i] = stBasic
		s.dse[i] = 1
	}
	s.needFactor = true
}

// nonbasicStatus picks the bound at which nonbasic j rests, preferring
// the one that makes reduced cost dj dual feasible.
func (s *Solver) nonbasicStatus(j int, dj float64) int8 {
	lo, up := s.lo[j], s.up[j]
	loFin, upFin := !math.IsInf(lo, -1), !math.IsInf(up, 1)
	switch {
	case loFin && upFin:
		if dj < 0 {
			return stUpper
		}
		return stLower
	case loFin:
		return stLower
	case upFin:
		return stUpper
	}
	return stFree
}

// Solve solves p from the slack basis.
func Solve(p *Problem, opt Options) (*Result, error) {
	s, err := New(p, opt)
	if err != nil {
		return nil, err
	}
	return s.Solve()
}

// SetOptions replaces the options used by later solves.
func (s *Solver) SetOptions(opt Options) {
	s.opt = opt
	s.feasTol = opt.feasTol()
}

func (s *Solver) checkCol(j int) {
	if j < 0 || j >= s.n {
		panic(fmt.Sprintf("lp: column index %d out of range [0, %d)", j, s.n))
	}
}

func (s *Solver) checkRow(i int) {
	if i < 0 || i >= s.m {
		panic(fmt.Sprintf("lp: row index %d out of range [0, %d)", i, s.m))
	}
}

// SetColBounds sets the bounds of column j, keeping the basis. A lower
// bound above the upper bound makes the next Solve report Infeasible.
func (s *Solver) SetColBounds(j int, lo, up float64) {
	s.checkCol(j)
	lo, up = NormBound(lo), NormBound(up)
	s.prob.ColLo[j], s.prob.ColUp[j] = lo, up
	s.lo[j], s.up[j] = lo/s.colScale[j], up/s.colScale[j]
	s.fixNonbasic(j)
}

// ColBounds returns the current bounds of column j.
func (s *Solver) ColBounds(j int) (lo, up float64) {
	s.checkCol(j)
	return s.prob.ColLo[j], s.prob.ColUp[j]
}

// SetRowBounds sets the bounds of row i, keeping the basis.
func (s *Solver) SetRowBounds(i int, lo, up float64) {
	s.checkRow(i)
	lo, up = NormBound(lo), NormBound(up)
	s.prob.RowLo[i], s.prob.RowUp[i] = lo, up
	s.lo[s.n+i], s.up[s.n+i] = -up*s.rowScale[i], -lo*s.rowScale[i]
	s.fixNonbasic(s.n + i)
}

// RowBounds returns the current bounds of row i.
func (s *Solver) RowBounds(i int) (lo, up float64) {
	s.checkRow(i)
	return s.prob.RowLo[i], s.prob.RowUp[i]
}

// SetObj sets the objective coefficient of column j, keeping the basis.
func (s *Solver) SetObj(j int, c float64) {
	s.checkCol(j)
	s.prob.Obj[j] = c
	s.obj[j] = c * s.colScale[j]
}

// Obj returns the objective coefficient of column j.
func (s *Solver) Obj(j int) float64 {
	s.checkCol(j)
	return s.prob.Obj[j]
}

// fixNonbasic keeps the status of nonbasic j consistent with its bounds
// after they changed.
func (s *Solver) fixNonbasic(j int) {
	switch s.stat[j] {
	case stBasic:
		return
	case stLower:
		if math.IsInf(s.lo[j], -1) {
			s.stat[j] = s.nonbasicStatus(j, 0)
		}
	case stUpper:
		if math.IsInf(s.up[j], 1) {
			s.stat[j] = s.nonbasicStatus(j, 0)
		}
	case stFree:
		s.stat[j] = s.nonbasicStatus(j, 0)
	}
}

// Basis is a snapshot of which variables (columns and row logicals) are
// basic and at which bound each nonbasic one rests.
type Basis struct {
	owner *Solver
	stat  []int8
	head  []int
	dse   []float64
}

// Basis returns a snapshot of the current basis.
func (s *Solver) Basis() *Basis {
	return &Basis{
		owner: s,
		stat:  append([]int8(nil), s.stat...),
		head:  append([]int(nil), s.head...),
		dse:   append([]float64(nil), s.dse...),
	}
}

// SetBasis restores a snapshot taken from this Solver by Basis. It
// returns ErrBasis for a snapshot of another Solver.
func (s *Solver) SetBasis(b *Basis) error {
	if b == nil || b.owner != s || len(b.stat) != len(s.stat) || len(b.head) != s.m {
		return ErrBasis
	}
	// The factorization depends only on which column sits in which basis
	// position; if that is unchanged (a child solve that made no basis
	// change) it stays valid.
	same := true
	for p, j := range b.head {
		if s.head[p] != j {
			same = false
			break
		}
	}
	copy(s.stat, b.stat)
	copy(s.head, b.head)
	copy(s.dse, b.dse)
	for j := range s.stat {
		s.fixNonbasic(j)
	}
	if !same {
		// A branch-and-bound parent's basis is often the one last
		// factorized, before the child's updates: restoring that
		// factorization costs O(m) instead of a new one.
		if s.factHead != nil && equalInts(b.head, s.factHead) {
			s.lu.restore()
			s.needFactor = false
		} else {
			s.needFactor = true
		}
	}
	return nil
}

func equalInts(a, b []int) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// column returns the nonzeros of variable j's column in [A I].
func (s *Solver) column(j int) ([]int, []float64) {
	if j < s.n {
		a, b := s.colStart[j], s.colStart[j+1]
		return s.colRow[a:b], s.colVal[a:b]
	}
	i := j - s.n
	return s.unit[i : i+1 : i+1], unitVal[:]
}

var unitVal = [1]float64{1}
