import type { Network } from '../circuit/network.js';
import { codeParts, networkDcTransfer, networkRipple, networkSettling, networkWorstRipple, type ExtremumSearch } from '../engine/index.js';
import { maximizeOverCodes } from './codeSearch.js';
import { maximizeFromHints } from './dutySearch.js';
import type { MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';

export interface NetworkMetricsOptions {
  /** The engine's own full searches for every figure (a reference; slow for a fine output). */
  engineOnly?: boolean;
}

/**
 * Worst ripple, droop, INL, gain error and settling time of one network (second PWM output,
 * Sallen-Key stages: model.md 1.1) for tolerance studies, with the definitions of `analyze`.
 *
 * Method: every value comes from the general periodic engine (src/engine/periodic: exact ripple
 * of one operating point, networkRipple; the endpoint-fit DC errors, networkDcTransfer; settling,
 * networkSettling, the slowest of the plan's steps). What differs from the engine's own figures is
 * only where the searches start: worst ripple by Brent's maximization from the nominal network's
 * ripple peaks in the plan (maximizeFromHints, dutySearch.ts), and the largest DC errors likewise
 * from the plan's DC peaks; with a fine output the codes are discrete, and both are searched over
 * codes from the nominal's worst codes (maximizeOverCodes, codeSearch.ts) instead of the engine's
 * scan of every coarse code: the ripple along coarse and fine codes, the DC errors along the coarse
 * codes at the fine codes where the engine looks for them (0, half and full). `engineOnly` calls networkWorstRipple and networkDcTransfer
 * themselves (the full searches, as analyze does); tests hold the two to each other.
 *
 * Syntax: networkMetrics(network, plan[, { engineOnly }])
 * Example: networkMetrics(n, metricPlan(p, n)).worstRipple.ripple  // V
 */
export function networkMetrics(network: Network, plan: MetricPlan, options: NetworkMetricsOptions = {}): CircuitMetrics {
  const { dutyMin: a, dutyMax: b } = plan;
  const second = network.second;
  const fine = second?.role === 'fine' ? { bits: second.bits!, total: 2 ** (second.bits! + second.coarseBits!) } : null;
  let worstRipple: { duty: number; ripple: number };
  let search: ExtremumSearch | undefined;
  if (options.engineOnly) {
    worstRipple = networkWorstRipple(network, a, b);
  } else if (fine) {
    const lo = codeParts(network, a).code;
    const hi = codeParts(network, b).code;
    const codes = (hints: number[] | null) => (hints ?? []).map((d) => Math.round(d * fine.total));
    const best = maximizeOverCodes((code) => networkRipple(network, code / fine.total), lo, hi, fine.bits, codes(plan.rippleHints));
    worstRipple = { duty: best.x / fine.total, ripple: best.value };
    // The engine's premise for DC errors (networkDcTransfer): along a coarse code's fine codes
    // their extremes sit at fine 0, half and full, so three coarse lines are searched.
    const last = 2 ** fine.bits - 1;
    const probes = [...new Set([0, Math.round(0.5 * last), last])];
    search = (g, _min, _max, figure) => {
      if (figure === 'inl' && !plan.inl) return a;
      const hints = codes(figure === 'droop' ? plan.droopHints : plan.inlHints);
      return maximizeOverCodes((code) => g(code / fine.total), lo, hi, fine.bits, hints, probes).x / fine.total;
    };
  } else {
    const best = maximizeFromHints((d) => networkRipple(network, d), a, b, plan.rippleHints);
    worstRipple = { duty: best.x, ripple: best.value };
    search = (g, min, max, figure) => {
      if (figure === 'inl' && !plan.inl) return min;
      return maximizeFromHints(g, min, max, figure === 'droop' ? plan.droopHints : plan.inlHints).x;
    };
  }
  const dc = networkDcTransfer(network, a, b, search);
  let settling: number | null = 0;
  for (const { from, to } of plan.steps) {
    const t = networkSettling(network, from, to, plan.band).time;
    if (t === null) {
      settling = null;
      break;
    }
    settling = Math.max(settling, t);
  }
  return {
    worstRipple,
    droop: dc.droop,
    inl: plan.inl ? dc.inl : null,
    gain: plan.gain ? dc.gainError / (network.pin.high - network.pin.low) : null,
    settlingTime: settling,
    usedEngine: true,
  };
}
