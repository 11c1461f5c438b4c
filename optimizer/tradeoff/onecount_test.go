package tradeoff

import (
	"context"
	"math"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
)

// TestTradeoffsUseTheEstimate: every plan of the frontier and of the
// budget curve is priced at its printed estimate's total (the model's cost
// and the itemized total agree to the cent), a budget plan's itemized
// total fits its budget, and each frontier plan's field days are the days
// schedule.Build lays for it.
func TestTradeoffsUseTheEstimate(t *testing.T) {
	ctx := context.Background()
	a := analyzer(t, "wetlot")
	in := a.Prepared().In
	check := func(what string, s Summary) {
		t.Helper()
		if !s.Feasible {
			return
		}
		if math.Abs(s.PricedCost-s.TotalCost) > 0.005 {
			t.Errorf("%s: model cost %.2f, estimate total %.2f", what, s.PricedCost, s.TotalCost)
		}
	}
	f, err := a.Frontier(ctx)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range f.Swept {
		check("frontier", p.Summary)
		if !p.Feasible {
			continue
		}
		jobs, specs, err := plan.ScheduleInputs(ctx, p.Plan(), in.Scenario, in.RateBook, in.Rigs)
		if err != nil {
			t.Fatal(err)
		}
		s, err := schedule.Build(jobs, specs, schedule.Calendar{Start: time.Date(2027, 3, 1, 0, 0, 0, 0, time.UTC),
			WorkStart: 7 * time.Hour, HoursPerDay: in.Scenario.HoursDay, StartUpHours: plan.StartUpHours})
		if err != nil {
			t.Fatal(err)
		}
		if s.FieldDays != p.FieldDays {
			t.Errorf("frontier D=%d: %d field days in the trade-off, %d in the schedule", p.MaxDays, p.FieldDays, s.FieldDays)
		}
	}
	bc, err := a.BudgetCurve(ctx)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range bc.Points {
		check("budget curve", p.Summary)
		if p.Feasible && p.TotalCost > p.Budget+0.005 {
			t.Errorf("budget %.2f: itemized total %.2f", p.Budget, p.TotalCost)
		}
	}
}
