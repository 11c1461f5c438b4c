package plan

import (
	"context"
	"errors"
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"
	"time"

	"github.com/rigmix/rigmix/optimizer/candidates"
	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// Input is everything a plan is made from, as plain data and interfaces.
type Input struct {
	Scenario *scenarios.Scenario
	RateBook *ratebooks.RateBook
	// Rigs are the rigs that can be hired, keyed by the name each gives in
	// Describe. The scenario's rig list selects among them.
	Rigs map[string]sdk.Rig
}

// Options steer the solve.
type Options struct {
	GapRel    float64 // 0: the scenario's setting
	TimeLimit float64 // seconds; 0: the scenario's setting
	Threads   int
	Progress  func(mip.Progress)
	Budget    float64 // 0: none
	MaxDays   float64 // 0: none
}

// InputError is a problem with the inputs that the user can fix; the CLI
// exits with code 2 for it.
type InputError struct{ Msg string }

func (e *InputError) Error() string { return e.Msg }

// BadInput marks the error as the user's to fix.
func (e *InputError) BadInput() bool { return true }

func inputErrorf(format string, a ...any) error {
	return &InputError{Msg: fmt.Sprintf(format, a...)}
}

// DefaultDepthFt is the depth used for a method when a zone gives no depth
// rule. These are common practice for a first look, not a published rule.
var DefaultDepthFt = map[sdk.Method]float64{
	sdk.Boring:  20, // common practice
	sdk.CPT:     20, // common practice
	sdk.TestPit: 8,  // common practice
	sdk.Probe:   4,  // common practice
}

// allMethods lists the methods in a fixed order.
var allMethods = []sdk.Method{sdk.Boring, sdk.CPT, sdk.TestPit, sdk.Probe}

// Prepared is the pipeline up to the model: the candidates, the priced
// options and the model itself. Trade-off analyses re-solve it many times.
type Prepared struct {
	In      Input
	Layout  *candidates.Layout
	Rigs    []rigData
	Options []optionData // one per model option
	Spec    *model.Spec
	Model   *model.Model
	ZoneMin []int // points each zone's count rules ask for
	// CoverMin is, per zone, a proven lower bound on the number of points
	// that can meet its spacing rule (the zone's covering number when the
	// subproblem is solved to optimality). See coverNumbers.
	CoverMin []int
	// CoverSets is, per zone, the points of the least cover found while
	// computing CoverMin (nil when the zone has no spacing rule or none
	// was found); the start solution is built from it.
	CoverSets [][]int
	// reqHow fixes the method or rig of required candidates.
	reqHow map[int]scenarios.PointHow
	// ImpliedRadiusFt is, per zone, the covering radius a count rule
	// implies where no spacing rule is given (0: none; see ImpliedRadius).
	ImpliedRadiusFt []float64
	// Rounds reports the row generation of the last Solve (see exact.go).
	Rounds CoverageRounds
	pool   *pooling
	// handGrids are the hand-laid grids, offered as candidates; hand is
	// the baseline laid from them (baseline.go).
	handGrids [][]geom.Point
	hand      *handBase
	// Timings records how long each stage took (wall time; kept out of
	// the plan so the plan stays the same from run to run).
	Timings Timings
	// rigWarnings flag rig answers that pass the contract but look wrong
	// (sdk.Implausible), in rig and site order; Assemble adds them to the
	// plan's warnings.
	rigWarnings []string
}

// Timings lists stage durations in the order the stages ran.
type Timings []Timing

// Timing is one stage's wall time.
type Timing struct {
	Stage string
	Took  time.Duration
}

func (t *Timings) add(stage string, since time.Time) {
	*t = append(*t, Timing{stage, time.Since(since)})
}

type rigData struct {
	name     string // the rig's name; a further crew's is "name#k"
	unit     int    // crew number, from 1
	rig      sdk.Rig
	info     sdk.RigInfo
	mob      sdk.MobilizeResponse
	mobCost  float64
	dayCost  float64
	profiles map[profileKey]profile
}

type profileKey struct {
	zone   int
	method sdk.Method
}

type profile struct {
	answer  sdk.Answer     // quantities kept to the thousandth (roundQuantities)
	lab     lab.Counts     // samples the point recovers, by kind
	labQ    []sdk.Quantity // the point's expected share of the lab program
	onHours float64        // hours on the point, to the hundredth
	move    float64        // hours to move to a point in this zone, to the hundredth
	cost    float64        // the point's whole priced cost, lab share included
	direct  float64        // the part of cost in whole cents (not pooled)
	uses    []model.Use    // pooled items
}

type optionData struct {
	point  int
	zone   int
	method sdk.Method
	rig    int
	depth  float64
	prof   profile
}

// Prepare runs the pipeline up to the built model.
func Prepare(ctx context.Context, in Input, opt Options) (*Prepared, error) {
	sc := in.Scenario
	if sc == nil || in.RateBook == nil {
		panic("plan: Prepare needs a scenario and a rate book")
	}
	pr := &Prepared{In: in}

	// Rigs offered, in the scenario's order.
	for _, name := range sc.Rigs {
		r, ok := in.Rigs[name]
		if !ok {
			known := make([]string, 0, len(in.Rigs))
			for k := range in.Rigs {
				known = append(known, k)
			}
			sort.Strings(known)
			return nil, inputErrorf("%s: rigs: rig %q is not available (available: %s)", sc.Source, name, strings.Join(known, ", "))
		}
		info, err := r.Describe(ctx)
		if err != nil {
			return nil, err // the host names the rig and the call
		}
		pr.Rigs = append(pr.Rigs, rigData{name: name, unit: 1, rig: r, info: info, profiles: map[profileKey]profile{}})
	}

	// Counting rules: points each zone's count and area rules ask for.
	pr.ZoneMin = make([]int, len(sc.Zones))
	for z, zn := range sc.Zones {
		n := zn.Rules.MinPoints
		if zn.Rules.AreaPerPointFt2 > 0 {
			if k := int(math.Ceil(zn.Polygon.Area()/zn.Rules.AreaPerPointFt2 - 1e-9)); k > n {
				n = k
			}
		}
		pr.ZoneMin[z] = n
	}

	// Candidates and coverage.
	zin := make([]candidates.ZoneInput, len(sc.Zones))
	pr.ImpliedRadiusFt = make([]float64, len(sc.Zones))
	for z, zn := range sc.Zones {
		cand := 0.0
		spacing, lattice := zn.Rules.MaxSpacingFt, string(zn.Rules.Lattice)
		if zn.Rules.SpacingMeans == scenarios.SpacingRadius && spacing > 0 {
			// The radius itself: a square pattern of spacing r·√2 has it.
			spacing, lattice = zn.Rules.SpacingRadiusFt()*math.Sqrt2, string(scenarios.Square)
		}
		if spacing == 0 && zn.Rules.AreaPerPointFt2 > 0 {
			// No spacing rule: lay candidates at half the spacing of a
			// square grid with one point per the rule's area.
			cand = 0.5 * math.Sqrt(zn.Rules.AreaPerPointFt2)
		}
		// A count rule spreads its points (see ImpliedRadius), unless they
		// are so many that their candidates would be closer than the
		// plan's minimum separation: then there is nothing to spread.
		if r := ImpliedRadius(zn.Polygon.Area(), pr.ZoneMin[z]); spacing == 0 && r > 0 && !zn.Rules.NoSpread && 0.25*r*math.Sqrt2 >= sc.MinSeparationFt {
			pr.ImpliedRadiusFt[z] = r
			spacing, lattice = r*math.Sqrt2, string(scenarios.Square)
			// A quarter of the spacing: with few points each one's place
			// matters, and half the spacing can leave no pair of
			// candidates that meets the radius on a small zone.
			if cand == 0 || cand > 0.25*spacing {
				cand = 0.25 * spacing
			}
		}
		zin[z] = candidates.ZoneInput{
			ID: zn.ID, Polygon: zn.Polygon,
			SpacingFt: spacing, Lattice: lattice,
			CandidateSpacingFt: cand,
			Corners:            zn.Rules.Corners, Required: zn.Rules.RequiredPoints,
			Weight: zn.Priority,
			Extra:  handGrid(zn),
		}
		pr.handGrids = append(pr.handGrids, zin[z].Extra)
	}
	if err := checkSize(sc); err != nil {
		return nil, err
	}
	nogo := make([]geom.Polygon, len(sc.NoGo))
	for i, ng := range sc.NoGo {
		nogo[i] = ng.Polygon
	}
	t0 := time.Now()
	lay, err := candidates.Generate(zin, nogo, candidates.Options{})
	pr.Timings.add("candidates and coverage cells", t0)
	if err != nil {
		return nil, inputErrorf("%s: %v", sc.Source, err)
	}
	pr.Layout = lay
	// Required points that fix their method or rig, by candidate.
	pr.reqHow = map[int]scenarios.PointHow{}
	for q, c := range lay.Candidates {
		if !c.Required {
			continue
		}
		r := sc.Zones[c.Zone].Rules
		for k, pt := range r.RequiredPoints {
			if k < len(r.RequiredHow) && pt == c.P && (r.RequiredHow[k] != scenarios.PointHow{}) {
				how := r.RequiredHow[k]
				if how.Rig != "" && !slices.Contains(sc.Rigs, how.Rig) {
					return nil, inputErrorf("%s: zones[%d].rules.required_points[%d].rig: %q is not offered (rigs: %s); offer it or name one of those",
						sc.Source, c.Zone, k, how.Rig, strings.Join(sc.Rigs, ", "))
				}
				pr.reqHow[q] = how
			}
		}
	}

	// One batched question per rig: every distinct (zone, method) site.
	t0 = time.Now()
	for ri := range pr.Rigs {
		rd := &pr.Rigs[ri]
		var sites []sdk.Site
		var keys []profileKey
		var legs []sdk.MoveLeg
		for z, zn := range sc.Zones {
			for _, m := range zoneMethods(zn, rd.info) {
				keys = append(keys, profileKey{z, m})
				sites = append(sites, sdk.Site{
					ID: fmt.Sprintf("%s/%s", zn.ID, m), Method: m,
					DepthFt:          depthFor(zn, m),
					SampleIntervalFt: zn.Rules.SampleIntervalFt,
					SampleSchedule:   zn.Rules.SampleSchedule,
					Surface:          zn.Ground.Surface, SlopePct: zn.Ground.SlopePct,
					OverheadFt: zn.Ground.OverheadFt, GroundwaterFt: zn.Ground.GroundwaterFt,
					RockFt:        zn.Ground.RockFt,
					Environmental: zn.Use == scenarios.UseEnvironmental,
				})
				legs = append(legs, sdk.MoveLeg{DistanceFt: moveDistanceFt(zn), Surface: zn.Ground.Surface, SlopePct: zn.Ground.SlopePct})
			}
		}
		if len(sites) == 0 {
			continue
		}
		ans, err := rd.rig.Assess(ctx, sdk.AssessRequest{Sites: sites})
		if err != nil {
			return nil, err // the host names the rig and the call
		}
		if len(ans.Answers) != len(sites) {
			return nil, fmt.Errorf("rig %q: assess: %d answers for %d sites", rd.name, len(ans.Answers), len(sites))
		}
		if err := sdk.CheckAgainstInfo(rd.info, sdk.AssessRequest{Sites: sites}, ans); err != nil {
			return nil, fmt.Errorf("rig %q: assess: %w", rd.name, err)
		}
		for _, a := range ans.Answers {
			if why := sdk.Implausible(a); why != "" {
				pr.rigWarnings = append(pr.rigWarnings, fmt.Sprintf("rig %q at %s: %s; check the rig plugin", rd.name, a.ID, why))
			}
		}
		mv, err := rd.rig.Moves(ctx, sdk.MovesRequest{Legs: legs})
		if err != nil {
			return nil, err // the host names the rig and the call
		}
		if len(mv.Hours) != len(legs) {
			return nil, fmt.Errorf("rig %q: moves: %d answers for %d legs", rd.name, len(mv.Hours), len(legs))
		}
		for k, a := range ans.Answers {
			prog, err := labProgram(sc, keys[k].zone)
			if err != nil {
				return nil, inputErrorf("%s: zones[%d].purpose: %v", sc.Source, keys[k].zone, err)
			}
			var counts lab.Counts
			if a.Feasible {
				// The zone's lab program may add samples the rig does not
				// report: bulk samples for compaction and permeability,
				// tubes between the SPT samples in soft ground (priced as
				// the rate book's tube-sample).
				var extra []sdk.Quantity
				m := sites[k].Method
				counts, extra = prog.Derived(samplesOf(a.Quantities, sites[k]), m.Sampled(), m == sdk.Boring)
				if len(extra) > 0 {
					a.Quantities = append(append([]sdk.Quantity(nil), a.Quantities...), extra...)
				}
			}
			a.Quantities = roundQuantities(a.Quantities)
			p := profile{answer: a, onHours: round(a.Hours.Total(), hourPlaces), move: round(mv.Hours[k], hourPlaces)}
			if a.Feasible {
				c, err := price(in.RateBook, a.Quantities, rd.name)
				if err != nil {
					return nil, err
				}
				// Each point carries its expected share of the lab
				// program on the samples it recovers (linear, so the
				// model can weigh a sampled boring against a sounding).
				p.lab = counts
				labQ, err := prog.Expected(p.lab)
				if err != nil {
					return nil, inputErrorf("%s: lab: %v", sc.Source, err)
				}
				lc, err := price(in.RateBook, labQ, "lab program")
				if err != nil {
					return nil, err
				}
				p.cost = c + lc
				p.labQ = labQ
			}
			rd.profiles[keys[k]] = p
		}
		rd.mob, err = rd.rig.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: sc.YardMiles})
		if err != nil {
			return nil, err // the host names the rig and the call
		}
		rd.mob.Quantities = roundQuantities(rd.mob.Quantities)
		rd.mob.Hours = round(rd.mob.Hours, hourPlaces)
		rd.info.DayItems = roundQuantities(rd.info.DayItems)
		if rd.mobCost, err = price(in.RateBook, rd.mob.Quantities, rd.name); err != nil {
			return nil, err
		}
		if rd.dayCost, err = price(in.RateBook, rd.info.DayItems, rd.name); err != nil {
			return nil, err
		}
	}

	pr.Timings.add("rig calls (one batch per rig)", t0)
	pr.Rigs = expandUnits(pr.Rigs, sc.RigUnits)
	pr.pool = pr.pooling()
	// Every zone needs at least one way to be explored.
	for z, zn := range sc.Zones {
		if err := zoneReachable(pr, z, zn); err != nil {
			return nil, err
		}
	}

	spec := &model.Spec{
		NumPoints:    len(lay.Candidates),
		PointZone:    make([]int, len(lay.Candidates)),
		Required:     make([]bool, len(lay.Candidates)),
		CoverRows:    lay.RowCells,
		HoursPerDay:  sc.HoursDay,
		StartUpHours: StartUpHours,
		Pooled:       pr.pool.items,
		DaysWeight:   0.01, // tie-break: among equally cheap plans, finish first
		Budget:       opt.Budget,
		MaxDays:      opt.MaxDays,
	}
	for p, c := range lay.Candidates {
		spec.PointZone[p] = c.Zone
		// A corner candidate exists only when the zone's rule asks for a
		// point at each corner (Rules.Corners), so it is required too.
		spec.Required[p] = c.Required || c.Corner
		pr.appendOptions(spec, p)
	}
	spec.Apart = apartPairs(lay.Candidates, sc.MinSeparationFt)
	// A required point whose method or rig no offered rig can do there.
	hasOption := make([]bool, len(lay.Candidates))
	for _, op := range spec.Options {
		hasOption[op.Point] = true
	}
	for q := range lay.Candidates {
		if how, ok := pr.reqHow[q]; ok && !hasOption[q] {
			c := lay.Candidates[q]
			zn := sc.Zones[c.Zone]
			k := slices.Index(zn.Rules.RequiredPoints, c.P)
			what := string(how.Method)
			if what == "" {
				what = "any method"
			}
			if how.Rig != "" {
				what += " by " + how.Rig
			}
			return nil, inputErrorf("%s: zones[%d].rules.required_points[%d]: %s cannot be done in zone %q (see the options the rigs ruled out with rigmix rigs); allow another method or rig for this point",
				sc.Source, c.Zone, k, what, zn.ID)
		}
	}
	t0 = time.Now()
	pr.CoverMin, pr.CoverSets, err = coverNumbers(ctx, pr, spec)
	pr.Timings.add("zone covering numbers", t0)
	if err != nil {
		return nil, err
	}
	for z, zn := range sc.Zones {
		n := pr.ZoneMin[z]
		spec.Zones = append(spec.Zones, model.Zone{Name: zn.Name, MinCount: max(n, pr.CoverMin[z]), SampledShare: zn.Rules.SampledShare})
	}
	for _, rd := range pr.Rigs {
		mob, mobUses := pr.pool.split(rd.mob.Quantities)
		day, dayUses := pr.pool.split(rd.info.DayItems)
		spec.Rigs = append(spec.Rigs, model.Rig{Name: rd.name, MobCost: mob, MobHours: rd.mob.Hours, DayCost: day, MobUses: mobUses, DayUses: dayUses, Unit: rd.unit})
	}
	if err := checkRoom(pr, spec); err != nil {
		return nil, err
	}
	t0 = time.Now()
	pr.Spec = spec
	spec.CoverRows = slices.Clone(spec.CoverRows)
	if err := pr.preloadRows(ctx); err != nil {
		return nil, err
	}
	pr.Timings.add("exact coverage of the zone covers", t0)
	t0 = time.Now()
	m, err := model.Build(spec)
	pr.Timings.add("model build", t0)
	if err != nil {
		if errors.Is(err, model.ErrNoOption) {
			return nil, inputErrorf("%s: %v", sc.Source, err)
		}
		return nil, err
	}
	pr.Spec, pr.Model = spec, m
	return pr, nil
}

