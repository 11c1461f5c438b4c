package schedule

import (
	"math/rand/v2"
	"testing"
)

func benchRoute(b *testing.B, n int) {
	rng := rand.New(rand.NewPCG(20261201, uint64(n)))
	js := randomJobs(rng, "r", n, 3000, 3000)
	rig := RigSpec{Name: "r", SpeedFtPerHr: map[string]float64{Firm: 1500, Soft: 400}}
	l := newLegs(&rig, ptrs(js))
	for b.Loop() {
		l.route()
	}
}

func BenchmarkRoute50(b *testing.B)  { benchRoute(b, 50) }
func BenchmarkRoute200(b *testing.B) { benchRoute(b, 200) }
func BenchmarkRoute400(b *testing.B) { benchRoute(b, 400) }

// BenchmarkRisk300 is 1000 Monte Carlo runs of 300 points on two rigs.
func BenchmarkRisk300(b *testing.B) {
	rng := rand.New(rand.NewPCG(20261201, 99))
	jobs := randomJobs(rng, "tire-drill", 300, 3000, 3000)
	for i := range jobs[150:] {
		jobs[150+i].Rig = "track-drill"
	}
	cal := testCalendar()
	for m := range cal.WetProbByMonth {
		cal.WetProbByMonth[m] = 0.2
	}
	for b.Loop() {
		if _, err := Risk(jobs, []RigSpec{tireRig(), trackRig()}, cal, Options{Seed: 1, ProductionCV: 0.2}); err != nil {
			b.Fatal(err)
		}
	}
}
