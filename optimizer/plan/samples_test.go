package plan

import (
	"context"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
)

// coreRig is a rig that reports its samples as lengths of soil core under
// its own item code (as a sonic rig would), not as spt-sample.
type coreRig struct {
	sdk.Rig
	kind sdk.SampleKind // the kind it tells; "" tells none
}

func (r coreRig) Assess(ctx context.Context, req sdk.AssessRequest) (sdk.AssessResponse, error) {
	resp, err := r.Rig.Assess(ctx, req)
	for i, a := range resp.Answers {
		qs := append([]sdk.Quantity(nil), a.Quantities...)
		for j, q := range qs {
			if q.Item == sdk.ItemSPTSample {
				qs[j] = sdk.Quantity{Item: "core-sample", Unit: "each", Amount: q.Amount, Note: "soil core", SampleKind: r.kind}
			}
		}
		resp.Answers[i].Quantities = qs
	}
	return resp, err
}

// labLines are the estimate's lab-test lines, item → quantity.
func labLines(p *Plan) map[string]float64 {
	out := map[string]float64{}
	for _, l := range p.Estimate {
		if strings.HasPrefix(l.Item, "lab-") {
			out[l.Item] = l.Quantity
		}
	}
	return out
}

// TestCoreSamplesGetLabLines plans the wetlot demo with its track drill
// reporting core samples under its own item: the lab program runs on them
// as on split-barrel samples (a soil core is disturbed by the advance and
// gets the index tests, common practice), so with the core item priced as
// the SPT sample the plan's lab lines are those of the plain drill. Told
// without a sample kind, the item gets no lab lines: the host reads only
// the kinds and the items it documents.
func TestCoreSamplesGetLabLines(t *testing.T) {
	base := demoInput(t, "wetlot")
	want, err := Run(context.Background(), base, Options{})
	if err != nil {
		t.Fatal(err)
	}
	wantLab := labLines(want)
	if len(wantLab) == 0 {
		t.Fatal("the wetlot plan has no lab lines to compare with")
	}
	// The rate book prices core-sample as spt-sample.
	rb := *base.RateBook
	rb.Items = append([]ratebooks.Item(nil), base.RateBook.Items...)
	for _, it := range base.RateBook.Items {
		if it.Code == sdk.ItemSPTSample {
			it.Code, it.Description = "core-sample", "Soil core sample"
			rb.Items = append(rb.Items, it)
		}
	}
	for _, kind := range []sdk.SampleKind{sdk.SampleCore, ""} {
		in := demoInput(t, "wetlot")
		in.RateBook = &rb
		in.Rigs["track-drill"] = coreRig{Rig: in.Rigs["track-drill"], kind: kind}
		p, err := Run(context.Background(), in, Options{})
		if err != nil {
			t.Fatal(err)
		}
		got := labLines(p)
		if kind == "" {
			if len(got) >= len(wantLab) && got[labMoisture] >= wantLab[labMoisture] {
				t.Errorf("core samples told without a kind still got the lab lines %v", got)
			}
			continue
		}
		if len(got) != len(wantLab) {
			t.Fatalf("core samples: lab lines %v, want %v", got, wantLab)
		}
		for item, n := range wantLab {
			if got[item] != n {
				t.Errorf("core samples: %s × %v, want %v (as for split-barrel samples)", item, got[item], n)
			}
		}
		if p.Total != want.Total {
			t.Errorf("core samples: total %v, want %v", p.Total, want.Total)
		}
	}
}

const labMoisture = "lab-moisture"
