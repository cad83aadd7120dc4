import type { Ladder, Stage } from '../circuit/ladder.js';
import type { Network, NetworkStage, PwmPin, SallenKeyStage, SecondPwm } from '../circuit/network.js';
import { networkOfLadder } from '../circuit/networkOfLadder.js';
import type { ToleranceSettings } from '../project/types.js';

/** Which part of the circuit a parameter sets (stage: 0-based, in file order). */
export type ParameterTarget =
  | { kind: 'resistor'; stage: number }
  | { kind: 'capacitor'; stage: number }
  | { kind: 'sallenKey'; stage: number; part: 'r1' | 'r2' | 'c1' | 'c2' }
  | { kind: 'secondResistor' }
  | { kind: 'secondCapacitor' }
  | { kind: 'driverHigh' }
  | { kind: 'driverLow' }
  | { kind: 'secondDriverHigh' }
  | { kind: 'secondDriverLow' }
  | { kind: 'supply' }
  | { kind: 'load' };

/** One uncertain part value and its range, SI units. */
export interface ToleranceParameter {
  /**
   * Stable identifier: `r1`, `c2` (RC stage 1, 2), `s2.r1`, `s2.c2` (Sallen-Key stage 2),
   * `second.r`, `second.c` (the second output's path), `driver.high`, `driver.low`,
   * `second.driver.high`, `second.driver.low`, `supply`, `load`.
   */
  key: string;
  /** For people: `R1`, `C2`, `stage 2 R1`, `second output R`, `driver high`, `supply (high level)`, `load R`. */
  label: string;
  unit: 'ohm' | 'F' | 'V';
  target: ParameterTarget;
  nominal: number;
  min: number;
  max: number;
}

/**
 * The uncertain parameters of a circuit (a `Ladder`, or the general `Network` of a version 1.1
 * file) under a project's tolerance settings, in a fixed order: each stage pin side first (an RC
 * stage's R and C; a Sallen-Key stage's r1, r2, c1, c2), the second output's R and C, driver high
 * and low, the second output's driver high and low, supply, load resistance. Parameters with no
 * spread are left out.
 *
 * Method: a relative tolerance t gives [nominal (1 - t), nominal (1 + t)]: resistors (the
 * Sallen-Key r1, r2 and the second output's r included) take tolerance.resistor, capacitors
 * tolerance.capacitor; per-stage overrides (`tolerance.stages[k]`) replace them for stage k + 1
 * (both resistors or both capacitors of a Sallen-Key stage). Driver resistances are absolute
 * ranges (tolerance.driver). The second output's drivers take the same ranges, drawn independently
 * of the first output's (two pins of one port differ; the independent draw is the honest worst
 * case for a fine or complement pair), when its nominal drivers are those of pwm (the default:
 * both pins of one timer port); set apart (second_pwm.driver) they stay nominal
 * (toleranceWarnings.ts says so). The supply parameter is the first output's high level; the
 * second output's high level follows it by the same factor (one supply rail).
 *
 * Syntax: toleranceParameters(settings, circuit)
 * Example: toleranceParameters({ resistor: 0.01, capacitor: 0.1, ... }, ladder)[0]
 *          // { key: 'r1', label: 'R1', nominal: 1000, min: 990, max: 1010, ... }
 */
export function toleranceParameters(settings: ToleranceSettings, circuit: Ladder | Network): ToleranceParameter[] {
  const network = 'pin' in circuit ? circuit : networkOfLadder(circuit);
  const out: ToleranceParameter[] = [];
  const relative = (key: string, label: string, unit: ToleranceParameter['unit'], target: ParameterTarget, nominal: number, tol: number) => {
    if (!(tol > 0)) return;
    if (!(tol < 1)) throw new RangeError(`${key}: a tolerance of ${tol * 100} % leaves no positive value`);
    out.push({ key, label, unit, target, nominal, min: nominal * (1 - tol), max: nominal * (1 + tol) });
  };
  network.stages.forEach((s, k) => {
    const override = settings.stages?.[k];
    const rTol = override?.resistor ?? settings.resistor;
    const cTol = override?.capacitor ?? settings.capacitor;
    if (s.kind === 'rc') {
      relative(`r${k + 1}`, `R${k + 1}`, 'ohm', { kind: 'resistor', stage: k }, s.r, rTol);
      relative(`c${k + 1}`, `C${k + 1}`, 'F', { kind: 'capacitor', stage: k }, s.c, cTol);
      return;
    }
    for (const part of ['r1', 'r2', 'c1', 'c2'] as const) {
      const resistor = part[0] === 'r';
      relative(`s${k + 1}.${part}`, `stage ${k + 1} ${part.toUpperCase()}`, resistor ? 'ohm' : 'F', { kind: 'sallenKey', stage: k, part }, s[part], resistor ? rTol : cTol);
    }
  });
  const second = network.second;
  if (second) {
    relative('second.r', 'second output R', 'ohm', { kind: 'secondResistor' }, second.r, settings.resistor);
    if (second.c !== null) relative('second.c', 'second output C', 'F', { kind: 'secondCapacitor' }, second.c, settings.capacitor);
  }
  const driver = settings.driver;
  if (driver) {
    const range = (key: string, label: string, target: ParameterTarget, nominal: number, r: { min: number; max: number }) => {
      if (!(r.min >= 0) || !(r.max >= r.min)) throw new RangeError(`${key}: the range needs 0 <= min <= max`);
      if (r.max > r.min) out.push({ key, label, unit: 'ohm', target, nominal, min: r.min, max: r.max });
    };
    range('driver.high', 'driver high', { kind: 'driverHigh' }, network.pin.driverHigh, driver.high);
    range('driver.low', 'driver low', { kind: 'driverLow' }, network.pin.driverLow, driver.low);
    if (second && secondSharesDrivers(network)) {
      range('second.driver.high', 'second output driver high', { kind: 'secondDriverHigh' }, second.pin.driverHigh, driver.high);
      range('second.driver.low', 'second output driver low', { kind: 'secondDriverLow' }, second.pin.driverLow, driver.low);
    }
  }
  if (settings.supply !== undefined) {
    relative('supply', 'supply (high level)', 'V', { kind: 'supply' }, network.pin.high, settings.supply);
  }
  if (settings.load !== undefined && network.loadResistance !== null) {
    relative('load', 'load R', 'ohm', { kind: 'load' }, network.loadResistance, settings.load);
  }
  return out;
}

