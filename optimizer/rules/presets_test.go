package rules

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite PRESETS.md from Presets()")

func TestPresetsWellFormed(t *testing.T) {
	all := Presets()
	if !sort.SliceIsSorted(presets, func(i, j int) bool { return presets[i].Name < presets[j].Name }) {
		t.Error("the presets table is not in name order")
	}
	seen := map[string]bool{}
	for _, p := range all {
		if seen[p.Name] {
			t.Errorf("preset %q listed twice", p.Name)
		}
		seen[p.Name] = true
		if p.Name != strings.ToLower(p.Name) || strings.ContainsAny(p.Name, " _") {
			t.Errorf("preset %q: want lower case words joined by hyphens", p.Name)
		}
		if p.Title == "" || p.Source == "" || p.Note == "" {
			t.Errorf("preset %q: empty title, source or note", p.Name)
		}
		switch p.BaseTag() {
		case TagSeen, TagMemory, TagDerived, TagPractice:
		default:
			t.Errorf("preset %q: tag %q, want seen, memory or derived", p.Name, p.Tag)
		}
		if p.MaxSpacingFt < 0 || p.AreaPerPointFt2 < 0 || p.MinPoints < 0 || p.MinDepthFt < 0 {
			t.Errorf("preset %q: negative value", p.Name)
		}
		if p.MaxSpacingFt == 0 && p.AreaPerPointFt2 == 0 && p.MinPoints == 0 && p.MinDepthFt == 0 {
			t.Errorf("preset %q sets no rule", p.Name)
		}
		if (p.MaxSpacingFt > 0) != (p.Lattice != "") {
			t.Errorf("preset %q: lattice %q with spacing %g ft", p.Name, p.Lattice, p.MaxSpacingFt)
		}
		if p.Lattice != "" && p.Lattice != "square" && p.Lattice != "triangular" {
			t.Errorf("preset %q: lattice %q", p.Name, p.Lattice)
		}
	}
}

// TestPresetValues checks each preset against the published value or range
// it rests on, in the unit the source gives.
func TestPresetValues(t *testing.T) {
	type want struct {
		lo, hi    float64 // published range of the spacing, in unit
		metres    bool
		minPoints int
		minDepth  float64 // ft
		corners   bool
		areaFt2   float64
	}
	for name, w := range map[string]want{
		"common-building-density":        {areaFt2: 2500},                  // one boring per 2,500 ft² of building area (common practice)
		"das-multistory-building":        {lo: 10, hi: 30, metres: true},   // Das, after Sowers & Sowers (1970): 10–30 m
		"das-one-story-industrial":       {lo: 20, hi: 60, metres: true},   // same: 20–60 m
		"das-highway":                    {lo: 250, hi: 500, metres: true}, // same: 250–500 m
		"das-residential-subdivision":    {lo: 250, hi: 500, metres: true}, // same: 250–500 m
		"das-dam-dike":                   {lo: 40, hi: 80, metres: true},   // same: 40–80 m
		"navfac-wide-site-preliminary":   {lo: 200, hi: 500},               // NAVFAC DM-7.01 Table 6: 200–500 ft
		"navfac-soft-strata":             {lo: 100, hi: 200},               // same: 100–200 ft
		"navfac-closely-spaced-footings": {lo: 50, hi: 50},                 // same: about 50 ft both ways
		"navfac-low-load-warehouse":      {minPoints: 4, corners: true},    // same: at least 4 at the corners plus interior
		"navfac-isolated-medium":         {minPoints: 3},                   // same: 2,500–10,000 ft², at least 3
		"navfac-isolated-small":          {minPoints: 2},                   // same: under 2,500 ft², at least 2
		"fhwa-wall":                      {lo: 30, hi: 60, metres: true},   // FHWA GEC-5 (2002): 30–60 m
		"fhwa-embankment-erratic":        {lo: 60, hi: 60, metres: true},   // same: 60 m in erratic ground
		"fhwa-embankment-uniform":        {lo: 120, hi: 120, metres: true}, // same: 120 m in uniform ground
		"txdot-wall":                     {lo: 200, hi: 200},               // TxDOT LRFD Geotechnical Manual (2024): ≤ 200 ft
		"ufc-road":                       {lo: 300, hi: 300},               // UFC 3-250-12N: ≤ 300 ft along the centre line
		"ufc-road-variable":              {lo: 100, hi: 100},               // same: ≤ 100 ft where soils vary
		"ufgs-unknown-site":              {lo: 200, hi: 200, minDepth: 30}, // UFGS 4-159-01: about 200 ft centres, ≥ 30 ft deep
	} {
		p, err := Lookup(name)
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		s := p.MaxSpacingFt
		if w.metres {
			s = FtToM(s)
		}
		if w.hi > 0 && (s < w.lo-1e-9 || s > w.hi+1e-9) {
			t.Errorf("%s: spacing %g outside the published %g–%g", name, s, w.lo, w.hi)
		}
		if w.hi == 0 && p.MaxSpacingFt != 0 {
			t.Errorf("%s: spacing %g ft, the source gives none", name, p.MaxSpacingFt)
		}
		if w.lo != w.hi && !strings.Contains(p.Note, fmt.Sprintf("%g–%g", w.lo, w.hi)) {
			t.Errorf("%s: note %q does not record the published range %g–%g", name, p.Note, w.lo, w.hi)
		}
		if p.AreaPerPointFt2 != w.areaFt2 {
			t.Errorf("%s: one point per %g ft², want %g", name, p.AreaPerPointFt2, w.areaFt2)
		}
		if p.MinPoints != w.minPoints || p.MinDepthFt != w.minDepth || p.Corners != w.corners {
			t.Errorf("%s: min points %d, min depth %g ft, corners %v; want %d, %g, %v",
				name, p.MinPoints, p.MinDepthFt, p.Corners, w.minPoints, w.minDepth, w.corners)
		}
	}
	if got, want := len(Presets()), 19; got != want {
		t.Errorf("%d presets, the table above checks %d", got, want)
	}
}

