package plan

import (
	"context"
	"fmt"
	"math"
	"time"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/rules"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/scenarios"
)

// ErrNoPlan is returned when the solve ends without any plan meeting the
// rules.
type ErrNoPlan struct {
	Status mip.Status
	Why    string
}

func (e *ErrNoPlan) Error() string {
	switch e.Status {
	case mip.Interrupted:
		return "plan: interrupted before the solve found a plan; no file written"
	case mip.TimeLimit, mip.NodeLimit:
		return fmt.Sprintf("plan: the solve reached its %s before it found a plan; raise the limit (--time-limit) or relax the rules%s", e.Status, e.Why)
	}
	return fmt.Sprintf("plan: no plan meets every rule (solver: %s)%s", e.Status, e.Why)
}

// BadInput marks an infeasible plan as the user's to fix (rules or rigs).
func (e *ErrNoPlan) BadInput() bool { return e.Status == mip.Infeasible }

// Run plans a scenario: Prepare, solve, Assemble.
func Run(ctx context.Context, in Input, opt Options) (*Plan, error) {
	pr, err := Prepare(ctx, in, opt)
	if err != nil {
		return nil, err
	}
	res, err := pr.Solve(ctx, opt)
	if err != nil {
		return nil, err
	}
	return pr.Assemble(res)
}

// Solve solves the prepared model with the engine.
func (pr *Prepared) Solve(ctx context.Context, opt Options) (*mip.Result, error) {
	sc := pr.In.Scenario
	mo := mip.Options{GapRel: sc.GapRel, Threads: opt.Threads, Progress: opt.Progress}
	if opt.GapRel > 0 {
		mo.GapRel = opt.GapRel
	}
	tl := sc.TimeLimitS
	if opt.TimeLimit > 0 {
		tl = opt.TimeLimit
	}
	if tl > 0 {
		mo.TimeLimit = secs(tl)
	}
	t0 := time.Now()
	// The start gets at most a third of the time limit; the node limit
	// usually ends it far sooner.
	mo.Start = pr.BestStart(ctx, mo.GapRel, mo.TimeLimit/3)
	pr.Timings.add("start solution (zone covers)", t0)
	t0 = time.Now()
	cov, res, rounds, err := pr.SolveCovered(ctx, mo)
	if err != nil {
		return nil, err
	}
	timings := pr.Timings
	*pr = *cov
	pr.Timings = timings
	pr.Rounds = rounds
	pr.Timings.add(fmt.Sprintf("solve (%d round(s) of exact coverage, %d row(s) and %d point(s) added)", rounds.Rounds, rounds.RowsAdded, rounds.PointsAdded), t0)
	if res.X == nil {
		return nil, &ErrNoPlan{Status: res.Status}
	}
	return res, nil
}

