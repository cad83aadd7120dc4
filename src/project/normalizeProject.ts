import type { Stage } from '../circuit/ladder.js';
import type { NetworkStage, PwmPin, SecondPwm } from '../circuit/network.js';
import { formatEng, parseQuantity, QuantityError, type Dimension, type ParseQuantityOptions } from '../units/index.js';
import { agreesAsWritten } from './agreesAsWritten.js';
import { derivePwmFrequency } from './derivePwmFrequency.js';
import { parseSpecLevel, type SpecLevel } from './parseSpecLevel.js';
import type { IssueDraft } from './projectError.js';
import type {
  Alignment,
  LoadSettings,
  Project,
  ProjectNetwork,
  PwmSettings,
  SearchSettings,
  SeriesName,
  SettlingSpec,
  Spec,
  ToleranceSettings,
} from './types.js';

type Path = ReadonlyArray<string | number>;
type Range = { min: number; max: number };

/** Full-scale limit when a spec bounds neither droop nor INL: 2 % gain error (model.md 1.1). */
export const DEFAULT_GAIN_LIMIT = 0.02;
/** Headroom of a recommended design below each limit when search.margin is not given (model.md 1.1). */
export const DEFAULT_SEARCH_MARGIN = 0.1;

const percent = (fraction: number): string => `${Number((fraction * 100).toPrecision(6))} %`;

/** Reads values out of schema-checked raw data, collecting every problem instead of stopping. */
class Reader {
  readonly issues: IssueDraft[] = [];
  constructor(private readonly root: Record<string, unknown>) {}

  raw(path: Path): unknown {
    let node: unknown = this.root;
    for (const segment of path) {
      if (node === null || typeof node !== 'object') return undefined;
      node = (node as Record<string | number, unknown>)[segment];
    }
    return node;
  }

  has(path: Path): boolean {
    return this.raw(path) !== undefined && this.raw(path) !== null;
  }

  fail(path: Path, message: string, at: 'key' | 'value' = 'value'): void {
    this.issues.push({ path, message, at });
  }

  /** The quantity at `path` in SI, undefined when absent or wrong (then an issue is recorded). */
  quantity(path: Path, dimension: Dimension, opts?: ParseQuantityOptions): number | undefined {
    const value = this.raw(path);
    if (value === undefined || value === null) return undefined;
    try {
      return parseQuantity(value as string | number, dimension, opts);
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      this.fail(path, error.message);
      return undefined;
    }
  }

  level(path: Path, scale: { fullScale: number; lsb?: number }): SpecLevel | undefined {
    const value = this.raw(path);
    if (value === undefined || value === null) return undefined;
    try {
      return parseSpecLevel(value as string | number, scale);
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      this.fail(path, error.message);
      return undefined;
    }
  }

  /** {min, max} with min <= max (or < when `strict`). */
  range(path: Path, dimension: Dimension, unit: string, opts: ParseQuantityOptions, strict: boolean): Range | undefined {
    const min = this.quantity([...path, 'min'], dimension, opts);
    const max = this.quantity([...path, 'max'], dimension, opts);
    if (min === undefined || max === undefined) return undefined;
    if (strict ? !(min < max) : !(min <= max)) {
      this.fail([...path, 'min'], `min (${formatEng(min, unit)}) must be ${strict ? 'below' : 'at most'} max (${formatEng(max, unit)})`);
      return undefined;
    }
    return { min, max };
  }

  /** A relative tolerance: a fraction below 1 (100 %). */
  tolerance(path: Path): number | undefined {
    const value = this.quantity(path, 'fraction');
    if (value !== undefined && value >= 1) {
      this.fail(path, `a tolerance must be below 100 %, got '${String(this.raw(path))}'`);
      return undefined;
    }
    return value;
  }
}

/**
 * Turn schema-checked project data into the `Project` the engine uses: every quantity in SI
 * base units, defaults filled in (model.md, project file version 1), the PWM frequency derived
 * from the timer when a clock is given, spec levels in volts, and the cross-key rules checked
 * (high above low, duty min below max, clock and frequency agreeing, LSB limits needing bits).
 *
 * Syntax: normalizeProject(data, file)
 * Example: normalizeProject({ pwm: { frequency: '20 kHz', high: '3.3 V' }, filter: { stages: [{ r: '4k7', c: '100n' }] } }, 'p.yaml')
 *          // { project: { pwm: { frequency: 20000, high: 3.3, low: 0, ... }, ... }, issues: [] }
 */
