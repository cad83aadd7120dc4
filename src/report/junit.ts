import type { CheckedFile } from './check.js';
import { failure } from './check.js';
import { checkKey } from './checkKey.js';

/** XML 1.0 character data and attribute values: the five predefined entities; control characters XML forbids become U+FFFD. */
const xml = (s: string) =>
  s
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');

const attrs = (a: Record<string, string | number | undefined>) =>
  Object.entries(a)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${xml(String(v))}"`)
    .join('');

interface Case {
  name: string;
  line?: number;
  /** failure: the spec fails; error: the file could not be checked; skipped: nothing to check. */
  outcome?: { kind: 'failure' | 'error' | 'skipped'; message: string; type?: string };
}

/** One file's test cases: one per check, one per warning under --strict, one for an invalid or skipped file. */
function casesOf(f: CheckedFile, strict: boolean): Case[] {
  if (f.error !== undefined) return [{ name: 'project file', ...(f.problems?.[0]?.line !== undefined && { line: f.problems[0].line }), outcome: { kind: 'error', message: f.error, type: 'invalid' } }];
  if (f.skipped !== undefined) return [{ name: 'project file', outcome: { kind: 'skipped', message: f.skipped } }];
  const cases: Case[] = f.checks.map((c) => {
    const line = f.positions?.get(checkKey(c.name))?.line;
    return {
      name: c.name,
      ...(line !== undefined && { line }),
      ...(!c.pass && { outcome: { kind: 'failure' as const, message: failure(c), type: 'spec' } }),
    };
  });
  if (strict) {
    for (const w of f.warnings) {
      const line = f.positions?.get(w.key)?.line;
      cases.push({ name: `warning ${w.key}`, ...(line !== undefined && { line }), outcome: { kind: 'failure', message: `${w.key}: ${w.message}`, type: 'warning' } });
    }
  }
  return cases;
}

/**
 * The results of `check` as a JUnit XML report, the shape CI systems read (Jenkins, GitLab, Azure,
 * test-report actions; common practice, no single standard): a `testsuites` root, one `testsuite`
 * per project file (name = the file), one `testcase` per spec check (name = the check,
 * classname = the file, file and line = where its limit is written), a `failure` element (message
 * = 'ripple 4.12 mV > 1.61 mV') for a failing check, an `error` element for a file that could not
 * be read, `skipped` for a design-only file. Warnings are test cases that fail only under --strict;
 * otherwise they are listed in the suite's `system-out`. Counts (tests, failures, errors, skipped)
 * on every suite and on the root. No times: the report of the same files is the same bytes.
 *
 * Syntax: junitReport(files[, { strict, name }])
 * Example: junitReport([{ file: 'a.yaml', pass: true, checks: [], warnings: [], lsb: null }])
 *          // '<?xml version="1.0" encoding="UTF-8"?>\n<testsuites name="dacsmith check" tests="0" ...'
 */
export function junitReport(files: CheckedFile[], options: { strict?: boolean; name?: string } = {}): string {
  const strict = options.strict ?? false;
  const totals = { tests: 0, failures: 0, errors: 0, skipped: 0 };
  const suites = files.map((f) => {
    const cases = casesOf(f, strict);
    const count = (kind: string) => cases.filter((c) => c.outcome?.kind === kind).length;
    const tally = { tests: cases.length, failures: count('failure'), errors: count('error'), skipped: count('skipped') };
    for (const k of Object.keys(totals) as Array<keyof typeof totals>) totals[k] += tally[k];
    const body = cases.map((c) => {
      const head = `    <testcase${attrs({ name: c.name, classname: f.file, file: f.file, line: c.line })}`;
      if (!c.outcome) return `${head}/>`;
      const { kind, message, type } = c.outcome;
      const inner = kind === 'skipped' ? `<skipped${attrs({ message })}/>` : `<${kind}${attrs({ message, type })}>${xml(message)}</${kind}>`;
      return `${head}>\n      ${inner}\n    </testcase>`;
    });
    const out = !strict && f.warnings.length > 0 ? [`    <system-out>${xml(f.warnings.map((w) => `warning: ${w.key}: ${w.message}`).join('\n'))}</system-out>`] : [];
    return [`  <testsuite${attrs({ name: f.file, ...tally })}>`, ...body, ...out, '  </testsuite>'].join('\n');
  });
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites${attrs({ name: options.name ?? 'dacsmith check', ...totals })}>`,
    ...suites,
    '</testsuites>',
    '',
  ].join('\n');
}
