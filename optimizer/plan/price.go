package plan

import (
	"math"
	"strings"

	"github.com/rigmix/rigmix/optimizer/model"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
)

// How the estimate prices (and the model with it, so that the optimized
// cost is the estimate's total to the cent):
//
//   - every quantity a rig reports is kept to the thousandth of its unit,
//     the precision the estimate prints (quantityPlaces), hours to the
//     hundredth;
//   - hours are kept to the hundredth (hourPlaces), so field days are
//     counted on exact sums (model.Hundredths);
//   - each rate-book item is summed over the plan, then extended; a lab
//     test is bought whole (⌈Σ need⌉) and every extension is rounded up to
//     the cent (extension).
//
// Items whose every term is already a whole number of cents (feet of
// drilling at a price in cents, crew-days, mobilizations) are priced in the
// options' and rigs' own costs; the others — lab tests and fractional
// quantities such as hours of logging — are pooled (model.Pooled).
const (
	// StartUpHours opens every field day (schedule.StartUpHours).
	StartUpHours = schedule.StartUpHours

	quantityPlaces = 3
	hourPlaces     = 2
)

// extension is the estimate line's amount: quantity × unit price, rounded
// up to the cent (a tolerance of a millionth of a cent absorbs the
// floating-point error of the product).
func extension(q, unitPrice float64) float64 {
	return math.Ceil(100*q*unitPrice-1e-6) / 100
}

// roundQuantities keeps each amount to the estimate's precision, hours
// to the hundredth as every hour in the plan is kept (so an hourly item at
// a price in whole dollars extends to whole cents on every point and needs
// no pooled column).
func roundQuantities(qs []sdk.Quantity) []sdk.Quantity {
	out := make([]sdk.Quantity, len(qs))
	for i, q := range qs {
		places := quantityPlaces
		if q.Unit == "hr" {
			places = hourPlaces
		}
		q.Amount = round(q.Amount, places)
		out[i] = q
	}
	return out
}

// isLabItem tells a laboratory test item (lab.ItemMoisture, ...).
func isLabItem(item string) bool { return strings.HasPrefix(item, "lab-") }

// pooling decides which items are pooled and splits quantities into a cost
// in whole cents and uses of pooled items.
type pooling struct {
	rb    *ratebooks.RateBook
	index map[string]int
	items []model.Pooled
}

// newPooling pools every lab item and every item of which some quantity in
// qss, at its unit price, is not a whole number of cents. Items are listed
// in rate-book order, so the model's columns do not depend on map order.
func newPooling(rb *ratebooks.RateBook, qss [][]sdk.Quantity) *pooling {
	pooled := map[string]bool{}
	for _, qs := range qss {
		for _, q := range qs {
			it, ok := rb.Price(q.Item)
			if !ok {
				continue // price() reports the missing item
			}
			c := 100 * q.Amount * it.UnitPrice
			if isLabItem(q.Item) || math.Abs(c-math.Round(c)) > 1e-6 {
				pooled[q.Item] = true
			}
		}
	}
	pl := &pooling{rb: rb, index: map[string]int{}}
	for _, it := range rb.Items {
		if pooled[it.Code] {
			pl.index[it.Code] = len(pl.items)
			pl.items = append(pl.items, model.Pooled{Name: it.Code, Price: it.UnitPrice, Whole: isLabItem(it.Code)})
		}
	}
	return pl
}

// split returns the cost of the quantities that are not pooled and the
// uses of those that are. Every item has a price (checked by price()).
func (pl *pooling) split(qs []sdk.Quantity) (float64, []model.Use) {
	cost := 0.0
	var uses []model.Use
	for _, q := range qs {
		if i, ok := pl.index[q.Item]; ok {
			merged := false
			for k := range uses {
				if uses[k].Item == i { // one entry per item and column
					uses[k].Amount += q.Amount
					merged = true
				}
			}
			if !merged {
				uses = append(uses, model.Use{Item: i, Amount: q.Amount})
			}
			continue
		}
		it, _ := pl.rb.Price(q.Item)
		cost += q.Amount * it.UnitPrice
	}
	return cost, uses
}
