"""A 16-column cloud-survival sweep in plain NumPy, written to CSV with numpy.savetxt.

Usage:
    /usr/bin/python3 numpy_sweep.py COOLING.csv OUT.csv [--chi SPEC] [--mach SPEC]
                                    [--pressure SPEC] [--radius SPEC]

This is the script a researcher would write instead of `cloudwind sweep`:
the same formulas, vectorised over the whole grid, then numpy.savetxt with
'%.9g'. It is the reference of the side-by-side benchmark
(BenchmarkSweepVsNumPy in internal/cli) and of TestNumpyScriptAgrees, which
checks that it writes the same numbers as

    cloudwind sweep --chi SPEC --mach SPEC --pressure SPEC --radius SPEC \\
        --columns chi,mach,pressure_kcm3,radius_pc,t_hot_k,t_mix_k,n_hot_cm3,v_wind_kms,t_cc_myr,\\
t_cool_mix_myr,t_cool_hot_myr,gronke_oh_2018_ratio,gronke_oh_2018_radius_crit_pc,gronke_oh_2018_verdict,\\
sparre_2020_radius_crit_pc,sparre_2020_verdict

to 1e-6 relative. A SPEC is a comma list ("0.5,1,1.5,2") or log:A:B:N /
lin:A:B:N (N points, both ends included), as cloudwind reads them; the
radius is in pc and the pressure P/k_B in K cm^-3. The defaults are the
benchmark's 10^6-point grid: chi log:10:1e4:100, mach 0.5,1,1.5,2,
pressure log:10:1e5:25, radius log:0.1:1e3:100. Rows run as cloudwind's:
radius fastest, then mach, chi, pressure.

The cooling function is cloudwind's built-in curve at Z = 1 Z_sun, exported
on its own nodes (every 0.01 dex from 10^4 to 10^8 K) with

    cloudwind cooling --format csv --tmin 1e4 --tmax 1e8 --points 401

and interpolated here as cloudwind's cooling.PowerLaw does: linear in
log10 T - log10 Lambda between nodes, Lambda_last (T/T_last)^(1/2) above the
last node, 0 below the first (cooling/powerlaw.go, PowerLaw.Lambda). Every
temperature of this grid (T_cl = 10^4 K, T_mix and T_hot up to 10^8 K) lies
on the table, so both sides interpolate the same straight segments; the
built-in curve rather than a constant Lambda keeps the comparison honest
(a table look-up per temperature, as in a real study).

Formulas, with cloudwind's default conventions (model/state.go State.derive,
model/physics.go, model/criteria.go State.evaluate, model/builtin.go):
  * T_cl = 10^4 K, mu = 0.6 in both phases, gamma = 5/3, X = 0.7381
    (Asplund et al. 2009 present-day), f = 3/2 (isochoric),
    N = n_H^2, cooling floor at T_cl (Lambda = 0 below it);
  * T_hot = chi T_cl mu_hot/mu_cl (pressure equilibrium);
    T_mix = (T_cl T_hot)^(1/2) (Begelman & Fabian 1990);
  * n = (P/k_B)/T (ideal gas); rho = mu m_p n; rho_mix = (rho_cl rho_hot)^(1/2);
    n_H = X rho/m_H;
  * c_s,hot = (gamma k_B T_hot/(mu m_p))^(1/2); v_wind = M c_s,hot;
  * t_cc = chi^(1/2) r_cl/v_wind (Klein, McKee & Colella 1994);
  * t_cool = f n k_B T/(n_H^2 Lambda(T)), at (T_mix, n_mix) and (T_hot, n_hot);
  * Gronke & Oh 2018: ratio t_cool,mix/t_cc, survives-and-grows when < 1,
    r_crit = r_cl ratio/1; Sparre et al. 2020: t_cool,hot/t_cc < 10,
    r_crit = r_cl (t_cool,hot/t_cc)/10; otherwise "destroyed".
Constants (model/constants.go): k_B = 1.380649e-16 erg/K and
m_p = 1.67262192369e-24 g (CODATA 2018), m_H = 1.00782503223 u with
u = 1.66053906660e-24 g (CODATA 2018), pc = 648000/pi au with
au = 1.495978707e13 cm (IAU 2012 B2, IAU 2015 B2), Myr = 10^6 Julian years
of 365.25 d, km/s = 10^5 cm/s.
"""
import sys

import numpy as np

K_B = 1.380649e-16
M_P = 1.67262192369e-24
M_H = 1.00782503223 * 1.66053906660e-24
PC = 1.495978707e13 / (np.pi / 648000)
MYR = 1e6 * 365.25 * 86400
KMS = 1e5

T_CL = 1e4
MU = 0.6
GAMMA = 5.0 / 3.0
X_H = 0.7381
F_HEAT = 1.5

