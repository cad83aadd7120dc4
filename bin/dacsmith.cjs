#!/usr/bin/env node
'use strict';
/**
 * Start the bundled command line, dist/cli.cjs, with V8's code cache when the build left one.
 *
 * Why: compiling the ~0.7 MB bundle, and lazily every function the run reaches, is a large part
 * of a short run (about 50 ms of ~300 ms for `analyze` on a sample, measured on the bench machine).
 * The build runs commands on a sample and saves V8's compiled code (vm.Script#createCachedData,
 * nodejs.org/api/vm.html) to dist/cli.cjs.cache (trained on `analyze`) and dist/cli.cjs.design.cache
 * (trained on `design`, used by that command); later starts reuse them.
 *
 * The cache file is the hex SHA-256 of the bundle it was made from (64 bytes), then V8's data.
 * A cache whose hash does not match the bundle is not used; V8 itself refuses data from another
 * V8 version or flag set (script.cachedDataRejected). Either way the bundle just compiles as usual,
 * so a missing or stale cache costs time, never correctness.
 *
 * DACSMITH_CODE_CACHE_OUT=<file> (used by scripts/build.mjs only): compile without a cache and
 * write a fresh one to <file> when the process exits. With DACSMITH_CODE_CACHE_TRAIN (a JSON
 * array of argument lists) those commands run too, in this process, each once the one before has
 * finished ('beforeExit'), on the same compiled script: the cache then holds the code every one of
 * them compiled (V8 keeps compiled functions per script), not only the first command's.
 *
 * On V8 11 (Node.js 20) the optimizing compiler's interrupt budget is raised 4x before the bundle
 * compiles (v8.setFlagsFromString, nodejs.org/api/v8.html): a default design run queued about
 * 1.1 s of optimizing-compiler work on the one spare core in a 0.6 s run, much of it for functions
 * that turn warm rather than hot. Measured on the bench machine (farm-bench, paired, medians):
 * default design 0.86, robust worst-case 0.93, yield 0.91, three-stage search 0.96, analyze 0.96,
 * tolerance 0.93 to 0.98, a 5.5 s three-stage design with curves 1.03. The optimizing compiler's
 * cumulative inlining budget is lowered from 920 to 600 bytes of bytecode as well: the compiler
 * thread had about 630 ms of work queued in a 0.5 s default design run (--trace-opt; the hottest
 * search functions took 20 to 37 ms each to compile, mostly for callees inlined again into every
 * caller), and smaller graphs reach optimized code sooner. Measured against the 4x budget alone,
 * order-alternating pairs, each build with its own code cache: default design 0.972 (20 rounds),
 * --robust worst-case 0.931, three stages 0.973, complement design sample 0.946, analyze 0.983,
 * a 4 s three-stage design with curves 0.987 (a cap of 460 gained as much on the short runs but
 * made that one 1.04). Other V8 versions were not measured and keep their defaults (an unknown flag
 * would print an error). The flags change when code is optimized, never what it computes; the
 * build's code cache is made under them too (V8 refuses a cache made under other flags).
 */
const { createHash } = require('node:crypto');
const { readFileSync, writeFileSync } = require('node:fs');
const { createRequire, wrap } = require('node:module');
const { join } = require('node:path');
const vm = require('node:vm');

if (process.versions.v8.startsWith('11.')) require('node:v8').setFlagsFromString('--interrupt-budget=270336 --max-inlined-bytecode-size-cumulative=600');

const bundle = join(__dirname, '..', 'dist', 'cli.cjs');
const HASH_BYTES = 64;

let source;
try {
  source = readFileSync(bundle);
} catch {
  process.stderr.write(`dacsmith: ${bundle} is missing: run 'npm run build' (npm ci runs it).\n`);
  process.exit(70);
}
const hash = createHash('sha256').update(source).digest('hex');
const cacheOut = process.env.DACSMITH_CODE_CACHE_OUT;

// `design` has a cache of its own, trained on design runs (scripts/build.mjs, CODE_CACHES); every
// other command, or a design run without that file, takes the one trained on `analyze`.
let cachedData;
if (!cacheOut) {
  for (const file of process.argv[2] === 'design' ? [`${bundle}.design.cache`, `${bundle}.cache`] : [`${bundle}.cache`]) {
    try {
      const cache = readFileSync(file);
      if (cache.toString('latin1', 0, HASH_BYTES) === hash) {
        cachedData = cache.subarray(HASH_BYTES);
        break;
      }
    } catch {
      // no such cache: the next, or compile as usual
    }
  }
}

const script = new vm.Script(wrap(source.toString('utf8')), {
  filename: bundle,
  cachedData,
});
if (process.env.DACSMITH_DEBUG && cachedData && script.cachedDataRejected) {
  process.stderr.write('dacsmith: V8 rejected the code cache (other Node.js version or flags); compiling.\n');
}
if (cacheOut) {
  process.on('exit', () => {
    writeFileSync(cacheOut, Buffer.concat([Buffer.from(hash, 'latin1'), script.createCachedData()]));
  });
}

const module_ = { exports: {}, filename: bundle, id: bundle, loaded: false };
const start = () => script.runInThisContext()(module_.exports, createRequire(bundle), module_, bundle, join(__dirname, '..', 'dist'));
start();
if (cacheOut && process.env.DACSMITH_CODE_CACHE_TRAIN) {
  const more = JSON.parse(process.env.DACSMITH_CODE_CACHE_TRAIN);
  // (through setImmediate: a run that needs no I/O would otherwise leave the loop empty, and
  // 'beforeExit' would not come again for the next one)
  process.on('beforeExit', () => {
    const next = more.shift();
    if (next === undefined) return;
    setImmediate(() => {
      process.argv = [process.argv[0], process.argv[1], ...next];
      start();
    });
  });
}
