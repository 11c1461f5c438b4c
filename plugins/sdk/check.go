package sdk

import (
	"fmt"
	"math"
	"regexp"
)

// The checks below are what the host-side shim applies to every answer a
// plugin sends back. They are exported so that a rig's own tests, and the
// host for rigs it runs in-process, can apply the same rules.

// namePattern is the shape of a rig name: it is typed in scenario files'
// rigs: lists, so lower-case words joined by hyphens.
var namePattern = regexp.MustCompile(`^[a-z][a-z0-9]*(-[a-z0-9]+)*$`)

// CheckInfo reports what is wrong with a rig's description, or nil.
func CheckInfo(info RigInfo) error {
	if info.Name == "" {
		return errNoName
	}
	if !namePattern.MatchString(info.Name) {
		return fmt.Errorf("rig name %q: want lower-case letters and digits joined by hyphens, e.g. \"track-drill\"", info.Name)
	}
	if len(info.Methods) == 0 {
		return fmt.Errorf("rig %q: describe lists no methods", info.Name)
	}
	for i, m := range info.Methods {
		if m.Method == "" {
			return fmt.Errorf("rig %q: method %d has no name", info.Name, i)
		}
		if !knownMethod(m.Method) {
			return fmt.Errorf("rig %q: unknown method %q (want boring, cpt, test_pit or probe: the plan's rules count these)", info.Name, m.Method)
		}
		if !finiteNonNeg(m.MaxDepthFt) || m.MaxDepthFt == 0 {
			return fmt.Errorf("rig %q: method %s: maximum depth %v ft must be a positive number", info.Name, m.Method, m.MaxDepthFt)
		}
	}
	for _, x := range info.Access.Surfaces {
		if x != Firm && x != Wet && x != Soft {
			return fmt.Errorf("rig %q: unknown surface %q (want firm, wet or soft)", info.Name, x)
		}
	}
	if !finiteNonNeg(info.Access.MaxSlopePct) || !finiteNonNeg(info.Access.MinOverheadFt) {
		return fmt.Errorf("rig %q: access limits (slope %v %%, overhead %v ft) must be numbers ≥ 0",
			info.Name, info.Access.MaxSlopePct, info.Access.MinOverheadFt)
	}
	return checkQuantities("day item", info.DayItems, false)
}

// CheckAssess reports what is wrong with the answers to req, or nil: one
// answer per site, in order, with matching IDs, hours and amounts finite and
// not negative, and a reason for every infeasible answer.
func CheckAssess(req AssessRequest, resp AssessResponse) error {
	if len(resp.Answers) != len(req.Sites) {
		return fmt.Errorf("%d answers for %d sites; want one answer per site", len(resp.Answers), len(req.Sites))
	}
	for i, a := range resp.Answers {
		want := req.Sites[i].ID
		if a.ID != want {
			return fmt.Errorf("answer %d has ID %q, want %q (answers must come back in request order)", i, a.ID, want)
		}
		h := a.Hours
		for _, part := range []struct {
			name string
			v    float64
		}{{"setup", h.Setup}, {"advance", h.Advance}, {"sampling", h.Sampling}, {"grouting", h.Grouting}, {"teardown", h.Teardown}} {
			if !finiteNonNeg(part.v) {
				return fmt.Errorf("site %q: %s hours %v must be a finite number ≥ 0", a.ID, part.name, part.v)
			}
		}
		if !a.Feasible && a.Reason == "" {
			return fmt.Errorf("site %q: infeasible answer gives no reason", a.ID)
		}
		if err := checkQuantities(fmt.Sprintf("site %q: quantity", a.ID), a.Quantities, true); err != nil {
			return err
		}
	}
	return nil
}

// CheckMobilize reports what is wrong with a mobilization answer, or nil.
func CheckMobilize(resp MobilizeResponse) error {
	if !finiteNonNeg(resp.Hours) {
		return fmt.Errorf("hours %v must be a finite number ≥ 0", resp.Hours)
	}
	return checkQuantities("quantity", resp.Quantities, false)
}

// CheckMoves reports what is wrong with the answers to a moves request, or
// nil: one finite, non-negative number of hours per leg.
func CheckMoves(req MovesRequest, resp MovesResponse) error {
	if len(resp.Hours) != len(req.Legs) {
		return fmt.Errorf("%d answers for %d legs; want one per leg", len(resp.Hours), len(req.Legs))
	}
	for i, h := range resp.Hours {
		if !finiteNonNeg(h) {
			return fmt.Errorf("leg %d: hours %v must be a finite number ≥ 0", i, h)
		}
	}
	return nil
}

