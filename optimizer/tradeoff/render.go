package tradeoff

import (
	"encoding/csv"
	"fmt"
	"io"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"
)

// methodOrder lists methods in the order tables show them.
var methodOrder = []string{"boring", "cpt", "test_pit", "probe"}

func methodsText(m map[string]int) string {
	var parts []string
	seen := map[string]bool{}
	for _, k := range methodOrder {
		if m[k] > 0 {
			parts = append(parts, fmt.Sprintf("%d %s", m[k], k))
			seen[k] = true
		}
	}
	var rest []string
	for k := range m {
		if !seen[k] && m[k] > 0 {
			rest = append(rest, k)
		}
	}
	sort.Strings(rest)
	for _, k := range rest {
		parts = append(parts, fmt.Sprintf("%d %s", m[k], k))
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, ", ")
}

func gapText(s Summary) string {
	if s.LargestGapFt == nil {
		if s.GapNote != "" {
			return s.GapNote
		}
		return "-"
	}
	return strconv.FormatFloat(*s.LargestGapFt, 'f', 1, 64)
}

func missText(s Summary) string {
	var parts []string
	for _, m := range s.Miss {
		parts = append(parts, fmt.Sprintf("%s %.0f%%", m.Zone, 100*m.MissProbability))
	}
	return strings.Join(parts, " ")
}

func pct(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }

// WriteAlternativesText writes the alternatives side by side as a terminal
// table, with the chance of a miss per zone for a feature of featureFt.
func WriteAlternativesText(w io.Writer, rows []Summary, featureFt float64) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "alternative\ttotal cost\tfield days\trigs\tpoints by method\tarea covered %\tlargest gap ft\trules met\topt. gap %\t")
	for _, s := range rows {
		if !s.Feasible {
			fmt.Fprintf(tw, "%s\t%s\t\t\t\t\t\t\t\t\n", s.Label, s.Status)
			continue
		}
		fmt.Fprintf(tw, "%s\t%s\t%d\t%d\t%s\t%s\t%s\t%d/%d\t%.2f\t\n",
			s.Label, money(s.TotalCost), s.FieldDays, s.RigsMobilized, methodsText(s.PointsByMethod),
			pct(s.AreaCoveredPct), gapText(s), s.RulesMet, s.RulesTotal, 100*s.OptimalityGap)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	fmt.Fprintf(w, "\nChance of missing a buried feature %g ft across (per zone):\n", featureFt)
	for _, s := range rows {
		if s.Feasible {
			fmt.Fprintf(w, "  %-28s %s\n", s.Label, missText(s))
		}
	}
	fmt.Fprintln(w, "\nNotes:")
	for _, s := range rows {
		if s.Note != "" {
			fmt.Fprintf(w, "  %s: %s\n", s.Label, s.Note)
		}
	}
	fmt.Fprintln(w, "  Total cost is the itemized estimate, the cost the model prices too (priced_cost in CSV and JSON): budgets, savings and the frontier use it.")
	_, err := fmt.Fprintln(w, "  Miss chance: 1 − (area of the zone within d/2 of a chosen point) / (zone area); for a square grid of spacing s and d < s the hit chance is πd²/(4s²) (Davis, Statistics and Data Analysis in Geology, ch. 5).")
	return err
}

