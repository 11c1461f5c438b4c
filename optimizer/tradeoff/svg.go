package tradeoff

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// Charts are drawn in our own plain style: black on white, light grey grid,
// series told apart by marker shape and dash, not by colour, so they read
// in grey print. Every number is formatted with a fixed precision, so the
// same data give the same bytes.

const (
	chartW, chartH                     = 720, 440
	marginL, marginR, marginT, marginB = 90, 30, 50, 60
)

type xy struct{ x, y float64 }

type chartMark struct {
	at    xy
	shape string // "ring", "triangle", "diamond"
	label string
}

type chart struct {
	title, xLabel, yLabel string
	xMoney, yMoney        bool
	xInteger              bool // x is a count: whole-number ticks
	line                  []xy // the main series, joined
	hollow                []xy // other points, hollow circles
	marks                 []chartMark
	vlines                []float64 // dashed verticals at these x
}

func f1(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }

// niceTicks returns about n round tick values covering [lo, hi] (the
// 1-2-5 rule of axis labelling).
func niceTicks(lo, hi float64, n int, integer bool) []float64 {
	if hi <= lo {
		hi = lo + 1
	}
	raw := (hi - lo) / float64(n)
	if integer && raw < 1 {
		raw = 1
	}
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	step := mag
	for _, m := range []float64{1, 2, 5, 10} {
		if m*mag >= raw {
			step = m * mag
			break
		}
	}
	var out []float64
	for v := math.Floor(lo/step) * step; v <= hi+step*1e-9; v += step {
		if v >= lo-step*1e-9 {
			out = append(out, math.Round(v/step)*step)
		}
	}
	return out
}

func (c *chart) write(w io.Writer) error {
	all := append(append([]xy(nil), c.line...), c.hollow...)
	for _, m := range c.marks {
		all = append(all, m.at)
	}
	if len(all) == 0 {
		all = []xy{{0, 0}, {1, 1}}
	}
	x0, x1, y0, y1 := all[0].x, all[0].x, all[0].y, all[0].y
	for _, p := range all {
		x0, x1 = math.Min(x0, p.x), math.Max(x1, p.x)
		y0, y1 = math.Min(y0, p.y), math.Max(y1, p.y)
	}
	for _, v := range c.vlines {
		x0, x1 = math.Min(x0, v), math.Max(x1, v)
	}
	// Pad the ranges by a tenth so markers stay inside the frame.
	padX, padY := 0.1*(x1-x0), 0.1*(y1-y0)
	if padX == 0 {
		padX = math.Max(1, 0.1*math.Abs(x0))
	}
	if padY == 0 {
		padY = math.Max(1, 0.1*math.Abs(y0))
	}
	x0, x1, y0, y1 = x0-padX, x1+padX, y0-padY, y1+padY
	pw, ph := float64(chartW-marginL-marginR), float64(chartH-marginT-marginB)
	sx := func(v float64) float64 { return float64(marginL) + (v-x0)/(x1-x0)*pw }
	sy := func(v float64) float64 { return float64(marginT) + (1-(v-y0)/(y1-y0))*ph }
	label := func(v float64, isMoney bool) string {
		if isMoney {
			return money(v)
		}
		if v == math.Trunc(v) {
			return strconv.FormatFloat(v, 'f', 0, 64)
		}
		return f1(v)
	}

	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%d" height="%d" viewBox="0 0 %d %d" font-family="sans-serif" font-size="12">`+"\n", chartW, chartH, chartW, chartH)
	fmt.Fprintf(&b, `<rect x="0" y="0" width="%d" height="%d" fill="#ffffff"/>`+"\n", chartW, chartH)
	fmt.Fprintf(&b, `<text x="%d" y="24" font-size="15" font-weight="bold">%s</text>`+"\n", marginL, esc(c.title))
	// Grid and ticks.
	for _, t := range niceTicks(x0, x1, 6, c.xInteger) {
		x := sx(t)
		fmt.Fprintf(&b, `<line x1="%s" y1="%d" x2="%s" y2="%d" stroke="#d0d0d0" stroke-width="1"/>`+"\n", f1(x), marginT, f1(x), chartH-marginB)
		fmt.Fprintf(&b, `<text x="%s" y="%d" text-anchor="middle">%s</text>`+"\n", f1(x), chartH-marginB+18, esc(label(t, c.xMoney)))
	}
	for _, t := range niceTicks(y0, y1, 6, false) {
		y := sy(t)
		fmt.Fprintf(&b, `<line x1="%d" y1="%s" x2="%d" y2="%s" stroke="#d0d0d0" stroke-width="1"/>`+"\n", marginL, f1(y), chartW-marginR, f1(y))
		fmt.Fprintf(&b, `<text x="%d" y="%s" text-anchor="end">%s</text>`+"\n", marginL-8, f1(y+4), esc(label(t, c.yMoney)))
	}
	fmt.Fprintf(&b, `<rect x="%d" y="%d" width="%s" height="%s" fill="none" stroke="#000000" stroke-width="1"/>`+"\n", marginL, marginT, f1(pw), f1(ph))
	fmt.Fprintf(&b, `<text x="%s" y="%d" text-anchor="middle">%s</text>`+"\n", f1(float64(marginL)+pw/2), chartH-16, esc(c.xLabel))
	fmt.Fprintf(&b, `<text x="18" y="%s" text-anchor="middle" transform="rotate(-90 18 %s)">%s</text>`+"\n", f1(float64(marginT)+ph/2), f1(float64(marginT)+ph/2), esc(c.yLabel))
	for _, v := range c.vlines {
		fmt.Fprintf(&b, `<line x1="%s" y1="%d" x2="%s" y2="%d" stroke="#000000" stroke-width="1" stroke-dasharray="6 4"/>`+"\n", f1(sx(v)), marginT, f1(sx(v)), chartH-marginB)
	}
	if len(c.line) > 1 {
		var pts []string
		for _, p := range c.line {
			pts = append(pts, f1(sx(p.x))+","+f1(sy(p.y)))
		}
		fmt.Fprintf(&b, `<polyline points="%s" fill="none" stroke="#000000" stroke-width="2"/>`+"\n", strings.Join(pts, " "))
	}
	for _, p := range c.line {
		fmt.Fprintf(&b, `<circle cx="%s" cy="%s" r="4" fill="#000000"/>`+"\n", f1(sx(p.x)), f1(sy(p.y)))
	}
	for _, p := range c.hollow {
		fmt.Fprintf(&b, `<circle cx="%s" cy="%s" r="4" fill="#ffffff" stroke="#000000" stroke-width="1"/>`+"\n", f1(sx(p.x)), f1(sy(p.y)))
	}
	// Marks at the same spot share one label.
	var marks []chartMark
	for _, m := range c.marks {
		merged := false
		for k := range marks {
			if marks[k].at == m.at {
				marks[k].label += ", " + m.label
				if marks[k].shape == "" {
					marks[k].shape = m.shape
				}
				merged = true
				break
			}
		}
		if !merged {
			marks = append(marks, m)
		}
	}
	for _, m := range marks {
		x, y := sx(m.at.x), sy(m.at.y)
		switch m.shape {
		case "ring":
			fmt.Fprintf(&b, `<circle cx="%s" cy="%s" r="9" fill="none" stroke="#000000" stroke-width="2"/>`+"\n", f1(x), f1(y))
		case "triangle":
			fmt.Fprintf(&b, `<polygon points="%s,%s %s,%s %s,%s" fill="none" stroke="#000000" stroke-width="2"/>`+"\n", f1(x), f1(y-11), f1(x-10), f1(y+7), f1(x+10), f1(y+7))
		case "diamond":
			fmt.Fprintf(&b, `<polygon points="%s,%s %s,%s %s,%s %s,%s" fill="none" stroke="#000000" stroke-width="2"/>`+"\n", f1(x), f1(y-10), f1(x+10), f1(y), f1(x), f1(y+10), f1(x-10), f1(y))
		}
		anchor, dx := "start", 13.0
		if x > float64(chartW-marginR)-120 {
			anchor, dx = "end", -13
		}
		fmt.Fprintf(&b, `<text x="%s" y="%s" text-anchor="%s">%s</text>`+"\n", f1(x+dx), f1(y-10), anchor, esc(m.label))
	}
	b.WriteString("</svg>\n")
	_, err := io.WriteString(w, b.String())
	return err
}

