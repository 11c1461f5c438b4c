package sdk

import "github.com/rigmix/rigmix/plugins/proto"

// Conversions between the plain sdk types and their protobuf mirrors. Empty
// slices become nil on both sides so that a value sent through the shims
// compares equal to the value a rig returned directly.

func quantitiesToProto(qs []Quantity) []*proto.Quantity {
	if len(qs) == 0 {
		return nil
	}
	out := make([]*proto.Quantity, len(qs))
	for i, q := range qs {
		out[i] = &proto.Quantity{Item: q.Item, Unit: q.Unit, Amount: q.Amount, Note: q.Note, SampleKind: string(q.SampleKind)}
	}
	return out
}

func quantitiesFromProto(qs []*proto.Quantity) []Quantity {
	if len(qs) == 0 {
		return nil
	}
	out := make([]Quantity, len(qs))
	for i, q := range qs {
		out[i] = Quantity{Item: q.GetItem(), Unit: q.GetUnit(), Amount: q.GetAmount(), Note: q.GetNote(), SampleKind: SampleKind(q.GetSampleKind())}
	}
	return out
}

func infoToProto(in RigInfo) *proto.RigInfo {
	out := &proto.RigInfo{
		Name:        in.Name,
		Title:       in.Title,
		DayItems:    quantitiesToProto(in.DayItems),
		StandbyItem: in.StandbyItem,
		Basis:       in.Basis,
		Access: &proto.AccessLimits{
			MaxSlopePct:   in.Access.MaxSlopePct,
			MinOverheadFt: in.Access.MinOverheadFt,
		},
	}
	for _, m := range in.Methods {
		out.Methods = append(out.Methods, &proto.MethodLimit{Method: string(m.Method), MaxDepthFt: m.MaxDepthFt})
	}
	for _, s := range in.Access.Surfaces {
		out.Access.Surfaces = append(out.Access.Surfaces, string(s))
	}
	return out
}

func infoFromProto(in *proto.RigInfo) RigInfo {
	out := RigInfo{
		Name:        in.GetName(),
		Title:       in.GetTitle(),
		DayItems:    quantitiesFromProto(in.GetDayItems()),
		StandbyItem: in.GetStandbyItem(),
		Basis:       in.GetBasis(),
		Access: AccessLimits{
			MaxSlopePct:   in.GetAccess().GetMaxSlopePct(),
			MinOverheadFt: in.GetAccess().GetMinOverheadFt(),
		},
	}
	for _, m := range in.GetMethods() {
		out.Methods = append(out.Methods, MethodLimit{Method: Method(m.GetMethod()), MaxDepthFt: m.GetMaxDepthFt()})
	}
	for _, s := range in.GetAccess().GetSurfaces() {
		out.Access.Surfaces = append(out.Access.Surfaces, Surface(s))
	}
	return out
}

func siteToProto(s Site) *proto.Site {
	var sched []*proto.SampleBand
	for _, b := range s.SampleSchedule {
		sched = append(sched, &proto.SampleBand{ToFt: b.ToFt, EveryFt: b.EveryFt})
	}
	return &proto.Site{
		SampleSchedule:   sched,
		Id:               s.ID,
		Method:           string(s.Method),
		DepthFt:          s.DepthFt,
		SampleIntervalFt: s.SampleIntervalFt,
		Surface:          string(s.Surface),
		SlopePct:         s.SlopePct,
		OverheadFt:       s.OverheadFt,
		GroundwaterFt:    s.GroundwaterFt,
		RockFt:           s.RockFt,
		Environmental:    s.Environmental,
	}
}

func siteFromProto(s *proto.Site) Site {
	var sched []SampleBand
	for _, b := range s.GetSampleSchedule() {
		sched = append(sched, SampleBand{ToFt: b.GetToFt(), EveryFt: b.GetEveryFt()})
	}
	return Site{
		SampleSchedule:   sched,
		ID:               s.GetId(),
		Method:           Method(s.GetMethod()),
		DepthFt:          s.GetDepthFt(),
		SampleIntervalFt: s.GetSampleIntervalFt(),
		Surface:          Surface(s.GetSurface()),
		SlopePct:         s.GetSlopePct(),
		OverheadFt:       s.GetOverheadFt(),
		GroundwaterFt:    s.GetGroundwaterFt(),
		RockFt:           s.GetRockFt(),
		Environmental:    s.GetEnvironmental(),
	}
}

func answerToProto(a Answer) *proto.Answer {
	return &proto.Answer{
		Id:       a.ID,
		Feasible: a.Feasible,
		Reason:   a.Reason,
		Hours: &proto.Hours{
			Setup:    a.Hours.Setup,
			Advance:  a.Hours.Advance,
			Sampling: a.Hours.Sampling,
			Grouting: a.Hours.Grouting,
			Teardown: a.Hours.Teardown,
		},
		Quantities: quantitiesToProto(a.Quantities),
	}
}

func answerFromProto(a *proto.Answer) Answer {
	h := a.GetHours()
	return Answer{
		ID:       a.GetId(),
		Feasible: a.GetFeasible(),
		Reason:   a.GetReason(),
		Hours: Hours{
			Setup:    h.GetSetup(),
			Advance:  h.GetAdvance(),
			Sampling: h.GetSampling(),
			Grouting: h.GetGrouting(),
			Teardown: h.GetTeardown(),
		},
		Quantities: quantitiesFromProto(a.GetQuantities()),
	}
}

func legToProto(l MoveLeg) *proto.MoveLeg {
	return &proto.MoveLeg{DistanceFt: l.DistanceFt, Surface: string(l.Surface), SlopePct: l.SlopePct}
}

func legFromProto(l *proto.MoveLeg) MoveLeg {
	return MoveLeg{DistanceFt: l.GetDistanceFt(), Surface: Surface(l.GetSurface()), SlopePct: l.GetSlopePct()}
}
