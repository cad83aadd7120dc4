import type { StateSpace } from '../circuit/stateSpace.js';
import type { Matrix, Vector } from '../numeric/dense.js';
import type { Flow } from './flow.js';

/**
 * The data the matrix-exponential route keeps per ladder (prepare.ts) and per duty (dutyPlan.ts,
 * periodTrajectory.ts). Declared here, apart from the code, so that those three files import the
 * shapes from one place and not from each other (they used to form an import cycle).
 */

/** Everything about a ladder that does not depend on the duty, computed once per ladder object. */
/**
 * Remembered per ladder object (prepare.ts), so its figures are readonly; only its two caches
 * change: `plans` (bounded) and `timeConstants` (filled on first use).
 */
export interface Prepared {
  readonly n: number;
  readonly period: number;
  readonly system: StateSpace;
  /** DC state of each phase alone: x_p = -A_p^{-1} b_p. */
  readonly xHigh: Vector;
  readonly xLow: Vector;
  /** xHigh - xLow, formed from the per-volt gains so equal drivers give no subtraction. */
  readonly delta: Vector;
  /** Balancing scale sqrt(C_i) of each node (see flow.ts). */
  readonly balance: readonly number[];
  /** Grid cells per phase for locating turning points (1 for one stage: none exist). */
  readonly cells: number;
  /** Per-duty work, reused by several calls on the same ladder (bounded size). */
  readonly plans: Map<number, DutyPlan>;
  /** Lazily filled: time constants, slowest first. */
  timeConstants?: number[];
}

/** Largest number of cached duty plans per ladder before the cache is cleared. */
export const PLAN_CACHE_SIZE = 64;

/** One phase (pin high or low) of a period at a given duty. */
export interface PhasePlan {
  A: Matrix;
  /** Phase length, s (0 at duty 0 or 1). */
  t: number;
  /** Grid cells and their length t / cells. */
  cells: number;
  h: number;
  /** Flow over one cell (marching) and over the whole phase. */
  step: Flow;
  full: Flow;
  /**
   * Flows over h 2^-K, h 2^-(K-1), ..., h/2: the first cell is marched on the geometric grid
   * 0, h 2^-K, h 2^-(K-1), ..., h so that turning points caused by time constants far shorter than
   * a cell are bracketed too. Empty when h is short against every time constant.
   */
  fine: Flow[];
}

/** Periodic steady state at one duty, without extrema; quantities in deviation form. */
export interface DutyPlan {
  duty: number;
  high: PhasePlan;
  low: PhasePlan;
  /** S = I - E_l E_h = K_l + E_l K_h: the one-period map of deviations is I - S. */
  S: Matrix;
  /** u = x_s - x_l, x_s the state at the rising edge. */
  u: Vector;
  /** Delta - u = x_h - x_s, what drives the high phase. */
  vHigh: Vector;
  /** x_s = x_l + u = x_h - vHigh (whichever adds the smaller correction). */
  xStart: Vector;
  /** Output at the rising edge, V. */
  yStart: number;
  /** average - yStart, V (a small quantity, kept separately for relative accuracy). */
  meanOffset: number;
  /** Time-average output, V. */
  average: number;
  /** Steady-state extrema, filled on first use. */
  extrema?: PeriodExtrema;
}

/** Extremes of the output over one period, as deviations from the output at the period start. */
export interface PeriodExtrema {
  /** Smallest and largest c^T (x(t) - x(0)), V, and where (s from the rising edge). */
  minW: number;
  maxW: number;
  tMin: number;
  tMax: number;
}
