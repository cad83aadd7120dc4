/** Bench section: cost of settlingTime as the time constant grows from 10 to 1e7 periods. */
import { performance } from 'node:perf_hooks';
import { settlingTime, steadyState } from '../src/engine/index.js';
import { freshLadder, ladderWithSlowestTau } from './bench-cases.js';
import { interleavedTimePerCall, median } from './bench-measure.js';
import type { BenchSection } from './bench-table.js';

export interface SettlingCostRow {
  /** Slowest time constant, PWM periods. */
  tauPeriods: number;
  /** Median CPU time of one settlingTime call, s, for one and two stages. */
  oneStage: number;
  twoStage: number;
  /** Settling time found, in periods (null: never settles), for one and two stages. */
  settledOne: number | null;
  settledTwo: number | null;
}

export interface SettlingCost {
  rows: SettlingCostRow[];
  /** Least-squares slope of time against log10(tau), s per decade, one and two stages. */
  perDecade: { oneStage: number; twoStage: number };
  /** perDecade / median time: the share by which the cost grows per decade of tau. */
  relativePerDecade: { oneStage: number; twoStage: number };
  /** Largest / smallest time over the range, one and two stages. */
  spread: { oneStage: number; twoStage: number };
}

/** Step of the bench: 10 % to 90 % duty. */
const FROM = 0.1;
const TO = 0.9;

/**
 * Time of one settlingTime call (10 % -> 90 % duty, fresh ladder per call) for a slowest time
 * constant of 10, 100, ..., 1e7 PWM periods, one and two stages; the cost per decade is the
 * least-squares slope against log10(tau). The band is 0.5 LSB of 10 bits, widened to twice the
 * ripple at 90 % where the ripple is larger (short time constants), so that every case settles and
 * the full search runs. All cases run for a second before the timing starts (JIT warm-up), and
 * their timed runs are interleaved so that a change in load cannot pass for a trend in tau.
 *
 * Syntax: settlingCost()
 * Example: settlingCost().perDecade.twoStage   // 1e-6 (s per decade)
 */
export function settlingCost(): { data: SettlingCost; section: BenchSection } {
  const taus = [1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7];
  const cases = taus.flatMap((tau) =>
    ([1, 2] as const).map((stages) => {
      const ladder = ladderWithSlowestTau(stages, tau);
      const lsb = (ladder.high - ladder.low) / 1024;
      const band = Math.max(lsb / 2, 2 * steadyState(freshLadder(ladder), TO).ripple);
      const settled = settlingTime(freshLadder(ladder), FROM, TO, band).time;
      return { tau, stages, settled: settled === null ? null : settled / ladder.period, work: () => settlingTime(freshLadder(ladder), FROM, TO, band) };
    }),
  );
  // Every case, round after round for a second, before any timing: the first cases must not pay
  // for the JIT's warm-up.
  const warmUntil = performance.now() + 1000;
  while (performance.now() < warmUntil) for (const c of cases) for (let i = 0; i < 10; i++) c.work();
  const timings = interleavedTimePerCall(cases.map((c) => c.work), { runs: 9, runSeconds: 0.03, warmup: false });
  const at = (tau: number, stages: 1 | 2) => cases.findIndex((c) => c.tau === tau && c.stages === stages);
  const rows = taus.map((tauPeriods): SettlingCostRow => ({
    tauPeriods,
    oneStage: timings[at(tauPeriods, 1)].perCall,
    twoStage: timings[at(tauPeriods, 2)].perCall,
    settledOne: cases[at(tauPeriods, 1)].settled,
    settledTwo: cases[at(tauPeriods, 2)].settled,
  }));
  const x = taus.map(Math.log10);
  const perDecade = { oneStage: slope(x, rows.map((r) => r.oneStage)), twoStage: slope(x, rows.map((r) => r.twoStage)) };
  const relativePerDecade = {
    oneStage: perDecade.oneStage / median(rows.map((r) => r.oneStage)),
    twoStage: perDecade.twoStage / median(rows.map((r) => r.twoStage)),
  };
  const spreadOf = (ys: number[]) => Math.max(...ys) / Math.min(...ys);
  const spread = { oneStage: spreadOf(rows.map((r) => r.oneStage)), twoStage: spreadOf(rows.map((r) => r.twoStage)) };
  const periods = (p: number | null) => (p === null ? 'never' : p);
  return {
    data: { rows, perDecade, relativePerDecade, spread },
    section: {
      title: 'Settling-time cost against the time constant (settlingTime, 10 % -> 90 % duty)',
      columns: ['tau/T', '1 stage, CPU (us)', 'settles after (T)', '2 stages, CPU (us)', 'settles after (T)'],
      rows: rows.map((r) => [r.tauPeriods, r.oneStage * 1e6, periods(r.settledOne), r.twoStage * 1e6, periods(r.settledTwo)]),
      notes: [
        `cost per decade of tau (least-squares slope): 1 stage ${(perDecade.oneStage * 1e6).toFixed(2)} us ` +
          `(${percent(relativePerDecade.oneStage)} of the median), 2 stages ${(perDecade.twoStage * 1e6).toFixed(2)} us (${percent(relativePerDecade.twoStage)})`,
        `largest / smallest cost over 10..1e7 periods: 1 stage ${spread.oneStage.toFixed(2)}, 2 stages ${spread.twoStage.toFixed(2)}`,
      ],
    },
  };
}

const percent = (x: number) => `${(100 * x).toFixed(1)} %`;

/** Least-squares slope of y against x. */
function slope(x: number[], y: number[]): number {
  const n = x.length;
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  return sxy / sxx;
}