// ImpliedRadius is the covering radius a zone of area a ft² with a rule of
// n points is held to when it has no spacing rule, so that its points are
// spread over it rather than bunched: √(a/n), the side of the square of
// ground each point stands for. A square grid of one point per a/n would
// leave √(a/n)/√2; the √2 of slack lets n points meet it on compact zones
// with room to follow their shape (our choice, not a published rule; on a
// long thin zone it can ask for more than n points, which is what spreading
// them along it takes). A scenario turns it off per zone with spread: false.
func ImpliedRadius(areaFt2 float64, n int) float64 {
	if n <= 0 || !(areaFt2 > 0) {
		return 0
	}
	return math.Sqrt(areaFt2 / float64(n))
}

// apartPairs lists the candidate pairs closer than sep (both required
// excepted: the scenario asks for both), in index order.
func apartPairs(cands []candidates.Candidate, sep float64) [][2]int {
	if !(sep > 0) {
		return nil
	}
	pts := make([]geom.Point, len(cands))
	for i, c := range cands {
		pts[i] = c.P
	}
	g := geom.NewGrid(pts, sep)
	var out [][2]int
	var buf []int
	for p, c := range cands {
		buf = g.WithinSorted(c.P, sep*(1-1e-9), buf[:0])
		for _, q := range buf {
			if q > p && !(c.Required && cands[q].Required) {
				out = append(out, [2]int{p, q})
			}
		}
	}
	return out
}

