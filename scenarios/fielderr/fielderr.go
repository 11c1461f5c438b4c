// Package fielderr is the error a user can act on that both loaders
// (scenarios and rate books) return — file, field path, what is wrong, what
// would be right — the misspelling hints they give with it, and their
// bounded reading of a file.
package fielderr

import (
	"fmt"
	"sort"
	"strings"
)

// FieldError is a problem with one field of a scenario file, worded so the
// user can fix it: which file, which field (a path such as
// "zones[2].rules.max_spacing", list indexes counted from 0), what is wrong
// and what would be right.
type FieldError struct {
	File    string // file name, "demo:NAME" or "overrides"
	Field   string // field path; empty for the file as a whole
	Problem string // what is wrong, with the value found
	Hint    string // what would be right; may be empty
}

// Error reads like
// "scenario.yaml: zones[2].rules.max_spacing: must be > 0, got -50 (give a spacing in ft, e.g. 100)".
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

// BadInput marks the error as the user's input being wrong, not the
// program failing; the command line maps it to exit code 2.
func (e *FieldError) BadInput() bool { return true }

// Nearest returns the candidate closest to word by edit distance, when it is
// close enough to be a likely misspelling; otherwise "". Ties go to the
// candidate that sorts first, so the suggestion is deterministic.
func Nearest(word string, candidates []string) string {
	sorted := append([]string(nil), candidates...)
	sort.Strings(sorted)
	best, bestD := "", -1
	lw := strings.ToLower(word)
	for _, c := range sorted {
		d := EditDistance(lw, c)
		if bestD < 0 || d < bestD {
			best, bestD = c, d
		}
	}
	// Accept up to a third of the longer word's length (at least 2 edits),
	// or a candidate that contains the word or is contained in it.
	limit := max(2, max(len(word), len(best))/3)
	if bestD >= 0 && bestD <= limit {
		return best
	}
	for _, c := range sorted {
		if len(lw) >= 3 && (strings.Contains(c, lw) || strings.Contains(lw, c)) {
			return c
		}
	}
	return ""
}

// EditDistance is the Levenshtein distance between a and b, counted in
// bytes (keys are ASCII).
func EditDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		// Keys are short; a very long token is no misspelling.
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

// Suggest formats a hint for a misspelt word.
func Suggest(word string, candidates []string) string {
	if n := Nearest(word, candidates); n != "" {
		return fmt.Sprintf("did you mean %s?", n)
	}
	sorted := append([]string(nil), candidates...)
	sort.Strings(sorted)
	return "known: " + strings.Join(sorted, ", ")
}
