package mip

import (
	"context"
	"flag"
	"fmt"
	"os/exec"
	"strings"
	"testing"
	"time"
)

var orlibBench = flag.Bool("orlib.bench", false, "solve OR-Library sets 4, 5, 6, A, B, C, D with this engine and with CBC and print a timing table (long)")

// TestORLibBenchmark compares this engine with CBC (COIN-OR Branch and
// Cut, run single-threaded as `cbc file.mps -threads 1 -solve -quit`,
// timing the whole process) on the OR-Library set-covering sets 4, 5, 6,
// A, B, C and D (Beasley 1987; optimal values from OPTIMA.tsv). It runs
// only with -orlib.bench; see bench-orlib.sh.
func TestORLibBenchmark(t *testing.T) {
	if !*orlibBench {
		t.Skip("benchmark: run with -orlib.bench (see bench-orlib.sh)")
	}
	dir := dataDir(t, "orlib-scp")
	opt := orlibOptima(t, dir)
	_, cbcErr := exec.LookPath("cbc")
	var names []string
	if *orlibOnly != "" {
		names = strings.Split(*orlibOnly, ",")
	} else {
		for _, s := range []string{"4", "5", "6", "a", "b", "c", "d"} {
			k := 5
			if s == "4" || s == "5" {
				k = 10
			}
			names = append(names, orlibSet(s, k)...)
		}
	}
	tmp := t.TempDir()
	var lines []string
	add := func(format string, args ...any) { lines = append(lines, fmt.Sprintf(format, args...)) }
	add("%-8s %6s %6s %9s %8s %8s %9s %6s %8s", "instance", "opt", "ours", "status", "nodes", "ours_s", "cbc_obj", "cbc", "cbc_s")
	var totalOurs, totalCBC time.Duration
	provedOurs, provedCBC := 0, 0
	for _, name := range names {
		p := loadORLib(t, dir, name)
		start := time.Now()
		res, err := Solve(context.Background(), p, Options{TimeLimit: 120 * time.Second, Threads: *orlibThreads})
		ours := time.Since(start)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		totalOurs += ours
		ok := res.Status == Optimal && sameObj(res.Obj, opt[name])
		if ok {
			provedOurs++
		} else {
			t.Errorf("%s: %v obj %v, want optimal %v", name, res.Status, res.Obj, opt[name])
		}
		cbcObj, cbcStat, cbcTime := "-", "-", "-"
		if cbcErr == nil {
			file := writeMPSFile(t, tmp, name, p)
			ext := runCBC(t, file, 600*time.Second)
			totalCBC += ext.wall
			cbcObj = fmt.Sprintf("%g", ext.obj)
			cbcStat = ext.status
			cbcTime = fmt.Sprintf("%.2f", ext.wall.Seconds())
			if ext.status == "optimal" {
				provedCBC++
			}
		}
		add("%-8s %6g %6g %9s %8d %8.2f %9s %6s %8s", name, opt[name], res.Obj, res.Status, res.Nodes, ours.Seconds(), cbcObj, cbcStat, cbcTime)
		t.Log(lines[len(lines)-1])
	}
	add("total: ours %.1f s (%d/%d proven optimal), CBC %.1f s (%d/%d proven optimal), ratio ours/CBC %.2f",
		totalOurs.Seconds(), provedOurs, len(names), totalCBC.Seconds(), provedCBC, len(names), totalOurs.Seconds()/totalCBC.Seconds())
	fmt.Println(strings.Join(lines, "\n"))
}
