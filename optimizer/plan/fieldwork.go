package plan

import (
	"context"
	"fmt"
	"sort"

	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// speedLegFt is the length of the test leg each rig is asked to travel on
// each ground surface to learn its on-site speed.
const speedLegFt = 1000

// ScheduleInputs turns a plan into the jobs and rig descriptions the field
// scheduler needs. It asks each mobilized rig, in one batched call, how long
// a leg of known length takes on each ground surface, and prices standby
// from the rate book. A plan made for another scenario is an input error.
func ScheduleInputs(ctx context.Context, p *Plan, sc *scenarios.Scenario, rb *ratebooks.RateBook, rigs map[string]sdk.Rig) ([]schedule.Job, []schedule.RigSpec, error) {
	if p.Scenario.Name != sc.Name {
		return nil, nil, inputErrorf("the plan was made for scenario %q, not %q: plan the scenario again or give its own plan file", p.Scenario.Name, sc.Name)
	}
	zones := map[string]bool{}
	for _, z := range sc.Zones {
		zones[z.ID] = true
	}
	var jobs []schedule.Job
	used := map[string]bool{}
	for _, pt := range p.Points {
		if !zones[pt.Zone] {
			return nil, nil, inputErrorf("plan point %s is in zone %q, which scenario %q does not have: the plan file is from another version of the scenario", pt.ID, pt.Zone, sc.Name)
		}
		jobs = append(jobs, schedule.Job{
			ID: pt.ID, Rig: pt.Rig, X: pt.XFt, Y: pt.YFt, Hours: pt.OnPointHours,
			MoveHours: round(pt.Hours-pt.OnPointHours, hourPlaces),
			Surface:   pt.Surface, Method: pt.Method, DepthFt: pt.DepthFt,
			SampleIntervalFt: pt.SampleIntervalFt, Sampling: pt.Sampling, Lon: pt.Lon, Lat: pt.Lat,
		})
		used[pt.Rig] = true
	}
	names := make([]string, 0, len(used))
	for n := range used {
		names = append(names, n)
	}
	sort.Strings(names)
	mob := map[string]float64{}
	for _, r := range p.Rigs {
		mob[r.Name] = r.MobHours
	}
	surfaces := []sdk.Surface{sdk.Firm, sdk.Wet, sdk.Soft}
	var specs []schedule.RigSpec
	for _, n := range names {
		r, ok := rigs[BaseRig(n)]
		if !ok {
			return nil, nil, inputErrorf("the plan uses rig %q, which is not available now", n)
		}
		info, err := r.Describe(ctx)
		if err != nil {
			return nil, nil, err
		}
		legs := make([]sdk.MoveLeg, len(surfaces))
		for i, s := range surfaces {
			legs[i] = sdk.MoveLeg{DistanceFt: speedLegFt, Surface: s}
		}
		mv, err := r.Moves(ctx, sdk.MovesRequest{Legs: legs})
		if err != nil {
			return nil, nil, err
		}
		spec := schedule.RigSpec{Name: n, SpeedFtPerHr: map[string]float64{}, StandbyItem: info.StandbyItem,
			// The plan's mobilization hours are the round trip (sdk.MobilizeResponse).
			MobHours: mob[n] / 2, DemobHours: mob[n] / 2,
			// The moves as the plan priced them, so the schedule keeps the
			// field days the estimate charges (schedule.RigSpec.BidMoves).
			BidMoves: true}
		for i, s := range surfaces {
			if mv.Hours[i] > 0 {
				spec.SpeedFtPerHr[string(s)] = speedLegFt / mv.Hours[i]
			}
		}
		for _, s := range info.Access.Surfaces {
			spec.WetAccess = spec.WetAccess || s == sdk.Wet
		}
		if info.StandbyItem != "" {
			it, ok := rb.Price(info.StandbyItem)
			if !ok {
				return nil, nil, inputErrorf("%s: rate book %q has no price for standby item %q of rig %q", rb.Source, rb.Name, info.StandbyItem, n)
			}
			spec.StandbyRate = it.UnitPrice
		}
		specs = append(specs, spec)
	}
	if len(jobs) == 0 {
		return nil, nil, fmt.Errorf("plan: the plan has no points to schedule")
	}
	return jobs, specs, nil
}
