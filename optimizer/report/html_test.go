package report

import (
	"bytes"
	"encoding/csv"
	"encoding/xml"
	"io"
	"regexp"
	"strings"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/optimizer/tradeoff"
)

// Stand-in charts for the layout tests: small SVGs shaped like the other
// stages' output (a defs pattern with an id, a url(#id) reference), not
// their numbers.
const (
	testChartSVG = `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="200" height="80" viewBox="0 0 200 80"><defs><pattern id="hatch" width="4" height="4" patternUnits="userSpaceOnUse"><rect width="4" height="4" fill="#fff"/></pattern></defs><rect x="10" y="10" width="50" height="50" fill="url(#hatch)"/><text x="70" y="40">chart &amp; data</text></svg>
`
	testFixedRunDate = "2026-01-02"
)

func sampleSchedule() *schedule.Schedule {
	d := func(day int) time.Time { return time.Date(2026, time.March, day, 0, 0, 0, 0, time.UTC) }
	return &schedule.Schedule{
		Start: d(2), Finish: d(3), FieldDays: 2, StandbyHours: 2.5, StandbyCost: 312.5,
		Rigs: []schedule.RigSchedule{{Rig: "tire-drill", First: d(2), Last: d(3), FieldDays: 2, RouteFt: 50.5, WorkHours: 4.5, TravelHours: 0.2, StandbyHours: 2.5}},
	}
}

// fullInput gives every optional piece, so every section appears.
func fullInput() HTMLInput {
	return HTMLInput{
		Plan: samplePlan(), Scenario: sampleScenario(), Version: "v0.0.0-test", RunDate: testFixedRunDate,
		GanttSVG: []byte(testChartSVG), Schedule: sampleSchedule(),
		RiskText:     "P50 <finish> 2026-03-03\n",
		Alternatives: &Table{Title: "Alternatives", Header: []string{"alternative", "cost", "field days"}, Rows: [][]string{{"cheapest", "1,235,167.50", "1"}, {"fastest", "1,300,000.00", "1"}}, Note: "same rules"},
		FrontierSVG:  []byte(testChartSVG), BudgetSVG: []byte(testChartSVG),
		RuleCosts: &Table{Title: "What each rule costs", Header: []string{"zone", "rule", "cost"}, Rows: [][]string{{"Z1", "minimum points", "600.00"}}},
	}
}

func renderHTML(t *testing.T, in HTMLInput) []byte {
	t.Helper()
	var b bytes.Buffer
	if err := HTML(&b, in); err != nil {
		t.Fatal(err)
	}
	return b.Bytes()
}

// TestHTMLGolden pins the report's structure for a small fixed plan, once
// with every optional piece and once with none. The run date is fixed by
// the test, so nothing volatile reaches the golden files.
func TestHTMLGolden(t *testing.T) {
	for _, c := range []struct {
		name string
		in   HTMLInput
	}{
		{"html-full.html.golden", fullInput()},
		{"html-plain.html.golden", HTMLInput{Plan: samplePlan(), Scenario: sampleScenario(), Version: "v0.0.0-test", RunDate: testFixedRunDate}},
	} {
		t.Run(c.name, func(t *testing.T) {
			got := renderHTML(t, c.in)
			if again := renderHTML(t, c.in); !bytes.Equal(got, again) {
				t.Fatal("two renders of the same input differ")
			}
			checkGolden(t, c.name, got)
		})
	}
}

