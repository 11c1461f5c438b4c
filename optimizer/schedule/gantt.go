package schedule

import (
	"bufio"
	"fmt"
	"html"
	"io"
	"strconv"
	"time"
)

// The Gantt chart's look. Each kind differs in lightness and in shape, not
// in hue alone, so a grey print keeps them apart: work is a dark solid bar,
// travel a light solid bar, mobilization and demobilization white with
// diagonal stripes, standby white with a cross-hatch and a dashed outline,
// the day's start-up allowance white with a solid outline.
const (
	ganttWorkFill   = "#1f5f5b"
	ganttTravelFill = "#d9c89e"
	ganttMobInk     = "#7a4e2d"
	ganttStandbyInk = "#b03a2e"
	ganttOffDayFill = "#ececec"
	ganttGridInk    = "#bdbdbd"
	ganttTextInk    = "#202020"

	ganttLeft     = 150.0 // room for rig names
	ganttTop      = 64.0  // room for the title and date rows
	ganttLaneH    = 40.0
	ganttBarH     = 22.0
	ganttLegendH  = 56.0
	ganttRightPad = 16.0
)

// ganttDayWidth narrows the day columns as the schedule grows so the chart
// stays a printable width.
func ganttDayWidth(days int) float64 {
	switch {
	case days <= 40:
		return 28
	case days <= 120:
		return 14
	default:
		return 7
	}
}

