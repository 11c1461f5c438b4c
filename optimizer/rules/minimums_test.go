package rules

import (
	"strings"
	"testing"
)

// TestBuildingDepthMinimum: common practice sets a least boring depth for
// buildings, about 20–25 ft or to refusal, whatever a stress rule gives
// (common practice; the deeper end, 25 ft, is the default).
func TestBuildingDepthMinimum(t *testing.T) {
	if BuildingMinDepthLowFt != 20 || BuildingMinDepthFt != 25 {
		t.Fatalf("building minimum %g–%g ft, want the common-practice 20–25 ft", BuildingMinDepthLowFt, BuildingMinDepthFt)
	}
	// A two-story school on 6-ft square footings, 2,500 psf net, 2 ft deep:
	// the ASCE (1972) criteria (in Das) give well under 20 ft.
	res, err := ASCEDepth(Load{Area: Area{Shape: Square, WidthFt: 6}, NetPressurePsf: 2500, FoundationDepthFt: 2},
		Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: 10}, TwoToOne)
	if err != nil {
		t.Fatal(err)
	}
	if res.BelowGroundFt >= 20 {
		t.Fatalf("the stress rule gives %.1f ft; the case needs one under the minimum", res.BelowGroundFt)
	}
	for _, c := range []struct {
		rule, rock float64
		want       float64
		governs    string
	}{
		{res.BelowGroundFt, 0, BuildingMinDepthFt, GovernsFloor}, // raised to the minimum (common practice)
		{res.BelowGroundFt, 18, 18, GovernsRefusal},              // to refusal at rock above the minimum (common practice)
		{8, 5, 8, GovernsRefusal},                                // the rule's own depth when deeper than rock
		{69, 0, 69, GovernsRule},                                 // a deeper rule stands
		{25, 0, 25, GovernsRule},
	} {
		d, g, basis, err := BuildingDepth(c.rule, c.rock)
		if err != nil {
			t.Fatal(err)
		}
		if d != c.want || g != c.governs {
			t.Errorf("BuildingDepth(%g, rock %g) = %g ft (%s), want %g ft (%s)", c.rule, c.rock, d, g, c.want, c.governs)
		}
		if !strings.Contains(basis, "common practice") {
			t.Errorf("basis %q does not say common practice", basis)
		}
	}
	if _, _, _, err := BuildingDepth(-1, 0); err == nil {
		t.Error("a negative depth was accepted")
	}
}

// TestEmbankmentDepth: TxDOT LRFD Geotechnical Manual (2024, seen): the
// larger of the embankment height and 20 ft; federal guidance (AASHTO LRFD
// Table 10.4.2-1 / FHWA GEC-5, from memory): twice the height over soft
// ground. The default is the deeper of the two.
func TestEmbankmentDepth(t *testing.T) {
	for _, c := range []struct {
		h, want float64
		governs string
	}{
		{5, 20, "TxDOT"},   // TxDOT's 20 ft floor (seen) beats 2 × 5 = 10 ft (from memory)
		{10, 20, "TxDOT"},  // tie: 20 ft either way
		{15, 30, "AASHTO"}, // 2 × 15 ft (from memory) beats 20 ft (TxDOT, seen)
		{30, 60, "AASHTO"}, // 2 × 30 ft (from memory) beats 30 ft (TxDOT, seen): the case the issue found unconservative
	} {
		d, src, err := EmbankmentDepth(c.h)
		if err != nil {
			t.Fatal(err)
		}
		if d != c.want {
			t.Errorf("EmbankmentDepth(%g) = %g ft, want %g ft", c.h, d, c.want)
		}
		if i := strings.Index(src, "governs"); i < 0 || !strings.Contains(src[:i], c.governs) {
			t.Errorf("EmbankmentDepth(%g): source %q does not say %s governs", c.h, src, c.governs)
		}
		if !strings.Contains(src, "from memory") {
			t.Errorf("source %q does not say the federal rule is from memory", src)
		}
		tx, _, _ := TxDOTEmbankmentDepth(c.h)
		if d < tx {
			t.Errorf("the default %g ft is shallower than TxDOT's %g ft", d, tx)
		}
	}
}

// TestOverheadLineClearance checks OSHA 29 CFR 1926.1408 Table A (seen in a
// stored copy of the regulation's text): up to 50 kV 10 ft, over 50 to
// 200 kV 15 ft, over 200 to 350 kV 20 ft, over 350 to 500 kV 25 ft, over
// 500 to 750 kV 35 ft, over 750 to 1,000 kV 45 ft; "to" includes its value.
func TestOverheadLineClearance(t *testing.T) {
	for _, c := range []struct{ kV, ft float64 }{
		{0.24, 10}, {12.47, 10}, {50, 10}, {50.1, 15}, {69, 15}, {200, 15}, {230, 20}, {350, 20},
		{345, 20}, {500, 25}, {501, 35}, {765, 45}, {1000, 45},
	} {
		ft, src, err := OverheadLineClearanceFt(c.kV)
		if err != nil {
			t.Fatalf("%g kV: %v", c.kV, err)
		}
		if ft != c.ft {
			t.Errorf("%g kV: %g ft, want %g ft (OSHA 29 CFR 1926.1408 Table A)", c.kV, ft, c.ft)
		}
		if !strings.HasPrefix(src, SourceOSHAPowerLines) {
			t.Errorf("source %q", src)
		}
	}
	if _, _, err := OverheadLineClearanceFt(1100); err == nil || !strings.Contains(err.Error(), "registered professional engineer") {
		t.Errorf("1,100 kV: %v, want an error naming who sets the clearance", err)
	}
	if _, _, err := OverheadLineClearanceFt(0); err == nil {
		t.Error("0 kV accepted")
	}
	// The old single figure, 20 ft, is right only up to 350 kV (Table A).
	if ft, _, _ := OverheadLineClearanceFt(500); ft <= 20 {
		t.Errorf("500 kV: %g ft, want more than 20 ft", ft)
	}
	c := OverheadLineCaution()
	for _, s := range []string{"up to 50 kV 10 ft", "over 50 to 200 kV 15 ft", "over 200 to 350 kV 20 ft", "over 350 to 500 kV 25 ft",
		"over 500 to 750 kV 35 ft", "over 750 to 1,000 kV 45 ft", "1926.1408 Table A"} {
		if !strings.Contains(c, s) {
			t.Errorf("caution %q lacks %q", c, s)
		}
	}
}
