import { ofFullScale } from './quantities.js';
import type { Check, Warning } from '../engine/index.js';
import type { KeyPosition, ProjectIssue } from '../project/index.js';
import { checkKey } from './checkKey.js';
import { formatEng } from '../units/index.js';
import { palette } from './color.js';
import { textWidth, wrapParagraph, wrapText } from './wrapText.js';

/** What `check` found for one file: its spec checks, or why it could not be read. */
export interface CheckedFile {
  file: string;
  /** Every check holds (false when the file is invalid; with --strict, also false on a warning). */
  pass: boolean;
  checks: Check[];
  /** Plausibility warnings of the file (empty when none or invalid). */
  warnings: Warning[];
  /** LSB of the project, V (null when unknown or invalid). */
  lsb: number | null;
  /** The message when the file is invalid (FILE:LINE:COL: key.path: message). */
  error?: string;
  /** Why the file was not checked: a design-only file (a search and no filter) has no spec to hold. */
  skipped?: string;
  /** Where each limit and warned key sits in the file (key path -> line, column), for annotations. */
  positions?: ReadonlyMap<string, KeyPosition>;
  /** Each problem of an invalid file with its key path and, when known, line and column. */
  problems?: readonly ProjectIssue[];
  /** Said after a failing check's annotation, by check name (compare: 'passed in main.yaml'). */
  checkNotes?: Readonly<Record<string, string>>;
}

export type CheckFormat = 'text' | 'markdown' | 'json' | 'github';

export interface CheckRenderOptions {
  /** ANSI colour for the text format (default false). */
  color?: boolean;
  /** `check --strict`: warnings count as failures (default false). */
  strict?: boolean;
  /** Text: the widest line, columns (default 80); longer lines wrap under the details. */
  width?: number;
  /** GitHub: what the summary line starts with (default 'dacsmith check'). */
  command?: string;
}

/** A check value or limit: a fraction of full scale ('1') in percent, else engineering units. */
function quantity(x: number, unit: Check['unit'], digits: number): string {
  return unit === '1' ? ofFullScale(x, digits) : formatEng(x, unit, digits);
}

/**
 * A value and its limit in engineering units, with enough digits that they read differently when
 * they differ (a ripple just over its limit must not print as '1.61 mV > 1.61 mV').
 */
function valueAndLimit(value: number, limit: number, unit: Check['unit']): [string, string] {
  for (let digits = 3; digits < 8; digits++) {
    const pair: [string, string] = [quantity(value, unit, digits), quantity(limit, unit, digits)];
    if (pair[0] !== pair[1] || value === limit) return pair;
  }
  return [quantity(value, unit, 8), quantity(limit, unit, 8)];
}

/** 'ripple 4.12 mV > 1.61 mV' or 'settling never settles (limit 20 ms)'. */
export function failure(c: Check): string {
  if (c.value === null) return `${c.name} never settles (limit ${quantity(c.limit, c.unit, 3)})`;
  const [value, limit] = valueAndLimit(c.value, c.limit, c.unit);
  return `${c.name} ${value} > ${limit}`;
}

const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** What a line says after the verdict; warnings are counted, and named as failures with --strict. */
function details(f: CheckedFile, strict: boolean): string {
  if (f.error !== undefined) return f.error;
  if (f.skipped !== undefined) return f.skipped;
  const failed = f.checks.filter((c) => !c.pass);
  const w = f.warnings.length;
  const parts: string[] = [];
  if (f.checks.length === 0) parts.push('no spec limits given');
  else if (failed.length === 0) parts.push(f.checks.length === 1 ? '1 check holds' : `${f.checks.length} checks hold`);
  else parts.push(failed.map(failure).join(', '));
  if (w > 0) parts.push(strict ? `${count(w, 'warning')} (strict: fails): ${f.warnings.map((x) => x.key).join(', ')}` : count(w, 'warning'));
  return parts.join('; ');
}

const verdictOf = (f: CheckedFile): 'PASS' | 'FAIL' | 'INVALID' | 'SKIP' =>
  f.error !== undefined ? 'INVALID' : f.skipped !== undefined ? 'SKIP' : f.pass ? 'PASS' : 'FAIL';

