import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../src/circuit/ladder.js';
import type { OperatingPoint } from '../../src/engine/types.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { hasModalForm } from '../../src/engine/hasModalForm.js';
import { timeConstants } from '../../src/engine/timeConstants.js';
import { ladder, stage } from './ladders.js';

/**
 * Hard cases against 80-digit references: mpmath 1.3 (Python) at 80 significant digits, printed to
 * 20, by steadyState.highPrecision.py beside this file (nodal equations written there from Kirchhoff's
 * current law, independently of src/; one-period map from mpmath.expm, fixed point by an LU solve,
 * extremes at the phase ends and at the zeros of the output's derivative, found on a 2000-point grid
 * per phase and refined by bisection; average from the exact integral of each phase). The ladders
 * are invented; 50 us period, 3.3 V / 0 V unless stated.
 */
/** The reference values, in the engine's own result shape. */
type ReferencePoint = OperatingPoint;
interface ReferenceCase {
  name: string;
  ladder: Ladder;
  points: ReferencePoint[];
}

const CASES: ReferenceCase[] = [
  {
    name: 'two equal stages, tau = 1000 T',
    ladder: ladder([stage(1e4, 5e-6), stage(1e4, 5e-6)]),
    points: [
      { duty: 0.001, average: 3.2999999999999998911e-3, min: 3.2999997254123989547e-3, max: 3.300000137499856089e-3, ripple: 4.1208745713426134226e-10, tMin: 2.4987506251456148772e-8, tMax: 2.5018750006614584493e-5 },
      { duty: 0.5, average: 1.6499999999999999112, min: 1.6499999484375034024, max: 1.65000005156249642, ripple: 1.0312499301757884539e-7, tMin: 1.2495312500341797435e-5, tMax: 3.7495312500341798633e-5 },
      { duty: 0.999, average: 3.2966999999999998196, min: 3.2966999998624999634, max: 3.2967000002745874205, ripple: 4.1208745713426169933e-10, tMin: 2.4968750006614584468e-5, tMax: 4.997498750625145852e-5 },
    ],
  },
  {
    name: 'two stages, tau2 = 1e-4 tau1, drivers 0 / 1000 ohm',
    ladder: ladder([stage(1e4, 5e-9), stage(1e4, 5e-13)], { driverHigh: 0, driverLow: 1000 }),
    points: [
      { duty: 0.001, average: 3.6296124284674682629e-3, min: 2.2277161073517907301e-3, max: 5.5200520497180370284e-3, ripple: 3.2923359423662462982e-3, tMin: 3.069302900521418446e-12, tMax: 8.2438816745462626507e-8 },
      { duty: 0.3, average: 1.0562333415784180454, min: 7.4461811995840116692e-1, max: 1.4067091126430372535, ripple: 6.6209099268463608657e-1, tMin: 1.1748543528676812972e-9, tMax: 1.5004541838581582915e-5 },
      { duty: 0.999, average: 3.2969997049358547678, min: 3.2952592318304578525, max: 3.2982527485795956324, ripple: 2.9935167491377798603e-3, tMin: 3.224806337036864848e-8, tMax: 4.995000291248851856e-5 },
    ],
  },
  {
    name: 'two stages, tau2 = 1e4 tau1, low 0.1 V, drivers 40 / 25 ohm, R and C load',
    ladder: ladder([stage(1e4, 5e-8), stage(1e5, 5e-5)], { low: 0.1, driverHigh: 40, driverLow: 25, loadResistance: 1e6, loadCapacitance: 1e-10 }),
    points: [
      { duty: 0, average: 9.0088061079705417041e-2, min: 9.0088061079705417041e-2, max: 9.0088061079705417041e-2, ripple: 0, tMin: 0, tMax: 0 },
      { duty: 0.05, average: 2.3402421202863395951e-1, min: 2.3402419972930435066e-1, max: 2.3402421865194830151e-1, ripple: 1.8922643950850538351e-8, tMin: 1.2277111770098570958e-6, tMax: 2.6021926050019527823e-5 },
      { duty: 0.5, average: 1.5304093963731330479, min: 1.5304093465418093311, max: 1.5304094462044612887, ripple: 9.9662651957621670618e-8, tMin: 1.2328674160986565553e-5, tMax: 3.7328596566573246406e-5 },
      { duty: 1, average: 2.972865842672335972, min: 2.972865842672335972, max: 2.972865842672335972, ripple: 0, tMin: 0, tMax: 0 },
    ],
  },
  {
    name: 'stiff two stages, tau from 1.4e-2 T down to 5e-9 T, loaded',
    ladder: ladder([stage(1e3, 7e-10), stage(10, 2.5e-14)], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 }),
    points: [
      { duty: 0.002, average: 6.4443540891534671839e-3, min: 1.3006810589109394046e-31, max: 4.2318940765143880017e-1, ripple: 4.2318940765143880017e-1, tMin: 0, tMax: 1.00000507658127187e-7 },
      { duty: 0.5, average: 1.6321831431924929869, min: 1.6874155436750571626e-15, max: 3.2657100445324067333, ripple: 3.2657100445324050458, tMin: 0, tMax: 2.5000000000000001198e-5 },
    ],
  },
  {
    name: 'three equal stages, tau = 10 T, 1 Mohm load',
    ladder: ladder([stage(1e4, 5e-8), stage(1e4, 5e-8), stage(1e4, 5e-8)], { loadResistance: 1e6 }),
    points: [
      { duty: 1e-6, average: 3.2038834951456307505e-6, min: 3.2038566854037988642e-6, max: 3.2039095415920533017e-6, ripple: 5.2856188254437557925e-11, tMin: 9.8801556941705708331e-6, tMax: 3.8729430085145729209e-5 },
      { duty: 0.5, average: 1.6019417475728154477, min: 1.6019331719595292116, max: 1.6019503231861016839, ripple: 1.7151226572472356319e-5, tMin: 2.4467806235245089266e-5, tMax: 4.9467806235245090464e-5 },
      { duty: 0.999999, average: 3.2038802912621356577, min: 3.2038802912360892113, max: 3.2038802912889453996, ripple: 5.2856188255957475134e-11, tMin: 3.872938008514572849e-5, tMax: 9.8801056941705701142e-6 },
    ],
  },
  {
    name: 'three stages, tau = 10 T, 1e4 T, 1e-2 T, drivers 0 / 1000 ohm',
    ladder: ladder([stage(1e4, 5e-8), stage(1e4, 5e-5), stage(1e4, 5e-11)], { driverHigh: 0, driverLow: 1000 }),
    points: [
      { duty: 0.05, average: 1.805958401471399171e-1, min: 1.8059571494810317569e-1, max: 1.8059590828060637986e-1, ripple: 1.9333250320416447632e-7, tMin: 1.6937629834421423673e-6, tMax: 2.6353567771284403022e-5 },
      { duty: 0.7, average: 2.3747454778971617775, min: 2.3747451276622285851, max: 2.3747459353584291197, ripple: 8.0769620053462568408e-7, tMin: 1.7623666276417187542e-5, tMax: 4.2792062814843195973e-5 },
    ],
  },
  {
    name: 'follower after the last stage, load behind it',
    ladder: ladder([stage(1e4, 5e-8), stage(1e4, 1e-7, true)], { driverHigh: 40, driverLow: 25, loadResistance: 1e3, loadCapacitance: 1e-6 }),
    points: [
      { duty: 0.25, average: 8.2407551449950836407e-1, min: 8.2385090088160554284e-1, max: 8.2423599948532943827e-1, ripple: 3.8509860372389543739e-4, tMin: 6.02256630433508538e-6, tMax: 3.0762461026459938371e-5 },
      { duty: 0.9, average: 2.9695557437329193513, min: 2.9694878868922554398, max: 2.9696728965401336236, ripple: 1.8500964787818381236e-4, tMin: 2.1985417728883282879e-5, tMax: 4.7401268603983947643e-5 },
    ],
  },
  {
    name: 'cascade: follower after stage 1 of 3, drivers 0 / 1000 ohm',
    ladder: ladder([stage(1e4, 5e-8, true), stage(1e4, 1.5e-8), stage(1e4, 2.5e-7)], { driverHigh: 0, driverLow: 1000 }),
    points: [
      { duty: 0.1, average: 3.5940393597989139246e-1, min: 3.5940218722080958705e-1, max: 3.5940561092366202784e-1, ripple: 3.4237028524407861614e-6, tMin: 1.2092425485137456417e-5, tMax: 4.0776888192692030438e-5 },
      { duty: 0.6, average: 2.0547033993161657809, min: 2.0546983514597045915, max: 2.0547085370941776639, ripple: 1.018563447307246114e-5, tMin: 2.7294140126152601672e-5, tMax: 8.8558429157686985264e-7 },
    ],
  },
  {
    // Found by the routes test (fast-check): the matrix exponentials missed this one by 9.4e-12 V,
    // 19 of that test's rounding units; the modal route is within 5e-15 V of the reference.
    name: 'three stages, 1 us period, tau from 27 T down to 1e-2 T, output capacitance only',
    ladder: ladder([stage(10, 3.2041384135748383e-9), stage(102465.36138704566, 2.6787049590544845e-10), stage(10.000002895007214, 1.0000000171555959e-9)], { period: 1e-6, loadCapacitance: 1.752033089975738e-12 }),
    points: [
      { duty: 0.5531775262206793, average: 1.8254858365282415361, min: 1.8226441630195815479, max: 1.8283529757373367636, ripple: 5.7088127177552157341e-3, tMin: 2.7934446731008598595e-8, tMax: 5.7428249339362236797e-7 },
    ],
  },
  {
    name: 'cascade of two identical sections (repeated mode: the matrix exponentials)',
    ladder: ladder([stage(1e4, 1e-8, true), stage(1e4, 1e-8)]),
    points: [
      { duty: 0.3, average: 9.8999999999999991007e-1, min: 9.7780948164624371942e-1, max: 9.9936488322427755725e-1, ripple: 2.1555401578033837838e-2, tMin: 6.4440510654659646788e-6, tMax: 3.0612725598306321746e-5 },
    ],
  },
];

