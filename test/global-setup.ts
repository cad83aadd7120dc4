/**
 * vitest globalSetup: build the bundle once (node scripts/build.mjs) so that CLI tests run
 * bin/dacsmith.cjs like a user. A failed build does not stop other suites: the error is handed to
 * the CLI tests (inject('buildError')), which then fail with it.
 */
import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** null when the build succeeded, else esbuild's message. */
    buildError: string | null;
  }
}

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

export default function setup(project: TestProject): void {
  try {
    execFileSync(process.execPath, [join(root, 'scripts', 'build.mjs')], { cwd: root, stdio: 'pipe' });
    project.provide('buildError', null);
  } catch (error) {
    const e = error as { stderr?: Buffer; message: string };
    project.provide('buildError', e.stderr?.toString() || e.message);
  }
}
