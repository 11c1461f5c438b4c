package lp

import "math"

// primalSimplex runs the bounded primal simplex: phase 1 minimizes the
// sum of bound violations of the basic variables (the composite
// piecewise-linear objective of Maros 2003, ch. 9, with costs −1 below
// the lower bound and +1 above the upper), phase 2 the true objective.
// The ratio test uses Harris's (1973) two passes; a boxed entering
// variable that reaches its own opposite bound first is flipped without
// a basis change. Pricing is Devex (Harris 1973) in reference framework
// form, reset at each phase start.
func (s *Solver) primalSimplex() (Status, error) {
	const phase1Factor = 100
	N := s.n + s.m
	tolD := s.opt.optTol()
	y := s.rho
	devex := make([]float64, N)
	for j := range devex {
		devex[j] = 1
	}
	lastPhase1 := true
	for {
		if s.lu.needRefactor() {
			if err := s.refactor(); err != nil {
				return 0, err
			}
			s.computePrimal()
		}
		// Phase costs on the basis.
		// Phase 1 only for violations well beyond the tolerance: the
		// Harris ratio test lets basic variables stray by up to the
		// tolerance, and round-off would otherwise bounce the method
		// between the phases; small leftovers go to the dual clean-up.
		phase1 := false
		for p, j := range s.head {
			v := s.infeasibility(j)
			if math.Abs(v) <= phase1Factor*s.primalTol(s.x[j]) {
				v = 0
			}
			switch {
			case v < 0:
				y[p] = -1
				phase1 = true
			case v > 0:
				y[p] = 1
				phase1 = true
			default:
				y[p] = 0
			}
		}
		if phase1 != lastPhase1 {
			for j := range devex {
				devex[j] = 1
			}
			lastPhase1 = phase1
		}
		if !phase1 {
			for p, j := range s.head {
				y[p] = s.cost[j]
			}
		}
		if s.m > 0 {
			s.lu.btran(y)
		}
		// Pricing over nonbasic variables.
		q := -1
		best := 0.0
		dq := 0.0
		for j := 0; j < N; j++ {
			st := s.stat[j]
			if st == stBasic || s.lo[j] == s.up[j] {
				continue
			}
			var dj float64
			if !phase1 {
				dj = s.cost[j]
			}
			if j < s.n {
				for k := s.colStart[j]; k < s.colStart[j+1]; k++ {
					dj -= s.colVal[k] * y[s.colRow[k]]
				}
			} else {
				dj -= y[j-s.n]
			}
			s.d[j] = dj
			var viol float64
			switch st {
			case stLower:
				viol = -dj
			case stUpper:
				viol = dj
			case stFree:
				viol = math.Abs(dj)
			}
			if viol <= tolD {
				continue
			}
			if sc := viol * viol / devex[j]; sc > best {
				q, best, dq = j, sc, dj
			}
		}
		if q < 0 {
			if phase1 {
				if s.certifyFarkas(y, tolD) || tolD < s.opt.optTol() {
					return Infeasible, nil
				}
				// No proof: the phase 1 reduced costs may just be tiny
				// (badly scaled columns); price once more with a
				// tolerance a thousand times smaller. Without a proof
				// then, Infeasible is the verdict within tolerances.
				tolD *= 1e-3
				continue
			}
			for _, j := range s.head {
				s.d[j] = 0
			}
			return Optimal, nil
		}
		// Limits are checked once the basis is known not to be optimal.
		if s.checkStop() {
			return s.stopStat, nil
		}
		dir := 1.0
		if dq > 0 {
			dir = -1
		}
		s.ftranCol(q, s.alpha)
		alpha := s.alpha

		// Harris pass 1: the largest step keeping every basic variable
		// within its tolerance-widened bounds.
		tmax := math.Inf(1)
		rangeQ := s.up[q] - s.lo[q]
		for i, ai := range alpha {
			if math.Abs(ai) <= zeroTol {
				continue
			}
			g := -dir * ai // dx_B[i]/dt
			j := s.head[i]
			lim := s.stepLimit(j, g, true, phase1)
			if lim < tmax {
				tmax = lim
			}
		}
		if rangeQ <= tmax {
			// Bound flip of the entering variable.
			if math.IsInf(rangeQ, 1) {
				if phase1 {
					if tolD < s.opt.optTol() {
						// A reduced cost admitted only by the retry
						// tolerance moves nothing: round-off.
						return Infeasible, nil
					}
					return 0, ErrNumerical
				}
				return Unbounded, nil
			}
			step := dir * rangeQ
			for i, ai := range alpha {
				if ai != 0 {
					s.x[s.head[i]] -= step * ai
				}
			}
			s.x[q] += step
			if s.stat[q] == stLower {
				s.stat[q] = stUpper
				s.x[q] = s.up[q]
			} else {
				s.stat[q] = stLower
				s.x[q] = s.lo[q]
			}
			s.iters++
			continue
		}
		// Harris pass 2: among the blocking variables within tmax, the
		// largest |α|.
		r := -1
		bestA := 0.0
		var step float64
		var toUpper bool
		for i, ai := range alpha {
			if math.Abs(ai) <= zeroTol {
				continue
			}
			g := -dir * ai
			j := s.head[i]
			lim := s.stepLimit(j, g, false, phase1)
			if lim <= tmax && math.Abs(ai) > bestA {
				r, bestA, step = i, math.Abs(ai), lim
				toUpper = s.hitsUpper(j, g, phase1)
			}
		}
		if r < 0 {
			return 0, ErrNumerical
		}
		if step < 0 {
			step = 0
		}

		p := s.head[r]
		for i, ai := range alpha {
			if ai != 0 {
				s.x[s.head[i]] -= dir * step * ai
			}
		}
		s.x[q] += dir * step
		if toUpper {
			s.x[p] = s.up[p]
			s.stat[p] = stUpper
		} else {
			s.x[p] = s.lo[p]
			s.stat[p] = stLower
		}
		if s.lo[p] == s.up[p] {
			s.stat[p] = stLower
		}
		// Devex weights (Harris 1973; update as in Forrest & Goldfarb
		// 1992): with the pivot row α_r, w_j = max(w_j, (α_rj/α_rq)²
		// w_q) for the other nonbasic j and w_p = max(w_q/α_rq², 1) for
		// the leaving variable; the reference framework is reset when a
		// weight grows past 1e6.
		rho := s.tau
		for i := range rho {
			rho[i] = 0
		}
		rho[r] = 1
		s.rhoIdx = s.lu.btranSparse(rho, append(s.rhoIdx[:0], r), &s.hintRho)
		arq := alpha[r]
		wq := devex[q]
		reset := false
		for _, j := range s.pivotRow(rho, s.rhoIdx) {
			if j == q {
				continue
			}
			ratio := s.rowAlpha[j] / arq
			if w := ratio * ratio * wq; w > devex[j] {
				devex[j] = w
				reset = reset || w > 1e6
			}
		}
		devex[p] = math.Max(wq/(arq*arq), 1)
		if reset {
			for j := range devex {
				devex[j] = 1
			}
		}
		s.stat[q] = stBasic
		s.head[r] = q
		s.lu.update(r, alpha)
		s.iters++
	}
}

