package scenarios_test

import (
	"fmt"

	"github.com/rigmix/rigmix/scenarios"
)

func ExampleLoadDemo() {
	s, err := scenarios.LoadDemo("wetlot", map[string]any{"yard_miles": 75})
	if err != nil {
		panic(err)
	}
	fmt.Printf("%s (%s), %d zones, yard %g mi, rate book %s\n", s.Name, s.Units, len(s.Zones), s.YardMiles, s.RateBook)
	for _, z := range s.Zones {
		fmt.Printf("%-3s %-13s %-5s spacing %5.1f ft  depth %4.1f ft  %v\n",
			z.ID, z.Use, z.Ground.Surface, z.Rules.MaxSpacingFt, z.Rules.MinDepthFt, z.Rules.Methods)
	}
	// Output:
	// wetlot (m), 4 zones, yard 75 mi, rate book coastal-2026
	// W1  structure     soft  spacing  98.4 ft  depth 65.6 ft  [boring cpt]
	// F1  fill          wet   spacing   0.0 ft  depth 11.5 ft  [test_pit boring]
	// E1  environmental wet   spacing  49.2 ft  depth 19.7 ft  [boring]
	// R1  pavement      firm  spacing 196.9 ft  depth  9.8 ft  [cpt boring test_pit]
}

func ExampleParse() {
	_, err := scenarios.Parse([]byte("units: ft\nname: x\nyard_mile: 20\n"), "site.yaml", nil)
	fmt.Println(err)
	// Output:
	// site.yaml: yard_mile: unknown key (did you mean yard_miles?)
}

func ExampleRules_Origins() {
	s, err := scenarios.LoadDemo("midrise", nil)
	if err != nil {
		panic(err)
	}
	for _, z := range s.Zones[:2] {
		r := z.Rules
		fmt.Printf("%s: spacing %.0f ft (%s lattice), depth %.1f ft\n", z.ID, r.MaxSpacingFt, r.Lattice, r.MinDepthFt)
		for _, key := range []string{"max_spacing", "lattice", "min_depth"} {
			fmt.Printf("  %-11s %s\n", key, r.Origins[key])
		}
	}
	// Output:
	// B1: spacing 50 ft (triangular lattice), depth 69.0 ft
	//   max_spacing scenario
	//   lattice     default: triangular
	//   min_depth   computed: Sowers, in Das: D = 6·S^0.7 m, heavy building (formula from memory); S = 6; deeper than the 25 ft building minimum (common practice) → 69.0 ft
	// P1: spacing 75 ft (square lattice), depth 45.0 ft
	//   max_spacing scenario
	//   lattice     preset das-multistory-building: Das, Principles of Foundation Engineering, after Sowers & Sowers (1970)
	//   min_depth   scenario
}
