// Package host launches rig plugins and talks to them: the built-in rigs
// (by re-executing the running rigmix binary with "rig-serve NAME") and
// external rig executables found in a plugin folder, each in its own
// process over go-plugin's gRPC protocol. It asks each rig to describe
// itself once, refuses two rigs of one name, applies a per-call timeout,
// names the rig in every error, and kills every child on Close.
//
// Each plugin runs in a process group of its own; Close kills the group
// first, so a process a plugin started does not outlive the run nor keep
// the plugin's stdout or stderr open (go-plugin's own clean-up, which waits
// for them to end, is then waited for at most two seconds). Starting a
// plugin is bounded by the call timeout and ends at once when the context
// does. On Linux a rig process is killed when rigmix dies without closing
// (PR_SET_PDEATHSIG).
// A plugin that crashes, hangs, speaks another protocol version, prints on
// stdout where the handshake belongs, or answers out of contract gets a
// one-line error naming its file or its rig (see misbehave_test.go and
// plugins/examples/misbehave).
//
// External executables may be pinned to a SHA-256 digest; a pinned file
// whose digest differs is not run (go-plugin's SecureConfig). Plugins run
// with the user's rights: only put executables you trust in the folder.
package host

import (
	"context"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"slices"
	"sort"
	"strings"
	"sync"
	"time"

	"github.com/hashicorp/go-hclog"
	"github.com/hashicorp/go-plugin"

	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// DefaultCallTimeout bounds each call to a rig when Options.CallTimeout is 0.
const DefaultCallTimeout = 30 * time.Second

// Options say which rigs to launch and how.
type Options struct {
	// Builtins are the built-in rig names wanted (see builtin.Names).
	Builtins []string
	// PluginDir is a folder of external rig executables ("" for none).
	// Only regular files with an execute bit are run; others are ignored.
	PluginDir string
	// Pins optionally maps an executable's base name to the SHA-256 hex
	// digest it must have; a file whose digest differs is refused.
	Pins map[string]string
	// CallTimeout bounds each call to a rig, and the start of each plugin
	// (0: DefaultCallTimeout).
	CallTimeout time.Duration
	// SelfCommand gives the command that serves the built-in rig name.
	// Default: the running executable with the arguments "rig-serve" name.
	SelfCommand func(name string) *exec.Cmd
	// Stderr receives the plugins' logs (nil: discarded).
	Stderr io.Writer
	// Want, when not nil, names the rigs the caller needs (a scenario's
	// offered rigs). Executables of the plugin folder are then needed only
	// for those: one that fails to start, or serves a rig not wanted, is
	// stopped and listed by Fleet.Skipped instead of failing Open — unless
	// a wanted rig is missing, when the failures are the error (any of
	// them may be the missing rig). Nil: every rig is needed.
	Want []string
}

// Fleet is a set of running rigs.
type Fleet struct {
	rigs      []*Rig
	byName    map[string]*Rig
	skipped   []error
	closeOnce sync.Once
}

// Rig is one running rig. It implements sdk.Rig, applying the fleet's
// per-call timeout and naming the rig in every error.
type Rig struct {
	// Info is what the rig's Describe returned when it was launched.
	Info sdk.RigInfo
	// Path is the plugin file of an external rig; "" for a built-in.
	Path string

	impl    sdk.Rig
	client  *plugin.Client // nil when not run as a subprocess (tests)
	timeout time.Duration
	stderr  *tailWriter // the end of the plugin's own stderr; nil in tests
	pid     int         // the plugin's process group id, when it leads its own group; else 0
}

var _ sdk.Rig = (*Rig)(nil)

// launch is one rig to start.
type launch struct {
	label  string // for errors: `built-in rig "tire-drill"` or `rig plugin file "/x/y"`
	short  string // for log lines: the built-in's name or the file's base name
	path   string // plugin file; "" for a built-in
	cmd    *exec.Cmd
	secure *plugin.SecureConfig
}

// Open launches every rig Options ask for, in parallel, and asks each to
// describe itself. On any failure it kills what it started and returns an
// error naming each rig or plugin file that failed.
func Open(ctx context.Context, opt Options) (*Fleet, error) {
	if opt.CallTimeout <= 0 {
		opt.CallTimeout = DefaultCallTimeout
	}
	if opt.SelfCommand == nil {
		opt.SelfCommand = selfCommand
	}
	launches, err := plan(opt)
	if err != nil {
		return nil, err
	}
	// One logger for all children: its sub-loggers share a lock, so lines
	// from rigs starting in parallel do not interleave in opt.Stderr.
	logger := hclog.NewNullLogger()
	if opt.Stderr != nil {
		logger = hclog.New(&hclog.LoggerOptions{Name: "rig", Output: opt.Stderr, Level: hclog.Debug})
	}

	rigs := make([]*Rig, len(launches))
	errs := make([]error, len(launches))
	var wg sync.WaitGroup
	for i, l := range launches {
		wg.Add(1)
		go func() {
			defer wg.Done()
			rigs[i], errs[i] = start(ctx, l, opt, logger.Named(l.short))
		}()
	}
	wg.Wait()

	f := &Fleet{byName: map[string]*Rig{}}
	var bad, skipped []error
	var unwanted []*Rig
	wanted := map[string]bool{}
	for _, n := range opt.Want {
		wanted[n] = true
	}
	for i, r := range rigs {
		optional := opt.Want != nil && launches[i].path != ""
		if errs[i] != nil {
			if optional {
				skipped = append(skipped, errs[i])
			} else {
				bad = append(bad, errs[i])
			}
			continue
		}
		if optional && !wanted[r.Info.Name] {
			unwanted = append(unwanted, r)
			continue
		}
		if prev, dup := f.byName[r.Info.Name]; dup {
			bad = append(bad, fmt.Errorf("%s and %s both call themselves rig %q: rig names must be unique",
				labelOf(prev), launches[i].label, r.Info.Name))
		}
		f.rigs = append(f.rigs, r)
		if _, dup := f.byName[r.Info.Name]; !dup {
			f.byName[r.Info.Name] = r
		}
	}
	// Rigs no one asked for are not needed: stop them now.
	(&Fleet{rigs: unwanted}).Close()
	if len(skipped) > 0 && len(bad) == 0 {
		var missing []string
		for _, n := range opt.Want {
			if _, ok := f.byName[n]; !ok && !slices.Contains(missing, n) {
				missing = append(missing, n)
			}
		}
		if len(missing) > 0 {
			bad = append([]error{fmt.Errorf("rig %s not started, and %d plugin file(s) of the folder %q failed, and one of them may be it",
				quoteList(missing), len(skipped), opt.PluginDir)}, skipped...)
			skipped = nil
		}
	}
	if len(bad) > 0 {
		f.Close()
		return nil, errors.Join(bad...)
	}
	f.skipped = skipped
	sort.Slice(f.rigs, func(i, j int) bool { return f.rigs[i].Info.Name < f.rigs[j].Info.Name })
	return f, nil
}

// quoteList writes names as "a", "b" and "c".
func quoteList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = fmt.Sprintf("%q", n)
	}
	if len(q) == 1 {
		return q[0]
	}
	return strings.Join(q[:len(q)-1], ", ") + " and " + q[len(q)-1]
}

