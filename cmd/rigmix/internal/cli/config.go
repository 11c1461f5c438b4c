package cli

import (
	"bytes"
	"errors"
	"fmt"
	"io/fs"
	"math"
	"os"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/spf13/pflag"
	"github.com/spf13/viper"

	"github.com/rigmix/rigmix/scenarios/fielderr"
)

// Config holds the settings that may come from a flag, the environment
// (RIGMIX_ plus the key in capitals), a configuration file or the default —
// in that order of precedence.
type Config struct {
	PluginDir   string  `mapstructure:"plugin_dir"`
	CallTimeout float64 `mapstructure:"call_timeout"` // seconds
	Gap         float64 `mapstructure:"gap"`          // relative optimality gap; 0: the scenario's
	TimeLimit   float64 `mapstructure:"time_limit"`   // seconds; 0: the scenario's
	Threads     int     `mapstructure:"threads"`
	RateBook    string  `mapstructure:"rate_book"` // demo name or file; "": the scenario's
	// PluginPins pins external rig plugins by SHA-256: executable name in
	// the plugin folder → hex digest. A pinned plugin whose file does not
	// match is refused. Set in the configuration file only.
	PluginPins map[string]string `mapstructure:"plugin_pins"`
	// File is the configuration file read ("" for none).
	File string `mapstructure:"-"`
	// RateBookFrom names where RateBook was set: the flag, the variable
	// or the file and key.
	RateBookFrom string `mapstructure:"-"`
}

// defaults is the bottom layer.
var defaults = Config{CallTimeout: 30, Threads: 1}

// flagKeys maps flag names to configuration keys.
var flagKeys = map[string]string{
	"plugin-dir":   "plugin_dir",
	"call-timeout": "call_timeout",
	"gap":          "gap",
	"time-limit":   "time_limit",
	"threads":      "threads",
	"rate-book":    "rate_book",
}

type globalOptions struct {
	configFile string
	flags      *pflag.FlagSet
}

