/**
 * The side-by-side table of the README ("What each circuit buys"): five circuits on one spec, each
 * scaled to the smallest capacitors that meet the ripple limit, with the settling time that buys.
 * Invented scenario: a 20 MHz timer clock, 12-bit resolution, 3.3 V, 25 ohm drivers, open output,
 * worst ripple at most 0.5 LSB over 5 %..95 %, settling to 0.5 LSB after the full-range step
 * (the slower of rising and falling). Every figure comes from the general engine.
 *
 * Usage: npx tsx scripts/circuit-table.ts
 */
import type { Network, NetworkStage, SecondPwm } from '../src/circuit/network.js';
import { slowerSettling } from '../src/engine/defaultSettling.js';
import { networkSettling, networkWorstRipple } from '../src/engine/periodic/networkFigures.js';

const CLOCK = 20e6;
const BITS = 12;
const V = 3.3;
const LSB = V / 2 ** BITS;
const pin = { high: V, low: 0, driverHigh: 25, driverLow: 25 };

export interface CircuitRow {
  name: string;
  pwmFrequency: number;
  /** Scale found, F (the capacitor that the topology scales). */
  scale: number;
  worstRipple: number;
  settling: number | null;
  parts: string;
}

interface Topology {
  name: string;
  /** PWM resolution of the first output (fine: the coarse bits). */
  firstBits: number;
  build: (k: number, period: number) => Network;
  parts: (k: number) => string;
}

const base = (period: number, stages: NetworkStage[], second: SecondPwm | null = null): Network => ({
  period,
  alignment: 'edge',
  pin,
  stages,
  second,
  loadResistance: null,
  loadCapacitance: 0,
});
const rc = (r: number, c: number): NetworkStage => ({ kind: 'rc', r, c, buffered: false });
const eng = (c: number) => `${(c * 1e9).toPrecision(3)} nF`;

export const TOPOLOGIES: Topology[] = [
  { name: 'passive, 1 stage', firstBits: BITS, build: (k, T) => base(T, [rc(10e3, k)]), parts: (k) => `10k / ${eng(k)}` },
  {
    name: 'passive, 2 stages',
    firstBits: BITS,
    build: (k, T) => base(T, [rc(10e3, k), rc(10e3, k)]),
    parts: (k) => `2 x 10k / ${eng(k)}`,
  },
  ...[0.5, 1, 2].map(
    (m): Topology => ({
      name: `complement, 1 stage, c = ${m} C`,
      firstBits: BITS,
      // The inverted output through 10k + m C into the node: above 1 / (2 pi 10k m C) its current
      // cancels the main path's ripple current, below it the main path alone sets the DC value.
      build: (k, T) => base(T, [rc(10e3, k)], { role: 'complement', bits: null, coarseBits: null, pin, stage: 0, r: 10e3, c: m * k }),
      parts: (k) => `10k / ${eng(k)}, complement 10k + ${eng(m * k)}`,
    }),
  ),
  {
    name: 'fine 6 + 6 bits, 2 stages',
    firstBits: 6,
    build: (k, T) => base(T, [rc(10e3, k), rc(10e3, k)], { role: 'fine', bits: 6, coarseBits: 6, pin, stage: 0, r: 640e3, c: null }),
    parts: (k) => `2 x 10k / ${eng(k)}, fine through 640k`,
  },
  {
    name: 'RC + Sallen-Key (Q 0.55)',
    firstBits: BITS,
    // Unity-gain Sallen-Key with r1 = r2: Q = sqrt(c1 / c2) / 2, so c1 = (2 Q)^2 c2 = 1.21 c2.
    build: (k, T) => base(T, [rc(10e3, k), { kind: 'sallen-key', r1: 10e3, r2: 10e3, c1: 1.21 * k, c2: k }]),
    parts: (k) => `10k / ${eng(k)}, SK 10k 10k ${eng(1.21 * k)} ${eng(k)}`,
  },
];

/**
 * One row: the smallest scale k (bisection on log k; ripple falls as k grows) whose worst ripple is
 * at most 0.5 LSB, and the settling time there.
 */
export function circuitRow(t: Topology): CircuitRow {
  const period = 2 ** t.firstBits / CLOCK;
  const ripple = (k: number) => networkWorstRipple(t.build(k, period), 0.05, 0.95).ripple;
  let lo = Math.log10(1e-12);
  let hi = Math.log10(1e-3);
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    if (ripple(10 ** mid) <= 0.5 * LSB) hi = mid;
    else lo = mid;
  }
  const k = 10 ** hi;
  const net = t.build(k, period);
  return {
    name: t.name,
    pwmFrequency: 1 / period,
    scale: k,
    worstRipple: ripple(k),
    settling: slowerSettling(networkSettling(net, 0.05, 0.95, 0.5 * LSB), networkSettling(net, 0.95, 0.05, 0.5 * LSB)).time,
    parts: t.parts(k),
  };
}

function main(): void {
  const rows = TOPOLOGIES.map(circuitRow);
  const passive = Math.min(...rows.slice(0, 2).map((r) => r.settling ?? Infinity));
  console.log('| circuit | PWM frequency | parts (smallest meeting the ripple limit) | worst ripple | settling to 0.5 LSB | vs best passive |');
  console.log('|---|---|---|---|---|---|');
  for (const r of rows) {
    const s = r.settling === null ? 'never' : `${(r.settling * 1e3).toPrecision(3)} ms`;
    const ratio = r.settling === null ? '' : `${(passive / r.settling).toFixed(1)}x faster`;
    console.log(`| ${r.name} | ${(r.pwmFrequency / 1e3).toPrecision(4)} kHz | ${r.parts} | ${(r.worstRipple / LSB).toFixed(3)} LSB | ${s} | ${ratio} |`);
  }
}

if (process.argv[1] && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) main();
