package plan

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"math"
	"math/rand/v2"
	"os/exec"
	"reflect"
	"runtime"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/mip/miptest"
	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// builtinRigs serves every built-in rig through the real gRPC shims,
// in-process (go-plugin's test connection).
func builtinRigs(t testing.TB) map[string]sdk.Rig {
	t.Helper()
	rigs := map[string]sdk.Rig{}
	for _, n := range builtin.Names() {
		r, err := builtin.New(n)
		if err != nil {
			t.Fatal(err)
		}
		rigs[n] = sdk.TestRig(t, r)
	}
	return rigs
}

func demoInput(t testing.TB, name string) Input {
	t.Helper()
	sc, err := scenarios.LoadDemo(name, nil)
	if err != nil {
		t.Fatal(err)
	}
	return scenarioInput(t, sc)
}

// scenarioInput is sc with its rate book and the built-in rigs.
func scenarioInput(t testing.TB, sc *scenarios.Scenario) Input {
	t.Helper()
	rb, err := ratebooks.Open(sc.RateBook)
	if err != nil {
		t.Fatal(err)
	}
	return Input{Scenario: sc, RateBook: rb, Rigs: builtinRigs(t)}
}

// TestDemoPlansHoldTogether plans every demo and checks the plan against
// its own inputs: money adds up, every point lies in its zone and outside
// the no-go areas at the zone's depth, every rule is met, and the solve is
// proven.
func TestDemoPlansHoldTogether(t *testing.T) {
	for _, name := range scenarios.Demos() {
		t.Run(name, func(t *testing.T) {
			in := demoInput(t, name)
			p, err := Run(context.Background(), in, Options{})
			if err != nil {
				t.Fatal(err)
			}
			if p.Solver.Status != mip.Optimal.String() {
				t.Fatalf("solver %s, gap %g", p.Solver.Status, p.Solver.Gap)
			}
			sum := 0.0
			for _, l := range p.Estimate {
				// Extensions are rounded up to the cent.
				if d := l.Extension - l.Quantity*l.UnitPrice; d < -1e-6 || d >= 0.01 {
					t.Errorf("%s: extension %.2f is not %g × %g rounded up to the cent", l.Item, l.Extension, l.Quantity, l.UnitPrice)
				}
				sum += l.Extension
			}
			if math.Abs(sum-p.Total) > 0.005 {
				t.Errorf("lines add to %.2f, total says %.2f", sum, p.Total)
			}
			// The objective is the cost plus the tie-break 0.01 per field
			// day, and the cost is the estimate's total (the objective is
			// printed to 4 places).
			if obj := p.Solver.Objective - 0.01*float64(p.Finish); math.Abs(obj-p.Total) > 0.005 {
				t.Errorf("solver objective less tie-break %.4f, estimate total %.2f", obj, p.Total)
			}
			zones := map[string]scenarios.Zone{}
			for _, z := range in.Scenario.Zones {
				zones[z.ID] = z
			}
			for _, pt := range p.Points {
				z := zones[pt.Zone]
				q := geom.Point{X: pt.XFt, Y: pt.YFt}
				if !z.Polygon.Contains(q) && z.Polygon.DistanceToBoundary(q) > 0.06 {
					t.Errorf("%s at (%g, %g) is outside zone %s", pt.ID, pt.XFt, pt.YFt, z.ID)
				}
				for _, ng := range in.Scenario.NoGo {
					if ng.Polygon.Contains(q) && ng.Polygon.DistanceToBoundary(q) > 0.06 {
						t.Errorf("%s lies in no-go area %s", pt.ID, ng.ID)
					}
				}
				if pt.DepthFt < z.Rules.MinDepthFt-1e-9 {
					t.Errorf("%s depth %g under the zone's %g", pt.ID, pt.DepthFt, z.Rules.MinDepthFt)
				}
			}
			for _, r := range p.Rules {
				if !r.Met {
					t.Errorf("rule not met: %+v", r)
				}
			}
			// The hand-laid grid meets the same rules (gaps filled, all
			// sampled borings, one rig), so it is a feasible plan: the
			// optimized plan can cost no more, up to the solver's gap.
			if b := p.Baseline; b != nil && b.Saving < -p.Solver.Gap*b.Cost-0.01 {
				t.Errorf("the hand-laid grid (%+v) is cheaper than the optimized plan", *b)
			}
			pits, env := false, false
			for _, pt := range p.Points {
				pits = pits || pt.Method == "test_pit"
			}
			for _, z := range in.Scenario.Zones {
				env = env || z.Use == scenarios.UseEnvironmental
			}
			if !reflect.DeepEqual(p.Cautions, CautionsFor(pits, env)) {
				t.Errorf("plan carries cautions %q, want those for test pits %v, environmental zone %v", p.Cautions, pits, env)
			}
		})
	}
}

