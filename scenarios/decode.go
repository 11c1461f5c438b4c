package scenarios

import (
	"fmt"
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"time"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/rules"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
)

// Defaults for settings a scenario may leave out.
const (
	// DefaultHoursPerDay is a common ten-hour field day (common practice).
	DefaultHoursPerDay = 10.0
	// DefaultGap stops the solve once the plan is proven within 0.01 % of
	// the best possible; 0 asks for proven optimality, which on large
	// models can take far longer for a difference below the precision of
	// any unit price.
	DefaultGap = 1e-4
	// DefaultTimeLimitS bounds a solve to a minute; 0 means no limit.
	DefaultTimeLimitS = 60.0
	// DefaultPriority weighs every zone's area alike.
	DefaultPriority = 1.0
	// DefaultRateBook prices scenarios that name no rate book.
	DefaultRateBook = "valley-2026"
)

// Upper bounds that catch a slipped digit or a wrong unit. Each is far past
// anything an exploration program asks for (common practice).
const (
	maxCoordFt      = 1e7    // about 1,900 miles from the frame's origin
	maxBoundaryFt2  = 4.4e8  // about 10,000 acres
	maxSpacingFt    = 5000   // DM-7.01 preliminary spacing tops out at 500 ft
	maxAreaPerPtFt2 = 1e7    // about 230 acres per point
	maxDepthFt      = 1000   // deeper than nearly any site boring
	maxIntervalFt   = 100    // sampling interval
	maxOverheadFt   = 500    // overhead clearance
	maxSlopePct     = 100    // 45°; no rig works steeper ground
	maxPriority     = 1000   // zone weight
	maxMinPoints    = 10000  // points in one zone
	maxStories      = 200    // stories of a building
	maxYardMiles    = 5000   // one-way road miles from the rig yard
	maxTimeLimitS   = 604800 // a week
	maxVertices     = 10000  // vertices in one polygon
	maxRequiredPts  = 10000  // required points in one zone
	maxTextLen      = 20000  // characters in a free-text field
	maxListLen      = 1000   // zones, no-go areas, rigs
)

var (
	nameRE = regexp.MustCompile(`^[a-z0-9][a-z0-9._-]{0,63}$`)
	idRE   = regexp.MustCompile(`^[A-Za-z0-9][A-Za-z0-9._-]{0,39}$`)
	rigRE  = regexp.MustCompile(`^[a-z0-9][a-z0-9-]{0,39}$`)
)

var (
	uses     = []string{string(UseEnvironmental), string(UseFill), string(UseOpen), string(UsePavement), string(UseSlope), string(UseStructure)}
	surfaces = []string{string(sdk.Firm), string(sdk.Soft), string(sdk.Wet)}
	methods  = []string{string(sdk.Boring), string(sdk.CPT), string(sdk.Probe), string(sdk.TestPit)}
	lattices = []string{string(Square), string(Triangular)}
	// spacingMeanings are the readings of max_spacing (Rules.SpacingMeans).
	spacingMeanings = []string{SpacingGrid, SpacingRadius}
	loads           = []string{"heavy", "light"}
)

// decoder turns the merged settings (viper's view of file, environment and
// overrides) into a Scenario, checking each value as it goes. The first
// problem ends decoding.
type decoder struct {
	file     string
	unit     string  // "ft" or "m"
	ftPer    float64 // feet per file unit
	origin   *LonLat
	readFile func(rel string) ([]byte, string, error) // for GeoJSON
	// rawText holds the text of each scalar as written in the file, by
	// field path, so text fields keep what the user wrote (an id "01",
	// a title that YAML would read as a date) rather than YAML's typed
	// reading of it. Overridden keys are left out.
	rawText map[string]string
}

func (d *decoder) errf(field, hint, format string, args ...any) error {
	return &FieldError{File: d.file, Field: field, Problem: fmt.Sprintf(format, args...), Hint: hint}
}

// fmtNum prints a number as a user would write it.
func fmtNum(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// fmtVal prints a raw value found in the file.
func fmtVal(v any) string {
	switch t := v.(type) {
	case string:
		return strconv.Quote(t)
	case nil:
		return "nothing"
	case []any:
		return "a list"
	case map[string]any:
		return "a mapping"
	}
	return fmt.Sprint(v)
}

// toNumber converts a decoded value to float64. Strings that parse as
// numbers are accepted because environment variables arrive as text.
func toNumber(v any) (float64, bool) {
	switch t := v.(type) {
	case int:
		return float64(t), true
	case int64:
		return float64(t), true
	case uint64:
		return float64(t), true
	case float64:
		return t, true
	case float32:
		return float64(t), true
	case string:
		f, err := strconv.ParseFloat(strings.TrimSpace(t), 64)
		return f, err == nil
	}
	return 0, false
}

// num reads an optional number. present is false when the key is absent.
func (d *decoder) num(m map[string]any, field, key, hint string) (v float64, present bool, err error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return 0, false, nil
	}
	p := join(field, key)
	f, ok := toNumber(raw)
	if !ok {
		return 0, true, d.errf(p, hint, "must be a number, got %s", fmtVal(raw))
	}
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return 0, true, d.errf(p, hint, "must be a finite number, got %s", fmtNum(f))
	}
	return f, true, nil
}

// bound describes the range a number must lie in.
type bound struct {
	min, max       float64
	minOpen        bool // min itself not allowed
	hint           string
	unit           string // unit the limits are printed in ("" none)
	omitToSkipRule bool   // zero is refused with a hint to omit the key
}

func (d *decoder) check(p string, f float64, b bound) error {
	u := ""
	if b.unit != "" {
		u = " " + b.unit
	}
	if b.minOpen && f <= b.min {
		hint := b.hint
		if b.omitToSkipRule && f == 0 {
			hint = "leave the key out if the rule does not apply; " + hint
		}
		return d.errf(p, hint, "must be > %s%s, got %s", fmtNum(b.min), u, fmtNum(f))
	}
	if !b.minOpen && f < b.min {
		return d.errf(p, b.hint, "must be ≥ %s%s, got %s", fmtNum(b.min), u, fmtNum(f))
	}
	if f > b.max {
		hint := b.hint
		if b.unit == "ft" || b.unit == "m" || b.unit == "ft²" || b.unit == "m²" {
			hint = "is the unit right? " + hint
		}
		return d.errf(p, hint, "must be ≤ %s%s, got %s", fmtNum(b.max), u, fmtNum(f))
	}
	return nil
}

