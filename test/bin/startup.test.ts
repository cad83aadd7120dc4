/**
 * bin/dacsmith.cjs, the start-up script: it runs dist/cli.cjs through V8's code cache when the
 * build left a matching one, and must give exactly the same results with a missing, stale, foreign
 * or corrupt cache (the cache may only ever change speed). Runs the bundle that vitest's
 * globalSetup built, copied into a scratch directory so the real dist/ is never touched.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { root } from '../cli/runBuilt.js';

const sample = join(root, 'sample-configs', 'greenhouse-heater.yaml');
let work: string;

/** Run the copied start-up script with the given cache file contents (null: no cache file). */
function runWithCache(cache: Buffer | null, args: string[], env: Record<string, string> = {}) {
  const cacheFile = join(work, 'dist', 'cli.cjs.cache');
  rmSync(cacheFile, { force: true });
  if (cache) writeFileSync(cacheFile, cache);
  const r = spawnSync(process.execPath, [join(work, 'bin', 'dacsmith.cjs'), ...args], {
    cwd: root,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', ...env },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('start-up script and code cache (bin/dacsmith.cjs)', () => {
  let built: Buffer;
  let bundle: Buffer;
  beforeAll(() => {
    expect(inject('buildError')).toBeNull();
    work = mkdtempSync(join(tmpdir(), 'dacsmith-startup-'));
    mkdirSync(join(work, 'bin'));
    mkdirSync(join(work, 'dist'));
    copyFileSync(join(root, 'bin', 'dacsmith.cjs'), join(work, 'bin', 'dacsmith.cjs'));
    copyFileSync(join(root, 'dist', 'cli.cjs'), join(work, 'dist', 'cli.cjs'));
    bundle = readFileSync(join(root, 'dist', 'cli.cjs'));
    built = readFileSync(join(root, 'dist', 'cli.cjs.cache'));
  });
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  it('the build leaves a cache stamped with the SHA-256 of its bundle', () => {
    // Reference: Node's crypto SHA-256 (FIPS 180-4) of the bundle bytes, hex, as the cache header.
    const hash = createHash('sha256').update(bundle).digest('hex');
    expect(built.subarray(0, 64).toString('latin1')).toBe(hash);
    expect(built.length).toBeGreaterThan(64 + 10_000); // V8 data, not only a header
  });

  it('V8 accepts the built cache (the same Node.js that built it)', () => {
    const r = runWithCache(built, ['--version'], { DACSMITH_DEBUG: '1' });
    expect(r.code).toBe(0);
    expect(r.stderr).not.toMatch(/rejected/);
  });

  it('gives the same report with the cache, without it, and with a stale or corrupt one', () => {
    const args = ['analyze', sample, '--format', 'json'];
    const reference = runWithCache(null, args);
    expect(reference.code).toBe(0);
    expect(JSON.parse(reference.stdout).checks.length).toBeGreaterThan(0);
    // Built cache; a cache of another bundle (header hash differs); right header over garbage data.
    const stale = Buffer.concat([Buffer.from('0'.repeat(64), 'latin1'), built.subarray(64)]);
    const garbage = Buffer.concat([built.subarray(0, 64), Buffer.alloc(4096, 0x5a)]);
    for (const [name, cache] of [['built', built], ['stale', stale], ['garbage', garbage]] as const) {
      const r = runWithCache(cache, args, { DACSMITH_DEBUG: '1' });
      expect(r.code, name).toBe(0);
      expect(r.stdout, name).toBe(reference.stdout);
      if (name === 'garbage') expect(r.stderr).toMatch(/rejected the code cache/);
      else expect(r.stderr, name).toBe('');
    }
  });

  it('ignores the cache of an edited bundle of the same length (V8 checks only the length)', () => {
    // Same length, different code: the version string the bundle prints, changed in place. Were
    // the built cache used, V8 would run the old compiled code and print the old version.
    const version = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
    const edited = version.replace(/\d$/, (d) => String((Number(d) + 1) % 10));
    const text = bundle.toString('utf8');
    expect(text).toContain(`"${version}"`);
    writeFileSync(join(work, 'dist', 'cli.cjs'), text.split(`"${version}"`).join(`"${edited}"`));
    try {
      const r = runWithCache(built, ['--version']);
      expect(r.code).toBe(0);
      expect(r.stdout.trim()).toBe(edited);
    } finally {
      copyFileSync(join(root, 'dist', 'cli.cjs'), join(work, 'dist', 'cli.cjs'));
    }
  });

  it('design takes its own cache (trained on design runs) and gives the same answer without either', () => {
    const designCache = join(work, 'dist', 'cli.cjs.design.cache');
    const builtDesign = readFileSync(join(root, 'dist', 'cli.cjs.design.cache'));
    // stamped like the other, and a different training (more than the analyze run compiled)
    expect(builtDesign.subarray(0, 64).toString('latin1')).toBe(built.subarray(0, 64).toString('latin1'));
    expect(builtDesign.equals(built)).toBe(false);
    const args = ['design', sample, '--format', 'json', '--no-charts'];
    // (the elapsed time is the only figure that may differ between runs)
    const answer = (stdout: string) => stdout.replace(/"elapsed":[^,}]*/g, '');
    try {
      writeFileSync(designCache, builtDesign);
      const withOwn = runWithCache(built, args, { DACSMITH_DEBUG: '1' });
      expect(withOwn.stderr).toBe('');
      rmSync(designCache);
      const withAnalyzeOnly = runWithCache(built, args);
      const withNone = runWithCache(null, args);
      expect(withOwn.code).toBe(0);
      expect(JSON.parse(withOwn.stdout).candidates.length).toBeGreaterThan(0);
      expect(answer(withAnalyzeOnly.stdout)).toBe(answer(withOwn.stdout));
      expect(answer(withNone.stdout)).toBe(answer(withOwn.stdout));
      // a stale design cache is passed over for the analyze one (still the same answer)
      writeFileSync(designCache, Buffer.concat([Buffer.from('0'.repeat(64), 'latin1'), builtDesign.subarray(64)]));
      const stale = runWithCache(built, args, { DACSMITH_DEBUG: '1' });
      expect(stale.stderr).toBe('');
      expect(answer(stale.stdout)).toBe(answer(withOwn.stdout));
    } finally {
      rmSync(designCache, { force: true });
    }
  });

  it('reads a quantity only mathjs understands through its chunk, loaded on first use', () => {
    // scripts/build.mjs puts mathjs in dist/mathjs-units.cjs; '0.0008 min' is 48 ms (1 min = 60 s).
    const file = join(work, 'minutes.yaml');
    writeFileSync(file, readFileSync(sample, 'utf8').replace(/time: 50 ms,/, 'time: 0.0008 min,'));
    expect(readFileSync(file, 'utf8')).toContain('0.0008 min');
    const r = spawnSync(process.execPath, [join(root, 'bin', 'dacsmith.cjs'), 'analyze', file, '--format', 'json'], { encoding: 'utf8' });
    expect(r.status).toBe(0);
    const settling = (JSON.parse(r.stdout) as { checks: Array<{ name: string; limit: number }> }).checks.find((c) => c.name === 'settling');
    expect(settling?.limit).toBeCloseTo(0.048, 15);
    expect(existsSync(join(root, 'dist', 'mathjs-units.cjs'))).toBe(true);
  });

  it('says how to build when the bundle is missing (exit 70, no stack trace)', () => {
    const lonely = mkdtempSync(join(tmpdir(), 'dacsmith-nobundle-'));
    try {
      mkdirSync(join(lonely, 'bin'));
      copyFileSync(join(root, 'bin', 'dacsmith.cjs'), join(lonely, 'bin', 'dacsmith.cjs'));
      const r = spawnSync(process.execPath, [join(lonely, 'bin', 'dacsmith.cjs'), '--version'], { encoding: 'utf8' });
      expect(r.status).toBe(70);
      expect(r.stderr).toMatch(/npm run build/);
      expect(r.stderr).not.toMatch(/\n\s+at /);
      expect(existsSync(join(lonely, 'dist'))).toBe(false);
    } finally {
      rmSync(lonely, { recursive: true, force: true });
    }
  });
});
