package mip

import (
	"bufio"
	"bytes"
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"
)

// extResult is what an external solver reported.
type extResult struct {
	status string // "optimal", "infeasible" or "other"
	obj    float64
	wall   time.Duration
}

var (
	cbcObjRe   = regexp.MustCompile(`(?m)^Objective value:\s+(\S+)`)
	cbcLPObjRe = regexp.MustCompile(`(?m)^Optimal - objective value (\S+)`) // an LP: no branch and cut
	glpkObjRe  = regexp.MustCompile(`(?m)^Objective:\s+\S+ = (\S+)`)
	glpkStatRe = regexp.MustCompile(`(?m)^Status:\s+(.+)$`)
)

// runCBC solves an MPS file with CBC (COIN-OR Branch and Cut), single
// thread, timing the whole process.
func runCBC(t testing.TB, file string, timeout time.Duration) extResult {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), timeout)
	defer cancel()
	start := time.Now()
	out, err := exec.CommandContext(ctx, "cbc", file, "-threads", "1", "-solve", "-quit").CombinedOutput()
	wall := time.Since(start)
	if err != nil && ctx.Err() == nil {
		t.Fatalf("cbc %s: %v\n%s", file, err, out)
	}
	s := string(out)
	if strings.Contains(s, "errors on input") {
		t.Fatalf("cbc could not read %s:\n%s", file, s)
	}
	r := extResult{status: "other", wall: wall}
	switch {
	case strings.Contains(s, "Result - Optimal solution found"):
		r.status = "optimal"
	case cbcLPObjRe.MatchString(s) && !strings.Contains(s, "Result - "):
		r.status = "optimal"
		r.obj, _ = strconv.ParseFloat(cbcLPObjRe.FindStringSubmatch(s)[1], 64)
		return r
	case strings.Contains(s, "infeasible"):
		r.status = "infeasible"
	}
	if m := cbcObjRe.FindStringSubmatch(s); m != nil {
		r.obj, _ = strconv.ParseFloat(m[1], 64)
	}
	return r
}

// runGLPK solves an MPS file with GLPK's glpsol (--freemps).
func runGLPK(t testing.TB, file string, timeout time.Duration) extResult {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), timeout)
	defer cancel()
	outFile := file + ".glpk.txt"
	start := time.Now()
	out, err := exec.CommandContext(ctx, "glpsol", "--freemps", file, "-o", outFile).CombinedOutput()
	wall := time.Since(start)
	r := extResult{status: "other", wall: wall}
	if err != nil {
		if ctx.Err() != nil {
			return r
		}
		t.Fatalf("glpsol %s: %v\n%s", file, err, out)
	}
	b, err := os.ReadFile(outFile)
	if err != nil {
		t.Fatalf("glpsol wrote no report: %v\n%s", err, out)
	}
	s := string(b)
	if m := glpkStatRe.FindStringSubmatch(s); m != nil {
		switch st := strings.TrimSpace(m[1]); {
		case st == "INTEGER OPTIMAL" || st == "OPTIMAL":
			r.status = "optimal"
		case strings.Contains(st, "EMPTY") || strings.Contains(st, "INFEASIBLE"):
			r.status = "infeasible"
		}
	}
	if m := glpkObjRe.FindStringSubmatch(s); m != nil {
		r.obj, _ = strconv.ParseFloat(m[1], 64)
	}
	if r.status == "other" && strings.Contains(string(out), "PROBLEM HAS NO") {
		r.status = "infeasible"
	}
	return r
}

