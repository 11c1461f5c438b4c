package schedule

import (
	"bytes"
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
	"time"
)

func tireRig() RigSpec {
	return RigSpec{Name: "tire-drill", SpeedFtPerHr: map[string]float64{Firm: 1200, Soft: 500},
		MobHours: 2, DemobHours: 2, StandbyItem: "standby-hr", StandbyRate: 180}
}

func trackRig() RigSpec {
	return RigSpec{Name: "track-drill", SpeedFtPerHr: map[string]float64{Firm: 800, Soft: 600, Wet: 400},
		WetAccess: true, MobHours: 3, DemobHours: 3, StandbyItem: "standby-hr", StandbyRate: 210}
}

// checkInvariants asserts what every schedule must satisfy: each entry
// inside the working hours of a working day, entries in time order without
// overlap, days in order, each job routed once with exactly its hours of
// work, travel equal to the route's legs, mobilization first and
// demobilization last.
func checkInvariants(t *testing.T, s *Schedule, jobs []Job, rigs []RigSpec, cal Calendar) {
	t.Helper()
	work := map[time.Weekday]bool{}
	wds := cal.WorkDays
	if wds == nil {
		wds = defaultWorkDays
	}
	for _, d := range wds {
		work[d] = true
	}
	workH := map[string]float64{}
	travelH := map[string]float64{}
	pieces := map[string]int{}
	days := map[string]map[time.Time]bool{}
	routed := map[string]int{}
	for _, r := range s.Rigs {
		for _, id := range r.Route {
			routed[id]++
		}
		var prevEnd time.Time
		var prevDate time.Time
		for di, d := range r.Days {
			if !work[d.Date.Weekday()] {
				t.Errorf("%s: entries on %s, a %s, which is not a work day", r.Rig, d.Date.Format(dateLayout), d.Date.Weekday())
			}
			if di > 0 && !d.Date.After(prevDate) {
				t.Errorf("%s: day %s does not follow %s", r.Rig, d.Date.Format(dateLayout), prevDate.Format(dateLayout))
			}
			prevDate = d.Date
			open := d.Date.Add(cal.WorkStart)
			shut := open.Add(hoursDur(cal.HoursPerDay))
			if len(d.Entries) == 0 {
				t.Errorf("%s: day %s has no entries", r.Rig, d.Date.Format(dateLayout))
			}
			for _, e := range d.Entries {
				if e.Start.Before(open) || e.End.After(shut) || !e.End.After(e.Start) {
					t.Errorf("%s %s: %s %s %s–%s outside working hours %s–%s", r.Rig, d.Date.Format(dateLayout), e.Kind, e.JobID,
						hhmm(e.Start), hhmm(e.End), hhmm(open), hhmm(shut))
				}
				if e.Start.Before(prevEnd) {
					t.Errorf("%s %s: %s %s starts %s before the previous entry ends", r.Rig, d.Date.Format(dateLayout), e.Kind, e.JobID, hhmm(e.Start))
				}
				prevEnd = e.End
				switch e.Kind {
				case Work:
					workH[e.JobID] += e.Hours
					pieces[e.JobID]++
				case Travel:
					travelH[e.JobID] += e.Hours
				}
				if e.JobID != "" {
					if days[e.JobID] == nil {
						days[e.JobID] = map[time.Time]bool{}
					}
					days[e.JobID][d.Date] = true
				}
			}
		}
		first, last := r.Days[0].Entries[0], r.Days[len(r.Days)-1].Entries
		if first.Kind == StartUp && len(r.Days[0].Entries) > 1 {
			first = r.Days[0].Entries[1]
		}
		if r.MobHours > 0 && first.Kind != Mobilize {
			t.Errorf("%s: first entry is %s, want mobilize", r.Rig, first.Kind)
		}
		if r.DemobHours > 0 && last[len(last)-1].Kind != Demobilize {
			t.Errorf("%s: last entry is %s, want demobilize", r.Rig, last[len(last)-1].Kind)
		}
	}
	for _, j := range jobs {
		if routed[j.ID] != 1 {
			t.Errorf("job %s routed %d times, want once", j.ID, routed[j.ID])
		}
		if math.Abs(workH[j.ID]-j.Hours) > 1e-6 {
			t.Errorf("job %s worked %.4f h, want %.4f h", j.ID, workH[j.ID], j.Hours)
		}
		// A job is worked in one piece a day, on consecutive field days.
		if pieces[j.ID] != len(days[j.ID]) && travelH[j.ID] == 0 {
			t.Errorf("job %s worked in %d pieces on %d days", j.ID, pieces[j.ID], len(days[j.ID]))
		}
	}
	// The day rule: every day but a rig's last is worked to its end (the
	// start-up allowance, moves, work, standby), so that with no wet day a
	// rig's days are ⌈total hours / (hours a day − start-up)⌉.
	for _, r := range s.Rigs {
		total := 0.0
		for k, d := range r.Days {
			h := 0.0
			for _, e := range d.Entries {
				h += e.Hours
				if e.Kind != StartUp && e.Kind != Standby {
					total += e.Hours
				}
			}
			if k < len(r.Days)-1 && math.Abs(h-cal.HoursPerDay) > 1e-6 {
				t.Errorf("%s %s: %.4f h laid in a %v h day that is not the rig's last", r.Rig, d.Date.Format(dateLayout), h, cal.HoursPerDay)
			}
			if k > 0 || cal.StartUpHours > 0 {
				if cal.StartUpHours > 0 && (len(d.Entries) == 0 || d.Entries[0].Kind != StartUp || math.Abs(d.Entries[0].Hours-cal.StartUpHours) > 1e-9) {
					t.Errorf("%s %s: the day does not open with its %.2f h start-up", r.Rig, d.Date.Format(dateLayout), cal.StartUpHours)
				}
			}
		}
		if len(cal.WetDates) == 0 {
			want := int(math.Ceil(total/(cal.HoursPerDay-cal.StartUpHours) - 1e-9))
			if r.FieldDays != want {
				t.Errorf("%s: %d field days for %.4f h at %v h a day less %v h start-up; want %d", r.Rig, r.FieldDays, total, cal.HoursPerDay, cal.StartUpHours, want)
			}
		}
	}
	if len(s.Stakes) != len(jobs) {
		t.Errorf("%d stakes for %d jobs", len(s.Stakes), len(jobs))
	}
}

func TestBuildInvariantsRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261201, 10))
	for tc := 0; tc < 30; tc++ {
		n := 1 + rng.IntN(40)
		jobs := randomJobs(rng, "tire-drill", n, 1500, 900)
		for i := range jobs {
			if rng.IntN(2) == 0 {
				jobs[i].Rig = "track-drill"
			}
			if rng.IntN(8) == 0 {
				jobs[i].Hours = 11 + rng.Float64()*15 // longer than a day: spans
			}
		}
		cal := testCalendar()
		cal.HoursPerDay = 8 + float64(rng.IntN(5))
		cal.Start = cal.Start.AddDate(0, 0, rng.IntN(7)) // any weekday, weekends too
		if tc%3 == 0 {
			cal.WorkDays = []time.Weekday{time.Monday, time.Tuesday, time.Wednesday, time.Thursday, time.Friday, time.Saturday}
		}
		if tc%2 == 0 {
			cal.StartUpHours = StartUpHours
		}
		if tc%4 != 1 {
			for k := 0; k < rng.IntN(6); k++ {
				cal.WetDates = append(cal.WetDates, cal.Start.AddDate(0, 0, rng.IntN(30)))
			}
		}
		rigs := []RigSpec{tireRig(), trackRig()}
		s, err := Build(jobs, rigs, cal)
		if err != nil {
			t.Fatal(err)
		}
		checkInvariants(t, s, jobs, rigs, cal)
	}
}

