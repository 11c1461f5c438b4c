package report

import (
	"bufio"
	"errors"
	"fmt"
	"html"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/scenarios"
)

// The site map's look. The legend is our own: the marker's shape says the
// method, its fill says the rig, and a number inside repeats the rig, so a
// grey print keeps both apart; the point's ID (B-1, S-1, TP-1, ...) is
// written beside it. Rigs are numbered, never lettered, so no rig reads as
// a method's ID prefix. Zones are lightly tinted by use and always
// labelled with their id; no-go areas are hatched. Every id in the SVG
// starts with "sitemap-" so the map can be inlined beside other charts in
// one HTML page without clashes.
const (
	mapPlotMaxW  = 860.0 // largest drawing of the site, px
	mapPlotMaxH  = 700.0
	mapMargin    = 24.0
	mapTitleH    = 30.0
	mapMinWidth  = 900.0 // room for three legend columns
	mapLegendRow = 20.0
	mapLegendTop = 34.0 // legend heading and gap under the drawing
	mapMarkerR   = 7.5  // marker half-size, px
	mapInk       = "#202020"
	mapBoundary  = "#000000"
	mapNoGoInk   = "#8c2d19"
)

// zoneStyle is the tint and outline of a zone by its use; tints are light so
// markers stay readable on top, outlines differ in dash so uses stay apart
// in grey.
type zoneStyle struct{ fill, stroke, dash, label string }

var zoneStyles = map[scenarios.Use]zoneStyle{
	scenarios.UseStructure:     {"#f2dfb8", "#7a5a1e", "", "structure"},
	scenarios.UsePavement:      {"#e4e4e4", "#555555", "6,3", "pavement"},
	scenarios.UseSlope:         {"#e5d6ee", "#6a3d85", "2,2", "slope"},
	scenarios.UseFill:          {"#f5e3d3", "#8a5a36", "8,2,2,2", "fill"},
	scenarios.UseEnvironmental: {"#d8eed5", "#2e6b2a", "4,2", "environmental"},
	scenarios.UseOpen:          {"#eaf3fa", "#3b6e8f", "1,3", "open"},
}

var zoneUseOrder = []scenarios.Use{scenarios.UseStructure, scenarios.UsePavement, scenarios.UseSlope,
	scenarios.UseFill, scenarios.UseEnvironmental, scenarios.UseOpen}

// rigStyle is how a rig fills the marker: dark solid, hollow, light solid,
// hatched, mid solid, dashed hollow — six lightness/texture steps that a
// grey print keeps apart. Beyond six rigs the number tells them apart.
type rigStyle struct{ fill, stroke, strokeW, dash, letterInk string }

var rigStyles = []rigStyle{
	{"#1f3a5f", "#000000", "1", "", "#ffffff"},
	{"#ffffff", "#8a2d0b", "2", "", "#202020"},
	{"#f0b43c", "#000000", "1", "", "#000000"},
	{"url(#sitemap-rig-hatch)", "#1e6b2e", "1.5", "", "#000000"},
	{"#8e6bb0", "#000000", "1", "", "#ffffff"},
	{"#ffffff", "#000000", "1.5", "2,1.5", "#000000"},
}

// methodOrder fixes the legend order of the methods rigmix knows.
var methodOrder = []string{"boring", "cpt", "test_pit", "probe"}

var methodLabel = map[string]string{
	"boring":   "boring",
	"cpt":      "CPT sounding",
	"test_pit": "test pit",
	"probe":    "hand probe",
}

// rigNumber names the i-th rig on the map 1, 2, 3, …: numbers, not
// letters, since letters are the point IDs' method prefixes.
func rigNumber(i int) string { return strconv.Itoa(i + 1) }

// mapRig is one rig on the map: its number and style.
type mapRig struct {
	name   string
	number string
	style  rigStyle
	points int
}

