package schedule

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"encoding/xml"
	"errors"
	"flag"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

var update = flag.Bool("update", false, "rewrite golden files in testdata")

// smallCase is a fixed invented case: two rigs, six points, a wet Tuesday,
// a weekend. Demo data only.
func smallCase(t *testing.T) *Schedule {
	t.Helper()
	lon := func(v float64) *float64 { return &v }
	jobs := []Job{
		{ID: "B-1", Rig: "tire-drill", X: 0, Y: 0, Hours: 5, Surface: Firm, Method: "boring", DepthFt: 30, SampleIntervalFt: 5, Lon: lon(-97.0001), Lat: lon(30.0001)},
		{ID: "B-2", Rig: "tire-drill", X: 400, Y: 0, Hours: 6, Surface: Firm, Method: "boring", DepthFt: 40, SampleIntervalFt: 5, Lon: lon(-96.9988), Lat: lon(30.0001)},
		{ID: "B-3", Rig: "tire-drill", X: 400, Y: 300, Hours: 12, Surface: Soft, Method: "boring", DepthFt: 50, SampleIntervalFt: 5, Lon: lon(-96.9988), Lat: lon(30.0009)},
		{ID: "B-4", Rig: "tire-drill", X: 0, Y: 300, Hours: 4, Surface: Firm, Method: "boring", DepthFt: 25, SampleIntervalFt: 2.5, Lon: lon(-97.0001), Lat: lon(30.0009)},
		{ID: "C-1", Rig: "cone-truck", X: 200, Y: 150, Hours: 3, Surface: Firm, Method: "cpt", DepthFt: 60, Lon: lon(-96.9995), Lat: lon(30.0005)},
		{ID: "C-2", Rig: "cone-truck", X: 600, Y: 150, Hours: 12, Surface: Firm, Method: "cpt", DepthFt: 100, Lon: lon(-96.9982), Lat: lon(30.0005)},
	}
	rigs := []RigSpec{
		{Name: "tire-drill", SpeedFtPerHr: map[string]float64{Firm: 1200, Soft: 500}, MobHours: 2.5, DemobHours: 2, StandbyItem: "standby-hr", StandbyRate: 180, Entrance: &XY{0, -100}},
		{Name: "cone-truck", SpeedFtPerHr: map[string]float64{Firm: 1500}, WetAccess: true, MobHours: 1, DemobHours: 1},
	}
	cal := Calendar{Start: time.Date(2027, 4, 1, 0, 0, 0, 0, time.UTC), WorkStart: 7 * time.Hour, HoursPerDay: 10, StartUpHours: StartUpHours,
		WetDates: []time.Time{time.Date(2027, 4, 6, 0, 0, 0, 0, time.UTC)}}
	s, err := Build(jobs, rigs, cal)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.MkdirAll("testdata", 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs from the golden file; run go test -update after checking the change", name)
	}
}

func TestGanttSVGGolden(t *testing.T) {
	s := smallCase(t)
	var b bytes.Buffer
	if err := WriteGanttSVG(&b, s); err != nil {
		t.Fatal(err)
	}
	// Well-formed XML, one lane per rig, a standby bar for the wet day.
	d := xml.NewDecoder(bytes.NewReader(b.Bytes()))
	for {
		if _, err := d.Token(); err == io.EOF {
			break
		} else if err != nil {
			t.Fatalf("SVG is not well-formed XML: %v", err)
		}
	}
	out := b.String()
	for _, want := range []string{`id="lane-1"`, `id="lane-2"`, `url(#standby-hatch)`, `stroke-dasharray`, `>tire-drill<`, `>cone-truck<`, `Apr 2027`} {
		if !strings.Contains(out, want) {
			t.Errorf("SVG lacks %s", want)
		}
	}
	if strings.Contains(out, "<script") || strings.Contains(out, "href=\"http") {
		t.Error("SVG is not self-contained")
	}
	golden(t, "gantt_small.svg", b.Bytes())
	var b2 bytes.Buffer
	_ = WriteGanttSVG(&b2, smallCase(t))
	if !bytes.Equal(b.Bytes(), b2.Bytes()) {
		t.Error("two renderings differ")
	}
}

