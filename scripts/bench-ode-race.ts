/** Bench section: the exact engine against time-stepping with a general-purpose ODE solver. */
import { steadyState, timeConstants } from '../src/engine/index.js';
import { freshLadder, odeCases } from './bench-cases.js';
import { median, timeOnce, timePerCall } from './bench-measure.js';
import { odeRipple } from './bench-ode.js';
import type { BenchSection } from './bench-table.js';

/** The accuracy both routes must reach: ripple to this relative difference. */
export const MATCHED_ACCURACY = 1e-6;

export interface OdeRace {
  name: string;
  duty: number;
  /** Slowest time constant in PWM periods. */
  tauPeriods: number;
  /** Engine ripple, V. */
  ripple: number;
  /** Median CPU time of steadyState on a fresh ladder, s. */
  engine: number;
  /** Median CPU time of the ODE route at the loosest tolerance that matches, s; null when none matched. */
  ode: number | null;
  /** The same two as wall time, s. */
  engineWall: number;
  odeWall: number | null;
  /** ode / engine. */
  ratio: number | null;
  /** ODEX tolerance used (relative; absolute the same in V). */
  tolerance: number | null;
  /** |ripple_ode - ripple_engine| / ripple_engine at that tolerance. */
  difference: number | null;
  periods: number | null;
  steps: number | null;
}

/**
 * The same periodic steady-state ripple by the exact engine (steadyState) and by integrating the
 * circuit period by period with ODEX until the periodic state is reached (bench-ode.ts), at
 * matched accuracy: the ODE route gets the loosest tolerance of 1e-6, 1e-7, ..., 1e-13 whose ripple
 * agrees with the engine's to MATCHED_ACCURACY relative (its settle threshold a tenth of that),
 * so it is not slowed down by more accuracy than the comparison asks for. Each route's time is a
 * median CPU time over 3 rounds, each round one engine measurement (3 runs of many calls) and one
 * ODE run, alternating; the ratio is of CPU times.
 *
 * Syntax: await engineVersusOde()
 * Example: (await engineVersusOde()).data[0].ratio   // 2.5e4
 */
export async function engineVersusOde(): Promise<{ data: OdeRace[]; section: BenchSection }> {
  const data: OdeRace[] = [];
  for (const { name, ladder, duty } of odeCases) {
    const reference = steadyState(freshLadder(ladder), duty).ripple;
    const engineWork = () => steadyState(freshLadder(ladder), duty);
    timePerCall(engineWork, { runs: 3 }); // warm-up
    const tauPeriods = timeConstants(freshLadder(ladder))[0] / ladder.period;
    const scale = Math.abs(ladder.high - ladder.low);
    let match: { tolerance: number; difference: number; periods: number; steps: number } | null = null;
    for (let k = 6; k <= 13 && !match; k++) {
      const tolerance = 10 ** -k;
      const run = odeRipple(ladder, duty, { relativeTolerance: tolerance, absoluteTolerance: tolerance * scale, settle: MATCHED_ACCURACY / 10 });
      const difference = Math.abs(run.ripple - reference) / reference;
      if (difference <= MATCHED_ACCURACY) match = { tolerance, difference, periods: run.periods, steps: run.steps };
    }
    if (!match) {
      const { perCall, wallPerCall } = timePerCall(engineWork, { runs: 7 });
      data.push({ name, duty, tauPeriods, ripple: reference, engine: perCall, engineWall: wallPerCall, ode: null, odeWall: null, ratio: null, tolerance: null, difference: null, periods: null, steps: null });
      continue;
    }
    const options = { relativeTolerance: match.tolerance, absoluteTolerance: match.tolerance * scale, settle: MATCHED_ACCURACY / 10 };
    // Engine and ODE runs alternate, so that a change in machine load hits both routes alike.
    const engineRuns: Array<{ cpu: number; wall: number }> = [];
    const odeRuns: Array<{ cpu: number; wall: number }> = [];
    for (let i = 0; i < 3; i++) {
      const t = timePerCall(engineWork, { runs: 3, warmup: false });
      engineRuns.push({ cpu: t.perCall, wall: t.wallPerCall });
      odeRuns.push(await timeOnce(() => odeRipple(ladder, duty, options)));
    }
    const engine = median(engineRuns.map((r) => r.cpu));
    const ode = median(odeRuns.map((r) => r.cpu));
    data.push({
      name,
      duty,
      tauPeriods,
      ripple: reference,
      engine,
      engineWall: median(engineRuns.map((r) => r.wall)),
      ode,
      odeWall: median(odeRuns.map((r) => r.wall)),
      ratio: ode / engine,
      ...match,
    });
  }
  return {
    data,
    section: {
      title: `Periodic steady-state ripple: exact engine against ODEX time-stepping from power-up, matched to ${MATCHED_ACCURACY} relative`,
      columns: ['case', 'tau/T', 'duty', 'ripple (V)', 'engine (us)', 'ODE (ms)', 'ODE/engine', 'ODE periods', 'ODE steps', 'ODE tol', 'rel. diff'],
      rows: data.map((d) => [
        d.name,
        d.tauPeriods,
        d.duty,
        d.ripple,
        d.engine * 1e6,
        d.ode === null ? 'no match' : d.ode * 1e3,
        d.ratio ?? '-',
        d.periods ?? '-',
        d.steps ?? '-',
        d.tolerance ?? '-',
        d.difference ?? '-',
      ]),
      notes: [
        'CPU times; engine: steadyState on a fresh ladder object per call (no cached preparation);',
        'ODE: npm odex (GBS extrapolation), loosest tolerance of 1e-6..1e-13 that matches, stop when the',
        'estimated distance to the periodic state is below 1e-7 of the ripple; extrema from dense output.',
      ],
    },
  };
}
