package fieldwork

import (
	"fmt"
	"math"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// surfaceOf reads a site's surface; a site that does not state one is on
// firm ground (the scenarios stage states it; this only guards old inputs).
func surfaceOf(s sdk.Surface) sdk.Surface {
	if s == "" {
		return sdk.Firm
	}
	return s
}

// Reasons lists why the rig described by info cannot do site s as far as
// the limits every rig shares go: the method, its depth limit, the ground
// surface, the slope and the overhead clearance. Rig-specific limits
// (groundwater in a pit, refusal at rock) are added by each rig. An empty
// list means none of these bars the site.
func Reasons(info sdk.RigInfo, s sdk.Site) []string {
	var out []string
	lim, ok := MethodLimitOf(info, s.Method)
	if !ok {
		var have []string
		for _, m := range info.Methods {
			have = append(have, string(m.Method))
		}
		out = append(out, fmt.Sprintf("%s does not perform %q (it performs %s)", info.Name, s.Method, strings.Join(have, ", ")))
	}
	switch {
	case math.IsNaN(s.DepthFt) || math.IsInf(s.DepthFt, 0) || s.DepthFt <= 0:
		out = append(out, fmt.Sprintf("depth %v ft: a depth must be a positive number of feet", s.DepthFt))
	case ok && s.DepthFt > lim.MaxDepthFt:
		out = append(out, fmt.Sprintf("depth %.4g ft is beyond the %.4g ft %s reaches by %s", s.DepthFt, lim.MaxDepthFt, info.Name, s.Method))
	}
	surf := surfaceOf(s.Surface)
	switch surf {
	case sdk.Firm, sdk.Wet, sdk.Soft:
		if !HasSurface(info.Access, surf) {
			out = append(out, fmt.Sprintf("%s ground: %s works only on %s ground", surf, info.Name, surfacesText(info.Access.Surfaces)))
		}
	default:
		out = append(out, fmt.Sprintf("unknown surface %q (want firm, wet or soft)", s.Surface))
	}
	slope := math.Abs(s.SlopePct)
	switch {
	case math.IsNaN(slope) || math.IsInf(slope, 0):
		out = append(out, fmt.Sprintf("slope %v %%: want a number", s.SlopePct))
	case slope > info.Access.MaxSlopePct:
		out = append(out, fmt.Sprintf("slope %.4g %% is steeper than the %.4g %% %s can set up on", slope, info.Access.MaxSlopePct, info.Name))
	}
	if s.OverheadFt > 0 && s.OverheadFt < info.Access.MinOverheadFt {
		out = append(out, fmt.Sprintf("overhead clearance %.4g ft is less than the %.4g ft %s needs for its mast or boom", s.OverheadFt, info.Access.MinOverheadFt, info.Name))
	}
	return out
}

// MethodLimitOf finds the rig's limit for method m.
func MethodLimitOf(info sdk.RigInfo, m sdk.Method) (sdk.MethodLimit, bool) {
	for _, l := range info.Methods {
		if l.Method == m {
			return l, true
		}
	}
	return sdk.MethodLimit{}, false
}

// HasSurface reports whether the rig can work on surface s.
func HasSurface(a sdk.AccessLimits, s sdk.Surface) bool {
	for _, x := range a.Surfaces {
		if x == s {
			return true
		}
	}
	return false
}

func surfacesText(ss []sdk.Surface) string {
	parts := make([]string, len(ss))
	for i, s := range ss {
		parts[i] = string(s)
	}
	switch len(parts) {
	case 0:
		return "no"
	case 1:
		return parts[0]
	default:
		return strings.Join(parts[:len(parts)-1], ", ") + " or " + parts[len(parts)-1]
	}
}
