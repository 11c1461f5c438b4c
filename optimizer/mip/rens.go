package mip

import (
	"math"
	"time"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// Limits of the RENS sub-MIP (Berthold 2014 uses a minimum fixing rate
// of one half and a node limit of a few hundred; the values here are
// common practice).
const (
	rensMinFixRate = 0.5
	rensNodeLimit  = 100
	rensGapRel     = 1e-3
	rensMaxDepth   = 1
)

// rens is the relaxation enforced neighbourhood search of Berthold
// (2014, Math. Prog. Comp. 6:33–54, from memory), in a softer form:
// binary columns that are integral in the LP optimum r are fixed at
// their value and every other column keeps its global bounds, and the
// sub-MIP is solved by this engine with a node limit. Berthold's
// restriction of fractional columns to the two integers around their
// LP value made the sub-MIP of plan models infeasible (rounding the
// points up needs more rig days than the rounded-up LP days), so it is
// not applied. On plan models the LP bound is tight and three quarters
// of the LP optimum is integral, so the sub-MIP is small. The node
// limit keeps the work deterministic; only the caller's deadline cuts
// it short. It reports whether the incumbent improved.
func (e *engine) rens(r *lp.Result) bool { return e.subMIP(r, nil) }

// rins is RINS (Danna, Rothberg and Le Pape 2005, Math. Prog. 102:71–90):
// as rens, but a binary is fixed only where the node's LP value and the
// incumbent agree, so the sub-MIP searches around the incumbent.
func (e *engine) rins(r *lp.Result) bool {
	if e.inc == nil {
		return false
	}
	return e.subMIP(r, e.inc)
}

// subMIP fixes the binaries that are integral in r (and equal to ref
// where ref is given) and solves the rest with a node limit.
func (e *engine) subMIP(r *lp.Result, ref []float64) bool {
	if e.opt.subDepth >= rensMaxDepth || e.cover != nil {
		return false
	}
	q := &e.p.LP
	nInt, fixed := 0, 0
	lo := append([]float64(nil), e.glo...)
	up := append([]float64(nil), e.gup...)
	for j := 0; j < e.n; j++ {
		if !e.p.Integer[j] {
			continue
		}
		nInt++
		v := r.X[j]
		if !isFrac(v) && up[j]-lo[j] <= 1 && (ref == nil || math.Round(v) == ref[j]) {
			lo[j] = math.Round(v)
			up[j] = lo[j]
			fixed++
		}
	}
	if nInt == 0 || float64(fixed) < rensMinFixRate*float64(nInt) {
		return false
	}
	sub := &Problem{LP: *q, Integer: e.p.Integer}
	sub.LP.ColLo, sub.LP.ColUp = lo, up
	opt := Options{GapRel: rensGapRel, NodeLimit: rensNodeLimit, subDepth: e.opt.subDepth + 1}
	if !e.deadline.IsZero() {
		left := time.Until(e.deadline)
		if left <= 0 {
			return false
		}
		opt.TimeLimit = left
	}
	res, err := Solve(e.ctx, sub, opt)
	if err != nil || res.X == nil {
		return false
	}
	return e.setIncumbent(res.X)
}
