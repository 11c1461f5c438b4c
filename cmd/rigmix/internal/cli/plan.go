package cli

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"time"

	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/report"
	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/host"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/fielderr"
)

type planOptions struct {
	demo        string
	jsonOut     string
	csvOut      string
	geojsonOut  string
	mpsOut      string
	quiet       bool
	estimateCSV string
	csvBOM      bool
	timings     bool
}

func newPlanCmd(g *globalOptions, stdout, stderr io.Writer) *cobra.Command {
	o := &planOptions{}
	c := &cobra.Command{
		Use:   "plan [SCENARIO.yaml]",
		Short: "Choose, price and count the days of the exploration program for a scenario (default: the embedded demo)",
		Long: "plan lays candidate points in every zone, asks each rig offered what it can do there, and chooses the\n" +
			"points, methods and rigs that meet every rule at least cost (fewest field days among equals).\n" +
			"With no SCENARIO it plans the embedded demo scenario " + scenarios.DefaultDemo + ".",
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			return runPlan(cmd.Context(), cfg, o, args, stdout, stderr)
		},
	}
	f := c.Flags()
	f.StringVar(&o.demo, "demo", "", "plan the embedded demo scenario `NAME` (list them with: rigmix demos)")
	f.String("rate-book", "", "price with this rate `BOOK` (demo name or file) instead of the scenario's")
	f.Float64("gap", 0, "stop when the plan is proven within this relative `GAP` of the optimum (e.g. 0.01)")
	f.Float64("time-limit", 0, "stop the solve after this many `SECONDS` with the best plan so far")
	f.Int("threads", 1, "solver threads, `N` = 1 or 2")
	f.StringVar(&o.jsonOut, "json", "", "write the plan as JSON to `FILE` (- for standard output)")
	f.StringVar(&o.csvOut, "points-csv", "", "write the points as CSV to `FILE` (- for standard output)")
	f.StringVar(&o.geojsonOut, "points-geojson", "", "write the points as GeoJSON (RFC 7946) to `FILE` (- for standard output)")
	f.StringVar(&o.mpsOut, "model-mps", "", "write the optimization model as free MPS to `FILE` (- for standard output)")
	f.StringVar(&o.estimateCSV, "estimate-csv", "", "write the itemized estimate as CSV to `FILE` (- for standard output)")
	f.BoolVar(&o.csvBOM, "csv-bom", false, "begin every CSV file written with a UTF-8 byte-order mark (for spreadsheets)")
	f.BoolVar(&o.quiet, "quiet", false, "print nothing but errors")
	f.BoolVar(&o.timings, "timings", false, "print how long each stage took to stderr")
	return c
}

// stdinPath names standard input as the scenario.
const stdinPath = "-"

// maxStdinBytes bounds a scenario read from standard input, as the loader
// bounds a scenario file.
const maxStdinBytes = 8 << 20

