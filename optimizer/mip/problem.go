package mip

import "github.com/rigmix/rigmix/optimizer/lp"

// Problem is a mixed-integer linear program: the linear program LP with the
// columns marked in Integer restricted to integer values. Names are optional
// (nil or one per column/row) and are used by MPS export and messages.
type Problem struct {
	Name string
	LP   lp.Problem

	Integer   []bool // length LP.NumCols
	ColNames  []string
	RowNames  []string
	ObjOffset float64 // constant added to the objective value
	// Maximize records that the source of the problem maximized (MPS
	// OBJSENSE MAX): LP.Obj and ObjOffset hold the negated objective, so
	// Solve still minimizes, and Sense turns a result's Obj and Bound
	// back into the source's own sense. WriteMPS writes the minimization
	// form (GLPK 5.0 reads no OBJSENSE section).
	Maximize bool
}

// Sense returns v, an objective value or bound of Solve's minimization,
// in the problem's own sense: -v when Maximize is set.
func (p *Problem) Sense(v float64) float64 {
	if p.Maximize {
		return -v
	}
	return v
}
