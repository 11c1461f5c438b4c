// Package model turns an exploration problem, stated as plain data, into a
// mixed-integer program and reads a solution of it back.
//
// The formulation (see PRODUCT.md, "The optimization model"):
//
//	x[o] ∈ {0,1}   option o chosen: one candidate point explored by one
//	               method with one rig (depth fixed by the zone's rule)
//	y[r] ∈ {0,1}   rig r mobilized
//	d[r] ∈ ℤ≥0     field days of rig r
//	T   ≥ 0        finish (the longest rig's days; rigs work in parallel)
//
//	q[i] ∈ ℤ≥0     pooled item i: whole units (lab tests) or cents
//
//	minimize  Σ c[o] x[o] + Σ M[r] y[r] + Σ D[r] d[r] + Σ P[i] q[i] + w T
//	s.t.      Σ_{o at p∈S} x[o] ≥ 1           every coverage row S
//	          Σ_{o at p} x[o] ≤ 1 (= 1 if required)   each point
//	          Σ_{o at p or q} x[o] ≤ 1        points p, q closer than the separation
//	          Σ_{o at p, rig r} x[o] ≤ y[r]    each point and rig
//	          Σ_{o in zone} x[o] ≥ n[z]        per-zone minimum count
//	          Σ_{sampled o in z} x[o] − s[z] Σ_{o in z} x[o] ≥ 0   sampled share
//	          (H−u) d[r] − Σ_{o of r} h[o] x[o] − hm[r] y[r] ≥ 0  days
//	          q[i] − k[i] (Σ a[o,i] x[o] + Σ a[r,i] y[r] + Σ b[r,i] d[r]) ≥ 0   pooled
//	          T − d[r] ≥ 0
//	          cost ≤ budget, T ≤ deadline       (optional)
//
// Two other objectives share the rows above (PRODUCT.md, "Objectives"):
//
// MinimizeDays replaces the objective by the finish T alone, with T an
// integer column (it is bounded below by the integer d[r], so the least T is
// an integer): the first stage of a lexicographic "fastest, then cheapest"
// solve.
//
// MaximizeCoverage is the maximal covering form of Church and ReVelle,
// "The maximal covering location problem", Papers of the Regional Science
// Association 32, 1974 (from memory). The coverage rows are dropped and
// every coverage cell c gets a column u[c] ∈ [0,1]:
//
//	maximize  Σ_c w[c] a[c] u[c]           (area weighted by zone priority)
//	s.t.      u[c] − Σ_{o at p covering c} x[o] ≤ 0
//	          cost ≤ budget                 (required)
//
// stated as a minimization of −100 Σ w a u / Σ w a (the weighted share
// covered, in percent) plus a tie-break of at most 0.01 percent point that
// prefers the cheaper of two plans covering the same. The per-zone minimum
// counts are dropped too (a count is a coverage rule in another form, and
// keeping it would make every budget under the full program infeasible);
// the sampled shares, the required points, one option per point, the
// linking rows and the days rows are kept. u may stay continuous: for fixed
// x its best value is min(1, Σ x) ∈ {0,1}.
//
// Pooled items make the model's cost the estimate's total to the cent. The
// estimate sums each rate-book item over the whole plan before it prices it:
// a lab test is bought whole (⌈Σ need⌉ tests, however the need is shared
// among points), and an item whose quantity is fractional (hours of
// logging) is extended to the cent once, on its total. An item whose every
// term is already a whole number of cents stays in c[o], M[r], D[r]; each
// other item gets an integer column q[i] — whole units at price P[i] = its
// unit price (k[i] = 1), or cents at P[i] = 0.01 (k[i] = 100 × unit price) —
// so the least q[i] is the estimate's rounded-up figure.
//
// Days: H is the working day and u the start-up allowance that opens every
// field day (see schedule.Calendar.StartUpHours): a point unfinished at the
// end of a day is finished the next morning, so a rig's days are
// ⌈(mobilization + Σ hours on its points) / (H − u)⌉, the count
// schedule.Build lays. Hours enter the row in hundredths (Spec hours are
// kept to 0.01 h), so the row's arithmetic is exact and the ceiling is the
// scheduler's to the last hundredth.
//
// The point-and-rig linking row is the disaggregated form of x ≤ y, whose LP
// relaxation is far tighter than one aggregated big-M row per rig (the
// standard result for fixed-charge facility location; Wolsey, Integer
// Programming, 1998, §1.5 — from memory). w is a small tie-break weight so
// that among equally cheap plans the one that finishes first is chosen.
package model

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"github.com/rigmix/rigmix/optimizer/lp"
	"github.com/rigmix/rigmix/optimizer/mip"
)

