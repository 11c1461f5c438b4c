package ratebooks

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/lab"
)

func TestBadRateBooks(t *testing.T) {
	tests := []struct{ file, field, problem, hint string }{
		{"empty", "", "is empty", ""},
		{"binary", "", "not a text file", ""},
		{"syntax", "", "not valid YAML", ""},
		{"not_mapping", "", "must be a mapping", ""},
		{"unknown_key", "curency", "unknown key", "did you mean currency?"},
		{"unknown_item_key", "items[0].unit_prize", "unknown key", "did you mean unit_price?"},
		{"missing_name", "name", "missing", ""},
		{"missing_currency", "currency", "missing", "ISO 4217"},
		{"bad_currency", "currency", `"dollars" is not a currency code`, "USD"},
		{"missing_date", "effective", "missing", "YYYY-MM-DD"},
		{"bad_date", "effective", `"2026-02-30" is not a date`, ""},
		{"date_format", "effective", `"03/01/2026" is not a date`, "YYYY-MM-DD"},
		{"demo_without_note", "note", "missing (demo: true)", "invented"},
		{"no_items", "items", "missing", ""},
		{"empty_items", "items", "is empty", ""},
		{"duplicate_code", "items[1].code", `duplicate code "drill-0-50" (also items[0])`, ""},
		{"bad_code", "items[1].code", `"SPT sample" is not a valid item code`, ""},
		{"missing_description", "items[1].description", "missing", ""},
		{"unknown_unit", "items[1].unit", `unknown unit "ea"`, "did you mean each?"},
		{"wrong_standard_unit", "items[0].unit", "must be ft for the standard item drill-0-50, got m", ""},
		{"missing_price", "items[1].unit_price", "missing", "a price per each in USD"},
		{"negative_price", "items[1].unit_price", "must be ≥ 0, got -45.5", ""},
		{"nan_price", "items[1].unit_price", "must be a finite number", ""},
		{"inf_price", "items[1].unit_price", "must be a finite number", ""},
		{"huge_price", "items[1].unit_price", "must be ≤ 1e+07", ""},
		{"text_price", "items[1].unit_price", `must be a number, got "$45.50"`, "without a currency sign"},
	}
	covered := map[string]bool{}
	for _, tc := range tests {
		covered[tc.file+".yaml"] = true
		t.Run(tc.file, func(t *testing.T) {
			path := filepath.Join("testdata", "bad", tc.file+".yaml")
			b, err := Load(path)
			if err == nil {
				t.Fatalf("loaded without error: %+v", b)
			}
			var fe *FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("error is %T, want *FieldError: %v", err, err)
			}
			if !fe.BadInput() || fe.File != path {
				t.Errorf("BadInput %v File %q", fe.BadInput(), fe.File)
			}
			if fe.Field != tc.field || !strings.Contains(fe.Problem, tc.problem) || !strings.Contains(fe.Hint, tc.hint) {
				t.Errorf("got %v\nwant field %q, problem ~%q, hint ~%q", err, tc.field, tc.problem, tc.hint)
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

func TestGoodRateBook(t *testing.T) {
	b, err := Load(filepath.Join("testdata", "good.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	if b.Name != "test-rates" || b.Currency != "USD" || b.Effective != "2026-03-01" || len(b.Items) != 3 || b.Demo {
		t.Errorf("loaded %+v", b)
	}
	it, ok := b.Price("spt-sample")
	if !ok || it.UnitPrice != 45.5 || it.Unit != "each" {
		t.Errorf("Price(spt-sample) = %+v, %v", it, ok)
	}
	if _, ok := b.Price("rock-core"); ok {
		t.Error("Price(rock-core) found in a book that does not price it")
	}
	if err := b.Check([]string{"drill-0-50", "spt-sample"}); err != nil {
		t.Errorf("Check of priced codes: %v", err)
	}
}

// TestCheckNamesMissing: Check names every missing item once, sorted, with
// the rate book's file and the unit each standard item takes.
func TestCheckNamesMissing(t *testing.T) {
	path := filepath.Join("testdata", "good.yaml")
	b, err := Load(path)
	if err != nil {
		t.Fatal(err)
	}
	err = b.Check([]string{"spt-sample", "rock-core", "mob-cpt-rig", "rock-core", "own-item"})
	var fe *FieldError
	if !errors.As(err, &fe) {
		t.Fatalf("Check = %v, want a *FieldError", err)
	}
	want := path + ": items: no price for 3 items: mob-cpt-rig, own-item, rock-core " +
		"(add code: mob-cpt-rig, unit: each; code: own-item; code: rock-core, unit: ft with a unit_price)"
	if err.Error() != want {
		t.Errorf("Check error\n got %q\nwant %q", err.Error(), want)
	}
	if err := b.Check(nil); err != nil {
		t.Errorf("Check(nil) = %v", err)
	}
}

// TestDemos: the demo rate books price every standard item in its unit,
// say they are invented, and stand for different price levels.
func TestDemos(t *testing.T) {
	names := Demos()
	if len(names) < 2 || names[0] != "coastal-2026" || names[1] != "valley-2026" {
		t.Fatalf("Demos() = %v", names)
	}
	books := map[string]*RateBook{}
	for _, n := range names {
		b, err := LoadDemo(n)
		if err != nil {
			t.Fatal(err)
		}
		if !b.Demo || !strings.Contains(strings.ToLower(b.Note), "invented") || b.Source != "demo:"+n || b.Name != n {
			t.Errorf("%s: Demo %v Note %q Source %q Name %q", n, b.Demo, b.Note, b.Source, b.Name)
		}
		raw, _ := DemoFile(n)
		if !strings.Contains(string(raw), "INVENTED DEMO DATA") {
			t.Errorf("%s: file does not say INVENTED DEMO DATA", n)
		}
		if err := b.Check(StandardCodes()); err != nil {
			t.Error(err)
		}
		for _, std := range StandardItems() {
			it, _ := b.Price(std.Code)
			if it.Unit != std.Unit || it.UnitPrice <= 0 {
				t.Errorf("%s: %s priced %g per %s; want a positive price per %s", n, std.Code, it.UnitPrice, it.Unit, std.Unit)
			}
		}
		books[n] = b
	}
	// The coastal book is the costlier region item by item (a property of
	// the invented demo data, so the rate-book comparison shows a difference).
	for _, it := range books["valley-2026"].Items {
		c, _ := books["coastal-2026"].Price(it.Code)
		if c.UnitPrice <= it.UnitPrice {
			t.Errorf("%s: coastal %g ≤ valley %g", it.Code, c.UnitPrice, it.UnitPrice)
		}
	}
	if _, err := LoadDemo("valley"); err == nil || !strings.Contains(err.Error(), "valley-2026") {
		t.Errorf("LoadDemo(valley) = %v", err)
	}
}

func TestStandardItemsMatchTable(t *testing.T) {
	// The contract in notes/items.md lists 27 codes, plus the 13 test
	// codes of package optimizer/lab (7 index and strength tests, and the
	// compaction, bearing-ratio, permeability, infiltration and analytical
	// items of the programs by zone purpose); each unit is one of ft,
	// each, hr, day, mi.
	if n := len(StandardCodes()); n != 40 {
		t.Errorf("%d standard codes, want 40", n)
	}
	seen := map[string]bool{}
	for _, it := range StandardItems() {
		if seen[it.Code] {
			t.Errorf("standard code %s twice", it.Code)
		}
		seen[it.Code] = true
		switch it.Unit {
		case "ft", "each", "hr", "day", "mi":
		default:
			t.Errorf("%s: unit %q", it.Code, it.Unit)
		}
	}
}

func TestLoadMissingFile(t *testing.T) {
	_, err := Load(filepath.Join("testdata", "nope.yaml"))
	var fe *FieldError
	if !errors.As(err, &fe) || fe.Problem != "no such file" || !strings.Contains(fe.Hint, "valley-2026") {
		t.Errorf("err = %v", err)
	}
}

// FuzzParse: Parse never panics and fails only with a *FieldError.
func FuzzParse(f *testing.F) {
	for _, n := range Demos() {
		b, _ := DemoFile(n)
		f.Add(b)
	}
	files, _ := filepath.Glob(filepath.Join("testdata", "*", "*.yaml"))
	for _, p := range append(files, filepath.Join("testdata", "good.yaml")) {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := Parse(data, "fuzz.yaml")
		if err != nil {
			var fe *FieldError
			if !errors.As(err, &fe) || b != nil {
				t.Fatalf("error %T %v with book %v", err, err, b)
			}
			return
		}
		if len(b.Items) == 0 || b.Currency == "" {
			t.Fatalf("incomplete book loaded: %+v", b)
		}
		_ = b.Check(StandardCodes())
	})
}

func TestOpen(t *testing.T) {
	b, err := Open(filepath.Join("testdata", "good.yaml"))
	if err != nil || b.Name != "test-rates" {
		t.Errorf("Open(file) = %v, %v", b, err)
	}
	b, err = Open("coastal-2026")
	if err != nil || b.Source != "demo:coastal-2026" {
		t.Errorf("Open(demo) = %v, %v", b, err)
	}
	if _, err := Open("coastal-2025"); err == nil {
		t.Error("Open of an unknown name succeeded")
	}
}

// TestLabItemsAreStandard: every test of the lab programs (package
// optimizer/lab), and the tube samples soft ground adds, is a standard
// item priced per test in every demo rate book.
func TestLabItemsAreStandard(t *testing.T) {
	items := append([]string{"tube-sample"}, func() []string {
		var out []string
		for _, c := range lab.Catalog() {
			out = append(out, c.Item)
		}
		return out
	}()...)
	for _, code := range items {
		if u, ok := standardUnit(code); !ok || u != lab.Unit {
			t.Errorf("%s: standard unit %q (listed %v), want %q", code, u, ok, lab.Unit)
		}
		for _, name := range Demos() {
			b, err := LoadDemo(name)
			if err != nil {
				t.Fatal(err)
			}
			found := false
			for _, it := range b.Items {
				if it.Code == code {
					found = it.UnitPrice > 0
				}
			}
			if !found {
				t.Errorf("demo rate book %s does not price %s", name, code)
			}
		}
	}
}
