import type { Network } from '../../circuit/network.js';
import { identity, matmul } from '../../numeric/dense.js';
import { checkCount } from '../checkArguments.js';
import { periodPowers } from '../periodPowers.js';
import { flow } from '../flow.js';
import type { DcErrorSeries, MagnitudeSeries, StepRecord, SteadyRecord } from '../types.js';
import { networkDuties, networkIdeal } from './networkCodes.js';
import { networkMagnitude } from './networkResponse.js';
import { networkCache } from './phaseFlows.js';
import { periodicOrbit, type PeriodicOrbit } from './periodicOrbit.js';

/**
 * The orbit's output at instants inside one period and the row c Phi(tau) that maps a deviation of
 * the period-start state to the output at tau, so that a transient's sample is one dot product.
 */
function inPeriod(network: Network, orbit: PeriodicOrbit, taus: readonly number[]): { y: number[]; rows: number[][] } {
  const { equations } = networkCache(network);
  const n = equations.n;
  const c = equations.output;
  const y: number[] = [];
  const rows: number[][] = [];
  let x = orbit.start.slice();
  let Phi: number[] = identity(n);
  let t0 = 0;
  let i = 0;
  orbit.phases.forEach((ph, p) => {
    const last = p === orbit.phases.length - 1;
    while (i < taus.length && (taus[i] < t0 + ph.duration || last)) {
      const local = Math.min(Math.max(taus[i] - t0, 0), ph.duration);
      const f = flow(ph.A, n, local, false, equations.scale);
      let v = 0;
      const row = new Array<number>(n).fill(0);
      for (let a = 0; a < n; a++) {
        let kx = 0;
        for (let b = 0; b < n; b++) kx += f.K[a * n + b] * (ph.xStar[b] - x[b]);
        v += c[a] * (x[a] + kx);
        for (let b = 0; b < n; b++) {
          let e = 0;
          for (let k = 0; k < n; k++) e += f.E[a * n + k] * Phi[k * n + b];
          row[b] += c[a] * e;
        }
      }
      y.push(v);
      rows.push(row);
      i++;
    }
    const { E, K } = ph.full;
    x = x.map((_, a) => {
      let s = x[a];
      for (let b = 0; b < n; b++) s += K[a * n + b] * (ph.xStar[b] - x[b]);
      return s;
    });
    Phi = matmul(E, Phi, n);
    t0 += ph.duration;
  });
  return { y, rows };
}

/**
 * `periods` periods of the steady state at a fraction of the code range, `samplesPerPeriod` per
 * period plus the end, t from the period start.
 *
 * Method: the exact orbit (periodicOrbit.ts) and the exact flow to each instant.
 *
 * Syntax: networkSteadyRecord(network, fraction, periods, samplesPerPeriod)
 */
export function networkSteadyRecord(network: Network, fraction: number, periods: number, samplesPerPeriod: number): SteadyRecord {
  const orbit = periodicOrbit(network, networkDuties(network, fraction), false);
  const T = network.period;
  const taus = Array.from({ length: samplesPerPeriod }, (_, j) => (j * T) / samplesPerPeriod);
  const { y } = inPeriod(network, orbit, taus);
  const t: number[] = [];
  const v: number[] = [];
  for (let m = 0; m < periods; m++) taus.forEach((tau, j) => (t.push(m * T + tau), v.push(y[j])));
  t.push(periods * T);
  v.push(y[0]);
  return { duty: fraction, average: orbit.average, wave: { t, v } };
}

/**
 * The step from one fraction to another as a record on t = k T + j T / m for `duration` (at most
 * `maxSamples` samples: beyond that an evenly spread subset of periods is kept whole), with the
 * final average, band and settling time given by the caller.
 *
 * Method: deviation from the new orbit at period k is M^k delta_0 (binary powers of M in the form
 * I - S, as periodicSettling.ts), and the output at tau in the period is y_orbit(tau) + c Phi(tau) delta.
 *
 * Syntax: networkStepRecord(network, from, to, { duration, perPeriod, maxSamples, band, time })
 */
export function networkStepRecord(
  network: Network,
  from: number,
  to: number,
  options: { duration: number; perPeriod: number; maxSamples: number; band: number; time: number | null },
): StepRecord {
  const T = network.period;
  const n = networkCache(network).equations.n;
  const a = periodicOrbit(network, networkDuties(network, from), false);
  const b = periodicOrbit(network, networkDuties(network, to), false);
  const m = options.perPeriod;
  const taus = Array.from({ length: m }, (_, j) => (j * T) / m);
  const { y, rows } = inPeriod(network, b, taus);
  const periods = Math.ceil(options.duration / T);
  const keepEvery = Math.max(1, Math.ceil((periods * m) / options.maxSamples));
  const t: number[] = [];
  const v: number[] = [];
  let delta = a.start.map((s, i) => s - b.start[i]);
  let at = 0;
  const powers = periodPowers([...b.S], n);
  for (let k = 0; k < periods; k += keepEvery) {
    if (k !== at) throw new Error('networkStepRecord: period bookkeeping');
    for (let j = 0; j < m; j++) {
      const time = k * T + taus[j];
      if (time > options.duration) break;
      let s = y[j];
      for (let i = 0; i < n; i++) s += rows[j][i] * delta[i];
      t.push(time);
      v.push(s);
    }
    delta = powers.applyPower(keepEvery, delta);
    at += keepEvery;
  }
  return { wave: { t, v }, from, to, final: b.average, band: options.band, time: options.time };
}

/**
 * Magnitude response relative to DC at `points` log-spaced frequencies from a hundredth of the lower
 * to ten times the higher of the cutoff and the PWM frequency (as magnitudeResponse.ts).
 *
 * Syntax: networkMagnitudeResponse(network, points, cutoff)
 */
export function networkMagnitudeResponse(network: Network, points: number, cutoff: number): MagnitudeSeries {
  checkCount(points, 'points', true);
  const pwmFrequency = 1 / network.period;
  const fLo = Math.min(cutoff, pwmFrequency) / 100;
  const fHi = Math.max(cutoff, pwmFrequency) * 10;
  const dc = networkMagnitude(network, 0);
  const frequency = Array.from({ length: points }, (_, i) => (points === 1 ? fLo : fLo * (fHi / fLo) ** (i / (points - 1))));
  return { frequency, gainDb: frequency.map((f) => 20 * Math.log10(networkMagnitude(network, f) / dc)), cutoff, pwmFrequency };
}

/**
 * DC error ideal - average at `points` fractions across the used range.
 *
 * Syntax: networkDcErrorAcrossDuty(network, min, max, points)
 */
export function networkDcErrorAcrossDuty(network: Network, min: number, max: number, points: number): DcErrorSeries {
  checkCount(points, 'points', true);
  const duty = Array.from({ length: points }, (_, i) => (points === 1 ? min : min + ((max - min) * i) / (points - 1)));
  return { duty, error: duty.map((d) => networkIdeal(network, d) - periodicOrbit(network, networkDuties(network, d), false).average) };
}
