package cli

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/spf13/pflag"
)

// TestConfigPrecedence checks each layer: flag > environment > file > default.
func TestConfigPrecedence(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "rigmix.yaml")
	if err := os.WriteFile(file, []byte("gap: 0.03\ntime_limit: 40\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	newFlags := func() *pflag.FlagSet {
		fs := pflag.NewFlagSet("plan", pflag.ContinueOnError)
		fs.Float64("gap", 0, "")
		fs.Float64("time-limit", 0, "")
		fs.Int("threads", 1, "")
		return fs
	}
	cases := []struct {
		name      string
		file      string
		env       map[string]string
		args      []string
		wantGap   float64
		wantLimit float64
	}{
		{name: "default", wantGap: 0, wantLimit: 0},
		{name: "file", file: file, wantGap: 0.03, wantLimit: 40},
		{name: "env over file", file: file, env: map[string]string{"RIGMIX_GAP": "0.02"}, wantGap: 0.02, wantLimit: 40},
		{name: "flag over env", file: file, env: map[string]string{"RIGMIX_GAP": "0.02"}, args: []string{"--gap", "0.01"}, wantGap: 0.01, wantLimit: 40},
		{name: "flag alone", args: []string{"--time-limit", "5"}, wantGap: 0, wantLimit: 5},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			for k, v := range c.env {
				t.Setenv(k, v)
			}
			fs := newFlags()
			if err := fs.Parse(c.args); err != nil {
				t.Fatal(err)
			}
			g := &globalOptions{configFile: c.file}
			cfg, err := g.load(fs)
			if err != nil {
				t.Fatal(err)
			}
			if cfg.Gap != c.wantGap || cfg.TimeLimit != c.wantLimit {
				t.Fatalf("gap %g time limit %g, want %g and %g", cfg.Gap, cfg.TimeLimit, c.wantGap, c.wantLimit)
			}
		})
	}
}

func TestConfigRejects(t *testing.T) {
	dir := t.TempDir()
	for name, body := range map[string]string{
		"unknown key": "gapp: 0.01\n",
		"bad gap":     "gap: 2\n",
		"bad yaml":    "gap: [\n",
	} {
		t.Run(name, func(t *testing.T) {
			file := filepath.Join(dir, "c.yaml")
			if err := os.WriteFile(file, []byte(body), 0o644); err != nil {
				t.Fatal(err)
			}
			g := &globalOptions{configFile: file}
			_, err := g.load(pflag.NewFlagSet("x", pflag.ContinueOnError))
			if err == nil {
				t.Fatal("want an error")
			}
			if _, ok := err.(usageError); !ok {
				t.Fatalf("want a usage error (exit 2), got %T %v", err, err)
			}
		})
	}
}

func TestConfigPins(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "rigmix.yaml")
	digest := "9f86d081884c7d659a2feaa0c55ad015a3bf4f1b2b0b822cd15d6c15b0f00a08"
	if err := os.WriteFile(file, []byte("plugin_dir: "+dir+"\nplugin_pins:\n  hand-crew: "+digest+"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	g := &globalOptions{configFile: file}
	cfg, err := g.load(pflag.NewFlagSet("x", pflag.ContinueOnError))
	if err != nil {
		t.Fatal(err)
	}
	if cfg.PluginPins["hand-crew"] != digest || cfg.PluginDir != dir {
		t.Fatalf("pins %v, plugin dir %q", cfg.PluginPins, cfg.PluginDir)
	}
}
