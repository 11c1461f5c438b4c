package sdk_test

import (
	"context"
	"errors"
	"math"
	"reflect"
	"strings"
	"sync/atomic"
	"testing"
	"time"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// fakeRig answers with whatever the test puts in it, so the shims' checks
// and conversions can be tested apart from any real rig.
type fakeRig struct {
	info     sdk.RigInfo
	assess   func(sdk.AssessRequest) sdk.AssessResponse
	mobilize sdk.MobilizeResponse
	moves    func(sdk.MovesRequest) sdk.MovesResponse
	// sawDeadline records whether the context reaching the rig carried the
	// caller's deadline.
	sawDeadline atomic.Bool
	block       atomic.Bool
}

func (f *fakeRig) Describe(ctx context.Context) (sdk.RigInfo, error) { return f.info, nil }

func (f *fakeRig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	_, ok := ctx.Deadline()
	f.sawDeadline.Store(ok)
	if f.block.Load() {
		<-ctx.Done()
		return sdk.AssessResponse{}, ctx.Err()
	}
	return f.assess(req), nil
}

func (f *fakeRig) Mobilize(ctx context.Context, req sdk.MobilizeRequest) (sdk.MobilizeResponse, error) {
	if req.DistanceMi < 0 {
		return sdk.MobilizeResponse{}, errors.New("distance must be ≥ 0 mi")
	}
	return f.mobilize, nil
}

func (f *fakeRig) Moves(ctx context.Context, req sdk.MovesRequest) (sdk.MovesResponse, error) {
	return f.moves(req), nil
}

var fakeInfo = sdk.RigInfo{
	Name:  "fake-rig",
	Title: "A rig for tests",
	Methods: []sdk.MethodLimit{
		{Method: sdk.Boring, MaxDepthFt: 100},
		{Method: sdk.CPT, MaxDepthFt: 80},
	},
	Access:      sdk.AccessLimits{Surfaces: []sdk.Surface{sdk.Firm, sdk.Wet}, MaxSlopePct: 12, MinOverheadFt: 20},
	DayItems:    []sdk.Quantity{{Item: "crew-day-drill", Unit: "day", Amount: 1, Note: "per diem"}},
	StandbyItem: "standby-drill",
	Basis:       "test values",
}

func echoAnswers(req sdk.AssessRequest) sdk.AssessResponse {
	var out sdk.AssessResponse
	for _, s := range req.Sites {
		out.Answers = append(out.Answers, sdk.Answer{
			ID: s.ID, Feasible: true,
			Hours: sdk.Hours{Setup: 0.5, Advance: s.DepthFt / 30, Sampling: 1, Grouting: 0.25, Teardown: 0.25},
			Quantities: []sdk.Quantity{{Item: "drill-0-50", Unit: "ft", Amount: s.DepthFt},
				{Item: "sonic-core", Unit: "each", Amount: 4, SampleKind: sdk.SampleCore}},
		})
	}
	return out
}

func TestRoundTripThroughShims(t *testing.T) {
	f := &fakeRig{info: fakeInfo, assess: echoAnswers,
		mobilize: sdk.MobilizeResponse{Hours: 3, Quantities: []sdk.Quantity{{Item: "mob-tire-rig", Unit: "each", Amount: 1}}},
		moves: func(req sdk.MovesRequest) sdk.MovesResponse {
			var out sdk.MovesResponse
			for _, l := range req.Legs {
				out.Hours = append(out.Hours, l.DistanceFt/1000)
			}
			return out
		},
	}
	r := sdk.TestRig(t, f)
	ctx := context.Background()

	info, err := r.Describe(ctx)
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(info, fakeInfo) {
		t.Errorf("Describe through gRPC:\n got %+v\nwant %+v", info, fakeInfo)
	}

	req := sdk.AssessRequest{Sites: []sdk.Site{
		{ID: "B-1", Method: sdk.Boring, DepthFt: 60, SampleIntervalFt: 2.5, Surface: sdk.Wet, SlopePct: 4,
			OverheadFt: 30, GroundwaterFt: 12, RockFt: 45, Environmental: true},
		{ID: "C-1", Method: sdk.CPT, DepthFt: 40},
	}}
	got, err := r.Assess(ctx, req)
	if err != nil {
		t.Fatal(err)
	}
	if want := echoAnswers(req); !reflect.DeepEqual(got, want) {
		t.Errorf("Assess through gRPC:\n got %+v\nwant %+v", got, want)
	}

	mob, err := r.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: 30})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(mob, f.mobilize) {
		t.Errorf("Mobilize: got %+v want %+v", mob, f.mobilize)
	}
	mv, err := r.Moves(ctx, sdk.MovesRequest{Legs: []sdk.MoveLeg{{DistanceFt: 500, Surface: sdk.Firm}, {DistanceFt: 0}}})
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(mv.Hours, []float64{0.5, 0}) {
		t.Errorf("Moves: got %v", mv.Hours)
	}

	// An error from the rig comes back as the rig's own message, naming it.
	_, err = r.Mobilize(ctx, sdk.MobilizeRequest{DistanceMi: -1})
	if err == nil || !strings.Contains(err.Error(), `rig "fake-rig"`) || !strings.Contains(err.Error(), "distance must be ≥ 0 mi") {
		t.Errorf("Mobilize(-1) error = %v; want the rig's message naming fake-rig", err)
	}
}

