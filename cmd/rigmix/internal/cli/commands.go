package cli

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"text/tabwriter"
	"time"

	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/optimizer/mip"
	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/scenarios"
	"github.com/rigmix/rigmix/scenarios/sitegen"
)

// selfCommand launches a built-in rig by re-running this program with the
// hidden rig-serve subcommand. os.Args[0] is preferred over os.Executable so
// that a program reached through a link keeps its name (test harnesses
// dispatch on it).
func selfCommand(name string) *exec.Cmd {
	self := os.Args[0]
	if !strings.ContainsRune(self, filepath.Separator) {
		if p, err := exec.LookPath(self); err == nil {
			self = p
		} else if p, err := os.Executable(); err == nil {
			self = p
		}
	}
	return exec.Command(self, "rig-serve", name)
}

func newRigServeCmd() *cobra.Command {
	return &cobra.Command{
		Use:    "rig-serve NAME",
		Short:  "serve a built-in rig over the plugin protocol (used by rigmix itself)",
		Hidden: true,
		Args:   cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			return builtin.Serve(args[0])
		},
	}
}

// rigJSON is one rig in rigs --json.
type rigJSON struct {
	Name          string          `json:"name"`
	Title         string          `json:"title"`
	Methods       []rigMethodJSON `json:"methods"`
	Surfaces      []string        `json:"surfaces"`
	MaxSlopePct   float64         `json:"max_slope_pct"`
	MinOverheadFt float64         `json:"min_overhead_ft"`
	Basis         string          `json:"basis"`
	DayItems      []rigItemJSON   `json:"day_items"`
	StandbyItem   string          `json:"standby_item,omitempty"`
	PluginFile    string          `json:"plugin_file,omitempty"` // "" for a built-in rig
}

// rigItemJSON is one per-day quantity of a rig in rigs --json.
type rigItemJSON struct {
	Item   string  `json:"item"`
	Unit   string  `json:"unit"`
	Amount float64 `json:"amount"`
	Note   string  `json:"note,omitempty"`
}

type rigMethodJSON struct {
	Method     string  `json:"method"`
	MaxDepthFt float64 `json:"max_depth_ft"`
}

func newRigsCmd(g *globalOptions, stdout io.Writer) *cobra.Command {
	var asJSON bool
	c := &cobra.Command{
		Use:   "rigs",
		Short: "List every rig that can be offered: built-in ones and plugins in the plugin folder",
		Args:  cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			fleet, err := openFleet(cmd.Context(), cfg, nil, nil)
			if err != nil {
				return err
			}
			defer fleet.Close()
			var b bytes.Buffer
			if asJSON {
				list := []rigJSON{}
				for _, r := range fleet.Rigs() {
					in := r.Info
					j := rigJSON{Name: in.Name, Title: in.Title, Methods: []rigMethodJSON{}, Surfaces: []string{},
						MaxSlopePct: in.Access.MaxSlopePct, MinOverheadFt: in.Access.MinOverheadFt, Basis: in.Basis,
						DayItems: []rigItemJSON{}, StandbyItem: in.StandbyItem, PluginFile: r.Path}
					for _, q := range in.DayItems {
						j.DayItems = append(j.DayItems, rigItemJSON{q.Item, q.Unit, q.Amount, q.Note})
					}
					for _, m := range in.Methods {
						j.Methods = append(j.Methods, rigMethodJSON{string(m.Method), m.MaxDepthFt})
					}
					for _, s := range in.Access.Surfaces {
						j.Surfaces = append(j.Surfaces, string(s))
					}
					list = append(list, j)
				}
				out, err := json.MarshalIndent(list, "", "  ")
				if err != nil {
					return err
				}
				_, err = stdout.Write(append(out, '\n'))
				return err
			}
			tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
			fmt.Fprintln(tw, "rig\tdescription\tmethods (deepest)\tground\tmax slope\tneeds overhead")
			for _, r := range fleet.Rigs() {
				in := r.Info
				var ms []string
				for _, m := range in.Methods {
					ms = append(ms, fmt.Sprintf("%s (%g ft)", m.Method, m.MaxDepthFt))
				}
				var gs []string
				for _, s := range in.Access.Surfaces {
					gs = append(gs, string(s))
				}
				oh := "-"
				if in.Access.MinOverheadFt > 0 {
					oh = fmt.Sprintf("%g ft", in.Access.MinOverheadFt)
				}
				fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%g%%\t%s\n", in.Name, in.Title, strings.Join(ms, ", "), strings.Join(gs, ", "), in.Access.MaxSlopePct, oh)
			}
			tw.Flush()
			// Where each rig's numbers come from, and what it charges per
			// field day and per hour of standby, with the rig's own notes.
			fmt.Fprintln(&b)
			fmt.Fprintln(&b, "Basis and per-day items")
			for _, r := range fleet.Rigs() {
				in := r.Info
				basis := in.Basis
				if basis == "" {
					basis = "(the rig gives no basis)"
				}
				fmt.Fprintf(&b, "  %s: %s\n", in.Name, basis)
				if r.Path != "" {
					fmt.Fprintf(&b, "    plugin file: %s\n", r.Path)
				}
				for _, q := range in.DayItems {
					line := fmt.Sprintf("    per field day: %s %g %s", q.Item, q.Amount, q.Unit)
					if q.Note != "" {
						line += " — " + q.Note
					}
					fmt.Fprintln(&b, line)
				}
				if in.StandbyItem != "" {
					fmt.Fprintf(&b, "    standby: %s per hour idle on wet ground\n", in.StandbyItem)
				}
			}
			_, err = stdout.Write(b.Bytes())
			return err
		},
	}
	c.Flags().BoolVar(&asJSON, "json", false, "print the rigs as JSON")
	return c
}