export function normalizeProject(data: Record<string, unknown>, file: string): { project?: Project; issues: IssueDraft[] } {
  const read = new Reader(data);
  const pwm = readPwm(read);
  const load = readLoad(read);
  const filter = readStages(read);
  const second = readSecondPwm(read, pwm);
  // A fine channel of b bits splits each step of pwm.bits into 2^b: one LSB is full scale over the
  // combined code range (model.md 1.1), and spec levels in LSB are read against it.
  const fineBits = second?.role === 'fine' && second.bits !== null ? second.bits : 0;
  const lsb = pwm && pwm.bits !== undefined ? (pwm.high - pwm.low) / 2 ** (pwm.bits + fineBits) : undefined;
  const { spec, specInLsb } = readSpec(read, pwm, lsb);
  const search = read.has(['search']) ? readSearch(read, pwm) : undefined;
  const tolerance = read.has(['tolerance']) ? readTolerance(read, pwm) : undefined;

  const stageCount = filter?.all.length ?? 0;
  const overrides = tolerance?.stages?.length ?? 0;
  if (stageCount > 0 && overrides > stageCount) {
    read.fail(
      ['tolerance', 'stages', stageCount],
      `the filter has ${stageCount} stage${stageCount > 1 ? 's' : ''}, so this override has no stage to apply to; remove it or add the stage`,
      'key',
    );
  }
  if (search && filter && second !== undefined) checkNetworkSearch(read, filter.all, second);
  if (read.issues.length > 0 || !pwm || !filter || second === undefined) return { issues: read.issues };
  const network: ProjectNetwork | undefined =
    second !== null || filter.all.some((s) => s.kind !== 'rc') ? { stages: filter.all, second } : undefined;
  const project: Project = {
    file,
    pwm,
    load,
    filter: { stages: filter.rc },
    ...(network && { network }),
    spec,
    // A version 1.1 circuit keeps its stages: the search chooses their parts (checkNetworkSearch).
    ...(search && { search: network ? { ...search, stages: [filter.all.length] } : search }),
    ...(tolerance && { tolerance }),
    ...(lsb !== undefined && { lsb }),
    ...(Object.keys(specInLsb).length > 0 && { specInLsb }),
  };
  return { project, issues: [] };
}

