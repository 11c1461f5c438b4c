package candidates

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// checkRows verifies the structure of the reduced rows: each is the set of
// its named cell, none contains another, and every cell's set contains
// some kept row (so covering the kept rows covers every cell).
func checkRows(t *testing.T, l *Layout) {
	t.Helper()
	if len(l.RowCells) != len(l.RowCell) {
		t.Fatalf("%d rows but %d row cells", len(l.RowCells), len(l.RowCell))
	}
	subset := func(a, b []int) bool { // a ⊆ b, both ascending
		j := 0
		for _, x := range a {
			for j < len(b) && b[j] < x {
				j++
			}
			if j == len(b) || b[j] != x {
				return false
			}
		}
		return true
	}
	all := append(slices.Clip(l.Cells), l.EdgePoints...)
	for k, r := range l.RowCells {
		if !slices.Equal(r, all[l.RowCell[k]].CoveredBy) || len(r) == 0 {
			t.Fatalf("row %d %v is not the set of cell %d", k, r, l.RowCell[k])
		}
		if k > 0 && l.RowCell[k] <= l.RowCell[k-1] {
			t.Fatalf("rows not in cell order at %d", k)
		}
	}
	if len(l.RowCells) < 400 {
		for a := range l.RowCells {
			for b := range l.RowCells {
				if a != b && subset(l.RowCells[a], l.RowCells[b]) {
					t.Fatalf("kept row %d %v is contained in kept row %d %v", a, l.RowCells[a], b, l.RowCells[b])
				}
			}
		}
	}
	for ci, c := range all {
		ok := false
		for _, r := range l.RowCells {
			if subset(r, c.CoveredBy) {
				ok = true
				break
			}
		}
		if !ok {
			t.Fatalf("cell %d set %v contains no kept row", ci, c.CoveredBy)
		}
	}
}

// TestRowReductionBruteForce checks on small layouts that a subset of
// candidates covers every cell if and only if it meets every kept row,
// over all 2ⁿ subsets (an exhaustive check, independent of the reduction
// method).
func TestRowReductionBruteForce(t *testing.T) {
	tests := []struct {
		name  string
		zones []ZoneInput
		noGo  []geom.Polygon
		opt   Options
	}{
		{"square", []ZoneInput{{Polygon: square(0, 0, 100, 100), SpacingFt: 100, CandidateSpacingFt: 50}}, nil, Options{}},
		{"triangle, triangular rule", []ZoneInput{{Polygon: geom.Polygon{{X: 0, Y: 0}, {X: 180, Y: 0}, {X: 40, Y: 130}}, SpacingFt: 90, Lattice: geom.Triangular, CandidateSpacingFt: 60}}, nil, Options{}},
		{"L with no-go", []ZoneInput{{Polygon: geom.Polygon{{X: 0, Y: 0}, {X: 160, Y: 0}, {X: 160, Y: 60}, {X: 60, Y: 60}, {X: 60, Y: 160}, {X: 0, Y: 160}}, SpacingFt: 80, CandidateSpacingFt: 70}},
			[]geom.Polygon{square(10, 10, 40, 40)}, Options{BoundaryStep: 1.5}},
		{"two zones", []ZoneInput{
			{Polygon: square(0, 0, 80, 60), SpacingFt: 60, CandidateSpacingFt: 60},
			{Polygon: square(80, 0, 140, 60), SpacingFt: 50, CandidateSpacingFt: 60, Lattice: geom.Triangular},
		}, nil, Options{BoundaryStep: 1.5}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			l, err := Generate(tc.zones, tc.noGo, tc.opt)
			if err != nil {
				t.Fatal(err)
			}
			n := len(l.Candidates)
			if n > 18 {
				t.Fatalf("test set-up: %d candidates, too many to enumerate", n)
			}
			if len(l.RowCells) >= len(l.Cells) {
				t.Errorf("reduction kept %d rows of %d cells; expected some removed", len(l.RowCells), len(l.Cells))
			}
			checkRows(t, l)
			meets := func(mask uint32, set []int) bool {
				for _, j := range set {
					if mask&(1<<j) != 0 {
						return true
					}
				}
				return false
			}
			feasible := 0
			for mask := uint32(0); mask < 1<<n; mask++ {
				all := true
				for _, c := range append(slices.Clip(l.Cells), l.EdgePoints...) {
					if !meets(mask, c.CoveredBy) {
						all = false
						break
					}
				}
				rows := true
				for _, r := range l.RowCells {
					if !meets(mask, r) {
						rows = false
						break
					}
				}
				if all != rows {
					t.Fatalf("candidate subset %b: covers all cells %v, meets all kept rows %v", mask, all, rows)
				}
				if all {
					feasible++
				}
			}
			t.Logf("%d candidates, %d cells, %d kept rows, %d feasible subsets", n, len(l.Cells), len(l.RowCells), feasible)
		})
	}
}

// TestRowReductionRandom repeats the exhaustive check on seeded random
// star-shaped zones (simple by construction: vertices at increasing
// angles about a centre) with a random no-go square.
func TestRowReductionRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	checked := 0
	for trial := 0; trial < 300 && checked < 40; trial++ {
		n := 3 + rng.IntN(6)
		var p geom.Polygon
		for k := 0; k < n; k++ {
			a := 2 * math.Pi * (float64(k) + 0.8*rng.Float64()) / float64(n)
			r := 40 + 80*rng.Float64()
			p = append(p, geom.Point{X: 150 + r*math.Cos(a), Y: 150 + r*math.Sin(a)})
		}
		kind := geom.Square
		if rng.IntN(2) == 1 {
			kind = geom.Triangular
		}
		s := 50 + 60*rng.Float64()
		z := ZoneInput{Polygon: p, SpacingFt: s, Lattice: kind, CandidateSpacingFt: s * (0.6 + 0.6*rng.Float64()), Corners: rng.IntN(2) == 1}
		x, y := 100+100*rng.Float64(), 100+100*rng.Float64()
		noGo := []geom.Polygon{square(x, y, x+20+30*rng.Float64(), y+20+30*rng.Float64())}
		l, err := Generate([]ZoneInput{z}, noGo, Options{BoundaryStep: 1 + rng.Float64()})
		if err != nil {
			t.Fatal(err)
		}
		if len(l.Candidates) > 16 || len(l.Cells) == 0 {
			continue
		}
		checked++
		checkRows(t, l)
		demand := append(slices.Clip(l.Cells), l.EdgePoints...)
		full := make([]uint32, len(demand))
		for k, c := range demand {
			for _, j := range c.CoveredBy {
				full[k] |= 1 << j
			}
		}
		rows := make([]uint32, len(l.RowCells))
		for k, r := range l.RowCells {
			for _, j := range r {
				rows[k] |= 1 << j
			}
		}
		all := func(sets []uint32, mask uint32) bool {
			for _, s := range sets {
				if s&mask == 0 {
					return false
				}
			}
			return true
		}
		for mask := uint32(0); mask < 1<<len(l.Candidates); mask++ {
			if all(full, mask) != all(rows, mask) {
				t.Fatalf("trial %d: subset %b covers cells %v but kept rows %v", trial, mask, all(full, mask), all(rows, mask))
			}
		}
	}
	if checked < 20 {
		t.Fatalf("only %d random layouts small enough to enumerate", checked)
	}
	t.Logf("%d random layouts checked exhaustively", checked)
}
