package tiredrill_test

import (
	"context"
	"fmt"

	"github.com/rigmix/rigmix/plugins/builtin/tiredrill"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// A 50-ft geotechnical boring sampled by the default schedule (every 2.5 ft to
// 10 ft, then every 5 ft), and a 25-ft
// boring on an environmental site: the hours on the point and the bill of
// quantities the rate book prices.
func Example() {
	r := tiredrill.New()
	resp, _ := r.Assess(context.Background(), sdk.AssessRequest{Sites: []sdk.Site{
		{ID: "B-1", Method: sdk.Boring, DepthFt: 50, Surface: sdk.Firm},
		{ID: "B-2", Method: sdk.Boring, DepthFt: 25, Surface: sdk.Firm, Environmental: true},
		{ID: "B-3", Method: sdk.Boring, DepthFt: 30, Surface: sdk.Wet},
	}})
	for _, a := range resp.Answers {
		if !a.Feasible {
			fmt.Printf("%s: no: %s\n", a.ID, a.Reason)
			continue
		}
		h := a.Hours
		fmt.Printf("%s: %.2f h (setup %.2f, advance %.2f, sampling %.2f, grouting %.2f, teardown %.2f)\n",
			a.ID, h.Total(), h.Setup, h.Advance, h.Sampling, h.Grouting, h.Teardown)
		for _, q := range a.Quantities {
			fmt.Printf("  %-13s %6.2f %s\n", q.Item, q.Amount, q.Unit)
		}
	}
	// Output:
	// B-1: 5.82 h (setup 0.50, advance 1.67, sampling 2.66, grouting 0.75, teardown 0.25)
	//   drill-0-50     50.00 ft
	//   spt-sample     12.00 each
	//   grout-boring   50.00 ft
	//   field-logging   5.82 hr
	// B-2: 4.39 h (setup 0.50, advance 0.83, sampling 1.31, grouting 0.50, teardown 1.25)
	//   drill-0-50     25.00 ft
	//   spt-sample      7.00 each
	//   grout-boring   25.00 ft
	//   idw-drum        3.00 each
	//   field-logging   4.39 hr
	// B-3: no: wet ground: tire-drill works only on firm ground
}
