package lp

// result assembles the Result from the current basis on the true costs.
func (s *Solver) result(st Status) *Result {
	s.resetCosts()
	if s.needFactor || s.lu.broken {
		_ = s.refactor()
		s.computePrimal()
		s.dualFresh = false
	}
	// After an optimal run the last computeDual was made on these costs,
	// basis and factors; doing it again would give the same bits.
	if !s.dualFresh {
		s.computeDual()
	}
	s.dualFresh = false
	n, m := s.n, s.m
	dualFeasible := st != Infeasible && s.dualInfeasible() == 0
	res := &Result{
		Status:      st,
		X:           make([]float64, n),
		RowActivity: make([]float64, m),
		Dual:        make([]float64, m),
		ReducedCost: make([]float64, n),
		Iterations:  s.iters,

		DualFeasible: dualFeasible,
	}
	for i := 0; i < m; i++ {
		res.Dual[i] = s.rho[i] * s.rowScale[i]
	}
	for j := 0; j < n; j++ {
		xj := s.x[j] * s.colScale[j]
		switch {
		case s.stat[j] == stLower || (s.stat[j] == stUpper && s.prob.ColLo[j] == s.prob.ColUp[j]):
			xj = s.prob.ColLo[j] // exact, free of scaling round-off
		case s.stat[j] == stUpper:
			xj = s.prob.ColUp[j]
		}
		res.X[j] = xj
		res.Obj += s.prob.Obj[j] * xj
		dj := s.prob.Obj[j]
		for k := s.prob.ColStart[j]; k < s.prob.ColStart[j+1]; k++ {
			i := s.prob.RowIndex[k]
			res.RowActivity[i] += s.prob.Value[k] * xj
			dj -= s.prob.Value[k] * res.Dual[i]
		}
		res.ReducedCost[j] = dj
	}
	return res
}
