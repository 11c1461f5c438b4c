package mip

import (
	"bytes"
	"math"
	"math/rand/v2"
	"os"
	"reflect"
	"strings"
	"testing"
)

var inf = math.Inf(1)

// TestReadMPSAllSections reads a hand-written file that uses every section
// and bound type; the expected values follow the MPS conventions written
// in the GLPK reference manual, appendix "MPS format" (from memory).
func TestReadMPSAllSections(t *testing.T) {
	f, err := os.Open("testdata/allsections.mps")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	p, err := ReadMPS(f)
	if err != nil {
		t.Fatal(err)
	}
	if p.Name != "ALLSECT" {
		t.Errorf("Name = %q", p.Name)
	}
	wantRows := []string{"LIM1", "LIM2", "MYEQN", "EQRNG", "LRNG", "SPARE"}
	if !reflect.DeepEqual(p.RowNames, wantRows) {
		t.Errorf("rows = %v, want %v", p.RowNames, wantRows)
	}
	q := &p.LP
	// OBJSENSE MAX: objective negated; RHS on the objective row -7.5
	// means constant +7.5 in the max form, so -7.5 in the min form.
	wantObj := []float64{-1, -2, 1, -3, 0, -1, -1, -1, -1}
	if !reflect.DeepEqual(q.Obj, wantObj) {
		t.Errorf("Obj = %v, want %v", q.Obj, wantObj)
	}
	if p.ObjOffset != -7.5 {
		t.Errorf("ObjOffset = %v, want -7.5", p.ObjOffset)
	}
	wantLo := []float64{math.Inf(-1), 1, 7, -1, 6, math.Inf(-1)}
	wantUp := []float64{4, 3.5, 7, 2, 10, inf}
	if !reflect.DeepEqual(q.RowLo, wantLo) || !reflect.DeepEqual(q.RowUp, wantUp) {
		t.Errorf("row bounds lo=%v up=%v, want lo=%v up=%v", q.RowLo, q.RowUp, wantLo, wantUp)
	}
	wantCLo := []float64{0, -1, math.Inf(-1), 0, 3.25, math.Inf(-1), 0, 2, math.Inf(-1)}
	wantCUp := []float64{4, 1, inf, 9, 3.25, inf, 1, inf, -2}
	if !reflect.DeepEqual(q.ColLo, wantCLo) || !reflect.DeepEqual(q.ColUp, wantCUp) {
		t.Errorf("col bounds lo=%v up=%v, want lo=%v up=%v", q.ColLo, q.ColUp, wantCLo, wantCUp)
	}
	wantInt := []bool{false, true, true, true, false, false, true, true, false}
	if !reflect.DeepEqual(p.Integer, wantInt) {
		t.Errorf("Integer = %v, want %v", p.Integer, wantInt)
	}
	if q.ColStart[q.NumCols] != 8 {
		t.Errorf("nonzeros = %d, want 8", q.ColStart[q.NumCols])
	}
	if err := p.Validate(); err != nil {
		t.Error(err)
	}
}