// Option is one way to explore one candidate point.
type Option struct {
	Point   int     // candidate index
	Rig     int     // index into Spec.Rigs
	Sampled bool    // recovers samples (counts toward the sampled share)
	Cost    float64 // priced quantities at the point
	Hours   float64 // hours on the point including the move to it
	Label   string  // for column names, e.g. "boring/track-drill"
	Uses    []Use   // pooled items the option needs (not in Cost)
}

// Use is an amount of a pooled item (Spec.Pooled[Item]).
type Use struct {
	Item   int
	Amount float64
}

// Pooled is a rate-book item summed over the plan before it is priced and
// rounded up, as the estimate prices it (see the package comment).
type Pooled struct {
	Name  string
	Price float64 // unit price
	// Whole: bought in whole units (⌈Σ need⌉, e.g. lab tests); otherwise
	// the total is extended and rounded up to the cent.
	Whole bool
}

// Zone holds the counting rules of one zone.
type Zone struct {
	Name         string
	MinCount     int     // at least this many points
	SampledShare float64 // at least this share of its points sampled
}

// Rig holds the fixed and per-day charges of one rig.
type Rig struct {
	Name       string
	MobCost    float64 // mobilization and demobilization, priced
	MobHours   float64 // hours of mobilization counted in field days
	DayCost    float64 // priced items per field day
	TravelNote string
	// Unit numbers the crews of one rig (from 1; 0 is 1). A crew with
	// Unit > 1 follows the one before it in Spec.Rigs and is identical to
	// it; the model orders them — the earlier is mobilized and works at
	// least as many days — which cuts off only permutations of one plan.
	Unit    int
	MobUses []Use // pooled items of mobilization (not in MobCost)
	DayUses []Use // pooled items per field day (not in DayCost)
}

// Spec is a whole exploration problem as plain data.
type Spec struct {
	NumPoints int
	PointZone []int  // zone of each point
	Required  []bool // point must be explored (nil: none)
	Options   []Option
	CoverRows [][]int // each a set of points of which at least one is explored
	// Apart are pairs of points of which at most one is explored (closer
	// than the plan's minimum separation).
	Apart       [][2]int
	Zones       []Zone
	Rigs        []Rig
	HoursPerDay float64
	// StartUpHours opens every field day (0 ≤ u < HoursPerDay); see the
	// package comment.
	StartUpHours float64
	// Pooled lists the items priced on their plan total (see the package
	// comment).
	Pooled     []Pooled
	Budget     float64 // 0: none
	MaxDays    float64 // 0: none; limit on the finish T
	DaysWeight float64 // objective weight of T (tie-break); 0 allowed
	CostWeight float64 // objective weight of cost; 0 means 1

	// MinimizeDays makes the objective the finish T alone (see the
	// package comment).
	MinimizeDays bool
	// MaximizeCoverage selects the maximal covering form over Cells
	// (see the package comment); it needs Budget > 0.
	MaximizeCoverage bool
	// Cells are the coverage cells of the maximal covering form.
	Cells []Cell
}

