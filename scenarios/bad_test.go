package scenarios

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestMain clears RIGMIX_* variables so a developer's environment cannot
// change what the files in testdata mean.
func TestMain(m *testing.M) {
	for _, k := range settingKeys {
		os.Unsetenv(EnvVar(k))
	}
	os.Exit(m.Run())
}

// TestBadInput loads every file under testdata/bad and checks the first
// problem reported: its field path and a piece of its wording. Every file
// in the folder must have a row, so a new case cannot go untested.
func TestBadInput(t *testing.T) {
	tests := []struct {
		file, field, problem, hint string
	}{
		{"empty", "", "is empty", ""},
		{"comments_only", "", "is empty", ""},
		{"binary", "", "not a text file", ""},
		{"syntax", "", "not valid YAML", ""},
		{"not_mapping", "", "must be a mapping", ""},
		{"unknown_key", "yard_mile", "unknown key", "did you mean yard_miles?"},
		{"misspelt_nested", "zones[0].rules.max_spacng", "unknown key", "did you mean max_spacing?"},
		{"duplicate_key", "yard_miles", "key given twice", ""},
		{"missing_units", "units", "missing", "units: ft"},
		{"bad_units", "units", `unknown value "feet"`, "did you mean ft?"},
		{"negative_spacing", "zones[0].rules.max_spacing", "must be > 0 ft, got -50", "give a spacing in ft, e.g. 100"},
		{"zero_spacing", "zones[0].rules.max_spacing", "must be > 0 ft, got 0", "leave the key out"},
		{"nan_depth", "zones[0].rules.min_depth", "must be a finite number, got NaN", ""},
		{"inf_coordinate", "zones[0].polygon[1][0]", "must be a finite number, got +Inf", ""},
		{"huge_depth", "zones[0].rules.min_depth", "must be ≤ 1000 ft, got 50000", ""},
		{"huge_boundary", "boundary", "encloses 2754821 acres", ""},
		{"text_number", "zones[0].rules.max_spacing", `must be a number, got "wide"`, ""},
		{"negative_slope", "zones[0].ground.slope_pct", "must be ≥ 0 %, got -3", ""},
		{"two_vertices", "zones[0].polygon", "has 2 vertices", "at least 3 vertices"},
		{"collinear", "zones[0].polygon", "has no area", ""},
		{"duplicate_vertex", "zones[0].polygon", "vertices 1 and 2 are the same point", ""},
		{"self_intersecting", "zones[0].polygon", "is self-intersecting", ""},
		{"zone_outside", "zones[1].polygon", "zone B reaches outside the site boundary", ""},
		{"overlapping", "zones[1].polygon", "zone B overlaps zone A", ""},
		{"identical_zones", "zones[1].polygon", "zone B overlaps zone A", ""},
		{"duplicate_id", "zones[1].id", `duplicate id "A"`, ""},
		{"unknown_use", "zones[0].use", `unknown value "building"`, "did you mean structure? one of: environmental"},
		{"unknown_surface", "zones[0].ground.surface", `unknown value "frim"`, "did you mean firm?"},
		{"unknown_method", "zones[0].rules.methods[1]", `unknown method "spt"`, "did you mean boring? one of: boring, cpt, probe, test_pit"},
		{"unknown_lattice", "zones[0].rules.lattice", `unknown value "hexagonal"`, "did you mean triangular?"},
		{"share_above_one", "zones[0].rules.sampled_share", "must be ≤ 1, got 1.5", ""},
		{"share_negative", "zones[0].rules.sampled_share", "must be ≥ 0, got -0.1", ""},
		{"share_unsampled", "zones[0].rules.sampled_share", "none of the methods (cpt, probe) recovers samples", ""},
		{"nogo_swallows", "zones[0]", "no-go area tank leaves no ground to explore in zone A", ""},
		{"nogo_union_swallows", "zones[0]", "no-go areas east, west leave no ground", ""},
		{"missing_min_depth", "zones[1].rules.min_depth", "missing", ""},
		{"no_point_rule", "zones[1].rules", "asks for no points", "max_spacing"},
		{"structure_missing", "zones[0].structure", "missing (use: structure)", "stories"},
		{"structure_on_open", "zones[0].structure", "only a zone with use: structure", ""},
		{"fractional_stories", "zones[0].structure.stories", "must be a whole number, got 2.5", ""},
		{"demo_without_note", "note", "missing (demo: true)", "invented"},
		{"geojson_no_origin", "zones[1].geojson", "GeoJSON needs the scenario's origin", "origin:"},
		{"geojson_no_feature", "zones[1].geojson", `no feature with id = "Q9"`, `"B", "far", "holed"`},
		{"geojson_missing_file", "zones[1].geojson.file", "cannot read", ""},
		{"geojson_and_polygon", "zones[1].geojson", "either polygon or geojson", ""},
		{"geojson_holed", "zones[1].geojson", `feature "holed" has a hole`, "no-go area"},
		{"geojson_multi", "zones[1].geojson", "MultiPolygon of 2 parts", ""},
		{"geojson_open_ring", "zones[1].geojson", "ring is not closed", "RFC 7946"},
		{"geojson_far", "zones[1].geojson", "ft from the origin", ""},
		{"geojson_line", "zones[1].geojson", "is a LineString, not a Polygon", ""},
		{"geojson_twin", "zones[1].geojson", `2 features have id = "twin"`, ""},
		{"required_point_outside", "zones[0].rules.required_points[0]", "[250, 100] is outside the zone", ""},
		{"required_point_in_nogo", "zones[0].rules.required_points[0]", "point lies in no-go area well", ""},
		{"unknown_rate_book", "rate_book", `no demo rate book named "valey-2026"`, "did you mean valley-2026?"},
		{"missing_rate_book_file", "rate_book", "cannot read", ""},
		{"rate_book_device", "rate_book", "cannot read /dev/zero", ""},
		{"hours_per_day", "hours_per_day", "must be ≤ 24 h, got 30", ""},
		{"missing_yard_miles", "yard_miles", "missing", "yard_miles: 35"},
		{"duplicate_rig", "rigs[2]", `"tire-drill" listed twice`, ""},
		{"no_rigs", "rigs", "missing", ""},
		{"units_not_offered", "rig_units.track-drill", `"track-drill" is not among the rigs offered`, "rigs"},
		{"units_too_many", "rig_units.tire-drill", "must be ≤ 10", "crews"},
		{"zones_not_list", "zones", "must be a list", ""},
		{"missing_boundary", "boundary", "missing", ""},
		{"gap_too_big", "solver.gap", "must be ≤ 0.99, got 1.5", ""},
		{"negative_time_limit", "solver.time_limit_s", "must be ≥ 0 s, got -1", ""},
		{"bad_name", "name", `"Base Case" is not a valid name`, ""},
		{"origin_out_of_range", "origin.lat", "must be ≤ 85, got 141.25", ""},
		{"unknown_preset", "zones[1].rules.preset", `zone B: unknown preset "navfac-soft-strta"`, "did you mean navfac-soft-strata?"},
		{"depth_without_stories", "zones[0].rules.min_depth.from", "zone A: depth rule from: stories is missing the number of stories", "structure"},
		{"footing_without_pressure", "zones[1].rules.min_depth.bearing_pressure", "zone B: depth rule from: footing is missing bearing_pressure", "psf"},
		{"rock_without_depth", "zones[1].rules.min_depth.from", "zone B: depth rule from: rock is missing the depth to rock", "rock_depth"},
		{"unknown_lab_program", "lab.program", `unknown lab program "ful"`, "default"},
	}
	covered := map[string]bool{}
	for _, tc := range tests {
		covered[tc.file+".yaml"] = true
		t.Run(tc.file, func(t *testing.T) {
			path := filepath.Join("testdata", "bad", tc.file+".yaml")
			s, err := Load(path, nil)
			if err == nil {
				t.Fatalf("loaded without error: %+v", s)
			}
			var fe *FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("error is %T, want *FieldError: %v", err, err)
			}
			if !fe.BadInput() {
				t.Errorf("BadInput() = false")
			}
			if fe.File != path {
				t.Errorf("File = %q, want %q", fe.File, path)
			}
			if fe.Field != tc.field {
				t.Errorf("Field = %q, want %q (error: %v)", fe.Field, tc.field, err)
			}
			if !strings.Contains(fe.Problem, tc.problem) {
				t.Errorf("Problem = %q, want it to contain %q", fe.Problem, tc.problem)
			}
			if !strings.Contains(fe.Hint, tc.hint) {
				t.Errorf("Hint = %q, want it to contain %q", fe.Hint, tc.hint)
			}
		})
	}
	entries, err := os.ReadDir(filepath.Join("testdata", "bad"))
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range entries {
		if !covered[e.Name()] {
			t.Errorf("testdata/bad/%s has no row in the table", e.Name())
		}
	}
}

