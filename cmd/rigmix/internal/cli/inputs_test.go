package cli

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// safetyCase is one command line that must be refused quickly: exit 2, one
// line on stderr holding want and none of notWant, nothing on stdout.
type safetyCase struct {
	name    string
	args    []string
	env     map[string]string
	want    []string
	notWant []string
}

// runSafety runs each case in-process, bounded: a case that hangs (a pipe
// opened for reading, a huge read) fails instead of stalling the tests.
func runSafety(t *testing.T, cases []safetyCase) {
	t.Helper()
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			for k, v := range c.env {
				t.Setenv(k, v)
			}
			var stdout, stderr bytes.Buffer
			done := make(chan int, 1)
			go func() { done <- Main(c.args, &stdout, &stderr) }()
			var code int
			select {
			case code = <-done:
			case <-time.After(10 * time.Second):
				t.Fatalf("rigmix %s: still running after 10 s", strings.Join(c.args, " "))
			}
			msg := stderr.String()
			if code != ExitBadInput {
				t.Errorf("exit %d, want %d; stderr %q", code, ExitBadInput, msg)
			}
			if strings.Count(strings.TrimSuffix(msg, "\n"), "\n") > 0 || !strings.HasPrefix(msg, "rigmix: ") {
				t.Errorf("stderr is not one line \"rigmix: ...\": %q", msg)
			}
			for _, w := range c.want {
				if !strings.Contains(msg, w) {
					t.Errorf("stderr %q does not say %q", msg, w)
				}
			}
			for _, w := range c.notWant {
				if strings.Contains(msg, w) {
					t.Errorf("stderr %q holds %q", msg, w)
				}
			}
			if stdout.Len() > 0 {
				t.Errorf("stdout: %.200q", stdout.String())
			}
		})
	}
}