/** 'all 3 files pass' / '1 of 3 files fails its spec, 1 invalid'. */
function summary(files: CheckedFile[], strict: boolean): string {
  const skipped = files.filter((f) => f.skipped !== undefined).length;
  const skippedNote = skipped > 0 ? ` (${skipped} design-only file${skipped > 1 ? 's' : ''} skipped)` : '';
  files = files.filter((f) => f.skipped === undefined);
  const n = files.length;
  const invalid = files.filter((f) => f.error !== undefined).length;
  const failing = files.filter((f) => f.error === undefined && !f.pass).length;
  if (invalid === 0 && failing === 0) return (n === 1 ? 'the file passes its spec' : `all ${n} files pass their spec`) + skippedNote;
  const parts: string[] = [];
  const what = strict ? ' (or warn: --strict)' : '';
  if (failing > 0) parts.push(`${failing} of ${n} file${n > 1 ? 's' : ''} ${failing > 1 ? 'fail their' : 'fails its'} spec${what}`);
  if (invalid > 0) parts.push(`${invalid} of ${n} file${n > 1 ? 's' : ''} ${invalid > 1 ? 'are' : 'is'} invalid`);
  return parts.join(', ') + skippedNote;
}

/** Escape what would end a GitHub-flavoured Markdown table cell. */
const cell = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');

/** Every file's warnings, `file: key: message`. */
const warningLines = (files: CheckedFile[]) => files.flatMap((f) => f.warnings.map((w) => `${f.file}: ${w.key}: ${w.message}`));

/**
 * GitHub's workflow-command escaping (from memory of actions/toolkit, command.ts: escapeData and
 * escapeProperty): in the message `%`, CR and LF become %25, %0D, %0A; in a property value also
 * `:` and `,` (they end a property) become %3A and %2C.
 */
const escapeData = (s: string) => s.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A');
const escapeProperty = (s: string) => escapeData(s).replace(/:/g, '%3A').replace(/,/g, '%2C');

/** One workflow command: `::error file=F,line=L,col=C,title=T::message`. */
function annotation(level: 'error' | 'warning', file: string, at: { line?: number; column?: number } | undefined, title: string, message: string): string {
  const props = [`file=${escapeProperty(file)}`];
  if (at?.line !== undefined) props.push(`line=${at.line}`, `col=${at.column ?? 1}`);
  props.push(`title=${escapeProperty(title)}`);
  return `::${level} ${props.join(',')}::${escapeData(message)}`;
}

/**
 * GitHub Actions annotations: one `::error` per failing check at the line of its limit, one
 * `::warning` per plausibility warning at its key (`::error` under --strict, where it fails), one
 * `::error` per problem of an invalid file; then a plain summary line for the log.
 */
function githubAnnotations(files: CheckedFile[], strict: boolean, command: string): string {
  const lines: string[] = [];
  for (const f of files) {
    if (f.error !== undefined) {
      const problems = f.problems && f.problems.length > 0 ? f.problems : [{ path: '', message: f.error }];
      for (const p of problems) {
        const at = 'line' in p ? p : undefined;
        lines.push(annotation('error', f.file, at, 'dacsmith: invalid project file', p.path ? `${p.path}: ${p.message}` : p.message));
      }
      continue;
    }
    for (const c of f.checks.filter((k) => !k.pass)) {
      const key = checkKey(c.name);
      const at = f.positions?.get(key);
      const where = at === undefined || at.exact ? `limit ${key}` : `default limit: the file has no ${key}`;
      const note = f.checkNotes?.[c.name];
      lines.push(annotation('error', f.file, at, `dacsmith: ${c.name} fails`, `${failure(c)} (${where})${note ? `; ${note}` : ''}`));
    }
    for (const w of f.warnings) {
      const title = strict ? 'dacsmith: warning (strict: fails)' : 'dacsmith: warning';
      lines.push(annotation(strict ? 'error' : 'warning', f.file, f.positions?.get(w.key), title, `${w.key}: ${w.message}`));
    }
  }
  lines.push(`${command}: ${summary(files, strict)}`);
  return lines.join('\n') + '\n';
}

