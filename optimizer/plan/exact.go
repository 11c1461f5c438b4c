package plan

import (
	"context"
	"fmt"
	"math"
	"slices"
	"time"

	"github.com/rigmix/rigmix/optimizer/candidates"
	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
)

// The covering model sees a zone's ground through coverage cells: a cell is
// covered when its centre lies within the covering radius of a point. That
// is an approximation of the rule, which must hold at every spot of the
// zone. So every solve is followed by the exact measure (geom.FarthestBySite:
// the farthest ground of each point's Voronoi region), and each spot it
// finds beyond the radius becomes a new covering row — at least one point
// within the radius of that spot — and the model is solved again from the
// previous plan, until no spot is left (row generation, also called
// constraint generation or lazy constraints; Dantzig, Fulkerson and
// Johnson, "Solution of a large-scale traveling-salesman problem",
// Operations Research 2(4), 1954, is the classic instance — from memory).
// A spot no candidate reaches gets a candidate of its own, with every
// option its zone allows. Each round cuts off the previous plan and there
// are finitely many distinct rows over a finite candidate set, so the loop
// ends; maxCoverRounds bounds it all the same.

// maxCoverRounds bounds the rounds of row generation; a plan still short
// of its rule after them is reported as not meeting it.
const maxCoverRounds = 40

// coverTol is how far past the covering radius a spot may lie and still
// count as covered: a millionth of the radius (rounding), never more.
func coverTol(r float64) float64 { return r * 1e-6 }

// CoverageRounds reports the row generation behind a solve.
type CoverageRounds struct {
	Rounds      int // solves, the first included
	RowsAdded   int // covering rows added at spots the measure found
	PointsAdded int // candidates added where no candidate reached a spot
}

// Ground returns zone z's ground under its spacing rule: the zone polygon
// minus the no-go areas that meet it.
func (pr *Prepared) Ground(z int) geom.Ground {
	sc := pr.In.Scenario
	g := geom.Ground{Outline: sc.Zones[z].Polygon}
	zb := g.Outline.Bounds()
	for _, ng := range sc.NoGo {
		if ng.Polygon.Bounds().Intersects(zb) {
			g.Holes = append(g.Holes, ng.Polygon)
		}
	}
	return g
}

// zonePoints lists, per zone, the chosen candidates' positions.
func (pr *Prepared) zonePoints(chosen []bool) [][]geom.Point {
	pts := make([][]geom.Point, len(pr.In.Scenario.Zones))
	for q, c := range pr.Layout.Candidates {
		if q < len(chosen) && chosen[q] {
			pts[c.Zone] = append(pts[c.Zone], c.P)
		}
	}
	return pts
}

// ExactReach returns, per zone, the farthest spot of its ground from the
// zone's chosen points (geom.Farthest); zones without a spacing rule get
// a Spot with Site -1 and Dist 0.
func (pr *Prepared) ExactReach(chosen []bool) []geom.Spot {
	pts := pr.zonePoints(chosen)
	out := make([]geom.Spot, len(pts))
	for z := range pts {
		out[z] = geom.Spot{Site: -1}
		if pr.Layout.RadiusFt[z] > 0 {
			out[z] = geom.Farthest(pr.Ground(z), pts[z])
		}
	}
	return out
}

// NeighbourFt returns, per zone with a spacing rule, the largest distance
// between two of its chosen points that are neighbours across its ground
// (geom.NeighbourPairs: Voronoi regions sharing an edge on the ground), 0
// with fewer than two points.
func (pr *Prepared) NeighbourFt(chosen []bool) []float64 {
	pts := pr.zonePoints(chosen)
	out := make([]float64, len(pts))
	for z := range pts {
		if pr.Layout.RadiusFt[z] == 0 {
			continue
		}
		for _, pq := range geom.NeighbourPairs(pr.Ground(z), pts[z]) {
			out[z] = max(out[z], pts[z][pq[0]].Dist(pts[z][pq[1]]))
		}
	}
	return out
}

// zoneSpot is a spot of zone Zone's ground beyond its covering radius.
type zoneSpot struct {
	Zone int
	At   geom.Point
}