// TestSpacingHoldsBetweenCells samples spots in each zone at random and
// checks each lies within the covering radius of a chosen point, plus half
// the diagonal of a coverage cell: the rule is enforced at cell centres, and
// a spot is at most that far from its cell's centre (plane geometry).
func TestSpacingHoldsBetweenCells(t *testing.T) {
	in := demoInput(t, scenarios.DefaultDemo)
	pr, err := Prepare(context.Background(), in, Options{})
	if err != nil {
		t.Fatal(err)
	}
	res, err := pr.Solve(context.Background(), Options{})
	if err != nil {
		t.Fatal(err)
	}
	p, err := pr.Assemble(res)
	if err != nil {
		t.Fatal(err)
	}
	rng := rand.New(rand.NewPCG(7, 11))
	for z, zn := range in.Scenario.Zones {
		s := zn.Rules.MaxSpacingFt
		if s == 0 {
			continue
		}
		r := pr.Layout.RadiusFt[z]
		slack := 0.25 * s * math.Sqrt2 / 2 // default cells at s/4
		var pts []geom.Point
		for _, pt := range p.Points {
			if pt.Zone == zn.ID {
				pts = append(pts, geom.Point{X: pt.XFt, Y: pt.YFt})
			}
		}
		b := zn.Polygon.Bounds()
		for k := 0; k < 2000; k++ {
			q := geom.Point{X: b.Min.X + rng.Float64()*(b.Max.X-b.Min.X), Y: b.Min.Y + rng.Float64()*(b.Max.Y-b.Min.Y)}
			if !zn.Polygon.Contains(q) {
				continue
			}
			inNoGo := false
			for _, ng := range in.Scenario.NoGo {
				inNoGo = inNoGo || ng.Polygon.Contains(q)
			}
			if inNoGo {
				continue
			}
			best := math.Inf(1)
			for _, c := range pts {
				best = math.Min(best, math.Hypot(c.X-q.X, c.Y-q.Y))
			}
			if best > r+slack+0.1 {
				t.Fatalf("zone %s: spot (%.1f, %.1f) is %.1f ft from the nearest point; radius %.1f + cell slack %.1f", zn.ID, q.X, q.Y, best, r, slack)
			}
		}
	}
}

// TestPlanIsDeterministic: the same input gives the same plan JSON, byte for
// byte, with one or two processors.
func TestPlanIsDeterministic(t *testing.T) {
	var first []byte
	for _, procs := range []int{1, 2, 1} {
		prev := runtime.GOMAXPROCS(procs)
		p, err := Run(context.Background(), demoInput(t, scenarios.DefaultDemo), Options{})
		runtime.GOMAXPROCS(prev)
		if err != nil {
			t.Fatal(err)
		}
		b, err := json.Marshal(p)
		if err != nil {
			t.Fatal(err)
		}
		if first == nil {
			first = b
		} else if !bytes.Equal(first, b) {
			t.Fatalf("plan JSON differs between runs (GOMAXPROCS %d)", procs)
		}
	}
}

