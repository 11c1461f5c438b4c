package scenarios

import (
	"bytes"
	"encoding/json"
	"errors"
	"flag"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
)

var update = flag.Bool("update", false, "rewrite the golden files under testdata/golden")

// TestDemosGolden loads every demo and compares the Scenario, as indented
// JSON, with testdata/golden/NAME.json. Refresh with go test -update.
func TestDemosGolden(t *testing.T) {
	for _, name := range Demos() {
		t.Run(name, func(t *testing.T) {
			s, err := LoadDemo(name, nil)
			if err != nil {
				t.Fatal(err)
			}
			got, err := json.MarshalIndent(s, "", "  ")
			if err != nil {
				t.Fatal(err)
			}
			got = append(got, '\n')
			path := filepath.Join("testdata", "golden", name+".json")
			if *update {
				if err := os.WriteFile(path, got, 0o644); err != nil {
					t.Fatal(err)
				}
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run go test -update to create it)", err)
			}
			if !bytes.Equal(got, want) {
				t.Errorf("loaded %s differs from %s (run go test -update after checking the change)", name, path)
			}
		})
	}
}

// accessLimit is what a practitioner expects of each built-in rig (the
// brief's access limits, common practice): surfaces it can work on,
// steepest slope, overhead height it needs, and the methods it performs
// with the deepest each reaches. Test-pit reach of 15 ft is a large
// backhoe or small tracked excavator (published practice note, SOURCES.md:
// about 2.5–5 m).
type accessLimit struct {
	surfaces   []sdk.Surface
	maxSlope   float64
	overheadFt float64
	methods    map[sdk.Method]float64
}

var expectedAccess = map[string]accessLimit{
	"tire-drill":  {[]sdk.Surface{sdk.Firm}, 12, 30, map[sdk.Method]float64{sdk.Boring: 150}},
	"track-drill": {[]sdk.Surface{sdk.Firm, sdk.Wet, sdk.Soft}, 30, 30, map[sdk.Method]float64{sdk.Boring: 150}},
	"excavator":   {[]sdk.Surface{sdk.Firm, sdk.Wet}, 20, 20, map[sdk.Method]float64{sdk.TestPit: 15}},
	"cpt-rig":     {[]sdk.Surface{sdk.Firm}, 8, 25, map[sdk.Method]float64{sdk.CPT: 150}},
}

// TestDemoInvariants checks what the demos promise: they say they are
// invented, they are a few acres, every zone can be reached by an offered
// rig with an allowed method at the required depth, and their rate book
// prices every standard item.
func TestDemoInvariants(t *testing.T) {
	if len(Demos()) < 3 {
		t.Fatalf("Demos() = %v, want at least 3", Demos())
	}
	if !contains(Demos(), DefaultDemo) {
		t.Errorf("DefaultDemo %q not among %v", DefaultDemo, Demos())
	}
	for _, name := range Demos() {
		t.Run(name, func(t *testing.T) {
			raw, err := DemoFile(name)
			if err != nil {
				t.Fatal(err)
			}
			if !strings.Contains(string(raw), "INVENTED DEMO DATA") {
				t.Error("demo file does not say INVENTED DEMO DATA")
			}
			s, err := LoadDemo(name, nil)
			if err != nil {
				t.Fatal(err)
			}
			if !s.Demo || !strings.Contains(strings.ToLower(s.Note), "invented") {
				t.Errorf("Demo = %v, Note = %q; want demo: true and a note saying invented", s.Demo, s.Note)
			}
			if s.Name != name || s.Source != "demo:"+name {
				t.Errorf("Name %q Source %q", s.Name, s.Source)
			}
			acres := area(s.Boundary) / 43560 // 1 acre = 43,560 ft² (US customary definition)
			if acres < 2 || acres > 10 {
				t.Errorf("site is %.2f acres; demos are a few acres", acres)
			}
			if len(s.Zones) < 3 {
				t.Errorf("%d zones; want at least 3", len(s.Zones))
			}
			for _, z := range s.Zones {
				if z.Rules.Source == "" {
					t.Errorf("zone %s: rules cite no source", z.ID)
				}
				if !reachable(s, z) {
					t.Errorf("zone %s (%s, slope %g %%, overhead %g ft, depth %g ft, methods %v) is reached by none of %v",
						z.ID, z.Ground.Surface, z.Ground.SlopePct, z.Ground.OverheadFt, z.Rules.MinDepthFt, z.Rules.Methods, s.Rigs)
				}
			}
			rb, err := ratebooks.LoadDemo(s.RateBook)
			if err != nil {
				t.Fatal(err)
			}
			if err := rb.Check(ratebooks.StandardCodes()); err != nil {
				t.Error(err)
			}
		})
	}
}

