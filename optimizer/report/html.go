package report

import (
	"bytes"
	"encoding/csv"
	"encoding/xml"
	"errors"
	"fmt"
	"html/template"
	"io"
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/scenarios"
)

// HTMLInput is everything the HTML report shows. Plan and Scenario are
// required; the rest is optional and its section is left out when absent.
// Charts and tables made by other stages come in as plain data — SVG bytes
// and rows of text — so the report shows exactly the numbers those stages
// wrote to their own CSV and SVG files, never a second computation.
type HTMLInput struct {
	Plan     *plan.Plan
	Scenario *scenarios.Scenario
	Version  string // rigmix version
	RunDate  string // date of the run, as the caller gives it

	GanttSVG []byte             // schedule.WriteGanttSVG output
	Schedule *schedule.Schedule // for the schedule summary
	RiskText string             // schedule.WriteRiskText output, shown preformatted

	Alternatives *Table // the alternatives table, as its CSV
	FrontierSVG  []byte // cost–days frontier chart
	BudgetSVG    []byte // budget–coverage chart
	RuleCosts    *Table // what each rule costs, as its CSV
}

// Table is a table of text cells, such as a CSV another stage wrote.
type Table struct {
	Title  string
	Header []string
	Rows   [][]string
	Note   string
}

// TableFromCSV reads a CSV whose first record is the header into a Table,
// so a stage's CSV output can be shown as it is.
func TableFromCSV(title string, r io.Reader, note string) (*Table, error) {
	cr := csv.NewReader(r)
	cr.FieldsPerRecord = -1
	recs, err := cr.ReadAll()
	if err != nil {
		return nil, fmt.Errorf("report: table %q: %w", title, err)
	}
	if len(recs) == 0 {
		return nil, fmt.Errorf("report: table %q: the CSV is empty; it needs a header row", title)
	}
	return &Table{Title: title, Header: recs[0], Rows: recs[1:], Note: note}, nil
}

// HTML writes the report as one self-contained HTML page: every style and
// chart is inline and nothing is fetched from a network, so the file can be
// attached to a proposal and opened anywhere. The page reads on a laptop
// screen and prints with each section starting on a new sheet. Every number
// is taken from the plan (or from the optional pieces) as it is; none is
// worked out again here.
//
// The command layer calls it after planning, handing over the pieces it has
// made for its other outputs:
//
//	var gantt, risk bytes.Buffer
//	schedule.WriteGanttSVG(&gantt, sched)           // optional
//	schedule.WriteRiskText(&risk, riskResult)       // optional
//	alt, _ := report.TableFromCSV("Alternatives", &alternativesCSV, "")
//	err := report.HTML(f, report.HTMLInput{
//		Plan: p, Scenario: sc, Version: version, RunDate: time.Now().Format("2006-01-02"),
//		GanttSVG: gantt.Bytes(), Schedule: sched, RiskText: risk.String(),
//		Alternatives: alt, FrontierSVG: frontierSVG, BudgetSVG: budgetSVG, RuleCosts: ruleCosts,
//	})
func HTML(w io.Writer, in HTMLInput) error {
	if in.Plan == nil || in.Scenario == nil {
		return errors.New("report: the HTML report needs both the plan and the scenario")
	}
	v, err := newHTMLView(in)
	if err != nil {
		return err
	}
	var b bytes.Buffer
	if err := htmlPage.Execute(&b, v); err != nil {
		return fmt.Errorf("report: HTML: %w", err)
	}
	_, err = w.Write(b.Bytes())
	return err
}

// htmlView is the report's content, formatted for the template.
type htmlView struct {
	Title, ScenarioName, ScenarioTitle, ScenarioSource, ScenarioNote, ScenarioDescription string
	Demo                                                                                  bool
	RateBook                                                                              plan.RateBookInfo
	Version, RunDate                                                                      string

	Points, TotalAmount, FieldDays, Coverage, CoverageDetail string
	Baseline                                                 *baselineView

	Cautions []string
	SiteMap  template.HTML

	MethodRig          htmlTable
	PointList          htmlTable
	Estimate           htmlTable
	EstimateTotal      string
	Currency           string
	Rigs               htmlTable
	Rules              []ruleView
	Sources            []sourceView
	Bases              []sourceView
	Lab                []sourceView
	Excluded           htmlTable
	Alternatives       *htmlTable
	Frontier, Budget   template.HTML
	RuleCosts          *htmlTable
	Gantt              template.HTML
	ScheduleSummary    []kv
	ScheduleRigs       *htmlTable
	Risk               string
	HasTradeoffs       bool
	HasSchedule        bool
	Warnings           []string
	Inputs, SolverRows []kv
}

