package lp

import (
	"context"
	"errors"
	"fmt"
	"math"
	"time"
)

// rngSeed fixes the pseudo-random stream used for cost perturbation so
// that every solve of the same input takes the same path.
const rngSeed = 0x9E3779B97F4A7C15

// rand01 returns a number in [0, 1) from a xorshift64* generator
// (Vigna 2016).
func (s *Solver) rand01() float64 {
	s.rng ^= s.rng >> 12
	s.rng ^= s.rng << 25
	s.rng ^= s.rng >> 27
	return float64((s.rng*2685821657736338717)>>11) / (1 << 53)
}

// Solve solves the current problem starting from the current basis (warm
// start): the dual simplex when the basis is dual feasible (as after
// bound changes); otherwise, as after objective changes, a dual phase 1
// on the auxiliary boxed problem and then the dual simplex, with the
// primal simplex as fallback and for clean-up (see the package doc). The returned error is non-nil only for numerical
// failure (ErrNumerical) or for bounds set to NaN, a lower bound of +Inf
// or an upper bound of −Inf (ErrInvalid); infeasibility (including a
// lower bound above the upper), unboundedness and limits are statuses.
func (s *Solver) Solve() (*Result, error) {
	s.iters = 0
	for j := 0; j < s.n+s.m; j++ {
		lo, up := s.lo[j], s.up[j]
		if math.IsNaN(lo) || math.IsNaN(up) || math.IsInf(lo, 1) || math.IsInf(up, -1) {
			what, k := "column", j
			if j >= s.n {
				what, k = "row", j-s.n
			}
			return nil, fmt.Errorf("%w: %s %d has bounds that admit no finite value (NaN, lower +Inf or upper -Inf)", ErrInvalid, what, k)
		}
	}
	for j := 0; j < s.n+s.m; j++ {
		if s.lo[j] > s.up[j] {
			return s.result(Infeasible), nil
		}
	}
	st, err := s.run()
	if err != nil {
		return nil, err
	}
	return s.result(st), nil
}

// checkStop reports whether a limit has been reached.
func (s *Solver) checkStop() bool {
	if s.opt.MaxIterations > 0 && s.iters >= s.opt.MaxIterations {
		s.stopStat = IterationLimit
		return true
	}
	if s.iters%16 != 0 {
		return false
	}
	if !s.opt.Deadline.IsZero() && time.Now().After(s.opt.Deadline) {
		s.stopStat = TimeLimit
		return true
	}
	if ctx := s.opt.Context; ctx != nil {
		if err := ctx.Err(); err != nil {
			s.stopStat = Canceled
			if errors.Is(err, context.DeadlineExceeded) {
				s.stopStat = TimeLimit
			}
			return true
		}
	}
	return false
}

func (s *Solver) resetCosts() {
	copy(s.cost, s.obj)
	for i := 0; i < s.m; i++ {
		s.cost[s.n+i] = 0
	}
}

// run drives the phases: dual or primal simplex on perturbed costs, then
// removal of the perturbation and clean-up passes until the basis is
// both primal and dual feasible for the true data.
func (s *Solver) run() (Status, error) {
	s.dualFresh = false
	s.rng = rngSeed
	s.feasTol = s.opt.feasTol()
	s.resetCosts()
	// The factorization survives bound and cost changes; only a new basis
	// (SetBasis, first solve) needs a fresh one.
	if s.needFactor || s.lu.needRefactor() {
		if err := s.refactor(); err != nil {
			return 0, err
		}
	}
	s.computePrimal()
	s.computeDual()
	perturbed := false
	triedPhase1 := false
	for round := 0; round < 8; round++ {
		var st Status
		var err error
		if s.forcePrimal && round == 0 {
			st, err = s.primalSimplex()
		} else if s.makeDualFeasible() {
			if !perturbed && s.primalInfeasible() {
				s.perturbCosts()
				perturbed = true
			}
			st, err = s.dualSimplex()
		} else if !triedPhase1 && round == 0 {
			// Dual phase 1 on the auxiliary problem; on success the next
			// round runs the dual phase 2 on the perturbed costs.
			triedPhase1 = true
			perturbed = true
			st, err = s.dualPhase1()
			if err == nil && st == Optimal {
				continue
			}
		} else {
			if perturbed {
				s.resetCosts()
				s.computeDual()
			}
			st, err = s.primalSimplex()
		}
		if err != nil {
			return 0, err
		}
		if st == statusUncertain {
			// The dual simplex could not prove infeasibility: let the
			// primal phase 1 decide on the true costs.
			s.resetCosts()
			s.computeDual()
			st, err = s.primalSimplex()
			if err != nil {
				return 0, err
			}
		}
		if st != Optimal {
			// Infeasibility (a dual ray) does not depend on the costs, so
			// it stands despite the perturbation; the primal simplex
			// runs on the true costs, so Unbounded stands too.
			return st, nil
		}
		// Remove perturbation and shifts and recompute x, y and d, from a
		// fresh factorization once the eta file is half full.
		s.resetCosts()
		if 2*s.lu.numEtas() >= s.lu.refactorLimit() {
			if err := s.refactor(); err != nil {
				return 0, err
			}
		}
		s.computePrimal()
		s.computeDual()
		if !s.primalInfeasible() && s.dualInfeasible() == 0 {
			s.dualFresh = true
			return Optimal, nil
		}
	}
	// The phases kept handing back small infeasibilities. Accept the basis
	// if they are within a thousand times the tolerances (common practice
	// for a final relaxed check), else report numerical trouble.
	saveF, saveO := s.feasTol, s.opt.OptTol
	s.feasTol *= 1e3
	s.opt.OptTol = 1e3 * s.opt.optTol()
	ok := !s.primalInfeasible() && s.dualInfeasible() == 0
	s.feasTol, s.opt.OptTol = saveF, saveO
	if ok {
		return Optimal, nil
	}
	return 0, ErrNumerical
}

