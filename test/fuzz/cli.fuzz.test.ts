/**
 * Fuzz suite: generated and mutated project files through every command of the built CLI, with a
 * fixed seed so that a run is repeatable. Each run must end with exit 0, 1 or 2 (model.md: the
 * exit codes of every command), within a hang limit, with no stack trace, no internal error and
 * no NaN or Infinity in what it prints. The counts (inputs tried, exit classes, slowest run) are
 * printed for the record. Findings that were fixed live on as named files in
 * test/fixtures/projects (see test/project/inputLimits.test.ts and the engine's domain tests).
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bin } from '../cli/runBuilt.js';
import { mutatedData, projectText, textMutation, validProject, type ProjectData } from './projectArbitraries.js';

/** `npm run fuzz` sets DACSMITH_FUZZ_SCALE (and may set DACSMITH_FUZZ_SEED) for a longer run. */
const SCALE = Math.max(1, Number(process.env.DACSMITH_FUZZ_SCALE ?? 1) || 1);
const SEED = Number(process.env.DACSMITH_FUZZ_SEED ?? 20261202) || 20261202;
/** A run longer than this is a hang (a robustness limit, not a speed goal: those live in the bench). */
const HANG_MS = 20_000;
const COUNTS = { valid: 16 * SCALE, data: 40 * SCALE, text: 24 * SCALE };

interface Case {
  name: string;
  bytes: Buffer;
}

function cases(): Case[] {
  const valid = fc.sample(validProject, { seed: SEED, numRuns: COUNTS.valid }) as ProjectData[];
  const out: Case[] = valid.map((data, i) => ({ name: `valid-${i}`, bytes: Buffer.from(projectText(data)) }));
  const mutants = fc.sample(validProject.chain((d) => mutatedData(d as ProjectData)), { seed: SEED + 1, numRuns: COUNTS.data });
  mutants.forEach((data, i) => out.push({ name: `data-${i}`, bytes: Buffer.from(projectText(data)) }));
  const texts = fc.sample(fc.tuple(validProject, textMutation), { seed: SEED + 2, numRuns: COUNTS.text });
  texts.forEach(([data, mutate], i) => out.push({ name: `text-${i}`, bytes: mutate(projectText(data as ProjectData)) }));
  return out;
}

/**
 * The commands a file goes through: analyze always, and one other in turn (check, tolerance,
 * compare, design), so that every command sees a quarter of the files at a bounded cost.
 */
function commandsFor(file: string, other: string, index: number): string[][] {
  const second = [
    ['check', file],
    ['tolerance', file, '--samples', '200', '--format', 'json', '--no-charts'],
    ['compare', other, file, '--format', 'json'],
    ['design', file, '--top', '3', '--no-charts', '--format', 'json'],
  ][index % 4];
  return [['analyze', file, '--format', 'json'], second];
}

function runOnce(args: string[]): Promise<{ code: number | null; stdout: string; stderr: string; ms: number; killed: boolean }> {
  return new Promise((resolve) => {
    const started = Date.now();
    const child = spawn(process.execPath, [bin, ...args], { env: { ...process.env, NO_COLOR: '1' } });
    let stdout = '';
    let stderr = '';
    let killed = false;
    const timer = setTimeout(() => {
      killed = true;
      child.kill('SIGKILL');
    }, HANG_MS);
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, stdout, stderr, ms: Date.now() - started, killed });
    });
  });
}

describe('fuzz: every command answers every generated file with exit 0, 1 or 2', () => {
  it(`${COUNTS.valid} valid, ${COUNTS.data} data-mutated and ${COUNTS.text} text-mutated files (seed ${SEED})`, async () => {
    const dir = mkdtempSync(join(tmpdir(), 'dacsmith-fuzz-'));
    const base = join(dir, 'base.yaml');
    writeFileSync(base, 'pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V }\nfilter: { stages: [{ r: 4k7, c: 1u }] }\n');
    const jobs: Array<{ c: Case; args: string[] }> = [];
    cases().forEach((c, i) => {
      const file = join(dir, `${c.name}.yaml`);
      writeFileSync(file, c.bytes);
      for (const args of commandsFor(file, base, i)) jobs.push({ c, args });
    });

    const findings: string[] = [];
    const exits = new Map<string, number>();
    let slowest = { ms: 0, what: '' };
    let next = 0;
    const worker = async () => {
      while (next < jobs.length) {
        const { c, args } = jobs[next++];
        const r = await runOnce(args);
        const what = `${c.name}: dacsmith ${args.map((a) => a.replace(dir, '.')).join(' ')}`;
        exits.set(String(r.code), (exits.get(String(r.code)) ?? 0) + 1);
        if (r.ms > slowest.ms) slowest = { ms: r.ms, what };
        const out = r.stdout + r.stderr;
        if (r.killed) findings.push(`${what}: still running after ${HANG_MS} ms`);
        else if (r.code !== 0 && r.code !== 1 && r.code !== 2) findings.push(`${what}: exit ${r.code}: ${r.stderr.slice(0, 300)}`);
        else if (/internal error|\n\s+at .*:\d+:\d+\)?\n/.test(out)) findings.push(`${what}: internal error or stack: ${r.stderr.slice(0, 300)}`);
        else if (/\bNaN\b|\bInfinity\b/.test(r.stdout)) findings.push(`${what}: NaN or Infinity in the output`);
      }
    };
    await Promise.all([worker(), worker()]);
    const counts = [...exits].sort().map(([code, n]) => `exit ${code}: ${n}`).join(', ');
    console.log(`fuzz: ${jobs.length} runs over ${COUNTS.valid + COUNTS.data + COUNTS.text} files; ${counts}; slowest ${slowest.ms} ms (${slowest.what})`);
    expect(findings).toEqual([]);
  }, 900_000);
});