// uncovered returns the spots beyond the covering radius: for each chosen
// point, the farthest ground of its Voronoi region if that is too far; for
// a ruled zone with no point at all, its first vertex.
func (pr *Prepared) uncovered(chosen []bool) []zoneSpot {
	return pr.uncoveredIn(chosen, nil)
}

// uncoveredIn is uncovered for the zones marked in only (nil: all).
func (pr *Prepared) uncoveredIn(chosen []bool, only []bool) []zoneSpot {
	pts := pr.zonePoints(chosen)
	// Only zones whose spacing rule the model holds: a variant that drops
	// a zone's rule (a rule cost, the minimal program) drops its rows.
	active := make([]bool, len(pts))
	if !pr.Spec.MaximizeCoverage {
		for _, row := range pr.Spec.CoverRows {
			if len(row) > 0 {
				active[pr.Spec.PointZone[row[0]]] = true
			}
		}
	}
	var out []zoneSpot
	for z := range pts {
		r := pr.Layout.RadiusFt[z]
		if r == 0 || !active[z] || (only != nil && !only[z]) {
			continue
		}
		g := pr.Ground(z)
		if len(pts[z]) == 0 {
			out = append(out, zoneSpot{z, g.Outline[0]})
			continue
		}
		for _, s := range geom.SpotsBeyond(g, pts[z], r+coverTol(r)) {
			out = append(out, zoneSpot{z, s.At})
		}
	}
	return out
}

// withSpots returns a copy of pr whose model also requires a point within
// the covering radius of each spot. The copy shares nothing it changes with
// pr. It returns the number of rows and candidates added; a spot no
// allowed place can reach (in a no-go area) gets no row.
func (pr *Prepared) withSpots(spots []zoneSpot) (*Prepared, int, int, error) {
	cp := *pr
	lay := *pr.Layout
	cp.Layout = &lay
	spec := *pr.Spec
	cp.Spec = &spec
	spec.CoverRows = slices.Clone(spec.CoverRows)
	byZone := make([][]int, len(pr.In.Scenario.Zones))
	for q, c := range lay.Candidates {
		byZone[c.Zone] = append(byZone[c.Zone], q)
	}
	var rows, added int
	cloned := false
	seen := map[string]bool{}
	for _, s := range spots {
		row := cp.rowFor(s, byZone[s.Zone])
		if len(row) == 0 {
			if pr.inNoGo(s.At) {
				continue
			}
			q := len(lay.Candidates)
			if !cloned {
				cloned = true
				lay.Candidates = slices.Clone(lay.Candidates)
				cp.Options = slices.Clone(cp.Options)
				spec.Options = slices.Clone(spec.Options)
				spec.PointZone = slices.Clone(spec.PointZone)
				spec.Required = slices.Clone(spec.Required)
			}
			lay.Candidates = append(lay.Candidates, candidates.Candidate{Zone: s.Zone, P: s.At})
			byZone[s.Zone] = append(byZone[s.Zone], q)
			spec.NumPoints++
			spec.PointZone = append(spec.PointZone, s.Zone)
			spec.Required = append(spec.Required, false)
			cp.appendOptions(&spec, q)
			added++
			row = []int{q}
		}
		key := fmt.Sprint(row)
		if seen[key] {
			continue
		}
		seen[key] = true
		spec.CoverRows = append(spec.CoverRows, row)
		rows++
	}
	if err := cp.raiseCoverNumbers(&spec, spots); err != nil {
		return nil, 0, 0, err
	}
	m, err := model.Build(&spec)
	if err != nil {
		return nil, 0, 0, err
	}
	cp.Model = m
	return &cp, rows, added, nil
}

// raiseCoverNumbers recomputes the covering number and least cover of each
// zone that got rows (see coverNumbers): the new rows can only raise it,
// and a bound at the old number would leave the search the weak LP of
// covering to close alone. The least covers also give the next round's
// start (StartSolution). It replaces, never edits, the slices it changes.
func (pr *Prepared) raiseCoverNumbers(spec *model.Spec, spots []zoneSpot) error {
	touched := map[int]bool{}
	for _, s := range spots {
		touched[s.Zone] = true
	}
	rowsByZone, ptsByZone := coverInputs(spec, len(spec.Zones))
	spec.Zones = slices.Clone(spec.Zones)
	pr.CoverMin = slices.Clone(pr.CoverMin)
	pr.CoverSets = slices.Clone(pr.CoverSets)
	for z := range spec.Zones {
		if !touched[z] || len(rowsByZone[z]) == 0 {
			continue
		}
		k, set, err := coverNumber(context.Background(), spec, z, rowsByZone[z], ptsByZone[z], recoverNodeLimit)
		if err != nil {
			return err
		}
		if k > pr.CoverMin[z] {
			pr.CoverMin[z] = k
			spec.Zones[z].MinCount = max(spec.Zones[z].MinCount, k)
		}
		if set != nil {
			pr.CoverSets[z] = set
		}
	}
	return nil
}

