package schedule

import (
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
	"time"
)

func riskCase() ([]Job, []RigSpec, Calendar) {
	rng := rand.New(rand.NewPCG(20261201, 20))
	jobs := randomJobs(rng, "tire-drill", 30, 1500, 900)
	for i := range jobs[20:] {
		jobs[20+i].Rig = "track-drill"
	}
	cal := testCalendar()
	for m := range cal.WetProbByMonth {
		cal.WetProbByMonth[m] = 0.25
	}
	return jobs, []RigSpec{tireRig(), trackRig()}, cal
}

func TestRiskReproducibleAndOrdered(t *testing.T) {
	jobs, rigs, cal := riskCase()
	opt := Options{Seed: 7, Runs: 400, ProductionCV: 0.2}
	a, err := Risk(jobs, rigs, cal, opt)
	if err != nil {
		t.Fatal(err)
	}
	b, err := Risk(jobs, rigs, cal, opt)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(a, b) {
		t.Error("same seed, different results")
	}
	for i := range a.StandbyCost {
		if math.Float64bits(a.StandbyCost[i]) != math.Float64bits(b.StandbyCost[i]) {
			t.Fatalf("run %d standby cost differs in its bits", i)
		}
	}
	opt.Seed = 8
	c, err := Risk(jobs, rigs, cal, opt)
	if err != nil {
		t.Fatal(err)
	}
	if reflect.DeepEqual(a.StandbyCost, c.StandbyCost) && reflect.DeepEqual(a.FieldDays, c.FieldDays) {
		t.Error("seeds 7 and 8 gave the same samples")
	}
	for _, r := range []*RiskResult{a, c} {
		if r.P80Finish.Before(r.P50Finish) || r.P80FieldDays < r.P50FieldDays || r.P80StandbyCost < r.P50StandbyCost || r.P80StandbyHours < r.P50StandbyHours {
			t.Errorf("seed %d: P50 above P80: %+v", r.Seed, r)
		}
		if len(r.FieldDays) != 400 {
			t.Errorf("%d samples, want 400", len(r.FieldDays))
		}
	}
}

// TestRiskNoUncertainty: with no wet days and certain hours every run is
// the plan.
func TestRiskNoUncertainty(t *testing.T) {
	jobs, rigs, cal := riskCase()
	cal.WetProbByMonth = [12]float64{}
	r, err := Risk(jobs, rigs, cal, Options{Seed: 1, Runs: 50})
	if err != nil {
		t.Fatal(err)
	}
	if !r.P50Finish.Equal(r.Planned) || !r.P80Finish.Equal(r.Planned) || r.P80StandbyCost != 0 || r.P50FieldDays != r.PlannedFieldDays {
		t.Errorf("no uncertainty: planned %s (%d days), P50 %s, P80 %s, P80 standby %v", r.Planned.Format(dateLayout), r.PlannedFieldDays,
			r.P50Finish.Format(dateLayout), r.P80Finish.Format(dateLayout), r.P80StandbyCost)
	}
}

// TestRiskWetDaysNegativeBinomial: a rig without wet access needs D dry
// working days (one 10 h point a day, no moves, no mobilization). Days are
// wet independently with probability p, so the wet working days it waits
// through before its D-th dry one follow the negative binomial law with
// mean D·p/(1−p) and variance D·p/(1−p)² (Feller, An Introduction to
// Probability Theory and Its Applications, vol. 1, 3rd ed., VI.8).
func TestRiskWetDaysNegativeBinomial(t *testing.T) {
	const D, p, runs, H = 5, 0.3, 4000, 10.0
	rig := RigSpec{Name: "tire", SpeedFtPerHr: map[string]float64{Firm: 1000}, StandbyRate: 100}
	var jobs []Job
	for i := 0; i < D; i++ {
		jobs = append(jobs, Job{ID: itoa(i), Rig: "tire", Hours: H, Surface: Firm})
	}
	cal := testCalendar()
	for m := range cal.WetProbByMonth {
		cal.WetProbByMonth[m] = p
	}
	r, err := Risk(jobs, []RigSpec{rig}, cal, Options{Seed: 3, Runs: runs})
	if err != nil {
		t.Fatal(err)
	}
	mean := 0.0
	for _, h := range r.StandbyHours {
		mean += h / H
	}
	mean /= runs
	want := D * p / (1 - p)
	se := math.Sqrt(D*p/((1-p)*(1-p))) / math.Sqrt(runs)
	if math.Abs(mean-want) > 4*se {
		t.Errorf("mean wet working days %.4f, want %.4f ± %.4f (4 standard errors)", mean, want, 4*se)
	}
	if math.Abs(r.MeanStandbyCost-mean*H*100) > 1e-6 {
		t.Errorf("mean standby cost %.2f, want %.2f (hours × rate)", r.MeanStandbyCost, mean*H*100)
	}
	// Field days are D plus the wet working days: the P50 is the median of
	// D + NB(D, p); check against the median of the exact law.
	cdf, k := 0.0, 0
	for ; ; k++ {
		cdf += nbPMF(D, p, k)
		if cdf >= 0.5 {
			break
		}
	}
	if r.P50FieldDays < D+k-1 || r.P50FieldDays > D+k+1 {
		t.Errorf("P50 field days %d, want about %d (median of D + negative binomial)", r.P50FieldDays, D+k)
	}
}

