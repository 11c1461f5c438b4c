// Package sdk is the rig plugin contract of rigmix: the Rig interface a rig
// implements, the plain data it exchanges with the host, the go-plugin
// handshake and plugin map, the gRPC shims and a Serve helper.
//
// A rig knows physics and logistics — which methods it performs and to what
// depth, whether it can reach a point, the hours spent there and the
// quantities of work that produces. It knows nothing of money: the host
// prices quantities from a rate book.
package sdk

import "context"

// Method names an exploration method. The values are the strings used in
// scenario files and in plan output.
type Method string

const (
	// Boring is a drilled soil boring with split-barrel sampling and the
	// Standard Penetration Test (ASTM D1586).
	Boring Method = "boring"
	// CPT is a cone penetration test sounding (ASTM D5778).
	CPT Method = "cpt"
	// TestPit is an excavated test pit.
	TestPit Method = "test_pit"
	// Probe is a hand probe or dynamic cone penetrometer test (ASTM D6951).
	Probe Method = "probe"
)

// Sampled reports whether the method recovers soil samples for the
// laboratory (and so counts toward a rule's share of sampled points).
func (m Method) Sampled() bool { return m == Boring || m == TestPit }

// Surface is the condition of the ground a rig must travel and set up on.
type Surface string

const (
	Firm Surface = "firm"
	Wet  Surface = "wet"
	Soft Surface = "soft"
)

// Rig is what every rig plugin implements. Each call carries the caller's
// context; a rig must answer a whole batch in one call.
type Rig interface {
	// Describe tells what the rig is and what it can do.
	Describe(ctx context.Context) (RigInfo, error)
	// Assess answers, for each requested exploration point, whether the
	// rig can do it and if so the hours and quantities it takes. Answers
	// come back in request order, one per request.
	Assess(ctx context.Context, req AssessRequest) (AssessResponse, error)
	// Mobilize answers the hours and quantities to bring the rig from its
	// yard to the site and back.
	Mobilize(ctx context.Context, req MobilizeRequest) (MobilizeResponse, error)
	// Moves answers the hours to move between points on site, one answer
	// per leg, in request order.
	Moves(ctx context.Context, req MovesRequest) (MovesResponse, error)
}

// MethodLimit is one method a rig performs and the deepest it reaches.
type MethodLimit struct {
	Method     Method
	MaxDepthFt float64
}

// AccessLimits are the site conditions a rig can work in.
type AccessLimits struct {
	Surfaces      []Surface // ground surfaces it can travel and set up on
	MaxSlopePct   float64   // steepest ground slope, percent
	MinOverheadFt float64   // overhead clearance it needs (mast or boom height)
}

// RigInfo describes a rig.
type RigInfo struct {
	Name    string // short identifier, e.g. "track-drill"
	Title   string // a line for people, e.g. "Track-mounted drill rig"
	Methods []MethodLimit
	Access  AccessLimits
	// DayItems are quantities incurred per field day the rig is on site
	// (for example crew per diem); the host multiplies by days.
	DayItems []Quantity
	// StandbyItem is the rate-book item for an hour of standby, if any.
	StandbyItem string
	// Basis says where the rig's numbers come from.
	Basis string
}

// Site is one exploration point put to a rig: where, what and how deep.
type Site struct {
	ID               string
	Method           Method
	DepthFt          float64
	SampleIntervalFt float64 // 0: the rig's default
	Surface          Surface
	SlopePct         float64
	OverheadFt       float64 // clearance above the point; 0 means none limiting
	GroundwaterFt    float64 // depth to groundwater; 0 means unknown
	RockFt           float64 // depth to rock; 0 means unknown or none
	Environmental    bool    // soil and water brought up are investigation-derived waste
	// SampleSchedule is the sampling schedule in borings, shallowest band
	// first; empty: SampleIntervalFt, or the rig's default when that is 0
	// too (ScheduleOf).
	SampleSchedule []SampleBand
}

