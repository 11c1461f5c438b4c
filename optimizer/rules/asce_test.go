package rules

import (
	"math"
	"testing"
)

func TestHomeworkFootingD1(t *testing.T) {
	// Published homework solution (SOURCES: seen): 2,500 kN on a 3 m × 2 m
	// footing, 2:1 spread: D1 = 5.26 m below the footing. D1 depends on the
	// shape only: (2 + z)(3 + z) = 60 m².
	a := Area{Shape: Rectangle, WidthFt: MToFt(2), LengthFt: MToFt(3)}
	z, err := DepthToLoadFraction(a, TwoToOne, 0.1)
	if err != nil {
		t.Fatal(err)
	}
	if got := FtToM(z); !near(got, 5.26, 0.005) {
		t.Errorf("D1 = %.4f m, want 5.26 m (published homework solution)", got)
	}
	// The same through ASCEDepth, with the load given as the column load
	// over the area and any reasonable profile.
	l := Load{Area: a, NetPressurePsf: KPaToPsf(2500.0 / 6)}
	p := Profile{UnitWeightPcf: KNPerM3ToPcf(18), WaterTableFt: math.Inf(1)}
	r, err := ASCEDepth(l, p, TwoToOne)
	if err != nil {
		t.Fatal(err)
	}
	if !near(FtToM(r.D1Ft), 5.26, 0.005) {
		t.Errorf("ASCEDepth D1 = %.4f m, want 5.26 m (published homework solution)", FtToM(r.D1Ft))
	}
}

// TestTankMETU reproduces the METU CE366 solution (SOURCES: seen): a 90 m
// tank at 200 kPa on ground of γ = 19 kN/m³ above a water table at 9.5 m
// and 20 kN/m³ below, explored to where Δσ = 10 % of σ'v: z ≈ 61.8 m.
//
// Investigation: circular Boussinesq does not give it (70.5 m with
// γw = 9.81 kN/m³, 71.0 m with 10); the 2:1 method spreading the circle to
// a diameter D + z does, with γ' = 20 − 10 = 10 kN/m³ below the water:
// 61.775 m. With γw = 9.81 the 2:1 method gives 61.27 m. So the solution
// used the 2:1 method and γw = 10 kN/m³; the published figure is given to
// 0.1 m, so it is checked to ± 0.05 m.
func TestTankMETU(t *testing.T) {
	l := Load{Area: Area{Shape: Circle, WidthFt: MToFt(90)}, NetPressurePsf: KPaToPsf(200)}
	profile := func(gammaW float64) Profile {
		return Profile{
			UnitWeightPcf:      KNPerM3ToPcf(19),
			SatUnitWeightPcf:   KNPerM3ToPcf(20),
			WaterUnitWeightPcf: KNPerM3ToPcf(gammaW),
			WaterTableFt:       MToFt(9.5),
		}
	}
	for _, c := range []struct {
		name       string
		method     StressMethod
		gammaW     float64 // kN/m³
		reproduces bool
	}{
		{"2:1, γw 10", TwoToOne, 10, true},
		{"2:1, γw 9.81", TwoToOne, WaterUnitWeightKNPerM3, false},
		{"Boussinesq, γw 9.81", Boussinesq, WaterUnitWeightKNPerM3, false},
		{"Boussinesq, γw 10", Boussinesq, 10, false},
	} {
		z, err := DepthToStressRatio(l, profile(c.gammaW), c.method, 0.10)
		if err != nil {
			t.Fatal(err)
		}
		zm := FtToM(z)
		t.Logf("%s: z = %.3f m", c.name, zm)
		if c.reproduces && !near(zm, 61.8, 0.05) {
			t.Errorf("%s: z = %.3f m, want 61.8 ± 0.05 m (METU CE366 solution)", c.name, zm)
		}
		if !c.reproduces && near(zm, 61.8, 0.4) {
			t.Errorf("%s: z = %.3f m now matches 61.8 m (METU CE366); revisit which assumptions the solution used", c.name, zm)
		}
	}
}