func TestClientChecksAnswers(t *testing.T) {
	sites := sdk.AssessRequest{Sites: []sdk.Site{{ID: "a", Method: sdk.Boring, DepthFt: 10}, {ID: "b", Method: sdk.Boring, DepthFt: 20}}}
	tests := []struct {
		name   string
		assess func(sdk.AssessRequest) sdk.AssessResponse
		want   string
	}{
		{"too few answers", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers = r.Answers[:1]
			return r
		}, "1 answers for 2 sites"},
		{"IDs out of order", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[0], r.Answers[1] = r.Answers[1], r.Answers[0]
			return r
		}, `answer 0 has ID "b", want "a"`},
		{"NaN hours", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[1].Hours.Advance = math.NaN()
			return r
		}, `site "b": advance hours NaN`},
		{"infinite hours", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[0].Hours.Setup = math.Inf(1)
			return r
		}, `site "a": setup hours +Inf`},
		{"negative amount", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[1].Quantities[0].Amount = -3
			return r
		}, `site "b": quantity drill-0-50: amount -3`},
		{"unknown sample kind", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[0].Quantities[1].SampleKind = "shelby"
			return r
		}, `site "a": quantity sonic-core: unknown sample kind "shelby" (want one of split-barrel, tube, core, bag, bulk)`},
		{"samples not counted each", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[1].Quantities[1].Unit = "ft"
			return r
		}, `site "b": quantity sonic-core: samples of kind core are counted in unit "each", not "ft"`},
		{"infeasible without reason", func(req sdk.AssessRequest) sdk.AssessResponse {
			r := echoAnswers(req)
			r.Answers[0].Feasible = false
			return r
		}, `site "a": infeasible answer gives no reason`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := sdk.TestRig(t, &fakeRig{info: fakeInfo, assess: tc.assess})
			if _, err := r.Describe(context.Background()); err != nil {
				t.Fatal(err)
			}
			_, err := r.Assess(context.Background(), sites)
			if err == nil {
				t.Fatalf("Assess accepted a bad answer; want error containing %q", tc.want)
			}
			if !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), `rig "fake-rig"`) {
				t.Errorf("error %q; want it to name the rig and contain %q", err, tc.want)
			}
		})
	}
}

func TestClientChecksMovesAndMobilize(t *testing.T) {
	f := &fakeRig{info: fakeInfo,
		mobilize: sdk.MobilizeResponse{Hours: math.NaN()},
		moves:    func(sdk.MovesRequest) sdk.MovesResponse { return sdk.MovesResponse{Hours: []float64{1}} },
	}
	r := sdk.TestRig(t, f)
	if _, err := r.Mobilize(context.Background(), sdk.MobilizeRequest{DistanceMi: 1}); err == nil || !strings.Contains(err.Error(), "hours NaN") {
		t.Errorf("Mobilize NaN hours: error %v", err)
	}
	_, err := r.Moves(context.Background(), sdk.MovesRequest{Legs: make([]sdk.MoveLeg, 3)})
	if err == nil || !strings.Contains(err.Error(), "1 answers for 3 legs") {
		t.Errorf("Moves with 1 answer for 3 legs: error %v", err)
	}
}

