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
	"strings"

	plugin "github.com/hashicorp/go-plugin"
	"github.com/spf13/cobra"
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

// Main runs rigmix with args and returns the exit code.
func Main(args []string, stdout, stderr io.Writer) int {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	go func() {
		// After the first Ctrl-C the run winds down; a second one ends
		// the program at once (rig processes die with it).
		<-ctx.Done()
		stop()
	}()
	defer plugin.CleanupClients()

	root := newRoot(stdout, stderr)
	root.SetArgs(args)
	err := root.ExecuteContext(ctx)
	if err == nil {
		return ExitOK
	}
	fmt.Fprintf(stderr, "rigmix: %v\n", err)
	var bi badInput
	if errors.As(err, &bi) && bi.BadInput() {
		return ExitBadInput
	}
	if isFlagError(err) {
		return ExitBadInput
	}
	if ctx.Err() != nil {
		return ExitFailure
	}
	return ExitFailure
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
		Version:       Version,
	}
	root.SetOut(stdout)
	root.SetErr(stderr)
	root.SetFlagErrorFunc(func(c *cobra.Command, err error) error {
		fmt.Fprintln(stderr, c.UsageString())
		return usageError{err}
	})
	root.PersistentFlags().StringVar(&g.configFile, "config", "", "configuration file (YAML); default ./rigmix.yaml if present")
	root.PersistentFlags().String("plugin-dir", "", "folder of external rig plugin executables")
	root.PersistentFlags().Float64("call-timeout", 0, "seconds a rig plugin may take to answer one call")
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
	return root
}
