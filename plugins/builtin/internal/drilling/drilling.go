// Package drilling is the point arithmetic shared by the built-in drill
// rigs (tire- and track-mounted): hollow-stem auger drilling in soil by
// depth band, NQ wireline coring below rock, split-barrel sampling with the
// Standard Penetration Test (ASTM D1586) at the sample interval, grouting
// the hole, and drums of cuttings on environmental sites.
//
// Calibration: with the default rates below, a 25-ft boring sampled every
// 5 ft on an environmental site takes about 4.2 h on the point with a tire
// rig, so about two such borings fit in a field day — USACE ETL 1110-1-171
// (1996) gives "about two 25-ft sampled hollow-stem borings a day" for
// environmental work. A 50-ft geotechnical boring sampled every 5 ft takes
// about 5.7 h, some 90 ft of sampled boring in a 10-h day.
package drilling

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/plugins/builtin/internal/fieldwork"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// Rates are the hours of a drill rig's work on a point.
type Rates struct {
	SetupHr    float64 // level, jack up, raise the mast
	TeardownHr float64 // lower the mast, stow tools
	// AugerFtPerHr is the hollow-stem auger advance rate in soil for each
	// of fieldwork.DrillBands; deeper is slower as flights are added and
	// torque rises.
	AugerFtPerHr []float64
	CoreSetupHr  float64 // change from augers to the NQ wireline core barrel
	CoreFtPerHr  float64 // NQ wireline coring rate in rock (ASTM D2113)
	// An SPT sample takes SPTBaseHr plus SPTHrPerFt per foot of depth
	// (tripping rods in and out of the hole grows with depth).
	SPTBaseHr, SPTHrPerFt float64
	// Grouting takes GroutSetupHr plus GroutHrPerFt per foot of hole.
	GroutSetupHr, GroutHrPerFt float64
	// DeconHr is added to teardown on environmental sites: cleaning augers
	// and tools between borings.
	DeconHr float64
}

// CommonRates are the rates both built-in drill rigs use: the drill head
// and tooling are the same on either carrier, only set-up and tear-down
// differ (common practice).
var CommonRates = Rates{
	// Hollow-stem auger advance in ordinary soil, between samples: 30, 20
	// and 12 ft/h in the 0–50, 50–100 and 100–150 ft bands (from memory).
	AugerFtPerHr: []float64{30, 20, 12},
	// Changing over to core tools about 1 h; NQ coring about 5 ft/h in
	// moderately hard rock including core-run trips (from memory).
	CoreSetupHr: 1.0,
	CoreFtPerHr: 5,
	// One SPT sample: 0.15 h to drive 18 in (ASTM D1586), retrieve, open
	// and log the barrel, plus 0.003 h per ft of depth for the rod trip
	// inside the augers — about 18 min a sample at 50 ft (from memory).
	SPTBaseHr:  0.15,
	SPTHrPerFt: 0.003,
	// Tremie grouting: 0.25 h to mix and set up, about 100 ft of hole an hour
	// (common practice).
	GroutSetupHr: 0.25,
	GroutHrPerFt: 0.01,
	// Steam-cleaning augers and samplers between borings on an
	// environmental site: about 1 h (common practice).
	DeconHr: 1.0,
}

// Hollow-stem auger hole: 8.25 in outside diameter for 4.25-in inside
// diameter augers (common practice), cuttings bulking 25 % once loose
// (from memory). NQ core hole 2.98 in (ASTM D2113 NQ bit, from memory);
// most of it comes up as core, the rest as cuttings in the return water.
const (
	augerHoleDiaIn = 8.25
	coreHoleDiaIn  = 2.98
	bulking        = 1.25
	// deconWaterDrums: one drum of decontamination water per boring on an
	// environmental site (common practice).
	deconWaterDrums = 1
)

func holeFt3PerFt(diaIn float64) float64 {
	r := diaIn / 12 / 2
	return math.Pi * r * r
}

// Point works out hours and quantities for a feasible boring with rates r.
// Below a stated rock depth the hole is cored (rock-core); above it the
// soil footage is split by depth band. Samples are taken in soil only.
func Point(r Rates) fieldwork.Point {
	return func(s sdk.Site) (sdk.Hours, []sdk.Quantity) {
		soilFt, rockFt := s.DepthFt, 0.0
		if s.RockFt > 0 && s.DepthFt > s.RockFt {
			soilFt, rockFt = s.RockFt, s.DepthFt-s.RockFt
		}
		var h sdk.Hours
		var qs []sdk.Quantity
		h.Setup = r.SetupHr
		for i, ft := range fieldwork.BandFootage(soilFt) {
			if ft <= 0 {
				continue
			}
			h.Advance += ft / r.AugerFtPerHr[i]
			b := fieldwork.DrillBands[i]
			qs = append(qs, fieldwork.Qty(b.Item, fieldwork.UnitFt, ft,
				fmt.Sprintf("hollow-stem auger, %.4g–%.4g ft band", b.TopFt, b.BottomFt)))
		}
		if rockFt > 0 {
			h.Advance += r.CoreSetupHr + rockFt/r.CoreFtPerHr
			qs = append(qs, fieldwork.Qty(fieldwork.ItemRockCore, fieldwork.UnitFt, rockFt,
				fmt.Sprintf("NQ wireline core from rock at %.4g ft (ASTM D2113)", s.RockFt)))
		}
		samples := fieldwork.BoringSampleDepths(s, soilFt)
		for _, d := range samples {
			h.Sampling += r.SPTBaseHr + r.SPTHrPerFt*d
		}
		if len(samples) > 0 {
			q := fieldwork.Qty(fieldwork.ItemSPTSample, fieldwork.UnitEach, float64(len(samples)),
				"split-barrel samples with SPT at "+fieldwork.DescribeDepths(samples)+"; "+fieldwork.SPTDriveNote)
			q.SampleKind = sdk.SampleSplitBarrel
			qs = append(qs, q)
		}
		h.Grouting = r.GroutSetupHr + r.GroutHrPerFt*s.DepthFt
		qs = append(qs, fieldwork.Qty(fieldwork.ItemGroutBoring, fieldwork.UnitFt, s.DepthFt, "grout the hole full depth"))
		h.Teardown = r.TeardownHr
		if s.Environmental {
			h.Teardown += r.DeconHr
			waste := bulking * (soilFt*holeFt3PerFt(augerHoleDiaIn) + rockFt*holeFt3PerFt(coreHoleDiaIn))
			drums := fieldwork.Drums(waste) + deconWaterDrums
			qs = append(qs, fieldwork.Qty(fieldwork.ItemIDWDrum, fieldwork.UnitEach, drums,
				fmt.Sprintf("%.1f ft³ of cuttings plus one drum of decontamination water", waste)))
		}
		return h, qs
	}
}
