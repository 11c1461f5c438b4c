package tradeoff

import (
	"context"
	"errors"
	"fmt"
	"math"
	"sort"
	"sync"
	"time"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/plan"
)

// Defaults for Settings fields left at zero.
const (
	// DefaultGapRel: each trade-off solve stops within 0.5 % of the
	// proven bound. Trade-off figures compare plans that differ by
	// several percent; proving each to 0.01 % would cost minutes.
	DefaultGapRel = 0.005
	// DefaultNodeLimit bounds each solve's branch-and-bound nodes.
	DefaultNodeLimit = 400
	// DefaultFrontierPoints: at most this many day limits are swept.
	DefaultFrontierPoints = 12
	// DefaultBudgetPoints: budgets swept on the coverage curve.
	DefaultBudgetPoints = 8
	// DefaultFeatureDiameterFt is the buried feature the chance of a miss
	// is computed for when none is given: a 20 ft soft pocket or tank
	// (our choice of example size).
	DefaultFeatureDiameterFt = 20
	// DefaultBudgetShare: with no budget stated, the "most coverage"
	// alternative is given three quarters of the cheapest plan's cost
	// (our choice, to show what a cut of a quarter buys).
	DefaultBudgetShare = 0.75
	// DefaultTimeLimit is a safety net on each solve, far above what the
	// node limit takes on the demos; a solve that reaches it says so in
	// its status ("time limit"), and only then may the output depend on
	// the machine.
	DefaultTimeLimit = 60 * time.Second
	// DefaultWorkers: independent solves run two at a time (one per core
	// of the reference machine); results do not depend on the order.
	DefaultWorkers = 2
)

// Settings steer every solve of an analysis.
type Settings struct {
	GapRel    float64 // relative gap each solve stops at; 0: DefaultGapRel
	NodeLimit int     // nodes per solve; 0: DefaultNodeLimit, <0: none
	Workers   int     // solves run at once; 0: DefaultWorkers
	// TimeLimit per solve; 0: DefaultTimeLimit, <0: none.
	TimeLimit time.Duration
}

func (s Settings) withDefaults() Settings {
	if s.GapRel <= 0 {
		s.GapRel = DefaultGapRel
	}
	if s.NodeLimit == 0 {
		s.NodeLimit = DefaultNodeLimit
	}
	if s.NodeLimit < 0 {
		s.NodeLimit = 0
	}
	if s.Workers <= 0 {
		s.Workers = DefaultWorkers
	}
	if s.TimeLimit == 0 {
		s.TimeLimit = DefaultTimeLimit
	}
	if s.TimeLimit < 0 {
		s.TimeLimit = 0
	}
	return s
}

func (s Settings) mip() mip.Options {
	return mip.Options{GapRel: s.GapRel, NodeLimit: s.NodeLimit, TimeLimit: s.TimeLimit}
}

// Summary is one plan in the trade-off tables.
type Summary struct {
	Label  string `json:"label"`
	Note   string `json:"note,omitempty"`
	Status string `json:"status"` // solver status; "no plan" when none was found
	// Feasible is false when no plan was found within the limits.
	Feasible bool `json:"feasible"`
	// TotalCost is the plan's itemized estimate total.
	TotalCost float64 `json:"total_cost"`
	// PricedCost is the cost the model prices and the solver minimizes
	// (Σ option costs + mobilizations + day costs). Budgets, savings and
	// the frontier's ordering use it; the estimate may differ where the
	// plan prices items outside the model.
	PricedCost     float64        `json:"priced_cost"`
	FieldDays      int            `json:"field_days"`
	RigsMobilized  int            `json:"rigs_mobilized"`
	Rigs           []string       `json:"rigs"`
	Points         int            `json:"points"`
	PointsByMethod map[string]int `json:"points_by_method"`
	// AreaCoveredPct is the share of the ground under spacing rules within
	// the covering radius of a chosen point (plan.Coverage).
	AreaCoveredPct float64 `json:"area_covered_percent"`
	// WeightedCoveredPct weighs each cell by its zone's priority and counts
	// only ground some allowed point can reach (the budget curve's measure).
	WeightedCoveredPct float64 `json:"weighted_covered_percent"`
	// LargestGapFt is the exact farthest ground of any ruled zone from
	// the nearest chosen point of the zone; nil when a zone under a
	// spacing rule has no point at all (GapNote names it).
	LargestGapFt  *float64   `json:"largest_gap_ft"`
	GapNote       string     `json:"largest_gap_note,omitempty"`
	RulesMet      int        `json:"rules_met"`
	RulesTotal    int        `json:"rules_total"`
	OptimalityGap float64    `json:"optimality_gap"`
	Miss          []ZoneMiss `json:"miss_chance"`
	RateBook      string     `json:"rate_book"`

	plan *plan.Plan
}

