package cli

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"time"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// solveSummary is the result of `rigmix solve` in the model's own sense:
// a maximization (MPS OBJSENSE MAX) reports the maximum and an upper
// bound, a minimization the minimum and a lower bound.
type solveSummary struct {
	model        string
	rows, cols   int
	sense        string // "minimize" or "maximize"
	status       string
	hasSolution  bool
	obj, bound   float64
	gap          float64
	nodes, iters int
	elapsed      time.Duration
}

func summarize(p *mip.Problem, res *mip.Result) solveSummary {
	s := solveSummary{
		model: p.Name, rows: p.LP.NumRows, cols: p.LP.NumCols, sense: "minimize",
		status: res.Status.String(), hasSolution: res.X != nil,
		obj: p.Sense(res.Obj), bound: p.Sense(res.Bound), gap: res.Gap,
		nodes: res.Nodes, iters: res.LPIterations, elapsed: res.Elapsed,
	}
	if p.Maximize {
		s.sense = "maximize"
	}
	return s
}

// jsonNumber is a float64 in solve's JSON: a finite value is a JSON
// number; +∞ and −∞ are the strings "+inf" and "-inf" (JSON has no
// infinities).
type jsonNumber float64

func (v jsonNumber) MarshalJSON() ([]byte, error) {
	switch f := float64(v); {
	case math.IsInf(f, 1):
		return []byte(`"+inf"`), nil
	case math.IsInf(f, -1):
		return []byte(`"-inf"`), nil
	case math.IsNaN(f):
		return []byte(`null`), nil
	default:
		return strconv.AppendFloat(nil, f, 'g', -1, 64), nil
	}
}

// writeJSON writes the summary as the JSON object documented in the help
// of `rigmix solve`.
func (s solveSummary) writeJSON(w io.Writer) error {
	type out struct {
		Model        string      `json:"model"`
		Sense        string      `json:"sense"`
		Status       string      `json:"status"`
		Objective    *jsonNumber `json:"objective"`
		Bound        jsonNumber  `json:"bound"`
		Gap          jsonNumber  `json:"gap"`
		Nodes        int         `json:"nodes"`
		LPIterations int         `json:"lp_iterations"`
		Seconds      float64     `json:"seconds"`
	}
	o := out{Model: s.model, Sense: s.sense, Status: s.status, Bound: jsonNumber(s.bound), Gap: jsonNumber(s.gap),
		Nodes: s.nodes, LPIterations: s.iters, Seconds: s.elapsed.Seconds()}
	if s.hasSolution || math.IsInf(s.obj, 0) && s.status == mip.Unbounded.String() {
		v := jsonNumber(s.obj)
		o.Objective = &v
	}
	b, err := json.MarshalIndent(o, "", "  ")
	if err != nil {
		return err
	}
	_, err = w.Write(append(b, '\n'))
	return err
}

// writeText writes the summary as labelled lines.
func (s solveSummary) writeText(w io.Writer) error {
	num := func(v float64) string {
		switch {
		case math.IsInf(v, 1):
			return "+inf"
		case math.IsInf(v, -1):
			return "-inf"
		}
		return fmt.Sprintf("%.10g", v)
	}
	obj := "none (no solution found)"
	if s.hasSolution || math.IsInf(s.obj, 0) && s.status == mip.Unbounded.String() {
		obj = num(s.obj)
	}
	boundLabel := "lower bound"
	if s.sense == "maximize" {
		boundLabel = "upper bound"
	}
	gap := "none"
	if !math.IsInf(s.gap, 0) && !math.IsNaN(s.gap) {
		gap = fmt.Sprintf("%.6f%%", 100*s.gap)
	}
	_, err := fmt.Fprintf(w, "model      %s (%d rows, %d columns)\nsense      %s\nstatus     %s\nobjective  %s\nbound      %s (%s)\ngap        %s\nnodes      %d\ntime       %s\n",
		s.model, s.rows, s.cols, s.sense, s.status, obj, num(s.bound), boundLabel, gap, s.nodes, s.elapsed.Round(time.Millisecond))
	return err
}

// senseProgress shows progress in the model's own sense.
func senseProgress(p *mip.Problem, f func(mip.Progress)) func(mip.Progress) {
	return func(pr mip.Progress) {
		pr.Incumbent, pr.Bound = p.Sense(pr.Incumbent), p.Sense(pr.Bound)
		f(pr)
	}
}

const solveLong = `Solve any mixed-integer model in free MPS form with rigmix's engine (for cross-checks).

The file is read as CPLEX, CBC and HiGHS read free MPS: bounds, right-hand sides and
ranges of magnitude 1e20 or more are infinite (1e30 is "no bound"); finite ones must
be at most 1e15, coefficients zero or between 1e-15 and 1e15 in magnitude; a UTF-8
byte-order mark is skipped, anything after ENDATA ignored, a field starting with $
begins a comment. SC/SI bounds, quadratic, SOS and indicator sections are refused
by name.

The objective and the bound are printed in the file's own sense: with OBJSENSE MAX
the objective is the maximum and the bound an upper bound ("sense maximize").

--json prints one object: model, sense ("minimize" or "maximize"), status
("optimal", "infeasible", "unbounded", "time limit", "node limit", "work limit",
"interrupted"),
objective (null when no solution was found; "-inf" or "+inf" when unbounded),
bound and gap (numbers, or the strings "+inf" and "-inf" where infinite: an
infeasible minimization has bound "+inf", a search stopped before any bound
"-inf"), nodes, lp_iterations and seconds.

--work-limit N stops the search after N simplex iterations, checked between nodes:
unlike --time-limit it gives the same result on every run whatever the machine's
load. The time limit stays a safety; status "time limit" says that it fired.

The exit status is 0 whenever the solve ran to a status, whichever it is (the
status line says how it ended); 2 for a file that cannot be read; 1 for an
internal failure.`
