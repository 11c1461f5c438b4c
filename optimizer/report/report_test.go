package report

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"flag"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/plan"
)

var update = flag.Bool("update", false, "rewrite the golden files")

func f(v float64) *float64 { return &v }

// samplePlan is a small fixed plan (invented numbers, for layout only).
func samplePlan() *plan.Plan {
	return &plan.Plan{
		Schema:   plan.SchemaVersion,
		Scenario: plan.ScenarioInfo{Name: "sample", Title: "Sample lot", Source: "demo:sample", Demo: true},
		RateBook: plan.RateBookInfo{Name: "book", Title: "Book", Currency: "USD", Effective: "2026-01-01", Region: "Nowhere", Demo: true},
		Points: []plan.Point{
			{ID: "B-1", Zone: "Z1", XFt: 10, YFt: 20, Lon: f(-100.0001), Lat: f(40.0002), Method: "boring", Rig: "tire-drill", DepthFt: 30, SampleIntervalFt: 5, Sampling: "every 2.5 ft to 5 ft, then every 5 ft", Hours: 4.5, Cost: 1234.5},
			{ID: "S-1", Zone: "Z1", XFt: 60.5, YFt: 20, Lon: f(-100.0003), Lat: f(40.0002), Method: "cpt", Rig: "cpt-rig", DepthFt: 30, Hours: 1.25, Cost: 600},
		},
		Estimate: []plan.Line{
			{Item: "drill-0-50", Description: "Soil drilling", Quantity: 30, Unit: "ft", UnitPrice: 20, Extension: 600},
			{Item: "mob-tire-rig", Description: "Mobilization", Quantity: 1, Unit: "each", UnitPrice: 1234567.5, Extension: 1234567.5},
		},
		Total:  1235167.5,
		Rigs:   []plan.RigPlan{{Name: "tire-drill", Title: "Tire rig", Mobilized: true, Points: 1, ByMethod: map[string]int{"boring": 1}, Hours: 4.5, MobHours: 2, FieldDays: 1}},
		Finish: 1,
		Rules: []plan.RuleCheck{{Zone: "Z1", Rule: "minimum points", Required: "≥ 2", Achieved: "2", Met: true, Source: "common practice"},
			{Zone: "Z1", Rule: "minimum depth", Required: "≥ 25.0 ft", Achieved: "30.0 ft", Met: true, Source: "common practice",
				Origin: "computed: a stress rule; raised from the rule's 15.0 ft to the 25 ft minimum (common practice) → 25.0 ft"}},
		Lab:      []plan.LabBasis{{Zone: "Z1", Program: "pavement", Basis: "common practice: Proctor (ASTM D698) and CBR (ASTM D1883) on bulk samples"}},
		Coverage: plan.Coverage{AreaFt2: 1000, CoveredFt2: 1000, CoveredPercent: 100},
		Solver:   plan.SolverInfo{Status: "optimal", Objective: 1235167.51, Bound: 1235167.51},
		Excluded: []plan.Excluded{{Zone: "Z1", Method: "test_pit", Rig: "excavator", Reason: "groundwater at 3 ft"}},
		Warnings: []string{"a warning"},
		Cautions: plan.Cautions,
	}
}

func TestGolden(t *testing.T) {
	for _, c := range []struct {
		file   string
		render func(*bytes.Buffer, *plan.Plan) error
	}{
		{"plan.txt", func(b *bytes.Buffer, p *plan.Plan) error { return Text(b, p) }},
		{"plan.json", func(b *bytes.Buffer, p *plan.Plan) error { return JSON(b, p) }},
		{"points.csv", func(b *bytes.Buffer, p *plan.Plan) error { return PointsCSV(b, p) }},
		{"points.geojson", func(b *bytes.Buffer, p *plan.Plan) error { return GeoJSON(b, p) }},
		{"estimate.csv", func(b *bytes.Buffer, p *plan.Plan) error { return EstimateCSV(b, p) }},
	} {
		t.Run(c.file, func(t *testing.T) {
			var b bytes.Buffer
			if err := c.render(&b, samplePlan()); err != nil {
				t.Fatal(err)
			}
			path := filepath.Join("testdata", c.file+".golden")
			if *update {
				if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
					t.Fatal(err)
				}
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test -update to create it)", err)
			}
			if !bytes.Equal(b.Bytes(), want) {
				t.Fatalf("%s differs from the golden file; run go test ./optimizer/report -update if intended\n%s", c.file, b.String())
			}
		})
	}
}