func writeMPSFile(t testing.TB, dir, name string, p *Problem) string {
	t.Helper()
	var buf bytes.Buffer
	if err := WriteMPS(&buf, p); err != nil {
		t.Fatal(err)
	}
	f := filepath.Join(dir, name+".mps")
	if err := os.WriteFile(f, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return f
}

// randomGeneralMIP makes a small bounded MIP with general rows, integer
// and continuous columns (invented data for cross-checks).
func randomGeneralMIP(rng *rand.Rand, m, n int) *Problem {
	p := &Problem{Integer: make([]bool, n)}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj = make([]float64, n)
	q.ColLo = make([]float64, n)
	q.ColUp = make([]float64, n)
	q.RowLo = make([]float64, m)
	q.RowUp = make([]float64, m)
	q.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		q.Obj[j] = float64(rng.IntN(21) - 10)
		p.Integer[j] = rng.IntN(4) != 0
		q.ColLo[j] = float64(-rng.IntN(2))
		q.ColUp[j] = q.ColLo[j] + float64(1+rng.IntN(3))
		for i := 0; i < m; i++ {
			if rng.IntN(2) == 0 {
				q.RowIndex = append(q.RowIndex, i)
				q.Value = append(q.Value, float64(rng.IntN(11)-5)+0.5*float64(rng.IntN(2)))
			}
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	for i := 0; i < m; i++ {
		b := float64(rng.IntN(9) - 2)
		switch rng.IntN(4) {
		case 0:
			q.RowLo[i], q.RowUp[i] = b, math.Inf(1)
		case 1:
			q.RowLo[i], q.RowUp[i] = math.Inf(-1), b
		case 2:
			q.RowLo[i], q.RowUp[i] = b, b
		default:
			q.RowLo[i], q.RowUp[i] = b-2, b+1
		}
	}
	p.ObjOffset = float64(rng.IntN(7) - 3)
	return p
}

func sameObj(a, b float64) bool {
	return math.Abs(a-b) <= 1e-6*math.Max(1, math.Max(math.Abs(a), math.Abs(b)))
}

// TestAgainstExternalSolvers cross-checks optimal values with CBC and
// GLPK (independent solvers) on problems written by WriteMPS.
func TestAgainstExternalSolvers(t *testing.T) {
	type solver struct {
		name string
		run  func(testing.TB, string, time.Duration) extResult
	}
	var solvers []solver
	if _, err := exec.LookPath("cbc"); err == nil {
		solvers = append(solvers, solver{"cbc", runCBC})
	}
	if _, err := exec.LookPath("glpsol"); err == nil {
		solvers = append(solvers, solver{"glpsol", runGLPK})
	}
	if len(solvers) == 0 {
		t.Skip("neither cbc nor glpsol is on PATH; skipping the cross-check with external solvers")
	}
	dir := t.TempDir()
	rng := rand.New(rand.NewPCG(3, 5))
	var probs []*Problem
	for k := 0; k < 8; k++ {
		m, n := 20+rng.IntN(30), 40+rng.IntN(60)
		cost := make([]float64, n)
		rows := make([][]int, n)
		for j := range cost {
			cost[j] = float64(1 + rng.IntN(20))
			for i := 0; i < m; i++ {
				if rng.IntN(8) == 0 {
					rows[j] = append(rows[j], i)
				}
			}
		}
		p := SetCoverRows(m, cost, rows)
		p.Name = fmt.Sprintf("cover%d", k)
		probs = append(probs, p)
	}
	for k := 0; k < 12; k++ {
		p := randomGeneralMIP(rng, 2+rng.IntN(5), 3+rng.IntN(6))
		p.Name = fmt.Sprintf("general%d", k)
		probs = append(probs, p)
	}
	for k := 0; k < 6; k++ {
		p := planLikeMIP(rng, 25+rng.IntN(20), 3+rng.IntN(2))
		p.Name = fmt.Sprintf("planlike%d", k)
		probs = append(probs, p)
	}
	if d := orlibDirIfPresent(); d != "" {
		for _, name := range []string{"scp41", "scp61", "scpe1"} {
			probs = append(probs, loadORLib(t, d, name))
		}
	}
	for _, p := range probs {
		file := writeMPSFile(t, dir, p.Name, p)
		res, err := Solve(context.Background(), p, Options{TimeLimit: 60 * time.Second})
		if err != nil {
			t.Fatalf("%s: %v", p.Name, err)
		}
		t.Logf("%s: ours %v %v, %d nodes, %v", p.Name, res.Status, res.Obj, res.Nodes, res.Elapsed.Round(time.Millisecond))
		for _, s := range solvers {
			ext := s.run(t, file, 120*time.Second)
			switch {
			case ext.status == "infeasible":
				if res.Status != Infeasible {
					t.Errorf("%s: %s says infeasible; we say %v (obj %v)", p.Name, s.name, res.Status, res.Obj)
				}
			case ext.status == "optimal":
				if res.Status != Optimal || !sameObj(res.Obj, ext.obj) {
					t.Errorf("%s: %s finds optimum %v; we say %v with %v", p.Name, s.name, ext.obj, res.Status, res.Obj)
				}
			default:
				t.Logf("%s: %s ended without a proven result", p.Name, s.name)
			}
		}
	}
}

func orlibDirIfPresent() string {
	dir, err := os.Getwd()
	if err != nil {
		return ""
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			break
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			return ""
		}
		dir = parent
	}
	d := filepath.Join(dir, "..", "shared", "data", "orlib-scp")
	if _, err := os.Stat(d); err != nil {
		return ""
	}
	return d
}

var _ = bufio.NewScanner

// mipBuilder assembles a Problem row by row (test helper).
type mipBuilder struct {
	cost   []float64
	lo, up []float64
	isInt  []bool
	rows   []map[int]float64
	rlo    []float64
	rup    []float64
}

func (b *mipBuilder) col(cost, lo, up float64, integer bool) int {
	b.cost = append(b.cost, cost)
	b.lo = append(b.lo, lo)
	b.up = append(b.up, up)
	b.isInt = append(b.isInt, integer)
	return len(b.cost) - 1
}

func (b *mipBuilder) row(coef map[int]float64, lo, up float64) {
	b.rows = append(b.rows, coef)
	b.rlo = append(b.rlo, lo)
	b.rup = append(b.rup, up)
}

func (b *mipBuilder) problem() *Problem {
	n, m := len(b.cost), len(b.rows)
	p := &Problem{Integer: b.isInt}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj, q.ColLo, q.ColUp, q.RowLo, q.RowUp = b.cost, b.lo, b.up, b.rlo, b.rup
	q.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		for i := 0; i < m; i++ {
			if v, ok := b.rows[i][j]; ok {
				q.RowIndex = append(q.RowIndex, i)
				q.Value = append(q.Value, v)
			}
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	return p
}

// planLikeMIP builds a random problem with the row types of an
// exploration-program model (invented data): candidate points chosen by
// binaries must cover every zone, a rig must be hired (binary, with a
// mobilization cost) for any of its points to be used (linking
// y ≤ z), each rig's field days are an integer variable with
// Σ hours ≤ 8·days, a share of the chosen points must be of the first
// kind, and a minimum count of points is required.
func planLikeMIP(rng *rand.Rand, cands, rigs int) *Problem {
	b := &mipBuilder{}
	zones := 6 + rng.IntN(6)
	rigCol := make([]int, rigs)
	dayCol := make([]int, rigs)
	for r := 0; r < rigs; r++ {
		rigCol[r] = b.col(float64(500+rng.IntN(1500)), 0, 1, true)
		dayCol[r] = b.col(float64(800+rng.IntN(700)), 0, 30, true)
	}
	y := make([]int, cands)
	rigOf := make([]int, cands)
	hours := make([]float64, cands)
	cover := make([]map[int]float64, zones)
	for z := range cover {
		cover[z] = map[int]float64{}
	}
	for c := 0; c < cands; c++ {
		rigOf[c] = rng.IntN(rigs)
		y[c] = b.col(float64(100+rng.IntN(900)), 0, 1, true)
		hours[c] = float64(2 + rng.IntN(9))
		for z := 0; z < zones; z++ {
			if rng.IntN(4) == 0 {
				cover[z][y[c]] = 1
			}
		}
		b.row(map[int]float64{y[c]: 1, rigCol[rigOf[c]]: -1}, math.Inf(-1), 0)
	}
	for z := 0; z < zones; z++ {
		if len(cover[z]) > 0 {
			b.row(cover[z], 1, math.Inf(1))
		}
	}
	for r := 0; r < rigs; r++ {
		row := map[int]float64{dayCol[r]: -8}
		for c := 0; c < cands; c++ {
			if rigOf[c] == r {
				row[y[c]] = hours[c]
			}
		}
		b.row(row, math.Inf(-1), 0)
	}
	share := map[int]float64{}
	count := map[int]float64{}
	for c := 0; c < cands; c++ {
		count[y[c]] = 1
		if c%3 == 0 {
			share[y[c]] = 0.7 // 1 − 0.3: at least 30 % of chosen points of the first kind
		} else {
			share[y[c]] = -0.3
		}
	}
	b.row(share, 0, math.Inf(1))
	b.row(count, float64(3+rng.IntN(5)), math.Inf(1))
	return b.problem()
}
