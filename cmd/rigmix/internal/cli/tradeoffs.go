package cli

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strings"
	"time"

	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/report"
	"github.com/rigmix/rigmix/optimizer/tradeoff"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
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
	quiet     bool
	csvBOM    bool
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
			return runTradeoffs(cmd.Context(), cfg, o, args, stdout, stderr)
		},
	}
	f := c.Flags()
	f.StringVar(&o.demo, "demo", "", "analyse the embedded demo scenario `NAME`")
	f.String("rate-book", "", "price with this rate `BOOK` (demo name or file) instead of the scenario's")
	f.StringVar(&o.rateBooks, "compare-rate-books", "", "comma-separated further rate `BOOKS` (demo names or files) to price the cheapest plan under")
	f.Float64Var(&o.budget, "budget", 0, "`AMOUNT` for the most-coverage alternative (default: 75% of the cheapest plan)")
	f.Float64Var(&o.featureFt, "feature-diameter", 0, "plan diameter in `FT` of the buried feature whose chance of a miss is shown (default 20)")
	f.IntVar(&o.frontierN, "frontier-points", 0, "most points on the cost–days frontier, `N` (at most 100; default 12)")
	f.IntVar(&o.budgetN, "budget-points", 0, "budgets on the budget–coverage curve, `N` (at most 100; default 8)")
	f.Float64("gap", 0, "relative `GAP` every solve stops at (default 0.005)")
	f.BoolVar(&o.csvBOM, "csv-bom", false, "begin every CSV file written with a UTF-8 byte-order mark (for spreadsheets)")
	f.BoolVar(&o.quiet, "quiet", false, "print nothing but errors")
	f.StringVar(&o.jsonOut, "json", "", "write the whole analysis as JSON to `FILE` (- for standard output)")
	f.StringVar(&o.altCSV, "alternatives-csv", "", "write the alternatives table as CSV to `FILE`")
	f.StringVar(&o.frontCSV, "frontier-csv", "", "write the cost–days frontier as CSV to `FILE`")
	f.StringVar(&o.frontSVG, "frontier-svg", "", "write the cost–days frontier chart as SVG to `FILE`")
	f.StringVar(&o.budgetCSV, "budget-csv", "", "write the budget–coverage curve as CSV to `FILE`")
	f.StringVar(&o.budgetSVG, "budget-svg", "", "write the budget–coverage chart as SVG to `FILE`")
	f.StringVar(&o.ruleCSV, "rule-costs-csv", "", "write what each rule costs as CSV to `FILE`")
	return c
}

