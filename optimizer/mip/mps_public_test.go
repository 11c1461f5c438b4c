package mip

import (
	"context"
	"flag"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

var (
	mpsBench = flag.Bool("mps.bench", false, "run TestMPSPublicBenchmark: every file of ../shared/data/mps-public, ours beside CBC (see bench-mps.sh)")
	mpsSec   = flag.Float64("mps.sec", 300, "time limit in seconds per file and solver for -mps.bench")
)

// publicMPS lists ../shared/data/mps-public with the published optima
// given in its README (netlib LP and MIPLIB 3 tables). slow marks the
// files that are solved only with RIGMIX_MPS_SLOW=1 or -mps.bench.
var publicMPS = []struct {
	file string
	opt  float64
	slow bool
}{
	{"afiro.mps", -464.7531429, false},
	{"adlittle.mps", 225494.9632, false},
	{"25fv47.mps", 5501.845888, false},
	{"flugpl.mps", 1201500, false},
	{"egout.mps", 568.1007, false},
	{"lseu.mps", 1120, false},
	{"p0548.mps", 8691, false},
	{"rgn.mps", 82.1999992, false},
	{"gt2.mps", 21166, false},
	{"dcmulti.mps", 188182, false},
	{"bell5.mps", 8966406.49, true},
	{"sp150x300d.mps", 69, true},
}

// publishedMatch compares with a published optimum given to 7–10
// significant digits.
func publishedMatch(got, want float64) bool {
	return math.Abs(got-want) <= 1e-7*math.Max(1, math.Abs(want))
}

// TestMPSPublic solves the files of ../shared/data/mps-public to their
// published optima (netlib / MIPLIB 3, as listed in the folder's README)
// and checks the returned point against every row, bound and integrality.
// The slow files run only with RIGMIX_MPS_SLOW=1.
func TestMPSPublic(t *testing.T) {
	dir := dataDir(t, "mps-public")
	slow := os.Getenv("RIGMIX_MPS_SLOW") == "1"
	for _, c := range publicMPS {
		t.Run(strings.TrimSuffix(c.file, ".mps"), func(t *testing.T) {
			if c.slow && !slow {
				t.Skipf("%s is slow: set RIGMIX_MPS_SLOW=1 to solve it (or run bench-mps.sh)", c.file)
			}
			p := readMPSFile(t, filepath.Join(dir, c.file))
			res, err := Solve(context.Background(), p, Options{TimeLimit: 600 * time.Second})
			if err != nil {
				t.Fatal(err)
			}
			t.Logf("%s: %v obj %v nodes %d in %v", c.file, res.Status, res.Obj, res.Nodes, res.Elapsed.Round(time.Millisecond))
			if res.Status != Optimal || !publishedMatch(res.Obj, c.opt) {
				t.Errorf("%s: %v with objective %v; want optimal %v (published)", c.file, res.Status, res.Obj, c.opt)
			}
			if v, ok := checkFeasible(p, res.X); !ok || math.Abs(v-res.Obj) > 1e-6*math.Max(1, math.Abs(v)) {
				t.Errorf("%s: the returned point is not feasible or its objective %v differs from %v", c.file, v, res.Obj)
			}
		})
	}
}

func readMPSFile(t testing.TB, file string) *Problem {
	t.Helper()
	f, err := os.Open(file)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	p, err := ReadMPS(f)
	if err != nil {
		t.Fatalf("%s: %v", file, err)
	}
	return p
}

// TestMPSPublicBenchmark solves every file of ../shared/data/mps-public
// with this engine and with CBC (COIN-OR Branch and Cut 2.10, an
// independent solver, run on the same file as `cbc FILE -threads 1 -solve
// -quit`, the whole process timed) one after the other in the same run,
// and prints a table. It runs only with -mps.bench; see bench-mps.sh.
func TestMPSPublicBenchmark(t *testing.T) {
	if !*mpsBench {
		t.Skip("benchmark: run with -mps.bench (see bench-mps.sh)")
	}
	dir := dataDir(t, "mps-public")
	_, cbcErr := exec.LookPath("cbc")
	limit := time.Duration(*mpsSec * float64(time.Second))
	var lines []string
	add := func(format string, args ...any) { lines = append(lines, fmt.Sprintf(format, args...)) }
	add("| file | rows × cols | published | ours | ours status | nodes | ours s | CBC | CBC status | CBC s | ours / CBC |")
	add("|---|---|---|---|---|---|---|---|---|---|---|")
	var totalOurs, totalCBC time.Duration
	for _, c := range publicMPS {
		file := filepath.Join(dir, c.file)
		start := time.Now()
		p := readMPSFile(t, file)
		res, err := Solve(context.Background(), p, Options{TimeLimit: limit})
		ours := time.Since(start)
		if err != nil {
			t.Fatalf("%s: %v", c.file, err)
		}
		totalOurs += ours
		status := res.Status.String()
		if res.Status == Optimal && !publishedMatch(res.Obj, c.opt) {
			status = "WRONG"
			t.Errorf("%s: objective %v, published %v", c.file, res.Obj, c.opt)
		}
		cbcObj, cbcStat, cbcTime, ratio := "-", "-", "-", "-"
		if cbcErr == nil {
			ext := runCBC(t, file, limit)
			totalCBC += ext.wall
			cbcObj, cbcStat = fmt.Sprintf("%.10g", ext.obj), ext.status
			cbcTime = fmt.Sprintf("%.2f", ext.wall.Seconds())
			ratio = fmt.Sprintf("%.2f", ours.Seconds()/ext.wall.Seconds())
		}
		add("| %s | %d × %d | %.10g | %.10g | %s | %d | %.2f | %s | %s | %s | %s |", strings.TrimSuffix(c.file, ".mps"),
			p.LP.NumRows, p.LP.NumCols, c.opt, res.Obj, status, res.Nodes, ours.Seconds(), cbcObj, cbcStat, cbcTime, ratio)
		t.Log(lines[len(lines)-1])
	}
	add("| all | | | | | | %.2f | | | %.2f | %.2f |", totalOurs.Seconds(), totalCBC.Seconds(), totalOurs.Seconds()/totalCBC.Seconds())
	fmt.Println(strings.Join(lines, "\n"))
}
