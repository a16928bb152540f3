"""References for round3_test.go, written to ../testdata/round3.txt.

Run: python3 round3.py > ../testdata/round3.txt   (mpmath, 40 digits)

Sources:
  zeros      mpmath.polyroots (polynomials, 40 digits, 200 iterations) and
             closed forms: E - V0 exp(-x^2) = 0 at x = ±i sqrt(ln(E/V0)) for
             E > V0; 1 - X sech^2 x = 0 at cosh x = ±sqrt(X); the poles of
             sech^2 x at i pi/2 + i k pi (double poles of Q).
  angles     local expansion Q ≈ a (x - t)^m at a zero of order m:
             w = 2 sqrt(a) (x - t)^((m+2)/2) / (m + 2), so a Stokes line
             (Re w = 0) starts at θ = (π/2 + kπ - arg(a)/2)·2/(m + 2) and an
             anti-Stokes line (Im w = 0) at θ = (kπ - arg(a)/2)·2/(m + 2),
             k = 0 … m + 1; a = Q^(m)(t)/m! by mpmath.diff.
  gap        ∫_{-√E}^{√E} sqrt(x^2 - E) dx = ± iπE/2 (closed form; magnitude).
  eckart T   Eckart (1930) closed form for V = A ξ/(1+ξ) + B ξ/(1+ξ)^2,
             ξ = exp(x/L): T = 1 - [cosh 2π(α-β) + cosh 2πδ]/[cosh 2π(α+β)
             + cosh 2πδ], α = k1 L, β = k2 L, δ = sqrt(2mBL²/ħ² - 1/4);
             checked in the comment of round3_test.go against the sech²
             (Landau & Lifshitz §25 problem 4) and step (§25 problem 2) limits.
  parabolic  y'' + λ²(x² - ε) y = 0: with x = u/sqrt(2λ) it is Weber's
             y'' + (u²/4 - a) y = 0, a = λε/2, whose exact transmission is
             T = 1/(1 + exp(2πa)) (Kemble 1935) = 1/(1 + exp(πλε)).
  morse E    E_n = ħω(n+½) - (ħω(n+½))²/(4D), ω = a sqrt(2D/m) (Morse 1929).
  pt E       E_n = -(ħ²α²/2m)(s - n)², s = -½ + sqrt(¼ + 2mV0/(α²ħ²))
             (Landau & Lifshitz §23 problem 4).
"""
from mpmath import mp, mpf, mpc, polyroots, sqrt, log, exp, cosh, acosh, pi, diff, arg, factorial, sin

mp.dps = 40
out = []


def emit(name, qty, at, v, digits):
    out.append("%s %s %s %s %d" % (name, qty, at, mp.nstr(v, 30), digits))


def zeros_and_angles(name, zs, q, orders):
    for i, (t, m) in enumerate(zip(zs, orders)):
        emit(name, "re", str(i), mpf(t.real), 30)
        emit(name, "im", str(i), mpf(t.imag), 30)
        a = diff(q, t, m) / factorial(m)
        for fam, off in (("stokes", pi / 2), ("anti", 0)):
            for k in range(m + 2):
                th = (off + k * pi - arg(a) / 2) * 2 / (m + 2)
                emit(name, fam, "%d.%d" % (i, k), th * 180 / pi, 25)


# Degree 6, complex coefficients (highest power first for polyroots).
c6 = [1, 0, 0, mpc("0.5", "0.3"), 0, mpc("-1", "0.2"), mpc(0, "0.7")]
z6 = polyroots(c6, maxsteps=200, extraprec=200)
q6 = lambda x: x**6 + mpc("0.5", "0.3") * x**3 - mpc("1", "-0.2") * x + mpc(0, "0.7")
z6 = sorted(z6, key=lambda z: (float(z.real), float(z.imag)))
zeros_and_angles("poly6", z6, q6, [1] * 6)

# Double zero at 0.5, simple at -1.2, near-double pair 1.5 ± 0.001 i.
qd = lambda x: (x - mpf("0.5"))**2 * (x + mpf("1.2")) * ((x - mpf("1.5"))**2 + mpf("1e-6"))
zd = [mpf("-1.2"), mpf("0.5"), mpc("1.5", "-0.001"), mpc("1.5", "0.001")]
zeros_and_angles("double", zd, qd, [1, 2, 1, 1])

