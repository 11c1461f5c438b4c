package plan

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
)

// oddRig is the built-in track drill with its description or its answers
// changed, to play a plugin whose answers do not fit.
type oddRig struct {
	sdk.Rig
	describe func(*sdk.RigInfo)
	answer   func(*sdk.Answer)
}

func (r oddRig) Describe(ctx context.Context) (sdk.RigInfo, error) {
	info, err := r.Rig.Describe(ctx)
	if r.describe != nil {
		info.Methods = append([]sdk.MethodLimit(nil), info.Methods...)
		info.Access.Surfaces = append([]sdk.Surface(nil), info.Access.Surfaces...)
		r.describe(&info)
	}
	return info, err
}

func (r oddRig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	resp, err := r.Rig.Assess(ctx, req)
	if r.answer != nil {
		for i := range resp.Answers {
			if resp.Answers[i].Feasible {
				r.answer(&resp.Answers[i])
			}
		}
	}
	return resp, err
}

// wetlotWith is the wetlot demo with its track drill replaced by odd,
// served in-process through the gRPC shims (sdk.TestRig) when shim is set,
// else handed to the plan directly.
func wetlotWith(t *testing.T, odd oddRig, shim bool) Input {
	t.Helper()
	in := demoInput(t, "wetlot")
	raw, err := builtin.New("track-drill")
	if err != nil {
		t.Fatal(err)
	}
	odd.Rig = raw
	if shim {
		in.Rigs["track-drill"] = sdk.TestRig(t, odd)
	} else {
		in.Rigs["track-drill"] = odd
	}
	return in
}

// A rig whose answers contradict its own description is refused, naming
// the rig and the site: by the host-side shim for a plugin, and by the
// plan for a rig handed to it directly.
func TestAnswersAgainstDescribe(t *testing.T) {
	cases := []struct {
		name     string
		describe func(*sdk.RigInfo)
		want     string
	}{
		{"surface not described", func(info *sdk.RigInfo) {
			info.Access.Surfaces = []sdk.Surface{sdk.Firm, sdk.Wet}
		}, "on soft ground, which its description does not list (it lists firm, wet)"},
		{"depth beyond the described maximum", func(info *sdk.RigInfo) {
			for i := range info.Methods {
				info.Methods[i].MaxDepthFt = 12
			}
		}, "beyond the 12 ft its description gives as the deepest"},
	}
	for _, tc := range cases {
		for _, shim := range []bool{true, false} {
			in := wetlotWith(t, oddRig{describe: tc.describe}, shim)
			_, err := Run(context.Background(), in, Options{})
			if err != nil {
				t.Logf("%s (shim %v): %v", tc.name, shim, err)
			}
			if err == nil || !strings.Contains(err.Error(), `rig "track-drill": assess: site "`) || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("%s (through the shim: %v): error %v; want it to name the rig and say %q", tc.name, shim, err, tc.want)
			}
		}
	}
}

// Answers that pass the contract but cannot be right are planned with a
// warning naming the rig: a thousand hours on a point, and a feasible point with
// no hours and no quantities.
func TestImplausibleAnswersWarn(t *testing.T) {
	plain, err := Run(context.Background(), demoInput(t, "wetlot"), Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range plain.Warnings {
		if strings.Contains(w, "check the rig plugin") {
			t.Fatalf("the built-in rigs get a rig warning: %s", w)
		}
	}
	cases := []struct {
		name   string
		answer func(*sdk.Answer)
		want   string
	}{
		{"a thousand hours", func(a *sdk.Answer) { a.Hours.Advance = 1000 }, "hours on one point, more than 720"},
		{"nothing at all", func(a *sdk.Answer) { a.Hours = sdk.Hours{}; a.Quantities = nil }, "a feasible answer with no hours and no quantities"},
	}
	for _, tc := range cases {
		p, err := Run(context.Background(), wetlotWith(t, oddRig{answer: tc.answer}, true), Options{})
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		found := false
		for _, w := range p.Warnings {
			if strings.Contains(w, `rig "track-drill" at `) && strings.Contains(w, tc.want) {
				found = true
				t.Logf("%s: %s", tc.name, w)
			}
		}
		if !found {
			t.Errorf("%s: warnings %q; want one naming track-drill and saying %q", tc.name, p.Warnings, tc.want)
		}
	}
}
