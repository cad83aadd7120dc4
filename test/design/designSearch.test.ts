import { describe, expect, it, vi } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { designSearch } from '../../src/design/designSearch.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { infeasibilityBounds } from '../../src/design/infeasibilityBounds.js';
import { modalLadderOf } from '../../src/engine/modal/modalLadderOf.js';
import { steadySwing } from '../../src/engine/modal/steadySwing.js';
import { slowestTimeConstant } from '../../src/design/slowestTimeConstant.js';
import { steadyState } from '../../src/engine/index.js';
import { loadProject, parseProject } from '../../src/project/index.js';
import { seriesValues } from '../../src/units/index.js';
import { bruteForce, designKey } from './bruteForce.js';

/** An invented project with a search section; `o` overrides pieces of the YAML. */
function project(o: Record<string, string>) {
  const yaml = `
pwm: { frequency: ${o.f ?? '20 kHz'}, bits: ${o.bits ?? 10}, high: 3.3 V, low: 0 V, driver: ${o.driver ?? '0 ohm'}, duty: { min: ${o.dmin ?? '5 %'}, max: ${o.dmax ?? '95 %'} } }
${o.load ? `load: ${o.load}` : ''}
spec:
  ripple: ${o.ripple ?? '0.5 LSB'}
${o.droop ? `  droop: ${o.droop}` : ''}
${o.gain ? `  gain: ${o.gain}` : ''}
${o.settling ? `  settling: ${o.settling}` : ''}
search:
  stages: ${o.stages ?? '[1, 2]'}
  series: ${o.series ?? 'E3'}
  margin: ${o.margin ?? '0 %'}
${o.buffered ? `  buffered: ${o.buffered}` : ''}
  resistance: { min: ${o.rmin ?? '1k'}, max: ${o.rmax ?? '10k'} }
  capacitance: { min: ${o.cmin ?? '10n'}, max: ${o.cmax ?? '1u'} }
${o.pin ? `  pin_current: ${o.pin}` : ''}
`;
  return parseProject(yaml, 'invented.yaml');
}

