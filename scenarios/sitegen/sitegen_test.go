package sitegen

import (
	"bytes"
	"math"
	"testing"

	"github.com/rigmix/rigmix/scenarios"
)

// TestGeneratedSitesLoad: every generated file passes the scenario loader,
// has the area asked for, and the same seed gives the same bytes.
func TestGeneratedSitesLoad(t *testing.T) {
	for _, acres := range []float64{1, 10, 100, 1000} {
		data := Site(acres, 1)
		if !bytes.Equal(data, Site(acres, 1)) {
			t.Fatalf("%g acres: two runs differ", acres)
		}
		sc, err := scenarios.Parse(data, "gen.yaml", nil)
		if err != nil {
			t.Fatalf("%g acres: %v", acres, err)
		}
		if a := sc.Boundary.Area() / FtPerAcre; math.Abs(a-acres) > 0.01*acres {
			t.Fatalf("site is %.2f acres, want %g", a, acres)
		}
	}
	sc, err := scenarios.Parse(Corridor(20, 1), "corridor.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	b := sc.Boundary.Bounds()
	if got := (b.Max.X - b.Min.X) / FtPerMile; math.Abs(got-20) > 1e-6 {
		t.Fatalf("corridor is %g miles long", got)
	}
}