// TestBuildHandWorked checks clock times against arithmetic on a small
// case: a rig at 600 ft/hr on firm ground, mobilization 2 h, points at
// (0,0), (300,0), (300,400) from an entrance at (0,0).
func TestBuildHandWorked(t *testing.T) {
	rig := RigSpec{Name: "r", SpeedFtPerHr: map[string]float64{Firm: 600}, MobHours: 2, DemobHours: 1.5, Entrance: &XY{}}
	jobs := []Job{
		{ID: "A", Rig: "r", X: 0, Y: 0, Hours: 3, Surface: Firm},
		{ID: "C", Rig: "r", X: 300, Y: 400, Hours: 6, Surface: Firm},
		{ID: "B", Rig: "r", X: 300, Y: 0, Hours: 4, Surface: Firm},
	}
	s, err := Build(jobs, []RigSpec{rig}, testCalendar())
	if err != nil {
		t.Fatal(err)
	}
	r := s.Rigs[0]
	if got := strings.Join(r.Route, ","); got != "A,B,C" {
		t.Fatalf("route %s, want A,B,C (700 ft against 800 ft or more)", got)
	}
	// Day 1 (Mon 2027-03-01): mobilize 07:00–09:00; A 09:00–12:00; move
	// 300 ft = 0.5 h 12:00–12:30; B 12:30–16:30. The move to C, 400 ft =
	// 0.6667 h, takes the 0.5 h left, 16:30–17:00, and goes on day 2 (Tue)
	// 07:00–07:10; C 07:10–13:10; demobilize 13:10–14:40.
	want := []struct{ date, start, end string }{
		{"2027-03-01", "07:00", "09:00"}, {"2027-03-01", "09:00", "12:00"}, {"2027-03-01", "12:00", "12:30"}, {"2027-03-01", "12:30", "16:30"},
		{"2027-03-01", "16:30", "17:00"}, {"2027-03-02", "07:00", "07:10"}, {"2027-03-02", "07:10", "13:10"}, {"2027-03-02", "13:10", "14:40"},
	}
	kinds := []Kind{Mobilize, Work, Travel, Work, Travel, Travel, Work, Demobilize}
	var got []Entry
	var dates []string
	for _, d := range r.Days {
		for _, e := range d.Entries {
			got = append(got, e)
			dates = append(dates, d.Date.Format(dateLayout))
		}
	}
	if len(got) != len(want) {
		t.Fatalf("%d entries, want %d: %+v", len(got), len(want), got)
	}
	for i, w := range want {
		if dates[i] != w.date || hhmm(got[i].Start) != w.start || hhmm(got[i].End) != w.end || got[i].Kind != kinds[i] {
			t.Errorf("entry %d: %s %s %s–%s, want %s %s %s–%s", i, got[i].Kind, dates[i], hhmm(got[i].Start), hhmm(got[i].End), kinds[i], w.date, w.start, w.end)
		}
	}
	if math.Abs(r.RouteFt-700) > 1e-9 || r.FieldDays != 2 || s.FieldDays != 2 {
		t.Errorf("route %.3f ft, %d field days; want 700 ft, 2 days", r.RouteFt, r.FieldDays)
	}
}

func TestBuildWeekendsSkipped(t *testing.T) {
	// Start on a Friday: 3 jobs of 8 h each on a 10 h day, no travel, no
	// mobilization: Fri, Mon, Tue.
	rig := RigSpec{Name: "r", SpeedFtPerHr: map[string]float64{Firm: 600}}
	jobs := []Job{{ID: "1", Rig: "r", Hours: 8, Surface: Firm}, {ID: "2", Rig: "r", Hours: 8, Surface: Firm}, {ID: "3", Rig: "r", Hours: 8, Surface: Firm}}
	cal := testCalendar()
	cal.Start = time.Date(2027, 3, 5, 0, 0, 0, 0, time.UTC) // a Friday
	s, err := Build(jobs, []RigSpec{rig}, cal)
	if err != nil {
		t.Fatal(err)
	}
	var got []string
	for _, d := range s.Rigs[0].Days {
		got = append(got, d.Date.Format("Mon 02"))
	}
	if strings.Join(got, ",") != "Fri 05,Mon 08,Tue 09" {
		t.Errorf("days %v, want Fri 05, Mon 08, Tue 09", got)
	}
	// A Saturday start with Monday–Saturday work days starts that Saturday.
	cal.Start = time.Date(2027, 3, 6, 0, 0, 0, 0, time.UTC)
	cal.WorkDays = []time.Weekday{time.Monday, time.Tuesday, time.Wednesday, time.Thursday, time.Friday, time.Saturday}
	s, err = Build(jobs, []RigSpec{rig}, cal)
	if err != nil {
		t.Fatal(err)
	}
	got = got[:0]
	for _, d := range s.Rigs[0].Days {
		got = append(got, d.Date.Format("Mon 02"))
	}
	if strings.Join(got, ",") != "Sat 06,Mon 08,Tue 09" {
		t.Errorf("days %v, want Sat 06, Mon 08, Tue 09", got)
	}
}