// expandUnits lists, after each rig, its further crews (scenario
// rig_units): each is a rig of its own to the model — mobilized, priced on
// its own field days and scheduled on its own route — that answers as the
// rig does. Crews of one rig follow each other, so the model can order
// them (model.Rig.Unit).
func expandUnits(rigs []rigData, units map[string]int) []rigData {
	var out []rigData
	for _, rd := range rigs {
		out = append(out, rd)
		for k := 2; k <= units[rd.name]; k++ {
			c := rd
			c.name, c.unit = fmt.Sprintf("%s#%d", rd.name, k), k
			c.info.Title = fmt.Sprintf("%s (crew %d)", rd.info.Title, k)
			out = append(out, c)
		}
	}
	return out
}

// appendOptions adds candidate p's options — every method its zone allows
// with every rig that can do it there — to pr.Options and spec.Options.
func (pr *Prepared) appendOptions(spec *model.Spec, p int) {
	c := pr.Layout.Candidates[p]
	zn := pr.In.Scenario.Zones[c.Zone]
	how, fixed := pr.reqHow[p]
	for ri := range pr.Rigs {
		rd := &pr.Rigs[ri]
		if fixed && how.Rig != "" && how.Rig != rd.name {
			continue
		}
		for _, m := range allMethods {
			if fixed && how.Method != "" && how.Method != m {
				continue
			}
			prof, ok := rd.profiles[profileKey{c.Zone, m}]
			if !ok || !prof.answer.Feasible {
				continue
			}
			pr.Options = append(pr.Options, optionData{point: p, zone: c.Zone, method: m, rig: ri, depth: depthFor(zn, m), prof: prof})
			spec.Options = append(spec.Options, model.Option{
				Point: p, Rig: ri, Sampled: m.Sampled(),
				Cost: prof.direct, Uses: prof.uses, Hours: prof.onHours + prof.move,
				Label: fmt.Sprintf("%s_%s", m, rd.name),
			})
		}
	}
}