func TestASCEDepthCriteria(t *testing.T) {
	clay := Profile{UnitWeightPcf: 115, SatUnitWeightPcf: 120, WaterTableFt: 8}
	for _, c := range []struct {
		name    string
		load    Load
		profile Profile
		governs string
	}{
		// A light footing deep in the ground: the overburden criterion D2
		// is met before Δσ falls to q/10.
		{"light deep footing", Load{Area: Area{Shape: Square, WidthFt: 6}, NetPressurePsf: 600, FoundationDepthFt: 20}, clay, GovernsD2},
		// A wide heavily loaded mat at grade on submerged ground: q/10
		// comes first.
		{"heavy mat", Load{Area: Area{Shape: Rectangle, WidthFt: 20, LengthFt: 30}, NetPressurePsf: 8000}, Profile{UnitWeightPcf: 110, SatUnitWeightPcf: 112, WaterTableFt: 0}, GovernsD1},
		{"strip", Load{Area: Area{Shape: Strip, WidthFt: 4}, NetPressurePsf: 2500, FoundationDepthFt: 3}, clay, ""},
		{"circle, rock at 30 ft", Load{Area: Area{Shape: Circle, WidthFt: 80}, NetPressurePsf: 3000, FoundationDepthFt: 2},
			Profile{UnitWeightPcf: 115, SatUnitWeightPcf: 120, WaterTableFt: 8, RockFt: 30}, GovernsRock},
	} {
		for _, m := range []StressMethod{TwoToOne, Boussinesq} {
			r, err := ASCEDepth(c.load, c.profile, m)
			if err != nil {
				t.Fatalf("%s %s: %v", c.name, m, err)
			}
			l, p := c.load, c.profile
			// D1 and D2 meet their definitions (ASCE 1972, in Das).
			if got := influence(l.Area, m, r.D1Ft); !near(got, 0.1, 1e-7) {
				t.Errorf("%s %s: Δσ/q at D1 = %.9f, want 0.1", c.name, m, got)
			}
			ratio := l.NetPressurePsf * influence(l.Area, m, r.D2Ft) / p.effective(l.FoundationDepthFt+r.D2Ft)
			if !near(ratio, 0.05, 1e-7) {
				t.Errorf("%s %s: Δσ/σ'v at D2 = %.9f, want 0.05", c.name, m, ratio)
			}
			want := math.Min(r.D1Ft, r.D2Ft)
			if p.RockFt > 0 && p.RockFt-l.FoundationDepthFt < want {
				want = p.RockFt - l.FoundationDepthFt
			}
			if r.DepthFt != want || r.BelowGroundFt != l.FoundationDepthFt+want {
				t.Errorf("%s %s: depth %g ft (%g below ground), want %g", c.name, m, r.DepthFt, r.BelowGroundFt, want)
			}
			if c.governs != "" && r.Governs != c.governs {
				t.Errorf("%s %s: %s governs (D1 %.2f, D2 %.2f ft), want %s", c.name, m, r.Governs, r.D1Ft, r.D2Ft, c.governs)
			}
			if r.Source == "" {
				t.Errorf("%s %s: no source", c.name, m)
			}
		}
	}
}

func TestWaterTableDeepensD2(t *testing.T) {
	// Effective stress principle: a higher water table lowers σ'v, so the
	// 5 % criterion is met deeper.
	l := Load{Area: Area{Shape: Square, WidthFt: 10}, NetPressurePsf: 2000, FoundationDepthFt: 4}
	prev := math.Inf(1)
	d2 := func(wt float64) float64 {
		r, err := ASCEDepth(l, Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: wt}, Boussinesq)
		if err != nil {
			t.Fatal(err)
		}
		return r.D2Ft
	}
	for _, wt := range []float64{0, 5, 10, 20} {
		if got := d2(wt); got >= prev {
			t.Errorf("water table at %g ft: D2 %.3f ft, not shallower than %.3f ft with a higher table", wt, got, prev)
		} else {
			prev = got
		}
	}
	// A water table below D2 does not change it.
	if deep, none := d2(60), d2(math.Inf(1)); deep != none || deep >= prev {
		t.Errorf("D2 with the water at 60 ft %.4f ft, with none %.4f ft; want equal and shallower than %.4f", deep, none, prev)
	}
}