// TestPresetSourcesInSourcesTable checks every preset's source string and
// tag against the project's table of outside sources, when it is present.
func TestPresetSourcesInSourcesTable(t *testing.T) {
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			break
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Skip("no go.mod above the package directory")
		}
		dir = parent
	}
	raw, err := os.ReadFile(filepath.Join(dir, "..", "shared", "SOURCES.md"))
	if err != nil {
		t.Skipf("the sources table is absent (%v); run inside the project tree to check sources", err)
	}
	table := strings.ReplaceAll(string(raw), "*", "") // drop Markdown emphasis
	for _, p := range Presets() {
		if !strings.Contains(table, p.Source) {
			t.Errorf("preset %q: source %q is not in SOURCES.md", p.Name, p.Source)
		}
		if p.BaseTag() == TagPractice {
			// A fact of the trade has no row; the table's preamble says
			// such facts are marked common practice.
			if !strings.Contains(table, "common practice") {
				t.Errorf("preset %q: SOURCES.md does not mention common practice", p.Name)
			}
			continue
		}
		if !strings.Contains(table, "| "+p.Tag+" |") {
			t.Errorf("preset %q: tag %q is not a tag in SOURCES.md", p.Name, p.Tag)
		}
	}
	for _, src := range []string{SourceSowersTab, SourceSowersForm, SourceASCE, SourceUFCTable7, SourceEN1997, SourceTxDOT, SourceGEC5} {
		if !strings.Contains(table, src) {
			t.Errorf("source %q is not in SOURCES.md", src)
		}
	}
}

func TestLookup(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"navfac-soft-strata", "navfac-soft-strata"},
		{"  UFGS-Unknown-Site ", "ufgs-unknown-site"},
	} {
		p, err := Lookup(c.in)
		if err != nil || p.Name != c.want {
			t.Errorf("Lookup(%q) = %q, %v; want %q", c.in, p.Name, err, c.want)
		}
	}
	for _, c := range []struct{ in, suggest string }{
		{"navfac-soft-strta", "navfac-soft-strata"},
		{"das-multistorey-building", "das-multistory-building"},
		{"ufc-raod", "ufc-road"},
		{"fhwa-embankment-eratic", "fhwa-embankment-erratic"},
		{"txdot-walls", "txdot-wall"},
	} {
		_, err := Lookup(c.in)
		if !errors.Is(err, ErrUnknownPreset) {
			t.Errorf("Lookup(%q): error %v, want ErrUnknownPreset", c.in, err)
			continue
		}
		if msg := err.Error(); !strings.Contains(msg, fmt.Sprintf("did you mean %q", c.suggest)) || !strings.Contains(msg, fmt.Sprintf("%q", c.in)) {
			t.Errorf("Lookup(%q): %q, want it to name the input and suggest %q", c.in, msg, c.suggest)
		}
	}
}

