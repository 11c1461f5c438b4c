package cli

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"time"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/fielderr"
)

type scheduleOptions struct {
	demo         string
	planFile     string
	start        string
	workStart    string
	workDays     string
	wetDates     string
	wetProb      string
	seed         uint64
	runs         int
	cv           float64
	csvOut       string
	ganttOut     string
	stakeCSV     string
	stakeGeoJSON string
	quiet        bool
	csvBOM       bool
	jsonOut      string
}

func newScheduleCmd(g *globalOptions, stdout, stderr io.Writer) *cobra.Command {
	o := &scheduleOptions{}
	c := &cobra.Command{
		Use:   "schedule [SCENARIO.yaml]",
		Short: "Turn a plan into field days: each rig's route, a day-by-day table, weather risk and a stakeout list",
		Long: "schedule plans the scenario (or reads --plan, a plan file made for it), orders each rig's points into a\n" +
			"short route, places the work into working days, and runs a seeded Monte Carlo over wet days and\n" +
			"production to give P50 and P80 finish dates and standby cost.",
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			return runSchedule(cmd.Context(), cfg, o, args, stdout, stderr)
		},
	}
	f := c.Flags()
	f.StringVar(&o.demo, "demo", "", "schedule the embedded demo scenario `NAME`")
	f.StringVar(&o.planFile, "plan", "", "schedule this plan `FILE` (written by rigmix plan --json) instead of planning again")
	f.String("rate-book", "", "price standby with this rate `BOOK` (demo name or file)")
	f.Float64("gap", 0, "optimality `GAP` for planning on the fly")
	f.Float64("time-limit", 0, "`SECONDS` for planning on the fly")
	o.addCalendarFlags(f)
	f.StringVar(&o.jsonOut, "json", "", "write a summary (dates, days, standby, each rig, risk) as JSON to `FILE` (- for standard output)")
	f.StringVar(&o.csvOut, "csv", "", "write the day-by-day table as CSV to `FILE` (- for standard output)")
	f.StringVar(&o.ganttOut, "gantt-svg", "", "write a Gantt chart as SVG to `FILE` (- for standard output)")
	f.StringVar(&o.stakeCSV, "stakeout-csv", "", "write the stakeout list as CSV to `FILE` (- for standard output)")
	f.BoolVar(&o.csvBOM, "csv-bom", false, "begin every CSV file written with a UTF-8 byte-order mark (for spreadsheets)")
	f.BoolVar(&o.quiet, "quiet", false, "print nothing but errors")
	f.StringVar(&o.stakeGeoJSON, "stakeout-geojson", "", "write the stakeout list as GeoJSON to `FILE` (- for standard output)")
	return c
}