// checkQuantities checks item codes, units and amounts; samples (a
// SampleKind) belong only in Assess answers, of a known kind, counted
// "each".
func checkQuantities(what string, qs []Quantity, samples bool) error {
	for i, q := range qs {
		if q.Item == "" {
			return fmt.Errorf("%s %d has no item code", what, i)
		}
		if q.Unit == "" {
			return fmt.Errorf("%s %s has no unit", what, q.Item)
		}
		if !finiteNonNeg(q.Amount) {
			return fmt.Errorf("%s %s: amount %v must be a finite number ≥ 0", what, q.Item, q.Amount)
		}
		if q.SampleKind == "" {
			continue
		}
		if !samples {
			return fmt.Errorf("%s %s: sample kind %q: samples are counted only in Assess answers", what, q.Item, q.SampleKind)
		}
		if !knownSampleKind(q.SampleKind) {
			return fmt.Errorf("%s %s: unknown sample kind %q (want one of %s)", what, q.Item, q.SampleKind, sampleKindList())
		}
		if q.Unit != "each" {
			return fmt.Errorf("%s %s: samples of kind %s are counted in unit \"each\", not %q", what, q.Item, q.SampleKind, q.Unit)
		}
	}
	return nil
}

func finiteNonNeg(v float64) bool {
	return !math.IsNaN(v) && !math.IsInf(v, 0) && v >= 0
}

func knownSampleKind(k SampleKind) bool {
	for _, x := range SampleKinds() {
		if x == k {
			return true
		}
	}
	return false
}

func sampleKindList() string {
	s := ""
	for i, k := range SampleKinds() {
		if i > 0 {
			s += ", "
		}
		s += string(k)
	}
	return s
}

// CheckAgainstInfo reports a feasible answer that contradicts the rig's
// own description, or nil: a method the description does not list, a depth
// beyond the method's described maximum, a ground surface it does not list
// (an empty surface is firm ground), a slope steeper than its maximum, or
// overhead clearance below what it says it needs. The host refuses such an
// answer, naming the rig: Describe is what the plan and the schedule rely
// on, so a rig must answer infeasible wherever its description says it
// cannot work. Infeasible answers are not checked.
func CheckAgainstInfo(info RigInfo, req AssessRequest, resp AssessResponse) error {
	for i, a := range resp.Answers {
		if !a.Feasible || i >= len(req.Sites) {
			continue
		}
		s := req.Sites[i]
		var lim *MethodLimit
		for k := range info.Methods {
			if info.Methods[k].Method == s.Method {
				lim = &info.Methods[k]
				break
			}
		}
		if lim == nil {
			return fmt.Errorf("site %q: answers feasible for method %q, which its description does not list (it lists %s); answer infeasible or describe the method", a.ID, s.Method, methodList(info))
		}
		if s.DepthFt > lim.MaxDepthFt {
			return fmt.Errorf("site %q: answers feasible for %s to %.4g ft, beyond the %.4g ft its description gives as the deepest; answer infeasible or describe the deeper reach", a.ID, s.Method, s.DepthFt, lim.MaxDepthFt)
		}
		surf := s.Surface
		if surf == "" {
			surf = Firm
		}
		found := false
		for _, x := range info.Access.Surfaces {
			found = found || x == surf
		}
		if !found {
			return fmt.Errorf("site %q: answers feasible on %s ground, which its description does not list (it lists %s); answer infeasible or describe the surface", a.ID, surf, surfaceList(info))
		}
		if math.Abs(s.SlopePct) > info.Access.MaxSlopePct {
			return fmt.Errorf("site %q: answers feasible on a %.4g %% slope, steeper than the %.4g %% its description allows", a.ID, math.Abs(s.SlopePct), info.Access.MaxSlopePct)
		}
		if s.OverheadFt > 0 && s.OverheadFt < info.Access.MinOverheadFt {
			return fmt.Errorf("site %q: answers feasible under %.4g ft of overhead clearance, less than the %.4g ft its description says it needs", a.ID, s.OverheadFt, info.Access.MinOverheadFt)
		}
	}
	return nil
}

// MaxPlausibleHoursPerPoint is the most hours on one point the host takes
// without a warning: a month of round-the-clock work (24 h × 30 days, our
// own bound; no exploration point takes near that).
const MaxPlausibleHoursPerPoint = 24 * 30

// Implausible says what looks wrong with a feasible answer that passes
// the contract's checks, or "": more than MaxPlausibleHoursPerPoint hours,
// or no hours and no quantities at all (work that costs nothing). The host
// shows it as a warning in the plan.
func Implausible(a Answer) string {
	if !a.Feasible {
		return ""
	}
	switch h := a.Hours.Total(); {
	case h > MaxPlausibleHoursPerPoint:
		return fmt.Sprintf("%.4g hours on one point, more than %d (a month of round-the-clock work)", h, MaxPlausibleHoursPerPoint)
	case h == 0 && len(a.Quantities) == 0:
		return "a feasible answer with no hours and no quantities (the point would cost nothing)"
	}
	return ""
}

func methodList(info RigInfo) string {
	s := ""
	for i, m := range info.Methods {
		if i > 0 {
			s += ", "
		}
		s += string(m.Method)
	}
	return s
}

func surfaceList(info RigInfo) string {
	if len(info.Access.Surfaces) == 0 {
		return "none"
	}
	s := ""
	for i, x := range info.Access.Surfaces {
		if i > 0 {
			s += ", "
		}
		s += string(x)
	}
	return s
}

func knownMethod(m Method) bool {
	return m == Boring || m == CPT || m == TestPit || m == Probe
}
