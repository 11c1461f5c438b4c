package scenarios

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/rules"
)

// presetNames lists the preset names rules.Presets knows, sorted.
func presetNames() []string {
	var out []string
	for _, p := range rules.Presets() {
		out = append(out, p.Name)
	}
	return out
}

// preset reads rules.preset: the name of a published rule set. nil when
// the zone names none.
func (d *decoder) preset(m map[string]any, p string, zoneID string) (*rules.Preset, error) {
	names := presetNames()
	name, ok, err := d.str(m, p, "preset", "one of: "+strings.Join(names, ", "))
	if err != nil || !ok {
		return nil, err
	}
	pr, err := rules.Lookup(name)
	if err != nil {
		return nil, d.errf(p+".preset", suggestOneOf(name, names)+" (each listed with its source in optimizer/rules/PRESETS.md)",
			"zone %s: unknown preset %q", zoneID, name)
	}
	return &pr, nil
}

// depthKinds are the values of min_depth.from, and the keys each uses
// besides "from".
var depthKinds = map[string][]string{
	"stories":    nil,
	"footing":    {"bearing_pressure", "foundation_depth", "length", "method", "sat_unit_weight", "shape", "unit_weight", "width"},
	"cut":        {"cut_depth", "guide"},
	"embankment": {"guide", "height"},
	"wall":       {"base_depth", "wall"},
	"rock":       {"core"},
}

