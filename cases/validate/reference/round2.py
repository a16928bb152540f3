#!/usr/bin/env python3
"""Write ../testdata/round2.txt: references for the second validation round
(round2_test.go), independent of turnpoint.

Sources, per case (the same format as references.txt: case quantity at value
digits):
  * closed forms, evaluated in mpmath at 40 digits and named beside each
    case; where the closed form was typed from memory, one point of it is
    re-derived here by refcore's Taylor shooter/integrator (check_closed);
  * refcore.scatter / refcore.level (Taylor integration at 40 digits), whose
    digits column comes from a second run at other precision and series degree;
  * for p (TM) polarisation a Taylor integrator of the untransformed TM system
    H' = eps G, G' = -k0^2 (1 - s^2/eps) H  (G = H'/eps), written below; the
    power coefficients come from the flux Im(conj(H) G), and every p value is
    cross-checked against refcore.scatter on the Liouville form
    u'' + (k0^2 (eps - s^2) + eps''/(2 eps) - 3/4 (eps'/eps)^2) u = 0.

Run:  python3 round2.py            (a few minutes)
"""
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))

from mpmath import mp, mpf, mpc, sqrt, sinh, cosh, cos, sin, pi, exp, fabs, log10, quad, radians  # noqa: E402
import refcore  # noqa: E402
from refcore import Jet, jexp, jsech2, jfermi, jtanh, scatter, level, evalseries  # noqa: E402

mp.dps = 40
rows = []


def emit(case, qty, at, val, digits):
    rows.append((case, qty, at, val, int(digits)))
    print(f"{case:24s} {qty:9s} {at:>10s} {mp.nstr(val, 25):>32s} {int(digits)}", flush=True)


def agree(a, b, cap=30):
    d = fabs(a - b) / fabs(b)
    return cap if d == 0 else min(cap, int(-log10(d)))


def check(name, a, b, tol=mpf("1e-20")):
    if fabs(a - b) > tol * fabs(b):
        raise SystemExit(f"{name}: {a} and {b} disagree")


# ------------------------------------------------------------ closed forms

def cosh2_T(E, U0, alpha, m, hbar):
    """Landau & Lifshitz, Quantum Mechanics, §25 problem 4 (checked against
    integration to 1e-25 in make_references.py)."""
    k = sqrt(2 * m * E) / hbar
    s = 8 * m * U0 / (hbar**2 * alpha**2)
    a = sinh(pi * k / alpha) ** 2
    b = cosh(pi / 2 * sqrt(s - 1)) ** 2 if s > 1 else cos(pi / 2 * sqrt(1 - s)) ** 2
    return a / (a + b)


def closed_scatter(name, at, T):
    emit(name, "R", at, 1 - T, 30)
    emit(name, "T", at, T, 30)


