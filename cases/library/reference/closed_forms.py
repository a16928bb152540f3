#!/usr/bin/env python3
"""Closed-form reference values for the bundled cases of turnpoint.

Each function is a published closed form; mpmath (Debian's python3-mpmath)
evaluates it at 30 significant digits, so the values carried by the case files
as expectations are limited by the formula, not by rounding. Run
`python3 closed_forms.py` to print every value the case files quote; the
tests of the project never run this script.
"""
from mpmath import mp, mpf, sqrt, sinh, cosh, cos, pi, airyaizero

mp.dps = 30


def cosh2_barrier_T(E, U0, alpha, m, hbar):
    """Transmission of U0/cosh^2(alpha x): Landau & Lifshitz, Quantum
    Mechanics, §25, problem 4."""
    k = sqrt(2 * m * E) / hbar
    s = 8 * m * U0 / (hbar**2 * alpha**2)
    a = sinh(pi * k / alpha) ** 2
    if s > 1:
        b = cosh(pi / 2 * sqrt(s - 1)) ** 2
    else:
        b = cos(pi / 2 * sqrt(1 - s)) ** 2
    return a / (a + b)


def smooth_step_R(E, U0, alpha, m, hbar):
    """Reflection of U0/(1 + exp(-alpha x)) above the step: Landau & Lifshitz,
    Quantum Mechanics, §25, problem 2."""
    k1 = sqrt(2 * m * E) / hbar
    k2 = sqrt(2 * m * (E - U0)) / hbar
    return (sinh(pi * (k1 - k2) / alpha) / sinh(pi * (k1 + k2) / alpha)) ** 2


def epstein_R(wavelength, n1, n2, w, angle_deg=0, n_in=1):
    """The same formula in optical form (the Epstein layer): n^2 goes from n1^2
    to n2^2 as 1/(1 + exp(-x/w)); s-polarisation at angle theta in n_in."""
    k0 = 2 * pi / wavelength
    s2 = (n_in * mp.sin(angle_deg * pi / 180)) ** 2
    k1 = k0 * sqrt(n1**2 - s2)
    k2 = k0 * sqrt(n2**2 - s2)
    return (sinh(pi * w * (k2 - k1)) / sinh(pi * w * (k1 + k2))) ** 2


def morse_E(n, D, a, m, hbar):
    """Levels of D(1 - exp(-a x))^2 (Morse, Phys. Rev. 34, 57 (1929))."""
    hw = hbar * a * sqrt(2 * D / m)
    return hw * (n + mpf(1) / 2) - (hw * (n + mpf(1) / 2)) ** 2 / (4 * D)


def poschl_teller_E(n, V0, alpha, m, hbar):
    """Levels of -V0/cosh^2(alpha x): Landau & Lifshitz, Quantum Mechanics,
    §23, problem 4."""
    s = sqrt(1 + 8 * m * V0 / (hbar**2 * alpha**2))
    return -(hbar**2 * alpha**2 / (8 * m)) * (-(1 + 2 * n) + s) ** 2


def floor_field_E(n, F, m, hbar):
    """Levels of V = F x above a hard wall at x = 0: E_n = (hbar^2 F^2/2m)^(1/3)
    (-a_(n+1)), a_k the zeros of Ai (DLMF §9.9)."""
    return (hbar**2 * F**2 / (2 * m)) ** (mpf(1) / 3) * (-airyaizero(n + 1))


def main():
    print("cosh-barrier: U0=1 alpha=1 m=1 hbar=0.1")
    for E in ["0.5", "0.8", "1.0", "1.2"]:
        print("  T(E=%s) = %s" % (E, mp.nstr(cosh2_barrier_T(mpf(E), 1, 1, 1, mpf("0.1")), 17)))
    print("smooth-step: U0=1 alpha=1 m=1 hbar=0.2")
    for E in ["1.1", "1.3", "1.6"]:
        print("  R(E=%s) = %s" % (E, mp.nstr(smooth_step_R(mpf(E), 1, 1, 1, mpf("0.2")), 17)))
    print("epstein-coating: n1=1 n2=1.52 w=0.1 (micrometres), normal incidence")
    for lam in ["0.3", "0.55", "1.0"]:
        print("  R(lambda0=%s) = %s" % (lam, mp.nstr(epstein_R(mpf(lam), 1, mpf("1.52"), mpf("0.1")), 17)))
    print("morse-diatomic: D=1 a=1 m=1 hbar=0.05")
    for n in [0, 1, 5, 10, 15]:
        print("  E_%d = %s" % (n, mp.nstr(morse_E(n, 1, 1, 1, mpf("0.05")), 17)))
    print("poschl-teller-well: V0=1 alpha=1 m=1 hbar=0.1")
    for n in [0, 1, 3, 6]:
        print("  E_%d = %s" % (n, mp.nstr(poschl_teller_E(n, 1, 1, 1, mpf("0.1")), 17)))
    print("floor-field: F=1 m=1 hbar=1")
    for n in [0, 1, 2, 3, 4]:
        print("  E_%d = %s" % (n, mp.nstr(floor_field_E(n, 1, 1, 1), 17)))
    print("harmonic-trap: V=x^2/2 m=1 hbar=0.1: E_n = 0.1 (n + 1/2) exactly")
    print("radial-oscillator: V=r^2/2 + hbar^2 (l+1/2)^2/(2 r^2), l=2, hbar=0.2: E_n = 0.2 (2n + l + 3/2) exactly")


if __name__ == "__main__":
    main()
