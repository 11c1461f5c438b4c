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
