package model

import (
	"fmt"
	"math"
)

// Sources of the planner's own rules, for the warnings' Source field.
const (
	srcResolutionLevels = "cloudwind's suggested levels for growth studies (< 8 poor, 8–16 marginal, ≥ 32 good), not a published threshold"
	srcGO18Minimum      = "Gronke & Oh 2018, arXiv:1806.02728: minimum for converged growth (secondary: quoted by a third party, not in the abstract)"
	srcKanjilal         = "Kanjilal, Dutta & Sharma 2021, arXiv:2009.00525 (confirmed)"
	srcYirak            = "Yirak et al. 2010, arXiv:0912.4777 (confirmed)"
	srcBanda            = "Banda-Barragán, Federrath, Crocker & Bicknell 2018, arXiv:1706.06607 (confirmed, abstract)"
	srcLeary            = "Leary, Richie & Schneider 2026, arXiv:2602.10082 (confirmed)"
)

// warnings adds every warning whose condition holds, most serious first.
func (pl *Plan) warnings(s *State, q PlanSettings) {
	R, mach := q.CellsPerRadius, s.Params.Mach
	if !pl.Testable {
		code, lvl := WarnNotTestable, LevelSerious
		if pl.AllDestroyed {
			code = WarnAllDestroyed
		}
		src := "the cloud's trajectory integrated on the criterion's branch (cloudwind's growth model); cap: cloudwind's choice"
		pl.warn(code, lvl, src, "%s", pl.Verdict)
	}
	if pl.RunTcc >= pl.TCoolHotTcc {
		pl.warn(WarnBackgroundCooling, LevelSerious, srcKanjilal,
			"the wind cools during the run: t_end = %.3g t_cc ≥ t_cool,hot = %.3g t_cc; switch off cooling in the hot phase or shorten the run, so that the background does not cool catastrophically", pl.RunTcc, pl.TCoolHotTcc)
	}
	if q.Question == QuestionGrowth && pl.Testable && q.RunTcc > 0 && !math.IsNaN(pl.TDoubleTcc) && q.RunTcc < pl.TDoubleTcc {
		pl.warn(WarnTooShortForGrowth, LevelCaution, "the cloud's trajectory (cloudwind's growth model)",
			"the run ends before growth could be seen: t_end = %.3g t_cc, but the mass doubles only at %.3g t_cc", pl.RunTcc, pl.TDoubleTcc)
	}
	if q.Question == QuestionEntrainment && math.IsNaN(pl.TEntrainTcc) && pl.RunTcc < pl.TDragTcc {
		pl.warn(WarnShorterThanDrag, LevelCaution, "t_drag ~ χ^1/2 t_cc: the order-of-magnitude drag time, as in Gronke & Oh 2018 (from memory)",
			"the run ends before the cloud can be entrained: t_end = %.3g t_cc < t_drag = χ^1/2 t_cc = %.3g t_cc", pl.RunTcc, pl.TDragTcc)
	}
	pl.AdvisedCellsPerRadius, pl.AdvisedSource = 32, srcResolutionLevels
	if q.Question == QuestionDestruction { // adiabatic destruction converges at ~100
		pl.AdvisedCellsPerRadius, pl.AdvisedSource = 100, srcYirak+": ~100 cells/r_cl converge an adiabatic clump"
	}
	if R < 8 {
		sub := ""
		if mach < 1 {
			sub = "; for subsonic winds Leary, Richie & Schneider 2026 (arXiv:2602.10082, confirmed) find mass growth and acceleration converged at 4 cells/r_cl"
		}
		pl.warn(WarnBelowMinimumResolution, LevelSerious, srcGO18Minimum,
			"R = %.3g cells per cloud radius is below the 8 quoted as the minimum for converged growth%s", R, sub)
	} else if R < 32 && q.Question == QuestionGrowth {
		pl.warn(WarnGrowthResolution, LevelCaution, srcResolutionLevels,
			"R = %.3g cells per cloud radius is marginal for a growth study (16–32 counted as marginal); a resolution ladder shows whether the result converges", R)
	}
	if q.MHD {
		if pl.AdvisedCellsPerRadius < 64 {
			pl.AdvisedCellsPerRadius, pl.AdvisedSource = 64, srcBanda+": ≥ 64 cells/r_cl in MHD"
		}
		if R < 64 {
			pl.warn(WarnMHDResolution, LevelCaution, srcBanda,
				"MHD run at R = %.3g < 64 cells/r_cl, the resolution at which the dynamical properties of MHD wind–cloud runs converge", R)
		}
	}
	if mach > 1 {
		lvl := LevelCaution
		if q.Question == QuestionGrowth {
			lvl = LevelInfo
		}
		pl.warn(WarnSupersonic, lvl, srcLeary,
			"supersonic wind (M = %.3g): in radiative supersonic runs cloud destruction and velocity were not converged even at 48 cells/r_cl; treat them as resolution-dependent at any R", mach)
	}
	yirak := "radiative runs did not self-converge even at 100 cells/r_cl: plan a resolution study"
	lvl := LevelInfo
	if R < 100 {
		yirak = fmt.Sprintf("R = %s < ~100 cells/r_cl, where an adiabatic clump converges; %s", num3(R), yirak)
		if q.Question == QuestionDestruction {
			lvl = LevelCaution
		}
	}
	pl.warn(WarnRadiativeConvergence, lvl, srcYirak, "%s", yirak)
	if pl.ShatterCells < 1 {
		pl.warn(WarnShatteringUnresolved, LevelInfo, "McCourt et al. 2018, arXiv:1610.01164 (confirmed, abstract)",
			"the shattering length l_shatter = %.3g Δx is not resolved; this matters only if fragmentation itself is the science", pl.ShatterCells)
	}
	if float64(pl.CellColumn) > convergedColumn {
		pl.warn(WarnCellColumn, LevelInfo, "Gronke & Oh 2020, arXiv:1907.04771 (confirmed as their speculation)",
			"one cell of cloud gas holds a column n_cl Δx = %.3g cm⁻², above the ~1e18 cm⁻² galaxy-scale simulations may need to resolve to converge in cold-gas mass", float64(pl.CellColumn))
	}
	pl.sortWarnings()
}