// stepLimit is the step t at which basic variable j, moving at rate g,
// reaches the bound that blocks it; with widen the bound is relaxed by
// the primal tolerance (Harris pass 1). In phase 1 a variable that
// violates a bound is blocked only by the bound it is moving toward; in
// phase 2 every basic variable counts as feasible, so one that sits a
// little outside its bound blocks at once if it moves further out.
func (s *Solver) stepLimit(j int, g float64, widen, phase1 bool) float64 {
	x, lo, up := s.x[j], s.lo[j], s.up[j]
	tl, tu := 0.0, 0.0
	if widen {
		tl, tu = s.primalTol(lo), s.primalTol(up)
	}
	if g < 0 {
		switch {
		case phase1 && x > up+s.primalTol(up):
			return (x - up + tu) / -g
		case phase1 && x < lo-s.primalTol(lo) || math.IsInf(lo, -1):
			return math.Inf(1)
		default:
			return math.Max(x-lo+tl, 0) / -g
		}
	}
	switch {
	case phase1 && x < lo-s.primalTol(lo):
		return (lo - x + tl) / g
	case phase1 && x > up+s.primalTol(up) || math.IsInf(up, 1):
		return math.Inf(1)
	default:
		return math.Max(up-x+tu, 0) / g
	}
}

// hitsUpper tells which bound blocks basic j moving at rate g.
func (s *Solver) hitsUpper(j int, g float64, phase1 bool) bool {
	if g < 0 {
		return phase1 && s.x[j] > s.up[j]+s.primalTol(s.up[j])
	}
	return !(phase1 && s.x[j] < s.lo[j]-s.primalTol(s.lo[j]))
}

// certifyFarkas checks that the row multipliers y prove infeasibility:
// every solution of A x + s = 0 satisfies Σ_k g_k v_k = 0 with
// g = [A I]ᵀy, so if the range of that sum over the bounds of all
// variables excludes zero by more than the feasibility tolerance (scaled
// by the size of the terms), no solution lies within the bounds (Farkas'
// lemma in interval form). Terms with |g_k| ≤ gTol, the dual tolerance
// the pricing used, count as zero.
func (s *Solver) certifyFarkas(y []float64, gTol float64) bool {
	lo, hi, scale := 0.0, 0.0, 1.0
	add := func(g float64, k int) {
		if math.Abs(g) <= gTol {
			return
		}
		a, b := g*s.lo[k], g*s.up[k]
		if g < 0 {
			a, b = b, a
		}
		lo += a
		hi += b
		scale = math.Max(scale, math.Max(math.Abs(a), math.Abs(b)))
	}
	for j := 0; j < s.n; j++ {
		g := 0.0
		for k := s.colStart[j]; k < s.colStart[j+1]; k++ {
			g += y[s.colRow[k]] * s.colVal[k]
		}
		add(g, j)
	}
	for i := 0; i < s.m; i++ {
		add(y[i], s.n+i)
	}
	tol := 1e3 * s.feasTol * scale
	return hi < -tol || lo > tol
}
