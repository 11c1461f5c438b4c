package plan

import (
	"context"
	"fmt"
	"github.com/rigmix/rigmix/optimizer/geom"
	"math"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// oneCountCases are every demo (scenarios embeds them) and generated sites
// of 1 and 10 acres.
type namedInput struct {
	name string
	in   Input
}

func oneCountCases(t *testing.T) []namedInput {
	var cases []namedInput
	for _, n := range scenarios.Demos() {
		cases = append(cases, namedInput{n, demoInput(t, n)})
	}
	cases = append(cases, namedInput{"generated-1-acre", generatedInput(t, sitegen.Site(1, 1))},
		namedInput{"generated-10-acres", generatedInput(t, sitegen.Site(10, 1))},
		namedInput{"generated-10-acres-3-crews", withCrews(generatedInput(t, sitegen.Site(10, 1)), 3)})
	return cases
}

// withCrews allows up to n crews of every rig offered.
func withCrews(in Input, n int) Input {
	sc := *in.Scenario
	sc.RigUnits = map[string]int{}
	for _, r := range sc.Rigs {
		sc.RigUnits[r] = n
	}
	in.Scenario = &sc
	return in
}

// fastest is the least finish of a prepared plan's rules: the incumbent
// and the proven lower bound of the MinimizeDays form.
func fastest(t *testing.T, pr *Prepared) (int, int) {
	t.Helper()
	s := *pr.Spec
	s.MinimizeDays = true
	m, err := model.Build(&s)
	if err != nil {
		t.Fatal(err)
	}
	res, err := mip.Solve(context.Background(), m.Problem, mip.Options{NodeLimit: 2000})
	if err != nil || res.X == nil {
		t.Fatalf("fastest plan: %v (%v)", err, res.Status)
	}
	return m.Decode(res.X).Finish, int(math.Ceil(res.Bound - 1e-6))
}

// TestCrewsShortenTheFinish: on a generated site, allowing three crews of
// every rig finishes sooner than the proven least finish with one crew of
// each; and the cheapest plan with crews allowed costs no more than with
// one crew (a plan with one crew each is still a plan).
func TestCrewsShortenTheFinish(t *testing.T) {
	ctx := context.Background()
	one := generatedInput(t, sitegen.Site(10, 1))
	three := withCrews(generatedInput(t, sitegen.Site(10, 1)), 3)
	pr1, err := Prepare(ctx, one, Options{})
	if err != nil {
		t.Fatal(err)
	}
	pr3, err := Prepare(ctx, three, Options{})
	if err != nil {
		t.Fatal(err)
	}
	_, bound1 := fastest(t, pr1)
	got3, _ := fastest(t, pr3)
	if got3 >= bound1 {
		t.Errorf("with three crews the fastest plan takes %d days; with one crew no plan takes fewer than %d", got3, bound1)
	}
	t.Logf("fastest finish: one crew each ≥ %d days, three crews each %d days", bound1, got3)
}

// TestOnePriceOneDayCount: the optimized cost is the printed estimate's
// total to the cent, and the field days the plan promises are the days
// schedule.Build lays for the same plan — each found by its own route: the
// cost from the solver's columns (model.Decode) against the estimate's lines
// summed from the rate book; the days from the model's integer day columns
// against the scheduler laying every stretch into working days on a
// calendar.
func TestOnePriceOneDayCount(t *testing.T) {
	ctx := context.Background()
	for _, c := range oneCountCases(t) {
		name, in := c.name, c.in
		t.Run(name, func(t *testing.T) {
			pr, err := Prepare(ctx, in, Options{})
			if err != nil {
				t.Fatal(err)
			}
			res, err := pr.Solve(ctx, Options{})
			if err != nil {
				t.Fatal(err)
			}
			p, err := pr.Assemble(res)
			if err != nil {
				t.Fatal(err)
			}
			sol := pr.Model.Decode(res.X)
			if math.Abs(sol.Cost-p.Total) > 0.005 {
				t.Errorf("optimized cost %.4f, printed total %.2f", sol.Cost, p.Total)
			}
			sum := 0.0
			for _, l := range p.Estimate {
				sum += l.Extension
				if isLabItem(l.Item) && l.Quantity != math.Trunc(l.Quantity) {
					t.Errorf("lab line %s: %v tests, want whole tests", l.Item, l.Quantity)
				}
				if c := 100 * l.Extension; math.Abs(c-math.Round(c)) > 1e-6 {
					t.Errorf("line %s: extension %v is not whole cents", l.Item, l.Extension)
				}
			}
			if math.Abs(sum-p.Total) > 0.005 {
				t.Errorf("lines add to %.2f, total %.2f", sum, p.Total)
			}

			s := scheduleOf(t, p, in)
			if s.FieldDays != p.Finish {
				t.Errorf("plan %d field days, schedule %d", p.Finish, s.FieldDays)
			}
			byRig := map[string]int{}
			for _, r := range s.Rigs {
				byRig[r.Rig] = r.FieldDays
			}
			for _, r := range p.Rigs {
				if r.Points > 0 && byRig[r.Name] != r.FieldDays {
					t.Errorf("rig %s: plan %d field days, schedule %d", r.Name, r.FieldDays, byRig[r.Name])
				}
			}
			// The hand-laid baseline is a plan of the model and a start of
			// the solve: the plan is never dearer, up to the tie-break of
			// 0.01 a field day; the split adds up to the saving.
			b := p.Baseline
			if b == nil {
				t.Fatal("no hand-laid baseline")
			}
			if b.Saving < -0.01*float64(b.FieldDays) {
				t.Errorf("the plan is dearer than the hand-laid baseline: %+v", *b)
			}
			if sp := b.Split; sp == nil || math.Abs(sp.Methods+sp.Rigs+sp.Layout-b.Saving) > 0.015 {
				t.Errorf("saving split %+v does not add up to the saving %.2f", sp, b.Saving)
			}
			// The baseline's days are the scheduler's too.
			bp := &Plan{Scenario: p.Scenario}
			for k, o := range pr.hand.chosen {
				od := pr.Options[o]
				c := pr.Layout.Candidates[od.point]
				bp.Points = append(bp.Points, Point{ID: fmt.Sprintf("H%03d", k+1), Zone: in.Scenario.Zones[od.zone].ID, XFt: c.P.X, YFt: c.P.Y,
					Method: string(od.method), Rig: pr.Rigs[od.rig].name, DepthFt: od.depth, Hours: pr.Spec.Options[o].Hours,
					OnPointHours: od.prof.onHours, Surface: string(in.Scenario.Zones[od.zone].Ground.Surface)})
			}
			for r, rd := range pr.Rigs {
				bp.Rigs = append(bp.Rigs, RigPlan{Name: rd.name, MobHours: pr.Spec.Rigs[r].MobHours})
			}
			bsched := scheduleOf(t, bp, in)
			if bsched.FieldDays != b.FieldDays {
				t.Errorf("baseline %d field days, its schedule %d", b.FieldDays, bsched.FieldDays)
			}
			// The baseline meets the spacing rules it claims to, checked by
			// dense sampling (sampledGap, written apart from the measure).
			var nogo []geom.Polygon
			for _, ng := range in.Scenario.NoGo {
				nogo = append(nogo, ng.Polygon)
			}
			for z, zn := range in.Scenario.Zones {
				r := pr.Layout.RadiusFt[z]
				if r == 0 {
					continue
				}
				var pts []geom.Point
				for _, bpt := range bp.Points {
					if bpt.Zone == zn.ID {
						pts = append(pts, geom.Point{X: bpt.XFt, Y: bpt.YFt})
					}
				}
				if gap, at := sampledGap(zn.Polygon, nogo, pts, r/20); gap > r+1e-6 {
					t.Errorf("baseline, zone %s: ground at (%.1f, %.1f) is %.2f ft from its points; the rule allows %.2f", zn.ID, at.X, at.Y, gap, r)
				}
			}
			t.Logf("%s: USD %.2f, %d field days; baseline USD %.2f, %d days, saving %.2f (%.1f %%)", name, p.Total, p.Finish, b.Cost, b.FieldDays, b.Saving, b.SavingPct)
		})
	}
}

// scheduleOf lays a plan's days with the scheduler, from 2027-03-01 at
// 07:00 with the scenario's working hours and the plan's start-up.
func scheduleOf(t *testing.T, p *Plan, in Input) *schedule.Schedule {
	t.Helper()
	jobs, specs, err := ScheduleInputs(context.Background(), p, in.Scenario, in.RateBook, in.Rigs)
	if err != nil {
		t.Fatal(err)
	}
	s, err := schedule.Build(jobs, specs, schedule.Calendar{
		Start: time.Date(2027, 3, 1, 0, 0, 0, 0, time.UTC), WorkStart: 7 * time.Hour,
		HoursPerDay: in.Scenario.HoursDay, StartUpHours: StartUpHours,
	})
	if err != nil {
		t.Fatal(err)
	}
	return s
}
