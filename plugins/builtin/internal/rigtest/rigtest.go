// Package rigtest holds test helpers shared by the built-in rigs' tests.
// Every helper talks to a rig through sdk.TestRig, so the gRPC shims and
// the host-side answer checks are exercised as in a real run.
package rigtest

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Serve wraps r in the in-process gRPC harness.
func Serve(t testing.TB, r sdk.Rig) sdk.Rig {
	t.Helper()
	c := sdk.TestRig(t, r)
	if _, err := c.Describe(context.Background()); err != nil {
		t.Fatalf("Describe: %v", err)
	}
	return c
}

// Assess asks for sites in one batch and fails the test on error.
func Assess(t testing.TB, r sdk.Rig, sites ...sdk.Site) []sdk.Answer {
	t.Helper()
	resp, err := r.Assess(context.Background(), sdk.AssessRequest{Sites: sites})
	if err != nil {
		t.Fatalf("Assess: %v", err)
	}
	return resp.Answers
}

// Amount is the amount of item in an answer's quantities, summed, and
// whether the item appears at all.
func Amount(qs []sdk.Quantity, item string) (float64, bool) {
	sum, found := 0.0, false
	for _, q := range qs {
		if q.Item == item {
			sum += q.Amount
			found = true
		}
	}
	return sum, found
}

// Case is one feasibility case: an edit of a base site and the reason
// expected ("" means feasible).
type Case struct {
	Name string
	Edit func(*sdk.Site)
	Want string
}

// Feasibility asks the rig every case in one batch and checks each answer.
func Feasibility(t *testing.T, r sdk.Rig, base sdk.Site, cases []Case) {
	t.Helper()
	sites := make([]sdk.Site, len(cases))
	for i, c := range cases {
		s := base
		s.ID = c.Name
		c.Edit(&s)
		sites[i] = s
	}
	answers := Assess(t, r, sites...)
	for i, c := range cases {
		a := answers[i]
		switch {
		case c.Want == "" && !a.Feasible:
			t.Errorf("%s: infeasible (%s), want feasible", c.Name, a.Reason)
		case c.Want != "" && a.Feasible:
			t.Errorf("%s: feasible, want refused with %q", c.Name, c.Want)
		case c.Want != "" && !strings.Contains(a.Reason, c.Want):
			t.Errorf("%s: reason %q, want it to contain %q", c.Name, a.Reason, c.Want)
		case a.Feasible && a.Hours.Total() <= 0:
			t.Errorf("%s: feasible with %g hours, want > 0", c.Name, a.Hours.Total())
		}
	}
}

// HoursGrow checks that hours on the point are positive and strictly grow
// with depth, and that field-logging equals the hours on the point.
func HoursGrow(t *testing.T, r sdk.Rig, base sdk.Site, depthsFt []float64) {
	t.Helper()
	sites := make([]sdk.Site, len(depthsFt))
	for i, d := range depthsFt {
		s := base
		s.DepthFt = d
		sites[i] = s
	}
	prev := 0.0
	for i, a := range Assess(t, r, sites...) {
		if !a.Feasible {
			t.Fatalf("depth %g ft: infeasible: %s", depthsFt[i], a.Reason)
		}
		h := a.Hours.Total()
		if h <= prev {
			t.Errorf("depth %g ft: %g h, not more than %g h at the shallower depth", depthsFt[i], h, prev)
		}
		prev = h
		if log, _ := Amount(a.Quantities, "field-logging"); log != h {
			t.Errorf("depth %g ft: field-logging %g hr, want the %g hours on the point", depthsFt[i], log, h)
		}
	}
}

// C builds a Case.
func C(name string, edit func(*sdk.Site), want string) Case {
	return Case{Name: name, Edit: edit, Want: want}
}
