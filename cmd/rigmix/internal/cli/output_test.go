package cli

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestOutputsCheck: every output path is resolved (links followed, same
// file by os.SameFile) and refused, before any work, when it is an input
// of the run, another output of the run, a folder, or in a missing folder.
func TestOutputsCheck(t *testing.T) {
	type out struct{ flag, path string }
	cases := []struct {
		name   string
		setup  func(t *testing.T) // in the test's folder
		inputs []string
		outs   []out
		want   string // "" for accepted; else words of the one-line error
	}{
		{name: "new file", outs: []out{{"--json", "plan.json"}}},
		{name: "output is the scenario", inputs: []string{"site.yaml"},
			outs: []out{{"--json", "site.yaml"}}, want: "--json site.yaml: is the input file site.yaml"},
		{name: "output is a link to the scenario", inputs: []string{"site.yaml"},
			setup: func(t *testing.T) { link(t, "site.yaml", "plan.json") },
			outs:  []out{{"--json", "plan.json"}}, want: "--json plan.json: is the input file site.yaml"},
		{name: "output is a chain of links to the rate book", inputs: []string{"site.yaml", "rates.yaml"},
			setup: func(t *testing.T) { link(t, "rates.yaml", "l1"); link(t, "l1", "l2") },
			outs:  []out{{"--points-csv", "l2"}}, want: "is the input file rates.yaml"},
		{name: "output is a hard link to the scenario", inputs: []string{"site.yaml"},
			setup: func(t *testing.T) {
				if err := os.Link("site.yaml", "hard.json"); err != nil {
					t.Skip(err)
				}
			},
			outs: []out{{"--json", "hard.json"}}, want: "is the input file site.yaml"},
		{name: "output is the scenario by another path", inputs: []string{"site.yaml"},
			setup: func(t *testing.T) { mkdir(t, "sub") },
			outs:  []out{{"--json", "sub/../site.yaml"}}, want: "is the input file"},
		{name: "input given through a link", inputs: []string{"in-link.yaml"},
			setup: func(t *testing.T) { link(t, "site.yaml", "in-link.yaml") },
			outs:  []out{{"--json", "site.yaml"}}, want: "is the input file in-link.yaml"},
		{name: "two outputs, one new path", outs: []out{{"--json", "a.json"}, {"--points-csv", "./a.json"}},
			want: "--points-csv ./a.json: is the same file as --json a.json"},
		{name: "two outputs, one existing file", outs: []out{{"--json", "site.yaml"}, {"--points-csv", "site.yaml"}},
			want: "is the same file as --json site.yaml"},
		{name: "two outputs, a link and its target", setup: func(t *testing.T) { link(t, "old.json", "l.json") },
			outs: []out{{"--json", "old.json"}, {"--points-csv", "l.json"}}, want: "is the same file as --json old.json"},
		{name: "two outputs to standard output", outs: []out{{"--json", "-"}, {"--points-csv", "-"}},
			want: "--points-csv -: is the same file as --json -"},
		{name: "the null device twice", outs: []out{{"--json", os.DevNull}, {"--points-csv", os.DevNull}}},
		{name: "a folder", setup: func(t *testing.T) { mkdir(t, "dir") },
			outs: []out{{"--json", "dir"}}, want: "--json dir: is a folder"},
		{name: "a link to a folder", setup: func(t *testing.T) { mkdir(t, "dir"); link(t, "dir", "dl") },
			outs: []out{{"--json", "dl"}}, want: "--json dl: is a folder"},
		{name: "a missing folder", outs: []out{{"--json", "plan.json"}, {"--points-csv", "nowhere/p.csv"}},
			want: "--points-csv nowhere/p.csv: the folder nowhere is not there"},
		{name: "a link loop", setup: func(t *testing.T) { link(t, "loop2", "loop1"); link(t, "loop1", "loop2") },
			outs: []out{{"--json", "loop1"}}, want: "too many links"},
		{name: "a dangling link", setup: func(t *testing.T) { link(t, "made.json", "dangling") },
			outs: []out{{"--json", "dangling"}}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Chdir(t.TempDir())
			write(t, "site.yaml", "units: ft\n", 0o644)
			write(t, "rates.yaml", "items: []\n", 0o644)
			write(t, "old.json", "{}\n", 0o644)
			if c.setup != nil {
				c.setup(t)
			}
			o := &outputs{stdout: &bytes.Buffer{}}
			for _, x := range c.outs {
				o.add(x.flag, x.path)
			}
			err := o.check(c.inputs)
			switch {
			case c.want == "" && err != nil:
				t.Fatalf("refused: %v", err)
			case c.want != "" && err == nil:
				t.Fatalf("accepted; want %q", c.want)
			case c.want != "":
				var bi badInput
				if !errors.As(err, &bi) || !bi.BadInput() {
					t.Errorf("%v: not a bad-input error (exit 2)", err)
				}
				if !strings.Contains(err.Error(), c.want) || strings.Contains(err.Error(), "\n") {
					t.Errorf("error %q, want one line with %q", err, c.want)
				}
			}
			if b, err := os.ReadFile("site.yaml"); err != nil || string(b) != "units: ft\n" {
				t.Errorf("the check changed the input: %q %v", b, err)
			}
			assertNoTemps(t, ".")
		})
	}
}

