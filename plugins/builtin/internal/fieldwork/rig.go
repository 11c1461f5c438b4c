package fieldwork

import (
	"context"
	"fmt"
	"slices"
	"strings"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// Point is what a rig works out for one feasible site: the hours and the
// quantities of work. Rig adds field-logging itself.
type Point func(s sdk.Site) (sdk.Hours, []sdk.Quantity)

// Rig assembles a built-in rig from its description, its own feasibility
// limits beyond the shared ones, its point arithmetic, travel and
// mobilization.
type Rig struct {
	Info   sdk.RigInfo
	Limits func(s sdk.Site) []string // rig-specific reasons a site is barred; may be nil
	Point  Point
	Travel Travel
	Mob    Mobilization
}

var _ sdk.Rig = (*Rig)(nil)

// Describe returns a copy of the rig's description.
func (r *Rig) Describe(ctx context.Context) (sdk.RigInfo, error) {
	info := r.Info
	info.Methods = slices.Clone(info.Methods)
	info.Access.Surfaces = slices.Clone(info.Access.Surfaces)
	info.DayItems = slices.Clone(info.DayItems)
	return info, ctx.Err()
}

// Assess answers every site of the batch in order.
func (r *Rig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	if err := ctx.Err(); err != nil {
		return sdk.AssessResponse{}, err
	}
	out := sdk.AssessResponse{Answers: make([]sdk.Answer, 0, len(req.Sites))}
	for _, s := range req.Sites {
		out.Answers = append(out.Answers, r.answer(s))
	}
	if len(out.Answers) == 0 {
		out.Answers = nil
	}
	return out, nil
}

func (r *Rig) answer(s sdk.Site) sdk.Answer {
	reasons := Reasons(r.Info, s)
	if len(reasons) == 0 && r.Limits != nil {
		reasons = append(reasons, r.Limits(s)...)
	}
	if len(reasons) > 0 {
		return sdk.Answer{ID: s.ID, Reason: strings.Join(reasons, "; ")}
	}
	h, qs := r.Point(s)
	qs = append(qs, Qty(ItemFieldLogging, UnitHr, h.Total(), "field engineer or geologist for the hours on the point"))
	return sdk.Answer{ID: s.ID, Feasible: true, Hours: h, Quantities: qs}
}

// Mobilize answers mobilization and demobilization.
func (r *Rig) Mobilize(ctx context.Context, req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	if err := ctx.Err(); err != nil {
		return sdk.MobilizeResponse{}, err
	}
	resp, err := r.Mob.Answer(req)
	if err != nil {
		return resp, fmt.Errorf("%s: mobilize: %w", r.Info.Name, err)
	}
	return resp, nil
}

// Moves answers the hours for each leg.
func (r *Rig) Moves(ctx context.Context, req sdk.MovesRequest) (sdk.MovesResponse, error) {
	if err := ctx.Err(); err != nil {
		return sdk.MovesResponse{}, err
	}
	resp, err := r.Travel.Moves(req)
	if err != nil {
		return resp, fmt.Errorf("%s: moves: %w", r.Info.Name, err)
	}
	return resp, nil
}
