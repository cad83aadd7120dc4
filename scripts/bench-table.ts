/** The shapes `npm run bench` reports in, and the plain-text table it prints. */

/** One block of the printed table. */
export interface BenchSection {
  title: string;
  columns: string[];
  rows: Array<Array<string | number>>;
  /** Lines printed under the block. */
  notes: string[];
}

/** A performance target of the project and whether this run met it (null: not measured). */
export interface BenchTarget {
  name: string;
  goal: string;
  measured: string;
  met: boolean | null;
}

export interface BenchMachine {
  cpu: string;
  cores: number;
  node: string;
  platform: string;
  /** 1-minute load average when the bench started and when it ended. */
  loadBefore: number;
  loadAfter: number;
}

export interface BenchReport {
  machine: BenchMachine;
  sections: BenchSection[];
  targets: BenchTarget[];
  /** Wall time of the whole bench, s. */
  seconds: number;
  /** Section name -> its measurements, SI units (s, Hz), for --json. */
  data: Record<string, unknown>;
}

/**
 * The bench report as aligned plain text: the machine, one block per section (title, columns,
 * rows, notes), then the targets with "met", "NOT met" or "not measured".
 *
 * Syntax: benchTable(report)
 * Example: benchTable(report).split('\n')[0]   // 'dacsmith bench - AMD EPYC, 2 cores, Node v20.20.2, linux'
 */
export function benchTable(report: BenchReport): string {
  const m = report.machine;
  const lines = [
    `dacsmith bench - ${m.cpu}, ${m.cores} cores, Node ${m.node}, ${m.platform}`,
    `load average (1 min): ${m.loadBefore.toFixed(2)} at start, ${m.loadAfter.toFixed(2)} at end; each figure is a median of several runs`,
    '',
  ];
  for (const section of report.sections) {
    lines.push(section.title, ...grid(section.columns, section.rows), ...section.notes.map((n) => `  ${n}`), '');
  }
  lines.push('Targets', ...grid(['target', 'goal', 'measured', 'result'], report.targets.map((t) => [t.name, t.goal, t.measured, verdict(t.met)])));
  lines.push('', `bench time ${report.seconds.toFixed(0)} s`);
  return `${lines.join('\n')}\n`;
}

const verdict = (met: boolean | null): string => (met === null ? 'not measured' : met ? 'met' : 'NOT met');

/** Columns padded to their widest cell; numbers right-aligned, text left-aligned. */
function grid(columns: string[], rows: Array<Array<string | number>>): string[] {
  const cells = rows.map((row) => row.map((c) => (typeof c === 'number' ? formatNumber(c) : c)));
  const widths = columns.map((h, i) => Math.max(h.length, ...cells.map((r) => (r[i] ?? '').length)));
  const numeric = columns.map((_, i) => rows.length > 0 && rows.every((r) => typeof r[i] === 'number'));
  const line = (r: string[]) =>
    `  ${r.map((c, i) => (numeric[i] ? c.padStart(widths[i]) : c.padEnd(widths[i]))).join('  ')}`.trimEnd();
  return [line(columns), line(widths.map((w) => '-'.repeat(w))), ...cells.map(line)];
}

/** Three significant digits, plain notation from 0.001 to 1e6, else exponent notation. */
export function formatNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  if (a !== 0 && (a < 1e-3 || a >= 1e6)) return x.toExponential(2);
  if (Number.isInteger(x)) return String(x);
  return String(Number(x.toPrecision(3)));
}