// mapRigs lists the rigs that have points, in the plan's rig order, then
// any rig named only by a point (sorted), each with a number and a style.
func mapRigs(p *plan.Plan) []mapRig {
	count := map[string]int{}
	for _, pt := range p.Points {
		count[pt.Rig]++
	}
	var names []string
	seen := map[string]bool{}
	for _, r := range p.Rigs {
		if count[r.Name] > 0 && !seen[r.Name] {
			names = append(names, r.Name)
			seen[r.Name] = true
		}
	}
	var rest []string
	for n := range count {
		if !seen[n] {
			rest = append(rest, n)
		}
	}
	sort.Strings(rest)
	names = append(names, rest...)
	out := make([]mapRig, len(names))
	for i, n := range names {
		out[i] = mapRig{name: n, number: rigNumber(i), style: rigStyles[i%len(rigStyles)], points: count[n]}
	}
	return out
}

// mapMethods lists the methods the plan uses: known ones in a fixed order,
// then others sorted, with their counts.
func mapMethods(p *plan.Plan) ([]string, map[string]int) {
	count := map[string]int{}
	for _, pt := range p.Points {
		count[pt.Method]++
	}
	var out []string
	for _, m := range methodOrder {
		if count[m] > 0 {
			out = append(out, m)
		}
	}
	var rest []string
	for m := range count {
		if _, known := methodLabel[m]; !known {
			rest = append(rest, m)
		}
	}
	sort.Strings(rest)
	return append(out, rest...), count
}

// markerPath is the outline of a method's marker centred on (cx, cy) with
// half-size r: a circle for a boring, a cone (triangle, point down) for a
// CPT sounding, a square for a test pit, a diamond for a probe and a plus
// for any other method.
func markerShape(method string, cx, cy, r float64) string {
	f := num
	switch method {
	case "boring":
		return fmt.Sprintf(`<circle cx="%s" cy="%s" r="%s"`, f(cx), f(cy), f(r))
	case "cpt":
		k := r * 1.3
		return fmt.Sprintf(`<path d="M%s,%s L%s,%s L%s,%s Z"`, f(cx-k), f(cy-k*0.75), f(cx+k), f(cy-k*0.75), f(cx), f(cy+k))
	case "test_pit":
		k := r * 0.9
		return fmt.Sprintf(`<rect x="%s" y="%s" width="%s" height="%s"`, f(cx-k), f(cy-k), f(2*k), f(2*k))
	case "probe":
		k := r * 1.25
		return fmt.Sprintf(`<path d="M%s,%s L%s,%s L%s,%s L%s,%s Z"`, f(cx), f(cy-k), f(cx+k), f(cy), f(cx), f(cy+k), f(cx-k), f(cy))
	default:
		a, b := r*0.4, r*1.1
		return fmt.Sprintf(`<path d="M%s,%s H%s V%s H%s V%s H%s V%s H%s V%s H%s V%s H%s Z"`,
			f(cx-a), f(cy-b), f(cx+a), f(cy-a), f(cx+b), f(cy+a), f(cx+a), f(cy+b), f(cx-a), f(cy+a), f(cx-b), f(cy-a), f(cx-a))
	}
}

// letterY puts the rig number at the visual centre of the marker (a cone's
// is above its middle).
func letterY(method string, cy, r float64) float64 {
	if method == "cpt" {
		return cy - r*0.25
	}
	return cy
}

func marker(b *bufio.Writer, method string, st rigStyle, letter string, cx, cy, r float64) {
	dash := ""
	if st.dash != "" {
		dash = ` stroke-dasharray="` + st.dash + `"`
	}
	fmt.Fprintf(b, `%s fill="%s" stroke="%s" stroke-width="%s"%s/>`, markerShape(method, cx, cy, r), st.fill, st.stroke, st.strokeW, dash)
	if letter != "" {
		halo := ""
		if strings.HasPrefix(st.fill, "url(") {
			halo = ` stroke="#ffffff" stroke-width="2.2" paint-order="stroke"`
		}
		fmt.Fprintf(b, `<text x="%s" y="%s" text-anchor="middle" dominant-baseline="central" font-size="%s" font-weight="bold" fill="%s"%s>%s</text>`,
			num(cx), num(letterY(method, cy, r)), num(r*1.3), st.letterInk, halo, esc(letter))
	}
}