// Assemble reads a solution back into a plan.
func (pr *Prepared) Assemble(res *mip.Result) (*Plan, error) {
	sc, rb := pr.In.Scenario, pr.In.RateBook
	sol := pr.Model.Decode(res.X)
	p := &Plan{
		Schema:   SchemaVersion,
		Scenario: ScenarioInfo{Name: sc.Name, Title: sc.Title, Source: sc.Source, Demo: sc.Demo},
		RateBook: RateBookInfo{Name: rb.Name, Title: rb.Title, Currency: rb.Currency, Effective: rb.Effective, Region: rb.Region, Demo: rb.Demo},
		Finish:   sol.Finish,
		Warnings: []string{},
	}
	var frame *geom.LocalFrame
	if sc.Origin != nil {
		frame = &geom.LocalFrame{OriginLon: sc.Origin.Lon, OriginLat: sc.Origin.Lat}
	}

	zoneCount := make([]int, len(sc.Zones))
	zoneSampled := make([]int, len(sc.Zones))
	zoneMinDepth := make([]float64, len(sc.Zones))
	rigPts := make([]int, len(pr.Rigs))
	rigHours := make([]float64, len(pr.Rigs))
	rigBy := make([]map[string]int, len(pr.Rigs))
	for i := range rigBy {
		rigBy[i] = map[string]int{}
	}
	chosenPoint := make([]bool, len(pr.Layout.Candidates))
	labCounts := make([]lab.Counts, len(sc.Zones))
	methods := make([]string, len(sol.Chosen))
	for k, o := range sol.Chosen {
		methods[k] = string(pr.Options[o].method)
	}
	ids := pointIDs(methods)
	for k, o := range sol.Chosen {
		od := pr.Options[o]
		c := pr.Layout.Candidates[od.point]
		zn := sc.Zones[od.zone]
		pt := Point{
			ID: ids[k], Zone: zn.ID,
			XFt: round(c.P.X, 1), YFt: round(c.P.Y, 1),
			Method: string(od.method), Rig: pr.Rigs[od.rig].name,
			DepthFt: od.depth, Hours: round(pr.Spec.Options[o].Hours, 2),
			OnPointHours: od.prof.onHours, Surface: string(zn.Ground.Surface),
			Cost: round(od.prof.cost, 2), Required: c.Required || c.Corner,
		}
		if od.method == sdk.Boring {
			pt.SampleIntervalFt = zn.Rules.SampleIntervalFt
			pt.Sampling = sdk.DescribeSchedule(sdk.ScheduleOf(sdk.Site{SampleIntervalFt: zn.Rules.SampleIntervalFt, SampleSchedule: zn.Rules.SampleSchedule}))
		}
		if frame != nil {
			lon, lat := frame.ToLonLat(c.P)
			lon, lat = round(lon, 7), round(lat, 7)
			pt.Lon, pt.Lat = &lon, &lat
		}
		p.Points = append(p.Points, pt)
		labCounts[od.zone] = labCounts[od.zone].Add(od.prof.lab)
		chosenPoint[od.point] = true
		zoneCount[od.zone]++
		if od.method.Sampled() {
			zoneSampled[od.zone]++
		}
		if zoneMinDepth[od.zone] == 0 || od.depth < zoneMinDepth[od.zone] {
			zoneMinDepth[od.zone] = od.depth
		}
		rigPts[od.rig]++
		rigHours[od.rig] += pr.Spec.Options[o].Hours
		rigBy[od.rig][string(od.method)]++
		if od.method == sdk.TestPit {
			p.Warnings = append(p.Warnings, pitWarnings(pt.ID, od.depth)...)
		}
	}
	// The lab program by zone, for the basis shown: each zone's samples
	// get its purposes' tests (priced, with every other item, by price).
	for z, zn := range sc.Zones {
		prog, err := labProgram(sc, z)
		if err != nil {
			return nil, err
		}
		if labCounts[z] != (lab.Counts{}) {
			p.Lab = append(p.Lab, LabBasis{Zone: zn.ID, Program: prog.Name, Basis: prog.Source})
		}
	}
	est, err := pr.price(sol.Chosen, sol.Days)
	if err != nil {
		return nil, err
	}
	p.Estimate, p.Total = est.Lines, est.Total
	for r, rd := range pr.Rigs {
		rp := RigPlan{Name: rd.name, Title: rd.info.Title, Mobilized: sol.Mobilized[r], Points: rigPts[r],
			ByMethod: rigBy[r], Hours: round(rigHours[r], 2), FieldDays: sol.Days[r]}
		if sol.Mobilized[r] {
			rp.MobHours = round(rd.mob.Hours, 2)
		}
		p.Rigs = append(p.Rigs, rp)
	}

	// Coverage of ground under spacing rules.
	cov := Coverage{}
	for _, cell := range pr.Layout.Cells {
		cov.AreaFt2 += cell.AreaFt2
		for _, q := range cell.CoveredBy {
			if chosenPoint[q] {
				cov.CoveredFt2 += cell.AreaFt2
				break
			}
		}
	}
	for _, cell := range pr.Layout.Uncoverable {
		cov.AreaFt2 += cell.AreaFt2
	}
	if cov.AreaFt2 > 0 {
		cov.CoveredPercent = round(100*cov.CoveredFt2/cov.AreaFt2, 2)
	}
	cov.AreaFt2, cov.CoveredFt2 = round(cov.AreaFt2, 0), round(cov.CoveredFt2, 0)
	p.Coverage = cov
	if len(pr.Layout.Uncoverable) > 0 {
		a := 0.0
		for _, c := range pr.Layout.Uncoverable {
			a += c.AreaFt2
		}
		p.Warnings = append(p.Warnings, fmt.Sprintf("%.0f ft² of ground under spacing rules lies beyond reach of any allowed point (inside or behind no-go areas)", a))
	}

	p.Excluded = pr.excluded()
	p.Baseline = pr.baselineFor(p.Total, p.Finish)
	p.Rules = pr.ruleChecks(zoneCount, zoneSampled, zoneMinDepth, pr.ExactReach(chosenPoint), pr.NeighbourFt(chosenPoint))
	p.Warnings = append(p.Warnings, shallowBuildingWarnings(sc)...)
	p.Warnings = append(p.Warnings, pr.rigWarnings...)
	p.Cautions = planCautions(sc, p.Points)
	pb := pr.Model.Problem
	if math.IsInf(res.Bound, 0) || math.IsNaN(res.Bound) {
		// Stopped before the root bound: every cost is ≥ 0, so 0 is a
		// proven (if weak) lower bound.
		res.Bound = 0
		res.Gap = 1
		if res.Obj != 0 {
			res.Gap = res.Obj / math.Max(1, math.Abs(res.Obj))
		}
		p.Warnings = append(p.Warnings, "the solve stopped before it proved a lower bound; the gap shown is against zero cost")
	}
	p.Solver = SolverInfo{
		Status: res.Status.String(), Objective: round(res.Obj, 4), Bound: round(res.Bound, 4), Gap: round(res.Gap, 6),
		Nodes: res.Nodes, Candidates: len(pr.Layout.Candidates), Options: len(pr.Spec.Options),
		Rows: pb.LP.NumRows, Columns: pb.LP.NumCols,
	}
	return p, nil
}

