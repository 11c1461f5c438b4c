package report

import "html/template"

// htmlStyle is the report's only stylesheet. Fonts are the reader's own
// system fonts (nothing is fetched). On paper the first sheet holds the
// title, summary and cautions; the site map, the points with the estimate
// and rigs, the rules with the options ruled out, the alternatives, the
// schedule, the warnings with the inputs, and the point list each start a
// new sheet; rows and figures are not split, table headers repeat, and
// backgrounds print as shown; every mark that carries meaning also differs
// in text, border or pattern, so a grey print keeps it.
const htmlStyle = `
:root { --ink: #1d1d1d; --muted: #555; --rule: #c9c9c9; --accent: #1f3a5f; --warn: #8c1d0e; --band: #f4f4f1; }
* { box-sizing: border-box; -webkit-print-color-adjust: exact; print-color-adjust: exact; }
html { font-family: system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; font-size: 15px; color: var(--ink); background: #fff; }
body { margin: 0 auto; max-width: 1120px; padding: 24px 28px 48px; line-height: 1.45; }
h1 { font-size: 1.75rem; margin: 0 0 .4rem; color: var(--accent); }
h2 { font-size: 1.3rem; margin: 0 0 .7rem; padding-bottom: .25rem; border-bottom: 3px solid var(--accent); color: var(--accent); }
h3 { font-size: 1.05rem; margin: 1.2rem 0 .4rem; }
section { margin: 0 0 2.2rem; }
p.note, .muted { color: var(--muted); font-size: .92rem; }
nav.contents { font-size: .9rem; margin: .8rem 0 1.6rem; padding: .5rem .8rem; border: 1px solid var(--rule); background: var(--band); }
nav.contents a { color: var(--accent); margin-right: .9rem; white-space: nowrap; }
.demo-banner { border: 3px dashed #000; background: #fff3b0; padding: .55rem .9rem; margin: .6rem 0 1rem; font-weight: 700; }
dl.meta { display: grid; grid-template-columns: max-content 1fr; gap: .15rem 1.2rem; margin: .4rem 0 0; }
dl.meta dt { color: var(--muted); }
dl.meta dd { margin: 0; }
.figures { display: grid; grid-template-columns: repeat(auto-fit, minmax(170px, 1fr)); gap: .8rem; margin: .6rem 0 1rem; }
.figure { border: 1px solid var(--rule); border-top: 5px solid var(--accent); padding: .55rem .75rem; background: #fff; }
.figure .value { display: block; white-space: nowrap; font-size: 1.45rem; font-weight: 700; font-variant-numeric: tabular-nums; }
.figure .label { color: var(--muted); font-size: .88rem; }
.cautions { border: 2px solid var(--warn); border-left: 10px solid var(--warn); background: #fff1ec; padding: .7rem 1rem .5rem; }
.cautions h2 { color: var(--warn); border-bottom-color: var(--warn); }
.cautions li { margin-bottom: .35rem; }
figure { margin: .4rem 0 1rem; }
figure svg { display: block; max-width: 100%; height: auto; }
#site-map-figure svg { width: 100%; max-height: 96vh; }
figcaption { color: var(--muted); font-size: .9rem; margin-top: .3rem; }
table { border-collapse: collapse; width: 100%; margin: .3rem 0 .8rem; font-size: .92rem; }
caption { text-align: left; font-weight: 700; padding: .2rem 0 .35rem; }
th, td { border: 1px solid var(--rule); padding: .28rem .5rem; vertical-align: top; text-align: left; }
thead th { background: #e6e9ee; border-bottom: 2px solid var(--ink); }
tbody tr:nth-child(even) td { background: var(--band); }
tfoot td { font-weight: 700; border-top: 2px solid var(--ink); }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.met { font-weight: 600; }
.not-met { font-weight: 700; color: #fff; background: var(--warn); padding: 0 .35rem; border: 2px solid #000; }
.table-wrap { overflow-x: auto; }
pre.risk { background: var(--band); border: 1px solid var(--rule); padding: .6rem .8rem; overflow-x: auto; font-size: .88rem; }
ul.warnings li { margin-bottom: .3rem; }
ul.sources li { margin-bottom: .45rem; }
footer { margin-top: 2.5rem; color: var(--muted); font-size: .85rem; border-top: 1px solid var(--rule); padding-top: .5rem; }
@page { size: auto; margin: 14mm 12mm; }
@media print {
  html { font-size: 10pt; }
  body { max-width: none; padding: 0; }
  nav.contents { display: none; }
  section.sheet { break-before: page; }
  section, figure, .figures, .cautions { break-inside: avoid-page; }
  section.long { break-inside: auto; }
  tr, .figure, li { break-inside: avoid; }
  h2, h3, caption { break-after: avoid; }
  thead { display: table-header-group; }
  tfoot { display: table-footer-group; }
  .table-wrap { overflow: visible; }
  a { color: inherit; text-decoration: none; }
}
`

