"""Independent cross-check of a cloudwind ECSV sweep with astropy.

Usage: /usr/bin/python3 astropy_crosscheck.py SWEEP.ecsv

Reads the sweep with astropy.table (Debian's python3-astropy), checks the
unit of every column, and recomputes at every row, with astropy.constants
and astropy.units only, the quantities below; each must agree with
cloudwind to 1e-6 relative.

Sources of what is recomputed:
  * constants: astropy.constants, CODATA 2018 (k_B, m_p, u) and IAU 2015
    (pc), astropy 5.2.1's defaults; Myr is the Julian megayear of
    astropy.units;
  * T_hot = chi T_cl mu_hot/mu_cl: pressure equilibrium, P = rho k T/(mu m_p);
  * n_hot = (P/k_B)/T_hot: ideal gas;
  * T_mix = (T_cl T_hot)^(1/2): Begelman & Fabian 1990 (geometric mean);
  * v_wind = M (gamma k_B T_hot/(mu_hot m_p))^(1/2): adiabatic sound speed
    of the hot gas times the Mach number;
  * t_cc = chi^(1/2) r_cl/v_wind: Klein, McKee & Colella 1994;
  * the Gronke & Oh 2018 threshold t_cool,mix/t_cc = 1, i.e.
    r_crit = v_wind t_cool,mix/chi^(1/2), with
    t_cool,mix = f n_mix k_B T_mix/(N Lambda) and constant Lambda from the
    sweep's cooling spec; N = n_mix^2 (n2) or n_H,mix^2 (nh2) with
    n_H = X rho/m_H, rho_mix = mu m_p n_mix and m_H = 1.00782503223 u
    (the 1H atomic mass as cloudwind uses it).
"""
import math
import sys

import numpy as np
from astropy import constants as const
from astropy import units as u
from astropy.table import QTable

RTOL = 1e-6

EXPECTED_UNITS = {
    "chi": None, "mach": None, "pressure_kcm3": "K / cm3", "t_cloud_k": "K", "radius_pc": "pc",
    "metallicity_zsun": None, "t_hot_k": "K", "t_mix_k": "K", "t_minmix_k": "K", "n_cloud_cm3": "1 / cm3",
    "n_hot_cm3": "1 / cm3", "v_wind_kms": "km / s", "t_cc_myr": "Myr", "t_shear_myr": "Myr",
    "t_drag_myr": "Myr", "t_cool_hot_myr": "Myr", "t_cool_mix_myr": "Myr", "t_cool_minmix_myr": "Myr",
    "t_cool_cold_myr": "Myr", "t_grow_myr": "Myr", "l_shatter_pc": "pc", "mass_cloud_msun": "solMass",
}


def fail(msg):
    print("cross-check failed: " + msg)
    sys.exit(1)


def check_units(t):
    for name in t.colnames:
        unit = getattr(t[name], "unit", None)
        if isinstance(unit, u.UnrecognizedUnit):
            fail(f"column {name}: unrecognised unit {unit!s}")
        if name.endswith("_radius_crit_pc"):
            want = "pc"
        elif name.endswith(("_ratio", "_margin", "_verdict")):
            want = None
        elif name in EXPECTED_UNITS:
            want = EXPECTED_UNITS[name]
        else:
            fail(f"unexpected column {name}")
        if want is None:
            if unit is not None and unit != u.dimensionless_unscaled:
                fail(f"column {name}: unit {unit!s}, want none")
        elif unit is None or unit != u.Unit(want):
            fail(f"column {name}: unit {unit!s}, want {want}")


def close(name, got, want):
    got = np.asarray(got.value if hasattr(got, "value") else got, dtype=float)
    want = np.asarray(want, dtype=float)
    bad = ~np.isclose(got, want, rtol=RTOL, atol=0)
    if bad.any():
        i = int(np.argmax(bad))
        fail(f"{name} row {i}: cloudwind {got[i]!r}, astropy {want[i]!r} (rtol {RTOL})")
    print(f"ok {name}: {len(got)} rows agree to {RTOL}")


def main(path):
    t = QTable.read(path, format="ascii.ecsv")
    check_units(t)
    conv = t.meta["conventions"]
    spec = t.meta["cooling"]["spec"]
    if not spec.startswith("const:"):
        fail(f"the cross-check needs constant cooling, got {spec}")
    lam_text = spec[len("const:"):]
    lam = 10 ** float(lam_text[3:]) if lam_text.startswith("10^") else float(lam_text)
    lam = lam * u.erg * u.cm**3 / u.s
    gamma, mu_c, mu_h = conv["gamma"], conv["mu_cloud"], conv["mu_hot"]
    f = conv["heat_capacity_f"]
    x_h = conv["hydrogen_fraction"]

    chi = np.asarray(t["chi"], dtype=float)
    mach = np.asarray(t["mach"], dtype=float)
    p_k = t["pressure_kcm3"]  # P/k_B in K / cm3
    t_cl = t["t_cloud_k"]
    r_cl = t["radius_pc"]

    t_hot = chi * t_cl * mu_h / mu_c
    close("t_hot_k", t["t_hot_k"], t_hot.to_value(u.K))
    n_hot = p_k / t_hot
    close("n_hot_cm3", t["n_hot_cm3"], n_hot.to_value(u.cm**-3))
    t_mix = np.sqrt(t_cl * t_hot)
    close("t_mix_k", t["t_mix_k"], t_mix.to_value(u.K))
    cs_hot = np.sqrt(gamma * const.k_B * t_hot / (mu_h * const.m_p))
    v_wind = mach * cs_hot
    close("v_wind_kms", t["v_wind_kms"], v_wind.to_value(u.km / u.s))
    t_cc = np.sqrt(chi) * r_cl / v_wind
    close("t_cc_myr", t["t_cc_myr"], t_cc.to_value(u.Myr))

    n_mix = p_k / t_mix
    if conv["density_product"] == "n2":
        dens2 = n_mix**2
    else:
        m_h = 1.00782503223 * const.u
        mu_mix = math.sqrt(mu_c * mu_h)
        n_h_mix = x_h * mu_mix * const.m_p * n_mix / m_h
        dens2 = n_h_mix**2
    t_cool_mix = f * n_mix * const.k_B * t_mix / (dens2 * lam)
    close("t_cool_mix_myr", t["t_cool_mix_myr"], t_cool_mix.to_value(u.Myr))
    r_crit = v_wind * t_cool_mix / np.sqrt(chi)
    close("gronke_oh_2018_radius_crit_pc", t["gronke_oh_2018_radius_crit_pc"], r_crit.to_value(u.pc))
    ratio = t_cool_mix / t_cc
    close("gronke_oh_2018_ratio", t["gronke_oh_2018_ratio"], ratio.to_value(u.dimensionless_unscaled))
    verdict = np.where(ratio.to_value(u.dimensionless_unscaled) < 1, "survives-and-grows", "destroyed")
    if not (np.asarray(t["gronke_oh_2018_verdict"]) == verdict).all():
        fail("gronke_oh_2018_verdict differs")
    print(f"ok: {len(t)} rows, {len(t.colnames)} columns, convention {conv['density_product']}, f = {f}")


if __name__ == "__main__":
    main(sys.argv[1])
