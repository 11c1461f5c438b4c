package scenarios

import (
	"bytes"
	"strings"
	"testing"
)

// TestDemoFiles: a demo written out whole is its YAML and exactly the
// embedded files the YAML reads, byte for byte; a demo reading none is
// its YAML alone.
func TestDemoFiles(t *testing.T) {
	for _, c := range []struct {
		name string
		want []string
	}{
		{"hillside", []string{"hillside.yaml", "hillside.geojson"}},
		{"midrise", []string{"midrise.yaml"}},
		{"wetlot", []string{"wetlot.yaml"}},
	} {
		files, err := DemoFiles(c.name)
		if err != nil {
			t.Fatal(err)
		}
		var got []string
		for _, f := range files {
			got = append(got, f.Name)
			b, err := demoFS.ReadFile("demos/" + f.Name)
			if err != nil || !bytes.Equal(b, f.Data) {
				t.Errorf("%s: %s is not the embedded file (%v)", c.name, f.Name, err)
			}
		}
		if strings.Join(got, " ") != strings.Join(c.want, " ") {
			t.Errorf("%s: files %q, want %q", c.name, got, c.want)
		}
	}
	if _, err := DemoFiles("nosuch"); err == nil {
		t.Error("no error for an unknown demo")
	}
}