func reachable(s *Scenario, z Zone) bool {
	for _, r := range s.Rigs {
		a, ok := expectedAccess[r]
		if !ok {
			continue
		}
		if !containsSurface(a.surfaces, z.Ground.Surface) || z.Ground.SlopePct > a.maxSlope {
			continue
		}
		if z.Ground.OverheadFt > 0 && z.Ground.OverheadFt < a.overheadFt {
			continue
		}
		for m, depth := range a.methods {
			allowed := len(z.Rules.Methods) == 0
			for _, zm := range z.Rules.Methods {
				allowed = allowed || zm == m
			}
			if allowed && depth >= z.Rules.MinDepthFt {
				return true
			}
		}
	}
	return false
}

func containsSurface(list []sdk.Surface, s sdk.Surface) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

// TestMetricEqualsFeet loads the same scenario written in feet and in
// metres (every length × 0.3048) and expects the same Scenario in feet.
// 1 ft = 0.3048 m exactly: the international foot, by the 1959 agreement of
// the national standards laboratories (NBS Special Publication 330 and
// NIST SP 811, appendix B).
func TestMetricEqualsFeet(t *testing.T) {
	ft, err := Load(filepath.Join("testdata", "good", "base.yaml"), nil)
	if err != nil {
		t.Fatal(err)
	}
	m, err := Load(filepath.Join("testdata", "good", "metric.yaml"), nil)
	if err != nil {
		t.Fatal(err)
	}
	if m.Units != "m" || ft.Units != "ft" {
		t.Fatalf("Units %q %q", m.Units, ft.Units)
	}
	near := func(what string, a, b float64) {
		t.Helper()
		if math.Abs(a-b) > 1e-12*math.Max(1, math.Abs(b)) {
			t.Errorf("%s: metric file gives %.15g ft, feet file %.15g ft", what, a, b)
		}
	}
	for i := range ft.Boundary {
		near("boundary x", m.Boundary[i].X, ft.Boundary[i].X)
		near("boundary y", m.Boundary[i].Y, ft.Boundary[i].Y)
	}
	for i, z := range ft.Zones {
		mz := m.Zones[i]
		for k := range z.Polygon {
			near(z.ID+" x", mz.Polygon[k].X, z.Polygon[k].X)
			near(z.ID+" y", mz.Polygon[k].Y, z.Polygon[k].Y)
		}
		near(z.ID+" max_spacing", mz.Rules.MaxSpacingFt, z.Rules.MaxSpacingFt)
		near(z.ID+" min_depth", mz.Rules.MinDepthFt, z.Rules.MinDepthFt)
		near(z.ID+" area_per_point", mz.Rules.AreaPerPointFt2, z.Rules.AreaPerPointFt2)
	}
	// The definition itself: 0.3048 m is one foot, 0.09290304 m² one
	// square foot, with no rounding on the way.
	s, err := Parse([]byte(strings.Replace(strings.Replace(mustRead(t, "testdata/good/metric.yaml"),
		"max_spacing: 30.48", "max_spacing: 0.3048", 1), "area_per_point: 929.0304", "area_per_point: 0.09290304", 1)), "metric.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	if got := s.Zones[0].Rules.MaxSpacingFt; got != 1 {
		t.Errorf("0.3048 m = %.17g ft, want exactly 1", got)
	}
	if got := s.Zones[1].Rules.AreaPerPointFt2; math.Abs(got-1) > 1e-15 {
		t.Errorf("0.09290304 m² = %.17g ft², want 1", got)
	}
}

