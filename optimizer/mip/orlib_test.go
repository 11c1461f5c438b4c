package mip

import (
	"bufio"
	"context"
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"
)

var (
	orlibAll     = flag.Bool("orlib.all", false, "also solve OR-Library set-covering sets 5, A, B, C and D (long)")
	orlibThreads = flag.Int("orlib.threads", 1, "Options.Threads for the OR-Library runs")
	orlibOnly    = flag.String("orlib.only", "", "comma-separated instance names to solve instead of the default sets (e.g. scp41,scpa1)")
)

// orlibOptima reads OPTIMA.tsv: optimal values of the OR-Library
// set-covering instances (Beasley 1987, EJOR 31:85–93; OR-Library).
func orlibOptima(t testing.TB, dir string) map[string]float64 {
	f, err := os.Open(filepath.Join(dir, "OPTIMA.tsv"))
	if err != nil {
		t.Skipf("OPTIMA.tsv absent: %v", err)
	}
	defer f.Close()
	out := map[string]float64{}
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		fs := strings.Fields(sc.Text())
		if len(fs) < 2 || fs[0] == "instance" {
			continue
		}
		v, err := strconv.ParseFloat(fs[1], 64)
		if err != nil {
			t.Fatalf("OPTIMA.tsv: %v", err)
		}
		out[fs[0]] = v
	}
	return out
}

func loadORLib(t testing.TB, dir, name string) *Problem {
	f, err := os.Open(filepath.Join(dir, name+".txt"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	p, err := ReadORLibSetCover(f)
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	p.Name = name
	return p
}

func orlibSet(prefix string, k int) []string {
	var out []string
	for i := 1; i <= k; i++ {
		out = append(out, fmt.Sprintf("scp%s%d", prefix, i))
	}
	return out
}

func TestORLibSetCover(t *testing.T) {
	dir := dataDir(t, "orlib-scp")
	opt := orlibOptima(t, dir)
	var names []string
	switch {
	case *orlibOnly != "":
		names = strings.Split(*orlibOnly, ",")
	default:
		names = append(names, orlibSet("4", 10)...)
		names = append(names, orlibSet("6", 5)...)
		names = append(names, orlibSet("e", 5)...)
		if *orlibAll {
			for _, s := range []string{"5", "a", "b", "c", "d"} {
				k := 5
				if s == "5" {
					k = 10
				}
				names = append(names, orlibSet(s, k)...)
			}
		}
	}
	for _, name := range names {
		t.Run(name, func(t *testing.T) {
			want, ok := opt[name]
			if !ok {
				t.Fatalf("no optimum for %s in OPTIMA.tsv", name)
			}
			p := loadORLib(t, dir, name)
			start := time.Now()
			res, err := Solve(context.Background(), p, Options{TimeLimit: 120 * time.Second, Threads: *orlibThreads})
			if err != nil {
				t.Fatal(err)
			}
			t.Logf("%s: %v obj %v bound %v nodes %d LP iterations %d in %v", name, res.Status, res.Obj, res.Bound, res.Nodes, res.LPIterations, time.Since(start).Round(time.Millisecond))
			// Optimal value: OR-Library / Beasley (1987), via OPTIMA.tsv.
			if res.Status != Optimal || math.Abs(res.Obj-want) > 1e-6 {
				t.Errorf("%s: %v with objective %v; want optimal %v", name, res.Status, res.Obj, want)
			}
			if v, ok := checkFeasible(p, res.X); !ok || math.Abs(v-res.Obj) > 1e-6 {
				t.Errorf("%s: returned X is not a feasible cover of cost %v", name, res.Obj)
			}
		})
	}
}
