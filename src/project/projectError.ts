import { InputError } from '../units/index.js';

/** One problem found in a project file, with where it is. */
export interface ProjectIssue {
  /** File as the user named it. */
  file: string;
  /** Key path like `filter.stages[1].c`; '' for the file as a whole. */
  path: string;
  /** 1-based line and column of the offending key or value, when the file has one. */
  line?: number;
  column?: number;
  /** What is wrong, in an engineer's words. */
  message: string;
}

/** A problem before its position is known: key path segments and which end of the pair it is about. */
export interface IssueDraft {
  path: ReadonlyArray<string | number>;
  message: string;
  /** Point at the key (unknown or missing keys) or at the value (default). */
  at?: 'key' | 'value';
}

/**
 * `FILE:LINE:COL: key.path: message`, leaving out what is not known.
 *
 * Syntax: formatIssue(issue)
 * Example: formatIssue({ file: 'p.yaml', path: 'pwm.high', line: 4, column: 9, message: 'expected a voltage (V), got ...' })
 *          // 'p.yaml:4:9: pwm.high: expected a voltage (V), got ...'
 */
export function formatIssue(issue: ProjectIssue): string {
  const where = issue.line === undefined ? issue.file : `${issue.file}:${issue.line}:${issue.column ?? 1}`;
  return issue.path ? `${where}: ${issue.path}: ${issue.message}` : `${where}: ${issue.message}`;
}

/**
 * A project file that cannot be used: missing, unreadable, not YAML, or not a valid project.
 * Carries every problem found (`issues`, in file order); `file`, `path`, `line`, `column` and
 * `message` are those of the first.
 *
 * Syntax: new ProjectError(issues)
 * Example: err.format()   // 'p.yaml:12:10: filter.stages[0].c: expected a capacitance (F), got '3.3 V' (a voltage)'
 */
export class ProjectError extends InputError {
  override name = 'ProjectError';
  override readonly file: string;
  readonly path: string;
  readonly line?: number;
  readonly column?: number;
  readonly issues: readonly ProjectIssue[];

  constructor(issues: readonly ProjectIssue[]) {
    if (issues.length === 0) throw new RangeError('ProjectError needs at least one issue');
    const sorted = [...issues].sort(
      (a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0),
    );
    super(sorted[0].message);
    this.issues = sorted;
    this.file = sorted[0].file;
    this.path = sorted[0].path;
    this.line = sorted[0].line;
    this.column = sorted[0].column;
  }

  /** One line per problem: `FILE:LINE:COL: key.path: message`. */
  format(): string {
    return this.issues.map(formatIssue).join('\n');
  }
}