// TestHTMLSections checks that each section is there exactly when its data
// is given.
func TestHTMLSections(t *testing.T) {
	full := string(renderHTML(t, fullInput()))
	plain := string(renderHTML(t, HTMLInput{Plan: samplePlan(), Scenario: sampleScenario()}))
	always := []string{`id="title"`, `id="demo-banner"`, `id="summary"`, `id="cautions"`, `id="site-map"`, `<svg xmlns="http://www.w3.org/2000/svg" id="sitemap"`,
		`id="points"`, `id="estimate-table"`, `id="rigs"`, `id="rules-table"`, `id="rule-sources"`, `id="excluded"`, `id="warnings"`, `id="inputs"`, `id="solver"`, `id="point-list"`}
	optional := []string{`id="tradeoffs"`, `id="alternatives"`, `id="frontier-chart"`, `id="budget-chart"`, `id="rule-costs"`,
		`id="schedule"`, `id="schedule-summary"`, `id="gantt-chart"`, `id="risk"`}
	for _, s := range always {
		if !strings.Contains(full, s) || !strings.Contains(plain, s) {
			t.Errorf("%s missing (full %v, plain %v)", s, strings.Contains(full, s), strings.Contains(plain, s))
		}
	}
	for _, s := range optional {
		if !strings.Contains(full, s) {
			t.Errorf("%s missing though its data is given", s)
		}
		if strings.Contains(plain, s) {
			t.Errorf("%s shown though its data is not given", s)
		}
	}
	if !strings.Contains(plain, "(not given)") {
		t.Error("a report without version or run date should say so")
	}
	// Each chart's ids are prefixed so the three copies of the stand-in
	// chart do not clash; every id in the page is unique.
	ids := regexp.MustCompile(`\bid="([^"]+)"`).FindAllStringSubmatch(full, -1)
	seen := map[string]bool{}
	for _, m := range ids {
		if seen[m[1]] {
			t.Errorf("id %q used twice", m[1])
		}
		seen[m[1]] = true
	}
	for _, ref := range []string{`url(#gantt-hatch)`, `url(#frontier-hatch)`, `url(#budget-hatch)`} {
		if !strings.Contains(full, ref) {
			t.Errorf("%s missing: chart references were not prefixed with their ids", ref)
		}
	}
	if strings.Contains(full, "<?xml") {
		t.Error("an XML prolog was left inside the HTML body")
	}
}

// TestHTMLEscapes checks html/template's escaping of text from the
// scenario and plan, and that the risk text stays preformatted and escaped.
func TestHTMLEscapes(t *testing.T) {
	in := fullInput()
	in.Plan.Warnings = []string{`<script>alert("x")</script>`}
	got := string(renderHTML(t, in))
	if strings.Contains(got, "<script") {
		t.Fatal("a warning's markup reached the page unescaped")
	}
	if !strings.Contains(got, "&lt;script&gt;") || !strings.Contains(got, "P50 &lt;finish&gt; 2026-03-03") {
		t.Fatal("escaped warning or risk text not found")
	}
}

// TestHTMLNoNetwork: the report is one file that fetches nothing. The only
// http(s) text allowed is the SVG namespace name in xmlns, which names and
// does not fetch (Namespaces in XML 1.0, §2).
func TestHTMLNoNetwork(t *testing.T) {
	got := string(renderHTML(t, fullInput()))
	allowed := regexp.MustCompile(`xmlns="http://www\.w3\.org/2000/svg"`)
	rest := allowed.ReplaceAllString(got, "")
	if i := strings.Index(rest, "http://"); i >= 0 {
		t.Errorf("http:// reference: %q", rest[max(0, i-60):min(len(rest), i+60)])
	}
	if i := strings.Index(rest, "https://"); i >= 0 {
		t.Errorf("https:// reference: %q", rest[max(0, i-60):min(len(rest), i+60)])
	}
	for _, bad := range []string{"<script", "<link", "<img", "<iframe", "@import", "src=", "url(http", "//fonts"} {
		if strings.Contains(rest, bad) {
			t.Errorf("the page holds %q, which could fetch or run something", bad)
		}
	}
	if n := len(allowed.FindAllString(got, -1)); n != 4 {
		t.Errorf("%d inline SVGs, want 4 (map, frontier, budget, Gantt)", n)
	}
}