def run_closed():
    # Near the top of U0 sech^2(al x) from both sides, |E - U0|/U0 = 1e-3, 1e-6.
    U0, al, m, hb = mpf(2), mpf("0.9"), mpf(1), mpf("0.06")
    for E in ("1.998", "1.999998", "2.000002", "2.002"):
        closed_scatter("top-cosh2", E, cosh2_T(mpf(E), U0, al, m, hb))
    # Deep tunnelling through the same barrier at E = 0.5: T ~ 1e-40 and 1e-76.
    closed_scatter("deep-cosh2", "0.075", cosh2_T(mpf("0.5"), U0, al, m, mpf("0.075")))
    closed_scatter("deep-cosh2", "0.04", cosh2_T(mpf("0.5"), U0, al, m, mpf("0.04")))
    # General form y'' + lam^2 (1 - U sech^2 x) y = 0 is the same closed form
    # with 2m/hbar^2 = lam^2 (m = 1/2, hbar = 1/lam), alpha = 1, E = 1.
    for U, name in (("0.99", "lam-above"), ("1.01", "lam-below"), ("0.999999", "lam-top-above"), ("1.000001", "lam-top-below")):
        for lam in ("100", "1000"):
            closed_scatter(name, lam, cosh2_T(mpf(1), mpf(U), mpf(1), mpf("0.5"), 1 / mpf(lam)))

    # Morse D(1-exp(-a x))^2, high n: E_n = hw(n+1/2) - (hw(n+1/2))^2/(4D),
    # hw = hbar a sqrt(2D/m) (Morse, Phys. Rev. 34, 57 (1929); typed from
    # memory, re-derived below by shooting at n = 5, hbar = 0.05).
    D, a, m, hb = mpf(1), mpf(1), mpf(1), mpf("0.002")
    morse = lambda n, hb: (lambda hw: hw * (n + mpf(1) / 2) - (hw * (n + mpf(1) / 2)) ** 2 / (4 * D))(hb * a * sqrt(2 * D / m))
    for n in (100, 300, 600):
        emit("morse-high", "E", str(n), morse(n, hb), 30)
    QE = lambda E: (lambda x: 2 * m * (E - D * (1 - jexp(-a * x)) ** 2))
    Ec = morse(5, mpf("0.05"))
    E, nodes = level(QE, 20, -1.5, 9, mpf("0.2"), Ec * (1 + mpf("1e-4")), 5)
    assert nodes == 5
    check("morse closed form", E, Ec)

    # Poschl-Teller -V0 sech^2(al x), high n: E_n = -(hb^2 al^2/(8m))
    # (-(1+2n) + sqrt(1 + 8 m V0/(hb^2 al^2)))^2 (Landau & Lifshitz QM §23
    # problem 4; checked against shooting in make_references.py).
    V0, al, m, hb = mpf(1), mpf(1), mpf(1), mpf("0.005")
    sq = sqrt(1 + 8 * m * V0 / (hb**2 * al**2))
    for n in (100, 250):
        emit("pt-high", "E", str(n), -(hb**2 * al**2 / (8 * m)) * (-(1 + 2 * n) + sq) ** 2, 30)

    # Harmonic x^2/2, m = 1, hbar = 0.005: E_n = hbar (n + 1/2) (exact).
    for n in (250, 500):
        emit("harmonic-high", "E", str(n), mpf("0.005") * (n + mpf(1) / 2), 30)

    # Radial Coulomb well -1/r + hbar^2 l(l+1)/(2 r^2), m = 1, l = 4,
    # hbar = 0.2: E_n = -1/(2 hbar^2 (n + l + 1)^2) (hydrogen in units
    # e = m = 1; Landau & Lifshitz QM §36, typed from memory; re-derived
    # below by shooting at n = 0).
    hb, l = mpf("0.2"), 4
    for n in (0, 3, 10):
        emit("coulomb-l4", "E", str(n), -1 / (2 * hb**2 * (n + l + 1) ** 2), 30)
    save = mp.dps
    mp.dps = 30
    QE = lambda E: (lambda x: 2 * (E + 1 / x - hb**2 * l * (l + 1) / (2 * x * x)))
    Ec = -1 / (2 * hb**2 * (l + 1) ** 2)
    E, nodes = level(QE, 1 / hb, mpf("0.01"), 30, mpf("1.0"), Ec * (1 + mpf("1e-4")), 0, radial_l=None)
    assert nodes == 0
    check("coulomb closed form", E, Ec, tol=mpf("1e-14"))  # wall at r = 0.01: (0.01/0.55)^9
    mp.dps = save


# ------------------------------------------------------------ TM integrator

