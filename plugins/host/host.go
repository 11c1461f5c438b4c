// Package host launches rig plugins and talks to them: the built-in rigs
// (by re-executing the running rigmix binary with "rig-serve NAME") and
// external rig executables found in a plugin folder, each in its own
// process over go-plugin's gRPC protocol. It asks each rig to describe
// itself once, refuses two rigs of one name, applies a per-call timeout,
// names the rig in every error, and kills every child on Close.
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
	"os"
	"os/exec"
	"path/filepath"
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
}

// Fleet is a set of running rigs.
type Fleet struct {
	rigs      []*Rig
	byName    map[string]*Rig
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
	var bad []error
	for i, r := range rigs {
		if errs[i] != nil {
			bad = append(bad, errs[i])
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
	if len(bad) > 0 {
		f.Close()
		return nil, errors.Join(bad...)
	}
	sort.Slice(f.rigs, func(i, j int) bool { return f.rigs[i].Info.Name < f.rigs[j].Info.Name })
	return f, nil
}

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
			return nil, fmt.Errorf("no built-in rig %q (built-in rigs: %s)", name, strings.Join(known, ", "))
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
				return nil, fmt.Errorf("pin for %q: %q is not a SHA-256 digest (want 64 hex digits)", base, hexSum)
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
		return nil, fmt.Errorf("pins name %s, but no such executable is in the plugin folder %q", strings.Join(missing, ", "), opt.PluginDir)
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
	client := plugin.NewClient(&plugin.ClientConfig{
		HandshakeConfig:  sdk.HandshakeConfig,
		Plugins:          sdk.PluginMap,
		Cmd:              l.cmd,
		SecureConfig:     l.secure,
		AllowedProtocols: []plugin.Protocol{plugin.ProtocolGRPC},
		Managed:          true,
		StartTimeout:     opt.CallTimeout,
		Logger:           logger,
	})
	fail := func(format string, args ...any) (*Rig, error) {
		client.Kill()
		return nil, fmt.Errorf("%s: "+format, append([]any{l.label}, args...)...)
	}
	rpc, err := client.Client()
	switch {
	case errors.Is(err, plugin.ErrChecksumsDoNotMatch):
		return fail("its SHA-256 digest does not match the pin; not run (re-pin it only if you trust the new file)")
	case err != nil:
		return fail("did not start as a rigmix rig plugin (handshake failed): %v", err)
	}
	raw, err := rpc.Dispense(sdk.PluginName)
	if err != nil {
		return fail("serves no %q plugin: %v", sdk.PluginName, err)
	}
	impl, ok := raw.(sdk.Rig)
	if !ok {
		return fail("dispensed %T, not a rig", raw)
	}
	r := &Rig{Path: l.path, impl: impl, client: client, timeout: opt.CallTimeout}
	cctx, cancel := context.WithTimeout(ctx, opt.CallTimeout)
	defer cancel()
	info, err := impl.Describe(cctx)
	if err != nil {
		return fail("describe: %v", err)
	}
	r.Info = info
	return r, nil
}

// Discover lists the candidate rig executables in dir, sorted: regular
// files (or links to them) with an execute bit, not hidden. An empty dir
// means none.
func Discover(dir string) ([]string, error) {
	if dir == "" {
		return nil, nil
	}
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, fmt.Errorf("rig plugin folder: %w", err)
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
				r.client.Kill()
			}()
		}
		wg.Wait()
	})
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
// may not) and says plainly when the per-call timeout ran out.
func (r *Rig) wrap(ctx context.Context, call string, err error) error {
	if err == nil {
		return nil
	}
	if errors.Is(err, context.DeadlineExceeded) || errors.Is(ctx.Err(), context.DeadlineExceeded) {
		return fmt.Errorf("rig %q: %s: no answer within %s (the per-call timeout) or before the caller's deadline: %w",
			r.Info.Name, call, r.timeout, context.DeadlineExceeded)
	}
	if strings.HasPrefix(err.Error(), fmt.Sprintf("rig %q:", r.Info.Name)) {
		return err
	}
	return fmt.Errorf("rig %q: %s: %w", r.Info.Name, call, err)
}
