package cli

import (
	"fmt"
	"os"
	"path/filepath"
)

// outputs collects every file a command writes so that nothing is written
// until all of them rendered, and then all are put in place or none.
type outputs struct {
	files []outFile
}

type outFile struct {
	path string
	data []byte
}

func (o *outputs) add(path string, data []byte) { o.files = append(o.files, outFile{path, data}) }

// write puts every file in place or none: each goes to a temporary file
// beside its target first, and only when all of them are written are they
// renamed over their targets. A device or pipe given as a target (/dev/null,
// /dev/stdout, a FIFO) is written in place, last.
func (o *outputs) write() error {
	temps := make([]string, len(o.files))
	cleanup := func() {
		for _, t := range temps {
			if t != "" {
				os.Remove(t)
			}
		}
	}
	var direct []outFile
	for i, f := range o.files {
		if isSpecial(f.path) {
			direct = append(direct, f)
			continue
		}
		t, err := writeTemp(f.path, f.data)
		if err != nil {
			cleanup()
			return err
		}
		temps[i] = t
	}
	for i, f := range o.files {
		if temps[i] == "" {
			continue
		}
		if err := os.Rename(temps[i], f.path); err != nil {
			cleanup()
			return fmt.Errorf("%s: %v", f.path, err)
		}
		temps[i] = ""
	}
	for _, f := range direct {
		if err := writeAtomic(f.path, f.data); err != nil {
			return err
		}
	}
	return nil
}

// isSpecial reports whether path names an existing file that is not a
// regular file.
func isSpecial(path string) bool {
	st, err := os.Stat(path)
	return err == nil && !st.Mode().IsRegular()
}

// writeAtomic writes one file through a temporary file and a rename, or in
// place when the target is a device or pipe: renaming a file over it would
// replace the device.
func writeAtomic(path string, data []byte) error {
	if st, err := os.Stat(path); err == nil && !st.Mode().IsRegular() {
		if st.IsDir() {
			return usageError{fmt.Errorf("%s: is a folder; give a file name", path)}
		}
		f, err := os.OpenFile(path, os.O_WRONLY, 0)
		if err != nil {
			return usageError{fmt.Errorf("%s: cannot write: %v", path, err)}
		}
		_, werr := f.Write(data)
		if err := f.Close(); werr == nil {
			werr = err
		}
		return werr
	}
	name, err := writeTemp(path, data)
	if err != nil {
		return err
	}
	if err := os.Rename(name, path); err != nil {
		os.Remove(name)
		return fmt.Errorf("%s: %v", path, err)
	}
	return nil
}

// writeTemp writes data to a new temporary file beside path and returns its
// name.
func writeTemp(path string, data []byte) (string, error) {
	if st, err := os.Stat(path); err == nil && st.IsDir() {
		return "", usageError{fmt.Errorf("%s: is a folder; give a file name", path)}
	}
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return "", usageError{fmt.Errorf("%s: cannot write: %v", path, err)}
	}
	name := tmp.Name()
	_, werr := tmp.Write(data)
	if err := tmp.Sync(); werr == nil {
		werr = err
	}
	if err := tmp.Close(); werr == nil {
		werr = err
	}
	if werr == nil {
		werr = os.Chmod(name, 0o644)
	}
	if werr != nil {
		os.Remove(name)
		return "", fmt.Errorf("%s: %v", path, werr)
	}
	return name, nil
}
