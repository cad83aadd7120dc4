/**
 * The general engine (src/engine/periodic) against an independent time-domain integration
 * (odexNetwork.ts: our own Kirchhoff equations, written apart from src/, integrated by Hairer &
 * Wanner's ODEX extrapolation method, npm `odex`, at 1e-12 relative tolerance) on every example
 * network: RC ladders, Sallen-Key stages with Q 0.55 to 2, complement injection through r and
 * r + c, fine outputs of 4 + 4 bits, edge and center alignment. Circuits are invented.
 */
import { describe, expect, it } from 'vitest';
import type { Duties, Network } from '../../../src/circuit/network.js';
import { networkEquations } from '../../../src/circuit/networkEquations.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { periodicSettling } from '../../../src/engine/periodic/periodicSettling.js';
import { networkDcTransfer } from '../../../src/engine/periodic/networkFigures.js';
import { exampleNetworks, fine44 } from './networks.js';
import { networkDerivative, networkStateLayout, periodicByRelaxation, settlingBySimulation } from './odexNetwork.js';

const dutiesFor = (n: Network, d: number): Duties => (n.second?.role === 'fine' ? { first: d, second: 1 - d } : { first: d, second: null });

describe('general engine against time-domain integration', () => {
  it('state equations: the same derivative as the independent nodal equations in every pin state', () => {
    for (const [name, n] of Object.entries(exampleNetworks)) {
      const eq = networkEquations(n);
      const layout = networkStateLayout(n);
      expect(eq.n, name).toBe(layout.size);
      for (const [key, first, second] of [['hh', true, true], ['hl', true, false], ['lh', false, true], ['ll', false, false]] as const) {
        const f = networkDerivative(n, first, second);
        const x = Array.from({ length: eq.n }, (_, i) => 0.3 + 0.7 * Math.sin(1 + 2.1 * i));
        const ref = f(0, x);
        const { A, b } = eq.phases[key];
        for (let i = 0; i < eq.n; i++) {
          let v = b[i];
          for (let j = 0; j < eq.n; j++) v += A[i * eq.n + j] * x[j];
          expect(Math.abs(v - ref[i]), `${name} ${key} state ${i}`).toBeLessThan(1e-9 * Math.max(1, Math.abs(ref[i])));
        }
      }
    }
  });

  it('periodic steady state: average, ripple, extremes (1e-8 of full scale)', () => {
    for (const [name, n] of Object.entries(exampleNetworks)) {
      for (const d of [0.2, 0.55]) {
        const duties = dutiesFor(n, d);
        const exact = periodicOrbit(n, duties);
        const sim = periodicByRelaxation(n, duties);
        const span = n.pin.high - n.pin.low;
        expect(Math.abs(exact.average - sim.average), `${name} average at ${d}`).toBeLessThan(1e-8 * span);
        expect(Math.abs(exact.ripple - sim.ripple), `${name} ripple at ${d}`).toBeLessThan(1e-8 * span + 1e-6 * sim.ripple);
        expect(Math.abs(exact.max - sim.max), `${name} max at ${d}`).toBeLessThan(1e-8 * span);
      }
    }
  });

  it('settling time after a step (1e-6 of a period)', () => {
    for (const [name, n] of Object.entries(exampleNetworks)) {
      const from = dutiesFor(n, 0.15);
      const to = dutiesFor(n, 0.8);
      const band = 0.004 * (n.pin.high - n.pin.low);
      const exact = periodicSettling(n, from, to, band).time;
      const sim = settlingBySimulation(n, from, to, band).time;
      if (sim === null) expect(exact, name).toBeNull();
      else expect(Math.abs(exact! - sim), name).toBeLessThan(1e-6 * n.period + 1e-9 * sim);
    }
  });

  it('fine output: averages at every code follow superposition of the two weighted sources (Millman)', () => {
    // fine44: 4 + 4 bits, equal drivers (25 ohm) on both outputs, open output. With equal drivers the
    // average is the DC response to the average inputs, so Millman's theorem gives it exactly:
    // (D1 G1 + D2 G2) / (G1 + G2) (high - low) + low, G1 = 1 / (10k + 25), G2 = 1 / (160k + 25).
    // The driver resistance makes the fine weight 0.2 % off 1/16, which shows as INL (tested below).
    const G1 = 1 / (10e3 + 25);
    const G2 = 1 / (160e3 + 25);
    const millman = (d1: number, d2: number) => ((d1 * G1 + d2 * G2) / (G1 + G2)) * 3.3;
    let worst = 0;
    for (let code = 0; code < 256; code += 7) {
      const duties = { first: Math.floor(code / 16) / 16, second: (code % 16) / 16 };
      worst = Math.max(worst, Math.abs(periodicOrbit(fine44, duties, false).average - millman(duties.first, duties.second)));
    }
    expect(worst).toBeLessThan(1e-12 * 3.3);
    // INL: largest deviation from the endpoint line over every code, from the same formula.
    let inl = 0;
    const y = (code: number) => millman(Math.floor(code / 16) / 16, (code % 16) / 16);
    for (let code = 0; code <= 256; code++) inl = Math.max(inl, Math.abs(y(0) + ((y(256) - y(0)) * code) / 256 - y(code)));
    const dc = networkDcTransfer(fine44, 0, 1);
    expect(Math.abs(Math.abs(dc.inl.error) - inl)).toBeLessThan(1e-9 * inl);
  });
});
