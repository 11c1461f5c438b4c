package mip_test

import (
	"context"
	"fmt"
	"strings"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// A small set-covering problem: three zones, four candidate points with
// their costs (invented data).
func ExampleSolve() {
	p := mip.SetCover(
		[]float64{3, 2, 2, 5},
		[][]int{{0, 1}, {1, 2}, {0}, {0, 1, 2}},
	)
	res, err := mip.Solve(context.Background(), p, mip.Options{})
	if err != nil {
		panic(err)
	}
	fmt.Println(res.Status, res.Obj, res.X)
	// Output: optimal 4 [0 1 1 0]
}

func ExampleReadMPS() {
	const text = `NAME EXAMPLE
ROWS
 N COST
 G NEED
COLUMNS
 MARKER 'MARKER' 'INTORG'
 X COST 3 NEED 2
 Y COST 2 NEED 1
 MARKER 'MARKER' 'INTEND'
RHS
 RHS NEED 3
BOUNDS
 UP BND X 5
 UP BND Y 5
ENDATA
`
	p, err := mip.ReadMPS(strings.NewReader(text))
	if err != nil {
		panic(err)
	}
	res, err := mip.Solve(context.Background(), p, mip.Options{})
	if err != nil {
		panic(err)
	}
	fmt.Println(res.Status, res.Obj, res.X)
	// Output: optimal 5 [1 1]
}
