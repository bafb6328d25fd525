"""Independent check of a cloudwind outflow profile (ECSV) with astropy.

Usage: /usr/bin/python3 astropy_outflow.py PROFILE.ecsv

Reads the profile with astropy.table (Debian's python3-astropy), checks
the units and the boolean columns, and at every row, with
astropy.constants and astropy.units only:

  * P/k_B = n_hot T_hot: the ideal gas;
  * chi = T_hot/T_cl (one mu): a cloud in pressure equilibrium;
  * c_s = (gamma k_B T/(mu m_p))^(1/2): the adiabatic sound speed, and
    M = v/c_s;
  * outside R, the mass flux rho v 4 pi r^2 = Mdot and Bernoulli's
    constant v^2/2 + c_s^2/(gamma - 1) = Edot/Mdot (the steady adiabatic
    wind of Chevalier & Clegg 1985 conserves both; derived), with rho =
    mu m_p n_hot and Edot, Mdot, gamma, mu from the file's metadata;
  * inside R, rho v = Mdot r/(4 pi R^3) (mass injected uniformly; derived).

Constants: astropy.constants, CODATA 2018 (k_B, m_p) and IAU 2015 (M_sun,
pc); yr is the Julian year of astropy.units.
"""
import math
import sys

from astropy import constants as const
from astropy import units as u
from astropy.table import QTable

RTOL = 1e-6

UNITS = {"r_pc": "pc", "v_wind_kms": "km / s", "cs_hot_kms": "km / s", "n_hot_cm3": "1 / cm3",
         "pressure_kcm3": "K / cm3", "t_hot_k": "K", "t_flow_myr": "Myr", "t_cool_wind_myr": "Myr",
         "t_cc_myr": "Myr", "gronke_oh_2018_radius_crit_pc": "pc"}


def close(a, b, what, row):
    if not math.isclose(a, b, rel_tol=RTOL):
        sys.exit(f"row {row}: {what}: {a!r} vs {b!r} (relative {abs(a / b - 1):.2e})")


def main(path):
    t = QTable.read(path, format="ascii.ecsv")
    for name, unit in UNITS.items():
        if t[name].unit != u.Unit(unit):
            sys.exit(f"column {name} has unit {t[name].unit}, want {unit}")
    for name in ("adiabatic", "disagree"):
        if t[name].dtype.kind != "b":
            sys.exit(f"column {name} has dtype {t[name].dtype}, want bool")
    meta = t.meta
    wind, inputs = meta["wind"], meta["inputs"]
    edot = wind["energy_rate_ergs"] * u.erg / u.s
    mdot = (wind["mass_rate_msunyr"] * u.Msun / u.yr).to(u.g / u.s)
    gamma, mu = inputs["gamma"], inputs["mu"]
    big_r = inputs["injection_radius_pc"] * u.pc
    t_cl = inputs["t_cloud_k"] * u.K
    inside = outside = 0
    for i, row in enumerate(t):
        n, temp, v = row["n_hot_cm3"], row["t_hot_k"], row["v_wind_kms"].to(u.cm / u.s)
        close((n * temp).to_value(u.K / u.cm**3), row["pressure_kcm3"].to_value(u.K / u.cm**3), "P/k_B = n T", i)
        close(float(row["chi"]), (temp / t_cl).to_value(u.one), "chi = T/T_cl", i)
        cs = ((gamma * const.k_B * temp / (mu * const.m_p)) ** 0.5).to(u.cm / u.s)
        close(cs.to_value(u.km / u.s), row["cs_hot_kms"].to_value(u.km / u.s), "c_s", i)
        close(float(row["mach"]), (v / cs).to_value(u.one), "M = v/c_s", i)
        rho = (mu * const.m_p * n).to(u.g / u.cm**3)
        r = row["r_pc"].to(u.cm)
        if r > big_r:
            outside += 1
            close((rho * v * 4 * math.pi * r**2).to_value(u.g / u.s), mdot.to_value(u.g / u.s), "mass flux", i)
            bern = (v**2 / 2 + cs**2 / (gamma - 1)).to(u.cm**2 / u.s**2)
            close(bern.to_value(u.cm**2 / u.s**2), (edot / mdot).to_value(u.cm**2 / u.s**2), "Bernoulli's constant", i)
        elif r < big_r:
            inside += 1
            want = mdot * r / (4 * math.pi * big_r.to(u.cm) ** 3)
            close((rho * v).to_value(u.g / u.cm**2 / u.s), want.to_value(u.g / u.cm**2 / u.s), "rho v inside R", i)
    if inside == 0 or outside == 0:
        sys.exit(f"{inside} rows inside R and {outside} outside: want both")
    print(f"astropy: {len(t)} rows ({inside} inside R, {outside} outside) agree to {RTOL:g}")


if __name__ == "__main__":
    main(sys.argv[1])
