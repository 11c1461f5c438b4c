package host

import (
	"bytes"
	"context"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// The misbehaving plugin (plugins/examples/misbehave) is built once per
// test run; each test copies it into its own plugin folder under the name
// of the misbehaviour it wants.
var (
	misbehaveOnce sync.Once
	misbehavePath string
	misbehaveErr  error
	misbehaveDir  string // removed by TestMain
)

func misbehaveExe(t *testing.T) string {
	t.Helper()
	if testing.Short() {
		t.Skip("builds the misbehaving test plugin")
	}
	misbehaveOnce.Do(func() {
		misbehaveDir, misbehaveErr = os.MkdirTemp("", "rigmix-misbehave-")
		if misbehaveErr != nil {
			return
		}
		misbehavePath = filepath.Join(misbehaveDir, "misbehave")
		cmd := exec.Command("go", "build", "-o", misbehavePath, "./plugins/examples/misbehave")
		cmd.Dir = repoRoot(t)
		if out, err := cmd.CombinedOutput(); err != nil {
			misbehaveErr = err
			misbehavePath = string(out)
		}
	})
	if misbehaveErr != nil {
		t.Fatalf("go build misbehave: %v\n%s", misbehaveErr, misbehavePath)
	}
	return misbehavePath
}

// misbehaving puts the misbehaving plugin in a fresh plugin folder under
// mode's name and returns the options to open it (with a built-in rig
// beside it, which must be killed as well when the plugin fails) and the
// plugin file's path.
func misbehaving(t *testing.T, mode string, callTimeout time.Duration) (Options, string) {
	t.Helper()
	exe := misbehaveExe(t)
	dir := t.TempDir()
	path := filepath.Join(dir, mode)
	copyFile(t, exe, path)
	opt := testOptions()
	opt.PluginDir = dir
	opt.Builtins = []string{"tire-drill"}
	opt.CallTimeout = callTimeout
	return opt, path
}

// testSites is a small batch; every well-behaved answer to it is checked
// by sdk.CheckAssess.
var testSites = sdk.AssessRequest{Sites: []sdk.Site{
	{ID: "B-1", Method: sdk.Boring, DepthFt: 30, Surface: sdk.Firm},
	{ID: "B-2", Method: sdk.Boring, DepthFt: 45, Surface: sdk.Firm},
	{ID: "B-3", Method: sdk.Boring, DepthFt: 20, Surface: sdk.Firm},
}}

// bounded runs f with a context that ends after limit, and fails the test
// if f has not returned a little after that: the host must never hang.
func bounded(t *testing.T, limit time.Duration, f func(ctx context.Context)) time.Duration {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), limit)
	defer cancel()
	done := make(chan struct{})
	start := time.Now()
	go func() {
		defer close(done)
		f(ctx)
	}()
	select {
	case <-done:
	case <-time.After(limit + 10*time.Second):
		t.Fatalf("still waiting %s after the context's deadline: the host hangs", 10*time.Second)
	}
	return time.Since(start)
}