// TestInputsRefused: inputs that are not regular files are refused before
// they are opened (a pipe would wait for ever for a writer, /dev/zero never
// ends), files past a size cap are refused unread, and count flags and
// numbers have caps and must be finite.
func TestInputsRefused(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir)
	fifo := filepath.Join(dir, "fifo.yaml")
	if err := syscall.Mkfifo(fifo, 0o644); err != nil {
		t.Skipf("mkfifo: %v", err)
	}
	sparse := func(name string, size int64) string {
		f, err := os.Create(name)
		if err != nil {
			t.Fatal(err)
		}
		defer f.Close()
		if err := f.Truncate(size); err != nil {
			t.Fatal(err)
		}
		return name
	}
	scenario := func(name, extra string) string {
		body := "units: ft\nname: t\nboundary:\n  polygon: [[0, 0], [300, 0], [300, 200], [0, 200]]\nzones:\n" +
			"  - id: pad\n    use: structure\n" + extra +
			"    structure: {stories: 1, load_class: light}\n    ground: {surface: firm}\n    rules: {max_spacing: 100, min_depth: 20}\n" +
			"rigs: [tire-drill]\nyard_miles: 10\norigin: {lon: -100, lat: 40}\n"
		if err := os.WriteFile(name, []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
		return name
	}
	geo := scenario("geo.yaml", "    geojson: {file: fifo.yaml, feature: pad}\n")
	rb := scenario("rb.yaml", "    polygon: [[50, 50], [250, 50], [250, 150], [50, 150]]\n")
	if err := os.WriteFile(rb, append(must(os.ReadFile(rb)), "rate_book: fifo.yaml\n"...), 0o644); err != nil {
		t.Fatal(err)
	}
	bigConfig := sparse("big-config.yaml", 2<<20)
	bigPlan := sparse("big-plan.json", 300<<20)
	bigModel := sparse("big.mps", 1<<30+1)

	runSafety(t, []safetyCase{
		// Not regular files.
		{name: "scenario is a pipe", args: []string{"plan", fifo}, want: []string{"fifo.yaml", "not a regular file"}},
		{name: "GeoJSON is a pipe", args: []string{"plan", geo}, want: []string{"geo.yaml", "zones[0].geojson", "not a regular file"}},
		{name: "scenario's rate book is a pipe", args: []string{"plan", rb}, want: []string{"rb.yaml", "rate_book", "not a regular file"}},
		{name: "--rate-book is a pipe", args: []string{"plan", "--rate-book", fifo}, want: []string{"fifo.yaml", "not a regular file"}},
		{name: "--config is a pipe", args: []string{"plan", "--config", fifo}, want: []string{"fifo.yaml", "not a regular file"}},
		{name: "--config is /dev/zero", args: []string{"plan", "--config", "/dev/zero"}, want: []string{"/dev/zero", "not a regular file"}},
		{name: "--plan is a pipe", args: []string{"schedule", "--plan", fifo}, want: []string{"--plan", "not a regular file"}},
		{name: "--plan is /dev/zero", args: []string{"schedule", "--plan", "/dev/zero"}, want: []string{"--plan /dev/zero", "not a regular file"}},
		{name: "solve's model is a pipe", args: []string{"solve", fifo}, want: []string{"fifo.yaml", "not a regular file"}},
		{name: "solve's model is /dev/zero", args: []string{"solve", "/dev/zero"}, want: []string{"/dev/zero", "not a regular file"}},
		{name: "--compare-rate-books is a pipe", args: []string{"tradeoffs", "--compare-rate-books", fifo}, want: []string{"fifo.yaml", "not a regular file"}},

		// Size caps, checked before reading.
		{name: "--config past 1 MB", args: []string{"plan", "--config", bigConfig}, want: []string{"big-config.yaml", "larger than 1 MB"}},
		{name: "--plan past 256 MB", args: []string{"schedule", "--plan", bigPlan}, want: []string{"--plan big-plan.json", "larger than 256 MB"}},
		{name: "solve's model past 1 GB", args: []string{"solve", bigModel}, want: []string{"big.mps", "larger than 1024 MB"}},

		// Count flags.
		{name: "--budget-points 1e8", args: []string{"tradeoffs", "--budget-points", "100000000"}, want: []string{"--budget-points", "100", "got 100000000"}},
		{name: "--budget-points -1", args: []string{"tradeoffs", "--budget-points", "-1"}, want: []string{"--budget-points"}},
		{name: "--frontier-points 1e6", args: []string{"tradeoffs", "--frontier-points", "1000000"}, want: []string{"--frontier-points", "got 1000000"}},
		{name: "gen-site --acres 1e9", args: []string{"gen-site", "--acres", "1e9"}, want: []string{"--acres", "at most 10000"}},
		{name: "gen-site --miles 1e9", args: []string{"gen-site", "--miles", "1e9"}, want: []string{"--miles", "at most 200"}},
		{name: "gen-site --acres NaN", args: []string{"gen-site", "--acres", "NaN"}, want: []string{"--acres or --miles"}},
		{name: "gen-site --acres Inf", args: []string{"gen-site", "--acres", "Inf"}, want: []string{"--acres", "at most"}},

		// Numbers: finite, in range.
		{name: "--gap NaN", args: []string{"plan", "--gap", "NaN"}, want: []string{"--gap", "finite", `"NaN"`}},
		{name: "--time-limit Inf", args: []string{"plan", "--time-limit", "Inf"}, want: []string{"--time-limit", "finite"}},
		{name: "--call-timeout NaN", args: []string{"rigs", "--call-timeout", "NaN"}, want: []string{"--call-timeout", "finite"}},
		{name: "--call-timeout a year", args: []string{"rigs", "--call-timeout", "31536000"}, want: []string{"--call-timeout", "at most 86400"}},
		{name: "solve --gap -Inf", args: []string{"solve", "x.mps", "--gap", "-Inf"}, want: []string{"--gap", "finite"}},
		{name: "--budget -5", args: []string{"tradeoffs", "--budget", "-5"}, want: []string{"--budget", "≥ 0", "got -5"}},
		{name: "--budget NaN", args: []string{"tradeoffs", "--budget", "NaN"}, want: []string{"--budget", "finite"}},
		{name: "schedule --runs 1e8", args: []string{"schedule", "--runs", "100000000"}, want: []string{"--runs", "1 to 1000000", "got 100000000"}},
		{name: "report --runs -5", args: []string{"report", "--out", "r.html", "--runs", "-5"}, want: []string{"--runs", "got -5"}},
		{name: "--production-cv NaN", args: []string{"schedule", "--production-cv", "NaN"}, want: []string{"--production-cv", "got NaN"}},
		{name: "--production-cv -1", args: []string{"schedule", "--production-cv", "-1"}, want: []string{"--production-cv", "got -1"}},
		{name: "--wet-prob NaN", args: []string{"schedule", "--wet-prob", "NaN"}, want: []string{"--wet-prob", `"NaN"`, "between 0 and 1"}},
		{name: "--feature-diameter Inf", args: []string{"tradeoffs", "--feature-diameter", "Inf"}, want: []string{"--feature-diameter", "finite"}},
	})
}