var htmlPage = template.Must(template.New("report").Parse(`<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8"/>
<meta name="viewport" content="width=device-width, initial-scale=1"/>
<meta name="generator" content="rigmix {{.Version}}"/>
<title>{{.Title}}</title>
<style>` + htmlStyle + `</style>
</head>
<body>
<header id="title">
<h1>{{.Title}}</h1>
{{- if .Demo}}
<p class="demo-banner" id="demo-banner">Invented demo data: the site, the project and the prices are made up to show what rigmix does. Not for a bid.</p>
{{- end}}
<dl class="meta">
<dt>scenario</dt><dd>{{.ScenarioName}} ({{.ScenarioSource}})</dd>
<dt>rate book</dt><dd>{{.RateBook.Title}} ({{.RateBook.Name}}), {{.RateBook.Region}} — effective {{.RateBook.Effective}}, prices in {{.RateBook.Currency}}</dd>
<dt>made by</dt><dd>rigmix {{.Version}}</dd>
<dt>date of the run</dt><dd id="run-date">{{.RunDate}}</dd>
</dl>
<nav class="contents" aria-label="contents">
<a href="#summary">Summary</a><a href="#cautions">Cautions</a><a href="#site-map">Site map</a><a href="#points">Points</a><a href="#estimate">Estimate</a><a href="#rigs">Rigs</a><a href="#rules">Rules</a>
{{- if .Excluded.Rows}}<a href="#excluded">Options ruled out</a>{{end}}
{{- if .HasTradeoffs}}<a href="#tradeoffs">Alternatives</a>{{end}}
{{- if .HasSchedule}}<a href="#schedule">Schedule</a>{{end}}
<a href="#warnings">Warnings</a><a href="#inputs">Inputs</a><a href="#point-list-section">Point list</a>
</nav>
</header>

<section id="summary">
<h2>Summary</h2>
<div class="figures">
<div class="figure"><span class="value" id="summary-points">{{.Points}}</span><span class="label">exploration points</span></div>
<div class="figure"><span class="value" id="summary-total">{{.TotalAmount}}</span><span class="label">estimated total ({{.Currency}})</span></div>
<div class="figure"><span class="value" id="summary-days">{{.FieldDays}}</span><span class="label">field days (rigs in parallel)</span></div>
<div class="figure"><span class="value" id="summary-coverage">{{.Coverage}}</span><span class="label">of ruled ground covered</span></div>
{{- with .Baseline}}
<div class="figure"><span class="value" id="summary-saving">{{.SavingAmount}}</span><span class="label">{{$.Currency}} saved against a hand-laid grid ({{.SavingPct}})</span></div>
{{- end}}
</div>
<p>{{.CoverageDetail}}.</p>
{{- with .Baseline}}
<p id="baseline">Against a hand-laid grid — {{.Note}}: {{.Points}} points by {{.Rig}}, {{.Cost}}, {{.FieldDays}} field days. This plan saves {{.Saving}} ({{.SavingPct}}) and {{.DaysSaved}} field days{{with .Split}}; by source: {{.}}{{end}}.</p>
{{- end}}
</section>

<section id="cautions" class="cautions" role="note">
<h2>Cautions — read before any field work</h2>
<ul>
{{- range .Cautions}}
<li>{{.}}</li>
{{- end}}
</ul>
</section>

<section id="site-map" class="sheet">
<h2>Site map</h2>
<figure id="site-map-figure">
{{.SiteMap}}
<figcaption>North is up. Marker shape gives the method, its fill and number the rig, and the ID beside it names the point as in the point list and the stakeout list (B borings, S CPT soundings, TP test pits, P probes); zones are tinted by use and labelled with their ids; hatched areas are no-go.</figcaption>
</figure>
</section>

<section id="points" class="sheet">
<h2>Points by method and rig</h2>
{{template "table" .MethodRig}}
<p class="note">Letters are the rigs' markers on the site map. The full point list closes the report.</p>
</section>

<section id="estimate" class="long">
<h2>Itemized estimate</h2>
<div class="table-wrap">
<table id="estimate-table">
<thead><tr>{{range $i, $h := .Estimate.Header}}<th{{if index $.Estimate.Num $i}} class="num"{{end}}>{{$h}}</th>{{end}}</tr></thead>
<tbody>
{{- range .Estimate.Rows}}
<tr>{{range $i, $c := .}}<td{{if index $.Estimate.Num $i}} class="num"{{end}}>{{$c}}</td>{{end}}</tr>
{{- end}}
</tbody>
<tfoot><tr><td colspan="5">total ({{.Currency}})</td><td class="num" id="estimate-total">{{.EstimateTotal}}</td></tr></tfoot>
</table>
</div>
<p class="note">Extension is quantity × unit price, rounded to cents. Unit prices are the rate book's, effective {{.RateBook.Effective}}.</p>
</section>

<section id="rigs">
<h2>Rigs</h2>
{{template "table" .Rigs}}
</section>

<section id="rules" class="sheet long">
<h2>Rules</h2>
<div class="table-wrap">
<table id="rules-table">
<thead><tr><th>Zone</th><th>Rule</th><th>Required</th><th>Achieved</th><th>Met?</th></tr></thead>
<tbody>
{{- range .Rules}}
<tr><td>{{.Zone}}</td><td>{{.Rule}}</td><td>{{.Required}}</td><td>{{.Achieved}}</td><td>{{if .Met}}<span class="met">✓ met</span>{{else}}<span class="not-met">✗ NOT MET</span>{{end}}</td></tr>
{{- end}}
</tbody>
</table>
</div>
<h3>Where the rules come from</h3>
<ul class="sources" id="rule-sources">
{{- range .Sources}}
<li><strong>{{.Zone}}</strong>: {{.Source}}</li>
{{- end}}
</ul>
{{- if .Bases}}
<h3>Basis of computed, preset and default rules</h3>
<ul class="sources" id="rule-bases">
{{- range .Bases}}
<li><strong>{{.Zone}}</strong>: {{.Source}}</li>
{{- end}}
</ul>
{{- end}}
{{- if .Lab}}
<h3>Lab program by zone</h3>
<ul class="sources" id="lab-programs">
{{- range .Lab}}
<li><strong>{{.Zone}}</strong>: {{.Source}}</li>
{{- end}}
</ul>
{{- end}}
</section>
{{- if .Excluded.Rows}}

<section id="excluded" class="long">
<h2>Options ruled out</h2>
<p>Ways of exploring a zone that the zone's rules allow but a rig cannot do there.</p>
{{template "table" .Excluded}}
</section>
{{- end}}
{{- if .HasTradeoffs}}

<section id="tradeoffs" class="sheet long">
<h2>Alternatives</h2>
{{- with .Alternatives}}
<div id="alternatives">{{template "table" .}}</div>
{{- end}}
{{- if .Frontier}}
<figure id="frontier-chart">
{{.Frontier}}
<figcaption>Cost against field days: each mark is a program that meets every rule; none is both cheaper and faster than another on the line.</figcaption>
</figure>
{{- end}}
{{- if .Budget}}
<figure id="budget-chart">
{{.Budget}}
<figcaption>How much of the ruled ground a budget covers.</figcaption>
</figure>
{{- end}}
{{- with .RuleCosts}}
<div id="rule-costs">{{template "table" .}}</div>
{{- end}}
</section>
{{- end}}
{{- if .HasSchedule}}

<section id="schedule" class="sheet long">
<h2>Schedule</h2>
{{- if .ScheduleSummary}}
<dl class="meta" id="schedule-summary">
{{- range .ScheduleSummary}}
<dt>{{.Key}}</dt><dd>{{.Value}}</dd>
{{- end}}
</dl>
{{- end}}
{{- with .ScheduleRigs}}
{{template "table" .}}
{{- end}}
{{- if .Gantt}}
<figure id="gantt-chart">
{{.Gantt}}
<figcaption>Each rig's days on site; within a day, the working hours.</figcaption>
</figure>
{{- end}}
{{- if .Risk}}
<h3>Weather and production risk</h3>
<pre class="risk" id="risk">{{.Risk}}</pre>
{{- end}}
</section>
{{- end}}

<section id="warnings" class="sheet">
<h2>Warnings</h2>
{{- if .Warnings}}
<ul class="warnings">
{{- range .Warnings}}
<li>{{.}}</li>
{{- end}}
</ul>
{{- else}}
<p>None: the plan needs nothing attended to beyond the cautions.</p>
{{- end}}
</section>

<section id="inputs">
<h2>Inputs</h2>
<dl class="meta" id="inputs-list">
{{- range .Inputs}}
<dt>{{.Key}}</dt><dd>{{.Value}}</dd>
{{- end}}
</dl>
{{- if .ScenarioDescription}}
<p>{{.ScenarioDescription}}</p>
{{- end}}
{{- if .ScenarioNote}}
<p class="note">{{.ScenarioNote}}</p>
{{- end}}
<h3>Solver</h3>
<dl class="meta" id="solver">
{{- range .SolverRows}}
<dt>{{.Key}}</dt><dd>{{.Value}}</dd>
{{- end}}
</dl>
</section>

<section id="point-list-section" class="sheet long">
<h2>Point list</h2>
<div id="point-list">{{template "table" .PointList}}</div>
</section>

<footer>Made by rigmix {{.Version}} on {{.RunDate}}. A planning aid: a licensed professional reviews it; local codes and the client's requirements govern.</footer>
</body>
</html>
{{define "table" -}}
<div class="table-wrap">
<table>
{{- if .Title}}
<caption>{{.Title}}</caption>
{{- end}}
<thead><tr>{{range $i, $h := .Header}}<th{{if and (lt $i (len $.Num)) (index $.Num $i)}} class="num"{{end}}>{{$h}}</th>{{end}}</tr></thead>
<tbody>
{{- range .Rows}}
<tr>{{range $i, $c := .}}<td{{if and (lt $i (len $.Num)) (index $.Num $i)}} class="num"{{end}}>{{$c}}</td>{{end}}</tr>
{{- end}}
</tbody>
{{- if .Foot}}
<tfoot><tr>{{range $i, $c := .Foot}}<td{{if and (lt $i (len $.Num)) (index $.Num $i)}} class="num"{{end}}>{{$c}}</td>{{end}}</tr></tfoot>
{{- end}}
</table>
</div>
{{- if .Note}}
<p class="note">{{.Note}}</p>
{{- end}}
{{- end}}
`))