// niceLength picks a scale-bar length of 1, 2 or 5 × 10ⁿ ft no longer than
// maxFt.
func niceLength(maxFt float64) float64 {
	if maxFt <= 0 {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(maxFt)))
	for _, m := range []float64{5, 2, 1} {
		if m*p <= maxFt {
			return m * p
		}
	}
	return p
}

// labelPoint finds where to write a zone's label: the spot inside the zone
// farthest from its edges, from the no-go areas and from the chosen points,
// among the centroid and a 9 × 9 grid over the zone's bounds, so the label
// does not sit on a marker or a hatched area. The centroid wins when it is
// at least half as clear as the best spot (it reads as the zone's middle).
// For a zone with no room at all it falls back to the middle of the widest
// inside span through the middle of its bounds.
func labelPoint(poly geom.Polygon, avoid []geom.Polygon, pts []geom.Point) geom.Point {
	clear := func(q geom.Point) float64 {
		if !poly.Contains(q) {
			return -1
		}
		d := poly.DistanceToBoundary(q)
		for _, a := range avoid {
			if a.Contains(q) {
				return 0
			}
			d = math.Min(d, a.DistanceToBoundary(q))
		}
		for _, p := range pts {
			d = math.Min(d, q.Dist(p))
		}
		return d
	}
	c := poly.Centroid()
	cScore := clear(c)
	bb := poly.Bounds()
	best, bestScore := c, cScore
	const n = 9
	for i := 1; i <= n; i++ {
		for j := 1; j <= n; j++ {
			q := geom.Point{X: bb.Min.X + (bb.Max.X-bb.Min.X)*float64(i)/(n+1), Y: bb.Min.Y + (bb.Max.Y-bb.Min.Y)*float64(j)/(n+1)}
			if sc := clear(q); sc > bestScore {
				best, bestScore = q, sc
			}
		}
	}
	if cScore > 0 && cScore >= bestScore/2 {
		return c
	}
	if bestScore > 0 {
		return best
	}
	y := (bb.Min.Y + bb.Max.Y) / 2
	xs := poly.RowCrossings(y, nil)
	best, bestW := c, -1.0
	for i := 0; i+1 < len(xs); i += 2 {
		if w := xs[i+1] - xs[i]; w > bestW {
			best, bestW = geom.Point{X: (xs[i] + xs[i+1]) / 2, Y: y}, w
		}
	}
	return best
}

