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
