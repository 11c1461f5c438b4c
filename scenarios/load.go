package scenarios

import (
	"bytes"
	"embed"
	"errors"
	"fmt"
	"io/fs"
	"path"
	"path/filepath"
	"sort"
	"strings"
	"unicode/utf8"

	"github.com/rigmix/rigmix/scenarios/fielderr"
	"github.com/spf13/viper"
	"gopkg.in/yaml.v3"
)

// DefaultDemo is the demo scenario used when none is named.
const DefaultDemo = "midrise"

// maxFileBytes bounds a scenario file; real ones are a few kilobytes.
const maxFileBytes = 8 << 20

//go:embed demos/*.yaml demos/*.geojson
var demoFS embed.FS

// Demos lists the names of the embedded demo scenarios, sorted.
func Demos() []string {
	entries, err := fs.ReadDir(demoFS, "demos")
	if err != nil {
		panic(err) // the embedded folder is part of the binary
	}
	var names []string
	for _, e := range entries {
		if n, ok := strings.CutSuffix(e.Name(), ".yaml"); ok {
			names = append(names, n)
		}
	}
	sort.Strings(names)
	return names
}

// DemoFile returns the raw YAML of a demo scenario.
func DemoFile(name string) ([]byte, error) {
	for _, n := range Demos() {
		if n == name {
			return demoFS.ReadFile("demos/" + name + ".yaml")
		}
	}
	return nil, &FieldError{File: "demo:" + name, Problem: "no such demo scenario", Hint: suggestOneOf(name, Demos())}
}

// File is one file of a demo written out: its name relative to the
// demo's YAML, and its bytes.
type File struct {
	Name string
	Data []byte
}

// DemoFiles is a demo whole: its YAML (NAME.yaml) first, then every
// embedded file the YAML reads (GeoJSON outlines), each once, in the order
// read, so that the YAML written into a folder beside them plans as the
// demo does.
func DemoFiles(name string) ([]File, error) {
	sc, err := LoadDemo(name, nil)
	if err != nil {
		return nil, err
	}
	data, err := DemoFile(name)
	if err != nil {
		return nil, err
	}
	out := []File{{Name: name + ".yaml", Data: data}}
	seen := map[string]bool{out[0].Name: true}
	for _, rel := range sc.embedded {
		if seen[rel] {
			continue
		}
		seen[rel] = true
		b, err := demoFS.ReadFile("demos/" + rel)
		if err != nil {
			return nil, err
		}
		out = append(out, File{Name: rel, Data: b})
	}
	return out, nil
}

// LoadDemo loads an embedded demo scenario by name.
func LoadDemo(name string, overrides map[string]any) (*Scenario, error) {
	data, err := DemoFile(name)
	if err != nil {
		return nil, err
	}
	return Parse(data, "demo:"+name, overrides)
}

// Load reads, merges and validates a scenario file. Settings are taken, in
// rising precedence, from defaults, the file and overrides (keys such as "solver.gap" or "yard_miles"; see
// SettingKeys).
func Load(path string, overrides map[string]any) (*Scenario, error) {
	data, err := fielderr.ReadRegular(path, maxFileBytes)
	if err != nil {
		problem := "cannot read the file: " + unwrapPathErr(err)
		hint := ""
		if errors.Is(err, fs.ErrNotExist) {
			problem, hint = "no such file", "check the path; `rigmix` can also write out a demo scenario to start from"
		}
		return nil, &FieldError{File: path, Problem: problem, Hint: hint}
	}
	return Parse(data, path, overrides)
}