// number reads an optional number in a range.
func (d *decoder) number(m map[string]any, field, key string, b bound) (float64, bool, error) {
	f, ok, err := d.num(m, field, key, b.hint)
	if err != nil || !ok {
		return f, ok, err
	}
	return f, true, d.check(join(field, key), f, b)
}

// length reads an optional length in the file's unit, checks it against
// limits given in feet, and returns it in feet.
func (d *decoder) length(m map[string]any, field, key string, maxFt float64, exampleFt float64, what string) (float64, bool, error) {
	b := bound{min: 0, minOpen: true, max: d.fromFt(maxFt), unit: d.unit, omitToSkipRule: true,
		hint: fmt.Sprintf("give %s in %s, e.g. %s", what, d.unit, fmtNum(d.example(exampleFt)))}
	f, ok, err := d.number(m, field, key, b)
	return f * d.ftPer, ok, err
}

// areaField is length's counterpart for areas (file unit squared).
func (d *decoder) areaField(m map[string]any, field, key string, maxFt2, exampleFt2 float64, what string) (float64, bool, error) {
	b := bound{min: 0, minOpen: true, max: maxFt2 / (d.ftPer * d.ftPer), unit: d.unit + "²", omitToSkipRule: true,
		hint: fmt.Sprintf("give %s in %s², e.g. %s", what, d.unit, fmtNum(d.exampleArea(exampleFt2)))}
	f, ok, err := d.number(m, field, key, b)
	return f * d.ftPer * d.ftPer, ok, err
}

func (d *decoder) fromFt(ft float64) float64 { return ft / d.ftPer }

// example rounds a length in feet to a friendly value in the file unit.
func (d *decoder) example(ft float64) float64 {
	v := ft / d.ftPer
	if v >= 10 {
		return math.Round(v/5) * 5
	}
	return math.Round(v*10) / 10
}

func (d *decoder) exampleArea(ft2 float64) float64 {
	v := ft2 / (d.ftPer * d.ftPer)
	return math.Round(v/100) * 100
}

func (d *decoder) integer(m map[string]any, field, key string, lo, hi int, hint string) (int, bool, error) {
	f, ok, err := d.num(m, field, key, hint)
	if err != nil || !ok {
		return 0, ok, err
	}
	p := join(field, key)
	if f != math.Trunc(f) {
		return 0, true, d.errf(p, hint, "must be a whole number, got %s", fmtNum(f))
	}
	if err := d.check(p, f, bound{min: float64(lo), max: float64(hi), hint: hint}); err != nil {
		return 0, true, err
	}
	return int(f), true, nil
}

func (d *decoder) str(m map[string]any, field, key, hint string) (string, bool, error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return "", false, nil
	}
	p := join(field, key)
	var s string
	switch t := raw.(type) {
	case string:
		s = t
	case int, int64, uint64, float64, bool, time.Time:
		// A plain scalar such as an id written 01 or a title written as
		// a date reads as text, as written.
		if txt, ok := d.rawText[p]; ok {
			s = txt
		} else {
			s = fmt.Sprint(t)
		}
	default:
		return "", true, d.errf(p, hint, "must be text, got %s", fmtVal(raw))
	}
	if len(s) > maxTextLen {
		return "", true, d.errf(p, hint, "is %d characters long; at most %d", len(s), maxTextLen)
	}
	return s, true, nil
}

func (d *decoder) boolean(m map[string]any, field, key string) (bool, bool, error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return false, false, nil
	}
	switch t := raw.(type) {
	case bool:
		return t, true, nil
	case string:
		if b, err := strconv.ParseBool(strings.TrimSpace(t)); err == nil {
			return b, true, nil
		}
	}
	return false, true, d.errf(join(field, key), "write true or false", "must be true or false, got %s", fmtVal(raw))
}

// choice reads a text value that must be one of the known words.
func (d *decoder) choice(m map[string]any, field, key string, known []string) (string, bool, error) {
	s, ok, err := d.str(m, field, key, "one of: "+strings.Join(known, ", "))
	if err != nil || !ok {
		return s, ok, err
	}
	for _, k := range known {
		if s == k {
			return s, true, nil
		}
	}
	return "", true, d.errf(join(field, key), suggestOneOf(s, known), "unknown value %q", s)
}

// synonyms maps words users write to the scenario's own words.
var synonyms = map[string]string{
	"building": "structure", "bldg": "structure", "foundation": "structure",
	"parking": "pavement", "road": "pavement", "paving": "pavement", "lot": "pavement",
	"contaminated": "environmental", "env": "environmental",
	"cut": "slope", "embankment": "fill", "landscape": "open",
	"feet": "ft", "foot": "ft", "meters": "m", "metres": "m", "meter": "m", "metre": "m",
	"spt": "boring", "drill": "boring", "borehole": "boring", "cptu": "cpt", "pit": "test_pit",
	"test-pit": "test_pit", "dcp": "probe", "hexagonal": "triangular",
	"hard": "firm", "dry": "firm", "muddy": "wet", "saturated": "wet",
}

func suggestOneOf(s string, known []string) string {
	if n, ok := synonyms[strings.ToLower(s)]; ok && contains(known, n) {
		return fmt.Sprintf("did you mean %s? one of: %s", n, strings.Join(known, ", "))
	}
	if n := nearest(s, known); n != "" {
		return fmt.Sprintf("did you mean %s? one of: %s", n, strings.Join(known, ", "))
	}
	return "one of: " + strings.Join(known, ", ")
}

func (d *decoder) section(m map[string]any, field, key string) (map[string]any, bool, error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return nil, false, nil
	}
	sub, isMap := raw.(map[string]any)
	if !isMap {
		return nil, true, d.errf(join(field, key), "", "must be a mapping, got %s", fmtVal(raw))
	}
	return sub, true, nil
}

func (d *decoder) list(m map[string]any, field, key string) ([]any, bool, error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return nil, false, nil
	}
	l, isList := raw.([]any)
	if !isList {
		return nil, true, d.errf(join(field, key), "write each item on its own line starting with \"- \"", "must be a list, got %s", fmtVal(raw))
	}
	if len(l) > maxListLen {
		return nil, true, d.errf(join(field, key), "", "has %d items; at most %d", len(l), maxListLen)
	}
	return l, true, nil
}

