package plan

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Baseline is the program a person would lay by hand, priced with the same
// rate book and rigs: a square grid in every zone whose covering radius is
// the rule's (spacing s for a square rule; s·√(2/3) for a triangular rule,
// whose radius s/√3 a square grid of side a meets when a/√2 = s/√3 — plane
// geometry), started half a spacing in from the zone's edges, points in
// no-go areas dropped, at least the zone's minimum count; every point a
// sampled boring to the zone's depth, with a point added wherever the grid
// leaves a coverage cell uncovered (so the baseline meets the same spacing
// rule the plan meets), all drilled by the one rig offered
// that can reach every zone.
type Baseline struct {
	Rig       string  `json:"rig"`
	Points    int     `json:"points"`
	Cost      float64 `json:"cost"`
	FieldDays int     `json:"field_days"`
	Saving    float64 `json:"saving"`         // baseline cost − optimized cost
	SavingPct float64 `json:"saving_percent"` // of the baseline cost
	DaysSaved int     `json:"field_days_saved"`
	Note      string  `json:"note,omitempty"`
}

// baseline prices the hand-laid grid. It returns nil when no single rig can
// drill borings in every zone (then there is no such baseline to compare
// with).
func (pr *Prepared) baseline() *Baseline {
	sc := pr.In.Scenario
	best := -1
	bestCost := math.Inf(1)
	var bestB Baseline
	for ri, rd := range pr.Rigs {
		b := Baseline{Rig: rd.name}
		hours, cost := 0.0, 0.0
		ok := true
		for z := range sc.Zones {
			prof, has := rd.profiles[profileKey{z, sdk.Boring}]
			if !has || !prof.answer.Feasible {
				ok = false
				break
			}
			n := pr.gridCount(z)
			b.Points += n
			hours += float64(n) * (prof.answer.Hours.Total() + prof.move)
			cost += float64(n) * prof.cost
		}
		if !ok {
			continue
		}
		days := int(math.Ceil((hours+rd.mob.Hours)/sc.HoursDay - 1e-9))
		cost += rd.mobCost + float64(days)*rd.dayCost
		if cost < bestCost {
			best, bestCost = ri, cost
			b.Cost, b.FieldDays = cost, days
			bestB = b
		}
	}
	if best < 0 {
		return nil
	}
	bestB.Cost = round(bestB.Cost, 2)
	bestB.Note = fmt.Sprintf("square grid meeting each zone's spacing rule, all sampled borings by %s", bestB.Rig)
	return &bestB
}

// gridCount is how many points a square grid at the zone's rule spacing puts
// in the zone (outside no-go areas), plus the points a person adds where the
// grid leaves a coverage cell beyond the covering radius (one at an allowed
// spot covering the cell, as one fills gaps by hand), but at least the
// zone's minimum count.
func (pr *Prepared) gridCount(z int) int {
	zn := pr.In.Scenario.Zones[z]
	s := zn.Rules.MaxSpacingFt
	if s > 0 && zn.Rules.Lattice != "square" {
		s *= math.Sqrt(2.0 / 3.0) // triangular rule: same covering radius
	}
	if s == 0 && zn.Rules.AreaPerPointFt2 > 0 {
		s = math.Sqrt(zn.Rules.AreaPerPointFt2)
	}
	// Required points and corners first: a person places those by rule.
	var pts []geom.Point
	for _, c := range pr.Layout.Candidates {
		if c.Zone == z && (c.Required || c.Corner) {
			pts = append(pts, c.P)
		}
	}
	if s > 0 {
		b := zn.Polygon.Bounds()
		for _, q := range zn.Polygon.Lattice(geom.Square, s, geom.Point{X: b.Min.X + s/2, Y: b.Min.Y + s/2}) {
			free := true
			for _, ng := range pr.In.Scenario.NoGo {
				if ng.Polygon.Contains(q) {
					free = false
					break
				}
			}
			if free {
				pts = append(pts, q)
			}
		}
	}
	if r := pr.Layout.RadiusFt[z]; r > 0 {
		for _, c := range pr.Layout.Cells {
			if c.Zone != z || len(c.CoveredBy) == 0 {
				continue
			}
			covered := false
			for _, q := range pts {
				if math.Hypot(q.X-c.P.X, q.Y-c.P.Y) <= r+1e-9 {
					covered = true
					break
				}
			}
			if !covered {
				pts = append(pts, pr.Layout.Candidates[c.CoveredBy[0]].P)
			}
		}
		// Then, as a person checks a layout with a scale rule, a point at
		// each spot still beyond the radius (the exact measure), until none
		// is left; spots in no-go areas cannot take a point.
		g := pr.Ground(z)
		for round := 0; round < maxCoverRounds; round++ {
			added := false
			if len(pts) == 0 {
				pts = append(pts, zn.Polygon.Centroid())
				added = true
			}
			for _, sp := range geom.FarthestBySite(g, pts) {
				if sp.Site < 0 || sp.Dist <= r+coverTol(r) || pr.inNoGo(sp.At) {
					continue
				}
				pts = append(pts, sp.At)
				added = true
			}
			if !added {
				break
			}
		}
	}
	return max(len(pts), pr.ZoneMin[z], 1)
}

// inNoGo reports whether q lies in a no-go area (boundary included).
func (pr *Prepared) inNoGo(q geom.Point) bool {
	for _, ng := range pr.In.Scenario.NoGo {
		if ng.Polygon.Contains(q) {
			return true
		}
	}
	return false
}
