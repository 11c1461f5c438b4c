package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// TestSolveJSONInfinities: a search stopped by its limit before any
// solution or bound writes valid JSON with objective null, bound "-inf"
// and gap "+inf"; a maximization reports its maximum and an upper bound.
func TestSolveJSONInfinities(t *testing.T) {
	p := &mip.Problem{Name: "m"}
	res := &mip.Result{Status: mip.TimeLimit, Obj: math.Inf(1), Bound: math.Inf(-1), Gap: math.Inf(1)}
	var b bytes.Buffer
	if err := summarize(p, res).writeJSON(&b); err != nil {
		t.Fatal(err)
	}
	var got map[string]any
	if err := json.Unmarshal(b.Bytes(), &got); err != nil {
		t.Fatalf("not JSON: %v\n%s", err, b.String())
	}
	if got["objective"] != nil || got["bound"] != "-inf" || got["gap"] != "+inf" || got["status"] != "time limit" {
		t.Errorf("got %v", got)
	}

	p.Maximize = true
	res = &mip.Result{Status: mip.TimeLimit, X: []float64{1}, Obj: -5, Bound: -7, Gap: 0.4}
	b.Reset()
	if err := summarize(p, res).writeText(&b); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"sense      maximize", "objective  5\n", "bound      7 (upper bound)"} {
		if !strings.Contains(b.String(), want) {
			t.Errorf("text output lacks %q:\n%s", want, b.String())
		}
	}
}
