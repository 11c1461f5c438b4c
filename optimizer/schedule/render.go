package schedule

import (
	"bufio"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
	"time"

	moneyfmt "github.com/rigmix/rigmix/internal/money"
)

const dateLayout = "2006-01-02"

func hhmm(t time.Time) string { return t.Format("15:04") }

// endClock writes an end at midnight as 24:00 of the same day, not 00:00.
func endClock(day, t time.Time) string {
	if !t.Before(day.AddDate(0, 0, 1)) {
		return "24:00"
	}
	return hhmm(t)
}

func num(v float64, prec int) string { return strconv.FormatFloat(v, 'f', prec, 64) }

// WriteCSV writes the day-by-day table, one row per entry: rig, date, work
// day number, start, end, hours, kind, point, method, depth.
func WriteCSV(w io.Writer, s *Schedule) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"rig", "date", "work_day", "start", "end", "hours", "kind", "point", "method", "depth_ft", "spans_days", "wet"}); err != nil {
		return err
	}
	for _, r := range s.Rigs {
		for _, d := range r.Days {
			for _, e := range d.Entries {
				depth := ""
				if e.Kind == Work {
					depth = num(e.DepthFt, 1)
				}
				if err := cw.Write([]string{
					r.Rig, d.Date.Format(dateLayout), strconv.Itoa(d.WorkDay), hhmm(e.Start), endClock(d.Date, e.End),
					num(e.Hours, 2), string(e.Kind), e.JobID, e.Method, depth, strconv.FormatBool(e.Spans), strconv.FormatBool(d.Wet),
				}); err != nil {
					return err
				}
			}
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteText writes the schedule as terminal tables: a summary, then per rig
// its route and its days.
func WriteText(w io.Writer, s *Schedule) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintf(bw, "Field schedule: %s to %s, %d field days (working %s from %s, %s h a day)\n",
		s.Start.Format(dateLayout), s.Finish.Format(dateLayout), s.FieldDays, weekdays(s.WorkDays), clock(s.WorkStart), num(s.HoursPerDay, 1))
	if s.StandbyHours > 0 {
		fmt.Fprintf(bw, "Standby on wet days: %s h, %s\n", num(s.StandbyHours, 1), moneyfmt.Format(s.StandbyCost))
	}
	for _, r := range s.Rigs {
		fmt.Fprintf(bw, "\nRig %s: %d points, %s to %s, %d field days\n", r.Rig, len(r.Route), r.First.Format(dateLayout), r.Last.Format(dateLayout), r.FieldDays)
		fmt.Fprintf(bw, "  hours: mobilize %s, travel %s, work %s, standby %s, demobilize %s; route %s ft\n",
			num(r.MobHours, 1), num(r.TravelHours, 1), num(r.WorkHours, 1), num(r.StandbyHours, 1), num(r.DemobHours, 1), num(r.RouteFt, 0))
		if r.StandbyHours > 0 {
			fmt.Fprintf(bw, "  standby: %s h × %s (%s) = %s\n", num(r.StandbyHours, 1), moneyfmt.Format(r.StandbyRate), r.StandbyItem, moneyfmt.Format(r.StandbyCost))
		}
		if math.Abs(r.RouteTravelHours-r.TravelHours) >= 0.05 {
			fmt.Fprintf(bw, "  moves laid at the plan's allowance, %s h; the route itself takes %s h\n", num(r.TravelHours, 1), num(r.RouteTravelHours, 1))
		}
		fmt.Fprintf(bw, "  route: %s\n", strings.Join(r.Route, " → "))
		tw := tabwriter.NewWriter(bw, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "  day\tdate\t\tstart\tend\thours\tdoing\tpoint\tmethod\tdepth ft")
		for _, d := range r.Days {
			wet := ""
			if d.Wet {
				wet = "wet"
			}
			for i, e := range d.Entries {
				day, date, dw := "", "", ""
				if i == 0 {
					day, date, dw = strconv.Itoa(d.WorkDay), d.Date.Format("Mon 2006-01-02"), wet
				}
				kind := string(e.Kind)
				if e.Spans {
					kind += " (cont.)"
				}
				depth := ""
				if e.Kind == Work {
					depth = num(e.DepthFt, 1)
				}
				fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", day, date, dw, hhmm(e.Start), endClock(d.Date, e.End),
					num(e.Hours, 2), kind, e.JobID, e.Method, depth)
			}
		}
		if err := tw.Flush(); err != nil {
			return err
		}
	}
	return bw.Flush()
}

func weekdays(ds []time.Weekday) string {
	var s []string
	for _, d := range ds {
		s = append(s, d.String()[:3])
	}
	return strings.Join(s, " ")
}

// WriteRiskText writes the Monte Carlo summary.
func WriteRiskText(w io.Writer, r *RiskResult) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintf(bw, "Weather and production risk: %d runs, production CV %s, repeatable with seed %d\n", r.Runs, num(r.ProductionCV, 2), r.Seed)
	tw := tabwriter.NewWriter(bw, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "\tfinish\tfield days\tstandby h\tstandby cost\t")
	fmt.Fprintf(tw, "planned\t%s\t%d\t\t\t\n", r.Planned.Format(dateLayout), r.PlannedFieldDays)
	fmt.Fprintf(tw, "P50\t%s\t%d\t%s\t%s\t\n", r.P50Finish.Format(dateLayout), r.P50FieldDays, num(r.P50StandbyHours, 1), moneyfmt.Format(r.P50StandbyCost))
	fmt.Fprintf(tw, "P80\t%s\t%d\t%s\t%s\t\n", r.P80Finish.Format(dateLayout), r.P80FieldDays, num(r.P80StandbyHours, 1), moneyfmt.Format(r.P80StandbyCost))
	if err := tw.Flush(); err != nil {
		return err
	}
	fmt.Fprintln(bw, "P50: half the runs finish by then; P80: four in five do.")
	return bw.Flush()
}
