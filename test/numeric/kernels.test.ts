import fc from 'fast-check';
import { lusolve, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../src/numeric/brentRoot.js';
import { normInf } from '../../src/numeric/dense.js';
import { expSumRoots } from '../../src/numeric/expSumRoots.js';
import { expm } from '../../src/numeric/expm.js';
import { symmetricEigen } from '../../src/numeric/symmetricEigen.js';
import { luFactor, luSolve, solveLinear, solveTwoByTwo } from '../../src/numeric/lu.js';
import { brentMaximize, brentMaximizeBracketed, maximizeOnInterval } from '../../src/numeric/maximizeOnInterval.js';
import { oneMinusPhi1, phi1, phi2 } from '../../src/numeric/phi.js';

// Reference values: mpmath 1.3.0 at 50 digits, printed by kernels.references.py beside this file
// (findroot, lu_solve, exp, hilbert), rounded to the nearest double.

const relErr = (x: number, want: number) => Math.abs(x - want) / Math.max(Math.abs(want), 1e-300);

describe('brentRoot (Brent 1973, ch. 4)', () => {
  it('solves cos x = x (the Dottie number; mpmath findroot)', () => {
    expect(relErr(brentRoot((x) => Math.cos(x) - x, 0, 1), 0.7390851332151607)).toBeLessThan(4e-16);
  });
  it("solves Wallis's cubic x^3 - 2x - 5 = 0 (mpmath findroot)", () => {
    expect(relErr(brentRoot((x) => x ** 3 - 2 * x - 5, 2, 3), 2.0945514815423265)).toBeLessThan(4e-16);
  });
  it("solves Kepler's equation E - 0.9 sin E = 1 (mpmath findroot)", () => {
    expect(relErr(brentRoot((E) => E - 0.9 * Math.sin(E) - 1, 0, Math.PI), 1.8620866868745323)).toBeLessThan(4e-16);
  });
  it('honours xtol, returns an exact end root, and refuses a bracket without a sign change', () => {
    const r = brentRoot((x) => x - 1 / 3, 0, 1, 1e-3);
    expect(Math.abs(r - 1 / 3)).toBeLessThanOrEqual(1e-3);
    expect(brentRoot((x) => x - 2, 2, 5)).toBe(2);
    expect(() => brentRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
  it('takes no more evaluations than bisection would need (plus a margin; Brent 1973, ch. 4 bound)', () => {
    // Brent's method is guaranteed to need at most about (log2((b - a)/tol))^2 evaluations and in
    // practice fewer than bisection; a regression to a slower scheme shows up here.
    let calls = 0;
    brentRoot((x) => (calls++, Math.exp(x) - 5), 0, 10, 1e-12);
    expect(calls).toBeLessThan(Math.ceil(Math.log2(10 / 1e-12)));
  });
});

describe('brentMaximize and maximizeOnInterval (Brent 1973, ch. 5)', () => {
  it('finds the peak of x^2 e^-x at x = 2, value 4/e^2 (closed form; mpmath)', () => {
    const m = brentMaximize((x) => x * x * Math.exp(-x), 0, 10);
    expect(m.x).toBeCloseTo(2, 7);
    expect(relErr(m.value, 0.5413411329464508)).toBeLessThan(1e-14);
  });
  it('finds sin(x) e^(-x/5) peaking at atan 5 (closed form: tan x = 5)', () => {
    const m = maximizeOnInterval((x) => Math.sin(x) * Math.exp(-x / 5), 0, 3);
    expect(m.x).toBeCloseTo(Math.atan(5), 7);
  });
  it('picks the global of two peaks of sin 3x + sin(7x)/2 on [0, 3] (mpmath findroot on f\')', () => {
    const f = (x: number) => Math.sin(3 * x) + 0.5 * Math.sin(7 * x);
    const m = maximizeOnInterval(f, 0, 3);
    expect(m.x).toBeCloseTo(0.3034860055224039, 7);
    expect(relErr(m.value, 1.2151019249431465)).toBeLessThan(1e-14);
    // brentMaximize alone, bracketed around a lesser peak, stays on it (a local search)
    expect(brentMaximize(f, 2.0, 2.4).x).toBeCloseTo(2.161958042660804, 7);
  });
  it('from a bracket: the same peaks (x^2 e^-x, 4/e^2; sin(pi x) at 1/2; the lesser peak of sin 3x + sin(7x)/2)', () => {
    let evals = 0;
    const counted = (f: (x: number) => number) => (x: number) => {
      evals++;
      return f(x);
    };
    const g = counted((x) => x * x * Math.exp(-x));
    const m = brentMaximizeBracketed(g, 1, 2.5, 4, g(1), g(2.5), g(4), 1e-9);
    expect(m.x).toBeCloseTo(2, 7);
    expect(relErr(m.value, 0.5413411329464508)).toBeLessThan(1e-14);
    // Evaluations counted (not timed): the three known values replace the first golden-section
    // steps, so a near-parabolic peak (a ripple against duty) takes fewer: 5 against 8 here.
    const s = counted((x) => Math.sin(Math.PI * x));
    evals = 0;
    const p = brentMaximizeBracketed(s, 0.4, 0.47, 0.54, s(0.4), s(0.47), s(0.54), 1e-9);
    const bracketed = evals - 3;
    evals = 0;
    brentMaximize(s, 0.4, 0.54, 1e-9);
    expect(p.x).toBeCloseTo(0.5, 8);
    expect(bracketed).toBeLessThan(evals);
    const f = (x: number) => Math.sin(3 * x) + 0.5 * Math.sin(7 * x);
    expect(brentMaximizeBracketed(f, 2.0, 2.2, 2.4, f(2.0), f(2.2), f(2.4)).x).toBeCloseTo(2.161958042660804, 7);
  });
  it('from a bracket: value = f(x) with x inside, and never below the bracket\'s middle (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 20, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true }), (k, phase) => {
        const f = (x: number) => Math.sin(k * x + phase) - 0.1 * x;
        // a bracket from a fine grid: its best inner point and the neighbours
        const xs = Array.from({ length: 41 }, (_, i) => (2 * i) / 40);
        let i = 1;
        for (let j = 2; j < 40; j++) if (f(xs[j]) > f(xs[i])) i = j;
        if (!(f(xs[i]) >= f(xs[i - 1]) && f(xs[i]) >= f(xs[i + 1]))) return true;
        const m = brentMaximizeBracketed(f, xs[i - 1], xs[i], xs[i + 1], f(xs[i - 1]), f(xs[i]), f(xs[i + 1]), 1e-10);
        return m.x > xs[i - 1] && m.x < xs[i + 1] && m.value === f(m.x) && m.value >= f(xs[i]);
      }),
      { numRuns: 200, seed: 12 },
    );
  });
  it('returns an end when f rises toward it, and f(a) on an empty interval', () => {
    expect(maximizeOnInterval((x) => x, 0, 1)).toEqual({ x: 1, value: 1 });
    expect(maximizeOnInterval((x) => -x, 0.3, 0.3)).toEqual({ x: 0.3, value: -0.3 });
  });
  it('never reports a value f does not take (fast-check: value = f(x), x inside)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 20, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true }), (k, phase) => {
        const f = (x: number) => Math.sin(k * x + phase) - 0.1 * x;
        const m = maximizeOnInterval(f, 0, 2);
        return m.x >= 0 && m.x <= 2 && m.value === f(m.x);
      }),
      { numRuns: 200, seed: 11 },
    );
  });
});

