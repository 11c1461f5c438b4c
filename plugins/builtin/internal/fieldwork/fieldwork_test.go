package fieldwork

import (
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
)

func TestBandFootage(t *testing.T) {
	// Plain arithmetic of the 0–50, 50–100, 100–150 ft bands.
	tests := []struct {
		depth float64
		want  []float64
	}{
		{0, []float64{0, 0, 0}},
		{25, []float64{25, 0, 0}},
		{50, []float64{50, 0, 0}},
		{60, []float64{50, 10, 0}},
		{100, []float64{50, 50, 0}},
		{120.5, []float64{50, 50, 20.5}},
		{150, []float64{50, 50, 50}},
	}
	for _, tc := range tests {
		got := BandFootage(tc.depth)
		if !reflect.DeepEqual(got, tc.want) {
			t.Errorf("BandFootage(%g) = %v, want %v", tc.depth, got, tc.want)
		}
		sum := 0.0
		for _, v := range got {
			sum += v
		}
		if sum != tc.depth {
			t.Errorf("BandFootage(%g) sums to %g", tc.depth, sum)
		}
	}
}

func TestSampleDepths(t *testing.T) {
	// Samples at 2.5 and 5 ft, then every interval (TxDOT LRFD Geotechnical
	// Manual: every 5 ft from 5 ft; the 2.5-ft sample is common practice).
	tests := []struct {
		depth, interval float64
		want            []float64
	}{
		{2, 0, nil},
		{2.5, 0, []float64{2.5}},
		{4.9, 5, []float64{2.5}},
		{5, 0, []float64{2.5, 5}},
		{25, 0, []float64{2.5, 5, 10, 15, 20, 25}},
		{24.9, 5, []float64{2.5, 5, 10, 15, 20}},
		{20, 10, []float64{2.5, 5, 15}},
		{10, 2.5, []float64{2.5, 5, 7.5, 10}},
		// Continuous: 24-in barrels back to back (ASTM D1586 allows 18–30 in halves).
		{10, ContinuousSampleIntervalFt, []float64{2, 4, 6, 8, 10}},
	}
	for _, tc := range tests {
		got := SampleDepths(tc.depth, tc.interval)
		if !reflect.DeepEqual(got, tc.want) {
			t.Errorf("SampleDepths(%g, %g) = %v, want %v", tc.depth, tc.interval, got, tc.want)
		}
	}
	// 60 ft at 5 ft: 2.5, 5 and 10 … 60 (11 more) = 13 samples.
	if n := len(SampleDepths(60, 5)); n != 13 {
		t.Errorf("60-ft boring at 5 ft: %d samples, want 13", n)
	}
}

func TestDrums(t *testing.T) {
	// A 55-gal drum is 7.35 ft³ (55 × 0.13368); we fill it to 90 %.
	if math.Abs(DrumUsableFt3-6.6172) > 1e-3 {
		t.Errorf("DrumUsableFt3 = %g", DrumUsableFt3)
	}
	for _, tc := range []struct{ ft3, want float64 }{{0, 0}, {0.1, 1}, {DrumUsableFt3, 1}, {DrumUsableFt3 + 0.01, 2}, {20, 4}} {
		if got := Drums(tc.ft3); got != tc.want {
			t.Errorf("Drums(%g) = %g, want %g", tc.ft3, got, tc.want)
		}
	}
}

func TestReasons(t *testing.T) {
	info := sdk.RigInfo{
		Name:    "test-rig",
		Methods: []sdk.MethodLimit{{Method: sdk.Boring, MaxDepthFt: 100}},
		Access:  sdk.AccessLimits{Surfaces: []sdk.Surface{sdk.Firm, sdk.Wet}, MaxSlopePct: 10, MinOverheadFt: 25},
	}
	ok := sdk.Site{ID: "a", Method: sdk.Boring, DepthFt: 50, Surface: sdk.Firm}
	tests := []struct {
		name string
		edit func(*sdk.Site)
		want string // "" means feasible
	}{
		{"ok", func(*sdk.Site) {}, ""},
		{"no surface stated is firm", func(s *sdk.Site) { s.Surface = "" }, ""},
		{"at slope limit", func(s *sdk.Site) { s.SlopePct = 10 }, ""},
		{"downslope counts too", func(s *sdk.Site) { s.SlopePct = -12 }, "slope 12 % is steeper than the 10 %"},
		{"clearance equal", func(s *sdk.Site) { s.OverheadFt = 25 }, ""},
		{"clearance short", func(s *sdk.Site) { s.OverheadFt = 24 }, "overhead clearance 24 ft is less than the 25 ft"},
		{"soft", func(s *sdk.Site) { s.Surface = sdk.Soft }, "soft ground: test-rig works only on firm or wet ground"},
		{"unknown surface", func(s *sdk.Site) { s.Surface = "mud" }, `unknown surface "mud"`},
		{"method", func(s *sdk.Site) { s.Method = sdk.CPT }, `test-rig does not perform "cpt" (it performs boring)`},
		{"too deep", func(s *sdk.Site) { s.DepthFt = 100.5 }, "depth 100.5 ft is beyond the 100 ft"},
		{"zero depth", func(s *sdk.Site) { s.DepthFt = 0 }, "a depth must be a positive number"},
		{"NaN depth", func(s *sdk.Site) { s.DepthFt = math.NaN() }, "a depth must be a positive number"},
	}
	for _, tc := range tests {
		s := ok
		tc.edit(&s)
		got := strings.Join(Reasons(info, s), "; ")
		if tc.want == "" && got != "" || !strings.Contains(got, tc.want) {
			t.Errorf("%s: reasons %q, want %q", tc.name, got, tc.want)
		}
	}
	// Several problems are all reported.
	s := ok
	s.Surface, s.SlopePct = sdk.Soft, 30
	if n := len(Reasons(info, s)); n != 2 {
		t.Errorf("soft and steep: %d reasons, want 2", n)
	}
}

