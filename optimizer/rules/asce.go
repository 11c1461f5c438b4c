package rules

import (
	"math"
)

// Load is a foundation: its loaded area, the net bearing pressure on it and
// how deep it sits.
type Load struct {
	Area
	NetPressurePsf    float64 // q: net bearing pressure at the foundation level, psf
	FoundationDepthFt float64 // Df: depth of the foundation level below ground, ft
}

func (l Load) check() error {
	if err := l.Area.check(); err != nil {
		return err
	}
	if v := l.NetPressurePsf; math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
		return badInput("Load.NetPressurePsf", v, "a net bearing pressure greater than 0 psf")
	}
	return checkLength("Load.FoundationDepthFt", l.FoundationDepthFt, false)
}

// Profile is the ground for vertical effective stress: one unit weight
// above the water table and one below.
type Profile struct {
	UnitWeightPcf      float64 // γ above the water table, pcf
	SatUnitWeightPcf   float64 // γsat below the water table, pcf
	WaterUnitWeightPcf float64 // γw, pcf; 0 means WaterUnitWeightPcf (62.4)
	WaterTableFt       float64 // depth of the water table below ground, ft; +Inf for none within reach
	RockFt             float64 // depth of rock below ground, ft; 0 when none is known
}

// gammaW returns γw with the default filled in.
func (p Profile) gammaW() float64 {
	if p.WaterUnitWeightPcf == 0 {
		return WaterUnitWeightPcf
	}
	return p.WaterUnitWeightPcf
}

func (p Profile) check() error {
	pos := func(name string, v float64) error {
		if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
			return badInput(name, v, "a unit weight greater than 0 pcf")
		}
		return nil
	}
	if err := pos("Profile.UnitWeightPcf", p.UnitWeightPcf); err != nil {
		return err
	}
	if err := pos("Profile.WaterUnitWeightPcf", p.gammaW()); err != nil {
		return err
	}
	if math.IsNaN(p.WaterTableFt) || p.WaterTableFt < 0 || math.IsInf(p.WaterTableFt, -1) {
		return badInput("Profile.WaterTableFt", p.WaterTableFt, "a depth of 0 ft or more, or +Inf for no water table")
	}
	if !math.IsInf(p.WaterTableFt, 1) {
		if err := pos("Profile.SatUnitWeightPcf", p.SatUnitWeightPcf); err != nil {
			return err
		}
		if p.SatUnitWeightPcf <= p.gammaW() {
			return badInput("Profile.SatUnitWeightPcf", p.SatUnitWeightPcf,
				"a saturated unit weight greater than the water's "+formatG(p.gammaW())+" pcf")
		}
	}
	return checkLength("Profile.RockFt", p.RockFt, false)
}

// EffectiveStress returns the vertical effective stress σ'v, psf, at
// depthFt below ground: γ·d above the water table at dw, and
// γ·dw + (γsat − γw)·(d − dw) below it (Terzaghi's effective stress with
// hydrostatic pore pressure).
func EffectiveStress(p Profile, depthFt float64) (float64, error) {
	if err := p.check(); err != nil {
		return 0, err
	}
	if err := checkLength("depthFt", depthFt, false); err != nil {
		return 0, err
	}
	return p.effective(depthFt), nil
}

func (p Profile) effective(d float64) float64 {
	if d <= p.WaterTableFt {
		return p.UnitWeightPcf * d
	}
	return p.UnitWeightPcf*p.WaterTableFt + (p.SatUnitWeightPcf-p.gammaW())*(d-p.WaterTableFt)
}

// DepthToLoadFraction returns the depth zFt below the foundation level at
// which Δσ falls to fraction·q. It depends on the shape and size only.
func DepthToLoadFraction(a Area, m StressMethod, fraction float64) (float64, error) {
	if err := a.check(); err != nil {
		return 0, err
	}
	if err := checkMethod(m); err != nil {
		return 0, err
	}
	if math.IsNaN(fraction) || fraction <= 0 || fraction >= 1 {
		return 0, badInput("fraction", fraction, "a fraction of q between 0 and 1")
	}
	return solveDecreasing(a.WidthFt, func(z float64) float64 {
		return influence(a, m, z) - fraction
	})
}

// DepthToStressRatio returns the depth zFt below the foundation level at
// which Δσ falls to ratio·σ'v, σ'v taken at Df + z below ground. Δσ falls
// and σ'v rises with depth, so there is one such depth; 0 when Δσ is
// already below the ratio at the foundation level.
func DepthToStressRatio(l Load, p Profile, m StressMethod, ratio float64) (float64, error) {
	if err := l.check(); err != nil {
		return 0, err
	}
	if err := p.check(); err != nil {
		return 0, err
	}
	if err := checkMethod(m); err != nil {
		return 0, err
	}
	if math.IsNaN(ratio) || ratio <= 0 || math.IsInf(ratio, 0) {
		return 0, badInput("ratio", ratio, "a ratio Δσ/σ'v greater than 0")
	}
	return depthToRatio(l, p, m, ratio)
}

func depthToRatio(l Load, p Profile, m StressMethod, ratio float64) (float64, error) {
	return solveDecreasing(l.WidthFt, func(z float64) float64 {
		return l.NetPressurePsf*influence(l.Area, m, z) - ratio*p.effective(l.FoundationDepthFt+z)
	})
}