/**
 * Render the results of `check`:
 * - `text`: one line per valid file, `PASS  file  (n checks hold)` or
 *   `FAIL  file  ripple 4.12 mV > 1.61 mV, ...` (invalid files are left to standard error), then a
 *   "Warnings" heading with one line per warning when there are any;
 * - `markdown`: a heading, a verdict line and a table (file, result, details) for a CI summary, and
 *   a "Warnings" list when there are any;
 * A design-only file (a search and no filter) is listed as SKIP and neither passes nor fails.
 * - `json`: `{ files: [{ file, pass, checks, warnings, error?, skipped? }], warnings: [{ file, key, message }],
 *   strict, pass }`, SI units, nothing else;
 * - `github`: GitHub Actions workflow commands, `::error file=F,line=L,col=C,title=T::message` per
 *   failing check at the line of its limit (from `positions`), `::warning` per warning, then a
 *   summary line.
 * With `strict` (check --strict) a warning is a failure: the caller sets `pass` so, and the details
 * name the warned keys.
 *
 * Syntax: renderCheck(files, format[, { color, strict }])
 * Example: renderCheck([{ file: 'a.yaml', pass: true, checks: [], warnings: [], lsb: null }], 'text')
 *          // 'PASS  a.yaml  (no spec limits given)\n'
 */
export function renderCheck(files: CheckedFile[], format: CheckFormat, options: CheckRenderOptions = {}): string {
  const strict = options.strict ?? false;
  const pass = files.every((f) => f.pass && f.error === undefined);
  if (format === 'github') return githubAnnotations(files, strict, options.command ?? 'dacsmith check');
  if (format === 'json') {
    const body = {
      files: files.map((f) => ({
        file: f.file,
        pass: f.pass && f.error === undefined,
        checks: f.checks,
        warnings: f.warnings,
        ...(f.error !== undefined ? { error: f.error } : {}),
        ...(f.skipped !== undefined ? { skipped: f.skipped } : {}),
      })),
      warnings: files.flatMap((f) => f.warnings.map((w) => ({ file: f.file, ...w }))),
      strict,
      pass,
    };
    return JSON.stringify(body, null, 2) + '\n';
  }

  const warned = warningLines(files);
  if (format === 'markdown') {
    const rows = files.map((f) => `| ${cell(f.file)} | ${verdictOf(f)} | ${cell(details(f, strict))} |`);
    const warnings = warned.length > 0 ? ['', '### Warnings', '', ...warned.map((w) => `- ${w}`), ''] : [];
    return [
      '## dacsmith check',
      '',
      `**${pass ? 'PASS' : 'FAIL'}**: ${summary(files, strict)}.`,
      '',
      '| File | Result | Details |',
      '|:---|:---|:---|',
      ...rows,
      ...warnings,
      '',
    ].join('\n');
  }

  const paint = palette(options.color ?? false);
  const valid = files.filter((f) => f.error === undefined);
  const width = Math.max(0, ...valid.map((f) => f.file.length));
  const columns = options.width ?? 80;
  const lines = valid.map((f) => {
    const verdict = f.skipped !== undefined ? 'SKIP' : f.pass ? paint.good('PASS') : paint.bad('FAIL');
    const head = `${verdict}  ${f.file.padEnd(width)}  `;
    const text = f.skipped !== undefined ? `(${f.skipped})` : f.pass ? `(${details(f, strict)})` : details(f, strict);
    // A long file name leaves no room beside it: the details then go on the lines below.
    return textWidth(head) + 20 <= columns
      ? wrapParagraph(text, columns, head, ' '.repeat(textWidth(head)))
      : `${verdict}  ${wrapText(f.file, columns - 6).join('\n      ')}\n${wrapParagraph(text, columns, '      ', '      ')}`;
  });
  if (warned.length > 0) lines.push('', paint.bold('Warnings'), ...warned.flatMap((w) => wrapParagraph(w, columns, '  - ', '    ').split('\n')));
  return lines.length > 0 ? lines.join('\n') + '\n' : '';
}