// mapStart carries a solution of old's model over to the columns of nu's,
// which has the same options (perhaps more at the end, new candidates,
// taken as unexplored): the same options chosen, every other column as
// model.StartFor sets it.
func mapStart(old, nu *model.Model, x []float64) []float64 {
	if x == nil {
		return nil
	}
	return nu.StartFor(old.Decode(x).Chosen)
}

// SolveCovered solves pr's model and then adds covering rows at every spot
// the exact measure finds beyond a zone's covering radius, re-solving from
// the previous plan until none is left (see the comment at the top of this
// file). It returns the Prepared whose model the result belongs to (pr
// itself when no row was needed). opt.TimeLimit bounds all rounds
// together. The maximal covering form is solved once: coverage is its
// objective, not its rule.
func (pr *Prepared) SolveCovered(ctx context.Context, opt mip.Options) (*Prepared, *mip.Result, CoverageRounds, error) {
	var deadline time.Time
	if opt.TimeLimit > 0 {
		deadline = time.Now().Add(opt.TimeLimit)
	}
	res, err := mip.Solve(ctx, pr.Model.Problem, loose(opt))
	if err != nil {
		return nil, nil, CoverageRounds{Rounds: 1}, err
	}
	if !deadline.IsZero() {
		opt.TimeLimit = max(time.Until(deadline), time.Millisecond)
	}
	cov, res, cr, err := pr.completeCoverage(ctx, res, opt, opt.GapRel >= loose(opt).GapRel)
	cr.Rounds++
	return cov, res, cr, err
}

// looseGap is the gap of the rounds before the last: a plan that will be
// cut off by the next round's rows need not be proven to the plan's gap.
// The last round, whose plan meets every rule exactly, is solved to it.
const looseGap = 0.03

func loose(opt mip.Options) mip.Options {
	opt.GapRel = max(opt.GapRel, looseGap)
	return opt
}

// CompleteCoverage takes a solve's result on pr's model and adds covering
// rows at the spots the exact measure finds beyond a zone's covering
// radius, re-solving from the previous plan until none is left. It returns
// the Prepared whose model the final result belongs to (pr itself when no
// row was needed) and the rounds it added. opt.TimeLimit bounds all its
// rounds together.
func (pr *Prepared) CompleteCoverage(ctx context.Context, res *mip.Result, opt mip.Options) (*Prepared, *mip.Result, CoverageRounds, error) {
	return pr.completeCoverage(ctx, res, opt, true)
}

