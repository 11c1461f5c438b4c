package plan

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// sampledGap is the independent check of a zone's coverage: the largest
// distance from a spot of the zone (outside no-go interiors) to the nearest
// of pts, over a square grid of step h and points every h along the zone's
// and the no-go areas' edges. It never exceeds the exact farthest distance,
// and falls short of it by about h at most.
func sampledGap(zone geom.Polygon, nogo []geom.Polygon, pts []geom.Point, h float64) (float64, geom.Point) {
	var worst float64
	var at geom.Point
	try := func(q geom.Point) {
		if !zone.Contains(q) {
			return
		}
		for _, ng := range nogo {
			if ng.Contains(q) && ng.DistanceToBoundary(q) > 1e-6 {
				return
			}
		}
		d := math.Inf(1)
		for _, p := range pts {
			d = math.Min(d, math.Hypot(p.X-q.X, p.Y-q.Y))
		}
		if d > worst {
			worst, at = d, q
		}
	}
	b := zone.Bounds()
	for y := b.Min.Y; y <= b.Max.Y+h; y += h {
		for x := b.Min.X; x <= b.Max.X+h; x += h {
			try(geom.Point{X: x, Y: y})
		}
	}
	rings := append([]geom.Polygon{zone}, nogo...)
	for _, r := range rings {
		for i := range r {
			a, c := r[i], r[(i+1)%len(r)]
			n := int(math.Ceil(math.Hypot(c.X-a.X, c.Y-a.Y)/h)) + 1
			for k := 0; k <= n; k++ {
				t := float64(k) / float64(n)
				try(geom.Point{X: a.X + t*(c.X-a.X), Y: a.Y + t*(c.Y-a.Y)})
			}
		}
	}
	return worst, at
}

// radiusOf is the covering radius the zone is held to, worked out here from
// the rule (plane geometry: s/√3 for a triangular pattern of spacing s,
// s/√2 for a square one; √(area/n) for a count rule without spacing, our
// stated spreading rule), or 0 when none applies.
func radiusOf(zn scenarios.Zone, n int) float64 {
	r := zn.Rules
	switch {
	case r.MaxSpacingFt > 0 && r.SpacingMeans == scenarios.SpacingRadius:
		return r.MaxSpacingFt
	case r.MaxSpacingFt > 0 && r.Lattice == scenarios.Square:
		return r.MaxSpacingFt / math.Sqrt2
	case r.MaxSpacingFt > 0:
		return r.MaxSpacingFt / math.Sqrt(3)
	case n > 0 && !r.NoSpread:
		return math.Sqrt(zn.Polygon.Area() / float64(n))
	}
	return 0
}

// checkCoverage plans in and checks, by dense sampling, that every ruled
// zone's ground lies within its radius of the zone's points, and that the
// farthest distance the rules table prints is the sampled one to within
// the sampling step.
func checkCoverage(t *testing.T, in Input, steps float64) *Plan {
	t.Helper()
	p, err := Run(context.Background(), in, Options{})
	if err != nil {
		t.Fatal(err)
	}
	sc := in.Scenario
	// No two holes closer than the minimum separation (5 ft by default,
	// common practice), whatever zones they serve.
	for i, a := range p.Points {
		for _, b := range p.Points[i+1:] {
			if d := math.Hypot(a.XFt-b.XFt, a.YFt-b.YFt); d < sc.MinSeparationFt-0.15 && !(a.Required && b.Required) {
				t.Errorf("points %s (zone %s) and %s (zone %s) are %.2f ft apart; the separation is %.1f ft", a.ID, a.Zone, b.ID, b.Zone, d, sc.MinSeparationFt)
			}
		}
	}
	var nogo []geom.Polygon
	for _, ng := range sc.NoGo {
		nogo = append(nogo, ng.Polygon)
	}
	for _, zn := range sc.Zones {
		n := zn.Rules.MinPoints
		if zn.Rules.AreaPerPointFt2 > 0 {
			n = max(n, int(math.Ceil(zn.Polygon.Area()/zn.Rules.AreaPerPointFt2-1e-9)))
		}
		r := radiusOf(zn, n)
		if r == 0 {
			continue
		}
		var pts []geom.Point
		for _, pt := range p.Points {
			if pt.Zone == zn.ID {
				pts = append(pts, geom.Point{X: pt.XFt, Y: pt.YFt})
			}
		}
		h := r / steps
		got, at := sampledGap(zn.Polygon, nogo, pts, h)
		// Printed coordinates are rounded to 0.1 ft.
		if got > r+0.08 {
			t.Errorf("zone %s: ground at (%.1f, %.1f) is %.2f ft from the nearest point; the rule allows %.2f", zn.ID, at.X, at.Y, got, r)
		}
		var rc *RuleCheck
		for i := range p.Rules {
			if p.Rules[i].Zone == zn.ID && (p.Rules[i].Rule == "max spacing" || p.Rules[i].Rule == "spread (implied)") {
				rc = &p.Rules[i]
			}
		}
		if rc == nil || !rc.Met {
			t.Errorf("zone %s: rules table %+v, want the spacing rule met", zn.ID, rc)
			continue
		}
		if rc.FarthestFt < got-0.08 || rc.FarthestFt > got+1.5*h+0.08 {
			t.Errorf("zone %s: printed farthest %.3f ft, dense sampling (step %.2f ft) %.3f ft", zn.ID, rc.FarthestFt, h, got)
		}
	}
	return p
}

func TestDemosMeetSpacingEverywhere(t *testing.T) {
	for _, name := range scenarios.Demos() {
		t.Run(name, func(t *testing.T) { checkCoverage(t, demoInput(t, name), 40) })
	}
}

