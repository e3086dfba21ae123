"""Writes the reference curves used by ReferenceCurvesTest (run: python3 generate_reference_curves.py).

Closed-form models, sampled on a uniform strain grid, S0 = 100 mm², Le = 50 mm, 17 significant
digits, then a five-point fracture drop. Expected values are in reference-curves.csv with sources.
"""
import math

S0, LE = 100.0, 50.0


def invert(f, y, lo, hi):
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if f(mid) < y:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def write(name, stress_of_strain, e_max, points, rate):
    de = e_max / (points - 1)
    rows = []
    for i in range(points):
        e = i * de
        rows.append((stress_of_strain(e) * S0, e * LE, e / rate))
    f_last, x_last, t_last = rows[-1]
    for k in range(1, 6):
        rows.append((f_last * (1 - 0.99 * k / 5), x_last + k * de * LE * 0.01, t_last + k * 1e-3))
    with open(name, "w") as out:
        out.write("force_N,extension_mm,time_s\n")
        for f, x, t in rows:
            out.write("%.17g,%.17g,%.17g\n" % (f, x, t))


# Ramberg-Osgood, E = 200 GPa, sigma0.2 = 300 MPa, n = 10 (Ramberg & Osgood 1943).
E, S02, N = 200000.0, 300.0, 10.0
write("ramberg-osgood-n10.csv",
      lambda e: invert(lambda s: s / E + 0.002 * (s / S02) ** N, e, 0.0, 3000.0), 0.02, 3000, 0.00025)

# Stainless-like Ramberg-Osgood, E = 193 GPa, sigma0.2 = 250 MPa, n = 6.
E2, S2, N2 = 193000.0, 250.0, 6.0
write("ramberg-osgood-n6.csv",
      lambda e: invert(lambda s: s / E2 + 0.002 * (s / S2) ** N2, e, 0.0, 3000.0), 0.03, 3000, 0.00025)

# Hollomon K = 800 MPa, n = 0.2 after an elastic line (Considere criterion), as in AnalysisCurves.
K, NH, EH, EPS_A = 800.0, 0.2, 200000.0, 0.0005
SIG_A = K * EPS_A ** NH
U_EL = SIG_A / EH


def stress_u(u):
    if u <= U_EL:
        return EH * u
    ep = u - U_EL
    return K * max(ep, EPS_A) ** NH * math.exp(-ep)


def strain_u(u):
    return u if u <= U_EL else math.expm1(u - U_EL) + stress_u(u) / EH


write("hollomon-k800-n02.csv", lambda e: stress_u(invert(strain_u, e, 0.0, 1.0)), 0.35, 6000, 0.0067)

# Brittle: linear, E = 70 GPa, to 0.4 % strain.
write("brittle-linear-e70.csv", lambda e: 70000.0 * e, 0.004, 500, 0.00025)
