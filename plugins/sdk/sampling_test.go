package sdk_test

import (
	"context"
	"reflect"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
)

// TestDefaultSampleSchedule: the common practice is continuous or every
// 2.5 ft to 10 ft, then every 5 ft (common practice; ASTM D1586 sets no
// interval), so a 30-ft boring is sampled at 2.5, 5, 7.5, 10, 15, 20, 25
// and 30 ft — 7.5 ft included.
func TestDefaultSampleSchedule(t *testing.T) {
	got := sdk.SampleDepths(30, sdk.DefaultSampleSchedule())
	want := []float64{2.5, 5, 7.5, 10, 15, 20, 25, 30}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("default schedule, 30 ft: %v, want %v (common practice)", got, want)
	}
	if got := sdk.ScheduleOf(sdk.Site{}); !reflect.DeepEqual(got, sdk.DefaultSampleSchedule()) {
		t.Errorf("a site with no interval or schedule gets %v", got)
	}
	if s := sdk.DescribeSchedule(sdk.DefaultSampleSchedule()); s != "every 2.5 ft to 10 ft, then every 5 ft" {
		t.Errorf("DescribeSchedule = %q", s)
	}
	// 1.5 m in feet, to four figures (1 ft = 0.3048 m).
	if s := sdk.DescribeSchedule([]sdk.SampleBand{{EveryFt: 1.5 / 0.3048}}); s != "every 4.921 ft" {
		t.Errorf("DescribeSchedule(1.5 m) = %q", s)
	}
}

func TestSampleDepthsSchedules(t *testing.T) {
	for _, c := range []struct {
		name  string
		depth float64
		sched []sdk.SampleBand
		want  []float64
	}{
		// An interval of 5 ft: 2.5, 5, then every 5 ft (the 2.5-ft sample is
		// common practice; every 5 ft from 5 ft is TxDOT LRFD Geotechnical
		// Manual, 2024, for embankments and cuts).
		{"interval 5", 22, sdk.IntervalSchedule(5), []float64{2.5, 5, 10, 15, 20}},
		{"interval 10", 31, sdk.IntervalSchedule(10), []float64{2.5, 5, 15, 25}},
		// Continuous 24-in barrels (ASTM D1586 halves 18–30 in): every 2 ft.
		{"continuous", 9, sdk.IntervalSchedule(sdk.ContinuousSampleIntervalFt), []float64{2, 4, 6, 8}},
		{"default, shallow", 6, sdk.DefaultSampleSchedule(), []float64{2.5, 5}},
		{"default, 10 ft", 10, sdk.DefaultSampleSchedule(), []float64{2.5, 5, 7.5, 10}},
		{"default, 12 ft", 12, sdk.DefaultSampleSchedule(), []float64{2.5, 5, 7.5, 10}},
		{"three bands", 40, []sdk.SampleBand{{ToFt: 6, EveryFt: 2}, {ToFt: 20, EveryFt: 3.5}, {EveryFt: 10}},
			[]float64{2, 4, 6, 9.5, 13, 16.5, 20, 30, 40}},
		{"last band bounded", 40, []sdk.SampleBand{{ToFt: 10, EveryFt: 5}}, []float64{5, 10}},
		{"nothing", 2, sdk.DefaultSampleSchedule(), nil},
	} {
		if got := sdk.SampleDepths(c.depth, c.sched); !reflect.DeepEqual(got, c.want) {
			t.Errorf("%s: %v, want %v", c.name, got, c.want)
		}
	}
}

func TestCheckSchedule(t *testing.T) {
	if err := sdk.CheckSchedule(sdk.DefaultSampleSchedule()); err != nil {
		t.Errorf("default: %v", err)
	}
	for name, bad := range map[string][]sdk.SampleBand{
		"zero interval":  {{ToFt: 10, EveryFt: 0}},
		"not deeper":     {{ToFt: 10, EveryFt: 2.5}, {ToFt: 8, EveryFt: 5}},
		"open in middle": {{EveryFt: 2.5}, {ToFt: 20, EveryFt: 5}},
	} {
		if err := sdk.CheckSchedule(bad); err == nil {
			t.Errorf("%s: accepted", name)
		}
	}
}

// TestScheduleThroughShims: a site's schedule reaches the rig through the
// gRPC shims unchanged.
func TestScheduleThroughShims(t *testing.T) {
	var seen []sdk.Site
	f := &fakeRig{info: fakeInfo, assess: func(req sdk.AssessRequest) sdk.AssessResponse {
		seen = append(seen, req.Sites...)
		return echoAnswers(req)
	}}
	r := sdk.TestRig(t, f)
	sched := []sdk.SampleBand{{ToFt: 10, EveryFt: 2.5}, {ToFt: 30, EveryFt: 5}, {EveryFt: 10}}
	req := sdk.AssessRequest{Sites: []sdk.Site{{ID: "B-1", Method: sdk.Boring, DepthFt: 60, SampleSchedule: sched}}}
	if _, err := r.Assess(context.Background(), req); err != nil {
		t.Fatal(err)
	}
	if len(seen) != 1 || !reflect.DeepEqual(seen[0].SampleSchedule, sched) {
		t.Errorf("the rig saw %+v, want schedule %v", seen, sched)
	}
}
