package fieldwork

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Travel is how fast a rig moves between points on site.
type Travel struct {
	// FirmFtPerHr is the speed across firm, level ground, counting the
	// care taken crossing a site (not the machine's top speed).
	FirmFtPerHr float64
	// SurfaceFactor scales the speed on wet and soft ground (firm is 1).
	// A rig may cross ground it cannot set up on — slowly, on mats or
	// under tow — so a leg is never refused, only slowed.
	SurfaceFactor map[sdk.Surface]float64
	// MaxSlopePct is the steepest slope the rig travels on directly.
	MaxSlopePct float64
}

// steepDetourFactor is how much longer a leg takes when its slope is beyond
// the rig's limit and the rig must go around or be winched (modelling
// assumption: four times the level time).
const steepDetourFactor = 4.0

// LegHours is the time for one leg: distance over the speed for the
// surface, lengthened in proportion to slope — at the rig's slope limit a
// leg takes twice as long as on the level (modelling assumption).
func (t Travel) LegHours(l sdk.MoveLeg) (float64, error) {
	if math.IsNaN(l.DistanceFt) || math.IsInf(l.DistanceFt, 0) || l.DistanceFt < 0 {
		return 0, fmt.Errorf("distance %v ft must be a finite number ≥ 0", l.DistanceFt)
	}
	slope := math.Abs(l.SlopePct)
	if math.IsNaN(slope) || math.IsInf(slope, 0) {
		return 0, fmt.Errorf("slope %v %% must be a number", l.SlopePct)
	}
	factor := 1.0
	switch surf := surfaceOf(l.Surface); surf {
	case sdk.Firm:
	case sdk.Wet, sdk.Soft:
		factor = t.SurfaceFactor[surf]
	default:
		return 0, fmt.Errorf("unknown surface %q (want firm, wet or soft)", l.Surface)
	}
	hours := l.DistanceFt / (t.FirmFtPerHr * factor)
	if slope <= t.MaxSlopePct {
		hours *= 1 + slope/t.MaxSlopePct
	} else {
		hours *= steepDetourFactor
	}
	return hours, nil
}

// Moves answers a batch of legs.
func (t Travel) Moves(req sdk.MovesRequest) (sdk.MovesResponse, error) {
	var out sdk.MovesResponse
	for i, l := range req.Legs {
		h, err := t.LegHours(l)
		if err != nil {
			return sdk.MovesResponse{}, fmt.Errorf("leg %d: %w", i, err)
		}
		out.Hours = append(out.Hours, h)
	}
	return out, nil
}

// FreeMileageMi is the one-way distance covered by the mobilization lump
// sum; miles beyond it are billed by mob-mileage, counted round trip
// (the rate book's contract, items.md).
const FreeMileageMi = 50.0

// Mobilization is how a rig gets to site and back.
type Mobilization struct {
	Item         string  // mob-<rig>
	RoadMph      float64 // average road speed of the rig or its trailer
	LoadHr       float64 // to load (or make road-ready) at one end of a trip
	UnloadHr     float64 // to unload (or make work-ready) at the other end
	Note         string  // what the lump sum covers
	MileageLabel string  // how the rig travels, for the mileage note
}

// Answer gives mobilization and demobilization together: two road trips
// of the one-way distance, each with a load and an unload.
func (m Mobilization) Answer(req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	d := req.DistanceMi
	if math.IsNaN(d) || math.IsInf(d, 0) || d < 0 {
		return sdk.MobilizeResponse{}, fmt.Errorf("distance %v mi must be a finite number ≥ 0", d)
	}
	out := sdk.MobilizeResponse{
		Hours:      2 * (m.LoadHr + d/m.RoadMph + m.UnloadHr),
		Quantities: []sdk.Quantity{Qty(m.Item, UnitEach, 1, m.Note)},
	}
	if extra := d - FreeMileageMi; extra > 0 {
		out.Quantities = append(out.Quantities, Qty(ItemMobMileage, UnitMi, 2*extra,
			fmt.Sprintf("%s: %g mi one way, %g mi beyond the first %g, round trip", m.MileageLabel, d, extra, FreeMileageMi)))
	}
	return out, nil
}
