#!/usr/bin/env python3
"""Write ../testdata/references.txt: independent high-precision references
for the validation cases of package cases/validate.

Every value is computed here from the equation itself (refcore.py: Taylor
integration in mpmath at 40 digits) or from a published closed form, never
from turnpoint. Where both exist the script computes both and stops if they
disagree beyond 1e-25, which validates the integrator. The case parameters
are the validation's own; validate_test.go builds the same cases as TOML.

Run everything at once (about 15 to 30 minutes on a loaded machine):
    python3 make_references.py
or in groups of a few minutes each, then merge the group files:
    python3 make_references.py scattering cosh2-barrier
    python3 make_references.py scattering smooth-step epstein-oblique
    python3 make_references.py scattering eckart-asym graded-bump gauss-barrier
    python3 make_references.py scattering double-barrier field-emission
    python3 make_references.py levels morse poschl-teller harmonic quartic linear-wall
    python3 make_references.py levels double-well double-well-asym radial-morse radial-harmonic
    python3 make_references.py levels double-well-deep double-well-top
    python3 make_references.py scattering field-emission-strong eckart-top general-q1
    python3 make_references.py merge
"""
import os
import sys
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))

from mpmath import mp, mpf, sqrt, sinh, cosh, cos, sin, pi, exp, log10, fabs, airyaizero, quad  # noqa: E402
import refcore  # noqa: E402
from refcore import jexp, jsech2, jfermi, jtanh, scatter, level  # noqa: E402

mp.dps = 40
rows = []
ONLY = set()  # scattering cases to run; empty means all


def want(name):
    return not ONLY or name in ONLY


def emit(case, qty, at, val, digits):
    rows.append((case, qty, at, val, int(digits)))
    print(f"{case:22s} {qty:9s} {at:>22s} {mp.nstr(val, 25):>32s} {int(digits)}", flush=True)


def agree_digits(a, b, cap):
    d = fabs(a - b) / fabs(b)
    return cap if d == 0 else min(cap, int(-log10(d)))


def check_closed(name, num, closed, tol=mpf("1e-25")):
    if fabs(num - closed) > tol * fabs(closed):
        raise SystemExit(f"{name}: integration {num} and closed form {closed} disagree")


# ---------------------------------------------------------------- scattering

def cosh2_T(E, U0, alpha, m, hbar):
    """Landau & Lifshitz, Quantum Mechanics, §25 problem 4."""
    k = sqrt(2 * m * E) / hbar
    s = 8 * m * U0 / (hbar**2 * alpha**2)
    a = sinh(pi * k / alpha) ** 2
    b = cosh(pi / 2 * sqrt(s - 1)) ** 2 if s > 1 else cos(pi / 2 * sqrt(1 - s)) ** 2
    return a / (a + b)


def step_R(k1, k2, alpha):
    """Landau & Lifshitz §25 problem 2 (smooth step, Epstein layer):
    Q goes from k1^2 to k2^2 as 1/(1+exp(-alpha x))."""
    return (sinh(pi * (k1 - k2) / alpha) / sinh(pi * (k1 + k2) / alpha)) ** 2


def scat(name, Q, lam, a, b, at, closed_R=None, closed_T=None, right="plane"):
    """R and T at 40 digits; the digits column comes from a second run with a
    different series degree and precision (or from the closed form).

    The interval must make the tails of Q below 1e-40: a tail of 1e-25
    changed R of the cosh^-2 barrier in the 18th digit."""
    if not want(name):
        return None, None
    R, T, _ = scatter(Q, lam, a, b, right)
    dR = dT = 30
    if closed_R is None:
        save = (mp.dps, refcore.ORDER)
        mp.dps, refcore.ORDER = 44, 40
        R2, T2, _ = scatter(Q, lam, a, b, right)
        mp.dps, refcore.ORDER = save
        dR = agree_digits(R, R2, 30)
        dT = agree_digits(T, T2, 30)
    if closed_R is not None:
        check_closed(name + " R", R, closed_R)
        R, dR = closed_R, 30
    if closed_T is not None:
        check_closed(name + " T", T, closed_T)
        T, dT = closed_T, 30
    emit(name, "R", at, R, dR)
    emit(name, "T", at, T, dT)
    return R, T