// TestMisbehavingPluginAtStart: plugins that fail before or during the
// handshake or in Describe. Open fails with an error naming the plugin
// file and the kind of failure, within the call timeout, and leaves no
// process behind — not the plugin, not the built-in started beside it.
func TestMisbehavingPluginAtStart(t *testing.T) {
	cases := []struct {
		mode string
		want []string
	}{
		{"hang-at-start", []string{"did not start", "timeout"}},
		{"exit-at-start", []string{"did not start", "exited"}},
		{"other-protocol", []string{"protocol version 99", "rigmix speaks version 1"}},
		{"noise-on-stdout", []string{"did not start", "misbehave rig 0.1"}},
		{"hang-in-describe", []string{"describe", "no answer within"}},
		{"bad-name", []string{"describe", `rig name "Bad Name!"`}},
		{"no-methods", []string{"describe", "lists no methods"}},
	}
	for _, c := range cases {
		t.Run(c.mode, func(t *testing.T) {
			opt, path := misbehaving(t, c.mode, 2*time.Second)
			before := childPIDs(t)
			var err error
			took := bounded(t, 30*time.Second, func(ctx context.Context) {
				var f *Fleet
				f, err = Open(ctx, opt)
				if err == nil {
					f.Close()
				}
			})
			if err == nil {
				t.Fatalf("Open accepted the %s plugin", c.mode)
			}
			msg := err.Error()
			t.Logf("%s (%s): %s", c.mode, took.Round(time.Millisecond), msg)
			if !strings.Contains(msg, path) {
				t.Errorf("error does not name the plugin file %s", path)
			}
			for _, w := range c.want {
				if !strings.Contains(msg, w) {
					t.Errorf("error does not say %q", w)
				}
			}
			if strings.Contains(msg, "\n") {
				t.Errorf("error spans lines:\n%s", msg)
			}
			if took > opt.CallTimeout+5*time.Second {
				t.Errorf("Open took %s with a call timeout of %s", took, opt.CallTimeout)
			}
			assertNoNewChildren(t, before)
		})
	}
}

// TestMisbehavingPluginInCalls: plugins that start well and then crash,
// hang, or answer out of contract. Each call returns an error naming the
// rig and what is wrong, within the call timeout, and Close leaves no
// process behind.
func TestMisbehavingPluginInCalls(t *testing.T) {
	assess := func(ctx context.Context, r *Rig) error {
		_, err := r.Assess(ctx, testSites)
		return err
	}
	cases := []struct {
		mode string
		call func(ctx context.Context, r *Rig) error
		want []string
	}{
		{"crash-in-assess", assess, []string{"assess", "/crash-in-assess) ended during the call", "printed nothing on stderr"}},
		{"panic-in-assess", assess, []string{"assess", "/panic-in-assess) ended during the call", `"panic: misbehave: assess went wrong"`}},
		{"hang-in-assess", assess, []string{"assess", "no answer within 1.5s"}},
		{"error-in-assess", assess, []string{"assess", "rate table for 3 sites not loaded"}},
		{"negative-hours", assess, []string{"assess", `site "B-1": setup hours -1`}},
		{"nan-quantity", assess, []string{"assess", `site "B-1": quantity drill-0-50: amount NaN`}},
		{"inf-hours", assess, []string{"assess", `site "B-1": advance hours +Inf`}},
		{"too-few-answers", assess, []string{"assess", "2 answers for 3 sites"}},
		{"wrong-order", assess, []string{"assess", `answer 0 has ID "B-3", want "B-1"`}},
		{"no-reason", assess, []string{"assess", `site "B-1": infeasible answer gives no reason`}},
		{"nan-mobilize", func(ctx context.Context, r *Rig) error {
			_, err := r.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 20})
			return err
		}, []string{"mobilize", "hours NaN"}},
		{"short-moves", func(ctx context.Context, r *Rig) error {
			_, err := r.Moves(ctx, sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 100}, {DistanceFt: 200}}})
			return err
		}, []string{"moves", "1 answers for 2 legs"}},
	}
	for _, c := range cases {
		t.Run(c.mode, func(t *testing.T) {
			opt, _ := misbehaving(t, c.mode, 1500*time.Millisecond)
			var logs bytes.Buffer
			opt.Stderr = &syncWriter{w: &logs}
			before := childPIDs(t)
			var callErr error
			took := bounded(t, 30*time.Second, func(ctx context.Context) {
				f, err := Open(ctx, opt)
				if err != nil {
					t.Errorf("Open: %v", err)
					return
				}
				defer f.Close()
				r, ok := f.Rig(c.mode)
				if !ok {
					t.Errorf("rig %s not loaded", c.mode)
					return
				}
				callErr = c.call(ctx, r)
				// The built-in beside it still answers.
				tire, _ := f.Rig("tire-drill")
				if _, err := tire.Assess(ctx, testSites); err != nil {
					t.Errorf("tire-drill after %s: %v", c.mode, err)
				}
			})
			if callErr == nil {
				t.Fatalf("the %s plugin's answer was accepted", c.mode)
			}
			msg := callErr.Error()
			t.Logf("%s (%s): %s", c.mode, took.Round(time.Millisecond), msg)
			if !strings.HasPrefix(msg, `rig "`+c.mode+`": `) {
				t.Errorf("error does not start with the rig's name")
			}
			for _, w := range c.want {
				if !strings.Contains(msg, w) {
					t.Errorf("error does not say %q", w)
				}
			}
			assertNoNewChildren(t, before)
		})
	}
}

