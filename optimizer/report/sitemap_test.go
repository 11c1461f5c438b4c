package report

import (
	"bytes"
	"encoding/xml"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/scenarios"
)

// sampleScenario is a small invented site that holds samplePlan's points
// (for layout only; no value here is a check value from outside).
func sampleScenario() *scenarios.Scenario {
	return &scenarios.Scenario{
		Name: "sample", Title: "Sample lot", Demo: true, Source: "demo:sample",
		Note:     "Invented demo data for the report's layout tests.",
		Boundary: poly(0, 0, 120, 0, 120, 70, 0, 70),
		Zones: []scenarios.Zone{
			{ID: "Z1", Name: "Shed <one story> & yard", Use: scenarios.UseStructure, Polygon: poly(0, 0, 80, 0, 80, 40, 0, 40)},
			{ID: "Z2", Name: "Drive", Use: scenarios.UsePavement, Polygon: poly(80, 0, 120, 0, 120, 70, 80, 70)},
		},
		NoGo:       []scenarios.NoGo{{ID: "well", Reason: "Existing well", Polygon: poly(30, 5, 40, 5, 40, 12, 30, 12)}},
		Rigs:       []string{"tire-drill", "cpt-rig"},
		RateBook:   "book",
		YardMiles:  12,
		HoursDay:   10,
		GapRel:     0.001,
		TimeLimitS: 60,
	}
}

// poly builds a polygon from x, y pairs in feet.
func poly(xy ...float64) geom.Polygon {
	out := make(geom.Polygon, 0, len(xy)/2)
	for i := 0; i+1 < len(xy); i += 2 {
		out = append(out, geom.Point{X: xy[i], Y: xy[i+1]})
	}
	return out
}

// checkGolden compares got with testdata/name, rewriting it under -update.
func checkGolden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./optimizer/report -update to create it)", err)
	}
	if !bytes.Equal(got, want) {
		t.Fatalf("%s differs from the golden file; run go test ./optimizer/report -update if intended\n%s", name, got)
	}
}

// wellFormed parses b as strict XML (encoding/xml) to the end.
func wellFormed(b []byte) error {
	d := xml.NewDecoder(bytes.NewReader(b))
	d.Strict = true
	for {
		_, err := d.Token()
		if err == io.EOF {
			return nil
		}
		if err != nil {
			return err
		}
	}
}

func TestSiteMapGolden(t *testing.T) {
	var b bytes.Buffer
	if err := SiteMapSVG(&b, sampleScenario(), samplePlan()); err != nil {
		t.Fatal(err)
	}
	if err := wellFormed(b.Bytes()); err != nil {
		t.Fatalf("site map is not well-formed XML: %v", err)
	}
	var again bytes.Buffer
	if err := SiteMapSVG(&again, sampleScenario(), samplePlan()); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(b.Bytes(), again.Bytes()) {
		t.Fatal("two renders of the same plan differ")
	}
	checkGolden(t, "html-sitemap.svg.golden", b.Bytes())
}

// svgElement is the part of an SVG element the map checks look at.
type svgElement struct {
	name  string
	attrs map[string]string
	text  string
}

func svgElements(t *testing.T, b []byte) []svgElement {
	t.Helper()
	d := xml.NewDecoder(bytes.NewReader(b))
	var out []svgElement
	for {
		tok, err := d.Token()
		if err == io.EOF {
			return out
		}
		if err != nil {
			t.Fatal(err)
		}
		switch v := tok.(type) {
		case xml.StartElement:
			e := svgElement{name: v.Name.Local, attrs: map[string]string{}}
			for _, a := range v.Attr {
				e.attrs[a.Name.Local] = a.Value
			}
			out = append(out, e)
		case xml.CharData:
			if len(out) > 0 {
				out[len(out)-1].text += string(v)
			}
		}
	}
}

