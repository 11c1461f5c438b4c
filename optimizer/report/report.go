// Package report renders a plan for people and for other programs: terminal
// tables, plan JSON, a points CSV and GeoJSON (RFC 7946) for stakeout and GIS.
// Renderers write to an io.Writer; they never open files.
package report

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"

	moneyfmt "github.com/rigmix/rigmix/internal/money"
	"github.com/rigmix/rigmix/optimizer/plan"
)

// JSON writes the plan as indented JSON (the plan file; schema in
// optimizer/plan/SCHEMA.md).
func JSON(w io.Writer, p *plan.Plan) error {
	b, err := json.MarshalIndent(p, "", "  ")
	if err != nil {
		return err
	}
	b = append(b, '\n')
	_, err = w.Write(b)
	return err
}

// PointsCSV writes one row per exploration point.
func PointsCSV(w io.Writer, p *plan.Plan) error {
	cw := csv.NewWriter(w)
	_ = cw.Write([]string{"id", "zone", "x_ft", "y_ft", "lon", "lat", "method", "rig", "depth_ft", "sample_interval_ft", "hours", "cost"})
	for _, pt := range p.Points {
		lon, lat := "", ""
		if pt.Lon != nil {
			lon, lat = ftoa(*pt.Lon), ftoa(*pt.Lat)
		}
		_ = cw.Write([]string{pt.ID, pt.Zone, ftoa(pt.XFt), ftoa(pt.YFt), lon, lat, pt.Method, pt.Rig,
			ftoa(pt.DepthFt), ftoa(pt.SampleIntervalFt), ftoa(pt.Hours), ftoa(pt.Cost)})
	}
	cw.Flush()
	return cw.Error()
}

// EstimateCSV writes the itemized estimate for a spreadsheet: one row per
// line (item, description, quantity, unit, unit price, extension) and a
// closing total row; money with two decimals and no thousands separators,
// so a spreadsheet reads every amount as a number.
func EstimateCSV(w io.Writer, p *plan.Plan) error {
	cur := p.RateBook.Currency
	cw := csv.NewWriter(w)
	_ = cw.Write([]string{"item", "description", "quantity", "unit", "unit_price_" + cur, "extension_" + cur})
	for _, l := range p.Estimate {
		_ = cw.Write([]string{l.Item, l.Description, ftoa(l.Quantity), l.Unit, money2(l.UnitPrice), money2(l.Extension)})
	}
	_ = cw.Write([]string{"total", "total of the estimate", "", "", "", money2(p.Total)})
	cw.Flush()
	return cw.Error()
}

// money2 is an amount with two decimals, for CSV: no separators.
func money2(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	if s == "-0.00" {
		return "0.00"
	}
	return s
}

// GeoJSON writes the points as an RFC 7946 FeatureCollection, each with
// its ID as the feature id and as the "name" property, the field GIS
// programs label points by (KML's name, a shapefile's NAME). RFC 7946
// requires WGS 84 longitude and latitude, so a scenario without an origin
// cannot be written; the error says so.
func GeoJSON(w io.Writer, p *plan.Plan) error {
	type geometry struct {
		Type        string    `json:"type"`
		Coordinates []float64 `json:"coordinates"`
	}
	type feature struct {
		Type       string         `json:"type"`
		ID         string         `json:"id"`
		Geometry   geometry       `json:"geometry"`
		Properties map[string]any `json:"properties"`
	}
	fc := struct {
		Type     string    `json:"type"`
		Features []feature `json:"features"`
	}{Type: "FeatureCollection", Features: []feature{}}
	for _, pt := range p.Points {
		if pt.Lon == nil {
			return fmt.Errorf("report: GeoJSON needs WGS 84 positions, and scenario %q gives no origin: add origin (lon, lat) to the scenario", p.Scenario.Name)
		}
		fc.Features = append(fc.Features, feature{
			Type: "Feature", ID: pt.ID,
			Geometry: geometry{Type: "Point", Coordinates: []float64{*pt.Lon, *pt.Lat}},
			Properties: map[string]any{ // encoding/json sorts map keys: stable output
				"name": pt.ID, "zone": pt.Zone, "method": pt.Method, "rig": pt.Rig, "depth_ft": pt.DepthFt,
				"sample_interval_ft": pt.SampleIntervalFt, "x_ft": pt.XFt, "y_ft": pt.YFt,
			},
		})
	}
	b, err := json.MarshalIndent(fc, "", "  ")
	if err != nil {
		return err
	}
	_, err = w.Write(append(b, '\n'))
	return err
}

