package cli

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"sync"
)

// Output files are planned before a command does its work and written only
// after all of them rendered:
//
//   - plan resolves every output path (through links) and refuses, before
//     any work, a path that is an input of the run or another output, a
//     folder, or a file in a folder that is not there or not writable;
//   - commit writes every regular file to a temporary file beside its
//     target (the link's target, never the link), then writes devices and
//     pipes (and "-", standard output), and only then renames the
//     temporary files over their targets, keeping each replaced file's
//     mode; a failure before the renames leaves every file as it was;
//   - nothing is written once the run was interrupted.

// commitMu is held while outputs are put in place; an interrupted Main
// takes it before it exits, so it never leaves half of the renames done.
var commitMu sync.Mutex

// output is one file a command may write.
type output struct {
	flag string // "--json"
	path string // as given; "-" is standard output
	data []byte
	set  bool // data rendered
	csv  bool // a CSV file: gets a byte-order mark when the run asks for one

	target string      // the path written: links followed; "" for "-"
	st     os.FileInfo // the existing target; nil when it is to be created
}

// outputs are the files of one run, and the inputs they must not replace.
type outputs struct {
	stdout io.Writer
	files  []*output
	// summary is printed on standard output after the files are in place
	// (nil: nothing).
	summary []byte
	// committed is set once the files are in place.
	committed bool
	// bom puts a UTF-8 byte-order mark before every CSV output (--csv-bom),
	// so spreadsheets read ≥, ², — and the like as UTF-8.
	bom bool
}

// utf8BOM is the UTF-8 encoding of U+FEFF, the byte-order mark.
var utf8BOM = []byte{0xEF, 0xBB, 0xBF}

// stdoutPath names standard output as an output path.
const stdoutPath = "-"

// add registers the output flag with its path ("" for none) and returns it.
func (o *outputs) add(flag, path string) *output {
	if path == "" {
		return nil
	}
	f := &output{flag: flag, path: path, csv: strings.HasSuffix(flag, "csv")}
	o.files = append(o.files, f)
	return f
}

// toStdout reports whether some output goes to standard output, where the
// text summary would otherwise go.
func (o *outputs) toStdout() bool {
	for _, f := range o.files {
		if f.path == stdoutPath || (f.st != nil && sameFile(f.st, os.Stdout)) {
			return true
		}
	}
	return false
}

// setData gives the rendered bytes of an output registered by add.
func (f *output) setData(b []byte) {
	if f != nil {
		f.data, f.set = b, true
	}
}

// regular reports whether the output is a regular file (or one to be
// created), not standard output, a device or a pipe.
func (f *output) regular() bool {
	return f.path != stdoutPath && (f.st == nil || f.st.Mode().IsRegular())
}

// check resolves every output and refuses one that is an input, the same
// file as another output, a folder, or in a folder that is missing or not
// writable. inputs are the files the run reads.
func (o *outputs) check(inputs []string) error {
	type in struct {
		path string
		st   os.FileInfo
	}
	var ins []in
	for _, p := range inputs {
		if p == "" || p == stdoutPath {
			continue
		}
		if st, err := os.Stat(p); err == nil {
			ins = append(ins, in{p, st})
		}
	}
	for i, f := range o.files {
		if err := f.resolve(); err != nil {
			return err
		}
		for _, x := range ins {
			if f.st != nil && os.SameFile(f.st, x.st) {
				return usageError{fmt.Errorf("%s %s: is the input file %s; writing it would destroy the input; give another file name", f.flag, f.path, x.path)}
			}
		}
		for _, g := range o.files[:i] {
			if clash(f, g) {
				return usageError{fmt.Errorf("%s %s: is the same file as %s %s; give each output its own file", f.flag, f.path, g.flag, g.path)}
			}
		}
	}
	return nil
}

// clash reports whether two outputs would write the same place. The null
// device may take any number.
func clash(f, g *output) bool {
	if f.path == stdoutPath || g.path == stdoutPath {
		return f.path == g.path
	}
	if f.st != nil && g.st != nil {
		if !os.SameFile(f.st, g.st) {
			return false
		}
		null, err := os.Stat(os.DevNull)
		return err != nil || !os.SameFile(f.st, null)
	}
	return f.st == nil && g.st == nil && f.target == g.target
}

// maxLinks bounds the links followed from one output path (as Linux's
// ELOOP does).
const maxLinks = 40

