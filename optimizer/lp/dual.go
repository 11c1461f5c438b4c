package lp

import "math"

// dualSimplex runs the bounded dual simplex (phase 2) from a dual
// feasible basis, following Koberstein (2005), with the bound flipping
// ratio test and dual steepest edge pricing (after Forrest & Goldfarb
// 1992) described there.
//
// Each iteration:
//  1. Pricing: pick the basic variable p (position r) with the largest
//     δ²/w_r, δ its bound violation and w_r ≈ ‖e_rᵀB⁻¹‖² its weight.
//  2. BTRAN ρ = B⁻ᵀe_r and the pivot row α_j = ρᵀa_j for nonbasic j.
//  3. Ratio test: with σ = sign(δ) the dual step t ≥ 0 moves each reduced
//     cost d_j(t) = d_j − tσα_j; breakpoints are where a d_j would change
//     sign. Passing the breakpoint of a boxed variable flips it to its
//     other bound and lowers the slope of the dual objective, initially
//     |δ|, by |α_j|(u_j − l_j) (bound flipping, Fourer 1994; Maros 2003).
//     The entering q is taken among the breakpoints within Harris's
//     (1973) tolerance band, by largest |α_q|.
//  4. FTRAN α_q = B⁻¹a_q (and B⁻¹ of the flipped columns, and τ = B⁻¹ρ
//     for the weights); update x_B, d, the weights and the eta file.
func (s *Solver) dualSimplex() (Status, error) {
	tolD := s.opt.optTol()
	// The vectors of an iteration are hypersparse (lu_sparse.go): each
	// is kept zero outside its index list, and the pricing scans only
	// the positions that may be infeasible (after Hall & McKinnon 2005,
	// from memory).
	rho, alpha, tau, fc := s.drho, s.alpha, s.tau, s.flipCol
	s.resetDualWork()
	for {
		if s.lu.needRefactor() {
			if err := s.refactor(); err != nil {
				return 0, err
			}
			s.computePrimal()
			s.computeDual()
			s.resetDualWork()
		}
		// 1. Pricing, ties to the lowest position (so the choice does
		// not depend on the order of the list).
		r := -1
		best := 0.0
		var delta float64
		inf := s.infPos
		for k := 0; k < len(inf); {
			p := inf[k]
			v := s.infVal[p]
			if v == 0 {
				s.infIn[p] = false
				inf[k] = inf[len(inf)-1]
				inf = inf[:len(inf)-1]
				continue
			}
			if sc := v * v / s.dse[p]; sc > best || (sc == best && p < r) {
				r, best, delta = p, sc, v
			}
			k++
		}
		s.infPos = inf
		if r < 0 {
			return Optimal, nil
		}
		// Limits are checked once the basis is known not to be optimal.
		if s.checkStop() {
			return s.stopStat, nil
		}
		p := s.head[r]
		sigma := 1.0
		target := s.up[p]
		if delta < 0 {
			sigma = -1
			target = s.lo[p]
		}
		// 2. ρ and the pivot row.
		s.rhoIdx = clearSparse(rho, s.rhoIdx)
		rho[r] = 1
		s.rhoIdx = s.lu.btranSparse(rho, append(s.rhoIdx, r), &s.hintRho)
		list := s.pivotRow(rho, s.rhoIdx)

		// 3. Bound flipping ratio test with Harris tolerances.
		cand := s.rowList[:0]
		for _, j := range list {
			if s.lo[j] == s.up[j] {
				continue
			}
			a := sigma * s.rowAlpha[j]
			switch s.stat[j] {
			case stLower:
				if a > pivotTol {
					cand = append(cand, j)
				}
			case stUpper:
				if a < -pivotTol {
					cand = append(cand, j)
				}
			case stFree:
				if math.Abs(a) > pivotTol {
					cand = append(cand, j)
				}
			}
		}
		slope := math.Abs(delta)
		slopeTol := s.primalTol(target)
		q := -1
		nflip := 0
		flips := s.flipList[:0]
		for len(cand) > 0 {
			tmax := math.Inf(1)
			for _, j := range cand {
				a := sigma * s.rowAlpha[j]
				var t float64
				switch s.stat[j] {
				case stLower:
					t = (s.d[j] + tolD) / a
				case stUpper:
					t = (s.d[j] - tolD) / a
				default:
					t = (math.Abs(s.d[j]) + tolD) / math.Abs(a)
				}
				if t < tmax {
					tmax = t
				}
			}
			q = -1
			bestA := 0.0
			reduction := 0.0
			k := 0
			group := s.groupList[:0]
			for _, j := range cand {
				a := sigma * s.rowAlpha[j]
				t := s.d[j] / a
				if s.stat[j] == stFree {
					t = math.Abs(s.d[j]) / math.Abs(a)
				}
				if t <= tmax {
					group = append(group, j)
					if math.Abs(a) > bestA {
						q, bestA = j, math.Abs(a)
					}
					reduction += math.Abs(a) * (s.up[j] - s.lo[j])
				} else {
					cand[k] = j
					k++
				}
			}
			s.groupList = group
			cand = cand[:k]
			// The slope left after passing the group; within the primal
			// tolerance it counts as zero (the group's last breakpoint is
			// where the dual objective peaks).
			left := slope - reduction
			passable := !math.IsInf(reduction, 1) && left > slopeTol
			if passable && len(cand) > 0 {
				// Pass the whole group: flip them and go on.
				flips = append(flips, group...)
				slope -= reduction
				continue
			}
			if passable && len(cand) == 0 {
				// Every breakpoint passed and the slope stays positive:
				// the dual is unbounded, the primal infeasible.
				q = -1
			}
			break
		}
		s.flipList = flips
		s.rowList = cand[:0]
		if q < 0 {
			if s.certifyInfeasible(p, sigma, list) {
				return Infeasible, nil
			}
			return statusUncertain, nil
		}
		alphaRQ := s.rowAlpha[q]
		// 4. FTRAN of the entering column; check it against the row.
		s.alphaIdx = s.ftranColSparse(q, alpha, s.alphaIdx)
		if math.Abs(alpha[r]-alphaRQ) > 1e-8*(1+math.Abs(alphaRQ)) && s.lu.numEtas() > 0 {
			// Accuracy lost: refactorize and redo the iteration.
			if err := s.refactor(); err != nil {
				return 0, err
			}
			s.computePrimal()
			s.computeDual()
			s.resetDualWork()
			continue
		}
		alphaRQ = alpha[r]

		// Bound flips: x_B −= B⁻¹ Σ a_j Δx_j.
		s.fcIdx = clearSparse(fc, s.fcIdx)
		if len(flips) > 0 {
			fidx := s.fcIdx
			for _, j := range flips {
				var dx float64
				if s.stat[j] == stLower {
					s.stat[j] = stUpper
					dx = s.up[j] - s.lo[j]
				} else {
					s.stat[j] = stLower
					dx = s.lo[j] - s.up[j]
				}
				s.x[j] += dx
				idx, val := s.column(j)
				for k, i := range idx {
					if !s.fcMark[i] {
						s.fcMark[i] = true
						fidx = append(fidx, i)
					}
					fc[i] += val[k] * dx
				}
			}
			for _, i := range fidx {
				s.fcMark[i] = false
			}
			fidx = s.lu.ftranSparse(fc, fidx, &s.hintFlip)
			for _, pos := range fidx {
				s.x[s.head[pos]] -= fc[pos]
			}
			s.fcIdx = fidx
			nflip += len(flips)
		}

		// Dual step, with a cost shift if Harris let d_q go wrong-signed.
		thetaD := s.d[q] / alphaRQ
		if thetaD*sigma < 0 {
			s.cost[q] -= s.d[q]
			s.d[q] = 0
			thetaD = 0
		}
		if thetaD != 0 {
			for _, j := range list {
				s.d[j] -= thetaD * s.rowAlpha[j]
			}
		}
		s.d[q] = 0
		s.d[p] = -thetaD

		// Dual steepest edge weights (Forrest & Goldfarb 1992):
		// w_r' = w_r/α_r², w_i' = w_i − 2(α_i/α_r)τ_i + (α_i/α_r)² w_r.
		wr := 0.0
		for _, i := range s.rhoIdx {
			wr += rho[i] * rho[i]
		}
		s.computeTau(r, rho, alpha, tau)
		for _, i := range s.alphaIdx {
			ai := alpha[i]
			if i == r || ai == 0 {
				continue
			}
			ratio := ai / alphaRQ
			w := s.dse[i] + ratio*(ratio*wr-2*tau[i])
			if w < 1e-4 {
				w = 1e-4
			}
			s.dse[i] = w
		}
		s.dse[r] = math.Max(wr/(alphaRQ*alphaRQ), 1e-4)

		// Primal step: p goes to its violated bound.
		thetaP := (s.x[p] - target) / alphaRQ
		for _, i := range s.alphaIdx {
			if ai := alpha[i]; ai != 0 {
				s.x[s.head[i]] -= thetaP * ai
			}
		}
		s.x[q] += thetaP
		s.x[p] = target

		// Basis change.
		if sigma < 0 || s.lo[p] == s.up[p] {
			s.stat[p] = stLower
		} else {
			s.stat[p] = stUpper
		}
		s.stat[q] = stBasic
		s.head[r] = q
		s.lu.update(r, alpha)
		s.iters++
		for _, i := range s.alphaIdx {
			s.touchInf(i)
		}
		for _, i := range s.fcIdx {
			s.touchInf(i)
		}
		s.touchInf(r)
	}
}