// TestSettingsNameTheirSource: a bad tool setting names the flag, the
// environment variable or the configuration file (and key) it came from.
func TestSettingsNameTheirSource(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir)
	if err := os.WriteFile("nan.yaml", []byte("gap: .nan\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile("ok.yaml", []byte("gap: 0.01\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	runSafety(t, []safetyCase{
		{name: "RIGMIX_GAP=abc", args: []string{"plan"}, env: map[string]string{"RIGMIX_GAP": "abc"}, want: []string{"environment variable RIGMIX_GAP", "finite number", `"abc"`}},
		{name: "RIGMIX_GAP=2", args: []string{"plan"}, env: map[string]string{"RIGMIX_GAP": "2"}, want: []string{"environment variable RIGMIX_GAP", "[0, 1)", "got 2"}},
		{name: "RIGMIX_TIME_LIMIT=-1", args: []string{"plan"}, env: map[string]string{"RIGMIX_TIME_LIMIT": "-1"}, want: []string{"environment variable RIGMIX_TIME_LIMIT", "≥ 0"}},
		{name: "RIGMIX_THREADS=many", args: []string{"plan"}, env: map[string]string{"RIGMIX_THREADS": "many"}, want: []string{"environment variable RIGMIX_THREADS", `"many"`}},
		{name: "RIGMIX_CALL_TIMEOUT=0", args: []string{"rigs"}, env: map[string]string{"RIGMIX_CALL_TIMEOUT": "0"}, want: []string{"environment variable RIGMIX_CALL_TIMEOUT", "> 0"}},
		{name: "RIGMIX_PLUGIN_DIR missing", args: []string{"rigs"}, env: map[string]string{"RIGMIX_PLUGIN_DIR": "no-such-dir"}, want: []string{"environment variable RIGMIX_PLUGIN_DIR", "no-such-dir", "no such folder"}},
		{name: "RIGMIX_RATE_BOOK missing", args: []string{"plan"}, env: map[string]string{"RIGMIX_RATE_BOOK": "no-such-rates.yaml"}, want: []string{"environment variable RIGMIX_RATE_BOOK: no-such-rates.yaml: no such file"}},
		{name: "--rate-book missing", args: []string{"plan", "--rate-book", "no-such-rates.yaml"}, want: []string{"--rate-book: no-such-rates.yaml: no such file"}},
		{name: "flag over a good variable", args: []string{"plan", "--gap", "2"}, env: map[string]string{"RIGMIX_GAP": "0.1"}, want: []string{"--gap: must be in [0, 1), got 2"}, notWant: []string{"RIGMIX_GAP"}},
		{name: "variable over a good file", args: []string{"plan", "--config", "ok.yaml"}, env: map[string]string{"RIGMIX_GAP": "1.5"}, want: []string{"environment variable RIGMIX_GAP"}, notWant: []string{"ok.yaml"}},
		{name: "file", args: []string{"plan", "--config", "nan.yaml"}, want: []string{"nan.yaml: gap: must be a finite number"}},
	})
}

// TestMessagesQuoteLittle: a message quotes at most a short, escaped
// excerpt of a file that is not what it should be, and never a terminal
// control sequence.
func TestMessagesQuoteLittle(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir)
	pw := "root:x:0:0:root:/root:/bin/bash\ndaemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin\nsecret-second-line:x:2:2\n"
	if err := os.WriteFile("passwd", []byte(pw), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile("long.mps", []byte(strings.Repeat("x", 10000)+"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile("esc.yaml", []byte(`units: "\e[2J\e[31mft"`+"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile("esc-config.yaml", []byte(`threads: "\e]0;title\atwo"`+"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	runSafety(t, []safetyCase{
		{name: "a system file as the rate book", args: []string{"plan", "--rate-book", "passwd"},
			want: []string{"passwd", `"root:x:0:0:root:/root:/bin/bash daemon:x"…`}, notWant: []string{"nologin", "secret-second-line"}},
		{name: "a system file as the configuration", args: []string{"plan", "--config", "passwd"},
			want: []string{"passwd", "not a YAML configuration file"}, notWant: []string{"nologin", "secret-second-line"}},
		{name: "a system file as the scenario", args: []string{"plan", "passwd"},
			want: []string{"passwd", `"root:x:0:0:root:/root:/bin/bash daemon:x"…`}, notWant: []string{"nologin", "secret-second-line"}},
		{name: "a one-line file of 10,000 characters as the model", args: []string{"solve", "long.mps"},
			want: []string{"long.mps", "… (cut)"}},
		{name: "escape sequences in a scenario value", args: []string{"plan", "esc.yaml"},
			want: []string{"esc.yaml", "units"}, notWant: []string{"\x1b"}},
		{name: "escape sequences in a configuration value", args: []string{"plan", "--config", "esc-config.yaml"},
			want: []string{"threads", `\x1b`}, notWant: []string{"\x1b", "\x07"}},
	})
}

func must(b []byte, err error) []byte {
	if err != nil {
		panic(err)
	}
	return b
}

// TestPrintable: the last guard before stderr escapes control characters
// an error may carry unquoted, keeping line breaks and tabs.
func TestPrintable(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"plain message", "plain message"},
		{"clear \x1b[2J screen", `clear \x1b[2J screen`},
		{"bell\a and del\x7f", `bell\a and del\x7f`},
		{"two\nlines\tand a tab", "two\nlines\tand a tab"},
		{"bad utf-8 \xff here", "bad utf-8 \ufffd here"},
		{"unicode ≥ ± µ stays", "unicode ≥ ± µ stays"},
		{strings.Repeat("a", 600) + "\nshort", strings.Repeat("a", 500) + "… (cut)\nshort"},
		{strings.Repeat("µ", 500), strings.Repeat("µ", 500)},
	} {
		if got := printable(c.in); got != c.want {
			t.Errorf("printable(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}