func TestFieldErrorText(t *testing.T) {
	e := &FieldError{File: "scenario.yaml", Field: "zones[2].rules.max_spacing", Problem: "must be > 0, got -50", Hint: "give a spacing in ft, e.g. 100"}
	want := "scenario.yaml: zones[2].rules.max_spacing: must be > 0, got -50 (give a spacing in ft, e.g. 100)"
	if got := e.Error(); got != want {
		t.Errorf("Error() = %q, want %q", got, want)
	}
	e = &FieldError{File: "x.yaml", Problem: "is empty"}
	if got := e.Error(); got != "x.yaml: is empty" {
		t.Errorf("Error() = %q", got)
	}
	// The command line finds the exit code through this interface.
	var bi interface{ BadInput() bool }
	if !errors.As(error(e), &bi) || !bi.BadInput() {
		t.Error("FieldError does not report BadInput")
	}
}

func TestLoadMissingFile(t *testing.T) {
	_, err := Load(filepath.Join("testdata", "no-such.yaml"), nil)
	var fe *FieldError
	if !errors.As(err, &fe) || fe.Problem != "no such file" {
		t.Fatalf("err = %v, want a FieldError \"no such file\"", err)
	}
}

func TestNearest(t *testing.T) {
	known := []string{"max_spacing", "min_depth", "min_points", "methods", "sampled_share"}
	tests := []struct{ word, want string }{
		{"max_spacng", "max_spacing"},
		{"min_dept", "min_depth"},
		{"MIN_POINTS", "min_points"},
		{"sample_share", "sampled_share"},
		{"zzz", ""},
		{"spacing", "max_spacing"}, // contained in a key
	}
	for _, tc := range tests {
		if got := nearest(tc.word, known); got != tc.want {
			t.Errorf("nearest(%q) = %q, want %q", tc.word, got, tc.want)
		}
	}
}
