package rules

import (
	"fmt"
	"math"
)

// Sources of the minimum depths and clearances below.
const (
	// SourceAASHTOEmbankment is the federal guidance for borings under an
	// embankment over soft ground: at least twice the embankment height
	// unless a hard stratum is met first. The rule and its attribution are
	// recalled from memory; the text could not be read here.
	SourceAASHTOEmbankment = "AASHTO LRFD Table 10.4.2-1 / FHWA GEC-5 (from memory)"
	// SourceOSHAPowerLines is the table of minimum clearances from
	// energized overhead lines by voltage (read in a stored copy of the
	// regulation's text).
	SourceOSHAPowerLines = "OSHA 29 CFR 1926.1408, Table A"
)

// BuildingMinDepthFt is the least boring depth for a building whatever a
// stress or stories rule gives, unless refusal (rock) comes first. Common
// practice puts it at about 20–25 ft for buildings, or to refusal; no
// published source sets it, and the deeper end, 25 ft, is taken as the
// conservative default.
const BuildingMinDepthFt = 25.0

// BuildingMinDepthLowFt is the shallow end of that common-practice range,
// 20 ft: a stated depth under it is flagged.
const BuildingMinDepthLowFt = 20.0

// Governing names for a depth with a floor.
const (
	GovernsRule    = "rule"    // the depth rule itself
	GovernsFloor   = "minimum" // the stated minimum
	GovernsRefusal = "rock"    // rock (refusal) met above the minimum
)

// BuildingDepth applies BuildingMinDepthFt to the depth ruleFt a stories or
// stress rule gives for a building: the larger of the two, except that a
// boring stops at rock (refusal) when rock is known at rockFt above the
// minimum — then it goes to the larger of the rule's depth and the rock
// (the caller adds a core with ToRockDepth). It returns the depth, which
// governs, and a line for the rules table.
func BuildingDepth(ruleFt, rockFt float64) (depthFt float64, governs, basis string, err error) {
	if err := checkLength("ruleFt", ruleFt, false); err != nil {
		return 0, "", "", err
	}
	if err := checkLength("rockFt", rockFt, false); err != nil {
		return 0, "", "", err
	}
	const src = "common practice: buildings at least about 20–25 ft or to refusal; the deeper end, 25 ft, taken"
	switch {
	case ruleFt >= BuildingMinDepthFt:
		return ruleFt, GovernsRule, fmt.Sprintf("deeper than the %g ft building minimum (common practice)", BuildingMinDepthFt), nil
	case rockFt > 0 && rockFt < BuildingMinDepthFt:
		d := math.Max(ruleFt, rockFt)
		return d, GovernsRefusal, fmt.Sprintf("to rock (refusal) at %.1f ft, above the %g ft minimum (%s)", rockFt, BuildingMinDepthFt, src), nil
	}
	return BuildingMinDepthFt, GovernsFloor, fmt.Sprintf("raised from the rule's %.1f ft to the %g ft minimum (%s)", ruleFt, BuildingMinDepthFt, src), nil
}

// AASHTOEmbankmentDepth returns twice the embankment height, the depth the
// federal guidance asks for under an embankment over soft ground unless a
// hard stratum is met first (AASHTO LRFD Table 10.4.2-1 / FHWA GEC-5; from
// memory, not re-read).
func AASHTOEmbankmentDepth(heightFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("heightFt", heightFt, false); err != nil {
		return 0, "", err
	}
	return 2 * heightFt, SourceAASHTOEmbankment + ": twice the embankment height over soft ground", nil
}

// EmbankmentDepth is the default depth under an embankment: the more
// conservative (deeper) of the state DOT rule, max(height, 20 ft) (TxDOT
// LRFD Geotechnical Manual, 2024; seen), and twice the height (federal
// guidance over soft ground; from memory). Whether the ground is soft is
// seldom known before the borings, so both are applied; the source says
// which governs.
func EmbankmentDepth(heightFt float64) (depthFt float64, source string, err error) {
	tx, txSrc, err := TxDOTEmbankmentDepth(heightFt)
	if err != nil {
		return 0, "", err
	}
	fed, fedSrc, err := AASHTOEmbankmentDepth(heightFt)
	if err != nil {
		return 0, "", err
	}
	if fed > tx {
		return fed, fmt.Sprintf("the deeper of %s (%.1f ft, governs) and %s (%.1f ft)", fedSrc, fed, txSrc, tx), nil
	}
	return tx, fmt.Sprintf("the deeper of %s (%.1f ft, governs) and %s (%.1f ft)", txSrc, tx, fedSrc, fed), nil
}