type baselineView struct {
	Note, Rig, Points, Cost, FieldDays, Saving, SavingAmount, SavingPct, DaysSaved, Split string
}

type ruleView struct {
	Zone, Rule, Required, Achieved string
	Met                            bool
}

type sourceView struct{ Zone, Source string }

type kv struct{ Key, Value string }

// htmlTable is a table ready to print; Num marks the columns whose cells
// are right-aligned numbers.
type htmlTable struct {
	Title, Note string
	Header      []string
	Rows        [][]string
	Num         []bool
	Foot        []string
}

var numericCell = regexp.MustCompile(`^[-+−]?[A-Z]{0,3}\s?[$€£]?[0-9][0-9,]*(\.[0-9]+)?\s?(%|ft|h|d|days?)?$`)

// fromTable turns a Table (a stage's CSV) into an htmlTable for people:
// each field name becomes a header in words, amounts in the money columns
// take the one money format (thousands separators, two decimals) with the
// currency in the header, true/false read yes/no, and the columns whose
// every non-empty cell is a number are right-aligned.
func fromTable(t *Table, cur string) *htmlTable {
	if t == nil {
		return nil
	}
	out := &htmlTable{Title: t.Title, Note: t.Note}
	isMoney := make([]bool, len(t.Header))
	for i, h := range t.Header {
		isMoney[i] = moneyColumns[h]
		hh := humanHeader(h)
		if isMoney[i] && cur != "" {
			hh += " (" + cur + ")"
		}
		out.Header = append(out.Header, hh)
	}
	for _, r := range t.Rows {
		row := make([]string, len(r))
		for i, c := range r {
			row[i] = c
			switch {
			case c == "true":
				row[i] = "yes"
			case c == "false":
				row[i] = "no"
			case i < len(isMoney) && isMoney[i]:
				if v, err := strconv.ParseFloat(c, 64); err == nil {
					row[i] = money(v, "")
				}
			}
		}
		out.Rows = append(out.Rows, row)
	}
	out.Num = numericColumns(out.Header, out.Rows)
	return out
}

// moneyColumns are the field names of the trade-off CSVs that hold amounts.
var moneyColumns = map[string]bool{
	"total_cost": true, "priced_cost": true, "bound_cost": true, "budget": true, "every_rule_met_budget": true,
	"step_saving": true, "step_max_saving": true, "dropped_saving": true, "dropped_max_saving": true, "lp_estimate": true,
	"cost": true, "unit_price": true, "extension": true,
}

// headerWords are the headers in words of the field names the report's
// tables come with.
var headerWords = map[string]string{
	"alternative": "Alternative", "feasible": "Feasible", "status": "Solver status", "rate_book": "Rate book",
	"total_cost": "Total cost", "priced_cost": "Priced cost", "bound_cost": "Proven least cost",
	"field_days": "Field days", "max_days": "Days allowed", "rigs_mobilized": "Rigs mobilized", "rigs": "Rigs",
	"points": "Points", "boring": "Borings", "cpt": "CPT soundings", "test_pit": "Test pits", "probe": "Probes",
	"area_covered_percent": "Area covered (%)", "weighted_covered_percent": "Weighted coverage (%)",
	"largest_gap_ft": "Largest gap (ft)", "rules_met": "Rules met", "rules_total": "Rules in all",
	"optimality_gap": "Optimality gap", "on_frontier": "On the frontier", "balanced": "Balanced",
	"budget": "Budget", "from_lower_budget": "Plan from a lower budget", "every_rule_met_budget": "Least budget meeting every rule",
	"knee": "Knee", "zone": "Zone", "rule": "Rule", "required": "Required",
	"step_change": "One step looser", "step_saving": "Saving, one step", "step_max_saving": "Most saving, one step",
	"step_gap": "Gap, one step", "dropped_change": "Rule dropped", "dropped_saving": "Saving, dropped",
	"dropped_max_saving": "Most saving, dropped", "dropped_gap": "Gap, dropped", "lp_estimate": "LP estimate",
}