// refactor factorizes the current basis, repairing a singular one by
// replacing dependent columns with row logicals.
func (s *Solver) refactor() error {
	if s.m == 0 {
		s.needFactor = false
		return nil
	}
	singPos, singRow := s.lu.factor(func(p int) ([]int, []float64) { return s.column(s.head[p]) })
	for k, p := range singPos {
		old := s.head[p]
		s.stat[old] = s.nonbasicStatus(old, s.d[old])
		lj := s.n + singRow[k]
		s.head[p] = lj
		s.stat[lj] = stBasic
		s.dse[p] = 1
	}
	if len(singPos) > 0 {
		s.computePrimal()
	}
	s.needFactor = false
	s.factHead = append(s.factHead[:0], s.head...)
	return nil
}

// nonbasicValue returns the value at which nonbasic j rests.
func (s *Solver) nonbasicValue(j int) float64 {
	switch s.stat[j] {
	case stLower:
		return s.lo[j]
	case stUpper:
		return s.up[j]
	}
	return 0
}

// computePrimal sets nonbasic variables to their bounds and solves
// B x_B = −N x_N.
func (s *Solver) computePrimal() {
	rhs := s.alpha
	for i := range rhs {
		rhs[i] = 0
	}
	for j := 0; j < s.n+s.m; j++ {
		if s.stat[j] == stBasic {
			continue
		}
		v := s.nonbasicValue(j)
		s.x[j] = v
		if v == 0 {
			continue
		}
		idx, val := s.column(j)
		for k, i := range idx {
			rhs[i] -= val[k] * v
		}
	}
	if s.m == 0 {
		return
	}
	s.lu.ftran(rhs)
	for p, j := range s.head {
		s.x[j] = rhs[p]
	}
}

// computeDual solves Bᵀy = c_B into s.rho and sets d = c − [A I]ᵀy.
func (s *Solver) computeDual() {
	y := s.rho
	for p, j := range s.head {
		y[p] = s.cost[j]
	}
	if s.m > 0 {
		s.lu.btran(y)
	}
	for j := 0; j < s.n; j++ {
		if s.stat[j] == stBasic {
			s.d[j] = 0
			continue
		}
		v := s.cost[j]
		for k := s.colStart[j]; k < s.colStart[j+1]; k++ {
			v -= s.colVal[k] * y[s.colRow[k]]
		}
		s.d[j] = v
	}
	for i := 0; i < s.m; i++ {
		j := s.n + i
		if s.stat[j] == stBasic {
			s.d[j] = 0
		} else {
			s.d[j] = s.cost[j] - y[i]
		}
	}
}

func (s *Solver) primalTol(bound float64) float64 {
	a := math.Abs(bound)
	if a < 1 {
		a = 1
	}
	return s.feasTol * a
}

// infeasibility of basic variable j: negative below lo, positive above up.
func (s *Solver) infeasibility(j int) float64 {
	// The tolerance is computed only for a value outside its bounds:
	// the dual pricing calls this for every basic variable in every
	// iteration, and most of them are within their bounds.
	x := s.x[j]
	if lo := s.lo[j]; x < lo {
		if v := x - lo; v < -s.primalTol(lo) {
			return v
		}
		return 0
	}
	if up := s.up[j]; x > up {
		if v := x - up; v > s.primalTol(up) {
			return v
		}
	}
	return 0
}