function readPwm(read: Reader): PwmSettings | undefined {
  const high = read.quantity(['pwm', 'high'], 'voltage');
  const low = read.quantity(['pwm', 'low'], 'voltage') ?? (read.has(['pwm', 'low']) ? undefined : 0);
  if (high !== undefined && low !== undefined && !(high > low)) {
    read.fail(['pwm', 'high'], `the high level (${formatEng(high, 'V')}) must be above the low level (${formatEng(low, 'V')})`);
  }

  const driver = readDriver(read, ['pwm', 'driver'], { high: 0, low: 0 });

  const dutyMin = read.has(['pwm', 'duty', 'min']) ? read.quantity(['pwm', 'duty', 'min'], 'fraction') : 0;
  const dutyMax = read.has(['pwm', 'duty', 'max']) ? read.quantity(['pwm', 'duty', 'max'], 'fraction') : 1;
  if (dutyMin !== undefined && dutyMax !== undefined && !(dutyMin < dutyMax)) {
    read.fail(['pwm', 'duty', 'min'], `min (${percent(dutyMin)}) must be below max (${percent(dutyMax)})`);
  }

  const bits = read.raw(['pwm', 'bits']) as number | undefined;
  const prescaler = (read.raw(['pwm', 'prescaler']) as number | undefined) ?? 1;
  const alignment = (read.raw(['pwm', 'alignment']) as Alignment | undefined) ?? 'edge';
  const clock = read.quantity(['pwm', 'clock'], 'frequency', { sign: 'positive' });
  const given = read.quantity(['pwm', 'frequency'], 'frequency', { sign: 'positive' });

  let frequency = given;
  if (clock !== undefined && bits !== undefined) {
    const derived = derivePwmFrequency({ clock, bits, prescaler, alignment });
    const written = read.raw(['pwm', 'frequency']) as string | number | undefined;
    if (given !== undefined && written !== undefined && !agreesAsWritten(written, given, derived)) {
      read.fail(
        ['pwm', 'frequency'],
        `${formatEng(given, 'Hz', 6)} does not match the timer: clock / (${alignment === 'center' ? '2 * ' : ''}prescaler * 2^bits) = ` +
          `${formatEng(clock, 'Hz', 6)} / (${alignment === 'center' ? '2 * ' : ''}${prescaler} * 2^${bits}) = ${formatEng(derived, 'Hz', 6)}; ` +
          'correct one of them, or give only one',
      );
    }
    frequency = derived;
  } else if (given === undefined && !read.has(['pwm', 'frequency'])) {
    const message = read.has(['pwm', 'clock'])
      ? 'missing; with pwm.clock, give pwm.bits (and pwm.prescaler) so that the frequency follows, or give pwm.frequency'
      : "missing; give pwm.frequency (e.g. '19.5 kHz'), or pwm.clock and pwm.bits (and pwm.prescaler)";
    read.fail(['pwm', 'frequency'], message, 'key');
  }

  if (high === undefined || low === undefined || !(high > low) || !driver || frequency === undefined) return undefined;
  if (dutyMin === undefined || dutyMax === undefined || !(dutyMin < dutyMax)) return undefined;
  return {
    frequency,
    ...(clock !== undefined && { clock }),
    ...(bits !== undefined && { bits }),
    prescaler,
    alignment,
    high,
    low,
    driver,
    duty: { min: dutyMin, max: dutyMax },
  };
}

/** A driver resistance: one value for both phases or {high, low}; `fallback` when absent, undefined when wrong. */
function readDriver(read: Reader, path: Path, fallback: { high: number; low: number }): { high: number; low: number } | undefined {
  const raw = read.raw(path);
  if (raw !== null && typeof raw === 'object') {
    const high = read.quantity([...path, 'high'], 'resistance', { sign: 'nonNegative' });
    const low = read.quantity([...path, 'low'], 'resistance', { sign: 'nonNegative' });
    return high !== undefined && low !== undefined ? { high, low } : undefined;
  }
  if (raw === undefined || raw === null) return { ...fallback };
  const both = read.quantity(path, 'resistance', { sign: 'nonNegative' });
  return both !== undefined ? { high: both, low: both } : undefined;
}

function readLoad(read: Reader): LoadSettings {
  const resistance = read.quantity(['load', 'resistance'], 'resistance', { sign: 'positive' });
  const capacitance = read.quantity(['load', 'capacitance'], 'capacitance', { sign: 'nonNegative' }) ?? 0;
  return { ...(resistance !== undefined && { resistance }), capacitance };
}

const RC_KEYS = ['r', 'c'] as const;
const SALLEN_KEY_KEYS = ['r1', 'r2', 'c1', 'c2'] as const;
const PART_OF: Record<string, string> = {
  r: 'series resistor of the RC stage',
  c: 'capacitor from the node of the RC stage to ground',
  r1: 'resistor from the previous node to the middle node',
  r2: 'resistor from the middle node to the op-amp input',
  c1: 'capacitor from the middle node to the op-amp output',
  c2: 'capacitor from the op-amp input to ground',
};

/**
 * filter.stages: `all` in file order (RC and active stages), `rc` the RC stages alone (what
 * `Project.filter.stages` keeps, so that ladder code sees no active stage as an RC stage).
 */