// TestPluginNoiseDuringCalls: a plugin that prints on stdout and stderr
// while it answers still answers; what it prints reaches Options.Stderr
// (stderr) or is dropped (stdout), and never mixes into the protocol.
func TestPluginNoiseDuringCalls(t *testing.T) {
	opt, _ := misbehaving(t, "noise-in-assess", 10*time.Second)
	opt.Stderr = &syncWriter{w: &bytes.Buffer{}}
	bounded(t, 30*time.Second, func(ctx context.Context) {
		f, err := Open(ctx, opt)
		if err != nil {
			t.Errorf("Open: %v", err)
			return
		}
		defer f.Close()
		r, _ := f.Rig("noise-in-assess")
		resp, err := r.Assess(ctx, testSites)
		if err != nil {
			t.Errorf("Assess: %v", err)
			return
		}
		if len(resp.Answers) != 3 || resp.Answers[2].ID != "B-3" {
			t.Errorf("answers %+v", resp.Answers)
		}
		// What the plugin prints travels on a stream of its own; give it
		// a moment, while the plugin still runs.
		for range 100 {
			if strings.Contains(opt.Stderr.(*syncWriter).String(), "assessing on stderr") {
				return
			}
			time.Sleep(50 * time.Millisecond)
		}
		t.Errorf("the plugin's stderr did not reach Options.Stderr within 5 s:\n%s", opt.Stderr.(*syncWriter).String())
	})
}

// TestPluginGrandchild: a plugin that starts a process of its own. Close
// ends the plugin's whole process group, so the helper does not outlive
// the run.
func TestPluginGrandchild(t *testing.T) {
	opt, _ := misbehaving(t, "grandchild", 10*time.Second)
	opt.Builtins = nil
	logs := &syncWriter{w: &bytes.Buffer{}}
	opt.Stderr = logs
	var helper int
	bounded(t, 30*time.Second, func(ctx context.Context) {
		f, err := Open(ctx, opt)
		if err != nil {
			t.Errorf("Open: %v", err)
			return
		}
		r, _ := f.Rig("grandchild")
		if _, err := r.Assess(ctx, testSites); err != nil {
			t.Errorf("Assess: %v", err)
		}
		time.Sleep(100 * time.Millisecond)
		helper = helperPID(logs.String())
		f.Close()
	})
	if helper == 0 {
		t.Fatalf("the plugin did not report its helper process:\n%s", logs.String())
	}
	deadline := time.Now().Add(5 * time.Second)
	for alive(helper) && time.Now().Before(deadline) {
		time.Sleep(50 * time.Millisecond)
	}
	if alive(helper) {
		if p, err := os.FindProcess(helper); err == nil {
			_ = p.Kill()
		}
		t.Errorf("the plugin's helper process %d outlived Close", helper)
	}
}

// holdEnv makes the test binary open a fleet, print its rigs' process ids
// and wait to be killed: TestHostKilled plays a rigmix that dies without
// closing its fleet.
const holdEnv = "RIGMIX_TEST_HOLD_FLEET"

