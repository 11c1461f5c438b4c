package cli

import (
	"fmt"
	"os"
	"path/filepath"
)

// outputs collects every file a command writes so that nothing is written
// until all of them rendered, and each is written atomically: to a temporary
// file in the same folder, then renamed over the target.
type outputs struct {
	files []outFile
}

type outFile struct {
	path string
	data []byte
}

func (o *outputs) add(path string, data []byte) { o.files = append(o.files, outFile{path, data}) }

func (o *outputs) write() error {
	for _, f := range o.files {
		if err := writeAtomic(f.path, f.data); err != nil {
			return err
		}
	}
	return nil
}

func writeAtomic(path string, data []byte) error {
	if st, err := os.Stat(path); err == nil && !st.Mode().IsRegular() {
		// A device or pipe (/dev/null, /dev/stdout, a FIFO) is written as
		// it is: renaming a file over it would replace the device.
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
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return usageError{fmt.Errorf("%s: cannot write: %v", path, err)}
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
	if werr == nil {
		werr = os.Rename(name, path)
	}
	if werr != nil {
		os.Remove(name)
		return fmt.Errorf("%s: %v", path, werr)
	}
	return nil
}