function readStages(read: Reader): { all: NetworkStage[]; rc: Stage[] } | undefined {
  const list = read.raw(['filter', 'stages']);
  if (!Array.isArray(list)) {
    if (!read.has(['search'])) {
      read.fail(['filter'], 'missing; give filter.stages (1 to 4 RC stages), or a search section to design a filter', 'key');
      return undefined;
    }
    return { all: [], rc: [] }; // design only: the search proposes the stages
  }
  const all: NetworkStage[] = [];
  let complete = true;
  list.forEach((_, i) => {
    const at = (key: string): Path => ['filter', 'stages', i, key];
    const part = (key: string, dimension: Dimension): number | undefined => {
      if (!read.has(at(key))) {
        read.fail(at(key), `missing; ${PART_OF[key]}, e.g. '${dimension === 'resistance' ? '10k' : '100n'}'`, 'key');
        return undefined;
      }
      return read.quantity(at(key), dimension, { sign: 'positive' });
    };
    const dimensionOf = (key: string): Dimension => (key.startsWith('r') ? 'resistance' : 'capacitance');
    if (read.has(at('active'))) {
      for (const key of RC_KEYS) {
        if (read.has(at(key))) read.fail(at(key), `'${key}' belongs to an RC stage; an active (sallen-key) stage takes r1, r2, c1 and c2`, 'key');
      }
      if (read.has(at('buffered'))) {
        read.fail(
          at('buffered'),
          "not allowed on an active stage: its output is already an op-amp output, which nothing after it loads; remove 'buffered'",
          'key',
        );
      }
      const [r1, r2, c1, c2] = SALLEN_KEY_KEYS.map((key) => part(key, dimensionOf(key)));
      if (r1 === undefined || r2 === undefined || c1 === undefined || c2 === undefined) complete = false;
      else all.push({ kind: 'sallen-key', r1, r2, c1, c2 });
      return;
    }
    for (const key of SALLEN_KEY_KEYS) {
      if (read.has(at(key))) {
        read.fail(at(key), `'${key}' belongs to an active stage; add 'active: sallen-key', or give r and c for an RC stage`, 'key');
        complete = false;
      }
    }
    const [r, c] = RC_KEYS.map((key) => part(key, dimensionOf(key)));
    const buffered = (read.raw(at('buffered')) as boolean | undefined) ?? false;
    if (r === undefined || c === undefined) complete = false;
    else all.push({ kind: 'rc', r, c, buffered });
  });
  if (!complete) return undefined;
  const rc = all.flatMap((s): Stage[] => (s.kind === 'rc' ? [{ r: s.r, c: s.c, buffered: s.buffered }] : []));
  return { all, rc };
}

/**
 * second_pwm (model.md 1.1): null when absent, undefined when wrong (issues recorded). Levels and
 * driver default to those of pwm; `stage` becomes 0-based into the file's stages and must name an
 * RC stage (the injection enters a node with a capacitor to ground).
 */
