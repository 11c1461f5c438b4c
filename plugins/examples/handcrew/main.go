// Command handcrew is an example external rig plugin for rigmix, "hand-crew":
// a two-person crew with a pickup truck doing hand-auger borings to about
// 10 ft and dynamic cone penetrometer probes (ASTM D6951) to about 6 ft, on
// firm, wet or soft ground and slopes to 40 %, with no overhead limit.
//
// It uses only the public SDK (plugins/sdk), as a rig written outside
// rigmix would. Build it and put the executable in the plugin folder:
//
//	go build -o ~/rigs/hand-crew ./plugins/examples/handcrew
//	rigmix plan --plugin-dir ~/rigs ...
//
// The rates are common practice or from memory, as noted beside each.
package main

import (
	"context"
	"fmt"
	"math"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

func main() { sdk.Serve(handCrew{}) }

// Depth limits: a hand auger in ordinary soil is practical to about 10 ft
// (common practice); a DCP with one extension rod to about 6 ft (ASTM D6951
// describes the test; the depth with extensions is from memory).
const (
	augerMaxFt = 10.0
	dcpMaxFt   = 6.0
)

// Rates (common practice, figures from memory): set up and clear 0.1 h;
// hand auger 0.15 h per ft including a bag sample every change of soil;
// backfill 0.1 h; DCP 0.1 h per ft of penetration including readings every
// few blows (8-kg hammer, 575-mm drop, ASTM D6951) and extraction 0.1 h.
const (
	setupHr       = 0.1
	augerHrPerFt  = 0.15
	backfillHr    = 0.1
	dcpHrPerFt    = 0.1
	dcpExtractHr  = 0.1
	walkFtPerHr   = 3000 // walking with the tools (common practice)
	maxSlopePct   = 40
	pickupMph     = 55 // pickup truck on the road (common practice)
	loadUnloadHr  = 0.25
	freeMileageMi = 50 // items.md: mob-mileage counts miles beyond 50 one way, round trip
)

type handCrew struct{}

func (handCrew) Describe(ctx context.Context) (sdk.RigInfo, error) {
	return sdk.RigInfo{
		Name:  "hand-crew",
		Title: "Hand crew: hand-auger borings and DCP probes (example external plugin)",
		Methods: []sdk.MethodLimit{
			{Method: sdk.Boring, MaxDepthFt: augerMaxFt},
			{Method: sdk.Probe, MaxDepthFt: dcpMaxFt},
		},
		Access: sdk.AccessLimits{
			Surfaces:    []sdk.Surface{sdk.Firm, sdk.Wet, sdk.Soft},
			MaxSlopePct: maxSlopePct, // on foot (common practice)
		},
		DayItems: []sdk.Quantity{{Item: "crew-day-hand", Unit: "day", Amount: 1, Note: "hand crew per diem"}},
		Basis:    "ASTM D6951 for the DCP; rates common practice or from memory",
	}, nil
}

func (handCrew) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	var out sdk.AssessResponse
	for _, s := range req.Sites {
		out.Answers = append(out.Answers, assess(s))
	}
	return out, ctx.Err()
}

func assess(s sdk.Site) sdk.Answer {
	var why []string
	limit := 0.0
	switch s.Method {
	case sdk.Boring:
		limit = augerMaxFt
	case sdk.Probe:
		limit = dcpMaxFt
	default:
		why = append(why, fmt.Sprintf("hand-crew does not perform %q (it performs boring by hand auger, probe by DCP)", s.Method))
	}
	if math.IsNaN(s.DepthFt) || s.DepthFt <= 0 {
		why = append(why, fmt.Sprintf("depth %v ft: a depth must be a positive number of feet", s.DepthFt))
	} else if limit > 0 && s.DepthFt > limit {
		why = append(why, fmt.Sprintf("depth %g ft is beyond the %g ft hand-crew reaches by %s", s.DepthFt, limit, s.Method))
	}
	if slope := math.Abs(s.SlopePct); slope > maxSlopePct {
		why = append(why, fmt.Sprintf("slope %g %% is steeper than the %d %% hand-crew works on", slope, maxSlopePct))
	}
	if s.RockFt > 0 && s.DepthFt > s.RockFt {
		why = append(why, fmt.Sprintf("rock at %g ft: refusal for hand tools", s.RockFt))
	}
	if len(why) > 0 {
		return sdk.Answer{ID: s.ID, Reason: strings.Join(why, "; ")}
	}
	var h sdk.Hours
	var qs []sdk.Quantity
	h.Setup = setupHr
	if s.Method == sdk.Boring {
		h.Advance = augerHrPerFt * s.DepthFt
		h.Grouting = backfillHr
		qs = append(qs, sdk.Quantity{Item: "hand-auger", Unit: "ft", Amount: s.DepthFt, Note: "hand-auger boring"})
	} else {
		h.Advance = dcpHrPerFt * s.DepthFt
		h.Teardown = dcpExtractHr
		qs = append(qs, sdk.Quantity{Item: "dcp-probe", Unit: "each", Amount: 1, Note: "DCP probe (ASTM D6951)"})
	}
	qs = append(qs, sdk.Quantity{Item: "field-logging", Unit: "hr", Amount: h.Total(), Note: "field engineer for the hours on the point"})
	return sdk.Answer{ID: s.ID, Feasible: true, Hours: h, Quantities: qs}
}

func (handCrew) Mobilize(ctx context.Context, req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	d := req.DistanceMi
	if math.IsNaN(d) || math.IsInf(d, 0) || d < 0 {
		return sdk.MobilizeResponse{}, fmt.Errorf("distance %v mi must be a finite number ≥ 0", d)
	}
	out := sdk.MobilizeResponse{
		Hours:      2 * (d/pickupMph + 2*loadUnloadHr),
		Quantities: []sdk.Quantity{{Item: "mob-hand-crew", Unit: "each", Amount: 1, Note: "hand crew and pickup truck"}},
	}
	if extra := d - freeMileageMi; extra > 0 {
		out.Quantities = append(out.Quantities, sdk.Quantity{Item: "mob-mileage", Unit: "mi", Amount: 2 * extra,
			Note: fmt.Sprintf("pickup truck: %g mi beyond the first %d, round trip", extra, freeMileageMi)})
	}
	return out, ctx.Err()
}

func (handCrew) Moves(ctx context.Context, req sdk.MovesRequest) (sdk.MovesResponse, error) {
	var out sdk.MovesResponse
	for i, l := range req.Legs {
		if math.IsNaN(l.DistanceFt) || math.IsInf(l.DistanceFt, 0) || l.DistanceFt < 0 {
			return sdk.MovesResponse{}, fmt.Errorf("leg %d: distance %v ft must be a finite number ≥ 0", i, l.DistanceFt)
		}
		// Slower on wet and soft ground and on slopes (modelling assumption:
		// ×1.25 wet, ×1.5 soft, and up to twice as long at the slope limit).
		f := 1.0
		switch l.Surface {
		case sdk.Wet:
			f = 1.25
		case sdk.Soft:
			f = 1.5
		}
		f *= 1 + math.Min(math.Abs(l.SlopePct), maxSlopePct)/maxSlopePct
		out.Hours = append(out.Hours, l.DistanceFt/walkFtPerHr*f)
	}
	return out, ctx.Err()
}
