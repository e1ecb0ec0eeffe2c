"""Reference figures for tests/reference/scale.test.ts: kernels near the ends of the double range.

Run: python3 tests/reference/scripts/scale.py > tests/reference/data/scale.json   (mpmath 1.3)

Every case is c * K0(t, s) on [0, 1], with c the double nearest the constant as written (so the reference is
the kernel the program reads), and K0 one of:

- exp(-|t - s|): on [-a, a] (here a = 1/2, shifted to [0, 1]) the eigenvalues are lambda = 2 / (1 + w^2), where
  w solves 1 - w tan(w a) = 0 (even eigenfunctions cos(w x)) or w + tan(w a) = 0 (odd, sin(w x)): H. L. Van Trees,
  Detection, Estimation and Modulation Theory, Part I, 1968, section 3.4 (the exponential covariance example),
  and R. Ghanem & P. Spanos, Stochastic Finite Elements: A Spectral Approach, 1991, section 2.3 (both from memory).
  The roots come from mpmath.findroot at 40 digits; method two: each pair (lambda, eigenfunction) is checked by
  evaluating the eigen-equation integral  int K0(x, y) phi(y) dy  with mpmath.quad (split at the kink) at three
  points; the largest residual is written to the JSON. Trace = 1; HS norm^2 = int int exp(-2|t - s|) =
  2 int_0^1 (1 - u) exp(-2u) du, in closed form and by mpmath.quad (agreement written).
- t*s: rank one, lambda = 1/3, HS norm 1/3, trace 1/3 (common practice).
- t + s: rank two, the degenerate-kernel matrix [[1/2, 1], [1/3, 1/2]] has eigenvalues 1/2 +- 1/sqrt(3)
  (common practice); HS norm^2 = int int (t + s)^2 = 7/6; trace = 1.
- exp(t*s - 740): no closed form; Gauss-Legendre Nystrom (symmetrised W^1/2 K W^1/2, mpmath.eigsy) at 24 and 32
  points (analytic kernel: the two agree to the digits written); trace and HS norm by mpmath.quad.
"""
import json
from mpmath import mp, mpf, exp, pi, findroot, quad, cos, sin, sqrt, matrix, eigsy

mp.dps = 40


def exp_abs_eigen(count):
    a = mpf(1) / 2
    out = []
    for k in range(count):
        if k % 2 == 0:  # even: w a in (j pi, j pi + pi/2)
            j = k // 2
            f = lambda w: cos(w * a) - w * sin(w * a)  # 1 - w tan(w a), times cos(w a)
            lo, hi = j * pi / a, (j * pi + pi / 2) / a
        else:  # odd: w a in (j pi + pi/2, (j + 1) pi)
            j = k // 2
            f = lambda w: w * cos(w * a) + sin(w * a)  # w + tan(w a), times cos(w a)
            lo, hi = (j * pi + pi / 2) / a, ((j + 1) * pi) / a
        w = findroot(f, (lo + mpf('1e-30'), hi - mpf('1e-30')), solver='illinois')
        lam = 2 / (1 + w * w)
        phi = (lambda x, w=w: cos(w * (x - a))) if k % 2 == 0 else (lambda x, w=w: sin(w * (x - a)))
        res = 0
        for t in (mpf('0.1'), mpf('0.5'), mpf('0.83')):
            lhs = quad(lambda s: exp(-abs(t - s)) * phi(s), [0, t, 1])
            res = max(res, abs(lhs - lam * phi(t)))
        out.append((lam, res))
    lams = sorted(out, key=lambda p: -p[0])
    return [p[0] for p in lams], max(p[1] for p in lams)


def nystrom(kernel, n):
    xs, ws = [], []
    for x, w in zip(*gauss_legendre(n)):
        xs.append((x + 1) / 2)
        ws.append(w / 2)
    A = matrix(n, n)
    for i in range(n):
        for j in range(n):
            A[i, j] = sqrt(ws[i]) * kernel(xs[i], xs[j]) * sqrt(ws[j])
    ev = eigsy(A, eigvals_only=True)
    return sorted([ev[i] for i in range(n)], key=lambda v: -abs(v))