func (pr *Prepared) ruleChecks(count, sampled []int, minDepth []float64, farthest []geom.Spot, neighbour []float64) []RuleCheck {
	sc := pr.In.Scenario
	var out []RuleCheck
	for z, zn := range sc.Zones {
		r := zn.Rules
		if r.MaxSpacingFt > 0 {
			lat := r.Lattice
			if lat == "" {
				lat = "triangular"
			}
			radius := r.SpacingRadiusFt()
			reading := fmt.Sprintf("%s spacing %.0f ft", lat, r.MaxSpacingFt)
			if r.SpacingMeans == scenarios.SpacingRadius {
				reading = fmt.Sprintf("spacing %.0f ft read as the largest distance to a point", r.MaxSpacingFt)
			}
			f := farthest[z]
			rc := RuleCheck{Zone: zn.ID, Rule: "max spacing",
				Required: fmt.Sprintf("every spot of the zone within %.1f ft of a point (%s)", radius, reading),
				Met:      f.Site >= 0 && f.Dist <= radius+coverTol(radius), Source: r.Source}
			rc.setFarthest(f)
			if f.Site >= 0 && neighbour[z] > 0 {
				rc.Achieved += fmt.Sprintf("; neighbouring points at most %.1f ft apart", neighbour[z])
				rc.NeighbourFt = round(neighbour[z], 3)
			}
			out = append(out, rc)
		}
		if r := pr.ImpliedRadiusFt[z]; r > 0 {
			f := farthest[z]
			rc := RuleCheck{Zone: zn.ID, Rule: "spread (implied)",
				Required: fmt.Sprintf("every spot of the zone within %.1f ft of a point (√(area / %d points); spread: false turns it off)", r, pr.ZoneMin[z]),
				Met:      f.Site >= 0 && f.Dist <= r+coverTol(r),
				Origin:   "computed: √(zone area / points required), so a count rule's points are spread (our choice of slack)"}
			rc.setFarthest(f)
			out = append(out, rc)
		}
		if n := pr.ZoneMin[z]; n > 0 {
			out = append(out, RuleCheck{Zone: zn.ID, Rule: "minimum points",
				Required: fmt.Sprintf("≥ %d", n), Achieved: fmt.Sprintf("%d", count[z]), Met: count[z] >= n, Source: r.Source})
		}
		if r.MinDepthFt > 0 {
			out = append(out, RuleCheck{Zone: zn.ID, Rule: "minimum depth",
				Required: fmt.Sprintf("≥ %.1f ft", r.MinDepthFt), Achieved: fmt.Sprintf("%.1f ft", minDepth[z]), Met: count[z] == 0 || minDepth[z] >= r.MinDepthFt-1e-9, Source: r.Source})
		}
		if r.SampledShare > 0 {
			share := 0.0
			if count[z] > 0 {
				share = float64(sampled[z]) / float64(count[z])
			}
			out = append(out, RuleCheck{Zone: zn.ID, Rule: "sampled share",
				Required: fmt.Sprintf("≥ %.0f%%", 100*r.SampledShare), Achieved: fmt.Sprintf("%.0f%% (%d of %d)", 100*share, sampled[z], count[z]),
				Met: share >= r.SampledShare-1e-9, Source: r.Source})
		}
	}
	for i := range out {
		zn := sc.Zones[zoneIndex(sc.Zones, out[i].Zone)]
		o := zn.Rules.Origins
		switch out[i].Rule {
		case "max spacing":
			out[i].Origin = o["max_spacing"]
		case "minimum points":
			out[i].Origin = o["min_points"]
			if zn.Rules.AreaPerPointFt2 > 0 && pr.ZoneMin[zoneIndex(sc.Zones, out[i].Zone)] > zn.Rules.MinPoints {
				out[i].Origin = o["area_per_point"]
			}
		case "minimum depth":
			out[i].Origin = o["min_depth"]
		case "sampled share":
			out[i].Origin = o["sampled_share"]
		}
	}
	return out
}