func TestBuildLongJobSpans(t *testing.T) {
	rig := RigSpec{Name: "r", SpeedFtPerHr: map[string]float64{Firm: 600}, MobHours: 4}
	jobs := []Job{{ID: "deep", Rig: "r", Hours: 23, Surface: Firm}}
	s, err := Build(jobs, []RigSpec{rig}, testCalendar())
	if err != nil {
		t.Fatal(err)
	}
	// 4 h mobilization, then 6 + 10 + 7 h of work over three days, each
	// piece flagged.
	var pieces []float64
	for _, d := range s.Rigs[0].Days {
		for _, e := range d.Entries {
			if e.Kind == Work {
				if !e.Spans {
					t.Errorf("piece on %s not flagged as spanning", d.Date.Format(dateLayout))
				}
				pieces = append(pieces, e.Hours)
			}
		}
	}
	if len(pieces) != 3 || pieces[0] != 6 || pieces[1] != 10 || pieces[2] != 7 {
		t.Errorf("work pieces %v, want [6 10 7]", pieces)
	}
}

// TestBuildWetDaysShiftTireRig: a calendar whose wet days bar a tire rig
// shifts each of its work entries by exactly the number of wet work days
// before it, keeps the clock times, and charges a full day of standby for
// each; a track rig with wet access is unaffected.
func TestBuildWetDaysShiftTireRig(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261201, 11))
	jobs := randomJobs(rng, "tire-drill", 25, 1200, 800)
	track := randomJobs(rng, "track-drill", 10, 1200, 800)
	for i := range track {
		track[i].ID = "T" + track[i].ID
	}
	jobs = append(jobs, track...)
	rigs := []RigSpec{tireRig(), trackRig()}
	dry, err := Build(jobs, rigs, testCalendar())
	if err != nil {
		t.Fatal(err)
	}
	// Wet: Wed 3 Mar, Sat 6 Mar (weekend: no effect), Tue 9 and Wed 10 Mar.
	cal := testCalendar()
	cal.WetDates = []time.Time{time.Date(2027, 3, 3, 0, 0, 0, 0, time.UTC), time.Date(2027, 3, 6, 0, 0, 0, 0, time.UTC),
		time.Date(2027, 3, 9, 0, 0, 0, 0, time.UTC), time.Date(2027, 3, 10, 0, 0, 0, 0, time.UTC)}
	wet, err := Build(jobs, rigs, cal)
	if err != nil {
		t.Fatal(err)
	}
	checkInvariants(t, wet, jobs, rigs, cal)
	if dry.Rigs[0].Last.Before(time.Date(2027, 3, 11, 0, 0, 0, 0, time.UTC)) {
		t.Fatalf("dry tire schedule ends %s, before the wet days: the test needs more work", dry.Rigs[0].Last.Format(dateLayout))
	}
	wetWork := map[string]bool{"2027-03-03": true, "2027-03-09": true, "2027-03-10": true}
	type slot struct {
		workDay    int
		start, end string
	}
	work := func(r RigSchedule) map[string][]slot {
		m := map[string][]slot{}
		for _, d := range r.Days {
			for _, e := range d.Entries {
				if e.Kind == Work {
					m[e.JobID] = append(m[e.JobID], slot{d.WorkDay, hhmm(e.Start), hhmm(e.End)})
				}
			}
		}
		return m
	}
	dw, ww := work(dry.Rigs[0]), work(wet.Rigs[0])
	for id, ds := range dw {
		ws := ww[id]
		if len(ws) != len(ds) {
			t.Errorf("%s: %d pieces dry, %d wet", id, len(ds), len(ws))
			continue
		}
		for k := range ds {
			// Wet work days on or before the shifted day: count them on the
			// wet schedule's dates.
			shift := 0
			for _, d := range wet.Rigs[0].Days {
				if d.WorkDay < ws[k].workDay && wetWork[d.Date.Format(dateLayout)] {
					shift++
				}
			}
			if ws[k].workDay != ds[k].workDay+shift || ws[k].start != ds[k].start || ws[k].end != ds[k].end {
				t.Errorf("%s: dry day %d %s–%s, wet day %d %s–%s; want shifted by %d work days, same clock",
					id, ds[k].workDay, ds[k].start, ds[k].end, ws[k].workDay, ws[k].start, ws[k].end, shift)
			}
		}
	}
	if got, want := wet.Rigs[0].FieldDays, dry.Rigs[0].FieldDays+3; got != want {
		t.Errorf("tire rig %d field days wet, want %d (dry %d + 3 wet work days)", got, want, dry.Rigs[0].FieldDays)
	}
	if got := wet.Rigs[0].StandbyHours; got != 30 {
		t.Errorf("tire standby %v h, want 30 (3 wet work days × 10 h)", got)
	}
	if got := wet.Rigs[0].StandbyCost; got != 30*180 {
		t.Errorf("tire standby cost %v, want %v", got, 30*180)
	}
	var a, b bytes.Buffer
	wetTrack, dryTrack := wet.Rigs[1], dry.Rigs[1]
	for i := range wetTrack.Days {
		wetTrack.Days[i].Wet = false // the flag differs; the work must not
	}
	_ = WriteCSV(&a, &Schedule{Rigs: []RigSchedule{wetTrack}})
	_ = WriteCSV(&b, &Schedule{Rigs: []RigSchedule{dryTrack}})
	if a.String() != b.String() || wetTrack.StandbyHours != 0 {
		t.Errorf("track rig with wet access changed on wet days:\n%s\nvs\n%s", a.String(), b.String())
	}
}

