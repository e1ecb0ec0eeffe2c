"""Reference norms of Volterra-type kernels K(t, s) = k(t - s) for t > s, 0 for t < s, on [a, b].

The operator norm is the square root of the largest eigenvalue of T*T, whose kernel
    M(s, u) = integral_{max(s, u)}^{b} k(t - s) k(t - u) dt
is continuous with a kink on the diagonal s = u; equally of TT*, with kernel
    N(t, v) = integral_{a}^{min(t, v)} k(t - s) k(v - s) ds.
Method: Nystrom discretisation of each with the composite trapezoidal rule on n + 1 equally spaced nodes (the kink
falls on a node, so the eigenvalue error has an expansion in even powers of h), at n = 200, 400, 800, and Richardson
extrapolation in h^2 and h^4; the inner integrals by 40-point Gauss-Legendre (the integrand is smooth).
The two methods (T*T and TT*) are independent discretisations of the same number; their difference and the last
Richardson correction give the reference error. Run: python3 tests/reference/scripts/volterra.py > tests/reference/data/volterra.json
"""
import json
import numpy as np

GL_X, GL_W = np.polynomial.legendre.leggauss(40)

KERNELS = {
    'vcos': (lambda x: np.cos(x), 0.0, 1.0, 't > s ? cos(t - s) : 0'),
    'vsq': (lambda x: x ** 2 + 1, 0.0, 1.0, 's < t ? (t - s)^2 + 1 : 0'),
    'vexp': (lambda x: np.exp(x), 0.0, 1.0, '(t >= s) * exp(t - s)'),
    'integ': (lambda x: np.ones_like(x), 0.0, 1.0, 't > s ? 1 : 0'),
    'vramp': (lambda x: x, 0.0, 2.0, 'max(t - s, 0) on [0, 2]'),
}


def gram(k, a, b, n, which):
    x = np.linspace(a, b, n + 1)
    w = np.full(n + 1, (b - a) / n)
    w[0] *= 0.5
    w[-1] *= 0.5
    S, U = np.meshgrid(x, x, indexing='ij')
    if which == 'TstarT':
        lo, hi = np.maximum(S, U), np.full_like(S, b)
    else:
        lo, hi = np.full_like(S, a), np.minimum(S, U)
    half = 0.5 * (hi - lo)
    mid = 0.5 * (hi + lo)
    M = np.zeros_like(S)
    for xi, wi in zip(GL_X, GL_W):
        r = mid + half * xi
        if which == 'TstarT':
            M += wi * k(r - S) * k(r - U)
        else:
            M += wi * k(S - r) * k(U - r)
    M *= half
    sw = np.sqrt(w)
    A = sw[:, None] * M * sw[None, :]
    return np.linalg.eigvalsh(A)[-1]


def richardson(values):
    # values at h, h/2, h/4: eliminate h^2, then h^4
    l1 = [(4 * values[i + 1] - values[i]) / 3 for i in range(2)]
    l2 = (16 * l1[1] - l1[0]) / 15
    return l2, abs(l2 - l1[1])


out = {'method': 'Nystrom on T*T and on TT*, composite trapezoid n = 200, 400, 800, Richardson in h^2 and h^4 (numpy)', 'cases': {}}
for name, (k, a, b, expr) in KERNELS.items():
    res = {}
    for which in ('TstarT', 'TTstar'):
        lam = [gram(k, a, b, n, which) for n in (200, 400, 800)]
        l, corr = richardson(lam)
        res[which] = (float(np.sqrt(l)), float(corr / (2 * np.sqrt(l))))
    n1, e1 = res['TstarT']
    n2, e2 = res['TTstar']
    out['cases'][name] = {
        'expression': expr, 'domain': [a, b], 'norm': 0.5 * (n1 + n2),
        'normTstarT': n1, 'normTTstar': n2,
        'error': float(max(abs(n1 - n2), e1, e2, 1e-15 * abs(n1))),
    }
print(json.dumps(out, indent=2))