// nbPMF is P(K = k) for the number of failures before the r-th success with
// success probability 1−p: C(k+r−1, k)·(1−p)^r·p^k.
func nbPMF(r int, p float64, k int) float64 {
	lg := func(x float64) float64 { v, _ := math.Lgamma(x); return v }
	return math.Exp(lg(float64(k+r)) - lg(float64(k+1)) - lg(float64(r)) + float64(r)*math.Log(1-p) + float64(k)*math.Log(p))
}

// TestLognormalFactor: the production factor has mean 1 and the asked
// coefficient of variation (moments of the lognormal, Johnson, Kotz &
// Balakrishnan vol. 1 ch. 14).
func TestLognormalFactor(t *testing.T) {
	for _, cv := range []float64{0.1, 0.2, 0.5} {
		mu, sigma := lognormalParams(cv)
		mean := math.Exp(mu + sigma*sigma/2)
		sd := math.Sqrt((math.Exp(sigma*sigma) - 1) * math.Exp(2*mu+sigma*sigma))
		if math.Abs(mean-1) > 1e-12 || math.Abs(sd/mean-cv) > 1e-12 {
			t.Errorf("cv %v: mean %v, cv %v", cv, mean, sd/mean)
		}
		rng := rand.New(rand.NewPCG(1, 2))
		const n = 200000
		s, s2 := 0.0, 0.0
		for i := 0; i < n; i++ {
			x := math.Exp(mu + sigma*rng.NormFloat64())
			s += x
			s2 += x * x
		}
		m := s / n
		v := s2/n - m*m
		if math.Abs(m-1) > 5*cv/math.Sqrt(n) || math.Abs(math.Sqrt(v)/m-cv) > 0.02*cv {
			t.Errorf("cv %v: sample mean %.5f, sample cv %.5f", cv, m, math.Sqrt(v)/m)
		}
	}
}

func TestNearestRank(t *testing.T) {
	// Hyndman & Fan (1996) definition 1 on 1..10: Q(0.5) = 5, Q(0.8) = 8.
	if a, b := nearestRank(10, 0.5), nearestRank(10, 0.8); a != 4 || b != 7 {
		t.Errorf("ranks %d, %d; want indices 4 and 7", a, b)
	}
	if a := nearestRank(1, 0.8); a != 0 {
		t.Errorf("one sample: index %d", a)
	}
}

func TestRiskGivenWetDatesAlwaysWet(t *testing.T) {
	jobs := []Job{{ID: "1", Rig: "tire-drill", Hours: 4, Surface: Firm}}
	cal := testCalendar()
	cal.WetDates = []time.Time{cal.Start.AddDate(0, 0, 1)}
	rig := tireRig()
	rig.MobHours = 10 // day 1 is all mobilization; day 2 is wet in every run
	r, err := Risk(jobs, []RigSpec{rig}, cal, Options{Seed: 5, Runs: 20})
	if err != nil {
		t.Fatal(err)
	}
	if r.StandbyHours[0] != 10 || r.P50FieldDays != 3 {
		t.Errorf("given wet date: least standby %v h, P50 days %d; want 10 h and 3 days", r.StandbyHours[0], r.P50FieldDays)
	}
}

// TestRiskMonthlyProbability: April certain wet, other months dry. A rig
// without wet access needing ten full days from Monday 29 March 2027 works
// 29–31 March, stands by every working day of April 2027 (22: thirty days
// less eight weekend days) and finishes the other seven in May, on Tuesday
// 11 May (calendar arithmetic).
func TestRiskMonthlyProbability(t *testing.T) {
	rig := RigSpec{Name: "tire", SpeedFtPerHr: map[string]float64{Firm: 1000}, StandbyRate: 100}
	var jobs []Job
	for i := 0; i < 10; i++ {
		jobs = append(jobs, Job{ID: itoa(i), Rig: "tire", Hours: 10, Surface: Firm})
	}
	cal := testCalendar()
	cal.Start = time.Date(2027, 3, 29, 0, 0, 0, 0, time.UTC)
	cal.WetProbByMonth[time.April-1] = 1
	r, err := Risk(jobs, []RigSpec{rig}, cal, Options{Seed: 9, Runs: 10})
	if err != nil {
		t.Fatal(err)
	}
	if got := r.P50Finish.Format(dateLayout); got != "2027-05-11" || r.P80Finish.Format(dateLayout) != got {
		t.Errorf("P50/P80 finish %s/%s, want 2027-05-11", got, r.P80Finish.Format(dateLayout))
	}
	if r.P50StandbyHours != 220 || r.P80StandbyCost != 22000 || r.P50FieldDays != 32 {
		t.Errorf("standby %v h, cost %v, %d field days; want 220 h, 22000, 32 days", r.P50StandbyHours, r.P80StandbyCost, r.P50FieldDays)
	}
}
