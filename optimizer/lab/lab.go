// Package lab turns the samples an exploration program recovers into the
// laboratory tests a bid carries: a program of tests per sample kind and
// soil group, each test named by its ASTM standard and priced from the rate
// book under its own item code. It takes plain data in and gives rate-book
// quantities out; it reads no files and no flags.
//
// A Program says, for each kind of sample (split-barrel SPT samples, ASTM
// D1586; thin-walled tube samples, ASTM D1587; bag samples from test pits),
// which tests are run and on what share of the samples. A test marked for
// fine-grained soil (silts and clays: hydrometer, Atterberg limits,
// consolidation, strength) applies only to the share of samples expected to
// be fine-grained, Program.FineShare; tube samples are taken in
// fine-grained soil (ASTM D1587 is a practice for tube sampling of
// fine-grained soils; the title is from memory), so every tube sample
// counts as fine.
//
// Quantities sums, for each test, count × soil share × test share over the
// sample kinds and rounds the total up to whole tests:
//
//	n(test) = ⌈ Σ_kind  count(kind) · soil(kind, test) · share(kind, test) ⌉
//
// The default program (Default) is common practice, not a published rule:
// moisture content on every sample, grain size by sieve on one in three,
// the hydrometer on one in ten fine-grained samples (classification by
// ASTM D2487 needs only the sieve and the Atterberg limits), Atterberg
// limits on one in four fine-grained samples; on tube samples also
// one-dimensional consolidation on one in ten, unconfined compression on
// one in four and UU triaxial on one in ten.
//
// A zone's purposes (ForPurposes, purpose.go) change the program for its
// samples: pavements get compaction (ASTM D698, or D1557) and bearing ratio
// (ASTM D1883) on bulk samples of the subgrade; ponds and infiltration
// areas hydraulic conductivity (ASTM D5084), field infiltration (ASTM
// D3385) and the hydrometer; soft compressible ground tube samples between
// the SPT samples and consolidation (ASTM D2435) on them; environmental
// zones the site's analytical list as a lump sum per sample. Combine sums
// the zones' expected tests and rounds each total up.
package lab

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Kind is a kind of soil sample.
type Kind string

const (
	// SplitBarrel is a split-barrel sample from the Standard Penetration
	// Test (ASTM D1586): disturbed, good for index tests.
	SplitBarrel Kind = "split-barrel"
	// Tube is a thin-walled tube sample (ASTM D1587): undisturbed enough for
	// consolidation and strength tests.
	Tube Kind = "tube"
	// Bag is a bulk sample bagged from a test pit: disturbed, good for
	// index tests.
	Bag Kind = "bag"
	// Bulk is a bulk sample of the subgrade or of a pond's floor, some
	// 25–50 lb, from auger cuttings or a pit near the surface: enough soil
	// for compaction, bearing-ratio and remoulded permeability tests, which
	// a split barrel's sample is too small for (common practice). A
	// program's BulkPerPoint says how many each sampled point gives.
	Bulk Kind = "bulk"
	// Analytical is a sample jarred for the environmental analytical
	// list; a program's AnalyticalPerPoint says how many each sampled
	// point gives (common practice: two a boring — the interval field
	// screening marks as most affected, and the deepest or the one at the
	// water table).
	Analytical Kind = "analytical"
)

// Kinds lists the sample kinds in the order quantities are summed.
func Kinds() []Kind { return []Kind{SplitBarrel, Tube, Bag, Bulk, Analytical} }

// Soil is the soil group a test applies to.
type Soil string

const (
	AnySoil Soil = "any"  // every sample of the kind
	Fine    Soil = "fine" // fine-grained samples only (silts and clays)
)

// Rate-book item codes of the laboratory tests, all priced per test
// ("each").
const (
	ItemMoisture      = "lab-moisture"
	ItemSieve         = "lab-sieve"
	ItemHydrometer    = "lab-hydrometer"
	ItemAtterberg     = "lab-atterberg"
	ItemConsolidation = "lab-consolidation"
	ItemUCS           = "lab-ucs"
	ItemUU            = "lab-uu"
	ItemProctor       = "lab-proctor"
	ItemProctorMod    = "lab-proctor-modified"
	ItemCBR           = "lab-cbr"
	ItemPermeability  = "lab-permeability"
	ItemInfiltration  = "field-infiltration"
	ItemAnalytical    = "lab-analytical"

	// Unit is the unit of every lab item.
	Unit = "each"
)