// Samples are counted only in Assess answers: a sample kind on a day item
// or a mobilization quantity is refused.
func TestSampleKindOnlyInAssess(t *testing.T) {
	info := fakeInfo
	info.DayItems = []sdk.Quantity{{Item: "crew-day-drill", Unit: "each", Amount: 1, SampleKind: sdk.SampleBag}}
	if err := sdk.CheckInfo(info); err == nil || !strings.Contains(err.Error(), "samples are counted only in Assess answers") {
		t.Errorf("CheckInfo with a sampled day item: %v", err)
	}
	mob := sdk.MobilizeResponse{Hours: 1, Quantities: []sdk.Quantity{{Item: "mob-x", Unit: "each", Amount: 1, SampleKind: sdk.SampleTube}}}
	if err := sdk.CheckMobilize(mob); err == nil || !strings.Contains(err.Error(), "samples are counted only in Assess answers") {
		t.Errorf("CheckMobilize with a sampled quantity: %v", err)
	}
}

// SampleKindOf reads a quantity's kind, and the two standard sample items
// when it gives none.
func TestSampleKindOf(t *testing.T) {
	for _, tc := range []struct {
		q    sdk.Quantity
		want sdk.SampleKind
	}{
		{sdk.Quantity{Item: "spt-sample"}, sdk.SampleSplitBarrel},
		{sdk.Quantity{Item: "tube-sample"}, sdk.SampleTube},
		{sdk.Quantity{Item: "sonic-core", SampleKind: sdk.SampleCore}, sdk.SampleCore},
		{sdk.Quantity{Item: "spt-sample", SampleKind: sdk.SampleCore}, sdk.SampleCore},
		{sdk.Quantity{Item: "core-sample"}, ""},
		{sdk.Quantity{Item: "drill-0-50"}, ""},
	} {
		if got := sdk.SampleKindOf(tc.q); got != tc.want {
			t.Errorf("SampleKindOf(%+v) = %q, want %q", tc.q, got, tc.want)
		}
	}
}

// The method and surface sets are closed: the plan's rules count methods
// and the schedule reads surfaces, so an unknown one is refused.
func TestDescribeRefusesUnknownMethodOrSurface(t *testing.T) {
	info := fakeInfo
	info.Methods = []sdk.MethodLimit{{Method: "sonic", MaxDepthFt: 200}}
	if _, err := sdk.TestRig(t, &fakeRig{info: info}).Describe(context.Background()); err == nil ||
		!strings.Contains(err.Error(), `rig "fake-rig": unknown method "sonic" (want boring, cpt, test_pit or probe`) {
		t.Errorf("unknown method: error %v", err)
	}
	info = fakeInfo
	info.Access.Surfaces = []sdk.Surface{sdk.Firm, "ice"}
	if _, err := sdk.TestRig(t, &fakeRig{info: info}).Describe(context.Background()); err == nil ||
		!strings.Contains(err.Error(), `rig "fake-rig": unknown surface "ice" (want firm, wet or soft)`) {
		t.Errorf("unknown surface: error %v", err)
	}
}

func TestDescribeChecksName(t *testing.T) {
	for _, name := range []string{"", "Track Drill", "-x"} {
		info := fakeInfo
		info.Name = name
		r := sdk.TestRig(t, &fakeRig{info: info})
		if _, err := r.Describe(context.Background()); err == nil {
			t.Errorf("Describe accepted rig name %q", name)
		}
	}
}

// The caller's context reaches the rig: its deadline arrives with the call,
// and when it passes the client gets context.DeadlineExceeded back.
func TestContextPassesThrough(t *testing.T) {
	f := &fakeRig{info: fakeInfo, assess: echoAnswers}
	r := sdk.TestRig(t, f)
	ctx, cancel := context.WithTimeout(context.Background(), 5*time.Second)
	defer cancel()
	if _, err := r.Assess(ctx, sdk.AssessRequest{Sites: []sdk.Site{{ID: "a"}}}); err != nil {
		t.Fatal(err)
	}
	if !f.sawDeadline.Load() {
		t.Error("the rig did not see the caller's deadline")
	}

	f.block.Store(true)
	ctx2, cancel2 := context.WithTimeout(context.Background(), 100*time.Millisecond)
	defer cancel2()
	_, err := r.Assess(ctx2, sdk.AssessRequest{Sites: []sdk.Site{{ID: "a"}}})
	if !errors.Is(err, context.DeadlineExceeded) {
		t.Errorf("blocked Assess: error %v; want context.DeadlineExceeded", err)
	}
}