func TestReadMPSErrors(t *testing.T) {
	cases := []struct {
		name, text, want string
	}{
		{"no objective", "ROWS\n L R1\nCOLUMNS\n", "line 3: COLUMNS before any N"},
		{"bad row type", "ROWS\n N OBJ\n X R1\n", "line 3: row \"R1\" has type \"X\""},
		{"unknown row", "ROWS\n N OBJ\nCOLUMNS\n x R9 1\n", "line 4: column \"x\" names row \"R9\""},
		{"bad number", "ROWS\n N OBJ\n L R\nCOLUMNS\n x R 1..2\n", "line 5: coefficient of column \"x\" in row \"R\" \"1..2\" is not a number"},
		{"bad bound", "ROWS\n N OBJ\nCOLUMNS\n x OBJ 1\nBOUNDS\n ZZ BND x 3\nENDATA\n", "line 6: bound type \"ZZ\""},
		{"unknown col", "ROWS\n N OBJ\nCOLUMNS\n x OBJ 1\nBOUNDS\n UP BND y 3\nENDATA\n", "line 6: BOUNDS names column \"y\""},
		{"no endata", "ROWS\n N OBJ\n", "no ENDATA"},
		{"bad section", "ROWZ\n", "line 1: unknown section header"},
		{"crossed bounds", "ROWS\n N OBJ\nCOLUMNS\n x OBJ 1\nBOUNDS\n LO BND x 3\n UP BND x 2\nENDATA\n", "lower bound 3 above its upper bound 2"},
		{"noncontiguous", "ROWS\n N OBJ\nCOLUMNS\n x OBJ 1\n y OBJ 1\n x OBJ 2\nENDATA\n", "line 6: column \"x\" appears again"},
		{"marker", "ROWS\n N OBJ\nCOLUMNS\n M 'MARKER' 'FOO'\nENDATA\n", "line 4: MARKER"},
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

// randomProblem makes a random, valid mixed-integer problem for format
// tests (invented data).
func randomProblem(rng *rand.Rand, m, n int, names bool) *Problem {
	p := &Problem{Name: "rand test", Integer: make([]bool, n)}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj = make([]float64, n)
	q.ColLo = make([]float64, n)
	q.ColUp = make([]float64, n)
	q.RowLo = make([]float64, m)
	q.RowUp = make([]float64, m)
	q.ColStart = make([]int, n+1)
	vals := []float64{0, 1, -1, 2.5, 1e-7, 3e12, -0.1}
	pick := func() float64 { return vals[rng.IntN(len(vals))] * float64(1+rng.IntN(5)) }
	for j := 0; j < n; j++ {
		q.Obj[j] = pick()
		switch rng.IntN(6) {
		case 0:
			q.ColLo[j], q.ColUp[j] = math.Inf(-1), inf
		case 1:
			q.ColLo[j], q.ColUp[j] = math.Inf(-1), pick()
		case 2:
			q.ColLo[j], q.ColUp[j] = 2, 2
		case 3:
			q.ColLo[j], q.ColUp[j] = -1, 7
		case 4:
			q.ColLo[j], q.ColUp[j] = 0, inf
		default:
			q.ColLo[j], q.ColUp[j] = 0, 1
		}
		p.Integer[j] = rng.IntN(2) == 0
		for i := 0; i < m; i++ {
			if rng.IntN(3) == 0 {
				q.RowIndex = append(q.RowIndex, i)
				q.Value = append(q.Value, pick())
			}
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	for i := 0; i < m; i++ {
		b := pick()
		switch rng.IntN(5) {
		case 0:
			q.RowLo[i], q.RowUp[i] = b, inf
		case 1:
			q.RowLo[i], q.RowUp[i] = math.Inf(-1), b
		case 2:
			q.RowLo[i], q.RowUp[i] = b, b
		case 3:
			q.RowLo[i], q.RowUp[i] = b, b+3
		default:
			q.RowLo[i], q.RowUp[i] = math.Inf(-1), inf
		}
	}
	p.ObjOffset = pick()
	if names {
		p.ColNames = make([]string, n)
		p.RowNames = make([]string, m)
		for j := range p.ColNames {
			p.ColNames[j] = "x_" + string(rune('a'+j%26)) + strings.Repeat("z", j/26)
		}
		for i := range p.RowNames {
			p.RowNames[i] = "row" + strings.Repeat("k", i)
		}
	}
	return p
}

func TestMPSRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := 0; trial < 200; trial++ {
		names := trial%2 == 0
		p := randomProblem(rng, rng.IntN(6), rng.IntN(8), names)
		var buf bytes.Buffer
		if err := WriteMPS(&buf, p); err != nil {
			t.Fatal(err)
		}
		text := buf.String()
		got, err := ReadMPS(strings.NewReader(text))
		if err != nil {
			t.Fatalf("trial %d: %v\n%s", trial, err, text)
		}
		want := *p
		want.Name = "rand_test"
		if !names {
			// Generated names come back.
			want.ColNames, want.RowNames = mpsNames(nil, p.LP.NumCols, "C"), mpsNames(nil, p.LP.NumRows, "R")
		}
		if want.LP.RowIndex == nil {
			want.LP.RowIndex, want.LP.Value = got.LP.RowIndex, got.LP.Value
		}
		if len(got.LP.RowIndex) == 0 && len(want.LP.RowIndex) == 0 {
			got.LP.RowIndex, got.LP.Value = want.LP.RowIndex, want.LP.Value
		}
		if len(want.RowNames) == 0 && len(got.RowNames) == 0 {
			got.RowNames = want.RowNames
		}
		if len(want.ColNames) == 0 && len(got.ColNames) == 0 {
			got.ColNames = want.ColNames
		}
		if !reflect.DeepEqual(got, &want) {
			t.Fatalf("trial %d: round trip differs\nwant %+v\ngot  %+v\n%s", trial, want, *got, text)
		}
		// Deterministic: writing again gives the same bytes.
		var again bytes.Buffer
		if err := WriteMPS(&again, p); err != nil || again.String() != text {
			t.Fatalf("trial %d: second write differs", trial)
		}
	}
}

func TestValidate(t *testing.T) {
	good := SetCover([]float64{1, 2}, [][]int{{0}, {0, 1}})
	if err := good.Validate(); err != nil {
		t.Fatal(err)
	}
	bad := []func(p *Problem){
		func(p *Problem) { p.LP.Obj = p.LP.Obj[:1] },
		func(p *Problem) { p.LP.RowIndex[0] = 5 },
		func(p *Problem) { p.LP.ColLo[0] = 3 },
		func(p *Problem) { p.LP.Value[1] = math.NaN() },
		func(p *Problem) { p.Integer = nil },
		func(p *Problem) { p.LP.RowLo[1] = math.Inf(1) },
		func(p *Problem) { p.LP.RowIndex[2] = 0 },
		func(p *Problem) { p.ColNames = []string{"a"} },
	}
	for k, f := range bad {
		p := SetCover([]float64{1, 2}, [][]int{{0}, {0, 1}})
		f(p)
		if err := p.Validate(); err == nil {
			t.Errorf("case %d: Validate accepted a broken problem", k)
		}
	}
}

func FuzzReadMPS(f *testing.F) {
	seed, err := os.ReadFile("testdata/allsections.mps")
	if err != nil {
		f.Fatal(err)
	}
	f.Add(string(seed))
	f.Add("ROWS\n N O\nCOLUMNS\n x O 1\nENDATA\n")
	f.Add("NAME\nROWS\n N O\n G r\nCOLUMNS\n x r 1e308\nRHS\n r 1\nRANGES\n r -1\nBOUNDS\n UP B x -1\nENDATA\n")
	f.Fuzz(func(t *testing.T, s string) {
		p, err := ReadMPS(strings.NewReader(s))
		if err != nil {
			return
		}
		if err := p.Validate(); err != nil {
			t.Fatalf("ReadMPS returned an invalid problem: %v", err)
		}
		var buf bytes.Buffer
		if err := WriteMPS(&buf, p); err != nil {
			t.Fatalf("WriteMPS: %v", err)
		}
		if _, err := ReadMPS(&buf); err != nil {
			t.Fatalf("re-read: %v\n%s", err, buf.String())
		}
	})
}
