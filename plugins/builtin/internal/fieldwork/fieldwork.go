// Package fieldwork holds what the built-in rigs share: the rate-book item
// codes they report in, depth bands, split-barrel sample depths, access
// checks, travel and mobilization arithmetic, drums of investigation-derived
// waste, and a Rig that assembles these parts into an sdk.Rig.
//
// Every number carries its basis beside it: a published source where one
// exists (see the project's SOURCES.md), otherwise "common practice" for a
// fact of the trade without a single published source, "from memory" for a
// value recalled rather than re-read, or "modelling assumption" for a choice
// of ours that only shapes the estimate.
package fieldwork

import (
	"fmt"
	"math"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Rate-book item codes (the contract with rate books; see items.md).
const (
	ItemDrill0to50    = "drill-0-50"
	ItemDrill50to100  = "drill-50-100"
	ItemDrill100to150 = "drill-100-150"
	ItemRockCore      = "rock-core"
	ItemSPTSample     = "spt-sample"
	ItemGroutBoring   = "grout-boring"
	ItemCPTSounding   = "cpt-sounding"
	ItemPitExcavation = "pit-excavation"
	ItemPitProtection = "pit-protection"
	ItemFieldLogging  = "field-logging"
	ItemIDWDrum       = "idw-drum"
	ItemMobMileage    = "mob-mileage"
)

// Units of measure of the items.
const (
	UnitFt   = "ft"
	UnitEach = "each"
	UnitHr   = "hr"
	UnitDay  = "day"
	UnitMi   = "mi"
)

// Band is one depth band of drilled footage, priced per foot by its own
// item because deeper footage is slower and costlier (common practice in
// drilling rate schedules).
type Band struct {
	Item            string
	TopFt, BottomFt float64
}

// DrillBands are the soil-drilling depth bands of the rate book.
var DrillBands = []Band{
	{ItemDrill0to50, 0, 50},
	{ItemDrill50to100, 50, 100},
	{ItemDrill100to150, 100, 150},
}

// BandFootage splits depthFt of drilling into the feet falling in each of
// DrillBands: a 60-ft boring is 50 ft in 0–50 and 10 ft in 50–100.
// Footage below the last band is not reported (rigs refuse such depths).
func BandFootage(depthFt float64) []float64 {
	out := make([]float64, len(DrillBands))
	for i, b := range DrillBands {
		out[i] = math.Max(0, math.Min(depthFt, b.BottomFt)-b.TopFt)
	}
	return out
}

// DefaultSampleIntervalFt and ContinuousSampleIntervalFt: see package sdk.
const (
	DefaultSampleIntervalFt    = sdk.DefaultSampleIntervalFt
	ContinuousSampleIntervalFt = sdk.ContinuousSampleIntervalFt
)

// The Standard Penetration Test drive (ASTM D1586): the split barrel is
// driven 18 in in three 6-in increments and the blows of each increment
// are recorded; the first increment seats the sampler and N is the sum of
// the blows of the last two (12 in).
const (
	SPTDriveIn     = 18.0
	SPTIncrementIn = 6.0
	SPTSeatingIncr = 1 // increments that only seat the sampler
	SPTDriveNote   = "18 in driven in three 6-in increments, N = blows of the last two (ASTM D1586)"
)

// SampleDepths gives the depths (top of each drive, ft) of samples in a
// hole of depthFt at intervalFt (0: DefaultSampleIntervalFt): for intervals
// of 2.5 ft or more, 2.5, 5, then every interval after 5 ft; for shorter
// (continuous) intervals, every interval from the surface
// (sdk.IntervalSchedule). A sample counts when its top is at or above the
// bottom of the hole (common practice: the hole ends with its last sample).
// Test pits take their bag samples by this rule.
func SampleDepths(depthFt, intervalFt float64) []float64 {
	if intervalFt <= 0 || math.IsNaN(intervalFt) || math.IsInf(intervalFt, 0) {
		intervalFt = DefaultSampleIntervalFt
	}
	return sdk.SampleDepths(depthFt, sdk.IntervalSchedule(intervalFt))
}

// BoringSampleDepths gives the depths of split-barrel samples in soilFt of
// soil at a boring site, by the site's schedule (sdk.ScheduleOf): its
// SampleSchedule, else its SampleIntervalFt, else the default schedule,
// every 2.5 ft to 10 ft then every 5 ft (common practice; ASTM D1586 sets
// no interval).
func BoringSampleDepths(s sdk.Site, soilFt float64) []float64 {
	return sdk.SampleDepths(soilFt, sdk.ScheduleOf(s))
}

// DescribeDepths writes sample depths for an estimate note: "2.5, 5, 10 … 60 ft".
func DescribeDepths(ds []float64) string {
	f := func(v float64) string { return fmt.Sprintf("%g", v) }
	switch {
	case len(ds) == 0:
		return "none"
	case len(ds) <= 4:
		parts := make([]string, len(ds))
		for i, d := range ds {
			parts[i] = f(d)
		}
		return strings.Join(parts, ", ") + " ft"
	default:
		return fmt.Sprintf("%s, %s, %s … %s ft", f(ds[0]), f(ds[1]), f(ds[2]), f(ds[len(ds)-1]))
	}
}

// DrumUsableFt3 is what one 55-gallon drum of investigation-derived waste
// holds: 55 gal × 0.13368 ft³/gal = 7.35 ft³, filled to about 90 % to leave
// head space for the lid and expansion (common practice).
const DrumUsableFt3 = 55 * 0.13368 * 0.9

// Drums is the number of drums for wasteFt3 of waste at one point, rounded
// up per point: waste from different points is kept apart so that a drum's
// analytical result can be traced to one location (common practice on
// environmental sites).
func Drums(wasteFt3 float64) float64 {
	if wasteFt3 <= 0 {
		return 0
	}
	return math.Ceil(wasteFt3/DrumUsableFt3 - 1e-9)
}

// Qty is shorthand for a quantity.
func Qty(item, unit string, amount float64, note string) sdk.Quantity {
	return sdk.Quantity{Item: item, Unit: unit, Amount: amount, Note: note}
}