describe('designSearch finds the exhaustive optimum (brute force with the engine in the test)', () => {
  it('one stage, E12 over four decades of R and C, unequal drivers and a load', () => {
    const p = project({
      stages: '[1]',
      series: 'E12',
      rmin: '100',
      rmax: '100k',
      cmin: '1n',
      cmax: '10u',
      driver: '{ high: 40 ohm, low: 25 ohm }',
      load: '{ resistance: 470k, capacitance: 100p }',
      droop: '2 %',
    });
    const found = designSearch(p, { top: 5, compare: false });
    const brute = bruteForce(p, 5);
    expect(brute.count).toBe(seriesValues('E12', 100, 100e3).length * seriesValues('E12', 1e-9, 10e-6).length);
    expect(brute.ranked.length).toBe(5);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    expect(found.candidates.map((c) => c.settlingTime)).toEqual(brute.ranked.map((c) => c.settlingTime));
  });

  const twoStage: Array<[string, Record<string, string>]> = [
    ['ideal driver, open output', {}],
    ['unequal drivers, loaded', { driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 100k, capacitance: 100p }', gain: 'none' }],
    [
      'step from the spec, time limit, pin current limit, low-side driver weaker',
      { f: '10 kHz', driver: '{ high: 20 ohm, low: 60 ohm }', ripple: '2 mV', rmin: '220', rmax: '22k', cmin: '22n', cmax: '2.2u', settling: '{ band: 1 LSB, time: 20 ms, from: 20 %, to: 60 % }', pin: '5 mA' },
    ],
    ['droop limit with a heavy load', { f: '50 kHz', driver: '30 ohm', ripple: '1 LSB', droop: '4 LSB', series: 'E6', rmax: '4.7k', cmax: '220n', load: '{ resistance: 1M }', stages: '[2]' }],
  ];
  for (const [name, o] of twoStage) {
    it(`one and two stages: ${name}`, () => {
      const p = project(o);
      const found = designSearch(p, { top: 5, compare: false });
      const brute = bruteForce(p, 5);
      expect(brute.ranked.length).toBeGreaterThan(0);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      expect(found.stats.verified).toBeLessThan(brute.count / 10);
    });
  }
});

describe('a threshold set by a design the engine then rejects is corrected', () => {
  // With unequal drivers the droop depends on the capacitors and can peak inside the duty range;
  // the search's first threshold may come from such a design. Regression: top 1 once missed the optimum.
  const o = { driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 100k, capacitance: 100p }', droop: '3 %', series: 'E3', rmin: '100', rmax: '10k', cmin: '1n', cmax: '10u', stages: '[2]' };

  it('top 1 equals the exhaustive optimum', () => {
    const p = project(o);
    const found = designSearch(p, { top: 1, compare: false });
    const brute = bruteForce(p, 1);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
  });

  it('top 1 is the first of top 10 on a wide space', () => {
    const p = project({ ...o, series: 'E12', rmax: '1M', cmin: '100p', cmax: '100u', load: '{ resistance: 1M, capacitance: 100p }', droop: '2 %' });
    const one = designSearch(p, { top: 1, compare: false });
    const ten = designSearch(p, { top: 10, compare: false });
    expect(designKey(one.candidates[0])).toBe(designKey(ten.candidates[0]));
    expect(one.stats.verified).toBeLessThanOrEqual(ten.stats.verified);
  });
});

describe('three stages', () => {
  it('finds the exhaustive optimum of a small two- and three-stage space', () => {
    const p = project({ stages: '[2, 3]', ripple: '0.1 LSB', rmin: '2.2k', cmin: '47n', driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 1M }' });
    const found = designSearch(p, { top: 3, compare: false });
    const brute = bruteForce(p, 3);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    expect(found.candidates[0].stages).toHaveLength(3);
  });

  // Slices of the first capacitor ruled out together by one ripple check at a larger first
  // capacitor (deadThrough in collectCandidates.ts) and, with unequal drivers and a droop limit, the
  // droop floor (droopFloor.ts): each case below exercises them (checked once by counting while
  // writing the test); the designs stay those of exhaustive search.
  const sliced: Array<[string, Record<string, string>]> = [
    ['unequal drivers, a droop limit, a loaded output, two and three stages', { stages: '[2, 3]', ripple: '0.2 LSB', rmin: '220', rmax: '1k', cmin: '22n', cmax: '470n', driver: '{ high: 100 ohm, low: 20 ohm }', load: '{ resistance: 100k, capacitance: 1n }', droop: '30 LSB', gain: 'none' }],
    ['equal drivers, open output', { stages: '[3]', ripple: '0.2 LSB', rmin: '220', rmax: '1k', cmin: '47n', cmax: '1u', driver: '30 ohm' }],
    ['equal drivers, a load', { stages: '[3]', ripple: '0.2 LSB', rmin: '100', rmax: '470', cmin: '47n', cmax: '1u', driver: '30 ohm', load: '{ resistance: 47k }', gain: 'none' }],
  ];
  for (const [name, o] of sliced) {
    it(`whole slices and the droop floor keep the exhaustive optimum: ${name}`, () => {
      const p = project(o);
      const found = designSearch(p, { top: 5, compare: false, diagnose: false });
      const brute = bruteForce(p, 5);
      expect(brute.ranked.length).toBe(5);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      expect(found.candidates.some((c) => c.stages.length === 3)).toBe(true);
    });
  }
});

describe('what the search reports', () => {
  it('ranks by settling time, then fewer stages, then smaller total capacitance', () => {
    const p = project({ series: 'E6', stages: '[1, 2]' });
    const { candidates } = designSearch(p, { top: 10, compare: false });
    expect(candidates.length).toBe(10);
    for (let i = 1; i < candidates.length; i++) {
      const a = candidates[i - 1];
      const b = candidates[i];
      expect(a.settlingTime!).toBeLessThanOrEqual(b.settlingTime! * (1 + 1e-9));
      if (Math.abs(a.settlingTime! - b.settlingTime!) <= 1e-9 * b.settlingTime!) {
        expect(a.stages.length * 1e3 + a.totalCapacitance).toBeLessThanOrEqual(b.stages.length * 1e3 + b.totalCapacitance);
      }
    }
    expect(candidates.every((c) => c.pass)).toBe(true);
  });

  it('counts evaluated candidates and stays far below the raw space', () => {
    const r = designSearch(project({ series: 'E12', rmin: '100', rmax: '1M', cmin: '100p', cmax: '100u', stages: '[2]' }), { top: 3, compare: false });
    expect(r.stats.space).toBe((seriesValues('E12', 100, 1e6).length * seriesValues('E12', 100e-12, 100e-6).length) ** 2);
    expect(r.stats.evaluated).toBeGreaterThan(0);
    expect(r.stats.evaluated).toBeLessThan(r.stats.space / 100);
    expect(r.stats.verified).toBeGreaterThanOrEqual(3);
  });

  it('compares with the filter: design of the project', () => {
    const r = designSearch(loadProject('sample-configs/design-tight-ripple.yaml'), { top: 1 });
    expect(r.current?.stages).toEqual([
      { r: 10e3, c: 1e-6 },
      { r: 10e3, c: 1e-6 },
    ]);
    expect(r.current!.settlingTime!).toBeGreaterThan(r.candidates[0].settlingTime!);
  });
});

describe('when nothing is feasible', () => {
  it('names a settling-time limit that binds and shows the closest designs with their misses', () => {
    const p = project({ ripple: '0.1 LSB', settling: '{ band: 0.5 LSB, time: 2 ms }', stages: '[1, 2]' });
    const r = designSearch(p, { top: 5 });
    expect(r.feasible).toBe(false);
    expect(r.diagnosis.some((l) => l.startsWith('settling binds'))).toBe(true);
    expect(r.candidates.length).toBeGreaterThan(0);
    for (const c of r.candidates) {
      expect(c.pass).toBe(false);
      expect(c.checks.some((k) => !k.pass)).toBe(true);
    }
  });

  it('an explanation started before the deadline stops at it too, and claims nothing about the ranges', () => {
    // The same project as above: with time, settling binds; the deadline passes while the side
    // searches run (a stepping clock, 1 ms a reading, makes the cut fall at the same place).
    const p = project({ ripple: '0.1 LSB', settling: '{ band: 0.5 LSB, time: 2 ms }', stages: '[1, 2]' });
    const clock = { now: 0 };
    const spy = vi.spyOn(performance, 'now').mockImplementation(() => (clock.now += 1));
    try {
      designSearch(p, { top: 5, diagnose: false, deadline: 1e300 });
      const searchReadings = clock.now;
      clock.now = 0;
      const r = designSearch(p, { top: 5, deadline: searchReadings + 3.5 });
      expect(r.complete).toBe(true); // the search itself ended in time
      expect(r.diagnosis).toContain('(the side searches behind this explanation stopped at the time limit (--max-time); changes not listed were not proven either way)');
      expect(r.diagnosis.some((l) => l.startsWith('no design found with every limit relaxed'))).toBe(false);
      // readings past the deadline: the one-second grace of the verification at most, not whole side searches
      expect(clock.now).toBeLessThan(searchReadings + 3.5 + 1000 + 50);
    } finally {
      spy.mockRestore();
    }
  });

  it('says how much time constant one stage needs for the ripple and what the parts allow', () => {
    // 0.05 LSB at 20 kHz with at most 10 kohm and 100 nF: tau = 1 ms available
    const p = project({ ripple: '0.05 LSB', stages: '[1]', cmax: '100n' });
    const r = designSearch(p, { top: 3 });
    expect(r.feasible).toBe(false);
    const line = r.diagnosis.find((l) => l.includes('needs a time constant of about'));
    expect(line).toBeDefined();
    // Textbook estimate for tau >> T: ripple = (high - low) d (1 - d) T / tau at d = 0.5 (common practice)
    const lsb = 3.3 / 1024;
    const tauEstimate = (3.3 * 0.25 * (1 / 20e3)) / (0.05 * lsb);
    const said = Number(/about ([\d.]+) (m?)s/.exec(line!)![1]) * (/about [\d.]+ ms/.test(line!) ? 1e-3 : 1);
    expect(Math.abs(said / tauEstimate - 1)).toBeLessThan(0.02);
    expect(line).toContain('give 1 ms');
  });

  it('names the pin current limit when no allowed R1 can meet it', () => {
    const p = project({ pin: '100 uA' }); // needs R1 >= 33 kohm, range ends at 10 kohm
    const r = designSearch(p, { top: 3 });
    expect(r.feasible).toBe(false);
    expect(r.diagnosis.some((l) => l.startsWith('pin current binds'))).toBe(true);
    // Ohm's law: 3.3 V / 100 uA = 33 kohm (the driver is 0 ohm here)
    expect(r.diagnosis.some((l) => /R1 must be at least 33 kΩ/.test(l))).toBe(true);
  });
});

describe('search over the resolution', () => {
  const yaml = `
pwm: { clock: 16 MHz, bits: 10, prescaler: 1, alignment: edge, high: 3.3 V, low: 0 V, driver: 25 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 1M }
spec:
  ripple: 0.5 LSB
  droop: 10 mV
  settling: { band: 0.5 LSB }
search:
  stages: [2]
  series: E6
  margin: 0 %
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 1n, max: 1u }
  bits: { min: 8, max: 11 }
`;
  it('rescales LSB limits with each resolution and keeps limits in volts', () => {
    const p = parseProject(yaml, 'bits.yaml');
    const r = designSearch(p, { top: 3, compare: false });
    expect(r.resolutions.map((x) => x.bits)).toEqual([8, 9, 10, 11]);
    for (const row of r.resolutions) {
      // timer frequency, edge-aligned: clock / (prescaler 2^bits) (common practice)
      expect(row.frequency).toBeCloseTo(16e6 / 2 ** row.bits, 6);
      expect(row.lsb).toBeCloseTo(3.3 / 2 ** row.bits, 15);
      expect(row.best).not.toBeNull();
      const checks = Object.fromEntries(row.best!.checks.map((k) => [k.name, k.limit]));
      expect(checks.ripple).toBeCloseTo(0.5 * row.lsb, 15);
      expect(checks.droop).toBe(0.01);
      expect(row.best!.worstRipple).toBeLessThanOrEqual(0.5 * row.lsb);
    }
    // the ranking is by settling time, across resolutions
    expect(r.candidates[0].settlingTime).toBe(Math.min(...r.resolutions.map((x) => x.best!.settlingTime!)));
  });

  it("each row is the best design of that resolution's own search", () => {
    const p = parseProject(yaml, 'bits.yaml');
    const r = designSearch(p, { top: 1, compare: false });
    const fixed = parseProject(yaml.replace('bits: { min: 8, max: 11 }', '').replace('bits: 10,', 'bits: 9,'), 'nine.yaml');
    const nine = designSearch(fixed, { top: 1, compare: false });
    expect(designKey(r.resolutions.find((x) => x.bits === 9)!.best!)).toBe(designKey(nine.candidates[0]));
  });
});

describe('sample-configs/design-tight-ripple.yaml', () => {
  const p = loadProject('sample-configs/design-tight-ripple.yaml');
  const one = designSearch(p, { top: 1, stageCounts: [1], compare: false });
  const two = designSearch(p, { top: 1, stageCounts: [2], compare: false });

  it('a two-stage design settles measurably faster than the best one-stage design', () => {
    expect(one.feasible && two.feasible).toBe(true);
    expect(two.candidates[0].settlingTime! * 10).toBeLessThan(one.candidates[0].settlingTime!);
  });

  it('the one-stage optimum settles about tau ln(S / band) (textbook first-order step, common practice)', () => {
    const best = one.candidates[0];
    const { pwm, load } = p;
    const tau = slowestTimeConstant([best.stages[0].r], [best.stages[0].c], (pwm.driver.high + pwm.driver.low) / 2, load.resistance ?? null, load.capacitance);
    const m = modalLadderOf({ period: 1 / pwm.frequency, high: pwm.high, low: pwm.low, driverHigh: pwm.driver.high, driverLow: pwm.driver.low, loadResistance: load.resistance ?? null, loadCapacitance: load.capacitance }, [best.stages[0].r], [best.stages[0].c]);
    const step = steadySwing(m, pwm.duty.max).average - steadySwing(m, pwm.duty.min).average;
    const estimate = tau * Math.log(step / p.spec.settling!.band);
    expect(Math.abs(best.settlingTime! / estimate - 1)).toBeLessThan(0.1);
  });
});

/** The search against exhaustive search on the rules of model.md 1.1 (margin, gain, split series, follower). */
describe('search.margin: every design keeps the margin below every limit, as exhaustive search finds', () => {
  const cases: Array<[string, Record<string, string>]> = [
    ['equal drivers, open output, E24 resistors and E12 capacitors', { margin: '20 %', series: '{ resistor: E24, capacitor: E12 }', rmin: '1k', rmax: '1.5k', cmin: '100n', cmax: '470n', ripple: '4 LSB', settling: '{ band: 0.5 LSB, time: 20 ms }' }],
    ['unequal drivers, loaded, droop and pin current', { margin: '10 %', series: 'E12', rmax: '3.3k', cmin: '100n', cmax: '1u', driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 100k, capacitance: 100p }', droop: '5 %', pin: '3 mA' }],
    ['a 25 % margin, low-side driver weaker', { margin: '25 %', driver: '{ high: 20 ohm, low: 60 ohm }', series: 'E6', cmax: '2.2u' }],
  ];
  for (const [name, o] of cases) {
    it(name, () => {
      const p = project(o);
      const m = p.search!.margin;
      const found = designSearch(p, { top: 5, compare: false });
      const brute = bruteForce(p, 5);
      expect(brute.ranked.length).toBeGreaterThan(0);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      for (const c of found.candidates) {
        expect(c.keepsMargin).toBe(true);
        for (const k of c.checks) {
          expect(k.value).not.toBeNull();
          expect(k.value!).toBeLessThanOrEqual(k.limit * (1 - m));
          expect(c.margins[k.name]).toBeCloseTo((k.limit - k.value!) / k.limit, 12);
          expect(c.margins[k.name]!).toBeGreaterThanOrEqual(m - 1e-12);
        }
      }
      // The margin changes the answer: without it the best design sits closer to some limit.
      const bare = designSearch(project({ ...o, margin: '0 %' }), { top: 1, compare: false }).candidates[0];
      expect(Math.min(...Object.values(bare.margins).map((x) => x ?? -1))).toBeLessThan(m);
    });
  }

  it('says so when designs meet the limits but none with the margin', () => {
    // A 10 kohm load and 100 ohm parts: 100 + 100 ohm gives 200 / 10200 = 1.96 % gain error (Ohm's
    // law), inside the 2 % limit but not inside it less 10 %.
    const o = { load: '{ resistance: 10k }', rmin: '100', rmax: '10k', cmin: '100n', cmax: '10u', series: 'E3', ripple: '2 LSB' };
    const bare = designSearch(project({ ...o, margin: '0 %' }), { top: 3, compare: false });
    expect(bare.feasible).toBe(true);
    const r = designSearch(project({ ...o, margin: '10 %' }), { top: 3, compare: false });
    expect(bruteForce(project({ ...o, margin: '10 %' }), 1).ranked).toHaveLength(0);
    expect(r.feasible).toBe(false);
    expect(r.diagnosis[0]).toMatch(/^no design keeps the 10 % margin/);
    expect(r.candidates.map(designKey)).toEqual(bare.candidates.map(designKey));
    expect(r.candidates.length).toBeGreaterThan(0);
    for (const c of r.candidates) {
      expect(c.pass).toBe(true);
      expect(c.keepsMargin).toBe(false);
    }
  });
});

describe('the search without the margin is a side search with a budget (WITHOUT_MARGIN_BUDGET)', () => {
  it('a hard space that no design meets even without the margin gets its explanation, not a search to the time limit', () => {
    // Invented (a fuzz run's project): 12 V into 100 kohm with the default 2 % gain limit and a
    // 30 % margin, two and three E24 stages from 10 ohm to 100 kohm. The search with the margin is
    // proven out of reach from bounds; the one without it used to walk the three-stage space until
    // the 60 s default time limit of the command (and with no deadline, for hours).
    const p = parseProject(
      `
pwm: { frequency: 100 kHz, bits: 6, high: 12 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 0 %, max: 100 % } }
load: { resistance: 100k }
spec:
  ripple: 10 mV
  settling: { band: 1 LSB, time: 5 ms, from: 0 %, to: 100 % }
search:
  stages: [2, 3]
  series: E24
  margin: 30 %
  resistance: { min: 10, max: 100k }
  capacitance: { min: 100p, max: 100u }
  pin_current: 5 mA
`,
      'no-margin.yaml',
    );
    const r = designSearch(p, { top: 10, compare: false });
    expect(r.feasible).toBe(false);
    expect(r.complete).toBe(true);
    // The explanation ran (the no-margin search found nothing within its budget): gain binds.
    expect(r.diagnosis.join('\n')).toMatch(/gain binds/);
  });
});

describe('the full-scale (gain) limit keeps divided-down outputs out', () => {
  it('10 kohm load, no droop limit: no design divides the output, exhaustive search agrees', () => {
    const o = { load: '{ resistance: 10k }', rmin: '10', rmax: '1k', cmin: '100n', cmax: '10u', series: 'E3', margin: '10 %', ripple: '2 LSB' };
    const p = project(o);
    expect(p.spec.gain).toBe(0.02); // the default, model.md 1.1
    const found = designSearch(p, { top: 5, compare: false });
    const brute = bruteForce(p, 5);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    expect(found.feasible).toBe(true);
    for (const c of found.candidates) {
      // DC divider of the series resistance and the load (Ohm's law): R_s / (R_L + R_s) of full scale
      const rs = c.stages.reduce((s, st) => s + st.r, 0);
      expect(rs / (10e3 + rs)).toBeLessThanOrEqual(0.02 * 0.9);
      expect(Math.abs(c.gainError) / 3.3).toBeCloseTo(rs / (10e3 + rs), 9);
    }
    // Without the gain limit the same space prefers a divided-down output: the case the limit exists for.
    const off = designSearch(project({ ...o, gain: 'none' }), { top: 1, compare: false }).candidates[0];
    expect(Math.abs(off.gainError) / 3.3).toBeGreaterThan(0.02);
  });

  it('unequal drivers (no closed form): the search prunes by the fast endpoint averages and agrees with exhaustive search', () => {
    const p = project({ driver: '{ high: 60 ohm, low: 20 ohm }', load: '{ resistance: 220k, capacitance: 47p }', gain: '1.5 %', margin: '10 %', rmin: '100', cmin: '10n', cmax: '10u' });
    const found = designSearch(p, { top: 5, compare: false });
    const brute = bruteForce(p, 5);
    expect(brute.ranked.length).toBeGreaterThan(0);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    for (const c of found.candidates) expect(Math.abs(c.gainError) / 3.3).toBeLessThanOrEqual(0.015 * 0.9);
  });
});

describe('search.series with a capacitor series of its own', () => {
  // IEC 60063 mantissas, typed from the standard's tables (E6, E12).
  const E6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
  const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
  const mantissa = (x: number) => Number((x / 10 ** Math.floor(Math.log10(x) + 1e-9)).toFixed(1));
  for (const [cs, table] of [
    ['E6', E6],
    ['E12', E12],
  ] as const) {
    it(`E24 resistors, ${cs} capacitors: every capacitor from ${cs}, exhaustive search agrees`, () => {
      const p = project({ series: `{ resistor: E24, capacitor: ${cs} }`, rmin: '1k', rmax: '1.5k', cmin: '100n', cmax: '470n', ripple: '4 LSB', margin: '10 %' });
      expect(p.search!.series).toEqual({ resistor: 'E24', capacitor: cs });
      const found = designSearch(p, { top: 8, compare: false });
      const brute = bruteForce(p, 8);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      expect(found.basis.series).toBe(`E24 resistors, ${cs} capacitors`);
      expect(found.candidates.length).toBe(8);
      for (const c of found.candidates) for (const st of c.stages) expect(table).toContain(mantissa(st.c));
      // the resistors do come from E24 (1.1, 1.3 are not E12 values)
      expect(designProblem(p).rValues.map(mantissa)).toEqual([1.0, 1.1, 1.2, 1.3, 1.5]);
    });
  }
});

describe('search.buffered: an ideal follower after the last stage', () => {
  it('the fast model of the unloaded ladder is the engine on the buffered one (same averages and ripple)', () => {
    const p = project({ load: '{ resistance: 10k, capacitance: 1n }', driver: '{ high: 40 ohm, low: 25 ohm }', buffered: '[false, true]' });
    const problem = designProblem(p, undefined, true);
    for (const [r, c] of [
      [[4700], [220e-9]],
      [[1000, 10e3], [1e-6, 47e-9]],
      [[2200, 4700, 10e3], [470e-9, 100e-9, 22e-9]],
    ]) {
      const ladder = problem.ladderOf(r, c);
      expect(ladder.stages[ladder.stages.length - 1].buffered).toBe(true);
      expect(ladder.loadResistance).toBe(10e3); // the engine sees the real load, behind the follower
      const fast = modalLadderOf(problem.circuit, r, c);
      for (const d of [0.05, 0.5, 0.9]) {
        const f = steadySwing(fast, d);
        const exact = steadyState(ladder, d);
        expect(f.average).toBeCloseTo(exact.average, 9);
        expect(f.ripple).toBeCloseTo(exact.ripple, 9);
      }
    }
  });

  const cases: Array<[string, Record<string, string>]> = [
    ['10 kohm load: only follower designs meet the gain limit', { load: '{ resistance: 10k }', margin: '10 %', buffered: '[false, true]', stages: '[1, 2]' }],
    ['a light load, unequal drivers: both kinds compete', { load: '{ resistance: 10M, capacitance: 4.7n }', driver: '{ high: 40 ohm, low: 25 ohm }', margin: '10 %', buffered: '[false, true]', droop: '4 LSB' }],
    ['only with a follower', { load: '{ resistance: 47k, capacitance: 10n }', buffered: '[true]', stages: '[2]', margin: '10 %' }],
    ['two and three stages, unequal drivers, a heavy load', { stages: '[2, 3]', ripple: '0.1 LSB', rmin: '2.2k', cmin: '47n', driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 100k, capacitance: 220p }', buffered: '[false, true]', margin: '10 %' }],
  ];
  for (const [name, o] of cases) {
    it(`equals exhaustive search over both options: ${name}`, () => {
      const p = project(o);
      const found = designSearch(p, { top: 6, compare: false });
      const brute = bruteForce(p, 6);
      expect(brute.ranked.length).toBeGreaterThan(0);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      for (const c of found.candidates) {
        expect(c.needsFollower).toBe(c.stages[c.stages.length - 1].buffered === true);
        c.stages.slice(0, -1).forEach((st) => expect(st.buffered ?? false).toBe(false));
      }
      if (name.includes('both kinds')) expect(new Set(found.candidates.map((c) => c.needsFollower)).size).toBe(2);
    });
  }

  it('the 10 kohm case has no design without a follower, and every one found has it', () => {
    const p = project({ load: '{ resistance: 10k }', margin: '10 %', buffered: '[false, true]' });
    const found = designSearch(p, { top: 6, compare: false });
    expect(found.candidates.length).toBeGreaterThan(0);
    expect(found.candidates.every((c) => c.needsFollower)).toBe(true);
    expect(designSearch(project({ load: '{ resistance: 10k }', margin: '10 %' }), { top: 1, compare: false, diagnose: false }).feasible).toBe(false);
  });

  describe('when nothing is feasible, the explanation is about the designs searched', () => {
    // Invented: a 10 kohm load (gain limit 2 % by default) and a ripple limit so tight with a
    // 1 ms settling limit that no follower design meets both either. The explanation once took
    // every design as unbuffered: it proved the stage counts out of reach by the load (which the
    // follower removes) and re-evaluated the closest designs without their follower.
    const tight = (buffered: string) => project({ load: '{ resistance: 10k }', buffered, ripple: '0.05 LSB', settling: '{ band: 1 LSB, time: 1 ms }', rmin: '1k', rmax: '100k', series: 'E6' });

    it('a follower-only search: the proofs are the follower designs\' own, the closest designs have the follower and its figures', () => {
      const p = tight('[true]');
      const result = designSearch(p, { top: 3, compare: false });
      expect(result.feasible).toBe(false);
      const follower = designProblem(p, undefined, true);
      const proofs = (result.proven ?? []).map((m) => m.reason);
      expect(proofs.length).toBeGreaterThan(0);
      for (const n of [1, 2]) {
        const own = infeasibilityBounds(follower, n).misses;
        if (own.length > 0) expect(proofs.some((r) => own.some((m) => m.reason === r))).toBe(true);
      }
      // nothing about the load's gain loss: the follower isolates the load
      expect(result.diagnosis.some((l) => l.includes('proven out of reach') && l.includes('gain'))).toBe(false);
      expect(result.candidates.length).toBeGreaterThan(0);
      for (const c of result.candidates) {
        expect(c.stages[c.stages.length - 1].buffered).toBe(true);
        // the figures are the engine's with the follower
        const again = exactCandidate(follower, follower.ladderOf(c.stages.map((x) => x.r), c.stages.map((x) => x.c)));
        expect(c.droop).toBe(again.droop);
        expect(c.settlingTime).toBe(again.settlingTime);
      }
    });

    it('with and without a follower: each stage count proven out of reach gives both proofs', () => {
      const p = tight('[false, true]');
      const result = designSearch(p, { top: 3, compare: false });
      expect(result.feasible).toBe(false);
      const lines = result.diagnosis.filter((l) => l.includes('proven out of reach'));
      expect(lines.length).toBeGreaterThan(0);
      for (const l of lines) {
        expect(l).toContain('without a follower');
        expect(l).toContain('with a follower');
      }
      // In JSON terms: one proof per option and stage count, each saying which option it is for.
      const proven = result.proven ?? [];
      for (const n of new Set(proven.map((m) => m.stages))) {
        expect(proven.filter((m) => m.stages === n).map((m) => m.follower).sort()).toEqual([false, true]);
      }
    });
  });
});
