package plan

import (
	"context"
	"fmt"
	"math"
	"runtime"
	"sync"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
)

// coverNodeLimit bounds the search for each zone's covering number. A node
// limit, not a time limit, keeps the result the same on every run and every
// machine.
const coverNodeLimit = 20000

// recoverNodeLimit bounds the search when a zone's covering number is
// raised after exact-coverage rows were added (raiseCoverNumbers): the
// number is then the bound rounded up, still a valid lower bound, and the
// incumbent is still a cover for the start; the full search there is
// repeated round after round, so it is kept short.
const recoverNodeLimit = 200

// coverNumbers computes, for every zone, a lower bound on how many points
// any plan must place there to meet the spacing rule: the optimum (or the
// proven bound, rounded up) of the unit-cost set-covering problem over the
// zone's coverage rows and its explorable candidates (required points fixed
// in).
//
// Why: the LP relaxation of covering by discs is weak — a fractional cover
// can spread weight evenly, while whole points overlap. For a lattice of
// discs the covering density of the best integer arrangement is 2π/√27 ≈
// 1.209 (Kershner 1939, from memory), so on a large zone the LP bound sits
// up to about 17 % under any real plan, and branch and bound cannot close
// that gap by branching alone. Every point of a zone costs the same for a
// given option (ground is uniform within a zone), so the number of points is
// what drives the price; the row Σ_{p∈z} x_p ≥ k_z with k_z the zone's
// covering number is a valid inequality that lifts the bound to where the
// plans are. It cuts off no plan: every plan covers the zone with at least
// k_z points.
//
// It also returns, per zone, the points of the best cover it found (nil
// when none): what the start solution is built from (see StartSolution).
func coverNumbers(ctx context.Context, pr *Prepared, spec *model.Spec) ([]int, [][]int, error) {
	nz := len(pr.In.Scenario.Zones)
	out := make([]int, nz)
	sets := make([][]int, nz)
	rowsByZone, ptsByZone := coverInputs(spec, nz)
	// Zones are independent subproblems: solved side by side, one per
	// processor, each written to its own slot, so the result is the same
	// on every run.
	errs := make([]error, nz)
	forEachZone(nz, func(z int) {
		if len(rowsByZone[z]) == 0 {
			return
		}
		out[z], sets[z], errs[z] = coverNumber(ctx, spec, z, rowsByZone[z], ptsByZone[z], coverNodeLimit)
	})
	for _, err := range errs {
		if err != nil {
			return nil, nil, err
		}
	}
	return out, sets, nil
}

// coverInputs lists, per zone, its covering rows and its explorable points
// (each listed once: a scan of every point per zone would grow with zones
// × points) — what coverNumber takes.
func coverInputs(spec *model.Spec, nz int) (rowsByZone [][][]int, ptsByZone [][]int) {
	explorable := make([]bool, spec.NumPoints)
	for _, op := range spec.Options {
		explorable[op.Point] = true
	}
	rowsByZone = make([][][]int, nz)
	for _, row := range spec.CoverRows {
		if len(row) > 0 {
			z := spec.PointZone[row[0]]
			rowsByZone[z] = append(rowsByZone[z], row)
		}
	}
	ptsByZone = make([][]int, nz)
	for p := 0; p < spec.NumPoints; p++ {
		if explorable[p] {
			ptsByZone[spec.PointZone[p]] = append(ptsByZone[spec.PointZone[p]], p)
		}
	}
	return rowsByZone, ptsByZone
}

func coverNumber(ctx context.Context, spec *model.Spec, z int, rows [][]int, pts []int, nodeLimit int) (int, []int, error) {
	col := make(map[int]int, len(pts))
	for j, p := range pts {
		col[p] = j
	}
	n := len(pts)
	entries := make([][]int, n) // rows of each column
	nrows := 0
	for _, row := range rows {
		seen := map[int]bool{}
		any := false
		for _, p := range row {
			j, ok := col[p]
			if !ok || seen[j] {
				continue
			}
			seen[j] = true
			entries[j] = append(entries[j], nrows)
			any = true
		}
		if !any {
			// model.Build reports this row with the zone's name.
			return 0, nil, nil
		}
		nrows++
	}
	prob := &mip.Problem{Name: fmt.Sprintf("cover-zone-%d", z), Integer: make([]bool, n)}
	P := &prob.LP
	P.NumRows, P.NumCols = nrows, n
	P.Obj, P.ColLo, P.ColUp = make([]float64, n), make([]float64, n), make([]float64, n)
	P.RowLo, P.RowUp = make([]float64, nrows), make([]float64, nrows)
	for i := range P.RowLo {
		P.RowLo[i], P.RowUp[i] = 1, math.Inf(1)
	}
	P.ColStart = make([]int, n+1)
	for j, p := range pts {
		P.Obj[j], P.ColUp[j] = 1, 1
		if spec.Required != nil && spec.Required[p] {
			P.ColLo[j] = 1
		}
		prob.Integer[j] = true
		for _, i := range entries[j] {
			P.RowIndex = append(P.RowIndex, i)
			P.Value = append(P.Value, 1)
		}
		P.ColStart[j+1] = len(P.RowIndex)
	}
	res, err := mip.Solve(ctx, prob, mip.Options{NodeLimit: nodeLimit})
	if err != nil {
		return 0, nil, err
	}
	var set []int
	for j, v := range res.X {
		if v > 0.5 {
			set = append(set, pts[j])
		}
	}
	switch {
	case res.Status == mip.Optimal:
		return int(math.Round(res.Obj)), set, nil
	case res.Status == mip.Infeasible:
		return 0, nil, nil // model.Build explains what cannot be covered
	case math.IsInf(res.Bound, 0) || math.IsNaN(res.Bound):
		return 0, set, nil
	default:
		return int(math.Ceil(res.Bound - 1e-6)), set, nil
	}
}

// forEachZone calls fn for zones 0..n-1 on one goroutine per processor;
// fn must write only its own zone's slots.
func forEachZone(n int, fn func(z int)) {
	next := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < max(1, min(runtime.GOMAXPROCS(0), n)); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for z := range next {
				fn(z)
			}
		}()
	}
	for z := 0; z < n; z++ {
		next <- z
	}
	close(next)
	wg.Wait()
}