// Skipped lists the plugin files that failed to start but were not needed
// (Options.Want), one error each naming the file; nil when none.
func (f *Fleet) Skipped() []error { return append([]error(nil), f.skipped...) }

func labelOf(r *Rig) string {
	if r.Path == "" {
		return fmt.Sprintf("built-in rig %q", r.Info.Name)
	}
	return fmt.Sprintf("rig plugin file %q", r.Path)
}

// plan lists what to launch: built-ins in the order given, then the
// plugin folder's executables in name order.
func plan(opt Options) ([]launch, error) {
	var out []launch
	known := builtin.Names()
	seen := map[string]bool{}
	for _, name := range opt.Builtins {
		if i := sort.SearchStrings(known, name); i == len(known) || known[i] != name {
			return nil, inputError{fmt.Errorf("no built-in rig %q (built-in rigs: %s)", name, strings.Join(known, ", "))}
		}
		if seen[name] {
			continue
		}
		seen[name] = true
		out = append(out, launch{label: fmt.Sprintf("built-in rig %q", name), short: name, cmd: opt.SelfCommand(name)})
	}
	files, err := Discover(opt.PluginDir)
	if err != nil {
		return nil, err
	}
	pinned := map[string]bool{}
	for _, path := range files {
		base := filepath.Base(path)
		l := launch{label: fmt.Sprintf("rig plugin file %q", path), short: base, path: path, cmd: exec.Command(path)}
		if hexSum, ok := opt.Pins[base]; ok {
			pinned[base] = true
			sum, err := hex.DecodeString(strings.TrimSpace(hexSum))
			if err != nil || len(sum) != sha256.Size {
				return nil, inputError{fmt.Errorf("pin for %q: %q is not a SHA-256 digest (want 64 hex digits)", base, hexSum)}
			}
			l.secure = &plugin.SecureConfig{Checksum: sum, Hash: sha256.New()}
		}
		out = append(out, l)
	}
	var missing []string
	for base := range opt.Pins {
		if !pinned[base] {
			missing = append(missing, base)
		}
	}
	if len(missing) > 0 {
		sort.Strings(missing)
		return nil, inputError{fmt.Errorf("pins name %s, but no such executable is in the plugin folder %q", strings.Join(missing, ", "), opt.PluginDir)}
	}
	return out, nil
}

