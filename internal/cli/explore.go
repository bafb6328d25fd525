package cli

import (
	"flag"
	"fmt"
	"io"
	"os"

	"cloudwind/cooling"
	"cloudwind/internal/scenario"

	"cloudwind/tui"
)

const exploreSynopsis = `Usage: cloudwind [explore] [flags]

Open the explorer: change χ, the Mach number, pressure, metallicity, cloud
temperature and radius with the keys and watch every criterion's threshold
radius, the timescale ratios, the verdicts and the charts move at once. It
starts from the first demo scenario (fictional settings), or from a
scenario file, or from the scenario flags given. Press ? inside for keys.`

const exploreExamples = `  cloudwind
  cloudwind --scenario my-run.toml
  cloudwind --chi 300 --mach 1.5 --radius "10 pc" --cooling builtin
  cloudwind --palette light --ascii        # projectors, fonts without braille
  NO_COLOR=1 cloudwind                     # no colour at all`

func runExplore(e *env) error {
	f := newFlagSet("explore", exploreSynopsis, exploreExamples)
	var sf scenarioFlags
	sf.register(f)
	demo := f.fs.Int("demo", 1, "start from demo scenario N (fictional settings) when no inputs are given")
	palette := f.fs.String("palette", "dark", "colours: dark or light (for projectors with a white screen)")
	ascii := f.fs.Bool("ascii", false, "draw charts and borders with plain ASCII, no braille")
	if err := f.parse(e); err != nil {
		return err
	}
	var pal tui.Palette
	switch *palette {
	case "dark":
		pal = tui.DarkPalette()
	case "light":
		pal = tui.LightPalette()
	default:
		return usagef("--palette: want dark or light (got %q)", sanitizeArg(*palette))
	}
	demos, err := scenario.Demos()
	if err != nil {
		return err
	}
	cfg := tui.Config{Palette: pal, Color: e.getenv("NO_COLOR") == "", ASCII: *ascii, Version: versionString(), Demos: demos,
		Open: func(path string) (io.Reader, string, func(), error) { return openInput(e, path) }}
	if cfg.Criteria, err = loadCriteria(e, sf.criteria); err != nil {
		return err
	}
	// The starting scenario: a file, explicit flags, or a demo.
	var sc scenario.Scenario
	// Any scenario flag given (an input, a convention, the cooling
	// function) starts from the flags; only the explorer's own flags and
	// --criteria leave the demo in place.
	flagsGiven := false
	f.fs.Visit(func(fl *flag.Flag) {
		switch fl.Name {
		case "demo", "palette", "ascii", "criteria", "scenario":
		default:
			flagsGiven = true
		}
	})
	switch {
	case sf.scenario != "" || flagsGiven:
		p, err := sf.params(e)
		if err != nil {
			return err
		}
		sc = scenario.Scenario{Params: p, Cooling: sf.cooling, Table: sf.table}
		if sf.base != nil {
			sc.Name, sc.Description, sc.Outflow = sf.base.Name, sf.base.Description, sf.base.Outflow
		}
	default:
		if *demo < 1 || *demo > len(demos) {
			return usagef("--demo: want 1 to %d (got %d)", len(demos), *demo)
		}
		sc = demos[*demo-1]
	}
	if err := sc.Params.Validate(); err != nil {
		return fieldUsage(err)
	}
	spec := sc.Cooling
	if spec == "" {
		spec = cooling.DefaultSpec
	}
	if cfg.Cooling, err = resolveCooling(e, "--cooling", spec, sc.Table); err != nil {
		return err
	}
	cfg.Params, cfg.Scenario, cfg.Outflow = sc.Params, sc.Name, sc.Outflow
	if !isTerminal(e.stdout) || !isTerminalReader(e.stdin) {
		return fmt.Errorf("the explorer needs a terminal; for scripts use 'cloudwind eval' or 'cloudwind sweep'")
	}
	return tui.Run(cfg)
}

// isTerminalReader reports whether r is a terminal.
func isTerminalReader(r io.Reader) bool {
	f, ok := r.(*os.File)
	return ok && isTTY(f)
}
