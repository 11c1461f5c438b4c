package mip

import (
	"context"
	"math"
	"strings"
	"testing"
)

// Textbook integer programs with published optima. All were typed from
// memory of the books named; each optimum was also confirmed with GLPK
// 5.0 (glpsol) before being written here.
func TestTextbookExamples(t *testing.T) {
	cases := []struct {
		source string
		mps    string
		max    float64   // published optimal (maximum) objective
		x      []float64 // published optimal solution, nil if not unique
	}{
		{
			// Taha, Operations Research: An Introduction (8th ed.),
			// §9.2.1, branch-and-bound example: max 5x1+4x2,
			// x1+x2 ≤ 5, 10x1+6x2 ≤ 45; optimum z = 23 at (3, 2).
			source: "Taha §9.2.1",
			mps: `NAME TAHA
OBJSENSE MAX
ROWS
 N Z
 L C1
 L C2
COLUMNS
 M1 'MARKER' 'INTORG'
 X1 Z 5 C1 1
 X1 C2 10
 X2 Z 4 C1 1
 X2 C2 6
 M2 'MARKER' 'INTEND'
RHS
 RHS C1 5 C2 45
ENDATA
`,
			max: 23, x: []float64{3, 2},
		},
		{
			// Winston, Operations Research: Applications and Algorithms
			// (4th ed.), §9.3, Telfa Corporation: max 8x1+5x2,
			// x1+x2 ≤ 6, 9x1+5x2 ≤ 45; optimum z = 40 at (5, 0).
			source: "Winston §9.3 Telfa",
			mps: `NAME TELFA
OBJSENSE
    MAX
ROWS
 N Z
 L C1
 L C2
COLUMNS
 X1 Z 8 C1 1
 X1 C2 9
 X2 Z 5 C1 1
 X2 C2 5
RHS
 RHS C1 6 C2 45
BOUNDS
 LI BND X1 0
 LI BND X2 0
ENDATA
`,
			max: 40, x: []float64{5, 0},
		},
		{
			// Hillier and Lieberman, Introduction to Operations Research
			// (7th ed.), §12.1, California Manufacturing Co.: binary
			// max 9x1+5x2+6x3+4x4, 6x1+3x2+5x3+2x4 ≤ 10, x3+x4 ≤ 1,
			// x3 ≤ x1, x4 ≤ x2; optimum 14 at (1, 1, 0, 0).
			source: "Hillier–Lieberman §12.1 California Manufacturing",
			mps: `NAME CALMAN
OBJSENSE MAX
ROWS
 N Z
 L BUDGET
 L ONEWH
 L W3
 L W4
COLUMNS
 X1 Z 9 BUDGET 6
 X1 W3 -1
 X2 Z 5 BUDGET 3
 X2 W4 -1
 X3 Z 6 BUDGET 5
 X3 ONEWH 1 W3 1
 X4 Z 4 BUDGET 2
 X4 ONEWH 1 W4 1
RHS
 RHS BUDGET 10 ONEWH 1
BOUNDS
 BV BND X1
 BV BND X2
 BV BND X3
 BV BND X4
ENDATA
`,
			max: 14, x: []float64{1, 1, 0, 0},
		},
		{
			// Hillier and Lieberman (7th ed.), §12.7, mixed BIP/MIP
			// branch-and-bound example: max 4x1−2x2+7x3−x4,
			// x1+5x3 ≤ 10, x1+x2−x3 ≤ 1, 6x1−5x2 ≤ 0, −x1+2x3−2x4 ≤ 3,
			// x1..x3 integer, x4 continuous; optimum 13.5 at
			// (0, 0, 2, 0.5).
			source: "Hillier–Lieberman §12.7 MIP example",
			mps: `NAME HLMIP
OBJSENSE MAX
ROWS
 N Z
 L C1
 L C2
 L C3
 L C4
COLUMNS
 M1 'MARKER' 'INTORG'
 X1 Z 4 C1 1
 X1 C2 1 C3 6
 X1 C4 -1
 X2 Z -2 C2 1
 X2 C3 -5
 X3 Z 7 C1 5
 X3 C2 -1 C4 2
 M2 'MARKER' 'INTEND'
 X4 Z -1 C4 -2
RHS
 RHS C1 10 C2 1
 RHS C4 3
BOUNDS
 PL BND X1
 PL BND X2
 PL BND X3
ENDATA
`,
			max: 13.5, x: []float64{0, 0, 2, 0.5},
		},
		{
			// Winston (4th ed.), §9.2, Stockco capital budgeting:
			// binary max 16x1+22x2+12x3+8x4, 5x1+7x2+4x3+3x4 ≤ 14;
			// optimum 42 at (0, 1, 1, 1).
			source: "Winston §9.2 Stockco",
			mps: `NAME STOCKCO
OBJSENSE MAX
ROWS
 N NPV
 L CASH
COLUMNS
 X1 NPV 16 CASH 5
 X2 NPV 22 CASH 7
 X3 NPV 12 CASH 4
 X4 NPV 8 CASH 3
RHS
 RHS CASH 14
BOUNDS
 BV BND X1
 BV BND X2
 BV BND X3
 BV BND X4
ENDATA
`,
			max: 42, x: []float64{0, 1, 1, 1},
		},
	}
	for _, c := range cases {
		t.Run(c.source, func(t *testing.T) {
			p, err := ReadMPS(strings.NewReader(c.mps))
			if err != nil {
				t.Fatal(err)
			}
			res, err := Solve(context.Background(), p, Options{})
			if err != nil {
				t.Fatal(err)
			}
			// ReadMPS turns MAX into minimizing the negated objective.
			if res.Status != Optimal || math.Abs(-res.Obj-c.max) > 1e-9 {
				t.Fatalf("%v with max %v; want optimal %v (%s)", res.Status, -res.Obj, c.max, c.source)
			}
			for j, v := range c.x {
				if math.Abs(res.X[j]-v) > 1e-7 {
					t.Errorf("x = %v; want %v (%s)", res.X, c.x, c.source)
					break
				}
			}
		})
	}
}