function readSecondPwm(read: Reader, pwm: PwmSettings | undefined): SecondPwm | null | undefined {
  if (!read.has(['second_pwm'])) return null;
  const role = read.raw(['second_pwm', 'role']) as SecondPwm['role'];
  const bitsPath: Path = ['second_pwm', 'bits'];
  const bits = read.has(bitsPath) ? (read.raw(bitsPath) as number) : null;
  let valid = true;
  const fail = (path: Path, message: string, at: 'key' | 'value' = 'value'): void => {
    read.fail(path, message, at);
    valid = false;
  };
  if (role === 'complement' && bits !== null) {
    fail(bitsPath, "only role fine has bits of its own: a complement output is the inverted copy of pwm; remove bits, or write 'role: fine'", 'key');
  } else if (role === 'fine' && bits === null) {
    fail(bitsPath, 'missing; role fine needs the resolution of the fine channel (code = coarse * 2^bits + fine), e.g. 8', 'key');
  } else if (role === 'fine' && !read.has(['pwm', 'bits'])) {
    fail(bitsPath, 'needs pwm.bits: the code is coarse * 2^bits + fine, so the coarse resolution must be known; give pwm.bits', 'key');
  }

  const stagePath: Path = ['second_pwm', 'into', 'stage'];
  const stage = read.raw(stagePath) as number;
  const list = read.raw(['filter', 'stages']);
  const stages = Array.isArray(list) ? (list as unknown[]) : [];
  const rcNumbers = stages.flatMap((s, i) => (s !== null && typeof s === 'object' && 'active' in s ? [] : [i + 1]));
  const choice = rcNumbers.length > 0 ? `name an RC stage (${rcNumbers.join(', ')})` : 'the filter has no RC stage to inject into';
  if (stages.length === 0) {
    fail(stagePath, 'needs filter.stages: the second output enters the node of an RC stage of the filter');
  } else if (stage > stages.length) {
    fail(stagePath, `the filter has ${stages.length} stage${stages.length > 1 ? 's' : ''}, so there is no stage ${stage}; ${choice}`);
  } else if (!rcNumbers.includes(stage)) {
    fail(stagePath, `stage ${stage} is an active (sallen-key) stage; the second output enters the node of an RC stage; ${choice}`);
  }

  const r = read.quantity(['second_pwm', 'into', 'r'], 'resistance', { sign: 'positive' });
  const c = read.quantity(['second_pwm', 'into', 'c'], 'capacitance', { sign: 'positive' });
  const high = read.has(['second_pwm', 'high']) ? read.quantity(['second_pwm', 'high'], 'voltage') : pwm?.high;
  const low = read.has(['second_pwm', 'low']) ? read.quantity(['second_pwm', 'low'], 'voltage') : pwm?.low;
  if (high !== undefined && low !== undefined && !(high > low)) {
    const side = read.has(['second_pwm', 'high']) ? 'high' : 'low';
    fail(['second_pwm', side], `the high level (${formatEng(high, 'V')}) must be above the low level (${formatEng(low, 'V')})`);
  }
  const driver = readDriver(read, ['second_pwm', 'driver'], pwm?.driver ?? { high: 0, low: 0 });

  const partsRead = r !== undefined && (c !== undefined || !read.has(['second_pwm', 'into', 'c']));
  if (!valid || !pwm || !partsRead || high === undefined || low === undefined || !driver) return undefined;
  const pin: PwmPin = { high, low, driverHigh: driver.high, driverLow: driver.low };
  return { role, bits: role === 'fine' ? bits : null, coarseBits: role === 'fine' ? (pwm.bits ?? null) : null, pin, stage: stage - 1, r: r as number, c: c ?? null };
}

function readSpec(
  read: Reader,
  pwm: PwmSettings | undefined,
  lsb: number | undefined,
): { spec: Spec; specInLsb: NonNullable<Project['specInLsb']> } {
  const spec: Spec = {};
  const specInLsb: NonNullable<Project['specInLsb']> = {};
  if (!read.has(['spec'])) return { spec: { gain: DEFAULT_GAIN_LIMIT }, specInLsb };
  // Without a valid pwm section there is no full scale (its issues are reported already): read the
  // limits against a stand-in scale, to report their own mistakes, and discard the numbers.
  const scale = pwm ? { fullScale: pwm.high - pwm.low, lsb } : { fullScale: 1, lsb: 1 };
  for (const key of ['ripple', 'droop', 'inl'] as const) {
    const level = read.level(['spec', key], scale);
    if (level) {
      spec[key] = level.volts;
      if (level.lsb !== undefined) specInLsb[key] = level.lsb;
    }
  }
  const gainRaw = read.raw(['spec', 'gain']);
  if (typeof gainRaw === 'string' && gainRaw.trim().toLowerCase() === 'none') {
    // turned off on purpose
  } else if (gainRaw !== undefined && gainRaw !== null) {
    const gain = read.quantity(['spec', 'gain'], 'fraction');
    if (gain !== undefined && !(gain > 0)) read.fail(['spec', 'gain'], `a limit must be greater than 0, got '${String(gainRaw)}'; write 'none' to turn the gain check off`);
    else if (gain !== undefined) spec.gain = gain;
  } else if (spec.droop === undefined) {
    // Only droop bounds the full scale: INL, an endpoint-fit figure, is blind to a divided-down output.
    spec.gain = DEFAULT_GAIN_LIMIT;
  }
  if (read.has(['spec', 'settling'])) {
    const band = read.level(['spec', 'settling', 'band'], scale);
    const time = read.quantity(['spec', 'settling', 'time'], 'time', { sign: 'positive' });
    const from = read.quantity(['spec', 'settling', 'from'], 'fraction');
    const to = read.quantity(['spec', 'settling', 'to'], 'fraction');
    if (from !== undefined && to !== undefined && from === to) {
      read.fail(['spec', 'settling', 'to'], `from and to are the same duty (${percent(from)}); a step needs two different duties`);
    }
    if (band) {
      const settling: SettlingSpec = {
        band: band.volts,
        ...(time !== undefined && { time }),
        ...(from !== undefined && to !== undefined && { from, to }),
      };
      spec.settling = settling;
      if (band.lsb !== undefined) specInLsb.band = band.lsb;
    }
  }
  return { spec, specInLsb };
}

