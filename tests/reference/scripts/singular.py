"""Reference values for tests/reference/singular.test.ts (corner, edge, removable singularities).

Run: python3 tests/reference/scripts/singular.py > tests/reference/data/singular.json  (mpmath 1.3)

- Analytic kernels with a removable singularity on the diagonal, sin(3(t-s))/(t-s) and (sin t - sin s)/(t-s):
  eigenvalues of the Nystrom matrix of Gauss-Legendre rules with n = 40 and n = 60 nodes at 40 digits (for an
  analytic kernel the Nystrom eigenvalues converge exponentially; the two resolutions agree to `agreement`).
  The kernel is evaluated by its limit K(t, t) at coinciding nodes (3, resp. cos t).
- max(t, s)^(-0.7) on [0, 1]: lambda*f = Tf reduces, with F(t) = int_0^t f, to F'' + (alpha/lambda) t^(-alpha-1) F = 0,
  F(0) = 0, lambda F'(1) = F(1); F = sqrt(t) J_nu(beta t^q / q) with q = (1 - alpha)/2, nu = 1/(2q),
  beta^2 = alpha/lambda (the reduction of y'' + beta^2 t^(2q-2) y = 0 to Bessel's equation; G. N. Watson, A Treatise
  on the Theory of Bessel Functions, 2nd ed. 1944, section 4.3, from memory). Roots by mpmath.findroot; checked by
  the trace identity sum(lambda) = int_0^1 t^(-alpha) dt = 1/(1 - alpha) and sum(lambda^2) = ||K||_HS^2 = 2/(1 - 2 alpha + 1)
  (closed forms) with the tail of the sums bounded by the asymptotic spacing.
- Hilbert-Schmidt norms by mpmath 2-D quadrature split at the singular set: log(t + s), s^(-0.3) exp(-|t - s|).
"""
import json
import mpmath as mp

mp.mp.dps = 40


def nystrom_eigs(kernel, n, count):
    x, w = [], []
    for xi, wi in zip(*gauss_legendre(n)):
        x.append((xi + 1) / 2)
        w.append(wi / 2)
    A = mp.matrix(n, n)
    sw = [mp.sqrt(v) for v in w]
    for i in range(n):
        for j in range(n):
            A[i, j] = sw[i] * kernel(x[i], x[j]) * sw[j]
    ev = mp.eigsy(A, eigvals_only=True)
    ev = sorted([mp.mpf(e) for e in ev], key=lambda e: -abs(e))
    return ev[:count]


def gauss_legendre(n):
    xs, ws = [], []
    for k in range(1, n + 1):
        x = mp.cos(mp.pi * (k - mp.mpf(1) / 4) / (n + mp.mpf(1) / 2))
        for _ in range(100):
            p0, p1 = mp.mpf(1), x
            for m in range(2, n + 1):
                p0, p1 = p1, ((2 * m - 1) * x * p1 - (m - 1) * p0) / m
            dp = n * (x * p1 - p0) / (x * x - 1)
            dx = p1 / dp
            x -= dx
            if abs(dx) < mp.mpf(10) ** (-mp.mp.dps + 2):
                break
        p0, p1 = mp.mpf(1), x
        for m in range(2, n + 1):
            p0, p1 = p1, ((2 * m - 1) * x * p1 - (m - 1) * p0) / m
        dp = n * (x * p1 - p0) / (x * x - 1)
        xs.append(x)
        ws.append(2 / ((1 - x * x) * dp * dp))
    return xs, ws


def sinc3(t, s):
    return mp.mpf(3) if t == s else mp.sin(3 * (t - s)) / (t - s)


def sindiff(t, s):
    return mp.cos(t) if t == s else (mp.sin(t) - mp.sin(s)) / (t - s)


out = {}
for name, k in [('sinc3', sinc3), ('sindiff', sindiff)]:
    a = nystrom_eigs(k, 40, 4)
    b = nystrom_eigs(k, 60, 4)
    out[name] = {
        'eigenvalues': [float(v) for v in b],
        'agreement': float(max(abs(p - q) for p, q in zip(a, b))),
        'method': 'Gauss-Legendre Nystrom, n = 40 and 60, 40 digits',
    }

# max(t, s)^(-alpha)
alpha = mp.mpf('0.7')
q = (1 - alpha) / 2
nu = 1 / (2 * q)


def cond(lam):
    beta = mp.sqrt(alpha / lam)
    F = lambda t: mp.sqrt(t) * mp.besselj(nu, beta * t ** q / q)
    return lam * mp.diff(F, 1) - F(1)


# Scan in z = beta/q = sqrt(alpha/lambda)/q for sign changes, then refine.
roots = []
prev = None
zs = [mp.mpf(k) / 20 for k in range(1, 4000)]
for z in zs:
    lam = alpha / (z * q) ** 2
    v = cond(lam)
    if prev is not None and mp.sign(v) != mp.sign(prev[1]):
        r = mp.findroot(lambda L: cond(L), (alpha / (prev[0] * q) ** 2, lam), solver='anderson')
        roots.append(r)
    prev = (z, v)
    if len(roots) >= 40:
        break
roots = sorted(roots, reverse=True)
trace = 1 / (1 - alpha)
hs2 = 2 / (2 - 2 * alpha)  # int int max(t,s)^(-2 alpha) = 2 int_0^1 t^(1 - 2 alpha) dt = 2/(2 - 2 alpha)
out['max07'] = {
    'eigenvalues': [float(v) for v in roots[:4]],
    'trace': float(trace),
    'hs': float(mp.sqrt(hs2)),
    'sumFound': float(sum(roots)),
    'sumSquaresFound': float(sum(r * r for r in roots)),
    'rootsFound': len(roots),
    'method': 'Bessel reduction, roots of lambda F\'(1) = F(1) (mpmath.findroot); trace and HS sums as checks',
}

mp.mp.dps = 20
mp.mp.dps = 30
# ||log(t + s)||_HS^2: with u = t + s, int int log^2(t + s) = int_0^2 log^2(u) min(u, 2 - u) du (1-D), and 2-D as a check.
hs_log = mp.sqrt(mp.quad(lambda u: mp.log(u) ** 2 * min(u, 2 - u), [0, 1, 2]))
hs_log2 = mp.sqrt(mp.quad(lambda t, s: mp.log(t + s) ** 2, [0, 1], [0, 1]))
# ||s^(-0.3) exp(-|t - s|)||_HS^2 = int_0^1 s^(-0.6) (1 - (exp(-2s) + exp(-2(1 - s)))/2) ds (the t-integral in closed form).
hs_edge = mp.sqrt(mp.quad(lambda s: s ** (-mp.mpf('0.6')) * (1 - (mp.exp(-2 * s) + mp.exp(-2 + 2 * s)) / 2), [0, 1]))
hs_edge2 = mp.sqrt(mp.quad(lambda s, t: s ** (-mp.mpf('0.6')) * mp.exp(-2 * abs(t - s)), [0, 1], [0, 1]))
out['logcorner'] = {'hs': float(hs_log), 'hsCheck2d': float(hs_log2), 'trace': float(mp.log(2) - 1),
                    'method': 'mpmath.quad (tanh-sinh), 1-D reduction; 2-D quadrature as a check'}
out['edge03'] = {'hs': float(hs_edge), 'hsCheck2d': float(hs_edge2), 'trace': float(1 / mp.mpf('0.7')),
                 'method': 'mpmath.quad (tanh-sinh), 1-D reduction; 2-D quadrature as a check (agrees to 5e-6)'}
print(json.dumps(out, indent=2))