/**
 * Whether the second output's nominal drivers are the first output's (second_pwm.driver left to
 * its default), so that tolerance.driver describes its pin too.
 *
 * Syntax: secondSharesDrivers(network)
 * Example: secondSharesDrivers(networkFromProject(p))  // true unless second_pwm.driver is set apart
 */
export function secondSharesDrivers(network: Network): boolean {
  const s = network.second;
  return s !== null && s.pin.driverHigh === network.pin.driverHigh && s.pin.driverLow === network.pin.driverLow;
}

/** The value of a parameter at deviate z in [-1, 1]: centre + z * half-width. */
function valueAt(q: ToleranceParameter, z: number): number {
  return 0.5 * (q.min + q.max) + z * 0.5 * (q.max - q.min);
}

/**
 * The ladder with each parameter set to a value given as a deviate z in [-1, 1] across its range:
 * value = centre + z * half-width (z = 0 is the centre of the range, the nominal value for a
 * relative tolerance).
 *
 * Syntax: ladderAt(ladder, parameters, z[, offset])
 * Example: ladderAt(ladder, params, [-1, 1])  // R1 at its minimum, C1 at its maximum
 */
export function ladderAt(ladder: Ladder, parameters: ToleranceParameter[], z: ArrayLike<number>, offset = 0): Ladder {
  // A fresh ladder, written field by field before anyone sees it (Ladder is readonly to its users).
  const stages: Writable<Stage>[] = ladder.stages.map((s) => ({ ...s }));
  const next: Writable<Ladder> = { ...ladder, stages };
  for (let p = 0; p < parameters.length; p++) {
    const { target } = parameters[p];
    const value = valueAt(parameters[p], z[offset + p]);
    switch (target.kind) {
      case 'resistor':
        stages[target.stage].r = value;
        break;
      case 'capacitor':
        stages[target.stage].c = value;
        break;
      case 'driverHigh':
        next.driverHigh = value;
        break;
      case 'driverLow':
        next.driverLow = value;
        break;
      case 'supply':
        next.high = value;
        break;
      case 'load':
        next.loadResistance = value;
        break;
      default:
        throw new RangeError(`ladderAt: a ladder has no part '${parameters[p].key}' (a network parameter: use networkAt)`);
    }
  }
  return next;
}

/**
 * The network with each parameter set to a value given as a deviate z in [-1, 1] across its
 * range, as ladderAt does for a ladder; the supply moves both outputs' high levels by the same
 * factor (one rail).
 *
 * Syntax: networkAt(network, parameters, z[, offset])
 * Example: networkAt(n, params, [-1, 1, 0, 0])  // first part at its minimum, second at its maximum
 */
export function networkAt(network: Network, parameters: ToleranceParameter[], z: ArrayLike<number>, offset = 0): Network {
  const stages: Array<Writable<NetworkStage>> = network.stages.map((s) => ({ ...s }));
  const pin: Writable<PwmPin> = { ...network.pin };
  const second: Writable<SecondPwm> | null = network.second ? { ...network.second } : null;
  const pin2: Writable<PwmPin> | null = second ? { ...second.pin } : null;
  const next: Writable<Network> = { ...network, stages, pin, second };
  if (second) second.pin = pin2!;
  for (let p = 0; p < parameters.length; p++) {
    const { target } = parameters[p];
    const value = valueAt(parameters[p], z[offset + p]);
    switch (target.kind) {
      case 'resistor':
        (stages[target.stage] as Writable<{ r: number }>).r = value;
        break;
      case 'capacitor':
        (stages[target.stage] as Writable<{ c: number }>).c = value;
        break;
      case 'sallenKey':
        (stages[target.stage] as Writable<SallenKeyStage>)[target.part] = value;
        break;
      case 'secondResistor':
        second!.r = value;
        break;
      case 'secondCapacitor':
        second!.c = value;
        break;
      case 'driverHigh':
        pin.driverHigh = value;
        break;
      case 'driverLow':
        pin.driverLow = value;
        break;
      case 'secondDriverHigh':
        pin2!.driverHigh = value;
        break;
      case 'secondDriverLow':
        pin2!.driverLow = value;
        break;
      case 'supply':
        pin.high = value;
        if (pin2) pin2.high = (network.second!.pin.high * value) / network.pin.high;
        break;
      case 'load':
        next.loadResistance = value;
        break;
    }
  }
  return next;
}

type Writable<T> = { -readonly [K in keyof T]: T[K] };
