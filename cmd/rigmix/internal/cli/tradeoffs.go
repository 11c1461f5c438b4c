package cli

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/report"
	"github.com/rigmix/rigmix/optimizer/tradeoff"
	"github.com/rigmix/rigmix/ratebooks"
)

type tradeoffOptions struct {
	demo      string
	rateBooks string
	budget    float64
	featureFt float64
	jsonOut   string
	altCSV    string
	frontCSV  string
	frontSVG  string
	budgetCSV string
	budgetSVG string
	ruleCSV   string
	frontierN int
	budgetN   int
}

func newTradeoffsCmd(g *globalOptions, stdout, stderr io.Writer) *cobra.Command {
	o := &tradeoffOptions{}
	c := &cobra.Command{
		Use:   "tradeoffs [SCENARIO.yaml]",
		Short: "Lay the alternatives side by side: cheapest, fastest, balanced, most coverage for a budget, each rate book; the cost–days frontier, the budget–coverage curve and what each rule costs",
		Args:  cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			return runTradeoffs(cmd.Context(), cfg, o, args, stdout)
		},
	}
	f := c.Flags()
	f.StringVar(&o.demo, "demo", "", "analyse an embedded demo scenario by name")
	f.String("rate-book", "", "price with this rate book (demo name or file) instead of the scenario's")
	f.StringVar(&o.rateBooks, "compare-rate-books", "", "comma-separated further rate books (demo names or files) to price the cheapest plan under")
	f.Float64Var(&o.budget, "budget", 0, "budget for the most-coverage alternative (default: 75% of the cheapest plan)")
	f.Float64Var(&o.featureFt, "feature-diameter", 0, "plan diameter in ft of the buried feature whose chance of a miss is shown (default 20)")
	f.IntVar(&o.frontierN, "frontier-points", 0, "most points on the cost–days frontier")
	f.IntVar(&o.budgetN, "budget-points", 0, "budgets on the budget–coverage curve")
	f.Float64("gap", 0, "relative gap every solve stops at (default 0.005)")
	f.StringVar(&o.jsonOut, "json", "", "write the whole analysis as JSON to this file")
	f.StringVar(&o.altCSV, "alternatives-csv", "", "write the alternatives table as CSV")
	f.StringVar(&o.frontCSV, "frontier-csv", "", "write the cost–days frontier as CSV")
	f.StringVar(&o.frontSVG, "frontier-svg", "", "write the cost–days frontier chart as SVG")
	f.StringVar(&o.budgetCSV, "budget-csv", "", "write the budget–coverage curve as CSV")
	f.StringVar(&o.budgetSVG, "budget-svg", "", "write the budget–coverage chart as SVG")
	f.StringVar(&o.ruleCSV, "rule-costs-csv", "", "write what each rule costs as CSV")
	return c
}

func runTradeoffs(ctx context.Context, cfg Config, o *tradeoffOptions, args []string, stdout io.Writer) error {
	sc, rb, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	var extra []*ratebooks.RateBook
	if o.rateBooks != "" {
		for _, name := range strings.Split(o.rateBooks, ",") {
			b, err := loadRateBook(strings.TrimSpace(name), ".")
			if err != nil {
				return err
			}
			if b.Currency != rb.Currency {
				return usageError{fmt.Errorf("--compare-rate-books: %s prices in %s, %s in %s; compare rate books in one currency", b.Name, b.Currency, rb.Name, rb.Currency)}
			}
			extra = append(extra, b)
		}
	}
	fleet, rigs, err := startRigs(ctx, cfg, sc)
	if err != nil {
		return err
	}
	defer fleet.Close()
	an, err := tradeoff.Analyze(ctx, tradeoff.Config{
		Input:       plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs},
		PlanOptions: plan.Options{Threads: cfg.Threads},
		RateBooks:   extra, Budget: o.budget, FeatureDiameterFt: o.featureFt,
		FrontierPoints: o.frontierN, BudgetPoints: o.budgetN,
		Settings: tradeoff.Settings{GapRel: cfg.Gap},
	})
	if err != nil {
		return err
	}
	outs := outputs{}
	for _, w := range []struct {
		path   string
		render func(io.Writer) error
	}{
		{o.altCSV, func(w io.Writer) error { return tradeoff.WriteAlternativesCSV(w, an.Alternatives) }},
		{o.frontCSV, func(w io.Writer) error { return tradeoff.WriteFrontierCSV(w, an.Frontier) }},
		{o.frontSVG, func(w io.Writer) error { return tradeoff.WriteFrontierSVG(w, an.Frontier) }},
		{o.budgetCSV, func(w io.Writer) error { return tradeoff.WriteBudgetCSV(w, an.Budget) }},
		{o.budgetSVG, func(w io.Writer) error { return tradeoff.WriteBudgetSVG(w, an.Budget) }},
		{o.ruleCSV, func(w io.Writer) error { return tradeoff.WriteRuleCostsCSV(w, an.RuleCosts) }},
		{o.jsonOut, func(w io.Writer) error {
			b, err := json.MarshalIndent(an, "", "  ")
			if err != nil {
				return err
			}
			_, err = w.Write(append(b, '\n'))
			return err
		}},
	} {
		if w.path == "" {
			continue
		}
		var b bytes.Buffer
		if err := w.render(&b); err != nil {
			return err
		}
		outs.add(w.path, b.Bytes())
	}
	if err := outs.write(); err != nil {
		return err
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, "rigmix tradeoffs — %s (%s)%s\n\n", sc.Title, sc.Source, map[bool]string{true: " — invented demo data", false: ""}[sc.Demo])
	if err := an.WriteText(&b); err != nil {
		return err
	}
	b.WriteString("\nCautions\n")
	for _, c := range plan.Cautions {
		fmt.Fprintf(&b, "  * %s\n", c)
	}
	_, err = stdout.Write(b.Bytes())
	return err
}

// addTradeoffs fills the report's alternatives table, frontier and budget
// curve and rule costs from one analysis; the report shows the very bytes the
// CSV and SVG writers produce.
func addTradeoffs(ctx context.Context, hin *report.HTMLInput, pr *plan.Prepared, in plan.Input, popt plan.Options) error {
	a, err := tradeoff.FromPrepared(ctx, pr, tradeoff.Config{Input: in, PlanOptions: plan.Options{Threads: popt.Threads}})
	if err != nil {
		return err
	}
	an, err := a.All(ctx)
	if err != nil {
		return err
	}
	var alt, rules, front, budget bytes.Buffer
	if err := tradeoff.WriteAlternativesCSV(&alt, an.Alternatives); err != nil {
		return err
	}
	if err := tradeoff.WriteRuleCostsCSV(&rules, an.RuleCosts); err != nil {
		return err
	}
	if err := tradeoff.WriteFrontierSVG(&front, an.Frontier); err != nil {
		return err
	}
	if err := tradeoff.WriteBudgetSVG(&budget, an.Budget); err != nil {
		return err
	}
	if hin.Alternatives, err = report.TableFromCSV("Alternatives", &alt, "Each row re-solved with the exact engine to the gap shown."); err != nil {
		return err
	}
	if hin.RuleCosts, err = report.TableFromCSV("What each rule costs", &rules, "Saving against the cheapest plan when the rule is relaxed one step or dropped, re-solved."); err != nil {
		return err
	}
	hin.FrontierSVG, hin.BudgetSVG = front.Bytes(), budget.Bytes()
	return nil
}
