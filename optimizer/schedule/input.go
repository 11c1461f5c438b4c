package schedule

import (
	"fmt"
	"math"
	"sort"
	"strings"
	"time"
)

// Ground surfaces a rig travels on. They are the scenario's own words.
const (
	Firm = "firm"
	Wet  = "wet"
	Soft = "soft"
)

// XY is a position in the site's plan frame, in feet.
type XY struct {
	XFt, YFt float64
}

// RigSpec is what the scheduler needs to know about one rig.
type RigSpec struct {
	Name string
	// SpeedFtPerHr is the on-site travel speed by ground surface ("firm",
	// "wet", "soft"). Every surface of the rig's points needs a speed > 0.
	SpeedFtPerHr map[string]float64
	// WetAccess tells whether the rig can move and work on wet ground (on
	// wet days and on points whose surface is "wet").
	WetAccess bool
	// MobHours is the travel from the yard to the site, done on the first
	// working day before any work.
	MobHours float64
	// DemobHours is the travel back, done after the last point.
	DemobHours float64
	// StandbyItem is the rate-book item for an hour of standby; StandbyRate
	// is its unit price per hour (from the rate book, passed in).
	StandbyItem string
	StandbyRate float64
	// Entrance is where the rig enters the site after mobilization. Nil:
	// the route may start at any point (whichever makes it shortest).
	Entrance *XY
	// BidMoves lays each move at its job's MoveHours — the allowance the
	// plan priced and counted days on (a move at the zone's typical
	// spacing) — instead of the route leg's own time, so the schedule keeps
	// the days the bid promised. The route still orders the visits;
	// RigSchedule.RouteTravelHours reports its own travel beside the
	// allowances.
	BidMoves bool
}

// Job is one exploration point to schedule.
type Job struct {
	ID  string
	Rig string
	// X, Y are plan coordinates in feet.
	X, Y float64
	// Hours on the point (set-up, advance, sampling, grouting, tear-down),
	// excluding travel between points.
	Hours float64
	// MoveHours is the plan's allowance for the move to the point (used
	// when the rig's BidMoves is set).
	MoveHours        float64
	Surface          string
	Method           string
	DepthFt          float64
	SampleIntervalFt float64
	// Sampling is the boring's sampling schedule in words, as the plan
	// gives it ("every 2.5 ft to 10 ft, then every 5 ft"); "" for other
	// methods.
	Sampling string
	// Lon, Lat are WGS 84 degrees when the site has an origin; nil if not.
	Lon, Lat *float64
}

// Calendar is the field calendar.
type Calendar struct {
	// Start is the first field day; only its date (in its location) counts.
	Start time.Time
	// WorkStart is the start of the working hours after midnight, e.g. 7h.
	WorkStart time.Duration
	// HoursPerDay is the length of the working day, e.g. 10.
	HoursPerDay float64
	// StartUpHours opens every field day (see the package's StartUpHours,
	// the value the plan assumes); 0: none.
	StartUpHours float64
	// WorkDays are the weekdays worked. Nil means Monday to Friday; a
	// non-nil empty slice is an error.
	WorkDays []time.Weekday
	// WetDates are days known (or assumed) wet.
	WetDates []time.Time
	// WetProbByMonth is the probability that a day of each month (January
	// first) is wet; Risk draws wet days from it, Build ignores it.
	WetProbByMonth [12]float64
}

// Options control the Monte Carlo of Risk.
type Options struct {
	// Seed makes the runs reproducible: the same seed gives the same
	// result bit for bit.
	Seed uint64
	// Runs is the number of simulated schedules; 0 means DefaultRuns.
	Runs int
	// ProductionCV is the coefficient of variation of the hours on points,
	// e.g. 0.2; 0 means the hours are certain.
	ProductionCV float64
}

// DefaultRuns is the number of Monte Carlo runs when Options.Runs is 0. At
// 1000 runs the P80 of a smooth distribution is estimated within about
// ±2.5 percentile points (binomial standard error √(0.8·0.2/1000) ≈ 0.013).
const DefaultRuns = 1000

// MaxRuns bounds Options.Runs so a typo cannot hang the tool.
const MaxRuns = 1_000_000

// maxCalendarDays bounds how far a schedule may run: ten years of calendar
// days. A schedule that does not finish by then is a sign of a calendar that
// bars a rig for good.
const maxCalendarDays = 3653