// BaseRig is the rig a crew's name stands for: "tire-drill#2" →
// "tire-drill" (rig names never hold "#").
func BaseRig(name string) string {
	if i := strings.IndexByte(name, '#'); i >= 0 {
		return name[:i]
	}
	return name
}

// pooling decides which items the model pools (see price.go) and splits
// every feasible profile's quantities.
func (pr *Prepared) pooling() *pooling {
	var qss [][]sdk.Quantity
	for _, rd := range pr.Rigs {
		for _, k := range sortedProfileKeys(rd.profiles) {
			if p := rd.profiles[k]; p.answer.Feasible {
				qss = append(qss, p.answer.Quantities, p.labQ)
			}
		}
		qss = append(qss, rd.mob.Quantities, rd.info.DayItems)
	}
	pl := newPooling(pr.In.RateBook, qss)
	for _, rd := range pr.Rigs {
		for k, p := range rd.profiles {
			if !p.answer.Feasible {
				continue
			}
			all := append(append([]sdk.Quantity(nil), p.answer.Quantities...), p.labQ...)
			p.direct, p.uses = pl.split(all)
			rd.profiles[k] = p
		}
	}
	return pl
}

func sortedProfileKeys(m map[profileKey]profile) []profileKey {
	ks := make([]profileKey, 0, len(m))
	for k := range m {
		ks = append(ks, k)
	}
	sort.Slice(ks, func(i, j int) bool {
		if ks[i].zone != ks[j].zone {
			return ks[i].zone < ks[j].zone
		}
		return ks[i].method < ks[j].method
	})
	return ks
}