describe('LU with partial pivoting (Golub & Van Loan, Alg. 3.4.1)', () => {
  it('solves a 4 x 4 system with a zero leading entry (mpmath lu_solve)', () => {
    const A = [0, 2, 1, -1, 3, -1, 4, 2, 1, 5, -2, 0.5, -2, 1, 1, 6];
    const want = [-0.9976744186046511, 0.3697674418604651, 0.313953488372093, 0.053488372093023255];
    const x = luSolve(luFactor(A, 4), [1, -2, 0.25, 3]);
    for (let i = 0; i < 4; i++) expect(relErr(x[i], want[i])).toBeLessThan(1e-14);
  });
  it('solves the 6 x 6 Hilbert system to within its condition number (mpmath: exact integers)', () => {
    // cond(H6) is about 1.5e7 (a textbook value, from memory), so ~1e-9 relative is what LU can give
    const H = Array.from({ length: 36 }, (_, k) => 1 / (Math.floor(k / 6) + (k % 6) + 1));
    const want = [-6, 210, -1680, 5040, -6300, 2772];
    const x = solveLinear(H, 6, [1, 1, 1, 1, 1, 1]);
    expect(x).not.toBeNull();
    for (let i = 0; i < 6; i++) expect(relErr(x![i], want[i])).toBeLessThan(1e-8);
  });
  it('matches mathjs lusolve on random well-conditioned systems, several columns at once', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 6 }).chain((n) =>
          fc.tuple(
            fc.constant(n),
            fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n * n, maxLength: n * n }),
            fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 2 * n, maxLength: 2 * n }),
          ),
        ),
        ([n, r, b]) => {
          // diagonally dominant by construction, so well conditioned
          const a = r.map((v, k) => (Math.floor(k / n) === k % n ? v + (v < 0 ? -n : n) : v));
          const mine = solveLinear(a, n, b, 2)!;
          const rows = Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));
          for (let c = 0; c < 2; c++) {
            const col = Array.from({ length: n }, (_, i) => [b[i * 2 + c]]);
            const ref = (lusolve(matrix(rows), matrix(col)).toArray() as number[][]).map((row) => row[0]);
            for (let i = 0; i < n; i++) expect(Math.abs(mine[i * 2 + c] - ref[i])).toBeLessThan(1e-12 * (1 + Math.abs(ref[i])));
          }
        },
      ),
      { numRuns: 200, seed: 7 },
    );
  });
  it('solveTwoByTwo is luFactor + luSolve at order 2, to the last bit (fast-check), and false when singular', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 6, maxLength: 6 }), ([a, b, c, d, e, f]) => {
        fc.pre(Math.abs(a * d - b * c) > 1e-6 * (Math.abs(a * d) + Math.abs(b * c)));
        const out = [0, 0];
        expect(solveTwoByTwo(a, b, c, d, e, f, out)).toBe(true);
        expect(out).toEqual(luSolve(luFactor([a, b, c, d], 2), [e, f]));
      }),
      { numRuns: 300, seed: 3 },
    );
    expect(solveTwoByTwo(0, 1, 0, 2, 1, 1, [0, 0])).toBe(false);
    expect(solveTwoByTwo(1, 2, 2, 4, 1, 1, [0, 0])).toBe(false);
  });
  it('reports a singular matrix: luFactor throws, solveLinear returns null (also for NaN)', () => {
    expect(() => luFactor([1, 2, 2, 4], 2)).toThrow(RangeError);
    expect(solveLinear([1, 2, 2, 4], 2, [1, 1])).toBeNull();
    expect(solveLinear([NaN, 0, 0, 1], 2, [1, 1])).toBeNull();
  });
  it('normInf is the largest absolute row sum and NaN on a NaN entry (Golub & Van Loan eq. 2.3.10)', () => {
    expect(normInf([1, -2, 3, 4], 2)).toBe(7);
    expect(normInf([1, NaN, 3, 4], 2)).toBeNaN();
  });
});