func runTradeoffs(ctx context.Context, cfg Config, o *tradeoffOptions, args []string, stdout, stderr io.Writer) error {
	if err := o.validate(); err != nil {
		return err
	}
	prog := startProgress(stderr, "tradeoffs", !o.quiet && isTerminal(stderr), time.Second)
	defer prog.end()
	prog.set("loading")
	sc, rb, inputs, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	var extra []*ratebooks.RateBook
	if o.rateBooks != "" {
		for _, name := range strings.Split(o.rateBooks, ",") {
			name = strings.TrimSpace(name)
			b, err := loadRateBook(name, ".")
			if err != nil {
				return err
			}
			if b.Currency != rb.Currency {
				return usageError{fmt.Errorf("--compare-rate-books: %s prices in %s, %s in %s; compare rate books in one currency", b.Name, b.Currency, rb.Name, rb.Currency)}
			}
			extra = append(extra, b)
			if !isDemoRateBook(name) {
				inputs = append(inputs, name)
			}
		}
	}
	outs := &outputs{stdout: stdout, bom: o.csvBOM}
	type render func(w io.Writer) error
	var an *tradeoff.Analysis
	files := []struct {
		out    *output
		render render
	}{
		{outs.add("--alternatives-csv", o.altCSV), func(w io.Writer) error { return tradeoff.WriteAlternativesCSV(w, an.Alternatives) }},
		{outs.add("--frontier-csv", o.frontCSV), func(w io.Writer) error { return tradeoff.WriteFrontierCSV(w, an.Frontier) }},
		{outs.add("--frontier-svg", o.frontSVG), func(w io.Writer) error { return tradeoff.WriteFrontierSVG(w, an.Frontier) }},
		{outs.add("--budget-csv", o.budgetCSV), func(w io.Writer) error { return tradeoff.WriteBudgetCSV(w, an.Budget) }},
		{outs.add("--budget-svg", o.budgetSVG), func(w io.Writer) error { return tradeoff.WriteBudgetSVG(w, an.Budget) }},
		{outs.add("--rule-costs-csv", o.ruleCSV), func(w io.Writer) error { return tradeoff.WriteRuleCostsCSV(w, an.RuleCosts) }},
		{outs.add("--json", o.jsonOut), func(w io.Writer) error {
			b, err := json.MarshalIndent(an, "", "  ")
			if err != nil {
				return err
			}
			_, err = w.Write(append(b, '\n'))
			return err
		}},
	}
	if err := outs.check(inputs); err != nil {
		return err
	}
	prog.set("starting the rigs")
	fleet, rigs, err := startRigs(ctx, cfg, sc, stderr)
	if err != nil {
		return err
	}
	defer fleet.Close()
	prog.set("planning the alternatives, the frontier, the budget curve and the rule costs")
	an, err = tradeoff.Analyze(ctx, tradeoff.Config{
		Input:       plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs},
		PlanOptions: plan.Options{Threads: cfg.Threads},
		RateBooks:   extra, Budget: o.budget, FeatureDiameterFt: o.featureFt,
		FrontierPoints: o.frontierN, BudgetPoints: o.budgetN,
		Settings: tradeoff.Settings{GapRel: cfg.Gap},
	})
	if err != nil {
		return err
	}
	if ctx.Err() != nil {
		// The analysis stops early on a signal with what it has; those
		// are not the numbers asked for.
		return errInterrupted
	}
	for _, f := range files {
		if f.out == nil {
			continue
		}
		var b bytes.Buffer
		if err := f.render(&b); err != nil {
			return err
		}
		f.out.setData(b.Bytes())
	}
	prog.end()
	if !o.quiet && !outs.toStdout() {
		var b bytes.Buffer
		fmt.Fprintf(&b, "rigmix tradeoffs — %s (%s)%s\n\n", sc.Title, sc.Source, map[bool]string{true: " — invented demo data", false: ""}[sc.Demo])
		if err := an.WriteText(&b); err != nil {
			return err
		}
		b.WriteString("\nCautions\n")
		for _, c := range tradeoffCautions(sc, an) {
			fmt.Fprintf(&b, "  * %s\n", c)
		}
		outs.summary = b.Bytes()
	}
	return outs.commit(ctx)
}

// Caps on the count flags: each frontier point and each budget is a solve.
const (
	maxFrontierPoints = 100
	maxBudgetPoints   = 100
)

// validate refuses flag values that are out of range or not finite.
func (o *tradeoffOptions) validate() error {
	switch {
	case math.IsNaN(o.budget) || math.IsInf(o.budget, 0) || o.budget < 0:
		return usageError{fmt.Errorf("--budget: must be a finite amount ≥ 0 (0: 75%% of the cheapest plan), got %g", o.budget)}
	case math.IsNaN(o.featureFt) || math.IsInf(o.featureFt, 0) || o.featureFt < 0:
		return usageError{fmt.Errorf("--feature-diameter: must be a finite number of feet ≥ 0 (0: the default, 20), got %g", o.featureFt)}
	case o.frontierN < 0 || o.frontierN > maxFrontierPoints:
		return usageError{fmt.Errorf("--frontier-points: must be 0 (the default) to %d, got %d", maxFrontierPoints, o.frontierN)}
	case o.budgetN < 0 || o.budgetN > maxBudgetPoints:
		return usageError{fmt.Errorf("--budget-points: must be 0 (the default) to %d, got %d", maxBudgetPoints, o.budgetN)}
	}
	return nil
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

// tradeoffCautions is the cautions that fit the alternatives: the test-pit
// caution when any alternative digs a test pit, the waste caution when the
// site has an environmental zone.
func tradeoffCautions(sc *scenarios.Scenario, an *tradeoff.Analysis) []string {
	pits, env := false, false
	for _, a := range an.Alternatives {
		pits = pits || a.PointsByMethod[string(sdk.TestPit)] > 0
	}
	for _, z := range sc.Zones {
		env = env || z.Use == scenarios.UseEnvironmental
	}
	return plan.CautionsFor(pits, env)
}