const EPS = 2 ** -52;

/** Shortest distance between two instants of a periodic waveform, s. */
const periodicDistance = (a: number, b: number, period: number) => {
  const d = Math.abs(a - b) % period;
  return Math.min(d, period - d);
};

describe('steadyState against 80-digit references', () => {
  for (const c of CASES) {
    it(c.name, () => {
      const n = c.ladder.stages.length;
      const level = c.ladder.high - c.ladder.low;
      const T = c.ladder.period;
      // the route under test: modal form except for the repeated mode
      expect(hasModalForm(c.ladder)).toBe(!c.name.includes('identical'));
      const slowest = timeConstants(c.ladder)[0];
      for (const p of c.points) {
        const op = steadyState(c.ladder, p.duty);
        // levels: a few units of rounding of the level (measured at most 3.1e-15 of it)
        for (const k of ['average', 'min', 'max'] as const) {
          expect(Math.abs(op[k] - p[k]), `${k} at ${p.duty}`).toBeLessThan(2e-14 * level);
        }
        if (p.ripple === 0) {
          expect(op.ripple).toBe(0);
          continue;
        }
        // Ripple, relative: at a ripple of about (T/tau)^n of the level the n modal terms, each of
        // about T/tau, cancel, so rounding grows about (tau/T)^(n-1) (our estimate; the same holds
        // for the matrix exponentials). Measured at most 5.6e-9 (three stages, tau up to 1e4 T).
        const cancel = Math.max(1, slowest / T) ** (n - 1);
        expect(Math.abs(op.ripple - p.ripple) / p.ripple, `ripple at ${p.duty}`).toBeLessThan(1e-11 + 4 * EPS * cancel);
        // Where the extremes are (measured at most 1.3e-10 T). Skipped where the output rests on a
        // DC level for part of the phase (tau << T): any instant of that plateau is an extreme.
        if (timeConstants(c.ladder).at(-1)! > 0.1 * T) {
          expect(periodicDistance(op.tMin, p.tMin, T), `tMin at ${p.duty}`).toBeLessThan(1e-9 * T);
          expect(periodicDistance(op.tMax, p.tMax, T), `tMax at ${p.duty}`).toBeLessThan(1e-9 * T);
        }
      }
    });
  }
});
