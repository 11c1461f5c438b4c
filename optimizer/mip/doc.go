// Package mip is rigmix's exact mixed-integer linear programming engine,
// written in Go on top of the simplex code of package lp. It solves
//
//	minimize    cᵀx + ObjOffset
//	subject to  RowLo ≤ A x ≤ RowUp
//	            ColLo ≤ x ≤ ColUp,   x_j integer for j with Integer[j]
//
// # Method
//
// Presolve (presolve.go) removes fixed and empty columns, empty, free
// and redundant rows and turns singleton rows into bounds; these rules
// are exact for every MIP. When the problem is pure set covering (every
// row Σ x_j ≥ 1 with unit coefficients, binary columns, nonnegative
// costs) it also removes dominated rows, dominated columns and columns
// priced out by the rule of Beasley (1987): column j goes when c_j is at
// least the sum over its rows of the cheapest other column covering the
// row. Solutions are mapped back to the original columns.
//
// Branch and bound (Land and Doig 1960) runs on the LP relaxation, one
// warm-started bounded dual simplex (package lp) for the whole tree:
// moving to a node changes column bounds only, so the previous optimal
// basis stays dual feasible and each node starts from it (open nodes keep
// a snapshot of their parent's basis). Node selection is best bound with
// depth-first plunges while the child's bound is within half the gap of
// the best open node. Branching is reliability branching (Achterberg,
// Koch and Martin 2005; Achterberg 2007, §5.3): pseudocost scores by the
// product rule, with iteration-limited strong branching on candidates
// whose pseudocosts have fewer than a few observations; a strong-branching
// child that is infeasible or cannot beat the incumbent tightens the
// node's bounds instead. Reduced-cost fixing is applied globally with the
// root LP and locally in every node (Achterberg 2007, §7.7). When every
// feasible objective value is a multiple of a known g (integer costs on
// integer columns only), bounds are rounded up to multiples of g, which
// prunes nodes whose bound lies within g of the incumbent.
//
// At the root of a general MIP (not pure set covering) rounds of Gomory
// mixed-integer cuts (Gomory 1960; Marchand, Martin, Weismantel and
// Wolsey 2002), derived from the rows of the optimal simplex tableau
// (lp.Solver.TableauRow), and of extended knapsack cover cuts on rows of
// binaries (Balas 1975; Crowder, Johnson and Padberg 1983; knapcover.go)
// are added to the LP (lp.Solver.AddRows, warm):
// numerically unsafe cuts are dropped, the rest filtered by efficacy and
// parallelism (Achterberg 2007, §8.9) as gomory.go describes. The cuts
// live in the LP only; heuristics and feasibility checks use the rows of
// the problem.
//
// Primal heuristics: for covering, the greedy rule of Chvátal (1979) with
// redundant-column removal and 1-opt exchanges, an LP-guided greedy at
// nodes; for general MIPs, before any LP, a weighted-violation repair
// search in the spirit of Feasibility Jump (Luteberget and Sartor 2023)
// followed by lowering of costly columns and 1-opt with repair, so that a
// large model has a feasible point even when its root LP is slow; the
// same repair search started again from the rounded LP optimum; at the
// root RENS (Berthold 2014), a sub-MIP with the binaries that are
// integral in the LP fixed, and every hundred nodes RINS (Danna,
// Rothberg and Le Pape 2005), fixing the binaries where the node LP and
// the incumbent agree, both solved by this engine with a node limit;
// for every MIP, nearest rounding (with an LP over the continuous
// columns) and fractional diving on the LP with a single backtrack
// (Achterberg 2007, §9.1). Every candidate is
// checked against all rows and bounds before it is accepted, so the
// heuristics are safe on general MIPs.
//
// For set covering the root also runs Lagrangian relaxation of the
// covering rows with subgradient optimization (Beasley 1990): it gives a
// lower bound close to the LP bound within milliseconds, good covers
// through the Lagrangian heuristic, and fixes columns by Lagrangian
// reduced costs. On many OR-Library instances this alone proves
// optimality.
//
// Options.GapRel stops the search when (incumbent − bound)/max(1,|incumbent|)
// ≤ GapRel; such a result has status Optimal (the default GapRel 1e-9
// means proven optimal). Results are deterministic: ties are broken by
// index or creation order, and only time limits and cancellation depend
// on the clock. Options.WorkLimit bounds the search in simplex iterations
// instead, checked between nodes, so a solve stopped by it gives the same
// result on every run whatever the load of the machine; a time limit is
// then only a safety, and status TimeLimit says that it fired. With Options.Threads 2 a second LP solver runs in
// lockstep with the first (node LPs solved on both, strong-branching
// candidates shared between them, results used in candidate order), so
// that run is deterministic too.
//
// # References
//
//   - A. H. Land and A. G. Doig (1960), An automatic method of solving
//     discrete programming problems, Econometrica 28:497–520.
//   - V. Chvátal (1979), A greedy heuristic for the set-covering problem,
//     Mathematics of Operations Research 4:233–235.
//   - J. E. Beasley (1987), An algorithm for set covering problem,
//     European Journal of Operational Research 31:85–93.
//   - J. E. Beasley (1990), A Lagrangian heuristic for set-covering
//     problems, Naval Research Logistics 37:151–164.
//   - T. Achterberg, T. Koch and A. Martin (2005), Branching rules
//     revisited, Operations Research Letters 33:42–54.
//   - T. Achterberg (2007), Constraint Integer Programming, PhD thesis,
//     TU Berlin (SCIP).
//   - R. E. Gomory (1960), An algorithm for the mixed integer problem,
//     RM-2597, The RAND Corporation (from memory).
//   - H. Marchand, A. Martin, R. Weismantel and L. Wolsey (2002), Cutting
//     planes in integer and mixed integer programming, Discrete Applied
//     Mathematics 123:397–446 (from memory).
//   - E. Balas (1975), Facets of the knapsack polytope, Mathematical
//     Programming 8:146–164 (from memory).
//   - H. Crowder, E. L. Johnson and M. Padberg (1983), Solving large-scale
//     zero-one linear programming problems, Operations Research
//     31:803–834 (from memory).
//   - G. Cornuéjols (2008), Valid inequalities for mixed integer linear
//     programs, Mathematical Programming 112:3–44 (from memory).
//   - E. Danna, E. Rothberg and C. Le Pape (2005), Exploring relaxation
//     induced neighborhoods to improve MIP solutions, Mathematical
//     Programming 102:71–90 (from memory).
//   - T. Berthold (2014), RENS: the optimal rounding, Mathematical
//     Programming Computation 6:33–54 (from memory).
//   - B. Luteberget and G. Sartor (2023), Feasibility Jump: an LP-free
//     Lagrangian MIP heuristic, Mathematical Programming Computation
//     15:365–388 (volume and pages from memory).
//
// # Infinite and large values
//
// A bound (column or row) of magnitude lp.Infinity = 1e20 or more is
// infinite: Solve reads 1e30 as "no bound", as CPLEX, CBC and HiGHS do.
// Finite bounds, costs and coefficients must be at most lp.MaxFinite =
// 1e15 in magnitude; Validate and Solve refuse others rather than risk a
// wrong optimum, and ReadMPS also refuses nonzero coefficients below
// MinCoef = 1e-15. A maximization read from MPS (OBJSENSE MAX) is solved
// as the minimization of the negated objective; Problem.Sense turns a
// result back into the file's own sense.
//
// Files in free MPS format are read and written by ReadMPS and WriteMPS;
// OR-Library set-covering files by ReadORLibSetCover.
package mip
