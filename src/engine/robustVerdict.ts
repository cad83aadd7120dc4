import type { Ladder } from '../circuit/ladder.js';
import type { Project } from '../project/types.js';

/**
 * What a robust design check says about one circuit: the contract between the design search
 * (src/design/robustDesigns.ts, which walks the nominal ranking) and the tolerance studies
 * (src/tolerance/robustChecks.ts, which judge one design). Kept here, below both, so that neither
 * imports the other.
 */

/** Figures of one design at the worst case over the tolerance box, SI units. */
export interface WorstCaseFigures {
  /** s; null when some corner never settles. */
  settlingTime: number | null;
  /** V peak-to-peak. */
  worstRipple: number;
  /** Largest |DC error|, V. */
  droop: number;
  /** Largest |INL|, V (null when the spec does not limit INL). */
  inl: number | null;
  /** Pin peak current with R1 and the driver at their minimum and the supply at its worst, A. */
  pinCurrent: number;
  /**
   * A figure a single corner of the box already took over its limit: the full search was skipped
   * and the other figures are NaN (tolerance/cornerMiss.ts).
   */
  missedAtCorner?: 'ripple' | 'droop' | 'inl' | 'settling';
}

/** Monte Carlo outcome of one design. */
export interface YieldFigures {
  /** Share of samples meeting every limit, 0..1. */
  yield: number;
  samples: number;
  target: number;
  /**
   * Sequential runs: the confidence interval of the yield when sampling stopped (tolerance/
   * sequentialYield.ts); the verdict is then `lower >= target` or `upper < target`, or at the
   * sample cap the point estimate against the target.
   */
  interval?: [number, number];
  /** Pin peak current at its worst corner of the tolerance box, A (as in WorstCaseFigures). */
  pinCurrent: number;
}

/** What a robust check says about one design. */
export interface RobustVerdict {
  pass: boolean;
  worstCase?: WorstCaseFigures;
  yield?: YieldFigures;
}

/**
 * Checks one design; `project` is the project at the design's resolution, `ladder` the design's
 * circuit in it.
 */
export type RobustCheck = (project: Project, ladder: Ladder) => RobustVerdict;

/** The two robust checks, as the tolerance layer provides them (tolerance/robustChecks.ts). */
export interface RobustChecks {
  worstCase: RobustCheck;
  /** A yield check with the given Monte Carlo sample count per design. */
  yield: (samples: number) => RobustCheck;
  /**
   * Corners of the tolerance box, as circuits, whose exact figures the worst-case check takes
   * into its worst values, so that a corner beyond a limit fails the check; empty when the check
   * cannot promise that. Lets the design search screen designs out before the full check.
   */
  corners?: (project: Project, ladder: Ladder) => Ladder[];
}
