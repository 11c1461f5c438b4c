package money

import "testing"

// TestFormat: comma thousands separators and two decimals (the usual
// layout of English-language estimates: common practice), cents rounded by
// strconv from the binary value.
func TestFormat(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{
		{0, "0.00"}, {-0.001, "0.00"}, {12.3, "12.30"}, {999.995, "1,000.00"}, {999, "999.00"},
		{1000, "1,000.00"}, {110203.09, "110,203.09"}, {1234567.5, "1,234,567.50"}, {-1500, "-1,500.00"},
		{-123456, "-123,456.00"},
	} {
		if got := Format(c.v); got != c.want {
			t.Errorf("Format(%v) = %q, want %q", c.v, got, c.want)
		}
	}
	if got := WithCurrency(6300, "USD"); got != "USD 6,300.00" {
		t.Errorf("WithCurrency = %q", got)
	}
	if got := WithCurrency(6300, ""); got != "6,300.00" {
		t.Errorf("WithCurrency without a code = %q", got)
	}
}
