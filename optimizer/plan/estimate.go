package plan

import (
	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// costing is a set of chosen options priced as the estimate prices them.
type costing struct {
	Lines     []Line
	Total     float64
	Days      []int // per rig
	Mobilized []bool
	Finish    int
}

// price prices chosen options (indices into pr.Options) with the rigs'
// days given (nil: by the day rule, model.Days, from the options' hours and
// the rigs' mobilization) — the one estimate the plan, the hand-laid
// baseline and every alternative are priced by.
func (pr *Prepared) price(chosen []int, days []int) (*costing, error) {
	sc, rb := pr.In.Scenario, pr.In.RateBook
	qty := map[string]float64{}
	addQ := func(qs []sdk.Quantity, times float64) {
		for _, q := range qs {
			qty[q.Item] += q.Amount * times
		}
	}
	c := &costing{Mobilized: make([]bool, len(pr.Rigs))}
	hours := make([]float64, len(pr.Rigs))
	labCounts := make([]lab.Counts, len(sc.Zones))
	for _, o := range chosen {
		od := pr.Options[o]
		addQ(od.prof.answer.Quantities, 1)
		labCounts[od.zone] = labCounts[od.zone].Add(od.prof.lab)
		c.Mobilized[od.rig] = true
		hours[od.rig] += pr.Spec.Options[o].Hours
	}
	// The lab program by zone: each zone's samples get its purposes'
	// tests; the totals are rounded up once over the plan, as the model's
	// whole-test columns round the sum of the points' expected tests.
	parts := make([]lab.Part, len(sc.Zones))
	for z, zn := range sc.Zones {
		prog, err := labProgram(sc, z)
		if err != nil {
			return nil, err
		}
		parts[z] = lab.Part{Label: zn.ID, Program: prog, Counts: labCounts[z]}
	}
	labQ, err := lab.Combine(parts)
	if err != nil {
		return nil, err
	}
	if _, err := price(rb, labQ, "lab program"); err != nil {
		return nil, err
	}
	addQ(labQ, 1)
	c.Days = days
	if c.Days == nil {
		c.Days = make([]int, len(pr.Rigs))
		for r, rd := range pr.Rigs {
			if c.Mobilized[r] {
				c.Days[r] = model.Days(rd.mob.Hours+hours[r], sc.HoursDay, StartUpHours)
			}
		}
	}
	for r, rd := range pr.Rigs {
		if c.Mobilized[r] {
			addQ(rd.mob.Quantities, 1)
		}
		addQ(rd.info.DayItems, float64(c.Days[r]))
		c.Finish = max(c.Finish, c.Days[r])
	}
	// Estimate lines in rate-book order; every item was priced in Prepare.
	for _, it := range rb.Items {
		q, ok := qty[it.Code]
		if !ok || q == 0 {
			continue
		}
		q = round(q, quantityPlaces)
		ext := extension(q, it.UnitPrice)
		c.Lines = append(c.Lines, Line{Item: it.Code, Description: it.Description, Quantity: q, Unit: it.Unit, UnitPrice: it.UnitPrice, Extension: ext})
		c.Total += ext
	}
	c.Total = round(c.Total, 2)
	return c, nil
}
