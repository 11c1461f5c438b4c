package schedule

import (
	"fmt"
	"math"
	"math/rand/v2"
	"sort"
	"time"
)

// RiskResult is the outcome of the weather and production Monte Carlo.
type RiskResult struct {
	Runs         int
	Seed         uint64
	ProductionCV float64
	// Planned is the deterministic schedule's finish (Build: given wet
	// dates, planned hours) and its field days.
	Planned          time.Time
	PlannedFieldDays int
	// P50 and P80 of the finish date (the last rig's last day) and of the
	// working days from Calendar.Start to it. Each percentile is taken on
	// its own quantity, so the P80 standby cost need not come from the run
	// of the P80 finish.
	P50Finish, P80Finish       time.Time
	P50FieldDays, P80FieldDays int
	// P50 and P80 of the standby hours and their cost, all rigs together.
	P50StandbyHours, P80StandbyHours float64
	P50StandbyCost, P80StandbyCost   float64
	MeanStandbyCost                  float64
	// The samples, each sorted ascending, for histograms.
	FieldDays    []int
	StandbyHours []float64
	StandbyCost  []float64
}

// lognormalParams gives μ and σ of a lognormal factor with mean 1 and
// coefficient of variation cv: σ² = ln(1 + cv²), μ = −σ²/2 (Johnson, Kotz &
// Balakrishnan, Continuous Univariate Distributions vol. 1, 2nd ed., ch. 14:
// mean e^{μ+σ²/2}, variance (e^{σ²} − 1)e^{2μ+σ²}).
func lognormalParams(cv float64) (mu, sigma float64) {
	s2 := math.Log1p(cv * cv)
	return -s2 / 2, math.Sqrt(s2)
}

// nearestRank is the q-quantile of sorted data by the nearest-rank method
// (Hyndman & Fan 1996, definition 1): the ⌈qN⌉-th smallest value.
func nearestRank(n int, q float64) int {
	k := int(math.Ceil(q*float64(n))) - 1
	return min(max(k, 0), n-1)
}

// Risk runs the seeded Monte Carlo of wet days and production. Run r draws
// from its own PCG stream (Seed, r): first one factor per job in input
// order, then one uniform per calendar day in date order, so the same seed
// gives the same result bit for bit whatever the number of rigs.
func Risk(jobs []Job, rigs []RigSpec, cal Calendar, opt Options) (*RiskResult, error) {
	work, err := validCalendar(cal)
	if err != nil {
		return nil, err
	}
	if _, err := validate(jobs, rigs); err != nil {
		return nil, err
	}
	runs := opt.Runs
	if runs == 0 {
		runs = DefaultRuns
	}
	if runs < 0 || runs > MaxRuns {
		return nil, bad("options.runs", "%d runs", fmt.Sprintf("give 1 to %d runs (0: %d)", MaxRuns, DefaultRuns), opt.Runs)
	}
	if !finite(opt.ProductionCV) || opt.ProductionCV < 0 || opt.ProductionCV > 2 {
		return nil, bad("options.production_cv", "coefficient of variation %v", "give a value from 0 to 2, e.g. 0.2", opt.ProductionCV)
	}
	routes := planRoutes(jobs, rigs)
	base, err := build(cal, work, routes)
	if err != nil {
		return nil, err
	}
	res := &RiskResult{
		Runs: runs, Seed: opt.Seed, ProductionCV: opt.ProductionCV,
		Planned: base.Finish, PlannedFieldDays: base.FieldDays,
	}
	c := newCalx(cal, work)
	mu, sigma := lognormalParams(opt.ProductionCV)
	hours := make([]float64, len(jobs))
	var wet []bool
	offs := make([]int, runs)
	res.FieldDays = make([]int, runs)
	res.StandbyHours = make([]float64, runs)
	res.StandbyCost = make([]float64, runs)
	for r := 0; r < runs; r++ {
		rng := rand.New(rand.NewPCG(opt.Seed, uint64(r)))
		for i := range jobs {
			f := 1.0
			if opt.ProductionCV > 0 {
				f = math.Exp(mu + sigma*rng.NormFloat64())
			}
			hours[i] = jobs[i].Hours * f
		}
		wet = wet[:0]
		c.wet = func(off int) bool {
			for len(wet) <= off {
				d := len(wet)
				u := rng.Float64()
				wet = append(wet, c.given[d] || u < c.prob[c.month(d)-1])
			}
			return wet[off]
		}
		lastOff, lastWD := -1, 0
		var sh, sc float64
		for i := range routes {
			p := lay(c, &routes[i], hours, false)
			if p.err != nil {
				return nil, tooLong(routes[i].rig.Name)
			}
			if p.off > lastOff {
				lastOff, lastWD = p.off, p.workDay
			}
			sh += p.standby
			sc += p.standby * routes[i].rig.StandbyRate
		}
		offs[r], res.FieldDays[r] = lastOff, lastWD
		res.StandbyHours[r], res.StandbyCost[r] = sh, sc
		res.MeanStandbyCost += sc
	}
	res.MeanStandbyCost /= float64(runs)
	sort.Ints(offs)
	sort.Ints(res.FieldDays)
	sort.Float64s(res.StandbyHours)
	sort.Float64s(res.StandbyCost)
	k50, k80 := nearestRank(runs, 0.5), nearestRank(runs, 0.8)
	res.P50Finish, res.P80Finish = c.date(offs[k50]), c.date(offs[k80])
	res.P50FieldDays, res.P80FieldDays = res.FieldDays[k50], res.FieldDays[k80]
	res.P50StandbyHours, res.P80StandbyHours = res.StandbyHours[k50], res.StandbyHours[k80]
	res.P50StandbyCost, res.P80StandbyCost = res.StandbyCost[k50], res.StandbyCost[k80]
	return res, nil
}
