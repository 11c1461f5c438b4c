package sdk

import (
	"fmt"
	"math"
	"strings"
)

// Sampling interval conventions for Site.SampleIntervalFt and
// Site.SampleSchedule, shared by rigs and scenario files.
//
// ASTM D1586 describes how a split barrel is driven; it sets no sampling
// interval. The interval is the engineer's choice: the common practice is
// continuous or every 2.5 ft to 10 ft, then every 5 ft (DefaultSampleSchedule).
// The TxDOT LRFD Geotechnical Manual (2024) asks every 5 ft from 5 ft under
// embankments and in cuts; a scenario can ask for that with an interval of 5.
const (
	// DefaultSampleIntervalFt is the interval below 10 ft of the default
	// schedule, 5 ft (common practice). A site's SampleIntervalFt of I ≥
	// 2.5 ft samples at 2.5 ft, 5 ft, then every I ft (the 2.5-ft sample
	// below topsoil is common practice).
	DefaultSampleIntervalFt = 5.0
	// ContinuousSampleIntervalFt asks for continuous sampling: 24-in split
	// barrels driven one after another, a sample every 2 ft from the
	// surface (ASTM D1586 allows barrel halves 18–30 in long). Any interval
	// under 2.5 ft is sampled from the surface at that interval.
	ContinuousSampleIntervalFt = 2.0
)

// SampleBand is one band of a sampling schedule: a sample every EveryFt
// from the bottom of the band above (0 for the first band) down to ToFt.
// ToFt 0 means to the bottom of the hole; only the last band may have it.
type SampleBand struct {
	ToFt    float64
	EveryFt float64
}

// DefaultSampleSchedule is the schedule a rig uses when a site gives
// neither a schedule nor an interval: every 2.5 ft to 10 ft, then every
// 5 ft — samples at 2.5, 5, 7.5, 10, 15, 20 ft ... (common practice; ASTM
// D1586 sets no interval).
func DefaultSampleSchedule() []SampleBand {
	return []SampleBand{{ToFt: 10, EveryFt: 2.5}, {EveryFt: DefaultSampleIntervalFt}}
}

// IntervalSchedule is the schedule of a single interval: at 2.5 ft, 5 ft,
// then every intervalFt for intervals of 2.5 ft or more; every intervalFt
// from the surface for shorter (continuous) intervals.
func IntervalSchedule(intervalFt float64) []SampleBand {
	if intervalFt < 2.5 {
		return []SampleBand{{EveryFt: intervalFt}}
	}
	return []SampleBand{{ToFt: 5, EveryFt: 2.5}, {EveryFt: intervalFt}}
}

// ScheduleOf returns the schedule a site asks for: its SampleSchedule, else
// the schedule of its SampleIntervalFt, else DefaultSampleSchedule.
func ScheduleOf(s Site) []SampleBand {
	switch {
	case len(s.SampleSchedule) > 0:
		return s.SampleSchedule
	case s.SampleIntervalFt > 0 && !math.IsInf(s.SampleIntervalFt, 0):
		return IntervalSchedule(s.SampleIntervalFt)
	}
	return DefaultSampleSchedule()
}

// CheckSchedule reports what is wrong with a schedule, or nil: every band
// samples at a finite positive interval, the bands go deeper in turn, and
// only the last may run to the bottom of the hole (ToFt 0).
func CheckSchedule(bands []SampleBand) error {
	prev := 0.0
	for i, b := range bands {
		if !(b.EveryFt > 0) || math.IsInf(b.EveryFt, 0) {
			return fmt.Errorf("sampling band %d: interval %v ft: want a number of feet greater than 0", i, b.EveryFt)
		}
		if b.ToFt == 0 {
			if i != len(bands)-1 {
				return fmt.Errorf("sampling band %d runs to the bottom of the hole but band %d follows it; only the last band may leave out its depth", i, i+1)
			}
			continue
		}
		if !(b.ToFt > prev) || math.IsInf(b.ToFt, 0) {
			return fmt.Errorf("sampling band %d: to %v ft: want a depth below the band above (%v ft)", i, b.ToFt, prev)
		}
		prev = b.ToFt
	}
	return nil
}

// SampleDepths gives the depths (top of each drive, ft) of split-barrel
// samples in a hole depthFt deep under a schedule: in each band, every
// EveryFt from the bottom of the band above, down to the band's ToFt. A
// sample counts when its top is at or above the bottom of the hole (common
// practice: the boring ends with its last sample). Below the last band's
// ToFt (when it gives one) no more samples are taken.
func SampleDepths(depthFt float64, bands []SampleBand) []float64 {
	const eps = 1e-9
	var out []float64
	top := 0.0
	for _, b := range bands {
		if !(b.EveryFt > 0) {
			continue
		}
		bottom := depthFt
		if b.ToFt > 0 && b.ToFt < bottom {
			bottom = b.ToFt
		}
		for k := 1; ; k++ {
			d := top + float64(k)*b.EveryFt
			if d > bottom+eps {
				break
			}
			out = append(out, math.Round(d*1e6)/1e6)
		}
		if b.ToFt == 0 || b.ToFt >= depthFt {
			break
		}
		top = b.ToFt
	}
	return out
}

// DescribeSchedule writes a schedule for people, to four significant
// figures: "every 2.5 ft to 10 ft, then every 5 ft".
func DescribeSchedule(bands []SampleBand) string {
	parts := make([]string, len(bands))
	for i, b := range bands {
		p := fmt.Sprintf("every %.4g ft", b.EveryFt)
		if b.ToFt > 0 {
			p += fmt.Sprintf(" to %.4g ft", b.ToFt)
		}
		if i > 0 {
			p = "then " + p
		}
		parts[i] = p
	}
	return strings.Join(parts, ", ")
}
