/**
 * Invented example circuits of the general type (`Network`, src/circuit/network.ts) for the tests
 * of the periodic engine and its time-domain reference (odexNetwork.ts). Not taken from any product
 * or data sheet. Time constants are 1 to 50 PWM periods, so that the ODEX reference stays fast.
 * `stage` of a second output is 0-based here (the project file's `into.stage: 1` is index 0).
 */
import type { Network, NetworkStage, PwmPin, RcStage, SallenKeyStage, SecondPwm } from '../../../src/circuit/network.js';

/** A 3.3 V / 0 V pin with the given driver resistances. */
export const pin = (driverHigh = 25, driverLow = 25, high = 3.3, low = 0): PwmPin => ({ high, low, driverHigh, driverLow });
export const rc = (r: number, c: number, buffered = false): RcStage => ({ kind: 'rc', r, c, buffered });
export const sallenKey = (r1: number, r2: number, c1: number, c2: number): SallenKeyStage => ({ kind: 'sallen-key', r1, r2, c1, c2 });

/** A network at 20 kHz, edge-aligned, open output, one pin with 25 ohm drivers unless overridden. */
export function network(stages: NetworkStage[], extra: Partial<Network> = {}): Network {
  return {
    period: 50e-6,
    alignment: 'edge',
    pin: pin(),
    stages,
    second: null,
    loadResistance: null,
    loadCapacitance: 0,
    ...extra,
  };
}

/** A second output (levels and drivers as `pin()` unless given); a fine one after a coarse output of `coarseBits` (default: as many as the fine one). */
export function secondPwm(role: 'fine' | 'complement', stage: number, r: number, c: number | null, bits: number | null, p: PwmPin = pin(), coarseBits: number | null = bits): SecondPwm {
  return { role, bits, coarseBits: role === 'fine' ? coarseBits : null, pin: p, stage, r, c };
}

/** One RC stage, 10 kohm + 10 nF (tau = 100 us + driver = 2 periods). */
export const oneRc = network([rc(10e3, 10e-9)]);

/** One RC stage, center-aligned, otherwise oneRc. */
export const oneRcCenter = network([rc(10e3, 10e-9)], { alignment: 'center' });

/** Two RC stages, unequal drivers (40 ohm high, 25 ohm low), a 100 kohm / 220 pF load. */
export const twoRcLoaded = network([rc(4.7e3, 47e-9), rc(47e3, 4.7e-9)], { pin: pin(40, 25), loadResistance: 100e3, loadCapacitance: 220e-12 });

/** Two RC stages with a follower after the first; the load is at the second node. */
export const twoRcBufferedFirst = network([rc(4.7e3, 47e-9, true), rc(47e3, 4.7e-9)], { pin: pin(40, 25), loadResistance: 100e3 });

/**
 * Unbuffered RC stage followed by a unity-gain Sallen-Key with r1 = r2 = 10 kohm: Q = 0.5 sqrt(c1/c2)
 * (model.md's formula with r1 = r2), so c1 = 12.1 nF, c2 = 10 nF gives Q = 0.55; f0 = 1/(2 pi R sqrt(c1 c2)) = 1.45 kHz.
 * The load on the op-amp output changes nothing (ideal output).
 */
export const rcSallenKeyQ055 = network([rc(10e3, 10e-9), sallenKey(10e3, 10e3, 12.1e-9, 10e-9)], { loadResistance: 10e3, loadCapacitance: 1e-9 });

/** As rcSallenKeyQ055 with c1 = 160 nF: Q = 2, f0 = 398 Hz (rings for several periods). */
export const rcSallenKeyQ2 = network([rc(10e3, 10e-9), sallenKey(10e3, 10e3, 160e-9, 10e-9)]);

/** rcSallenKeyQ055 with a follower after the RC stage (the Sallen-Key input current no longer loads it). */
export const rcBufferedSallenKeyQ055 = network([rc(10e3, 10e-9, true), sallenKey(10e3, 10e3, 12.1e-9, 10e-9)]);

/** A Sallen-Key stage alone, Q = sqrt(2)/2 (c1 = 2 c2, r1 = r2 = 10 kohm), f0 = 1.13 kHz; ideal driver. */
export const sallenKeyButterworth = network([sallenKey(10e3, 10e3, 20e-9, 10e-9)], { pin: pin(0, 0) });

/** Complement output into the single RC node through 22 kohm only. */
export const complementR = network([rc(10e3, 10e-9)], { second: secondPwm('complement', 0, 22e3, null, null) });

/** Complement output into the single RC node through 22 kohm and 100 nF in series. */
export const complementRC = network([rc(10e3, 10e-9)], { second: secondPwm('complement', 0, 22e3, 100e-9, null) });

/** complementR, center-aligned, with a 2-stage ladder and a 47 kohm load. */
export const complementRCenter = network([rc(10e3, 10e-9), rc(22e3, 4.7e-9)], {
  alignment: 'center',
  second: secondPwm('complement', 0, 22e3, null, null),
  loadResistance: 47e3,
});

/**
 * Fine channel of 4 bits into the first node of a 2-stage ladder through 16 x 10 kohm (the weight
 * 2^-4 of the main path's 10 kohm + driver, roughly); the main channel is the coarse 4 bits.
 */
export const fine44 = network([rc(10e3, 22e-9), rc(22e3, 4.7e-9)], { second: secondPwm('fine', 0, 160e3, null, 4) });

/** fine44, center-aligned (each output's high phase centered in the period). */
export const fine44Center = network([rc(10e3, 22e-9), rc(22e3, 4.7e-9)], { alignment: 'center', second: secondPwm('fine', 0, 160e3, null, 4) });

/** fine44 with the fine output entering the second node (stage index 1) instead, with unequal drivers. */
export const fine44IntoSecond = network([rc(10e3, 22e-9), rc(22e3, 4.7e-9)], { pin: pin(40, 25), second: secondPwm('fine', 1, 352e3, null, 4, pin(40, 25)) });

/** All examples by name. */
export const exampleNetworks: Readonly<Record<string, Network>> = {
  oneRc,
  oneRcCenter,
  twoRcLoaded,
  twoRcBufferedFirst,
  rcSallenKeyQ055,
  rcSallenKeyQ2,
  rcBufferedSallenKeyQ055,
  sallenKeyButterworth,
  complementR,
  complementRC,
  complementRCenter,
  fine44,
  fine44Center,
  fine44IntoSecond,
};