// Test is one laboratory test in a program.
type Test struct {
	Key      string  // short name in scenario files: moisture, sieve, ...
	Item     string  // rate-book item code, e.g. "lab-moisture"
	Name     string  // words for the estimate line
	Standard string  // the ASTM standard the test follows
	Soil     Soil    // the soil group it applies to
	Share    float64 // share of the samples of its kind and soil group tested, 0..1
}

// catalog lists every test the package knows, in the order quantities are
// reported, with the standard each follows.
var catalog = []Test{
	{Key: "moisture", Item: ItemMoisture, Name: "Moisture content", Standard: "ASTM D2216", Soil: AnySoil},
	{Key: "sieve", Item: ItemSieve, Name: "Particle-size distribution by sieve", Standard: "ASTM D6913", Soil: AnySoil},
	{Key: "hydrometer", Item: ItemHydrometer, Name: "Particle-size distribution of fines by hydrometer", Standard: "ASTM D7928", Soil: Fine},
	{Key: "atterberg", Item: ItemAtterberg, Name: "Liquid limit, plastic limit and plasticity index (Atterberg limits)", Standard: "ASTM D4318", Soil: Fine},
	{Key: "consolidation", Item: ItemConsolidation, Name: "One-dimensional consolidation (incremental loading)", Standard: "ASTM D2435", Soil: Fine},
	{Key: "ucs", Item: ItemUCS, Name: "Unconfined compressive strength of cohesive soil", Standard: "ASTM D2166", Soil: Fine},
	{Key: "uu", Item: ItemUU, Name: "Unconsolidated-undrained triaxial compression", Standard: "ASTM D2850", Soil: Fine},
	{Key: "proctor", Item: ItemProctor, Name: "Compaction, standard effort (standard Proctor)", Standard: "ASTM D698", Soil: AnySoil},
	{Key: "proctor_modified", Item: ItemProctorMod, Name: "Compaction, modified effort (modified Proctor)", Standard: "ASTM D1557", Soil: AnySoil},
	{Key: "cbr", Item: ItemCBR, Name: "California bearing ratio of laboratory-compacted soil", Standard: "ASTM D1883", Soil: AnySoil},
	{Key: "permeability", Item: ItemPermeability, Name: "Hydraulic conductivity, flexible-wall permeameter", Standard: "ASTM D5084", Soil: AnySoil},
	{Key: "infiltration", Item: ItemInfiltration, Name: "Field infiltration rate, double-ring infiltrometer", Standard: "ASTM D3385", Soil: AnySoil},
	{Key: "analytical", Item: ItemAnalytical, Name: "Environmental analytical list, one lump sum per sample for the list the site's rules name", Standard: "the site's analytical list", Soil: AnySoil},
}

// Catalog returns every known test with a zero Share, in report order.
func Catalog() []Test { return append([]Test(nil), catalog...) }

// Keys returns the tests' short names in report order.
func Keys() []string {
	out := make([]string, len(catalog))
	for i, t := range catalog {
		out[i] = t.Key
	}
	return out
}

// ByKey returns the catalogue entry of a short name, with share s.
func ByKey(key string, s float64) (Test, bool) {
	for _, t := range catalog {
		if t.Key == key {
			t.Share = s
			return t, true
		}
	}
	return Test{}, false
}

// Program is a configurable program of lab tests.
type Program struct {
	Name   string // "default", "none" or "custom"
	Source string // what the shares rest on
	// FineShare is the share of split-barrel and bag samples expected to
	// be fine-grained, 0..1; tests for fine soil apply to that share.
	FineShare float64
	// PerSample lists the tests run on each kind of sample.
	PerSample map[Kind][]Test
	// BulkPerPoint is the number of bulk samples each sampled point
	// (boring or test pit) gives for the program's bulk tests; 0: none.
	BulkPerPoint float64
	// AnalyticalPerPoint is the number of samples each sampled point sends
	// for the analytical list; 0: none.
	AnalyticalPerPoint float64
	// TubesBetweenSPT asks for a thin-walled tube sample at each position
	// between split-barrel samples in a boring (TxDOT LRFD Geotechnical
	// Manual, 2024: where cohesive soils are observed, tubes at the
	// intermediate locations between SPT samples), so soft ground yields
	// tubes to consolidate.
	TubesBetweenSPT bool
}

