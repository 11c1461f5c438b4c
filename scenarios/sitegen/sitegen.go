// Package sitegen writes invented scenario files of any size for scale
// tests and benchmarks: a square site of so many acres divided into blocks of
// mixed use (structures, pavement, slopes, wet ground, fill, open ground,
// no-go areas), and a linear corridor of so many miles with crossings. The
// same size and seed give the same file, byte for byte. Everything in them is
// invented; the files say so.
package sitegen

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
)

// FtPerAcre is the area of an acre in square feet (by definition, 43,560).
const FtPerAcre = 43560.0

// FtPerMile is the length of a mile in feet (5,280, by definition).
const FtPerMile = 5280.0

type zone struct {
	id, name, use string
	poly          [][2]float64
	body          string // ground, structure and rules lines
}

// block uses and their ground and rules, as a practitioner would set them for
// a first program. The numbers follow the presets' published ranges (see
// optimizer/rules PRESETS.md) but are chosen for variety, not cited.
var uses = []string{"structure", "pavement", "slope", "wet", "fill", "open", "structure", "pavement"}

// Site returns a scenario file for a square site of the given area.
func Site(acres float64, seed uint64) []byte {
	rng := rand.New(rand.NewPCG(seed, 0x5173))
	side := math.Sqrt(acres * FtPerAcre)
	k := int(math.Max(2, math.Round(math.Sqrt(acres)/3)))
	cell := side / float64(k)
	street := math.Min(40, cell*0.1)
	var zones []zone
	var nogo []string
	for i := 0; i < k; i++ {
		for j := 0; j < k; j++ {
			x0, y0 := float64(i)*cell+street/2, float64(j)*cell+street/2
			w := cell - street
			use := uses[rng.IntN(len(uses))]
			id := fmt.Sprintf("Z%d-%d", i+1, j+1)
			z := zone{id: id, use: use}
			switch use {
			case "structure":
				bw := math.Min(w, 100+rng.Float64()*300)
				bh := math.Min(w, 80+rng.Float64()*200)
				ox, oy := x0+(w-bw)*rng.Float64(), y0+(w-bh)*rng.Float64()
				z.name = fmt.Sprintf("Building %s", id)
				z.poly = rect(ox, oy, bw, bh)
				stories := 1 + rng.IntN(6)
				z.body = fmt.Sprintf("    structure: {stories: %d, load_class: %s}\n    ground: {surface: firm, slope_pct: 1, groundwater_depth: %d}\n    rules: {max_spacing: %d, min_points: 4, min_depth: %d, sampled_share: 0.5, methods: [boring, cpt], sample_interval: 5, source: \"invented scale-test rule\"}\n",
					stories, []string{"light", "heavy"}[rng.IntN(2)], 10+rng.IntN(20), 50+25*rng.IntN(3), 20+10*stories)
			case "pavement":
				z.name, z.poly = "Pavement "+id, rect(x0, y0, w, w)
				z.body = "    ground: {surface: firm, slope_pct: 2}\n    rules: {area_per_point: 10000, max_spacing: 200, min_depth: 10, sampled_share: 0.34, methods: [boring, cpt], source: \"invented scale-test rule\"}\n"
				if rng.IntN(3) == 0 && w > 120 { // a utility vault inside the lot
					nogo = append(nogo, fmt.Sprintf("  - id: vault-%s\n    reason: invented utility vault\n    polygon: %s\n", id, polyText(rect(x0+w/2-20, y0+w/2-20, 40, 40))))
				}
			case "slope":
				z.use = "slope"
				z.name, z.poly = "Cut slope "+id, rect(x0, y0, w, w)
				z.body = fmt.Sprintf("    ground: {surface: firm, slope_pct: %d}\n    rules: {max_spacing: 150, min_points: 2, min_depth: 30, methods: [boring], source: \"invented scale-test rule\"}\n", 15+rng.IntN(12))
			case "wet":
				z.use = "open"
				z.name, z.poly = "Low wet ground "+id, rect(x0, y0, w, w)
				z.body = "    ground: {surface: soft, slope_pct: 1, groundwater_depth: 3}\n    rules: {max_spacing: 150, min_depth: 40, sampled_share: 0.34, methods: [boring, cpt], source: \"invented scale-test rule\"}\n"
			case "fill":
				fw := math.Min(w, 150+rng.Float64()*200)
				z.name, z.poly = "Old fill "+id, rect(x0, y0, fw, fw)
				z.body = "    ground: {surface: firm, slope_pct: 2, groundwater_depth: 15}\n    rules: {area_per_point: 4000, min_depth: 8, sampled_share: 1, methods: [test_pit, boring], source: \"invented scale-test rule\"}\n"
			default:
				z.name, z.poly = "Open ground "+id, rect(x0, y0, w, w)
				z.body = "    ground: {surface: firm, slope_pct: 3}\n    rules: {max_spacing: 300, min_depth: 15, methods: [boring, cpt], source: \"invented scale-test rule\"}\n"
			}
			zones = append(zones, z)
		}
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, "# INVENTED DATA for scale tests: a %g-acre site that does not exist (seed %d).\n", acres, seed)
	fmt.Fprintf(&b, "units: ft\nname: gen-%gac-%d\ntitle: Generated %g-acre site (seed %d)\ndemo: true\nnote: Invented scale-test data; the site, the ground and the rules are made up.\n", acres, seed, acres, seed)
	fmt.Fprintf(&b, "origin: {lon: -101.5, lat: 38.5}\nboundary:\n  polygon: %s\n", polyText(rect(0, 0, side, side)))
	writeZones(&b, zones)
	if len(nogo) > 0 {
		b.WriteString("no_go:\n")
		for _, n := range nogo {
			b.WriteString(n)
		}
	}
	b.WriteString("rigs: [tire-drill, track-drill, excavator, cpt-rig]\nrate_book: valley-2026\nyard_miles: 40\nhours_per_day: 10\nsolver: {gap: 0.01, time_limit_s: 60}\n")
	return b.Bytes()
}

