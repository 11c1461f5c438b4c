package sdk

// Sampling interval conventions for Site.SampleIntervalFt, shared by rigs
// and scenario files.
const (
	// DefaultSampleIntervalFt is the split-barrel sampling interval a rig
	// uses when a site gives 0: samples at 2.5 ft, 5 ft, then every 5 ft
	// (TxDOT LRFD Geotechnical Manual: every 5 ft from 5 ft; the 2.5-ft
	// sample below topsoil is common practice).
	DefaultSampleIntervalFt = 5.0
	// ContinuousSampleIntervalFt asks for continuous sampling: 24-in split
	// barrels driven one after another, a sample every 2 ft from the
	// surface (ASTM D1586 allows barrel halves 18–30 in long). Any interval
	// under 2.5 ft is sampled from the surface at that interval.
	ContinuousSampleIntervalFt = 2.0
)
