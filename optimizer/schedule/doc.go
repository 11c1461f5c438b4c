// Package schedule turns a plan's points into a field schedule: the order in
// which each rig visits its points (its route), a day-by-day plan of
// mobilization, moves, work, standby and demobilization inside the working
// hours of working days, the weather risk to the finish date and to standby
// cost, and a stakeout list for the survey crew.
//
// It takes plain data in (Job, RigSpec, Calendar, Options) and gives plain
// data out (Schedule, RiskResult); renderers write CSV, text, an SVG Gantt
// chart and stakeout CSV or GeoJSON to an io.Writer. It reads no files and no
// flags.
//
// # Routes
//
// Each rig's points form an open path that starts at the rig's site entrance
// (RigSpec.Entrance) or, without one, at whichever of its points makes the
// path shortest. The cost of a leg is the travel time in hours: the straight-line
// distance, half over the ground of each end, at the rig's speed for that
// ground. Because the leg cost is symmetric, reversing a stretch of the path
// does not change its cost, which is what 2-opt relies on.
//
// Up to ExactRouteMax points the shortest open path is found exactly by the
// Held–Karp dynamic programme (Held & Karp 1962, "A dynamic programming
// approach to sequencing problems", J. SIAM 10(1):196–210). Beyond that the
// route is built by nearest neighbour and improved by 2-opt (Croes 1958,
// Oper. Res. 6(6):791–812) and Or-opt moves of one to three consecutive
// points (Or 1976, PhD thesis, Northwestern University) until neither gains;
// on random uniform instances such local search ends a few per cent above
// optimal (Johnson & McGeoch 1997, "The traveling salesman problem: a case
// study in local optimization", in Aarts & Lenstra, Local Search in
// Combinatorial Optimization, ch. 8).
//
// # Days
//
// Rigs work in parallel and independently. A rig mobilizes on the first
// working day at the start of the working hours. Each point is then a block
// of the move to it followed by the work on it. A block that does not fit in
// what is left of the day starts at the beginning of the next working day; a
// block longer than a whole working day starts at once and spans days, each
// piece flagged Spans. Demobilization follows the last point under the same
// rule. Days not in Calendar.WorkDays are skipped.
//
// # Wet days
//
// The rule is kept simple on purpose: on a wet working day a rig without wet
// access cannot move or work at all — the ground between points is wet too —
// and stands by for the rest of the working day (standby hours priced at its
// standby rate). A rig with wet access works normally. Mobilization and
// demobilization travel on roads and are not stopped by wet ground. A rig
// stands by only between its arrival and its last point.
//
// # Weather risk
//
// Risk repeats the day placement many times with a seeded PCG generator
// (math/rand/v2): each calendar day is wet with the probability given for its
// month (in addition to the given wet dates), and the hours on each point are
// multiplied by a lognormal factor of mean 1 and the given coefficient of
// variation. Routes do not change between runs. P50 and P80 are nearest-rank
// percentiles (Hyndman & Fan 1996, "Sample quantiles in statistical
// packages", Am. Stat. 50(4):361–365, definition 1), so each is a value that
// occurred in a run and P50 ≤ P80 always.
//
// # Calling it
//
// The command layer builds one Job per plan point and one RigSpec per
// mobilized rig, a Calendar from its flags or config, then calls Build and
// the renderers it needs, and Risk with Options when a weather risk is asked.
// Errors that are the caller's input are *InputError (BadInput() reports
// true; map them to exit code 2); errors.As finds them. Everything else is a
// failure to write.
//
//	s, err := schedule.Build(jobs, rigs, cal)
//	if err != nil { ... }
//	schedule.WriteText(os.Stdout, s)
//	schedule.WriteCSV(csvFile, s)
//	schedule.WriteGanttSVG(svgFile, s)
//	schedule.WriteStakeoutCSV(stakeFile, s)
//	r, err := schedule.Risk(jobs, rigs, cal, schedule.Options{Seed: 1, Runs: 1000, ProductionCV: 0.2})
//	schedule.WriteRiskText(os.Stdout, r)
package schedule
