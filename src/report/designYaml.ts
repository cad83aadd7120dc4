import { isMap, isScalar, isSeq, parseDocument, type Document, type Node, type Pair, YAMLMap, YAMLSeq } from 'yaml';
import type { AnyCandidateStage, Candidate, CandidateStage, SallenKeyCandidateStage } from '../design/types.js';
import { formatEng, formatIec60062, parseQuantity, type Dimension } from '../units/index.js';

/** One change `--write` made to the project file: `pwm.bits 8 -> 6`, a stage added or removed. */
export interface DesignEdit {
  /** Key path as the project file spells it: 'pwm.bits', 'filter.stages[0].r', 'filter.stages[1]'. */
  path: string;
  /** The text as the file had it; null when the key or stage is added. */
  from: string | null;
  /** The new text; null when the stage is removed. */
  to: string | null;
}

/** The rewritten file and what changed in it. */
export interface WrittenDesign {
  text: string;
  changes: DesignEdit[];
  /**
   * How the text was produced: 'edited' (only the changed values spliced into the original
   * text, everything else byte for byte) or 'rewritten' (the yaml Document API's toString, which
   * keeps comments and key order but may re-space the file; used when the file's shape is one the
   * splicer does not handle, e.g. aliases).
   */
  method: 'edited' | 'rewritten';
}

/** The line `pwm.bits 8 -> 6`, `filter.stages[1] added: { r: 8k2, c: 1n0 }`. */
export function changeLine(e: DesignEdit): string {
  if (e.from === null) return `${e.path} added: ${e.to}`;
  if (e.to === null) return `${e.path} removed (was ${e.from})`;
  return `${e.path} ${e.from} -> ${e.to}`;
}

interface Splice {
  start: number;
  end: number;
  text: string;
}

type Target = Pick<Candidate<AnyCandidateStage>, 'stages' | 'bits' | 'frequency' | 'secondPwm'>;

const isActive = (s: AnyCandidateStage): s is SallenKeyCandidateStage => 'active' in s && s.active === 'sallen-key';

/** The parts of a Sallen-Key stage, in file order. */
const SK_PARTS = [
  ['r1', 'resistance'],
  ['r2', 'resistance'],
  ['c1', 'capacitance'],
  ['c2', 'capacitance'],
] as const;

const stageFlow = (s: AnyCandidateStage) =>
  isActive(s)
    ? `{ active: sallen-key, ${SK_PARTS.map(([k, d]) => `${k}: ${formatIec60062(s[k], d)}`).join(', ')} }`
    : `{ r: ${formatIec60062((s as CandidateStage).r, 'resistance')}, c: ${formatIec60062((s as CandidateStage).c, 'capacitance')}${(s as CandidateStage).buffered ? ', buffered: true' : ''} }`;

/** The value as SI, or NaN when it does not read as that dimension. */
function valueOf(node: unknown, dimension: Dimension): number {
  if (!isScalar(node)) return NaN;
  try {
    return parseQuantity(node.value as string | number, dimension);
  } catch {
    return NaN;
  }
}

const sameValue = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

/** Source text of a node (its value, without a trailing comment). */
const sourceOf = (text: string, node: Node) => text.slice(node.range![0], node.range![1]);

/** Start of the line holding position `i`. */
const lineStart = (text: string, i: number) => text.lastIndexOf('\n', i - 1) + 1;
/** Position after the newline ending the line that holds position `i` (text length at the end). */
const lineEnd = (text: string, i: number) => {
  const n = text.indexOf('\n', i);
  return n < 0 ? text.length : n + 1;
};

class Unsupported extends Error {}

