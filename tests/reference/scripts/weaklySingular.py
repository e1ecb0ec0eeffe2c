"""
Reference eigenvalues of the weakly singular kernels |t - s|^(-alpha) and -log|t - s| on [0, 1], independent of
Kernwright: product-integration Nystrom methods (K. E. Atkinson, The Numerical Solution of Integral Equations of the
Second Kind, 1997, ch. 4, product integration) in which the singular factor is integrated exactly against the
piecewise-polynomial interpolant of the eigenfunction.

  A_ij = integral over [0, 1] of K(t_i, s) L_j(s) ds,   L_j the Lagrange basis of panel-wise Gauss-Legendre nodes.

Near a node (the panel within one panel length of t_i) the integral is a closed form: u^k expanded in powers of
(u - x), and  integral |x - u|^(-alpha) (u - x)^m du  and  integral -log|x - u| (u - x)^m du  are elementary; these
are evaluated in mpmath at 40 digits (checked here against mpmath.quad). Far panels use 40-point Gauss-Legendre.

Eigenfunctions of these kernels behave like t^(1 - alpha) (and t log t) at the ends of the interval, so the mesh
is graded toward both ends. Two independent refinements are run:
  method A: geometric mesh (ratio 0.15) with growing number of layers and degree (hp; exponential convergence),
  method B: algebraically graded mesh t_k = (k/n)^q near each end, fixed degree, at n and 2n, Richardson-extrapolated
            with the observed rate.
The value committed is method A's finest; its error is ten times A's last level difference (at least 1e-13 of
lambda_1): A converges monotonically and geometrically from level to level. B is less accurate (algebraic rate);
|A - B| is committed as agreementAB, the independent check (about 1e-10 of lambda_1 or better for the leading
eigenvalues up to alpha = 0.9, looser for higher ones and for alpha = 0.99, where B's grading cannot keep up).

Run:  python3 tests/reference/scripts/weaklySingular.py  >  tests/reference/data/weaklySingular.json
"""
import json
import sys

import mpmath as mp
import numpy as np
from scipy.special import roots_jacobi

mp.mp.dps = 40
EIGS = 6


def moment_power(alpha, x, m):
    """integral over u in [-1, 1] of |x - u|^(-alpha) (u - x)^m du (mpmath)."""
    e = m + 1 - alpha
    if x >= 1:
        return (-1) ** m * ((x + 1) ** e - (x - 1) ** e) / e
    if x <= -1:
        return ((1 - x) ** e - (-1 - x) ** e) / e
    return ((1 - x) ** e + (-1) ** m * (1 + x) ** e) / e


def _ylog(L, m):
    """integral over y in [0, L] of -y^m log y dy."""
    if L == 0:
        return mp.mpf(0)
    return -(L ** (m + 1)) * (mp.log(L) / (m + 1) - mp.mpf(1) / (m + 1) ** 2)


def moment_log(x, m):
    """integral over u in [-1, 1] of -log|x - u| (u - x)^m du (mpmath)."""
    if x >= 1:
        return (-1) ** m * (_ylog(x + 1, m) - _ylog(x - 1, m))
    if x <= -1:
        return _ylog(1 - x, m) - _ylog(-1 - x, m)
    return _ylog(1 - x, m) + (-1) ** m * _ylog(1 + x, m)


def monomial_moments(kind, alpha, x, p):
    """M_k = integral over [-1, 1] of w(x - u) u^k du, k = 0..p, with u^k = sum C(k, m) x^(k - m) (u - x)^m."""
    mom = [moment_power(alpha, x, m) if kind == 'power' else moment_log(x, m) for m in range(p + 1)]
    out = []
    for k in range(p + 1):
        out.append(sum(mp.binomial(k, m) * x ** (k - m) * mom[m] for m in range(k + 1)))
    return out