def gauss_legendre(n):
    """Gauss-Legendre nodes and weights: numpy's double nodes refined by Newton steps in mpmath."""
    import numpy
    from mpmath import legendre
    xs, ws = [], []
    for x0 in numpy.polynomial.legendre.leggauss(n)[0]:
        x = mpf(float(x0))
        for _ in range(6):
            d = n * (x * legendre(n, x) - legendre(n - 1, x)) / (x * x - 1)
            x = x - legendre(n, x) / d
        d = n * (x * legendre(n, x) - legendre(n - 1, x)) / (x * x - 1)
        xs.append(x)
        ws.append(2 / ((1 - x * x) * d * d))
    return xs, ws


def s(x):
    return mp.nstr(x, 25)


cases = {}
exp_eigs, exp_res = exp_abs_eigen(8)
hs2_closed = 2 * ((1 - exp(-2)) / 2 - (1 - 3 * exp(-2)) / 4)
hs2_quad = quad(lambda t: quad(lambda u: exp(-2 * abs(t - u)), [0, t, 1]), [0, 1])
base = {
    'exp-abs': {
        'eigenvalues': exp_eigs, 'hs': sqrt(hs2_closed), 'trace': mpf(1),
        'agreement': {'eigenEquationResidual': s(exp_res), 'hsClosedVsQuad': s(abs(hs2_closed - hs2_quad))},
    },
    'ts': {'eigenvalues': [mpf(1) / 3], 'hs': mpf(1) / 3, 'trace': mpf(1) / 3, 'agreement': {}},
    't+s': {'eigenvalues': [mpf(1) / 2 + 1 / sqrt(3), mpf(1) / 2 - 1 / sqrt(3)], 'hs': sqrt(mpf(7) / 6), 'trace': mpf(1), 'agreement': {}},
}
e740 = lambda t, u: exp(t * u - 740)
n24 = nystrom(e740, 24)
n32 = nystrom(e740, 32)
base['exp(ts-740)'] = {
    'eigenvalues': n32[:4],
    'hs': sqrt(quad(lambda t: quad(lambda u: e740(t, u) ** 2, [0, 1]), [0, 1])),
    'trace': quad(lambda t: e740(t, t), [0, 1]),
    'agreement': {'nystrom24vs32': s(max(abs(x - y) / abs(n32[0]) for x, y in zip(n24[:4], n32[:4])))},
}

# (name, body, constant as written, base kernel, expected positivity)
table = [
    ('p250', '1e250 * exp(-abs(t - s))', '1e250', 'exp-abs', True),
    ('m250', '1e-250 * exp(-abs(t - s))', '1e-250', 'exp-abs', True),
    ('p300', '1e300 * exp(-abs(t - s))', '1e300', 'exp-abs', True),
    ('m300', '1e-300 * exp(-abs(t - s))', '1e-300', 'exp-abs', True),
    ('d300', 'exp(-abs(t - s)) / 1e-300', '1e300', 'exp-abs', True),
    ('m310', '1e-310 * exp(-abs(t - s))', '1e-310', 'exp-abs', True),
    ('p308', '1e308 * t * s', '1e308', 'ts', True),
    ('m320', '1e-320 * t * s', '1e-320', 'ts', True),
    ('p154', '1e154 * (t + s)', '1e154', 't+s', False),
    ('e740', 'exp(t * s - 740)', '1', 'exp(ts-740)', True),
]
for name, body, c, kind, positive in table:
    cd = mpf(float(c)) if name != 'd300' else 1 / mpf(float('1e-300'))
    b = base[kind]
    cases[name] = {
        'body': body, 'base': kind, 'positive': positive,
        'eigenvalues': [s(cd * x) for x in b['eigenvalues']],
        'norm': s(cd * max(abs(x) for x in b['eigenvalues'])),
        'hs': s(cd * b['hs']), 'trace': s(cd * b['trace']),
        'agreement': b['agreement'],
    }
import mpmath
print(json.dumps({'generator': 'tests/reference/scripts/scale.py (mpmath %s)' % mpmath.__version__, 'cases': cases}, indent=2))