// WriteAlternativesCSV writes the alternatives as CSV, one row each, with
// one miss-chance column per zone.
func WriteAlternativesCSV(w io.Writer, rows []Summary) error {
	cw := csv.NewWriter(w)
	head := []string{"alternative", "feasible", "status", "rate_book", "total_cost", "priced_cost", "field_days", "rigs_mobilized", "rigs",
		"points", "boring", "cpt", "test_pit", "probe", "area_covered_percent", "weighted_covered_percent",
		"largest_gap_ft", "rules_met", "rules_total", "optimality_gap"}
	var zones []string
	for _, s := range rows {
		if len(s.Miss) > 0 {
			for _, m := range s.Miss {
				zones = append(zones, m.Zone)
			}
			break
		}
	}
	for _, z := range zones {
		head = append(head, "miss_probability_"+z)
	}
	if err := cw.Write(head); err != nil {
		return err
	}
	for _, s := range rows {
		gap := ""
		if s.LargestGapFt != nil {
			gap = ff(*s.LargestGapFt, 1)
		}
		rec := []string{s.Label, strconv.FormatBool(s.Feasible), s.Status, s.RateBook, ff(s.TotalCost, 2), ff(s.PricedCost, 2), strconv.Itoa(s.FieldDays),
			strconv.Itoa(s.RigsMobilized), strings.Join(s.Rigs, " "), strconv.Itoa(s.Points),
			strconv.Itoa(s.PointsByMethod["boring"]), strconv.Itoa(s.PointsByMethod["cpt"]),
			strconv.Itoa(s.PointsByMethod["test_pit"]), strconv.Itoa(s.PointsByMethod["probe"]),
			ff(s.AreaCoveredPct, 2), ff(s.WeightedCoveredPct, 2), gap,
			strconv.Itoa(s.RulesMet), strconv.Itoa(s.RulesTotal), ff(s.OptimalityGap, 6)}
		for i := range zones {
			v := ""
			if i < len(s.Miss) {
				v = ff(s.Miss[i].MissProbability, 4)
			}
			rec = append(rec, v)
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

func ff(v float64, places int) string { return strconv.FormatFloat(v, 'f', places, 64) }

// WriteFrontierCSV writes every swept day limit, marking the non-dominated
// points.
func WriteFrontierCSV(w io.Writer, f *Frontier) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"max_days", "feasible", "status", "field_days", "total_cost", "priced_cost", "bound_cost", "optimality_gap", "rigs_mobilized", "rigs", "points", "on_frontier", "balanced"}); err != nil {
		return err
	}
	on, bal := f.marks()
	for _, p := range f.Swept {
		rec := []string{strconv.Itoa(p.MaxDays), strconv.FormatBool(p.Feasible), p.Status, strconv.Itoa(p.FieldDays),
			ff(p.TotalCost, 2), ff(p.PricedCost, 2), ff(p.BoundCost, 2), ff(p.OptimalityGap, 6), strconv.Itoa(p.RigsMobilized), strings.Join(p.Rigs, " "),
			strconv.Itoa(p.Points), strconv.FormatBool(on[p.MaxDays]), strconv.FormatBool(p.MaxDays == bal)}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteBudgetCSV writes the budget–coverage curve.
func WriteBudgetCSV(w io.Writer, b *BudgetCurve) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"budget", "feasible", "status", "total_cost", "priced_cost", "weighted_covered_percent", "area_covered_percent", "points", "field_days", "rules_met", "rules_total", "optimality_gap", "from_lower_budget", "every_rule_met_budget", "knee"}); err != nil {
		return err
	}
	for i, p := range b.Points {
		rec := []string{ff(p.Budget, 2), strconv.FormatBool(p.Feasible), p.Status, ff(p.TotalCost, 2), ff(p.PricedCost, 2), ff(p.WeightedCoveredPct, 2),
			ff(p.AreaCoveredPct, 2), strconv.Itoa(p.Points), strconv.Itoa(p.FieldDays), strconv.Itoa(p.RulesMet), strconv.Itoa(p.RulesTotal),
			ff(p.OptimalityGap, 6), strconv.FormatBool(p.FromLower), strconv.FormatBool(i == b.Full), strconv.FormatBool(i == b.Knee)}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteRuleCostsText writes what each rule costs, the dearest first.
func WriteRuleCostsText(w io.Writer, rules []RuleCost, base float64) error {
	fmt.Fprintf(w, "What each rule costs (cheapest plan priced at %s; savings in priced cost, re-solved):\n", money(base))
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "zone\trule\trequired\tone step\tsaving\tdropped\tsaving\tLP estimate of the step")
	localized := false
	rel := func(r *Relaxation) (string, string) {
		switch {
		case r == nil:
			return "-", "-"
		case !r.Feasible:
			return r.Change, r.Status
		case isLocalized(r):
			localized = true
			return r.Change, "≥ " + money(r.Saving)
		}
		return r.Change, money(r.Saving)
	}
	for _, r := range rules {
		sc, ss := rel(r.Step)
		dc, ds := rel(r.Dropped)
		lpv := "-"
		if r.LPEstimate != nil {
			lpv = money(*r.LPEstimate)
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", r.Zone, r.Rule, r.Required, sc, ss, dc, ds, lpv)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	if localized {
		_, err := fmt.Fprintln(w, "≥: only that zone re-planned, the other zones as in the cheapest plan (a large site); re-planning the whole site may save more, up to the proven most (max_saving in the JSON and CSV).")
		return err
	}
	return nil
}

// localizedCSVMark follows the change of a localized relaxation in the
// CSV (and so in the report's table built from it).
const localizedCSVMark = " (only this zone re-planned: it saves at least the saving column, at most the max_saving column)"

// isLocalized reports whether a relaxation was priced by re-planning its
// zone alone without proof that the whole site could do no better
// (localized).
func isLocalized(r *Relaxation) bool { return strings.HasPrefix(r.Status, localizedStatus) }

// WriteRuleCostsCSV writes what each rule costs as CSV.
func WriteRuleCostsCSV(w io.Writer, rules []RuleCost) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"zone", "rule", "required", "step_change", "step_saving", "step_max_saving", "step_gap", "dropped_change", "dropped_saving", "dropped_max_saving", "dropped_gap", "lp_estimate"}); err != nil {
		return err
	}
	cols := func(r *Relaxation) []string {
		if r == nil {
			return []string{"", "", "", ""}
		}
		if !r.Feasible {
			return []string{r.Change, "", "", ""}
		}
		change := r.Change
		if isLocalized(r) {
			// The mark goes with the change, so that the saving columns
			// stay numbers and a table built from the CSV carries it.
			change += localizedCSVMark
		}
		return []string{change, ff(r.Saving, 2), ff(r.MaxSaving, 2), ff(r.Gap, 6)}
	}
	for _, r := range rules {
		rec := append([]string{r.Zone, r.Rule, r.Required}, cols(r.Step)...)
		rec = append(rec, cols(r.Dropped)...)
		lpv := ""
		if r.LPEstimate != nil {
			lpv = ff(*r.LPEstimate, 2)
		}
		if err := cw.Write(append(rec, lpv)); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteFrontierText prints the cost–days frontier: the non-dominated plans
// and, after them, the swept day limits whose plans were dominated.
func WriteFrontierText(w io.Writer, f *Frontier) error {
	fmt.Fprintf(w, "Cost–days frontier (%s; each solve to a %.2g%% gap):\n", f.Method, 100*f.GapRel)
	fmt.Fprintf(w, "fastest finish found %d days (proven bound %d); cheapest plan %d days\n", f.FastestDays, f.FastestBound, f.CheapestDays)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "day limit\tfield days\tpriced cost\tcost bound\trigs\tpoints\topt. gap %\t\t")
	on, bal := f.marks()
	for _, p := range f.Swept {
		if !p.Feasible {
			fmt.Fprintf(tw, "%d\t%s\t\t\t\t\t\t\t\n", p.MaxDays, p.Status)
			continue
		}
		mark := ""
		switch {
		case p.MaxDays == bal:
			mark = "frontier, balanced"
		case on[p.MaxDays]:
			mark = "frontier"
		default:
			mark = "dominated"
		}
		fmt.Fprintf(tw, "%d\t%d\t%s\t%s\t%d\t%d\t%.2f\t%s\t\n", p.MaxDays, p.FieldDays, money(p.PricedCost), money(p.BoundCost),
			p.RigsMobilized, p.Points, 100*p.OptimalityGap, mark)
	}
	return tw.Flush()
}

