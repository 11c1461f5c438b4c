// Package ratebooks loads, validates and embeds rate books: the unit price
// of each item of exploration work. A rig reports quantities; the rate book
// turns them into money.
package ratebooks

// RateBook is a loaded and validated rate book.
type RateBook struct {
	Name      string
	Title     string
	Currency  string // ISO 4217 code, e.g. "USD"
	Effective string // date the prices take effect, YYYY-MM-DD
	Region    string // where the prices apply
	Note      string // e.g. "invented demo prices"
	Demo      bool
	Source    string // file it came from, or "demo:NAME"
	Items     []Item
}

// Item is one priced item.
type Item struct {
	Code        string  // identifier rigs report quantities in, e.g. "drill-0-50"
	Description string  // words for the estimate line
	Unit        string  // unit of measure: "ft", "each", "hr", "day", ...
	UnitPrice   float64 // price per unit in the book's currency
}