// Cell is a piece of ground for the maximal covering form.
type Cell struct {
	AreaFt2 float64
	Weight  float64 // zone priority; 0 means 1
	Points  []int   // candidate points within the covering radius
}

// Model is the built program and the map from its columns back to the spec.
type Model struct {
	Problem *mip.Problem
	Spec    *Spec
	XCol    []int // option → column
	YCol    []int // rig → column
	DCol    []int // rig → column
	TCol    int
	NCol    []int // zone → count column, -1 if none
	SCol    []int // zone → sampled-count column, -1 if none
	QCol    []int // pooled item → column
	CostRow int   // row holding the cost (budget row), -1 if none
	UCol    []int // cell → covered column (MaximizeCoverage), nil otherwise
	// CountRow and ShareRow are, per zone, the rows that carry the zone's
	// counting rules (-1 if none): count_z (Σ x − n = 0, whose dual prices
	// one more point) and sampled_z (s − share·n ≥ 0). Rule-cost reports
	// read their LP duals.
	CountRow []int
	ShareRow []int
}

// Errors returned by Build.
var (
	ErrNoOption = errors.New("model: a rule cannot be met: no feasible option")
)

// Build assembles the program. It returns an error naming what cannot be met
// when a coverage row, a required point or a zone count has no option at all.
func Build(s *Spec) (*Model, error) {
	if s.HoursPerDay <= 0 {
		return nil, fmt.Errorf("model: hours per day must be > 0, got %g", s.HoursPerDay)
	}
	if !(s.StartUpHours >= 0 && s.StartUpHours < s.HoursPerDay) {
		return nil, fmt.Errorf("model: start-up allowance %g h: want 0 ≤ allowance < %g h (the working day)", s.StartUpHours, s.HoursPerDay)
	}
	if len(s.PointZone) != s.NumPoints {
		panic("model: PointZone length differs from NumPoints")
	}
	costW := s.CostWeight
	if costW == 0 {
		costW = 1
	}
	daysW := s.DaysWeight
	if s.MaximizeCoverage && !(s.Budget > 0) {
		return nil, fmt.Errorf("model: the maximal covering form needs a budget > 0, got %g", s.Budget)
	}
	if s.MinimizeDays && s.MaximizeCoverage {
		return nil, errors.New("model: MinimizeDays and MaximizeCoverage exclude each other")
	}
	var totalWA float64
	if s.MaximizeCoverage {
		for _, c := range s.Cells {
			totalWA += cellWeight(c) * c.AreaFt2
		}
		if !(totalWA > 0) {
			return nil, errors.New("model: the maximal covering form needs cells with positive area")
		}
		// Tie-break: at most 0.01 percent point over the whole budget.
		costW = 0.01 / s.Budget
		daysW = 0
	}
	if s.MinimizeDays {
		costW, daysW = 0, 1
	}
	b := newBuilder()
	m := &Model{Spec: s, CostRow: -1}

	byPoint := make([][]int, s.NumPoints)
	for o, op := range s.Options {
		byPoint[op.Point] = append(byPoint[op.Point], o)
	}
	m.XCol = make([]int, len(s.Options))
	for o, op := range s.Options {
		m.XCol[o] = b.col(fmt.Sprintf("x_p%d_%s", op.Point, op.Label), costW*op.Cost, 0, 1, true)
	}
	m.YCol = make([]int, len(s.Rigs))
	m.DCol = make([]int, len(s.Rigs))
	for r, rg := range s.Rigs {
		m.YCol[r] = b.col("y_"+rg.Name, costW*rg.MobCost, 0, 1, true)
	}
	for r, rg := range s.Rigs {
		m.DCol[r] = b.col("d_"+rg.Name, costW*rg.DayCost, 0, math.Inf(1), true)
	}
	m.TCol = b.col("finish_days", daysW, 0, math.Inf(1), s.MinimizeDays)
	m.QCol = make([]int, len(s.Pooled))
	for i, it := range s.Pooled {
		m.QCol[i] = b.col("q_"+it.Name, costW*it.unitCost(), 0, math.Inf(1), true)
	}

	// Coverage rows (the maximal covering form has its own, below).
	coverRows := s.CoverRows
	if s.MaximizeCoverage {
		coverRows = nil
	}
	for i, row := range coverRows {
		var cols []int
		seen := map[int]bool{}
		for _, p := range row {
			if seen[p] {
				continue // a point listed twice counts once
			}
			seen[p] = true
			for _, o := range byPoint[p] {
				cols = append(cols, m.XCol[o])
			}
		}
		if len(cols) == 0 {
			z := s.PointZone[row[0]]
			return nil, fmt.Errorf("%w: zone %q has ground no candidate point can cover (no rig offered can explore there)", ErrNoOption, s.Zones[z].Name)
		}
		b.row(fmt.Sprintf("cover_%d", i), 1, math.Inf(1), cols, ones(len(cols)))
	}
	if s.MaximizeCoverage {
		m.UCol = make([]int, len(s.Cells))
		for c, cell := range s.Cells {
			m.UCol[c] = b.col(fmt.Sprintf("u_c%d", c), -100*cellWeight(cell)*cell.AreaFt2/totalWA, 0, 1, false)
			cols := []int{m.UCol[c]}
			seen := map[int]bool{}
			for _, p := range cell.Points {
				if seen[p] {
					continue
				}
				seen[p] = true
				for _, o := range byPoint[p] {
					cols = append(cols, m.XCol[o])
				}
			}
			vals := make([]float64, len(cols))
			for k := range vals {
				vals[k] = -1
			}
			vals[0] = 1
			b.row(fmt.Sprintf("covers_c%d", c), math.Inf(-1), 0, cols, vals)
		}
	}
	// One option per point; required points exactly one.
	for p, opts := range byPoint {
		req := s.Required != nil && s.Required[p]
		if len(opts) == 0 {
			if req {
				return nil, fmt.Errorf("%w: zone %q has a required point no offered rig can explore", ErrNoOption, s.Zones[s.PointZone[p]].Name)
			}
			continue
		}
		lo := math.Inf(-1)
		if req {
			lo = 1
		}
		if len(opts) == 1 && !req {
			continue // bound x ≤ 1 already holds
		}
		cols := make([]int, len(opts))
		for k, o := range opts {
			cols[k] = m.XCol[o]
		}
		b.row(fmt.Sprintf("one_p%d", p), lo, 1, cols, ones(len(cols)))
	}
	// Points too close together: at most one of each pair.
	for _, pq := range s.Apart {
		var cols []int
		for _, p := range pq {
			for _, o := range byPoint[p] {
				cols = append(cols, m.XCol[o])
			}
		}
		if len(byPoint[pq[0]]) > 0 && len(byPoint[pq[1]]) > 0 {
			b.row(fmt.Sprintf("apart_p%d_p%d", pq[0], pq[1]), math.Inf(-1), 1, cols, ones(len(cols)))
		}
	}
	// Point-and-rig linking.
	for p, opts := range byPoint {
		perRig := map[int][]int{}
		var rigs []int
		for _, o := range opts {
			r := s.Options[o].Rig
			if _, ok := perRig[r]; !ok {
				rigs = append(rigs, r)
			}
			perRig[r] = append(perRig[r], m.XCol[o])
		}
		for _, r := range rigs { // rigs in first-seen order: deterministic
			cols := append(append([]int(nil), perRig[r]...), m.YCol[r])
			vals := ones(len(cols))
			vals[len(vals)-1] = -1
			b.row(fmt.Sprintf("link_p%d_%s", p, s.Rigs[r].Name), math.Inf(-1), 0, cols, vals)
		}
	}
	// Zone counts and sampled shares, through integer count columns
	// n[z] = Σ x and s[z] = Σ sampled x. Branching on a count moves a whole
	// zone's mix at once, where branching on one point's x meets a wall of
	// symmetric alternatives; and the share's lower bound rounds up:
	// s[z] ≥ ⌈share·n_min⌉ (a Chvátal–Gomory rounding of s ≥ share·n with
	// n ≥ n_min; Wolsey, Integer Programming, 1998, §8.2 — from memory).
	// Options by zone and by rig, listed once: a scan of every option
	// per zone or per rig would grow with zones × options.
	byZone := make([][]int, len(s.Zones))
	byRig := make([][]int, len(s.Rigs))
	for o, op := range s.Options {
		z := s.PointZone[op.Point]
		byZone[z] = append(byZone[z], o)
		byRig[op.Rig] = append(byRig[op.Rig], o)
	}
	m.NCol = make([]int, len(s.Zones))
	m.SCol = make([]int, len(s.Zones))
	m.CountRow = make([]int, len(s.Zones))
	m.ShareRow = make([]int, len(s.Zones))
	for z, zn := range s.Zones {
		m.NCol[z], m.SCol[z] = -1, -1
		m.CountRow[z], m.ShareRow[z] = -1, -1
		if s.MaximizeCoverage {
			zn.MinCount = 0 // counts dropped in the maximal covering form
		}
		var cols, sampled []int
		for _, o := range byZone[z] {
			op := s.Options[o]
			cols = append(cols, m.XCol[o])
			if op.Sampled {
				sampled = append(sampled, m.XCol[o])
			}
		}
		if zn.MinCount > 0 && len(cols) == 0 {
			return nil, fmt.Errorf("%w: zone %q needs %d points but no offered rig can explore it", ErrNoOption, zn.Name, zn.MinCount)
		}
		if len(cols) == 0 || (zn.MinCount == 0 && zn.SampledShare == 0) {
			continue
		}
		m.NCol[z] = b.col(fmt.Sprintf("n_z%d", z), 0, float64(zn.MinCount), math.Inf(1), true)
		m.CountRow[z] = b.row(fmt.Sprintf("count_z%d", z), 0, 0, append(cols, m.NCol[z]), append(ones(len(cols)), -1))
		if zn.SampledShare > 0 {
			lo := math.Ceil(zn.SampledShare*float64(zn.MinCount) - 1e-9)
			m.SCol[z] = b.col(fmt.Sprintf("s_z%d", z), 0, lo, math.Inf(1), true)
			b.row(fmt.Sprintf("sampledcount_z%d", z), 0, 0, append(sampled, m.SCol[z]), append(ones(len(sampled)), -1))
			m.ShareRow[z] = b.row(fmt.Sprintf("sampled_z%d", z), 0, math.Inf(1), []int{m.SCol[z], m.NCol[z]}, []float64{1, -zn.SampledShare})
		}
	}
	// Field days and finish, in hundredths of an hour.
	for r, rg := range s.Rigs {
		cols := []int{m.DCol[r], m.YCol[r]}
		vals := []float64{Hundredths(s.HoursPerDay - s.StartUpHours), -Hundredths(rg.MobHours)}
		for _, o := range byRig[r] {
			cols = append(cols, m.XCol[o])
			vals = append(vals, -Hundredths(s.Options[o].Hours))
		}
		b.row("days_"+rg.Name, 0, math.Inf(1), cols, vals)
		b.row("finish_"+rg.Name, 0, math.Inf(1), []int{m.TCol, m.DCol[r]}, []float64{1, -1})
		if rg.Unit > 1 {
			if r == 0 || max(s.Rigs[r-1].Unit, 1) != rg.Unit-1 {
				return nil, fmt.Errorf("model: crew %d of rig %q does not follow crew %d", rg.Unit, rg.Name, rg.Unit-1)
			}
			b.row("crews_y_"+rg.Name, 0, math.Inf(1), []int{m.YCol[r-1], m.YCol[r]}, []float64{1, -1})
			b.row("crews_d_"+rg.Name, 0, math.Inf(1), []int{m.DCol[r-1], m.DCol[r]}, []float64{1, -1})
		}
	}
	// Pooled items: q[i] ≥ k[i] · (the plan's total need).
	if len(s.Pooled) > 0 {
		cols := make([][]int, len(s.Pooled))
		vals := make([][]float64, len(s.Pooled))
		add := func(us []Use, col int) {
			for _, u := range us {
				if u.Item < 0 || u.Item >= len(s.Pooled) {
					panic("model: a use names no pooled item")
				}
				cols[u.Item] = append(cols[u.Item], col)
				vals[u.Item] = append(vals[u.Item], -s.Pooled[u.Item].scale()*u.Amount)
			}
		}
		for o, op := range s.Options {
			add(op.Uses, m.XCol[o])
		}
		for r, rg := range s.Rigs {
			add(rg.MobUses, m.YCol[r])
			add(rg.DayUses, m.DCol[r])
		}
		for i, it := range s.Pooled {
			b.row("pooled_"+it.Name, 0, math.Inf(1), append([]int{m.QCol[i]}, cols[i]...), append([]float64{1}, vals[i]...))
		}
	}
	if s.Budget > 0 {
		cols, vals := m.costTerms()
		m.CostRow = b.row("budget", math.Inf(-1), s.Budget, cols, vals)
	}
	if s.MaxDays > 0 {
		b.setColUp(m.TCol, s.MaxDays)
	}
	m.Problem = b.problem("rigmix-plan")
	return m, nil
}