func holdFleet() {
	opt := testOptions()
	opt.Builtins = []string{"tire-drill", "cpt-rig"}
	f, err := Open(context.Background(), opt)
	if err != nil {
		os.Stderr.WriteString(err.Error() + "\n")
		os.Exit(1)
	}
	var ids []string
	for _, r := range f.Rigs() {
		ids = append(ids, strconv.Itoa(r.client.ReattachConfig().Pid))
	}
	os.Stdout.WriteString(strings.Join(ids, " ") + "\n")
	time.Sleep(time.Minute)
	os.Exit(2)
}

// TestHostKilled: when rigmix itself is killed (SIGKILL: no deferred
// Close, no plugin.CleanupClients), its rig processes end too instead of
// living on as orphans.
func TestHostKilled(t *testing.T) {
	if _, err := os.Stat("/proc/self/stat"); err != nil {
		t.Skip("no /proc")
	}
	cmd := exec.Command(os.Args[0], "-test.run=^$")
	cmd.Env = append(os.Environ(), holdEnv+"=1")
	out, err := cmd.StdoutPipe()
	if err != nil {
		t.Fatal(err)
	}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	defer cmd.Process.Kill()
	line := make(chan string, 1)
	go func() {
		b := make([]byte, 256)
		n, _ := out.Read(b)
		line <- string(b[:n])
	}()
	var pids []int
	select {
	case l := <-line:
		for _, f := range strings.Fields(l) {
			n, err := strconv.Atoi(f)
			if err != nil {
				t.Fatalf("holder printed %q", l)
			}
			pids = append(pids, n)
		}
	case <-time.After(30 * time.Second):
		t.Fatal("the holder did not open its fleet within 30 s")
	}
	if len(pids) != 2 {
		t.Fatalf("holder's rigs: %v", pids)
	}
	if err := cmd.Process.Kill(); err != nil {
		t.Fatal(err)
	}
	_ = cmd.Wait()
	deadline := time.Now().Add(5 * time.Second)
	for time.Now().Before(deadline) && (alive(pids[0]) || alive(pids[1])) {
		time.Sleep(50 * time.Millisecond)
	}
	for _, pid := range pids {
		if alive(pid) {
			if p, err := os.FindProcess(pid); err == nil {
				_ = p.Kill()
			}
			t.Errorf("rig process %d outlived its killed host", pid)
		}
	}
}

// helperPID finds "started helper process N" in the plugin's log.
func helperPID(logs string) int {
	const marker = "started helper process "
	i := strings.Index(logs, marker)
	if i < 0 {
		return 0
	}
	s := logs[i+len(marker):]
	j := 0
	for j < len(s) && s[j] >= '0' && s[j] <= '9' {
		j++
	}
	n, _ := strconv.Atoi(s[:j])
	return n
}

// alive reports whether pid is a process that has not exited (a zombie
// waiting for its parent counts as exited).
func alive(pid int) bool {
	b, err := os.ReadFile(filepath.Join("/proc", strconv.Itoa(pid), "stat"))
	if err != nil {
		return false
	}
	s := string(b)
	fields := strings.Fields(s[strings.LastIndexByte(s, ')')+1:])
	return len(fields) > 0 && fields[0] != "Z"
}

// syncWriter serializes writes from the plugin log copiers and the test.
type syncWriter struct {
	mu sync.Mutex
	w  *bytes.Buffer
}

func (s *syncWriter) String() string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.w.String()
}

func (s *syncWriter) Write(p []byte) (int, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.w.Write(p)
}