// selfCommand re-executes the running binary to serve a built-in rig.
func selfCommand(name string) *exec.Cmd {
	exe, err := os.Executable()
	if err != nil {
		exe = os.Args[0]
	}
	return exec.Command(exe, "rig-serve", name)
}

func start(ctx context.Context, l launch, opt Options, logger hclog.Logger) (*Rig, error) {
	// Each plugin leads a process group of its own, so that Close can end
	// whatever it started too, and a Ctrl-C at the terminal reaches rigmix
	// alone, which then stops the rigs in order.
	grouped := ownProcessGroup(l.cmd)
	tail := &tailWriter{}
	// What the plugin prints on stdout or stderr once it serves is copied
	// over go-plugin's stdio stream; it goes to the log, named by the rig.
	stdio := logger.StandardWriter(&hclog.StandardLoggerOptions{InferLevels: true})
	client := plugin.NewClient(&plugin.ClientConfig{
		HandshakeConfig:  sdk.HandshakeConfig,
		Plugins:          sdk.PluginMap,
		Cmd:              l.cmd,
		SecureConfig:     l.secure,
		AllowedProtocols: []plugin.Protocol{plugin.ProtocolGRPC},
		Managed:          true,
		StartTimeout:     opt.CallTimeout,
		Logger:           logger,
		Stderr:           tail,
		SyncStdout:       stdio,
		SyncStderr:       stdio,
	})
	pid := 0
	fail := func(format string, args ...any) (*Rig, error) {
		stop(client, pid)
		return nil, fmt.Errorf("%s: "+format, append([]any{l.label}, args...)...)
	}
	// Starting is bounded by the call timeout (go-plugin's StartTimeout)
	// and by ctx: a signal ends the wait at once; the plugin is stopped
	// when its start returns.
	type started struct {
		rpc plugin.ClientProtocol
		err error
	}
	ch := make(chan started, 1)
	go func() {
		rpc, err := client.Client()
		ch <- started{rpc, err}
	}()
	var rpc plugin.ClientProtocol
	var err error
	select {
	case st := <-ch:
		rpc, err = st.rpc, st.err
	case <-ctx.Done():
		// Kill what has started now (go-plugin's start then returns
		// early), and the rest once its start returns.
		if grouped {
			killGroup(startedChild(l.cmd))
		}
		go func() {
			<-ch
			p := 0
			if grouped && l.cmd.Process != nil {
				p = l.cmd.Process.Pid
			}
			stop(client, p)
		}()
		return nil, fmt.Errorf("%s: not started: %w", l.label, ctx.Err())
	}
	if grouped && l.cmd.Process != nil {
		pid = l.cmd.Process.Pid
	}
	switch {
	case errors.Is(err, plugin.ErrChecksumsDoNotMatch):
		_, err := fail("its SHA-256 digest does not match the pin; not run (re-pin it only if you trust the new file)")
		return nil, inputError{err}
	case err != nil:
		return fail("did not start as a rigmix rig plugin: %s", handshakeProblem(err, client, tail, opt.CallTimeout))
	}
	raw, err := rpc.Dispense(sdk.PluginName)
	if err != nil {
		return fail("serves no %q plugin: %v", sdk.PluginName, err)
	}
	impl, ok := raw.(sdk.Rig)
	if !ok {
		return fail("dispensed %T, not a rig", raw)
	}
	r := &Rig{Path: l.path, impl: impl, client: client, timeout: opt.CallTimeout, stderr: tail, pid: pid}
	cctx, cancel := context.WithTimeout(ctx, opt.CallTimeout)
	defer cancel()
	info, err := impl.Describe(cctx)
	if err != nil {
		// The rig has no name yet; the label names its file.
		r.Info.Name = l.short
		msg := r.wrap(cctx, "describe", err).Error()
		msg = strings.TrimPrefix(msg, fmt.Sprintf("rig %q: ", l.short))
		msg = strings.Replace(msg, `rig "(not yet described)": `, "", 1)
		return fail("%s", msg)
	}
	r.Info = info
	return r, nil
}