// zoneMethods lists the methods a zone allows that a rig performs, in the
// fixed method order.
func zoneMethods(zn scenarios.Zone, info sdk.RigInfo) []sdk.Method {
	var out []sdk.Method
	for _, m := range allMethods {
		if len(zn.Rules.Methods) > 0 && !containsMethod(zn.Rules.Methods, m) {
			continue
		}
		for _, ml := range info.Methods {
			if ml.Method == m {
				out = append(out, m)
				break
			}
		}
	}
	return out
}

func containsMethod(ms []sdk.Method, m sdk.Method) bool {
	for _, x := range ms {
		if x == m {
			return true
		}
	}
	return false
}

// depthFor is the depth a point of the zone is explored to: the zone's
// minimum depth rounded up to a whole foot, as depths are bid and drilled
// (common practice; rounding up keeps the rule met), or the method's default
// when the zone has no depth rule.
func depthFor(zn scenarios.Zone, m sdk.Method) float64 {
	if zn.Rules.MinDepthFt > 0 {
		return math.Ceil(zn.Rules.MinDepthFt - 1e-6)
	}
	return DefaultDepthFt[m]
}

// moveDistanceFt is the typical move between neighbouring points of a zone:
// the rule spacing when there is one, else the side of the area per point.
func moveDistanceFt(zn scenarios.Zone) float64 {
	switch {
	case zn.Rules.MaxSpacingFt > 0:
		return zn.Rules.MaxSpacingFt
	case zn.Rules.AreaPerPointFt2 > 0:
		return math.Sqrt(zn.Rules.AreaPerPointFt2)
	}
	return math.Sqrt(zn.Polygon.Area()) / 2
}