// loadInputs reads the scenario and its rate book, and lists every file
// read (the configuration file too), so that no output replaces one.
func loadInputs(cfg Config, demo string, args []string) (*scenarios.Scenario, *ratebooks.RateBook, []string, error) {
	var sc *scenarios.Scenario
	var err error
	inputs := []string{cfg.File}
	switch {
	case len(args) == 1 && demo != "":
		return nil, nil, nil, usageError{fmt.Errorf("give either a scenario file or --demo, not both")}
	case len(args) == 1 && args[0] == stdinPath:
		// "-": the scenario from standard input; its relative paths
		// (GeoJSON, a rate-book file) resolve against the working folder.
		data, rerr := io.ReadAll(io.LimitReader(os.Stdin, maxStdinBytes+1))
		switch {
		case rerr != nil:
			return nil, nil, nil, usageError{fmt.Errorf("standard input: cannot read: %v", rerr)}
		case len(data) > maxStdinBytes:
			return nil, nil, nil, usageError{fmt.Errorf("standard input: larger than %d MB; a scenario is at most that", maxStdinBytes>>20)}
		}
		sc, err = scenarios.Parse(data, "stdin", nil)
	case len(args) == 1:
		sc, err = scenarios.Load(args[0], nil)
		inputs = append(inputs, args[0])
	default:
		if demo == "" {
			demo = scenarios.DefaultDemo
		}
		sc, err = scenarios.LoadDemo(demo, nil)
	}
	if err != nil {
		return nil, nil, nil, err
	}
	inputs = append(inputs, sc.Files...)
	// The scenario's rate_book is already resolved against its folder.
	name := sc.RateBook
	var own *ratebooks.RateBook
	if cfg.RateBook != "" {
		if own, err = loadRateBook(name, ""); err != nil {
			return nil, nil, nil, err
		}
		name = cfg.RateBook
	}
	rb, err := loadRateBook(name, "")
	if err != nil {
		if own != nil {
			// Name the flag, variable or file that gave the rate book.
			return nil, nil, nil, usageError{fmt.Errorf("%s: %w", cfg.RateBookFrom, err)}
		}
		return nil, nil, nil, err
	}
	if !isDemoRateBook(name) {
		inputs = append(inputs, name)
	}
	if own != nil && own.Currency != rb.Currency {
		return nil, nil, nil, usageError{fmt.Errorf("%s: rate_book: %s prices in %s, but --rate-book %s prices in %s; compare plans in one currency", sc.Source, own.Name, own.Currency, rb.Name, rb.Currency)}
	}
	return sc, rb, inputs, nil
}

func isDemoRateBook(name string) bool {
	for _, d := range ratebooks.Demos() {
		if d == name {
			return true
		}
	}
	return false
}

// loadRateBook takes a demo name, or a file path relative to base.
func loadRateBook(name, base string) (*ratebooks.RateBook, error) {
	if isDemoRateBook(name) {
		return ratebooks.LoadDemo(name)
	}
	p := name
	if !filepath.IsAbs(p) && base != "" {
		p = filepath.Join(base, p)
	}
	return ratebooks.Load(p)
}

// openFleet launches the rigs a scenario offers: built-ins by re-running
// this binary, the rest from the plugin folder. want nil asks for every
// rig (the rigs command), each of which must start; otherwise a plugin
// file that fails but serves no wanted rig is skipped with a warning on
// stderr (host.Options.Want).
func openFleet(ctx context.Context, cfg Config, want []string, stderr io.Writer) (*host.Fleet, error) {
	isBuiltin := map[string]bool{}
	for _, n := range builtin.Names() {
		isBuiltin[n] = true
	}
	bs := builtin.Names()
	if want != nil {
		bs = nil
		for _, n := range want {
			if isBuiltin[n] {
				bs = append(bs, n)
			}
		}
	}
	fleet, err := host.Open(ctx, host.Options{
		Builtins:    bs,
		PluginDir:   cfg.PluginDir,
		Pins:        cfg.PluginPins,
		CallTimeout: time.Duration(cfg.CallTimeout * float64(time.Second)),
		SelfCommand: selfCommand,
		Want:        want,
	})
	if err != nil {
		return nil, err
	}
	keepFleet(fleet)
	if stderr != nil {
		for _, e := range fleet.Skipped() {
			fmt.Fprintf(stderr, "warning: %v (skipped: the scenario does not need it)\n", e)
		}
	}
	return fleet, nil
}

// startRigs launches the scenario's rigs, checks every offered rig is
// there, and returns them by name.
func startRigs(ctx context.Context, cfg Config, sc *scenarios.Scenario, stderr io.Writer) (*host.Fleet, map[string]sdk.Rig, error) {
	fleet, err := openFleet(ctx, cfg, append([]string{}, sc.Rigs...), stderr)
	if err != nil {
		return nil, nil, err
	}
	if err := checkRigsOffered(sc, fleet, cfg); err != nil {
		fleet.Close()
		return nil, nil, err
	}
	if err := checkMethodsOffered(ctx, sc, fleet); err != nil {
		fleet.Close()
		return nil, nil, err
	}
	rigs := map[string]sdk.Rig{}
	for _, r := range fleet.Rigs() {
		rigs[r.Info.Name] = r
	}
	return fleet, rigs, nil
}

