package tui

import (
	"cloudwind/cooling"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/scenario"
)

// Messages. Commands (commands.go) do the work that is not instant
// (charts, maps, files) off the update loop and report back with one of
// these.

// chartMsg carries a computed chart for request gen.
type chartMsg struct {
	gen     int
	view    viewKind
	carry   bool // the outflow view's carried cloud
	line    *chartspec.LineChart
	line2   *chartspec.LineChart // the second panel: v/v_w of the evolution view, v of the carried cloud
	regime  *chartspec.RegimeMap
	text    []string           // the plan view
	outflow *chartspec.Outflow // the outflow view's data; nil when its wind is not valid
}

// statusMsg sets the status line.
type statusMsg struct {
	text  string
	isErr bool
}

// coolingMsg carries a resolved cooling source (or the error).
type coolingMsg struct {
	src *cooling.Source
	err error
}

// scenarioMsg carries a loaded scenario and its cooling source.
type scenarioMsg struct {
	sc  scenario.Scenario
	src *cooling.Source
	err error
}
