// Package cptrig is the built-in cone penetration rig, "cpt-rig": a
// 20-t truck pushing a piezocone at the standard 20 mm/s (ASTM D5778) to
// 100 ft, on firm, gentle ground. A cone cannot be pushed into rock: a
// sounding deeper than the stated rock depth meets refusal and is refused.
//
// Calibration: with the rates below, 100-ft soundings 200 ft apart give
// about 700 ft a 10-h field day, inside the 600–800 ft a day Robertson's CPT
// notes give for a 20–25 t truck.
package cptrig

import (
	"fmt"

	"github.com/rigmix/rigmix/plugins/builtin/internal/fieldwork"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Name is the rig's name in scenario files.
const Name = "cpt-rig"

// PushFtPerHr is the standard rate of penetration, 20 mm/s (ASTM D5778):
// 20 mm/s × 3600 s/h ÷ 304.8 mm/ft = 236.2 ft/h.
const PushFtPerHr = 20.0 * 3600 / 304.8

// Info describes the rig.
var Info = sdk.RigInfo{
	Name:  Name,
	Title: "CPT truck, 20 t push (CPTu, ASTM D5778)",
	Methods: []sdk.MethodLimit{
		// 100 ft with a 20-t reaction truck in soil above refusal (common
		// practice; deeper needs a heavier truck or friction reducers).
		{Method: sdk.CPT, MaxDepthFt: 100},
	},
	Access: sdk.AccessLimits{
		// A 20-t truck: firm ground only (common practice).
		Surfaces: []sdk.Surface{sdk.Firm},
		// Levelled on its jacks to about 8 % slope (common practice).
		MaxSlopePct: 8,
		// Push frame inside the truck body, about 12 ft high (from memory).
		MinOverheadFt: 12,
	},
	DayItems: []sdk.Quantity{
		fieldwork.Qty("crew-day-cpt", fieldwork.UnitDay, 1, "CPT crew per diem"),
	},
	StandbyItem: "standby-cpt",
	Basis: "ASTM D5778 push rate 20 mm/s; Robertson CPT notes, 600–800 ft a day for a 20–25 t truck; " +
		"other rates common practice or from memory",
}

// Sounding rates (common practice, figures from memory): level on jacks,
// check the cone's saturation and take zero readings 0.25 h; adding 1-m
// rods and pausing for them 0.002 h per ft pushed (about 24 s a rod);
// grouting through the rods as they come out 0.1 h plus 0.001 h per ft;
// pulling rods, final zero readings and cleaning the cone 0.15 h plus
// 0.002 h per ft.
const (
	setupHr          = 0.25
	rodHrPerFt       = 0.002
	groutHr          = 0.1
	groutHrPerFt     = 0.001
	teardownHr       = 0.15
	pullRodsHrPerFt  = 0.002
	soundingIDWDrums = 1 // rod-wash water and grout return, a drum a sounding (common practice)
)

func limits(s sdk.Site) []string {
	if s.RockFt > 0 && s.DepthFt > s.RockFt {
		return []string{fmt.Sprintf("rock at %.4g ft: the cone meets refusal there and cannot be pushed to %.4g ft", s.RockFt, s.DepthFt)}
	}
	return nil
}

func point(s sdk.Site) (sdk.Hours, []sdk.Quantity) {
	h := sdk.Hours{
		Setup:    setupHr,
		Advance:  s.DepthFt/PushFtPerHr + rodHrPerFt*s.DepthFt,
		Grouting: groutHr + groutHrPerFt*s.DepthFt,
		Teardown: teardownHr + pullRodsHrPerFt*s.DepthFt,
	}
	qs := []sdk.Quantity{
		fieldwork.Qty(fieldwork.ItemCPTSounding, fieldwork.UnitFt, s.DepthFt, "CPTu sounding at 20 mm/s (ASTM D5778)"),
		fieldwork.Qty(fieldwork.ItemGroutBoring, fieldwork.UnitFt, s.DepthFt, "grout the sounding full depth"),
	}
	if s.Environmental {
		qs = append(qs, fieldwork.Qty(fieldwork.ItemIDWDrum, fieldwork.UnitEach, soundingIDWDrums, "rod-wash water and grout return"))
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
			// About 5,000 ft/h (1 mph) driving across firm ground; a heavy
			// truck on wet or soft ground needs mats or a tow: 40 % and 25 %
			// (modelling assumption).
			FirmFtPerHr:   5000,
			SurfaceFactor: map[sdk.Surface]float64{sdk.Wet: 0.4, sdk.Soft: 0.25},
			MaxSlopePct:   8,
		},
		Mob: fieldwork.Mobilization{
			Item: "mob-cpt-rig",
			// Drives itself at about 45 mph; 0.25 h each end (common practice).
			RoadMph:      45,
			LoadHr:       0.25,
			UnloadHr:     0.25,
			Note:         "CPT truck and crew, to site and back",
			MileageLabel: "CPT truck",
		},
	}
}
