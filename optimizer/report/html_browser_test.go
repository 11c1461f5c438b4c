package report

import (
	"bytes"
	"context"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/rigmix/rigmix/optimizer/plan"
	"github.com/rigmix/rigmix/optimizer/schedule"
	"github.com/rigmix/rigmix/plugins/builtin"
	"github.com/rigmix/rigmix/plugins/sdk"
	"github.com/rigmix/rigmix/ratebooks"
	"github.com/rigmix/rigmix/scenarios"
)

// findChromium returns the path of Debian's chromium (or chromium-browser),
// or "" when neither is on PATH.
func findChromium() string {
	for _, name := range []string{"chromium", "chromium-browser"} {
		if p, err := exec.LookPath(name); err == nil {
			return p
		}
	}
	return ""
}

// runChromium runs headless Chromium on a file with the given action flags
// and returns what it wrote to stdout and stderr. Host names resolve to
// nothing, so even a page that tried could not reach a network.
func runChromium(t *testing.T, bin, page string, action ...string) (stdout, stderr []byte) {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), 90*time.Second)
	defer cancel()
	args := []string{"--headless", "--no-sandbox", "--disable-gpu", "--no-first-run",
		"--disable-background-networking", "--disable-component-update", "--disable-sync",
		"--host-resolver-rules=MAP * ~NOTFOUND",
		"--user-data-dir=" + t.TempDir(), "--enable-logging=stderr", "--v=0", "--virtual-time-budget=5000"}
	args = append(args, action...)
	args = append(args, "file://"+page)
	cmd := exec.CommandContext(ctx, bin, args...)
	var out, errb bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errb
	if err := cmd.Run(); err != nil {
		t.Fatalf("chromium %s: %v\n%s", strings.Join(action, " "), err, tail(errb.String(), 3000))
	}
	return out.Bytes(), errb.Bytes()
}

func tail(s string, n int) string {
	if len(s) > n {
		return "…" + s[len(s)-n:]
	}
	return s
}

// consoleLines are the lines of Chromium's log that carry a page's console
// output or an uncaught exception. The report has no script, so it should
// write none; the log's other lines (D-Bus, GPU) are about the browser.
func consoleLines(log []byte) []string {
	var out []string
	for _, l := range strings.Split(string(log), "\n") {
		if strings.Contains(l, ":CONSOLE") || strings.Contains(l, "Uncaught") {
			out = append(out, l)
		}
	}
	return out
}

// plannedDemo plans a demo scenario in-process with the built-in rigs
// served through the real gRPC shims, as optimizer/plan's tests do.
func plannedDemo(t *testing.T, name string) (*scenarios.Scenario, *plan.Plan) {
	t.Helper()
	sc, err := scenarios.LoadDemo(name, nil)
	if err != nil {
		t.Fatal(err)
	}
	rb, err := ratebooks.Open(sc.RateBook)
	if err != nil {
		t.Fatal(err)
	}
	rigs := map[string]sdk.Rig{}
	for _, n := range builtin.Names() {
		r, err := builtin.New(n)
		if err != nil {
			t.Fatal(err)
		}
		rigs[n] = sdk.TestRig(t, r)
	}
	p, err := plan.Run(context.Background(), plan.Input{Scenario: sc, RateBook: rb, Rigs: rigs}, plan.Options{})
	if err != nil {
		t.Fatal(err)
	}
	return sc, p
}