describe('phi functions (Hochbruck & Ostermann 2010, section 2)', () => {
  const phi2Refs: [number, number][] = [
    [-50, 0.0196],
    [-3, 0.22775411870754045],
    [-1, 0.36787944117144233],
    [-0.5, 0.4261226388505337],
    [-0.001, 0.4998333749916681],
    [-1e-9, 0.4999999998333333],
    [1e-9, 0.5000000001666667],
    [0.001, 0.5001667083416681],
    [0.5, 0.5948850828005126],
    [0.999, 0.7180001876937665],
    [1, 0.7182818284590452],
    [3, 1.7872818803541852],
    [20, 1212912.9360244756],
  ];
  it.each(phi2Refs)('phi2(%d) to a few ulps (mpmath)', (z, want) => {
    expect(relErr(phi2(z), want)).toBeLessThan(1e-15);
  });
  const oneMinusRefs: [number, number][] = [
    [1e-12, 4.999999999998333e-13],
    [1e-6, 4.99999833333375e-7],
    [0.001, 0.000499833374991668],
    [0.0099, 0.004933705349207228],
    [0.01, 0.004983374916805358],
    [0.5, 0.21306131942526685],
    [1, 0.36787944117144233],
    [30, 0.9666666666666698],
    [1e4, 0.9999],
  ];
  it.each(oneMinusRefs)('oneMinusPhi1(%d) = 1 - (1 - e^-x)/x (mpmath)', (x, want) => {
    // the series branch is documented to 4e-14 relative at x = 0.01; the closed form to a few ulps above
    expect(relErr(oneMinusPhi1(x), want)).toBeLessThan(x < 0.01 ? 5e-14 : 1e-14);
  });
});