// strList reads a list of words; a comma- or space-separated string (from
// an environment variable) is accepted too.
func (d *decoder) strList(m map[string]any, field, key, hint string) ([]string, bool, error) {
	raw, ok := m[key]
	if !ok || raw == nil {
		return nil, false, nil
	}
	p := join(field, key)
	var out []string
	switch t := raw.(type) {
	case string:
		out = strings.FieldsFunc(t, func(r rune) bool { return r == ',' || r == ' ' })
	case []string:
		out = append(out, t...)
	case []any:
		for i, v := range t {
			s, isStr := v.(string)
			if !isStr {
				return nil, true, d.errf(fmt.Sprintf("%s[%d]", p, i), hint, "must be text, got %s", fmtVal(v))
			}
			out = append(out, s)
		}
	default:
		return nil, true, d.errf(p, hint, "must be a list, got %s", fmtVal(raw))
	}
	if len(out) > maxListLen {
		return nil, true, d.errf(p, hint, "has %d items; at most %d", len(out), maxListLen)
	}
	return out, true, nil
}

// point reads [x, y] in the file unit and returns it in feet.
func (d *decoder) point(raw any, p string) (geom.Point, error) {
	hint := fmt.Sprintf("a point is [x, y] in %s, e.g. [120, 80]", d.unit)
	l, ok := raw.([]any)
	if !ok || len(l) != 2 {
		return geom.Point{}, d.errf(p, hint, "must be a pair [x, y], got %s", fmtVal(raw))
	}
	var xy [2]float64
	for k, v := range l {
		f, ok := toNumber(v)
		if !ok {
			return geom.Point{}, d.errf(fmt.Sprintf("%s[%d]", p, k), hint, "must be a number, got %s", fmtVal(v))
		}
		if math.IsNaN(f) || math.IsInf(f, 0) {
			return geom.Point{}, d.errf(fmt.Sprintf("%s[%d]", p, k), hint, "must be a finite number, got %s", fmtNum(f))
		}
		if math.Abs(f*d.ftPer) > maxCoordFt {
			return geom.Point{}, d.errf(fmt.Sprintf("%s[%d]", p, k), "coordinates are in the site's local frame, in "+d.unit+", measured from a point on or near the site",
				"must be within ±%s %s, got %s", fmtNum(d.fromFt(maxCoordFt)), d.unit, fmtNum(f))
		}
		xy[k] = f * d.ftPer
	}
	return geom.Point{X: xy[0], Y: xy[1]}, nil
}

// polygonValue reads a list of [x, y] vertices in the file unit.
func (d *decoder) polygonValue(raw any, p string) (geom.Polygon, error) {
	l, ok := raw.([]any)
	if !ok {
		return nil, d.errf(p, fmt.Sprintf("a polygon is a list of [x, y] vertices in %s", d.unit), "must be a list of vertices, got %s", fmtVal(raw))
	}
	if len(l) > maxVertices {
		return nil, d.errf(p, "simplify the outline", "has %d vertices; at most %d", len(l), maxVertices)
	}
	poly := make(geom.Polygon, 0, len(l))
	for i, v := range l {
		pt, err := d.point(v, fmt.Sprintf("%s[%d]", p, i))
		if err != nil {
			return nil, err
		}
		poly = append(poly, pt)
	}
	return poly, nil
}

// checkPolygon checks a ring in feet: at least three distinct vertices, no
// repeated neighbours, positive area, no self-intersection. A repeated
// closing vertex has already been dropped.
func (d *decoder) checkPolygon(poly geom.Polygon, p string) error {
	if len(poly) < 3 {
		return d.errf(p, "a polygon needs at least 3 vertices [x, y], listed around its outline", "has %d vertices", len(poly))
	}
	for i := range poly {
		j := (i + 1) % len(poly)
		if math.Hypot(poly[i].X-poly[j].X, poly[i].Y-poly[j].Y) <= onEdgeTolFt {
			return d.errf(p, "remove the repeated vertex", "vertices %d and %d are the same point", i, j)
		}
	}
	if i, j := selfIntersection(poly); i >= 0 {
		return d.errf(p, "list the vertices in order around the outline so that no two edges cross",
			"is self-intersecting: edge %d–%d meets edge %d–%d", i, (i+1)%len(poly), j, (j+1)%len(poly))
	}
	if area(poly) <= onEdgeTolFt {
		return d.errf(p, "the vertices must enclose an area", "has no area (its vertices lie on one line)")
	}
	if k := foldBack(poly); k >= 0 {
		return d.errf(p, "list the vertices in order around the outline", "turns straight back on itself at vertex %d", k)
	}
	return nil
}

// dropClosing removes a closing vertex that repeats the first.
func dropClosing(poly geom.Polygon) geom.Polygon {
	if len(poly) >= 4 && poly[0] == poly[len(poly)-1] {
		return poly[:len(poly)-1]
	}
	return poly
}

// outline reads a polygon given either inline ("polygon") or from a
// GeoJSON file ("geojson") within mapping m; field is m's path.
func (d *decoder) outline(m map[string]any, field string, required bool) (geom.Polygon, bool, error) {
	rawPoly, hasPoly := m["polygon"]
	gj, hasGJ, err := d.section(m, field, "geojson")
	if err != nil {
		return nil, false, err
	}
	hasPoly = hasPoly && rawPoly != nil
	switch {
	case hasPoly && hasGJ:
		return nil, true, d.errf(join(field, "geojson"), "keep one of the two", "give either polygon or geojson, not both")
	case !hasPoly && !hasGJ:
		if !required {
			return nil, false, nil
		}
		return nil, false, d.errf(join(field, "polygon"), fmt.Sprintf("list the outline as [x, y] vertices in %s, or name a GeoJSON feature with geojson: {file: ..., feature: ...}", d.unit), "missing")
	}
	var poly geom.Polygon
	p := join(field, "polygon")
	if hasPoly {
		poly, err = d.polygonValue(rawPoly, p)
		if err != nil {
			return nil, true, err
		}
	} else {
		p = join(field, "geojson")
		poly, err = d.geojsonOutline(gj, p)
		if err != nil {
			return nil, true, err
		}
	}
	poly = dropClosing(poly)
	if err := d.checkPolygon(poly, p); err != nil {
		return nil, true, err
	}
	return poly, true, nil
}