/** The splices that turn `text` into the design, and the change list. Throws Unsupported for shapes it does not handle. */
function splices(text: string, doc: Document, target: Target): { edits: Splice[]; changes: DesignEdit[] } {
  const edits: Splice[] = [];
  const changes: DesignEdit[] = [];
  const root = doc.contents;
  if (!isMap(root) || root.flow) throw new Unsupported('the top level is not a block map');
  const want = target.stages;

  const filter = root.get('filter', true);
  const stagesNode = isMap(filter) ? filter.get('stages', true) : undefined;
  if (filter === undefined || filter === null || (isScalar(filter) && filter.value === null)) {
    // No filter yet (a design-only file): add one before `spec:` (or at the end).
    const lines = ['filter:', '  stages:', ...want.map((s) => `    - ${stageFlow(s)}`)].join('\n') + '\n';
    const spec = root.items.find((p) => isScalar(p.key) && p.key.value === 'spec');
    if (filter !== undefined) {
      // `filter:` with nothing after it: replace that line.
      const pair = root.items.find((p) => isScalar(p.key) && p.key.value === 'filter')!;
      const at = lineStart(text, (pair.key as Node).range![0]);
      edits.push({ start: at, end: lineEnd(text, (pair.key as Node).range![1]), text: lines });
    } else if (spec) {
      const at = lineStart(text, (spec.key as Node).range![0]);
      edits.push({ start: at, end: at, text: lines });
    } else {
      edits.push({ start: text.length, end: text.length, text: (text.endsWith('\n') || text === '' ? '' : '\n') + lines });
    }
    want.forEach((s, i) => changes.push({ path: `filter.stages[${i}]`, from: null, to: stageFlow(s) }));
  } else if (isMap(filter) && isSeq(stagesNode)) {
    stageSplices(text, filter, stagesNode, want, edits, changes);
  } else {
    throw new Unsupported('filter.stages is not a list');
  }

  // Resolution: only when the design is at another one than the file states.
  const pwm = root.get('pwm', true);
  if (target.bits !== null && isMap(pwm)) {
    const bitsNode = pwm.get('bits', true);
    if (bitsNode === undefined) {
      insertPair(text, pwm, 'bits', String(target.bits), edits);
      changes.push({ path: 'pwm.bits', from: null, to: String(target.bits) });
    } else if (!isScalar(bitsNode)) {
      throw new Unsupported('pwm.bits is not a plain value');
    } else if (Number(bitsNode.value) !== target.bits) {
      edits.push({ start: bitsNode.range![0], end: bitsNode.range![1], text: String(target.bits) });
      changes.push({ path: 'pwm.bits', from: sourceOf(text, bitsNode), to: String(target.bits) });
      const freq = pwm.get('frequency', true);
      if (freq !== undefined) {
        if (!isScalar(freq)) throw new Unsupported('pwm.frequency is not a plain value');
        const to = formatEng(target.frequency, 'Hz', 8);
        edits.push({ start: freq.range![0], end: freq.range![1], text: to });
        changes.push({ path: 'pwm.frequency', from: sourceOf(text, freq), to });
      }
    }
  }

  // The second output's parts (version 1.1 circuits): second_pwm.into.r and .c.
  if (target.secondPwm) {
    const second = root.get('second_pwm', true);
    const into = isMap(second) ? second.get('into', true) : undefined;
    if (!isMap(into)) throw new Unsupported('second_pwm.into is not a map');
    const parts: Array<['r' | 'c', number | null, 'resistance' | 'capacitance']> = [
      ['r', target.secondPwm.r, 'resistance'],
      ['c', target.secondPwm.c, 'capacitance'],
    ];
    for (const [key, value, dim] of parts) {
      if (value === null) continue;
      const node = into.get(key, true);
      if (!isScalar(node)) throw new Unsupported(`second_pwm.into.${key} is not a plain value`);
      if (sameValue(valueOf(node, dim), value)) continue;
      const to = formatIec60062(value, dim);
      edits.push({ start: node.range![0], end: node.range![1], text: to });
      changes.push({ path: `second_pwm.into.${key}`, from: sourceOf(text, node), to });
    }
  }
  return { edits, changes };
}