// costTerms lists the cost of every column (without the tie-break weight).
func (m *Model) costTerms() ([]int, []float64) {
	s := m.Spec
	var cols []int
	var vals []float64
	for o, op := range s.Options {
		cols = append(cols, m.XCol[o])
		vals = append(vals, op.Cost)
	}
	for r, rg := range s.Rigs {
		cols = append(cols, m.YCol[r], m.DCol[r])
		vals = append(vals, rg.MobCost, rg.DayCost)
	}
	for i, it := range s.Pooled {
		cols = append(cols, m.QCol[i])
		vals = append(vals, it.unitCost())
	}
	return cols, vals
}

// unitCost is the price of one unit of the item's column: a whole unit, or
// a cent.
func (it Pooled) unitCost() float64 {
	if it.Whole {
		return it.Price
	}
	return 0.01
}

// scale is k[i]: units of the column per unit of the item.
func (it Pooled) scale() float64 {
	if it.Whole {
		return 1
	}
	return 100 * it.Price
}

// Hundredths is hours counted in whole hundredths, as the days rows count
// them.
func Hundredths(h float64) float64 { return math.Round(100 * h) }

// Days is the field days a rig takes for the given hours (mobilization and
// points), by the rule of the days rows: ⌈hours / (H − u)⌉ in whole
// hundredths of an hour.
func Days(hours, hoursPerDay, startUp float64) int {
	return int(math.Ceil(Hundredths(hours) / Hundredths(hoursPerDay-startUp)))
}

