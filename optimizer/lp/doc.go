// Package lp is rigmix's linear programming engine: a sparse,
// bounded-variable primal and dual simplex method on a factorized basis,
// written in pure Go, that keeps its basis between solves so that the
// branch and bound of package mip and the trade-off sweeps re-solve warm.
//
// # Problem and computational form
//
// A Problem is
//
//	minimize cᵀx  subject to  RowLo ≤ A x ≤ RowUp,  ColLo ≤ x ≤ ColUp,
//
// with A in compressed sparse columns. A bound of magnitude Infinity
// (1e20) or more is infinite, as in CPLEX and HiGHS, so 1e30 written for
// "no bound" means no bound; finite bounds, costs and coefficients must
// be at most MaxFinite (1e15) in magnitude (Validate refuses others).
// The solver adds one logical
// variable s_i per row and works on
//
//	A x + s = 0,   ColLo ≤ x ≤ ColUp,   −RowUp ≤ s ≤ −RowLo,
//
// (Koberstein 2005), so every constraint is a bound on a variable
// and the logicals give the identity as a starting basis. A basis is m
// of the n+m variables; the others are nonbasic at their lower bound, at
// their upper bound, or (free variables) at zero. With B the basis
// columns and N the rest, the basic solution is x_B = −B⁻¹N x_N, the
// simplex multipliers are y = B⁻ᵀc_B and the reduced costs d = c − [A I]ᵀy.
// The basis is optimal when x_B is within its bounds (primal feasible)
// and every nonbasic d_j has the sign its bound calls for (dual
// feasible): d_j ≥ 0 at a lower bound, ≤ 0 at an upper, = 0 if free.
//
// # Algorithms
//
// Solve picks the method from the state of the basis (after Koberstein
// 2005; Bixby 2002 reports the dual simplex as the better default):
//
//   - dual feasible (always after bound changes, since boxed nonbasic
//     variables are put at the bound their reduced cost calls for):
//     dual simplex phase 2;
//   - otherwise (after objective changes, or a general cold start):
//     dual phase 1 on the auxiliary problem of Fourer (1994) — the same
//     matrix and costs with every bound replaced by [0,0], [0,1], [−1,0]
//     or [−1,1] by type, so that all variables are boxed — then dual
//     phase 2; if the auxiliary optimum leaves dual infeasibilities, the
//     primal simplex (phase 1 and 2) decides between Unbounded and
//     Infeasible.
//
// Dual simplex (dual.go): dual steepest-edge pricing (Forrest & Goldfarb
// 1992), the bound flipping ratio test (Fourer 1994; Koberstein 2005)
// with Harris's (1973) two-pass tolerances, cost shifting when
// the Harris step would leave the entering reduced cost wrong-signed, and
// a random cost perturbation (fixed seed) against dual degeneracy
// (Koberstein 2005). Infeasibility is only reported when the
// pivot row proves it (the interval −Σ α_rj [l_j, u_j] that the row
// allows for the leaving variable misses its violated bound); otherwise
// the primal phase 1 decides.
//
// Primal simplex (primal.go), used for the clean-up after the dual and
// when the dual cannot start: composite phase 1 minimizing the sum of
// bound violations (Maros 2003, ch. 9), then phase 2; Devex pricing in
// the reference-framework form (Harris 1973; Forrest & Goldfarb 1992);
// Harris ratio test; bound flips of a boxed entering variable. A phase 1
// that stops with bound violations reports Infeasible when the phase 1
// multipliers y prove it (the range of yᵀ(A x + s) over the bounds
// excludes zero) or, failing a proof, after one more pricing pass with a
// thousand times smaller tolerance.
//
// After either method the perturbation and shifts are removed, x, y and
// d are recomputed, and the other method cleans up any infeasibility that
// appears. If that still leaves infeasibilities after eight rounds, the
// basis is accepted when they are within a thousand times the
// tolerances, else Solve returns ErrNumerical.
//
// # Linear algebra
//
// The basis is factorized as B = L̃U by a left-looking sparse LU (Gilbert
// & Peierls 1988) that visits only the earlier pivots a column reaches,
// with threshold partial pivoting (threshold 0.1) and a row-count
// (Markowitz 1957) tie break, columns taken in order of increasing count
// (lu.go). Basis changes update the factors by the method of Forrest &
// Tomlin (1972): the entering column's partial transform L̃⁻¹a_q (the
// spike) replaces a column of U, its pivot moves to the end of U's
// triangular order, and the row left below the diagonal is eliminated and
// kept as a row eta. Each update is checked against the determinant
// identity (new diagonal = α_r × old diagonal); on failure, and every 50
// updates (200 from 5,000 rows on), the basis is refactorized. On the
// set-covering relaxations a spike plus row eta holds about 70 nonzeros
// where the product-form eta (Dantzig & Orchard-Hays 1954), kept as a
// fallback, holds about 390. A dependent basis found while factorizing is
// repaired by replacing columns with row logicals. SetBasis back to the
// basis last factorized drops the updates instead of refactorizing.
//
// FTRAN and BTRAN are hypersparse (lu_sparse.go; Gilbert & Peierls 1988,
// Hall & McKinnon 2005): a depth-first search from the nonzeros of the
// right-hand side over the graph of each triangular factor finds the
// entries that can become nonzero, and only those are computed; L and U
// are also kept by rows for BTRAN, and the Forrest–Tomlin update works
// along U's rows. Each kind of vector keeps an estimate of its recent
// density and takes the ordinary dense pass above 10%. The dual simplex
// keeps its vectors with index lists and prices only the positions that
// may be infeasible. For the steepest-edge update only the entries of
// τ = B⁻¹ρ where α_q is nonzero are needed; when τ has been dense they
// are computed alone, backward from those entries over the row-wise
// factors. Pivot rows are computed row-wise from the nonzeros of
// ρ = B⁻ᵀe_r.
//
// # Scaling
//
// New scales rows and columns by powers of 2 chosen by geometric-mean
// passes (Tomlin 1975) unless all |a_ij| lie in [1/16, 16]. The solver
// works on R A C; results are mapped back (x = C x', y = R y',
// d = C⁻¹ d'), and nonbasic X values are set to the user's bounds
// exactly.
//
// # Tolerances
//
// Applied to the scaled problem: primal feasibility FeasTol·max(1,
// |bound|) with FeasTol 1e-9 by default; dual feasibility OptTol 1e-9;
// pivots |α| ≥ 1e-7 in the dual ratio test (common practice; Koberstein 2005
// discusses such values); entries below 1e-12 are taken as zero in
// the primal ratio test; LU threshold 0.1 (Duff, Erisman & Reid 1986).
//
// # Determinism
//
// No maps are iterated and no goroutines are used; the perturbation comes
// from a xorshift generator with a fixed seed reset at every Solve. The
// same input gives the same output bit for bit.
//
// # References
//
// Cited by author and year; chapter numbers of books are from memory and
// no page numbers are given.
//
//   - Bixby, R.E. (2002). Solving real-world linear programs: a decade and
//     more of progress. Operations Research 50(1), 3–15.
//   - Dantzig, G.B., Orchard-Hays, W. (1954). The product form for the
//     inverse in the simplex method. MTAC 8(46), 64–67.
//   - Duff, I.S., Erisman, A.M., Reid, J.K. (1986). Direct Methods for
//     Sparse Matrices. Oxford.
//   - Forrest, J.J., Goldfarb, D. (1992). Steepest-edge simplex algorithms
//     for linear programming. Mathematical Programming 57, 341–374.
//   - Forrest, J.J.H., Tomlin, J.A. (1972). Updated triangular factors of
//     the basis to maintain sparsity in the product form simplex method.
//     Mathematical Programming 2, 263–278.
//   - Fourer, R. (1994). Notes on the dual simplex method. Unpublished.
//   - Gilbert, J.R., Peierls, T. (1988). Sparse partial pivoting in time
//     proportional to arithmetic operations. SIAM J. Sci. Stat. Comput.
//     9(5), 862–874.
//   - Hall, J.A.J., McKinnon, K.I.M. (2005). Hyper-sparsity in the
//     revised simplex method and how to exploit it. Computational
//     Optimization and Applications 32, 259–283 (from memory).
//   - Harris, P.M.J. (1973). Pivot selection methods of the Devex LP code.
//     Mathematical Programming 5, 1–28.
//   - Koberstein, A. (2005). The dual simplex method, techniques for a fast
//     and stable implementation. PhD thesis, Universität Paderborn.
//   - Maros, I. (2003). Computational Techniques of the Simplex Method.
//     Kluwer.
//   - Markowitz, H.M. (1957). The elimination form of the inverse and its
//     application to linear programming. Management Science 3, 255–269.
//   - Tomlin, J.A. (1975). On scaling linear programming problems.
//     Mathematical Programming Study 4, 146–166.
package lp