// TestOutputsCommit: outputs are written through links to their targets,
// keep the replaced file's mode, go to standard output for "-", and are
// all put in place or none.
func TestOutputsCommit(t *testing.T) {
	t.Run("through a link, keeping the mode", func(t *testing.T) {
		t.Chdir(t.TempDir())
		mkdir(t, "real")
		write(t, "real/plan.json", "old\n", 0o600)
		link(t, "real/plan.json", "plan.json")
		o := commitOne(t, "plan.json", "new\n")
		_ = o
		st, err := os.Lstat("plan.json")
		if err != nil || st.Mode()&os.ModeSymlink == 0 {
			t.Fatalf("the link was replaced: %v %v", st.Mode(), err)
		}
		assertFile(t, "real/plan.json", "new\n", 0o600)
		assertNoTemps(t, ".")
		assertNoTemps(t, "real")
	})
	t.Run("a dangling link makes its target", func(t *testing.T) {
		t.Chdir(t.TempDir())
		mkdir(t, "real")
		link(t, "real/made.json", "plan.json")
		commitOne(t, "plan.json", "new\n")
		assertFile(t, "real/made.json", "new\n", 0o644)
	})
	t.Run("modes kept", func(t *testing.T) {
		for _, mode := range []os.FileMode{0o600, 0o640, 0o664, 0o755} {
			t.Chdir(t.TempDir())
			write(t, "plan.json", "old\n", mode)
			commitOne(t, "plan.json", "new\n")
			assertFile(t, "plan.json", "new\n", mode)
		}
	})
	t.Run("a link to a pipe with no path, as /dev/stdout is", func(t *testing.T) {
		if _, err := os.Stat("/proc/self/fd"); err != nil {
			t.Skip("no /proc/self/fd")
		}
		t.Chdir(t.TempDir())
		r, w, err := os.Pipe()
		if err != nil {
			t.Fatal(err)
		}
		defer r.Close()
		defer w.Close()
		// /proc/self/fd/N of a pipe links to "pipe:[inode]", no path.
		link(t, fmt.Sprintf("/proc/self/fd/%d", w.Fd()), "stdout-link")
		got := make(chan string, 1)
		go func() {
			b, _ := io.ReadAll(r)
			got <- string(b)
		}()
		commitOne(t, "stdout-link", "through the pipe\n")
		w.Close()
		if s := <-got; s != "through the pipe\n" {
			t.Errorf("the pipe read %q", s)
		}
		st, err := os.Lstat("stdout-link")
		if err != nil || st.Mode()&os.ModeSymlink == 0 {
			t.Errorf("the link was replaced: %v %v", st.Mode(), err)
		}
		assertNoTemps(t, ".")
	})
	t.Run("standard output, then the summary", func(t *testing.T) {
		t.Chdir(t.TempDir())
		var stdout bytes.Buffer
		o := &outputs{stdout: &stdout}
		o.add("--json", "-").setData([]byte("{}\n"))
		f := o.add("--points-csv", "p.csv")
		f.setData([]byte("id\n"))
		if err := o.check(nil); err != nil {
			t.Fatal(err)
		}
		if !o.toStdout() {
			t.Error("toStdout false with --json -")
		}
		o.summary = []byte("summary\n")
		if err := o.commit(context.Background()); err != nil {
			t.Fatal(err)
		}
		if stdout.String() != "{}\nsummary\n" {
			t.Errorf("stdout %q", stdout.String())
		}
		assertFile(t, "p.csv", "id\n", 0o644)
	})
	t.Run("a byte-order mark on every CSV and nothing else", func(t *testing.T) {
		t.Chdir(t.TempDir())
		var stdout bytes.Buffer
		o := &outputs{stdout: &stdout, bom: true}
		o.add("--json", "p.json").setData([]byte("{}\n"))
		o.add("--points-csv", "p.csv").setData([]byte("id\n"))
		o.add("--csv", "-").setData([]byte("day\n"))
		o.add("--estimate-csv", "e.csv").setData([]byte("\xEF\xBB\xBFitem\n")) // already marked: one mark, not two
		if err := o.check(nil); err != nil {
			t.Fatal(err)
		}
		if err := o.commit(context.Background()); err != nil {
			t.Fatal(err)
		}
		assertFile(t, "p.json", "{}\n", 0o644)
		assertFile(t, "p.csv", "\xEF\xBB\xBFid\n", 0o644)
		assertFile(t, "e.csv", "\xEF\xBB\xBFitem\n", 0o644)
		if stdout.String() != "\xEF\xBB\xBFday\n" {
			t.Errorf("stdout %q", stdout.String())
		}
	})
	t.Run("a device that fails leaves the files as they were", func(t *testing.T) {
		if _, err := os.Stat("/dev/full"); err != nil {
			t.Skip("no /dev/full")
		}
		t.Chdir(t.TempDir())
		write(t, "plan.json", "old\n", 0o644)
		o := &outputs{stdout: &bytes.Buffer{}}
		o.add("--json", "plan.json").setData([]byte("new\n"))
		o.add("--points-csv", "/dev/full").setData([]byte("id\n"))
		if err := o.check(nil); err != nil {
			t.Fatal(err)
		}
		err := o.commit(context.Background())
		if err == nil || !strings.Contains(err.Error(), "--points-csv /dev/full") {
			t.Fatalf("commit: %v; want an error naming --points-csv /dev/full", err)
		}
		assertFile(t, "plan.json", "old\n", 0o644)
		assertNoTemps(t, ".")
	})
	t.Run("interrupted: nothing written", func(t *testing.T) {
		t.Chdir(t.TempDir())
		write(t, "plan.json", "old\n", 0o644)
		var stdout bytes.Buffer
		o := &outputs{stdout: &stdout}
		o.add("--json", "plan.json").setData([]byte("partial\n"))
		o.summary = []byte("partial numbers\n")
		if err := o.check(nil); err != nil {
			t.Fatal(err)
		}
		ctx, cancel := context.WithCancel(context.Background())
		cancel()
		if err := o.commit(ctx); !errors.Is(err, errInterrupted) {
			t.Fatalf("commit after a cancel: %v", err)
		}
		assertFile(t, "plan.json", "old\n", 0o644)
		if stdout.Len() > 0 {
			t.Errorf("printed %q after the interrupt", stdout.String())
		}
	})
}