// Solution is a decoded solution.
type Solution struct {
	Chosen    []int  // option indices, ascending
	Mobilized []bool // per rig
	Days      []int  // per rig
	Finish    int    // field days until the last rig is done
	// Pooled is the rounded quantity of each pooled item: whole units, or
	// the extension in cents.
	Pooled []float64
	Cost   float64
}

// Decode reads a primal solution of the program.
func (m *Model) Decode(x []float64) Solution {
	s := m.Spec
	var sol Solution
	for o, c := range m.XCol {
		if x[c] > 0.5 {
			sol.Chosen = append(sol.Chosen, o)
			sol.Cost += s.Options[o].Cost
		}
	}
	sol.Mobilized = make([]bool, len(s.Rigs))
	sol.Days = make([]int, len(s.Rigs))
	for r, rg := range s.Rigs {
		sol.Mobilized[r] = x[m.YCol[r]] > 0.5
		sol.Days[r] = int(math.Round(x[m.DCol[r]]))
		if sol.Mobilized[r] {
			sol.Cost += rg.MobCost
		}
		sol.Cost += float64(sol.Days[r]) * rg.DayCost
		if sol.Days[r] > sol.Finish {
			sol.Finish = sol.Days[r]
		}
	}
	sol.Pooled = make([]float64, len(s.Pooled))
	for i, it := range s.Pooled {
		sol.Pooled[i] = math.Round(x[m.QCol[i]])
		sol.Cost += sol.Pooled[i] * it.unitCost()
	}
	return sol
}