// SourceCommonPractice is the basis of the default program's shares.
const SourceCommonPractice = "common practice: moisture content on every sample, sieve on 1 in 3, " +
	"hydrometer on 1 in 10 fine-grained (classification by ASTM D2487 needs only the sieve and the " +
	"Atterberg limits; the hydrometer is for where the clay fraction itself is the question), " +
	"Atterberg limits on 1 in 4 fine-grained; on tube samples also consolidation on 1 in 10, " +
	"unconfined compression on 1 in 4, UU triaxial on 1 in 10"

// Default returns the default program (common practice, see the package
// comment). FineShare is 1: with nothing known of the ground, every
// disturbed sample is priced as if it might be fine-grained, the larger
// program and the safe side for a bid.
func Default() *Program {
	index := func() []Test {
		return []Test{
			must("moisture", 1),
			must("sieve", 1.0/3),
			must("hydrometer", 1.0/10),
			must("atterberg", 1.0/4),
		}
	}
	return &Program{
		Name:      "default",
		Source:    SourceCommonPractice,
		FineShare: 1,
		PerSample: map[Kind][]Test{
			SplitBarrel: index(),
			Bag:         index(),
			Tube: append(index(),
				must("consolidation", 1.0/10),
				must("ucs", 1.0/4),
				must("uu", 1.0/10)),
		},
	}
}

// None returns a program with no tests, for a bid that leaves the lab out.
func None() *Program {
	return &Program{Name: "none", Source: "no laboratory testing", FineShare: 1, PerSample: map[Kind][]Test{}}
}

func must(key string, s float64) Test {
	t, ok := ByKey(key, s)
	if !ok {
		panic("lab: unknown test " + key)
	}
	return t
}

// Clone returns a deep copy, so a caller can change a program it got from
// Default without touching anyone else's.
func (p *Program) Clone() *Program {
	if p == nil {
		return nil
	}
	c := *p
	c.PerSample = make(map[Kind][]Test, len(p.PerSample))
	for k, ts := range p.PerSample {
		c.PerSample[k] = append([]Test(nil), ts...)
	}
	return &c
}

// Set sets the share of test key on samples of kind k, adding the test
// when the program lacks it; share 0 removes it.
func (p *Program) Set(k Kind, key string, share float64) error {
	t, ok := ByKey(key, share)
	if !ok {
		return fmt.Errorf("lab: unknown test %q (known: %s)", key, strings.Join(Keys(), ", "))
	}
	if !knownKind(k) {
		return fmt.Errorf("lab: unknown sample kind %q", k)
	}
	if p.PerSample == nil {
		p.PerSample = map[Kind][]Test{}
	}
	ts := p.PerSample[k]
	out := ts[:0:0]
	found := false
	for _, x := range ts {
		if x.Key == key {
			found = true
			if share > 0 {
				out = append(out, t)
			}
			continue
		}
		out = append(out, x)
	}
	if !found && share > 0 {
		out = append(out, t)
	}
	sort.SliceStable(out, func(i, j int) bool { return order(out[i].Key) < order(out[j].Key) })
	p.PerSample[k] = out
	return nil
}

func order(key string) int {
	for i, t := range catalog {
		if t.Key == key {
			return i
		}
	}
	return len(catalog)
}

func knownKind(k Kind) bool {
	return k == SplitBarrel || k == Tube || k == Bag || k == Bulk || k == Analytical
}