// demoJSON is one demo scenario in demos --json.
type demoJSON struct {
	Name  string   `json:"name"`
	Title string   `json:"title"`
	Zones int      `json:"zones"`
	Rigs  []string `json:"rigs"`
	// Invented says the demo's site and numbers are invented data.
	Invented bool `json:"invented"`
}

func newDemosCmd(stdout io.Writer) *cobra.Command {
	var asJSON bool
	var outDir string
	c := &cobra.Command{
		Use:   "demos [NAME]",
		Short: "List the embedded demo scenarios, or print one as YAML to start your own from",
		Args:  cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if outDir != "" && len(args) == 0 {
				return usageError{fmt.Errorf("--out %s: name the demo to write out (rigmix demos NAME --out %s); list them with: rigmix demos", outDir, outDir)}
			}
			if len(args) == 1 {
				if asJSON {
					return usageError{fmt.Errorf("--json lists the demos; a demo itself prints as YAML (rigmix demos %s)", args[0])}
				}
				if outDir != "" {
					return writeDemo(cmd.Context(), args[0], outDir, stdout)
				}
				b, err := scenarios.DemoFile(args[0])
				if err != nil {
					return usageError{err}
				}
				_, err = stdout.Write(b)
				return err
			}
			var b bytes.Buffer
			list := []demoJSON{}
			tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
			fmt.Fprintln(tw, "demo\ttitle\tzones\trigs offered")
			for _, n := range scenarios.Demos() {
				sc, err := scenarios.LoadDemo(n, nil)
				if err != nil {
					return err
				}
				list = append(list, demoJSON{n, sc.Title, len(sc.Zones), sc.Rigs, sc.Demo})
				fmt.Fprintf(tw, "%s\t%s\t%d\t%s\n", n, sc.Title, len(sc.Zones), strings.Join(sc.Rigs, ", "))
			}
			if asJSON {
				out, err := json.MarshalIndent(list, "", "  ")
				if err != nil {
					return err
				}
				_, err = stdout.Write(append(out, '\n'))
				return err
			}
			tw.Flush()
			b.WriteString("\nAll demo scenarios and rate books are invented data.\n")
			_, err := stdout.Write(b.Bytes())
			return err
		},
	}
	c.Flags().BoolVar(&asJSON, "json", false, "list the demos as JSON (all are invented data)")
	c.Flags().StringVar(&outDir, "out", "", "write the demo's YAML and every file it reads (GeoJSON) into `FOLDER` (created if missing)")
	return c
}

// writeDemo writes a demo whole into dir: its YAML and the files it reads,
// all or none, never over an existing file (it may be the user's edited
// copy).
func writeDemo(ctx context.Context, name, dir string, stdout io.Writer) error {
	files, err := scenarios.DemoFiles(name)
	if err != nil {
		return usageError{err}
	}
	if st, err := os.Stat(dir); err == nil && !st.IsDir() {
		return usageError{fmt.Errorf("--out %s: is a file, not a folder; give a folder to write the demo into", dir)}
	}
	outs := &outputs{stdout: stdout}
	for _, f := range files {
		p := filepath.Join(dir, filepath.FromSlash(f.Name))
		if _, err := os.Lstat(p); err == nil {
			return usageError{fmt.Errorf("--out %s: %s is already there; remove it or give another folder (a demo is never written over a file)", dir, p)}
		}
		outs.add("--out", p).setData(f.Data)
	}
	for _, f := range files {
		if err := os.MkdirAll(filepath.Dir(filepath.Join(dir, filepath.FromSlash(f.Name))), 0o755); err != nil {
			return usageError{fmt.Errorf("--out %s: cannot create the folder: %v", dir, unwrapPathErr(err))}
		}
	}
	if err := outs.check(nil); err != nil {
		return err
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, "wrote demo %s (invented data) into %s:", name, dir)
	for _, f := range files {
		fmt.Fprintf(&b, " %s", f.Name)
	}
	fmt.Fprintf(&b, "\nplan it with: rigmix plan %s\n", filepath.Join(dir, files[0].Name))
	outs.summary = b.Bytes()
	return outs.commit(ctx)
}

type solveOptions struct {
	asJSON    bool
	workLimit int
}

