package lp

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// scpDir finds ../shared/data/orlib-scp relative to the repository root
// (the directory holding go.mod), or skips the test.
func scpDir(tb testing.TB) string {
	tb.Helper()
	dir, err := os.Getwd()
	if err != nil {
		tb.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			break
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			tb.Skip("no go.mod above the package directory; cannot locate ../shared/data")
		}
		dir = parent
	}
	d := filepath.Join(dir, "..", "shared", "data", "orlib-scp")
	if _, err := os.Stat(d); err != nil {
		tb.Skipf("OR-Library set-covering data not found at %s (expected ../shared/data/orlib-scp beside the repository)", d)
	}
	return d
}

// readSCP parses an OR-Library set-covering file (Beasley 1987 format:
// m n; n costs; per row a count and 1-based column indices) into the
// LP relaxation min cᵀx, Σ_{j covers i} x_j ≥ 1, 0 ≤ x ≤ 1.
func readSCP(tb testing.TB, path string) *Problem {
	tb.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		tb.Fatal(err)
	}
	f := strings.Fields(string(data))
	pos := 0
	next := func() int {
		if pos >= len(f) {
			tb.Fatalf("%s: unexpected end of file", path)
		}
		v, err := strconv.Atoi(f[pos])
		if err != nil {
			tb.Fatalf("%s: token %d: %v", path, pos, err)
		}
		pos++
		return v
	}
	m, n := next(), next()
	obj := make([]float64, n)
	for j := range obj {
		obj[j] = float64(next())
	}
	cols := make([][]int, n)
	for i := 0; i < m; i++ {
		k := next()
		for t := 0; t < k; t++ {
			j := next() - 1
			cols[j] = append(cols[j], i)
		}
	}
	p := &Problem{NumRows: m, NumCols: n, Obj: obj,
		ColLo: fill(n, 0), ColUp: fill(n, 1), RowLo: fill(m, 1), RowUp: fill(m, inf)}
	p.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		for _, i := range cols[j] {
			p.RowIndex = append(p.RowIndex, i)
			p.Value = append(p.Value, 1)
		}
		p.ColStart[j+1] = len(p.RowIndex)
	}
	return p
}

func scpOptima(tb testing.TB, dir string) map[string]float64 {
	data, err := os.ReadFile(filepath.Join(dir, "OPTIMA.tsv"))
	if err != nil {
		tb.Fatal(err)
	}
	out := map[string]float64{}
	for _, line := range strings.Split(string(data), "\n")[1:] {
		f := strings.Split(line, "\t")
		if len(f) < 2 {
			continue
		}
		v, err := strconv.ParseFloat(f[1], 64)
		if err == nil {
			out[f[0]] = v
		}
	}
	return out
}

// writeCPLEXLP writes p in CPLEX LP format (as read by glpsol --lp).
func writeCPLEXLP(p *Problem) []byte {
	var b bytes.Buffer
	num := func(v float64) string {
		switch {
		case math.IsInf(v, 1):
			return "+inf"
		case math.IsInf(v, -1):
			return "-inf"
		}
		return strconv.FormatFloat(v, 'g', -1, 64)
	}
	term := func(v float64, j int) string {
		if v < 0 {
			return fmt.Sprintf(" - %s x%d", num(-v), j)
		}
		return fmt.Sprintf(" + %s x%d", num(v), j)
	}
	b.WriteString("Minimize\n obj:")
	for j, c := range p.Obj {
		b.WriteString(term(c, j))
		if j%8 == 7 {
			b.WriteString("\n")
		}
	}
	b.WriteString("\nSubject To\n")
	type ent struct {
		j int
		v float64
	}
	rows := make([][]ent, p.NumRows)
	for j := 0; j < p.NumCols; j++ {
		for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
			rows[p.RowIndex[k]] = append(rows[p.RowIndex[k]], ent{j, p.Value[k]})
		}
	}
	for i, r := range rows {
		lo, up := p.RowLo[i], p.RowUp[i]
		if len(r) == 0 || (math.IsInf(lo, -1) && math.IsInf(up, 1)) {
			continue
		}
		write := func(name, rel string, rhs float64) {
			fmt.Fprintf(&b, " %s:", name)
			for k, e := range r {
				b.WriteString(term(e.v, e.j))
				if k%8 == 7 {
					b.WriteString("\n")
				}
			}
			fmt.Fprintf(&b, " %s %s\n", rel, num(rhs))
		}
		switch {
		case lo == up:
			write(fmt.Sprintf("r%d", i), "=", lo)
		case math.IsInf(lo, -1):
			write(fmt.Sprintf("r%d", i), "<=", up)
		case math.IsInf(up, 1):
			write(fmt.Sprintf("r%d", i), ">=", lo)
		default: // ranged: two rows, GLPK's reader has no double bounds
			write(fmt.Sprintf("r%d_lo", i), ">=", lo)
			write(fmt.Sprintf("r%d_up", i), "<=", up)
		}
	}
	b.WriteString("Bounds\n")
	for j := 0; j < p.NumCols; j++ {
		lo, up := p.ColLo[j], p.ColUp[j]
		switch {
		case lo == up:
			fmt.Fprintf(&b, " x%d = %s\n", j, num(lo))
		case math.IsInf(lo, -1) && math.IsInf(up, 1):
			fmt.Fprintf(&b, " x%d free\n", j)
		default:
			fmt.Fprintf(&b, " %s <= x%d <= %s\n", num(lo), j, num(up))
		}
	}
	b.WriteString("End\n")
	return b.Bytes()
}

