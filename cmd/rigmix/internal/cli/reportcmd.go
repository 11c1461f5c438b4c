package cli

import (
	"bytes"
	"context"
	"fmt"
	"io"
	"time"

	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/internal/money"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/report"
	"github.com/rigmix/rigmix/optimizer/schedule"
)

type reportOptions struct {
	demo        string
	out         string
	sched       scheduleOptions
	tradeoffs   bool
	runDate     string
	quiet       bool
	estimateCSV string
	csvBOM      bool
	jsonOut     string
}

func newReportCmd(g *globalOptions, stdout, stderr io.Writer) *cobra.Command {
	o := &reportOptions{}
	c := &cobra.Command{
		Use:   "report [SCENARIO.yaml] --out REPORT.html",
		Short: "Write one self-contained HTML report of the program for a bid: map, estimate, rules, alternatives, schedule, cautions",
		Args:  cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			if o.out == "" {
				return usageError{fmt.Errorf("--out: give the HTML file to write, e.g. --out report.html")}
			}
			return runReport(cmd.Context(), cfg, o, args, stdout, stderr)
		},
	}
	f := c.Flags()
	f.StringVar(&o.demo, "demo", "", "report on the embedded demo scenario `NAME`")
	f.StringVar(&o.jsonOut, "json", "", "also write the summary line (points, total, days, dates) as JSON to `FILE` (- for standard output)")
	f.StringVar(&o.out, "out", "", "the HTML `FILE` to write (- for standard output)")
	f.String("rate-book", "", "price with this rate `BOOK` (demo name or file)")
	f.Float64("gap", 0, "optimality `GAP` of the plan")
	f.Float64("time-limit", 0, "`SECONDS` for the plan's solve")
	f.BoolVar(&o.tradeoffs, "tradeoffs", true, "include the alternatives table, the cost–days frontier and the budget–coverage curve")
	f.StringVar(&o.estimateCSV, "estimate-csv", "", "write the itemized estimate as CSV to `FILE` (- for standard output)")
	f.BoolVar(&o.csvBOM, "csv-bom", false, "begin every CSV file written with a UTF-8 byte-order mark (for spreadsheets)")
	f.BoolVar(&o.quiet, "quiet", false, "print nothing but errors")
	f.StringVar(&o.runDate, "run-date", "", "`DATE` shown as the date of the run (default: today)")
	o.sched.addCalendarFlags(f)
	return c
}

func runReport(ctx context.Context, cfg Config, o *reportOptions, args []string, stdout, stderr io.Writer) error {
	if err := o.sched.validate(); err != nil {
		return err
	}
	prog := startProgress(stderr, "report", !o.quiet && isTerminal(stderr), time.Second)
	defer prog.end()
	prog.set("loading")
	sc, rb, inputs, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	outs := &outputs{stdout: stdout, bom: o.csvBOM}
	out := outs.add("--out", o.out)
	jsonF := outs.add("--json", o.jsonOut)
	estF := outs.add("--estimate-csv", o.estimateCSV)
	if err := outs.check(inputs); err != nil {
		return err
	}
	now := time.Now()
	cal, err := o.sched.calendar(sc.HoursDay, now)
	if err != nil {
		return err
	}
	prog.set("starting the rigs")
	fleet, rigs, err := startRigs(ctx, cfg, sc, stderr)
	if err != nil {
		return err
	}
	defer fleet.Close()
	prog.set("planning")
	in := plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}
	popt := plan.Options{GapRel: cfg.Gap, TimeLimit: cfg.TimeLimit, Threads: cfg.Threads}
	pr, err := plan.Prepare(ctx, in, popt)
	if err != nil {
		return err
	}
	res, err := pr.Solve(ctx, popt)
	if err != nil {
		return err
	}
	if ctx.Err() != nil {
		return errInterrupted
	}
	p, err := pr.Assemble(res)
	if err != nil {
		return err
	}
	prog.set("scheduling")
	s, risk, err := o.sched.build(ctx, p, sc, rb, rigs, cal)
	if err != nil {
		return err
	}
	var gantt, riskText bytes.Buffer
	if err := schedule.WriteGanttSVG(&gantt, s); err != nil {
		return err
	}
	if err := schedule.WriteRiskText(&riskText, risk); err != nil {
		return err
	}
	hin := report.HTMLInput{
		Plan: p, Scenario: sc, Version: Version, RunDate: o.runDate,
		GanttSVG: gantt.Bytes(), Schedule: s, RiskText: riskText.String(),
	}
	if hin.RunDate == "" {
		hin.RunDate = now.Format("2006-01-02")
	}
	if o.tradeoffs {
		prog.set("trade-offs")
		if err := addTradeoffs(ctx, &hin, pr, in, popt); err != nil {
			return err
		}
	}
	if ctx.Err() != nil {
		// The trade-offs stop early on a signal with what they have.
		return errInterrupted
	}
	var b bytes.Buffer
	if err := report.HTML(&b, hin); err != nil {
		return err
	}
	out.setData(b.Bytes())
	if jsonF != nil {
		j, err := reportSummary(o.out, p, sc, s)
		if err != nil {
			return err
		}
		jsonF.setData(j)
	}
	if estF != nil {
		var e bytes.Buffer
		if err := report.EstimateCSV(&e, p); err != nil {
			return err
		}
		estF.setData(e.Bytes())
	}
	prog.end()
	status := fmt.Sprintf("wrote %s: %d points, %s, %d field days in the plan; schedule %s to %s\n",
		o.out, len(p.Points), money.WithCurrency(p.Total, p.RateBook.Currency), p.Finish, s.Start.Format("2006-01-02"), s.Finish.Format("2006-01-02"))
	if o.quiet {
		return outs.commit(ctx)
	}
	if outs.toStdout() || !out.regular() {
		// The report itself goes to standard output (or a device): the
		// status line must not follow </html> there.
		if err := outs.commit(ctx); err != nil {
			return err
		}
		_, err := io.WriteString(stderr, status)
		return err
	}
	outs.summary = []byte(status)
	return outs.commit(ctx)
}