func TestGeneratedSitesMeetSpacingEverywhere(t *testing.T) {
	if testing.Short() {
		t.Skip("plans generated sites")
	}
	for _, tc := range []struct {
		name string
		data []byte
	}{
		{"10 acres", sitegen.Site(10, 1)},
		{"2-mile corridor", sitegen.Corridor(2, 1)},
	} {
		t.Run(tc.name, func(t *testing.T) { checkCoverage(t, generatedInput(t, tc.data), 20) })
	}
}

// siteYAML is a one-off scenario of our own (invented test data) with the
// zones given as YAML list items.
func siteYAML(boundary string, zones string, nogo string) []byte {
	s := "# INVENTED test data.\nunits: ft\nname: exact-test\ntitle: Exact coverage test site\ndemo: true\nnote: Invented test data.\n" +
		"boundary:\n  polygon: " + boundary + "\nzones:\n" + zones
	if nogo != "" {
		s += "no_go:\n" + nogo
	}
	return []byte(s + "rigs: [track-drill]\nrate_book: valley-2026\nyard_miles: 20\nhours_per_day: 10\nsolver: {gap: 0.005, time_limit_s: 60}\n")
}

func polyYAML(p geom.Polygon) string {
	var b strings.Builder
	b.WriteByte('[')
	for i, v := range p {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "[%.3f, %.3f]", v.X, v.Y)
	}
	b.WriteByte(']')
	return b.String()
}

func turned(p geom.Polygon, deg float64, about geom.Point) geom.Polygon {
	s, c := math.Sincos(deg * math.Pi / 180)
	out := make(geom.Polygon, len(p))
	for i, v := range p {
		x, y := v.X-about.X, v.Y-about.Y
		out[i] = geom.Point{X: about.X + c*x - s*y, Y: about.Y + s*x + c*y}
	}
	return out
}

func zoneYAML(id string, poly geom.Polygon, rules string) string {
	return fmt.Sprintf("  - id: %s\n    name: Zone %s\n    use: pavement\n    polygon: %s\n    ground: {surface: firm, slope_pct: 2}\n    rules: {%s, min_depth: 10, methods: [boring], source: \"invented test rule\"}\n",
		id, id, polyYAML(poly), rules)
}

// TestStripsAtAnyAngle: a road strip 900 × 40 ft under a 300-ft triangular
// spacing rule, turned to 0°, 4°, 30°, 45° and 90°, and a 20-ft-wide strip,
// meet the rule everywhere (dense sampling). Before the exact check the 4°
// strip got 2 borings 644 ft apart.
func TestStripsAtAnyAngle(t *testing.T) {
	if testing.Short() {
		t.Skip("plans several sites")
	}
	c := geom.Point{X: 1000, Y: 1000}
	for _, deg := range []float64{0, 4, 30, 45, 90} {
		for _, w := range []float64{40, 20} {
			t.Run(fmt.Sprintf("%g ft wide at %g°", w, deg), func(t *testing.T) {
				strip := turned(poly(550, 1000, 1450, 1000, 1450, 1000+w, 550, 1000+w), deg, c)
				data := siteYAML("[[0, 0], [2000, 0], [2000, 2000], [0, 2000]]",
					zoneYAML("RD", strip, "max_spacing: 300, lattice: triangular"), "")
				p := checkCoverage(t, generatedInput(t, data), 200)
				if n := len(p.Points); n < 3 {
					t.Errorf("%d points on a 900-ft strip; a 173.2-ft radius needs at least 3 (900 / (2·173.2) > 2)", n)
				}
			})
		}
	}
}

// TestAwkwardZones: concave and L-shaped zones, a zone with a no-go hole,
// two zones sharing an edge, and a count-only zone whose points must spread.
func TestAwkwardZones(t *testing.T) {
	if testing.Short() {
		t.Skip("plans several sites")
	}
	l := poly(0, 0, 400, 0, 400, 60, 60, 60, 60, 400, 0, 400)
	star := poly(200, 0, 260, 140, 400, 160, 280, 250, 320, 400, 200, 310, 80, 400, 120, 250, 0, 160, 140, 140)
	box := poly(0, 0, 300, 0, 300, 300, 0, 300)
	tests := []struct {
		name  string
		zones string
		nogo  string
	}{
		{"L-shape", zoneYAML("L", turned(l, 17, geom.Point{X: 200, Y: 200}), "max_spacing: 150, lattice: square"), ""},
		{"concave star", zoneYAML("S", star, "max_spacing: 120"), ""},
		{"no-go hole", zoneYAML("H", box, "max_spacing: 150"), "  - id: vault\n    reason: invented vault\n    polygon: [[110, 110], [190, 110], [190, 190], [110, 190]]\n"},
		{"shared edge", zoneYAML("A", poly(0, 0, 200, 0, 200, 200, 0, 200), "max_spacing: 150") +
			zoneYAML("B", poly(200, 0, 400, 0, 400, 200, 200, 200), "max_spacing: 100, lattice: square"), ""},
		{"count only", zoneYAML("C", poly(0, 0, 600, 0, 600, 120, 0, 120), "min_points: 3"), ""},
		{"spacing read as a radius", zoneYAML("R", poly(0, 0, 500, 0, 500, 300, 0, 300), "max_spacing: 120, spacing_means: radius"), ""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			data := siteYAML("[[-100, -100], [700, -100], [700, 700], [-100, 700]]", tc.zones, tc.nogo)
			checkCoverage(t, generatedInput(t, data), 60)
		})
	}
}

// poly builds a polygon from x, y pairs.
func poly(xy ...float64) geom.Polygon {
	p := make(geom.Polygon, len(xy)/2)
	for i := range p {
		p[i] = geom.Point{X: xy[2*i], Y: xy[2*i+1]}
	}
	return p
}
