package cli

import (
	"encoding/json"
	"reflect"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/scenarios"
)

// TestScheduleSummaryJSON: schedule --json carries the schedule's and the
// risk's figures field for field, dates as YYYY-MM-DD, hours and money to
// hundredths and feet to tenths (as the tables print them).
func TestScheduleSummaryJSON(t *testing.T) {
	d := func(m, day int) time.Time { return time.Date(2027, time.Month(m), day, 0, 0, 0, 0, time.UTC) }
	p := &plan.Plan{}
	p.RateBook.Currency = "USD"
	sc := &scenarios.Scenario{Name: "site", Source: "site.yaml"}
	s := &schedule.Schedule{
		Start: d(3, 1), Finish: d(3, 9), FieldDays: 7, StandbyHours: 10.004, StandbyCost: 1234.5678,
		Rigs: []schedule.RigSchedule{{
			Rig: "tire-drill", Route: []string{"B-1", "B-2", "B-3"}, RouteFt: 431.26,
			MobHours: 1.2849, TravelHours: 0.3333, WorkHours: 14.379999999999999, StandbyHours: 10.004, DemobHours: 1.28,
			StandbyCost: 1234.5678, First: d(3, 1), Last: d(3, 9), FieldDays: 7,
		}},
	}
	r := &schedule.RiskResult{Runs: 1000, Seed: 7, ProductionCV: 0.2, P50Finish: d(3, 9), P80Finish: d(3, 10),
		P50FieldDays: 7, P80FieldDays: 8, P50StandbyHours: 5.555, P80StandbyHours: 10, P50StandbyCost: 555.556, P80StandbyCost: 1000, MeanStandbyCost: 600.004}
	b, err := scheduleSummaryJSON(p, sc, s, r)
	if err != nil {
		t.Fatal(err)
	}
	var got scheduleJSON
	if err := json.Unmarshal(b, &got); err != nil {
		t.Fatal(err)
	}
	want := scheduleJSON{
		Schema: scheduleSchema, Scenario: "site", Source: "site.yaml", Currency: "USD",
		Start: "2027-03-01", Finish: "2027-03-09", FieldDays: 7, StandbyHours: 10, StandbyCost: 1234.57,
		Rigs: []scheduleRigJSON{{Rig: "tire-drill", Points: 3, RouteFt: 431.3, First: "2027-03-01", Last: "2027-03-09", FieldDays: 7,
			MobHours: 1.28, TravelHours: 0.33, WorkHours: 14.38, StandbyHours: 10, DemobHours: 1.28, StandbyCost: 1234.57}},
		Risk: scheduleRiskJSON{Runs: 1000, Seed: 7, ProductionCV: 0.2, P50Finish: "2027-03-09", P80Finish: "2027-03-10",
			P50FieldDays: 7, P80FieldDays: 8, P50StandbyHours: 5.56, P80StandbyHours: 10, P50StandbyCost: 555.56, P80StandbyCost: 1000, MeanStandbyCost: 600},
		Cautions: plan.Cautions,
	}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("schedule summary\n got %+v\nwant %+v", got, want)
	}
}
