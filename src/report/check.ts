import type { Check } from '../engine/checks.js';
import { formatEng } from '../units/index.js';
import { palette } from './color.js';
import { textWidth, wrapParagraph, wrapText } from './wrapText.js';

/** What `check` found for one file: its spec checks, or why it could not be read. */
export interface CheckedFile {
  file: string;
  /** Every check holds (false when the file is invalid). */
  pass: boolean;
  checks: Check[];
  /** LSB of the project, V (null when unknown or invalid). */
  lsb: number | null;
  /** The message when the file is invalid (FILE:LINE:COL: key.path: message). */
  error?: string;
}

export type CheckFormat = 'text' | 'markdown' | 'json';

export interface CheckRenderOptions {
  /** ANSI colour for the text format (default false). */
  color?: boolean;
  /** Text: the widest line, columns (default 80); longer lines wrap under the details. */
  width?: number;
}

/**
 * A value and its limit in engineering units, with enough digits that they read differently when
 * they differ (a ripple just over its limit must not print as '1.61 mV > 1.61 mV').
 */
function valueAndLimit(value: number, limit: number, unit: string): [string, string] {
  for (let digits = 3; digits < 8; digits++) {
    const pair: [string, string] = [formatEng(value, unit, digits), formatEng(limit, unit, digits)];
    if (pair[0] !== pair[1] || value === limit) return pair;
  }
  return [formatEng(value, unit, 8), formatEng(limit, unit, 8)];
}

/** 'ripple 4.12 mV > 1.61 mV' or 'settling never settles (limit 20 ms)'. */
function failure(c: Check): string {
  if (c.value === null) return `${c.name} never settles (limit ${formatEng(c.limit, c.unit, 3)})`;
  const [value, limit] = valueAndLimit(c.value, c.limit, c.unit);
  return `${c.name} ${value} > ${limit}`;
}

/** What a line says after the verdict. */
function details(f: CheckedFile): string {
  if (f.error !== undefined) return f.error;
  if (f.checks.length === 0) return 'no spec limits given';
  const failed = f.checks.filter((c) => !c.pass);
  if (failed.length === 0) return f.checks.length === 1 ? '1 check holds' : `${f.checks.length} checks hold`;
  return failed.map(failure).join(', ');
}

const verdictOf = (f: CheckedFile): 'PASS' | 'FAIL' | 'INVALID' => (f.error !== undefined ? 'INVALID' : f.pass ? 'PASS' : 'FAIL');

/** 'all 3 files pass' / '1 of 3 files fails its spec, 1 invalid'. */
function summary(files: CheckedFile[]): string {
  const n = files.length;
  const invalid = files.filter((f) => f.error !== undefined).length;
  const failing = files.filter((f) => f.error === undefined && !f.pass).length;
  if (invalid === 0 && failing === 0) return n === 1 ? 'the file passes its spec' : `all ${n} files pass their spec`;
  const parts: string[] = [];
  if (failing > 0) parts.push(`${failing} of ${n} file${n > 1 ? 's' : ''} ${failing > 1 ? 'fail their' : 'fails its'} spec`);
  if (invalid > 0) parts.push(`${invalid} of ${n} file${n > 1 ? 's' : ''} ${invalid > 1 ? 'are' : 'is'} invalid`);
  return parts.join(', ');
}

/** Escape what would end a GitHub-flavoured Markdown table cell. */
const cell = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');

/**
 * Render the results of `check`:
 * - `text`: one line per valid file, `PASS  file  (n checks hold)` or
 *   `FAIL  file  ripple 4.12 mV > 1.61 mV, ...` (invalid files are left to standard error);
 * - `markdown`: a heading, a verdict line and a table (file, result, details) for a CI summary;
 * - `json`: `{ files: [{ file, pass, checks, error? }], pass }`, SI units, nothing else.
 *
 * Syntax: renderCheck(files, format[, { color }])
 * Example: renderCheck([{ file: 'a.yaml', pass: true, checks: [], lsb: null }], 'text')
 *          // 'PASS  a.yaml  (no spec limits given)\n'
 */
export function renderCheck(files: CheckedFile[], format: CheckFormat, options: CheckRenderOptions = {}): string {
  const pass = files.every((f) => f.pass && f.error === undefined);
  if (format === 'json') {
    const body = {
      files: files.map((f) => ({
        file: f.file,
        pass: f.pass && f.error === undefined,
        checks: f.checks,
        ...(f.error !== undefined ? { error: f.error } : {}),
      })),
      pass,
    };
    return JSON.stringify(body, null, 2) + '\n';
  }

  if (format === 'markdown') {
    const rows = files.map((f) => `| ${cell(f.file)} | ${verdictOf(f)} | ${cell(details(f))} |`);
    return [
      '## dacsmith check',
      '',
      `**${pass ? 'PASS' : 'FAIL'}**: ${summary(files)}.`,
      '',
      '| File | Result | Details |',
      '|:---|:---|:---|',
      ...rows,
      '',
    ].join('\n');
  }

  const paint = palette(options.color ?? false);
  const valid = files.filter((f) => f.error === undefined);
  const width = Math.max(0, ...valid.map((f) => f.file.length));
  const columns = options.width ?? 80;
  const lines = valid.map((f) => {
    const head = `${f.pass ? paint.good('PASS') : paint.bad('FAIL')}  ${f.file.padEnd(width)}  `;
    const text = f.pass ? `(${details(f)})` : details(f);
    // A long file name leaves no room beside it: the details then go on the lines below.
    return textWidth(head) + 20 <= columns
      ? wrapParagraph(text, columns, head, ' '.repeat(textWidth(head)))
      : `${f.pass ? paint.good('PASS') : paint.bad('FAIL')}  ${wrapText(f.file, columns - 6).join('\n      ')}\n${wrapParagraph(text, columns, '      ', '      ')}`;
  });
  return lines.length > 0 ? lines.join('\n') + '\n' : '';
}