func (d *decoder) geojsonOutline(m map[string]any, p string) (geom.Polygon, error) {
	file, ok, err := d.str(m, p, "file", "")
	if err != nil {
		return nil, err
	}
	if !ok || file == "" {
		return nil, d.errf(join(p, "file"), "name the GeoJSON file, relative to the scenario file", "missing")
	}
	want, ok, err := d.str(m, p, "feature", "")
	if err != nil {
		return nil, err
	}
	if !ok || want == "" {
		return nil, d.errf(join(p, "feature"), "give the value of the feature's id property", "missing")
	}
	property, ok, err := d.str(m, p, "property", "")
	if err != nil {
		return nil, err
	}
	if !ok || property == "" {
		property = "id"
	}
	if d.origin == nil {
		return nil, d.errf(p, "add origin: {lon: ..., lat: ...} on or near the site so lon/lat can be projected to feet", "GeoJSON needs the scenario's origin")
	}
	data, shown, err := d.readFile(file)
	if err != nil {
		return nil, d.errf(join(p, "file"), "the path is relative to the scenario file", "cannot read %s: %v", shown, unwrapPathErr(err))
	}
	ring, err := featureRing(data, property, want, func(problem, hint string) error {
		return d.errf(p, hint, "%s: %s", shown, problem)
	})
	if err != nil {
		return nil, err
	}
	poly := make(geom.Polygon, len(ring))
	for i, ll := range ring {
		pt := projectFt(*d.origin, ll[0], ll[1])
		if math.Hypot(pt.X, pt.Y) > maxProjectFt {
			return nil, d.errf(p, fmt.Sprintf("move origin onto the site; the local projection is accurate only within %s ft of it", fmtNum(maxProjectFt)),
				"%s: feature %q vertex %d is %.0f ft from the origin", shown, want, i, math.Hypot(pt.X, pt.Y))
		}
		poly[i] = pt
	}
	return poly, nil
}

// decode builds the Scenario from merged settings.
func (d *decoder) decode(m map[string]any) (*Scenario, error) {
	s := &Scenario{}

	units, ok, err := d.choice(m, "", "units", []string{"ft", "m"})
	if err != nil {
		return nil, err
	}
	if !ok {
		return nil, d.errf("units", "add \"units: ft\" or \"units: m\"; every length and coordinate in the file is in that unit", "missing")
	}
	s.Units, d.unit = units, units
	d.ftPer = 1
	if units == "m" {
		// International foot: 1 ft = 0.3048 m exactly (1959 agreement).
		d.ftPer = 1 / metersPerFoot
	}

	if s.Name, ok, err = d.str(m, "", "name", ""); err != nil {
		return nil, err
	}
	if !ok || s.Name == "" {
		return nil, d.errf("name", "a short identifier such as name: north-campus", "missing")
	}
	if !nameRE.MatchString(s.Name) {
		return nil, d.errf("name", "lower-case letters, digits, '.', '_' and '-', starting with a letter or digit, at most 64", "%q is not a valid name", s.Name)
	}
	if s.Title, _, err = d.str(m, "", "title", ""); err != nil {
		return nil, err
	}
	if s.Description, _, err = d.str(m, "", "description", ""); err != nil {
		return nil, err
	}
	if s.Demo, _, err = d.boolean(m, "", "demo"); err != nil {
		return nil, err
	}
	if s.Note, _, err = d.str(m, "", "note", ""); err != nil {
		return nil, err
	}
	if s.Demo && strings.TrimSpace(s.Note) == "" {
		return nil, d.errf("note", "demo data must say so, e.g. note: invented demo data; the place and the ground are made up", "missing (demo: true)")
	}

	if o, ok, err := d.section(m, "", "origin"); err != nil {
		return nil, err
	} else if ok {
		lon, okLon, err := d.number(o, "origin", "lon", bound{min: -180, max: 180, hint: "WGS 84 longitude in degrees, east positive"})
		if err != nil {
			return nil, err
		}
		lat, okLat, err := d.number(o, "origin", "lat", bound{min: -85, max: 85, hint: "WGS 84 latitude in degrees, north positive"})
		if err != nil {
			return nil, err
		}
		if !okLon {
			return nil, d.errf("origin.lon", "WGS 84 longitude in degrees, east positive", "missing")
		}
		if !okLat {
			return nil, d.errf("origin.lat", "WGS 84 latitude in degrees, north positive", "missing")
		}
		s.Origin = &LonLat{Lon: lon, Lat: lat}
		d.origin = s.Origin
	}

	b, ok, err := d.section(m, "", "boundary")
	if err != nil {
		return nil, err
	}
	if !ok {
		return nil, d.errf("boundary", fmt.Sprintf("give the site outline: boundary: {polygon: [[x, y], ...]} in %s", d.unit), "missing")
	}
	if s.Boundary, _, err = d.outline(b, "boundary", true); err != nil {
		return nil, err
	}
	if a := area(s.Boundary); a > maxBoundaryFt2 {
		return nil, d.errf("boundary", "is the unit right? units: is "+d.unit, "encloses %.0f acres; at most %.0f", a/43560, maxBoundaryFt2/43560)
	}

	zl, ok, err := d.list(m, "", "zones")
	if err != nil {
		return nil, err
	}
	if !ok || len(zl) == 0 {
		return nil, d.errf("zones", "list at least one zone with id, use, polygon, ground and rules", "missing")
	}
	ids := map[string]string{}
	for i, raw := range zl {
		p := fmt.Sprintf("zones[%d]", i)
		zm, isMap := raw.(map[string]any)
		if !isMap {
			return nil, d.errf(p, "a zone is a mapping with id, use, polygon, ground and rules", "must be a mapping, got %s", fmtVal(raw))
		}
		z, err := d.zone(zm, p)
		if err != nil {
			return nil, err
		}
		if prev, dup := ids[z.ID]; dup {
			return nil, d.errf(p+".id", "give every zone and no-go area its own id", "duplicate id %q (also %s)", z.ID, prev)
		}
		ids[z.ID] = p
		s.Zones = append(s.Zones, z)
	}

	nl, _, err := d.list(m, "", "no_go")
	if err != nil {
		return nil, err
	}
	for i, raw := range nl {
		p := fmt.Sprintf("no_go[%d]", i)
		nm, isMap := raw.(map[string]any)
		if !isMap {
			return nil, d.errf(p, "a no-go area is a mapping with id, reason and polygon", "must be a mapping, got %s", fmtVal(raw))
		}
		n, err := d.noGo(nm, p)
		if err != nil {
			return nil, err
		}
		if prev, dup := ids[n.ID]; dup {
			return nil, d.errf(p+".id", "give every zone and no-go area its own id", "duplicate id %q (also %s)", n.ID, prev)
		}
		ids[n.ID] = p
		s.NoGo = append(s.NoGo, n)
	}

	rigHint := "rig names such as tire-drill, track-drill, excavator, cpt-rig, or a plugin's name"
	rigs, ok, err := d.strList(m, "", "rigs", rigHint)
	if err != nil {
		return nil, err
	}
	if !ok || len(rigs) == 0 {
		return nil, d.errf("rigs", "list the rigs that may be hired, e.g. rigs: [tire-drill, cpt-rig]", "missing")
	}
	seenRig := map[string]bool{}
	for i, r := range rigs {
		if !rigRE.MatchString(r) {
			return nil, d.errf(fmt.Sprintf("rigs[%d]", i), rigHint, "%q is not a rig name", r)
		}
		if seenRig[r] {
			return nil, d.errf(fmt.Sprintf("rigs[%d]", i), "list each rig once", "%q listed twice", r)
		}
		seenRig[r] = true
	}
	s.Rigs = rigs
	if s.RigUnits, err = d.rigUnits(m, seenRig); err != nil {
		return nil, err
	}

	if s.RateBook, err = d.rateBook(m); err != nil {
		return nil, err
	}
	if s.Lab, err = d.labProgram(m); err != nil {
		return nil, err
	}

	yard, ok, err := d.number(m, "", "yard_miles", bound{min: 0, max: maxYardMiles, unit: "mi", hint: "one-way road miles from the rig yard to the site, e.g. 35"})
	if err != nil {
		return nil, err
	}
	if !ok {
		return nil, d.errf("yard_miles", "give the one-way road miles from the rig yard to the site, e.g. yard_miles: 35", "missing")
	}
	s.YardMiles = yard

	s.MinSeparationFt = DefaultMinSeparationFt
	if f, ok, err := d.length(m, "", "min_separation", 100, DefaultMinSeparationFt, "the least distance between two points of a plan"); err != nil {
		return nil, err
	} else if ok {
		s.MinSeparationFt = f
	}

	s.HoursDay = DefaultHoursPerDay
	if h, ok, err := d.number(m, "", "hours_per_day", bound{min: 0, minOpen: true, max: 24, unit: "h", hint: "working hours in a field day, e.g. 10"}); err != nil {
		return nil, err
	} else if ok {
		s.HoursDay = h
	}

	s.GapRel, s.TimeLimitS = DefaultGap, DefaultTimeLimitS
	if sv, ok, err := d.section(m, "", "solver"); err != nil {
		return nil, err
	} else if ok {
		if g, ok, err := d.number(sv, "solver", "gap", bound{min: 0, max: 0.99, hint: "relative gap, e.g. 0.0001 (0.01 %); 0 asks for a proven optimum"}); err != nil {
			return nil, err
		} else if ok {
			s.GapRel = g
		}
		if t, ok, err := d.number(sv, "solver", "time_limit_s", bound{min: 0, max: maxTimeLimitS, unit: "s", hint: "seconds, e.g. 60; 0 means no limit"}); err != nil {
			return nil, err
		} else if ok {
			s.TimeLimitS = t
		}
	}
	return s, nil
}