def run_scattering():
    # S1: cosh^-2 barrier, own parameters, below / at / above the top.
    U0, al, m, hb = mpf("1.5"), mpf("1.3"), mpf("0.7"), mpf("0.08")
    for E in ("0.6", "1.5", "1.9"):
        Ev = mpf(E)
        Q = lambda x, Ev=Ev: 2 * m * (Ev - U0 * jsech2(al * x))
        Tc = cosh2_T(Ev, U0, al, m, hb)
        scat("cosh2-barrier", Q, 1 / hb, -36, 36, E, closed_R=1 - Tc, closed_T=Tc)

    # S2: asymmetric Eckart-type barrier (step plus sech^2 hump), numerics only.
    V1, V2, w, m, hb = mpf("0.4"), mpf("1.2"), mpf("0.5"), mpf(1), mpf("0.1")
    for E in ("0.9", "1.35", "1.8"):
        Ev = mpf(E)
        Q = lambda x, Ev=Ev: 2 * m * (Ev - V1 * jfermi(x / w) - V2 * jsech2(x / (2 * w)))
        scat("eckart-asym", Q, 1 / hb, -46, 46, E)

    # S3: quantum smooth step U0/(1+exp(-alpha x)) above the step: tiny R.
    U0, al, m, hb = mpf("0.6"), mpf("2.5"), mpf(1), mpf("0.05")
    for E in ("0.7", "0.8"):
        Ev = mpf(E)
        Q = lambda x, Ev=Ev: 2 * m * (Ev - U0 * jfermi(al * x))
        k1, k2 = sqrt(2 * m * Ev) / hb, sqrt(2 * m * (Ev - U0)) / hb
        Rc = step_R(k1, k2, al)
        scat("smooth-step", Q, 1 / hb, -37, 37, E, closed_R=Rc, closed_T=1 - Rc)

    # S4: Epstein graded layer at oblique incidence, s waves:
    # eps(x) = 1 + (n2^2 - 1)/(1 + exp(-x/w)), theta = 35 deg in n_in = 1.
    n2, w, th = mpf("1.6"), mpf("0.08"), mpf(35) * pi / 180
    s2 = sin(th) ** 2
    for wl in ("0.1", "0.15", "0.25", "0.5", "1.2"):
        k0 = 2 * pi / mpf(wl)
        Q = lambda x: 1 + (n2**2 - 1) * jfermi(x / w) - s2
        Rc = step_R(k0 * sqrt(1 - s2), k0 * sqrt(n2**2 - s2), 1 / w)
        scat("epstein-oblique", Q, k0, -8, 8, wl, closed_R=Rc, closed_T=1 - Rc)

    # S5: a graded layer that is not Epstein: tanh step plus a Gaussian bump,
    # eps(x) = 1.69 + 0.6 tanh(x/w) + 0.3 exp(-(x/s)^2), theta = 20 deg.
    w, s, th = mpf("0.15"), mpf("0.5"), mpf(20) * pi / 180
    s2 = sin(th) ** 2
    for wl in ("0.2", "0.4", "0.8"):
        k0 = 2 * pi / mpf(wl)
        Q = lambda x: mpf("1.69") + mpf("0.6") * jtanh(x / w) + mpf("0.3") * jexp(-(x / s) * (x / s)) - s2
        scat("graded-bump", Q, k0, -8, 8, wl)

    # S6: Gaussian double barrier near a resonance.
    V0, d, s, m, hb = mpf("0.8"), mpf("1.2"), mpf("0.35"), mpf(1), mpf("0.08")

    def QD(Ev):
        return lambda x: 2 * m * (Ev - V0 * (jexp(-((x - d) / s) * ((x - d) / s)) + jexp(-((x + d) / s) * ((x + d) / s))))

    if want("double-barrier"):
        Eres, Ehalf = resonance(QD, 1 / hb, V0, d, s, m, hb)
    else:
        Eres = Ehalf = None
    for E in (Eres, Ehalf, "0.3") if Eres else ():
        scat("double-barrier", QD(mpf(E)), 1 / hb, -5, 5, E)

    # S7: field-emission barrier (W - F x)/(1 + exp(-x/delta)); exact Airy
    # outgoing wave at b where the potential is linear to 1e-23.
    W, de, m, hb, E = mpf("1.2"), mpf("0.15"), mpf(1), mpf("0.1"), mpf("0.6")
    for F in ("0.25", "0.4"):
        Fv = mpf(F)
        Q = lambda x, Fv=Fv: 2 * m * (E - (W - Fv * x) * jfermi(x / de))
        scat("field-emission", Q, 1 / hb, -14, 14, F, right=("airy", 2 * m * Fv))

    # S7b: the same field-emission barrier in strong fields, where the
    # energy nears and passes the top of the barrier.
    for F in ("0.7", "1.0"):
        Fv = mpf(F)
        Q = lambda x, Fv=Fv: 2 * m * (E - (W - Fv * x) * jfermi(x / de))
        scat("field-emission-strong", Q, 1 / hb, -14, 14, F, right=("airy", 2 * m * Fv))

    # S2b: the asymmetric Eckart-type barrier of S2 exactly at its top (the
    # energy is the maximum of V, rounded to 15 digits).
    V1, V2, w, m, hb = mpf("0.4"), mpf("1.2"), mpf("0.5"), mpf(1), mpf("0.1")
    if want("eckart-top"):
        V = lambda x: V1 / (1 + exp(-x / w)) + V2 / cosh(x / (2 * w)) ** 2
        xt = mp.findroot(lambda x: mp.diff(V, x), mpf("0.05"))
        Et = mp.nstr(V(xt), 15)
        Ev = mpf(Et)
        Q = lambda x: 2 * m * (Ev - V1 * jfermi(x / w) - V2 * jsech2(x / (2 * w)))
        scat("eckart-top", Q, 1 / hb, -46, 46, Et)

    # S9: the general form y'' + (lam^2 Q + Q1) y = 0 with a lambda-free term:
    # Q = 1 + 0.3 tanh(x) - 1.2 exp(-x^2), Q1 = 2 exp(-x^2), scanned over lam.
    for L in ("12", "20"):
        lam = mpf(L)
        Q = lambda x, lam=lam: (1 + mpf("0.3") * jtanh(x) - mpf("1.2") * jexp(-x * x)
                                + 2 * jexp(-x * x) / lam**2)
        scat("general-q1", Q, lam, -47, 47, L)

    # S8: Gaussian barrier deep below, at and above its top.
    V0, s, m, hb = mpf(1), mpf("0.8"), mpf(1), mpf("0.05")
    for E in ("0.3", "1.0", "1.3"):
        Ev = mpf(E)
        Q = lambda x, Ev=Ev: 2 * m * (Ev - V0 * jexp(-(x / s) * (x / s)))
        scat("gauss-barrier", Q, 1 / hb, -8, 8, E)