// versionMismatch is go-plugin's wording when the plugin speaks another
// protocol version.
var versionMismatch = regexp.MustCompile(`incompatible API version with plugin\. Plugin version: (\d+), Client versions: \[([\d ]+)\]`)

// handshakeProblem turns go-plugin's start-up error, which can span a
// dozen lines of generic advice, into one line saying what went wrong with
// this plugin.
func handshakeProblem(err error, client *plugin.Client, tail *tailWriter, timeout time.Duration) string {
	msg := err.Error()
	if m := versionMismatch.FindStringSubmatch(msg); m != nil {
		return fmt.Sprintf("it speaks rig protocol version %s, this rigmix speaks version %s (rebuild the plugin against this rigmix's plugins/sdk)", m[1], m[2])
	}
	if strings.Contains(msg, "timeout while waiting for plugin to start") {
		return fmt.Sprintf("no handshake within %s (the call timeout); is it a rigmix rig plugin?", timeout)
	}
	const unrecognized = "Unrecognized remote plugin message: "
	if i := strings.Index(msg, unrecognized); i >= 0 {
		line, _, _ := strings.Cut(msg[i+len(unrecognized):], "\n")
		if line = strings.TrimSpace(line); line != "" {
			return fmt.Sprintf("it printed %q on stdout where the handshake belongs (a rig plugin calls sdk.Serve and prints nothing on stdout before it)", clip(line, 120))
		}
		waitExited(client)
		if last := tail.last(); last != "" {
			return fmt.Sprintf("it exited before the handshake; its last words on stderr: %q", clip(last, 200))
		}
		return "it exited before the handshake, printing nothing"
	}
	first, _, _ := strings.Cut(msg, "\n")
	return "handshake failed: " + strings.TrimSpace(first)
}

// waitExited gives go-plugin a moment to notice that the plugin process
// ended (it learns it from a goroutine waiting on the process).
func waitExited(client *plugin.Client) bool {
	for range 200 { // up to 2 s
		if client.Exited() {
			return true
		}
		time.Sleep(10 * time.Millisecond)
	}
	return client.Exited()
}

func clip(s string, n int) string {
	if len(s) <= n {
		return s
	}
	return s[:n] + "…"
}

// tailWriter keeps the last few KiB a plugin wrote on its own stderr, to
// quote in an error when it dies.
type tailWriter struct {
	mu  sync.Mutex
	buf []byte
}

const tailBytes = 4 << 10

func (w *tailWriter) Write(p []byte) (int, error) {
	w.mu.Lock()
	defer w.mu.Unlock()
	w.buf = append(w.buf, p...)
	if len(w.buf) > tailBytes {
		w.buf = append([]byte(nil), w.buf[len(w.buf)-tailBytes:]...)
	}
	return len(p), nil
}

// last returns the line that best says why the plugin died: a Go panic or
// fatal error line if there is one, else the last non-empty line.
func (w *tailWriter) last() string {
	if w == nil {
		return ""
	}
	w.mu.Lock()
	defer w.mu.Unlock()
	lines := strings.Split(string(w.buf), "\n")
	for i := len(lines) - 1; i >= 0; i-- {
		if l := strings.TrimSpace(lines[i]); strings.HasPrefix(l, "panic: ") || strings.HasPrefix(l, "fatal error: ") {
			return l
		}
	}
	for i := len(lines) - 1; i >= 0; i-- {
		// go-plugin's own log lines (JSON, from the plugin's side of the
		// library) say nothing about why the rig died.
		if l := strings.TrimSpace(lines[i]); l != "" && !strings.HasPrefix(l, `{"@`) {
			return l
		}
	}
	return ""
}

// inputError is a mistake in what the user configured (the plugin folder,
// the pins, a rig name): the command line maps it to exit code 2.
type inputError struct{ error }

func (inputError) BadInput() bool { return true }

func (e inputError) Unwrap() error { return e.error }

// Discover lists the candidate rig executables in dir, sorted: regular
// files (or links to them) with an execute bit, not hidden. An empty dir
// means none.
func Discover(dir string) ([]string, error) {
	if dir == "" {
		return nil, nil
	}
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, inputError{fmt.Errorf("rig plugin folder %q: %w", dir, unwrapPath(err))}
	}
	var out []string
	for _, e := range entries {
		if strings.HasPrefix(e.Name(), ".") {
			continue
		}
		path := filepath.Join(dir, e.Name())
		st, err := os.Stat(path) // follows links
		if err != nil || !st.Mode().IsRegular() || st.Mode().Perm()&0o111 == 0 {
			continue
		}
		out = append(out, path)
	}
	sort.Strings(out)
	return out, nil
}

