package rules

import (
	"fmt"
	"math"
)

// Unit conversions. The foot is 0.3048 m exactly and the pound-force is
// 4.4482216152605 N exactly (international yard and pound agreement, 1959;
// NIST SP 811, appendix B). The pressure and unit-weight factors follow from
// these two, so γ·z converts consistently: (kN/m³ → pcf)·(m → ft) equals
// (kPa → psf).
const (
	MetersPerFoot = 0.3048
	newtonsPerLbf = 4.4482216152605

	// PsfPerKPa is the number of pounds per square foot in one kilopascal.
	PsfPerKPa = 1000 * MetersPerFoot * MetersPerFoot / newtonsPerLbf
	// PcfPerKNPerM3 is the number of pounds per cubic foot in one kN/m³.
	PcfPerKNPerM3 = 1000 * MetersPerFoot * MetersPerFoot * MetersPerFoot / newtonsPerLbf

	// WaterUnitWeightPcf is the unit weight of water in US practice,
	// 62.4 pcf (common practice; the value used throughout Das's US
	// examples).
	WaterUnitWeightPcf = 62.4
	// WaterUnitWeightKNPerM3 is the unit weight of water in SI practice,
	// 9.81 kN/m³ (common practice).
	WaterUnitWeightKNPerM3 = 9.81
)

// MToFt converts metres to feet.
func MToFt(m float64) float64 { return m / MetersPerFoot }

// FtToM converts feet to metres.
func FtToM(ft float64) float64 { return ft * MetersPerFoot }

// KPaToPsf converts kilopascals to pounds per square foot.
func KPaToPsf(kPa float64) float64 { return kPa * PsfPerKPa }

// PsfToKPa converts pounds per square foot to kilopascals.
func PsfToKPa(psf float64) float64 { return psf / PsfPerKPa }

// KNPerM3ToPcf converts a unit weight in kN/m³ to pounds per cubic foot.
func KNPerM3ToPcf(kNm3 float64) float64 { return kNm3 * PcfPerKNPerM3 }

// InputError reports an input a rule cannot use: which input, the value
// given and what would be right. A caller that knows the file and field path
// can wrap it.
type InputError struct {
	Input string // name of the argument or field, e.g. "stories" or "Load.WidthFt"
	Got   string // the value given, formatted
	Want  string // what would be accepted
}

func (e *InputError) Error() string {
	return fmt.Sprintf("rules: %s = %s: want %s", e.Input, e.Got, e.Want)
}

func badInput(input string, got any, want string) error {
	return &InputError{Input: input, Got: fmt.Sprint(got), Want: want}
}

// checkLength reports a length that is NaN, infinite or below the allowed
// minimum. positive asks for > 0, otherwise ≥ 0 is accepted.
func checkLength(input string, v float64, positive bool) error {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return badInput(input, v, "a finite number of feet")
	case positive && v <= 0:
		return badInput(input, v, "a length greater than 0 ft")
	case v < 0:
		return badInput(input, v, "a length of 0 ft or more")
	}
	return nil
}