func cellWeight(c Cell) float64 {
	if c.Weight == 0 {
		return 1
	}
	return c.Weight
}

func ones(n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = 1
	}
	return v
}

// builder collects columns and row-wise entries, then forms the sparse
// column matrix.
type builder struct {
	obj, lo, up    []float64
	integer        []bool
	colNames       []string
	rowLo, rowUp   []float64
	rowNames       []string
	entCol, entRow []int
	entVal         []float64
}

func newBuilder() *builder { return &builder{} }

func (b *builder) col(name string, c, lo, up float64, integer bool) int {
	b.obj = append(b.obj, c)
	b.lo = append(b.lo, lo)
	b.up = append(b.up, up)
	b.integer = append(b.integer, integer)
	b.colNames = append(b.colNames, name)
	return len(b.obj) - 1
}

func (b *builder) setColUp(j int, up float64) { b.up[j] = up }

func (b *builder) row(name string, lo, up float64, cols []int, vals []float64) int {
	i := len(b.rowLo)
	b.rowLo = append(b.rowLo, lo)
	b.rowUp = append(b.rowUp, up)
	b.rowNames = append(b.rowNames, name)
	for k, j := range cols {
		if vals[k] == 0 {
			continue
		}
		b.entCol = append(b.entCol, j)
		b.entRow = append(b.entRow, i)
		b.entVal = append(b.entVal, vals[k])
	}
	return i
}

