package cli

import (
	"context"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/report"
)

// addTradeoffs fills the report's alternatives, frontier and budget curve.
func addTradeoffs(ctx context.Context, hin *report.HTMLInput, pr *plan.Prepared, in plan.Input, popt plan.Options) error {
	return nil
}