// TestSetupMistakesAreBadInput: a plugin folder that is not there, a pin
// that is not a digest, a pin for a file that is not in the folder, a
// digest that does not match and an unknown built-in are the user's to fix
// (exit code 2 at the command line), and each message names what is wrong.
func TestSetupMistakesAreBadInput(t *testing.T) {
	exe := misbehaveExe(t)
	dir := t.TempDir()
	copyFile(t, exe, filepath.Join(dir, "well-behaved"))
	sum := fileSHA256(t, filepath.Join(dir, "well-behaved"))
	other := strings.Repeat("0", 64)
	cases := []struct {
		name string
		opt  Options
		want string
	}{
		{"missing folder", Options{PluginDir: filepath.Join(dir, "nowhere")}, `rig plugin folder "` + filepath.Join(dir, "nowhere") + `": no such file or directory`},
		{"pin not a digest", Options{PluginDir: dir, Pins: map[string]string{"well-behaved": "sha256:" + sum}}, "not a SHA-256 digest"},
		{"pin for a missing file", Options{PluginDir: dir, Pins: map[string]string{"well-behaved": sum, "other-rig": sum}}, "pins name other-rig"},
		{"digest differs", Options{PluginDir: dir, Pins: map[string]string{"well-behaved": other}}, "does not match the pin"},
		{"unknown built-in", Options{Builtins: []string{"tire-drll"}}, `no built-in rig "tire-drll"`},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			c.opt.SelfCommand = testSelfCommand
			c.opt.CallTimeout = 10 * time.Second
			before := childPIDs(t)
			f, err := Open(context.Background(), c.opt)
			if err == nil {
				f.Close()
				t.Fatal("Open accepted it")
			}
			var bi interface{ BadInput() bool }
			if !errors.As(err, &bi) || !bi.BadInput() {
				t.Errorf("error %q is not marked as bad input", err)
			}
			if !strings.Contains(err.Error(), c.want) {
				t.Errorf("error %q does not say %q", err, c.want)
			}
			assertNoNewChildren(t, before)
		})
	}
	// The same folder with the right pin runs the plugin.
	f, err := Open(context.Background(), Options{PluginDir: dir, Pins: map[string]string{"well-behaved": strings.ToUpper(sum)}, CallTimeout: 10 * time.Second})
	if err != nil {
		t.Fatalf("the right pin (in capitals): %v", err)
	}
	f.Close()
}

// TestPluginChildHoldsStdio: plugins whose helper process keeps the
// plugin's stdout and stderr open, so that reading them never ends: a
// well-behaved one (Close must not wait for the end of its output), one
// that then sleeps before the handshake (Open must give up within the call
// timeout), and a shell script that sleeps in a child (the case of a
// wrapper script that never serves). Each returns promptly and leaves no
// process behind, the helper included.
func TestPluginChildHoldsStdio(t *testing.T) {
	cases := []struct {
		mode    string
		script  string // a shell-script plugin instead of the misbehave binary
		openErr string // "" when Open succeeds
	}{
		{mode: "child-holds-stdio"},
		{mode: "child-then-hang", openErr: "no handshake within 2s"},
		{mode: "sleeping-script", script: "#!/bin/sh\nsleep 3600 &\necho $! > \"$MISBEHAVE_PID_FILE\"\nwait\n", openErr: "no handshake within 2s"},
	}
	for _, c := range cases {
		t.Run(c.mode, func(t *testing.T) {
			var opt Options
			if c.script != "" {
				if _, err := exec.LookPath("sh"); err != nil {
					t.Skip("no sh")
				}
				dir := t.TempDir()
				if err := os.WriteFile(filepath.Join(dir, c.mode), []byte(c.script), 0o755); err != nil {
					t.Fatal(err)
				}
				opt = testOptions()
				opt.PluginDir = dir
				opt.CallTimeout = 2 * time.Second
			} else {
				opt, _ = misbehaving(t, c.mode, 2*time.Second)
			}
			opt.Builtins = nil
			pidFile := filepath.Join(t.TempDir(), "helper.pid")
			t.Setenv("MISBEHAVE_PID_FILE", pidFile)
			t.Cleanup(func() { killHelper(pidFile) }) // also when the test fails early
			before := childPIDs(t)
			var openErr error
			took := bounded(t, 20*time.Second, func(ctx context.Context) {
				f, err := Open(ctx, opt)
				openErr = err
				if err != nil {
					return
				}
				r := f.Rigs()[0]
				if _, err := r.Assess(ctx, testSites); err != nil {
					t.Errorf("Assess: %v", err)
				}
				f.Close()
			})
			t.Logf("%s: %s, Open: %v", c.mode, took.Round(time.Millisecond), openErr)
			switch {
			case c.openErr == "" && openErr != nil:
				t.Fatalf("Open: %v", openErr)
			case c.openErr != "" && (openErr == nil || !strings.Contains(openErr.Error(), c.openErr)):
				t.Errorf("Open: %v; want an error saying %q", openErr, c.openErr)
			}
			if took > opt.CallTimeout+3*time.Second {
				t.Errorf("took %s with a call timeout of %s", took, opt.CallTimeout)
			}
			b, err := os.ReadFile(pidFile)
			helper, _ := strconv.Atoi(strings.TrimSpace(string(b)))
			if err != nil || helper == 0 {
				t.Fatalf("the plugin did not record its helper process: %q %v", b, err)
			}
			deadline := time.Now().Add(3 * time.Second)
			for alive(helper) && time.Now().Before(deadline) {
				time.Sleep(50 * time.Millisecond)
			}
			if alive(helper) {
				_ = syscall.Kill(helper, syscall.SIGKILL)
				t.Errorf("the plugin's helper process %d outlived the fleet", helper)
			}
			assertNoNewChildren(t, before)
		})
	}
}

