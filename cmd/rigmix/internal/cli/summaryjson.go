package cli

import (
	"encoding/json"
	"math"
	"time"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/scenarios"
)

// scheduleSchema names the form of schedule --json.
const scheduleSchema = "rigmix.schedule-summary/1"

// scheduleJSON is the summary schedule --json writes: the dates, days and
// standby of the schedule, each rig's route and hours, and the weather and
// production risk. The day-by-day table and the stakeout list have their
// own files (--csv, --stakeout-csv, --stakeout-geojson).
type scheduleJSON struct {
	Schema       string            `json:"schema"`
	Scenario     string            `json:"scenario"`
	Source       string            `json:"source"`
	Invented     bool              `json:"invented"`
	Currency     string            `json:"currency"`
	Start        string            `json:"start"`
	Finish       string            `json:"finish"`
	FieldDays    int               `json:"field_days"`
	StandbyHours float64           `json:"standby_hours"`
	StandbyCost  float64           `json:"standby_cost"`
	Rigs         []scheduleRigJSON `json:"rigs"`
	Risk         scheduleRiskJSON  `json:"risk"`
	Cautions     []string          `json:"cautions"`
}

type scheduleRigJSON struct {
	Rig          string  `json:"rig"`
	Points       int     `json:"points"`
	RouteFt      float64 `json:"route_ft"`
	First        string  `json:"first"`
	Last         string  `json:"last"`
	FieldDays    int     `json:"field_days"`
	MobHours     float64 `json:"mob_hours"`
	TravelHours  float64 `json:"travel_hours"`
	WorkHours    float64 `json:"work_hours"`
	StandbyHours float64 `json:"standby_hours"`
	DemobHours   float64 `json:"demob_hours"`
	StandbyCost  float64 `json:"standby_cost"`
}

type scheduleRiskJSON struct {
	Runs            int     `json:"runs"`
	Seed            uint64  `json:"seed"`
	ProductionCV    float64 `json:"production_cv"`
	P50Finish       string  `json:"p50_finish"`
	P80Finish       string  `json:"p80_finish"`
	P50FieldDays    int     `json:"p50_field_days"`
	P80FieldDays    int     `json:"p80_field_days"`
	P50StandbyHours float64 `json:"p50_standby_hours"`
	P80StandbyHours float64 `json:"p80_standby_hours"`
	P50StandbyCost  float64 `json:"p50_standby_cost"`
	P80StandbyCost  float64 `json:"p80_standby_cost"`
	MeanStandbyCost float64 `json:"mean_standby_cost"`
}

func day(t time.Time) string { return t.Format("2006-01-02") }

// r2 rounds hours and money to hundredths, r1 feet to tenths, as the
// tables print them.
func r2(x float64) float64 { return math.Round(x*100) / 100 }
func r1(x float64) float64 { return math.Round(x*10) / 10 }

// scheduleSummaryJSON renders schedule --json.
func scheduleSummaryJSON(p *plan.Plan, sc *scenarios.Scenario, s *schedule.Schedule, r *schedule.RiskResult) ([]byte, error) {
	out := scheduleJSON{
		Schema: scheduleSchema, Scenario: sc.Name, Source: sc.Source, Invented: sc.Demo,
		Currency: p.RateBook.Currency, Start: day(s.Start), Finish: day(s.Finish), FieldDays: s.FieldDays,
		StandbyHours: r2(s.StandbyHours), StandbyCost: r2(s.StandbyCost), Rigs: []scheduleRigJSON{},
		Risk: scheduleRiskJSON{
			Runs: r.Runs, Seed: r.Seed, ProductionCV: r.ProductionCV,
			P50Finish: day(r.P50Finish), P80Finish: day(r.P80Finish),
			P50FieldDays: r.P50FieldDays, P80FieldDays: r.P80FieldDays,
			P50StandbyHours: r2(r.P50StandbyHours), P80StandbyHours: r2(r.P80StandbyHours),
			P50StandbyCost: r2(r.P50StandbyCost), P80StandbyCost: r2(r.P80StandbyCost), MeanStandbyCost: r2(r.MeanStandbyCost),
		},
		Cautions: planCautions(p),
	}
	for _, rs := range s.Rigs {
		out.Rigs = append(out.Rigs, scheduleRigJSON{
			Rig: rs.Rig, Points: len(rs.Route), RouteFt: r1(rs.RouteFt), First: day(rs.First), Last: day(rs.Last),
			FieldDays: rs.FieldDays, MobHours: r2(rs.MobHours), TravelHours: r2(rs.TravelHours), WorkHours: r2(rs.WorkHours),
			StandbyHours: r2(rs.StandbyHours), DemobHours: r2(rs.DemobHours), StandbyCost: r2(rs.StandbyCost),
		})
	}
	b, err := json.MarshalIndent(out, "", "  ")
	return append(b, '\n'), err
}

// reportSummaryJSON is what report --json writes: the line report prints,
// as data.
type reportSummaryJSON struct {
	Schema         string  `json:"schema"`
	Report         string  `json:"report"`
	Scenario       string  `json:"scenario"`
	Invented       bool    `json:"invented"`
	Points         int     `json:"points"`
	Currency       string  `json:"currency"`
	Total          float64 `json:"total"`
	PlanFieldDays  int     `json:"plan_field_days"`
	ScheduleStart  string  `json:"schedule_start"`
	ScheduleFinish string  `json:"schedule_finish"`
}

func reportSummary(out string, p *plan.Plan, sc *scenarios.Scenario, s *schedule.Schedule) ([]byte, error) {
	b, err := json.MarshalIndent(reportSummaryJSON{
		Schema: "rigmix.report-summary/1", Report: out, Scenario: sc.Name, Invented: sc.Demo,
		Points: len(p.Points), Currency: p.RateBook.Currency, Total: r2(p.Total), PlanFieldDays: p.Finish,
		ScheduleStart: day(s.Start), ScheduleFinish: day(s.Finish),
	}, "", "  ")
	return append(b, '\n'), err
}
