package ratebooks

import (
	"bytes"
	"embed"
	"errors"
	"fmt"
	"io/fs"
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"time"
	"unicode/utf8"

	"github.com/rigmix/rigmix/scenarios/fielderr"
	"gopkg.in/yaml.v3"
)

// DefaultDemo is the demo rate book used when none is named.
const DefaultDemo = "valley-2026"

// Units a rate-book item may be priced in: length (ft, m, mi, km), count
// (each), time (hr, day) and lump sum (ls).
var units = []string{"day", "each", "ft", "hr", "km", "ls", "m", "mi"}

// unitSynonyms maps units as estimators often write them to ours.
var unitSynonyms = map[string]string{
	"ea": "each", "no": "each", "nr": "each", "pcs": "each",
	"lf": "ft", "feet": "ft", "foot": "ft", "vf": "ft",
	"hour": "hr", "hours": "hr", "hrs": "hr", "h": "hr",
	"days": "day", "d": "day",
	"mile": "mi", "miles": "mi",
	"lump": "ls", "lump-sum": "ls", "lump sum": "ls", "lumpsum": "ls",
	"meter": "m", "metre": "m", "meters": "m", "metres": "m",
}

const (
	maxFileBytes = 8 << 20
	maxItems     = 10000
	maxPrice     = 1e7 // per unit; a slipped digit, not a price
	maxText      = 2000
)

var (
	nameRE     = regexp.MustCompile(`^[a-z0-9][a-z0-9._-]{0,63}$`)
	codeRE     = regexp.MustCompile(`^[a-z0-9][a-z0-9._-]{0,63}$`)
	currencyRE = regexp.MustCompile(`^[A-Z]{3}$`)
)

var topKeys = []string{"currency", "demo", "effective", "items", "name", "note", "region", "title"}
var itemKeys = []string{"code", "description", "unit", "unit_price"}

//go:embed demos/*.yaml
var demoFS embed.FS

// Demos lists the names of the embedded demo rate books, sorted.
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

// DemoFile returns the raw YAML of a demo rate book.
func DemoFile(name string) ([]byte, error) {
	for _, n := range Demos() {
		if n == name {
			return demoFS.ReadFile("demos/" + name + ".yaml")
		}
	}
	hint := "demo rate books: " + strings.Join(Demos(), ", ")
	if n := nearest(name, Demos()); n != "" {
		hint = "did you mean " + n + "? " + hint
	}
	return nil, &FieldError{File: "demo:" + name, Problem: "no such demo rate book", Hint: hint}
}

// LoadDemo loads an embedded demo rate book.
func LoadDemo(name string) (*RateBook, error) {
	data, err := DemoFile(name)
	if err != nil {
		return nil, err
	}
	return Parse(data, "demo:"+name)
}

// Open loads a rate book named the way a scenario's rate_book names it: a
// demo rate book's name, or else a file path.
func Open(ref string) (*RateBook, error) {
	for _, n := range Demos() {
		if n == ref {
			return LoadDemo(n)
		}
	}
	return Load(ref)
}

// Load reads and validates a rate-book file.
func Load(path string) (*RateBook, error) {
	data, err := fielderr.ReadRegular(path, maxFileBytes)
	if err != nil {
		problem, hint := "cannot read the file: "+err.Error(), ""
		if errors.Is(err, fs.ErrNotExist) {
			problem, hint = "no such file", "check the path, or name a demo rate book: "+strings.Join(Demos(), ", ")
		}
		return nil, &FieldError{File: path, Problem: problem, Hint: hint}
	}
	return Parse(data, path)
}

// Parse validates rate-book YAML; source names it in messages. The first
// problem found, in document order, is returned as a *FieldError.
func Parse(data []byte, source string) (*RateBook, error) {
	p := &parser{file: source}
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, p.errf("", "a rate book needs name, currency, effective and items; see a demo rate book", "is empty")
	}
	if len(data) > maxFileBytes {
		return nil, p.errf("", "", "is %d bytes; a rate book is at most %d MB", len(data), maxFileBytes>>20)
	}
	if bytes.IndexByte(data, 0) >= 0 || !utf8.Valid(data) {
		return nil, p.errf("", "a rate book is a YAML text file; is this the right file?", "is not a text file (binary or not UTF-8)")
	}
	var doc yaml.Node
	if err := yaml.Unmarshal(data, &doc); err != nil {
		return nil, p.errf("", "indent with spaces, and write each setting as key: value", "is not valid YAML: %s", strings.TrimPrefix(err.Error(), "yaml: "))
	}
	if doc.Kind != yaml.DocumentNode || len(doc.Content) == 0 {
		return nil, p.errf("", "a rate book needs name, currency, effective and items; see a demo rate book", "is empty")
	}
	b, err := p.book(doc.Content[0])
	if err != nil {
		return nil, err
	}
	b.Source = source
	return b, nil
}

type parser struct{ file string }

func (p *parser) errf(field, hint, format string, args ...any) error {
	return &FieldError{File: p.file, Field: field, Problem: fmt.Sprintf(format, args...), Hint: hint}
}