// Plan is the assembled plan behind the summary (nil when none was found).
func (s *Summary) Plan() *plan.Plan { return s.plan }

// ZoneMiss is the chance the plan's points in one zone miss a buried
// feature.
type ZoneMiss struct {
	Zone              string  `json:"zone"`
	Points            int     `json:"points"`
	FeatureDiameterFt float64 `json:"feature_diameter_ft"`
	Hit
	MissProbability float64 `json:"miss_probability"`
}

// variant copies a prepared plan with an edited spec and rebuilds its model.
// The edit must replace, not modify in place, any slice it changes: the
// copy shares them with pr.
func variant(pr *plan.Prepared, edit func(*model.Spec)) (*plan.Prepared, error) {
	sp := *pr.Spec
	edit(&sp)
	m, err := model.Build(&sp)
	if err != nil {
		return nil, err
	}
	cp := *pr
	cp.Spec, cp.Model = &sp, m
	return &cp, nil
}

// outcome is one solve and what it gave.
type outcome struct {
	pr  *plan.Prepared
	res *mip.Result
	sum Summary
}

// solveVariant solves a prepared plan's model and summarizes the result.
func solveVariant(ctx context.Context, pr *plan.Prepared, st Settings, featureFt float64, label string) (*outcome, error) {
	return solveWith(ctx, pr, st.mip(), featureFt, label)
}

// solveCheapest solves a prepared plan's own (least-cost) model. On a
// large site it starts, as plan.Prepared.Solve does, from the plan over
// each zone's least cover: the search alone finds good plans late there,
// and that start is usually within the gap of the root bound.
func solveCheapest(ctx context.Context, pr *plan.Prepared, st Settings, featureFt float64, label string) (*outcome, error) {
	opt := st.mip()
	if pr.Model.Problem.LP.NumCols >= localMinCols {
		opt.Start = pr.BestStart(ctx, st.GapRel, opt.TimeLimit/3)
	}
	return solveWith(ctx, pr, opt, featureFt, label)
}

// solveWith is solveVariant with the engine options given.
func solveWith(ctx context.Context, pr *plan.Prepared, opt mip.Options, featureFt float64, label string) (*outcome, error) {
	pr, res, _, err := pr.SolveCovered(ctx, opt)
	if err != nil {
		return nil, err
	}
	o := &outcome{pr: pr, res: res}
	o.sum, err = summarize(pr, res, featureFt, label)
	if err != nil {
		return nil, err
	}
	return o, nil
}

// summarize assembles the plan and fills the table columns.
func summarize(pr *plan.Prepared, res *mip.Result, featureFt float64, label string) (Summary, error) {
	s := Summary{Label: label, Status: res.Status.String(), RateBook: pr.In.RateBook.Name, PointsByMethod: map[string]int{}, Rigs: []string{}}
	if res.X == nil {
		s.Status = "no plan (" + res.Status.String() + ")"
		return s, nil
	}
	p, err := pr.Assemble(res)
	if err != nil {
		return s, err
	}
	s.plan = p
	s.Feasible = true
	s.TotalCost = p.Total
	s.PricedCost = roundTo(pr.Model.Decode(res.X).Cost, 2)
	s.FieldDays = p.Finish
	s.OptimalityGap = roundTo(res.Gap, 6)
	for _, r := range p.Rigs {
		if r.Mobilized {
			s.RigsMobilized++
			s.Rigs = append(s.Rigs, r.Name)
		}
	}
	for _, pt := range p.Points {
		s.PointsByMethod[pt.Method]++
	}
	s.Points = len(p.Points)
	s.AreaCoveredPct = p.Coverage.CoveredPercent
	for _, r := range p.Rules {
		s.RulesTotal++
		if r.Met {
			s.RulesMet++
		}
	}
	chosen := chosenPoints(pr, res)
	s.WeightedCoveredPct = roundTo(weightedCovered(pr, chosen), 2)
	s.LargestGapFt, s.GapNote = largestGap(pr, chosen)
	s.Miss = missByZone(pr, chosen, featureFt)
	return s, nil
}

