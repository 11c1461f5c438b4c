package candidates

import (
	"math"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// FuzzGenerate builds a zone and a no-go polygon from bytes and checks
// that Generate never panics and that, whenever it succeeds, the cells'
// areas sum to the zone's area, coverage matches a brute-force scan and
// the reduced rows keep every cell implied.
func FuzzGenerate(f *testing.F) {
	f.Add([]byte{4, 0, 0, 100, 0, 100, 100, 0, 100, 4, 40, 40, 60, 40, 60, 60, 40, 60, 50, 1})
	f.Add([]byte{3, 0, 0, 120, 0, 0, 90, 0, 30, 0})
	f.Add([]byte{6, 0, 0, 100, 0, 100, 30, 30, 30, 30, 100, 0, 100, 3, 5, 5, 20, 5, 5, 20, 40, 2})
	f.Fuzz(func(t *testing.T, data []byte) {
		read := func() (geom.Polygon, bool) {
			if len(data) == 0 {
				return nil, false
			}
			n := int(data[0]) % 9
			data = data[1:]
			var p geom.Polygon
			for len(data) >= 2 && len(p) < n {
				p = append(p, geom.Point{X: float64(data[0]), Y: float64(data[1])})
				data = data[2:]
			}
			return p, true
		}
		zone, ok := read()
		if !ok {
			return
		}
		noGoPoly, _ := read()
		var noGo []geom.Polygon
		if len(noGoPoly) > 0 {
			noGo = append(noGo, noGoPoly)
		}
		spacing, kind := 40.0, geom.Square
		if len(data) >= 2 {
			spacing = 10 + float64(data[0])
			if data[1]%2 == 1 {
				kind = geom.Triangular
			}
		}
		l, err := Generate([]ZoneInput{{ID: "z", Polygon: zone, SpacingFt: spacing, Lattice: kind, Corners: true}}, noGo, Options{})
		if err != nil {
			return
		}
		if got, want := zoneAreas(l, 1)[0], zone.Area(); math.Abs(got-want) > 1e-9*want {
			t.Fatalf("cell areas sum to %v, zone area %v", got, want)
		}
		for _, c := range l.Candidates {
			if !zone.Contains(c.P) {
				t.Fatalf("candidate %v outside the zone", c.P)
			}
			if len(noGo) > 0 && noGo[0].Contains(c.P) {
				t.Fatalf("candidate %v in the no-go area", c.P)
			}
		}
		checkCoverage(t, l, []float64{geom.CoveringRadius(kind, spacing)})
		checkRows(t, l)
	})
}