// SiteMapSVG writes a plan view of the site as a self-contained SVG: the
// boundary, the zones tinted by use and labelled with their ids, the no-go
// areas hatched, the chosen points by method (shape) and rig (fill and
// number) with each point's ID beside it, a legend, a north arrow and a scale bar in feet. The scenario's
// y axis points north, so the drawing flips it. The bytes depend only on
// the scenario and the plan.
func SiteMapSVG(w io.Writer, sc *scenarios.Scenario, p *plan.Plan) error {
	if sc == nil || p == nil {
		return errors.New("report: the site map needs both the scenario and the plan")
	}
	// Extent: boundary, zones, no-go areas and points.
	var pts []geom.Point
	pts = append(pts, sc.Boundary...)
	for _, z := range sc.Zones {
		pts = append(pts, z.Polygon...)
	}
	for _, ng := range sc.NoGo {
		pts = append(pts, ng.Polygon...)
	}
	for _, pt := range p.Points {
		pts = append(pts, geom.Point{X: pt.XFt, Y: pt.YFt})
	}
	if len(pts) == 0 {
		return fmt.Errorf("report: scenario %q has no boundary, zones or points to draw", sc.Name)
	}
	bb := geom.Polygon(pts).Bounds()
	dx, dy := bb.Max.X-bb.Min.X, bb.Max.Y-bb.Min.Y
	if dx <= 0 {
		dx = 1
	}
	if dy <= 0 {
		dy = 1
	}
	k := math.Min(mapPlotMaxW/dx, mapPlotMaxH/dy) // px per ft
	plotW, plotH := dx*k, dy*k
	width := math.Max(plotW+2*mapMargin, mapMinWidth)
	left := (width - plotW) / 2
	top := mapTitleH + mapMargin
	sx := func(x float64) float64 { return left + (x-bb.Min.X)*k }
	sy := func(y float64) float64 { return top + (bb.Max.Y-y)*k } // north up
	ring := func(poly geom.Polygon) string {
		var s strings.Builder
		for i, v := range poly {
			if i == 0 {
				s.WriteString("M")
			} else {
				s.WriteString(" L")
			}
			s.WriteString(num(sx(v.X)) + "," + num(sy(v.Y)))
		}
		s.WriteString(" Z")
		return s.String()
	}

	methods, methodCount := mapMethods(p)
	rigs := mapRigs(p)
	rigByName := map[string]mapRig{}
	for _, r := range rigs {
		rigByName[r.name] = r
	}
	var uses []scenarios.Use
	present := map[scenarios.Use]bool{}
	for _, z := range sc.Zones {
		present[z.Use] = true
	}
	for _, u := range zoneUseOrder {
		if present[u] {
			uses = append(uses, u)
		}
	}
	groundRows := len(uses) + 1 // + boundary
	if len(sc.NoGo) > 0 {
		groundRows++
	}
	legendRows := max(len(methods), len(rigs), groundRows, 1)
	legendTop := top + plotH + mapMargin + 20 // room for the scale bar under the drawing
	height := legendTop + mapLegendTop + float64(legendRows)*mapLegendRow + mapMargin

	b := bufio.NewWriter(w)
	fmt.Fprintf(b, `<svg xmlns="http://www.w3.org/2000/svg" id="sitemap" width="%s" height="%s" viewBox="0 0 %s %s" font-family="sans-serif" font-size="12" role="img" aria-labelledby="sitemap-title">`+"\n",
		num(width), num(height), num(width), num(height))
	fmt.Fprintf(b, `<title id="sitemap-title">Site map: %s</title>`+"\n", esc(p.Scenario.Title))
	b.WriteString(`<defs>
<pattern id="sitemap-nogo-hatch" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="8" height="8" fill="#ffffff"/><line x1="0" y1="0" x2="0" y2="8" stroke="` + mapNoGoInk + `" stroke-width="2"/></pattern>
<pattern id="sitemap-rig-hatch" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(-45)"><rect width="4" height="4" fill="#ffffff"/><line x1="0" y1="0" x2="0" y2="4" stroke="#1e6b2e" stroke-width="1.6"/></pattern>
</defs>
`)
	fmt.Fprintf(b, `<rect x="0" y="0" width="%s" height="%s" fill="#ffffff"/>`+"\n", num(width), num(height))
	fmt.Fprintf(b, `<text x="%s" y="%s" font-size="15" font-weight="bold" fill="%s">Site map — %s</text>`+"\n",
		num(mapMargin), num(mapTitleH-6), mapInk, esc(p.Scenario.Title))

	// Zones, then no-go areas over them, then the boundary on top.
	b.WriteString(`<g id="sitemap-zones">` + "\n")
	for _, z := range sc.Zones {
		st, ok := zoneStyles[z.Use]
		if !ok {
			st = zoneStyle{"#f4f4f4", "#555555", "", string(z.Use)}
		}
		dash := ""
		if st.dash != "" {
			dash = ` stroke-dasharray="` + st.dash + `"`
		}
		fmt.Fprintf(b, `<path d="%s" fill="%s" stroke="%s" stroke-width="1.5"%s><title>zone %s — %s (%s)</title></path>`+"\n",
			ring(z.Polygon), st.fill, st.stroke, dash, esc(z.ID), esc(z.Name), esc(st.label))
	}
	b.WriteString("</g>\n")
	b.WriteString(`<g id="sitemap-nogo">` + "\n")
	for _, ng := range sc.NoGo {
		fmt.Fprintf(b, `<path d="%s" fill="url(#sitemap-nogo-hatch)" stroke="%s" stroke-width="1.2"><title>no-go %s — %s</title></path>`+"\n",
			ring(ng.Polygon), mapNoGoInk, esc(ng.ID), esc(ng.Reason))
	}
	b.WriteString("</g>\n")
	if len(sc.Boundary) > 0 {
		fmt.Fprintf(b, `<path id="sitemap-boundary" d="%s" fill="none" stroke="%s" stroke-width="2.5"/>`+"\n", ring(sc.Boundary), mapBoundary)
	}

	// Labels of zones and no-go areas, with a white halo so they read
	// over tints and hatching.
	b.WriteString(`<g id="sitemap-labels" stroke="#ffffff" stroke-width="3" paint-order="stroke" stroke-linejoin="round">` + "\n")
	var noGo []geom.Polygon
	for _, ng := range sc.NoGo {
		noGo = append(noGo, ng.Polygon)
	}
	var chosen []geom.Point
	for _, pt := range p.Points {
		chosen = append(chosen, geom.Point{X: pt.XFt, Y: pt.YFt})
	}
	for _, z := range sc.Zones {
		c := labelPoint(z.Polygon, noGo, chosen)
		fmt.Fprintf(b, `<text x="%s" y="%s" text-anchor="middle" font-size="13" font-weight="bold" fill="%s">%s</text>`+"\n",
			num(sx(c.X)), num(sy(c.Y)), mapInk, esc(z.ID))
	}
	for _, ng := range sc.NoGo {
		c := labelPoint(ng.Polygon, nil, nil)
		fmt.Fprintf(b, `<text x="%s" y="%s" text-anchor="middle" font-size="10" font-style="italic" fill="%s">%s</text>`+"\n",
			num(sx(c.X)), num(sy(c.Y)-4), mapNoGoInk, esc(ng.ID))
	}
	b.WriteString("</g>\n")

	// Points.
	b.WriteString(`<g id="sitemap-points">` + "\n")
	for _, pt := range p.Points {
		r := rigByName[pt.Rig]
		fmt.Fprintf(b, `<g><title>%s: %s by %s, %s ft deep, zone %s</title>`, esc(pt.ID), esc(methodName(pt.Method)), esc(pt.Rig), feet(pt.DepthFt), esc(pt.Zone))
		marker(b, pt.Method, r.style, r.number, sx(pt.XFt), sy(pt.YFt), mapMarkerR)
		fmt.Fprintf(b, `<text class="sitemap-id" x="%s" y="%s" font-size="10" fill="%s" stroke="#ffffff" stroke-width="2.5" paint-order="stroke">%s</text>`,
			num(sx(pt.XFt)+mapMarkerR+2), num(sy(pt.YFt)-mapMarkerR+1), mapInk, esc(pt.ID))
		b.WriteString("</g>\n")
	}
	b.WriteString("</g>\n")

	// North arrow, above the drawing's top right corner: y grows north in
	// the scenario's frame.
	ax, ay := width-mapMargin-8, 8.0 // in the title band, clear of the drawing
	fmt.Fprintf(b, `<g id="sitemap-north"><path d="M%s,%s L%s,%s L%s,%s L%s,%s Z" fill="%s" stroke="%s" stroke-width="1"/><path d="M%s,%s L%s,%s L%s,%s Z" fill="#ffffff" stroke="%s" stroke-width="1"/><text x="%s" y="%s" text-anchor="middle" font-size="13" font-weight="bold" fill="%s" stroke="#ffffff" stroke-width="3" paint-order="stroke">N</text></g>`+"\n",
		num(ax), num(ay+8), num(ax+8), num(ay+36), num(ax), num(ay+30), num(ax), num(ay+8), mapInk, mapInk,
		num(ax), num(ay+8), num(ax-8), num(ay+36), num(ax), num(ay+30), mapInk,
		num(ax), num(ay+4), mapInk)

	// Scale bar under the drawing: four alternating segments.
	lenFt := niceLength(dx / 4)
	barPx := lenFt * k
	bx, by := left, top+plotH+12
	b.WriteString(`<g id="sitemap-scale">`)
	for i := 0; i < 4; i++ {
		fill := mapInk
		if i%2 == 1 {
			fill = "#ffffff"
		}
		fmt.Fprintf(b, `<rect x="%s" y="%s" width="%s" height="5" fill="%s" stroke="%s" stroke-width="0.8"/>`,
			num(bx+float64(i)*barPx/4), num(by), num(barPx/4), fill, mapInk)
	}
	fmt.Fprintf(b, `<text x="%s" y="%s" font-size="11" fill="%s">0</text><text x="%s" y="%s" font-size="11" fill="%s">%s ft</text></g>`+"\n",
		num(bx-3), num(by+17), mapInk, num(bx+barPx-6), num(by+17), mapInk, ftoa(lenFt))

	// Legend: methods, rigs, ground.
	colW := (width - 2*mapMargin) / 3
	col := func(i int) float64 { return mapMargin + float64(i)*colW }
	b.WriteString(`<g id="sitemap-legend" fill="` + mapInk + `">` + "\n")
	heads := []string{"Method (marker shape)", "Rig (fill and number)", "Ground"}
	for i, h := range heads {
		fmt.Fprintf(b, `<text x="%s" y="%s" font-weight="bold">%s</text>`+"\n", num(col(i)), num(legendTop+14), esc(h))
	}
	rowY := func(i int) float64 { return legendTop + mapLegendTop + float64(i)*mapLegendRow }
	neutral := rigStyle{"#ffffff", mapInk, "1.5", "", mapInk}
	for i, m := range methods {
		y := rowY(i)
		marker(b, m, neutral, "", col(0)+8, y-4, mapMarkerR)
		fmt.Fprintf(b, "\n"+`<text x="%s" y="%s">%s (%d)</text>`+"\n", num(col(0)+24), num(y), esc(methodName(m)), methodCount[m])
	}
	for i, r := range rigs {
		y := rowY(i)
		marker(b, "test_pit", r.style, r.number, col(1)+8, y-4, mapMarkerR+1)
		fmt.Fprintf(b, "\n"+`<text x="%s" y="%s">%s (%d)</text>`+"\n", num(col(1)+24), num(y), esc(r.name), r.points)
	}
	gi := 0
	fmt.Fprintf(b, `<rect x="%s" y="%s" width="16" height="10" fill="none" stroke="%s" stroke-width="2.5"/><text x="%s" y="%s">site boundary</text>`+"\n",
		num(col(2)), num(rowY(gi)-9), mapBoundary, num(col(2)+24), num(rowY(gi)))
	gi++
	for _, u := range uses {
		st := zoneStyles[u]
		dash := ""
		if st.dash != "" {
			dash = ` stroke-dasharray="` + st.dash + `"`
		}
		fmt.Fprintf(b, `<rect x="%s" y="%s" width="16" height="10" fill="%s" stroke="%s" stroke-width="1.5"%s/><text x="%s" y="%s">%s zone</text>`+"\n",
			num(col(2)), num(rowY(gi)-9), st.fill, st.stroke, dash, num(col(2)+24), num(rowY(gi)), esc(st.label))
		gi++
	}
	if len(sc.NoGo) > 0 {
		fmt.Fprintf(b, `<rect x="%s" y="%s" width="16" height="10" fill="url(#sitemap-nogo-hatch)" stroke="%s" stroke-width="1.2"/><text x="%s" y="%s">no-go area (no point allowed)</text>`+"\n",
			num(col(2)), num(rowY(gi)-9), mapNoGoInk, num(col(2)+24), num(rowY(gi)))
	}
	b.WriteString("</g>\n</svg>\n")
	return b.Flush()
}

// methodName is a method's name for people.
func methodName(m string) string {
	if s, ok := methodLabel[m]; ok {
		return s
	}
	return m
}

// num formats a drawing coordinate with at most one decimal.
func num(v float64) string {
	s := strconv.FormatFloat(math.Round(v*10)/10, 'f', -1, 64)
	if s == "-0" {
		return "0"
	}
	return s
}

// esc escapes text for XML and HTML.
func esc(s string) string { return html.EscapeString(s) }