func TestBuildWetFirstDayStandsByAfterMobilization(t *testing.T) {
	rig := tireRig()
	jobs := []Job{{ID: "1", Rig: rig.Name, Hours: 4, Surface: Firm}}
	cal := testCalendar()
	cal.WetDates = []time.Time{cal.Start}
	s, err := Build(jobs, []RigSpec{rig}, cal)
	if err != nil {
		t.Fatal(err)
	}
	d := s.Rigs[0].Days[0]
	if len(d.Entries) != 2 || d.Entries[0].Kind != Mobilize || d.Entries[1].Kind != Standby || d.Entries[1].Hours != 8 {
		t.Errorf("wet first day: %+v; want 2 h mobilize then 8 h standby", d.Entries)
	}
}

func TestBuildDeterministic(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261201, 12))
	jobs := randomJobs(rng, "tire-drill", 30, 2000, 1000)
	for i := range jobs[15:] {
		jobs[15+i].Rig = "track-drill"
	}
	cal := testCalendar()
	cal.WetDates = []time.Time{time.Date(2027, 3, 4, 0, 0, 0, 0, time.UTC)}
	render := func() string {
		s, err := Build(jobs, []RigSpec{tireRig(), trackRig()}, cal)
		if err != nil {
			t.Fatal(err)
		}
		var b bytes.Buffer
		for _, f := range []func(*bytes.Buffer, *Schedule) error{
			func(w *bytes.Buffer, s *Schedule) error { return WriteCSV(w, s) },
			func(w *bytes.Buffer, s *Schedule) error { return WriteText(w, s) },
			func(w *bytes.Buffer, s *Schedule) error { return WriteGanttSVG(w, s) },
			func(w *bytes.Buffer, s *Schedule) error { return WriteStakeoutCSV(w, s) },
		} {
			if err := f(&b, s); err != nil {
				t.Fatal(err)
			}
		}
		return b.String()
	}
	if a, b := render(), render(); a != b {
		t.Error("two runs on the same input differ")
	}
}

