package lp

import "math"

// scalePasses is the number of alternating row/column geometric-mean
// passes; a handful suffices in practice (common practice: most of the
// gain comes in the first few passes, cf. Tomlin 1975).
const scalePasses = 6

// scaleFactors returns row factors r and column factors c, powers of 2,
// so that the scaled matrix r_i a_ij c_j has entries near 1 in the
// geometric-mean sense: each pass sets r_i = 1/√(min_j|a_ij c_j| ·
// max_j|a_ij c_j|), then likewise c_j, as in Tomlin (1975), "On scaling
// linear programming problems", Math. Programming Study 4, 146–166.
// Rounding to powers of 2 keeps the scaling itself free of round-off.
// Rows and columns without entries keep factor 1.
func scaleFactors(p *Problem) (r, c []float64) {
	m, n := p.NumRows, p.NumCols
	r = make([]float64, m)
	c = make([]float64, n)
	for i := range r {
		r[i] = 1
	}
	for j := range c {
		c[j] = 1
	}
	// Skip scaling when the matrix is already within a factor 16 of 1.
	lo, hi := math.Inf(1), 0.0
	for _, v := range p.Value {
		a := math.Abs(v)
		if a == 0 {
			continue
		}
		lo = math.Min(lo, a)
		hi = math.Max(hi, a)
	}
	if hi == 0 || (hi <= 16 && lo >= 1.0/16) {
		return r, c
	}
	rmin := make([]float64, m)
	rmax := make([]float64, m)
	for pass := 0; pass < scalePasses; pass++ {
		for i := range rmin {
			rmin[i], rmax[i] = math.Inf(1), 0
		}
		for j := 0; j < n; j++ {
			for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
				a := math.Abs(p.Value[k]) * c[j]
				if a == 0 {
					continue
				}
				i := p.RowIndex[k]
				rmin[i] = math.Min(rmin[i], a)
				rmax[i] = math.Max(rmax[i], a)
			}
		}
		for i := 0; i < m; i++ {
			if rmax[i] > 0 {
				r[i] = 1 / math.Sqrt(rmin[i]*rmax[i])
			}
		}
		for j := 0; j < n; j++ {
			cmin, cmax := math.Inf(1), 0.0
			for k := p.ColStart[j]; k < p.ColStart[j+1]; k++ {
				a := math.Abs(p.Value[k]) * r[p.RowIndex[k]]
				if a == 0 {
					continue
				}
				cmin = math.Min(cmin, a)
				cmax = math.Max(cmax, a)
			}
			if cmax > 0 {
				c[j] = 1 / math.Sqrt(cmin*cmax)
			}
		}
	}
	pow2 := func(v float64) float64 { return math.Exp2(math.Round(math.Log2(v))) }
	for i := range r {
		r[i] = pow2(r[i])
	}
	for j := range c {
		c[j] = pow2(c[j])
	}
	return r, c
}