// capFirst writes a header's first letter as a capital ("item" → "Item").
func capFirst(h string) string {
	if h != "" && h[0] >= 'a' && h[0] <= 'z' {
		return strings.ToUpper(h[:1]) + h[1:]
	}
	return h
}

// humanHeader is a field name in words: the known ones from headerWords,
// others with spaces for underscores, a capital first letter and the unit
// of a _ft or _percent ending in brackets.
func humanHeader(h string) string {
	if w, ok := headerWords[h]; ok {
		return w
	}
	unit := ""
	for suf, u := range map[string]string{"_ft": " (ft)", "_percent": " (%)"} {
		if s, ok := strings.CutSuffix(h, suf); ok {
			h, unit = s, u
		}
	}
	return capFirst(strings.ReplaceAll(h, "_", " ")) + unit
}

func numericColumns(header []string, rows [][]string) []bool {
	n := len(header)
	for _, r := range rows {
		n = max(n, len(r))
	}
	num := make([]bool, n)
	for c := range num {
		any := false
		num[c] = true
		for _, r := range rows {
			if c >= len(r) || strings.TrimSpace(r[c]) == "" {
				continue
			}
			any = true
			if !numericCell.MatchString(strings.TrimSpace(r[c])) {
				num[c] = false
				break
			}
		}
		num[c] = num[c] && any
	}
	return num
}