// price multiplies quantities by unit prices; a quantity with no price is an
// error naming the item.
func price(rb *ratebooks.RateBook, qs []sdk.Quantity, rig string) (float64, error) {
	total := 0.0
	for _, q := range qs {
		it, ok := rb.Price(q.Item)
		if !ok {
			return 0, inputErrorf("%s: rate book %q has no price for item %q (%s), which rig %q reports; add it to the rate book's items", rb.Source, rb.Name, q.Item, q.Unit, rig)
		}
		if it.Unit != q.Unit {
			return 0, inputErrorf("%s: item %q is priced per %q but rig %q reports it in %q", rb.Source, q.Item, it.Unit, rig, q.Unit)
		}
		total += q.Amount * it.UnitPrice
	}
	return total, nil
}

// zoneReachable explains, when no offered rig can explore a zone, why each
// one cannot.
func zoneReachable(pr *Prepared, z int, zn scenarios.Zone) error {
	var why []string
	for _, rd := range pr.Rigs {
		ms := zoneMethods(zn, rd.info)
		if len(ms) == 0 {
			why = append(why, fmt.Sprintf("%s performs none of the methods allowed", rd.name))
			continue
		}
		for _, m := range ms {
			p := rd.profiles[profileKey{z, m}]
			if p.answer.Feasible {
				return nil
			}
			why = append(why, fmt.Sprintf("%s (%s): %s", rd.name, m, p.answer.Reason))
		}
	}
	if len(pr.Rigs) == 0 {
		why = append(why, "no rigs are offered")
	}
	return inputErrorf("%s: zones[%d]: zone %q cannot be explored by any offered rig: %s%s", pr.In.Scenario.Source, z, zn.ID, strings.Join(why, "; "), relaxations(pr, zn))
}