def check_moments():
    """The closed forms against mpmath.quad, integrating on each side of the singular point in y = |u - x| = z^10
    (which makes the integrand smooth in z)."""
    for kind, alpha in (('power', mp.mpf('0.9')), ('power', mp.mpf('0.3')), ('log', None)):
        for x in (mp.mpf('-0.3'), mp.mpf('1.7'), mp.mpf(-1), mp.mpf('-2.5')):
            for m in (0, 3, 6):
                w = (lambda y: y ** (-alpha)) if kind == 'power' else (lambda y: -mp.log(y))
                q = mp.mpf(0)
                for sign, lo, hi in ((1, max(x, -1), 1), (-1, -1, min(x, 1))):
                    if hi <= lo:
                        continue
                    y0, y1 = sorted((abs(lo - x), abs(hi - x)))
                    f = lambda z: 10 * z ** 9 * w(z ** 10) * (sign * z ** 10) ** m
                    q += mp.quad(f, [y0 ** mp.mpf('0.1'), y1 ** mp.mpf('0.1')])
                c = moment_power(alpha, x, m) if kind == 'power' else moment_log(x, m)
                assert abs(q - c) < mp.mpf(10) ** -25 * max(1, abs(c)), (kind, x, m, q, c)


class Rules:
    def __init__(self, p):
        self.p = p
        g, _ = np.polynomial.legendre.leggauss(p + 1)
        self.nodes = g
        mpn = [mp.mpf(v) for v in g]
        V = mp.matrix(p + 1, p + 1)
        for i in range(p + 1):
            for k in range(p + 1):
                V[i, k] = mpn[i] ** k
        # Lagrange weights from monomial moments: w = V^{-T} M.
        self.VinvT = (V ** -1).T
        self.far_x, self.far_w = np.polynomial.legendre.leggauss(40)
        # Lagrange basis at the far-rule points.
        Vd = np.vander(g, p + 1, increasing=True)
        self.far_L = np.linalg.solve(Vd.T, np.vander(self.far_x, p + 1, increasing=True).T)  # (p+1) x 40
        # integral over [-1, 1] of L_j
        self.int_L = np.array([float(v) for v in self.VinvT * mp.matrix(
            [mp.mpf(2) / (k + 1) if k % 2 == 0 else 0 for k in range(p + 1)])])

    def near(self, kind, alpha, x):
        M = mp.matrix(monomial_moments(kind, alpha, mp.mpf(x), self.p))
        return np.array([float(v) for v in self.VinvT * M])


def jacobi01(n, alpha):
    """Gauss-Jacobi rule on [0, 1] for the weight v^(-alpha): exact for polynomials of degree 2n - 1."""
    xi, w = roots_jacobi(n, 0.0, -alpha)
    return (1 + xi) / 2, w * 2.0 ** (alpha - 1)


def lagrange_at(R, u):
    """Values L_j(u) of the panel's Lagrange basis (Legendre form), shape (len(u), p + 1)."""
    return np.polynomial.legendre.legvander(u, R.p) @ R.legcoef


def near_power(R, alpha, x):
    """integral over [-1, 1] of |x - u|^(-alpha) L_j(u) du for one x with |x| <= 1.5: exact Gauss-Jacobi pieces
    (the integrand is y^(-alpha) times a polynomial of degree p in y = |u - x|)."""
    v, w = R.jac

    def piece(L, sign):  # integral over y in [0, L] of y^(-alpha) L_j(x + sign y) dy
        if L <= 0:
            return np.zeros(R.p + 1)
        return L ** (1 - alpha) * (w @ lagrange_at(R, x + sign * L * v))

    if x >= 1:
        return piece(x + 1, -1) - piece(x - 1, -1)
    if x <= -1:
        return piece(1 - x, 1) - piece(-1 - x, 1)
    return piece(1 - x, 1) + piece(1 + x, -1)


