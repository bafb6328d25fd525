package report

import (
	"fmt"
	"math"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/internal/safetext"
	"cloudwind/model"
)

// PlanText describes a simulation plan in lines of text: first, when the
// question cannot be answered, the verdict and what a run could answer
// instead; then the run length beside the trajectory's events and the
// wind's cooling time, the box, the concrete grid, counts, cost, and the
// warnings with their sources. cloudwind plan prints it and the explorer's
// plan view shows it.
func PlanText(pl *model.Plan) string {
	var b strings.Builder
	row := func(label, format string, a ...any) {
		fmt.Fprintf(&b, "  %-12s %s\n", label, fmt.Sprintf(format, a...))
	}
	q := pl.Settings
	if !pl.Testable {
		fmt.Fprintf(&b, "  ✗ NOT TESTABLE: %s\n", safetext.Terminal(pl.Verdict))
		if pl.Suggestion != "" {
			fmt.Fprintf(&b, "  → what a run can answer: %s\n", safetext.Terminal(pl.Suggestion))
		}
		b.WriteString("\n")
	} else if pl.Verdict != "" {
		fmt.Fprintf(&b, "  ! %s\n\n", safetext.Terminal(pl.Verdict))
	}
	row("run", "%s t_cc = %s  (%s)", quantity.FormatSig(pl.RunTcc, 3), quantity.Format(model.DimTime, float64(pl.RunTime)), pl.RunRule)
	row("trajectory", "on the branch of %s: mass doubling %s, entrainment %s, destruction %s", pl.Criterion,
		when(pl.TDoubleTcc), when(pl.TEntrainTcc), when(pl.TDestroyTcc))
	row("wind cools", "after t_cool,hot = %s t_cc%s", quantity.FormatSig(pl.TCoolHotTcc, 3), coolVerdict(pl))
	row("timescales", "t_grow = %s t_cc, t_drag = %s t_cc", quantity.FormatSig(pl.TGrowTcc, 3), quantity.FormatSig(pl.TDragTcc, 3))
	row("resolution", "R = %s cells per r_cl, Δx = %s  (advised ≥ %s: %s)", quantity.FormatSig(q.CellsPerRadius, 3),
		quantity.Format(model.DimLength, float64(pl.Dx)), quantity.FormatSig(pl.AdvisedCellsPerRadius, 3), pl.AdvisedSource)
	row("box", "%s × %s × %s r_cl  (%s)", quantity.FormatSig(pl.BoxAlongRcl, 3), quantity.FormatSig(pl.BoxAcrossRcl, 3), quantity.FormatSig(pl.BoxAcrossRcl, 3), pl.BoxRule)
	row("grid", "%s cells%s, time step Δt = %s, steps %s", GridText(pl.Grid), blockText(q.Block),
		quantity.Format(model.DimTime, float64(pl.Dt)), quantity.FormatSig(pl.Steps, 3))
	row("cost", "%s cell-updates = %s core-hours at %s cell-updates per core-second (set --throughput)", quantity.FormatSig(pl.CellUpdates, 3),
		quantity.FormatSig(pl.CoreHours, 3), quantity.FormatSig(q.CellUpdatesPerCoreSecond, 3))
	row("memory", "%s GB at %s bytes per cell", quantity.FormatSig(pl.MemoryBytes/1e9, 3), quantity.FormatSig(q.BytesPerCell, 3))
	row("shattering", "l_shatter = %s cells", quantity.FormatSig(pl.ShatterCells, 3))
	if len(pl.Warnings) > 0 {
		b.WriteString("\nWarnings\n")
		for _, w := range pl.Warnings {
			if w.Code == model.WarnNotTestable || w.Code == model.WarnAllDestroyed {
				continue // the verdict above
			}
			mark := "·"
			switch w.Level {
			case model.LevelSerious:
				mark = "✗"
			case model.LevelCaution:
				mark = "!"
			}
			fmt.Fprintf(&b, "  %s %s: %s [%s]\n", mark, w.Level, safetext.Terminal(w.Message), safetext.Terminal(w.Source))
		}
	}
	return b.String()
}

// GridText writes a grid as "Nx × Ny × Nz = N".
func GridText(g model.Grid) string {
	return fmt.Sprintf("%d × %d × %d = %s", g.Nx, g.Ny, g.Nz, quantity.FormatSig(g.Cells, 3))
}

func blockText(block int) string {
	if block <= 1 {
		return ""
	}
	return fmt.Sprintf(" (multiples of %d-cell blocks)", block)
}

// when writes an event time in t_cc, or "not within the run" when it did
// not happen.
func when(t float64) string {
	if math.IsNaN(t) {
		return "not within the run"
	}
	return "at " + quantity.FormatSig(t, 3) + " t_cc"
}

// coolVerdict says whether the wind cools during the run.
func coolVerdict(pl *model.Plan) string {
	if pl.RunTcc >= pl.TCoolHotTcc {
		return " — shorter than the run: the wind would cool"
	}
	return fmt.Sprintf(" — %s× the run", quantity.FormatSig(pl.TCoolHotTcc/pl.RunTcc, 3))
}
