package main

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	"github.com/rigmix/rigmix/cmd/rigmix/internal/cli"
)

// slowLoadSite writes a scenario that takes a long time to load (the
// loader's cross-checks on six 10,000-vertex outlines, within the
// documented limit of 10,000 vertices per outline): a signal sent during
// loading, which watches no context, must still end the run.
func slowLoadSite(t *testing.T, dir string) string {
	t.Helper()
	const n = 10000
	var b strings.Builder
	b.WriteString("# Invented site for the interrupt test.\nunits: ft\nname: slow-load\ntitle: Six fine outlines (test data)\n")
	b.WriteString("boundary:\n  polygon: [[0, 0], [3000, 0], [3000, 2000], [0, 2000]]\nzones:\n")
	for k := range 6 {
		cx, cy := 500+float64(k%3)*1000, 500+float64(k/3)*1000
		var pts []string
		for i := range n {
			a := 2 * math.Pi * float64(i) / n
			pts = append(pts, fmt.Sprintf("[%.3f, %.3f]", cx+400*math.Cos(a), cy+400*math.Sin(a)))
		}
		fmt.Fprintf(&b, "  - id: z%d\n    use: open\n    polygon: [%s]\n    ground: {surface: firm}\n    rules: {max_spacing: 200, min_depth: 10}\n", k, strings.Join(pts, ", "))
	}
	b.WriteString("rigs: [tire-drill]\nrate_book: valley-2026\nyard_miles: 10\n")
	p := filepath.Join(dir, "slow-load.yaml")
	if err := os.WriteFile(p, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// TestInterruptEveryCommand runs each command as a user would, in a
// process of its own, on a site whose work runs for minutes, and sends it
// SIGINT (to its process group, as Ctrl-C does) or SIGTERM (to it alone, as
// kill and service managers do) once its rigs are running, or while it is
// still loading. Each must exit 1 within a few seconds with "interrupted"
// on stderr and no stack trace, leave every earlier output file byte for
// byte as it was with no temporary file beside it, and leave no rig
// process behind. solve prints the best solution so far first.
func TestInterruptEveryCommand(t *testing.T) {
	if testing.Short() {
		t.Skip("plans large sites")
	}
	self, err := exec.LookPath("rigmix")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	site := interruptSite(t, dir)
	slow := slowLoadSite(t, dir)

	// solve's model: the site's model, written before its solve starts.
	model := filepath.Join(dir, "model.mps")
	{
		// The solve stops at once; the model is written before it.
		cmd := exec.Command(self, "plan", site, "--quiet", "--time-limit", "0.001", "--model-mps", model)
		out, _ := cmd.CombinedOutput()
		if _, err := os.Stat(model); err != nil {
			t.Fatalf("writing the model: %v\n%s", err, out)
		}
	}

	// A 5-acre generated site: the trade-offs take some 10 s, so a signal
	// after 5 s lands in the middle of the analysis, past the first plan.
	small := filepath.Join(dir, "small.yaml")
	{
		b, err := exec.Command(self, "gen-site", "--acres", "5").Output()
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(small, b, 0o644); err != nil {
			t.Fatal(err)
		}
	}

	type tc struct {
		name    string
		args    []string // outputs are added: earlier files that must survive
		outs    []string // output flags
		sig     syscall.Signal
		loading bool          // signal while loading (no rig started yet)
		after   time.Duration // wait after the rigs started (default 1.5 s)
		twice   bool          // a second signal right after the first ends the run at once
		stdout  string
	}
	cases := []tc{
		{name: "plan INT", args: []string{"plan", site}, outs: []string{"--json", "--points-csv"}, sig: syscall.SIGINT},
		{name: "plan TERM", args: []string{"plan", site}, outs: []string{"--json", "--points-geojson"}, sig: syscall.SIGTERM},
		{name: "plan TERM while loading", args: []string{"plan", slow}, outs: []string{"--json"}, sig: syscall.SIGTERM, loading: true},
		{name: "schedule INT", args: []string{"schedule", site, "--start", "2027-03-01"}, outs: []string{"--csv", "--gantt-svg"}, sig: syscall.SIGINT},
		{name: "schedule TERM", args: []string{"schedule", site, "--start", "2027-03-01"}, outs: []string{"--stakeout-csv"}, sig: syscall.SIGTERM},
		{name: "tradeoffs INT", args: []string{"tradeoffs", site}, outs: []string{"--json", "--alternatives-csv", "--budget-csv"}, sig: syscall.SIGINT},
		{name: "tradeoffs TERM", args: []string{"tradeoffs", site}, outs: []string{"--json", "--frontier-svg"}, sig: syscall.SIGTERM},
		{name: "tradeoffs INT mid-analysis", args: []string{"tradeoffs", small}, outs: []string{"--json", "--budget-csv"}, sig: syscall.SIGINT, after: 5 * time.Second},
		{name: "report TERM mid-analysis", args: []string{"report", small, "--start", "2027-03-01"}, outs: []string{"--out"}, sig: syscall.SIGTERM, after: 5 * time.Second},
		{name: "plan INT twice while loading", args: []string{"plan", slow}, outs: []string{"--json"}, sig: syscall.SIGINT, loading: true, twice: true},
		{name: "tradeoffs INT while loading", args: []string{"tradeoffs", slow}, outs: []string{"--json"}, sig: syscall.SIGINT, loading: true},
		{name: "report INT", args: []string{"report", site, "--start", "2027-03-01"}, outs: []string{"--out"}, sig: syscall.SIGINT},
		{name: "report TERM", args: []string{"report", site, "--start", "2027-03-01"}, outs: []string{"--out"}, sig: syscall.SIGTERM},
		{name: "solve INT", args: []string{"solve", model}, sig: syscall.SIGINT, stdout: "status"},
		{name: "solve TERM", args: []string{"solve", model}, sig: syscall.SIGTERM, stdout: "status"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			out := t.TempDir()
			prev := map[string]string{}
			args := append([]string(nil), c.args...)
			for i, flag := range c.outs {
				name := fmt.Sprintf("out%d%s", i, map[bool]string{true: ".html", false: ".txt"}[flag == "--out"])
				body := fmt.Sprintf("earlier output %d of %s\n", i, flag)
				prev[name] = body
				if err := os.WriteFile(filepath.Join(out, name), []byte(body), 0o644); err != nil {
					t.Fatal(err)
				}
				args = append(args, flag, filepath.Join(out, name))
			}
			cmd := exec.Command(self, args...)
			cmd.SysProcAttr = &syscall.SysProcAttr{Setpgid: true}
			var stdout, stderr bytes.Buffer
			cmd.Stdout, cmd.Stderr = &stdout, &stderr
			if err := cmd.Start(); err != nil {
				t.Fatal(err)
			}
			pid := cmd.Process.Pid
			done := make(chan struct{})
			go func() { _ = cmd.Wait(); close(done) }()
			defer func() { _ = syscall.Kill(-pid, syscall.SIGKILL) }()

			// Wait for the rigs to run (or, while loading, a moment).
			var rigs []int
			deadline := time.Now().Add(2 * time.Minute)
			wait := time.Second
			if !c.loading && c.args[0] != "solve" {
				for len(rigs) == 0 {
					select {
					case <-done:
						t.Fatalf("rigmix ended before the signal: %s", stderr.String())
					case <-time.After(100 * time.Millisecond):
					}
					if time.Now().After(deadline) {
						t.Fatal("no rig started within 2 minutes")
					}
					rigs = childrenOf(pid)
				}
				wait = 1500 * time.Millisecond
				if c.after > 0 {
					wait = c.after
				}
			}
			select {
			case <-done:
				if c.after > 0 && cmd.ProcessState.ExitCode() == 0 {
					t.Skipf("the run finished within %s, before the signal: this machine is faster than the case assumes", c.after)
				}
				t.Fatalf("rigmix ended before the signal: %s", stderr.String())
			case <-time.After(wait):
			}
			rigs = append(rigs, childrenOf(pid)...)
			target := pid
			if c.sig == syscall.SIGINT {
				target = -pid // the terminal's Ctrl-C goes to the foreground group
			}
			sent := time.Now()
			if err := syscall.Kill(target, c.sig); err != nil {
				t.Fatal(err)
			}
			if c.twice {
				time.Sleep(100 * time.Millisecond)
				if err := syscall.Kill(target, c.sig); err != nil {
					t.Fatal(err)
				}
			}
			select {
			case <-done:
			case <-time.After(20 * time.Second):
				t.Fatalf("still running 20 s after %v\n%s", c.sig, stderr.String())
			}
			took := time.Since(sent)
			if c.twice && took > 2*time.Second {
				t.Errorf("took %s after a second signal; want at once", took)
			}
			code := cmd.ProcessState.ExitCode()
			msg := stderr.String()
			t.Logf("exit %d %s after %v: %s", code, time.Since(sent).Round(time.Millisecond), c.sig, strings.TrimSpace(lastLine(msg)))
			if code != cli.ExitFailure {
				t.Errorf("exit code %d, want %d", code, cli.ExitFailure)
			}
			if !strings.Contains(lastLine(msg), "interrupted") {
				t.Errorf("stderr does not end saying the run was interrupted: %q", msg)
			}
			for _, bad := range []string{"goroutine ", "panic"} {
				if strings.Contains(msg, bad) {
					t.Errorf("stderr holds %q:\n%s", bad, msg)
				}
			}
			if c.stdout != "" && !strings.Contains(stdout.String(), c.stdout) {
				t.Errorf("stdout %q: want the best solution so far (%q)", stdout.String(), c.stdout)
			}
			if c.stdout == "" && stdout.Len() > 0 {
				t.Errorf("stdout after an interrupt: %.300q", stdout.String())
			}
			assertFiles(t, out, prev)
			for _, p := range rigs {
				deadline := time.Now().Add(5 * time.Second)
				for alive(p) && time.Now().Before(deadline) {
					time.Sleep(50 * time.Millisecond)
				}
				if alive(p) {
					_ = syscall.Kill(p, syscall.SIGKILL)
					t.Errorf("rig process %d outlived rigmix", p)
				}
			}
		})
	}
}

func lastLine(s string) string {
	s = strings.TrimRight(s, "\n")
	return s[strings.LastIndexByte(s, '\n')+1:]
}
