package plan

import (
	"context"
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/scenarios"
)

// Baseline is the program a competent person lays by hand, priced by the
// same estimate (Prepared.price) and counted in field days by the same day
// rule as the plan:
//
//   - in each zone with a spacing rule, a regular grid of the rule's
//     lattice (square or triangular) at the rule's spacing, centred on the
//     zone's extent (so its covering radius is the rule's; plane geometry);
//     in a zone with a count rule only, an even square grid with one point
//     per the zone's area share; required points and corners as the rules
//     place them; points in no-go areas dropped; a point added at each gap
//     the grid leaves (the allowed spot nearest the gap's centre), and
//     more until the zone's count rule is met;
//   - the sampled share of each zone's points, spread evenly through the
//     grid, as sampled borings (test pits where no boring is possible);
//     the rest as CPT soundings where the zone allows them and a rig can
//     push there, else as sampled borings too;
//   - for each zone and method the cheapest offered rig that reaches the
//     zone (least priced cost a point).
//
// Its points are offered to the optimizer as candidates
// (candidates.ZoneInput.Extra) and the baseline itself is a start of the
// solve, so the plan is never dearer than the baseline (up to the
// tie-break of 0.01 a field day). The saving splits, in this order, into
// methods (the optimizer's methods on the baseline's points and rigs),
// rigs (any offered rig on the baseline's points) and layout (the
// optimizer's points); each step is a solve of the model restricted to
// those options.
type Baseline struct {
	Rig       string  `json:"rig"` // the rigs used, comma-separated
	Points    int     `json:"points"`
	Cost      float64 `json:"cost"`
	FieldDays int     `json:"field_days"`
	Saving    float64 `json:"saving"`         // baseline cost − optimized cost
	SavingPct float64 `json:"saving_percent"` // of the baseline cost
	DaysSaved int     `json:"field_days_saved"`
	// Split is the saving by source; the three add up to Saving.
	Split *SavingSplit `json:"saving_split,omitempty"`
	Note  string       `json:"note,omitempty"`
}

// SavingSplit is the saving against the baseline by source.
type SavingSplit struct {
	Methods float64 `json:"methods"`
	Rigs    float64 `json:"rigs"`
	Layout  float64 `json:"layout"`
}

// handBase is the baseline, worked out once per prepared plan.
type handBase struct {
	chosen []int // options, ascending
	cost   *costing
	start  []float64
	// afterMethods and afterRigs are the costs of the restricted solves
	// (methods optimized on the baseline's points and rigs; then rigs too).
	afterMethods, afterRigs float64
	rigs                    string
}

// countRule is the number of points a zone's count rules ask for.
func countRule(zn scenarios.Zone) int {
	n := zn.Rules.MinPoints
	if zn.Rules.AreaPerPointFt2 > 0 {
		if k := int(math.Ceil(zn.Polygon.Area()/zn.Rules.AreaPerPointFt2 - 1e-9)); k > n {
			n = k
		}
	}
	return n
}

// handGrid is the grid a person lays in a zone (before gaps are filled):
// the rule's lattice at the rule's spacing s (or, for a count rule, a
// square grid at the side of the area per point, closed up until the count
// fits), aligned with the zone's extent: set out either with equal margins
// or from the same centred origin as the candidate lattice at half that
// spacing (candidates.Generate lays candidates at s/2 with as many rows and
// columns as fit and equal margins), whichever has fewer points. A lattice
// at s from the candidates' origin is a sub-lattice of theirs, for squares
// and for triangles alike (every other row, every other point), so those
// points are candidates already and the model does not grow; the others
// are offered as extra candidates.
func handGrid(zn scenarios.Zone) []geom.Point {
	b := zn.Polygon.Bounds()
	kind := string(zn.Rules.Lattice)
	if kind == "" {
		kind = geom.Square
	}
	s := zn.Rules.MaxSpacingFt
	if s == 0 && zn.Rules.AreaPerPointFt2 > 0 {
		s, kind = math.Sqrt(zn.Rules.AreaPerPointFt2), geom.Square
	}
	n := countRule(zn)
	if s > 0 {
		// Of the grid on the candidates and the grid with equal margins at
		// s, the person keeps the one with fewer points (shifting a grid
		// to save a row is common practice); a tie keeps the first.
		pts := zn.Polygon.Lattice(kind, s, geom.CentredOrigin(kind, b, s/2))
		if eq := zn.Polygon.Lattice(kind, s, geom.CentredOrigin(kind, b, s)); len(eq) < len(pts) {
			pts = eq
		}
		if len(pts) >= n || zn.Rules.MaxSpacingFt > 0 {
			return pts // a spacing zone gets more points later if its count asks
		}
	}
	n = max(n, 1)
	side := math.Sqrt(zn.Polygon.Area() / float64(n))
	var pts []geom.Point
	for k := 0; k < 40 && side > 0; k++ {
		pts = zn.Polygon.Lattice(geom.Square, side, geom.CentredOrigin(geom.Square, b, side))
		if len(pts) >= n {
			break
		}
		side *= 0.9
	}
	return pts
}