// solveDecreasing returns the root of a function that falls strictly with
// z ≥ 0, by bisection: it first doubles an upper bound from scale until the
// function is negative, then halves the bracket until it is narrower than a
// billionth of its upper end (about 60 steps). Bisection needs only the
// sign, so it cannot be led astray by the function's shape; 0 is returned
// when f(0) ≤ 0.
func solveDecreasing(scale float64, f func(z float64) float64) (float64, error) {
	if f(0) <= 0 {
		return 0, nil
	}
	lo, hi := 0.0, scale
	for i := 0; f(hi) > 0; i++ {
		if i == 200 {
			return 0, badInput("depth", hi, "a stress criterion met within "+formatG(hi)+" ft")
		}
		lo, hi = hi, 2*hi
	}
	for hi-lo > 1e-9*hi {
		mid := lo + (hi-lo)/2
		if f(mid) > 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo + (hi-lo)/2, nil
}

// Governing criterion names in depth results.
const (
	GovernsD1      = "D1"      // Δσ = q/10
	GovernsD2      = "D2"      // Δσ = 0.05 σ'v
	GovernsRock    = "rock"    // rock met before the stress criteria
	GovernsStress  = "stress"  // Δσ = 0.10 σ'v (UFC 3-220-10N Table 7)
	GovernsMinimum = "minimum" // the 30 ft floor (UFC 3-220-10N Table 7)
)

// ASCEResult is the boring depth the ASCE (1972) stress criteria give.
// Depths are below the foundation level unless named BelowGround.
type ASCEResult struct {
	D1Ft          float64 // depth where Δσ = q/10
	D2Ft          float64 // depth where Δσ/σ'v = 0.05
	DepthFt       float64 // the smaller of D1 and D2, or the depth to rock if met first
	BelowGroundFt float64 // Df + DepthFt: the boring depth from the ground surface
	Governs       string  // GovernsD1, GovernsD2 or GovernsRock
	Source        string
}

// ASCEDepth applies the ASCE (1972) criteria as given by Das: D1 is the
// depth below the foundation at which the stress increase Δσ falls to a
// tenth of the net pressure q, D2 the depth at which Δσ falls to 5 % of the
// vertical effective stress σ'v; the smaller governs unless rock is met
// first. Rock known at p.RockFt (below ground) above that depth cuts the
// boring there; add a core length with ToRockDepth.
func ASCEDepth(l Load, p Profile, m StressMethod) (ASCEResult, error) {
	if err := l.check(); err != nil {
		return ASCEResult{}, err
	}
	if err := p.check(); err != nil {
		return ASCEResult{}, err
	}
	if err := checkMethod(m); err != nil {
		return ASCEResult{}, err
	}
	d1, err := DepthToLoadFraction(l.Area, m, 0.1)
	if err != nil {
		return ASCEResult{}, err
	}
	d2, err := depthToRatio(l, p, m, 0.05)
	if err != nil {
		return ASCEResult{}, err
	}
	r := ASCEResult{D1Ft: d1, D2Ft: d2, DepthFt: d1, Governs: GovernsD1,
		Source: SourceASCE + ": D1 where Δσ = q/10, D2 where Δσ/σ'v = 0.05, smaller governs unless rock first; Δσ by " + m.String()}
	if d2 < d1 {
		r.DepthFt, r.Governs = d2, GovernsD2
	}
	if rock := p.RockFt - l.FoundationDepthFt; p.RockFt > 0 && rock < r.DepthFt {
		r.DepthFt, r.Governs = math.Max(rock, 0), GovernsRock
	}
	r.BelowGroundFt = l.FoundationDepthFt + r.DepthFt
	return r, nil
}

// UFCMinBelowFoundationFt is the least boring depth below the lowest
// foundation for large structures (UFC 3-220-10N Table 7).
const UFCMinBelowFoundationFt = 30

// UFCResult is the boring depth UFC 3-220-10N Table 7 gives for a large
// structure. Depths are below the lowest foundation level unless named
// BelowGround.
type UFCResult struct {
	StressFt      float64 // depth where Δσ = 0.10 σ'v
	DepthFt       float64 // max(StressFt, 30 ft), or the depth to rock if met first
	BelowGroundFt float64 // Df + DepthFt
	Governs       string  // GovernsStress, GovernsMinimum or GovernsRock
	Source        string
}

// UFCLargeStructureDepth applies UFC 3-220-10N Table 7 for large
// structures: explore to where the stress increase is less than 10 % of the
// vertical effective stress, and at least 30 ft below the lowest
// foundation, unless rock is met first. For a group of footings pass the
// area they load together; the foundation depth is the lowest one's.
func UFCLargeStructureDepth(l Load, p Profile, m StressMethod) (UFCResult, error) {
	z, err := DepthToStressRatio(l, p, m, 0.10)
	if err != nil {
		return UFCResult{}, err
	}
	r := UFCResult{StressFt: z, DepthFt: z, Governs: GovernsStress,
		Source: SourceUFCTable7 + ": to where Δσ < 10 % of σ'v and at least 30 ft below the lowest foundation; Δσ by " + m.String()}
	if z < UFCMinBelowFoundationFt {
		r.DepthFt, r.Governs = UFCMinBelowFoundationFt, GovernsMinimum
	}
	if rock := p.RockFt - l.FoundationDepthFt; p.RockFt > 0 && rock < r.DepthFt {
		r.DepthFt, r.Governs = math.Max(rock, 0), GovernsRock
	}
	r.BelowGroundFt = l.FoundationDepthFt + r.DepthFt
	return r, nil
}