func commitOne(t *testing.T, path, data string) *outputs {
	t.Helper()
	o := &outputs{stdout: &bytes.Buffer{}}
	o.add("--json", path).setData([]byte(data))
	if err := o.check(nil); err != nil {
		t.Fatal(err)
	}
	if err := o.commit(context.Background()); err != nil {
		t.Fatal(err)
	}
	return o
}

func write(t *testing.T, name, body string, mode os.FileMode) {
	t.Helper()
	if err := os.WriteFile(name, []byte(body), mode); err != nil {
		t.Fatal(err)
	}
	if err := os.Chmod(name, mode); err != nil { // past the umask
		t.Fatal(err)
	}
}

func link(t *testing.T, target, name string) {
	t.Helper()
	if err := os.Symlink(target, name); err != nil {
		t.Skip(err)
	}
}

func mkdir(t *testing.T, name string) {
	t.Helper()
	if err := os.Mkdir(name, 0o755); err != nil {
		t.Fatal(err)
	}
}

func assertFile(t *testing.T, name, body string, mode os.FileMode) {
	t.Helper()
	b, err := os.ReadFile(name)
	if err != nil || string(b) != body {
		t.Errorf("%s: %q %v, want %q", name, b, err, body)
	}
	if st, err := os.Stat(name); err == nil && st.Mode().Perm() != mode {
		t.Errorf("%s: mode %v, want %v", name, st.Mode().Perm(), mode)
	}
}

func assertNoTemps(t *testing.T, dir string) {
	t.Helper()
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if strings.Contains(e.Name(), ".tmp-") {
			t.Errorf("temporary file %s left in %s", e.Name(), filepath.Clean(dir))
		}
	}
}
