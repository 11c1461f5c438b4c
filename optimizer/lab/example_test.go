package lab_test

import (
	"fmt"

	"github.com/rigmix/rigmix/optimizer/lab"
	"github.com/rigmix/rigmix/plugins/sdk"
)

func ExampleProgram_Quantities() {
	// Quantities a plan's rigs reported (two borings) and two 10-ft pits.
	qs := []sdk.Quantity{
		{Item: "spt-sample", Unit: "each", Amount: 7},
		{Item: "spt-sample", Unit: "each", Amount: 5},
	}
	c := lab.CountsFromQuantities(qs)
	c.Bag += float64(2 * lab.PitBagSamples(10, 0))

	var p *lab.Program // nil: the default program
	tests, err := p.Quantities(c)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, q := range tests {
		fmt.Printf("%-15s %3.0f %s\n", q.Item, q.Amount, q.Unit)
	}
	// Output:
	// lab-moisture     18 each
	// lab-sieve         6 each
	// lab-hydrometer    2 each
	// lab-atterberg     5 each
}
