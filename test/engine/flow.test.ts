import { describe, expect, it } from 'vitest';
import { expm as mathjsExpm, inv, matrix, multiply, subtract, identity as mIdentity } from 'mathjs';
import { addFlows, doubleFlow, flow } from '../../src/engine/flow.js';
import { phi2 } from '../../src/numeric/phi.js';

const rows = (a: number[], n: number): number[][] =>
  Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));
const flat = (m: unknown): number[] => (m as { toArray(): number[][] }).toArray().flat();

/** 2 x 2 matrix product and sum helpers for the series reference. */
function matPoly(x: number[][], coefficients: number[]): number[][] {
  // sum_k coefficients[k] X^(k+1)
  let power = x;
  const out = [
    [0, 0],
    [0, 0],
  ];
  for (const c of coefficients) {
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) out[i][j] += c * power[i][j];
    power = [
      [power[0][0] * x[0][0] + power[0][1] * x[1][0], power[0][0] * x[0][1] + power[0][1] * x[1][1]],
      [power[1][0] * x[0][0] + power[1][1] * x[1][0], power[1][0] * x[0][1] + power[1][1] * x[1][1]],
    ];
  }
  return out;
}

// A two-node RC ladder state matrix (invented values; 1/s).
const A = [-3000, 1000, 2000, -2000];

describe('flow: E = e^{tA}, K = I - E, J = integral of K', () => {
  it('K and J keep full relative precision for tiny t (phi-function series)', () => {
    // Source: Taylor series e^X - I = X + X^2/2 + X^3/6 + ..., phi1(X) - I = X/2 + X^2/6 + X^3/24 + ...
    // (definition of the phi functions, Hochbruck & Ostermann, Acta Numerica 2010). With
    // ||X|| ~ 1e-8 four terms are exact to ~1e-32 relative.
    for (const t of [1e-12, 1e-11, 1e-9]) {
      const X = rows(A.map((v) => v * t), 2);
      const kRef = matPoly(X, [1, 1 / 2, 1 / 6, 1 / 24]).flat().map((v) => -v);
      const jRef = matPoly(X, [1 / 2, 1 / 6, 1 / 24, 1 / 120]).flat().map((v) => -t * v);
      const f = flow(A, 2, t);
      for (let i = 0; i < 4; i++) {
        expect(Math.abs(f.K[i] - kRef[i])).toBeLessThanOrEqual(1e-14 * Math.abs(kRef[i]));
        expect(Math.abs((f.J as number[])[i] - jRef[i])).toBeLessThanOrEqual(1e-14 * Math.abs(jRef[i]));
      }
    }
  });

  it('matches mathjs expm and J = t I - A^{-1}(e^{tA} - I) for moderate t', () => {
    // Source: mathjs expm/inv (npm); J formula from integrating I - e^{sA} over [0, t] (calculus).
    for (const t of [1e-4, 1e-3, 5e-3]) {
      const mA = matrix(rows(A, 2));
      const eRef = mathjsExpm(multiply(mA, t) as never);
      const kRef = subtract(mIdentity(2), eRef);
      const jRef = subtract(multiply(mIdentity(2), t), multiply(inv(mA), subtract(eRef, mIdentity(2))));
      const f = flow(A, 2, t);
      const close = (got: number[], ref: number[]) => {
        const scale = Math.max(...ref.map(Math.abs));
        ref.forEach((v, i) => expect(Math.abs(got[i] - v)).toBeLessThan(1e-12 * scale));
      };
      close(f.E, flat(eRef));
      close(f.K, flat(kRef));
      close(f.J as number[], flat(jRef));
    }
  });

  it('doubling reproduces the flow over twice the time', () => {
    // Source: semigroup property e^{2tA} = (e^{tA})^2 (common practice); compared with a direct flow.
    const t = 7e-4;
    const twice = doubleFlow(doubleFlow(flow(A, 2, t), 2), 2);
    const direct = flow(A, 2, 4 * t);
    for (let i = 0; i < 4; i++) {
      expect(twice.E[i]).toBeCloseTo(direct.E[i], 13);
      expect(twice.K[i]).toBeCloseTo(direct.K[i], 13);
      expect((twice.J as number[])[i] / 4 / t).toBeCloseTo((direct.J as number[])[i] / 4 / t, 12);
    }
  });

  it('adding flows over unequal times matches mathjs expm over the sum, J included; without J it returns none', () => {
    // Source: mathjs expm/inv (npm) over t1 + t2; J as in the first test (calculus).
    const [t1, t2] = [3e-4, 1.1e-3];
    const mA = matrix(rows(A, 2));
    const eRef = mathjsExpm(multiply(mA, t1 + t2) as never);
    const jRef = subtract(multiply(mIdentity(2), t1 + t2), multiply(inv(mA), subtract(eRef, mIdentity(2))));
    const sum = addFlows(flow(A, 2, t1), flow(A, 2, t2), 2);
    const e = flat(eRef);
    const j = flat(jRef);
    for (let i = 0; i < 4; i++) {
      expect(sum.E[i]).toBeCloseTo(e[i], 12);
      expect(sum.K[i]).toBeCloseTo((i % 3 === 0 ? 1 : 0) - e[i], 12);
      expect((sum.J as number[])[i] / (t1 + t2)).toBeCloseTo(j[i] / (t1 + t2), 11);
    }
    expect(sum.t).toBe(t1 + t2);
    expect(addFlows(flow(A, 2, t1), flow(A, 2, t2, false), 2).J).toBeNull();
    // doubleFlow is addFlows of a flow with itself, digit for digit
    const f = flow(A, 2, t2);
    expect(doubleFlow(f, 2)).toEqual(addFlows(f, f, 2));
  });

  it('phi2 matches its series and its closed form', () => {
    // Source: phi2(z) = sum z^k/(k+2)! (series), and (e^z - 1 - z)/z^2 evaluated where it is exact
    // enough (|z| >= 1); phi2(0) = 1/2.
    expect(phi2(0)).toBe(0.5);
    for (const z of [-1e-9, 1e-7, -3e-3]) {
      const series = 0.5 + z / 6 + z ** 2 / 24 + z ** 3 / 120 + z ** 4 / 720;
      expect(Math.abs(phi2(z) - series) / series).toBeLessThan(1e-15);
    }
    for (const z of [-0.9, -0.5, 0.7]) {
      // 30-term series as reference
      let term = 0.5;
      let sum = 0.5;
      for (let k = 1; k < 30; k++) sum += term *= z / (k + 2);
      expect(Math.abs(phi2(z) - sum) / sum).toBeLessThan(1e-15);
    }
    for (const z of [-1, -5, -50, 2]) {
      expect(Math.abs(phi2(z) - (Math.exp(z) - 1 - z) / z ** 2) / phi2(z)).toBeLessThan(1e-14);
    }
  });
});