func esc(s string) string {
	return strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;", `"`, "&quot;").Replace(s)
}

// WriteFrontierSVG draws the cost–days frontier: field days across, total
// cost up; frontier plans joined and filled, dominated plans of the sweep
// hollow, the balanced pick ringed.
func WriteFrontierSVG(w io.Writer, f *Frontier) error {
	cur := f.Currency
	if cur == "" {
		cur = "currency"
	}
	c := &chart{
		title:  "Cost and field days: least cost for each day limit",
		xLabel: "field days (rigs in parallel)", yLabel: "priced cost (" + cur + ")",
		yMoney: true, xInteger: true,
	}
	on := map[int]bool{}
	for _, p := range f.Points {
		c.line = append(c.line, xy{float64(p.FieldDays), p.PricedCost})
		on[p.MaxDays] = true
	}
	for _, p := range f.Swept {
		if p.Feasible && !on[p.MaxDays] {
			c.hollow = append(c.hollow, xy{float64(p.FieldDays), p.PricedCost})
		}
	}
	if n := len(f.Points); n > 0 {
		first, last, bal := f.Points[0], f.Points[n-1], f.Points[f.Balanced]
		c.marks = append(c.marks, chartMark{xy{float64(bal.FieldDays), bal.PricedCost}, "ring", "balanced"})
		if n > 1 {
			c.marks = append(c.marks, chartMark{xy{float64(first.FieldDays), first.PricedCost}, "", "fastest"})
		}
		c.marks = append(c.marks, chartMark{xy{float64(last.FieldDays), last.PricedCost}, "", "cheapest"})
	}
	return c.write(w)
}

// WriteBudgetSVG draws the budget–coverage curve: budget across, weighted
// area covered up; the budget at which every rule is met is a dashed line
// and a triangle, the knee a diamond.
func WriteBudgetSVG(w io.Writer, bc *BudgetCurve) error {
	cur := bc.Currency
	if cur == "" {
		cur = "currency"
	}
	c := &chart{
		title:  "Coverage a budget buys (maximal covering)",
		xLabel: "budget (" + cur + ")", yLabel: "area covered, weighted by zone priority (%)",
		xMoney: true,
	}
	for _, p := range bc.Points {
		if p.Feasible {
			c.line = append(c.line, xy{p.Budget, p.WeightedCoveredPct})
		}
	}
	if len(bc.Points) > 0 {
		full, kn := bc.Points[bc.Full], bc.Points[bc.Knee]
		c.vlines = append(c.vlines, full.Budget)
		c.marks = append(c.marks, chartMark{xy{full.Budget, full.WeightedCoveredPct}, "triangle", "every rule met"})
		if bc.Knee != bc.Full {
			c.marks = append(c.marks, chartMark{xy{kn.Budget, kn.WeightedCoveredPct}, "diamond", "knee"})
		}
	}
	return c.write(w)
}
