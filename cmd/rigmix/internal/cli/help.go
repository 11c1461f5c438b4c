package cli

import "github.com/spf13/cobra"

// examples are shown by each command's --help.
var examples = map[string]string{
	"plan": `  rigmix plan                                  # the embedded demo scenario
  rigmix plan --demo hillside
  rigmix plan site.yaml --json plan.json --points-csv points.csv
  rigmix plan site.yaml --estimate-csv estimate.csv --csv-bom     # the estimate for a spreadsheet
  rigmix plan site.yaml --gap 0.01 --time-limit 60 --quiet --json -   # the plan as JSON on stdout
  rigmix demos midrise > site.yaml              # a scenario to start your own from
  rigmix plan - < site.yaml                     # the scenario from standard input`,
	"schedule": `  rigmix schedule --start 2027-03-01 --wet-prob 0.2
  rigmix schedule site.yaml --plan plan.json --gantt-svg gantt.svg --stakeout-csv stakes.csv
  rigmix schedule site.yaml --work-days mon-sat --wet-dates 2027-03-02,2027-03-09 --csv days.csv`,
	"tradeoffs": `  rigmix tradeoffs
  rigmix tradeoffs site.yaml --compare-rate-books coastal-2026 --frontier-svg frontier.svg
  rigmix tradeoffs site.yaml --budget 40000 --budget-csv budget.csv --quiet`,
	"report": `  rigmix report --out report.html --start 2027-03-01
  rigmix report site.yaml --out report.html --tradeoffs=false
  rigmix report site.yaml --out - > report.html`,
	"solve": `  rigmix plan site.yaml --model-mps plan.mps && rigmix solve plan.mps
  rigmix solve model.mps --gap 0.001 --time-limit 120 --json`,
	"rigs": `  rigmix rigs
  rigmix rigs --plugin-dir ~/rigs`,
	"demos": `  rigmix demos
  rigmix demos wetlot > wetlot.yaml
  rigmix demos hillside --out mysite && rigmix plan mysite/hillside.yaml   # the YAML and its GeoJSON`,
}

// addExamples sets each command's examples.
func addExamples(root *cobra.Command) {
	for _, c := range root.Commands() {
		if ex, ok := examples[c.Name()]; ok {
			c.Example = ex
		}
	}
}