func newHTMLView(in HTMLInput) (*htmlView, error) {
	p, sc := in.Plan, in.Scenario
	cur := p.RateBook.Currency
	v := &htmlView{
		Title:               "Exploration program — " + p.Scenario.Title,
		ScenarioName:        p.Scenario.Name,
		ScenarioTitle:       p.Scenario.Title,
		ScenarioSource:      p.Scenario.Source,
		ScenarioNote:        sc.Note,
		ScenarioDescription: sc.Description,
		Demo:                p.Scenario.Demo || p.RateBook.Demo || sc.Demo,
		RateBook:            p.RateBook,
		Version:             in.Version,
		RunDate:             in.RunDate,
		Points:              fmt.Sprint(len(p.Points)),
		TotalAmount:         money(p.Total, ""),
		FieldDays:           fmt.Sprint(p.Finish),
		Coverage:            fmt.Sprintf("%.1f%%", p.Coverage.CoveredPercent),
		CoverageDetail: fmt.Sprintf("%s of %s ft² of ground under spacing rules lies within the covering radius of a chosen point",
			money0(p.Coverage.CoveredFt2), money0(p.Coverage.AreaFt2)),
		Cautions: p.Cautions,
		Currency: cur,
		Warnings: p.Warnings,
	}
	if v.Version == "" {
		v.Version = "(not given)"
	}
	if v.RunDate == "" {
		v.RunDate = "(not given)"
	}
	if len(v.Cautions) == 0 {
		// A plan file from elsewhere may lack them; the report always
		// shows them (PRODUCT.md, Cautions).
		v.Cautions = plan.Cautions
	}
	if bl := p.Baseline; bl != nil {
		v.Baseline = &baselineView{
			Note: bl.Note, Rig: bl.Rig, Points: fmt.Sprint(bl.Points), Cost: money(bl.Cost, cur),
			FieldDays: fmt.Sprint(bl.FieldDays), Saving: money(bl.Saving, cur), SavingAmount: money(bl.Saving, ""),
			SavingPct: fmt.Sprintf("%.1f%%", bl.SavingPct), DaysSaved: fmt.Sprint(bl.DaysSaved),
		}
		if sp := bl.Split; sp != nil {
			v.Baseline.Split = fmt.Sprintf("methods %s, rigs %s, layout %s", money(sp.Methods, cur), money(sp.Rigs, cur), money(sp.Layout, cur))
		}
	}

	var mapBuf bytes.Buffer
	if err := SiteMapSVG(&mapBuf, sc, p); err != nil {
		return nil, err
	}
	var err error
	if v.SiteMap, err = inlineSVG("site map", "", mapBuf.Bytes()); err != nil {
		return nil, err
	}

	v.MethodRig = methodRigTable(p)
	v.PointList = pointListTable(p)

	v.Estimate = htmlTable{Header: []string{"item", "description", "quantity", "unit", "unit price (" + cur + ")", "extension (" + cur + ")"},
		Num: []bool{false, false, true, false, true, true}}
	for _, l := range p.Estimate {
		v.Estimate.Rows = append(v.Estimate.Rows, []string{l.Item, l.Description, ftoa(l.Quantity), l.Unit, money(l.UnitPrice, ""), money(l.Extension, "")})
	}
	v.EstimateTotal = money(p.Total, "")

	v.Rigs = htmlTable{Header: []string{"rig", "description", "mobilized", "points", "by method", "hours on points", "mobilization h", "field days"},
		Num: []bool{false, false, false, true, false, true, true, true}}
	for _, r := range p.Rigs {
		var bm []string
		for _, m := range sortedMethodKeys(r.ByMethod) {
			bm = append(bm, fmt.Sprintf("%s %d", methodName(m), r.ByMethod[m]))
		}
		v.Rigs.Rows = append(v.Rigs.Rows, []string{r.Name, r.Title, yesNo(r.Mobilized), fmt.Sprint(r.Points), strings.Join(bm, ", "),
			fmt.Sprintf("%.1f", r.Hours), fmt.Sprintf("%.1f", r.MobHours), fmt.Sprint(r.FieldDays)})
	}

	seenSrc := map[[2]string]bool{}
	for _, r := range p.Rules {
		v.Rules = append(v.Rules, ruleView{Zone: r.Zone, Rule: r.Rule, Required: r.Required, Achieved: r.Achieved, Met: r.Met})
		k := [2]string{r.Zone, r.Source}
		if !seenSrc[k] {
			seenSrc[k] = true
			src := r.Source
			if src == "" {
				src = "(the scenario gives no source)"
			}
			v.Sources = append(v.Sources, sourceView{Zone: r.Zone, Source: src})
		}
	}

	v.Bases = ruleBases(p)
	for _, l := range p.Lab {
		v.Lab = append(v.Lab, sourceView{Zone: l.Zone + " (" + l.Program + ")", Source: l.Basis})
	}

	v.Excluded = htmlTable{Header: []string{"zone", "method", "rig", "why not"}}
	for _, e := range p.Excluded {
		v.Excluded.Rows = append(v.Excluded.Rows, []string{e.Zone, methodName(e.Method), e.Rig, e.Reason})
	}

	v.Alternatives = fromTable(in.Alternatives, cur)
	v.RuleCosts = fromTable(in.RuleCosts, cur)
	if v.Frontier, err = inlineSVG("cost–days frontier", "frontier-", in.FrontierSVG); err != nil {
		return nil, err
	}
	if v.Budget, err = inlineSVG("budget–coverage chart", "budget-", in.BudgetSVG); err != nil {
		return nil, err
	}
	v.HasTradeoffs = v.Alternatives != nil || v.RuleCosts != nil || v.Frontier != "" || v.Budget != ""

	if v.Gantt, err = inlineSVG("Gantt chart", "gantt-", in.GanttSVG); err != nil {
		return nil, err
	}
	v.Risk = in.RiskText
	if s := in.Schedule; s != nil {
		const day = "Mon 2 Jan 2006"
		v.ScheduleSummary = []kv{
			{"first field day", s.Start.Format(day)},
			{"last field day", s.Finish.Format(day)},
			{"field days (working days, both ends included)", fmt.Sprint(s.FieldDays)},
			{"standby (wet ground)", fmt.Sprintf("%.1f h, %s", s.StandbyHours, money(s.StandbyCost, cur))},
		}
		t := &htmlTable{Header: []string{"rig", "arrives", "leaves", "field days", "route ft", "work h", "travel h", "standby h"},
			Num: []bool{false, false, false, true, true, true, true, true}}
		for _, r := range s.Rigs {
			t.Rows = append(t.Rows, []string{r.Rig, r.First.Format(day), r.Last.Format(day), fmt.Sprint(r.FieldDays),
				fmt.Sprintf("%.0f", r.RouteFt), fmt.Sprintf("%.1f", r.WorkHours), fmt.Sprintf("%.1f", r.TravelHours), fmt.Sprintf("%.1f", r.StandbyHours)})
		}
		v.ScheduleRigs = t
	}
	v.HasSchedule = v.Gantt != "" || in.Schedule != nil || v.Risk != ""

	rigsOffered := strings.Join(sc.Rigs, ", ")
	if rigsOffered == "" {
		var names []string
		for _, r := range p.Rigs {
			names = append(names, r.Name)
		}
		rigsOffered = strings.Join(names, ", ")
	}
	v.Inputs = []kv{
		{"scenario", fmt.Sprintf("%s — %s", p.Scenario.Name, p.Scenario.Title)},
		{"scenario source", p.Scenario.Source},
		{"rate book", fmt.Sprintf("%s — %s", p.RateBook.Name, p.RateBook.Title)},
		{"rate book region", p.RateBook.Region},
		{"rate book effective date", p.RateBook.Effective},
		{"currency", cur},
		{"rigs offered", rigsOffered},
		{"working hours per field day", ftoa(sc.HoursDay)},
		{"distance from the rig yard (one way)", ftoa(sc.YardMiles) + " mi"},
		{"rigmix version", v.Version},
		{"date of the run", v.RunDate},
	}
	s := p.Solver
	v.SolverRows = []kv{
		{"status", s.Status},
		{"optimality gap", fmt.Sprintf("%.4f%% (stops at %s%%)", 100*s.Gap, ftoa(100*sc.GapRel))},
		{"objective / bound", fmt.Sprintf("%.2f / %.2f", s.Objective, s.Bound)},
		{"branch-and-bound nodes", fmt.Sprint(s.Nodes)},
		{"model", fmt.Sprintf("%d rows × %d columns, from %d candidate points and %d options", s.Rows, s.Columns, s.Candidates, s.Options)},
	}
	// Every table's headers start with a capital, as the trade-off
	// tables' headers in words do.
	for _, t := range []*htmlTable{&v.MethodRig, &v.PointList, &v.Estimate, &v.Rigs, &v.Excluded, v.Alternatives, v.RuleCosts, v.ScheduleRigs} {
		if t == nil {
			continue
		}
		for i, h := range t.Header {
			t.Header[i] = capFirst(h)
		}
	}
	return v, nil
}

