package fielderr

import (
	"errors"
	"fmt"
	"io"
	"os"
)

// ReadRegular reads a regular file of at most maxBytes, so a path to a
// device, a pipe or a huge file cannot stall or swamp a loader. The error
// says what is wrong without the path; the loader adds the file name.
func ReadRegular(path string, maxBytes int64) ([]byte, error) {
	// Checked before opening too: opening a pipe waits for a writer.
	if st, err := os.Stat(path); err != nil {
		return nil, err
	} else if !st.Mode().IsRegular() {
		return nil, errors.New("not a regular file")
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	st, err := f.Stat()
	if err != nil {
		return nil, err
	}
	if !st.Mode().IsRegular() {
		return nil, errors.New("not a regular file")
	}
	if st.Size() > maxBytes {
		return nil, fmt.Errorf("larger than %d MB", maxBytes>>20)
	}
	return io.ReadAll(io.LimitReader(f, maxBytes+1))
}
