package schedule_test

import (
	"fmt"
	"os"
	"time"

	"github.com/rigmix/rigmix/optimizer/schedule"
)

// A tire-mounted drill with three borings, a wet Tuesday, and the weather
// risk for a spring month. The site and numbers are invented for the demo.
func Example() {
	rigs := []schedule.RigSpec{{
		Name:         "tire-drill",
		SpeedFtPerHr: map[string]float64{schedule.Firm: 1200, schedule.Soft: 500},
		MobHours:     2, DemobHours: 2,
		StandbyItem: "standby-hr", StandbyRate: 180,
		Entrance: &schedule.XY{XFt: 0, YFt: -100},
	}}
	jobs := []schedule.Job{
		{ID: "B-1", Rig: "tire-drill", X: 0, Y: 0, Hours: 6, Surface: schedule.Firm, Method: "boring", DepthFt: 30},
		{ID: "B-2", Rig: "tire-drill", X: 400, Y: 300, Hours: 7, Surface: schedule.Soft, Method: "boring", DepthFt: 40},
		{ID: "B-3", Rig: "tire-drill", X: 400, Y: 0, Hours: 5, Surface: schedule.Firm, Method: "boring", DepthFt: 30},
	}
	cal := schedule.Calendar{
		Start: time.Date(2027, 4, 5, 0, 0, 0, 0, time.UTC), WorkStart: 7 * time.Hour, HoursPerDay: 10,
		StartUpHours: schedule.StartUpHours,
		WetDates:     []time.Time{time.Date(2027, 4, 6, 0, 0, 0, 0, time.UTC)},
	}
	s, err := schedule.Build(jobs, rigs, cal)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("route:", s.Rigs[0].Route, "finish:", s.Finish.Format("2006-01-02"), "standby:", s.StandbyHours, "h")
	_ = schedule.WriteCSV(os.Stdout, s)

	cal.WetProbByMonth[time.April-1] = 0.2
	r, err := schedule.Risk(jobs, rigs, cal, schedule.Options{Seed: 42, Runs: 500, ProductionCV: 0.2})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("P50 ≤ P80:", !r.P80Finish.Before(r.P50Finish))
	// Output:
	// route: [B-1 B-3 B-2] finish: 2027-04-08 standby: 9.5 h
	// rig,date,work_day,start,end,hours,kind,point,method,depth_ft,spans_days,wet
	// tire-drill,2027-04-05,1,07:00,07:30,0.50,start-up,,,,false,false
	// tire-drill,2027-04-05,1,07:30,09:30,2.00,mobilize,,,,false,false
	// tire-drill,2027-04-05,1,09:30,09:35,0.08,travel,B-1,,,false,false
	// tire-drill,2027-04-05,1,09:35,15:35,6.00,work,B-1,boring,30.0,false,false
	// tire-drill,2027-04-05,1,15:35,15:55,0.33,travel,B-3,,,false,false
	// tire-drill,2027-04-05,1,15:55,17:00,1.08,work,B-3,boring,30.0,true,false
	// tire-drill,2027-04-06,2,07:00,07:30,0.50,start-up,,,,false,true
	// tire-drill,2027-04-06,2,07:30,17:00,9.50,standby,,,,false,true
	// tire-drill,2027-04-07,3,07:00,07:30,0.50,start-up,,,,false,false
	// tire-drill,2027-04-07,3,07:30,11:25,3.92,work,B-3,boring,30.0,true,false
	// tire-drill,2027-04-07,3,11:25,11:50,0.42,travel,B-2,,,false,false
	// tire-drill,2027-04-07,3,11:50,17:00,5.16,work,B-2,boring,40.0,true,false
	// tire-drill,2027-04-08,4,07:00,07:30,0.50,start-up,,,,false,false
	// tire-drill,2027-04-08,4,07:30,09:20,1.84,work,B-2,boring,40.0,true,false
	// tire-drill,2027-04-08,4,09:20,11:20,2.00,demobilize,,,,false,false
	// P50 ≤ P80: true
}