function readSearch(read: Reader, pwm: PwmSettings | undefined): SearchSettings | undefined {
  const stages = (read.raw(['search', 'stages']) as number[] | undefined) ?? [1, 2];
  const seriesRaw = read.raw(['search', 'series']) as SeriesName | { resistor: SeriesName; capacitor?: SeriesName } | undefined;
  const series: SearchSettings['series'] =
    seriesRaw === undefined || seriesRaw === null
      ? { resistor: 'E24', capacitor: 'E24' }
      : typeof seriesRaw === 'string'
        ? { resistor: seriesRaw, capacitor: seriesRaw }
        : { resistor: seriesRaw.resistor, capacitor: seriesRaw.capacitor ?? 'E12' };
  const margin = read.has(['search', 'margin']) ? read.quantity(['search', 'margin'], 'fraction') : DEFAULT_SEARCH_MARGIN;
  if (margin !== undefined && !(margin >= 0 && margin < 1)) {
    read.fail(['search', 'margin'], `a margin must lie from 0 % up to (not including) 100 %, got '${String(read.raw(['search', 'margin']))}'`);
  }
  const buffered = [...((read.raw(['search', 'buffered']) as boolean[] | undefined) ?? [false])];
  const resistance = read.range(['search', 'resistance'], 'resistance', 'ohm', { sign: 'positive' }, true);
  const capacitance = read.range(['search', 'capacitance'], 'capacitance', 'F', { sign: 'positive' }, true);
  const pinCurrent = read.quantity(['search', 'pin_current'], 'current', { sign: 'positive' });
  let bits: Range | undefined;
  if (read.has(['search', 'bits'])) {
    const min = read.raw(['search', 'bits', 'min']) as number;
    const max = read.raw(['search', 'bits', 'max']) as number;
    if (!(min <= max)) read.fail(['search', 'bits', 'min'], `min (${min}) must be at most max (${max})`);
    else bits = { min, max };
    if (!read.has(['pwm', 'clock'])) {
      read.fail(['search', 'bits'], 'needs pwm.clock: the frequency at each resolution follows from the timer clock', 'key');
    }
  }
  let q: Range | undefined;
  if (read.has(['search', 'q'])) {
    const min = read.raw(['search', 'q', 'min']) as number;
    const max = read.raw(['search', 'q', 'max']) as number;
    if (!(min <= max)) read.fail(['search', 'q', 'min'], `min (${min}) must be at most max (${max})`);
    else q = { min, max };
  }
  const secondR = read.has(['search', 'second_pwm', 'r']) ? read.range(['search', 'second_pwm', 'r'], 'resistance', 'ohm', { sign: 'positive' }, false) : undefined;
  const secondC = read.has(['search', 'second_pwm', 'c']) ? read.range(['search', 'second_pwm', 'c'], 'capacitance', 'F', { sign: 'positive' }, false) : undefined;
  if (!resistance || !capacitance || !pwm || margin === undefined || !(margin >= 0 && margin < 1)) return undefined;
  return {
    stages: [...stages],
    series,
    margin,
    buffered,
    resistance,
    capacitance,
    ...(pinCurrent !== undefined && { pinCurrent }),
    ...(bits && { bits }),
    ...(q && { q }),
    ...(read.has(['search', 'second_pwm']) && { secondPwm: { ...(secondR && { r: secondR }), ...(secondC && { c: secondC }) } }),
  };
}

/**
 * The search keys that depend on the circuit (model.md 1.1): a file with second_pwm or an active
 * stage keeps its own topology, so search.stages may only repeat its stage count and search.buffered
 * may not add a follower; search.q needs a Sallen-Key stage, search.second_pwm a second output, and
 * search.second_pwm.c a series capacitor (second_pwm.into.c) to choose.
 */
