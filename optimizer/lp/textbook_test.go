package lp

import (
	"math"
	"testing"
)

// textbookCases are LPs with published optima. Maximizations are stated
// as minimizations of the negated objective; want is the minimum.
var textbookCases = []struct {
	name   string
	source string
	p      *Problem
	status Status
	want   float64
	wantX  []float64
}{
	{
		name:   "chvatal-ch2",
		source: "Chvátal, Linear Programming (1983), ch. 2, max 5x1+4x2+3x3, optimum 13 at (2,0,1); also Vanderbei, Linear Programming (2014), §2.1 (from memory)",
		p: dense([]float64{-5, -4, -3},
			[][]float64{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}},
			fill(3, -inf), []float64{5, 11, 8}, fill(3, 0), fill(3, inf)),
		status: Optimal, want: -13, wantX: []float64{2, 0, 1},
	},
	{
		name:   "wyndor-bounded",
		source: "Hillier & Lieberman, Introduction to Operations Research, §3.1 Wyndor Glass, max 3x1+5x2, optimum 36 at (2,6) (from memory); x1 ≤ 4 and 2x2 ≤ 12 given as column bounds",
		p: dense([]float64{-3, -5},
			[][]float64{{3, 2}},
			[]float64{-inf}, []float64{18}, []float64{0, 0}, []float64{4, 6}),
		status: Optimal, want: -36, wantX: []float64{2, 6},
	},
	{
		name:   "transport-equality",
		source: "Dantzig, Linear Programming and Extensions (1963), §3.3 transportation example as in the GAMS model library 'trnsport': optimum 153.675 (k$) (from memory); demand rows as equalities",
		p:      transport(true),
		status: Optimal, want: 153.675,
	},
	{
		name:   "transport-dual-free",
		source: "dual of the same transportation problem: max Σd_j v_j − Σs_i u_i, v_j − u_i ≤ c_ij, u ≥ 0, v free; equal to 153.675 by the duality theorem (Chvátal 1983, ch. 5)",
		p:      transportDual(),
		status: Optimal, want: -153.675,
	},
	{
		name:   "klee-minty-5",
		source: "Klee & Minty (1972) cube, n = 5: max Σ 2^(n−j) x_j, 2Σ_{j<i} 2^(i−j) x_j + x_i ≤ 5^i, optimum 5^n = 3125",
		p:      kleeMinty(5),
		status: Optimal, want: -3125,
	},
	{
		name:   "chvatal-cycling",
		source: "Chvátal (1983), ch. 3, the example on which the textbook rules cycle: max 10x1−57x2−9x3−24x4, optimum 1 at x1 = 1, x3 = 1 (from memory)",
		p: dense([]float64{-10, 57, 9, 24},
			[][]float64{{0.5, -5.5, -2.5, 9}, {0.5, -1.5, -0.5, 1}, {1, 0, 0, 0}},
			fill(3, -inf), []float64{0, 0, 1}, fill(4, 0), fill(4, inf)),
		status: Optimal, want: -1,
	},
	{
		name:   "chvatal-infeasible",
		source: "Chvátal (1983), ch. 1: max 3x1−x2, x1+x2 ≤ 2, −2x1−2x2 ≤ −10, x ≥ 0 is infeasible (from memory; evident: x1+x2 ≤ 2 and ≥ 5)",
		p: dense([]float64{-3, 1},
			[][]float64{{1, 1}, {-2, -2}},
			fill(2, -inf), []float64{2, -10}, fill(2, 0), fill(2, inf)),
		status: Infeasible,
	},
	{
		name:   "chvatal-unbounded",
		source: "Chvátal (1983), ch. 1: max x1−x2, −2x1+x2 ≤ −1, −x1−2x2 ≤ −2, x ≥ 0 is unbounded (from memory; x = (t, 0), t ≥ 2, is feasible with objective t)",
		p: dense([]float64{-1, 1},
			[][]float64{{-2, 1}, {-1, -2}},
			fill(2, -inf), []float64{-1, -2}, fill(2, 0), fill(2, inf)),
		status: Unbounded,
	},
}

// transport is Dantzig's two-plant three-market example: supplies 350
// and 600 cases, demands 325, 300, 275, freight 90 $ per case per
// thousand miles over the given distances, cost in k$.
func transport(eqDemand bool) *Problem {
	dist := [2][3]float64{{2.5, 1.7, 1.8}, {2.5, 1.8, 1.4}}
	supply := []float64{350, 600}
	demand := []float64{325, 300, 275}
	var obj []float64
	a := make([][]float64, 5)
	for i := range a {
		a[i] = make([]float64, 6)
	}
	for i := 0; i < 2; i++ {
		for j := 0; j < 3; j++ {
			k := 3*i + j
			obj = append(obj, 90*dist[i][j]/1000)
			a[i][k] = 1
			a[2+j][k] = 1
		}
	}
	rowLo := []float64{-inf, -inf, demand[0], demand[1], demand[2]}
	rowUp := []float64{supply[0], supply[1], inf, inf, inf}
	if eqDemand {
		copy(rowUp[2:], demand)
	}
	return dense(obj, a, rowLo, rowUp, fill(6, 0), fill(6, inf))
}

func transportDual() *Problem {
	dist := [2][3]float64{{2.5, 1.7, 1.8}, {2.5, 1.8, 1.4}}
	supply := []float64{350, 600}
	demand := []float64{325, 300, 275}
	// Variables u1, u2 (≥ 0), v1..v3 (free); minimize Σ s_i u_i − Σ d_j v_j.
	obj := []float64{supply[0], supply[1], -demand[0], -demand[1], -demand[2]}
	var a [][]float64
	var up []float64
	for i := 0; i < 2; i++ {
		for j := 0; j < 3; j++ {
			row := make([]float64, 5)
			row[i] = -1
			row[2+j] = 1
			a = append(a, row)
			up = append(up, 90*dist[i][j]/1000)
		}
	}
	return dense(obj, a, fill(6, -inf), up, []float64{0, 0, -inf, -inf, -inf}, fill(5, inf))
}

func kleeMinty(n int) *Problem {
	obj := make([]float64, n)
	a := make([][]float64, n)
	up := make([]float64, n)
	for i := 0; i < n; i++ {
		obj[i] = -math.Pow(2, float64(n-1-i))
		a[i] = make([]float64, n)
		for j := 0; j < i; j++ {
			a[i][j] = 2 * math.Pow(2, float64(i-j))
		}
		a[i][i] = 1
		up[i] = math.Pow(5, float64(i+1))
	}
	return dense(obj, a, fill(n, -inf), up, fill(n, 0), fill(n, inf))
}

func TestTextbook(t *testing.T) {
	for _, tc := range textbookCases {
		t.Run(tc.name, func(t *testing.T) {
			r, err := Solve(tc.p, Options{})
			if err != nil {
				t.Fatal(err)
			}
			if r.Status != tc.status {
				t.Fatalf("status %v, want %v (%s)", r.Status, tc.status, tc.source)
			}
			if tc.status != Optimal {
				return
			}
			if math.Abs(r.Obj-tc.want) > 1e-7*math.Max(1, math.Abs(tc.want)) {
				t.Errorf("objective %.10g, want %.10g (%s)", r.Obj, tc.want, tc.source)
			}
			for j, w := range tc.wantX {
				if math.Abs(r.X[j]-w) > 1e-7 {
					t.Errorf("x[%d] = %g, want %g (%s)", j, r.X[j], w, tc.source)
				}
			}
			checkKKT(t, tc.p, r, 1e-7)
		})
	}
}
