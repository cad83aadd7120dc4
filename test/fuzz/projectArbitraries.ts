/**
 * fast-check generators of project files for the command-line fuzz suite: valid projects in the
 * keys of model.md (invented boards with random but physical values) and mutations of their text
 * (dropped keys, wrong kinds, unit slips, extreme magnitudes, deep nesting, aliases, encodings).
 */
import fc from 'fast-check';
import { stringify } from 'yaml';

const pick = <T>(...values: T[]) => fc.constantFrom(...values);
const eng = (values: string[]) => fc.constantFrom(...values);

const R = eng(['100', '470', '1k', '2k2', '4k7', '10k', '22k', '47k', '100k', '220k', '1M']);
const C = eng(['1n', '4n7', '10n', '47n', '100n', '470n', '1u', '2.2u', '10u']);

/** A valid project as plain data (the file is its YAML text). */
export const validProject = fc.record({
  pwm: fc.record({
    frequency: eng(['1 kHz', '4.88 kHz', '19.5 kHz', '31.25 kHz', '62.5 kHz', '200 kHz']),
    bits: fc.integer({ min: 6, max: 14 }),
    high: pick('3.3 V', '5 V', '1.8 V'),
    low: pick('0 V', '0'),
    driver: fc.oneof(pick('0 ohm', '25 ohm', '50 ohm'), fc.record({ high: pick('40 ohm', '20 ohm'), low: pick('25 ohm', '60 ohm') })),
    duty: fc.record({ min: pick('0 %', '5 %', '10 %'), max: pick('90 %', '95 %', '100 %') }),
  }),
  load: fc.option(fc.record({ resistance: eng(['10k', '100k', '1M', '10M']), capacitance: pick('0', '47 pF', '1 nF') }), { nil: undefined }),
  filter: fc.record({
    stages: fc.array(fc.record({ r: R, c: C, buffered: fc.boolean() }), { minLength: 1, maxLength: 4 }),
  }),
  spec: fc.option(
    fc.record(
      {
        ripple: pick('0.5 LSB', '1 LSB', '2 mV', '0.1 %'),
        droop: pick('1 LSB', '2 %', '10 mV'),
        inl: pick('0.5 LSB', '1 mV'),
        settling: fc.record({ band: pick('0.5 LSB', '1 mV'), time: pick('1 ms', '20 ms', '1 s') }, { requiredKeys: ['band'] }),
      },
      { requiredKeys: [] },
    ),
    { nil: undefined },
  ),
  search: fc.option(
    fc.record({
      stages: pick([1], [2], [1, 2]),
      series: pick('E3', 'E6'),
      resistance: fc.record({ min: pick('1k', '4k7'), max: pick('10k', '47k') }),
      capacitance: fc.record({ min: pick('10n', '100n'), max: pick('1u', '4.7u') }),
    }),
    { nil: undefined },
  ),
  tolerance: fc.option(fc.record({ resistor: pick('1 %', '5 %'), capacitor: pick('10 %', '20 %'), samples: pick(200, 500) }), { nil: undefined }),
});

export type ProjectData = Record<string, unknown>;

/** Text of a project as a user would write it. */
export const projectText = (data: ProjectData): string => stringify(JSON.parse(JSON.stringify(data)), { flowCollectionPadding: true });

/** Every key path of plain data, for mutations ('pwm.driver.high', 'filter.stages.0.r'). */
function keyPaths(node: unknown, prefix: Array<string | number> = []): Array<Array<string | number>> {
  if (node === null || typeof node !== 'object') return [];
  const entries: Array<[string | number, unknown]> = Array.isArray(node) ? node.map((v, i) => [i, v]) : Object.entries(node);
  return entries.flatMap(([k, v]) => [[...prefix, k], ...keyPaths(v, [...prefix, k])]);
}

function setAt(data: ProjectData, path: Array<string | number>, value: unknown): ProjectData {
  const copy = structuredClone(data) as Record<string | number, unknown>;
  let node = copy as Record<string | number, unknown>;
  for (const k of path.slice(0, -1)) node = node[k] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (value === DROP) {
    if (Array.isArray(node) && typeof last === 'number') node.splice(last, 1);
    else delete node[last];
  } else node[last] = value;
  return copy;
}
const DROP = Symbol('drop');

/** Replacement values that are wrong in kind, unit or magnitude. */
const wrongValue = fc.oneof(
  pick<unknown>(DROP, null, true, 0, -1, 1e308, -1e-308, 1e-30, 1e30, '', ' ', '1m', '1M', '10 F', '1 Tohm', '1 fF', '3.3 V', '20 kHz'),
  pick<unknown>('NaN', 'Infinity', '-0', '0x10', '1e400', '5 %%', '100 %', '-5 %', '∞ V', 'ünïcödé', '\u0000', 'a: b', '[1, 2]'),
  pick<unknown>([], {}, [[[[[]]]]], { min: '1k' }, ['1k', '2k'], { high: '1', low: '2' }),
  fc.string({ maxLength: 12 }),
  fc.double({ noNaN: false }),
  fc.integer(),
);

/** A mutation applied to the data of a valid project. */
export const mutatedData = (data: ProjectData) =>
  fc.integer({ min: 0, max: 10_000 }).chain((i) => {
    const paths = keyPaths(data);
    const path = paths[i % paths.length];
    return wrongValue.map((v) => setAt(data, path, v));
  });

/** Mutations of the text itself: encodings, nesting, aliases, duplication, truncation. */
export const textMutation = fc.oneof(
  pick(
    (t: string) => Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(t, 'utf16le')]),
    (t: string) => Buffer.from(t.replace(/ohm/g, 'Ω').replace(/u(?=[F\s,}])/g, 'µ'), 'latin1'),
    (t: string) => Buffer.from(`${t}\u0000`),
    (t: string) => Buffer.from(t.replace(/\n/g, '\r')),
    (t: string) => Buffer.from(t.replace(/\n/g, '\r\n')),
    (t: string) => Buffer.from(`${t}extra: ${'['.repeat(3000)}${']'.repeat(3000)}\n`),
    (t: string) => Buffer.from(`${t}${t}`),
    (t: string) => Buffer.from(`base: &b { r: 1k, c: 1u }\n${t}more: [*b, *b, *b, *nope]\n`),
    (t: string) => Buffer.from(t.replace(/:/g, ':\t')),
    (t: string) => Buffer.from(t.replace(/^(\s*)/gm, '$1\t')),
    (t: string) => Buffer.from(`---\n${t}---\n${t}`),
  ),
  fc.integer({ min: 1, max: 400 }).map((n) => (t: string) => Buffer.from(t.slice(0, Math.max(0, t.length - n)))),
  fc.integer({ min: 0, max: 400 }).map((n) => (t: string) => Buffer.from(`${t.slice(0, n)}{[:&*!|>'"%@\`${t.slice(n)}`)),
);