func mustRead(t *testing.T, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// TestOverridesAndEnvironment checks the layers: default < file <
// environment < overrides.
func TestOverridesAndEnvironment(t *testing.T) {
	path := filepath.Join("testdata", "good", "base.yaml")
	s, err := Load(path, nil)
	if err != nil {
		t.Fatal(err)
	}
	if s.YardMiles != 20 || s.HoursDay != DefaultHoursPerDay || s.GapRel != DefaultGap || s.TimeLimitS != DefaultTimeLimitS || s.RateBook != DefaultRateBook {
		t.Fatalf("file and defaults: yard %g hours %g gap %g limit %g book %q", s.YardMiles, s.HoursDay, s.GapRel, s.TimeLimitS, s.RateBook)
	}
	if s.Zones[0].Rules.Lattice != Triangular || s.Zones[0].Priority != DefaultPriority || s.Zones[0].Name != "A" {
		t.Errorf("zone defaults: lattice %q priority %g name %q", s.Zones[0].Rules.Lattice, s.Zones[0].Priority, s.Zones[0].Name)
	}

	// The environment never changes a scenario: tool settings (gap, time
	// limit, threads, plugin folder, rate book) come from the environment
	// through the command line, never through the loader.
	for _, k := range settingKeys {
		t.Setenv(EnvVar(k), "12.5")
	}
	t.Setenv("RIGMIX_RIGS", "track-drill,excavator")
	t.Setenv("RIGMIX_UNITS", "m")
	env, err := Load(path, nil)
	if err != nil {
		t.Fatalf("a scenario loaded with RIGMIX_* variables set: %v", err)
	}
	if !reflect.DeepEqual(env, s) {
		t.Errorf("RIGMIX_* variables changed the scenario:\nwithout %+v\nwith    %+v", s, env)
	}

	s, err = Load(path, map[string]any{"yard_miles": 80, "solver.time_limit_s": 5.0, "rate_book": "coastal-2026"})
	if err != nil {
		t.Fatal(err)
	}
	if s.YardMiles != 80 || s.TimeLimitS != 5 || s.RateBook != "coastal-2026" || s.GapRel != DefaultGap {
		t.Errorf("overrides: yard %g limit %g book %q gap %g", s.YardMiles, s.TimeLimitS, s.RateBook, s.GapRel)
	}

	// A setting missing from the file is missing, whatever the environment.
	data := strings.Replace(mustRead(t, path), "yard_miles: 20\n", "", 1)
	_, err = Parse([]byte(data), "no-yard.yaml", nil)
	var fe *FieldError
	if !errors.As(err, &fe) || fe.Field != "yard_miles" || !strings.Contains(fe.Problem, "missing") {
		t.Errorf("yard_miles missing from the file, set in the environment: %v", err)
	}
}

func TestOverrideErrors(t *testing.T) {
	path := filepath.Join("testdata", "good", "base.yaml")
	tests := []struct {
		overrides      map[string]any
		field, problem string
	}{
		{map[string]any{"solver.gapp": 0.1}, "solver.gapp", "not a setting that can be overridden"},
		{map[string]any{"zones": nil}, "zones", "not a setting"},
		{map[string]any{"hours_per_day": 30}, "hours_per_day", "must be ≤ 24 h, got 30"},
		{map[string]any{"solver.gap": math.NaN()}, "solver.gap", "finite"},
		{map[string]any{"rigs": []string{"tire-drill", "tire-drill"}}, "rigs[1]", "listed twice"},
	}
	for _, tc := range tests {
		_, err := Load(path, tc.overrides)
		var fe *FieldError
		if !errors.As(err, &fe) || fe.Field != tc.field || !strings.Contains(fe.Problem, tc.problem) {
			t.Errorf("overrides %v: err = %v, want field %s and %q", tc.overrides, err, tc.field, tc.problem)
		}
	}
	// Overriding units reinterprets every length: the base file's feet
	// read as metres make every coordinate 1/0.3048 times larger.
	s, err := Load(path, map[string]any{"units": "m"})
	if err != nil {
		t.Fatal(err)
	}
	if got, want := s.Boundary[2].X, 400/0.3048; math.Abs(got-want) > 1e-9 {
		t.Errorf("units override: x = %g, want %g", got, want)
	}
}

// TestGeoJSON loads a scenario whose boundary and one zone come from a
// GeoJSON file (one selected by a numeric property) and checks the
// projected rings against the outlines the file was drawn from.
func TestGeoJSON(t *testing.T) {
	s, err := Load(filepath.Join("testdata", "good", "geo.yaml"), nil)
	if err != nil {
		t.Fatal(err)
	}
	want := pg(0, 0, 400, 0, 400, 300, 0, 300)
	if !reflect.DeepEqual(s.Boundary, want) {
		t.Errorf("boundary = %v, want %v", s.Boundary, want)
	}
	wantB := pg(200, 20, 380, 20, 380, 280, 200, 280)
	if !reflect.DeepEqual(s.Zones[1].Polygon, wantB) {
		t.Errorf("zone B = %v, want %v", s.Zones[1].Polygon, wantB)
	}

	// Independent check of scale: a degree of longitude at latitude φ on
	// the WGS 84 ellipsoid is (π/180)·N·cos φ with N = a/√(1 − e² sin²φ)
	// (Snyder, Map Projections — A Working Manual, USGS PP 1395, eq. 4-20;
	// WGS 84 a and f from NIMA TR8350.2). 400 ft east along the origin's
	// parallel must project to 400 ft within 0.01 ft.
	const a, f = 6378137.0, 1 / 298.257223563
	phi := 41.25 * math.Pi / 180
	e2 := f * (2 - f)
	n := a / math.Sqrt(1-e2*math.Sin(phi)*math.Sin(phi))
	dLon := 400 * 0.3048 / (n * math.Cos(phi)) * 180 / math.Pi
	p := projectFt(LonLat{Lon: -75.5, Lat: 41.25}, -75.5+dLon, 41.25)
	if math.Abs(p.X-400) > 0.01 || math.Abs(p.Y) > 0.01 {
		t.Errorf("400 ft east projects to %v", p)
	}
}

func TestRateBookFile(t *testing.T) {
	dir := t.TempDir()
	rates, err := ratebooks.DemoFile("valley-2026")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "rates"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "rates", "ours.yaml"), rates, 0o644); err != nil {
		t.Fatal(err)
	}
	data := mustRead(t, "testdata/good/base.yaml") + "rate_book: rates/ours.yaml\n"
	scen := filepath.Join(dir, "scenario.yaml")
	if err := os.WriteFile(scen, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	s, err := Load(scen, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want := filepath.Join(dir, "rates", "ours.yaml"); s.RateBook != want {
		t.Errorf("RateBook = %q, want %q", s.RateBook, want)
	}
	if _, err := ratebooks.Load(s.RateBook); err != nil {
		t.Error(err)
	}
}

// TestDeterministic parses each demo twice and expects identical output.
func TestDeterministic(t *testing.T) {
	for _, name := range Demos() {
		a, err := LoadDemo(name, nil)
		if err != nil {
			t.Fatal(err)
		}
		b, _ := LoadDemo(name, nil)
		ja, _ := json.Marshal(a)
		jb, _ := json.Marshal(b)
		if !bytes.Equal(ja, jb) {
			t.Errorf("%s loads differently twice", name)
		}
	}
	if _, err := DemoFile("midrse"); err == nil || !strings.Contains(err.Error(), "did you mean midrise?") {
		t.Errorf("DemoFile(midrse) = %v", err)
	}
}

// TestSettingKeysKnown keeps the override list in step with the schema.
func TestSettingKeysKnown(t *testing.T) {
	for _, k := range SettingKeys() {
		node := schema
		for _, part := range strings.Split(k, ".") {
			next, ok := node.fields[part]
			if !ok {
				t.Fatalf("setting %q is not in the schema", k)
			}
			node = next
		}
	}
	if got := EnvVar("solver.time_limit_s"); got != "RIGMIX_SOLVER_TIME_LIMIT_S" {
		t.Errorf("EnvVar = %q", got)
	}
}