// WriteGanttSVG writes a self-contained SVG Gantt chart: one lane per rig,
// calendar days along the x axis (days off shaded), and within each day the
// working hours scaled to the column. The bytes depend only on the schedule.
func WriteGanttSVG(w io.Writer, s *Schedule) error {
	bw := bufio.NewWriter(w)
	n := civilDays(s.Start, s.Finish) + 1
	if len(s.Rigs) == 0 {
		n = 1
	}
	dw := ganttDayWidth(n)
	width := ganttLeft + float64(n)*dw + ganttRightPad
	items := []struct{ label, style string }{
		{"work on a point", `fill="` + ganttWorkFill + `"`},
		{"move between points", `fill="` + ganttTravelFill + `"`},
		{"start-up (safety meeting, rig check)", `fill="#ffffff" stroke="` + ganttWorkFill + `" stroke-width="0.8"`},
		{"mobilize / demobilize", `fill="url(#mob-stripes)" stroke="` + ganttMobInk + `" stroke-width="0.8"`},
		{"standby (wet ground)", `fill="url(#standby-hatch)" stroke="` + ganttStandbyInk + `" stroke-width="1" stroke-dasharray="3,2"`},
		{"day off", `fill="` + ganttOffDayFill + `" stroke="` + ganttGridInk + `" stroke-width="0.5"`},
	}
	legendW := 8.0
	for _, it := range items {
		legendW += legendStep(it.label)
	}
	width = max(width, legendW)
	lanesH := float64(max(len(s.Rigs), 1)) * ganttLaneH
	height := ganttTop + lanesH + ganttLegendH
	f := func(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }
	work := [7]bool{}
	for _, d := range s.WorkDays {
		work[d] = true
	}

	fmt.Fprintf(bw, `<svg xmlns="http://www.w3.org/2000/svg" width="%s" height="%s" viewBox="0 0 %s %s" font-family="sans-serif" font-size="11">`+"\n",
		f(width), f(height), f(width), f(height))
	bw.WriteString(`<defs>
<pattern id="mob-stripes" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="6" height="6" fill="#ffffff"/><line x1="0" y1="0" x2="0" y2="6" stroke="` + ganttMobInk + `" stroke-width="2.5"/></pattern>
<pattern id="standby-hatch" width="6" height="6" patternUnits="userSpaceOnUse"><rect width="6" height="6" fill="#ffffff"/><path d="M0,0 L6,6 M6,0 L0,6" stroke="` + ganttStandbyInk + `" stroke-width="1"/></pattern>
</defs>
`)
	fmt.Fprintf(bw, `<rect x="0" y="0" width="%s" height="%s" fill="#ffffff"/>`+"\n", f(width), f(height))
	fmt.Fprintf(bw, `<text x="8" y="16" font-size="13" font-weight="bold" fill="%s">Field schedule %s to %s, %d field days</text>`+"\n",
		ganttTextInk, s.Start.Format(dateLayout), s.Finish.Format(dateLayout), s.FieldDays)

	// Wet days any rig saw, marked over the lanes so a standby bar can be
	// read against its cause.
	wet := map[int]bool{}
	for _, r := range s.Rigs {
		for _, d := range r.Days {
			if d.Wet {
				wet[civilDays(s.Start, d.Date)] = true
			}
		}
	}

	// Day columns: days off shaded, month names where a month starts,
	// day numbers (only Mondays when columns are narrow).
	for i := 0; i < n; i++ {
		d := s.Start.AddDate(0, 0, i)
		x := ganttLeft + float64(i)*dw
		if !work[d.Weekday()] {
			fmt.Fprintf(bw, `<rect x="%s" y="%s" width="%s" height="%s" fill="%s"/>`+"\n", f(x), f(ganttTop), f(dw), f(lanesH), ganttOffDayFill)
		}
		fmt.Fprintf(bw, `<line x1="%s" y1="%s" x2="%s" y2="%s" stroke="%s" stroke-width="0.5"/>`+"\n", f(x), f(ganttTop-12), f(x), f(ganttTop+lanesH), ganttGridInk)
		if i == 0 || d.Day() == 1 {
			fmt.Fprintf(bw, `<text x="%s" y="36" fill="%s">%s</text>`+"\n", f(x+2), ganttTextInk, d.Format("Jan 2006"))
		}
		if wet[i] {
			fmt.Fprintf(bw, `<text x="%s" y="%s" text-anchor="middle" font-size="8" font-style="italic" fill="%s">wet</text>`+"\n", f(x+dw/2), f(ganttTop-17), ganttStandbyInk)
		}
		if dw >= 14 || d.Weekday() == 1 {
			fmt.Fprintf(bw, `<text x="%s" y="%s" text-anchor="middle" font-size="9" fill="%s">%d</text>`+"\n", f(x+dw/2), f(ganttTop-4), ganttTextInk, d.Day())
		}
	}
	fmt.Fprintf(bw, `<line x1="%s" y1="%s" x2="%s" y2="%s" stroke="%s" stroke-width="0.5"/>`+"\n",
		f(ganttLeft+float64(n)*dw), f(ganttTop-12), f(ganttLeft+float64(n)*dw), f(ganttTop+lanesH), ganttGridInk)

	for li, r := range s.Rigs {
		y := ganttTop + float64(li)*ganttLaneH
		fmt.Fprintf(bw, `<line x1="0" y1="%s" x2="%s" y2="%s" stroke="%s" stroke-width="0.5"/>`+"\n", f(y+ganttLaneH), f(width), f(y+ganttLaneH), ganttGridInk)
		fmt.Fprintf(bw, `<text x="8" y="%s" fill="%s">%s</text>`+"\n", f(y+ganttLaneH/2+4), ganttTextInk, html.EscapeString(r.Rig))
		by := y + (ganttLaneH-ganttBarH)/2
		fmt.Fprintf(bw, "<g id=\"lane-%d\">\n", li+1)
		for _, d := range r.Days {
			x0 := ganttLeft + float64(civilDays(s.Start, d.Date))*dw
			for _, e := range d.Entries {
				a := (wallHours(d.Date, e.Start) - s.WorkStart.Hours()) / s.HoursPerDay
				b := (wallHours(d.Date, e.End) - s.WorkStart.Hours()) / s.HoursPerDay
				x, wd := x0+a*dw, (b-a)*dw
				var style string
				switch e.Kind {
				case Work:
					style = `fill="` + ganttWorkFill + `" stroke="#ffffff" stroke-width="0.5"`
				case Travel:
					style = `fill="` + ganttTravelFill + `"`
				case StartUp:
					style = `fill="#ffffff" stroke="` + ganttWorkFill + `" stroke-width="0.8"`
				case Mobilize, Demobilize:
					style = `fill="url(#mob-stripes)" stroke="` + ganttMobInk + `" stroke-width="0.8"`
				case Standby:
					style = `fill="url(#standby-hatch)" stroke="` + ganttStandbyInk + `" stroke-width="1" stroke-dasharray="3,2"`
				}
				title := string(e.Kind)
				if e.JobID != "" {
					title += " " + e.JobID
				}
				fmt.Fprintf(bw, `<rect x="%s" y="%s" width="%s" height="%s" %s><title>%s %s–%s %s</title></rect>`+"\n",
					f(x), f(by), f(wd), f(ganttBarH), style, d.Date.Format(dateLayout), hhmm(e.Start), endClock(d.Date, e.End), html.EscapeString(title))
			}
		}
		bw.WriteString("</g>\n")
	}

	// Legend.
	ly := ganttTop + lanesH + 20
	lx := 8.0
	for _, it := range items {
		fmt.Fprintf(bw, `<rect x="%s" y="%s" width="18" height="12" %s/>`+"\n", f(lx), f(ly), it.style)
		fmt.Fprintf(bw, `<text x="%s" y="%s" fill="%s">%s</text>`+"\n", f(lx+24), f(ly+10), ganttTextInk, it.label)
		lx += legendStep(it.label)
	}
	fmt.Fprintf(bw, `<text x="8" y="%s" font-size="9" fill="%s">Each day column spans the working hours %s to %s.</text>`+"\n",
		f(ly+32), ganttTextInk, clock(s.WorkStart), clock(s.WorkStart+hoursDur(s.HoursPerDay)))
	bw.WriteString("</svg>\n")
	return bw.Flush()
}

// wallHours is the wall-clock time of t in hours after the midnight that
// starts day (24 or more on a later date), so days with a daylight-saving
// change draw like any other.
func wallHours(day, t time.Time) float64 {
	h, m, sec := t.Clock()
	return float64(civilDays(day, t)*24+h) + float64(m)/60 + float64(sec)/3600
}

// legendStep is the room one legend entry takes: swatch, gap, label at about
// 6.5 px a character in the 11 px font, and a gap.
func legendStep(label string) float64 { return 24 + 6.5*float64(len([]rune(label))) + 16 }
