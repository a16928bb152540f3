"""High-precision integration of y'' + lam^2 Q(x) y = 0, independent of turnpoint.

Everything here is written from scratch on top of mpmath: a small truncated
Taylor series class (Jet), a Taylor-series integrator for the linear equation
whose step is chosen so that the series tail is below 10^-(dps+5), and on top
of it the two references the validation needs:

  scatter(...)  R and T of a wave incident from the left (flux-normalised);
  level(...)    a bound-state energy by two-sided shooting with node count.

The Taylor coefficients of the solution follow from those of Q exactly:
  (k+2)(k+1) c_{k+2} = -lam^2 sum_j Q_j c_{k-j},
so the only approximation is the truncation of the series, which is
monitored at every step.
"""
from mpmath import mp, mpf, mpc, sqrt, exp, fabs, pi, airyai, airybi

ORDER = 48  # degree of the Taylor series per step


class Jet:
    """Truncated Taylor series c[0] + c[1] t + ... + c[N] t^N."""

    __slots__ = ("c",)

    def __init__(self, c):
        self.c = c

    @staticmethod
    def var(x0, n=None):
        n = ORDER if n is None else n
        c = [mpf(0)] * (n + 1)
        c[0] = mpf(x0)
        c[1] = mpf(1)
        return Jet(c)

    @staticmethod
    def const(v, n):
        c = [mpf(0)] * (n + 1)
        c[0] = v
        return Jet(c)

    def _lift(self, o):
        return o if isinstance(o, Jet) else Jet.const(o, len(self.c) - 1)

    def __add__(self, o):
        o = self._lift(o)
        return Jet([a + b for a, b in zip(self.c, o.c)])

    __radd__ = __add__

    def __neg__(self):
        return Jet([-a for a in self.c])

    def __sub__(self, o):
        return self + (-self._lift(o))

    def __rsub__(self, o):
        return self._lift(o) - self

    def __mul__(self, o):
        if not isinstance(o, Jet):
            return Jet([a * o for a in self.c])
        n = len(self.c)
        a, b = self.c, o.c
        return Jet([mp.fsum(a[j] * b[k - j] for j in range(k + 1)) for k in range(n)])

    __rmul__ = __mul__

    def __truediv__(self, o):
        if not isinstance(o, Jet):
            return Jet([a / o for a in self.c])
        n = len(self.c)
        a, b = self.c, o.c
        q = [mpf(0)] * n
        for k in range(n):
            s = a[k] - mp.fsum(q[j] * b[k - j] for j in range(k))
            q[k] = s / b[0]
        return Jet(q)

    def __rtruediv__(self, o):
        return self._lift(o) / self

    def __pow__(self, p):
        assert isinstance(p, int) and p >= 0
        r = Jet.const(mpf(1), len(self.c) - 1)
        for _ in range(p):
            r = r * self
        return r


def jexp(u):
    """exp of a jet: e' = u' e."""
    n = len(u.c)
    e = [mpf(0)] * n
    e[0] = exp(u.c[0])
    for k in range(1, n):
        e[k] = mp.fsum(j * u.c[j] * e[k - j] for j in range(1, k + 1)) / k
    return Jet(e)


def jsech2(u):
    """sech(u)^2 = 4 e^{-2u} / (1 + e^{-2u})^2 (use e^{-2|u|} for range)."""
    if u.c[0] < 0:
        u = -u
    e = jexp(-2 * u)
    return 4 * e / ((1 + e) * (1 + e))


def jfermi(u):
    """1 / (1 + exp(-u))."""
    if u.c[0] >= 0:
        return 1 / (1 + jexp(-u))
    e = jexp(u)
    return e / (1 + e)


def jtanh(u):
    return 2 * jfermi(2 * u) - 1


def evalseries(c, h):
    """Value and derivative of sum c_k h^k."""
    y = mpf(0) * c[0]
    d = mpf(0) * c[0]
    for k in range(len(c) - 1, 0, -1):
        y = y * h + c[k]
        d = d * h + k * c[k]
    y = y * h + c[0]
    return y, d


def step_coeffs(qjet, lam2, y0, d0):
    n = len(qjet.c)
    f = [-lam2 * q for q in qjet.c]
    c = [mpf(0) * y0] * n
    c[0], c[1] = y0, d0
    for k in range(n - 2):
        c[k + 2] = mp.fsum(f[j] * c[k - j] for j in range(k + 1)) / ((k + 1) * (k + 2))
    return c


