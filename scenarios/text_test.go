package scenarios

import (
	"strings"
	"testing"
)

// TestTextAsWritten: text fields keep what the file says even where YAML
// would read the scalar as a number, a date or a boolean.
func TestTextAsWritten(t *testing.T) {
	base := mustRead(t, "testdata/good/base.yaml")
	data := strings.Replace(base, "- id: A", "- id: 01", 1) +
		"title: 2026-01-01\ndescription: 1e5\nnote: yes\n"
	s, err := Parse([]byte(data), "text.yaml", nil)
	if err != nil {
		t.Fatal(err)
	}
	if s.Zones[0].ID != "01" || s.Zones[0].Name != "01" || s.Title != "2026-01-01" || s.Description != "1e5" || s.Note != "yes" {
		t.Errorf("id %q name %q title %q description %q note %q", s.Zones[0].ID, s.Zones[0].Name, s.Title, s.Description, s.Note)
	}
	// An override replaces the file's text.
	s, err = Parse([]byte(data), "text.yaml", map[string]any{"title": 42})
	if err != nil || s.Title != "42" {
		t.Errorf("override title: %v %q", err, s.Title)
	}
}
