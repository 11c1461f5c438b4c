// Package trackdrill is the built-in track-mounted drill rig,
// "track-drill": the same hollow-stem auger, SPT (ASTM D1586) and NQ core
// work as the tire rig, to 150 ft, on firm, wet or soft ground and slopes to
// 30 %, but it moves slowly on site and comes on a lowboy trailer, so its
// mobilization is longer and costlier.
package trackdrill

import (
	"github.com/rigmix/rigmix/plugins/builtin/internal/drilling"
	"github.com/rigmix/rigmix/plugins/builtin/internal/fieldwork"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Name is the rig's name in scenario files.
const Name = "track-drill"

// Info describes the rig.
var Info = sdk.RigInfo{
	Name:  Name,
	Title: "Track-mounted drill rig (hollow-stem auger, SPT, NQ core)",
	Methods: []sdk.MethodLimit{
		// 150 ft: same drill head as the tire rig (common practice).
		{Method: sdk.Boring, MaxDepthFt: 150},
	},
	Access: sdk.AccessLimits{
		// Tracks spread the load: firm, wet and soft ground (common practice).
		Surfaces: []sdk.Surface{sdk.Firm, sdk.Wet, sdk.Soft},
		// About 30 % slope for a track carrier set up with blocking
		// (common practice).
		MaxSlopePct: 30,
		// Lower mast on the smaller carrier, about 22 ft raised (from
		// memory). Keep 20 ft from overhead power lines as for any mast.
		MinOverheadFt: 22,
	},
	DayItems: []sdk.Quantity{
		fieldwork.Qty("crew-day-drill", fieldwork.UnitDay, 1, "drill crew per diem and support truck"),
	},
	StandbyItem: "standby-drill",
	Basis: "USACE ETL 1110-1-171 (about two 25-ft sampled hollow-stem borings a day); ASTM D1586; " +
		"other rates common practice or from memory, each noted in the source",
}

// rates: the common drill rates with a longer set-up (level on blocking
// and raise mast: 0.75 h) and tear-down (0.5 h) (common practice).
var rates = func() drilling.Rates {
	r := drilling.CommonRates
	r.SetupHr = 0.75
	r.TeardownHr = 0.5
	return r
}()

// New returns the rig.
func New() sdk.Rig {
	return &fieldwork.Rig{
		Info:  Info,
		Point: drilling.Point(rates),
		Travel: fieldwork.Travel{
			// About 2,000 ft/h (0.4 mph) on firm ground; 80 % of that on
			// wet and 60 % on soft ground (common practice for rubber-track
			// carriers, figures from memory).
			FirmFtPerHr:   2000,
			SurfaceFactor: map[sdk.Surface]float64{sdk.Wet: 0.8, sdk.Soft: 0.6},
			MaxSlopePct:   30,
		},
		Mob: fieldwork.Mobilization{
			Item: "mob-track-rig",
			// On a lowboy trailer at about 40 mph average; 0.5 h to load and
			// chain down, 0.5 h to unload at each end (common practice).
			RoadMph:      40,
			LoadHr:       0.5,
			UnloadHr:     0.5,
			Note:         "track-mounted drill rig on a lowboy trailer and crew, to site and back",
			MileageLabel: "lowboy trailer",
		},
	}
}