func (s *Solver) primalInfeasible() bool {
	for _, j := range s.head {
		if s.infeasibility(j) != 0 {
			return true
		}
	}
	return false
}

// dualInfeasible counts nonbasic variables whose reduced cost has the
// wrong sign for their status beyond the optimality tolerance.
func (s *Solver) dualInfeasible() int {
	tol := s.opt.optTol()
	cnt := 0
	for j := 0; j < s.n+s.m; j++ {
		if s.lo[j] == s.up[j] {
			continue
		}
		switch s.stat[j] {
		case stLower:
			if s.d[j] < -tol {
				cnt++
			}
		case stUpper:
			if s.d[j] > tol {
				cnt++
			}
		case stFree:
			if math.Abs(s.d[j]) > tol {
				cnt++
			}
		}
	}
	return cnt
}

// makeDualFeasible moves boxed nonbasic variables to the bound their
// reduced cost calls for (which keeps them dual feasible at no cost,
// Koberstein 2005) and reports whether the basis is then dual
// feasible. Moved variables change x_B, which is recomputed.
func (s *Solver) makeDualFeasible() bool {
	tol := s.opt.optTol()
	moved := false
	ok := true
	for j := 0; j < s.n+s.m; j++ {
		st := s.stat[j]
		if st == stBasic || s.lo[j] == s.up[j] {
			continue
		}
		boxed := !math.IsInf(s.lo[j], -1) && !math.IsInf(s.up[j], 1)
		switch {
		case st == stLower && s.d[j] < -tol:
			if boxed {
				s.stat[j] = stUpper
				moved = true
			} else {
				ok = false
			}
		case st == stUpper && s.d[j] > tol:
			if boxed {
				s.stat[j] = stLower
				moved = true
			} else {
				ok = false
			}
		case st == stFree && math.Abs(s.d[j]) > tol:
			ok = false
		}
	}
	if !ok {
		// Going primal: undo nothing (moves are harmless), but x must
		// match the statuses.
		if moved {
			s.computePrimal()
		}
		return false
	}
	if moved {
		s.computePrimal()
	}
	return true
}

// perturbCosts adds a small random amount to the cost of each nonbasic
// structural in the direction that widens its dual feasibility, to
// break the dual degeneracy typical of combinatorial LPs (Koberstein
// 2005 describes the technique; the magnitudes, relative 1e-6 plus
// absolute 1e-7 times a random factor in [1, 2), are our choice).
func (s *Solver) perturbCosts() {
	for j := 0; j < s.n; j++ {
		st := s.stat[j]
		if st == stBasic || st == stFree || s.lo[j] == s.up[j] {
			continue
		}
		xi := (1e-7 + 1e-6*math.Abs(s.cost[j])) * (1 + s.rand01())
		if st == stLower {
			s.cost[j] += xi
			s.d[j] += xi
		} else {
			s.cost[j] -= xi
			s.d[j] -= xi
		}
	}
}

// pivotRow computes α_r = ρᵀ[A I] for the nonbasic variables, from the
// rows where ρ is nonzero (listed in idx, which may also list zeros). It
// returns the list of nonbasic variables with a nonzero entry, values in
// s.rowAlpha.
func (s *Solver) pivotRow(rho []float64, idx []int) []int {
	list := s.candIdx[:0]
	// Row-wise work is the length of the rows where ρ is nonzero; when
	// that approaches nnz(A), dot products down the nonbasic columns
	// do the same arithmetic with sequential access and no scatter.
	work := 0
	for _, i := range idx {
		if rho[i] != 0 {
			work += s.rowStart[i+1] - s.rowStart[i]
		}
	}
	if 2*work > len(s.colVal) {
		for j := 0; j < s.n; j++ {
			if s.stat[j] == stBasic {
				continue
			}
			v := 0.0
			for k := s.colStart[j]; k < s.colStart[j+1]; k++ {
				v += rho[s.colRow[k]] * s.colVal[k]
			}
			if v != 0 {
				s.rowAlpha[j] = v
				list = append(list, j)
			}
		}
	} else {
		list = s.pivotRowByRows(rho, idx, list)
	}
	for _, i := range idx {
		if r := rho[i]; r != 0 && s.stat[s.n+i] != stBasic {
			s.rowAlpha[s.n+i] = r
			list = append(list, s.n+i)
		}
	}
	s.candIdx = list
	return list
}

func (s *Solver) pivotRowByRows(rho []float64, idx []int, list []int) []int {
	for _, i := range idx {
		r := rho[i]
		if r == 0 {
			continue
		}
		for k := s.rowStart[i]; k < s.rowStart[i+1]; k++ {
			j := s.rowCol[k]
			if s.stat[j] == stBasic {
				continue
			}
			if !s.rowMark[j] {
				s.rowMark[j] = true
				s.rowAlpha[j] = 0
				list = append(list, j)
			}
			s.rowAlpha[j] += r * s.rowVal[k]
		}
	}
	for _, j := range list {
		s.rowMark[j] = false
	}
	return list
}

