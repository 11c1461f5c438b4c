// Package tiredrill is the built-in tire-mounted (truck) drill rig,
// "tire-drill": hollow-stem auger borings with split-barrel sampling and the
// Standard Penetration Test (ASTM D1586), NQ coring below rock, to 150 ft.
// It sets up and moves faster than a track rig but works on firm, gentle
// ground only.
package tiredrill

import (
	"github.com/rigmix/rigmix/plugins/builtin/internal/drilling"
	"github.com/rigmix/rigmix/plugins/builtin/internal/fieldwork"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Name is the rig's name in scenario files.
const Name = "tire-drill"

// Info describes the rig.
var Info = sdk.RigInfo{
	Name:  Name,
	Title: "Tire-mounted drill rig (hollow-stem auger, SPT, NQ core)",
	Methods: []sdk.MethodLimit{
		// 150 ft: the deepest depth band of the rate book; a truck rig of
		// the common mid-size class drills that deep with hollow-stem augers
		// in soil (common practice).
		{Method: sdk.Boring, MaxDepthFt: 150},
	},
	Access: sdk.AccessLimits{
		// A drill truck bogs on wet or soft ground (common practice).
		Surfaces: []sdk.Surface{sdk.Firm},
		// About 10 % cross slope is the most a truck can be levelled on
		// its jacks (common practice).
		MaxSlopePct: 10,
		// Mast of about 25 ft raised (from memory). Masts must also stay
		// at least 20 ft from overhead power lines (drilling safety
		// guidelines): give a line's clearance less that distance.
		MinOverheadFt: 25,
	},
	DayItems: []sdk.Quantity{
		fieldwork.Qty("crew-day-drill", fieldwork.UnitDay, 1, "drill crew per diem and support truck"),
	},
	StandbyItem: "standby-drill",
	Basis: "USACE ETL 1110-1-171 (about two 25-ft sampled hollow-stem borings a day); ASTM D1586; " +
		"other rates common practice or from memory, each noted in the source",
}

// rates: the common drill rates with the truck's quicker set-up (level on
// outriggers, raise mast: 0.5 h) and tear-down (0.25 h) (common practice).
var rates = func() drilling.Rates {
	r := drilling.CommonRates
	r.SetupHr = 0.5
	r.TeardownHr = 0.25
	return r
}()

// New returns the rig.
func New() sdk.Rig {
	return &fieldwork.Rig{
		Info:  Info,
		Point: drilling.Point(rates),
		Travel: fieldwork.Travel{
			// About 4,000 ft/h (0.75 mph) across firm ground between
			// points (common practice). On wet or soft ground it is towed
			// or crosses on mats: a half and a third of that (modelling
			// assumption).
			FirmFtPerHr:   4000,
			SurfaceFactor: map[sdk.Surface]float64{sdk.Wet: 0.5, sdk.Soft: 0.33},
			MaxSlopePct:   10,
		},
		Mob: fieldwork.Mobilization{
			Item: "mob-tire-rig",
			// Drives itself at about 45 mph average on the road; 0.25 h to
			// make road-ready and 0.25 h to make work-ready at each end
			// (common practice).
			RoadMph:      45,
			LoadHr:       0.25,
			UnloadHr:     0.25,
			Note:         "tire-mounted drill rig and crew, to site and back",
			MileageLabel: "drill truck",
		},
	}
}