// feet formats a length for people: to a tenth of a foot, which is finer
// than a stakeout or a depth is measured, without a trailing ".0". A
// scenario written in metres gives lengths such as 65.61679790026247 ft,
// which the plan file keeps exact.
func feet(v float64) string {
	s := strconv.FormatFloat(math.Round(v*10)/10, 'f', -1, 64)
	if s == "-0" {
		return "0"
	}
	return s
}

// money0 formats an amount with thousands separators and no decimals.
func money0(v float64) string {
	s := money(v, "")
	return s[:len(s)-3]
}

func sortedMethodKeys(m map[string]int) []string {
	var out []string
	for _, k := range methodOrder {
		if _, ok := m[k]; ok {
			out = append(out, k)
		}
	}
	var rest []string
	for k := range m {
		if _, known := methodLabel[k]; !known {
			rest = append(rest, k)
		}
	}
	sort.Strings(rest)
	return append(out, rest...)
}

// methodRigTable counts points by method (rows) and rig (columns), with
// the site map's rig numbers in the header.
func methodRigTable(p *plan.Plan) htmlTable {
	methods, _ := mapMethods(p)
	rigs := mapRigs(p)
	t := htmlTable{Header: []string{"method"}}
	t.Num = []bool{false}
	for _, r := range rigs {
		t.Header = append(t.Header, "rig "+r.number+" · "+r.name)
		t.Num = append(t.Num, true)
	}
	t.Header = append(t.Header, "all rigs")
	t.Num = append(t.Num, true)
	count := map[[2]string]int{}
	for _, pt := range p.Points {
		count[[2]string{pt.Method, pt.Rig}]++
	}
	colSum := make([]int, len(rigs))
	for _, m := range methods {
		row := []string{methodName(m)}
		sum := 0
		for i, r := range rigs {
			n := count[[2]string{m, r.name}]
			sum += n
			colSum[i] += n
			cell := ""
			if n > 0 {
				cell = fmt.Sprint(n)
			}
			row = append(row, cell)
		}
		t.Rows = append(t.Rows, append(row, fmt.Sprint(sum)))
	}
	t.Foot = []string{"all methods"}
	for _, n := range colSum {
		t.Foot = append(t.Foot, fmt.Sprint(n))
	}
	t.Foot = append(t.Foot, fmt.Sprint(len(p.Points)))
	return t
}

