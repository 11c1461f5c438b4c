package host

import (
	"bytes"
	"context"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// serveEnv makes the test binary serve a built-in rig when re-executed,
// standing in for "rigmix rig-serve NAME".
const serveEnv = "RIGMIX_TEST_SERVE_RIG"

func TestMain(m *testing.M) {
	if name := os.Getenv(serveEnv); name != "" {
		if err := builtin.Serve(name); err != nil {
			os.Stderr.WriteString(err.Error() + "\n")
			os.Exit(1)
		}
		os.Exit(0)
	}
	if os.Getenv(holdEnv) != "" {
		holdFleet()
	}
	code := m.Run()
	if misbehaveDir != "" {
		os.RemoveAll(misbehaveDir)
	}
	os.Exit(code)
}

func testSelfCommand(name string) *exec.Cmd {
	cmd := exec.Command(os.Args[0])
	cmd.Env = append(os.Environ(), serveEnv+"="+name)
	return cmd
}

func testOptions() Options {
	return Options{SelfCommand: testSelfCommand, CallTimeout: 20 * time.Second}
}

func pids(t *testing.T, f *Fleet) []int {
	t.Helper()
	var out []int
	for _, r := range f.Rigs() {
		rc := r.client.ReattachConfig()
		if rc == nil || rc.Pid == 0 {
			t.Fatalf("rig %s has no process", r.Info.Name)
		}
		out = append(out, rc.Pid)
	}
	return out
}

func TestBuiltinsThroughSubprocesses(t *testing.T) {
	opt := testOptions()
	opt.Builtins = []string{"track-drill", "tire-drill", "cpt-rig", "excavator", "tire-drill"}
	f, err := Open(context.Background(), opt)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, r := range f.Rigs() {
		names = append(names, r.Info.Name)
		if r.Path != "" {
			t.Errorf("built-in %s has a plugin path %q", r.Info.Name, r.Path)
		}
	}
	if want := builtin.Names(); !reflect.DeepEqual(names, want) {
		t.Errorf("Rigs() = %v, want %v (sorted, duplicates dropped)", names, want)
	}
	children := pids(t, f)
	// The child check below can see these processes while they run.
	live := childPIDs(t)
	for _, pid := range children {
		if !live[pid] {
			t.Errorf("rig process %d is not listed as a child", pid)
		}
	}

	// The subprocess answers exactly what the rig answers in-process.
	ctx := context.Background()
	req := sdk.AssessRequest{Sites: []sdk.Site{
		{ID: "B-1", Method: sdk.Boring, DepthFt: 60, Surface: sdk.Firm, Environmental: true},
		{ID: "B-2", Method: sdk.Boring, DepthFt: 30, Surface: sdk.Wet},
		{ID: "C-1", Method: sdk.CPT, DepthFt: 40},
	}}
	tire, ok := f.Rig("tire-drill")
	if !ok {
		t.Fatal("no tire-drill")
	}
	got, err := tire.Assess(ctx, req)
	if err != nil {
		t.Fatal(err)
	}
	direct, _ := builtin.New("tire-drill")
	want, _ := direct.Assess(ctx, req)
	if !reflect.DeepEqual(got, want) {
		t.Errorf("through the subprocess:\n got %+v\nwant %+v", got, want)
	}
	if got.Answers[1].Feasible || !strings.Contains(got.Answers[1].Reason, "wet ground") {
		t.Errorf("B-2 on wet ground: %+v", got.Answers[1])
	}
	if _, err := tire.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: -5}); err == nil || !strings.HasPrefix(err.Error(), `rig "tire-drill"`) {
		t.Errorf("bad mobilize: error %v, want one starting with the rig name", err)
	}

	f.Close()
	f.Close() // twice is harmless
	assertGone(t, children)
}