// relaxations suggests the nearest changes that would let an offered rig
// explore a zone, from the rigs' own stated limits: a depth they reach, the
// ground they work on, the slope they climb, the clearance they need.
func relaxations(pr *Prepared, zn scenarios.Zone) string {
	var deepest, steepest, lowest float64
	lowest = math.Inf(1)
	surfaceOK, methodOK := false, false
	for _, rd := range pr.Rigs {
		for _, m := range zoneMethods(zn, rd.info) {
			methodOK = true
			for _, ml := range rd.info.Methods {
				if ml.Method == m {
					deepest = math.Max(deepest, ml.MaxDepthFt)
				}
			}
		}
		for _, s := range rd.info.Access.Surfaces {
			surfaceOK = surfaceOK || s == zn.Ground.Surface
		}
		steepest = math.Max(steepest, rd.info.Access.MaxSlopePct)
		lowest = math.Min(lowest, rd.info.Access.MinOverheadFt)
	}
	var s []string
	if !methodOK {
		s = append(s, "allow another method in rules.methods, or offer a rig that performs one of those allowed")
	}
	if methodOK && zn.Rules.MinDepthFt > deepest {
		s = append(s, fmt.Sprintf("lower rules.min_depth to at most %.0f ft (the deepest an offered rig reaches with an allowed method)", deepest))
	}
	if !surfaceOK {
		s = append(s, fmt.Sprintf("offer a rig that works on %s ground (see `rigmix rigs`)", zn.Ground.Surface))
	}
	if zn.Ground.SlopePct > steepest {
		s = append(s, fmt.Sprintf("offer a rig that climbs %.0f %% slopes (the steepest offered climbs %.0f %%)", zn.Ground.SlopePct, steepest))
	}
	if zn.Ground.OverheadFt > 0 && zn.Ground.OverheadFt < lowest {
		s = append(s, fmt.Sprintf("offer a rig that works under %.0f ft of clearance (the lowest offered needs %.0f ft)", zn.Ground.OverheadFt, lowest))
	}
	if len(s) == 0 {
		return ""
	}
	return ". Nearest changes that would let a rig in: " + strings.Join(s, "; ")
}

