// Package rules holds rigmix's knowledge of published exploration practice:
// named presets of spacing and count rules a scenario can cite instead of
// typing numbers, and boring depths computed from the structure, the load
// and the ground rather than typed. It takes plain values in and gives plain
// values out; it reads no files and no flags.
//
// Lengths are in feet and areas in square feet at the API, matching the
// scenario package's Rules and Zone; pressures are in psf and unit weights
// in pcf. Metric sources are converted exactly: 1 ft = 0.3048 m, and the
// pressure and unit-weight factors come from the same foot and the exact
// pound-force, so γ·z in pcf·ft equals the converted kPa (MToFt, FtToM,
// KPaToPsf, KNPerM3ToPcf).
//
// Every result carries the source it rests on, as the project's table of
// outside sources names it, and a tag: seen (read in a stored copy),
// memory (recalled, not re-read) or derived (computed from a named formula).
//
// # Presets
//
// Presets and Lookup give the spacing and count rules below; PRESETS.md
// lists them all and is generated from the data by a test. Where a source
// gives a range the close (conservative) end is the default and the note
// records the range.
//
//   - Das, Principles of Foundation Engineering, after Sowers & Sowers
//     (1970): multistory buildings 10–30 m, one-story industrial plants
//     20–60 m, highways and residential subdivisions 250–500 m, dams and
//     dikes 40–80 m.
//   - NAVFAC DM-7.01 / UFC 3-220-10N, Table 6: new site of wide extent
//     200–500 ft; soft compressible strata 100–200 ft at possible building
//     locations; large structure with closely spaced footings about 50 ft
//     both ways; low-load warehouse at least 4 at the corners plus interior;
//     isolated rigid foundation 2,500–10,000 ft² at least 3, under
//     2,500 ft² at least 2 (MinPointsForFootprint).
//   - FHWA GEC-5 (2002, FHWA-IF-02-034): walls longer than 30 m a point
//     every 30–60 m; embankments and cut slopes every 60 m (erratic) to
//     120 m (uniform).
//   - Common practice, no published source: one boring per 2,500 ft² of
//     building area (common-building-density).
//   - TxDOT LRFD Geotechnical Manual (2024): wall borings at most 200 ft
//     apart. UFC 3-250-12N (Design: Pavements, 2005, since cancelled;
//     Section 2, read in a stored copy): roads at most 300 ft along the
//     centre line, 100 ft or less where soils vary widely. UFGS 4-159-01:
//     unknown site, about 200 ft centres, borings generally at least 30 ft
//     deep.
//
// # Depth from the number of stories
//
// Sowers's rule as quoted by Das (recalled from memory, not re-read):
//
//	D = 3·S^0.7 m  light steel or narrow concrete buildings
//	D = 6·S^0.7 m  heavy steel or wide concrete buildings
//
// with S the number of stories (SowersDepth); at S = 5 these give 9.26 m
// and 18.51 m. The Sowers & Sowers table in Das for a building about 30.5 m
// wide gives 3.5, 6, 10, 16 and 24 m for 1 to 5 stories (SowersTableDepth).
//
// # Depth from the stress a foundation adds
//
// ASCE (1972), as given by Das (ASCEDepth): with q the net bearing
// pressure, Δσ(z) the vertical stress increase at depth z below the
// foundation and σ'v the vertical effective stress there,
//
//	D1: Δσ(D1) = q/10
//	D2: Δσ(D2) = 0.05·σ'v(Df + D2)
//	D  = min(D1, D2), unless rock is met first.
//
// UFC 3-220-10N Table 7 for large structures (UFCLargeStructureDepth):
// to where Δσ < 0.10·σ'v, and at least 30 ft below the lowest foundation.
//
// The vertical effective stress, with the water table at dw and
// hydrostatic pore pressure (γw = 62.4 pcf or 9.81 kN/m³ by default of
// practice; give the one the problem uses):
//
//	σ'v(d) = γ·d                          d ≤ dw
//	σ'v(d) = γ·dw + (γsat − γw)·(d − dw)  d > dw
//
// The stress increase at the centre of a uniformly loaded area, by the 2:1
// method (load spread at 2 vertical to 1 horizontal; the rectangle form is
// Das's, the strip and circle forms apply the same spread):
//
//	rectangle B × L  Δσ/q = B·L / ((B + z)(L + z))
//	strip of width B Δσ/q = B / (B + z)
//	circle of diam D Δσ/q = D² / (D + z)²
//
// or by integrating Boussinesq's (1885) point-load solution for an elastic
// half-space, dΔσ = 3q·z³ / (2π·R⁵) dA, over the area:
//
//	rectangle: 4·I(m, n), m = B/2z, n = L/2z, with Newmark's (1935) corner value
//	  I = 1/(4π)·[2mn√V/(V + m²n²)·(V + 1)/V + atan2(2mn√V, V − m²n²)],  V = m² + n² + 1
//	strip:     Δσ/q = (α + sin α)/π,  α = 2·atan(B/2z)
//	circle:    Δσ/q = 1 − (1/(1 + (R/z)²))^{3/2}
//
// For a square footing these give Δσ/q = 0.336 at z = B, and q/10 at 2.09B
// (Boussinesq) or (√10 − 1)B = 2.162B (2:1). Δσ falls and σ'v rises with
// depth, so each criterion has one root; it is found by bisection on a
// bracket grown by doubling (solveDecreasing), to a billionth of the depth.
//
// The METU CE366 worked answer for a 90 m tank (z ≈ 61.8 m where
// Δσ = 0.1·σ'v) is reproduced by the 2:1 method with γw = 10 kN/m³
// (61.78 m); Boussinesq gives 70.5 m for the same tank, so which method a
// rule is applied with matters and is the caller's choice.
//
// # Earthworks, walls and rock
//
//   - FHWA GEC-5 (2002): cuts at least 5 m below the lowest cut elevation
//     (GEC5CutDepth).
//   - TxDOT LRFD Geotechnical Manual (2024; the slopes-and-embankments
//     page read in a stored copy): embankments max(height, 20 ft), further
//     where compressible soils exist; cuts 15 ft below the cut bottom; walls
//     at least 15 ft below a fill wall base and 20 ft below a cut wall base
//     (TxDOTEmbankmentDepth, TxDOTCutDepth, TxDOTWallDepth). The same page
//     asks SPT every 5 ft from 5 ft there, and tubes between the SPT samples
//     where cohesive soil is met.
//   - Federal guidance for embankments over soft ground: at least twice
//     the height unless a hard stratum is met (AASHTOEmbankmentDepth;
//     AASHTO LRFD Table 10.4.2-1 / FHWA GEC-5, from memory). The default,
//     EmbankmentDepth, is the deeper of this and the TxDOT rule: TxDOT alone
//     is unconservative for fills over 20 ft on soft ground.
//   - Buildings: at least BuildingMinDepthFt, 25 ft, or to refusal,
//     whatever a stories or stress rule gives (BuildingDepth; common
//     practice, about 20–25 ft, the deeper end taken).
//   - EN 1997-2 Annex B.3: spread footings max(3B, 6 m); rafts 1.5B; roads
//     2 m below formation (EN1997FootingDepth, EN1997RaftDepth,
//     EN1997RoadDepthFt).
//   - To rock plus a core length, common practice (ToRockDepth).
//
// # Overhead power lines
//
// OSHA 29 CFR 1926.1408 Table A (read in a stored copy of the regulation's
// text): up to 50 kV 10 ft, over 50 to 200 kV 15 ft, over 200 to 350 kV
// 20 ft, over 350 to 500 kV 25 ft, over 500 to 750 kV 35 ft, over 750 to
// 1,000 kV 45 ft; over 1,000 kV as the utility or a registered professional
// engineer sets (OverheadLineClearanceFt, OverheadLineCaution). The table is
// the crane rule; keeping drill masts and excavator booms to it is common
// practice.
//
// # Sampling intervals
//
// ASTM D1586 describes the drive and sets no sampling interval. The default
// schedule, every 2.5 ft to 10 ft then every 5 ft, is common practice
// (sdk.DefaultSampleSchedule); a scenario may give its own bands.
//
// # References
//
//   - Das, B. M., Principles of Foundation Engineering, chapter on
//     subsoil exploration (Sowers & Sowers 1970; ASCE 1972) and chapter on
//     stress increase (2:1 method, Boussinesq, Newmark).
//   - Newmark, N. M. (1935), Simplified computation of vertical pressures in
//     elastic foundations, Univ. of Illinois Eng. Exp. Station Circular 24.
//   - NAVFAC DM-7.01 (1986) / UFC 3-220-10N, Soil Mechanics, Tables 6 and 7.
//   - FHWA GEC-5, Evaluation of Soil and Rock Properties (2002),
//     FHWA-IF-02-034.
//   - TxDOT LRFD Geotechnical Manual (2024).
//   - UFC 3-250-12N; UFGS 4-159-01; EN 1997-2:2007 Annex B.3.
package rules