var glpObj = regexp.MustCompile(`Objective:\s+obj = ([-+0-9.eE]+)`)

// glpsolLP solves the LP with GLPK's glpsol (an independent solver), or
// returns NaN when glpsol is not on PATH.
func glpsolLP(tb testing.TB, p *Problem) float64 {
	st, v, ok := glpsolSolve(tb, p)
	if !ok {
		return math.NaN()
	}
	if st != Optimal {
		tb.Fatalf("glpsol: %v", st)
	}
	return v
}

// glpsolSolve runs glpsol --nopresol on p and returns its status and
// optimal value; ok is false when glpsol is not on PATH.
func glpsolSolve(tb testing.TB, p *Problem) (st Status, obj float64, ok bool) {
	path, err := exec.LookPath("glpsol")
	if err != nil {
		return 0, 0, false
	}
	dir := tb.TempDir()
	lpFile := filepath.Join(dir, "p.lp")
	outFile := filepath.Join(dir, "p.out")
	if err := os.WriteFile(lpFile, writeCPLEXLP(p), 0o644); err != nil {
		tb.Fatal(err)
	}
	log, err := exec.Command(path, "--nopresol", "--lp", lpFile, "-o", outFile).CombinedOutput()
	if err != nil {
		tb.Fatalf("glpsol: %v\n%s", err, log)
	}
	switch {
	case bytes.Contains(log, []byte("HAS NO PRIMAL FEASIBLE")):
		return Infeasible, 0, true
	case bytes.Contains(log, []byte("HAS UNBOUNDED PRIMAL")):
		return Unbounded, 0, true
	case !bytes.Contains(log, []byte("OPTIMAL LP SOLUTION FOUND")):
		tb.Fatalf("glpsol ended without a verdict:\n%s", log)
	}
	rep, err := os.ReadFile(outFile)
	if err != nil {
		tb.Fatal(err)
	}
	mm := glpObj.FindSubmatch(rep)
	if mm == nil {
		tb.Fatalf("glpsol report has no objective:\n%s", rep)
	}
	v, err := strconv.ParseFloat(string(mm[1]), 64)
	if err != nil {
		tb.Fatal(err)
	}
	return Optimal, v, true
}

// TestSetCoveringLP solves LP relaxations of OR-Library set-covering
// instances (Beasley 1987): the value must not exceed the proven integer
// optimum of OPTIMA.tsv, the solution must satisfy the KKT conditions,
// and it must equal GLPK's (glpsol) LP optimum when glpsol is installed.
func TestSetCoveringLP(t *testing.T) {
	dir := scpDir(t)
	optima := scpOptima(t, dir)
	names := []string{"scp41", "scp51", "scp61", "scpa1", "scpe1"}
	if !testing.Short() {
		names = append(names, "scpb1", "scpc1", "scpd1")
	}
	for _, name := range names {
		t.Run(name, func(t *testing.T) {
			p := readSCP(t, filepath.Join(dir, name+".txt"))
			r, err := Solve(p, Options{})
			if err != nil {
				t.Fatal(err)
			}
			if r.Status != Optimal {
				t.Fatalf("status %v", r.Status)
			}
			checkKKT(t, p, r, 1e-7)
			// OR-Library published integer optimum (OPTIMA.tsv).
			if ip, ok := optima[name]; !ok {
				t.Errorf("no integer optimum for %s in OPTIMA.tsv", name)
			} else if r.Obj > ip+1e-6 {
				t.Errorf("LP value %g exceeds the integer optimum %g", r.Obj, ip)
			}
			// Independent solver: GLPK glpsol.
			ref := glpsolLP(t, p)
			if math.IsNaN(ref) {
				t.Logf("%s: LP %.6f in %d iterations (glpsol not on PATH, no cross-check)", name, r.Obj, r.Iterations)
				return
			}
			if math.Abs(r.Obj-ref) > 1e-6*math.Max(1, math.Abs(ref)) {
				t.Errorf("LP value %.9g, glpsol %.9g", r.Obj, ref)
			}
			t.Logf("%s: LP %.6f (glpsol %.6f, integer optimum %g) in %d iterations", name, r.Obj, ref, optima[name], r.Iterations)
		})
	}
}