func TestPresetsCopy(t *testing.T) {
	a := Presets()
	a[0].Name = "changed"
	if Presets()[0].Name == "changed" {
		t.Error("Presets returns the package's own slice")
	}
}

// presetsDoc renders the presets as the Markdown table in PRESETS.md.
func presetsDoc() []byte {
	var b bytes.Buffer
	b.WriteString("# Exploration rule presets\n\n")
	b.WriteString("Generated from `rules.Presets()` and `rules.DepthRules()` by `go test ./optimizer/rules -run TestPresetsDoc -update`;\n")
	b.WriteString("do not edit by hand. Spacings are on a square lattice; a blank cell means the rule does not\n")
	b.WriteString("apply. Metric sources are converted exactly (1 ft = 0.3048 m). Tags: seen (read in a stored\n")
	b.WriteString("copy), memory (recalled, not re-read), derived (computed from a named formula), common\n")
	b.WriteString("practice (a fact of the trade with no published source).\n\n")
	b.WriteString("| name | rule | spacing ft | min points | corners | min depth ft | source | tag | note |\n")
	b.WriteString("|---|---|---|---|---|---|---|---|---|\n")
	num := func(v float64) string {
		if v == 0 {
			return ""
		}
		return fmt.Sprintf("%.1f", v)
	}
	for _, p := range Presets() {
		pts, corners := "", ""
		if p.MinPoints > 0 {
			pts = fmt.Sprint(p.MinPoints)
		}
		if p.Corners {
			corners = "yes"
		}
		area := ""
		if p.AreaPerPointFt2 > 0 {
			area = fmt.Sprintf("; one per %.0f ft²", p.AreaPerPointFt2)
		}
		fmt.Fprintf(&b, "| `%s` | %s%s | %s | %s | %s | %s | %s | %s | %s |\n",
			p.Name, p.Title, area, num(p.MaxSpacingFt), pts, corners, num(p.MinDepthFt),
			p.Source, p.Tag, strings.ReplaceAll(p.Note, "|", "\\|"))
	}
	b.WriteString("\n## Depth rules, minimums and defaults\n\n")
	b.WriteString("From `rules.DepthRules()`. The scenario keys that use them are in scenarios/REFERENCE.md.\n\n")
	b.WriteString("| rule | asks | source | tag | note |\n|---|---|---|---|---|\n")
	for _, r := range DepthRules() {
		fmt.Fprintf(&b, "| `%s` | %s | %s | %s | %s |\n", r.Name, r.Rule, r.Source, r.Tag, strings.ReplaceAll(r.Note, "|", "\\|"))
	}
	return b.Bytes()
}

// TestDepthRulesWellFormed: every depth rule names what it asks, its source
// and how that is known.
func TestDepthRulesWellFormed(t *testing.T) {
	for _, r := range DepthRules() {
		if r.Name == "" || r.Rule == "" || r.Source == "" || r.Tag == "" {
			t.Errorf("depth rule %+v lacks a field", r)
		}
		if !strings.Contains(r.Tag, TagSeen) && !strings.Contains(r.Tag, TagMemory) && !strings.Contains(r.Tag, TagPractice) && !strings.Contains(r.Tag, TagDerived) {
			t.Errorf("depth rule %s: tag %q", r.Name, r.Tag)
		}
		if r.Tag == TagMemory && !strings.Contains(r.Source, "memory") && r.Source != SourceSowersForm {
			t.Errorf("depth rule %s is from memory but its source %q does not say so", r.Name, r.Source)
		}
	}
}

func TestPresetsDoc(t *testing.T) {
	got := presetsDoc()
	if *update {
		if err := os.WriteFile("PRESETS.md", got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile("PRESETS.md")
	if err != nil {
		t.Fatalf("%v (run go test ./optimizer/rules -run TestPresetsDoc -update)", err)
	}
	if !bytes.Equal(got, want) {
		t.Error("PRESETS.md disagrees with Presets(); run go test ./optimizer/rules -run TestPresetsDoc -update and review the diff")
	}
}