func pointListTable(p *plan.Plan) htmlTable {
	cur := p.RateBook.Currency
	t := htmlTable{Header: []string{"point", "zone", "method", "rig", "depth ft", "sampling", "x ft", "y ft", "hours", "cost (" + cur + ")"},
		Num: []bool{false, false, false, false, true, false, true, true, true, true}}
	for _, pt := range p.Points {
		si := pt.Sampling
		if si == "" && pt.SampleIntervalFt > 0 {
			si = "every " + feet(pt.SampleIntervalFt) + " ft"
		}
		id := pt.ID
		if pt.Required {
			id += " (required)"
		}
		t.Rows = append(t.Rows, []string{id, pt.Zone, methodName(pt.Method), pt.Rig, feet(pt.DepthFt), si,
			feet(pt.XFt), feet(pt.YFt), fmt.Sprintf("%.2f", pt.Hours), money(pt.Cost, "")})
	}
	return t
}

var (
	xmlProlog = regexp.MustCompile(`(?s)^\s*(<\?xml[^>]*\?>\s*)?(<!DOCTYPE[^>]*>\s*)?`)
	svgIDAttr = regexp.MustCompile(`\bid="`)
	svgIDRef  = regexp.MustCompile(`url\(#|href="#`)
)

// inlineSVG checks an SVG made by another stage and readies it for the
// page. The SVG must be well-formed XML (encoding/xml) with an <svg> root,
// and may not script or fetch: no <script> or <foreignObject>, no on…
// event attributes, no link or url() that leaves the document. Ids and the
// references to them get prefix so two charts that both define, say, a
// hatch pattern do not clash in one page. The XML prolog is dropped, since
// HTML has none inside its body.
func inlineSVG(what, prefix string, b []byte) (template.HTML, error) {
	if len(bytes.TrimSpace(b)) == 0 {
		return "", nil
	}
	b = xmlProlog.ReplaceAll(b, nil)
	d := xml.NewDecoder(bytes.NewReader(b))
	d.Strict = true
	root := true
	for {
		tok, err := d.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			return "", fmt.Errorf("report: the %s is not well-formed SVG: %w", what, err)
		}
		el, ok := tok.(xml.StartElement)
		if !ok {
			continue
		}
		if root && el.Name.Local != "svg" {
			return "", fmt.Errorf("report: the %s must start with an <svg> element, not <%s>", what, el.Name.Local)
		}
		root = false
		switch strings.ToLower(el.Name.Local) {
		case "script", "foreignobject", "image", "iframe", "style":
			// <style> too: an @import or url() there would fetch, and a
			// chart's stylesheet would restyle the whole page.
			return "", fmt.Errorf("report: the %s has a <%s> element; a chart in the report may not script, embed or restyle the page", what, el.Name.Local)
		}
		for _, a := range el.Attr {
			name, val := strings.ToLower(a.Name.Local), strings.TrimSpace(a.Value)
			switch {
			case a.Name.Space == "xmlns" || name == "xmlns":
				// namespace declarations name, they do not fetch
			case strings.HasPrefix(name, "on"):
				return "", fmt.Errorf("report: the %s has an event attribute %s=; a chart in the report may not script", what, a.Name.Local)
			case name == "href" && !strings.HasPrefix(val, "#"):
				return "", fmt.Errorf("report: the %s links to %q; a chart in the report may only refer to its own parts (#id)", what, val)
			case strings.Contains(val, "url(") && !strings.Contains(val, "url(#"):
				return "", fmt.Errorf("report: the %s refers to %q; a chart in the report may only use url(#id)", what, val)
			}
		}
	}
	if root {
		return "", fmt.Errorf("report: the %s has no <svg> element", what)
	}
	if prefix != "" {
		b = svgIDAttr.ReplaceAll(b, []byte(`id="`+prefix))
		b = svgIDRef.ReplaceAllFunc(b, func(m []byte) []byte { return append(append([]byte(nil), m...), prefix...) })
	}
	return template.HTML(bytes.TrimSpace(b)), nil // checked above: SVG markup that neither scripts nor fetches
}
