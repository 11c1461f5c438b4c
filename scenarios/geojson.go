package scenarios

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// GeoJSON input (RFC 7946): a zone, a no-go area or the site boundary may
// be drawn in a GIS and saved as a GeoJSON FeatureCollection of Polygon
// features in WGS 84 longitude and latitude. The scenario names the file
// and the feature (by the value of a property, "id" unless told otherwise);
// the loader projects the ring to the scenario's local frame in feet about
// the scenario's origin.

// maxProjectFt is how far from the origin (in feet, 5 miles) a GeoJSON
// vertex may lie: a site is a few thousand feet across, so a vertex farther
// out means a wrong origin or a wrong layer.
const maxProjectFt = 26400

// metersPerFoot is the international foot (1959), exact.
const metersPerFoot = geom.MetersPerFoot

// projectFt maps WGS 84 longitude and latitude (degrees) to the local frame
// in feet with the project's one frame, geom.LocalFrame (a transverse
// Mercator projection about the origin's meridian, scale 1 there), so that
// points read from GeoJSON and points written back to GeoJSON use the same
// mapping. Its distances are right to under 1 ppm within 5 miles of the
// origin (see geom.LocalFrame). Results are rounded to 0.001 ft so files
// load to the same numbers on every platform.
func projectFt(o LonLat, lon, lat float64) geom.Point {
	p := geom.LocalFrame{OriginLon: o.Lon, OriginLat: o.Lat}.ToLocal(lon, lat)
	return geom.Point{X: round3(p.X), Y: round3(p.Y)}
}

func round3(v float64) float64 {
	r := math.Round(v*1000) / 1000
	if r == 0 {
		return 0 // no negative zero in output
	}
	return r
}

type gjFile struct {
	Type     string      `json:"type"`
	Features []gjFeature `json:"features"`
	// A lone Feature file.
	ID         any            `json:"id"`
	Properties map[string]any `json:"properties"`
	Geometry   *gjGeometry    `json:"geometry"`
}

type gjFeature struct {
	Type       string         `json:"type"`
	ID         any            `json:"id"`
	Properties map[string]any `json:"properties"`
	Geometry   *gjGeometry    `json:"geometry"`
}

type gjGeometry struct {
	Type        string          `json:"type"`
	Coordinates json.RawMessage `json:"coordinates"`
}

// propString gives a GeoJSON property value as text for matching: strings
// as they are, numbers in their shortest form.
func propString(v any) (string, bool) {
	switch t := v.(type) {
	case string:
		return t, true
	case float64:
		return strconv.FormatFloat(t, 'f', -1, 64), true
	case json.Number:
		return t.String(), true
	case bool:
		return strconv.FormatBool(t), true
	}
	return "", false
}

// parseGeoJSON reads a FeatureCollection (or a single Feature) and returns
// the ring, in lon/lat, of the one Polygon feature whose property equals
// want. fail builds an error about the reference's field.
func featureRing(data []byte, property, want string, fail func(problem, hint string) error) ([][2]float64, error) {
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, fail("GeoJSON file is empty", "export the layer as a GeoJSON FeatureCollection")
	}
	var f gjFile
	dec := json.NewDecoder(bytes.NewReader(data))
	if err := dec.Decode(&f); err != nil {
		return nil, fail("GeoJSON file is not valid JSON: "+err.Error(), "export the layer as a GeoJSON FeatureCollection (RFC 7946)")
	}
	feats := f.Features
	switch f.Type {
	case "FeatureCollection":
	case "Feature":
		feats = []gjFeature{{Type: "Feature", ID: f.ID, Properties: f.Properties, Geometry: f.Geometry}}
	default:
		return nil, fail(fmt.Sprintf("GeoJSON type must be FeatureCollection or Feature, got %q", f.Type), "export the layer as a GeoJSON FeatureCollection (RFC 7946)")
	}
	var match []gjFeature
	var ids []string
	for _, ft := range feats {
		v, ok := ft.Properties[property]
		if !ok && property == "id" {
			v, ok = ft.ID, ft.ID != nil
		}
		s, ok2 := propString(v)
		if !ok || !ok2 {
			continue
		}
		ids = append(ids, s)
		if s == want {
			match = append(match, ft)
		}
	}
	switch len(match) {
	case 0:
		sort.Strings(ids)
		more := len(ids) > 12
		if more {
			ids = ids[:12]
		}
		for i, id := range ids {
			ids[i] = excerpt(id)
		}
		if more {
			ids = append(ids, "...")
		}
		hint := fmt.Sprintf("no feature has property %q", property)
		if len(ids) > 0 {
			hint = fmt.Sprintf("features have %s: %s", property, strings.Join(ids, ", "))
		}
		return nil, fail(fmt.Sprintf("no feature with %s = %q", property, want), hint)
	case 1:
	default:
		return nil, fail(fmt.Sprintf("%d features have %s = %q", len(match), property, want), "give each feature its own id")
	}
	g := match[0].Geometry
	if g == nil {
		return nil, fail(fmt.Sprintf("feature %q has no geometry", want), "draw it as a Polygon")
	}
	var rings [][][]float64
	switch g.Type {
	case "Polygon":
		if err := json.Unmarshal(g.Coordinates, &rings); err != nil {
			return nil, fail(fmt.Sprintf("feature %q: Polygon coordinates are malformed", want), "a Polygon is a list of rings of [lon, lat] positions")
		}
	case "MultiPolygon":
		var polys [][][][]float64
		if err := json.Unmarshal(g.Coordinates, &polys); err != nil {
			return nil, fail(fmt.Sprintf("feature %q: MultiPolygon coordinates are malformed", want), "a MultiPolygon is a list of Polygons")
		}
		if len(polys) != 1 {
			return nil, fail(fmt.Sprintf("feature %q is a MultiPolygon of %d parts", want, len(polys)), "split it into one feature per part, each its own zone")
		}
		rings = polys[0]
	default:
		return nil, fail(fmt.Sprintf("feature %q is a %s, not a Polygon", want, g.Type), "draw areas as Polygons")
	}
	if len(rings) == 0 {
		return nil, fail(fmt.Sprintf("feature %q has no ring", want), "a Polygon needs an exterior ring")
	}
	if len(rings) > 1 {
		holes := "a hole"
		if len(rings) > 2 {
			holes = fmt.Sprintf("%d holes", len(rings)-1)
		}
		return nil, fail(fmt.Sprintf("feature %q has %s", want, holes), "draw each hole as a no-go area instead")
	}
	ring := rings[0]
	out := make([][2]float64, 0, len(ring))
	for i, pos := range ring {
		if len(pos) < 2 {
			return nil, fail(fmt.Sprintf("feature %q: position %d has %d numbers", want, i, len(pos)), "a position is [lon, lat]")
		}
		lon, lat := pos[0], pos[1]
		if !(lon >= -180 && lon <= 180 && lat >= -90 && lat <= 90) {
			return nil, fail(fmt.Sprintf("feature %q: position %d [%g, %g] is not a WGS 84 longitude and latitude", want, i, lon, lat),
				"GeoJSON is in degrees, longitude first (RFC 7946 §4); reproject the layer to WGS 84")
		}
		out = append(out, [2]float64{lon, lat})
	}
	// RFC 7946 §3.1.6: the first and last positions are equivalent.
	if len(out) >= 2 && out[0] == out[len(out)-1] {
		out = out[:len(out)-1]
	} else if len(out) > 0 {
		return nil, fail(fmt.Sprintf("feature %q: ring is not closed", want), "RFC 7946 §3.1.6: the last position repeats the first")
	}
	return out, nil
}