func TestMissingRateItemIsNamed(t *testing.T) {
	in := demoInput(t, scenarios.DefaultDemo)
	rb := *in.RateBook
	rb.Items = nil
	for _, it := range in.RateBook.Items {
		if it.Code != "spt-sample" {
			rb.Items = append(rb.Items, it)
		}
	}
	in.RateBook = &rb
	_, err := Prepare(context.Background(), in, Options{})
	var ie *InputError
	if !errors.As(err, &ie) || !strings.Contains(err.Error(), `"spt-sample"`) {
		t.Fatalf("want an input error naming spt-sample, got %v", err)
	}
}

func TestUnreachableZoneIsExplained(t *testing.T) {
	in := demoInput(t, "wetlot")
	in.Scenario.Rigs = []string{"tire-drill"} // firm ground only; the lot is wet and soft
	_, err := Prepare(context.Background(), in, Options{})
	var ie *InputError
	if !errors.As(err, &ie) || !strings.Contains(err.Error(), "cannot be explored by any offered rig") || !strings.Contains(err.Error(), "tire-drill") {
		t.Fatalf("want an explanation naming the zone and the rig, got %v", err)
	}
}

// TestDemoModelsAgreeWithCBC exports each demo's model as free MPS and
// solves it with COIN-OR CBC (Debian package coinor-cbc), an independent
// solver; the optimal objectives must agree to 1e-6 relative.
func TestDemoModelsAgreeWithCBC(t *testing.T) {
	cbc, err := exec.LookPath("cbc")
	if err != nil {
		t.Skip("cbc is not on PATH (install Debian's coinor-cbc); skipping the cross-check")
	}
	for _, name := range scenarios.Demos() {
		t.Run(name, func(t *testing.T) {
			pr, err := Prepare(context.Background(), demoInput(t, name), Options{})
			if err != nil {
				t.Fatal(err)
			}
			res, err := mip.Solve(context.Background(), pr.Model.Problem, mip.Options{})
			if err != nil || res.Status != mip.Optimal {
				t.Fatalf("engine: %v %v", res.Status, err)
			}
			want := miptest.CBCOptimum(t, cbc, pr.Model.Problem)
			if math.Abs(res.Obj-want) > 1e-6*math.Max(1, math.Abs(want)) {
				t.Fatalf("engine %.8f, CBC %.8f", res.Obj, want)
			}
		})
	}
}

// TestInfeasibleRulesAreExplained: a depth no offered rig reaches and a count
// no zone has room for are named with the zone, the rule and the nearest
// change that would make them plannable.
func TestInfeasibleRulesAreExplained(t *testing.T) {
	in := demoInput(t, "hillside")
	in.Scenario.Zones[0].Rules.MinDepthFt = 400
	_, err := Prepare(context.Background(), in, Options{})
	if err == nil || !strings.Contains(err.Error(), "zones[0]") || !strings.Contains(err.Error(), "lower rules.min_depth to at most 150 ft") {
		t.Fatalf("want the zone and the deepest reach named, got %v", err)
	}

	in = demoInput(t, "hillside")
	in.Scenario.Zones[0].Rules.MinPoints = 5000
	_, err = Prepare(context.Background(), in, Options{})
	if err == nil || !strings.Contains(err.Error(), "zones[0].rules.min_points") || !strings.Contains(err.Error(), "needs 5000 points but has room for") {
		t.Fatalf("want min_points named with the room there is, got %v", err)
	}
}

func TestSpacingTooFineIsRefused(t *testing.T) {
	in := demoInput(t, "hillside")
	in.Scenario.Zones[0].Rules.MaxSpacingFt = 0.5 // likely meant 0.5 of something else
	_, err := Prepare(context.Background(), in, Options{})
	var ie *InputError
	if !errors.As(err, &ie) || !strings.Contains(err.Error(), "zones[0].rules.max_spacing") {
		t.Fatalf("want the zone's spacing rule named, got %v", err)
	}
}