// TestEstimateCSVReadsBack reads the estimate CSV back with encoding/csv,
// as a spreadsheet would: every line's extension is its quantity times its
// unit price, the lines add to the total row, and every amount has exactly
// two decimals and no thousands separator.
func TestEstimateCSVReadsBack(t *testing.T) {
	p := samplePlan()
	p.Estimate = append(p.Estimate, plan.Line{Item: "lab-x", Description: "A test, with a comma — and a dash", Quantity: 2.5, Unit: "each", UnitPrice: 0.1, Extension: 0.25})
	p.Total += 0.25
	var b bytes.Buffer
	if err := EstimateCSV(&b, p); err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(&b).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != len(p.Estimate)+2 {
		t.Fatalf("%d rows, want header, %d lines and the total", len(rows), len(p.Estimate))
	}
	money := regexp.MustCompile(`^-?[0-9]+\.[0-9]{2}$`)
	num := func(s string) float64 {
		v, err := strconv.ParseFloat(s, 64)
		if err != nil {
			t.Fatalf("%q is not a number: %v", s, err)
		}
		return v
	}
	sum := 0.0
	for i, r := range rows[1 : len(rows)-1] {
		if r[0] != p.Estimate[i].Item || r[1] != p.Estimate[i].Description {
			t.Errorf("row %d: %q", i+1, r)
		}
		for _, m := range r[4:6] {
			if !money.MatchString(m) {
				t.Errorf("row %d: amount %q is not two decimals without separators", i+1, m)
			}
		}
		q, u, e := num(r[2]), num(r[4]), num(r[5])
		if math.Abs(q*u-e) > 0.005 {
			t.Errorf("row %d: %g × %g = %g, extension says %g", i+1, q, u, q*u, e)
		}
		sum += e
	}
	last := rows[len(rows)-1]
	if last[0] != "total" || math.Abs(num(last[5])-sum) > 0.005 || !money.MatchString(last[5]) {
		t.Errorf("total row %q; lines add to %.2f", last, sum)
	}
}

// TestGeoJSONNames: every point feature carries its ID as the "name"
// property GIS programs label points by, and as the feature id.
func TestGeoJSONNames(t *testing.T) {
	p := samplePlan()
	var b bytes.Buffer
	if err := GeoJSON(&b, p); err != nil {
		t.Fatal(err)
	}
	var fc struct {
		Features []struct {
			ID         string         `json:"id"`
			Properties map[string]any `json:"properties"`
		} `json:"features"`
	}
	if err := json.Unmarshal(b.Bytes(), &fc); err != nil {
		t.Fatal(err)
	}
	if len(fc.Features) != len(p.Points) {
		t.Fatalf("%d features for %d points", len(fc.Features), len(p.Points))
	}
	for i, f := range fc.Features {
		if f.ID != p.Points[i].ID || f.Properties["name"] != p.Points[i].ID {
			t.Errorf("feature %d: id %q, name %v; want both %q", i, f.ID, f.Properties["name"], p.Points[i].ID)
		}
	}
}

func TestGeoJSONNeedsOrigin(t *testing.T) {
	p := samplePlan()
	p.Points[1].Lon, p.Points[1].Lat = nil, nil
	var b bytes.Buffer
	err := GeoJSON(&b, p)
	if err == nil || !strings.Contains(err.Error(), "origin") {
		t.Fatalf("want an error asking for an origin, got %v", err)
	}
}

func TestMoney(t *testing.T) {
	for _, c := range []struct {
		v    float64
		cur  string
		want string
	}{
		{0, "", "0.00"},
		{999.995, "", "1,000.00"},
		{1234567.5, "USD", "USD 1,234,567.50"},
		{-1500, "", "-1,500.00"},
		{12.3, "", "12.30"},
	} {
		if got := money(c.v, c.cur); got != c.want {
			t.Errorf("money(%v, %q) = %q, want %q", c.v, c.cur, got, c.want)
		}
	}
}
