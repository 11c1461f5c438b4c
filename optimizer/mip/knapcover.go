package mip

import (
	"math"
	"sort"
)

// Knapsack cover cuts at the root (Balas 1975; Crowder, Johnson and
// Padberg 1983; Marchand et al. 2002, §4.1, from memory). A row whose
// columns are all binary (fixed columns moved to the right-hand side) is
// written, complementing columns with negative coefficients, as
//
//	Σ a_j y_j ≤ b,  a_j > 0,  y_j = x_j or 1 − x_j.
//
// A cover C (Σ_C a_j > b) gives Σ_C y_j ≤ |C| − 1, extended to every
// column whose coefficient is at least the largest in C. The cover is
// found from the LP point y* by taking columns in increasing order of
// (1 − y*_j)/a_j, then made minimal by dropping the columns with the
// smallest y*_j while it stays a cover. The cut is kept when the LP
// point violates it with efficacy at least gmiMinEfficacy.
func knapsackCandidates(g *gmiState, integer []bool, rowLo, rowUp, lo, up, x []float64) []cut {
	var out []cut
	type item struct {
		j    int
		a    float64
		y    float64
		comp bool
	}
	for i := 0; i < g.m0; i++ {
		for side := 0; side < 2; side++ {
			// side 0: row ≤ rowUp; side 1: −row ≤ −rowLo.
			b := rowUp[i]
			sign := 1.0
			if side == 1 {
				b, sign = -rowLo[i], -1
			}
			if math.IsInf(b, 1) {
				continue
			}
			var items []item
			ok := true
			g.row(i, func(j int, v float64) {
				if !ok {
					return
				}
				v *= sign
				switch {
				case lo[j] == up[j]:
					b -= v * lo[j]
				case !integer[j] || lo[j] != 0 || up[j] != 1:
					ok = false
				case v > 0:
					items = append(items, item{j, v, x[j], false})
				case v < 0:
					b -= v // v (1 − y) with y = 1 − x
					items = append(items, item{j, -v, 1 - x[j], true})
				}
			})
			if !ok || len(items) < 2 || b < 0 {
				continue
			}
			total := 0.0
			for _, it := range items {
				total += it.a
			}
			if total <= b+1e-9*math.Max(1, math.Abs(b)) {
				continue // the row cannot be violated by binaries
			}
			order := make([]int, len(items))
			for k := range order {
				order[k] = k
			}
			sort.SliceStable(order, func(p, q int) bool {
				return (1-items[order[p]].y)/items[order[p]].a < (1-items[order[q]].y)/items[order[q]].a
			})
			var cover []int
			sum := 0.0
			for _, k := range order {
				cover = append(cover, k)
				sum += items[k].a
				if sum > b+1e-9*math.Max(1, math.Abs(b)) {
					break
				}
			}
			// Minimal: drop the columns with the smallest y* while the
			// rest still covers.
			sort.SliceStable(cover, func(p, q int) bool { return items[cover[p]].y < items[cover[q]].y })
			for k := 0; k < len(cover); {
				if sum-items[cover[k]].a > b+1e-9*math.Max(1, math.Abs(b)) {
					sum -= items[cover[k]].a
					cover = append(cover[:k], cover[k+1:]...)
					continue
				}
				k++
			}
			amax := 0.0
			inCover := make(map[int]bool, len(cover))
			for _, k := range cover {
				inCover[k] = true
				amax = math.Max(amax, items[k].a)
			}
			// Σ_{E(C)} y_j ≤ |C| − 1 as π x ≥ π0: −Σ_pos x_j + Σ_neg x_j ≥ −(|C| − 1) + |neg|.
			rhs := -float64(len(cover) - 1)
			coef := map[int]float64{}
			for k, it := range items {
				if !inCover[k] && it.a < amax {
					continue
				}
				if it.comp {
					coef[it.j] += 1
					rhs++
				} else {
					coef[it.j] -= 1
				}
			}
			var c cut
			for j := range coef {
				if coef[j] != 0 {
					c.cols = append(c.cols, j)
				}
			}
			sort.Ints(c.cols)
			act, norm := 0.0, 0.0
			for _, j := range c.cols {
				c.vals = append(c.vals, coef[j])
				act += coef[j] * x[j]
				norm += coef[j] * coef[j]
			}
			if len(c.cols) == 0 {
				continue
			}
			c.rhs, c.norm = rhs, math.Sqrt(norm)
			c.eff = (rhs - act) / c.norm
			if c.eff >= gmiMinEfficacy {
				out = append(out, c)
			}
		}
	}
	return out
}
