// Package money is the one way rigmix writes an amount for people: in
// terminal text and HTML tables alike, thousands separated by commas and
// two decimals ("1,234,567.50"). Files for programs (CSV, JSON) keep plain
// numbers.
package money

import (
	"strconv"
	"strings"
)

// Format writes an amount with thousands separators and two decimals:
// 1234567.5 → "1,234,567.50", -1500 → "-1,500.00". An amount that rounds
// to zero is "0.00", never "-0.00".
func Format(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	neg := strings.HasPrefix(s, "-")
	s = strings.TrimPrefix(s, "-")
	intPart, frac := s[:len(s)-3], s[len(s)-3:]
	var b strings.Builder
	for i, c := range intPart {
		if i > 0 && (len(intPart)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(c)
	}
	out := b.String() + frac
	if neg && out != "0.00" {
		out = "-" + out
	}
	return out
}

// WithCurrency is Format after the currency code and a space
// ("USD 1,234.50"); an empty code gives Format alone.
func WithCurrency(v float64, cur string) string {
	if cur == "" {
		return Format(v)
	}
	return cur + " " + Format(v)
}