def resonance(QD, lam, V0, d, s, m, hb):
    """Energy of the resonance nearest 0.55 V0 (maximum of T, located by
    golden section on log T) and the energy above it where T = 1/2; both are
    rounded to 13 digits and returned as strings."""
    save = mp.dps, refcore.ORDER
    mp.dps, refcore.ORDER = 16, 24

    def T(E):
        return scatter(QD(mpf(E)), lam, -5, 5)[1]

    # Bohr-Sommerfeld between the inner turning points locates the resonances.
    def inner(E):
        V = lambda x: V0 * (exp(-((x - d) / s) ** 2) + exp(-((x + d) / s) ** 2))
        t = mp.findroot(lambda x: V(x) - E, d - s)
        return quad(lambda x: sqrt(max(0, 2 * m * (E - V(x)))), [-t, 0, t]) / hb / pi - mpf(1) / 2

    E0 = mpf("0.55") * V0
    n = int(mp.nint(inner(E0)))
    Ebs = mp.findroot(lambda E: inner(E) - n, E0)
    lo, hi = Ebs * (1 - mpf("0.02")), Ebs * (1 + mpf("0.02"))
    g = (sqrt(5) - 1) / 2
    a, b = lo, hi
    c, e = b - g * (b - a), a + g * (b - a)
    Tc, Te = T(c), T(e)
    for _ in range(40):
        if Tc > Te:
            b, e, Te = e, c, Tc
            c = b - g * (b - a)
            Tc = T(c)
        else:
            a, c, Tc = c, e, Te
            e = a + g * (b - a)
            Te = T(e)
        if b - a < mpf("1e-13"):
            break
    Eres = (a + b) / 2
    # half-width: T = 1/2 above the peak, by bisection on [Eres, hi]
    a, b = Eres, Eres + mpf("0.01")
    while T(b) > mpf("0.5"):
        b = Eres + 2 * (b - Eres)
    for _ in range(30):
        mid = (a + b) / 2
        if T(mid) > mpf("0.5"):
            a = mid
        else:
            b = mid
    mp.dps, refcore.ORDER = save
    return mp.nstr(Eres, 13), mp.nstr((a + b) / 2, 13)