def propagate_tm(eps, s2, k0, x0, x1, H, G):
    """Integrate H' = eps G, G' = -k0^2 (1 - s2/eps) H from x0 to x1 by
    Taylor series, the step keeping the series tail below 10^-(dps+5)."""
    k2 = mpf(k0) ** 2
    x, x1 = mpf(x0), mpf(x1)
    sgn = 1 if x1 > x else -1
    tiny = mpf(10) ** (-(mp.dps + 5))
    N = refcore.ORDER
    while (x1 - x) * sgn > 0:
        e = eps(Jet.var(x, N)).c
        f = (1 - s2 / eps(Jet.var(x, N))).c
        h_ = [mpf(0) * H] * (N + 1)
        g_ = [mpf(0) * G] * (N + 1)
        h_[0], g_[0] = H, G
        for k in range(N):
            h_[k + 1] = mp.fsum(e[j] * g_[k - j] for j in range(k + 1)) / (k + 1)
            g_[k + 1] = -k2 * mp.fsum(f[j] * h_[k - j] for j in range(k + 1)) / (k + 1)
        scale = fabs(H) + fabs(G) / k0
        h = None
        for k in (N - 1, N):
            ck = fabs(h_[k]) + fabs(g_[k]) / k0
            if ck == 0:
                continue
            hk = (tiny * scale / ck) ** (mpf(1) / k)
            h = hk if h is None else min(h, hk)
        h = min(mpf("0.7") * (h if h is not None else fabs(x1 - x)), fabs(x1 - x))
        H, _ = evalseries(h_, sgn * h)
        G, _ = evalseries(g_, sgn * h)
        x += sgn * h
        if (x1 - x) * sgn < tiny:
            x = x1
    return H, G


def scatter_tm(eps, s2, k0, a, b):
    """TM R and T for incidence from the left; eps constant at a and b."""
    ea, eb = eps(Jet.var(a, 1)).c[0], eps(Jet.var(b, 1)).c[0]
    ka, kb = sqrt(ea - s2), sqrt(eb - s2)  # kx / k0 at the ends
    k0 = mpf(k0)
    H = mpc(1)
    G = 1j * k0 * kb * H / eb
    out = mp.im(mp.conj(H) * G)
    H, G = propagate_tm(eps, s2, k0, b, a, H, G)
    A = (H + ea * G / (1j * k0 * ka)) / 2
    B = (H - ea * G / (1j * k0 * ka)) / 2
    return fabs(B / A) ** 2, out / (fabs(A) ** 2 * k0 * mp.re(ka / ea))


def liouville(eps, s2, k0):
    """Q of the Liouville form u = H/sqrt(eps), with Q1 folded in as Q1/k0^2."""
    def Q(u):
        N = len(u.c) - 1
        e = eps(Jet.var(u.c[0], N + 2)).c
        E0 = Jet(e[:N + 1])
        E1 = Jet([(k + 1) * e[k + 1] for k in range(N + 1)])
        E2 = Jet([(k + 2) * (k + 1) * e[k + 2] for k in range(N + 1)])
        q1 = E2 / (2 * E0) - mpf(3) / 4 * (E1 / E0) * (E1 / E0)
        return E0 - s2 + q1 / mpf(k0) ** 2
    return Q


def graded(name, eps, n_in, angles, pol, a, b, k0=2 * pi):
    for ang in angles:
        s2 = (mpf(n_in) * sin(radians(mpf(ang)))) ** 2
        if pol == "s":
            R, T, _ = scatter(lambda x: eps(x) - s2, k0, a, b)
            save = mp.dps, refcore.ORDER
            mp.dps, refcore.ORDER = 44, 40
            R2, T2, _ = scatter(lambda x: eps(x) - s2, k0, a, b)
            mp.dps, refcore.ORDER = save
        else:
            R, T = scatter_tm(eps, s2, k0, a, b)
            R2, T2, _ = scatter(liouville(eps, s2, k0), k0, a, b)
        dR, dT = agree(R, R2), agree(T, T2)
        if min(dR, dT) < 15:
            raise SystemExit(f"{name} {ang}: two ways disagree: R {R} {R2}, T {T} {T2}")
        emit(name, "R", ang, R, dR)
        emit(name, "T", ang, T, dT)


