package lp

// Problem is a linear program in bounded form:
//
//	minimize    cᵀx
//	subject to  RowLo ≤ A x ≤ RowUp
//	            ColLo ≤ x   ≤ ColUp
//
// A is stored by sparse columns (compressed sparse column form): the
// entries of column j are RowIndex[ColStart[j]:ColStart[j+1]] with values
// Value[ColStart[j]:ColStart[j+1]]. Bounds may be math.Inf(-1) or math.Inf(1);
// an equality row has RowLo == RowUp.
type Problem struct {
	NumRows, NumCols int

	Obj          []float64 // c, length NumCols
	ColLo, ColUp []float64 // length NumCols
	RowLo, RowUp []float64 // length NumRows

	ColStart []int     // length NumCols+1
	RowIndex []int     // length ColStart[NumCols]
	Value    []float64 // length ColStart[NumCols]
}