// Feasible answers that contradict the rig's description are refused by
// the shim once the rig has described itself; infeasible ones pass.
func TestClientChecksAnswersAgainstDescribe(t *testing.T) {
	cases := []struct {
		site sdk.Site
		want string
	}{
		{sdk.Site{ID: "p", Method: sdk.Probe, DepthFt: 5}, `site "p": answers feasible for method "probe", which its description does not list (it lists boring, cpt)`},
		{sdk.Site{ID: "deep", Method: sdk.CPT, DepthFt: 81}, `site "deep": answers feasible for cpt to 81 ft, beyond the 80 ft`},
		{sdk.Site{ID: "s", Method: sdk.Boring, DepthFt: 20, Surface: sdk.Soft}, `site "s": answers feasible on soft ground, which its description does not list (it lists firm, wet)`},
		{sdk.Site{ID: "odd", Method: sdk.Boring, DepthFt: 20, Surface: "ice"}, `site "odd": answers feasible on ice ground`},
		{sdk.Site{ID: "steep", Method: sdk.Boring, DepthFt: 20, SlopePct: -15}, `site "steep": answers feasible on a 15 % slope, steeper than the 12 %`},
		{sdk.Site{ID: "low", Method: sdk.Boring, DepthFt: 20, OverheadFt: 15}, `site "low": answers feasible under 15 ft of overhead clearance, less than the 20 ft`},
	}
	for _, tc := range cases {
		req := sdk.AssessRequest{Sites: []sdk.Site{{ID: "ok", Method: sdk.Boring, DepthFt: 100, Surface: sdk.Wet, SlopePct: 12, OverheadFt: 20}, tc.site}}
		r := sdk.TestRig(t, &fakeRig{info: fakeInfo, assess: echoAnswers})
		// Before Describe the shim knows no description to hold answers to.
		if _, err := r.Assess(context.Background(), req); err != nil {
			t.Errorf("%s before describe: %v", tc.site.ID, err)
		}
		if _, err := r.Describe(context.Background()); err != nil {
			t.Fatal(err)
		}
		_, err := r.Assess(context.Background(), req)
		if err == nil || !strings.Contains(err.Error(), `rig "fake-rig": assess: `+tc.want) {
			t.Errorf("%s: error %v; want %q", tc.site.ID, err, tc.want)
		}
		infeasible := func(req sdk.AssessRequest) sdk.AssessResponse {
			out := echoAnswers(req)
			out.Answers[1].Feasible, out.Answers[1].Reason = false, "cannot"
			return out
		}
		r = sdk.TestRig(t, &fakeRig{info: fakeInfo, assess: infeasible})
		if _, err := r.Describe(context.Background()); err != nil {
			t.Fatal(err)
		}
		if _, err := r.Assess(context.Background(), req); err != nil {
			t.Errorf("%s answered infeasible: %v", tc.site.ID, err)
		}
	}
}

func TestImplausible(t *testing.T) {
	for _, tc := range []struct {
		a    sdk.Answer
		want string
	}{
		{sdk.Answer{Feasible: true, Hours: sdk.Hours{Advance: 720}}, ""},
		{sdk.Answer{Feasible: true, Hours: sdk.Hours{Advance: 700, Setup: 21}}, "721 hours on one point, more than 720"},
		{sdk.Answer{Feasible: true, Quantities: []sdk.Quantity{{Item: "x", Unit: "each", Amount: 1}}}, ""},
		{sdk.Answer{Feasible: true}, "no hours and no quantities"},
		{sdk.Answer{Feasible: false, Reason: "no"}, ""},
	} {
		got := sdk.Implausible(tc.a)
		if (tc.want == "") != (got == "") || !strings.Contains(got, tc.want) {
			t.Errorf("Implausible(%+v) = %q, want %q", tc.a, got, tc.want)
		}
	}
}
