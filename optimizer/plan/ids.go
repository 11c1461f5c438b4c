package plan

import (
	"fmt"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// methodPrefix is our own point-ID scheme: the prefix says the method, so a
// printed map, point list and stakeout list read alike — B-1 a boring, S-1
// a CPT sounding, TP-1 a test pit, P-1 a probe.
var methodPrefix = map[string]string{
	string(sdk.Boring):  "B",
	string(sdk.CPT):     "S",
	string(sdk.TestPit): "TP",
	string(sdk.Probe):   "P",
}

// IDPrefix is the ID prefix of a method's points: the scheme's for the
// known methods, else the method's name in capitals with anything but
// letters and digits dropped ("X" when nothing is left), so a plugin's
// method still gets IDs no known method uses.
func IDPrefix(method string) string {
	if p, ok := methodPrefix[method]; ok {
		return p
	}
	var b strings.Builder
	for _, r := range strings.ToUpper(method) {
		if (r >= 'A' && r <= 'Z') || (r >= '0' && r <= '9') {
			b.WriteRune(r)
		}
	}
	s := b.String()
	if s == "" {
		s = "X"
	}
	for _, p := range methodPrefix {
		if s == p {
			// An unknown method must never read as a known one.
			s = "X" + s
		}
	}
	return s
}

// pointIDs numbers points by method in the order given: the n-th point of
// a method is prefix-n (B-1, B-2, S-1, ...).
func pointIDs(methods []string) []string {
	next := map[string]int{}
	out := make([]string, len(methods))
	for i, m := range methods {
		p := IDPrefix(m)
		next[p]++
		out[i] = fmt.Sprintf("%s-%d", p, next[p])
	}
	return out
}
