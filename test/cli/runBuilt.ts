/** The built command as a user runs it: `node bin/dacsmith.cjs ...`, no terminal, no colour. */
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository root and the built bin (vitest's globalSetup builds dist/ first). */
export const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const bin = join(root, 'bin', 'dacsmith.cjs');

/**
 * Run the built command in `cwd` with NO_COLOR set (and any extra environment).
 *
 * Syntax: runBuilt(args[, { cwd, env }])
 * Example: runBuilt(['check', 'a.yaml']).code   // 0, 1 or 2
 */
export function runBuilt(args: string[], options: { cwd?: string; env?: Record<string, string> } = {}) {
  const r = spawnSync(process.execPath, [bin, ...args], {
    cwd: options.cwd ?? root,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', ...options.env },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