// Text writes the plan for a terminal: summary, points by method and rig,
// the itemized estimate, rigs and field days, rules, solver, cautions.
func Text(w io.Writer, p *plan.Plan) error {
	var b bytes.Buffer
	cur := p.RateBook.Currency
	fmt.Fprintf(&b, "rigmix plan — %s\n", p.Scenario.Title)
	fmt.Fprintf(&b, "scenario %s (%s)%s\n", p.Scenario.Name, p.Scenario.Source, demoNote(p.Scenario.Demo))
	fmt.Fprintf(&b, "rate book %s, %s, effective %s%s\n\n", p.RateBook.Name, p.RateBook.Region, p.RateBook.Effective, demoNote(p.RateBook.Demo))

	fmt.Fprintf(&b, "Program: %d points, %s total, %d field days (rigs in parallel), %.1f%% of ruled ground covered\n\n",
		len(p.Points), money(p.Total, cur), p.Finish, p.Coverage.CoveredPercent)

	if bl := p.Baseline; bl != nil {
		fmt.Fprintf(&b, "Against a hand-laid grid (%s): %d points, %s, %d field days — this plan saves %s (%.1f%%) and %d field days\n",
			bl.Note, bl.Points, money(bl.Cost, cur), bl.FieldDays, money(bl.Saving, cur), bl.SavingPct, bl.DaysSaved)
		if sp := bl.Split; sp != nil {
			fmt.Fprintf(&b, "  the saving by source: methods %s, rigs %s, layout %s\n", money(sp.Methods, cur), money(sp.Rigs, cur), money(sp.Layout, cur))
		}
		b.WriteString("\n")
	}

	b.WriteString("Points by method and rig\n")
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	counts := map[[2]string]int{}
	for _, pt := range p.Points {
		counts[[2]string{pt.Method, pt.Rig}]++
	}
	keys := make([][2]string, 0, len(counts))
	for k := range counts {
		keys = append(keys, k)
	}
	sort.Slice(keys, func(i, j int) bool {
		if keys[i][0] != keys[j][0] {
			return keys[i][0] < keys[j][0]
		}
		return keys[i][1] < keys[j][1]
	})
	fmt.Fprintln(tw, "method\trig\tpoints\t")
	for _, k := range keys {
		fmt.Fprintf(tw, "%s\t%s\t%d\t\n", k[0], k[1], counts[k])
	}
	tw.Flush()

	// The point list: the IDs the site map, the CSV and the stakeout list
	// use, so a printed list and a printed map match.
	b.WriteString("\nPoint list\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(tw, "point\tzone\tmethod\trig\tdepth ft\tx ft\ty ft\tcost (%s)\t\n", cur)
	for _, pt := range p.Points {
		id := pt.ID
		if pt.Required {
			id += " (required)"
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t\n", id, pt.Zone, pt.Method, pt.Rig,
			strconv.FormatFloat(pt.DepthFt, 'f', 1, 64), strconv.FormatFloat(pt.XFt, 'f', 1, 64), strconv.FormatFloat(pt.YFt, 'f', 1, 64), money(pt.Cost, ""))
	}
	tw.Flush()

	b.WriteString("\nItemized estimate\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(tw, "item\tdescription\tquantity\tunit\tunit price\textension\t\n")
	for _, l := range p.Estimate {
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t\n", l.Item, l.Description, ftoa(l.Quantity), l.Unit, money(l.UnitPrice, ""), money(l.Extension, ""))
	}
	fmt.Fprintf(tw, "total\t\t\t\t%s\t%s\t\n", cur, money(p.Total, ""))
	tw.Flush()

	b.WriteString("\nRigs\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintf(tw, "rig\tmobilized\tpoints\thours on points\tmobilization h\tfield days\t\n")
	for _, r := range p.Rigs {
		fmt.Fprintf(tw, "%s\t%s\t%d\t%.1f\t%.1f\t%d\t\n", r.Name, yesNo(r.Mobilized), r.Points, r.Hours, r.MobHours, r.FieldDays)
	}
	tw.Flush()

	b.WriteString("\nRules\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "zone\trule\trequired\tachieved\tmet\tset by\n")
	var zones []string
	source := map[string]string{}
	for _, r := range p.Rules {
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\n", r.Zone, r.Rule, r.Required, r.Achieved, yesNo(r.Met), originWord(r.Origin))
		if _, ok := source[r.Zone]; !ok {
			zones = append(zones, r.Zone)
			source[r.Zone] = r.Source
		}
	}
	tw.Flush()
	b.WriteString("\nWhere the rules come from\n")
	for _, z := range zones {
		src := source[z]
		if src == "" {
			src = "(the scenario gives no source)"
		}
		fmt.Fprintf(&b, "  %s: %s\n", z, src)
	}
	if bs := ruleBases(p); len(bs) > 0 {
		b.WriteString("\nBasis of computed, preset and default rules\n")
		for _, x := range bs {
			fmt.Fprintf(&b, "  %s: %s\n", x.Zone, x.Source)
		}
	}
	if len(p.Lab) > 0 {
		b.WriteString("\nLab program by zone\n")
		for _, l := range p.Lab {
			fmt.Fprintf(&b, "  %s (%s): %s\n", l.Zone, l.Program, l.Basis)
		}
	}

	if len(p.Excluded) > 0 {
		b.WriteString("\nOptions the rigs ruled out\n")
		tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
		for _, e := range p.Excluded {
			fmt.Fprintf(tw, "  %s\t%s by %s:\t%s\n", e.Zone, e.Method, e.Rig, e.Reason)
		}
		tw.Flush()
	}

	s := p.Solver
	fmt.Fprintf(&b, "\nSolver: %s, objective %s, bound %s, gap %.4f%%, %d nodes; model %d rows × %d columns from %d candidates\n",
		s.Status, ftoa(s.Objective), ftoa(s.Bound), 100*s.Gap, s.Nodes, s.Rows, s.Columns, s.Candidates)

	if len(p.Warnings) > 0 {
		b.WriteString("\nWarnings\n")
		for _, w := range p.Warnings {
			fmt.Fprintf(&b, "  ! %s\n", w)
		}
	}
	b.WriteString("\nCautions\n")
	for _, c := range p.Cautions {
		fmt.Fprintf(&b, "  * %s\n", c)
	}
	_, err := w.Write(b.Bytes())
	return err
}

func demoNote(demo bool) string {
	if demo {
		return " — invented demo data"
	}
	return ""
}

func yesNo(b bool) string {
	if b {
		return "yes"
	}
	return "no"
}

func ftoa(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }

// money formats an amount for people: thousands separators, two decimals,
// after the currency code when one is given (internal/money).
func money(v float64, cur string) string { return moneyfmt.WithCurrency(v, cur) }

// ruleBases lists, rule by rule, the origin of every rule that the file
// did not state itself (computed, preset or default), with the rule named:
// "B1 minimum depth — computed: Sowers ... → 69.0 ft".
func ruleBases(p *plan.Plan) []sourceView {
	var out []sourceView
	for _, r := range p.Rules {
		if r.Origin == "" || r.Origin == "scenario" {
			continue
		}
		out = append(out, sourceView{Zone: r.Zone + " " + r.Rule, Source: r.Origin})
	}
	return out
}

// originWord shortens a rule's origin for the terminal table: "scenario",
// "preset NAME", "computed" or "default"; the plan JSON keeps it whole.
func originWord(o string) string {
	if i := strings.Index(o, ":"); i >= 0 {
		o = o[:i]
	}
	if o == "" {
		return "-"
	}
	return o
}
