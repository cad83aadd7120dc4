import type { Network } from '../../circuit/network.js';
import { maximizeOnInterval } from '../../numeric/maximizeOnInterval.js';
import { endpointFit, type ExtremumSearch } from '../endpointFit.js';
import type { DcTransfer, OperatingPoint, Settling, WorstRipple } from '../types.js';
import { codeParts, networkDuties, networkIdeal, quantizedFraction } from './networkCodes.js';
import { periodicOrbit } from './periodicOrbit.js';
import { periodicSettling } from './periodicSettling.js';

/**
 * Periodic steady state of a network at a fraction of its code range (networkCodes.ts), in the
 * engine's usual shape; `duty` is the (quantized) fraction.
 *
 * Syntax: networkPoint(network, fraction)
 * Example: networkPoint(n, 0.5).ripple
 */
export function networkPoint(network: Network, fraction: number): OperatingPoint {
  const o = periodicOrbit(network, networkDuties(network, fraction));
  return {
    duty: quantizedFraction(network, fraction),
    average: o.average,
    min: o.min,
    max: o.max,
    ripple: o.ripple,
    tMin: o.tMin,
    tMax: o.tMax,
  };
}

/**
 * Steady-state peak-to-peak ripple of a network at a fraction of its code range (periodicOrbit.ts
 * with extrema, without the average), V.
 *
 * Syntax: networkRipple(network, fraction)
 * Example: networkRipple(n, 0.5)  // V
 */
export function networkRipple(network: Network, fraction: number): number {
  return periodicOrbit(network, networkDuties(network, fraction), true, false).ripple;
}

/** Fine codes scanned per coarse code in the first pass of a fine output's ripple search. */
const FINE_PROBES = [0, 0.5, 1];
/** Coarse codes whose every fine code is scanned in the second pass. */
const FINE_FINALISTS = 4;

/**
 * The largest steady-state ripple over the used range [min, max] of fractions.
 *
 * Method: without a fine output, a 32-cell grid over the duty and Brent refinement of the three best
 * cells (numeric/maximizeOnInterval.ts). With a fine output the codes are discrete: every coarse code
 * in range at fine codes 0, half and full (the fine channel's ripple is 2^-b of the coarse one's, so
 * the coarse code decides), then every fine code of the four best coarse codes.
 *
 * Syntax: networkWorstRipple(network, min, max)
 * Example: networkWorstRipple(n, 0.05, 0.95).ripple
 */
export function networkWorstRipple(network: Network, min: number, max: number): WorstRipple {
  const second = network.second;
  if (second?.role !== 'fine') {
    const best = maximizeOnInterval((d) => periodicOrbit(network, { first: d, second: null }, true, false).ripple, min, max, 32, 3);
    return { duty: best.x, ripple: best.value };
  }
  const b = second.bits!;
  const total = 2 ** (b + second.coarseBits!);
  const lo = codeParts(network, min).code;
  const hi = codeParts(network, max).code;
  const rippleAt = (code: number) => networkRipple(network, code / total);
  const scores: Array<{ coarse: number; ripple: number; code: number }> = [];
  for (let coarse = Math.floor(lo / 2 ** b); coarse * 2 ** b <= hi; coarse++) {
    let best = { coarse, ripple: -Infinity, code: -1 };
    for (const p of FINE_PROBES) {
      const code = Math.min(Math.max(coarse * 2 ** b + Math.round(p * (2 ** b - 1)), lo), hi);
      const r = rippleAt(code);
      if (r > best.ripple) best = { coarse, ripple: r, code };
    }
    scores.push(best);
  }
  scores.sort((x, y) => y.ripple - x.ripple);
  let best = scores[0];
  for (const s of scores.slice(0, FINE_FINALISTS)) {
    for (let f = 0; f < 2 ** b; f++) {
      const code = s.coarse * 2 ** b + f;
      if (code < lo || code > hi) continue;
      const r = rippleAt(code);
      if (r > best.ripple) best = { coarse: s.coarse, ripple: r, code };
    }
  }
  return { duty: best.code / total, ripple: best.ripple };
}