// Check reports what is wrong with a program, or nil: an unknown kind or
// test, a share outside 0..1, a test listed twice for one kind.
func (p *Program) Check() error {
	if p == nil {
		return nil
	}
	if !(p.FineShare >= 0 && p.FineShare <= 1) {
		return fmt.Errorf("lab: fine share %v: want a share between 0 and 1", p.FineShare)
	}
	if !(p.BulkPerPoint >= 0) || math.IsInf(p.BulkPerPoint, 0) {
		return fmt.Errorf("lab: bulk samples per point %v: want a number ≥ 0", p.BulkPerPoint)
	}
	if !(p.AnalyticalPerPoint >= 0) || math.IsInf(p.AnalyticalPerPoint, 0) {
		return fmt.Errorf("lab: analytical samples per point %v: want a number ≥ 0", p.AnalyticalPerPoint)
	}
	kinds := make([]string, 0, len(p.PerSample))
	for k := range p.PerSample {
		kinds = append(kinds, string(k))
	}
	sort.Strings(kinds)
	for _, ks := range kinds {
		k := Kind(ks)
		if !knownKind(k) {
			return fmt.Errorf("lab: unknown sample kind %q (want split-barrel, tube, bag, bulk or analytical)", k)
		}
		seen := map[string]bool{}
		for _, t := range p.PerSample[k] {
			ref, ok := ByKey(t.Key, t.Share)
			if !ok || ref.Item != t.Item {
				return fmt.Errorf("lab: %s samples: unknown test %q (item %q)", k, t.Key, t.Item)
			}
			if seen[t.Key] {
				return fmt.Errorf("lab: %s samples: test %q listed twice", k, t.Key)
			}
			seen[t.Key] = true
			if !(t.Share >= 0 && t.Share <= 1) {
				return fmt.Errorf("lab: %s samples: %s share %v: want a share between 0 and 1", k, t.Key, t.Share)
			}
		}
	}
	return nil
}

// Counts are the samples a program recovers, by kind.
type Counts struct {
	SplitBarrel float64 // split-barrel SPT samples (the rate book's spt-sample)
	Tube        float64 // thin-walled tube samples (tube-sample)
	Bag         float64 // bag samples from test pits
	Bulk        float64 // bulk samples for compaction, bearing-ratio and permeability tests
	Analytical  float64 // samples sent for the environmental analytical list
}

// Of returns the count of kind k.
func (c Counts) Of(k Kind) float64 {
	switch k {
	case SplitBarrel:
		return c.SplitBarrel
	case Tube:
		return c.Tube
	case Bag:
		return c.Bag
	case Bulk:
		return c.Bulk
	case Analytical:
		return c.Analytical
	}
	return 0
}

// Add returns the sum of two counts.
func (c Counts) Add(d Counts) Counts {
	return Counts{SplitBarrel: c.SplitBarrel + d.SplitBarrel, Tube: c.Tube + d.Tube, Bag: c.Bag + d.Bag, Bulk: c.Bulk + d.Bulk,
		Analytical: c.Analytical + d.Analytical}
}

// Rate-book item the program's tubes between SPT samples are priced as.
const itemTubeSample = sdk.ItemTubeSample

// KindOfSample is the lab kind a rig's sample kind is tested as: a
// continuous soil core (a sonic or direct-push liner) is disturbed by the
// advance and gets the split-barrel tests (common practice); the others
// map one for one. An unknown kind gives "" (the host-side checks refuse
// it before it gets here).
func KindOfSample(k sdk.SampleKind) Kind {
	switch k {
	case sdk.SampleSplitBarrel, sdk.SampleCore:
		return SplitBarrel
	case sdk.SampleTube:
		return Tube
	case sdk.SampleBag:
		return Bag
	case sdk.SampleBulk:
		return Bulk
	}
	return ""
}

// CountsFromQuantities counts the samples among a rig's quantities, by
// their kind (sdk.SampleKindOf: a quantity's SampleKind, else items
// spt-sample and tube-sample). Test pits that report no samples get their
// bag samples from PitBagSamples.
func CountsFromQuantities(qs []sdk.Quantity) Counts {
	var c Counts
	for _, q := range qs {
		switch KindOfSample(sdk.SampleKindOf(q)) {
		case SplitBarrel:
			c.SplitBarrel += q.Amount
		case Tube:
			c.Tube += q.Amount
		case Bag:
			c.Bag += q.Amount
		case Bulk:
			c.Bulk += q.Amount
		}
	}
	return c
}

// firstSamplesFt are the two shallow samples taken before the regular
// interval starts, as the built-in rigs take them: 2.5 ft (just below
// topsoil) and 5 ft (common practice).
var firstSamplesFt = [2]float64{2.5, 5}