// computeTau sets tau_i = (B⁻¹ρ)_i for the positions i ≠ r where α_q is
// nonzero, which is all the weight update reads. τ is often far denser
// than ρ and α_q (in the plan models about half full while they hold a
// few dozen entries), so when recent τ were dense only the entries
// needed are computed (ftranPartial). Either way tau is zero outside
// s.tauIdx on return.
func (s *Solver) computeTau(r int, rho, alpha, tau []float64) {
	s.tauIdx = clearSparse(tau, s.tauIdx)
	if s.hintTau > hyperFrac {
		for _, i := range s.alphaIdx {
			if i != r && alpha[i] != 0 {
				s.tauIdx = append(s.tauIdx, i)
			}
		}
		if s.lu.ftranPartial(rho, s.tauIdx, tau, s.m/2) {
			// Let the estimate of τ's density fade so that a τ grown
			// sparse is noticed by an occasional full FTRAN.
			s.hintTau *= 0.99
			return
		}
		s.tauIdx = s.tauIdx[:0]
	}
	for _, i := range s.rhoIdx {
		tau[i] = rho[i]
	}
	s.tauIdx = s.lu.ftranSparse(tau, append(s.tauIdx, s.rhoIdx...), &s.hintTau)
}

// statusUncertain is returned by dualSimplex when the ratio test found no
// entering variable but the row does not prove infeasibility with a
// margin; run then lets the primal phase 1 decide.
const statusUncertain Status = -1

