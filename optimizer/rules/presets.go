package rules

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/scenarios/fielderr"
)

// Source strings, copied from the project's table of outside sources so a
// rule in a plan names exactly what it rests on.
const (
	SourceDasSowers  = "Das, Principles of Foundation Engineering, after Sowers & Sowers (1970)"
	SourceNAVFAC     = "NAVFAC DM-7.01 / UFC 3-220-10N, Table 6"
	SourceUFGS       = "UFGS 4-159-01"
	SourceUFCRoads   = "UFC 3-250-12N"
	SourceGEC5       = "FHWA GEC-5 (2002, FHWA-IF-02-034)"
	SourceTxDOT      = "TxDOT LRFD Geotechnical Manual (2024)"
	SourceSowersTab  = "Sowers & Sowers table, in Das"
	SourceSowersForm = "Sowers, in Das"
	SourceASCE       = "ASCE (1972), in Das"
	SourceUFCTable7  = "UFC 3-220-10N Table 7"
	SourceEN1997     = "EN 1997-2 Annex B.3"
	SourceToRock     = "common practice"
	// SourcePractice marks a fact of the trade with no published source.
	SourcePractice = "common practice"
)

// Tags say how a value is known: "seen" when read in a stored copy of the
// source, "memory" when recalled and not re-read, "derived" when computed
// from a formula whose source is named. A qualifier in parentheses may
// follow, e.g. "seen (attribution memory)".
const (
	TagSeen    = "seen"
	TagMemory  = "memory"
	TagDerived = "derived"
	// TagPractice is a fact of the trade with no published source.
	TagPractice = "common practice"
)

// Preset is a published exploration rule a scenario can name instead of
// typing numbers. Zero fields do not apply, as in a scenario's rules.
// Lengths are in feet and areas in square feet; a metric source's value is
// converted exactly (1 ft = 0.3048 m) and given in metres in the note.
type Preset struct {
	Name  string // identifier a scenario names, lower case with hyphens
	Title string // a line for people

	AreaPerPointFt2 float64 // at least one point per this many ft²
	MaxSpacingFt    float64 // points at most this far apart on the lattice
	MinPoints       int     // at least this many points
	MinDepthFt      float64 // every point at least this deep
	Lattice         string  // "square" for a grid spacing, "" when no spacing applies
	Corners         bool    // a point at each corner of the zone's polygon

	Source string // the document the values come from
	Note   string // the published range, the value chosen and why, limits of use
	Tag    string // seen, memory or derived, as the sources table gives it
}

// BaseTag returns the tag without any parenthesised qualifier.
func (p Preset) BaseTag() string {
	if strings.HasPrefix(p.Tag, TagPractice) {
		return TagPractice
	}
	t, _, _ := strings.Cut(p.Tag, " ")
	return t
}

// ErrUnknownPreset is wrapped by Lookup's error for a name it does not know.
var ErrUnknownPreset = errors.New("rules: unknown preset")

// metric spacing, ft, from a value in metres.
func m(v float64) float64 { return MToFt(v) }

const alongNote = " Spacing is along the alignment; on a square lattice a narrow corridor zone " +
	"lets points lie up to √2 times the spacing apart along its centre line, so model " +
	"the alignment so that the along-line distance is checked."

// ufcRoadNote says where in UFC 3-250-12N the road spacing is: the number
// was checked against a stored copy of the document's text.
const ufcRoadNote = "UFC 3-250-12N is Design: Pavements (8 June 2005, since cancelled), Section 2, " +
	"exploratory borings: the maximum spacing along the centre lines of proposed roads is 300 ft, " +
	"100 ft or less in widely varying soils; the same section asks at least 6 ft below finished grade in cuts."

