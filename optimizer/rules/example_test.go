package rules_test

import (
	"fmt"
	"math"

	"github.com/rigmix/rigmix/optimizer/rules"
)

func ExampleLookup() {
	p, err := rules.Lookup("ufgs-unknown-site")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: %.0f ft apart, %.0f ft deep (%s, %s)\n", p.Name, p.MaxSpacingFt, p.MinDepthFt, p.Source, p.Tag)

	_, err = rules.Lookup("navfac-soft-strta")
	fmt.Println(err != nil)
	// Output:
	// ufgs-unknown-site: 200 ft apart, 30 ft deep (UFGS 4-159-01, seen)
	// true
}

func ExampleASCEDepth() {
	// A 10 ft square footing 4 ft down carrying 3,000 psf net, in ground of
	// 120 pcf above a water table at 12 ft and 125 pcf below (invented).
	load := rules.Load{
		Area:              rules.Area{Shape: rules.Square, WidthFt: 10},
		NetPressurePsf:    3000,
		FoundationDepthFt: 4,
	}
	ground := rules.Profile{UnitWeightPcf: 120, SatUnitWeightPcf: 125, WaterTableFt: 12}
	r, err := rules.ASCEDepth(load, ground, rules.Boussinesq)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("D1 %.1f ft, D2 %.1f ft: %s governs, boring %.1f ft below ground\n",
		r.D1Ft, r.D2Ft, r.Governs, r.BelowGroundFt)
	// Output:
	// D1 20.9 ft, D2 30.9 ft: D1 governs, boring 24.9 ft below ground
}

func ExampleSowersTableDepth() {
	for s := 1; s <= 5; s++ {
		ft, _, _ := rules.SowersTableDepth(s)
		fmt.Printf("%d: %.1f m\n", s, math.Round(rules.FtToM(ft)*10)/10)
	}
	// Output:
	// 1: 3.5 m
	// 2: 6.0 m
	// 3: 10.0 m
	// 4: 16.0 m
	// 5: 24.0 m
}
