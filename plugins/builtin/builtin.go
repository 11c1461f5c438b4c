// Package builtin is the registry of the rigs that ship with rigmix:
// tire-drill, track-drill, excavator and cpt-rig. They are plain Go
// packages, but the host runs each in its own process over the same
// go-plugin protocol as an external rig — by re-executing the rigmix binary
// with the hidden subcommand "rig-serve NAME", which calls Serve — so the
// protocol is exercised on every run.
package builtin

import (
	"fmt"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/plugins/builtin/cptrig"
	"github.com/rigmix/rigmix/plugins/builtin/excavator"
	"github.com/rigmix/rigmix/plugins/builtin/tiredrill"
	"github.com/rigmix/rigmix/plugins/builtin/trackdrill"
	"github.com/rigmix/rigmix/plugins/sdk"
)

var registry = map[string]func() sdk.Rig{
	tiredrill.Name:  tiredrill.New,
	trackdrill.Name: trackdrill.New,
	excavator.Name:  excavator.New,
	cptrig.Name:     cptrig.New,
}

// Names lists the built-in rig names, sorted.
func Names() []string {
	out := make([]string, 0, len(registry))
	for n := range registry {
		out = append(out, n)
	}
	sort.Strings(out)
	return out
}

// New returns the built-in rig called name.
func New(name string) (sdk.Rig, error) {
	mk, ok := registry[name]
	if !ok {
		return nil, fmt.Errorf("builtin: no rig %q (built-in rigs: %s)", name, strings.Join(Names(), ", "))
	}
	return mk(), nil
}

// Serve serves the built-in rig called name over go-plugin and returns when
// the host stops it. It is what "rigmix rig-serve NAME" runs.
func Serve(name string) error {
	r, err := New(name)
	if err != nil {
		return err
	}
	sdk.Serve(r)
	return nil
}
