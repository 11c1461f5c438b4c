package rules

// DepthRule describes one depth rule, minimum or default of the package for
// the rules table in PRESETS.md: what it asks, where it comes from and how
// that is known.
type DepthRule struct {
	Name   string // the function or constant that applies it
	Rule   string
	Source string
	Tag    string // seen, memory, derived or common practice
	Note   string // how rigmix uses it, and the more conservative choice where sources differ
}

// DepthRules lists the depth rules, minimums and defaults, in the order
// PRESETS.md shows them.
func DepthRules() []DepthRule {
	return append([]DepthRule(nil), depthRules...)
}

var depthRules = []DepthRule{
	{"SowersDepth", "D = 3·S^0.7 m (light steel or narrow concrete), 6·S^0.7 m (heavy steel or wide concrete), S stories",
		SourceSowersForm, TagMemory, "min_depth: {from: stories}; at least BuildingMinDepthFt in a structure zone"},
	{"SowersTableDepth", "building about 30.5 m wide, 1–5 stories: 3.5, 6, 10, 16, 24 m", SourceSowersTab, TagSeen, ""},
	{"ASCEDepth", "D1 where Δσ = q/10, D2 where Δσ/σ'v = 0.05; the smaller, unless rock first", SourceASCE, TagSeen,
		"min_depth: {from: footing}; at least BuildingMinDepthFt in a structure zone"},
	{"UFCLargeStructureDepth", "to where Δσ < 10 % of σ'v, and at least 30 ft below the lowest foundation", SourceUFCTable7, TagSeen, ""},
	{"BuildingDepth", "buildings at least 25 ft, or to refusal (rock) when met first, whatever the stories or stress rule gives",
		SourcePractice, TagPractice, "common practice puts it at about 20–25 ft or to refusal; the deeper end is the default"},
	{"EmbankmentDepth", "the deeper of max(embankment height, 20 ft) and twice the height", SourceTxDOT + "; " + SourceAASHTOEmbankment,
		TagSeen + " (TxDOT); " + TagMemory + " (twice the height)",
		"the default of min_depth: {from: embankment}: TxDOT alone is unconservative for fills over 20 ft on soft ground"},
	{"TxDOTEmbankmentDepth", "the larger of the embankment height and 20 ft; further where compressible soils exist", SourceTxDOT, TagSeen, "guide: txdot"},
	{"AASHTOEmbankmentDepth", "twice the embankment height over soft ground unless a hard stratum is met", SourceAASHTOEmbankment, TagMemory, "guide: aashto"},
	{"GEC5CutDepth", "at least 5 m below the lowest cut elevation", SourceGEC5, TagSeen,
		"the default of min_depth: {from: cut}: 16.4 ft below, deeper than TxDOT's 15 ft"},
	{"TxDOTCutDepth", "15 ft below the cut bottom", SourceTxDOT, TagSeen, "guide: txdot"},
	{"TxDOTWallDepth", "at least 15 ft below a fill wall base, 20 ft below a cut wall base", SourceTxDOT, TagSeen, ""},
	{"EN1997FootingDepth", "spread footings max(3B, 6 m); rafts 1.5B; roads 2 m below formation", SourceEN1997, TagSeen, ""},
	{"ToRockDepth", "to rock plus a core length (10 ft or 3 m by default) to prove rock, not a boulder", SourceToRock, TagPractice, ""},
	{"sdk.DefaultSampleSchedule", "split-barrel samples every 2.5 ft to 10 ft, then every 5 ft (2.5, 5, 7.5, 10, 15, 20 ft …)",
		SourcePractice, TagPractice, "ASTM D1586 describes the drive and sets no interval; rules.sample_schedule or sample_interval change it"},
	{"sample_interval: 5", "SPT every 5 ft from 5 ft under embankments and in cuts; tubes between them in cohesive soil", SourceTxDOT, TagSeen,
		"a scenario asks for it with sample_interval: 5; purpose: soft_ground adds the tubes"},
	{"OverheadLineClearanceFt", "up to 50 kV 10 ft; over 50 to 200 kV 15 ft; over 200 to 350 kV 20 ft; over 350 to 500 kV 25 ft; over 500 to 750 kV 35 ft; over 750 to 1,000 kV 45 ft",
		SourceOSHAPowerLines, TagSeen, "the crane rule; applied to drill masts and excavator booms as common practice, in the plan's cautions"},
}
