import type { Ladder, Stage } from '../circuit/ladder.js';
import type { ToleranceSettings } from '../project/types.js';

/** Which part of the circuit a parameter sets. */
export type ParameterTarget =
  | { kind: 'resistor'; stage: number }
  | { kind: 'capacitor'; stage: number }
  | { kind: 'driverHigh' }
  | { kind: 'driverLow' }
  | { kind: 'supply' }
  | { kind: 'load' };

/** One uncertain part value and its range, SI units. */
export interface ToleranceParameter {
  /** Stable identifier, e.g. `r1`, `c2`, `driver.high`, `supply`, `load`. */
  key: string;
  /** For people: `R1`, `C2`, `driver high`, `supply (high level)`, `load R`. */
  label: string;
  unit: 'ohm' | 'F' | 'V';
  target: ParameterTarget;
  nominal: number;
  min: number;
  max: number;
}

/**
 * The uncertain parameters of a ladder under a project's tolerance settings, in a fixed order:
 * R and C of each stage (pin side first), driver high, driver low, supply (the high level), load
 * resistance. Parameters with no spread are left out.
 *
 * Method: a relative tolerance t gives [nominal (1 - t), nominal (1 + t)]; the driver resistance
 * is given as absolute ranges; per-stage overrides (`tolerance.stages[k]`) replace the common
 * resistor/capacitor tolerance for stage k + 1.
 *
 * Syntax: toleranceParameters(settings, ladder)
 * Example: toleranceParameters({ resistor: 0.01, capacitor: 0.1, ... }, ladder)[0]
 *          // { key: 'r1', label: 'R1', nominal: 1000, min: 990, max: 1010, ... }
 */
export function toleranceParameters(settings: ToleranceSettings, ladder: Ladder): ToleranceParameter[] {
  const out: ToleranceParameter[] = [];
  const relative = (key: string, label: string, unit: ToleranceParameter['unit'], target: ParameterTarget, nominal: number, tol: number) => {
    if (!(tol > 0)) return;
    if (!(tol < 1)) throw new RangeError(`${key}: a tolerance of ${tol * 100} % leaves no positive value`);
    out.push({ key, label, unit, target, nominal, min: nominal * (1 - tol), max: nominal * (1 + tol) });
  };
  ladder.stages.forEach((s, k) => {
    const override = settings.stages?.[k];
    relative(`r${k + 1}`, `R${k + 1}`, 'ohm', { kind: 'resistor', stage: k }, s.r, override?.resistor ?? settings.resistor);
    relative(`c${k + 1}`, `C${k + 1}`, 'F', { kind: 'capacitor', stage: k }, s.c, override?.capacitor ?? settings.capacitor);
  });
  const driver = settings.driver;
  if (driver) {
    const range = (key: string, label: string, target: ParameterTarget, nominal: number, r: { min: number; max: number }) => {
      if (!(r.min >= 0) || !(r.max >= r.min)) throw new RangeError(`${key}: the range needs 0 <= min <= max`);
      if (r.max > r.min) out.push({ key, label, unit: 'ohm', target, nominal, min: r.min, max: r.max });
    };
    range('driver.high', 'driver high', { kind: 'driverHigh' }, ladder.driverHigh, driver.high);
    range('driver.low', 'driver low', { kind: 'driverLow' }, ladder.driverLow, driver.low);
  }
  if (settings.supply !== undefined) {
    relative('supply', 'supply (high level)', 'V', { kind: 'supply' }, ladder.high, settings.supply);
  }
  if (settings.load !== undefined && ladder.loadResistance !== null) {
    relative('load', 'load R', 'ohm', { kind: 'load' }, ladder.loadResistance, settings.load);
  }
  return out;
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
    const { target, min, max } = parameters[p];
    const value = 0.5 * (min + max) + z[offset + p] * 0.5 * (max - min);
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
    }
  }
  return next;
}

type Writable<T> = { -readonly [K in keyof T]: T[K] };