// unwrapPath drops the operation and path an *fs.PathError repeats.
func unwrapPath(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}

// Rigs lists the running rigs sorted by name.
func (f *Fleet) Rigs() []*Rig { return append([]*Rig(nil), f.rigs...) }

// Rig finds a running rig by name.
func (f *Fleet) Rig(name string) (*Rig, bool) {
	r, ok := f.byName[name]
	return r, ok
}

// Close kills every rig process and waits for them to exit. It is safe to
// call more than once. The CLI should also call plugin.CleanupClients at
// exit, which kills any managed child left by a path that missed Close.
func (f *Fleet) Close() {
	f.closeOnce.Do(func() {
		var wg sync.WaitGroup
		for _, r := range f.rigs {
			if r.client == nil {
				continue
			}
			wg.Add(1)
			go func() {
				defer wg.Done()
				stop(r.client, r.pid)
			}()
		}
		wg.Wait()
	})
}

// killWait bounds how long stop waits for go-plugin to notice a killed
// plugin: its Kill waits for the plugin's stdout and stderr to end, which
// a process that escaped the group can hold open for ever.
const killWait = 2 * time.Second

// stop ends a plugin: first its whole process group, at once, so no
// process it started keeps its stdout or stderr open; then go-plugin's
// own clean-up, waited for at most killWait.
func stop(client *plugin.Client, pid int) {
	killGroup(pid)
	done := make(chan struct{})
	go func() {
		client.Kill()
		close(done)
	}()
	select {
	case <-done:
	case <-time.After(killWait):
	}
}

// Describe returns the description the rig gave at launch.
func (r *Rig) Describe(ctx context.Context) (sdk.RigInfo, error) { return r.Info, nil }

// Assess asks the rig about a batch of sites in one call.
func (r *Rig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	ctx, cancel := context.WithTimeout(ctx, r.timeout)
	defer cancel()
	resp, err := r.impl.Assess(ctx, req)
	return resp, r.wrap(ctx, "assess", err)
}

// Mobilize asks the rig for mobilization.
func (r *Rig) Mobilize(ctx context.Context, req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	ctx, cancel := context.WithTimeout(ctx, r.timeout)
	defer cancel()
	resp, err := r.impl.Mobilize(ctx, req)
	return resp, r.wrap(ctx, "mobilize", err)
}

// Moves asks the rig for the hours of each leg.
func (r *Rig) Moves(ctx context.Context, req sdk.MovesRequest) (sdk.MovesResponse, error) {
	ctx, cancel := context.WithTimeout(ctx, r.timeout)
	defer cancel()
	resp, err := r.impl.Moves(ctx, req)
	return resp, r.wrap(ctx, "moves", err)
}

// wrap names the rig in err (the gRPC shim already does; an in-process rig
// may not), says plainly when the per-call timeout ran out, and says when
// the plugin process ended during the call (crashed, panicked, was killed).
func (r *Rig) wrap(ctx context.Context, call string, err error) error {
	if err == nil {
		return nil
	}
	if errors.Is(err, context.DeadlineExceeded) || errors.Is(ctx.Err(), context.DeadlineExceeded) {
		return fmt.Errorf("rig %q: %s: no answer within %s (the per-call timeout) or before the caller's deadline: %w",
			r.Info.Name, call, r.timeout, context.DeadlineExceeded)
	}
	if r.client != nil && errors.Is(err, sdk.ErrConnectionLost) && waitExited(r.client) {
		why := "it printed nothing on stderr first"
		if last := r.stderr.last(); last != "" {
			why = fmt.Sprintf("its last words on stderr: %q", clip(last, 200))
		}
		proc := "the plugin process"
		if r.Path != "" {
			proc = fmt.Sprintf("the plugin process (%s)", r.Path)
		}
		return fmt.Errorf("rig %q: %s: %s ended during the call (%s)", r.Info.Name, call, proc, why)
	}
	if strings.HasPrefix(err.Error(), fmt.Sprintf("rig %q:", r.Info.Name)) {
		return err
	}
	return fmt.Errorf("rig %q: %s: %w", r.Info.Name, call, err)
}
