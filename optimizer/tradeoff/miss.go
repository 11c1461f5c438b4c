package tradeoff

import (
	"math"
	"sort"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// Hit is the chance that a zone's points find a buried feature.
type Hit struct {
	// Probability that at least one point falls inside a circular feature
	// of the given diameter whose centre lies anywhere in the zone with
	// equal likelihood.
	Probability float64 `json:"hit_probability"`
	// ErrorEstimate is the difference between the integral at the chosen
	// row step and at twice that step: an a-posteriori estimate of the
	// numerical error of Probability.
	ErrorEstimate float64 `json:"error_estimate"`
}

// HitProbability is the probability that a circular feature of diameter
// diameterFt, centred at a uniformly random spot of zone, contains at least
// one of pts. A point p lies inside the feature centred at c exactly when
// |p − c| < d/2, so the probability is the area of the union of discs of
// radius d/2 around the points, clipped to the zone, over the zone's area
// (the geometric-probability reading of grid search in Davis, Statistics
// and Data Analysis in Geology, ch. 5; for a square grid of spacing s and
// d < s it is πd²/(4s²)). Points outside the zone count too: a point just
// over the zone line still finds a feature straddling it.
//
// The area is integrated row by row: on each horizontal line the union of
// the discs' chords is intersected with the zone's inside intervals exactly,
// and the line lengths are summed by the midpoint rule over rows. The rows
// are spaced so that each disc is crossed by at least 64 rows; the result
// is also computed with half as many rows and the difference is returned as
// the error estimate.
func HitProbability(zone geom.Polygon, pts []geom.Point, diameterFt float64) Hit {
	a := zone.Area()
	if a <= 0 || len(pts) == 0 || !(diameterFt > 0) {
		return Hit{}
	}
	r := diameterFt / 2
	b := zone.Bounds()
	h := diameterFt / 64
	if n := b.Height() / h; n > 200000 {
		h = b.Height() / 200000 // bound the work on a huge zone with a tiny feature
	}
	sorted := append([]geom.Point(nil), pts...)
	sort.Slice(sorted, func(i, j int) bool {
		if sorted[i].Y != sorted[j].Y {
			return sorted[i].Y < sorted[j].Y
		}
		return sorted[i].X < sorted[j].X
	})
	fine := unionArea(zone, sorted, r, h)
	coarse := unionArea(zone, sorted, r, 2*h)
	p := math.Min(1, fine/a)
	return Hit{Probability: p, ErrorEstimate: math.Abs(fine-coarse) / a}
}

// unionArea integrates, by the midpoint rule with row step h, the length of
// the zone's part of the union of discs of radius r around pts (sorted by Y).
func unionArea(zone geom.Polygon, pts []geom.Point, r, h float64) float64 {
	b := zone.Bounds()
	n := int(math.Ceil(b.Height() / h))
	if n < 1 {
		n = 1
	}
	step := b.Height() / float64(n)
	var cross []float64
	var chords [][2]float64
	lo := 0 // first point with Y ≥ y − r
	total := 0.0
	for i := 0; i < n; i++ {
		y := b.Min.Y + (float64(i)+0.5)*step
		cross = zone.RowCrossings(y, cross[:0])
		if len(cross) < 2 {
			continue
		}
		sort.Float64s(cross)
		for lo < len(pts) && pts[lo].Y < y-r {
			lo++
		}
		chords = chords[:0]
		for k := lo; k < len(pts) && pts[k].Y <= y+r; k++ {
			dy := pts[k].Y - y
			if w := r*r - dy*dy; w > 0 {
				hw := math.Sqrt(w)
				chords = append(chords, [2]float64{pts[k].X - hw, pts[k].X + hw})
			}
		}
		if len(chords) == 0 {
			continue
		}
		sort.Slice(chords, func(a, b int) bool { return chords[a][0] < chords[b][0] })
		// Merge the chords, then intersect with the inside intervals.
		merged := chords[:1]
		for _, c := range chords[1:] {
			last := &merged[len(merged)-1]
			if c[0] <= last[1] {
				last[1] = math.Max(last[1], c[1])
			} else {
				merged = append(merged, c)
			}
		}
		length := 0.0
		for k := 0; k+1 < len(cross); k += 2 {
			x0, x1 := cross[k], cross[k+1]
			for _, c := range merged {
				if l := math.Min(x1, c[1]) - math.Max(x0, c[0]); l > 0 {
					length += l
				}
			}
		}
		total += length * step
	}
	return total
}