// AssessRequest is a batch of sites.
type AssessRequest struct {
	Sites []Site
}

// Hours breaks down the time a rig spends on one point.
type Hours struct {
	Setup, Advance, Sampling, Grouting, Teardown float64
}

// Total is the sum of the parts.
func (h Hours) Total() float64 {
	return h.Setup + h.Advance + h.Sampling + h.Grouting + h.Teardown
}

// Quantity is an amount of one rate-book item.
type Quantity struct {
	Item   string  // rate-book item code, e.g. "drill-0-50"
	Unit   string  // unit of measure, e.g. "ft", "each", "hr"
	Amount float64 // how many units
	Note   string  // optional explanation for the estimate line
	// SampleKind, in an Assess answer, says the quantity counts samples
	// recovered for the laboratory, Amount of them (unit "each"), of this
	// kind; the host runs its lab program on them. Empty: not samples —
	// except the items spt-sample and tube-sample, which count as
	// split-barrel and tube samples (SampleKindOf).
	SampleKind SampleKind
}

// SampleKind is a kind of soil sample a rig recovers, as the host's lab
// program tests it.
type SampleKind string

const (
	// SampleSplitBarrel is a split-barrel sample from the Standard
	// Penetration Test (ASTM D1586): disturbed, for index tests.
	SampleSplitBarrel SampleKind = "split-barrel"
	// SampleTube is a thin-walled tube sample (ASTM D1587): undisturbed
	// enough for consolidation and strength tests.
	SampleTube SampleKind = "tube"
	// SampleCore is a length of continuous soil core (a sonic or
	// direct-push rig's liner): disturbed by the advance, tested like a
	// split-barrel sample.
	SampleCore SampleKind = "core"
	// SampleBag is a bag sample from a test pit or auger cuttings:
	// disturbed, for index tests.
	SampleBag SampleKind = "bag"
	// SampleBulk is a bulk sample (some 25–50 lb) for compaction,
	// bearing-ratio and remoulded permeability tests.
	SampleBulk SampleKind = "bulk"
)

// SampleKinds lists every sample kind the host knows.
func SampleKinds() []SampleKind {
	return []SampleKind{SampleSplitBarrel, SampleTube, SampleCore, SampleBag, SampleBulk}
}

// Item codes the host reads as samples when a quantity gives no
// SampleKind (the standard rate book's items).
const (
	ItemSPTSample  = "spt-sample"
	ItemTubeSample = "tube-sample"
)

// SampleKindOf is the kind of sample a quantity counts, or "" when it
// counts none: its SampleKind, else split-barrel for item spt-sample and
// tube for item tube-sample.
func SampleKindOf(q Quantity) SampleKind {
	switch {
	case q.SampleKind != "":
		return q.SampleKind
	case q.Item == ItemSPTSample:
		return SampleSplitBarrel
	case q.Item == ItemTubeSample:
		return SampleTube
	}
	return ""
}

// Answer is a rig's answer for one site.
type Answer struct {
	ID         string
	Feasible   bool
	Reason     string // why not, when not feasible
	Hours      Hours
	Quantities []Quantity
}

// AssessResponse holds one answer per requested site, in order.
type AssessResponse struct {
	Answers []Answer
}

// MobilizeRequest asks for mobilization over a one-way distance.
type MobilizeRequest struct {
	DistanceMi float64
}

// MobilizeResponse covers mobilization and demobilization together.
type MobilizeResponse struct {
	Hours      float64
	Quantities []Quantity
}

// MoveLeg is one move between points on site.
type MoveLeg struct {
	DistanceFt float64
	Surface    Surface
	SlopePct   float64
}

// MovesRequest is a batch of legs.
type MovesRequest struct {
	Legs []MoveLeg
}

// MovesResponse holds the hours for each leg, in order.
type MovesResponse struct {
	Hours []float64
}