// presets lists every preset, in name order (checked by a test).
var presets = []Preset{
	{
		Name: "common-building-density", Title: "Buildings: the common density of borings",
		AreaPerPointFt2: 2500,
		Source:          SourcePractice, Tag: TagPractice,
		Note: "A density rule practitioners use, with no published source behind it: one boring per " +
			"2,500 ft² of building footprint. On a square grid that is one point every 50 ft, the " +
			"spacing NAVFAC gives for a large structure with closely spaced footings " +
			"(navfac-closely-spaced-footings).",
	},
	{
		Name: "das-dam-dike", Title: "Dams and dikes: borings about 40 m apart",
		MaxSpacingFt: m(40), Lattice: "square",
		Source: SourceDasSowers, Tag: TagSeen,
		Note: "Published range 40–80 m (131–262 ft); the close end, 40 m, is taken as the conservative default.",
	},
	{
		Name: "das-highway", Title: "Highways: borings about 250 m apart",
		MaxSpacingFt: m(250), Lattice: "square",
		Source: SourceDasSowers, Tag: TagSeen,
		Note: "Published range 250–500 m (820–1640 ft); the close end, 250 m, is taken as the conservative default. " +
			"UFC 3-250-12N asks at most 300 ft along a road's centre line (ufc-road), the more conservative of the two." + alongNote,
	},
	{
		Name: "das-multistory-building", Title: "Multistory buildings: borings about 10 m apart",
		MaxSpacingFt: m(10), Lattice: "square",
		Source: SourceDasSowers, Tag: TagSeen,
		Note: "Published range 10–30 m (33–98 ft); the close end, 10 m, is taken as the conservative default.",
	},
	{
		Name: "das-one-story-industrial", Title: "One-story industrial plants: borings about 20 m apart",
		MaxSpacingFt: m(20), Lattice: "square",
		Source: SourceDasSowers, Tag: TagSeen,
		Note: "Published range 20–60 m (66–197 ft); the close end, 20 m, is taken as the conservative default.",
	},
	{
		Name: "das-residential-subdivision", Title: "Residential subdivisions: borings about 250 m apart",
		MaxSpacingFt: m(250), Lattice: "square",
		Source: SourceDasSowers, Tag: TagSeen,
		Note: "Published range 250–500 m (820–1640 ft); the close end, 250 m, is taken as the conservative default.",
	},
	{
		Name: "fhwa-embankment-erratic", Title: "Embankments and cut slopes, erratic ground: a point every 60 m",
		MaxSpacingFt: m(60), Lattice: "square",
		Source: SourceGEC5, Tag: TagSeen,
		Note: "Published 60 m (197 ft) where ground is erratic, up to 120 m where uniform; at least 3 points " +
			"on a transverse line at critical sections; cuts explored at least 5 m below the lowest cut " +
			"elevation (GEC5CutDepth)." + alongNote,
	},
	{
		Name: "fhwa-embankment-uniform", Title: "Embankments and cut slopes, uniform ground: a point every 120 m",
		MaxSpacingFt: m(120), Lattice: "square",
		Source: SourceGEC5, Tag: TagSeen,
		Note: "Published 120 m (394 ft) where ground is uniform, down to 60 m where erratic; at least 3 points " +
			"on a transverse line at critical sections; cuts explored at least 5 m below the lowest cut " +
			"elevation (GEC5CutDepth)." + alongNote,
	},
	{
		Name: "fhwa-wall", Title: "Retaining walls longer than 30 m: a point every 30 m",
		MaxSpacingFt: m(30), Lattice: "square",
		Source: SourceGEC5, Tag: TagSeen + " (attribution memory)",
		Note: "Published 30–60 m (98–197 ft) for walls longer than 30 m, alternating in front of and behind " +
			"the wall; the close end, 30 m, is taken. The values were read; their attribution to GEC-5 is " +
			"from memory. TxDOT asks at most 200 ft (txdot-wall); where the two differ this one is the more " +
			"conservative." + alongNote,
	},
	{
		Name: "navfac-closely-spaced-footings", Title: "Large structure with closely spaced footings: about 50 ft both ways",
		MaxSpacingFt: 50, Lattice: "square",
		Source: SourceNAVFAC, Tag: TagSeen,
		Note: "About 50 ft in both directions, with points at possible exterior foundation walls and machinery or elevator pits.",
	},
	{
		Name: "navfac-isolated-medium", Title: "Isolated rigid foundation of 2,500–10,000 ft²: at least 3 points",
		MinPoints: 3,
		Source:    SourceNAVFAC, Tag: TagSeen,
		Note: "At least 3 borings around the perimeter; interior borings added depending on the first results (MinPointsForFootprint).",
	},
	{
		Name: "navfac-isolated-small", Title: "Isolated rigid foundation under 2,500 ft²: at least 2 points",
		MinPoints: 2,
		Source:    SourceNAVFAC, Tag: TagSeen,
		Note: "At least 2 borings at opposite corners; more in erratic ground (MinPointsForFootprint).",
	},
	{
		Name: "navfac-low-load-warehouse", Title: "Large low-load warehouse: 4 corners plus interior",
		MinPoints: 4, Corners: true,
		Source: SourceNAVFAC, Tag: TagSeen,
		Note: "At least 4 borings at the corners plus intermediate borings at interior foundations enough to " +
			"define the subsoil profile; combine with a spacing preset for the interior.",
	},
	{
		Name: "navfac-soft-strata", Title: "Site on soft compressible strata: 100 ft at possible building locations",
		MaxSpacingFt: 100, Lattice: "square",
		Source: SourceNAVFAC, Tag: TagSeen,
		Note: "Published range 100–200 ft at possible building locations; the close end, 100 ft, is taken; " +
			"add intermediate borings once building sites are fixed.",
	},
	{
		Name: "navfac-wide-site-preliminary", Title: "New site of wide extent, preliminary: 200 ft apart",
		MaxSpacingFt: 200, Lattice: "square",
		Source: SourceNAVFAC, Tag: TagSeen,
		Note: "Published range 200–500 ft for preliminary borings; the close end, 200 ft, is taken; " +
			"detailed exploration adds borings for geologic sections.",
	},
	{
		Name: "txdot-wall", Title: "Retaining walls: borings at most 200 ft apart",
		MaxSpacingFt: 200, Lattice: "square",
		Source: SourceTxDOT, Tag: TagSeen,
		Note: "At most 200 ft apart; at least 15 ft below a fill wall base and 20 ft below a cut wall base " +
			"(TxDOTWallDepth). FHWA GEC-5 asks a point every 30–60 m (98–197 ft; fhwa-wall), the more " +
			"conservative of the two." + alongNote,
	},
	{
		Name: "ufc-road", Title: "Roads: at most 300 ft apart along the centre line",
		MaxSpacingFt: 300, Lattice: "square",
		Source: SourceUFCRoads, Tag: TagSeen,
		Note: "At most 300 ft along the centre line; at most 100 ft where soils vary (ufc-road-variable). " +
			ufcRoadNote + alongNote,
	},
	{
		Name: "ufc-road-variable", Title: "Roads where soils vary: at most 100 ft apart",
		MaxSpacingFt: 100, Lattice: "square",
		Source: SourceUFCRoads, Tag: TagSeen,
		Note: "At most 100 ft along the centre line where soils vary; 300 ft otherwise (ufc-road). " +
			ufcRoadNote + alongNote,
	},
	{
		Name: "ufgs-unknown-site", Title: "Site of unknown ground, preliminary: about 200 ft centres, 30 ft deep",
		MaxSpacingFt: 200, MinDepthFt: 30, Lattice: "square",
		Source: SourceUFGS, Tag: TagSeen,
		Note: "Preliminary borings on about 200 ft centres; borings generally no less than 30 ft deep.",
	},
}

