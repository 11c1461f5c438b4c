// Package cli is rigmix's command tree: flags, configuration precedence,
// exit codes and output files. It wires the stages together and does no
// planning of its own.
package cli

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"runtime/debug"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"time"
	"unicode"

	plugin "github.com/hashicorp/go-plugin"
	"github.com/spf13/cobra"

	"github.com/rigmix/rigmix/plugins/host"
)

// Exit codes.
const (
	ExitOK       = 0
	ExitFailure  = 1 // internal failure
	ExitBadInput = 2 // bad input or usage
)

// badInput is implemented by errors the user can fix by changing input.
type badInput interface{ BadInput() bool }

// interruptedError is a run stopped by the user; it exits 1.
type interruptedError struct{ error }

// usageError marks a mistake in the command line.
type usageError struct{ error }

func (usageError) BadInput() bool { return true }

// Version is the rigmix version printed in reports.
var Version = "0.1.0-dev"

// versionLine is Version with the commit the binary was built from, when
// the build recorded it (go build in a git checkout, without
// -buildvcs=false).
func versionLine() string {
	rev, modified := "", false
	if bi, ok := debug.ReadBuildInfo(); ok {
		for _, s := range bi.Settings {
			switch s.Key {
			case "vcs.revision":
				rev = s.Value
			case "vcs.modified":
				modified = s.Value == "true"
			}
		}
	}
	if rev == "" {
		return Version + " (commit unknown: built without version-control information)"
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	if modified {
		rev += ", with uncommitted changes"
	}
	return Version + " (commit " + rev + ")"
}

// errInterrupted is the error of a run stopped by a signal before its
// outputs were put in place.
var errInterrupted = interruptedError{errors.New("interrupted; no output file was written or changed")}

// interruptGrace is how long a run may take to wind down after SIGINT or
// SIGTERM (a solve prints its best solution so far, rigs are stopped)
// before Main stops it where it is.
const interruptGrace = 3 * time.Second

// Main runs rigmix with args and returns the exit code. SIGINT and SIGTERM
// stop the run: it exits 1 with "interrupted" on stderr, writes no output
// file and leaves no rig process behind; a second signal stops it at once.
func Main(args []string, stdout, stderr io.Writer) int {
	if len(args) > 0 && args[0] == "rig-serve" {
		// A built-in rig serving its host: go-plugin's server handles
		// signals itself, and the host ends it.
		return run(context.Background(), args, stdout, stderr)
	}
	sigs := make(chan os.Signal, 2)
	signal.Notify(sigs, os.Interrupt, syscall.SIGTERM)
	defer signal.Stop(sigs)
	return mainWith(args, stdout, stderr, sigs, interruptGrace)
}

// mainWith runs the command in a goroutine so that a signal is answered
// at every stage, also one (such as loading a file) that does not watch
// the context.
func mainWith(args []string, stdout, stderr io.Writer, sigs <-chan os.Signal, grace time.Duration) int {
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	done := make(chan int, 1)
	go func() { done <- run(ctx, args, stdout, stderr) }()
	defer closeFleets()
	select {
	case code := <-done:
		return code
	case <-sigs:
	}
	cancel()
	timer := time.NewTimer(grace)
	defer timer.Stop()
	select {
	case code := <-done:
		return code
	case <-sigs:
	case <-timer.C:
	}
	// The run did not wind down in time, or a second signal came: stop
	// here, but not in the middle of putting outputs in place. A commit
	// that starts later finds the run's context ended and writes nothing.
	for i := 0; ; i++ {
		if commitMu.TryLock() {
			commitMu.Unlock()
			break
		}
		if i == 100 { // 1 s: a write to a pipe nobody reads
			break
		}
		time.Sleep(10 * time.Millisecond)
	}
	fmt.Fprintln(stderr, "rigmix: interrupted; no output file was written or changed")
	return ExitFailure
}

// run executes one command line.
func run(ctx context.Context, args []string, stdout, stderr io.Writer) int {
	root := newRoot(stdout, stderr)
	root.SetArgs(args)
	err := root.ExecuteContext(ctx)
	if err == nil {
		return ExitOK
	}
	if ctx.Err() != nil {
		// Whatever failed after the signal failed because of it.
		var ie interruptedError
		if !errors.As(err, &ie) {
			err = errInterrupted
		}
		fmt.Fprintf(stderr, "rigmix: %s\n", printable(err.Error()))
		return ExitFailure
	}
	fmt.Fprintf(stderr, "rigmix: %s\n", printable(err.Error()))
	var bi badInput
	if errors.As(err, &bi) && bi.BadInput() {
		return ExitBadInput
	}
	if isFlagError(err) {
		return ExitBadInput
	}
	return ExitFailure
}

// fleets are the rig fleets opened by this run, closed when Main returns
// however the run ended.
var (
	fleetsMu sync.Mutex
	fleets   []*host.Fleet
)

func keepFleet(f *host.Fleet) {
	fleetsMu.Lock()
	fleets = append(fleets, f)
	fleetsMu.Unlock()
}

// closeFleets stops every rig process this run started.
func closeFleets() {
	fleetsMu.Lock()
	fs := fleets
	fleets = nil
	fleetsMu.Unlock()
	for _, f := range fs {
		f.Close()
	}
	done := make(chan struct{})
	go func() {
		plugin.CleanupClients()
		close(done)
	}()
	select {
	case <-done:
	case <-time.After(2 * time.Second):
	}
}

// maxLineRunes bounds each line of a message: the loaders quote short
// excerpts, and this is the last guard against a message that carries a
// file's contents (an unusual token of a file that is not what it should
// be).
const maxLineRunes = 500

// printable escapes control characters (but line breaks and tabs) in a
// message, so that nothing quoted from a file or a plugin can drive the
// terminal, and cuts a line past maxLineRunes.
func printable(msg string) string {
	var b strings.Builder
	n := 0
	for _, r := range msg {
		if r == '\n' {
			b.WriteRune(r)
			n = 0
			continue
		}
		if n == maxLineRunes {
			b.WriteString("… (cut)")
		}
		n++
		if n > maxLineRunes {
			continue
		}
		switch {
		case r == '\t':
			b.WriteRune(r)
		case unicode.IsControl(r):
			q := strconv.QuoteRune(r)
			b.WriteString(q[1 : len(q)-1])
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}

// isFlagError recognises cobra's messages for command-line mistakes.
func isFlagError(err error) bool {
	msg := err.Error()
	for _, s := range []string{"unknown flag", "unknown shorthand flag", "unknown command", "invalid argument", "flag needs an argument", "accepts ", "requires at least", "requires exactly"} {
		if strings.Contains(msg, s) {
			return true
		}
	}
	return false
}

func newRoot(stdout, stderr io.Writer) *cobra.Command {
	g := &globalOptions{}
	root := &cobra.Command{
		Use:           "rigmix",
		Short:         "Plan geotechnical exploration programs: where to explore, with which rig, at what cost and in how many field days",
		SilenceErrors: true,
		SilenceUsage:  true,
		Version:       versionLine(),
	}
	root.SetOut(stdout)
	root.SetErr(stderr)
	root.SetFlagErrorFunc(func(c *cobra.Command, err error) error {
		fmt.Fprintln(stderr, c.UsageString())
		return usageError{err}
	})
	root.PersistentFlags().StringVar(&g.configFile, "config", "", "configuration `FILE` (YAML); default ./rigmix.yaml if present")
	root.PersistentFlags().String("plugin-dir", "", "`FOLDER` of external rig plugin executables")
	root.PersistentFlags().Float64("call-timeout", 0, "`SECONDS` a rig plugin may take to start or to answer one call (default 30)")
	g.flags = root.PersistentFlags()

	root.AddCommand(newPlanCmd(g, stdout, stderr))
	root.AddCommand(newRigsCmd(g, stdout))
	root.AddCommand(newDemosCmd(stdout))
	root.AddCommand(newSolveCmd(g, stdout, stderr))
	root.AddCommand(newScheduleCmd(g, stdout, stderr))
	root.AddCommand(newReportCmd(g, stdout, stderr))
	root.AddCommand(newTradeoffsCmd(g, stdout, stderr))
	root.AddCommand(newRigServeCmd())
	root.AddCommand(newGenSiteCmd(stdout))
	addExamples(root)
	return root
}