// TestHTMLInlineSVGWellFormed parses every <svg>…</svg> in the page with
// encoding/xml in strict mode.
func TestHTMLInlineSVGWellFormed(t *testing.T) {
	got := string(renderHTML(t, fullInput()))
	svgs := regexp.MustCompile(`(?s)<svg\b.*?</svg>`).FindAllString(got, -1)
	if len(svgs) != 4 {
		t.Fatalf("%d inline SVGs, want 4", len(svgs))
	}
	for i, s := range svgs {
		if err := wellFormed([]byte(s)); err != nil {
			t.Errorf("inline SVG %d is not well-formed: %v\n%s", i, err, s[:min(len(s), 300)])
		}
	}
}

// TestHTMLNumbersFromPlan reads the estimate table back from the page and
// compares it with the plan's lines: the report shows the plan's numbers,
// formatted as the text report formats them.
func TestHTMLNumbersFromPlan(t *testing.T) {
	p := samplePlan()
	got := renderHTML(t, HTMLInput{Plan: p, Scenario: sampleScenario()})
	rows := tableRows(t, got, "estimate-table")
	if len(rows) != len(p.Estimate)+1 { // + the total row
		t.Fatalf("%d rows in the estimate table, plan has %d lines", len(rows), len(p.Estimate))
	}
	for i, l := range p.Estimate {
		want := []string{l.Item, l.Description, ftoa(l.Quantity), l.Unit, money(l.UnitPrice, ""), money(l.Extension, "")}
		if strings.Join(rows[i], "|") != strings.Join(want, "|") {
			t.Errorf("row %d = %q, want %q", i, rows[i], want)
		}
	}
	if last := rows[len(rows)-1]; last[len(last)-1] != money(p.Total, "") {
		t.Errorf("total row %q, plan total %s", last, money(p.Total, ""))
	}
	if !bytes.Contains(got, []byte(`id="summary-total">`+money(p.Total, "")+`<`)) {
		t.Error("summary total is not the plan's total")
	}
}

// tableRows reads the cell texts of the table with the given id. The page
// writes void elements self-closed, so encoding/xml in HTML mode reads it.
func tableRows(t *testing.T, page []byte, id string) [][]string {
	t.Helper()
	d := xml.NewDecoder(bytes.NewReader(page))
	d.Strict = false
	d.AutoClose = xml.HTMLAutoClose
	d.Entity = xml.HTMLEntity
	var rows [][]string
	depth, in, cell := 0, false, false
	for {
		tok, err := d.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		switch v := tok.(type) {
		case xml.StartElement:
			if in {
				depth++
			}
			if v.Name.Local == "table" {
				for _, a := range v.Attr {
					if a.Name.Local == "id" && a.Value == id {
						in, depth = true, 1
					}
				}
			}
			if in && v.Name.Local == "tr" {
				rows = append(rows, nil)
			}
			if in && (v.Name.Local == "td") {
				rows[len(rows)-1] = append(rows[len(rows)-1], "")
				cell = true
			}
		case xml.EndElement:
			if in {
				depth--
				if v.Name.Local == "td" {
					cell = false
				}
				if depth == 0 {
					in = false
				}
			}
		case xml.CharData:
			if in && cell {
				r := rows[len(rows)-1]
				r[len(r)-1] += string(v)
			}
		}
	}
	var out [][]string
	for _, r := range rows {
		if len(r) > 0 { // the header row has th cells only
			out = append(out, r)
		}
	}
	return out
}

