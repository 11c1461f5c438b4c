package mip

import (
	"context"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// smallLP is a two-column LP whose optimum is computed by hand:
//
//	minimize x + y  subject to  x + 2y ≥ 4,  3x + y ≥ 6,  y ≥ 0, x free.
//
// Along x + 2y = 4 the objective is 4 − y and 3x + y ≥ 6 allows y ≤ 1.2;
// along 3x + y = 6 it is 6 − 2x and x + 2y ≥ 4 allows x ≤ 1.6; both meet
// at (1.6, 1.2), so the minimum is 2.8. Every "infinite" value below (an
// upper bound of 1e30 on y, a lower bound of -1e30 on x, a range of 1e30
// on the L row row_c, a right-hand side of 1e30 on row_d) leaves that
// optimum unchanged when read as infinite. rangesG adds lines to the
// RANGES section.
func smallLP(rangesG string) string {
	return `NAME small
ROWS
 N cost
 G row_a
 G row_b
 L row_c
 L row_d
COLUMNS
 col_x cost 1 row_a 1
 col_x row_b 3 row_c 1
 col_x row_d 1
 col_y cost 1 row_a 2
 col_y row_b 1 row_c -1
 col_y row_d 1
RHS
 rhs row_a 4 row_b 6
 rhs row_c 5 row_d 1e30
RANGES
 rng row_c 1e30
` + rangesG + `BOUNDS
 UP bnd col_y 1e30
 LO bnd col_x -1e30
ENDATA
`
}

func solveText(t *testing.T, text string) (*Problem, *Result) {
	t.Helper()
	p, err := ReadMPS(strings.NewReader(text))
	if err != nil {
		t.Fatal(err)
	}
	res, err := Solve(context.Background(), p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return p, res
}

// TestMPSInfiniteValues: bounds, right-hand sides and ranges of 1e30 are
// infinite, so the hand-computed optimum 2.8 of smallLP stands; CBC (an
// independent solver) gives 2.8 on the same file when it is on PATH.
func TestMPSInfiniteValues(t *testing.T) {
	text := smallLP("")
	p, res := solveText(t, text)
	if res.Status != Optimal || math.Abs(res.Obj-2.8) > 1e-9 {
		t.Fatalf("status %v objective %v, want optimal 2.8 (hand computation)", res.Status, res.Obj)
	}
	q := &p.LP
	if !math.IsInf(q.ColUp[1], 1) || !math.IsInf(q.ColLo[0], -1) || !math.IsInf(q.RowLo[2], -1) || !math.IsInf(q.RowUp[3], 1) {
		t.Errorf("1e30 values not read as infinite: cols [%v,%v] [%v,%v], rows %v %v", q.ColLo[0], q.ColUp[0], q.ColLo[1], q.ColUp[1], q.RowLo, q.RowUp)
	}
	// A range of 1e30 on a G row gives [rhs, +∞) by the MPS definition of
	// ranges (GLPK reference manual, appendix "MPS format"): the same
	// optimum. (CBC 2.10.8 drops such a row and reports 2, as the
	// measured-figures section of the README notes.)
	if _, res := solveText(t, smallLP(" rng row_a 1e30\n")); res.Status != Optimal || math.Abs(res.Obj-2.8) > 1e-9 {
		t.Errorf("with a 1e30 range on a G row: status %v objective %v, want optimal 2.8", res.Status, res.Obj)
	}
	// 1e20 is the threshold: the same model written with 1e20 reads alike.
	if _, res := solveText(t, strings.ReplaceAll(text, "1e30", "1e20")); res.Status != Optimal || math.Abs(res.Obj-2.8) > 1e-9 {
		t.Errorf("with 1e20: status %v objective %v, want optimal 2.8", res.Status, res.Obj)
	}
	if _, err := exec.LookPath("cbc"); err != nil {
		t.Log("cbc not on PATH: the cross-check with CBC is skipped")
		return
	}
	file := filepath.Join(t.TempDir(), "small.mps")
	if err := os.WriteFile(file, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	if r := runCBC(t, file, time.Minute); r.status != "optimal" || !sameObj(r.obj, 2.8) {
		t.Errorf("CBC: %s %v, want optimal 2.8", r.status, r.obj)
	}
}

// TestMPSMaximizeUnbounded: maximize x subject to x ≥ 1 with x ≤ 1e30 is
// unbounded (hand reasoning: 1e30 is no bound).
func TestMPSMaximizeUnbounded(t *testing.T) {
	p, res := solveText(t, `NAME unb
OBJSENSE MAX
ROWS
 N obj
 G row_a
COLUMNS
 col_x obj 1 row_a 1
RHS
 rhs row_a 1
BOUNDS
 UP bnd col_x 1e30
ENDATA
`)
	if res.Status != Unbounded {
		t.Errorf("status %v, want unbounded", res.Status)
	}
	if !p.Maximize {
		t.Error("Maximize not set for OBJSENSE MAX")
	}
}

// TestMPSMaximizeSense: maximize x + 2y subject to x + y ≤ 4, x ≤ 3,
// y ≤ 1: the maximum is 3 + 2 = 5 (hand computation: y at its bound 1
// and x = 3). Problem.Sense turns the minimization result back.
func TestMPSMaximizeSense(t *testing.T) {
	p, res := solveText(t, `NAME maxt
OBJSENSE
    MAX
ROWS
 N obj
 L c1
COLUMNS
 col_x obj 1 c1 1
 col_y obj 2 c1 1
RHS
 rhs c1 4
BOUNDS
 UP bnd col_x 3
 UP bnd col_y 1
ENDATA
`)
	if res.Status != Optimal || p.Sense(res.Obj) != 5 || p.Sense(res.Bound) != 5 {
		t.Errorf("status %v objective %v bound %v in the file's sense, want optimal 5", res.Status, p.Sense(res.Obj), p.Sense(res.Bound))
	}
}

// publicFile reads one file of ../shared/data/mps-public, skipping the
// test when the folder is absent.
func publicFile(t testing.TB, name string) string {
	t.Helper()
	b, err := os.ReadFile(filepath.Join(dataDir(t, "mps-public"), name))
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return string(b)
}

// withBounds returns the MPS text with a BOUNDS line "typ BND col value"
// for every column added before ENDATA (in a BOUNDS section of its own
// when the file has none).
func withBounds(t *testing.T, text, typ, value string) string {
	t.Helper()
	p, err := ReadMPS(strings.NewReader(text))
	if err != nil {
		t.Fatal(err)
	}
	var b strings.Builder
	if !strings.Contains(text, "\nBOUNDS") {
		b.WriteString("BOUNDS\n")
	}
	for _, c := range p.ColNames {
		fmt.Fprintf(&b, " %s BND %s %s\n", typ, c, value)
	}
	k := strings.LastIndex(text, "ENDATA")
	return text[:k] + b.String() + text[k:]
}

// TestMPSPublicWithInfiniteBounds: netlib afiro with an upper bound of
// 1e30 on every column keeps its published optimum -464.7531429, adlittle
// with 1e20 on every column keeps 225494.9632 (netlib optima, as listed in
// the folder's README).
func TestMPSPublicWithInfiniteBounds(t *testing.T) {
	for _, c := range []struct {
		file, value string
		want        float64
	}{
		{"afiro.mps", "1e30", -464.7531429},
		{"adlittle.mps", "1e20", 225494.9632},
	} {
		text := withBounds(t, publicFile(t, c.file), "UP", c.value)
		_, res := solveText(t, text)
		if res.Status != Optimal || math.Abs(res.Obj-c.want) > 1e-6*math.Abs(c.want) {
			t.Errorf("%s with UP %s on every column: status %v objective %v, want optimal %v", c.file, c.value, res.Status, res.Obj, c.want)
		}
	}
}

// TestSolveNormalizesBounds: a problem built in code with 1e30 for "no
// bound" solves like one with math.Inf (Solve reads |bound| ≥ 1e20 as
// infinite).
func TestSolveNormalizesBounds(t *testing.T) {
	p, err := ReadMPS(strings.NewReader(smallLP("")))
	if err != nil {
		t.Fatal(err)
	}
	q := &p.LP
	for j := range q.ColUp {
		if math.IsInf(q.ColUp[j], 1) {
			q.ColUp[j] = 1e30
		}
		if math.IsInf(q.ColLo[j], -1) {
			q.ColLo[j] = -1e25
		}
	}
	for i := range q.RowUp {
		if math.IsInf(q.RowUp[i], 1) {
			q.RowUp[i] = 1e20
		}
		if math.IsInf(q.RowLo[i], -1) {
			q.RowLo[i] = -1e30
		}
	}
	res, err := Solve(context.Background(), p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if res.Status != Optimal || math.Abs(res.Obj-2.8) > 1e-9 {
		t.Errorf("status %v objective %v, want optimal 2.8", res.Status, res.Obj)
	}
	if q.ColUp[1] != 1e30 {
		t.Error("Solve changed the caller's problem")
	}
}

// TestMPSLexical: a UTF-8 byte-order mark, text after ENDATA and '$'
// comments leave the problem as without them.
func TestMPSLexical(t *testing.T) {
	plain := smallLP("")
	want, err := ReadMPS(strings.NewReader(plain))
	if err != nil {
		t.Fatal(err)
	}
	variants := map[string]string{
		"bom":           "\uFEFF" + plain,
		"after ENDATA":  plain + "IMPORTANCES\n col_x 3\nanything at all\n",
		"$ comments":    strings.Replace(strings.Replace(plain, " col_x row_d 1\n", " col_x row_d 1 $ a comment\n", 1), "ROWS\n", "ROWS $ rows follow\n$ a whole-line comment\n", 1),
		"inf spelled":   strings.Replace(plain, "UP bnd col_y 1e30", "UP bnd col_y Infinity", 1),
		"-inf spelled":  strings.Replace(plain, "LO bnd col_x -1e30", "LO bnd col_x -inf", 1),
		"exponent form": strings.Replace(plain, "rhs row_a 4 row_b 6", "rhs row_a 4.0E+00 row_b .6e1", 1),
	}
	for name, text := range variants {
		got, err := ReadMPS(strings.NewReader(text))
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if fmt.Sprint(got) != fmt.Sprint(want) {
			t.Errorf("%s: read %v, want %v", name, got, want)
		}
	}
}

// TestMPSRefusals: features this engine does not solve are named, values
// out of the stated ranges and non-MPS numbers are refused with the row or
// column named.
func TestMPSRefusals(t *testing.T) {
	base := "NAME t\nROWS\n N obj\n L r1\nCOLUMNS\n col_x obj 1 r1 1\nRHS\n rhs r1 4\n"
	cases := []struct{ name, text, want string }{
		{"SC", base + "BOUNDS\n SC bnd col_x 3\nENDATA\n", "semi-continuous bounds are not supported"},
		{"SI", base + "BOUNDS\n SI bnd col_x 3\nENDATA\n", "semi-integer bounds are not supported"},
		{"QUADOBJ", base + "QUADOBJ\n col_x col_x 1\nENDATA\n", "QUADOBJ: quadratic objectives and constraints are not supported"},
		{"QMATRIX", base + "QMATRIX\n col_x col_x 1\nENDATA\n", "QMATRIX: quadratic"},
		{"QSECTION", base + "QSECTION obj\nENDATA\n", "QSECTION: quadratic"},
		{"QCMATRIX", base + "QCMATRIX r1\nENDATA\n", "QCMATRIX: quadratic"},
		{"SOS", base + "SOS\n S1 SOS s1 1\nENDATA\n", "special ordered sets are not supported"},
		{"huge coefficient", strings.Replace(base, "r1 1\n", "r1 1e300\n", 1) + "ENDATA\n", `coefficient of column "col_x" in row "r1" is 1e300`},
		{"1e16 coefficient", strings.Replace(base, "r1 1\n", "r1 1e16\n", 1) + "ENDATA\n", `coefficient of column "col_x" in row "r1" is 1e16`},
		{"tiny coefficient", strings.Replace(base, "r1 1\n", "r1 1e-20\n", 1) + "ENDATA\n", `coefficient of column "col_x" in row "r1" is 1e-20`},
		{"huge cost", strings.Replace(base, "obj 1", "obj 1e300", 1) + "ENDATA\n", `coefficient of column "col_x" in row "obj" is 1e300`},
		{"infinite coefficient", strings.Replace(base, "r1 1\n", "r1 inf\n", 1) + "ENDATA\n", `coefficient of column "col_x" in row "r1" is inf`},
		{"1e16 bound", base + "BOUNDS\n UP bnd col_x 1e16\nENDATA\n", `UP bound of column "col_x" is 1e16: finite values must be at most 1e+15`},
		{"1e16 rhs", strings.Replace(base, "rhs r1 4", "rhs r1 1e16", 1) + "ENDATA\n", `RHS value for row "r1" is 1e16`},
		{"LO 1e30", base + "BOUNDS\n LO bnd col_x 1e30\nENDATA\n", `lower bound of +∞`},
		{"E row 1e30", strings.Replace(base, " L r1", " E r1", 1) + "RHS\n rhs r1 1e30\nENDATA\n", `row "r1" (type E)`},
		{"digit separator", strings.Replace(base, "rhs r1 4", "rhs r1 1_0", 1) + "ENDATA\n", `"1_0" is not a number`},
		{"hexadecimal", strings.Replace(base, "rhs r1 4", "rhs r1 0x1p-2", 1) + "ENDATA\n", `"0x1p-2" is not a number`},
		{"NaN", strings.Replace(base, "rhs r1 4", "rhs r1 NaN", 1) + "ENDATA\n", `"NaN" is not a number`},
		{"bare exponent", strings.Replace(base, "rhs r1 4", "rhs r1 1e", 1) + "ENDATA\n", `"1e" is not a number`},
		{"lone point", strings.Replace(base, "rhs r1 4", "rhs r1 .", 1) + "ENDATA\n", `"." is not a number`},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, err := ReadMPS(strings.NewReader(c.text))
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Errorf("err = %v, want it to contain %q", err, c.want)
			}
		})
	}
}

func TestParseMPSNumber(t *testing.T) {
	good := map[string]float64{"1": 1, "-2.5": -2.5, "+.5": 0.5, "5.": 5, "1e3": 1000, "1E+30": 1e30, "-7e-2": -0.07,
		"inf": math.Inf(1), "-Infinity": math.Inf(-1), "+INF": math.Inf(1), "1e999": math.Inf(1)}
	for s, want := range good {
		if v, ok := parseMPSNumber(s); !ok || v != want {
			t.Errorf("parseMPSNumber(%q) = %v, %v; want %v", s, v, ok, want)
		}
	}
	for _, s := range []string{"", "+", "-", ".", "e5", "1e", "1e+", "1_0", "0x10", "0x1p-2", "nan", "1.2.3", "1,5", "infin", "1d3", "--1"} {
		if v, ok := parseMPSNumber(s); ok {
			t.Errorf("parseMPSNumber(%q) = %v, want refused", s, v)
		}
	}
}