// InputError is an error in the data given to Build or Risk, or a request a
// renderer cannot meet with the data it has. The CLI maps it to exit code 2.
type InputError struct {
	Field   string // where, e.g. `jobs[3] ("B-4").rig`
	Problem string // what is wrong
	Want    string // what would be right
}

func (e *InputError) Error() string {
	s := "schedule: " + e.Field + ": " + e.Problem
	if e.Want != "" {
		s += "; " + e.Want
	}
	return s
}

// BadInput reports that the error is the caller's input, not a failure.
func (e *InputError) BadInput() bool { return true }

func bad(field, problem, want string, args ...any) *InputError {
	return &InputError{Field: field, Problem: fmt.Sprintf(problem, args...), Want: want}
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// defaultWorkDays are Monday to Friday.
var defaultWorkDays = []time.Weekday{time.Monday, time.Tuesday, time.Wednesday, time.Thursday, time.Friday}

// validCalendar checks the calendar and returns its work-day set.
func validCalendar(cal Calendar) ([7]bool, error) {
	var wd [7]bool
	if cal.Start.IsZero() {
		return wd, bad("calendar.start", "no first field day given", "give the date of the first field day, e.g. 2027-03-01")
	}
	if !finite(cal.HoursPerDay) || cal.HoursPerDay <= 0 || cal.HoursPerDay > 24 {
		return wd, bad("calendar.hours_per_day", "working hours per day are %v", "give hours between 0 and 24, e.g. 10", cal.HoursPerDay)
	}
	if !finite(cal.StartUpHours) || cal.StartUpHours < 0 || cal.StartUpHours >= cal.HoursPerDay {
		return wd, bad("calendar.start_up_hours", "start-up allowance %v h in a %v h day", "give hours ≥ 0 and less than the working day, e.g. 0.5", cal.StartUpHours, cal.HoursPerDay)
	}
	if cal.WorkStart < 0 || cal.WorkStart >= 24*time.Hour {
		return wd, bad("calendar.work_start", "work starts at %v after midnight", "give a time of day from 00:00 to 23:59, e.g. 07:00", cal.WorkStart)
	}
	if end := cal.WorkStart.Hours() + cal.HoursPerDay; end > 24+1e-9 {
		return wd, bad("calendar.hours_per_day", "work starting at %s for %v hours ends after midnight (%.2f h)",
			"start earlier or work fewer hours so the day ends by 24:00", clock(cal.WorkStart), cal.HoursPerDay, end)
	}
	days := cal.WorkDays
	if days == nil {
		days = defaultWorkDays
	}
	if len(days) == 0 {
		return wd, bad("calendar.work_days", "no work days", "list at least one weekday, e.g. Monday to Friday")
	}
	for i, d := range days {
		if d < time.Sunday || d > time.Saturday {
			return wd, bad(fmt.Sprintf("calendar.work_days[%d]", i), "%d is not a weekday", "use Sunday (0) to Saturday (6)", int(d))
		}
		wd[d] = true
	}
	for m, p := range cal.WetProbByMonth {
		if !finite(p) || p < 0 || p > 1 {
			return wd, bad(fmt.Sprintf("calendar.wet_prob_by_month[%s]", time.Month(m+1)), "probability %v", "give a probability from 0 to 1", p)
		}
	}
	return wd, nil
}

func clock(d time.Duration) string {
	m := int(d.Round(time.Minute) / time.Minute)
	return fmt.Sprintf("%02d:%02d", m/60, m%60)
}

// validate checks jobs and rigs and returns the rigs by name.
func validate(jobs []Job, rigs []RigSpec) (map[string]*RigSpec, error) {
	byName := make(map[string]*RigSpec, len(rigs))
	names := make([]string, 0, len(rigs))
	for i := range rigs {
		r := &rigs[i]
		f := fmt.Sprintf("rigs[%d]", i)
		if r.Name == "" {
			return nil, bad(f+".name", "rig has no name", "give each rig its name as used by the plan's points")
		}
		f = fmt.Sprintf("rigs[%d] (%q)", i, r.Name)
		if _, dup := byName[r.Name]; dup {
			return nil, bad(f+".name", "rig named twice", "give each rig once")
		}
		byName[r.Name] = r
		names = append(names, r.Name)
		if len(r.SpeedFtPerHr) == 0 {
			return nil, bad(f+".speed_ft_per_hr", "no travel speed given", "give a speed in ft/hr for each ground surface the rig travels, e.g. firm: 1500")
		}
		for _, s := range sortedKeys(r.SpeedFtPerHr) {
			if v := r.SpeedFtPerHr[s]; !finite(v) || v <= 0 {
				return nil, bad(f+".speed_ft_per_hr."+s, "speed %v ft/hr", "give a speed greater than 0", v)
			}
		}
		if !finite(r.MobHours) || r.MobHours < 0 {
			return nil, bad(f+".mob_hours", "mobilization hours %v", "give hours ≥ 0", r.MobHours)
		}
		if !finite(r.DemobHours) || r.DemobHours < 0 {
			return nil, bad(f+".demob_hours", "demobilization hours %v", "give hours ≥ 0", r.DemobHours)
		}
		if !finite(r.StandbyRate) || r.StandbyRate < 0 {
			return nil, bad(f+".standby_rate", "standby rate %v", "give a price per hour ≥ 0", r.StandbyRate)
		}
		if r.Entrance != nil && (!finite(r.Entrance.XFt) || !finite(r.Entrance.YFt)) {
			return nil, bad(f+".entrance", "entrance at (%v, %v)", "give finite plan coordinates in feet", r.Entrance.XFt, r.Entrance.YFt)
		}
	}
	sort.Strings(names)
	seen := make(map[string]int, len(jobs))
	for i := range jobs {
		j := &jobs[i]
		f := fmt.Sprintf("jobs[%d]", i)
		if j.ID == "" {
			return nil, bad(f+".id", "point has no id", "give each point a unique id")
		}
		f = fmt.Sprintf("jobs[%d] (%q)", i, j.ID)
		if k, dup := seen[j.ID]; dup {
			return nil, bad(f+".id", "id already used by jobs[%d]", "give each point a unique id", k)
		}
		seen[j.ID] = i
		r, ok := byName[j.Rig]
		if !ok {
			return nil, bad(f+".rig", "rig %q is not among the rigs", "use one of: "+strings.Join(names, ", "), j.Rig)
		}
		if !finite(j.X) || !finite(j.Y) {
			return nil, bad(f+".x_ft/y_ft", "position (%v, %v)", "give finite plan coordinates in feet", j.X, j.Y)
		}
		if !finite(j.Hours) || j.Hours <= 0 {
			return nil, bad(f+".hours", "%v hours on the point", "give the hours on the point, greater than 0", j.Hours)
		}
		if j.Hours > 24*maxCalendarDays/10 {
			return nil, bad(f+".hours", "%v hours on one point", "check the units: hours on a point, not minutes", j.Hours)
		}
		if v, ok := r.SpeedFtPerHr[j.Surface]; !ok || v <= 0 {
			return nil, bad(f+".surface", "rig %q has no travel speed for ground %q", fmt.Sprintf("give rigs[%q].speed_ft_per_hr.%s, or a surface it has: %s", r.Name, j.Surface, strings.Join(sortedKeys(r.SpeedFtPerHr), ", ")), r.Name, j.Surface)
		}
		if j.Surface == Wet && !r.WetAccess {
			return nil, bad(f+".rig", "point is on wet ground but rig %q has no wet access", "give the point to a rig with wet access (e.g. a track rig)", r.Name)
		}
		if !finite(j.DepthFt) || j.DepthFt < 0 {
			return nil, bad(f+".depth_ft", "depth %v ft", "give a depth ≥ 0", j.DepthFt)
		}
		if !finite(j.MoveHours) || j.MoveHours < 0 {
			return nil, bad(f+".move_hours", "move allowance %v h", "give hours ≥ 0", j.MoveHours)
		}
		if !finite(j.SampleIntervalFt) || j.SampleIntervalFt < 0 {
			return nil, bad(f+".sample_interval_ft", "sample interval %v ft", "give an interval ≥ 0 (0: none)", j.SampleIntervalFt)
		}
		if (j.Lon == nil) != (j.Lat == nil) {
			return nil, bad(f+".lon/lat", "only one of lon and lat given", "give both or neither")
		}
		if j.Lon != nil && (!finite(*j.Lon) || !finite(*j.Lat) || *j.Lon < -180 || *j.Lon > 180 || *j.Lat < -90 || *j.Lat > 90) {
			return nil, bad(f+".lon/lat", "position (%v, %v)", "give WGS 84 degrees: lon in [-180, 180], lat in [-90, 90]", *j.Lon, *j.Lat)
		}
	}
	return byName, nil
}

func sortedKeys[V any](m map[string]V) []string {
	ks := make([]string, 0, len(m))
	for k := range m {
		ks = append(ks, k)
	}
	sort.Strings(ks)
	return ks
}
