package schedule

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"time"
)

// Kind says what a rig does during an entry of its day.
type Kind string

// The kinds of entries.
const (
	Mobilize   Kind = "mobilize"   // travel from the yard to the site
	Travel     Kind = "travel"     // move on site to the next point
	Work       Kind = "work"       // on the point: set-up to tear-down
	Standby    Kind = "standby"    // on site, kept from working by wet ground
	Demobilize Kind = "demobilize" // travel back to the yard
	StartUp    Kind = "start-up"   // the allowance that opens every field day
)

// StartUpHours is the start-up allowance of a field day: the morning
// safety meeting and rig check, and, when a point was left unfinished the
// evening before (a boring cased and capped, a pit covered and fenced, a
// sounding's rods left in), re-rigging it — half an hour (common
// practice). The plan's day count uses the same allowance
// (Calendar.StartUpHours).
const StartUpHours = 0.5

// Entry is one stretch of a rig's day.
type Entry struct {
	Kind Kind
	// JobID is the point worked on, or moved to; empty for mobilization,
	// demobilization and standby.
	JobID   string
	Method  string
	DepthFt float64
	// Start and End are clock times inside the day's working hours.
	Start, End time.Time
	Hours      float64
	// Spans marks a piece of a stretch too long for one working day, which
	// goes on over several days.
	Spans bool
}

// Day is one working day of one rig on site.
type Day struct {
	Date time.Time // midnight, in the calendar's location
	// WorkDay counts working days from Calendar.Start (1 for the first).
	WorkDay int
	Wet     bool
	Entries []Entry
}

// RigSchedule is the route and the days of one rig.
type RigSchedule struct {
	Rig string
	// Route lists the rig's point ids in visiting order.
	Route   []string
	RouteFt float64 // length of the route, from the entrance if given
	// Hours by kind over the whole stay.
	MobHours, TravelHours, WorkHours, StandbyHours, DemobHours, StartUpHours float64
	// RouteTravelHours is the route's own travel at the rig's speeds; it
	// differs from TravelHours when the moves are laid at the plan's
	// allowances (RigSpec.BidMoves).
	RouteTravelHours         float64
	StandbyItem              string
	StandbyRate, StandbyCost float64
	// First and Last are the dates of arrival and departure; FieldDays the
	// working days between them, both included, standby days too.
	First, Last time.Time
	FieldDays   int
	Days        []Day
}

// Stake is one line of the stakeout list: a point to mark in the field and
// when its rig reaches it.
type Stake struct {
	ID               string
	Rig              string
	Seq              int // place on the rig's route, from 1
	Method           string
	XFt, YFt         float64
	Lon, Lat         *float64
	DepthFt          float64
	SampleIntervalFt float64
	Sampling         string    // the boring's sampling schedule in words; "" for other methods
	Date             time.Time // the day work on the point starts
	WorkDay          int
}

// Schedule is a deterministic field schedule.
type Schedule struct {
	Start       time.Time // first field day (midnight, calendar location)
	WorkStart   time.Duration
	HoursPerDay float64
	WorkDays    []time.Weekday
	// Rigs in the order given to Build; rigs without points are left out.
	Rigs []RigSchedule
	// Stakes sorted by date, rig name and route place.
	Stakes []Stake
	// Finish is the last day of the last rig; FieldDays the working days
	// from Start to Finish, both included.
	Finish       time.Time
	FieldDays    int
	StandbyHours float64
	StandbyCost  float64
}

// fitEps absorbs rounding when deciding whether a stretch fits in a day.
const fitEps = 1e-9

// calx is a validated calendar in a form quick to ask.
type calx struct {
	loc         *time.Location
	y           int
	m           time.Month
	d           int
	weekday0    time.Weekday
	workStartS  int64
	hoursPerDay float64
	startUp     float64
	work        [7]bool
	given       map[int]bool   // wet day offsets given by Calendar.WetDates
	wet         func(int) bool // wet day test for this pass
	prob        [12]float64    // wet probability by month
	months      []time.Month   // month of each calendar offset, filled on demand
}

func newCalx(cal Calendar, work [7]bool) *calx {
	c := &calx{
		loc: cal.Start.Location(), weekday0: cal.Start.Weekday(),
		workStartS: int64(cal.WorkStart / time.Second), hoursPerDay: cal.HoursPerDay, startUp: cal.StartUpHours,
		work: work, given: map[int]bool{}, prob: cal.WetProbByMonth,
	}
	c.y, c.m, c.d = cal.Start.Date()
	for _, w := range cal.WetDates {
		c.given[civilDays(cal.Start, w)] = true
	}
	c.wet = func(off int) bool { return c.given[off] }
	return c
}

// civilDays counts calendar days from a's date to b's date, each read in its
// own location.
func civilDays(a, b time.Time) int {
	ya, ma, da := a.Date()
	yb, mb, db := b.Date()
	ta := time.Date(ya, ma, da, 12, 0, 0, 0, time.UTC)
	tb := time.Date(yb, mb, db, 12, 0, 0, 0, time.UTC)
	return int(math.Round(tb.Sub(ta).Hours() / 24))
}