// Parse validates scenario YAML. source names the data in messages; when
// it is "demo:NAME" relative files come from the embedded demos, otherwise
// relative paths (GeoJSON files, a rate-book file) resolve against
// filepath.Dir(source).
func Parse(data []byte, source string, overrides map[string]any) (*Scenario, error) {
	d := &decoder{file: source}
	demo := strings.HasPrefix(source, "demo:")
	var files, embedded []string
	d.readFile = func(rel string) ([]byte, string, error) {
		if demo {
			p := path.Clean("demos/" + rel)
			if !strings.HasPrefix(p, "demos/") {
				return nil, rel, fs.ErrNotExist
			}
			b, err := demoFS.ReadFile(p)
			if err == nil {
				embedded = append(embedded, strings.TrimPrefix(p, "demos/"))
			}
			return b, rel, err
		}
		p := rel
		if !filepath.IsAbs(p) {
			p = filepath.Join(filepath.Dir(source), rel)
		}
		b, err := fielderr.ReadRegular(p, maxFileBytes)
		if err == nil {
			files = append(files, p)
		}
		return b, p, err
	}

	if err := checkText(source, data); err != nil {
		return nil, err
	}
	var doc yaml.Node
	if err := yaml.Unmarshal(data, &doc); err != nil {
		return nil, &FieldError{File: source, Problem: "is not valid YAML: " + strings.TrimPrefix(err.Error(), "yaml: "),
			Hint: "indent with spaces, and write each setting as key: value"}
	}
	if doc.Kind == 0 || (doc.Kind == yaml.DocumentNode && len(doc.Content) == 0) {
		return nil, emptyFile(source)
	}
	if err := checkKeys(source, &doc); err != nil {
		return nil, err
	}

	v := viper.New()
	v.SetConfigType("yaml")
	if err := v.ReadConfig(bytes.NewReader(data)); err != nil {
		return nil, &FieldError{File: source, Problem: "is not valid YAML: " + err.Error()}
	}
	// The environment is never read here: a scenario means what its file
	// says (and the caller's overrides), whatever the shell holds.
	okeys := make([]string, 0, len(overrides))
	for k := range overrides {
		okeys = append(okeys, k)
	}
	sort.Strings(okeys)
	for _, k := range okeys {
		if !contains(settingKeys, k) {
			return nil, &FieldError{File: "overrides", Field: k, Problem: "not a setting that can be overridden",
				Hint: suggest(k, settingKeys)}
		}
		v.Set(k, overrides[k])
	}
	d.rawText = map[string]string{}
	scalarText(&doc, "", d.rawText)
	for k := range overrides {
		delete(d.rawText, k)
	}
	s, err := d.decode(v.AllSettings())
	if err != nil {
		return nil, err
	}
	if err := d.crossCheck(s); err != nil {
		return nil, err
	}
	s.Source = source
	s.Files = files
	s.embedded = embedded
	return s, nil
}

func emptyFile(source string) error {
	return &FieldError{File: source, Problem: "is empty",
		Hint: "a scenario needs at least units, name, boundary, zones, rigs and yard_miles; see scenarios/REFERENCE.md or print a demo with rigmix"}
}

// checkText refuses empty files and files that are not UTF-8 text.
func checkText(source string, data []byte) error {
	if len(bytes.TrimSpace(data)) == 0 {
		return emptyFile(source)
	}
	if len(data) > maxFileBytes {
		return &FieldError{File: source, Problem: fmt.Sprintf("is %d bytes; a scenario file is at most %d MB", len(data), maxFileBytes>>20)}
	}
	if bytes.IndexByte(data, 0) >= 0 || !utf8.Valid(data) {
		return &FieldError{File: source, Problem: "is not a text file (binary or not UTF-8)",
			Hint: "a scenario is a YAML text file; is this the right file?"}
	}
	return nil
}

// scalarText records the written text of every scalar in the document by
// field path ("zones[0].id").
func scalarText(n *yaml.Node, path string, out map[string]string) {
	if n.Kind == yaml.AliasNode && n.Alias != nil {
		n = n.Alias
	}
	switch n.Kind {
	case yaml.DocumentNode:
		for _, c := range n.Content {
			scalarText(c, path, out)
		}
	case yaml.MappingNode:
		for i := 0; i+1 < len(n.Content); i += 2 {
			if k := n.Content[i].Value; k == "<<" {
				scalarText(n.Content[i+1], path, out)
			} else {
				scalarText(n.Content[i+1], join(path, k), out)
			}
		}
	case yaml.SequenceNode:
		for i, c := range n.Content {
			scalarText(c, fmt.Sprintf("%s[%d]", path, i), out)
		}
	case yaml.ScalarNode:
		out[path] = n.Value
	}
}