func TestPluginDir(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the example plugin")
	}
	dir := t.TempDir()
	exe := buildHandCrew(t, dir)
	sum := fileSHA256(t, exe)

	t.Run("loads", func(t *testing.T) {
		opt := testOptions()
		opt.PluginDir = dir
		opt.Builtins = []string{"excavator"}
		opt.Pins = map[string]string{"hand-crew": sum}
		var logs bytes.Buffer
		opt.Stderr = &logs
		f, err := Open(context.Background(), opt)
		if err != nil {
			t.Fatal(err)
		}
		defer f.Close()
		r, ok := f.Rig("hand-crew")
		if !ok {
			t.Fatalf("hand-crew not loaded; rigs %v", f.Rigs())
		}
		if r.Path != exe {
			t.Errorf("Path %q, want %q", r.Path, exe)
		}
		if len(f.Rigs()) != 2 || f.Rigs()[0].Info.Name != "excavator" {
			t.Errorf("rigs not sorted by name: %v", f.Rigs())
		}
		resp, err := r.Assess(context.Background(), sdk.AssessRequest{Sites: []sdk.Site{
			{ID: "HA-1", Method: sdk.Boring, DepthFt: 6, Surface: sdk.Soft},
			{ID: "DCP-1", Method: sdk.Probe, DepthFt: 4, Surface: sdk.Firm},
		}})
		if err != nil {
			t.Fatal(err)
		}
		if !resp.Answers[0].Feasible || resp.Answers[0].Quantities[0].Item != "hand-auger" || resp.Answers[1].Quantities[0].Item != "dcp-probe" {
			t.Errorf("hand-crew answers: %+v", resp.Answers)
		}
		children := pids(t, f)
		f.Close()
		assertGone(t, children)
		if !strings.Contains(logs.String(), "rig.hand-crew") {
			t.Errorf("plugin logs in Options.Stderr lack the rig's name:\n%s", logs.String())
		}
	})

	t.Run("pin mismatch refuses to run", func(t *testing.T) {
		opt := testOptions()
		opt.PluginDir = dir
		wrong := sha256.Sum256([]byte("not the plugin"))
		opt.Pins = map[string]string{"hand-crew": hex.EncodeToString(wrong[:])}
		before := childPIDs(t)
		f, err := Open(context.Background(), opt)
		if err == nil {
			f.Close()
			t.Fatal("Open ran a plugin whose digest does not match its pin")
		}
		t.Logf("pin mismatch error: %v", err)
		if !strings.Contains(err.Error(), exe) || !strings.Contains(err.Error(), "does not match the pin") {
			t.Errorf("error %q; want it to name %s and the pin", err, exe)
		}
		assertNoNewChildren(t, before)
	})

	t.Run("bad pin and pin for a missing file", func(t *testing.T) {
		opt := testOptions()
		opt.PluginDir = dir
		opt.Pins = map[string]string{"hand-crew": "xyz"}
		if _, err := Open(context.Background(), opt); err == nil || !strings.Contains(err.Error(), "64 hex digits") {
			t.Errorf("bad pin: error %v", err)
		}
		opt.Pins = map[string]string{"other-rig": sum}
		if _, err := Open(context.Background(), opt); err == nil || !strings.Contains(err.Error(), "other-rig") {
			t.Errorf("pin for a missing file: error %v", err)
		}
	})

	t.Run("two rigs of one name", func(t *testing.T) {
		dup := t.TempDir()
		for _, n := range []string{"hand-crew", "hand-crew-copy"} {
			copyFile(t, exe, filepath.Join(dup, n))
		}
		opt := testOptions()
		opt.PluginDir = dup
		before := childPIDs(t)
		f, err := Open(context.Background(), opt)
		if err == nil {
			f.Close()
			t.Fatal("Open accepted two rigs called hand-crew")
		}
		if !strings.Contains(err.Error(), `both call themselves rig "hand-crew"`) || !strings.Contains(err.Error(), "hand-crew-copy") {
			t.Errorf("error %q", err)
		}
		assertNoNewChildren(t, before)
	})
}

func TestNotAPlugin(t *testing.T) {
	dir := t.TempDir()
	script := filepath.Join(dir, "noisy")
	if err := os.WriteFile(script, []byte("#!/bin/sh\necho 'hello, I am not a rig'\n"), 0o755); err != nil {
		t.Fatal(err)
	}
	opt := testOptions()
	opt.PluginDir = dir
	opt.Builtins = []string{"cpt-rig"}
	before := childPIDs(t)
	f, err := Open(context.Background(), opt)
	if err == nil {
		f.Close()
		t.Fatal("Open accepted a shell script as a rig plugin")
	}
	t.Logf("error for a script that is not a plugin: %v", err)
	if !strings.Contains(err.Error(), script) || !strings.Contains(err.Error(), "handshake") {
		t.Errorf("error %q; want it to name %s and the handshake", err, script)
	}
	// The built-in started beside it is killed too.
	assertNoNewChildren(t, before)
}

func TestUnknownBuiltin(t *testing.T) {
	opt := testOptions()
	opt.Builtins = []string{"drill-rig"}
	_, err := Open(context.Background(), opt)
	if err == nil || !strings.Contains(err.Error(), `"drill-rig"`) || !strings.Contains(err.Error(), "tire-drill") {
		t.Errorf("error %v; want it to name the unknown rig and list the built-ins", err)
	}
}