// Corridor returns a scenario file for a linear corridor (a road or
// pipeline) of the given length, 100 ft wide, with a crossing (a structure
// such as a culvert or bridge) every few thousand feet.
func Corridor(miles float64, seed uint64) []byte {
	rng := rand.New(rand.NewPCG(seed, 0xC0AA))
	length := miles * FtPerMile
	const width = 100.0
	var zones []zone
	x := 0.0
	n := 0
	for x < length-1 {
		n++
		seg := math.Min(length-x, 3000+rng.Float64()*4000)
		id := fmt.Sprintf("S%03d", n)
		z := zone{id: id, name: "Alignment segment " + id, poly: rect(x, 0, seg, width)}
		if rng.IntN(4) == 0 {
			z.use = "slope"
			z.body = fmt.Sprintf("    ground: {surface: firm, slope_pct: %d}\n    rules: {max_spacing: 200, lattice: square, min_depth: 25, methods: [boring], source: \"invented scale-test rule\"}\n", 12+rng.IntN(15))
		} else {
			z.use = "pavement"
			z.body = fmt.Sprintf("    ground: {surface: %s, slope_pct: 2}\n    rules: {max_spacing: 300, lattice: square, min_depth: 15, sampled_share: 0.34, methods: [boring, cpt], source: \"invented scale-test rule\"}\n", []string{"firm", "firm", "wet"}[rng.IntN(3)])
		}
		zones = append(zones, z)
		x += seg
		if x < length-200 && rng.IntN(2) == 0 { // a crossing
			n++
			cid := fmt.Sprintf("X%03d", n)
			zones = append(zones, zone{id: cid, name: "Crossing " + cid, use: "structure", poly: rect(x, 0, 120, width),
				body: "    structure: {stories: 1, load_class: heavy}\n    ground: {surface: firm, slope_pct: 2, groundwater_depth: 12}\n    rules: {max_spacing: 60, min_points: 2, min_depth: 60, sampled_share: 1, methods: [boring], sample_interval: 5, source: \"invented scale-test rule\"}\n"})
			x += 120
		}
	}
	var b bytes.Buffer
	fmt.Fprintf(&b, "# INVENTED DATA for scale tests: a %g-mile corridor that does not exist (seed %d).\n", miles, seed)
	fmt.Fprintf(&b, "units: ft\nname: gen-%gmi-%d\ntitle: Generated %g-mile corridor (seed %d)\ndemo: true\nnote: Invented scale-test data; the corridor, the ground and the rules are made up.\n", miles, seed, miles, seed)
	fmt.Fprintf(&b, "boundary:\n  polygon: %s\n", polyText(rect(0, 0, length, width)))
	writeZones(&b, zones)
	b.WriteString("rigs: [tire-drill, track-drill, cpt-rig]\nrate_book: valley-2026\nyard_miles: 40\nhours_per_day: 10\nsolver: {gap: 0.01, time_limit_s: 60}\n")
	return b.Bytes()
}

func writeZones(b *bytes.Buffer, zones []zone) {
	b.WriteString("zones:\n")
	for _, z := range zones {
		fmt.Fprintf(b, "  - id: %s\n    name: %s\n    use: %s\n    polygon: %s\n%s", z.id, z.name, z.use, polyText(z.poly), z.body)
	}
}

func rect(x, y, w, h float64) [][2]float64 {
	return [][2]float64{{x, y}, {x + w, y}, {x + w, y + h}, {x, y + h}}
}

func polyText(p [][2]float64) string {
	var b bytes.Buffer
	b.WriteByte('[')
	for i, v := range p {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "[%.1f, %.1f]", v[0], v[1])
	}
	b.WriteByte(']')
	return b.String()
}