// TestSiteMapGeometry checks the drawing against the plan: north is up
// (a point further north is drawn higher), east is right, distances keep
// their ratio (one scale for both axes), and each method gets its shape, each
// rig its number (never a letter, which would read as a method) and each
// point its ID beside the marker.
func TestSiteMapGeometry(t *testing.T) {
	p := samplePlan()
	// A third point due north of B-1 by the distance B-1–S-1 is east
	// of it, drawn by the first rig.
	p.Points = append(p.Points, plan.Point{ID: "TP-1", Zone: "Z1", XFt: 10, YFt: 70.5, Method: "test_pit", Rig: "tire-drill", DepthFt: 8})
	var b bytes.Buffer
	if err := SiteMapSVG(&b, sampleScenario(), p); err != nil {
		t.Fatal(err)
	}
	els := svgElements(t, b.Bytes())
	// The marker of each point follows its <title> in the points group.
	type xy struct{ x, y float64 }
	pos := map[string]xy{}
	shape := map[string]string{}
	letter := map[string]string{}
	label := map[string]string{}
	for i, e := range els {
		if e.name != "title" || i+2 >= len(els) {
			continue
		}
		id, _, ok := strings.Cut(e.text, ":")
		if !ok || (id != "B-1" && id != "S-1" && id != "TP-1") {
			continue
		}
		m := els[i+1]
		shape[id] = m.name
		f := func(k string) float64 {
			v, err := strconv.ParseFloat(m.attrs[k], 64)
			if err != nil {
				t.Fatalf("%s: %s=%q", id, k, m.attrs[k])
			}
			return v
		}
		switch m.name {
		case "circle":
			pos[id] = xy{f("cx"), f("cy")}
		case "rect":
			pos[id] = xy{f("x") + f("width")/2, f("y") + f("height")/2}
		default: // paths: the letter sits at the centre
		}
		if els[i+2].name == "text" {
			letter[id] = strings.TrimSpace(els[i+2].text)
			if _, ok := pos[id]; !ok {
				x, _ := strconv.ParseFloat(els[i+2].attrs["x"], 64)
				pos[id] = xy{x, 0}
			}
			if i+3 < len(els) && els[i+3].name == "text" {
				label[id] = strings.TrimSpace(els[i+3].text)
				x, _ := strconv.ParseFloat(els[i+3].attrs["x"], 64)
				if x <= pos[id].x {
					t.Errorf("%s: ID label at x %g, not right of its marker at %g", id, x, pos[id].x)
				}
			}
		}
	}
	if shape["B-1"] != "circle" || shape["S-1"] != "path" || shape["TP-1"] != "rect" {
		t.Fatalf("shapes by method: %v (want boring circle, CPT path, test pit rect)", shape)
	}
	if letter["B-1"] != "1" || letter["TP-1"] != "1" || letter["S-1"] != "2" {
		t.Fatalf("rig numbers %v: want tire-drill 1 (first in the plan's rigs), cpt-rig 2", letter)
	}
	for _, id := range []string{"B-1", "S-1", "TP-1"} {
		if label[id] != id {
			t.Errorf("point %s labelled %q beside its marker", id, label[id])
		}
	}
	a, c := pos["B-1"], pos["TP-1"]
	if !(c.y < a.y) {
		t.Fatalf("TP-1 is north of B-1 but drawn at y %g, not above %g", c.y, a.y)
	}
	if pos["S-1"].x <= a.x {
		t.Fatalf("S-1 is east of B-1 but drawn at x %g, not right of %g", pos["S-1"].x, a.x)
	}
	// Same feet, same pixels on both axes: 50.5 ft east vs 50.5 ft north.
	east, north := pos["S-1"].x-a.x, a.y-c.y
	if d := east - north; d > 0.2 || d < -0.2 {
		t.Fatalf("50.5 ft drawn as %g px east and %g px north: the axes do not share one scale", east, north)
	}
}

func TestSiteMapNeedsScenario(t *testing.T) {
	var b bytes.Buffer
	if err := SiteMapSVG(&b, nil, samplePlan()); err == nil {
		t.Fatal("no error without a scenario")
	}
}

func TestNiceLength(t *testing.T) {
	for _, c := range []struct{ in, want float64 }{
		{30, 20}, {120, 100}, {260, 200}, {499, 200}, {500, 500}, {7, 5}, {1.5, 1},
	} {
		if got := niceLength(c.in); got != c.want {
			t.Errorf("niceLength(%g) = %g, want %g", c.in, got, c.want)
		}
	}
}

// TestSiteMapVariants draws unusual plans: each must give well-formed SVG
// with one marker group per point and a legend entry per rig.
func TestSiteMapVariants(t *testing.T) {
	many := samplePlan()
	many.Points = nil
	for i := 0; i < 8; i++ { // more rigs than fill styles: numbers keep them apart
		many.Points = append(many.Points, plan.Point{ID: "P" + strconv.Itoa(i), Zone: "Z1", XFt: float64(5 + 9*i), YFt: 30,
			Method: methodOrder[i%len(methodOrder)], Rig: "rig-" + strconv.Itoa(i), DepthFt: 10})
	}
	odd := samplePlan()
	odd.Points[1].Method = "vane_shear" // a method rigmix has no marker for: the plus sign
	bare := sampleScenario()
	bare.Boundary, bare.NoGo = nil, nil
	for _, c := range []struct {
		name string
		sc   func() *scenarios.Scenario
		p    *plan.Plan
		rigs int
	}{
		{"no points", sampleScenario, func() *plan.Plan { p := samplePlan(); p.Points = nil; return p }(), 0},
		{"eight rigs", sampleScenario, many, 8},
		{"unknown method", sampleScenario, odd, 2},
		{"no boundary or no-go", func() *scenarios.Scenario { return bare }, samplePlan(), 2},
	} {
		t.Run(c.name, func(t *testing.T) {
			var b bytes.Buffer
			if err := SiteMapSVG(&b, c.sc(), c.p); err != nil {
				t.Fatal(err)
			}
			if err := wellFormed(b.Bytes()); err != nil {
				t.Fatalf("not well-formed: %v", err)
			}
			s := b.String()
			if n := strings.Count(s, "<g><title>"); n != len(c.p.Points) {
				t.Errorf("%d markers, plan has %d points", n, len(c.p.Points))
			}
			for i := 0; i < c.rigs; i++ {
				if !strings.Contains(s, ">"+rigNumber(i)+"</text>") {
					t.Errorf("rig number %s missing", rigNumber(i))
				}
			}
		})
	}
	if rigNumber(0) != "1" || rigNumber(25) != "26" {
		t.Errorf("rig numbers: %s %s", rigNumber(0), rigNumber(25))
	}
}
