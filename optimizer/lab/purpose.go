package lab

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Purpose is what a zone's ground is explored for, as far as the lab is
// concerned: it decides which tests its samples get.
type Purpose string

const (
	// Foundation: strength and index tests (the default program).
	Foundation Purpose = "foundation"
	// Pavement: compaction (standard Proctor, ASTM D698) and bearing ratio
	// (CBR, ASTM D1883) on a bulk sample of the subgrade, with its
	// classification; no hydrometer.
	Pavement Purpose = "pavement"
	// Pond: detention and infiltration areas — hydraulic conductivity
	// (ASTM D5084) on remoulded bulk samples and on tubes, field
	// infiltration (ASTM D3385), and the fines in full (hydrometer).
	Pond Purpose = "pond"
	// SoftGround: soft compressible ground — tube samples between the SPT
	// samples and consolidation (ASTM D2435) on them.
	SoftGround Purpose = "soft_ground"
	// Environmental: the site's analytical list on samples, as a lump sum
	// per sample, with moisture content.
	Environmental Purpose = "environmental"
	// Earthwork: fills and borrow — compaction on bulk samples and their
	// classification.
	Earthwork Purpose = "earthwork"
	// General: open ground — the default program.
	General Purpose = "general"
)

// Purposes lists every purpose, in name order.
func Purposes() []Purpose {
	return []Purpose{Earthwork, Environmental, Foundation, General, Pavement, Pond, SoftGround}
}

// ParsePurpose reads a purpose name.
func ParsePurpose(s string) (Purpose, bool) {
	for _, p := range Purposes() {
		if string(p) == s {
			return p, true
		}
	}
	return "", false
}

// purposeSources is the basis of each purpose's program. None of the
// shares is a published rule; each is common practice and says so.
var purposeSources = map[Purpose]string{
	Foundation: SourceCommonPractice,
	General:    SourceCommonPractice,
	Pavement: "common practice: one bulk sample of the subgrade per sampled point, each classified (sieve, " +
		"Atterberg limits); standard Proctor (ASTM D698; modified, ASTM D1557, where the specification asks " +
		"for modified effort) and CBR (ASTM D1883) on 1 in 3 bulk samples, at least one of each; no hydrometer " +
		"(classification needs none)",
	Pond: "common practice: one bulk sample of the pond floor per sampled point, classified in full (sieve, " +
		"hydrometer, Atterberg limits); hydraulic conductivity (ASTM D5084) remoulded on 1 in 2 bulk samples and on " +
		"1 in 2 tube samples; a field infiltration test (ASTM D3385) at 1 in 2 sampled points",
	SoftGround: "tube samples between the SPT samples where cohesive soil is met (TxDOT LRFD Geotechnical " +
		"Manual, 2024); on them, common practice: consolidation (ASTM D2435) on 1 in 3, UU triaxial on 1 in 3, " +
		"Atterberg limits and hydrometer on 1 in 3",
	Environmental: "common practice: the site's analytical list on two samples a sampled point (the interval " +
		"field screening marks as most affected, and the deepest or the one at the water table), priced as one " +
		"lump sum per sample; moisture content on every sample; geotechnical index tests left to the geotechnical zones",
	Earthwork: "common practice: one bulk sample per sampled point, classified (sieve, Atterberg limits); " +
		"standard Proctor (ASTM D698) on 1 in 3 bulk samples, at least one",
}

// PurposeSource returns the basis of a purpose's program.
func PurposeSource(p Purpose) string { return purposeSources[p] }

// purposeProgram returns the program of one purpose.
func purposeProgram(p Purpose) *Program {
	switch p {
	case Pavement:
		return &Program{Name: string(p), FineShare: 1, BulkPerPoint: 1, PerSample: map[Kind][]Test{
			SplitBarrel: {must("moisture", 1), must("sieve", 1.0/3), must("atterberg", 1.0/4)},
			Bulk:        {must("moisture", 1), must("sieve", 1), must("atterberg", 1), must("proctor", 1.0/3), must("cbr", 1.0/3)},
			Bag:         {must("moisture", 1), must("sieve", 1.0/3), must("atterberg", 1.0/4)},
		}}
	case Pond:
		return &Program{Name: string(p), FineShare: 1, BulkPerPoint: 1, PerSample: map[Kind][]Test{
			SplitBarrel: {must("moisture", 1), must("sieve", 1.0/3), must("hydrometer", 1.0/3), must("atterberg", 1.0/4)},
			Bulk: {must("moisture", 1), must("sieve", 1), must("hydrometer", 1), must("atterberg", 1),
				must("permeability", 1.0/2), must("infiltration", 1.0/2)},
			Bag:  {must("moisture", 1), must("sieve", 1.0/3), must("hydrometer", 1.0/3), must("atterberg", 1.0/4)},
			Tube: {must("moisture", 1), must("atterberg", 1.0/3), must("permeability", 1.0/2)},
		}}
	case SoftGround:
		return &Program{Name: string(p), FineShare: 1, TubesBetweenSPT: true, PerSample: map[Kind][]Test{
			SplitBarrel: {must("moisture", 1), must("sieve", 1.0/3), must("atterberg", 1.0/4)},
			Tube: {must("moisture", 1), must("hydrometer", 1.0/3), must("atterberg", 1.0/3),
				must("consolidation", 1.0/3), must("uu", 1.0/3)},
		}}
	case Environmental:
		return &Program{Name: string(p), FineShare: 1, AnalyticalPerPoint: 2, PerSample: map[Kind][]Test{
			SplitBarrel: {must("moisture", 1)},
			Bag:         {must("moisture", 1)},
			Analytical:  {must("analytical", 1)},
		}}
	case Earthwork:
		return &Program{Name: string(p), FineShare: 1, BulkPerPoint: 1, PerSample: map[Kind][]Test{
			SplitBarrel: {must("moisture", 1), must("sieve", 1.0/3), must("atterberg", 1.0/4)},
			Bulk:        {must("moisture", 1), must("sieve", 1), must("atterberg", 1), must("proctor", 1.0/3)},
			Bag:         {must("moisture", 1), must("sieve", 1.0/3), must("atterberg", 1.0/4)},
		}}
	}
	d := Default()
	d.Name = string(p)
	return d
}