// certifyInfeasible checks the Farkas-type proof carried by the pivot row:
// row r of B⁻¹[A I] x = 0 reads x_p = −Σ_j α_rj x_j over the nonbasic j,
// so x_p can range only over −Σ α_rj·[l_j, u_j]. The problem is proven
// infeasible when that interval misses p's violated bound by more than
// the feasibility tolerance scaled by the size of the terms.
func (s *Solver) certifyInfeasible(p int, sigma float64, list []int) bool {
	// sigma > 0: x_p above its upper bound; need min x_p > up_p.
	// min x_p = −max Σ α_j x_j; sigma < 0: max x_p = −min Σ α_j x_j < lo_p.
	sum, scale := 0.0, 1.0
	for _, j := range list {
		a := s.rowAlpha[j]
		if math.Abs(a) <= zeroTol {
			// Round-off of a true zero (such as 1e-15 left by the
			// cancellation in ρᵀa_j): counted as zero, as in the primal
			// ratio test, so that an unbounded variable it multiplies
			// does not void the proof.
			continue
		}
		var b float64
		if (a > 0) == (sigma > 0) {
			b = s.up[j]
		} else {
			b = s.lo[j]
		}
		if math.IsInf(b, 0) {
			return false
		}
		sum += a * b
		scale = math.Max(scale, math.Abs(a*b))
	}
	tol := 1e3 * s.opt.feasTol() * scale
	if sigma > 0 {
		return -sum > s.up[p]+tol
	}
	return -sum < s.lo[p]-tol
}