// calendar reads the calendar flags.
func (o *scheduleOptions) calendar(hoursPerDay float64, today time.Time) (schedule.Calendar, error) {
	// The start-up allowance the plan's day count assumes.
	cal := schedule.Calendar{HoursPerDay: hoursPerDay, StartUpHours: plan.StartUpHours}
	if o.start == "" {
		d := today.AddDate(0, 0, 1)
		for d.Weekday() != time.Monday {
			d = d.AddDate(0, 0, 1)
		}
		cal.Start = time.Date(d.Year(), d.Month(), d.Day(), 0, 0, 0, 0, time.UTC)
	} else {
		d, err := time.Parse("2006-01-02", o.start)
		if err != nil {
			return cal, usageError{fmt.Errorf("--start %q: not a date; give YYYY-MM-DD, e.g. 2027-03-01", o.start)}
		}
		cal.Start = d
	}
	ws, err := time.Parse("15:04", o.workStart)
	if err != nil {
		return cal, usageError{fmt.Errorf("--work-start %q: give a time of day as HH:MM, e.g. 07:00", o.workStart)}
	}
	cal.WorkStart = time.Duration(ws.Hour())*time.Hour + time.Duration(ws.Minute())*time.Minute
	switch o.workDays {
	case "mon-fri":
	case "mon-sat":
		cal.WorkDays = []time.Weekday{time.Monday, time.Tuesday, time.Wednesday, time.Thursday, time.Friday, time.Saturday}
	case "all":
		cal.WorkDays = []time.Weekday{time.Sunday, time.Monday, time.Tuesday, time.Wednesday, time.Thursday, time.Friday, time.Saturday}
	default:
		return cal, usageError{fmt.Errorf("--work-days %q: give mon-fri, mon-sat or all", o.workDays)}
	}
	if o.wetDates != "" {
		for _, s := range strings.Split(o.wetDates, ",") {
			d, err := time.Parse("2006-01-02", strings.TrimSpace(s))
			if err != nil {
				return cal, usageError{fmt.Errorf("--wet-dates: %q is not a date; give YYYY-MM-DD values separated by commas", s)}
			}
			cal.WetDates = append(cal.WetDates, d)
		}
	}
	if o.wetProb != "" {
		parts := strings.Split(o.wetProb, ",")
		if len(parts) != 1 && len(parts) != 12 {
			return cal, usageError{fmt.Errorf("--wet-prob: give one probability or twelve (January to December), got %d", len(parts))}
		}
		for m := 0; m < 12; m++ {
			s := parts[0]
			if len(parts) == 12 {
				s = parts[m]
			}
			v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
			if err != nil || math.IsNaN(v) || v < 0 || v > 1 {
				return cal, usageError{fmt.Errorf("--wet-prob: %q is not a probability between 0 and 1", s)}
			}
			cal.WetProbByMonth[m] = v
		}
	}
	return cal, nil
}

// validate refuses the risk flags out of range before any work, naming
// the flag (the schedule would refuse them too, but only after planning).
func (o *scheduleOptions) validate() error {
	switch {
	case o.runs < 0 || o.runs > schedule.MaxRuns:
		return usageError{fmt.Errorf("--runs: give 1 to %d runs (0: %d), got %d", schedule.MaxRuns, schedule.DefaultRuns, o.runs)}
	case math.IsNaN(o.cv) || o.cv < 0 || o.cv > maxProductionCV:
		return usageError{fmt.Errorf("--production-cv: give a coefficient of variation from 0 to %g, e.g. 0.2, got %g", float64(maxProductionCV), o.cv)}
	}
	return nil
}

// maxProductionCV is the largest --production-cv the schedule's Monte
// Carlo accepts.
const maxProductionCV = 2

// maxPlanBytes bounds a plan file read by --plan; the plan of a
// 1,000-acre site is a few megabytes.
const maxPlanBytes = 256 << 20

