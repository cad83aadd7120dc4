/**
 * Findings of the fuzz suite (cli.fuzz.test.ts, larger runs than the one in npm test), each kept
 * as a named project file and held to the exit-code contract of model.md (0, 1 or 2, never 70).
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { root, runBuilt } from '../cli/runBuilt.js';

const fixture = (name: string) => join(root, 'test', 'fixtures', 'projects', name);

describe('fuzz findings', () => {
  it('a 2.6e-123 ohm load: design says it is outside the numerical domain (exit 2), not a root-finder error (was exit 70)', () => {
    const r = runBuilt(['design', fixture('fuzz-load-short.yaml'), '--no-charts']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/fuzz-load-short\.yaml:\d+:\d+: filter: the fastest time constant = .* less than 1e-9/);
    expect(r.stderr).not.toMatch(/internal error|brentRoot/);
  });

  it('a valid file with followers in its own filter: design answers (it ran past 20 s with no output)', () => {
    const r = runBuilt(['design', fixture('fuzz-design-followers.yaml'), '--no-charts', '--format', 'json']);
    expect([0, 1]).toContain(r.code);
    const out = JSON.parse(r.stdout);
    expect(out.warnings ?? []).toBeDefined();
    expect(typeof out.pass).toBe('boolean');
  });
});
