package cli

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"os"
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
	f.StringVar(&o.demo, "demo", "", "schedule an embedded demo scenario by name")
	f.StringVar(&o.planFile, "plan", "", "schedule this plan file (from `rigmix plan --json`) instead of planning again")
	f.String("rate-book", "", "price standby with this rate book (demo name or file)")
	f.Float64("gap", 0, "optimality gap for planning on the fly")
	f.Float64("time-limit", 0, "seconds for planning on the fly")
	o.addCalendarFlags(f)
	f.StringVar(&o.csvOut, "csv", "", "write the day-by-day table as CSV to this file")
	f.StringVar(&o.ganttOut, "gantt-svg", "", "write a Gantt chart as SVG to this file")
	f.StringVar(&o.stakeCSV, "stakeout-csv", "", "write the stakeout list as CSV to this file")
	f.StringVar(&o.stakeGeoJSON, "stakeout-geojson", "", "write the stakeout list as GeoJSON to this file")
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
			if err != nil || v < 0 || v > 1 {
				return cal, usageError{fmt.Errorf("--wet-prob: %q is not a probability between 0 and 1", s)}
			}
			cal.WetProbByMonth[m] = v
		}
	}
	return cal, nil
}

func runSchedule(ctx context.Context, cfg Config, o *scheduleOptions, args []string, stdout, stderr io.Writer) error {
	sc, rb, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	cal, err := o.calendar(sc.HoursDay, time.Now())
	if err != nil {
		return err
	}
	fleet, rigs, err := startRigs(ctx, cfg, sc)
	if err != nil {
		return err
	}
	defer fleet.Close()
	var p *plan.Plan
	if o.planFile != "" {
		b, err := os.ReadFile(o.planFile)
		if err != nil {
			return usageError{fmt.Errorf("%s: %v", o.planFile, err)}
		}
		p = &plan.Plan{}
		if err := json.Unmarshal(b, p); err != nil || p.Schema != plan.SchemaVersion {
			return usageError{fmt.Errorf("%s: not a rigmix plan file (want schema %s)", o.planFile, plan.SchemaVersion)}
		}
	} else {
		p, err = plan.Run(ctx, plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}, plan.Options{GapRel: cfg.Gap, TimeLimit: cfg.TimeLimit, Threads: cfg.Threads})
		if err != nil {
			return err
		}
	}
	s, risk, err := o.build(ctx, p, sc, rb, rigs, cal)
	if err != nil {
		return err
	}
	outs := outputs{}
	for _, w := range []struct {
		path   string
		render func(io.Writer, *schedule.Schedule) error
	}{{o.csvOut, schedule.WriteCSV}, {o.ganttOut, schedule.WriteGanttSVG}, {o.stakeCSV, schedule.WriteStakeoutCSV}, {o.stakeGeoJSON, schedule.WriteStakeoutGeoJSON}} {
		if w.path == "" {
			continue
		}
		var b bytes.Buffer
		if err := w.render(&b, s); err != nil {
			return err
		}
		outs.add(w.path, b.Bytes())
	}
	if err := outs.write(); err != nil {
		return err
	}
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
	for _, c := range plan.Cautions {
		fmt.Fprintf(&b, "  * %s\n", c)
	}
	_, err = stdout.Write(b.Bytes())
	return err
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
	f.StringVar(&o.start, "start", "", "first field day, YYYY-MM-DD (default: the next Monday after today)")
	f.StringVar(&o.workStart, "work-start", "07:00", "start of the working day, HH:MM")
	f.StringVar(&o.workDays, "work-days", "mon-fri", "days worked: mon-fri, mon-sat or all")
	f.StringVar(&o.wetDates, "wet-dates", "", "comma-separated dates (YYYY-MM-DD) known or assumed wet")
	f.StringVar(&o.wetProb, "wet-prob", "", "probability a day is wet, one value for every month or twelve comma-separated values from January")
	f.Uint64Var(&o.seed, "seed", 1, "seed of the weather and production Monte Carlo")
	f.IntVar(&o.runs, "runs", 1000, "Monte Carlo runs")
	f.Float64Var(&o.cv, "production-cv", 0.2, "coefficient of variation of hours on points")
}