func TestScheduleCSV(t *testing.T) {
	s := smallCase(t)
	var b bytes.Buffer
	if err := WriteCSV(&b, s); err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(&b).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, r := range s.Rigs {
		for _, d := range r.Days {
			n += len(d.Entries)
		}
	}
	if len(rows) != n+1 {
		t.Fatalf("%d rows, want header + %d entries", len(rows), n)
	}
	if strings.Join(rows[0], ",") != "rig,date,work_day,start,end,hours,kind,point,method,depth_ft,spans_days,wet" {
		t.Errorf("header %v", rows[0])
	}
	standby := 0
	for _, r := range rows[1:] {
		if r[6] == "standby" {
			standby++
			if r[0] != "tire-drill" || r[1] != "2027-04-06" || r[3] != "07:30" || r[4] != "17:00" || r[11] != "true" {
				t.Errorf("standby row %v; want tire-drill on the wet Tuesday 07:30–17:00 (after the start-up)", r)
			}
		}
		if r[1] == "2027-04-03" || r[1] == "2027-04-04" {
			t.Errorf("row on a weekend: %v", r)
		}
	}
	if standby != 1 {
		t.Errorf("%d standby rows, want 1", standby)
	}
	golden(t, "schedule_small.csv", b.Bytes())
}

func TestScheduleText(t *testing.T) {
	var b bytes.Buffer
	if err := WriteText(&b, smallCase(t)); err != nil {
		t.Fatal(err)
	}
	golden(t, "schedule_small.txt", b.Bytes())
}

func TestStakeout(t *testing.T) {
	s := smallCase(t)
	var b bytes.Buffer
	if err := WriteStakeoutCSV(&b, s); err != nil {
		t.Fatal(err)
	}
	rows, err := csv.NewReader(&b).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 7 || rows[0][0] != "id" {
		t.Fatalf("stakeout CSV rows %v", rows)
	}
	for i := 2; i < len(rows); i++ {
		if rows[i][10] < rows[i-1][10] {
			t.Errorf("stakeout not by date: %v after %v", rows[i], rows[i-1])
		}
	}
	b.Reset()
	if err := WriteStakeoutGeoJSON(&b, s); err != nil {
		t.Fatal(err)
	}
	var fc struct {
		Type     string
		Features []struct {
			Type     string
			Geometry struct {
				Type        string
				Coordinates []float64
			}
			Properties map[string]any
		}
	}
	if err := json.Unmarshal(b.Bytes(), &fc); err != nil {
		t.Fatal(err)
	}
	// RFC 7946 §3.3, §3.2, §3.1.2: a FeatureCollection of Features whose
	// Point coordinates are [longitude, latitude].
	if fc.Type != "FeatureCollection" || len(fc.Features) != 6 {
		t.Fatalf("GeoJSON %s with %d features", fc.Type, len(fc.Features))
	}
	for _, f := range fc.Features {
		c := f.Geometry.Coordinates
		if f.Type != "Feature" || f.Geometry.Type != "Point" || len(c) != 2 || c[0] > -96 || c[1] < 29 {
			t.Errorf("feature %v: want a Point at [lon ≈ -97, lat ≈ 30]", f)
		}
		if f.Properties["date"] == "" || f.Properties["rig"] == "" {
			t.Errorf("feature %v lacks date or rig", f.Properties)
		}
		// The name property labels the point in GIS (KML <name>).
		if n, _ := f.Properties["name"].(string); n == "" || n != f.Properties["id"] {
			t.Errorf("feature %v: name %q, want its point ID", f.Properties, n)
		}
	}
	golden(t, "stakeout_small.geojson", b.Bytes())

	s.Stakes[2].Lon, s.Stakes[2].Lat = nil, nil
	var ie *InputError
	err = WriteStakeoutGeoJSON(io.Discard, s)
	if !errors.As(err, &ie) || !strings.Contains(err.Error(), "origin") {
		t.Errorf("GeoJSON without lon/lat: %v; want an InputError asking for an origin", err)
	}
}

func TestRiskText(t *testing.T) {
	jobs, rigs, cal := riskCase()
	r, err := Risk(jobs, rigs, cal, Options{Seed: 11, Runs: 200, ProductionCV: 0.2})
	if err != nil {
		t.Fatal(err)
	}
	var b bytes.Buffer
	if err := WriteRiskText(&b, r); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"P50", "P80", "seed 11", r.P80Finish.Format(dateLayout)} {
		if !strings.Contains(b.String(), want) {
			t.Errorf("risk text lacks %q:\n%s", want, b.String())
		}
	}
}
