package ratebooks_test

import (
	"fmt"

	"github.com/rigmix/rigmix/ratebooks"
)

func ExampleRateBook_Check() {
	b, err := ratebooks.Open("valley-2026")
	if err != nil {
		panic(err)
	}
	it, _ := b.Price("drill-0-50")
	fmt.Printf("%s: %.2f %s per %s\n", it.Code, it.UnitPrice, b.Currency, it.Unit)
	fmt.Println(b.Check([]string{"drill-0-50", "drill-150-200", "vane-shear"}))
	// Output:
	// drill-0-50: 19.00 USD per ft
	// demo:valley-2026: items: no price for 2 items: drill-150-200, vane-shear (add code: drill-150-200; code: vane-shear with a unit_price)
}
