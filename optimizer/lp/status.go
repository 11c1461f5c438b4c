package lp

import (
	"context"
	"errors"
	"strconv"
	"time"
)

// Status says how a solve ended.
type Status int

const (
	// Optimal: a basic solution that is primal and dual feasible within
	// the tolerances was found.
	Optimal Status = iota
	// Infeasible: the constraints admit no point (the dual simplex found
	// a dual ray, or primal phase 1 stopped with a positive sum of
	// infeasibilities).
	Infeasible
	// Unbounded: the problem is feasible and the objective decreases
	// without limit along a primal ray.
	Unbounded
	// IterationLimit: Options.MaxIterations was reached first.
	IterationLimit
	// TimeLimit: Options.Deadline passed first.
	TimeLimit
	// Canceled: Options.Context was canceled first.
	Canceled
)

var statusNames = [...]string{
	Optimal:        "Optimal",
	Infeasible:     "Infeasible",
	Unbounded:      "Unbounded",
	IterationLimit: "IterationLimit",
	TimeLimit:      "TimeLimit",
	Canceled:       "Canceled",
}

// String returns the name of the status.
func (s Status) String() string {
	if s >= 0 && int(s) < len(statusNames) {
		return statusNames[s]
	}
	return "Status(" + strconv.Itoa(int(s)) + ")"
}

// Sentinel errors. Errors from Validate and New wrap ErrInvalid with a
// message naming the offending field and index.
var (
	// ErrInvalid means the problem data are malformed.
	ErrInvalid = errors.New("lp: invalid problem")
	// ErrBasis means a Basis snapshot does not fit the Solver.
	ErrBasis = errors.New("lp: basis does not belong to this solver")
	// ErrNumerical means the solver lost numerical accuracy it could not
	// recover from by refactorization.
	ErrNumerical = errors.New("lp: numerical trouble")
)

// Default tolerances. They apply to the scaled problem (see the package
// documentation) and are at the tight end of common practice (Koberstein
// 2005 discusses the choice), since rigmix's models are small.
const (
	// DefaultFeasTol bounds the primal infeasibility accepted on a bound
	// or row, relative to max(1, |bound|).
	DefaultFeasTol = 1e-9
	// DefaultOptTol bounds the dual infeasibility (wrong-signed reduced
	// cost) accepted at optimality.
	DefaultOptTol = 1e-9
	// pivotTol is the smallest |α| accepted as a pivot in the ratio
	// tests (common practice; Koberstein 2005 discusses the choice).
	pivotTol = 1e-7
	// zeroTol: smaller entries of a transformed column are taken as
	// round-off of zero in the primal ratio test, where skipping a real
	// small entry would let a basic variable run far past its bound.
	zeroTol = 1e-12
	// refactorEvery is the number of basis updates after which the basis
	// is refactorized from scratch (product-form eta file length); a
	// value of the order of 100 is common practice (Maros 2003, ch. 8,
	// from memory), and 50 measured faster than 100 on the OR-Library
	// set-covering relaxations.
	refactorEvery = 50
)

// Options control a solve. The zero value is valid and means: no
// iteration or time limit, default tolerances.
type Options struct {
	MaxIterations int       // 0: no limit
	Deadline      time.Time // zero: none
	FeasTol       float64   // 0: DefaultFeasTol
	OptTol        float64   // 0: DefaultOptTol
	// Context, when not nil, is polled during the solve; cancellation
	// ends it with status Canceled (or TimeLimit if its deadline passed).
	Context context.Context
}

func (o Options) feasTol() float64 {
	if o.FeasTol > 0 {
		return o.FeasTol
	}
	return DefaultFeasTol
}

func (o Options) optTol() float64 {
	if o.OptTol > 0 {
		return o.OptTol
	}
	return DefaultOptTol
}

// Result is the outcome of a solve.
//
// Sign conventions (minimization): Dual[i] = y_i = ∂Obj/∂b_i where b_i is
// the row bound that is active (RowLo or RowUp); so a ≥ row (active at
// RowLo) has y_i ≥ 0 and a ≤ row (active at RowUp) has y_i ≤ 0.
// ReducedCost[j] = d_j = c_j − a_jᵀy = ∂Obj/∂(active bound of x_j); at an
// optimum d_j ≥ 0 for x_j at its lower bound and d_j ≤ 0 at its upper.
//
// For Optimal, X, RowActivity, Dual and ReducedCost describe the optimal
// basic solution. For other statuses they describe the last basis and
// are not feasible in general (for Infeasible: the point where the solve
// stopped; for Unbounded: the last feasible vertex).
type Result struct {
	Status      Status
	Obj         float64   // cᵀX
	X           []float64 // length NumCols
	RowActivity []float64 // A X, length NumRows
	Dual        []float64 // y, length NumRows
	ReducedCost []float64 // d = c − Aᵀy, length NumCols
	Iterations  int       // simplex iterations (basis changes and bound flips)
	// DualFeasible reports that the final basis is dual feasible for the
	// true costs (every reduced cost has the sign its bound calls for).
	// Obj is then a lower bound on the optimal value by weak duality even
	// when Status is not Optimal — for instance after IterationLimit in
	// the dual simplex, as in strong branching. It is false for
	// Infeasible.
	DualFeasible bool
}