func (b *builder) problem(name string) *mip.Problem {
	n := len(b.obj)
	start := make([]int, n+1)
	for _, j := range b.entCol {
		start[j+1]++
	}
	for j := 0; j < n; j++ {
		start[j+1] += start[j]
	}
	next := append([]int(nil), start[:n]...)
	rowIdx := make([]int, len(b.entCol))
	val := make([]float64, len(b.entCol))
	// Entries were added row by row, so within a column rows ascend.
	for k, j := range b.entCol {
		rowIdx[next[j]] = b.entRow[k]
		val[next[j]] = b.entVal[k]
		next[j]++
	}
	return &mip.Problem{
		Name: name,
		LP: lp.Problem{
			NumRows: len(b.rowLo), NumCols: n,
			Obj: b.obj, ColLo: b.lo, ColUp: b.up,
			RowLo: b.rowLo, RowUp: b.rowUp,
			ColStart: start, RowIndex: rowIdx, Value: val,
		},
		Integer:  b.integer,
		ColNames: b.colNames,
		RowNames: b.rowNames,
	}
}

// StartFor returns the column values of a plan given by its chosen
// options: the rigs they use, each rig's days by the day rule (Days), the
// finish, the zone counts and the pooled items rounded up as an estimate
// rounds them. It is a start for mip.Options.Start (a plan of the model
// when the options meet its rows).
func (m *Model) StartFor(chosen []int) []float64 {
	s := m.Spec
	x := make([]float64, m.Problem.LP.NumCols)
	hours := make([]float64, len(s.Rigs))
	used := make([]bool, len(s.Rigs))
	need := make([]float64, len(s.Pooled))
	n := make([]float64, len(s.Zones))
	ns := make([]float64, len(s.Zones))
	for _, o := range chosen {
		op := s.Options[o]
		x[m.XCol[o]] = 1
		hours[op.Rig] += op.Hours
		used[op.Rig] = true
		for _, u := range op.Uses {
			need[u.Item] += u.Amount
		}
		z := s.PointZone[op.Point]
		n[z]++
		if op.Sampled {
			ns[z]++
		}
	}
	finish := 0
	for r, rg := range s.Rigs {
		if !used[r] {
			continue
		}
		d := Days(rg.MobHours+hours[r], s.HoursPerDay, s.StartUpHours)
		x[m.YCol[r]], x[m.DCol[r]] = 1, float64(d)
		finish = max(finish, d)
		for _, u := range rg.MobUses {
			need[u.Item] += u.Amount
		}
		for _, u := range rg.DayUses {
			need[u.Item] += u.Amount * float64(d)
		}
	}
	x[m.TCol] = float64(finish)
	for z := range s.Zones {
		if m.NCol[z] >= 0 {
			x[m.NCol[z]] = n[z]
		}
		if m.SCol[z] >= 0 {
			x[m.SCol[z]] = ns[z]
		}
	}
	for i, it := range s.Pooled {
		if it.Whole {
			x[m.QCol[i]] = math.Ceil(need[i] - 1e-9)
		} else {
			x[m.QCol[i]] = math.Ceil(100*it.Price*need[i] - 1e-6)
		}
	}
	return x
}

