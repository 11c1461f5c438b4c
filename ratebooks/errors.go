package ratebooks

import (
	"fmt"
	"sort"
	"strings"
)

// FieldError is a problem with one field of a rate book, worded so the
// user can fix it: which file, which field (a path such as
// "items[3].unit_price", list indexes counted from 0), what is wrong and
// what would be right.
type FieldError struct {
	File    string // file name or "demo:NAME"
	Field   string // field path; empty for the file as a whole
	Problem string // what is wrong, with the value found
	Hint    string // what would be right; may be empty
}

// Error reads like
// "rates.yaml: items[3].unit_price: must be ≥ 0, got -12 (a price per ft in USD, e.g. 18.50)".
func (e *FieldError) Error() string {
	var b strings.Builder
	if e.File != "" {
		b.WriteString(e.File)
		b.WriteString(": ")
	}
	if e.Field != "" {
		b.WriteString(e.Field)
		b.WriteString(": ")
	}
	b.WriteString(e.Problem)
	if e.Hint != "" {
		b.WriteString(" (")
		b.WriteString(e.Hint)
		b.WriteString(")")
	}
	return b.String()
}

// BadInput marks the error as the user's input being wrong; the command
// line maps it to exit code 2.
func (e *FieldError) BadInput() bool { return true }

// nearest returns the candidate closest to word by edit distance when close
// enough to be a likely misspelling, else "". Ties go to the candidate that
// sorts first.
func nearest(word string, candidates []string) string {
	sorted := append([]string(nil), candidates...)
	sort.Strings(sorted)
	best, bestD := "", -1
	lw := strings.ToLower(word)
	for _, c := range sorted {
		d := editDistance(lw, c)
		if bestD < 0 || d < bestD {
			best, bestD = c, d
		}
	}
	if bestD >= 0 && bestD <= max(2, max(len(word), len(best))/3) {
		return best
	}
	return ""
}

func editDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		return 1 << 30
	}
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

func suggest(word string, candidates []string) string {
	sorted := append([]string(nil), candidates...)
	sort.Strings(sorted)
	if n := nearest(word, sorted); n != "" {
		return fmt.Sprintf("did you mean %s?", n)
	}
	return "known: " + strings.Join(sorted, ", ")
}