// chosenPoints marks the candidates the solution explores.
func chosenPoints(pr *plan.Prepared, res *mip.Result) []bool {
	sol := pr.Model.Decode(res.X)
	chosen := make([]bool, len(pr.Layout.Candidates))
	for _, o := range sol.Chosen {
		chosen[pr.Spec.Options[o].Point] = true
	}
	return chosen
}

// weightedCovered is the priority-weighted share, in percent, of the
// coverage cells within the covering radius of a chosen point.
func weightedCovered(pr *plan.Prepared, chosen []bool) float64 {
	var all, got float64
	for _, c := range pr.Layout.Cells {
		w := c.Weight
		if w == 0 {
			w = 1
		}
		all += w * c.AreaFt2
		for _, q := range c.CoveredBy {
			if chosen[q] {
				got += w * c.AreaFt2
				break
			}
		}
	}
	if all == 0 {
		return 100
	}
	return 100 * got / all
}

// largestGap is the exact farthest ground of any zone under a spacing rule
// (or an implied one) from the zone's nearest chosen point
// (plan.Prepared.ExactReach).
func largestGap(pr *plan.Prepared, chosen []bool) (*float64, string) {
	zones := pr.In.Scenario.Zones
	worst := 0.0
	var empty []string
	for z, s := range pr.ExactReach(chosen) {
		if pr.Layout.RadiusFt[z] == 0 {
			continue
		}
		if s.Site < 0 || math.IsInf(s.Dist, 1) {
			empty = append(empty, zones[z].ID)
			continue
		}
		worst = math.Max(worst, s.Dist)
	}
	if len(empty) > 0 {
		return nil, fmt.Sprintf("no point in zone %s", joinComma(empty))
	}
	w := roundTo(worst, 1)
	return &w, ""
}

// missByZone computes, zone by zone, the chance the plan's points miss a
// buried feature of the given diameter.
func missByZone(pr *plan.Prepared, chosen []bool, featureFt float64) []ZoneMiss {
	zones := pr.In.Scenario.Zones
	pts := make([][]geom.Point, len(zones))
	for q, c := range pr.Layout.Candidates {
		if chosen[q] {
			pts[c.Zone] = append(pts[c.Zone], c.P)
		}
	}
	out := make([]ZoneMiss, len(zones))
	for z, zn := range zones {
		h := HitProbability(zn.Polygon, pts[z], featureFt)
		h.Probability = roundTo(h.Probability, 4)
		h.ErrorEstimate = roundTo(h.ErrorEstimate, 5)
		out[z] = ZoneMiss{Zone: zn.ID, Points: len(pts[z]), FeatureDiameterFt: featureFt, Hit: h, MissProbability: roundTo(1-h.Probability, 4)}
	}
	return out
}

// runAll runs jobs on st.Workers goroutines and returns their results in
// job order; the first error (in job order) is returned.
func runAll[T any](ctx context.Context, workers int, jobs []func(context.Context) (T, error)) ([]T, error) {
	out := make([]T, len(jobs))
	errs := make([]error, len(jobs))
	next := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				out[i], errs[i] = jobs[i](ctx)
			}
		}()
	}
	for i := range jobs {
		next <- i
	}
	close(next)
	wg.Wait()
	return out, errors.Join(errs...)
}

func roundTo(v float64, places int) float64 {
	s := math.Pow(10, float64(places))
	r := math.Round(v*s) / s
	if r == 0 {
		return 0
	}
	return r
}

func joinComma(xs []string) string {
	sort.Strings(xs)
	out := ""
	for i, x := range xs {
		if i > 0 {
			out += ", "
		}
		out += x
	}
	return out
}
