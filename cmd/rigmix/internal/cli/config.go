package cli

import (
	"errors"
	"fmt"
	"os"
	"strconv"
	"strings"

	"github.com/spf13/pflag"
	"github.com/spf13/viper"
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
		v.SetConfigFile(file)
		v.SetConfigType("yaml")
		if err := v.ReadInConfig(); err != nil {
			var nf viper.ConfigFileNotFoundError
			if errors.As(err, &nf) || os.IsNotExist(err) {
				return Config{}, usageError{fmt.Errorf("%s: configuration file not found", file)}
			}
			return Config{}, usageError{fmt.Errorf("%s: cannot read configuration: %v", file, err)}
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
				return Config{}, usageError{fmt.Errorf("%s: %s: unknown setting (known: call_timeout, gap, plugin_dir, plugin_pins, rate_book, threads, time_limit)", file, k)}
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
	// where names the layer a bad value came from, so the message points
	// at the file when the file set it.
	where := func(key string) string {
		if file != "" && v.InConfig(key) && (fs == nil || !changed(fs, key)) && os.Getenv("RIGMIX_"+strings.ToUpper(key)) == "" {
			return file + ": " + key
		}
		return key
	}
	if t := v.GetString("threads"); t != "" {
		if _, err := strconv.Atoi(t); err != nil {
			return Config{}, usageError{fmt.Errorf("%s: must be a whole number, 1 or 2, got %q", where("threads"), t)}
		}
	}
	var c Config
	if err := v.Unmarshal(&c); err != nil {
		return Config{}, usageError{fmt.Errorf("%s: %v", firstNonEmpty(file, "configuration"), strings.ReplaceAll(err.Error(), "\n", " "))}
	}
	if c.Gap < 0 || c.Gap >= 1 {
		return Config{}, usageError{fmt.Errorf("%s: must be in [0, 1), got %g", where("gap"), c.Gap)}
	}
	if c.TimeLimit < 0 {
		return Config{}, usageError{fmt.Errorf("%s: must be ≥ 0 seconds, got %g", where("time_limit"), c.TimeLimit)}
	}
	if c.CallTimeout <= 0 {
		return Config{}, usageError{fmt.Errorf("%s: must be > 0 seconds, got %g", where("call_timeout"), c.CallTimeout)}
	}
	if c.Threads < 1 || c.Threads > 2 {
		return Config{}, usageError{fmt.Errorf("%s: must be 1 or 2, got %d", where("threads"), c.Threads)}
	}
	if c.PluginDir != "" {
		if st, err := os.Stat(c.PluginDir); err != nil || !st.IsDir() {
			return Config{}, usageError{fmt.Errorf("%s: %s: no such folder; give the folder that holds the rig plugin executables", where("plugin_dir"), c.PluginDir)}
		}
	}
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

func firstNonEmpty(a, b string) string {
	if a != "" {
		return a
	}
	return b
}