func depthKindNames() []string {
	out := make([]string, 0, len(depthKinds))
	for k := range depthKinds {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

// Defaults of a computed footing depth.
const (
	// defaultUnitWeightPcf and defaultSatUnitWeightPcf are a moist and a
	// saturated unit weight typical of ordinary soil, 120 and 125 pcf in
	// feet files, 19 and 20 kN/m³ in metre files (common practice).
	defaultUnitWeightPcf    = 120.0
	defaultSatUnitWeightPcf = 125.0
	defaultUnitWeightKN     = 19.0
	defaultSatUnitWeightKN  = 20.0
	// defaultCoreFt is the rock core taken to prove rock rather than a
	// boulder: 10 ft, or 3 m in a metre file (common practice).
	defaultCoreFt = 10.0
	defaultCoreM  = 3.0
	// maxFootingFt bounds a loaded area's width or length: wider than any
	// tank or raft.
	maxFootingFt = 2000
	// maxPressurePsf bounds a bearing pressure: 1,000,000 psf is about
	// 48 MPa, far past any soil.
	maxPressurePsf = 1e6
)

// minDepth reads rules.min_depth: a number in the file unit, or a mapping
// {from: KIND, ...} worked out by package rules. It returns the depth in
// feet and where it came from.
func (d *decoder) minDepth(m map[string]any, p string, z *Zone) (depthFt float64, origin string, ok bool, err error) {
	raw, present := m["min_depth"]
	if !present || raw == nil {
		return 0, "", false, nil
	}
	sub, isMap := raw.(map[string]any)
	if !isMap {
		ft, _, err := d.length(m, p, "min_depth", maxDepthFt, 30, "the depth every point reaches")
		return ft, OriginScenario, true, err
	}
	fp := p + ".min_depth"
	kinds := depthKindNames()
	kind, ok, err := d.choice(sub, fp, "from", kinds)
	if err != nil {
		return 0, "", true, err
	}
	if !ok {
		return 0, "", true, d.errf(fp+".from", "one of: "+strings.Join(kinds, ", ")+"; or give the depth as a number", "missing")
	}
	allowed := depthKinds[kind]
	keys := make([]string, 0, len(sub))
	for k := range sub {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		if k != "from" && !contains(allowed, k) {
			hint := "from: " + kind + " takes no other keys"
			if len(allowed) > 0 {
				hint = "from: " + kind + " takes " + strings.Join(allowed, ", ")
			}
			return 0, "", true, d.errf(fp+"."+k, hint, "is not used with from: %s", kind)
		}
	}
	var src string
	switch kind {
	case "stories":
		depthFt, src, err = d.storiesDepth(fp, z)
	case "footing":
		depthFt, src, err = d.footingDepth(sub, fp, z)
	case "cut":
		depthFt, src, err = d.cutDepth(sub, fp, z)
	case "embankment":
		depthFt, src, err = d.embankmentDepth(sub, fp, z)
	case "wall":
		depthFt, src, err = d.wallDepth(sub, fp, z)
	case "rock":
		depthFt, src, err = d.rockDepth(sub, fp, z)
	}
	if err != nil {
		var fe *FieldError
		if errors.As(err, &fe) {
			return 0, "", true, err
		}
		return 0, "", true, d.errf(fp, "check the inputs of the depth rule", "zone %s: cannot work out the depth: %v", z.ID, err)
	}
	if !(depthFt > 0) {
		return 0, "", true, d.errf(fp, "give the depth as a number, or check the inputs", "zone %s: the rule gives a depth of %s %s", z.ID, fmtNum(depthFt/d.ftPer), d.unit)
	}
	if z.Use == UseStructure && (kind == "stories" || kind == "footing") {
		// Common practice: a building's borings go at least about 20–25 ft
		// or to refusal, whatever the stories or stress rule gives.
		d2, _, basis, err := rules.BuildingDepth(depthFt, z.Ground.RockFt)
		if err != nil {
			return 0, "", true, d.errf(fp, "check the inputs of the depth rule", "zone %s: %v", z.ID, err)
		}
		src += "; " + basis
		depthFt = d2
	}
	if depthFt > maxDepthFt {
		return 0, "", true, d.errf(fp, "is the unit right? units: is "+d.unit, "zone %s: the rule gives %.4g %s, deeper than the %s %s a point may be",
			z.ID, depthFt/d.ftPer, d.unit, fmtNum(d.fromFt(maxDepthFt)), d.unit)
	}
	return depthFt, fmt.Sprintf("%s%s → %s", originComputed, src, d.showLength(depthFt)), true, nil
}

// showLength writes a length in feet in the file's unit, and in feet too
// for a metre file.
func (d *decoder) showLength(ft float64) string {
	if d.unit == "m" {
		return fmt.Sprintf("%.2f m (%.1f ft)", ft/d.ftPer, ft)
	}
	return fmt.Sprintf("%.1f ft", ft)
}

// missingInput is the error for a depth rule lacking one of its inputs.
func (d *decoder) missingInput(fp string, z *Zone, kind, what, hint string) error {
	return d.errf(fp, hint, "zone %s: depth rule from: %s is missing %s", z.ID, kind, what)
}

// needLength reads a required positive length of a depth rule.
func (d *decoder) needLength(sub map[string]any, fp, key string, z *Zone, what string, exampleFt float64) (float64, error) {
	kind, _ := sub["from"].(string)
	ft, ok, err := d.length(sub, fp, key, maxDepthFt, exampleFt, what)
	if err != nil {
		return 0, err
	}
	if !ok {
		return 0, d.missingInput(fp+"."+key, z, kind, key+" ("+what+")",
			fmt.Sprintf("add %s: in %s, e.g. %s", key, d.unit, fmtNum(d.example(exampleFt))))
	}
	return ft, nil
}

func (d *decoder) storiesDepth(fp string, z *Zone) (float64, string, error) {
	if z.Structure == nil {
		return 0, "", d.errf(fp+".from", "give the zone use: structure and structure: {stories: 2, load_class: light}, or give the depth as a number",
			"zone %s: depth rule from: stories is missing the number of stories (the zone's use is %s, so it has no structure)", z.ID, z.Use)
	}
	class, err := rules.ParseLoadClass(z.Structure.LoadClass)
	if err != nil {
		return 0, "", err
	}
	ft, src, err := rules.SowersDepth(z.Structure.Stories, class)
	if err != nil {
		return 0, "", err
	}
	return ft, fmt.Sprintf("%s; S = %d", src, z.Structure.Stories), nil
}

// footingDepth works out the ASCE (1972) depth under a footing: the file
// gives its size in the file unit, the bearing pressure in psf (ft files)
// or kPa (m files) and unit weights in pcf or kN/m³; the water table and
// rock come from the zone's ground.
func (d *decoder) footingDepth(sub map[string]any, fp string, z *Zone) (float64, string, error) {
	metric := d.unit == "m"
	width, err := d.needLength(sub, fp, "width", z, "the footing width (the short side; a circle's diameter)", 10)
	if err != nil {
		return 0, "", err
	}
	shapes := []string{"circle", "rectangle", "square", "strip"}
	shape, hasShape, err := d.choice(sub, fp, "shape", shapes)
	if err != nil {
		return 0, "", err
	}
	length, hasLength, err := d.length(sub, fp, "length", maxFootingFt, 20, "the footing length (the long side)")
	if err != nil {
		return 0, "", err
	}
	if !hasShape {
		shape = "square"
		if hasLength {
			shape = "rectangle"
		}
	}
	area := rules.Area{WidthFt: width}
	switch shape {
	case "square":
		area.Shape = rules.Square
	case "strip":
		area.Shape = rules.Strip
	case "circle":
		area.Shape = rules.Circle
	case "rectangle":
		area.Shape = rules.Rectangle
		if !hasLength {
			return 0, "", d.missingInput(fp+".length", z, "footing", "length (the long side of a rectangular footing)",
				fmt.Sprintf("add length: in %s, or set shape: square", d.unit))
		}
		if length < width {
			width, length = length, width
		}
		area.WidthFt, area.LengthFt = width, length
	}
	if hasLength && shape != "rectangle" {
		return 0, "", d.errf(fp+".length", "leave length out, or set shape: rectangle", "a %s footing has no length", shape)
	}
	pUnit, pHint := "psf", "the net bearing pressure in psf, e.g. 3000"
	if metric {
		pUnit, pHint = "kPa", "the net bearing pressure in kPa, e.g. 150"
	}
	pmax := maxPressurePsf
	if metric {
		pmax = rules.PsfToKPa(maxPressurePsf)
	}
	q, ok, err := d.number(sub, fp, "bearing_pressure", bound{min: 0, minOpen: true, max: pmax, unit: pUnit, hint: pHint})
	if err != nil {
		return 0, "", err
	}
	if !ok {
		return 0, "", d.missingInput(fp+".bearing_pressure", z, "footing", "bearing_pressure (net pressure under the footing, "+pUnit+")", "add "+pHint)
	}
	qPsf := q
	if metric {
		qPsf = rules.KPaToPsf(q)
	}
	df := 0.0
	if df, _, err = d.length(sub, fp, "foundation_depth", maxDepthFt, 4, "the depth of the footing base below ground"); err != nil {
		return 0, "", err
	}
	gUnit, gMin, gMax, gamma, gammaSat := "pcf", 40.0, 200.0, defaultUnitWeightPcf, defaultSatUnitWeightPcf
	if metric {
		gUnit, gMin, gMax, gamma, gammaSat = "kN/m³", 6.0, 31.0, defaultUnitWeightKN, defaultSatUnitWeightKN
	}
	gHint := fmt.Sprintf("a soil unit weight in %s, e.g. %s", gUnit, fmtNum(gamma))
	g, hasG, err := d.number(sub, fp, "unit_weight", bound{min: gMin, max: gMax, unit: gUnit, hint: gHint})
	if err != nil {
		return 0, "", err
	}
	if hasG {
		gamma, gammaSat = g, g
	}
	gs, hasGs, err := d.number(sub, fp, "sat_unit_weight", bound{min: gMin, max: gMax, unit: gUnit, hint: gHint})
	if err != nil {
		return 0, "", err
	}
	if hasGs {
		gammaSat = gs
	}
	prof := rules.Profile{UnitWeightPcf: gamma, SatUnitWeightPcf: gammaSat,
		WaterTableFt: z.Ground.GroundwaterFt, RockFt: z.Ground.RockFt}
	gammaW := rules.WaterUnitWeightPcf
	if metric {
		prof.UnitWeightPcf = rules.KNPerM3ToPcf(gamma)
		prof.SatUnitWeightPcf = rules.KNPerM3ToPcf(gammaSat)
		gammaW = rules.KNPerM3ToPcf(rules.WaterUnitWeightKNPerM3)
	}
	prof.WaterUnitWeightPcf = gammaW
	if prof.SatUnitWeightPcf <= gammaW {
		return 0, "", d.errf(fp+".sat_unit_weight", "a saturated soil is heavier than water", "must be more than the unit weight of water, got %s %s", fmtNum(gammaSat), gUnit)
	}
	method := rules.TwoToOne
	mname, ok, err := d.str(sub, fp, "method", "2:1 (the default) or boussinesq")
	if err != nil {
		return 0, "", err
	}
	if ok {
		switch strings.ToLower(strings.TrimSpace(mname)) {
		case "2:1", "two-to-one", "2-to-1":
		case "boussinesq":
			method = rules.Boussinesq
		default:
			return 0, "", d.errf(fp+".method", "2:1 (the default) or boussinesq", "unknown method %q", mname)
		}
	}
	res, err := rules.ASCEDepth(rules.Load{Area: area, NetPressurePsf: qPsf, FoundationDepthFt: df}, prof, method)
	if err != nil {
		return 0, "", err
	}
	water := "groundwater unknown, taken at the ground surface (the deepest answer)"
	if z.Ground.GroundwaterFt > 0 {
		water = "groundwater at " + d.showLength(z.Ground.GroundwaterFt)
	}
	src := fmt.Sprintf("%s; %s footing, D1 %s, D2 %s below the footing, %s governs; %s",
		res.Source, shape, d.showLength(res.D1Ft), d.showLength(res.D2Ft), res.Governs, water)
	return res.BelowGroundFt, src, nil
}

func (d *decoder) cutDepth(sub map[string]any, fp string, z *Zone) (float64, string, error) {
	cut, err := d.needLength(sub, fp, "cut_depth", z, "the depth of the cut below existing ground", 15)
	if err != nil {
		return 0, "", err
	}
	guide, _, err := d.choice(sub, fp, "guide", []string{"gec5", "txdot"})
	if err != nil {
		return 0, "", err
	}
	if guide == "txdot" {
		return rules.TxDOTCutDepth(cut)
	}
	return rules.GEC5CutDepth(cut)
}

// embankmentDepth works out the depth under an embankment: by default the
// deeper of the TxDOT rule, max(height, 20 ft), and the federal guidance
// over soft ground, twice the height (from memory); guide: txdot or
// guide: aashto takes one of them alone.
func (d *decoder) embankmentDepth(sub map[string]any, fp string, z *Zone) (float64, string, error) {
	h, err := d.needLength(sub, fp, "height", z, "the embankment height above original ground", 15)
	if err != nil {
		return 0, "", err
	}
	guide, _, err := d.choice(sub, fp, "guide", []string{"aashto", "txdot"})
	if err != nil {
		return 0, "", err
	}
	switch guide {
	case "txdot":
		return rules.TxDOTEmbankmentDepth(h)
	case "aashto":
		return rules.AASHTOEmbankmentDepth(h)
	}
	return rules.EmbankmentDepth(h)
}

func (d *decoder) wallDepth(sub map[string]any, fp string, z *Zone) (float64, string, error) {
	base, err := d.needLength(sub, fp, "base_depth", z, "the depth of the wall base below the ground at the boring", 5)
	if err != nil {
		return 0, "", err
	}
	w, ok, err := d.choice(sub, fp, "wall", []string{"cut", "fill"})
	if err != nil {
		return 0, "", err
	}
	if !ok {
		return 0, "", d.missingInput(fp+".wall", z, "wall", "wall (fill or cut)", "add wall: fill for a wall built up in fill, wall: cut for one in a cut")
	}
	kind := rules.FillWall
	if w == "cut" {
		kind = rules.CutWall
	}
	return rules.TxDOTWallDepth(kind, base)
}

func (d *decoder) rockDepth(sub map[string]any, fp string, z *Zone) (float64, string, error) {
	if z.Ground.RockFt <= 0 {
		return 0, "", d.missingInput(fp+".from", z, "rock", "the depth to rock",
			fmt.Sprintf("give ground.rock_depth in %s, or give the depth as a number", d.unit))
	}
	core := defaultCoreFt
	if d.unit == "m" {
		core = defaultCoreM * d.ftPer
	}
	if c, ok, err := d.length(sub, fp, "core", maxDepthFt, 10, "the length of rock core"); err != nil {
		return 0, "", err
	} else if ok {
		core = c
	}
	return rules.ToRockDepth(z.Ground.RockFt, core)
}

// labKinds maps the file's sample-kind keys to lab kinds.
var labKinds = []struct {
	key  string
	kind lab.Kind
}{
	{"split_barrel", lab.SplitBarrel},
	{"tube", lab.Tube},
	{"bag", lab.Bag},
	{"bulk", lab.Bulk},
	{"analytical", lab.Analytical},
}

// labProgram reads the top-level lab key: absent (nil, the default
// program), "none", "default", or a mapping that starts from a program and
// sets shares per kind of sample.
func (d *decoder) labProgram(m map[string]any) (*lab.Program, error) {
	raw, ok := m["lab"]
	if !ok || raw == nil {
		return nil, nil
	}
	programs := []string{"default", "none"}
	base := func(field, name string) (*lab.Program, error) {
		switch name {
		case "default":
			return lab.Default(), nil
		case "none":
			return lab.None(), nil
		}
		return nil, d.errf(field, suggestOneOf(name, programs)+"; or a mapping such as {program: default, tube: {consolidation: 0.2}}", "unknown lab program %q", name)
	}
	sub, isMap := raw.(map[string]any)
	if !isMap {
		name, _, err := d.str(m, "", "lab", "default or none, or a mapping")
		if err != nil {
			return nil, err
		}
		return base("lab", strings.ToLower(strings.TrimSpace(name)))
	}
	name := "default"
	if n, ok, err := d.str(sub, "lab", "program", "default or none"); err != nil {
		return nil, err
	} else if ok {
		name = strings.ToLower(strings.TrimSpace(n))
	}
	p, err := base("lab.program", name)
	if err != nil {
		return nil, err
	}
	changed := false
	if f, ok, err := d.number(sub, "lab", "fine_share", bound{min: 0, max: 1, hint: "the share of split-barrel and bag samples expected to be fine-grained (silt, clay), e.g. 0.5"}); err != nil {
		return nil, err
	} else if ok {
		p.FineShare, changed = f, true
	}
	for _, lk := range labKinds {
		ks, ok, err := d.section(sub, "lab", lk.key)
		if err != nil || !ok {
			if err != nil {
				return nil, err
			}
			continue
		}
		for _, test := range lab.Keys() {
			s, ok, err := d.number(ks, "lab."+lk.key, test, bound{min: 0, max: 1, hint: "the share of these samples tested, e.g. 0.25 for one in four; 0 for none"})
			if err != nil {
				return nil, err
			}
			if !ok {
				continue
			}
			if err := p.Set(lk.kind, test, s); err != nil {
				return nil, d.errf("lab."+lk.key+"."+test, "", "%v", err)
			}
			changed = true
		}
	}
	if changed {
		p.Name = "custom"
		p.Source = "scenario, starting from the " + name + " program (" + p.Source + ")"
	}
	if err := p.Check(); err != nil {
		return nil, d.errf("lab", "", "%v", err)
	}
	return p, nil
}