def run_graded():
    mp.dps = 30
    # Epstein layer eps = 1 + 1.25/(1 + exp(-x/0.25)) at wavelength 1, n_in = 1;
    # 56.30993247402 degrees is Brewster's angle atan(1.5) of the sharp step.
    ep = lambda x: 1 + mpf("1.25") * jfermi(x / mpf("0.25"))
    angs = ("0", "30", "56.30993247402", "70")
    graded("epstein-p", ep, 1, angs, "p", -18, 18)
    graded("epstein-s", ep, 1, angs, "s", -18, 18)
    # tanh layer eps = 1.96 + 0.52 tanh(x/0.2), n_in = 1.2 (eps = 1.44 on the left).
    th = lambda x: mpf("1.96") + mpf("0.52") * jtanh(x / mpf("0.2"))
    graded("tanh-p", th, mpf("1.2"), ("40", "60"), "p", -8, 8)
    graded("tanh-s", th, mpf("1.2"), ("40", "60"), "s", -8, 8)
    # Frustrated total reflection: n = 1.5 on both sides, an eps = 1 gap of
    # half-width 1 with tanh edges of width 0.1; incidence beyond 41.8 degrees.
    gap = lambda x: mpf("2.25") - mpf("0.625") * (jtanh((x + 1) / mpf("0.1")) - jtanh((x - 1) / mpf("0.1")))
    graded("ftir-s", gap, mpf("1.5"), ("50", "65"), "s", -5, 5)
    graded("ftir-p", gap, mpf("1.5"), ("50", "65"), "p", -5, 5)
    # Absorbing graded layer: eps = 1.625 + 0.625 tanh(x/0.2) + 0.2 i exp(-(x/0.5)^2).
    ab = lambda x: mpf("1.625") + mpf("0.625") * jtanh(x / mpf("0.2")) + mpc(0, "0.2") * jexp(-(x / mpf("0.5")) * (x / mpf("0.5")))
    graded("absorb-s", ab, 1, ("0", "45"), "s", -8, 8)
    graded("absorb-p", ab, 1, ("45",), "p", -8, 8)


# ------------------------------------------------------------ levels

def bisect(f, lo, hi):
    """Root of an increasing f on [lo, hi] to 1e-12 (level guesses only)."""
    for _ in range(45):
        mid = (lo + hi) / 2
        if mp.re(f(mid)) < 0:
            lo = mid
        else:
            hi = mid
    return (lo + hi) / 2


def lev(name, QE, lam, a, b, xm, n, guess, parity=None, digits=25):
    E, nodes = level(QE, lam, a, b, xm, guess, n, parity=parity)
    if nodes != n:
        raise SystemExit(f"{name} n={n}: found {nodes} nodes at E={E}")
    emit(name, "E", str(n), E, digits)
    return E


