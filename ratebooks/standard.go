package ratebooks

// standardItems are the item codes rigs report quantities in: the contract
// between rig plugins and rate books. Every demo rate book prices all of
// them, and a rate book that prices one of these codes must use its unit.
// Standards named in the descriptions are the ones the work follows.
var standardItems = []Item{
	{Code: "mob-tire-rig", Unit: "each", Description: "Mobilization and demobilization, tire-mounted drill rig and crew"},
	{Code: "mob-track-rig", Unit: "each", Description: "Mobilization and demobilization, track-mounted drill rig and crew (lowboy trailer)"},
	{Code: "mob-excavator", Unit: "each", Description: "Mobilization and demobilization, excavator on trailer"},
	{Code: "mob-cpt-rig", Unit: "each", Description: "Mobilization and demobilization, CPT rig and crew"},
	{Code: "mob-hand-crew", Unit: "each", Description: "Mobilization, hand crew (pickup truck)"},
	{Code: "mob-mileage", Unit: "mi", Description: "Road miles of mobilization beyond the first 50 miles one way, counted round trip"},
	{Code: "drill-0-50", Unit: "ft", Description: "Soil drilling, hollow-stem auger, depth band 0–50 ft"},
	{Code: "drill-50-100", Unit: "ft", Description: "Soil drilling, depth band 50–100 ft"},
	{Code: "drill-100-150", Unit: "ft", Description: "Soil drilling, depth band 100–150 ft"},
	{Code: "rock-core", Unit: "ft", Description: "Rock coring, NQ wireline (ASTM D2113)"},
	{Code: "spt-sample", Unit: "each", Description: "Split-barrel sample with Standard Penetration Test (ASTM D1586)"},
	{Code: "tube-sample", Unit: "each", Description: "Thin-walled tube sample (ASTM D1587)"},
	{Code: "grout-boring", Unit: "ft", Description: "Borehole abandonment by grouting, per foot of hole"},
	{Code: "cpt-sounding", Unit: "ft", Description: "CPTu sounding, per foot pushed (ASTM D5778)"},
	{Code: "pit-excavation", Unit: "hr", Description: "Excavator with operator digging, logging and backfilling test pits"},
	{Code: "pit-protection", Unit: "each", Description: "Protective system for a pit 5 ft or deeper (OSHA 29 CFR 1926.652)"},
	{Code: "hand-auger", Unit: "ft", Description: "Hand-auger boring"},
	{Code: "dcp-probe", Unit: "each", Description: "Dynamic cone penetrometer probe (ASTM D6951)"},
	{Code: "field-logging", Unit: "hr", Description: "Field engineer or geologist logging at the point"},
	{Code: "crew-day-drill", Unit: "day", Description: "Drill crew per diem and support truck, per field day"},
	{Code: "crew-day-cpt", Unit: "day", Description: "CPT crew per diem, per field day"},
	{Code: "crew-day-excavator", Unit: "day", Description: "Excavator operator per diem, per field day"},
	{Code: "crew-day-hand", Unit: "day", Description: "Hand crew per diem, per field day"},
	{Code: "standby-drill", Unit: "hr", Description: "Drill rig and crew standby"},
	{Code: "standby-cpt", Unit: "hr", Description: "CPT rig and crew standby"},
	{Code: "standby-excavator", Unit: "hr", Description: "Excavator standby"},
	{Code: "idw-drum", Unit: "each", Description: "55-gallon drum for investigation-derived waste on environmental sites"},
	// Laboratory tests on recovered samples, priced per test; package
	// optimizer/lab turns sample counts into these quantities.
	{Code: "lab-moisture", Unit: "each", Description: "Laboratory moisture content (ASTM D2216)"},
	{Code: "lab-sieve", Unit: "each", Description: "Laboratory particle-size distribution by sieve (ASTM D6913)"},
	{Code: "lab-hydrometer", Unit: "each", Description: "Laboratory hydrometer analysis of fines (ASTM D7928)"},
	{Code: "lab-atterberg", Unit: "each", Description: "Laboratory Atterberg limits — liquid limit, plastic limit, plasticity index (ASTM D4318)"},
	{Code: "lab-consolidation", Unit: "each", Description: "Laboratory one-dimensional consolidation, incremental loading (ASTM D2435)"},
	{Code: "lab-ucs", Unit: "each", Description: "Laboratory unconfined compressive strength of cohesive soil (ASTM D2166)"},
	{Code: "lab-uu", Unit: "each", Description: "Laboratory unconsolidated-undrained triaxial compression (ASTM D2850)"},
	{Code: "lab-proctor", Unit: "each", Description: "Laboratory compaction, standard effort — standard Proctor (ASTM D698)"},
	{Code: "lab-proctor-modified", Unit: "each", Description: "Laboratory compaction, modified effort — modified Proctor (ASTM D1557)"},
	{Code: "lab-cbr", Unit: "each", Description: "Laboratory California bearing ratio of compacted soil (ASTM D1883)"},
	{Code: "lab-permeability", Unit: "each", Description: "Laboratory hydraulic conductivity, flexible-wall permeameter (ASTM D5084)"},
	{Code: "field-infiltration", Unit: "each", Description: "Field infiltration rate, double-ring infiltrometer, technician and equipment (ASTM D3385)"},
	{Code: "lab-analytical", Unit: "each", Description: "Environmental analytical list, lump sum per sample for the list the site's rules name"},
}

// StandardItems returns the standard item codes with their units and
// descriptions (prices zero), in the order of the item table.
func StandardItems() []Item { return append([]Item(nil), standardItems...) }

// StandardCodes returns the standard item codes in table order.
func StandardCodes() []string {
	out := make([]string, len(standardItems))
	for i, it := range standardItems {
		out[i] = it.Code
	}
	return out
}

func standardUnit(code string) (string, bool) {
	for _, it := range standardItems {
		if it.Code == code {
			return it.Unit, true
		}
	}
	return "", false
}