func TestEffectiveStress(t *testing.T) {
	// σ'v = γ·dw + (γsat − γw)(d − dw) (effective stress, Terzaghi);
	// METU CE366 profile at 20 m with γw = 9.81: 19·9.5 + 10.19·10.5 kPa.
	p := Profile{UnitWeightPcf: KNPerM3ToPcf(19), SatUnitWeightPcf: KNPerM3ToPcf(20),
		WaterUnitWeightPcf: KNPerM3ToPcf(9.81), WaterTableFt: MToFt(9.5)}
	got, err := EffectiveStress(p, MToFt(20))
	if err != nil {
		t.Fatal(err)
	}
	if want := 19*9.5 + (20-9.81)*10.5; !near(PsfToKPa(got), want, 1e-9) {
		t.Errorf("σ'v at 20 m = %.6f kPa, want %.6f", PsfToKPa(got), want)
	}
	// Default γw is 62.4 pcf (common practice).
	us := Profile{UnitWeightPcf: 110, SatUnitWeightPcf: 125, WaterTableFt: 10}
	got, _ = EffectiveStress(us, 30)
	if want := 110*10 + (125-62.4)*20; !near(got, want, 1e-9) {
		t.Errorf("σ'v at 30 ft = %.4f psf, want %.4f", got, want)
	}
}

func TestUFCLargeStructureDepth(t *testing.T) {
	prof := Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: 15}
	for _, c := range []struct {
		name    string
		load    Load
		profile Profile
		governs string
	}{
		// UFC 3-220-10N Table 7: at least 30 ft below the lowest foundation.
		{"small footing", Load{Area: Area{Shape: Square, WidthFt: 6}, NetPressurePsf: 3000, FoundationDepthFt: 4}, prof, GovernsMinimum},
		// A large mat: the 10 % of σ'v criterion reaches deeper than 30 ft.
		{"large mat", Load{Area: Area{Shape: Rectangle, WidthFt: 150, LengthFt: 300}, NetPressurePsf: 2500, FoundationDepthFt: 10}, prof, GovernsStress},
		{"rock at 25 ft", Load{Area: Area{Shape: Square, WidthFt: 6}, NetPressurePsf: 3000, FoundationDepthFt: 4},
			Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: 15, RockFt: 25}, GovernsRock},
	} {
		r, err := UFCLargeStructureDepth(c.load, c.profile, Boussinesq)
		if err != nil {
			t.Fatal(err)
		}
		if r.Governs != c.governs {
			t.Errorf("%s: %s governs (stress depth %.1f ft), want %s", c.name, r.Governs, r.StressFt, c.governs)
		}
		l := c.load
		ratio := l.NetPressurePsf * influence(l.Area, Boussinesq, r.StressFt) / c.profile.effective(l.FoundationDepthFt+r.StressFt)
		if !near(ratio, 0.10, 1e-7) {
			t.Errorf("%s: Δσ/σ'v at the stress depth %.9f, want 0.10 (UFC 3-220-10N Table 7)", c.name, ratio)
		}
		switch r.Governs {
		case GovernsMinimum:
			if r.DepthFt != UFCMinBelowFoundationFt {
				t.Errorf("%s: %g ft, want 30 ft (UFC 3-220-10N Table 7)", c.name, r.DepthFt)
			}
		case GovernsStress:
			if r.DepthFt != r.StressFt || r.DepthFt < 30 {
				t.Errorf("%s: %g ft, want the stress depth %g ft ≥ 30 ft", c.name, r.DepthFt, r.StressFt)
			}
		case GovernsRock:
			if r.DepthFt != c.profile.RockFt-l.FoundationDepthFt {
				t.Errorf("%s: %g ft, want rock at %g ft", c.name, r.DepthFt, c.profile.RockFt-l.FoundationDepthFt)
			}
		}
		if r.BelowGroundFt != l.FoundationDepthFt+r.DepthFt {
			t.Errorf("%s: below ground %g, want %g", c.name, r.BelowGroundFt, l.FoundationDepthFt+r.DepthFt)
		}
	}
}
