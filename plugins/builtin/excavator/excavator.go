// Package excavator is the built-in excavator for test pits, "excavator":
// a mid-size tracked excavator digging, logging, sampling and backfilling
// pits to about 14 ft, on firm or wet ground and slopes to 20 %. A pit
// stops at groundwater (walls slough and the base heaves below it) and at
// rock. Pits 5 ft or deeper get a protective system — sloping, benching or
// shoring — as OSHA 29 CFR 1926.652(a)(1) requires; nobody enters a pit
// 4 ft or deeper without a safe way out (1926.651(c)(2)), so pits are logged
// and sampled from the surface and the bucket.
package excavator

import (
	"fmt"

	"github.com/rigmix/rigmix/plugins/builtin/internal/fieldwork"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Name is the rig's name in scenario files.
const Name = "excavator"

// ProtectionDepthFt is the depth from which a pit needs a protective
// system (OSHA 29 CFR 1926.652(a)(1): required unless under 5 ft deep with
// no sign of cave-in, or all in stable rock).
const ProtectionDepthFt = 5.0

// EgressDepthFt is the depth from which an excavation needs a safe means
// of egress — a ladder, steps or a ramp — within 25 ft of lateral travel
// (OSHA 29 CFR 1926.651(c)(2)). Nobody enters a pit 4 ft or deeper without
// it, nor without bracing or benching (common practice).
const EgressDepthFt = 4.0

// BagSamples is the number of bag samples taken in a pit depthFt deep
// sampled every intervalFt (0: the default): at 2.5 ft, 5 ft, then every
// interval (fieldwork.SampleDepths). The lab allowance counts these.
func BagSamples(depthFt, intervalFt float64) int {
	return len(fieldwork.SampleDepths(depthFt, intervalFt))
}

// Info describes the rig.
var Info = sdk.RigInfo{
	Name:  Name,
	Title: "Tracked excavator for test pits",
	Methods: []sdk.MethodLimit{
		// Practical pit depth about 14 ft: between the about 2.5 m (8 ft)
		// of a backhoe and the about 5 m (16 ft) of a large tracked
		// excavator (published practice note on test pit reach).
		{Method: sdk.TestPit, MaxDepthFt: 14},
	},
	Access: sdk.AccessLimits{
		// Tracks on firm or wet ground; soft ground needs mats
		// (common practice).
		Surfaces: []sdk.Surface{sdk.Firm, sdk.Wet},
		// About 20 % slope digging across the slope (common practice).
		MaxSlopePct: 20,
		// Boom top while digging a pit about 16 ft (from memory).
		MinOverheadFt: 16,
	},
	DayItems: []sdk.Quantity{
		fieldwork.Qty("crew-day-excavator", fieldwork.UnitDay, 1, "excavator operator per diem"),
	},
	StandbyItem: "standby-excavator",
	Basis: "test pit reach from a published practice note (2.5 m backhoe, 5 m large excavator); " +
		"OSHA 29 CFR 1926.651–652 for protection; rates common practice or from memory",
}

// Pit rates, all common practice: set up and mark out 0.15 h; dig and log
// 0.1 h per ft of depth (a 3 × 10 ft pit, about 1.1 yd³ per ft, photographed
// and logged as it goes); a bag sample 0.1 h; backfill and tamp 0.1 h plus
// 0.05 h per ft; tidy and walk off 0.1 h; a protective system (bench or
// slope the walls, or set a trench box) adds 0.5 h.
const (
	setupHr         = 0.15
	digHrPerFt      = 0.1
	sampleHr        = 0.1
	backfillHr      = 0.1
	backfillHrPerFt = 0.05
	teardownHr      = 0.1
	protectionHr    = 0.5
	// On an environmental site the spoil goes back in the pit; the excess
	// of samples and the decontamination water fill about one drum a pit
	// (common practice).
	pitDrums = 1
)

func limits(s sdk.Site) []string {
	var out []string
	if s.GroundwaterFt > 0 && s.DepthFt > s.GroundwaterFt {
		out = append(out, fmt.Sprintf("groundwater at %.4g ft: a test pit stops at groundwater (walls slough, base heaves), so %.4g ft cannot be reached", s.GroundwaterFt, s.DepthFt))
	}
	if s.RockFt > 0 && s.DepthFt > s.RockFt {
		out = append(out, fmt.Sprintf("rock at %.4g ft: the excavator cannot dig rock to %.4g ft", s.RockFt, s.DepthFt))
	}
	return out
}

func point(s sdk.Site) (sdk.Hours, []sdk.Quantity) {
	h := sdk.Hours{
		Setup:    setupHr,
		Advance:  digHrPerFt * s.DepthFt,
		Grouting: backfillHr + backfillHrPerFt*s.DepthFt, // backfill is a pit's abandonment
		Teardown: teardownHr,
	}
	samples := BagSamples(s.DepthFt, s.SampleIntervalFt)
	h.Sampling = sampleHr * float64(samples)
	protect := s.DepthFt >= ProtectionDepthFt
	if protect {
		h.Advance += protectionHr
	}
	note := fmt.Sprintf("dig, log, sample (%d bag samples) and backfill a %.4g-ft test pit", samples, s.DepthFt)
	if s.DepthFt >= EgressDepthFt {
		note += "; a ladder or ramp within 25 ft for anyone entering (OSHA 29 CFR 1926.651(c)(2))"
	}
	qs := []sdk.Quantity{fieldwork.Qty(fieldwork.ItemPitExcavation, fieldwork.UnitHr, h.Total(), note)}
	if protect {
		// One protective system per pit, whatever its depth up to the
		// rig's reach: the walls of one pit are sloped, benched or shored
		// once (29 CFR 1926.652(a)(1)); deeper than 20 ft would need an
		// engineer's design (Subpart P, App. B and F), past this rig's reach.
		qs = append(qs, fieldwork.Qty(fieldwork.ItemPitProtection, fieldwork.UnitEach, 1,
			"sloping, benching or shoring for a pit 5 ft or deeper (OSHA 29 CFR 1926.652(a)(1))"))
	}
	if s.Environmental {
		qs = append(qs, fieldwork.Qty(fieldwork.ItemIDWDrum, fieldwork.UnitEach, pitDrums,
			"spoil returned to the pit; excess samples and decontamination water"))
	}
	return h, qs
}

// New returns the rig.
func New() sdk.Rig {
	return &fieldwork.Rig{
		Info:   Info,
		Limits: limits,
		Point:  point,
		Travel: fieldwork.Travel{
			// About 2,500 ft/h tracking between pits on firm ground, 80 %
			// on wet, 50 % on soft ground on mats (common practice).
			FirmFtPerHr:   2500,
			SurfaceFactor: map[sdk.Surface]float64{sdk.Wet: 0.8, sdk.Soft: 0.5},
			MaxSlopePct:   20,
		},
		Mob: fieldwork.Mobilization{
			Item: "mob-excavator",
			// On a trailer at about 40 mph; 0.5 h to load and 0.5 h to unload
			// (common practice).
			RoadMph:      40,
			LoadHr:       0.5,
			UnloadHr:     0.5,
			Note:         "excavator on a trailer, to site and back",
			MileageLabel: "excavator trailer",
		},
	}
}
