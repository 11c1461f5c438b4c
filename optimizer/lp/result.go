package lp

// result assembles the Result from the current basis on the true costs.
func (s *Solver) result(st Status) *Result {
	s.resetCosts()
	if s.needFactor {
		_ = s.refactor()
		s.computePrimal()
	}
	s.computeDual()
	n, m := s.n, s.m
	res := &Result{
		Status:      st,
		X:           make([]float64, n),
		RowActivity: make([]float64, m),
		Dual:        make([]float64, m),
		ReducedCost: make([]float64, n),
		Iterations:  s.iters,
	}
	copy(res.Dual, s.rho[:m])
	for j := 0; j < n; j++ {
		xj := s.x[j]
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