// setFarthest writes a spacing check's achieved side from the exact
// farthest ground of its zone.
func (rc *RuleCheck) setFarthest(f geom.Spot) {
	if f.Site < 0 {
		rc.Achieved = "no point in the zone"
		return
	}
	rc.Achieved = fmt.Sprintf("farthest ground %.1f ft from a point, at %s", f.Dist, spotText(f.At))
	rc.FarthestFt = round(f.Dist, 3)
	rc.FarthestAt = &XY{XFt: round(f.At.X, 1), YFt: round(f.At.Y, 1)}
}

func zoneIndex(zs []scenarios.Zone, id string) int {
	for i, z := range zs {
		if z.ID == id {
			return i
		}
	}
	return -1
}

// shallowBuildingWarnings flags a structure zone whose stated depth is
// under the shallow end of the least depth common practice gives buildings
// (about 20–25 ft or to refusal; rules.BuildingMinDepthLowFt), unless known
// rock comes first. Depths worked out from stories or a footing already
// carry the 25 ft minimum.
func shallowBuildingWarnings(sc *scenarios.Scenario) []string {
	var w []string
	for _, zn := range sc.Zones {
		d := zn.Rules.MinDepthFt
		if zn.Use != scenarios.UseStructure || d >= rules.BuildingMinDepthLowFt || (zn.Ground.RockFt > 0 && zn.Ground.RockFt <= d) {
			continue
		}
		w = append(w, fmt.Sprintf("zone %s: a structure explored %.1f ft deep, under the least depth common practice gives buildings (about %g–%g ft, or to refusal); the scenario's min_depth governs", zn.ID, d, rules.BuildingMinDepthLowFt, rules.BuildingMinDepthFt))
	}
	return w
}

// pitWarnings flags the excavation safety requirements a test pit of a
// given depth carries (OSHA 29 CFR 1926 Subpart P).
func pitWarnings(id string, depthFt float64) []string {
	var w []string
	if depthFt >= 4 {
		w = append(w, fmt.Sprintf("%s: test pit %.1f ft deep — a safe means of egress is required within 25 ft of lateral travel (29 CFR 1926.651(c)(2))", id, depthFt))
	}
	if depthFt >= 5 {
		w = append(w, fmt.Sprintf("%s: test pit %.1f ft deep — no entry without a protective system (sloping, benching or shoring) unless in stable rock (29 CFR 1926.652(a)(1))", id, depthFt))
	}
	if depthFt > 20 {
		w = append(w, fmt.Sprintf("%s: test pit %.1f ft deep — protective system must be designed by a registered professional engineer (29 CFR 1926 Subpart P)", id, depthFt))
	}
	return w
}

func round(v float64, places int) float64 {
	s := math.Pow(10, float64(places))
	r := math.Round(v*s) / s
	if r == 0 {
		return 0 // no negative zero in output
	}
	return r
}

// excluded lists, zone by zone, the method and rig pairs the zone allows but
// the rig cannot do there, with the rig's reason.
func (pr *Prepared) excluded() []Excluded {
	out := []Excluded{}
	for z, zn := range pr.In.Scenario.Zones {
		for _, rd := range pr.Rigs {
			if rd.unit > 1 {
				continue // a further crew answers as its rig
			}
			for _, m := range zoneMethods(zn, rd.info) {
				if p, ok := rd.profiles[profileKey{z, m}]; ok && !p.answer.Feasible {
					out = append(out, Excluded{Zone: zn.ID, Method: string(m), Rig: rd.name, Reason: p.answer.Reason})
				}
			}
		}
	}
	return out
}

// planCautions picks the cautions that fit the plan's points and the
// scenario's zones.
func planCautions(sc *scenarios.Scenario, pts []Point) []string {
	pits, env := false, false
	for _, pt := range pts {
		pits = pits || pt.Method == string(sdk.TestPit)
	}
	for _, z := range sc.Zones {
		env = env || z.Use == scenarios.UseEnvironmental
	}
	return CautionsFor(pits, env)
}