def nystrom(breaks, p, kind, alpha):
    R = Rules(p)
    R.legcoef = np.linalg.inv(np.polynomial.legendre.legvander(R.nodes, p))  # legvander(u) @ legcoef = L_j(u)
    if kind == 'power':
        R.jac = jacobi01(p + 2, alpha)
    P = len(breaks) - 1
    pts = []
    for q in range(P):
        c, h = (breaks[q] + breaks[q + 1]) / 2, (breaks[q + 1] - breaks[q]) / 2
        pts.extend(c + h * R.nodes)
    pts = np.array(pts)
    N = len(pts)
    A = np.zeros((N, N))
    lim = 1.5 if kind == 'power' else 3
    for q in range(P):
        c, h = (breaks[q] + breaks[q + 1]) / 2, (breaks[q + 1] - breaks[q]) / 2
        cols = slice(q * (p + 1), (q + 1) * (p + 1))
        x = (pts - c) / h
        near = np.abs(x) <= lim
        # far: Gauss on the smooth integrand (a point at least half a panel away: 40 points reach rounding level)
        fx = x[~near][:, None] - R.far_x[None, :]
        if kind == 'power':
            kv = np.abs(h * fx) ** (-alpha)
        else:
            kv = -np.log(np.abs(h * fx))
        A[np.ix_(~near, np.arange(N)[cols])] = h * (kv * R.far_w[None, :]) @ R.far_L.T
        for i in np.nonzero(near)[0]:
            if kind == 'power':
                # h * integral |h (x - u)|^(-alpha) L_j(u) du
                A[i, cols] = h ** (1 - alpha) * near_power(R, alpha, x[i])
            else:
                xi = mp.mpf(pts[i] - c) / mp.mpf(h)
                A[i, cols] = h * R.near(kind, None, xi) - h * np.log(h) * R.int_L
    ev = np.linalg.eigvals(A)
    ev = ev[np.argsort(-ev.real)]
    return ev.real[:EIGS], float(np.max(np.abs(ev.imag[:EIGS]))), N


def geometric_mesh(layers, sigma=0.15, middle=4):
    """Panels graded geometrically (ratio sigma, `layers` layers) toward 0 and 1, `middle` equal panels between."""
    g = [0.5 * sigma ** k for k in range(layers, 0, -1)]
    core = list(np.linspace(0, 1, middle + 1))
    return np.array(sorted(set([0.0] + g + core + [1 - v for v in g] + [1.0])))


def algebraic_mesh(n, q):
    k = np.arange(n + 1) / n
    left = 0.5 * k ** q
    return np.array(sorted(set(list(left) + list(1 - left))))


def method_a(kind, alpha):
    seq = []
    for layers, p in ((8, 6), (11, 8), (14, 10), (17, 12)):
        ev, im, N = nystrom(geometric_mesh(layers), p, kind, alpha)
        seq.append(ev)
        print(f'  A layers={layers} p={p} N={N} im={im:.1e} ev={ev[:3]}', file=sys.stderr)
    return seq


def method_b(kind, alpha):
    p = 5
    q = 6.0 / (1 - alpha) if kind == 'power' else 6.0
    q = min(q, 30.0)
    vals = []
    for n in (12, 24, 48):
        ev, im, N = nystrom(algebraic_mesh(n, q), p, kind, alpha)
        vals.append(ev)
        print(f'  B n={n} q={q} N={N} ev={ev[:3]}', file=sys.stderr)
    v0, v1, v2 = vals
    d1, d2 = v1 - v0, v2 - v1
    with np.errstate(divide='ignore', invalid='ignore'):
        r = np.where(np.abs(d1) > 0, d2 / d1, 0.0)
    r = np.clip(r, 0.0, 0.9)
    extrap = v2 + d2 * r / (1 - r)
    return extrap, np.abs(d2)


def main():
    check_moments()
    cases = []
    for alpha in (0.1, 0.3, 0.49, 0.51, 0.6, 0.75, 0.9, 0.99):
        cases.append(('power', alpha, f'abs(t - s)^(-{alpha})'))
    cases.append(('log', None, '-log(abs(t - s))'))
    out = []
    for kind, alpha, text in cases:
        print(text, file=sys.stderr)
        a = method_a(kind, alpha)
        b, bdiff = method_b(kind, alpha)
        a_diff = np.abs(a[-1] - a[-2])
        agree = np.abs(a[-1] - b)
        err = np.maximum(10 * a_diff, 1e-13 * a[-1][0])
        out.append({
            'kernel': text, 'kind': kind, 'alpha': alpha,
            'eigenvalues': [float(v) for v in a[-1]],
            'error': [float(v) for v in err],
            'methodA_lastDifference': [float(v) for v in a_diff],
            'methodB_extrapolated': [float(v) for v in b],
            'agreementAB': [float(v) for v in agree],
        })
    json.dump({
        'source': 'tests/reference/scripts/weaklySingular.py: product-integration Nystrom (Atkinson 1997, ch. 4), '
                  'method A geometric hp mesh, method B algebraic grading with Richardson; value = A finest, '
                  'error = max(10 * A last difference, 1e-13 * lambda_1); agreementAB = |A - B|',
        'domain': [0, 1], 'cases': out}, sys.stdout, indent=1)


if __name__ == '__main__':
    main()