// optionKey finds an option by point, method and rig.
type optionKey struct {
	point, rig int
	method     sdk.Method
}

// baseline returns the hand-laid baseline, computing it on first use; nil
// when some zone cannot be laid by hand (no option at a needed point).
func (pr *Prepared) baseline() *handBase {
	if pr.hand == nil {
		pr.hand = pr.layBaseline()
	}
	if len(pr.hand.chosen) == 0 {
		return nil
	}
	return pr.hand
}

func (pr *Prepared) layBaseline() *handBase {
	none := &handBase{}
	sc, lay := pr.In.Scenario, pr.Layout
	byKey := map[optionKey]int{}
	for o, od := range pr.Options {
		byKey[optionKey{od.point, od.rig, od.method}] = o
	}
	byPos := map[geom.Point]int{}
	zoneCands := make([][]int, len(sc.Zones))
	for q, c := range lay.Candidates {
		byPos[c.P] = q
		zoneCands[c.Zone] = append(zoneCands[c.Zone], q)
	}
	chosenPt := make([]bool, len(lay.Candidates))
	var chosen []int
	rigNames := map[string]bool{}
	for z, zn := range sc.Zones {
		var pts []int
		take := func(q int) {
			if !chosenPt[q] {
				chosenPt[q] = true
				pts = append(pts, q)
			}
		}
		for _, q := range zoneCands[z] {
			if c := lay.Candidates[q]; c.Required || c.Corner {
				take(q)
			}
		}
		for _, p := range pr.handGrids[z] {
			if q, ok := byPos[p]; ok && lay.Candidates[q].Zone == z {
				take(q)
			}
		}
		// Gaps: a cell no grid point covers gets the allowed spot nearest
		// its centre.
		for _, cell := range lay.Cells {
			if cell.Zone != z || len(cell.CoveredBy) == 0 {
				continue
			}
			covered := false
			for _, q := range cell.CoveredBy {
				covered = covered || chosenPt[q]
			}
			if !covered {
				best := cell.CoveredBy[0]
				for _, q := range cell.CoveredBy[1:] {
					if lay.Candidates[q].P.Dist(cell.P) < lay.Candidates[best].P.Dist(cell.P) {
						best = q
					}
				}
				take(best)
			}
		}
		// Then, as a person checks a layout with a scale rule, the
		// candidate nearest each spot the exact measure finds beyond the
		// radius, until none is left (spots no candidate reaches excepted).
		if r := lay.RadiusFt[z]; r > 0 {
			g := pr.Ground(z)
			for round := 0; round < maxCoverRounds; round++ {
				sites := make([]geom.Point, len(pts))
				for i, q := range pts {
					sites[i] = lay.Candidates[q].P
				}
				added := false
				for _, sp := range geom.SpotsBeyond(g, sites, r+coverTol(r)) {
					row := pr.rowFor(zoneSpot{z, sp.At}, zoneCands[z])
					if len(row) == 0 || slices.ContainsFunc(row, func(q int) bool { return chosenPt[q] }) {
						continue
					}
					best := row[0]
					for _, q := range row[1:] {
						if lay.Candidates[q].P.Dist(sp.At) < lay.Candidates[best].P.Dist(sp.At) {
							best = q
						}
					}
					take(best)
					added = true
				}
				if !added {
					break
				}
			}
		}
		for _, q := range zoneCands[z] {
			if len(pts) >= pr.Spec.Zones[z].MinCount {
				break
			}
			take(q)
		}
		sort.Ints(pts)
		// Methods and rigs.
		cheapest := func(m sdk.Method) int {
			best, bestCost := -1, math.Inf(1)
			for ri, rd := range pr.Rigs {
				if !containsMethod(zoneMethods(zn, rd.info), m) {
					continue
				}
				if p, ok := rd.profiles[profileKey{z, m}]; ok && p.answer.Feasible && p.cost < bestCost {
					best, bestCost = ri, p.cost
				}
			}
			return best
		}
		sm, sr := sdk.Boring, cheapest(sdk.Boring)
		if sr < 0 {
			sm, sr = sdk.TestPit, cheapest(sdk.TestPit)
		}
		um, ur := sdk.CPT, cheapest(sdk.CPT)
		if ur < 0 {
			um, ur = sm, sr
		}
		if sr < 0 {
			sm, sr = um, ur
		}
		if sr < 0 {
			return none
		}
		n := len(pts)
		ns := int(math.Ceil(zn.Rules.SampledShare*float64(n) - 1e-9))
		for i, q := range pts {
			m, r := um, ur
			if (i+1)*ns/n > i*ns/n { // an even spread of ns among n
				m, r = sm, sr
			}
			o, ok := byKey[optionKey{q, r, m}]
			if !ok {
				// A required point that fixes its method or rig: the
				// sampled method, else the first way it allows.
				o, ok = byKey[optionKey{q, sr, sm}]
			}
			for oo := 0; !ok && oo < len(pr.Options); oo++ {
				if pr.Options[oo].point == q {
					o, ok = oo, true
				}
			}
			if !ok {
				return none
			}
			chosen = append(chosen, o)
			rigNames[pr.Rigs[r].name] = true
		}
	}
	sort.Ints(chosen)
	cost, err := pr.price(chosen, nil)
	if err != nil {
		return none
	}
	hb := &handBase{chosen: chosen, cost: cost, start: pr.startVector(chosen)}
	var names []string
	for n := range rigNames {
		names = append(names, n)
	}
	sort.Strings(names)
	hb.rigs = strings.Join(names, ", ")

	// The split: restricted solves, node-limited so they are the same on
	// every run; a restricted solve that ends without a better plan keeps
	// the step's cost.
	atPoint := map[int]bool{}
	rigOf := map[[2]int]bool{} // zone, rig
	for _, o := range chosen {
		od := pr.Options[o]
		atPoint[od.point] = true
		rigOf[[2]int{od.zone, od.rig}] = true
	}
	hb.afterMethods = pr.restricted(func(od optionData) bool { return atPoint[od.point] && rigOf[[2]int{od.zone, od.rig}] }, hb.start, cost.Total)
	hb.afterRigs = pr.restricted(func(od optionData) bool { return atPoint[od.point] }, hb.start, hb.afterMethods)
	return hb
}