function stageSplices(text: string, filter: YAMLMap, seq: YAMLSeq, want: AnyCandidateStage[], edits: Splice[], changes: DesignEdit[]) {
  const items = seq.items as Node[];
  const keep = Math.min(items.length, want.length);
  for (let i = 0; i < keep; i++) {
    const item = items[i];
    const want_i = want[i];
    const path = `filter.stages[${i}]`;
    if (isActive(want_i)) {
      // A Sallen-Key stage over one in the file: each of r1, r2, c1, c2 that differs is spliced.
      const nodes = SK_PARTS.map(([key]) => (isMap(item) ? item.get(key, true) : undefined));
      const active = isMap(item) ? item.get('active', true) : undefined;
      if (isMap(item) && isScalar(active) && active.value === 'sallen-key' && nodes.every((n) => isScalar(n))) {
        SK_PARTS.forEach(([key, dim], k) => {
          const node = nodes[k] as Node;
          if (sameValue(valueOf(node, dim), want_i[key])) return;
          const to = formatIec60062(want_i[key], dim);
          edits.push({ start: node.range![0], end: node.range![1], text: to });
          changes.push({ path: `${path}.${key}`, from: sourceOf(text, node), to });
        });
      } else {
        const from = sourceOf(text, item).replace(/\s+/g, ' ').trim();
        const to = stageFlow(want_i);
        edits.push({ start: item.range![0], end: item.range![1], text: to });
        changes.push({ path, from, to });
      }
      continue;
    }
    const s = want_i as CandidateStage;
    const r = isMap(item) ? item.get('r', true) : undefined;
    const c = isMap(item) ? item.get('c', true) : undefined;
    const buffered = isMap(item) ? item.get('buffered', true) : undefined;
    const bufferedNow = isScalar(buffered) && buffered.value === true;
    const plain = isMap(item) && isScalar(r) && isScalar(c) && item.items.every((p) => isScalar(p.key) && ['r', 'c', 'buffered'].includes(String(p.key.value)));
    if (!plain || (buffered !== undefined && !isScalar(buffered)) || (!bufferedNow && s.buffered === true && buffered === undefined)) {
      // Another kind of stage, or a follower to add: the whole stage is replaced.
      const from = sourceOf(text, item).replace(/\s+/g, ' ').trim();
      const to = stageFlow(s);
      if (from !== to) {
        edits.push({ start: item.range![0], end: item.range![1], text: to });
        changes.push({ path, from, to });
      }
      continue;
    }
    for (const [key, node, value, dim] of [
      ['r', r, s.r, 'resistance'],
      ['c', c, s.c, 'capacitance'],
    ] as const) {
      if (sameValue(valueOf(node, dim), value)) continue;
      const to = formatIec60062(value, dim);
      edits.push({ start: node.range![0], end: node.range![1], text: to });
      changes.push({ path: `${path}.${key}`, from: sourceOf(text, node), to });
    }
    if (isScalar(buffered) && bufferedNow !== (s.buffered === true)) {
      const to = String(s.buffered === true);
      edits.push({ start: buffered.range![0], end: buffered.range![1], text: to });
      changes.push({ path: `${path}.buffered`, from: sourceOf(text, buffered), to });
    }
  }

  if (items.length > want.length) {
    // Remove the surplus stages, with their lines (block list) or their separators (flow list).
    const first = items[want.length];
    const last = items[items.length - 1];
    if (seq.flow) {
      const start = want.length === 0 ? first.range![0] : items[want.length - 1].range![1];
      edits.push({ start, end: last.range![1], text: '' });
    } else {
      edits.push({ start: lineStart(text, first.range![0]), end: lineEnd(text, Math.max(last.range![1], last.range![2] - 1)), text: '' });
    }
    for (let i = want.length; i < items.length; i++) {
      changes.push({ path: `filter.stages[${i}]`, from: sourceOf(text, items[i]).replace(/\s+/g, ' ').trim(), to: null });
    }
  }

  if (want.length > items.length) {
    const added = want.slice(items.length);
    if (items.length === 0) {
      // `stages: []` (or an empty value): write a block list under the key.
      const pair = filter.items.find((p) => isScalar(p.key) && p.key.value === 'stages') as Pair<Node, Node>;
      const keyStart = pair.key.range![0];
      const indent = ' '.repeat(keyStart - lineStart(text, keyStart) + 2);
      const block = added.map((s) => `\n${indent}- ${stageFlow(s)}`).join('');
      edits.push({ start: pair.key.range![1] + 1, end: seq.range![1], text: block });
    } else if (seq.flow) {
      edits.push({ start: items[items.length - 1].range![1], end: items[items.length - 1].range![1], text: added.map((s) => `, ${stageFlow(s)}`).join('') });
    } else {
      const last = items[items.length - 1];
      const dash = text.lastIndexOf('-', last.range![0]);
      const indent = text.slice(lineStart(text, dash), dash);
      if (indent.trim() !== '') throw new Unsupported('filter.stages items do not start their lines');
      const at = lineEnd(text, Math.max(last.range![1], last.range![2] - 1));
      const nl = at === text.length && !text.endsWith('\n') ? '\n' : '';
      edits.push({ start: at, end: at, text: nl + added.map((s) => `${indent}- ${stageFlow(s)}\n`).join('') });
    }
    added.forEach((s, k) => changes.push({ path: `filter.stages[${items.length + k}]`, from: null, to: stageFlow(s) }));
  }
}