// load resolves the configuration for a command whose flags are fs.
func (g *globalOptions) load(fs *pflag.FlagSet) (Config, error) {
	v := viper.New()
	v.SetDefault("plugin_dir", defaults.PluginDir)
	v.SetDefault("call_timeout", defaults.CallTimeout)
	v.SetDefault("gap", defaults.Gap)
	v.SetDefault("time_limit", defaults.TimeLimit)
	v.SetDefault("threads", defaults.Threads)
	v.SetDefault("rate_book", defaults.RateBook)
	v.SetEnvPrefix("RIGMIX")
	v.SetEnvKeyReplacer(strings.NewReplacer("-", "_"))
	v.AutomaticEnv()

	file := g.configFile
	explicit := file != ""
	if !explicit {
		if _, err := os.Stat("rigmix.yaml"); err == nil {
			file = "rigmix.yaml"
		}
	}
	if file != "" {
		data, err := readConfigFile(file)
		if err != nil {
			return Config{}, err
		}
		v.SetConfigType("yaml")
		if err := v.ReadConfig(bytes.NewReader(data)); err != nil {
			return Config{}, usageError{fmt.Errorf("%s: is not a YAML configuration file (%s)", file, excerpt(err.Error(), 200))}
		}
		known := map[string]bool{}
		for _, k := range flagKeys {
			known[k] = true
		}
		for _, k := range v.AllKeys() {
			if strings.HasPrefix(k, "plugin_pins.") {
				continue
			}
			if !known[k] && v.InConfig(k) {
				return Config{}, usageError{fmt.Errorf("%s: %s: unknown setting (known: call_timeout, gap, plugin_dir, plugin_pins, rate_book, threads, time_limit)", file, excerpt(k, 60))}
			}
		}
	}
	for _, set := range []*pflag.FlagSet{g.flags, fs} {
		if set == nil {
			continue
		}
		set.VisitAll(func(f *pflag.Flag) {
			if key, ok := flagKeys[f.Name]; ok {
				_ = v.BindPFlag(key, f)
			}
		})
	}
	// where names the layer a value came from: the flag, the environment
	// variable or the configuration file.
	where := func(key string) string {
		for _, set := range []*pflag.FlagSet{fs, g.flags} {
			if set != nil && changed(set, key) {
				return "--" + flagOf(key)
			}
		}
		if env := "RIGMIX_" + strings.ToUpper(key); os.Getenv(env) != "" {
			return "environment variable " + env
		}
		if file != "" && v.InConfig(key) {
			return file + ": " + key
		}
		return key
	}
	var c Config
	for _, key := range []string{"gap", "time_limit", "call_timeout"} {
		t := strings.TrimSpace(v.GetString(key))
		x, err := strconv.ParseFloat(t, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return Config{}, usageError{fmt.Errorf("%s: must be a finite number, got %s", where(key), quoteExcerpt(t))}
		}
		switch key {
		case "gap":
			c.Gap = x
		case "time_limit":
			c.TimeLimit = x
		default:
			c.CallTimeout = x
		}
	}
	t := strings.TrimSpace(v.GetString("threads"))
	if n, err := strconv.Atoi(t); err != nil {
		return Config{}, usageError{fmt.Errorf("%s: must be a whole number, 1 or 2, got %s", where("threads"), quoteExcerpt(t))}
	} else {
		c.Threads = n
	}
	c.PluginDir = v.GetString("plugin_dir")
	c.RateBook = v.GetString("rate_book")
	if c.RateBook != "" {
		c.RateBookFrom = where("rate_book")
	}
	if v.IsSet("plugin_pins") {
		pins := v.GetStringMapString("plugin_pins")
		c.PluginPins = pins
	}
	if c.Gap < 0 || c.Gap >= 1 {
		return Config{}, usageError{fmt.Errorf("%s: must be in [0, 1), got %g", where("gap"), c.Gap)}
	}
	if c.TimeLimit < 0 {
		return Config{}, usageError{fmt.Errorf("%s: must be ≥ 0 seconds, got %g", where("time_limit"), c.TimeLimit)}
	}
	if c.CallTimeout <= 0 || c.CallTimeout > maxCallTimeout {
		return Config{}, usageError{fmt.Errorf("%s: must be > 0 and at most %d seconds, got %g", where("call_timeout"), maxCallTimeout, c.CallTimeout)}
	}
	if c.Threads < 1 || c.Threads > 2 {
		return Config{}, usageError{fmt.Errorf("%s: must be 1 or 2, got %d", where("threads"), c.Threads)}
	}
	if c.PluginDir != "" {
		if st, err := os.Stat(c.PluginDir); err != nil || !st.IsDir() {
			return Config{}, usageError{fmt.Errorf("%s: %s: no such folder; give the folder that holds the rig plugin executables", where("plugin_dir"), quoteExcerpt(c.PluginDir))}
		}
	}
	c.File = file
	return c, nil
}

// changed reports whether the flag bound to a configuration key was set.
func changed(fs *pflag.FlagSet, key string) bool {
	for flag, k := range flagKeys {
		if k == key {
			if f := fs.Lookup(flag); f != nil && f.Changed {
				return true
			}
		}
	}
	return false
}

// flagOf is the flag bound to a configuration key.
func flagOf(key string) string {
	for flag, k := range flagKeys {
		if k == key {
			return flag
		}
	}
	return key
}

// maxCallTimeout bounds --call-timeout (seconds): one day.
const maxCallTimeout = 86400

// maxConfigBytes bounds the configuration file; real ones are a few lines.
const maxConfigBytes = 1 << 20

// readConfigFile reads the configuration file, a regular file of at most
// maxConfigBytes.
func readConfigFile(file string) ([]byte, error) {
	data, err := fielderr.ReadRegular(file, maxConfigBytes)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return nil, usageError{fmt.Errorf("%s: configuration file not found", file)}
	case err != nil:
		return nil, usageError{fmt.Errorf("%s: cannot read configuration: %v", file, unwrapPathErr(err))}
	}
	return data, nil
}

// excerpt shortens s to at most n bytes (at a rune boundary) and escapes
// what is not printable, so a message never carries much of a file.
func excerpt(s string, n int) string {
	q := strconv.Quote(s)
	q = q[1 : len(q)-1]
	if len(q) > n {
		cut := n
		for cut > 0 && !utf8.RuneStart(q[cut]) {
			cut--
		}
		q = q[:cut] + "…"
	}
	return q
}

// quoteExcerpt is excerpt in double quotes.
func quoteExcerpt(s string) string { return `"` + excerpt(s, 60) + `"` }
