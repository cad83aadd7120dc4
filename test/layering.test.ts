import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The import boundaries of .dependency-cruiser.cjs, checked with dependency-cruiser (npm), on src/
// and on a fixture tree with one violation of each kind (test/fixtures/layering).
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bin = join(root, 'node_modules', 'dependency-cruiser', 'bin', 'dependency-cruise.mjs');
const config = join(root, '.dependency-cruiser.cjs');

interface Violation {
  from: string;
  to: string;
  rule: { name: string };
}

/** Run the cruiser in `cwd` over its src/ and return the rule violations. */
function violations(cwd: string): Violation[] {
  let out: string;
  try {
    out = execFileSync(process.execPath, [bin, 'src', '--config', config, '--output-type', 'json'], { cwd, encoding: 'utf8' });
  } catch (error) {
    // exit code = number of errors; the JSON is still on stdout
    out = (error as { stdout: string }).stdout;
  }
  return (JSON.parse(out) as { summary: { violations: Violation[] } }).summary.violations;
}

describe('import boundaries (DEVELOPERS.md, "Where each concern lives")', () => {
  it('src/ keeps them: no upward or sideways import, no cycle', () => {
    const found = violations(root).map((v) => `${v.rule.name}: ${v.from} -> ${v.to}`);
    expect(found).toEqual([]);
  });

  it('the checker fails a tree that breaks them, naming each broken rule', () => {
    const found = violations(join(root, 'test', 'fixtures', 'layering'));
    const pairs = found.map((v) => `${v.rule.name}: ${v.from} -> ${v.to}`);
    expect(pairs).toContain('circuit-imports-down-only: src/circuit/circuit.ts -> src/project/project.ts');
    expect(pairs).toContain('design-imports-down-only: src/design/search.ts -> src/tolerance/spread.ts');
    expect(pairs).toContain('report-imports-only-types-from-the-core: src/report/text.ts -> src/engine/first.ts');
    expect(pairs.some((p) => p.startsWith('no-circular: src/engine/first.ts -> src/engine/second.ts') || p.startsWith('no-circular: src/engine/second.ts -> src/engine/first.ts'))).toBe(true);
    expect(pairs).toContain('engine-only-through-its-index: src/tolerance/spread.ts -> src/engine/first.ts');
    // the allowed imports of the fixture (project -> circuit types, report -> circuit type,
    // tolerance -> engine/index.ts) are not reported
    expect(pairs.some((p) => p.includes('src/project/project.ts ->') && !p.startsWith('no-circular'))).toBe(false);
    expect(pairs.some((p) => p.includes('src/tolerance/viaIndex.ts'))).toBe(false);
    expect(pairs.some((p) => p.includes('-> src/circuit/circuit.ts') && p.startsWith('report'))).toBe(false);
  });
});