// WriteBudgetText prints the budget–coverage curve.
func WriteBudgetText(w io.Writer, b *BudgetCurve) error {
	fmt.Fprintf(w, "Budget–coverage curve (%s):\n", b.Method)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "budget\tpriced cost\tweighted covered %\tarea covered %\tpoints\trules met\topt. gap %\t\t")
	for i, p := range b.Points {
		if !p.Feasible {
			fmt.Fprintf(tw, "%s\t%s\t\t\t\t\t\t\t\n", money(p.Budget), p.Status)
			continue
		}
		var marks []string
		if i == b.Full {
			marks = append(marks, "every rule met")
		}
		if i == b.Knee {
			marks = append(marks, "knee")
		}
		if p.FromLower {
			marks = append(marks, "plan of a lower budget")
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%d\t%d/%d\t%.2f\t%s\t\n", money(p.Budget), money(p.PricedCost), pct(p.WeightedCoveredPct),
			pct(p.AreaCoveredPct), p.Points, p.RulesMet, p.RulesTotal, 100*p.OptimalityGap, strings.Join(marks, ", "))
	}
	return tw.Flush()
}

// WriteText prints the whole analysis: alternatives, frontier, budget
// curve and rule costs.
func (an *Analysis) WriteText(w io.Writer) error {
	fmt.Fprintf(w, "Trade-offs for scenario %s, rate book %s\n\n", an.Scenario, an.RateBook)
	steps := []func() error{
		func() error { return WriteAlternativesText(w, an.Alternatives, an.FeatureDiameterFt) },
		func() error { return WriteFrontierText(w, an.Frontier) },
		func() error { return WriteBudgetText(w, an.Budget) },
		func() error {
			base := 0.0
			if len(an.Alternatives) > 0 {
				base = an.Alternatives[0].PricedCost
			}
			return WriteRuleCostsText(w, an.RuleCosts, base)
		},
	}
	for i, f := range steps {
		if i > 0 {
			fmt.Fprintln(w)
		}
		if err := f(); err != nil {
			return err
		}
	}
	return nil
}

// marks gives the day limits whose solve is on the frontier and the day
// limit of the balanced point (−1 when there is none).
func (f *Frontier) marks() (on map[int]bool, balanced int) {
	on = map[int]bool{}
	for _, p := range f.Points {
		on[p.MaxDays] = true
	}
	balanced = -1
	if len(f.Points) > 0 {
		balanced = f.Points[f.Balanced].MaxDays
	}
	return on, balanced
}
