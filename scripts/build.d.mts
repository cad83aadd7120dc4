// Types of scripts/build.mjs (plain JavaScript, run by node before any TypeScript tooling).
import type { Plugin } from 'esbuild';

/** ES module source of the build-time project-schema validator (exports validate, default, AJV_OPTIONS). */
export function standaloneProjectValidator(): Promise<string>;

/** esbuild plugin: every `string-width` import gets the ASCII fast path in front of the hoisted copy. */
export function lazyStringWidth(): Plugin;

/** Bundle dist/cli.js (and dist/tolerance-worker.js); returns the JavaScript files written. */
export function buildCli(options?: { outdir?: string; minify?: boolean }): Promise<Array<{ file: string; bytes: number }>>;
