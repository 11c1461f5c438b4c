package tradeoff

import (
	"math"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// squareGrid lays points at spacing s from (x0, y0) over [lo, hi]².
func squareGrid(s, x0, y0, lo, hi float64) []geom.Point {
	var pts []geom.Point
	for x := x0; x <= hi; x += s {
		for y := y0; y <= hi; y += s {
			if x >= lo && y >= lo {
				pts = append(pts, geom.Point{X: x, Y: y})
			}
		}
	}
	return pts
}

// TestHitProbabilitySquareGrid checks the layout computation against the
// closed form for a square grid of spacing s and a circular target of
// diameter d < s: P(hit) = πd²/(4s²) (Davis, Statistics and Data Analysis
// in Geology, ch. 5). The grid extends past the zone on every side, so the
// zone sees the grid as if it were infinite; one case is aligned with the
// zone (each grid cell holds one whole disc, so the answer is exact) and
// one is offset so discs straddle the zone line.
func TestHitProbabilitySquareGrid(t *testing.T) {
	for _, tc := range []struct {
		name           string
		s, d, x0, y0   float64
		zoneLo, zoneHi float64
	}{
		{"aligned 50 ft grid, 20 ft target", 50, 20, -25, -25, 0, 500},
		{"offset 50 ft grid, 30 ft target", 50, 30, -37, -11, 0, 500},
		{"offset 100 ft grid, 90 ft target", 100, 90, -80, -3, 0, 1000},
		{"offset 30 ft grid, 5 ft target", 30, 5, -7.5, -21, 0, 600},
	} {
		t.Run(tc.name, func(t *testing.T) {
			zone := geom.Polygon{{X: tc.zoneLo, Y: tc.zoneLo}, {X: tc.zoneHi, Y: tc.zoneLo}, {X: tc.zoneHi, Y: tc.zoneHi}, {X: tc.zoneLo, Y: tc.zoneHi}}
			pts := squareGrid(tc.s, tc.x0, tc.y0, tc.zoneLo-2*tc.s, tc.zoneHi+2*tc.s)
			got := HitProbability(zone, pts, tc.d)
			want := math.Pi * tc.d * tc.d / (4 * tc.s * tc.s) // Davis, ch. 5
			// The zone is a whole number of grid cells wide, so edge
			// effects cancel exactly; what is left is the integration error.
			tol := math.Max(3*got.ErrorEstimate, 1e-4)
			if math.Abs(got.Probability-want) > tol {
				t.Fatalf("hit probability %.6f, closed form %.6f (tolerance %.2g, error estimate %.2g)", got.Probability, want, tol, got.ErrorEstimate)
			}
			if got.ErrorEstimate > 1e-3 {
				t.Fatalf("error estimate %.2g is too loose to be useful", got.ErrorEstimate)
			}
		})
	}
}

// TestHitProbabilityOnePoint: a single point in the middle of a large square
// finds a target of diameter d with probability π(d/2)²/A (plane geometry);
// with no points it finds nothing, and a disc reaching past the zone line
// counts only its part inside the zone (a half disc for a point on the edge).
func TestHitProbabilityOnePoint(t *testing.T) {
	zone := geom.Polygon{{X: 0, Y: 0}, {X: 200, Y: 0}, {X: 200, Y: 200}, {X: 0, Y: 200}}
	for _, tc := range []struct {
		name string
		pts  []geom.Point
		d    float64
		want float64
	}{
		{"centre", []geom.Point{{X: 100, Y: 100}}, 40, math.Pi * 20 * 20 / 40000},
		{"on the edge", []geom.Point{{X: 100, Y: 0}}, 40, 0.5 * math.Pi * 20 * 20 / 40000},
		{"two overlapping, coincident", []geom.Point{{X: 100, Y: 100}, {X: 100, Y: 100}}, 40, math.Pi * 20 * 20 / 40000},
		{"none", nil, 40, 0},
	} {
		got := HitProbability(zone, tc.pts, tc.d)
		if math.Abs(got.Probability-tc.want) > math.Max(3*got.ErrorEstimate, 2e-5) {
			t.Errorf("%s: %.6f, want %.6f", tc.name, got.Probability, tc.want)
		}
	}
}