func resolve(n *yaml.Node) *yaml.Node {
	for n.Kind == yaml.AliasNode && n.Alias != nil {
		n = n.Alias
	}
	return n
}

func describe(n *yaml.Node) string {
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

// excerptRunes bounds how much of a file a message quotes.
const excerptRunes = 40

// excerpt quotes the start of a value, escaped: a message names what it
// found without echoing a file that is not a rate book.
func excerpt(s string) string {
	if r := []rune(s); len(r) > excerptRunes {
		return strconv.Quote(string(r[:excerptRunes])) + "…"
	}
	return strconv.Quote(s)
}

// fields checks a mapping's keys against the known ones (document order)
// and returns key → value.
func (p *parser) fields(n *yaml.Node, path string, known []string) (map[string]*yaml.Node, error) {
	n = resolve(n)
	if n.Kind != yaml.MappingNode {
		return nil, p.errf(path, "known keys: "+strings.Join(known, ", "), "must be a mapping, got %s", describe(n))
	}
	out := map[string]*yaml.Node{}
	for i := 0; i+1 < len(n.Content); i += 2 {
		k := n.Content[i].Value
		f := k
		if path != "" {
			f = path + "." + k
		}
		found := false
		for _, c := range known {
			found = found || c == k
		}
		if !found {
			return nil, p.errf(f, suggest(k, known), "unknown key")
		}
		if _, dup := out[k]; dup {
			return nil, p.errf(f, "keep one of the two", "key given twice")
		}
		out[k] = resolve(n.Content[i+1])
	}
	return out, nil
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

func (p *parser) text(m map[string]*yaml.Node, path, key string, required bool, hint string) (string, error) {
	n, ok := m[key]
	f := join(path, key)
	if !ok || (n.Kind == yaml.ScalarNode && n.Tag == "!!null") {
		if required {
			return "", p.errf(f, hint, "missing")
		}
		return "", nil
	}
	if n.Kind != yaml.ScalarNode {
		return "", p.errf(f, hint, "must be text, got %s", describe(n))
	}
	if len(n.Value) > maxText {
		return "", p.errf(f, hint, "is %d characters long; at most %d", len(n.Value), maxText)
	}
	if required && strings.TrimSpace(n.Value) == "" {
		return "", p.errf(f, hint, "is empty")
	}
	return n.Value, nil
}

func (p *parser) book(root *yaml.Node) (*RateBook, error) {
	root = resolve(root)
	if root.Kind != yaml.MappingNode {
		return nil, p.errf("", "a rate book starts with lines such as \"name: my-rates\" and \"currency: USD\"", "must be a mapping of keys to values, got %s", describe(root))
	}
	m, err := p.fields(root, "", topKeys)
	if err != nil {
		return nil, err
	}
	b := &RateBook{}
	if b.Name, err = p.text(m, "", "name", true, "a short identifier such as name: north-drilling-2026"); err != nil {
		return nil, err
	}
	if !nameRE.MatchString(b.Name) {
		return nil, p.errf("name", "lower-case letters, digits, '.', '_' and '-', at most 64", "%q is not a valid name", b.Name)
	}
	if b.Title, err = p.text(m, "", "title", false, ""); err != nil {
		return nil, err
	}
	if b.Currency, err = p.text(m, "", "currency", true, "an ISO 4217 currency code such as USD"); err != nil {
		return nil, err
	}
	if !currencyRE.MatchString(b.Currency) {
		return nil, p.errf("currency", "an ISO 4217 code: three capital letters such as USD, CAD or EUR", "%q is not a currency code", b.Currency)
	}
	if b.Effective, err = p.text(m, "", "effective", true, "the date the prices take effect, YYYY-MM-DD, e.g. 2026-01-01"); err != nil {
		return nil, err
	}
	if _, err := time.Parse("2006-01-02", b.Effective); err != nil {
		return nil, p.errf("effective", "a calendar date written YYYY-MM-DD, e.g. 2026-01-01", "%q is not a date", b.Effective)
	}
	if b.Region, err = p.text(m, "", "region", false, ""); err != nil {
		return nil, err
	}
	if b.Note, err = p.text(m, "", "note", false, ""); err != nil {
		return nil, err
	}
	if n, ok := m["demo"]; ok {
		if n.Kind != yaml.ScalarNode {
			return nil, p.errf("demo", "write true or false", "must be true or false, got %s", describe(n))
		}
		v, err := strconv.ParseBool(n.Value)
		if err != nil {
			return nil, p.errf("demo", "write true or false", "must be true or false, got %q", n.Value)
		}
		b.Demo = v
	}
	if b.Demo && strings.TrimSpace(b.Note) == "" {
		return nil, p.errf("note", "demo prices must say so, e.g. note: invented demo prices, not a quote", "missing (demo: true)")
	}
	items, ok := m["items"]
	if !ok || (items.Kind == yaml.ScalarNode && items.Tag == "!!null") {
		return nil, p.errf("items", "list the priced items, each with code, description, unit and unit_price", "missing")
	}
	if items.Kind != yaml.SequenceNode {
		return nil, p.errf("items", "write each item on its own line starting with \"- \"", "must be a list, got %s", describe(items))
	}
	if len(items.Content) == 0 {
		return nil, p.errf("items", "list the priced items, each with code, description, unit and unit_price", "is empty")
	}
	if len(items.Content) > maxItems {
		return nil, p.errf("items", "", "has %d items; at most %d", len(items.Content), maxItems)
	}
	seen := map[string]int{}
	for i, n := range items.Content {
		path := fmt.Sprintf("items[%d]", i)
		it, err := p.item(n, path, b.Currency, seen)
		if err != nil {
			return nil, err
		}
		seen[it.Code] = i
		b.Items = append(b.Items, it)
	}
	return b, nil
}

func (p *parser) item(n *yaml.Node, path, currency string, seen map[string]int) (Item, error) {
	var it Item
	m, err := p.fields(n, path, itemKeys)
	if err != nil {
		return it, err
	}
	if it.Code, err = p.text(m, path, "code", true, "an item code such as drill-0-50"); err != nil {
		return it, err
	}
	if !codeRE.MatchString(it.Code) {
		return it, p.errf(path+".code", "lower-case letters, digits, '.', '_' and '-', e.g. drill-0-50", "%q is not a valid item code", it.Code)
	}
	if j, dup := seen[it.Code]; dup {
		return it, p.errf(path+".code", "price each item once", "duplicate code %q (also items[%d])", it.Code, j)
	}
	if it.Description, err = p.text(m, path, "description", true, "words for the estimate line"); err != nil {
		return it, err
	}
	if it.Unit, err = p.text(m, path, "unit", true, "one of: "+strings.Join(units, ", ")); err != nil {
		return it, err
	}
	known := false
	for _, u := range units {
		known = known || u == it.Unit
	}
	if !known {
		hint := "one of: " + strings.Join(units, ", ")
		if n, ok := unitSynonyms[strings.ToLower(strings.TrimSuffix(it.Unit, "."))]; ok {
			hint = "did you mean " + n + "? " + hint
		} else if n := nearest(it.Unit, units); n != "" {
			hint = "did you mean " + n + "? " + hint
		}
		return it, p.errf(path+".unit", hint, "unknown unit %q", it.Unit)
	}
	if su, std := standardUnit(it.Code); std && su != it.Unit {
		return it, p.errf(path+".unit", fmt.Sprintf("rigs report %s in %s; price it per %s", it.Code, su, su),
			"must be %s for the standard item %s, got %s", su, it.Code, it.Unit)
	}
	pn, ok := m["unit_price"]
	hint := fmt.Sprintf("a price per %s in %s, e.g. 25.50", it.Unit, currency)
	if !ok || (pn.Kind == yaml.ScalarNode && pn.Tag == "!!null") {
		return it, p.errf(path+".unit_price", hint, "missing")
	}
	if pn.Kind != yaml.ScalarNode || (pn.Tag != "!!int" && pn.Tag != "!!float") {
		return it, p.errf(path+".unit_price", hint+"; write the number without a currency sign or thousands separators", "must be a number, got %s", describe(pn))
	}
	var v float64
	if err := pn.Decode(&v); err != nil {
		return it, p.errf(path+".unit_price", hint, "must be a number, got %q", pn.Value)
	}
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return it, p.errf(path+".unit_price", hint, "must be a finite number, got %s", pn.Value)
	case v < 0:
		return it, p.errf(path+".unit_price", hint+"; a credit is not a unit price", "must be ≥ 0, got %s", pn.Value)
	case v > maxPrice:
		return it, p.errf(path+".unit_price", hint, "must be ≤ %g, got %s (a slipped digit?)", float64(maxPrice), pn.Value)
	}
	it.UnitPrice = v
	return it, nil
}

// Price returns the item priced under code.
func (b *RateBook) Price(code string) (Item, bool) {
	for _, it := range b.Items {
		if it.Code == code {
			return it, true
		}
	}
	return Item{}, false
}

// Check returns nil when every code is priced, else a *FieldError naming
// the rate book and every missing item (sorted, each once).
func (b *RateBook) Check(codes []string) error {
	missing := map[string]bool{}
	for _, c := range codes {
		if _, ok := b.Price(c); !ok {
			missing[c] = true
		}
	}
	if len(missing) == 0 {
		return nil
	}
	list := make([]string, 0, len(missing))
	for c := range missing {
		list = append(list, c)
	}
	sort.Strings(list)
	var adds []string
	for _, c := range list {
		if u, ok := standardUnit(c); ok {
			adds = append(adds, fmt.Sprintf("code: %s, unit: %s", c, u))
		} else {
			adds = append(adds, "code: "+c)
		}
	}
	word := "item"
	if len(list) > 1 {
		word = "items"
	}
	src := b.Source
	if src == "" {
		src = b.Name
	}
	return &FieldError{File: src, Field: "items",
		Problem: fmt.Sprintf("no price for %d %s: %s", len(list), word, strings.Join(list, ", ")),
		Hint:    "add " + strings.Join(adds, "; ") + " with a unit_price"}
}
