// Package plan runs the whole planning pipeline on plain data: candidates and
// coverage from the scenario's geometry, one batched question per rig, the
// priced options, the model, the solve, and the plan read back — item by
// item, rig by rig and rule by rule.
package plan

import "github.com/rigmix/rigmix/optimizer/rules"

// Plan is the result of planning one scenario. Its JSON form is the plan
// file documented in optimizer/plan/SCHEMA.md; field order and formatting are
// stable so the same input gives the same bytes.
type Plan struct {
	Schema   string       `json:"schema"`
	Scenario ScenarioInfo `json:"scenario"`
	RateBook RateBookInfo `json:"rate_book"`

	Points   []Point     `json:"points"`
	Estimate []Line      `json:"estimate"`
	Total    float64     `json:"total"`
	Rigs     []RigPlan   `json:"rigs"`
	Finish   int         `json:"field_days"` // days until the last rig is done (rigs in parallel)
	Rules    []RuleCheck `json:"rules"`
	// Lab says, for each zone whose points recover samples, which lab
	// program its samples get and what that program rests on.
	Lab      []LabBasis `json:"lab,omitempty"`
	Coverage Coverage   `json:"coverage"`
	Baseline *Baseline  `json:"hand_grid_baseline,omitempty"`
	Solver   SolverInfo `json:"solver"`
	Excluded []Excluded `json:"excluded_options"`
	Warnings []string   `json:"warnings"`
	Cautions []string   `json:"cautions"`
}

// ScenarioInfo names the scenario a plan was made for.
type ScenarioInfo struct {
	Name   string `json:"name"`
	Title  string `json:"title"`
	Source string `json:"source"`
	Demo   bool   `json:"demo"`
}

// RateBookInfo names the rate book that priced the plan.
type RateBookInfo struct {
	Name      string `json:"name"`
	Title     string `json:"title"`
	Currency  string `json:"currency"`
	Effective string `json:"effective"`
	Region    string `json:"region"`
	Demo      bool   `json:"demo"`
}

// Point is one exploration point of the plan.
type Point struct {
	ID               string   `json:"id"`
	Zone             string   `json:"zone"`
	XFt              float64  `json:"x_ft"`
	YFt              float64  `json:"y_ft"`
	Lon              *float64 `json:"lon,omitempty"`
	Lat              *float64 `json:"lat,omitempty"`
	Method           string   `json:"method"`
	Rig              string   `json:"rig"`
	DepthFt          float64  `json:"depth_ft"`
	SampleIntervalFt float64  `json:"sample_interval_ft,omitempty"`
	// Sampling is the boring's sampling schedule in words, e.g. "every
	// 2.5 ft to 10 ft, then every 5 ft".
	Sampling     string  `json:"sampling,omitempty"`
	Hours        float64 `json:"hours"`          // on the point plus the move to it
	OnPointHours float64 `json:"hours_on_point"` // set-up to tear-down, no travel
	Surface      string  `json:"surface"`        // ground surface of its zone
	Cost         float64 `json:"cost"`
	Required     bool    `json:"required,omitempty"`
}

// Line is one line of the itemized estimate: quantity × unit price.
type Line struct {
	Item        string  `json:"item"`
	Description string  `json:"description"`
	Quantity    float64 `json:"quantity"`
	Unit        string  `json:"unit"`
	UnitPrice   float64 `json:"unit_price"`
	Extension   float64 `json:"extension"`
}

// RigPlan is what one rig does.
type RigPlan struct {
	Name      string         `json:"name"`
	Title     string         `json:"title"`
	Mobilized bool           `json:"mobilized"`
	Points    int            `json:"points"`
	ByMethod  map[string]int `json:"by_method"`
	Hours     float64        `json:"hours"`
	MobHours  float64        `json:"mobilization_hours"`
	FieldDays int            `json:"field_days"`
}

// Excluded is a way of exploring a zone that a rig ruled out, and why.
type Excluded struct {
	Zone   string `json:"zone"`
	Method string `json:"method"`
	Rig    string `json:"rig"`
	Reason string `json:"reason"`
}