// checkMethodsOffered refuses, in one line naming the field, a method a
// zone allows that no offered rig performs (probe with only drill rigs
// offered, say), and names the built-in rigs that could; none doing it,
// it says a plugin rig would have to.
func checkMethodsOffered(ctx context.Context, sc *scenarios.Scenario, fleet *host.Fleet) error {
	offered := map[sdk.Method][]string{}
	var names []string
	for _, r := range fleet.Rigs() {
		names = append(names, r.Info.Name)
		for _, m := range r.Info.Methods {
			offered[m.Method] = append(offered[m.Method], r.Info.Name)
		}
	}
	for z, zn := range sc.Zones {
		for j, m := range zn.Rules.Methods {
			if len(offered[m]) > 0 {
				continue
			}
			var could []string
			for _, n := range builtin.Names() {
				r, err := builtin.New(n)
				if err != nil {
					return err
				}
				info, err := r.Describe(ctx)
				if err != nil {
					return err
				}
				for _, ml := range info.Methods {
					if ml.Method == m {
						could = append(could, n)
					}
				}
			}
			fix := "no built-in rig performs it: offer a plugin rig that does (--plugin-dir), or remove it from the zone's methods"
			if len(could) > 0 {
				fix = "built-in rigs that could: " + strings.Join(could, ", ") + "; add one to rigs, or remove it from the zone's methods"
			}
			return usageError{fmt.Errorf("%s: zones[%d].rules.methods[%d]: zone %q allows %s, but no offered rig performs it (offered: %s); %s",
				sc.Source, z, j, zn.ID, m, strings.Join(names, ", "), fix)}
		}
	}
	return nil
}

// checkRigsOffered names, by its field path, a rig the scenario offers that
// neither a built-in nor a plugin in the plugin folder provides, with the
// nearest name and where plugin rigs come from.
func checkRigsOffered(sc *scenarios.Scenario, fleet *host.Fleet, cfg Config) error {
	have := map[string]bool{}
	var names []string
	for _, r := range fleet.Rigs() {
		have[r.Info.Name] = true
		names = append(names, r.Info.Name)
	}
	for _, n := range builtin.Names() {
		if !have[n] {
			names = append(names, n)
		}
	}
	for i, n := range sc.Rigs {
		if have[n] {
			continue
		}
		hint := ""
		if near := fielderr.Nearest(n, names); near != "" {
			hint = fmt.Sprintf("did you mean %s? ", near)
		}
		where := "no plugin folder is set (--plugin-dir or plugin_dir)"
		if cfg.PluginDir != "" {
			where = "the plugin folder " + cfg.PluginDir + " has no rig of that name"
		}
		return usageError{fmt.Errorf("%s: rigs[%d]: rig %q is not available; %sbuilt-in rigs are %s, and a plugin rig needs its executable in the plugin folder: %s",
			sc.Source, i, n, hint, strings.Join(builtin.Names(), ", "), where)}
	}
	return nil
}