describe('phi1 against mpmath (expm1(z) / z at 50 digits, kernels.references.py)', () => {
  const phi1Refs: [number, number][] = [
    [-50, 0.02],
    [-3, 0.3167376438773787],
    [-1, 0.6321205588285577],
    [-0.5, 0.7869386805747332],
    [-0.001, 0.9995001666250083],
    [-1e-6, 0.9999995000001667],
    [-1e-9, 0.9999999995],
    [0, 1],
    [1e-9, 1.0000000005],
    [1e-6, 1.0000005000001666],
    [0.001, 1.0005001667083417],
    [0.5, 1.2974425414002564],
    [1, 1.7182818284590453],
    [3, 6.361845641062556],
    [20, 24258259.720489513],
  ];
  it.each(phi1Refs)('phi1(%d) to a few ulps', (z, want) => {
    expect(relErr(phi1(z), want)).toBeLessThan(1e-15);
  });
});

describe('expSumRoots against mpmath', () => {
  it('finds both roots of 0.3 - 1.2 e^-t + 1.5 e^-2.5t - 0.55 e^-4t on (0, 6)', () => {
    const roots = expSumRoots([0.3, -1.2, 1.5, -0.55], [0, -1, -2.5, -4], 6);
    const want = [0.13894238730354527, 1.154554987552791];
    expect(roots).toHaveLength(2);
    for (let i = 0; i < 2; i++) expect(Math.abs(roots[i] - want[i])).toBeLessThan(1e-12);
  });
});

describe('symmetricEigen (cyclic Jacobi) and expm (Higham 2005) against mpmath', () => {
  it('eigenvalues of a 4 x 4 ladder-like tridiagonal spanning three decades, each to 1e-13 relative (mpmath eigsy)', () => {
    const S = [-3e3, 1e3, 0, 0, 1e3, -1.1e3, 30, 0, 0, 30, -31, 1, 0, 0, 1, -1.5];
    const want = [-3429.3526406515844, -671.8742685049317, -29.808353201902175, -1.4647376415817501];
    const got = symmetricEigen(S, 4).values;
    // the smallest in magnitude too: Jacobi keeps small eigenvalues to high relative accuracy
    for (let i = 0; i < 4; i++) expect(relErr(got[i], want[i])).toBeLessThan(1e-13);
  });
  it('e^(2E) of a nonsymmetric 3 x 3 (norm 11: scaling and squaring), each entry to 1e-13 relative (mpmath expm)', () => {
    const E2 = [-4, 1.5, 0.25, 2, -3, 0.5, 0, 1, -0.5].map((v) => 2 * v);
    const want = [
      0.03395670808053313, 0.059147473937017477, 0.10436228009732516, 0.05523720663906774, 0.09701444931550035,
      0.17328542227921698, 0.14175655166173337, 0.27569256872756726, 0.5736110436418185,
    ];
    const got = expm(E2, 3);
    for (let i = 0; i < 9; i++) expect(relErr(got[i], want[i])).toBeLessThan(1e-13);
  });
});