// PitBagSamples is the number of bag samples in a test pit depthFt deep
// sampled every intervalFt (0: sdk.DefaultSampleIntervalFt), by the rule the
// built-in excavator follows: samples at 2.5 ft and 5 ft, then every
// interval below 5 ft; under 2.5 ft, every interval from the surface
// (common practice). A sample counts when its depth is at or above the
// bottom of the pit.
func PitBagSamples(depthFt, intervalFt float64) int {
	if !(depthFt > 0) || math.IsInf(depthFt, 0) {
		return 0
	}
	if !(intervalFt > 0) || math.IsInf(intervalFt, 0) {
		intervalFt = sdk.DefaultSampleIntervalFt
	}
	const eps = 1e-9
	if intervalFt < firstSamplesFt[0] {
		return int(math.Floor(depthFt/intervalFt + eps))
	}
	n := 0
	for _, d := range firstSamplesFt {
		if d <= depthFt+eps {
			n++
		}
	}
	last := firstSamplesFt[1]
	if depthFt+eps >= last {
		n += int(math.Floor((depthFt-last)/intervalFt + eps))
	}
	return n
}

// Quantities turns sample counts into rate-book quantities of lab tests,
// one per test item with a positive count, in catalogue order (moisture,
// sieve, hydrometer, Atterberg, consolidation, UCS, UU, then the compaction,
// bearing-ratio, permeability, infiltration and analytical tests). A nil program is
// the default program. Each total is rounded up to whole tests.
func (p *Program) Quantities(c Counts) ([]sdk.Quantity, error) {
	return p.quantities(c, true)
}

// Expected is Quantities without the rounding: the expected number of
// each test, in fractions. It is linear in the counts, so a model can
// charge each point its own share of the lab cost (for example one
// boring's samples); the estimate uses Quantities on the whole program.
func (p *Program) Expected(c Counts) ([]sdk.Quantity, error) {
	return p.quantities(c, false)
}

func (p *Program) quantities(c Counts, round bool) ([]sdk.Quantity, error) {
	if p == nil {
		p = Default()
	}
	if err := p.Check(); err != nil {
		return nil, err
	}
	for _, k := range Kinds() {
		if v := c.Of(k); math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			return nil, fmt.Errorf("lab: %s sample count %v: want a number ≥ 0", k, v)
		}
	}
	var out []sdk.Quantity
	for _, ref := range catalog {
		total := 0.0
		var parts []string
		for _, k := range Kinds() {
			n := c.Of(k)
			if n == 0 {
				continue
			}
			for _, t := range p.PerSample[k] {
				if t.Key != ref.Key || t.Share == 0 {
					continue
				}
				soil := 1.0
				if t.Soil == Fine && k != Tube {
					soil = p.FineShare
				}
				if soil == 0 {
					continue
				}
				total += n * soil * t.Share
				part := fmt.Sprintf("%s of %s %s", shareText(t.Share), fmtCount(n), k)
				if soil < 1 {
					part += fmt.Sprintf(" (%s fine-grained)", percent(soil))
				}
				parts = append(parts, part)
			}
		}
		amount := total
		if round {
			amount = math.Ceil(total - 1e-9)
		}
		if amount <= 0 {
			continue
		}
		out = append(out, sdk.Quantity{Item: ref.Item, Unit: Unit, Amount: amount,
			Note: fmt.Sprintf("%s (%s): %s samples", ref.Name, ref.Standard, strings.Join(parts, ", "))})
	}
	return out, nil
}

// shareText writes a share as a person would: "all", "1 in 4", "35 %".
func shareText(s float64) string {
	if s >= 1 {
		return "all"
	}
	if k := math.Round(1 / s); k >= 2 && math.Abs(1/k-s) < 1e-9 {
		return fmt.Sprintf("1 in %.0f", k)
	}
	return percent(s)
}

func percent(s float64) string {
	return strings.TrimSuffix(strings.TrimRight(fmt.Sprintf("%.1f", 100*s), "0"), ".") + " %"
}

func fmtCount(n float64) string { return fmt.Sprintf("%g", n) }