func (c *calx) date(off int) time.Time { return time.Date(c.y, c.m, c.d+off, 0, 0, 0, 0, c.loc) }

// at is the clock time h working hours into the day at offset off.
func (c *calx) at(off int, h float64) time.Time {
	s := c.workStartS + int64(math.Round(h*3600))
	return time.Date(c.y, c.m, c.d+off, 0, 0, int(s), 0, c.loc)
}

func (c *calx) isWork(off int) bool { return c.work[(int(c.weekday0)+off)%7] }

func (c *calx) month(off int) time.Month {
	for len(c.months) <= off {
		c.months = append(c.months, c.date(len(c.months)).Month())
	}
	return c.months[off]
}

var errTooLong = errors.New("schedule runs past ten years")

// placer lays one rig's route into days.
type placer struct {
	c       *calx
	barred  bool // no wet access: cannot move or work on wet days
	record  bool // keep entries (false in Monte Carlo runs)
	off     int  // calendar day offset of the current day
	workDay int
	used    float64 // working hours used in the current day
	days    []Day
	standby float64
	err     error
}

func (p *placer) begin() {
	p.off, p.workDay = 0, 1
	for !p.c.isWork(p.off) {
		p.off++
	}
	p.openDay()
}

func (p *placer) openDay() {
	if p.record {
		p.days = append(p.days, Day{Date: p.c.date(p.off), WorkDay: p.workDay, Wet: p.c.wet(p.off)})
	}
	if p.c.startUp > 0 {
		p.add(StartUp, nil, p.c.startUp, false)
	}
}

func (p *placer) nextDay() {
	p.off++
	for !p.c.isWork(p.off) {
		p.off++
	}
	p.workDay++
	p.used = 0
	if p.off > maxCalendarDays && p.err == nil {
		p.err = errTooLong
	}
	p.openDay()
}

// ensureDry stands the rig by through wet days it cannot work on.
func (p *placer) ensureDry() {
	for p.barred && p.err == nil && p.c.wet(p.off) {
		if rest := p.c.hoursPerDay - p.used; rest > fitEps {
			p.add(Standby, nil, rest, false)
			p.standby += rest
		}
		p.nextDay()
	}
}

// add records an entry of h hours from the current position.
func (p *placer) add(k Kind, j *Job, h float64, spans bool) {
	if p.record {
		e := Entry{Kind: k, Start: p.c.at(p.off, p.used), End: p.c.at(p.off, p.used+h), Hours: h, Spans: spans}
		if j != nil {
			e.JobID = j.ID
			if k == Work {
				e.Method, e.DepthFt = j.Method, j.DepthFt
			}
		}
		d := &p.days[len(p.days)-1]
		d.Entries = append(d.Entries, e)
	}
	p.used += h
}

// put lays h hours from the current position, going on over the next
// working days when the day runs out. ground stretches stop on wet days for
// a barred rig.
func (p *placer) put(k Kind, j *Job, h float64, ground bool) {
	if h <= fitEps {
		return
	}
	spans := h > p.c.hoursPerDay-p.used+fitEps
	for h > fitEps && p.err == nil {
		if ground {
			p.ensureDry()
		}
		avail := p.c.hoursPerDay - p.used
		if avail <= fitEps {
			p.nextDay()
			continue
		}
		take := math.Min(avail, h)
		if h-take <= fitEps {
			take = h
		}
		p.add(k, j, take, spans)
		h -= take
	}
}

// block lays a move of t hours and then h hours of k. The day rule (what a
// field coordinator plans by, and what the plan's day count assumes): work
// goes on to the end of the working day, and a point unfinished then is
// made safe and finished the next morning after the day's start-up
// allowance (Calendar.StartUpHours). A rig's days are therefore
// ⌈(mobilization + moves + hours on points + demobilization) / (hours a day −
// start-up)⌉ when no wet day stands it by.
func (p *placer) block(k Kind, j *Job, t, h float64, ground bool) {
	p.put(Travel, j, t, ground)
	p.put(k, j, h, ground)
}

// plannedRoute is one rig's route, ready to lay into days.
type plannedRoute struct {
	rig    *RigSpec
	jobs   []*Job    // in visiting order
	index  []int     // input index of each job, in visiting order
	travel []float64 // hours of the move to each job, as laid
	legs   float64   // hours of the route's own legs
	feet   float64
}

func planRoutes(jobs []Job, rigs []RigSpec) []plannedRoute {
	var out []plannedRoute
	for ri := range rigs {
		r := &rigs[ri]
		var js []*Job
		var idx []int
		for i := range jobs {
			if jobs[i].Rig == r.Name {
				js = append(js, &jobs[i])
				idx = append(idx, i)
			}
		}
		if len(js) == 0 {
			continue
		}
		l := newLegs(r, js)
		order := l.route()
		pr := plannedRoute{rig: r}
		prev, px, py, have := 0, 0.0, 0.0, false
		if r.Entrance != nil {
			px, py, have = r.Entrance.XFt, r.Entrance.YFt, true
		}
		for _, v := range order {
			j := js[v-1]
			pr.jobs = append(pr.jobs, j)
			pr.index = append(pr.index, idx[v-1])
			leg := l.at(prev, v)
			pr.legs += leg
			if r.BidMoves {
				leg = j.MoveHours
			}
			pr.travel = append(pr.travel, leg)
			if have {
				pr.feet += math.Hypot(j.X-px, j.Y-py)
			}
			px, py, have, prev = j.X, j.Y, true, v
		}
		out = append(out, pr)
	}
	return out
}