/** Insert `key: value` into a map, after its last pair (block: a line of its own at the keys' indent). */
function insertPair(text: string, map: YAMLMap, key: string, value: string, edits: Splice[]) {
  const last = map.items[map.items.length - 1] as Pair<Node, Node> | undefined;
  if (!last || !last.value) throw new Unsupported(`cannot add ${key} to an empty map`);
  if (map.flow) {
    edits.push({ start: last.value.range![1], end: last.value.range![1], text: `, ${key}: ${value}` });
    return;
  }
  const first = map.items[0].key as Node;
  const indent = ' '.repeat(first.range![0] - lineStart(text, first.range![0]));
  const at = lineEnd(text, Math.max(last.value.range![1], last.value.range![2] - 1));
  edits.push({ start: at, end: at, text: `${at === text.length && !text.endsWith('\n') ? '\n' : ''}${indent}${key}: ${value}\n` });
}

/** The same changes through the Document API (setIn, toString): comments and key order kept, spacing may change. */
function rewrite(text: string, target: Target): string {
  const doc = parseDocument(text, { version: '1.2' });
  const stages = new YAMLSeq();
  for (const s of target.stages) {
    const m = new YAMLMap();
    m.flow = true;
    if (isActive(s)) {
      m.set('active', 'sallen-key');
      for (const [key, dim] of SK_PARTS) m.set(key, formatIec60062(s[key], dim));
    } else {
      m.set('r', formatIec60062(s.r, 'resistance'));
      m.set('c', formatIec60062(s.c, 'capacitance'));
      if (s.buffered) m.set('buffered', true);
    }
    stages.items.push(m);
  }
  if (!isMap(doc.get('filter'))) doc.set('filter', new YAMLMap());
  doc.setIn(['filter', 'stages'], stages);
  if (target.secondPwm) {
    doc.setIn(['second_pwm', 'into', 'r'], formatIec60062(target.secondPwm.r, 'resistance'));
    if (target.secondPwm.c !== null) doc.setIn(['second_pwm', 'into', 'c'], formatIec60062(target.secondPwm.c, 'capacitance'));
  }
  if (target.bits !== null && doc.hasIn(['pwm']) && doc.getIn(['pwm', 'bits']) !== target.bits) {
    doc.setIn(['pwm', 'bits'], target.bits);
    if (doc.hasIn(['pwm', 'frequency'])) doc.setIn(['pwm', 'frequency'], formatEng(target.frequency, 'Hz', 8));
  }
  return doc.toString({ lineWidth: 0 });
}

/** A stage as a YAML text states it, as SI (NaN where a value does not read). */
function stageBack(m: unknown): AnyCandidateStage {
  if (isMap(m) && m.get('active') === 'sallen-key') {
    const part = (key: string, dim: Dimension) => valueOf(m.get(key, true), dim);
    return { active: 'sallen-key', r1: part('r1', 'resistance'), r2: part('r2', 'resistance'), c1: part('c1', 'capacitance'), c2: part('c2', 'capacitance') };
  }
  return {
    r: isMap(m) ? valueOf(m.get('r', true), 'resistance') : NaN,
    c: isMap(m) ? valueOf(m.get('c', true), 'capacitance') : NaN,
    buffered: isMap(m) && m.get('buffered') === true,
  };
}

/** The stages, bits and second output's parts a YAML text states, as SI, for the read-back check. */
function readBack(text: string): { stages: AnyCandidateStage[]; bits: number | undefined; second: { r: number; c: number } | null } | null {
  const doc = parseDocument(text, { version: '1.2' });
  if (doc.errors.length > 0) return null;
  const stages = doc.getIn(['filter', 'stages'], true);
  if (!isSeq(stages)) return null;
  const into = doc.getIn(['second_pwm', 'into'], true);
  return {
    stages: (stages.items as unknown[]).map(stageBack),
    bits: (doc.getIn(['pwm', 'bits']) as number | undefined) ?? undefined,
    second: isMap(into) ? { r: valueOf(into.get('r', true), 'resistance'), c: valueOf(into.get('c', true), 'capacitance') } : null,
  };
}

/** Whether two stages are the same design. */
function sameStage(a: AnyCandidateStage, b: AnyCandidateStage): boolean {
  if (isActive(a) || isActive(b)) return isActive(a) && isActive(b) && SK_PARTS.every(([k]) => sameValue(a[k], b[k]));
  const x = a as CandidateStage;
  const y = b as CandidateStage;
  return sameValue(x.r, y.r) && sameValue(x.c, y.c) && (x.buffered === true) === (y.buffered === true);
}

function agrees(text: string, target: Target): boolean {
  const got = readBack(text);
  if (!got || got.stages.length !== target.stages.length) return false;
  const stagesAgree = got.stages.every((s, i) => sameStage(s, target.stages[i]));
  const secondAgrees =
    !target.secondPwm ||
    (got.second !== null && sameValue(got.second.r, target.secondPwm.r) && (target.secondPwm.c === null || sameValue(got.second.c, target.secondPwm.c)));
  return stagesAgree && secondAgrees && (target.bits === null || got.bits === undefined || Number(got.bits) === target.bits);
}