// TestHTMLRejectsUnsafeSVG: a chart that would script or fetch is refused
// with an error naming the chart.
func TestHTMLRejectsUnsafeSVG(t *testing.T) {
	for _, c := range []struct{ name, svg string }{
		{"script", `<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>`},
		{"event", `<svg xmlns="http://www.w3.org/2000/svg"><rect onclick="x()"/></svg>`},
		{"external href", `<svg xmlns="http://www.w3.org/2000/svg"><image href="https://example.invalid/a.png"/></svg>`},
		{"external use", `<svg xmlns="http://www.w3.org/2000/svg"><use href="other.svg#a"/></svg>`},
		{"external url", `<svg xmlns="http://www.w3.org/2000/svg"><rect fill="url(https://example.invalid/p#a)"/></svg>`},
		{"style", `<svg xmlns="http://www.w3.org/2000/svg"><style>@import url(x.css);</style></svg>`},
		{"not svg", `<div>hello</div>`},
		{"broken", `<svg xmlns="http://www.w3.org/2000/svg"><rect></svg>`},
	} {
		t.Run(c.name, func(t *testing.T) {
			in := HTMLInput{Plan: samplePlan(), Scenario: sampleScenario(), GanttSVG: []byte(c.svg)}
			var b bytes.Buffer
			err := HTML(&b, in)
			if err == nil {
				t.Fatal("accepted")
			}
			if !strings.Contains(err.Error(), "Gantt chart") {
				t.Fatalf("error does not name the chart: %v", err)
			}
		})
	}
}

func TestTableFromCSV(t *testing.T) {
	tb, err := TableFromCSV("Alternatives", strings.NewReader("name,cost\ncheapest,100.5\nfastest,120\n"), "n")
	if err != nil {
		t.Fatal(err)
	}
	if strings.Join(tb.Header, ",") != "name,cost" || len(tb.Rows) != 2 || tb.Rows[1][1] != "120" {
		t.Fatalf("%+v", tb)
	}
	if _, err := TableFromCSV("Empty", strings.NewReader(""), ""); err == nil {
		t.Fatal("empty CSV accepted")
	}
	if got := numericColumns(tb.Header, tb.Rows); got[0] || !got[1] {
		t.Fatalf("numeric columns %v, want [false true]", got)
	}
}

// TestTableForPeople: a trade-off CSV shown in the report gets headers in
// words (the currency beside the money columns), the one money format
// and yes/no for true/false; other cells stay as written.
func TestTableForPeople(t *testing.T) {
	tb, err := TableFromCSV("Alternatives", strings.NewReader(
		"alternative,feasible,total_cost,field_days,largest_gap_ft,odd_field_percent\n"+
			"cheapest,true,110203.09,12,41.5,3\n"+
			"one rig,false,,,,\n"), "")
	if err != nil {
		t.Fatal(err)
	}
	h := fromTable(tb, "USD")
	wantHead := []string{"Alternative", "Feasible", "Total cost (USD)", "Field days", "Largest gap (ft)", "Odd field (%)"}
	if strings.Join(h.Header, "|") != strings.Join(wantHead, "|") {
		t.Errorf("headers %q, want %q", h.Header, wantHead)
	}
	wantRow := []string{"cheapest", "yes", "110,203.09", "12", "41.5", "3"}
	if strings.Join(h.Rows[0], "|") != strings.Join(wantRow, "|") {
		t.Errorf("row %q, want %q", h.Rows[0], wantRow)
	}
	if h.Rows[1][1] != "no" || h.Rows[1][2] != "" {
		t.Errorf("row %q", h.Rows[1])
	}
	if !h.Num[2] || h.Num[0] {
		t.Errorf("alignment %v: the money column is numeric, the names are not", h.Num)
	}
	for _, c := range h.Header {
		if strings.Contains(c, "_") {
			t.Errorf("header %q is a raw field name", c)
		}
	}
}

// TestTradeoffHeadersInWords: every column the trade-off CSVs the report
// shows begin with has a header in words.
func TestTradeoffHeadersInWords(t *testing.T) {
	var alt, rules bytes.Buffer
	if err := tradeoff.WriteAlternativesCSV(&alt, nil); err != nil {
		t.Fatal(err)
	}
	if err := tradeoff.WriteRuleCostsCSV(&rules, nil); err != nil {
		t.Fatal(err)
	}
	for _, b := range []*bytes.Buffer{&alt, &rules} {
		head, err := csv.NewReader(b).Read()
		if err != nil {
			t.Fatal(err)
		}
		for _, h := range head {
			if _, ok := headerWords[h]; !ok {
				t.Errorf("column %q has no header in words", h)
			}
		}
	}
}