// Presets returns every preset, sorted by name. The slice is a copy; the
// caller may change it.
func Presets() []Preset {
	out := append([]Preset(nil), presets...)
	sort.Slice(out, func(i, j int) bool { return out[i].Name < out[j].Name })
	return out
}

// Lookup returns the preset of the given name (case and surrounding blanks
// ignored). An unknown name gives an error wrapping ErrUnknownPreset that
// names the nearest known preset by edit distance.
func Lookup(name string) (Preset, error) {
	key := strings.ToLower(strings.TrimSpace(name))
	all := Presets()
	for _, p := range all {
		if p.Name == key {
			return p, nil
		}
	}
	best, bestD := "", math.MaxInt
	for _, p := range all { // name order, so ties go to the first name
		if d := fielderr.EditDistance(key, p.Name); d < bestD {
			best, bestD = p.Name, d
		}
	}
	names := make([]string, len(all))
	for i, p := range all {
		names[i] = p.Name
	}
	return Preset{}, fmt.Errorf("%w %q: did you mean %q? (known presets: %s)",
		ErrUnknownPreset, name, best, strings.Join(names, ", "))
}

// Footprint limits of NAVFAC's isolated rigid foundation rule, ft².
const (
	smallFootprintFt2  = 2500
	mediumFootprintFt2 = 10000
)

// MinPointsForFootprint returns the least number of borings NAVFAC DM-7.01
// (UFC 3-220-10N, Table 6) asks for under an isolated rigid foundation of
// the given plan area: 2 at opposite corners under 2,500 ft², 3 around the
// perimeter from 2,500 to 10,000 ft². Above 10,000 ft² that rule does not
// apply and n is 0 (no count rule, as in a scenario's rules); source then
// says which rules do: 50 ft both ways for a large structure with closely
// spaced footings, or 4 corners plus interior for a low-load warehouse.
func MinPointsForFootprint(areaFt2 float64) (n int, source string, err error) {
	switch {
	case math.IsNaN(areaFt2) || math.IsInf(areaFt2, 0) || areaFt2 <= 0:
		return 0, "", badInput("areaFt2", areaFt2, "a plan area greater than 0 ft²")
	case areaFt2 < smallFootprintFt2:
		return 2, SourceNAVFAC + ": isolated rigid foundation under 2,500 ft², at least 2 borings at opposite corners", nil
	case areaFt2 <= mediumFootprintFt2:
		return 3, SourceNAVFAC + ": isolated rigid foundation of 2,500–10,000 ft², at least 3 borings around the perimeter", nil
	}
	return 0, SourceNAVFAC + ": over 10,000 ft² the isolated-foundation rule does not apply; use " +
		"navfac-closely-spaced-footings (about 50 ft both ways) or navfac-low-load-warehouse " +
		"(4 corners plus interior)", nil
}