// checkRoom reports a zone whose count or share rules no plan can meet: more
// points asked than allowed spots in the zone, or a sampled share with no
// sampling method possible.
func checkRoom(pr *Prepared, spec *model.Spec) error {
	sc := pr.In.Scenario
	room := make([]int, len(sc.Zones))
	sampled := make([]bool, len(sc.Zones))
	seen := make([]bool, spec.NumPoints)
	for _, op := range spec.Options {
		z := spec.PointZone[op.Point]
		if !seen[op.Point] {
			seen[op.Point] = true
			room[z]++
		}
		sampled[z] = sampled[z] || op.Sampled
	}
	for z, zn := range sc.Zones {
		if n := pr.ZoneMin[z]; n > room[z] {
			return inputErrorf("%s: zones[%d].rules.min_points: zone %q needs %d points but has room for %d at its candidate spacing (outside no-go areas, where an offered rig can work); lower min_points or raise area_per_point", sc.Source, z, zn.ID, n, room[z])
		}
		if zn.Rules.SampledShare > 0 && !sampled[z] && room[z] > 0 {
			return inputErrorf("%s: zones[%d].rules.sampled_share: zone %q asks for %.0f %% sampled points, but no allowed method and offered rig recovers samples there; allow boring or test_pit, or drop the share", sc.Source, z, zn.ID, 100*zn.Rules.SampledShare)
		}
	}
	return nil
}

// labProgram is the lab program of zone z: the scenario's own lab program
// when it gives one (it then applies to every zone), else the program of
// the zone's purposes (lab.ForPurposes).
func labProgram(sc *scenarios.Scenario, z int) (*lab.Program, error) {
	if sc.Lab != nil {
		return sc.Lab, nil
	}
	return lab.ForPurposes(sc.Zones[z].Purposes)
}

// samplesOf counts the samples a point recovers: the samples the rig's
// quantities report, by kind (lab.CountsFromQuantities), and for a test pit
// that reports no bag samples, those of the rule the built-in excavator
// follows (lab.PitBagSamples).
func samplesOf(qs []sdk.Quantity, s sdk.Site) lab.Counts {
	c := lab.CountsFromQuantities(qs)
	if s.Method == sdk.TestPit && c.Bag == 0 {
		c.Bag += float64(lab.PitBagSamples(s.DepthFt, s.SampleIntervalFt))
	}
	return c
}

// maxCellsPerZone bounds the coverage cells of one zone (cells are laid at a
// quarter of the spacing). A million cells is a zone some 250 times the
// spacing on a side — far past any real rule — and almost always a spacing
// given in the wrong unit; refusing it early beats minutes of work.
const maxCellsPerZone = 1_000_000

// checkSize refuses a spacing rule so fine for its zone that the model
// would be unworkably large, naming the zone's rule and the likely cause.
func checkSize(sc *scenarios.Scenario) error {
	for z, zn := range sc.Zones {
		s := zn.Rules.MaxSpacingFt
		if s <= 0 {
			continue
		}
		if cells := 16 * zn.Polygon.Area() / (s * s); cells > maxCellsPerZone {
			return inputErrorf("%s: zones[%d].rules.max_spacing: %g ft in zone %q (%.0f ft²) would need about %.0f coverage cells, more than %d; is the spacing in the file's unit (%s)?", sc.Source, z, s, zn.ID, zn.Polygon.Area(), cells, maxCellsPerZone, sc.Units)
		}
	}
	return nil
}