// PowerLineClearance is one row of OSHA 29 CFR 1926.1408 Table A: up to and
// including UpToKV (nominal, alternating current), keep at least Ft away.
type PowerLineClearance struct {
	UpToKV float64
	Ft     float64
}

// powerLineTable is OSHA 29 CFR 1926.1408 Table A (seen): up to 50 kV
// 10 ft; over 50 to 200 kV 15 ft; over 200 to 350 kV 20 ft; over 350 to
// 500 kV 25 ft; over 500 to 750 kV 35 ft; over 750 to 1,000 kV 45 ft. Over
// 1,000 kV the utility owner/operator or a registered professional engineer
// sets it. "to" includes its value.
var powerLineTable = []PowerLineClearance{
	{50, 10}, {200, 15}, {350, 20}, {500, 25}, {750, 35}, {1000, 45},
}

// PowerLineTable returns a copy of OSHA 29 CFR 1926.1408 Table A.
func PowerLineTable() []PowerLineClearance {
	return append([]PowerLineClearance(nil), powerLineTable...)
}

// OverheadLineClearanceFt returns the least distance, ft, to keep a mast or
// boom from an energized overhead line of the given nominal voltage in kV
// (OSHA 29 CFR 1926.1408 Table A). The table is the crane rule; keeping
// drill masts and excavator booms to it is common practice. Over 1,000 kV
// there is no table value and the error says who sets it.
func OverheadLineClearanceFt(kV float64) (ft float64, source string, err error) {
	if math.IsNaN(kV) || math.IsInf(kV, 0) || kV <= 0 {
		return 0, "", badInput("kV", kV, "a nominal line voltage greater than 0 kV")
	}
	lo := 0.0
	for _, r := range powerLineTable {
		if kV <= r.UpToKV {
			band := fmt.Sprintf("over %g to %g kV", lo, r.UpToKV)
			if lo == 0 {
				band = fmt.Sprintf("up to %g kV", r.UpToKV)
			}
			return r.Ft, fmt.Sprintf("%s: %s, %g ft", SourceOSHAPowerLines, band, r.Ft), nil
		}
		lo = r.UpToKV
	}
	return 0, "", badInput("kV", kV, "1,000 kV or less: over 1,000 kV the clearance is set by the utility owner/operator or a registered professional engineer ("+SourceOSHAPowerLines+")")
}

// OverheadLineCaution is the caution line on overhead power lines, with the
// clearances of OSHA 29 CFR 1926.1408 Table A by voltage.
func OverheadLineCaution() string {
	s := "Keep drill masts and excavator booms clear of energized overhead power lines by voltage (OSHA 29 CFR 1926.1408 Table A, the crane rule, applied to masts and booms as common practice): "
	lo := 0.0
	for i, r := range powerLineTable {
		if i > 0 {
			s += ", "
		}
		if lo == 0 {
			s += fmt.Sprintf("up to %g kV %g ft", r.UpToKV, r.Ft)
		} else {
			s += fmt.Sprintf("over %g to %s kV %g ft", lo, thousands(r.UpToKV), r.Ft)
		}
		lo = r.UpToKV
	}
	return s + "; over 1,000 kV as the utility or a registered professional engineer sets. Ask the utility for the voltage; until it is known, treat every line as energized and keep the largest distance that could apply."
}

func thousands(v float64) string {
	if v >= 1000 && v == math.Trunc(v) {
		return fmt.Sprintf("%d,%03d", int(v)/1000, int(v)%1000)
	}
	return fmt.Sprintf("%g", v)
}