# A pair 2e-6 apart, a triple zero, a complex double zero (exact by construction).
qn = lambda x: (x + mpf("0.7")) * ((x - mpf("0.4"))**2 + mpf("1e-12"))
zeros_and_angles("near-pair", [mpf("-0.7"), mpc("0.4", "-1e-6"), mpc("0.4", "1e-6")], qn, [1, 1, 1])
qt = lambda x: (x - mpf("0.3"))**3 * (x + 1)
zeros_and_angles("triple", [mpf(-1), mpf("0.3")], qt, [1, 3])
t2 = mpc("0.3", "0.4")
qc = lambda x: (x - t2)**2 * (x + 1)
zeros_and_angles("cdouble", [mpf(-1), t2], qc, [1, 2])

# Gaussian barrier below its top energy: Q = 1.5 - exp(-x^2), zeros ±i sqrt(ln 1.5).
qg = lambda x: mpf("1.5") - exp(-x**2)
y = sqrt(log(mpf("1.5")))
zeros_and_angles("gauss-above", [mpc(0, -y), mpc(0, y)], qg, [1, 1])

# 1 - 0.5 sech^2 x: cos y = ±sqrt(0.5) on the imaginary axis: ±iπ/4, ±3iπ/4.
qs = lambda x: 1 - mpf("0.5") / cosh(x)**2
zs = [mpc(0, -3 * pi / 4), mpc(0, -pi / 4), mpc(0, pi / 4), mpc(0, 3 * pi / 4)]
zeros_and_angles("sech2-above", zs, qs, [1, 1, 1, 1])
emit("sech2-above", "pole", "0", -pi / 2, 30)
emit("sech2-above", "pole", "1", pi / 2, 30)
# 1 - 1.5 sech^2 x: real zeros ±acosh(sqrt 1.5).
r = acosh(sqrt(mpf("1.5")))
qs2 = lambda x: 1 - mpf("1.5") / cosh(x)**2
zeros_and_angles("sech2-below", [mpc(-r, 0), mpc(r, 0)], qs2, [1, 1])

# Gap for Q = x^2 - E.
for E in ("1.3", "0.25"):
    emit("gap", "im", E, pi * mpf(E) / 2, 30)


# Eckart asymmetric, mass 1.7, hbar 0.08, L = 0.6, A = 0.4, B = 2.5.
def eckart(E, A="0.4", B="2.5", L="0.6", m="1.7", hb="0.08"):
    E, A, B, L, m, hb = map(mpf, (E, A, B, L, m, hb))
    k1 = sqrt(2 * m * E) / hb
    k2 = sqrt(2 * m * (E - A)) / hb
    a, b = k1 * L, k2 * L
    d = sqrt(2 * m * B * L**2 / hb**2 - mpf(1) / 4)
    return 1 - (cosh(2 * pi * (a - b)) + cosh(2 * pi * d)) / (cosh(2 * pi * (a + b)) + cosh(2 * pi * d))


for E in ("0.7", "0.83", "0.9"):
    T = eckart(E)
    emit("eckart-m", "T", E, T, 30)
    emit("eckart-m", "R", E, 1 - T, 30)

for eps in ("0.3", "-0.2", "0.05"):
    T = 1 / (1 + exp(pi * 4 * mpf(eps)))  # lambda = 4
    emit("parabolic", "T", eps, T, 30)
    emit("parabolic", "R", eps, 1 - T, 30)

# Morse D = 3, a = 1.3, m = 2.5, hbar = 0.01.
D, a, m, hb = mpf(3), mpf("1.3"), mpf("2.5"), mpf("0.01")
w = a * sqrt(2 * D / m)
for n in (150, 250):
    x = hb * w * (n + mpf(1) / 2)
    emit("morse-m8", "E", str(n), x - x**2 / (4 * D), 30)

# Poschl-Teller V0 = 2, al = 1.1, m = 1.7, hbar = 0.2: s = 7.21..., top n = 7.
V0, al, m, hb = mpf(2), mpf("1.1"), mpf("1.7"), mpf("0.2")
s = -mpf(1) / 2 + sqrt(mpf(1) / 4 + 2 * m * V0 / (al**2 * hb**2))
for n in range(int(s) - 1, int(s) + 1):
    emit("pt-top", "E", str(n), -(hb**2 * al**2 / (2 * m)) * (s - n)**2, 30)
out.append("# pt-top s = %s" % mp.nstr(s, 20))

print("# References for round3_test.go (round3.py): case quantity at value digits.")
print("\n".join(out))