COLUMNS = [
    "chi", "mach", "pressure_kcm3", "radius_pc", "t_hot_k", "t_mix_k", "n_hot_cm3", "v_wind_kms",
    "t_cc_myr", "t_cool_mix_myr", "t_cool_hot_myr", "gronke_oh_2018_ratio",
    "gronke_oh_2018_radius_crit_pc", "gronke_oh_2018_verdict", "sparre_2020_radius_crit_pc",
    "sparre_2020_verdict",
]


def axis(spec):
    """The values of a grid spec: a comma list, log:A:B:N or lin:A:B:N."""
    mode, _, rest = spec.partition(":")
    if mode in ("log", "lin"):
        a, b, n = rest.split(":")
        a, b, n = float(a), float(b), int(n)
        v = np.logspace(np.log10(a), np.log10(b), n) if mode == "log" else np.linspace(a, b, n)
        v[0], v[-1] = a, b
        return v
    return np.array([float(s) for s in spec.split(",")])


def cooling_function(path):
    """Lambda(T) from `cloudwind cooling --format csv`, interpolated as cloudwind does."""
    tab = np.loadtxt(path, delimiter=",", skiprows=1, usecols=(0, 1))
    lt, ll = np.log10(tab[:, 0]), np.log10(tab[:, 1])

    def lam(t):
        x = np.log10(t)
        y = np.interp(x, lt, ll)
        y = np.where(x > lt[-1], ll[-1] + 0.5 * (x - lt[-1]), y)  # T^(1/2) above the table
        return np.where(x < lt[0], 0.0, 10.0 ** y)  # 0 below it

    return lam


def main(argv):
    args = dict(chi="log:10:1e4:100", mach="0.5,1,1.5,2", pressure="log:10:1e5:25", radius="log:0.1:1e3:100")
    if len(argv) < 2 or len(argv) % 2:
        sys.exit(__doc__)
    cooling, out = argv[0], argv[1]
    for flag, value in zip(argv[2::2], argv[3::2]):
        args[flag.lstrip("-")] = value
    lam = cooling_function(cooling)

    # The grid, radius fastest, then mach, chi, pressure.
    p, chi, mach, r_pc = np.meshgrid(axis(args["pressure"]), axis(args["chi"]), axis(args["mach"]),
                                     axis(args["radius"]), indexing="ij")
    p, chi, mach, r_pc = p.ravel(), chi.ravel(), mach.ravel(), r_pc.ravel()
    r = r_pc * PC

    t_hot = chi * T_CL  # one mu for both phases
    t_mix = np.sqrt(T_CL * t_hot)
    n_cl, n_hot, n_mix = p / T_CL, p / t_hot, p / t_mix
    rho_cl, rho_hot = MU * M_P * n_cl, MU * M_P * n_hot
    nh_hot = X_H * rho_hot / M_H
    nh_mix = X_H * np.sqrt(rho_cl * rho_hot) / M_H
    v_wind = mach * np.sqrt(GAMMA * K_B * t_hot / (MU * M_P))
    t_cc = np.sqrt(chi) * r / v_wind

    def t_cool(n, t, nh):
        lt = np.where(t < T_CL, 0.0, lam(t))  # the cooling floor at T_cl
        with np.errstate(divide="ignore"):
            return np.where(lt > 0, F_HEAT * n * K_B * t / (nh * nh * lt), np.inf)

    t_cool_mix = t_cool(n_mix, t_mix, nh_mix)
    t_cool_hot = t_cool(n_hot, t_hot, nh_hot)
    go_ratio = t_cool_mix / t_cc
    sp_ratio = t_cool_hot / t_cc

    cols = {
        "chi": chi, "mach": mach, "pressure_kcm3": p, "radius_pc": r_pc,
        "t_hot_k": t_hot, "t_mix_k": t_mix, "n_hot_cm3": n_hot,
        "v_wind_kms": v_wind / KMS, "t_cc_myr": t_cc / MYR,
        "t_cool_mix_myr": t_cool_mix / MYR, "t_cool_hot_myr": t_cool_hot / MYR,
        "gronke_oh_2018_ratio": go_ratio,
        "gronke_oh_2018_radius_crit_pc": r * (go_ratio / 1.0) / PC,
        "gronke_oh_2018_verdict": np.where(go_ratio < 1.0, "survives-and-grows", "destroyed"),
        "sparre_2020_radius_crit_pc": r * (sp_ratio / 10.0) / PC,
        "sparre_2020_verdict": np.where(sp_ratio < 10.0, "survives-and-grows", "destroyed"),
    }
    # Numbers and words in one object array: savetxt formats each row with
    # one %-operation. (A structured array writes at half this speed, since
    # its rows hold NumPy scalars; measured with NumPy 1.24.)
    table = np.empty((len(p), len(COLUMNS)), dtype=object)
    for j, c in enumerate(COLUMNS):
        table[:, j] = cols[c]
    fmt = ["%s" if c.endswith("_verdict") else "%.9g" for c in COLUMNS]
    np.savetxt(out, table, fmt=fmt, delimiter=",", header=",".join(COLUMNS), comments="")


if __name__ == "__main__":
    main(sys.argv[1:])