def run_levels():
    mp.dps = 34
    # Double well (x^2-1)^2, m = 1, hbar = 0.06: parity shooting from x = 0;
    # guesses from the harmonic well at x = 1 (omega = sqrt 8).
    hb = mpf("0.06")
    QE = lambda E: (lambda x: 2 * (E - (x * x - 1) ** 2))
    Es = {}
    for n in (0, 1, 2, 3):
        g = hb * sqrt(8) * (n // 2 + mpf(1) / 2) * (1 - mpf("0.05") * (2 * (n // 2) + 1) * hb)
        Es[n] = lev("dw-small", QE, 1 / hb, 0, mpf("2.2"), mpf("0.9"), n, g,
                    parity="even" if n % 2 == 0 else "odd")
    for k in (0, 1):
        sp = Es[2 * k + 1] - Es[2 * k]
        emit("dw-small", "splitting", str(k), sp, int(25 - log10(Es[2 * k] / sp)))

    # Walls at x = -1 and 1 with 3x^2 inside, m = 1, hbar = 0.1; guesses by
    # Bohr-Sommerfeld (soft points below E = 3, walls above).
    hb = mpf("0.1")
    QE = lambda E: (lambda x: 2 * (E - 3 * x * x))

    def bs(n):
        def f(E):
            if E < 3:
                return quad(lambda x: sqrt(fabs(2 * (E - 3 * x * x))), [0, sqrt(E / 3)]) * 2 / (pi * hb) - (n + mpf(1) / 2)
            return quad(lambda x: sqrt(fabs(2 * (E - 3 * x * x))), [0, 1]) * 2 / (pi * hb) - (n + 1)
        return bisect(f, mpf("0.01"), mpf(20))
    for n in (0, 12, 25):
        lev("walls-x2", QE, 1 / hb, 0, 1, mpf("0.5"), n, bs(n), parity="even" if n % 2 == 0 else "odd")

    # Wall at 0 and x^3 beyond it, m = 1, hbar = 0.1 (Maslov 3).
    QE = lambda E: (lambda x: 2 * (E - x * x * x))

    def bs3(n):
        f = lambda E: quad(lambda x: sqrt(fabs(2 * (E - x**3))), [0, E ** (mpf(1) / 3)]) / (pi * hb) - (n + mpf(3) / 4)
        return bisect(f, mpf("0.01"), mpf(20))
    for n in (0, 4, 15):
        lev("wall-cubic", QE, 1 / hb, 0, mpf("3.2"), mpf("0.3"), n, bs3(n))


def run_asym():
    """Asymmetric barrier V1/(1+exp(-x/w1)) + V2 sech^2(x/w2), m = 1,
    hbar = 0.1 (Q(-inf) != Q(+inf)), at |E - Vtop| = 1e-3 and 1e-5 on both
    sides of its top (located here by findroot on V'); the energies are
    written rounded to 15 digits and the references are at those energies."""
    mp.dps = 40
    V1, w1, V2, w2, hb = mpf("0.5"), mpf("0.5"), mpf(1), mpf(1), mpf("0.1")
    V = lambda x: V1 / (1 + exp(-x / w1)) + V2 / cosh(x / w2) ** 2
    xt = mp.findroot(lambda x: mp.diff(V, x), mpf("0.2"))
    Vt = V(xt)
    print("asym top at", xt, "V =", Vt)
    for off in ("-1e-3", "-1e-5", "1e-5", "1e-3"):
        at = mp.nstr(Vt + mpf(off), 15)
        Ev = mpf(at)
        Q = lambda x, Ev=Ev: 2 * (Ev - V1 * jfermi(x / w1) - V2 * jsech2(x / w2))
        R, T, _ = scatter(Q, 1 / hb, -47, 47)
        save = mp.dps, refcore.ORDER
        mp.dps, refcore.ORDER = 44, 40
        R2, T2, _ = scatter(Q, 1 / hb, -47, 47)
        mp.dps, refcore.ORDER = save
        emit("asym-top", "R", at, R, agree(R, R2))
        emit("asym-top", "T", at, T, agree(T, T2))


def run_quartic():
    """x^4 well, m = 1/2, hbar = 1, high n by parity shooting from x = 0;
    guesses by Bohr-Sommerfeld E^(3/4) B(1/4, 3/2)/2 = pi (n + 1/2)."""
    mp.dps = 34
    QE = lambda E: (lambda x: E - x**4)
    for n in (100, 201):
        g = (pi * (n + mpf(1) / 2) / (mp.beta(mpf(1) / 4, mpf(3) / 2) / 2)) ** (mpf(4) / 3)
        lev("quartic-high", QE, 1, 0, mpf(9), mpf("1.0"), n, g, parity="even" if n % 2 == 0 else "odd")


def main():
    run_quartic()
    run_asym()
    run_closed()
    run_levels()
    run_graded()
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "testdata", "round2.txt")
    with open(out, "w") as f:
        f.write("# References for round2_test.go (round2.py): case quantity at value digits;\n")
        f.write("# 'at' is the scan value (energy, hbar, lambda, angle in degrees) or n.\n")
        for c, q, at, v, d in rows:
            f.write(f"{c} {q} {at} {mp.nstr(v, 30)} {d}\n")


if __name__ == "__main__":
    main()
