package scenarios

import (
	"errors"
	"os"
	"path/filepath"
	"testing"
)

// FuzzParse feeds arbitrary bytes to Parse: it must never panic, and must
// either load a scenario or return a *FieldError.
func FuzzParse(f *testing.F) {
	for _, name := range Demos() {
		b, _ := DemoFile(name)
		f.Add(b)
	}
	for _, dir := range []string{"bad", "good"} {
		files, _ := filepath.Glob(filepath.Join("testdata", dir, "*.yaml"))
		for _, p := range files {
			if b, err := os.ReadFile(p); err == nil {
				f.Add(b)
			}
		}
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		s, err := Parse(data, filepath.Join("testdata", "good", "fuzz.yaml"), nil)
		if err != nil {
			var fe *FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("error %T is not a *FieldError: %v", err, err)
			}
			if s != nil {
				t.Fatal("both a scenario and an error")
			}
			return
		}
		if len(s.Zones) == 0 || len(s.Boundary) < 3 || s.Units == "" {
			t.Fatalf("loaded an incomplete scenario: %+v", s)
		}
	})
}
