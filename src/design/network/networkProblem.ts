import type { Network, NetworkStage, SecondPwm } from '../../circuit/network.js';
import { sallenKeyFigures } from '../../circuit/sallenKeyFigures.js';
import { networkFromProject } from '../../project/networkFromProject.js';
import type { Project, ProjectNetwork, SeriesName } from '../../project/types.js';
import { seriesValues } from '../../units/index.js';
import { designProblem, type DesignProblem } from '../designProblem.js';
import { DesignInputError } from '../designInputError.js';

/** Q window of Sallen-Key stages when search.q is absent: no ringing to speak of (common practice). */
export const DEFAULT_Q = { min: 0.5, max: 0.8 } as const;

/**
 * Default window of a fine output's weighting resistor around its ideal value (search.second_pwm.r
 * absent): a weight off by a fraction e puts the fine channel's full range e of a coarse step
 * off, an INL of about e (2^b - 1) / 2 LSB of the combined code (e.g. 0.2 * 255 / 2 = 25 LSB for
 * b = 8), so values further off are of no use.
 */
export const FINE_WINDOW = 1.25;

/** Largest design space the search walks (candidates); beyond it the key ranges must be narrowed. */
export const MAX_NETWORK_SPACE = 1e6;

/** The parts of the second output's path a design chooses. */
export interface SecondParts {
  readonly r: number;
  readonly c: number | null;
}

/**
 * A version 1.1 design problem (second PWM output, Sallen-Key stages): the file's circuit with
 * every part open to the search, and the limits, step and band of the passive search.
 */
export interface NetworkProblem {
  /** Limits, search limits (less search.margin), band, steps, duty range, series: as the passive search. */
  readonly base: DesignProblem;
  /** The file's circuit: stage kinds and order, followers, the second output's role and node. */
  readonly template: ProjectNetwork;
  /** Q window of Sallen-Key stages. */
  readonly q: { readonly min: number; readonly max: number };
  /** Resistor and capacitor values of the stages (search.series within search.resistance / .capacitance). */
  readonly rValues: readonly number[];
  readonly cValues: readonly number[];
  /** The circuit with the given parts. */
  networkOf(stages: readonly NetworkStage[], second: SecondParts | null): Network;
  /** Every candidate of the space, in a fixed order; `visit` returning false stops the walk. */
  enumerate(visit: (stages: readonly NetworkStage[], second: SecondParts | null) => boolean | void): void;
  /** Number of candidates in the space. */
  readonly space: number;
  /** The second output's resistor range as the report states it (null without a second output). */
  readonly secondRange: { r: string; c: { min: number; max: number } | null } | null;
}

/**
 * The design problem of a project whose circuit is a version 1.1 network (model.md 1.1). The
 * topology is the file's (stage kinds and count, followers, the second output's role, node and
 * whether it has a series capacitor); every part value is searched:
 * - RC stage: r from the resistor series within search.resistance, c from the capacitor series
 *   within search.capacitance;
 * - Sallen-Key stage: r1, r2 and c2 likewise, and c1 from the capacitor series restricted to the Q
 *   window (search.q, default 0.5 to 0.8): Q^2 = r1 r2 c1 / (c2 (r1 + r2)^2) grows with c1, so
 *   c1 in [q_min^2, q_max^2] c2 (r1 + r2)^2 / (r1 r2) (model.md's Q, solved for c1);
 * - second output, role fine: r within search.second_pwm.r, else every value within FINE_WINDOW of
 *   the ideal weight and the nearest value on either side of it (idealWeight below); role
 *   complement: r within search.second_pwm.r, else search.resistance; c (only with into.c) within
 *   search.second_pwm.c, else search.capacitance.
 * Limits, search limits, band and steps come from designProblem.ts, exactly as for RC ladders.
 *
 * Syntax: networkProblem(project)
 * Example: networkProblem(loadProject('sample-configs/design-sallen-key.yaml')).space   // candidates
 */
