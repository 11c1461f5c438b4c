// Package scenarios loads, validates and embeds rigmix scenario files: a
// site, its zones with their use and ground, no-go areas, the exploration
// rules per zone, the rigs offered and the rate book to price with.
//
// All lengths in a loaded Scenario are in feet and all areas in square feet,
// whatever unit the file was written in; names carry the unit.
//
// The file format is documented key by key in REFERENCE.md beside this
// file. Keys are checked strictly (a misspelt key is an error naming the
// nearest known key); settings are merged through viper, in rising
// precedence: defaults, the file, and the overrides map the command line
// passes; the environment is never read. Every problem with the input is a
// *FieldError naming the file, the field path, what is wrong and what
// would be right.
package scenarios

import (
	"github.com/rigmix/rigmix/optimizer/geom"
	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/plugins/sdk"
	"math"
)

// Scenario is a loaded and validated scenario.
type Scenario struct {
	Name        string // short identifier
	Title       string // a line for people
	Description string
	Demo        bool   // invented demo data
	Note        string // provenance note; says so when the data are invented
	Source      string // file it came from, or "demo:NAME"
	Units       string // unit the file was written in: "ft" or "m"

	// Origin anchors the local frame (0,0) to WGS 84 for GeoJSON in and out;
	// nil when the scenario gives none.
	Origin *LonLat

	Boundary geom.Polygon // site boundary, ft
	Zones    []Zone
	NoGo     []NoGo

	Rigs []string // rig names offered (built-in or plugin)
	// RigUnits is, per rig name, the most crews of that rig that may be
	// sent (1…MaxRigUnits); a rig not listed sends one. The plan chooses
	// how many.
	RigUnits  map[string]int `json:",omitempty"`
	RateBook  string         // demo rate-book name, or a file path already resolved against the scenario file's folder
	YardMiles float64        // one-way distance from the rig yard, miles
	// MinSeparationFt is the least distance between two points of a plan
	// (DefaultMinSeparationFt unless the file says), whatever zones they
	// serve; two required points may be closer.
	MinSeparationFt float64
	HoursDay        float64 // working hours per field day
	GapRel          float64 // relative optimality gap the solve stops at
	TimeLimitS      float64 // solve time limit, seconds (0: none)

	// Lab is the program of laboratory tests priced on the samples the
	// plan recovers, for every zone; nil means each zone's samples get
	// the program of its purposes (lab.ForPurposes(zone.Purposes)). A
	// file's "lab: none" gives lab.None().
	Lab *lab.Program

	// Files are the other files read: GeoJSON outlines, a rate-book file
	// (paths as opened).
	Files []string `json:"-"`
	// embedded are the embedded files a demo read, relative to its YAML.
	embedded []string
}

// LonLat is a WGS 84 position in degrees.
type LonLat struct {
	Lon, Lat float64
}

// Use is what a zone is for.
type Use string

const (
	UseStructure     Use = "structure"
	UsePavement      Use = "pavement"
	UseSlope         Use = "slope"
	UseFill          Use = "fill"
	UseEnvironmental Use = "environmental"
	UseOpen          Use = "open"
)

// PurposesOf returns the lab purposes a zone's use implies when the file
// names none: a structure's foundations, a pavement's subgrade, fill as
// earthwork, environmental samples for the analytical list; slopes are
// explored for strength like foundations, open ground for index tests.
func PurposesOf(u Use) []lab.Purpose {
	switch u {
	case UseStructure, UseSlope:
		return []lab.Purpose{lab.Foundation}
	case UsePavement:
		return []lab.Purpose{lab.Pavement}
	case UseFill:
		return []lab.Purpose{lab.Earthwork}
	case UseEnvironmental:
		return []lab.Purpose{lab.Environmental}
	}
	return []lab.Purpose{lab.General}
}

// Zone is an area of the site with one use, one kind of ground and one set
// of rules.
type Zone struct {
	ID   string
	Name string
	Use  Use
	// Purposes are what the zone's ground is explored for, as far as the
	// lab program goes (pavement, pond, soft_ground, ...); the file's
	// purpose list, else the one its use implies (PurposesOf).
	Purposes []lab.Purpose
	Polygon  geom.Polygon // ft
	Priority float64      // weight of its area in coverage measures (default 1)

	Structure *Structure // for UseStructure; nil otherwise
	Ground    Ground
	Rules     Rules
}