# ---------------------------------------------------------------- levels

def lev(name, QE, lam, a, b, xm, n, guess, closed=None, radial_l=None, parity=None):
    if not want(name):
        return None
    E, nodes = level(QE, lam, a, b, xm, guess, n, radial_l=radial_l, parity=parity)
    if nodes != n:
        raise SystemExit(f"{name} n={n}: found {nodes} nodes at E={E}")
    digits = 25
    if closed is not None:
        check_closed(f"{name} E{n}", E, closed)
        E, digits = closed, 30
    emit(name, "E", str(n), E, digits)
    return E


def run_levels():
    mp.dps = 34
    # L1: Morse D(1 - exp(-a x))^2: Morse, Phys. Rev. 34, 57 (1929).
    D, a, m, hb = mpf(6), mpf("0.8"), mpf("1.3"), mpf("0.2")
    hw = hb * a * sqrt(2 * D / m)
    for n in (0, 2, 7):
        Ec = hw * (n + mpf(1) / 2) - (hw * (n + mpf(1) / 2)) ** 2 / (4 * D)
        QE = lambda E: (lambda x: 2 * m * (E - D * (1 - jexp(-a * x)) ** 2))
        lev("morse", QE, 1 / hb, -2, 14, mpf("0.3"), n, Ec * (1 + mpf("1e-3")), closed=Ec)

    # L2: Poschl-Teller -V0/cosh^2(alpha x): Landau & Lifshitz §23 problem 4.
    V0, al, m, hb = mpf(3), mpf("0.9"), mpf("0.8"), mpf("0.25")
    sq = sqrt(1 + 8 * m * V0 / (hb**2 * al**2))
    for n in (0, 1, 3, 8):
        Ec = -(hb**2 * al**2 / (8 * m)) * (-(1 + 2 * n) + sq) ** 2
        QE = lambda E: (lambda x: 2 * m * (E + V0 * jsech2(al * x)))
        lev("poschl-teller", QE, 1 / hb, -30, 30, mpf("0.05"), n, Ec * (1 + mpf("1e-3")), closed=Ec)

    # L3: harmonic 2.25 x^2, m = 2 (omega = 1.5), hbar = 0.3: E_n = hbar omega (n + 1/2).
    m, hb = mpf(2), mpf("0.3")
    for n in (0, 3, 8):
        Ec = hb * mpf("1.5") * (n + mpf(1) / 2)
        QE = lambda E: (lambda x: 2 * m * (E - mpf("2.25") * x * x))
        lev("harmonic", QE, 1 / hb, -5, 5, mpf("0.05"), n, Ec * (1 + mpf("1e-3")), closed=Ec)

    # L4: quartic -y'' + x^4 y = E y (hbar = 1, m = 1/2). Shooting; the
    # script also prints the difference from E0 = 1.0603620904841829 and
    # E1 = 3.7996730298013941 (typed from memory) as a sanity check.
    m, hb = mpf("0.5"), mpf(1)
    for n in (0, 1, 4, 10):
        # Bohr-Sommerfeld guess: E^(3/4) B(1/4, 3/2)/2 = pi (n + 1/2)
        g = (pi * (n + mpf(1) / 2) / (mp.beta(mpf(1) / 4, mpf(3) / 2) / 2)) ** (mpf(4) / 3)
        QE = lambda E: (lambda x: 2 * m * (E - x**4))
        E = lev("quartic", QE, 1 / hb, -6, 6, mpf("0.05"), n, g)
        if n <= 1 and E is not None:
            print("   memory check:", E - [mpf("1.0603620904841829"), mpf("3.7996730298013941")][n])

    # L5: linear potential F x above a hard wall at 0: E_n = a_n (hbar^2 F^2/2m)^(1/3),
    # a_n the zeros of Ai (DLMF §9.9; mpmath.airyaizero).
    F, m, hb = mpf("0.7"), mpf("1.2"), mpf("0.15")
    sc = (hb**2 * F**2 / (2 * m)) ** (mpf(1) / 3)
    for n in (0, 1, 5):
        Ec = -airyaizero(n + 1) * sc
        QE = lambda E: (lambda x: 2 * m * (E - F * x))
        lev("linear-wall", QE, 1 / hb, 0, 12, Ec / F / 2, n, Ec * (1 + mpf("1e-3")), closed=Ec)

    # L6: symmetric double well 1.5 (x^2 - 1)^2, m = 1, hbar = 0.15: levels and splittings.
    m, hb = mpf(1), mpf("0.15")
    QE = lambda E: (lambda x: 2 * m * (E - mpf("1.5") * (x * x - 1) ** 2))
    om = sqrt(mpf("1.5") * 8 / m)  # V'' at the minima = 12 * 1.5/... : 1.5*8 = 12
    Es = []
    for n in range(4):
        k = n // 2
        g = hb * om * (k + mpf(1) / 2)
        Es.append(lev("double-well", QE, 1 / hb, 0, 3.5, mpf("1.0"), n, g,
                      parity="even" if n % 2 == 0 else "odd"))
    if want("double-well"):
        emit("double-well", "splitting", "0", Es[1] - Es[0], 18)
        emit("double-well", "splitting", "1", Es[3] - Es[2], 18)

    # L6b: a deeper symmetric double well 2 (x^2 - 1)^2, hbar = 0.125: splittings ~1e-10.
    m, hb = mpf(1), mpf("0.125")
    QE = lambda E: (lambda x: 2 * m * (E - 2 * (x * x - 1) ** 2))
    om = sqrt(mpf(16) / m)
    Es = []
    for n in range(4):
        g = hb * om * (n // 2 + mpf(1) / 2) - hb**2 / 2
        Es.append(lev("double-well-deep", QE, 1 / hb, 0, 3.5, mpf("1.0"), n, g,
                      parity="even" if n % 2 == 0 else "odd"))
    if want("double-well-deep"):
        emit("double-well-deep", "splitting", "0", Es[1] - Es[0], 14)
        emit("double-well-deep", "splitting", "1", Es[3] - Es[2], 16)

    # L6c: the double well of L6 near and above its barrier top (V = 1.5 at x = 0).
    m, hb = mpf(1), mpf("0.15")
    QE = lambda E: (lambda x: 2 * m * (E - mpf("1.5") * (x * x - 1) ** 2))
    om = sqrt(mpf("1.5") * 8 / m)
    Es = {}
    for n in range(4, 8):
        g = hb * om * (n // 2 + mpf(1) / 2) - mpf("0.1") * (n // 2)
        Es[n] = lev("double-well-top", QE, 1 / hb, 0, 3.5, mpf("1.0"), n, g,
                    parity="even" if n % 2 == 0 else "odd")
    if want("double-well-top"):
        emit("double-well-top", "splitting", "2", Es[5] - Es[4], 18)

    # L7: asymmetric double well (x^2 - 1)^2 + 0.08 x, m = 1, hbar = 0.1.
    m, hb = mpf(1), mpf("0.1")
    QE = lambda E: (lambda x: 2 * m * (E - (x * x - 1) ** 2 - mpf("0.08") * x))
    om = sqrt(mpf(8) / m)
    guesses = [mpf("-0.08") + hb * om / 2, mpf("0.08") + hb * om / 2,
               mpf("-0.08") + 3 * hb * om / 2, mpf("0.08") + 3 * hb * om / 2]
    for n in range(4):
        lev("double-well-asym", QE, 1 / hb, -3, 3, mpf("-1.0") if n % 2 == 0 else mpf("1.0"), n,
            guesses[n] - hb * hb)

    # L8: radial Morse-like well with a centrifugal term, l = 1.
    l, D, a, re, m, hb = 1, mpf(4), mpf(1), mpf(2), mpf(1), mpf("0.15")
    QE = lambda E: (lambda r: 2 * m * (E - hb**2 * l * (l + 1) / (2 * m * r * r)
                                           - D * (1 - jexp(-a * (r - re))) ** 2))
    hw = hb * a * sqrt(2 * D / m)
    for n in (0, 2):
        g = hw * (n + mpf(1) / 2) - (hw * (n + mpf(1) / 2)) ** 2 / (4 * D) + hb**2 * l * (l + 1) / (2 * m * re**2)
        lev("radial-morse", QE, 1 / hb, mpf("1e-6"), 14, re, n, g, radial_l=l)

    # L9: radial harmonic l = 3: E = hbar omega (2n + l + 3/2) (closed form,
    # Landau & Lifshitz §33), omega = 1.2, m = 1, hbar = 0.25.
    l, om, m, hb = 3, mpf("1.2"), mpf(1), mpf("0.25")
    QE = lambda E: (lambda r: 2 * m * (E - hb**2 * l * (l + 1) / (2 * m * r * r) - m * om**2 * r * r / 2))
    for n in (0, 3):
        Ec = hb * om * (2 * n + l + mpf(3) / 2)
        lev("radial-harmonic", QE, 1 / hb, mpf("1e-6"), 7, sqrt(2 * Ec / (m * om * om)) / 2 + mpf("0.3"), n,
            Ec * (1 + mpf("1e-3")), closed=Ec, radial_l=l)


def merge():
    """Concatenate the group files references-*.txt into references.txt."""
    import glob
    here = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "testdata")
    lines = []
    for p in sorted(glob.glob(os.path.join(here, "references-*.txt"))):
        with open(p) as f:
            lines += [ln for ln in f if not ln.startswith("#")]
    with open(os.path.join(here, "references.txt"), "w") as f:
        f.write(HEADER)
        f.writelines(lines)
    print(f"merged {len(lines)} references", file=sys.stderr)


HEADER = ("# Independent high-precision references for cases/validate (make_references.py).\n"
          "# case quantity at value digits; 'at' is the scan value (energy, wavelength, F) or the\n"
          "# quantum number n; 'digits' are the significant digits the value is good to.\n")

if __name__ == "__main__":
    if sys.argv[1:] == ["merge"]:
        merge()
        sys.exit(0)
    t0 = time.time()
    which = sys.argv[1:2] or ["scattering", "levels"]
    ONLY.update(sys.argv[2:])
    if "scattering" in which:
        run_scattering()
    if "levels" in which:
        run_levels()
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "testdata",
                       "references-" + "-".join(sys.argv[1:]) + ".txt" if sys.argv[1:] else "references.txt")
    with open(out, "w") as f:
        f.write(HEADER)
        for r in rows:
            f.write(f"{r[0]} {r[1]} {r[2]} {mp.nstr(r[3], 30)} {r[4]}\n")
    print(f"wrote {out} in {time.time() - t0:.0f} s", file=sys.stderr)