export function networkProblem(project: Project): NetworkProblem {
  const template = project.network;
  const search = project.search;
  if (!template) throw new RangeError('networkProblem: the project is a plain RC ladder (designSearch handles it)');
  if (!search) throw new DesignInputError(`missing; add a search section (series, resistance, capacitance) to design a filter`, 'search', project.file);
  if (search.bits) {
    throw new DesignInputError(
      'a search over the resolution is not supported yet for a file with second_pwm or an active stage; remove search.bits and set pwm.bits',
      'search.bits',
      project.file,
    );
  }
  // Limits, band and steps as for a ladder (the stage count and follower options play no part there).
  const base = designProblem({ ...project, search: { ...search, stages: [1], buffered: [false] } });
  const q = search.q ?? DEFAULT_Q;
  const rValues = base.rValues;
  const cValues = base.cValues;
  const shape = networkFromProject(project);
  const second = template.second;

  const rangeValues = (range: { min: number; max: number }, kind: 'resistor' | 'capacitor', key: string) => {
    const values = seriesValues(kind === 'resistor' ? search.series.resistor : search.series.capacitor, range.min, range.max);
    if (values.length === 0) throw new DesignInputError(`no ${kind === 'resistor' ? search.series.resistor : search.series.capacitor} value lies in the range`, key, project.file);
    return values;
  };
  const secondC =
    second?.c != null ? (search.secondPwm?.c ? rangeValues(search.secondPwm.c, 'capacitor', 'search.second_pwm.c') : cValues) : [null];
  const fixedSecondR = second
    ? search.secondPwm?.r
      ? rangeValues(search.secondPwm.r, 'resistor', 'search.second_pwm.r')
      : second.role === 'complement'
        ? rValues
        : null
    : null;
  const windows = new Map<number, number[]>();
  const secondR = (stages: readonly NetworkStage[]): readonly number[] => {
    if (fixedSecondR) return fixedSecondR;
    const ideal = idealWeight(shape, stages, second!);
    let w = windows.get(ideal);
    if (!w) {
      w = fineWindow(ideal, search.series.resistor);
      windows.set(ideal, w);
    }
    return w;
  };

  const c1Window = (r1: number, r2: number, c2: number): number[] => {
    const k = (c2 * (r1 + r2) ** 2) / (r1 * r2);
    const out: number[] = [];
    for (const c1 of cValues) {
      if (c1 < q.min ** 2 * k * (1 - 1e-9) || c1 > q.max ** 2 * k * (1 + 1e-9)) continue;
      // The exact Q decides at the window's edges (model.md's formula, sallenKeyFigures.ts).
      const { q: qq } = sallenKeyFigures({ r1, r2, c1, c2 });
      if (qq >= q.min * (1 - 1e-12) && qq <= q.max * (1 + 1e-12)) out.push(c1);
    }
    return out;
  };

  const stageChoices = (k: number): NetworkStage[] => {
    const s = template.stages[k];
    const out: NetworkStage[] = [];
    if (s.kind === 'rc') {
      for (const r of rValues) for (const c of cValues) out.push({ kind: 'rc', r, c, buffered: s.buffered });
    } else {
      for (const r1 of rValues) for (const r2 of rValues) for (const c2 of cValues) for (const c1 of c1Window(r1, r2, c2)) out.push({ kind: 'sallen-key', r1, r2, c1, c2 });
    }
    return out;
  };
  const choices = template.stages.map((_, k) => stageChoices(k));
  const empty = choices.findIndex((c) => c.length === 0);
  if (empty >= 0) {
    throw new DesignInputError(
      `no r1, r2, c1, c2 of the series and ranges give stage ${empty + 1} a Q from ${q.min} to ${q.max}; widen search.capacitance or search.q`,
      'search.q',
      project.file,
    );
  }

  const enumerate = (visit: (stages: readonly NetworkStage[], second: SecondParts | null) => boolean | void) => {
    const picked: NetworkStage[] = [];
    const walk = (k: number): boolean => {
      if (k === choices.length) {
        if (!second) return visit(picked.slice(), null) !== false;
        for (const r of secondR(picked)) for (const c of secondC) if (visit(picked.slice(), { r, c }) === false) return false;
        return true;
      }
      for (const s of choices[k]) {
        picked[k] = s;
        if (!walk(k + 1)) return false;
      }
      return true;
    };
    walk(0);
  };

  const space = countSpace(choices, second ? (stages) => secondR(stages).length * secondC.length : null, second ? pathStages(shape, second) : [], rValues, cValues.length);
  if (space > MAX_NETWORK_SPACE) {
    throw new DesignInputError(
      `the design space holds ${space.toExponential(2)} candidates, more than the ${MAX_NETWORK_SPACE.toExponential(0)} the search walks for a file with second_pwm or an active stage; narrow search.resistance or search.capacitance, or take a coarser search.series`,
      'search',
      project.file,
    );
  }

  return {
    base,
    template,
    q,
    rValues,
    cValues,
    // (fields written out, not spread: one network per candidate, and a spread cost about 2 us
    // a copy in the walk's still unoptimized code, measured for the ripple ceiling's plan)
    networkOf: (stages, parts) => ({
      period: shape.period,
      alignment: shape.alignment,
      pin: shape.pin,
      stages,
      second:
        second && parts
          ? { role: second.role, bits: second.bits, coarseBits: second.coarseBits, pin: second.pin, stage: second.stage, r: parts.r, c: parts.c }
          : null,
      loadResistance: shape.loadResistance,
      loadCapacitance: shape.loadCapacitance,
    }),
    enumerate,
    space,
    secondRange: second
      ? {
          r: search.secondPwm?.r
            ? 'search.second_pwm.r'
            : second.role === 'fine'
              ? `within a factor ${FINE_WINDOW} of the ideal weight, and the nearest value either side`
              : 'search.resistance',
          c: second.c != null ? (search.secondPwm?.c ?? search.capacitance) : null,
        }
      : null,
  };
}

