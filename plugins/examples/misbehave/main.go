// Command misbehave is a rig plugin that breaks the rig contract on
// purpose, for the host's tests: it is built once and copied into a plugin
// folder under the name of the misbehaviour wanted, and that file name is
// also the rig name it gives. It is never a rig to plan with.
//
//	crash-in-assess     exits (status 3) in the middle of Assess
//	panic-in-assess     panics in Assess, which ends the plugin process
//	hang-in-assess      sleeps forever in Assess, ignoring the caller's deadline
//	hang-in-describe    sleeps forever in Describe
//	hang-at-start       sleeps before the handshake
//	exit-at-start       writes a message to stderr and exits 1 before the handshake
//	other-protocol      speaks protocol version 99 of the rig handshake
//	noise-on-stdout     prints a banner on stdout before the handshake
//	noise-in-assess     prints on stdout and stderr during Assess, then answers well
//	negative-hours      answers with a negative setup time
//	nan-quantity        answers with a quantity of NaN feet
//	inf-hours           answers with +Inf advance hours
//	too-few-answers     answers one site fewer than asked
//	wrong-order         answers the sites in reverse order
//	no-reason           says a site is infeasible without saying why
//	nan-mobilize        answers mobilization with NaN hours
//	short-moves         answers one leg fewer than asked
//	bad-name            describes itself as "Bad Name!"
//	no-methods          describes itself with no methods
//	error-in-assess     returns an error from Assess
//	grandchild          starts a long-lived child process of its own, then answers well
//	child-holds-stdio   starts a long-lived child that keeps this plugin's stdout and stderr open, then answers well
//	child-then-hang     starts such a child, then sleeps before the handshake
//
// Any other file name serves a well-behaved rig.
package main

import (
	"context"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"time"

	"github.com/hashicorp/go-plugin"

	"github.com/rigmix/rigmix/plugins/sdk"
)

func main() {
	mode := filepath.Base(os.Args[0])
	switch mode {
	case "hang-at-start":
		time.Sleep(time.Hour)
	case "exit-at-start":
		fmt.Fprintln(os.Stderr, "misbehave: cannot find my configuration; giving up")
		os.Exit(1)
	case "noise-on-stdout":
		fmt.Println("misbehave rig 0.1 — starting up")
	case "other-protocol":
		hc := sdk.HandshakeConfig
		hc.ProtocolVersion = 99
		plugin.Serve(&plugin.ServeConfig{
			HandshakeConfig: hc,
			Plugins:         map[string]plugin.Plugin{sdk.PluginName: &sdk.RigPlugin{Impl: rig{mode}}},
			GRPCServer:      sdk.GRPCServer,
		})
		return
	case "child-holds-stdio", "child-then-hang":
		// The helper inherits stdout and stderr: the host's readers of
		// this plugin's output see no end of file until it dies too.
		cmd := exec.Command("sleep", "3600")
		cmd.Stdout, cmd.Stderr = os.Stdout, os.Stderr
		if err := cmd.Start(); err == nil {
			fmt.Fprintf(os.Stderr, "misbehave: started helper process %d\n", cmd.Process.Pid)
			writePID(cmd.Process.Pid)
		}
		if mode == "child-then-hang" {
			time.Sleep(time.Hour)
		}
	case "grandchild":
		// A helper that outlives a kill of this process unless the host
		// ends the whole process group.
		cmd := exec.Command("sleep", "3600")
		if err := cmd.Start(); err == nil {
			fmt.Fprintf(os.Stderr, "misbehave: started helper process %d\n", cmd.Process.Pid)
		}
	}
	sdk.Serve(rig{mode})
}

// writePID records a helper's process id in the file named by
// MISBEHAVE_PID_FILE, for tests that cannot read the plugin's stderr.
func writePID(pid int) {
	if f := os.Getenv("MISBEHAVE_PID_FILE"); f != "" {
		_ = os.WriteFile(f, []byte(fmt.Sprint(pid)), 0o644)
	}
}

// rig answers like a small drill rig, except where its mode says otherwise.
type rig struct{ mode string }

func (r rig) Describe(ctx context.Context) (sdk.RigInfo, error) {
	info := sdk.RigInfo{
		Name:    r.mode,
		Title:   "Misbehaving test plugin (" + r.mode + ")",
		Methods: []sdk.MethodLimit{{Method: sdk.Boring, MaxDepthFt: 100}},
		Access:  sdk.AccessLimits{Surfaces: []sdk.Surface{sdk.Firm}, MaxSlopePct: 10},
		Basis:   "test data: no numbers here describe a real rig",
	}
	switch r.mode {
	case "hang-in-describe":
		select {} // never answers
	case "bad-name":
		info.Name = "Bad Name!"
	case "no-methods":
		info.Methods = nil
	}
	return info, nil
}

func (r rig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	switch r.mode {
	case "crash-in-assess":
		os.Exit(3)
	case "panic-in-assess":
		panic("misbehave: assess went wrong")
	case "hang-in-assess":
		select {} // ignores ctx on purpose
	case "error-in-assess":
		return sdk.AssessResponse{}, fmt.Errorf("rate table for %d sites not loaded", len(req.Sites))
	case "noise-in-assess":
		fmt.Println("misbehave: assessing on stdout")
		fmt.Fprintln(os.Stderr, "misbehave: assessing on stderr")
	}
	var out sdk.AssessResponse
	for _, s := range req.Sites {
		// Test data: 1 h set-up, 0.1 h per foot.
		a := sdk.Answer{ID: s.ID, Feasible: true,
			Hours:      sdk.Hours{Setup: 1, Advance: 0.1 * s.DepthFt},
			Quantities: []sdk.Quantity{{Item: "drill-0-50", Unit: "ft", Amount: s.DepthFt}}}
		switch r.mode {
		case "negative-hours":
			a.Hours.Setup = -1
		case "nan-quantity":
			a.Quantities[0].Amount = math.NaN()
		case "inf-hours":
			a.Hours.Advance = math.Inf(1)
		case "no-reason":
			a = sdk.Answer{ID: s.ID}
		}
		out.Answers = append(out.Answers, a)
	}
	switch r.mode {
	case "too-few-answers":
		out.Answers = out.Answers[:len(out.Answers)-1]
	case "wrong-order":
		for i, j := 0, len(out.Answers)-1; i < j; i, j = i+1, j-1 {
			out.Answers[i], out.Answers[j] = out.Answers[j], out.Answers[i]
		}
	}
	return out, nil
}

func (r rig) Mobilize(ctx context.Context, req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	out := sdk.MobilizeResponse{Hours: 2, Quantities: []sdk.Quantity{{Item: "mob-tire-rig", Unit: "each", Amount: 1}}}
	if r.mode == "nan-mobilize" {
		out.Hours = math.NaN()
	}
	return out, nil
}

func (r rig) Moves(ctx context.Context, req sdk.MovesRequest) (sdk.MovesResponse, error) {
	var out sdk.MovesResponse
	for _, l := range req.Legs {
		out.Hours = append(out.Hours, l.DistanceFt/1000) // test data
	}
	if r.mode == "short-moves" && len(out.Hours) > 0 {
		out.Hours = out.Hours[:len(out.Hours)-1]
	}
	return out, nil
}
