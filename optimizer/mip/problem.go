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
}