def propagate(Q, lam, x0, x1, y, d, hmax=None, nodes=False):
    """Integrate y'' = -lam^2 Q(x) y from x0 to x1 (either direction).

    Q is a function of a Jet returning a Jet. Returns (y, y', node count,
    steps). The step h makes the last two terms of the series below
    10^-(dps+5) of the solution's size."""
    lam2 = mpf(lam) ** 2
    x = mpf(x0)
    x1 = mpf(x1)
    sgn = 1 if x1 > x else -1
    eps = mpf(10) ** (-(mp.dps + 5))
    count = 0
    steps = 0
    while (x1 - x) * sgn > 0:
        qj = Q(Jet.var(x))
        c = step_coeffs(qj, lam2, y, d)
        scale = fabs(y) + fabs(d) / (lam * sqrt(fabs(qj.c[0])) + 1)
        h = None
        for k in (ORDER - 1, ORDER):
            ck = fabs(c[k])
            if ck == 0:
                continue
            hk = (eps * scale / ck) ** (mpf(1) / k)
            h = hk if h is None else min(h, hk)
        if h is None:
            h = fabs(x1 - x)
        h = h * mpf("0.7")
        if hmax is not None:
            h = min(h, mpf(hmax))
        h = min(h, fabs(x1 - x))
        yn, dn = evalseries(c, sgn * h)
        if nodes and mp.re(yn) * mp.re(y) < 0:
            count += 1
        y, d = yn, dn
        x += sgn * h
        steps += 1
        if (x1 - x) * sgn < eps:
            x = x1
    return y, d, count, steps


def scatter(Q, lam, a, b, right="plane"):
    """R and T for a wave incident from the left on [a, b].

    Q must be constant (to working precision) at a; at b either constant
    (right="plane": y = Q_b^{-1/4} e^{i lam sqrt(Q_b)(x-b)}) or a tuple
    ("airy", slope) when Q is exactly linear near b with Q' = slope > 0 there,
    in which case the exact outgoing wave Ai(-z) - i Bi(-z) is used. T is the
    ratio of transmitted to incident flux, R = |r|^2; both are free of the
    phase conventions."""
    lam = mpf(lam)
    qa = Q(Jet.var(a, 1)).c[0]
    qb = Q(Jet.var(b, 1)).c[0]
    if right == "plane":
        kb = sqrt(qb)
        y = mpc(1) / sqrt(kb)
        d = 1j * lam * kb * y
    else:
        slope = mpf(right[1])
        # y'' + lam^2 (qb + slope (x - b)) y = 0: z = -(lam^2 slope)^(1/3) (x - b + qb/slope)
        s = (lam**2 * slope) ** (mpf(1) / 3)
        z = -s * (qb / slope)
        y = airyai(z) - 1j * airybi(z)
        d = -s * (airyai(z, 1) - 1j * airybi(z, 1))
    flux_out = mp.im(mp.conj(y) * d)
    y, d, _, steps = propagate(Q, lam, b, a, y, d)
    ka = sqrt(qa)
    # y = A ka^{-1/2} e^{i lam ka (x-a)} + B ka^{-1/2} e^{-i lam ka (x-a)} at x = a
    A = (y + d / (1j * lam * ka)) / 2 * sqrt(ka)
    B = (y - d / (1j * lam * ka)) / 2 * sqrt(ka)
    R = fabs(B / A) ** 2
    T = flux_out / (lam * fabs(A) ** 2)
    return R, T, steps


def level(Q_of_E, lam, a, b, xm, E0, n, left="decay", right="decay", radial_l=None, parity=None):
    """Bound-state energy with n nodes by two-sided shooting.

    Q_of_E(E) returns Q as a jet function; the left solution starts at a
    (y=0, y'=1 for a wall or for a point deep in the forbidden region, whose
    error is the exponentially small e^{-2 lam int |Q|^1/2}; or the regular
    Frobenius start r^{l+1} when radial_l is set), the right one at b, and the
    Wronskian at xm is zeroed by the secant method. For an even potential,
    parity "even" or "odd" starts the left solution at a = 0 with y' = 0 or
    y = 0 and counts the nodes of the whole line. Returns (E, node count)."""
    lam = mpf(lam)

    def shoot(E):
        Q = Q_of_E(E)
        if parity is not None:
            y0, d0 = (mpf(1), mpf(0)) if parity == "even" else (mpf(0), mpf(1))
        elif radial_l is not None:
            l = radial_l
            y0, d0 = mpf(a) ** (l + 1), (l + 1) * mpf(a) ** l
        else:
            y0, d0 = mpf(0), mpf(1)
        yl, dl, nl, _ = propagate(Q, lam, a, xm, y0, d0, nodes=True)
        yr, dr, nr, _ = propagate(Q, lam, b, xm, mpf(0), mpf(-1), nodes=True)
        nrm = sqrt(yl**2 + (dl / lam) ** 2) * sqrt(yr**2 + (dr / lam) ** 2)
        nodes = nl + nr
        if parity is not None:
            nodes = 2 * nodes + (1 if parity == "odd" else 0)
        return (yl * dr - dl * yr) / (lam * nrm), nodes

    E = mp.findroot(lambda e: shoot(e)[0], (mpf(E0), mpf(E0) * (1 + mpf("1e-6")) + mpf("1e-9")),
                    solver="secant", tol=mpf(10) ** (-2 * mp.dps + 10), maxsteps=100)
    _, nodes = shoot(E)
    return E, nodes
