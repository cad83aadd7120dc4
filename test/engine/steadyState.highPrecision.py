"""
80-digit references for test/engine/steadyState.highPrecision.test.ts (run: python3 steadyState.highPrecision.py;
needs mpmath). Periodic steady state of an RC ladder behind a PWM pin, written here from Kirchhoff's
current law independently of src/: per phase x' = A x + b, one period x -> x_l + E_l (x_h - x_l) + E_l E_h (x - x_h)
with E = mpmath.expm(A t), fixed point by an LU solve; the output over each phase from the
eigen-decomposition of A (mpmath.eig; mpmath.expm on a grid when the eigenvectors are degenerate), its
extremes at the phase ends and at the zeros of its derivative (sign changes on a 2000-point grid plus a
geometric grid near each edge, refined by bisection), the average from the exact integral of each phase.
Ladders are invented test circuits (model.md: stage k = series R_k, shunt C_k; buffered = unity-gain
follower after the stage; load R and C at the last node unless a follower sits there).
"""
import json, sys
import mpmath as mp
mp.mp.dps = 80

def system(l, pin, driver):
    st = l['stages']; n = len(st)
    A = mp.zeros(n, n); b = mp.zeros(n, 1)
    RL = l['loadResistance']; CL = mp.mpf(l['loadCapacitance'])
    for k in range(n):
        s = st[k]
        rIn = mp.mpf(s['r']) + (mp.mpf(driver) if k == 0 else 0)
        cap = mp.mpf(s['c']) + (CL if (k == n - 1 and not s['buffered']) else 0)
        if k == 0: b[k] += mp.mpf(pin) / rIn / cap
        else: A[k, k - 1] += 1 / rIn / cap
        A[k, k] -= 1 / rIn / cap
        if k < n - 1 and not s['buffered']:
            g = 1 / mp.mpf(st[k + 1]['r'])
            A[k, k] -= g / cap; A[k, k + 1] += g / cap
        if k == n - 1 and not s['buffered'] and RL is not None:
            A[k, k] -= 1 / mp.mpf(RL) / cap
    return A, b

def phase_curve(A, xp, x0, t, n):
    """y(tau) of the last node; returns (value(tau), list of turning points in (0,t), integral over [0,t])."""
    v = x0 - xp
    c_xp = xp[n - 1]
    lam, V = mp.eig(A)
    Vi = None
    try:
        Vi = mp.inverse(V)
        cond = mp.mnorm(V, 1) * mp.mnorm(Vi, 1)
    except ZeroDivisionError:
        cond = mp.inf
    if cond < mp.mpf(10) ** 25:
        w = Vi * v
        g = [V[n - 1, i] * w[i] for i in range(n)]
        val = lambda tau: mp.re(c_xp + mp.fsum(g[i] * mp.exp(lam[i] * tau) for i in range(n)))
        der = lambda tau: mp.re(mp.fsum(g[i] * lam[i] * mp.exp(lam[i] * tau) for i in range(n)))
        integ = mp.re(c_xp * t + mp.fsum(g[i] * mp.expm1(lam[i] * t) / lam[i] for i in range(n))) if t > 0 else mp.mpf(0)
        npts = 2000
    else:
        # Jordan block: exponentials on the grid
        val = lambda tau: (xp + mp.expm(A * tau) * v)[n - 1]
        der = lambda tau: (A * mp.expm(A * tau) * v)[n - 1]
        integ = mp.quad(val, [0, t]) if t > 0 else mp.mpf(0)
        npts = 300
    if t == 0:
        return val, [], integ
    lmax = max(abs(mp.re(x)) for x in lam)
    grid = set(t * mp.mpf(k) / npts for k in range(npts + 1))
    s = t / npts
    while s * lmax > mp.mpf('1e-3'):
        s /= 2
        grid.add(s)
    grid = sorted(grid)
    roots = []
    dprev = der(grid[0])
    for a, bb in zip(grid, grid[1:]):
        dn = der(bb)
        if dprev * dn < 0:
            lo_, hi_, dlo = a, bb, dprev
            for _ in range(300):
                mid = (lo_ + hi_) / 2
                dm = der(mid)
                if dm == 0: lo_ = hi_ = mid; break
                if (dm < 0) == (dlo < 0): lo_, dlo = mid, dm
                else: hi_ = mid
            r = (lo_ + hi_) / 2
            roots.append(r)
        dprev = dn
    return val, roots, integ

def steady(l, d):
    n = len(l['stages'])
    T = mp.mpf(l['period']); D = mp.mpf(d)
    t1 = D * T; t2 = (1 - D) * T
    Ah, bh = system(l, l['high'], l['driverHigh'])
    Al, bl = system(l, l['low'], l['driverLow'])
    xh = -(mp.inverse(Ah) * bh); xl = -(mp.inverse(Al) * bl)
    Eh = mp.expm(Ah * t1) if t1 > 0 else mp.eye(n)
    El = mp.expm(Al * t2) if t2 > 0 else mp.eye(n)
    M = El * Eh
    rhs = xl + El * (xh - xl) - M * xh
    x0 = mp.lu_solve(mp.eye(n) - M, rhs)
    x1 = xh + Eh * (x0 - xh)
    vh, rh, ih = phase_curve(Ah, xh, x0, t1, n)
    vl, rl, il = phase_curve(Al, xl, x1, t2, n)
    cand = [(x0[n - 1], mp.mpf(0))]
    if t1 > 0:
        cand += [(vh(r), r) for r in rh] + [(x1[n - 1], t1)]
    if t2 > 0:
        cand += [(vl(r), t1 + r) for r in rl]
    mx = max(cand, key=lambda c: c[0]); mn = min(cand, key=lambda c: c[0])
    return {'average': (ih + il) / T, 'min': mn[0], 'max': mx[0], 'ripple': mx[0] - mn[0], 'tMin': mn[1], 'tMax': mx[1],
            'turning': [float(r) for r in rh] + [float(t1 + r) for r in rl]}