// completeCoverage is CompleteCoverage; tight says res was solved with
// opt's own gap (else with looseGap, and the last round is solved again).
func (pr *Prepared) completeCoverage(ctx context.Context, res *mip.Result, opt mip.Options, tight bool) (*Prepared, *mip.Result, CoverageRounds, error) {
	var cr CoverageRounds
	var deadline time.Time
	if opt.TimeLimit > 0 {
		deadline = time.Now().Add(opt.TimeLimit)
	}
	cur := pr
	// A bound of an earlier round is a bound of every later one: the
	// later model only adds rows. A round cut short before its own root
	// bound keeps the best earlier one.
	best := math.Inf(-1)
	carry := func(r *mip.Result) {
		if r == nil || cur.Spec.MaximizeCoverage {
			return
		}
		if !(r.Bound >= best) { // NaN and -Inf too
			r.Bound = best
			if r.X != nil && !math.IsInf(best, -1) {
				r.Gap = math.Max(0, (r.Obj-r.Bound)/math.Max(1, math.Abs(r.Obj)))
			}
		}
		best = math.Max(best, r.Bound)
	}
	carry(res)
	for {
		if res.X == nil || cur.Spec.MaximizeCoverage {
			if !tight && res.X == nil && res.Status != mip.Infeasible && ctx.Err() == nil {
				// A loose solve that found nothing: try at the full gap.
				tight = true
				cr.Rounds++
				if res, err := mip.Solve(ctx, cur.Model.Problem, opt); err != nil {
					return nil, nil, cr, err
				} else {
					return cur, res, cr, nil
				}
			}
			return cur, res, cr, nil
		}
		spots := cur.uncovered(cur.chosen(res.X))
		stop := cr.Rounds+1 >= maxCoverRounds || ctx.Err() != nil || (!deadline.IsZero() && time.Until(deadline) <= 0)
		if len(spots) == 0 {
			if tight || (res.Status == mip.Optimal && res.Gap <= opt.GapRel) {
				// Proven to the gap asked for (a loose solve often is).
				return cur, res, cr, nil
			}
			if stop {
				// A loose solve's "optimal" is not the gap asked for: say
				// why the search ended short of it.
				if res.Status == mip.Optimal {
					res.Status = mip.TimeLimit
					if ctx.Err() != nil {
						res.Status = mip.Interrupted
					}
				}
				return cur, res, cr, nil
			}
			// The plan meets every rule: prove it, or a better one, to
			// the gap asked for.
			o := opt
			if !deadline.IsZero() {
				o.TimeLimit = max(time.Until(deadline), time.Millisecond)
			}
			o.Start = res.X
			tight = true
			cr.Rounds++
			var err error
			if res, err = mip.Solve(ctx, cur.Model.Problem, o); err != nil {
				return nil, nil, cr, err
			}
			carry(res)
			continue
		}
		if stop {
			// The rules table reports the spots left as a rule not met.
			return cur, res, cr, nil
		}
		next, rows, added, err := cur.withSpots(spots)
		if err != nil {
			return nil, nil, cr, err
		}
		cr.RowsAdded += rows
		cr.PointsAdded += added
		if rows == 0 {
			// Every spot left lies where no point may go.
			return cur, res, cr, nil
		}
		o := loose(opt)
		if !deadline.IsZero() {
			o.TimeLimit = max(time.Until(deadline), time.Millisecond)
		}
		// Start from the plan over the new least covers, which meets every
		// row; failing that, from the previous plan (the engine repairs it).
		o.Start = next.StartSolution(ctx, o.GapRel, o.TimeLimit/3)
		if o.Start == nil {
			o.Start = mapStart(cur.Model, next.Model, res.X)
		}
		if !deadline.IsZero() {
			o.TimeLimit = max(time.Until(deadline), time.Millisecond)
		}
		cur = next
		cr.Rounds++
		tight = o.GapRel <= opt.GapRel
		if res, err = mip.Solve(ctx, cur.Model.Problem, o); err != nil {
			return nil, nil, cr, err
		}
		carry(res)
	}
}

// AddSpotRows returns pr with a covering row at every spot beyond a zone's
// covering radius in the plan x (and a candidate where none reaches a
// spot), and the number of rows added; pr itself and 0 when x meets every
// spacing rule exactly. For callers that solve pr's model their own way
// (a restricted solve) and complete the coverage themselves.
func (pr *Prepared) AddSpotRows(x []float64) (*Prepared, int, error) {
	spots := pr.uncovered(pr.chosen(x))
	if len(spots) == 0 {
		return pr, 0, nil
	}
	next, rows, _, err := pr.withSpots(spots)
	if err != nil {
		return nil, 0, err
	}
	if rows == 0 {
		return pr, 0, nil
	}
	return next, rows, nil
}

// MapStart carries a solution of old's model to nu's, where nu came from
// old by AddSpotRows (same columns, perhaps options added at the end).
func MapStart(old, nu *model.Model, x []float64) []float64 { return mapStart(old, nu, x) }