// ForPurposes returns the program for ground explored for all the given
// purposes at once: each test on each kind of sample at the largest share
// any purpose asks, bulk samples at the largest number per point, tubes
// between SPT samples if any purpose asks for them. No purpose gives the
// default program. The source names each purpose's basis.
func ForPurposes(ps []Purpose) (*Program, error) {
	if len(ps) == 0 {
		return Default(), nil
	}
	seen := map[Purpose]bool{}
	var names, srcs []string
	out := &Program{FineShare: 1, PerSample: map[Kind][]Test{}}
	for _, pu := range ps {
		if _, ok := purposeSources[pu]; !ok {
			return nil, fmt.Errorf("lab: unknown purpose %q (known: %s)", pu, purposeList())
		}
		if seen[pu] {
			continue
		}
		seen[pu] = true
		names = append(names, string(pu))
		srcs = append(srcs, string(pu)+" — "+purposeSources[pu])
		p := purposeProgram(pu)
		out.BulkPerPoint = math.Max(out.BulkPerPoint, p.BulkPerPoint)
		out.AnalyticalPerPoint = math.Max(out.AnalyticalPerPoint, p.AnalyticalPerPoint)
		out.TubesBetweenSPT = out.TubesBetweenSPT || p.TubesBetweenSPT
		for _, k := range Kinds() {
			for _, t := range p.PerSample[k] {
				if cur := out.share(k, t.Key); t.Share > cur {
					if err := out.Set(k, t.Key, t.Share); err != nil {
						return nil, err
					}
				}
			}
		}
	}
	out.Name = strings.Join(names, "+")
	out.Source = strings.Join(srcs, "; ")
	if len(names) == 1 {
		out.Source = purposeSources[Purpose(names[0])]
	}
	return out, out.Check()
}

func purposeList() string {
	var s []string
	for _, p := range Purposes() {
		s = append(s, string(p))
	}
	return strings.Join(s, ", ")
}

func (p *Program) share(k Kind, key string) float64 {
	for _, t := range p.PerSample[k] {
		if t.Key == key {
			return t.Share
		}
	}
	return 0
}

// Derived completes the samples one point recovers with those the program
// adds: BulkPerPoint bulk samples and AnalyticalPerPoint samples for the
// analytical list at a sampled point, and with
// TubesBetweenSPT a tube at each position between two split-barrel samples
// of a boring (one fewer than the split-barrel samples). It returns the
// counts and the field quantities the added tubes cost (rate-book item
// tube-sample), which the caller adds to the point's quantities. A nil
// program adds nothing.
func (p *Program) Derived(c Counts, sampled, boring bool) (Counts, []sdk.Quantity) {
	if p == nil {
		return c, nil
	}
	var qs []sdk.Quantity
	if sampled {
		c.Bulk += p.BulkPerPoint
		c.Analytical += p.AnalyticalPerPoint
	}
	if boring && p.TubesBetweenSPT && c.SplitBarrel > 1 {
		n := c.SplitBarrel - 1
		c.Tube += n
		qs = append(qs, sdk.Quantity{Item: itemTubeSample, Unit: Unit, Amount: n,
			Note: "thin-walled tube samples (ASTM D1587) between the SPT samples, for consolidation in soft ground (TxDOT LRFD Geotechnical Manual, 2024)"})
	}
	return c, qs
}

// Part is the samples of one group of points (a zone) with the program
// their purpose gives.
type Part struct {
	Label   string // e.g. the zone's id
	Program *Program
	Counts  Counts
}

// Combine sums the expected tests of every part and rounds each total up
// to whole tests, one quantity per test item in catalogue order; the note
// gives each part's share. Parts with no samples are left out.
func Combine(parts []Part) ([]sdk.Quantity, error) {
	total := map[string]float64{}
	notes := map[string][]string{}
	for _, pt := range parts {
		qs, err := pt.Program.Expected(pt.Counts)
		if err != nil {
			return nil, fmt.Errorf("%s: %w", pt.Label, err)
		}
		for _, q := range qs {
			total[q.Item] += q.Amount
			_, detail, _ := strings.Cut(q.Note, ": ")
			notes[q.Item] = append(notes[q.Item], pt.Label+": "+detail)
		}
	}
	var out []sdk.Quantity
	for _, ref := range catalog {
		t, ok := total[ref.Item]
		if !ok {
			continue
		}
		n := math.Ceil(t - 1e-9)
		if n <= 0 {
			continue
		}
		ns := notes[ref.Item]
		sort.Strings(ns)
		out = append(out, sdk.Quantity{Item: ref.Item, Unit: Unit, Amount: n,
			Note: fmt.Sprintf("%s (%s): %s", ref.Name, ref.Standard, strings.Join(ns, "; "))})
	}
	return out, nil
}
