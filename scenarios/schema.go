package scenarios

import (
	"fmt"
	"sort"
	"strconv"
	"strings"

	"gopkg.in/yaml.v3"
)

// keys describes the shape of a scenario file: which keys a mapping may
// hold and what each key's value looks like. The loader compares the keys
// in a file against it before anything else, so a misspelt key is an error
// with a suggestion rather than a setting silently ignored.
type keys struct {
	fields map[string]*keys // a mapping with these keys
	items  *keys            // a sequence whose items have this shape
	// scalarOK lets a mapping key hold a plain value instead (min_depth: 70
	// or min_depth: {from: stories}; lab: none or lab: {...}); the decoder
	// checks the value.
	scalarOK bool
}

// leaf is any value whose inner keys are not checked here (scalars, lists
// of numbers); the decoder checks its type.
var leaf = &keys{}

func mapping(f map[string]*keys) *keys { return &keys{fields: f} }
func listOf(k *keys) *keys             { return &keys{items: k} }

// orScalar marks a mapping that may also be written as a plain value.
func orScalar(k *keys) *keys { k.scalarOK = true; return k }

// minDepthKeys are the keys of a computed depth rule, for every kind of
// "from"; the decoder checks which of them the chosen kind uses.
var minDepthKeys = orScalar(mapping(map[string]*keys{
	"from":             leaf,
	"width":            leaf,
	"length":           leaf,
	"shape":            leaf,
	"bearing_pressure": leaf,
	"foundation_depth": leaf,
	"unit_weight":      leaf,
	"sat_unit_weight":  leaf,
	"method":           leaf,
	"cut_depth":        leaf,
	"guide":            leaf,
	"height":           leaf,
	"base_depth":       leaf,
	"wall":             leaf,
	"core":             leaf,
}))

// labShares are the test shares of one kind of sample.
var labShares = mapping(map[string]*keys{
	"moisture":         leaf,
	"sieve":            leaf,
	"hydrometer":       leaf,
	"atterberg":        leaf,
	"consolidation":    leaf,
	"ucs":              leaf,
	"uu":               leaf,
	"proctor":          leaf,
	"proctor_modified": leaf,
	"cbr":              leaf,
	"permeability":     leaf,
	"infiltration":     leaf,
	"analytical":       leaf,
})

var geojsonKeys = mapping(map[string]*keys{
	"file":     leaf,
	"feature":  leaf,
	"property": leaf,
})

var schema = mapping(map[string]*keys{
	"units":       leaf,
	"name":        leaf,
	"title":       leaf,
	"description": leaf,
	"demo":        leaf,
	"note":        leaf,
	"origin": mapping(map[string]*keys{
		"lon": leaf,
		"lat": leaf,
	}),
	"boundary": mapping(map[string]*keys{
		"polygon": leaf,
		"geojson": geojsonKeys,
	}),
	"zones": listOf(mapping(map[string]*keys{
		"id":       leaf,
		"name":     leaf,
		"use":      leaf,
		"purpose":  leaf,
		"polygon":  leaf,
		"geojson":  geojsonKeys,
		"priority": leaf,
		"structure": mapping(map[string]*keys{
			"stories":    leaf,
			"load_class": leaf,
		}),
		"ground": mapping(map[string]*keys{
			"surface":            leaf,
			"slope_pct":          leaf,
			"groundwater_depth":  leaf,
			"rock_depth":         leaf,
			"overhead_clearance": leaf,
		}),
		"rules": mapping(map[string]*keys{
			"preset":          leaf,
			"area_per_point":  leaf,
			"max_spacing":     leaf,
			"lattice":         leaf,
			"min_points":      leaf,
			"min_depth":       minDepthKeys,
			"sampled_share":   leaf,
			"methods":         leaf,
			"sample_interval": leaf,
			"sample_schedule": listOf(mapping(map[string]*keys{
				"to":    leaf,
				"every": leaf,
			})),
			"corners":         leaf,
			"spread":          leaf,
			"spacing_means":   leaf,
			"required_points": leaf,
			"source":          leaf,
		}),
	})),
	"no_go": listOf(mapping(map[string]*keys{
		"id":      leaf,
		"reason":  leaf,
		"polygon": leaf,
		"geojson": geojsonKeys,
	})),
	"rigs":           leaf,
	"rig_units":      leaf,
	"rate_book":      leaf,
	"yard_miles":     leaf,
	"min_separation": leaf,
	"hours_per_day":  leaf,
	"solver": mapping(map[string]*keys{
		"gap":          leaf,
		"time_limit_s": leaf,
	}),
	"lab": orScalar(mapping(map[string]*keys{
		"program":      leaf,
		"fine_share":   leaf,
		"split_barrel": labShares,
		"tube":         labShares,
		"bag":          labShares,
		"bulk":         labShares,
		"analytical":   labShares,
	})),
})