function checkNetworkSearch(read: Reader, stages: readonly NetworkStage[], second: SecondPwm | null): void {
  const network = second !== null || stages.some((s) => s.kind !== 'rc');
  const activeCount = stages.filter((s) => s.kind === 'sallen-key').length;
  if (network) {
    const given = read.raw(['search', 'stages']) as number[] | undefined;
    if (given !== undefined && !(given.length === 1 && given[0] === stages.length)) {
      read.fail(
        ['search', 'stages'],
        `a file with second_pwm or an active stage keeps its own ${stages.length} stage${stages.length > 1 ? 's' : ''} (filter.stages) and the search chooses their parts; give [${stages.length}] or leave search.stages out`,
      );
    }
    const buffered = read.raw(['search', 'buffered']) as boolean[] | undefined;
    if (buffered?.includes(true)) {
      read.fail(
        ['search', 'buffered'],
        "a file with second_pwm or an active stage keeps its own followers (filter.stages[k].buffered); leave search.buffered out",
      );
    }
  }
  if (read.has(['search', 'q']) && activeCount === 0) {
    read.fail(['search', 'q'], "applies to Sallen-Key stages (active: sallen-key), and filter.stages has none; remove search.q", 'key');
  }
  if (read.has(['search', 'second_pwm']) && second === null) {
    read.fail(['search', 'second_pwm'], 'chooses the parts of the second PWM output, and the file has no second_pwm; remove it', 'key');
  }
  if (read.has(['search', 'second_pwm', 'c']) && second !== null && second.c === null) {
    read.fail(['search', 'second_pwm', 'c'], 'second_pwm.into has no series capacitor c to choose; give into.c in the file, or remove this range', 'key');
  }
}

function readTolerance(read: Reader, pwm: PwmSettings | undefined): ToleranceSettings | undefined {
  const resistor = read.tolerance(['tolerance', 'resistor']);
  const capacitor = read.tolerance(['tolerance', 'capacitor']);

  let stages: ToleranceSettings['stages'];
  const stageList = read.raw(['tolerance', 'stages']);
  if (Array.isArray(stageList)) {
    stages = stageList.map((entry, i) => {
      if (entry === null || entry === undefined) return undefined;
      const r = read.tolerance(['tolerance', 'stages', i, 'resistor']);
      const c = read.tolerance(['tolerance', 'stages', i, 'capacitor']);
      return { ...(r !== undefined && { resistor: r }), ...(c !== undefined && { capacitor: c }) };
    });
  }

  let driver: ToleranceSettings['driver'];
  if (read.has(['tolerance', 'driver'])) {
    const nominal = pwm?.driver ?? { high: 0, low: 0 };
    const side = (name: 'high' | 'low'): Range | undefined =>
      read.has(['tolerance', 'driver', name])
        ? read.range(['tolerance', 'driver', name], 'resistance', 'ohm', { sign: 'nonNegative' }, false)
        : { min: nominal[name], max: nominal[name] };
    const high = side('high');
    const low = side('low');
    if (high && low) driver = { high, low };
  }

  const supply = read.tolerance(['tolerance', 'supply']);
  const load = read.tolerance(['tolerance', 'load']);
  const yieldRequired = read.quantity(['tolerance', 'yield'], 'fraction');
  const distribution = (read.raw(['tolerance', 'distribution']) as ToleranceSettings['distribution'] | undefined) ?? 'normal';
  const samples = (read.raw(['tolerance', 'samples']) as number | undefined) ?? 10000;
  const seed = (read.raw(['tolerance', 'seed']) as number | undefined) ?? 1;

  if (resistor === undefined || capacitor === undefined) return undefined;
  return {
    resistor,
    capacitor,
    ...(stages && { stages }),
    ...(driver && { driver }),
    ...(supply !== undefined && { supply }),
    ...(load !== undefined && { load }),
    distribution,
    samples,
    seed,
    ...(yieldRequired !== undefined && { yield: yieldRequired }),
  };
}