// lay places one route into days; hours scales the hours on each point
// (nil: as given).
func lay(c *calx, pr *plannedRoute, hours []float64, record bool) *placer {
	p := &placer{c: c, barred: !pr.rig.WetAccess, record: record}
	p.begin()
	p.put(Mobilize, nil, pr.rig.MobHours, false)
	for k, j := range pr.jobs {
		h := j.Hours
		if hours != nil {
			h = hours[pr.index[k]]
		}
		p.block(Work, j, pr.travel[k], h, true)
	}
	p.block(Demobilize, nil, 0, pr.rig.DemobHours, false)
	return p
}

// Build makes the deterministic schedule: routes by rig, then days, with the
// wet dates of the calendar (its monthly probabilities are for Risk).
func Build(jobs []Job, rigs []RigSpec, cal Calendar) (*Schedule, error) {
	work, err := validCalendar(cal)
	if err != nil {
		return nil, err
	}
	if _, err := validate(jobs, rigs); err != nil {
		return nil, err
	}
	return build(cal, work, planRoutes(jobs, rigs))
}

// build lays planned routes into days with the calendar's given wet dates.
func build(cal Calendar, work [7]bool, routes []plannedRoute) (*Schedule, error) {
	c := newCalx(cal, work)
	s := &Schedule{
		Start: c.date(0), WorkStart: cal.WorkStart, HoursPerDay: cal.HoursPerDay,
		WorkDays: workDayList(work),
	}
	for i := range routes {
		pr := &routes[i]
		p := lay(c, pr, nil, true)
		if p.err != nil {
			return nil, tooLong(pr.rig.Name)
		}
		rs := RigSchedule{
			Rig: pr.rig.Name, RouteFt: pr.feet, RouteTravelHours: pr.legs, StandbyItem: pr.rig.StandbyItem,
			StandbyRate: pr.rig.StandbyRate, Days: p.days,
		}
		seq := map[string]int{}
		for k, j := range pr.jobs {
			rs.Route = append(rs.Route, j.ID)
			seq[j.ID] = k + 1
		}
		first := map[string]Day{}
		for _, d := range p.days {
			for _, e := range d.Entries {
				switch e.Kind {
				case Mobilize:
					rs.MobHours += e.Hours
				case Travel:
					rs.TravelHours += e.Hours
				case Work:
					rs.WorkHours += e.Hours
					if _, ok := first[e.JobID]; !ok {
						first[e.JobID] = d
					}
				case Standby:
					rs.StandbyHours += e.Hours
				case Demobilize:
					rs.DemobHours += e.Hours
				case StartUp:
					rs.StartUpHours += e.Hours
				}
			}
		}
		rs.StandbyCost = rs.StandbyHours * rs.StandbyRate
		rs.First, rs.Last = p.days[0].Date, p.days[len(p.days)-1].Date
		rs.FieldDays = p.days[len(p.days)-1].WorkDay - p.days[0].WorkDay + 1
		for _, j := range pr.jobs {
			d := first[j.ID]
			s.Stakes = append(s.Stakes, Stake{
				ID: j.ID, Rig: j.Rig, Seq: seq[j.ID], Method: j.Method, XFt: j.X, YFt: j.Y,
				Lon: j.Lon, Lat: j.Lat, DepthFt: j.DepthFt, SampleIntervalFt: j.SampleIntervalFt,
				Sampling: j.Sampling, Date: d.Date, WorkDay: d.WorkDay,
			})
		}
		s.StandbyHours += rs.StandbyHours
		s.StandbyCost += rs.StandbyCost
		if rs.Last.After(s.Finish) || s.Finish.IsZero() {
			s.Finish = rs.Last
			s.FieldDays = p.days[len(p.days)-1].WorkDay
		}
		s.Rigs = append(s.Rigs, rs)
	}
	sort.SliceStable(s.Stakes, func(a, b int) bool {
		x, y := s.Stakes[a], s.Stakes[b]
		if !x.Date.Equal(y.Date) {
			return x.Date.Before(y.Date)
		}
		if x.Rig != y.Rig {
			return x.Rig < y.Rig
		}
		return x.Seq < y.Seq
	})
	return s, nil
}

func tooLong(rig string) error {
	return bad(fmt.Sprintf("rig %q", rig), "the schedule does not finish within ten years",
		"check the calendar: wet dates or wet probabilities that keep a rig without wet access from working for good, or hours in the wrong units")
}

func workDayList(work [7]bool) []time.Weekday {
	var out []time.Weekday
	for d := time.Sunday; d <= time.Saturday; d++ {
		if work[d] {
			out = append(out, d)
		}
	}
	return out
}

func hoursDur(h float64) time.Duration { return time.Duration(math.Round(h*3600)) * time.Second }