// demoSchedule schedules the plan's points. The travel speeds and the
// calendar are the test's own layout values, not check values.
func demoSchedule(t *testing.T, sc *scenarios.Scenario, p *plan.Plan) *schedule.Schedule {
	t.Helper()
	var jobs []schedule.Job
	for _, pt := range p.Points {
		jobs = append(jobs, schedule.Job{ID: pt.ID, Rig: pt.Rig, X: pt.XFt, Y: pt.YFt, Hours: pt.OnPointHours,
			Surface: pt.Surface, Method: pt.Method, DepthFt: pt.DepthFt, SampleIntervalFt: pt.SampleIntervalFt})
	}
	var specs []schedule.RigSpec
	for _, r := range p.Rigs {
		if r.Points == 0 {
			continue
		}
		specs = append(specs, schedule.RigSpec{Name: r.Name, SpeedFtPerHr: map[string]float64{"firm": 1500, "wet": 800, "soft": 600},
			WetAccess: true, MobHours: r.MobHours / 2, DemobHours: r.MobHours / 2})
	}
	s, err := schedule.Build(jobs, specs, schedule.Calendar{
		Start: time.Date(2026, time.March, 2, 0, 0, 0, 0, time.UTC), WorkStart: 7 * time.Hour, HoursPerDay: sc.HoursDay})
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// stand-in charts for the trade-off stage's frontier and budget curve: the
// report takes any SVG as plain data, and this test must not build on that
// stage's Go API, which is still moving.
func standInChart(title string) []byte {
	return []byte(fmt.Sprintf(`<svg xmlns="http://www.w3.org/2000/svg" width="640" height="120" viewBox="0 0 640 120" font-family="sans-serif" font-size="13"><rect x="0.5" y="0.5" width="639" height="119" fill="#ffffff" stroke="#777777" stroke-dasharray="4,3"/><text x="320" y="64" text-anchor="middle" fill="#555555">%s — stand-in: the trade-off stage draws this chart</text></svg>`, esc(title)))
}

// TestHTMLInBrowser opens the report of a planned demo in headless
// Chromium: the page must load, show the map, the estimate table and the
// charts, and write nothing to the console; a screenshot is kept under
// $RIGMIX_ARTIFACTS (or the test's temporary folder). A canary page that
// throws first proves this Chromium's log shows console errors at all, so
// the console check can fail.
func TestHTMLInBrowser(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: the browser test of the HTML report takes some 20 s")
	}
	bin := findChromium()
	if bin == "" {
		t.Skip("no chromium or chromium-browser on PATH: the browser test of the HTML report is skipped (Debian: apt-get install chromium; .ci/run installs it)")
	}
	dir := t.TempDir()

	canary := filepath.Join(dir, "canary.html")
	if err := os.WriteFile(canary, []byte(`<!DOCTYPE html><html><body><p>canary</p><script>throw new Error("canary-thrown")</script></body></html>`), 0o644); err != nil {
		t.Fatal(err)
	}
	if _, log := runChromium(t, bin, canary, "--dump-dom"); len(consoleLines(log)) == 0 || !strings.Contains(string(log), "canary-thrown") {
		t.Fatalf("this Chromium's log does not show a page's uncaught error, so the console check below could not fail:\n%s", tail(string(log), 2000))
	}

	const demo = "hillside"
	sc, p := plannedDemo(t, demo)
	s := demoSchedule(t, sc, p)
	var gantt, risk bytes.Buffer
	if err := schedule.WriteGanttSVG(&gantt, s); err != nil {
		t.Fatal(err)
	}
	var pointsCSV bytes.Buffer
	if err := PointsCSV(&pointsCSV, p); err != nil {
		t.Fatal(err)
	}
	alt, err := TableFromCSV("Points as the CSV writes them (stand-in for the alternatives table)", &pointsCSV, "")
	if err != nil {
		t.Fatal(err)
	}
	in := HTMLInput{Plan: p, Scenario: sc, Version: "test", RunDate: time.Now().UTC().Format("2006-01-02"),
		GanttSVG: gantt.Bytes(), Schedule: s, RiskText: risk.String(), Alternatives: alt,
		FrontierSVG: standInChart("cost–days frontier"), BudgetSVG: standInChart("budget–coverage curve")}
	page := filepath.Join(dir, "rigmix-report-"+demo+".html")
	var b bytes.Buffer
	if err := HTML(&b, in); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(page, b.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}

	dom, log := runChromium(t, bin, page, "--dump-dom")
	if cl := consoleLines(log); len(cl) > 0 {
		t.Errorf("the report wrote to the browser console:\n%s", strings.Join(cl, "\n"))
	}
	if !bytes.Contains(dom, []byte("</html>")) {
		t.Fatalf("no document came back from Chromium:\n%s", tail(string(dom), 500))
	}
	for _, want := range []string{`id="sitemap"`, `id="sitemap-points"`, `id="estimate-table"`, `id="estimate-total"`,
		`id="frontier-chart"`, `id="budget-chart"`, `id="gantt-chart"`, `id="rules-table"`, `id="cautions"`} {
		if !bytes.Contains(dom, []byte(want)) {
			t.Errorf("the loaded page has no %s", want)
		}
	}
	// The browser's DOM holds every estimate line and every point's marker.
	for _, l := range p.Estimate {
		if !bytes.Contains(dom, []byte(">"+esc(l.Item)+"<")) {
			t.Errorf("estimate line %s is not in the loaded page", l.Item)
		}
	}
	if n, want := bytes.Count(dom, []byte(`class="sitemap-id"`)), len(p.Points); n != want {
		t.Errorf("%d point labels in the loaded map, plan has %d points", n, want)
	}
	for _, pt := range p.Points {
		if !bytes.Contains(dom, []byte(`paint-order="stroke">`+esc(pt.ID)+"</text>")) {
			t.Errorf("point %s has no ID beside its marker in the loaded map", pt.ID)
		}
	}

	art := os.Getenv("RIGMIX_ARTIFACTS")
	if art == "" {
		art = t.TempDir()
	} else if err := os.MkdirAll(art, 0o755); err != nil {
		t.Fatal(err)
	}
	shot := filepath.Join(art, "rigmix-report-"+demo+".png")
	_, log = runChromium(t, bin, page, "--hide-scrollbars", "--window-size=1280,2000", "--screenshot="+shot)
	if cl := consoleLines(log); len(cl) > 0 {
		t.Errorf("the report wrote to the browser console:\n%s", strings.Join(cl, "\n"))
	}
	st, err := os.Stat(shot)
	if err != nil || st.Size() < 10_000 {
		t.Fatalf("no screenshot at %s (%v)", shot, err)
	}
	if os.Getenv("RIGMIX_ARTIFACTS") != "" {
		if err := os.WriteFile(filepath.Join(art, "rigmix-report-"+demo+".html"), b.Bytes(), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	t.Logf("screenshot of the %s report: %s (%d bytes)", demo, shot, st.Size())
}