func runSchedule(ctx context.Context, cfg Config, o *scheduleOptions, args []string, stdout, stderr io.Writer) error {
	if err := o.validate(); err != nil {
		return err
	}
	prog := startProgress(stderr, "schedule", !o.quiet && isTerminal(stderr), time.Second)
	defer prog.end()
	prog.set("loading")
	sc, rb, inputs, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	outs := &outputs{stdout: stdout, bom: o.csvBOM}
	files := []*output{
		outs.add("--csv", o.csvOut), outs.add("--gantt-svg", o.ganttOut),
		outs.add("--stakeout-csv", o.stakeCSV), outs.add("--stakeout-geojson", o.stakeGeoJSON),
	}
	jsonF := outs.add("--json", o.jsonOut)
	if err := outs.check(append(inputs, o.planFile)); err != nil {
		return err
	}
	cal, err := o.calendar(sc.HoursDay, time.Now())
	if err != nil {
		return err
	}
	var p *plan.Plan
	if o.planFile != "" {
		b, err := fielderr.ReadRegular(o.planFile, maxPlanBytes)
		if err != nil {
			return usageError{fmt.Errorf("--plan %s: cannot read: %v", o.planFile, unwrapPathErr(err))}
		}
		p = &plan.Plan{}
		if err := json.Unmarshal(b, p); err != nil || p.Schema != plan.SchemaVersion {
			return usageError{fmt.Errorf("--plan %s: not a rigmix plan file (want schema %s)", o.planFile, plan.SchemaVersion)}
		}
	}
	prog.set("starting the rigs")
	fleet, rigs, err := startRigs(ctx, cfg, sc, stderr)
	if err != nil {
		return err
	}
	defer fleet.Close()
	if p == nil {
		prog.set("planning")
		p, err = plan.Run(ctx, plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}, plan.Options{GapRel: cfg.Gap, TimeLimit: cfg.TimeLimit, Threads: cfg.Threads})
		if err != nil {
			return err
		}
		if ctx.Err() != nil {
			return errInterrupted
		}
	}
	prog.set("scheduling and weather risk")
	s, risk, err := o.build(ctx, p, sc, rb, rigs, cal)
	if err != nil {
		return err
	}
	for i, render := range []func(io.Writer, *schedule.Schedule) error{
		schedule.WriteCSV, schedule.WriteGanttSVG, schedule.WriteStakeoutCSV, schedule.WriteStakeoutGeoJSON,
	} {
		if files[i] == nil {
			continue
		}
		var b bytes.Buffer
		if err := render(&b, s); err != nil {
			return err
		}
		files[i].setData(b.Bytes())
	}
	if jsonF != nil {
		b, err := scheduleSummaryJSON(p, sc, s, risk)
		if err != nil {
			return err
		}
		jsonF.setData(b)
	}
	prog.end()
	if !o.quiet && !outs.toStdout() {
		var b bytes.Buffer
		fmt.Fprintf(&b, "rigmix schedule — %s (%s)%s\n\n", sc.Title, sc.Source, map[bool]string{true: " — invented demo data", false: ""}[sc.Demo])
		if err := schedule.WriteText(&b, s); err != nil {
			return err
		}
		b.WriteString("\n")
		if err := schedule.WriteRiskText(&b, risk); err != nil {
			return err
		}
		b.WriteString("\nCautions\n")
		for _, c := range planCautions(p) {
			fmt.Fprintf(&b, "  * %s\n", c)
		}
		outs.summary = b.Bytes()
	}
	return outs.commit(ctx)
}

// build schedules a plan and runs the weather and production risk.
func (o *scheduleOptions) build(ctx context.Context, p *plan.Plan, sc *scenarios.Scenario, rb *ratebooks.RateBook, rigs map[string]sdk.Rig, cal schedule.Calendar) (*schedule.Schedule, *schedule.RiskResult, error) {
	jobs, specs, err := plan.ScheduleInputs(ctx, p, sc, rb, rigs)
	if err != nil {
		return nil, nil, err
	}
	s, err := schedule.Build(jobs, specs, cal)
	if err != nil {
		return nil, nil, err
	}
	risk, err := schedule.Risk(jobs, specs, cal, schedule.Options{Seed: o.seed, Runs: o.runs, ProductionCV: o.cv})
	if err != nil {
		return nil, nil, err
	}
	return s, risk, nil
}

// addCalendarFlags binds the calendar and risk flags shared by schedule and
// report.
func (o *scheduleOptions) addCalendarFlags(f *pflag.FlagSet) {
	f.StringVar(&o.start, "start", "", "first field day, `YYYY-MM-DD` (default: the next Monday after today)")
	f.StringVar(&o.workStart, "work-start", "07:00", "start of the working day, `HH:MM`")
	f.StringVar(&o.workDays, "work-days", "mon-fri", "`DAYS` worked: mon-fri, mon-sat or all")
	f.StringVar(&o.wetDates, "wet-dates", "", "comma-separated `DATES` (YYYY-MM-DD) known or assumed wet")
	f.StringVar(&o.wetProb, "wet-prob", "", "`P`robability a day is wet, one value for every month or twelve comma-separated values from January")
	f.Uint64Var(&o.seed, "seed", 1, "`SEED` of the weather and production Monte Carlo")
	f.IntVar(&o.runs, "runs", 1000, "Monte Carlo runs, `N` (at most 1,000,000)")
	f.Float64Var(&o.cv, "production-cv", 0.2, "coefficient of variation (`CV`) of hours on points")
}

// planCautions is the cautions that fit the plan; a plan file from
// elsewhere that carries none gets every caution.
func planCautions(p *plan.Plan) []string {
	if len(p.Cautions) == 0 {
		return plan.Cautions
	}
	return p.Cautions
}