func TestBadInput(t *testing.T) {
	good := func() ([]Job, []RigSpec, Calendar) {
		return []Job{{ID: "B-1", Rig: "tire-drill", Hours: 4, Surface: Firm}}, []RigSpec{tireRig()}, testCalendar()
	}
	cases := []struct {
		name  string
		edit  func(*[]Job, *[]RigSpec, *Calendar)
		field string
	}{
		{"zero hours per day", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.HoursPerDay = 0 }, "calendar.hours_per_day"},
		{"25 hours per day", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.HoursPerDay = 25 }, "calendar.hours_per_day"},
		{"day past midnight", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.WorkStart = 18 * time.Hour }, "calendar.hours_per_day"},
		{"no work days", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.WorkDays = []time.Weekday{} }, "calendar.work_days"},
		{"no start", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.Start = time.Time{} }, "calendar.start"},
		{"wet probability over 1", func(_ *[]Job, _ *[]RigSpec, c *Calendar) { c.WetProbByMonth[3] = 1.5 }, "calendar.wet_prob_by_month[April]"},
		{"unknown rig", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { (*j)[0].Rig = "crane" }, `jobs[0] ("B-1").rig`},
		{"zero speed", func(_ *[]Job, r *[]RigSpec, _ *Calendar) { (*r)[0].SpeedFtPerHr[Firm] = 0 }, `rigs[0] ("tire-drill").speed_ft_per_hr.firm`},
		{"no speed", func(_ *[]Job, r *[]RigSpec, _ *Calendar) { (*r)[0].SpeedFtPerHr = nil }, `rigs[0] ("tire-drill").speed_ft_per_hr`},
		{"no speed for the ground", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { (*j)[0].Surface = "ice" }, `jobs[0] ("B-1").surface`},
		{"wet point, no wet access", func(j *[]Job, r *[]RigSpec, _ *Calendar) { (*j)[0].Surface = Wet; (*r)[0].SpeedFtPerHr[Wet] = 100 }, `jobs[0] ("B-1").rig`},
		{"zero hours", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { (*j)[0].Hours = 0 }, `jobs[0] ("B-1").hours`},
		{"NaN hours", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { (*j)[0].Hours = math.NaN() }, `jobs[0] ("B-1").hours`},
		{"absurd hours", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { (*j)[0].Hours = 1e6 }, `jobs[0] ("B-1").hours`},
		{"duplicate id", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { *j = append(*j, (*j)[0]) }, `jobs[1] ("B-1").id`},
		{"duplicate rig", func(_ *[]Job, r *[]RigSpec, _ *Calendar) { *r = append(*r, tireRig()) }, `rigs[1] ("tire-drill").name`},
		{"negative mobilization", func(_ *[]Job, r *[]RigSpec, _ *Calendar) { (*r)[0].MobHours = -1 }, `rigs[0] ("tire-drill").mob_hours`},
		{"lon without lat", func(j *[]Job, _ *[]RigSpec, _ *Calendar) { v := 1.0; (*j)[0].Lon = &v }, `jobs[0] ("B-1").lon/lat`},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			j, r, c := good()
			tc.edit(&j, &r, &c)
			_, err := Build(j, r, c)
			var ie *InputError
			if !errors.As(err, &ie) || !ie.BadInput() {
				t.Fatalf("Build: %v, want an InputError", err)
			}
			if ie.Field != tc.field || ie.Want == "" {
				t.Errorf("field %q want %q; hint %q", ie.Field, tc.field, ie.Want)
			}
			if _, err := Risk(j, r, c, Options{Runs: 3}); !errors.As(err, &ie) {
				t.Errorf("Risk: %v, want an InputError", err)
			}
		})
	}
	j, r, c := good()
	if _, err := Build(j, r, c); err != nil {
		t.Fatalf("good input: %v", err)
	}
	for _, o := range []Options{{Runs: -1}, {ProductionCV: -0.1}, {ProductionCV: math.Inf(1)}} {
		var ie *InputError
		if _, err := Risk(j, r, c, o); !errors.As(err, &ie) {
			t.Errorf("Risk %+v: %v, want an InputError", o, err)
		}
	}
}

func TestForeverWetIsAnError(t *testing.T) {
	j := []Job{{ID: "B-1", Rig: "tire-drill", Hours: 4, Surface: Firm}}
	c := testCalendar()
	for m := range c.WetProbByMonth {
		c.WetProbByMonth[m] = 1
	}
	var ie *InputError
	if _, err := Risk(j, []RigSpec{tireRig()}, c, Options{Runs: 2}); !errors.As(err, &ie) {
		t.Errorf("Risk on a calendar wet every day: %v, want an InputError", err)
	}
}

// TestBuildDaylightSaving: clock times stay on the wall clock across the
// change to daylight saving time (US, Sunday 14 March 2027).
func TestBuildDaylightSaving(t *testing.T) {
	loc, err := time.LoadLocation("America/Chicago")
	if err != nil {
		t.Skip("no time zone database:", err)
	}
	rig := RigSpec{Name: "r", SpeedFtPerHr: map[string]float64{Firm: 600}}
	jobs := []Job{{ID: "1", Rig: "r", Hours: 8, Surface: Firm}, {ID: "2", Rig: "r", Hours: 8, Surface: Firm}}
	cal := testCalendar()
	cal.Start = time.Date(2027, 3, 12, 0, 0, 0, 0, loc) // Friday before the change
	s, err := Build(jobs, []RigSpec{rig}, cal)
	if err != nil {
		t.Fatal(err)
	}
	// Friday: job 1 07:00–15:00, job 2 15:00–17:00; Monday: the rest of
	// job 2, 6 h, 07:00–13:00 on the new wall clock.
	wantEnd := []string{"15:00", "13:00"}
	for k, d := range s.Rigs[0].Days {
		e := d.Entries[0]
		if k >= len(wantEnd) || hhmm(e.Start) != "07:00" || hhmm(e.End) != wantEnd[k] {
			t.Errorf("%s: %s–%s, want 07:00–%s wall clock", d.Date.Format(dateLayout), hhmm(e.Start), hhmm(e.End), wantEnd[min(k, 1)])
		}
	}
	if got := s.Rigs[0].Last.Format(dateLayout); got != "2027-03-15" {
		t.Errorf("last day %s, want Monday 2027-03-15", got)
	}
}