CASES = json.loads(r"""
[
 {"name": "two equal stages, tau = 1000 T", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 0, "stages": [{"r": 1e4, "c": 5e-6, "buffered": false}, {"r": 1e4, "c": 5e-6, "buffered": false}], "loadResistance": null, "loadCapacitance": 0}, "duties": [0.001, 0.5, 0.999]},
 {"name": "two stages, tau2 = 1e-4 tau1, drivers 0 / 1000 ohm", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 1000, "stages": [{"r": 1e4, "c": 5e-9, "buffered": false}, {"r": 1e4, "c": 5e-13, "buffered": false}], "loadResistance": null, "loadCapacitance": 0}, "duties": [0.001, 0.3, 0.999]},
 {"name": "two stages, tau2 = 1e4 tau1, low 0.1 V, drivers 40 / 25 ohm, R and C load", "ladder": {"period": 5e-5, "high": 3.3, "low": 0.1, "driverHigh": 40, "driverLow": 25, "stages": [{"r": 1e4, "c": 5e-8, "buffered": false}, {"r": 1e5, "c": 5e-5, "buffered": false}], "loadResistance": 1e6, "loadCapacitance": 1e-10}, "duties": [0, 0.05, 0.5, 1]},
 {"name": "stiff two stages, tau from 1.4e-2 T down to 5e-9 T, loaded", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 40, "driverLow": 25, "stages": [{"r": 1e3, "c": 7e-10, "buffered": false}, {"r": 10, "c": 2.5e-14, "buffered": false}], "loadResistance": 1e5, "loadCapacitance": 0}, "duties": [0.002, 0.5]},
 {"name": "three equal stages, tau = 10 T, 1 Mohm load", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 0, "stages": [{"r": 1e4, "c": 5e-8, "buffered": false}, {"r": 1e4, "c": 5e-8, "buffered": false}, {"r": 1e4, "c": 5e-8, "buffered": false}], "loadResistance": 1e6, "loadCapacitance": 0}, "duties": [1e-6, 0.5, 0.999999]},
 {"name": "three stages, tau = 10 T, 1e4 T, 1e-2 T, drivers 0 / 1000 ohm", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 1000, "stages": [{"r": 1e4, "c": 5e-8, "buffered": false}, {"r": 1e4, "c": 5e-5, "buffered": false}, {"r": 1e4, "c": 5e-11, "buffered": false}], "loadResistance": null, "loadCapacitance": 0}, "duties": [0.05, 0.7]},
 {"name": "follower after the last stage, load behind it", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 40, "driverLow": 25, "stages": [{"r": 1e4, "c": 5e-8, "buffered": false}, {"r": 1e4, "c": 1e-7, "buffered": true}], "loadResistance": 1e3, "loadCapacitance": 1e-6}, "duties": [0.25, 0.9]},
 {"name": "cascade: follower after stage 1 of 3, drivers 0 / 1000 ohm", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 1000, "stages": [{"r": 1e4, "c": 5e-8, "buffered": true}, {"r": 1e4, "c": 1.5e-8, "buffered": false}, {"r": 1e4, "c": 2.5e-7, "buffered": false}], "loadResistance": null, "loadCapacitance": 0}, "duties": [0.1, 0.6]},
 {"name": "three stages, 1 us period, tau from 27 T down to 1e-2 T, output capacitance only", "ladder": {"period": 1e-6, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 0, "stages": [{"r": 10, "c": 3.2041384135748383e-9, "buffered": false}, {"r": 102465.36138704566, "c": 2.6787049590544845e-10, "buffered": false}, {"r": 10.000002895007214, "c": 1.0000000171555959e-9, "buffered": false}], "loadResistance": null, "loadCapacitance": 1.752033089975738e-12}, "duties": [0.5531775262206793]},
 {"name": "cascade of two identical sections (repeated mode)", "ladder": {"period": 5e-5, "high": 3.3, "low": 0, "driverHigh": 0, "driverLow": 0, "stages": [{"r": 1e4, "c": 1e-8, "buffered": true}, {"r": 1e4, "c": 1e-8, "buffered": false}], "loadResistance": null, "loadCapacitance": 0}, "duties": [0.3]}
]
""")

if __name__ == '__main__':
    for c in CASES:
        print(c['name'])
        for d in c['duties']:
            r = steady(c['ladder'], d)
            print('  duty', d, {k: mp.nstr(r[k], 20) for k in ('average', 'min', 'max', 'ripple', 'tMin', 'tMax')})