// TestPluginStartInterrupted: a signal (the context ending) while a plugin
// is starting ends Open at once, not after the call timeout, and leaves no
// process behind.
func TestPluginStartInterrupted(t *testing.T) {
	opt, _ := misbehaving(t, "child-then-hang", 30*time.Second)
	pidFile := filepath.Join(t.TempDir(), "helper.pid")
	t.Setenv("MISBEHAVE_PID_FILE", pidFile)
	t.Cleanup(func() { killHelper(pidFile) })
	before := childPIDs(t)
	ctx, cancel := context.WithCancel(context.Background())
	time.AfterFunc(time.Second, cancel)
	start := time.Now()
	_, err := Open(ctx, opt)
	took := time.Since(start)
	if err == nil || !errors.Is(err, context.Canceled) {
		t.Errorf("Open: %v; want the context's cancellation", err)
	}
	if took > 5*time.Second {
		t.Errorf("Open took %s after its context ended at 1 s (call timeout 30 s)", took)
	}
	b, _ := os.ReadFile(pidFile)
	if helper, _ := strconv.Atoi(strings.TrimSpace(string(b))); helper > 0 {
		deadline := time.Now().Add(5 * time.Second)
		for alive(helper) && time.Now().Before(deadline) {
			time.Sleep(50 * time.Millisecond)
		}
		if alive(helper) {
			_ = syscall.Kill(helper, syscall.SIGKILL)
			t.Errorf("the plugin's helper process %d outlived Open", helper)
		}
	}
	deadline := time.Now().Add(5 * time.Second)
	for len(newChildren(t, before)) > 0 && time.Now().Before(deadline) {
		time.Sleep(50 * time.Millisecond)
	}
	assertNoNewChildren(t, before)
}

// killHelper kills the helper process recorded in pidFile, if it is still
// there: a failing test must not leave it running.
func killHelper(pidFile string) {
	b, err := os.ReadFile(pidFile)
	if err != nil {
		return
	}
	if pid, _ := strconv.Atoi(strings.TrimSpace(string(b))); pid > 0 && alive(pid) {
		_ = syscall.Kill(pid, syscall.SIGKILL)
	}
}

func newChildren(t *testing.T, before map[int]bool) []int {
	var out []int
	for pid := range childPIDs(t) {
		if !before[pid] {
			out = append(out, pid)
		}
	}
	return out
}