func newSolveCmd(g *globalOptions, stdout, stderr io.Writer) *cobra.Command {
	o := &solveOptions{}
	c := &cobra.Command{
		Use:   "solve MODEL.mps",
		Short: "Solve any mixed-integer model in free MPS form with rigmix's engine (for cross-checks)",
		Long:  solveLong,
		Args:  cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			cfg, err := g.load(cmd.Flags())
			if err != nil {
				return err
			}
			f, err := openRegular(args[0], maxModelBytes)
			if err != nil {
				return err
			}
			defer f.Close()
			p, err := mip.ReadMPS(f)
			if err != nil {
				return usageError{fmt.Errorf("%s: %v", args[0], err)}
			}
			if o.workLimit < 0 {
				return usageError{fmt.Errorf("--work-limit: must be ≥ 0 simplex iterations, got %d", o.workLimit)}
			}
			opt := mip.Options{GapRel: cfg.Gap, Threads: cfg.Threads, WorkLimit: o.workLimit}
			if cfg.TimeLimit > 0 {
				opt.TimeLimit = time.Duration(cfg.TimeLimit * float64(time.Second))
			}
			if !o.asJSON && isTerminal(stderr) {
				opt.Progress = senseProgress(p, progressPrinter(stderr))
			}
			res, err := mip.Solve(cmd.Context(), p, opt)
			if opt.Progress != nil {
				fmt.Fprintln(stderr)
			}
			if err != nil {
				return err
			}
			sum := summarize(p, res)
			if o.asJSON {
				if err := sum.writeJSON(stdout); err != nil {
					return err
				}
				return solveInterrupted(cmd.Context())
			}
			if err := sum.writeText(stdout); err != nil {
				return err
			}
			return solveInterrupted(cmd.Context())
		},
	}
	c.Flags().BoolVar(&o.asJSON, "json", false, "print the result as JSON")
	c.Flags().IntVar(&o.workLimit, "work-limit", 0, "stop after this many simplex iterations (deterministic: the same result on every run; 0: none)")
	c.Flags().Float64("gap", 0, "relative optimality gap to stop at")
	c.Flags().Float64("time-limit", 0, "seconds")
	c.Flags().Int("threads", 1, "solver threads (1 or 2)")
	return c
}

// solveInterrupted: after SIGINT or SIGTERM, solve prints the best
// solution found so far, then exits 1.
func solveInterrupted(ctx context.Context) error {
	if ctx.Err() != nil {
		return interruptedError{errors.New("interrupted; the best solution so far is printed above")}
	}
	return nil
}

// maxModelBytes bounds the MPS file solve reads.
const maxModelBytes = 1 << 30

// openRegular opens an input that must be a regular file of at most
// maxBytes, checking before it opens (opening a pipe waits for a writer);
// the file read is limited to maxBytes+1.
func openRegular(path string, maxBytes int64) (io.ReadCloser, error) {
	bad := func(what string) error { return usageError{fmt.Errorf("%s: %s", path, what)} }
	st, err := os.Stat(path)
	if err != nil {
		return nil, bad(unwrapPathErr(err).Error())
	}
	if !st.Mode().IsRegular() {
		return nil, bad("not a regular file; give a file")
	}
	if st.Size() > maxBytes {
		return nil, bad(fmt.Sprintf("is larger than %d MB", maxBytes>>20))
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, bad(unwrapPathErr(err).Error())
	}
	if fst, err := f.Stat(); err != nil || !os.SameFile(st, fst) {
		f.Close()
		return nil, bad("changed while it was opened")
	}
	return struct {
		io.Reader
		io.Closer
	}{io.LimitReader(f, maxBytes+1), f}, nil
}

// Caps on gen-site's sizes: the largest scale runs are 1,000 acres and a
// 20-mile corridor.
const (
	maxGenAcres = 10_000
	maxGenMiles = 200
)

func newGenSiteCmd(stdout io.Writer) *cobra.Command {
	var acres, miles float64
	var seed uint64
	c := &cobra.Command{
		Use:    "gen-site",
		Short:  "write an invented scenario of a given size for scale tests (developer command)",
		Hidden: true,
		Args:   cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			switch {
			case acres > 0 && miles > 0, !(acres > 0) && !(miles > 0):
				return usageError{fmt.Errorf("give one of --acres or --miles, a positive number")}
			case acres > maxGenAcres:
				return usageError{fmt.Errorf("--acres: at most %d, got %g", maxGenAcres, acres)}
			case miles > maxGenMiles:
				return usageError{fmt.Errorf("--miles: at most %d, got %g", maxGenMiles, miles)}
			case acres > 0:
				_, err := stdout.Write(sitegen.Site(acres, seed))
				return err
			default:
				_, err := stdout.Write(sitegen.Corridor(miles, seed))
				return err
			}
		},
	}
	c.Flags().Float64Var(&acres, "acres", 0, "area of a square site")
	c.Flags().Float64Var(&miles, "miles", 0, "length of a corridor")
	c.Flags().Uint64Var(&seed, "seed", 1, "seed")
	return c
}