// rateBook reads rate_book: a demo rate-book name, or a path to a rate-book
// file (it contains a path separator or ends in .yaml or .yml), resolved
// against the scenario file's folder.
func (d *decoder) rateBook(m map[string]any) (string, error) {
	rb, ok, err := d.str(m, "", "rate_book", "")
	if err != nil {
		return "", err
	}
	if !ok || rb == "" {
		return DefaultRateBook, nil
	}
	if strings.ContainsAny(rb, `/\`) || strings.HasSuffix(rb, ".yaml") || strings.HasSuffix(rb, ".yml") {
		_, shown, err := d.readFile(rb)
		if err != nil {
			return "", d.errf("rate_book", "a rate-book path is relative to the scenario file; or name a demo rate book: "+strings.Join(ratebooks.Demos(), ", "),
				"cannot read %s: %v", shown, unwrapPathErr(err))
		}
		return shown, nil
	}
	demos := ratebooks.Demos()
	for _, n := range demos {
		if n == rb {
			return rb, nil
		}
	}
	return "", d.errf("rate_book", suggestOneOf(rb, demos)+"; or give a path to a rate-book .yaml file", "no demo rate book named %q", rb)
}

func (d *decoder) zone(m map[string]any, p string) (Zone, error) {
	var z Zone
	id, ok, err := d.str(m, p, "id", "")
	if err != nil {
		return z, err
	}
	if !ok || id == "" {
		return z, d.errf(p+".id", "a short label such as B1 or lot-north", "missing")
	}
	if !idRE.MatchString(id) {
		return z, d.errf(p+".id", "letters, digits, '.', '_' and '-', starting with a letter or digit, at most 40", "%q is not a valid id", id)
	}
	z.ID = id
	if z.Name, _, err = d.str(m, p, "name", ""); err != nil {
		return z, err
	}
	if z.Name == "" {
		z.Name = id
	}
	use, ok, err := d.choice(m, p, "use", uses)
	if err != nil {
		return z, err
	}
	if !ok {
		return z, d.errf(p+".use", "one of: "+strings.Join(uses, ", "), "missing")
	}
	z.Use = Use(use)
	if z.Purposes, err = d.purposes(m, p, z.Use); err != nil {
		return z, err
	}
	if z.Polygon, _, err = d.outline(m, p, true); err != nil {
		return z, err
	}
	z.Priority = DefaultPriority
	if pr, ok, err := d.number(m, p, "priority", bound{min: 0, minOpen: true, max: maxPriority, hint: "a weight for the zone's area, e.g. 1 (normal) or 2 (twice as important)"}); err != nil {
		return z, err
	} else if ok {
		z.Priority = pr
	}

	st, hasSt, err := d.section(m, p, "structure")
	if err != nil {
		return z, err
	}
	switch {
	case z.Use == UseStructure && !hasSt:
		return z, d.errf(p+".structure", "describe the planned structure: structure: {stories: 2, load_class: light}", "missing (use: structure)")
	case z.Use != UseStructure && hasSt:
		return z, d.errf(p+".structure", "set use: structure, or remove the structure section", "only a zone with use: structure describes a structure (this zone's use is %s)", z.Use)
	case hasSt:
		sp := p + ".structure"
		stories, ok, err := d.integer(st, sp, "stories", 1, maxStories, "number of stories above ground, e.g. 2")
		if err != nil {
			return z, err
		}
		if !ok {
			return z, d.errf(sp+".stories", "number of stories above ground, e.g. 2", "missing")
		}
		lc, ok, err := d.choice(st, sp, "load_class", loads)
		if err != nil {
			return z, err
		}
		if !ok {
			// Sowers' light/heavy split of the depth rule (in Das).
			return z, d.errf(sp+".load_class", "light (light steel or narrow concrete) or heavy (heavy steel or wide concrete)", "missing")
		}
		z.Structure = &Structure{Stories: stories, LoadClass: lc}
	}

	g, ok, err := d.section(m, p, "ground")
	if err != nil {
		return z, err
	}
	if !ok {
		return z, d.errf(p+".ground", "give at least ground: {surface: firm}", "missing")
	}
	if z.Ground, err = d.ground(g, p+".ground"); err != nil {
		return z, err
	}

	r, ok, err := d.section(m, p, "rules")
	if err != nil {
		return z, err
	}
	if !ok {
		return z, d.errf(p+".rules", "give at least min_depth and one of max_spacing, area_per_point or min_points", "missing")
	}
	if z.Rules, err = d.rules(r, p+".rules", &z); err != nil {
		return z, err
	}
	return z, nil
}

func (d *decoder) ground(m map[string]any, p string) (Ground, error) {
	var g Ground
	surf, ok, err := d.choice(m, p, "surface", surfaces)
	if err != nil {
		return g, err
	}
	if !ok {
		return g, d.errf(p+".surface", "one of: "+strings.Join(surfaces, ", "), "missing")
	}
	g.Surface = sdk.Surface(surf)
	if g.SlopePct, _, err = d.number(m, p, "slope_pct", bound{min: 0, max: maxSlopePct, unit: "%", hint: "ground slope in percent (rise over run × 100), e.g. 5"}); err != nil {
		return g, err
	}
	if g.GroundwaterFt, _, err = d.length(m, p, "groundwater_depth", maxDepthFt, 10, "the depth to groundwater (leave out if unknown)"); err != nil {
		return g, err
	}
	if g.RockFt, _, err = d.length(m, p, "rock_depth", maxDepthFt, 40, "the depth to rock (leave out if unknown or none)"); err != nil {
		return g, err
	}
	if g.OverheadFt, _, err = d.length(m, p, "overhead_clearance", maxOverheadFt, 30, "the free height above ground (leave out if nothing limits it)"); err != nil {
		return g, err
	}
	return g, nil
}

func (d *decoder) rules(m map[string]any, p string, z *Zone) (Rules, error) {
	r := Rules{Origins: map[string]string{}}
	set := func(key string) { r.Origins[key] = OriginScenario }
	pre, err := d.preset(m, p, z.ID)
	if err != nil {
		return r, err
	}
	var hasArea, hasSpacing, hasMin, hasLattice, hasCorners bool
	if r.AreaPerPointFt2, hasArea, err = d.areaField(m, p, "area_per_point", maxAreaPerPtFt2, 10000, "the area each point stands for"); err != nil {
		return r, err
	}
	if r.MaxSpacingFt, hasSpacing, err = d.length(m, p, "max_spacing", maxSpacingFt, 100, "a spacing"); err != nil {
		return r, err
	}
	if l, ok, err := d.choice(m, p, "lattice", lattices); err != nil {
		return r, err
	} else if ok {
		r.Lattice, hasLattice = Lattice(l), true
	}
	if r.MinPoints, hasMin, err = d.integer(m, p, "min_points", 1, maxMinPoints, "a count of points, e.g. 3 (leave out if the rule does not apply)"); err != nil {
		return r, err
	}
	depthFt, depthOrigin, hasDepth, err := d.minDepth(m, p, z)
	if err != nil {
		return r, err
	}
	r.MinDepthFt = depthFt
	share, hasShare, err := d.number(m, p, "sampled_share", bound{min: 0, max: 1, hint: "a share between 0 and 1, e.g. 0.5 for half the points"})
	if err != nil {
		return r, err
	}
	r.SampledShare = share
	ms, _, err := d.strList(m, p, "methods", "methods: "+strings.Join(methods, ", "))
	if err != nil {
		return r, err
	}
	seen := map[string]bool{}
	for i, s := range ms {
		ip := fmt.Sprintf("%s.methods[%d]", p, i)
		if !contains(methods, s) {
			return r, d.errf(ip, suggestOneOf(s, methods), "unknown method %q", s)
		}
		if seen[s] {
			return r, d.errf(ip, "list each method once", "%q listed twice", s)
		}
		seen[s] = true
		r.Methods = append(r.Methods, sdk.Method(s))
	}
	if hasShare && share > 0 && len(r.Methods) > 0 {
		sampled := false
		for _, m := range r.Methods {
			sampled = sampled || m.Sampled()
		}
		if !sampled {
			return r, d.errf(p+".sampled_share", "add boring or test_pit to methods, or set sampled_share: 0",
				"asks for %s of points sampled, but none of the methods (%s) recovers samples", fmtNum(share), strings.Join(ms, ", "))
		}
	}
	hasInterval := false
	if r.SampleIntervalFt, hasInterval, err = d.length(m, p, "sample_interval", maxIntervalFt, 5, "the sampling interval in borings"); err != nil {
		return r, err
	}
	if r.SampleSchedule, err = d.sampleSchedule(m, p); err != nil {
		return r, err
	}
	if hasInterval && len(r.SampleSchedule) > 0 {
		return r, d.errf(p+".sample_schedule", "give sample_interval or sample_schedule, not both", "both sample_interval and sample_schedule are given")
	}
	if r.Corners, hasCorners, err = d.boolean(m, p, "corners"); err != nil {
		return r, err
	}
	if sm, ok, err := d.choice(m, p, "spacing_means", spacingMeanings); err != nil {
		return r, err
	} else if ok {
		r.SpacingMeans = sm
	}
	noSpread, hasSpread := false, false
	if noSpread, hasSpread, err = d.boolean(m, p, "spread"); err != nil {
		return r, err
	}
	r.NoSpread = hasSpread && !noSpread
	rp, hasReq, err := d.list(m, p, "required_points")
	if err != nil {
		return r, err
	}
	if len(rp) > maxRequiredPts {
		return r, d.errf(p+".required_points", "", "has %d points; at most %d", len(rp), maxRequiredPts)
	}
	for i, raw := range rp {
		ip := fmt.Sprintf("%s.required_points[%d]", p, i)
		var how PointHow
		if pm, ok := raw.(map[string]any); ok {
			// {at: [x, y], method: boring, rig: tire-drill}
			for k := range pm {
				if k != "at" && k != "method" && k != "rig" {
					return r, d.errf(ip+"."+k, "a required point is [x, y] or {at: [x, y], method: METHOD, rig: RIG}", "unknown key %q", k)
				}
			}
			if pm["at"] == nil {
				return r, d.errf(ip+".at", "give the point as at: [x, y]", "is missing")
			}
			if m, ok, err := d.choice(pm, ip, "method", methods); err != nil {
				return r, err
			} else if ok {
				how.Method = sdk.Method(m)
			}
			if how.Rig, _, err = d.str(pm, ip, "rig", "the name of an offered rig, e.g. tire-drill"); err != nil {
				return r, err
			}
			raw, ip = pm["at"], ip+".at"
		}
		pt, err := d.point(raw, ip)
		if err != nil {
			return r, err
		}
		r.RequiredHow = append(r.RequiredHow, how)
		if !insideOrOn(z.Polygon, pt) {
			return r, d.errf(ip, "a required point must lie inside its zone's polygon", "[%s, %s] is outside the zone", fmtNum(pt.X/d.ftPer), fmtNum(pt.Y/d.ftPer))
		}
		r.RequiredPoints = append(r.RequiredPoints, pt)
	}
	hasSource := false
	if r.Source, hasSource, err = d.str(m, p, "source", ""); err != nil {
		return r, err
	}

	// Where each rule comes from: the file's own numbers win over a
	// preset's, and a preset's over defaults.
	for key, stated := range map[string]bool{"area_per_point": hasArea, "max_spacing": hasSpacing, "min_points": hasMin,
		"sampled_share": hasShare && share > 0, "methods": len(r.Methods) > 0, "sample_interval": hasInterval,
		"sample_schedule": len(r.SampleSchedule) > 0,
		"required_points": len(r.RequiredPoints) > 0, "lattice": hasLattice, "corners": hasCorners && r.Corners} {
		if stated {
			set(key)
		}
	}
	if hasDepth {
		r.Origins["min_depth"] = depthOrigin
	}
	if pre != nil {
		r.Preset = pre.Name
		from := "preset " + pre.Name + ": " + pre.Source
		if !hasArea && pre.AreaPerPointFt2 > 0 {
			r.AreaPerPointFt2, hasArea, r.Origins["area_per_point"] = pre.AreaPerPointFt2, true, from
		}
		if !hasSpacing && pre.MaxSpacingFt > 0 {
			r.MaxSpacingFt, hasSpacing, r.Origins["max_spacing"] = pre.MaxSpacingFt, true, from
		}
		if !hasMin && pre.MinPoints > 0 {
			r.MinPoints, hasMin, r.Origins["min_points"] = pre.MinPoints, true, from
		}
		if !hasDepth && pre.MinDepthFt > 0 {
			r.MinDepthFt, hasDepth, r.Origins["min_depth"] = pre.MinDepthFt, true, from
		}
		if !hasLattice && pre.Lattice != "" {
			r.Lattice, hasLattice, r.Origins["lattice"] = Lattice(pre.Lattice), true, from
		}
		if !hasCorners && pre.Corners {
			r.Corners, r.Origins["corners"] = true, from
		}
		if !hasSource {
			r.Source = pre.Title + " (" + pre.Source + ")"
		}
	}
	if !hasLattice {
		r.Lattice = Triangular
		if r.MaxSpacingFt > 0 {
			r.Origins["lattice"] = originDefault + "triangular"
		}
	}
	if !hasDepth {
		return r, d.errf(p+".min_depth", fmt.Sprintf("give the depth every point must reach in %s, e.g. %s, or compute it: {from: stories}, {from: footing, ...}, {from: rock, ...} (see REFERENCE.md)",
			d.unit, fmtNum(d.example(30))), "missing")
	}
	if !hasMin && z.Use == UseStructure {
		// NAVFAC DM-7.01 (UFC 3-220-10N, Table 6): an isolated rigid
		// foundation under 10,000 ft² gets at least 2 or 3 borings.
		a := area(z.Polygon)
		if n, src, err := rules.MinPointsForFootprint(a); err == nil && n > 0 {
			r.MinPoints, hasMin = n, true
			r.Origins["min_points"] = fmt.Sprintf("%s%s (footprint %.0f ft²)", originComputed, src, a)
		}
	}
	if !hasArea && !hasSpacing && !hasMin && !(hasReq && len(rp) > 0) && !r.Corners {
		return r, d.errf(p, "give at least one of max_spacing, area_per_point, min_points, required_points, corners: true or a preset",
			"asks for no points")
	}
	return r, nil
}

func (d *decoder) noGo(m map[string]any, p string) (NoGo, error) {
	var n NoGo
	id, ok, err := d.str(m, p, "id", "")
	if err != nil {
		return n, err
	}
	if !ok || id == "" {
		return n, d.errf(p+".id", "a short label such as vault-1", "missing")
	}
	if !idRE.MatchString(id) {
		return n, d.errf(p+".id", "letters, digits, '.', '_' and '-', starting with a letter or digit, at most 40", "%q is not a valid id", id)
	}
	n.ID = id
	if n.Reason, _, err = d.str(m, p, "reason", ""); err != nil {
		return n, err
	}
	if n.Polygon, _, err = d.outline(m, p, true); err != nil {
		return n, err
	}
	return n, nil
}

func contains(list []string, s string) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

// crossCheck runs the checks that relate parts of the scenario to each
// other, in a fixed order: zones within the boundary, zones overlapping,
// no-go areas leaving no room in a zone.
func (d *decoder) crossCheck(s *Scenario) error {
	for i, z := range s.Zones {
		if !within(z.Polygon, s.Boundary) {
			return d.errf(fmt.Sprintf("zones[%d].polygon", i), "every zone must lie inside the site boundary; enlarge the boundary or trim the zone",
				"zone %s reaches outside the site boundary", z.ID)
		}
	}
	for i := range s.Zones {
		for j := i + 1; j < len(s.Zones); j++ {
			if overlaps(s.Zones[i].Polygon, s.Zones[j].Polygon) {
				return d.errf(fmt.Sprintf("zones[%d].polygon", j), "zones may share edges but not area; each spot of ground has one use and one set of rules",
					"zone %s overlaps zone %s (zones[%d])", s.Zones[j].ID, s.Zones[i].ID, i)
			}
		}
	}
	for i, z := range s.Zones {
		var hits []geom.Polygon
		var names []string
		for _, n := range s.NoGo {
			if overlaps(z.Polygon, n.Polygon) || within(z.Polygon, n.Polygon) {
				hits = append(hits, n.Polygon)
				names = append(names, n.ID)
			}
		}
		if coveredBy(z.Polygon, hits) {
			sort.Strings(names)
			what := "no-go area " + names[0] + " leaves"
			if len(names) > 1 {
				what = "no-go areas " + strings.Join(names, ", ") + " leave"
			}
			return d.errf(fmt.Sprintf("zones[%d]", i), "shrink the no-go area or drop the zone",
				"%s no ground to explore in zone %s", what, z.ID)
		}
		for k, pt := range z.Rules.RequiredPoints {
			for _, n := range s.NoGo {
				if strictlyInside(n.Polygon, pt) {
					return d.errf(fmt.Sprintf("zones[%d].rules.required_points[%d]", i, k), "move the point or the no-go area",
						"point lies in no-go area %s", n.ID)
				}
			}
		}
	}
	return nil
}

// unwrapPathErr drops the path from an *fs.PathError message: the message
// already names the file.
func unwrapPathErr(err error) string {
	msg := err.Error()
	if i := strings.LastIndex(msg, ": "); i >= 0 {
		return msg[i+2:]
	}
	return msg
}

// purposes reads a zone's purpose list (what its ground is explored for,
// for the lab program); absent, the purposes its use implies.
func (d *decoder) purposes(m map[string]any, p string, u Use) ([]lab.Purpose, error) {
	var known []string
	for _, pu := range lab.Purposes() {
		known = append(known, string(pu))
	}
	hint := "purposes: " + strings.Join(known, ", ") + "; e.g. purpose: [pavement, soft_ground]"
	names, ok, err := d.strList(m, p, "purpose", hint)
	if err != nil {
		return nil, err
	}
	if !ok || len(names) == 0 {
		return PurposesOf(u), nil
	}
	var out []lab.Purpose
	seen := map[string]bool{}
	for i, n := range names {
		ip := fmt.Sprintf("%s.purpose[%d]", p, i)
		pu, ok := lab.ParsePurpose(n)
		if !ok {
			return nil, d.errf(ip, suggestOneOf(n, known), "unknown purpose %q", n)
		}
		if seen[n] {
			return nil, d.errf(ip, "list each purpose once", "%q listed twice", n)
		}
		seen[n] = true
		out = append(out, pu)
	}
	return out, nil
}

// sampleSchedule reads rules.sample_schedule: a list of bands {to: DEPTH,
// every: INTERVAL} in the file unit, shallowest first; the last may leave
// out to (to the bottom of the hole).
func (d *decoder) sampleSchedule(m map[string]any, p string) ([]sdk.SampleBand, error) {
	items, ok, err := d.list(m, p, "sample_schedule")
	if err != nil || !ok {
		return nil, err
	}
	fp := p + ".sample_schedule"
	if len(items) == 0 {
		return nil, d.errf(fp, "leave the key out for the default, or give bands such as [{to: 10, every: 2.5}, {every: 5}]", "is empty")
	}
	var out []sdk.SampleBand
	prev := 0.0
	for i, raw := range items {
		ip := fmt.Sprintf("%s[%d]", fp, i)
		band, isMap := raw.(map[string]any)
		if !isMap {
			return nil, d.errf(ip, "a band such as {to: 10, every: 2.5}", "must be a mapping, got %s", fmtVal(raw))
		}
		every, ok, err := d.length(band, ip, "every", maxIntervalFt, 2.5, "the sampling interval in the band")
		if err != nil {
			return nil, err
		}
		if !ok {
			return nil, d.errf(ip+".every", fmt.Sprintf("the interval in %s, e.g. %s", d.unit, fmtNum(d.example(5))), "missing")
		}
		to, hasTo, err := d.length(band, ip, "to", maxDepthFt, 10, "the bottom of the band")
		if err != nil {
			return nil, err
		}
		if !hasTo && i != len(items)-1 {
			return nil, d.errf(ip+".to", "give the bottom of every band but the last", "missing")
		}
		if hasTo && to <= prev {
			return nil, d.errf(ip+".to", fmt.Sprintf("below the band above, which ends at %s %s", fmtNum(prev/d.ftPer), d.unit), "must be deeper than the band above")
		}
		prev = to
		out = append(out, sdk.SampleBand{ToFt: to, EveryFt: every})
	}
	if err := sdk.CheckSchedule(out); err != nil {
		return nil, d.errf(fp, "", "%v", err)
	}
	return out, nil
}

// MaxRigUnits bounds the crews of one rig a scenario may send.
const MaxRigUnits = 10

// rigUnits reads rig_units: a mapping from an offered rig's name to the
// most crews of it that may be sent.
func (d *decoder) rigUnits(m map[string]any, offered map[string]bool) (map[string]int, error) {
	raw, ok := m["rig_units"]
	if !ok || raw == nil {
		return nil, nil
	}
	hint := fmt.Sprintf("the most crews of each rig that may be sent, 1 to %d, e.g. rig_units: {tire-drill: 2}", MaxRigUnits)
	mm, ok := raw.(map[string]any)
	if !ok {
		return nil, d.errf("rig_units", hint, "must be a mapping from rig names to numbers, got %s", fmtVal(raw))
	}
	names := make([]string, 0, len(mm))
	for k := range mm {
		names = append(names, k)
	}
	sort.Strings(names)
	out := map[string]int{}
	for _, n := range names {
		if !offered[n] {
			return nil, d.errf("rig_units."+n, "name a rig listed under rigs", "%q is not among the rigs offered", n)
		}
		u, _, err := d.integer(mm, "rig_units", n, 1, MaxRigUnits, hint)
		if err != nil {
			return nil, err
		}
		out[n] = u
	}
	return out, nil
}
