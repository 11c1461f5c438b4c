package mip

import (
	"fmt"
	"time"
)

// Status says how a solve ended.
type Status int

const (
	// Optimal: the solution in Result.X is optimal within the requested
	// relative gap Options.GapRel (with the default GapRel it is proven
	// optimal up to round-off). There is no separate "gap limit" status.
	Optimal Status = iota
	// Infeasible: no integer-feasible point exists (proven).
	Infeasible
	// Unbounded: the LP relaxation is unbounded; when an integer
	// solution exists the MIP objective is unbounded too for rational
	// data (Meyer 1974), which is all this engine is meant for.
	Unbounded
	// TimeLimit: Options.TimeLimit ran out; Result holds the best
	// solution found (if any) and the proven bound.
	TimeLimit
	// NodeLimit: Options.NodeLimit nodes were processed.
	NodeLimit
	// Interrupted: the context was cancelled.
	Interrupted
	// WorkLimit: Options.WorkLimit simplex iterations were spent.
	WorkLimit
)

var statusNames = [...]string{"optimal", "infeasible", "unbounded", "time limit", "node limit", "interrupted", "work limit"}

func (s Status) String() string {
	if s >= 0 && int(s) < len(statusNames) {
		return statusNames[s]
	}
	return fmt.Sprintf("Status(%d)", int(s))
}

// Progress is reported through Options.Progress whenever the incumbent
// or the bound improves.
type Progress struct {
	Incumbent, Bound, Gap float64
	Nodes                 int
	Elapsed               time.Duration
}

// Options control Solve.
type Options struct {
	// GapRel stops the search when (incumbent-bound)/max(1,|incumbent|)
	// ≤ GapRel; 0 means 1e-9, that is, proven optimal.
	GapRel float64
	// TimeLimit is the wall-time budget; 0 means none.
	TimeLimit time.Duration
	// NodeLimit bounds the number of branch-and-bound nodes; 0 means none.
	NodeLimit int
	// WorkLimit bounds the work of the search in simplex iterations
	// (every LP of the tree, strong branching and the heuristics' LPs, as
	// counted in Result.LPIterations); 0 means none. It is checked
	// between nodes, so the search stops at the same node on every run
	// whatever the machine's load: unlike TimeLimit, a solve stopped by
	// it gives the same Result (Elapsed aside) every time.
	WorkLimit int
	// Threads: 0 or 1 runs on one goroutine. 2 (or more) adds a second
	// LP solver driven in lockstep with the first: it solves every node
	// LP alongside the first solver and evaluates every other
	// strong-branching candidate on the other core. Results are used in
	// candidate order, so the outcome never depends on timing; it may
	// differ from the one-thread run in node counts, not in the optimal
	// value. It helps where strong branching dominates (larger covering
	// instances) and can cost nodes elsewhere.
	Threads int
	// Progress, when not nil, is called (on the solving goroutine) as the
	// incumbent or the bound improve.
	Progress func(Progress)
	// Start, when not nil, is a solution in the original space (one value
	// per column) to begin from, a "MIP start": it becomes the first
	// incumbent if it meets every row, bound and integrality (integer
	// columns rounded to the nearest integer first); otherwise the repair
	// search starts from it. A start never changes what is optimal, only
	// how soon a good plan is known.
	Start []float64

	// noCuts turns the root cutting planes off (tests).
	noCuts bool

	// subMIP marks the solve of a sub-problem built by a heuristic, which
	// runs no sub-MIP heuristic of its own (rensMaxDepth).
	subDepth int
}

// Result is the outcome of Solve. Obj, Bound and X are in the original
// space of the problem, with ObjOffset included.
type Result struct {
	Status Status
	X      []float64 // best solution found (nil if none)
	// Obj is the objective of X (+Inf when there is none); Bound is the
	// proven lower bound; Gap = (Obj-Bound)/max(1,|Obj|).
	Obj, Bound, Gap     float64
	Nodes, LPIterations int
	// Cuts is the number of cutting planes added to the root LP.
	Cuts int
	// PresolvedRows and PresolvedCols give the size of the problem the
	// search worked on, after presolve.
	PresolvedRows, PresolvedCols int
	// Elapsed is wall time, PresolveTime the part of it spent in
	// presolve; keep both out of outputs that must be deterministic.
	Elapsed, PresolveTime time.Duration
}