// ftranColSparse sets out = B⁻¹ a_j, hypersparse, keeping the spike for
// the basis update; out must be zero outside idx on entry and is zero
// outside the returned list (which reuses idx's storage) on return.
func (s *Solver) ftranColSparse(j int, out []float64, idx []int) []int {
	for _, i := range idx {
		out[i] = 0
	}
	idx = idx[:0]
	ci, cv := s.column(j)
	for k, i := range ci {
		out[i] = cv[k]
		idx = append(idx, i)
	}
	s.lu.wantSpike = true
	idx = s.lu.ftranSparse(out, idx, &s.hintAlpha)
	s.lu.wantSpike = false
	return idx
}

// clearSparse zeroes v at idx and returns idx emptied.
func clearSparse(v []float64, idx []int) []int {
	for _, i := range idx {
		v[i] = 0
	}
	return idx[:0]
}

// resetDualWork zeroes the sparse work vectors of the dual simplex and
// rebuilds the list of primal infeasible positions from scratch.
func (s *Solver) resetDualWork() {
	for _, v := range [][]float64{s.drho, s.alpha, s.tau, s.flipCol} {
		for i := range v {
			v[i] = 0
		}
	}
	s.rhoIdx, s.alphaIdx, s.tauIdx, s.fcIdx = s.rhoIdx[:0], s.alphaIdx[:0], s.tauIdx[:0], s.fcIdx[:0]
	for _, p := range s.infPos {
		s.infIn[p] = false
	}
	s.infPos = s.infPos[:0]
	for p := range s.head {
		s.touchInf(p)
	}
}

// touchInf records the infeasibility of the variable in basis position
// p, whose value changed, and adds p to the infeasible list if it is
// nonzero; the pricing drops positions that have become feasible.
func (s *Solver) touchInf(p int) {
	v := s.infeasibility(s.head[p])
	s.infVal[p] = v
	if !s.infIn[p] && v != 0 {
		s.infIn[p] = true
		s.infPos = append(s.infPos, p)
	}
}

// ftranCol sets out = B⁻¹ a_j.
func (s *Solver) ftranCol(j int, out []float64) {
	for i := range out {
		out[i] = 0
	}
	idx, val := s.column(j)
	for k, i := range idx {
		out[i] = val[k]
	}
	s.lu.wantSpike = true
	s.lu.ftran(out)
	s.lu.wantSpike = false
}

// dualPhase1 seeks a dual feasible basis by solving, with the dual
// simplex, the auxiliary problem of Fourer (1994) and Koberstein (2005):
// the same costs and matrix with every bound replaced by
//
//	[0, 0] for boxed and fixed variables (always dual feasible by a flip),
//	[0, 1] for variables with only a lower bound,
//	[−1, 0] for variables with only an upper bound,
//	[−1, 1] for free variables,
//
// so that every variable is boxed, the slack basis is dual feasible, and
// the optimal value is minus the least total dual infeasibility. If it
// reaches zero the final basis is dual feasible for the true bounds.
// The true bounds are then restored and the nonbasic variables put at
// the bound their reduced cost calls for.
func (s *Solver) dualPhase1() (Status, error) {
	N := s.n + s.m
	saveLo := append([]float64(nil), s.lo...)
	saveUp := append([]float64(nil), s.up...)
	for j := 0; j < N; j++ {
		loFin, upFin := !math.IsInf(s.lo[j], -1), !math.IsInf(s.up[j], 1)
		switch {
		case loFin && upFin:
			s.lo[j], s.up[j] = 0, 0
		case loFin:
			s.lo[j], s.up[j] = 0, 1
		case upFin:
			s.lo[j], s.up[j] = -1, 0
		default:
			s.lo[j], s.up[j] = -1, 1
		}
		if s.stat[j] != stBasic {
			s.stat[j] = s.nonbasicStatus(j, s.d[j])
		}
	}
	s.computePrimal()
	s.perturbCosts()
	st, err := s.dualSimplex()
	copy(s.lo, saveLo)
	copy(s.up, saveUp)
	for j := 0; j < N; j++ {
		if s.stat[j] != stBasic {
			s.stat[j] = s.nonbasicStatus(j, s.d[j])
		}
	}
	if err != nil {
		return 0, err
	}
	if err := s.refactor(); err != nil {
		return 0, err
	}
	s.computePrimal()
	s.computeDual()
	return st, nil
}