// resolve follows links from the output path to the file to write, and
// checks that it can be written there.
func (f *output) resolve() error {
	if f.path == stdoutPath {
		return nil
	}
	if st, err := os.Stat(f.path); err == nil && !st.Mode().IsRegular() && !st.IsDir() {
		// A device or a pipe (also through a link such as /dev/stdout,
		// whose target may be no path at all, "pipe:[1234]") is written
		// in place through the path given.
		f.st, f.target = st, f.path
		if st.Mode()&fs.ModeNamedPipe != 0 {
			// Opening a pipe now would wait for a reader.
			return nil
		}
		w, err := os.OpenFile(f.path, os.O_WRONLY, 0)
		if err != nil {
			return usageError{fmt.Errorf("%s %s: cannot write: %v", f.flag, f.path, unwrapPathErr(err))}
		}
		w.Close()
		return nil
	}
	p := f.path
	for n := 0; ; n++ {
		if n > maxLinks {
			return usageError{fmt.Errorf("%s %s: too many links", f.flag, f.path)}
		}
		lst, err := os.Lstat(p)
		if errors.Is(err, fs.ErrNotExist) {
			break
		}
		if err != nil {
			return usageError{fmt.Errorf("%s %s: %v", f.flag, f.path, unwrapPathErr(err))}
		}
		if lst.Mode()&fs.ModeSymlink == 0 {
			f.st = lst
			break
		}
		to, err := os.Readlink(p)
		if err != nil {
			return usageError{fmt.Errorf("%s %s: %v", f.flag, f.path, unwrapPathErr(err))}
		}
		if !filepath.IsAbs(to) {
			to = filepath.Join(filepath.Dir(p), to)
		}
		p = to
	}
	dir, err := filepath.EvalSymlinks(filepath.Dir(p))
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return usageError{fmt.Errorf("%s %s: the folder %s is not there; create it first or give another path", f.flag, f.path, filepath.Dir(p))}
	case err != nil:
		return usageError{fmt.Errorf("%s %s: the folder %s: %v", f.flag, f.path, filepath.Dir(p), unwrapPathErr(err))}
	}
	if abs, err := filepath.Abs(dir); err == nil {
		dir = abs
	}
	f.target = filepath.Join(dir, filepath.Base(p))
	switch {
	case f.st == nil:
	case f.st.IsDir():
		return usageError{fmt.Errorf("%s %s: is a folder; give a file name", f.flag, f.path)}
	case !f.st.Mode().IsRegular():
		// Not a folder, not a regular file, yet os.Stat did not say so.
		return usageError{fmt.Errorf("%s %s: not a file that can be written", f.flag, f.path)}
	}
	// The temporary file is made beside the target: check that works now,
	// before the run, rather than after it.
	t, err := os.CreateTemp(dir, "."+filepath.Base(p)+".tmp-*")
	if err != nil {
		return usageError{fmt.Errorf("%s %s: cannot write in the folder %s: %v", f.flag, f.path, dir, unwrapPathErr(err))}
	}
	t.Close()
	os.Remove(t.Name())
	return nil
}

// commit puts every rendered output in place, then prints the summary; or,
// if the run was interrupted, writes nothing.
func (o *outputs) commit(ctx context.Context) error {
	commitMu.Lock()
	defer commitMu.Unlock()
	if ctx.Err() != nil {
		return errInterrupted
	}
	var temps []string
	cleanup := func() {
		for _, t := range temps {
			if t != "" {
				os.Remove(t)
			}
		}
	}
	// Regular files: a temporary file each, beside the target.
	if o.bom {
		for _, f := range o.files {
			if f.set && f.csv && !bytes.HasPrefix(f.data, utf8BOM) {
				f.data = append(append([]byte(nil), utf8BOM...), f.data...)
			}
		}
	}
	var regular []*output
	for _, f := range o.files {
		if !f.set || f.path == stdoutPath || (f.st != nil && !f.st.Mode().IsRegular()) {
			continue
		}
		mode := fs.FileMode(0o644)
		if f.st != nil {
			mode = f.st.Mode().Perm()
		}
		t, err := writeTemp(f, mode)
		if err != nil {
			cleanup()
			return err
		}
		temps = append(temps, t)
		regular = append(regular, f)
	}
	// Devices, pipes and standard output, in the order given.
	for _, f := range o.files {
		if !f.set {
			continue
		}
		var err error
		switch {
		case f.path == stdoutPath:
			_, err = o.stdout.Write(f.data)
		case f.st != nil && !f.st.Mode().IsRegular():
			err = writeInPlace(f)
		default:
			continue
		}
		if err != nil {
			cleanup()
			return fmt.Errorf("%s %s: %v", f.flag, f.path, unwrapPathErr(err))
		}
	}
	for i, f := range regular {
		if err := os.Rename(temps[i], f.target); err != nil {
			cleanup()
			return fmt.Errorf("%s %s: %v", f.flag, f.path, unwrapPathErr(err))
		}
		temps[i] = ""
	}
	o.committed = true
	if o.summary != nil {
		_, err := o.stdout.Write(o.summary)
		return err
	}
	return nil
}

func writeInPlace(f *output) error {
	w, err := os.OpenFile(f.target, os.O_WRONLY, 0)
	if err != nil {
		return err
	}
	_, werr := w.Write(f.data)
	if err := w.Close(); werr == nil {
		werr = err
	}
	return werr
}

// writeTemp writes an output's data to a new temporary file beside its
// target, with the given mode, and returns its name.
func writeTemp(f *output, mode fs.FileMode) (string, error) {
	tmp, err := os.CreateTemp(filepath.Dir(f.target), "."+filepath.Base(f.target)+".tmp-*")
	if err != nil {
		return "", usageError{fmt.Errorf("%s %s: cannot write: %v", f.flag, f.path, unwrapPathErr(err))}
	}
	name := tmp.Name()
	_, werr := tmp.Write(f.data)
	if err := tmp.Sync(); werr == nil {
		werr = err
	}
	if err := tmp.Close(); werr == nil {
		werr = err
	}
	if werr == nil {
		werr = os.Chmod(name, mode)
	}
	if werr != nil {
		os.Remove(name)
		return "", fmt.Errorf("%s %s: %v", f.flag, f.path, unwrapPathErr(werr))
	}
	return name, nil
}

// sameFile reports whether st is the file open as f.
func sameFile(st os.FileInfo, f *os.File) bool {
	fst, err := f.Stat()
	return err == nil && os.SameFile(st, fst)
}

// unwrapPathErr drops the operation and path an *fs.PathError repeats.
func unwrapPathErr(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}
