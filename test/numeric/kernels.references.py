"""
50-digit references for test/numeric/kernels.test.ts (run: python3 kernels.references.py; needs
mpmath). Each value is computed here with mpmath's own routines (findroot, lu_solve, diff), not with
anything from src/, and printed as JSON that the test file copies.
"""
import json
import mpmath as mp
mp.mp.dps = 50

out = {}

# Brent root: three classic test equations.
out['root_cos'] = mp.findroot(lambda x: mp.cos(x) - x, 0.7)               # the Dottie number
out['root_wallis'] = mp.findroot(lambda x: x**3 - 2*x - 5, 2.1)           # Wallis's cubic
out['root_kepler'] = mp.findroot(lambda E: E - mp.mpf('0.9')*mp.sin(E) - 1, 1.8)   # Kepler, e = 0.9, M = 1

# Bounded maximiser: a two-peak function on [0, 3]; all local maxima from f' = 0 by findroot,
# started on a fine grid (stationary points only; the ends are compared separately).
f = lambda x: mp.sin(3*x) + mp.mpf('0.5')*mp.sin(7*x)
df = lambda x: 3*mp.cos(3*x) + mp.mpf('3.5')*mp.cos(7*x)
crit = set()
for k in range(1, 300):
    x0 = mp.mpf(3) * k / 300
    if df(x0) * df(x0 + mp.mpf(3)/300) < 0:
        r = mp.findroot(df, (x0, x0 + mp.mpf(3)/300), solver='bisect' if False else 'anderson')
        crit.add(mp.nstr(r, 40))
crit = sorted(mp.mpf(c) for c in crit)
maxima = [c for c in crit if mp.diff(f, c, 2) < 0]
best = max(maxima + [mp.mpf(0), mp.mpf(3)], key=f)
out['twopeak_maxima'] = maxima
out['twopeak_best_x'] = best
out['twopeak_best_value'] = f(best)
# A skewed single peak: x^2 exp(-x) on [0, 10], max at x = 2 (f' = (2x - x^2) e^-x), value 4/e^2.
out['skew_value'] = mp.mpf(4) * mp.exp(-2)

# LU solve: a nonsymmetric 4 x 4 that needs pivoting (zero leading entry), and the 6 x 6 Hilbert matrix.
A = mp.matrix([[0, 2, 1, -1], [3, -1, 4, 2], [1, 5, -2, 0.5], [-2, 1, 1, 6]])
b = mp.matrix([1, -2, 0.25, 3])
out['lu4_x'] = list(mp.lu_solve(A, b))
H = mp.hilbert(6)
out['hilbert6_x'] = list(mp.lu_solve(H, mp.matrix([1] * 6)))

# phi functions.
zs = [-50, -3, -1, -0.5, -1e-3, -1e-9, 1e-9, 1e-3, 0.5, 0.999, 1, 3, 20]
out['phi2'] = [[z, (mp.exp(mp.mpf(z)) - 1 - mp.mpf(z)) / mp.mpf(z)**2] for z in zs]
xs = [1e-12, 1e-6, 1e-3, 0.0099, 0.01, 0.5, 1, 30, 1e4]
out['phi1'] = [[z, (mp.expm1(mp.mpf(z)) / mp.mpf(z)) if z != 0 else mp.mpf(1)] for z in [-50, -3, -1, -0.5, -1e-3, -1e-6, -1e-9, 0, 1e-9, 1e-6, 1e-3, 0.5, 1, 3, 20]]
out['oneMinusPhi1'] = [[x, 1 - (1 - mp.exp(-mp.mpf(x))) / mp.mpf(x)] for x in xs]

# Exponential sum with four terms: roots of 0.3 - 1.2 e^-t + 1.5 e^-2.5t - 0.55 e^-4t on (0, 6).
c = [mp.mpf('0.3'), mp.mpf('-1.2'), mp.mpf('1.5'), mp.mpf('-0.55')]
r = [0, -1, mp.mpf('-2.5'), -4]
h = lambda t: sum(ci * mp.exp(ri * t) for ci, ri in zip(c, r))
roots = []
N = 6000
for k in range(N):
    a0, a1 = mp.mpf(6) * k / N, mp.mpf(6) * (k + 1) / N
    if h(a0) * h(a1) < 0:
        roots.append(mp.findroot(h, (a0, a1), solver='anderson'))
out['expsum4_roots'] = roots

# Symmetric eigenvalues: a 4 x 4 tridiagonal (the symmetric form of an RC ladder, conductances and
# capacitances spread over decades so the eigenvalues span about six decades).
S = mp.matrix([[-3.0e3, 1.0e3, 0, 0], [1.0e3, -1.1e3, 3.0e1, 0], [0, 3.0e1, -3.1e1, 1.0], [0, 0, 1.0, -1.5]])
out['eig4'] = sorted(mp.eigsy(S)[0])

# Matrix exponential of a nonsymmetric 3 x 3 with a norm that forces scaling and squaring.
E = mp.matrix([[-4.0, 1.5, 0.25], [2.0, -3.0, 0.5], [0.0, 1.0, -0.5]])
out['expm3'] = list(mp.expm(E * 2))

def enc(v):
    if isinstance(v, list): return [enc(x) for x in v]
    if isinstance(v, (int, float)): return v
    return float(v)
print(json.dumps({k: enc(v) for k, v in out.items()}, indent=1))