// SplitCrews shares each rig's chosen options among its crews (Rig.Unit):
// in the order of their points, in consecutive runs of about equal hours,
// so each crew works one stretch of ground. It returns the options of the
// shared plan (the same points, methods and rigs; more crews), a start for
// a faster plan.
func (m *Model) SplitCrews(chosen []int) []int {
	s := m.Spec
	first := make([]int, len(s.Rigs)) // rig → its first crew
	crews := make([]int, len(s.Rigs)) // first crew → number of crews
	for r, rg := range s.Rigs {
		first[r] = r
		if rg.Unit > 1 {
			first[r] = first[r-1]
		}
		crews[first[r]]++
	}
	type key struct{ point, rig int }
	slot := map[key][]int{} // options of a point and rig, in order
	for o, op := range s.Options {
		k := key{op.Point, op.Rig}
		slot[k] = append(slot[k], o)
	}
	byFirst := map[int][]int{}
	var firsts []int
	for _, o := range chosen {
		f := first[s.Options[o].Rig]
		if _, ok := byFirst[f]; !ok {
			firsts = append(firsts, f)
		}
		byFirst[f] = append(byFirst[f], o)
	}
	var out []int
	for _, f := range firsts {
		os := byFirst[f]
		k := crews[f]
		if k == 1 {
			out = append(out, os...)
			continue
		}
		sort.Slice(os, func(a, b int) bool { return s.Options[os[a]].Point < s.Options[os[b]].Point })
		total := 0.0
		for _, o := range os {
			total += s.Options[o].Hours
		}
		groups := make([][]int, k)
		hours := make([]float64, k)
		done, crew := 0.0, 0
		for _, o := range os {
			op := s.Options[o]
			for crew < k-1 && done >= total*float64(crew+1)/float64(k) {
				crew++
			}
			done += op.Hours
			groups[crew] = append(groups[crew], o)
			hours[crew] += op.Hours
		}
		// The busiest run to the first crew, and so on: the model orders
		// the crews by their days.
		order := make([]int, k)
		for g := range order {
			order[g] = g
		}
		sort.SliceStable(order, func(a, b int) bool { return hours[order[a]] > hours[order[b]] })
		for rank, g := range order {
			for _, o := range groups[g] {
				op := s.Options[o]
				// The same option's place among its point's options on
				// the crew.
				idx := 0
				for i, q := range slot[key{op.Point, op.Rig}] {
					if q == o {
						idx = i
					}
				}
				out = append(out, slot[key{op.Point, f + rank}][idx])
			}
		}
	}
	sort.Ints(out)
	return out
}