func runPlan(ctx context.Context, cfg Config, o *planOptions, args []string, stdout, stderr io.Writer) error {
	t0 := time.Now()
	// Stages before the solve; the solve shows its own progress line.
	prog := startProgress(stderr, "plan", !o.quiet && isTerminal(stderr), time.Second)
	defer prog.end()
	prog.set("loading")
	sc, rb, inputs, err := loadInputs(cfg, o.demo, args)
	if err != nil {
		return err
	}
	outs := &outputs{stdout: stdout, bom: o.csvBOM}
	jsonF := outs.add("--json", o.jsonOut)
	csvF := outs.add("--points-csv", o.csvOut)
	geoF := outs.add("--points-geojson", o.geojsonOut)
	mpsF := outs.add("--model-mps", o.mpsOut)
	estF := outs.add("--estimate-csv", o.estimateCSV)
	if err := outs.check(inputs); err != nil {
		return err
	}
	tLoad := time.Since(t0)
	t0 = time.Now()
	prog.set("starting the rigs")
	fleet, rigs, err := startRigs(ctx, cfg, sc, stderr)
	if err != nil {
		return err
	}
	defer fleet.Close()
	tLaunch := time.Since(t0)
	in := plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}
	popt := plan.Options{GapRel: cfg.Gap, TimeLimit: cfg.TimeLimit, Threads: cfg.Threads}
	if !o.quiet && isTerminal(stderr) {
		popt.Progress = progressPrinter(stderr)
	}
	prog.set("candidates, rig calls and the model")
	pr, err := plan.Prepare(ctx, in, popt)
	prog.end()
	if err != nil {
		return err
	}
	if mpsF != nil {
		// The model is complete before the solve, so it is written even if
		// the solve then fails: that is when a cross-check is wanted most.
		var b bytes.Buffer
		if err := mip.WriteMPS(&b, pr.Model.Problem); err != nil {
			return err
		}
		mpsF.setData(b.Bytes())
		if err := outs.commit(ctx); err != nil {
			return err
		}
		mpsF.set = false
	}
	res, err := pr.Solve(ctx, popt)
	if popt.Progress != nil {
		fmt.Fprintln(stderr)
	}
	if err != nil {
		return err
	}
	if res.Status == mip.Interrupted && ctx.Err() != nil {
		// Ctrl-C: keep the previous files; the run did not finish.
		if math.IsInf(res.Gap, 0) || math.IsNaN(res.Gap) {
			return interruptedError{errors.New("interrupted before a plan was found; earlier output files are unchanged")}
		}
		return interruptedError{fmt.Errorf("interrupted; the best plan so far (within %.2f%% of optimal) was not written, and earlier output files are unchanged", 100*res.Gap)}
	}
	t0 = time.Now()
	p, err := pr.Assemble(res)
	if err != nil {
		return err
	}
	if o.timings {
		fmt.Fprintf(stderr, "stage timings (wall):\n  %-32s %s\n  %-32s %s\n", "load scenario and rate book", tLoad.Round(time.Millisecond), "launch rig plugins", tLaunch.Round(time.Millisecond))
		for _, tm := range pr.Timings {
			fmt.Fprintf(stderr, "  %-32s %s\n", tm.Stage, tm.Took.Round(time.Millisecond))
		}
		fmt.Fprintf(stderr, "  %-32s %s\n", "assemble plan", time.Since(t0).Round(time.Millisecond))
		fmt.Fprintf(stderr, "  model %d rows × %d columns, after presolve %d × %d (presolve %s); solver %s, gap %.3f%%, %d nodes\n",
			pr.Model.Problem.LP.NumRows, pr.Model.Problem.LP.NumCols, res.PresolvedRows, res.PresolvedCols, res.PresolveTime.Round(time.Millisecond), res.Status, 100*res.Gap, res.Nodes)
	}
	for _, w := range []struct {
		out    *output
		render func(io.Writer, *plan.Plan) error
	}{{jsonF, report.JSON}, {csvF, report.PointsCSV}, {geoF, report.GeoJSON}, {estF, report.EstimateCSV}} {
		if w.out == nil {
			continue
		}
		var b bytes.Buffer
		if err := w.render(&b, p); err != nil {
			return usageError{err}
		}
		w.out.setData(b.Bytes())
	}
	if !o.quiet && !outs.toStdout() {
		var b bytes.Buffer
		if err := report.Text(&b, p); err != nil {
			return err
		}
		outs.summary = b.Bytes()
	}
	return outs.commit(ctx)
}

// progressPrinter shows incumbent, bound and gap on one terminal line.
func progressPrinter(w io.Writer) func(mip.Progress) {
	return func(p mip.Progress) {
		fmt.Fprintf(w, "\r  solving: best %.2f  bound %.2f  gap %6.3f%%  nodes %d  %s   ", p.Incumbent, p.Bound, 100*p.Gap, p.Nodes, p.Elapsed.Round(time.Millisecond))
	}
}

func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}