// preloadRows runs the row generation on each zone's least cover before the
// first solve: the least cover's exact farthest ground gives rows, the
// zone's covering number and least cover are recomputed, and so on until
// a least cover meets the rule exactly (or maxCoverRounds). The rows are
// valid for every plan — each says some point must reach a spot of the
// ground — so they cut off nothing a plan may do; they spare the full
// model most of its rounds, and the start built from the covers
// (StartSolution) then meets the rule exactly. Only the candidates there
// are are used: a spot none reaches is left to the full rounds.
func (pr *Prepared) preloadRows(ctx context.Context) error {
	spec := pr.Spec
	nz := len(pr.In.Scenario.Zones)
	byZone := make([][]int, nz)
	for q, c := range pr.Layout.Candidates {
		byZone[c.Zone] = append(byZone[c.Zone], q)
	}
	rowsByZone, ptsByZone := coverInputs(spec, nz)
	// Each zone's loop is its own (its ground, rows and cover touch no
	// other zone's), so zones run side by side, one per processor; the
	// results are joined in zone order, the same on every run.
	type result struct {
		rows [][]int
		k    int
		set  []int
		err  error
	}
	results := make([]result, nz)
	zoneLoop := func(z int) result {
		var res result
		r := pr.Layout.RadiusFt[z]
		set := pr.CoverSets[z]
		if r == 0 || len(rowsByZone[z]) == 0 || set == nil {
			return res
		}
		pts := ptsByZone[z]
		g := pr.Ground(z)
		rows := slices.Clone(rowsByZone[z])
		seen := map[string]bool{}
		for round := 0; round < maxCoverRounds && ctx.Err() == nil; round++ {
			sites := make([]geom.Point, len(set))
			for i, q := range set {
				sites[i] = pr.Layout.Candidates[q].P
			}
			added := 0
			for _, sp := range geom.SpotsBeyond(g, sites, r+coverTol(r)) {
				row := pr.rowFor(zoneSpot{z, sp.At}, byZone[z])
				if len(row) == 0 {
					continue
				}
				key := fmt.Sprint(row)
				if seen[key] {
					continue
				}
				seen[key] = true
				rows = append(rows, row)
				res.rows = append(res.rows, row)
				added++
			}
			if added == 0 {
				break
			}
			k, s, err := coverNumber(ctx, spec, z, rows, pts, recoverNodeLimit)
			if err != nil {
				res.err = err
				return res
			}
			res.k = max(res.k, k)
			if s == nil {
				break
			}
			res.set, set = s, s
		}
		return res
	}
	forEachZone(nz, func(z int) { results[z] = zoneLoop(z) })
	if ctx.Err() != nil {
		return ctx.Err()
	}
	spec.Zones = slices.Clone(spec.Zones)
	pr.CoverMin = slices.Clone(pr.CoverMin)
	pr.CoverSets = slices.Clone(pr.CoverSets)
	for z, res := range results {
		if res.err != nil {
			return res.err
		}
		spec.CoverRows = append(spec.CoverRows, res.rows...)
		if res.k > pr.CoverMin[z] {
			pr.CoverMin[z] = res.k
			spec.Zones[z].MinCount = max(spec.Zones[z].MinCount, res.k)
		}
		if res.set != nil {
			pr.CoverSets[z] = res.set
		}
	}
	return nil
}

// rowFor lists the candidates (of cands, the spot's zone's) within the
// zone's covering radius of the spot.
func (pr *Prepared) rowFor(s zoneSpot, cands []int) []int {
	r := pr.Layout.RadiusFt[s.Zone] * (1 - 1e-9)
	var row []int
	for _, q := range cands {
		if pr.Layout.Candidates[q].P.Dist(s.At) <= r {
			row = append(row, q)
		}
	}
	return row
}

// chosen marks the candidates a solution explores.
func (pr *Prepared) chosen(x []float64) []bool {
	sol := pr.Model.Decode(x)
	out := make([]bool, len(pr.Layout.Candidates))
	for _, o := range sol.Chosen {
		out[pr.Spec.Options[o].Point] = true
	}
	return out
}

// spotText formats a spot for the rules table.
func spotText(p geom.Point) string { return fmt.Sprintf("(%.1f, %.1f)", p.X, p.Y) }

// inNoGo reports whether q lies in a no-go area (boundary included), where
// no point may go.
func (pr *Prepared) inNoGo(q geom.Point) bool {
	for _, ng := range pr.In.Scenario.NoGo {
		if ng.Polygon.Contains(q) {
			return true
		}
	}
	return false
}