// LabBasis is the lab program a zone's samples get: the program's name (the
// zone's purposes joined by "+", or the scenario's own program) and its
// basis.
type LabBasis struct {
	Zone    string `json:"zone"`
	Program string `json:"program"`
	Basis   string `json:"basis"`
}

// RuleCheck tells whether one rule of one zone is met.
type RuleCheck struct {
	Zone     string `json:"zone"`
	Rule     string `json:"rule"`
	Required string `json:"required"`
	Achieved string `json:"achieved"`
	Met      bool   `json:"met"`
	Source   string `json:"source,omitempty"`
	// Origin says where the rule's value came from: "scenario", "preset
	// NAME: SOURCE", "computed: …" or "default: …".
	Origin string  `json:"origin,omitempty"`
	Value  float64 `json:"-"`
	// FarthestFt and FarthestAt are, for a spacing rule, the exact
	// farthest ground from the zone's points and where it is (see
	// geom.Farthest); absent for other rules.
	FarthestFt float64 `json:"farthest_ft,omitempty"`
	FarthestAt *XY     `json:"farthest_at,omitempty"`
	// NeighbourFt is the largest distance between two neighbouring points
	// of the zone (Voronoi neighbours across its ground), for a spacing
	// rule read as "points no farther apart than"; 0 with fewer than two.
	NeighbourFt float64 `json:"neighbour_ft,omitempty"`
}

// XY is a place in the site's local frame, in feet.
type XY struct {
	XFt float64 `json:"x_ft"`
	YFt float64 `json:"y_ft"`
}

// Coverage summarizes how much of the ground under spacing rules lies within
// the covering radius of a chosen point.
type Coverage struct {
	AreaFt2        float64 `json:"area_ft2"`
	CoveredFt2     float64 `json:"covered_ft2"`
	CoveredPercent float64 `json:"covered_percent"`
}

// SolverInfo reports how the solve ended.
type SolverInfo struct {
	Status     string  `json:"status"`
	Objective  float64 `json:"objective"`
	Bound      float64 `json:"bound"`
	Gap        float64 `json:"gap"`
	Nodes      int     `json:"nodes"`
	Candidates int     `json:"candidates"`
	Options    int     `json:"options"`
	Rows       int     `json:"rows"`
	Columns    int     `json:"columns"`
}

// SchemaVersion identifies the plan JSON layout.
const SchemaVersion = "rigmix.plan/1"

// The cautions printed with plans: exploration work can hurt people. The
// utilities line cites OSHA 29 CFR 1926.651(b) alone: a clause of ASTM
// D420-18 once cited beside it could not be confirmed, so it was dropped.
// The overhead-line clearances are OSHA 29 CFR 1926.1408 Table A by voltage
// (rules.OverheadLineCaution); a single 20 ft is right only up to 350 kV.
const (
	CautionUtilities = "Locate underground utilities before any drilling or digging: make the one-call notice and have owners mark their lines (OSHA 29 CFR 1926.651(b))."
	CautionTestPits  = "Test pits: nobody enters an excavation 4 ft or deeper without a safe way out (29 CFR 1926.651(c)(2)); 5 ft or deeper needs a protective system — sloping, benching or shoring — unless in stable rock (1926.652(a)(1)); deeper than 20 ft needs a design by a registered professional engineer (Subpart P, Appendices B and F)."
	CautionWaste     = "On an environmental site, soil and water brought up are investigation-derived waste: contain, label and dispose of them as the site's rules require."
	CautionReview    = "This plan is a planning aid. A licensed professional reviews it; local codes and the client's requirements govern."
)

// Cautions is every caution, in print order: what a report shows for a
// plan file that carries none.
var Cautions = []string{CautionUtilities, rules.OverheadLineCaution(), CautionTestPits, CautionWaste, CautionReview}

// CautionsFor is the cautions that fit a plan: utilities, overhead lines
// and the licensed review always; the test-pit caution only when the plan
// digs test pits, the waste caution only when the site has an
// environmental zone.
func CautionsFor(testPits, environmental bool) []string {
	out := []string{CautionUtilities, rules.OverheadLineCaution()}
	if testPits {
		out = append(out, CautionTestPits)
	}
	if environmental {
		out = append(out, CautionWaste)
	}
	return append(out, CautionReview)
}