/**
 * The stages (0-based) whose resistors carry the coarse output to the node a second output enters:
 * walking back from that node through unbuffered RC stages to the pin or to the nearest ideal
 * source (a follower or a Sallen-Key output).
 */
function pathStages(network: Network, second: SecondPwm): number[] {
  const out: number[] = [];
  for (let k = second.stage; k >= 0; k--) {
    const s = network.stages[k];
    if (s.kind !== 'rc' || (k < second.stage && s.buffered)) break;
    out.push(k);
  }
  return out;
}

/**
 * The weighting resistor that makes one full range of a fine output weigh exactly one coarse step:
 * r = 2^B (R_path + R_d) - R_d2, B = pwm.bits, R_path the series resistance from the nearest ideal
 * source to the node the fine output enters, R_d (only when that source is the pin) and R_d2 the
 * mean driver resistances. Why: at DC the capacitors carry no current and the filter draws none
 * from an ideal source, so by superposition (any circuits textbook) the node voltage is a
 * conductance-weighted mean of the two sources, and so is the output after it (the same node, seen
 * through the same stages): the fine source's weight over the coarse one's is (R_path + R_d) /
 * (r + R_d2). Exact for equal drivers; with unequal ones, at their mean.
 *
 * Syntax: idealWeight(network, stages, second)
 * Example: idealWeight(n, [{ kind: 'rc', r: 10e3, c: 1e-6, buffered: false }, ...], fine8)   // 2^8 (10 kohm + 32.5) - 32.5
 */
export function idealWeight(network: Network, stages: readonly NetworkStage[], second: SecondPwm): number {
  const path = pathStages({ ...network, stages }, second);
  let r = 0;
  for (const k of path) r += (stages[k] as { r: number }).r;
  const fromPin = path.length > 0 && path[path.length - 1] === 0;
  const rd = fromPin ? (network.pin.driverHigh + network.pin.driverLow) / 2 : 0;
  const rd2 = (second.pin.driverHigh + second.pin.driverLow) / 2;
  return 2 ** (second.coarseBits ?? 0) * (r + rd) - rd2;
}

/** Resistor values within FINE_WINDOW of the ideal, and the nearest value below and above it. */
function fineWindow(ideal: number, series: SeriesName): number[] {
  const around = seriesValues(series, ideal / 2.5, ideal * 2.5);
  const below = around.filter((v) => v <= ideal);
  const above = around.filter((v) => v >= ideal);
  const set = new Set(around.filter((v) => v >= ideal / FINE_WINDOW && v <= ideal * FINE_WINDOW));
  if (below.length > 0) set.add(below[below.length - 1]);
  if (above.length > 0) set.add(above[0]);
  return [...set].sort((a, b) => a - b);
}

/**
 * Number of candidates: the product of the stages' choices times the second output's. A fine
 * output's default window depends only on the resistors of its path (all RC stages), so those are
 * walked by resistor alone, each resistor tuple standing for |C|^(path length) stage choices.
 */
function countSpace(
  choices: ReadonlyArray<readonly NetworkStage[]>,
  secondCount: ((stages: readonly NetworkStage[]) => number) | null,
  path: readonly number[],
  rValues: readonly number[],
  cCount: number,
): number {
  if (!secondCount) return choices.reduce((p, c) => p * c.length, 1);
  let off = 1;
  choices.forEach((c, k) => {
    if (!path.includes(k)) off *= c.length;
  });
  const picked: NetworkStage[] = choices.map((c) => c[0]);
  let onPath = 0;
  const walk = (i: number) => {
    if (i === path.length) {
      onPath += secondCount(picked) * cCount ** path.length;
      return;
    }
    for (const r of rValues) {
      picked[path[i]] = { kind: 'rc', r, c: 1, buffered: false };
      walk(i + 1);
    }
  };
  walk(0);
  return off * onPath;
}