/**
 * The project file's text with `filter.stages` set to a chosen design and, for a design at another
 * resolution, `pwm.bits` (and `pwm.frequency` when the file states it) set to the design's; for a
 * version 1.1 circuit, each Sallen-Key stage's r1, r2, c1, c2 and `second_pwm.into.r` / `.c` as the
 * design chose them (a loadable version 1.1 project); nothing else changes. Each change is listed (`pwm.bits 8 -> 6`, `filter.stages[0].r 10k -> 4k7`,
 * `filter.stages[1] added: { r: 8k2, c: 1n0 }`); values that already read as the design's stay as
 * written (`10 kohm` is not rewritten as `10k`). New values are IEC 60062 codes.
 *
 * Method: the yaml package's Document API (parseDocument) finds every node and its source range;
 * only the ranges that must change are spliced into the original text, so comments, their
 * alignment, key order and spacing survive byte for byte. The result is read back and compared
 * with the design; a file shape the splicer does not handle (aliases, a flow-style top level) is
 * written through the Document API's setIn and toString instead (comments and order kept, spacing
 * may change), and `method` says so.
 *
 * Syntax: withDesign(text, candidate)
 * Example: withDesign('pwm:\n  bits: 8\nfilter:\n  stages:\n    - { r: 10k, c: 1u }\n', { stages: [{ r: 4700, c: 1e-6 }], bits: 6, frequency: 250e3 })
 *          // { text: 'pwm:\n  bits: 6\nfilter:\n  stages:\n    - { r: 4k7, c: 1u }\n',
 *          //   changes: [{ path: 'filter.stages[0].r', from: '10k', to: '4k7' }, { path: 'pwm.bits', from: '8', to: '6' }], method: 'edited' }
 */
export function withDesign(text: string, candidate: Target): WrittenDesign {
  const doc = parseDocument(text, { version: '1.2' });
  if (doc.errors.length > 0) throw new Error(`cannot rewrite the project file: ${doc.errors[0].message}`);
  try {
    const { edits, changes } = splices(text, doc, candidate);
    let out = text;
    // New lines take the file's own line ending.
    const eol = text.includes('\r\n') ? '\r\n' : '\n';
    for (const e of [...edits].sort((a, b) => b.start - a.start)) out = out.slice(0, e.start) + e.text.replace(/\n/g, eol) + out.slice(e.end);
    if (agrees(out, candidate)) return { text: out, changes, method: 'edited' };
  } catch (error) {
    if (!(error instanceof Unsupported)) throw error;
  }
  const out = rewrite(text, candidate);
  if (!agrees(out, candidate)) throw new Error('cannot rewrite the project file: the written design does not read back as chosen');
  return { text: out, changes: rewriteChanges(text, candidate), method: 'rewritten' };
}

/** The change list of a rewrite, from the old values (so the user still sees what changed). */
function rewriteChanges(text: string, target: Target): DesignEdit[] {
  const old = readBack(text);
  const before = old?.stages ?? [];
  const changes: DesignEdit[] = [];
  const n = Math.max(before.length, target.stages.length);
  for (let i = 0; i < n; i++) {
    const a = before[i];
    const b = target.stages[i];
    const path = `filter.stages[${i}]`;
    const text = (s: AnyCandidateStage) => (Object.values(s).every((v) => typeof v !== 'number' || Number.isFinite(v)) ? stageFlow(s) : '(another kind of stage)');
    if (!a) changes.push({ path, from: null, to: stageFlow(b) });
    else if (!b) changes.push({ path, from: text(a), to: null });
    else if (!sameStage(a, b)) changes.push({ path, from: text(a), to: stageFlow(b) });
  }
  if (target.secondPwm && old?.second) {
    for (const [key, dim] of [['r', 'resistance'], ['c', 'capacitance']] as const) {
      const to = target.secondPwm[key];
      if (to === null || sameValue(old.second[key], to)) continue;
      changes.push({ path: `second_pwm.into.${key}`, from: formatIec60062(old.second[key], dim), to: formatIec60062(to, dim) });
    }
  }
  if (target.bits !== null && old?.bits !== undefined && Number(old.bits) !== target.bits) {
    changes.push({ path: 'pwm.bits', from: String(old.bits), to: String(target.bits) });
  }
  return changes;
}