func TestDiscover(t *testing.T) {
	dir := t.TempDir()
	for name, mode := range map[string]os.FileMode{"b-rig": 0o755, "a-rig": 0o700, "notes.txt": 0o644, ".hidden": 0o755} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte("x"), mode); err != nil {
			t.Fatal(err)
		}
	}
	if err := os.Mkdir(filepath.Join(dir, "sub"), 0o755); err != nil {
		t.Fatal(err)
	}
	got, err := Discover(dir)
	if err != nil {
		t.Fatal(err)
	}
	want := []string{filepath.Join(dir, "a-rig"), filepath.Join(dir, "b-rig")}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("Discover = %v, want %v", got, want)
	}
	if got, err := Discover(""); got != nil || err != nil {
		t.Errorf(`Discover("") = %v, %v`, got, err)
	}
	if _, err := Discover(filepath.Join(dir, "missing")); err == nil {
		t.Error("Discover of a missing folder gave no error")
	}
}

// slowRig never answers before its context ends.
type slowRig struct{ sdk.Rig }

func (slowRig) Assess(ctx context.Context, _ sdk.AssessRequest) (sdk.AssessResponse, error) {
	<-ctx.Done()
	return sdk.AssessResponse{}, ctx.Err()
}

func (slowRig) Mobilize(ctx context.Context, _ sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	return sdk.MobilizeResponse{}, errors.New("no road")
}

func TestCallTimeoutAndErrors(t *testing.T) {
	r := &Rig{Info: sdk.RigInfo{Name: "slow-rig"}, impl: slowRig{}, timeout: 50 * time.Millisecond}
	start := time.Now()
	_, err := r.Assess(context.Background(), sdk.AssessRequest{})
	if !errors.Is(err, context.DeadlineExceeded) || !strings.Contains(err.Error(), `rig "slow-rig": assess: no answer within 50ms`) {
		t.Errorf("error %v", err)
	}
	if d := time.Since(start); d > 5*time.Second {
		t.Errorf("timeout took %s", d)
	}
	if _, err := r.Mobilize(context.Background(), sdk.MobilizeRequest{}); err == nil || err.Error() != `rig "slow-rig": mobilize: no road` {
		t.Errorf("error %v", err)
	}
}

// --- helpers ---

func repoRoot(t *testing.T) string {
	t.Helper()
	dir, err := os.Getwd()
	if err != nil {
		t.Fatal(err)
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			return dir
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			t.Fatal("no go.mod above the test directory")
		}
		dir = parent
	}
}

func buildHandCrew(t *testing.T, dir string) string {
	t.Helper()
	exe := filepath.Join(dir, "hand-crew")
	cmd := exec.Command("go", "build", "-o", exe, "./plugins/examples/handcrew")
	cmd.Dir = repoRoot(t)
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go build handcrew: %v\n%s", err, out)
	}
	return exe
}

func fileSHA256(t *testing.T, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	s := sha256.Sum256(b)
	return hex.EncodeToString(s[:])
}

func copyFile(t *testing.T, from, to string) {
	t.Helper()
	b, err := os.ReadFile(from)
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(to, b, 0o755); err != nil {
		t.Fatal(err)
	}
}

// childPIDs lists the live child processes of this test process, read
// from /proc (Linux); the test is skipped where /proc is absent.
func childPIDs(t *testing.T) map[int]bool {
	t.Helper()
	entries, err := os.ReadDir("/proc")
	if err != nil {
		t.Skip("no /proc to list child processes")
	}
	me := os.Getpid()
	out := map[int]bool{}
	for _, e := range entries {
		pid, err := strconv.Atoi(e.Name())
		if err != nil {
			continue
		}
		b, err := os.ReadFile(filepath.Join("/proc", e.Name(), "stat"))
		if err != nil {
			continue
		}
		// stat: pid (comm) state ppid ...; comm may hold spaces, so cut at
		// the last ')'.
		s := string(b)
		fields := strings.Fields(s[strings.LastIndexByte(s, ')')+1:])
		if len(fields) < 2 {
			continue
		}
		if ppid, _ := strconv.Atoi(fields[1]); ppid == me {
			out[pid] = true
		}
	}
	return out
}

func assertNoNewChildren(t *testing.T, before map[int]bool) {
	t.Helper()
	for pid := range childPIDs(t) {
		if !before[pid] {
			t.Errorf("child process %d still alive", pid)
		}
	}
}

// assertGone checks that each process has exited and been reaped.
func assertGone(t *testing.T, pids []int) {
	t.Helper()
	for _, pid := range pids {
		if _, err := os.Stat(filepath.Join("/proc", strconv.Itoa(pid))); err == nil {
			t.Errorf("rig process %d still exists after Close", pid)
		}
	}
	assertNoNewChildren(t, map[int]bool{})
}