func TestTravel(t *testing.T) {
	tr := Travel{FirmFtPerHr: 2000, SurfaceFactor: map[sdk.Surface]float64{sdk.Wet: 0.5, sdk.Soft: 0.25}, MaxSlopePct: 20}
	tests := []struct {
		leg  sdk.MoveLeg
		want float64
	}{
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Firm}, 0.5},
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Wet}, 1},
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Soft}, 2},
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Firm, SlopePct: 10}, 0.75},
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Firm, SlopePct: 20}, 1},
		{sdk.MoveLeg{DistanceFt: 1000, Surface: sdk.Firm, SlopePct: 21}, 2},
		{sdk.MoveLeg{DistanceFt: 0, Surface: sdk.Firm}, 0},
	}
	for _, tc := range tests {
		got, err := tr.LegHours(tc.leg)
		if err != nil || math.Abs(got-tc.want) > 1e-12 {
			t.Errorf("LegHours(%+v) = %g, %v; want %g", tc.leg, got, err, tc.want)
		}
	}
	if _, err := tr.Moves(sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 1}, {DistanceFt: -1}}}); err == nil || !strings.Contains(err.Error(), "leg 1") {
		t.Errorf("negative distance: error %v, want one naming leg 1", err)
	}
}

func TestMobilization(t *testing.T) {
	m := Mobilization{Item: "mob-x", RoadMph: 40, LoadHr: 0.5, UnloadHr: 0.5, MileageLabel: "trailer"}
	// 40 mi one way: two trips of 1 h driving plus 1 h loading and unloading.
	r, err := m.Answer(sdk.MobilizeRequest{DistanceMi: 40})
	if err != nil || r.Hours != 4 || len(r.Quantities) != 1 || r.Quantities[0].Item != "mob-x" || r.Quantities[0].Amount != 1 {
		t.Errorf("40 mi: %+v, %v", r, err)
	}
	// 80 mi one way: 30 mi beyond the first 50, counted both ways = 60 mi
	// (the items.md contract for mob-mileage).
	r, err = m.Answer(sdk.MobilizeRequest{DistanceMi: 80})
	if err != nil || len(r.Quantities) != 2 || r.Quantities[1].Item != ItemMobMileage || r.Quantities[1].Amount != 60 {
		t.Errorf("80 mi: %+v, %v", r, err)
	}
	if r.Hours != 2*(1+2) {
		t.Errorf("80 mi: %g h, want 6", r.Hours)
	}
	if _, err := m.Answer(sdk.MobilizeRequest{DistanceMi: -1}); err == nil {
		t.Error("negative distance accepted")
	}
}

// TestSPTDrive checks the drive the sample note describes against ASTM
// D1586: 18 in in three 6-in increments, N from the last two; and that a
// continuous-sampling barrel, 24 in (ContinuousSampleIntervalFt), holds
// the drive (ASTM D1586 allows barrel halves 18–30 in long). Split-spoon
// samplers are commonly 2 ft long with blows counted every 6 in (common
// practice).
func TestSPTDrive(t *testing.T) {
	if n := SPTDriveIn / SPTIncrementIn; n != 3 {
		t.Errorf("%g-in drive in %g-in increments: %g increments, want 3 (ASTM D1586)", SPTDriveIn, SPTIncrementIn, n)
	}
	if nIn := (SPTDriveIn/SPTIncrementIn - SPTSeatingIncr) * SPTIncrementIn; nIn != 12 {
		t.Errorf("N counts %g in of drive, want the last 12 in (ASTM D1586)", nIn)
	}
	if barrelIn := ContinuousSampleIntervalFt * 12; barrelIn < SPTDriveIn || barrelIn > 30 || barrelIn != 24 {
		t.Errorf("continuous barrel %g in: want 24 in (common practice), within ASTM D1586's 18–30 in", barrelIn)
	}
	for _, w := range []string{"18 in", "three 6-in increments", "last two", "ASTM D1586"} {
		if !strings.Contains(SPTDriveNote, w) {
			t.Errorf("SPTDriveNote %q does not say %q", SPTDriveNote, w)
		}
	}
}