// settingKeys are the settings that may be overridden by the overrides map
// of Load and Parse and by RIGMIX_* environment variables: the scalar
// settings of the scenario (and the rig list), not its geometry.
var settingKeys = []string{
	"demo",
	"description",
	"hours_per_day",
	"name",
	"note",
	"origin.lat",
	"origin.lon",
	"rate_book",
	"rigs",
	"solver.gap",
	"solver.time_limit_s",
	"title",
	"units",
	"yard_miles",
}

// EnvVar is the environment variable that overrides a setting key, for
// example "solver.gap" → "RIGMIX_SOLVER_GAP".
func EnvVar(key string) string {
	return "RIGMIX_" + strings.ToUpper(strings.ReplaceAll(key, ".", "_"))
}

// SettingKeys lists, sorted, the keys an override or environment variable
// may set.
func SettingKeys() []string { return append([]string(nil), settingKeys...) }

// checkKeys walks the YAML document and reports the first key (in document
// order) that the schema does not know, or that appears twice in one
// mapping.
func checkKeys(file string, n *yaml.Node) error {
	if n.Kind == yaml.DocumentNode {
		if len(n.Content) == 0 {
			return nil
		}
		n = n.Content[0]
	}
	if n.Kind != yaml.MappingNode {
		return &FieldError{File: file, Problem: fmt.Sprintf("must be a mapping of keys to values, got %s", kindName(n)),
			Hint: "a scenario starts with lines such as \"units: ft\" and \"name: my-site\""}
	}
	return walkKeys(file, "", n, schema, 0)
}

func walkKeys(file, path string, n *yaml.Node, k *keys, depth int) error {
	if depth > 20 {
		return &FieldError{File: file, Field: path, Problem: "nested too deeply"}
	}
	if n.Kind == yaml.AliasNode && n.Alias != nil {
		n = n.Alias
	}
	switch {
	case k.fields != nil:
		if n.Kind != yaml.MappingNode {
			if n.Kind == yaml.ScalarNode && (n.Tag == "!!null" || k.scalarOK) {
				return nil // an empty section or a plain value; the decoder decides
			}
			return &FieldError{File: file, Field: path, Problem: fmt.Sprintf("must be a mapping, got %s", kindName(n)),
				Hint: "known keys: " + strings.Join(sortedKeys(k.fields), ", ")}
		}
		seen := map[string]bool{}
		for i := 0; i+1 < len(n.Content); i += 2 {
			kn, vn := n.Content[i], n.Content[i+1]
			key := kn.Value
			if key == "<<" { // YAML merge key: its value must fit the same mapping
				if err := walkKeys(file, path, vn, k, depth+1); err != nil {
					return err
				}
				continue
			}
			field := join(path, key)
			child, ok := k.fields[key]
			if !ok {
				return &FieldError{File: file, Field: field, Problem: "unknown key",
					Hint: suggest(key, sortedKeys(k.fields))}
			}
			if seen[key] {
				return &FieldError{File: file, Field: field, Problem: "key given twice",
					Hint: "keep one of the two"}
			}
			seen[key] = true
			if err := walkKeys(file, field, vn, child, depth+1); err != nil {
				return err
			}
		}
	case k.items != nil:
		if n.Kind != yaml.SequenceNode {
			if n.Kind == yaml.ScalarNode && n.Tag == "!!null" {
				return nil
			}
			return &FieldError{File: file, Field: path, Problem: fmt.Sprintf("must be a list, got %s", kindName(n)),
				Hint: "write each item on its own line starting with \"- \""}
		}
		for i, c := range n.Content {
			if err := walkKeys(file, fmt.Sprintf("%s[%d]", path, i), c, k.items, depth+1); err != nil {
				return err
			}
		}
	}
	return nil
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

func sortedKeys(m map[string]*keys) []string {
	out := make([]string, 0, len(m))
	for k := range m {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

func kindName(n *yaml.Node) string {
	switch n.Kind {
	case yaml.MappingNode:
		return "a mapping"
	case yaml.SequenceNode:
		return "a list"
	case yaml.ScalarNode:
		if n.Tag == "!!null" {
			return "nothing"
		}
		return excerpt(n.Value)
	}
	return "something else"
}

// excerptRunes bounds how much of a value a message quotes.
const excerptRunes = 40

// excerpt quotes the start of a value, escaped, so a message names what it
// found without echoing a file that is not a scenario.
func excerpt(s string) string {
	if r := []rune(s); len(r) > excerptRunes {
		return strconv.Quote(string(r[:excerptRunes])) + "…"
	}
	return strconv.Quote(s)
}