/**
 * DC transfer errors over the used range, with the definitions and signs of dcTransfer.ts (ideal
 * minus actual; endpoint fit through the averages at the range ends).
 *
 * Method: exact averages (periodicOrbit.ts without extrema), errors by endpointFit.ts. Without a
 * fine output the largest errors are searched over the duty. With a fine output the average is
 * affine in each duty when the drivers are equal and close to it otherwise, so the extremes sit at
 * the ends of a coarse code's fine range: every coarse code at fine codes 0, half and full.
 *
 * `search`, when given, replaces both searches (a tolerance study's, started from a nominal
 * circuit's peaks; endpointFit.ts).
 *
 * Syntax: networkDcTransfer(network, min, max[, search])
 * Example: networkDcTransfer(n, 0.05, 0.95).droop.error  // V
 */
export function networkDcTransfer(network: Network, min: number, max: number, search?: ExtremumSearch): DcTransfer {
  const second = network.second;
  let candidates: number[] | undefined;
  if (second?.role === 'fine' && !search) {
    const b = second.bits!;
    const total = 2 ** (b + second.coarseBits!);
    const lo = codeParts(network, min).code;
    const hi = codeParts(network, max).code;
    const codes = new Set<number>([lo, hi]);
    for (let coarse = Math.floor(lo / 2 ** b); coarse * 2 ** b <= hi; coarse++) {
      for (const p of FINE_PROBES) codes.add(Math.min(Math.max(coarse * 2 ** b + Math.round(p * (2 ** b - 1)), lo), hi));
    }
    candidates = [...codes].map((code) => code / total);
  }
  // Each average once: the droop and INL searches look at the same points (endpointFit.ts).
  const averages = new Map<number, number>();
  const average = (f: number) => {
    let y = averages.get(f);
    if (y === undefined) {
      y = networkAverage(network, f);
      averages.set(f, y);
    }
    return y;
  };
  return endpointFit(
    {
      average,
      ideal: (f) => networkIdeal(network, f),
      quantize: (f) => quantizedFraction(network, f),
      span: network.pin.high - network.pin.low,
      low: network.pin.low,
      candidates,
      search,
    },
    min,
    max,
  );
}

/**
 * Exact time-average output of a network at a fraction of its code range (periodicOrbit.ts
 * without extrema), V.
 *
 * Syntax: networkAverage(network, fraction)
 * Example: networkAverage(n, 0.5)  // V
 */
export function networkAverage(network: Network, fraction: number): number {
  return periodicOrbit(network, networkDuties(network, fraction), false).average;
}

/**
 * Settling of a network for a step between two fractions of the code range (periodicSettling.ts).
 *
 * Syntax: networkSettling(network, from, to, band)
 * Example: networkSettling(n, 0.05, 0.95, 1e-3).time  // s or null
 */
export function networkSettling(network: Network, from: number, to: number, band: number): Settling {
  const r = periodicSettling(network, networkDuties(network, from), networkDuties(network, to), band);
  return { from: quantizedFraction(network, from), to: quantizedFraction(network, to), band, time: r.time };
}

/**
 * Pin peak current (model.md): the swing over driver plus series resistance, the largest of the two
 * outputs (the second one drives its injection resistor).
 *
 * Syntax: networkPinPeakCurrent(network)
 */
export function networkPinPeakCurrent(network: Network): number {
  const p = network.pin;
  const first = network.stages[0];
  const r = first.kind === 'rc' ? first.r : first.r1;
  let peak = Math.abs(p.high - p.low) / (Math.min(p.driverHigh, p.driverLow) + r);
  const s = network.second;
  if (s) peak = Math.max(peak, Math.abs(s.pin.high - s.pin.low) / (Math.min(s.pin.driverHigh, s.pin.driverLow) + s.r));
  return peak;
}