// restricted solves the model with only the options allowed, from start,
// and returns the cost found (at most upTo).
func (pr *Prepared) restricted(allow func(optionData) bool, start []float64, upTo float64) float64 {
	m := pr.Model
	sub := *m.Problem
	sub.LP.ColUp = append([]float64(nil), m.Problem.LP.ColUp...)
	for o, od := range pr.Options {
		if !allow(od) {
			sub.LP.ColUp[m.XCol[o]] = 0
		}
	}
	pr.oneCrew(sub.LP.ColUp)
	res, err := mip.Solve(context.Background(), &sub, mip.Options{GapRel: pr.In.Scenario.GapRel, NodeLimit: startNodeLimit, Start: start})
	if err != nil || res.X == nil {
		return upTo
	}
	return math.Min(upTo, round(m.Decode(res.X).Cost, 2))
}

// startVector is the model's column values for a set of chosen options
// (model.StartFor).
func (pr *Prepared) startVector(chosen []int) []float64 { return pr.Model.StartFor(chosen) }

// baselineFor compares the baseline with a plan of the given cost and
// finish.
func (pr *Prepared) baselineFor(cost float64, finish int) *Baseline {
	hb := pr.baseline()
	if hb == nil {
		return nil
	}
	b := &Baseline{Rig: hb.rigs, Points: len(hb.chosen), Cost: hb.cost.Total, FieldDays: hb.cost.Finish}
	b.Saving = round(b.Cost-cost, 2)
	if b.Cost > 0 {
		b.SavingPct = round(100*b.Saving/b.Cost, 2)
	}
	b.DaysSaved = b.FieldDays - finish
	b.Split = &SavingSplit{
		Methods: round(b.Cost-hb.afterMethods, 2),
		Rigs:    round(hb.afterMethods-hb.afterRigs, 2),
		Layout:  round(hb.afterRigs-cost, 2),
	}
	b.Note = fmt.Sprintf("regular grid at each zone's rule spacing, the sampled share as borings and the rest as CPT where allowed, the cheapest rig for each zone, by %s", hb.rigs)
	return b
}
