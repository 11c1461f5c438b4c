package cli

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestExitCodes runs Main in-process for the cases that must not start a
// rig: usage and input mistakes exit 2 with one message on stderr.
func TestExitCodes(t *testing.T) {
	dir := t.TempDir()
	empty := filepath.Join(dir, "empty.yaml")
	if err := os.WriteFile(empty, nil, 0o644); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		args []string
		code int
		msg  string
	}{
		{[]string{"--no-such-flag"}, ExitBadInput, "unknown flag"},
		{[]string{"plan", "a.yaml", "b.yaml"}, ExitBadInput, "accepts at most 1 arg"},
		{[]string{"plan", filepath.Join(dir, "missing.yaml")}, ExitBadInput, "missing.yaml"},
		{[]string{"plan", empty}, ExitBadInput, "empty.yaml"},
		{[]string{"plan", "--gap", "-1"}, ExitBadInput, "gap"},
		{[]string{"demos", "nowhere"}, ExitBadInput, "nowhere"},
		{[]string{"solve", filepath.Join(dir, "none.mps")}, ExitBadInput, "none.mps"},
		{[]string{"demos"}, ExitOK, ""},
	}
	for _, c := range cases {
		t.Run(strings.Join(c.args, " "), func(t *testing.T) {
			var out, errb bytes.Buffer
			code := Main(c.args, &out, &errb)
			if code != c.code {
				t.Fatalf("exit %d, want %d; stderr: %s", code, c.code, errb.String())
			}
			if c.msg != "" && !strings.Contains(errb.String(), c.msg) {
				t.Fatalf("stderr %q does not mention %q", errb.String(), c.msg)
			}
			if strings.Contains(errb.String(), "goroutine ") {
				t.Fatalf("stack trace on stderr: %s", errb.String())
			}
		})
	}
}
