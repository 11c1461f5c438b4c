package rules

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

func formatG(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }

// LoadClass is how heavy a building is for Sowers's depth rule.
type LoadClass int

const (
	Light LoadClass = iota + 1 // light steel or narrow concrete buildings
	Heavy                      // heavy steel or wide concrete buildings
)

func (c LoadClass) String() string {
	switch c {
	case Light:
		return "light"
	case Heavy:
		return "heavy"
	}
	return fmt.Sprintf("LoadClass(%d)", int(c))
}

// ParseLoadClass reads "light" or "heavy", as a scenario's structure gives
// it.
func ParseLoadClass(s string) (LoadClass, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "light":
		return Light, nil
	case "heavy":
		return Heavy, nil
	}
	return 0, badInput("load class", strconv.Quote(s), `"light" or "heavy"`)
}

// SowersDepth returns the boring depth for a building of the given number
// of stories by Sowers's rule as quoted in Das: D = 3·S^0.7 m for light
// steel or narrow concrete buildings and D = 6·S^0.7 m for heavy steel or
// wide concrete ones (10·S^0.7 and 20·S^0.7 in feet, a rounding of the
// metric form). The formula is recalled from memory, not re-read; the
// metric form is converted exactly.
func SowersDepth(stories int, class LoadClass) (depthFt float64, source string, err error) {
	if stories < 1 {
		return 0, "", badInput("stories", stories, "1 or more stories")
	}
	var coefM float64
	switch class {
	case Light:
		coefM = 3
	case Heavy:
		coefM = 6
	default:
		return 0, "", badInput("load class", class, "light or heavy")
	}
	d := coefM * math.Pow(float64(stories), 0.7)
	return MToFt(d), fmt.Sprintf("%s: D = %g·S^0.7 m, %s building (formula from memory)", SourceSowersForm, coefM, class), nil
}

// sowersTableM is the Sowers & Sowers table in Das: approximate boring
// depth, m, for a building about 30.5 m wide, by number of stories.
var sowersTableM = [...]float64{3.5, 6, 10, 16, 24}

// SowersTableDepth returns the approximate boring depth from the Sowers &
// Sowers table quoted in Das for a building about 30.5 m (100 ft) wide of 1
// to 5 stories. Taller buildings are outside the table: use SowersDepth or
// the stress criteria.
func SowersTableDepth(stories int) (depthFt float64, source string, err error) {
	if stories < 1 || stories > len(sowersTableM) {
		return 0, "", badInput("stories", stories, "1 to 5 stories (the table's range; use SowersDepth or ASCEDepth beyond it)")
	}
	d := sowersTableM[stories-1]
	return MToFt(d), fmt.Sprintf("%s: %d-story building about 30.5 m wide, %g m", SourceSowersTab, stories, d), nil
}

// GEC5CutDepth returns the boring depth below existing ground for a cut
// cutFt deep: at least 5 m below the lowest cut elevation (FHWA GEC-5).
func GEC5CutDepth(cutFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("cutFt", cutFt, false); err != nil {
		return 0, "", err
	}
	return cutFt + MToFt(5), SourceGEC5 + ": at least 5 m below the lowest cut elevation", nil
}

// TxDOTEmbankmentDepth returns the boring depth below original ground for
// an embankment heightFt high: the larger of the embankment height and
// 20 ft (TxDOT LRFD Geotechnical Manual, 2024).
func TxDOTEmbankmentDepth(heightFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("heightFt", heightFt, false); err != nil {
		return 0, "", err
	}
	return math.Max(heightFt, 20), SourceTxDOT + ": the larger of the embankment height and 20 ft", nil
}

// TxDOTCutDepth returns the boring depth below existing ground for a cut
// cutFt deep: 15 ft below the cut bottom (TxDOT LRFD Geotechnical Manual,
// 2024).
func TxDOTCutDepth(cutFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("cutFt", cutFt, false); err != nil {
		return 0, "", err
	}
	return cutFt + 15, SourceTxDOT + ": 15 ft below the cut bottom", nil
}

// WallKind says whether a retaining wall is built up in fill or down in a
// cut.
type WallKind int

const (
	FillWall WallKind = iota + 1
	CutWall
)

func (k WallKind) String() string {
	switch k {
	case FillWall:
		return "fill wall"
	case CutWall:
		return "cut wall"
	}
	return fmt.Sprintf("WallKind(%d)", int(k))
}

// TxDOTWallDepth returns the boring depth below the ground at the boring
// for a retaining wall whose base is baseFt below that ground: at least
// 15 ft below the base of a fill wall and 20 ft below the base of a cut
// wall (TxDOT LRFD Geotechnical Manual, 2024).
func TxDOTWallDepth(kind WallKind, baseFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("baseFt", baseFt, false); err != nil {
		return 0, "", err
	}
	switch kind {
	case FillWall:
		return baseFt + 15, SourceTxDOT + ": at least 15 ft below a fill wall base", nil
	case CutWall:
		return baseFt + 20, SourceTxDOT + ": at least 20 ft below a cut wall base", nil
	}
	return 0, "", badInput("wall kind", kind, "fill wall or cut wall")
}

// ToRockDepth returns the depth of a boring taken to rock at rockFt and
// cored coreFt into it, to prove rock rather than a boulder and to sample
// it (common practice; the core length is the caller's, e.g. from the
// project's rules).
func ToRockDepth(rockFt, coreFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("rockFt", rockFt, false); err != nil {
		return 0, "", err
	}
	if err := checkLength("coreFt", coreFt, false); err != nil {
		return 0, "", err
	}
	return rockFt + coreFt, fmt.Sprintf("%s: to rock at %g ft plus %g ft of core", SourceToRock, rockFt, coreFt), nil
}

// EN1997FootingDepth returns the exploration depth below the foundation
// level of a spread footing widthFt wide for high-rise and civil
// engineering works: the larger of 3·B and 6 m (EN 1997-2 Annex B.3).
func EN1997FootingDepth(widthFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("widthFt", widthFt, true); err != nil {
		return 0, "", err
	}
	return math.Max(3*widthFt, MToFt(6)), SourceEN1997 + ": the larger of 3B and 6 m below a spread footing", nil
}

// EN1997RaftDepth returns the exploration depth below the foundation level
// of a raft widthFt wide: 1.5·B (EN 1997-2 Annex B.3).
func EN1997RaftDepth(widthFt float64) (depthFt float64, source string, err error) {
	if err := checkLength("widthFt", widthFt, true); err != nil {
		return 0, "", err
	}
	return 1.5 * widthFt, SourceEN1997 + ": 1.5B below a raft", nil
}

// EN1997RoadDepthFt is the exploration depth below the formation level of a
// road: 2 m (EN 1997-2 Annex B.3), in feet.
const EN1997RoadDepthFt = 2 / MetersPerFoot