// Structure describes a planned building or other structure.
type Structure struct {
	Stories   int
	LoadClass string // "light" or "heavy"
}

// Ground is what a rig meets at a zone.
type Ground struct {
	Surface       sdk.Surface
	SlopePct      float64
	GroundwaterFt float64 // depth to groundwater; 0 unknown
	RockFt        float64 // depth to rock; 0 unknown
	OverheadFt    float64 // overhead clearance; 0 none limiting
}

// Lattice is the pattern candidate points are laid on.
type Lattice string

const (
	Square     Lattice = "square"
	Triangular Lattice = "triangular"
)

// Rules are the exploration rules a zone must meet. A zero value means the
// rule does not apply.
type Rules struct {
	AreaPerPointFt2  float64      // at least one point per this many ft²
	MaxSpacingFt     float64      // every spot within the lattice covering radius of a point
	Lattice          Lattice      // pattern the spacing rule refers to (default triangular)
	MinPoints        int          // at least this many points
	MinDepthFt       float64      // every point at least this deep
	SampledShare     float64      // at least this share of points recovers samples (0..1)
	Methods          []sdk.Method // methods allowed (empty: all)
	SampleIntervalFt float64      // sampling interval in borings (0: rig default)
	// SampleSchedule is the sampling schedule in borings, shallowest band
	// first (depths in ft); empty: SampleIntervalFt, or the default
	// schedule (sdk.DefaultSampleSchedule) when that is 0 too.
	SampleSchedule []sdk.SampleBand
	Corners        bool // a point is required at each polygon corner
	// SpacingMeans is how MaxSpacingFt is read: SpacingGrid ("" too), the
	// spacing of a square or triangular pattern, whose covering radius
	// every spot must lie within; or SpacingRadius, the largest distance
	// from any spot to a point.
	SpacingMeans string
	// NoSpread turns off the implied spacing a count or area-per-point
	// rule without a spacing rule gets (the file's "spread: false").
	NoSpread       bool
	RequiredPoints []geom.Point // points that must be explored
	// RequiredHow is, for each required point, the method and rig it must
	// be explored by ("" for either: any the zone allows).
	RequiredHow []PointHow
	Source      string // where the rule numbers come from

	// Preset is the name of the rules.Presets entry the zone names, or "".
	Preset string
	// Origins says where each rule that applies came from, by its key in
	// the file ("max_spacing", "min_depth", ...): "scenario" when the file
	// states it, "preset NAME: SOURCE" when a preset filled it, "computed:
	// …" when worked out (depth from stories or a footing, the NAVFAC
	// footprint minimum), "default: …" for a default.
	Origins map[string]string
}

// DefaultMinSeparationFt keeps two holes of a plan at least 5 ft apart, so
// that one does not stand in the other's disturbed ground and two zones
// sharing an edge do not both drill the same spot (common practice).
const DefaultMinSeparationFt = 5.0

// Readings of a spacing rule (Rules.SpacingMeans).
const (
	SpacingGrid   = "grid"
	SpacingRadius = "radius"
)

// SpacingRadiusFt is the covering radius a spacing rule holds every spot
// of its zone to: for the grid reading, the lattice's covering radius (s/√2
// square, s/√3 triangular — plane geometry); for the radius reading, s
// itself; 0 without a spacing rule.
func (r Rules) SpacingRadiusFt() float64 {
	switch {
	case r.MaxSpacingFt <= 0:
		return 0
	case r.SpacingMeans == SpacingRadius:
		return r.MaxSpacingFt
	case r.Lattice == Square:
		return r.MaxSpacingFt / math.Sqrt2
	}
	return r.MaxSpacingFt / math.Sqrt(3)
}

// PointHow fixes how a required point is explored.
type PointHow struct {
	Method sdk.Method `json:",omitempty"`
	Rig    string     `json:",omitempty"`
}

// Origin values for rules the file states and for defaults.
const (
	OriginScenario = "scenario"
	originComputed = "computed: "
	originDefault  = "default: "
)

// NoGo is an area where no point may be placed (utilities, existing
// structures, protected trees, ...).
type NoGo struct {
	ID      string
	Reason  string
	Polygon geom.Polygon // ft
}