// One Assess call carries a whole batch; 20,000 sites with 300-byte IDs
// make a request of about 7 MB, past the 4 MiB a gRPC server accepts by
// default, so this fails unless the plugin raises it (sdk.GRPCServer).
func TestLargeBatch(t *testing.T) {
	opt := testOptions()
	opt.Builtins = []string{"tire-drill"}
	f, err := Open(context.Background(), opt)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	r, _ := f.Rig("tire-drill")
	sites := make([]sdk.Site, 20000)
	for i := range sites {
		sites[i] = sdk.Site{ID: strings.Repeat("x", 300) + strconv.Itoa(i), Method: sdk.Boring, DepthFt: float64(10 + i%140), Surface: sdk.Firm, Environmental: i%2 == 0}
	}
	start := time.Now()
	resp, err := r.Assess(context.Background(), sdk.AssessRequest{Sites: sites})
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("20,000 sites in one call: %s", time.Since(start))
	if len(resp.Answers) != len(sites) || resp.Answers[19999].ID != sites[19999].ID {
		t.Errorf("%d answers", len(resp.Answers))
	}
}

// A plugin that never completes the handshake is given up on after the
// call timeout and killed, and the error names it.
func TestPluginThatHangs(t *testing.T) {
	dir := t.TempDir()
	script := filepath.Join(dir, "silent")
	if err := os.WriteFile(script, []byte("#!/bin/sh\nexec sleep 30\n"), 0o755); err != nil {
		t.Fatal(err)
	}
	opt := testOptions()
	opt.PluginDir = dir
	opt.CallTimeout = 500 * time.Millisecond
	before := childPIDs(t)
	start := time.Now()
	f, err := Open(context.Background(), opt)
	if err == nil {
		f.Close()
		t.Fatal("Open accepted a plugin that never answered")
	}
	if d := time.Since(start); d > 10*time.Second {
		t.Errorf("Open took %s to give up", d)
	}
	if !strings.Contains(err.Error(), script) {
		t.Errorf("error %q does not name %s", err, script)
	}
	t.Logf("error for a plugin that hangs: %v", err)
	assertNoNewChildren(t, before)
}

// A plugin file no scenario rig needs does not break the fleet: with
// Options.Want, a broken executable in the folder is skipped (and listed
// by Skipped), a working plugin serving a rig not wanted is stopped; only
// when a wanted rig is missing do the failures become the error.
func TestUnofferedPluginNotNeeded(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the example plugin")
	}
	dir := t.TempDir()
	buildHandCrew(t, dir)
	script := filepath.Join(dir, "broken")
	if err := os.WriteFile(script, []byte("#!/bin/sh\necho 'hello, I am not a rig'\n"), 0o755); err != nil {
		t.Fatal(err)
	}
	open := func(want ...string) (*Fleet, error) {
		opt := testOptions()
		opt.PluginDir = dir
		opt.Builtins = []string{"cpt-rig"}
		opt.Want = want
		return Open(context.Background(), opt)
	}
	names := func(f *Fleet) []string {
		var out []string
		for _, r := range f.Rigs() {
			out = append(out, r.Info.Name)
		}
		return out
	}
	skippedOnlyScript := func(f *Fleet) {
		t.Helper()
		sk := f.Skipped()
		if len(sk) != 1 || !strings.Contains(sk[0].Error(), script) || !strings.Contains(sk[0].Error(), "handshake") {
			t.Errorf("Skipped() = %v; want the one broken file %s", sk, script)
		}
	}

	before := childPIDs(t)
	f, err := open("cpt-rig")
	if err != nil {
		t.Fatalf("a broken plugin file no offered rig needs failed Open: %v", err)
	}
	if got := names(f); !slices.Equal(got, []string{"cpt-rig"}) {
		t.Errorf("rigs %v, want only the wanted cpt-rig (hand-crew stopped)", got)
	}
	skippedOnlyScript(f)
	f.Close()
	assertNoNewChildren(t, before)

	f, err = open("hand-crew", "cpt-rig")
	if err != nil {
		t.Fatalf("wanted plugin beside a broken file: %v", err)
	}
	if got := names(f); !slices.Equal(got, []string{"cpt-rig", "hand-crew"}) {
		t.Errorf("rigs %v, want cpt-rig and hand-crew", got)
	}
	skippedOnlyScript(f)
	f.Close()

	// A wanted rig that is missing: the broken file may be it.
	_, err = open("cpt-rig", "sonic-rig")
	if err == nil || !strings.Contains(err.Error(), `rig "sonic-rig" not started, and 1 plugin file(s) of the folder`) || !strings.Contains(err.Error(), script) {
		t.Errorf("missing wanted rig with a broken file: error %v; want it to name the rig and the file", err)
	}
	// Every rig needed (Want nil, the rigs command): the broken file fails
	// Open as before.
	if f, err := open(); err == nil {
		f.Close()
		t.Error("with every rig needed, Open accepted the broken file")
	}
	assertNoNewChildren(t, before)
}
