/** Bench section: `dacsmith tolerance` on the version 1.1 samples (second PWM output, Sallen-Key stage). */
import { join } from 'node:path';
import type { BenchSection } from './bench-table.js';
import { processStart } from './bench-process.js';

/** The three version 1.1 samples, each with its own tolerance block (10 000 samples, seed 2026). */
const NETWORK_SAMPLES = [
  { name: 'complement output (ripple cancel)', file: 'sample-configs/complement-ripple-cancel.yaml' },
  { name: 'fine output, 8 + 8 bits', file: 'sample-configs/fine-16bit-setpoint.yaml' },
  { name: 'RC + Sallen-Key', file: 'sample-configs/sallen-key-reference.yaml' },
];

export interface NetworkToleranceCost {
  name: string;
  file: string;
  /** Median wall time of the whole process, s. */
  seconds: number;
  /** Median CPU time of the child (all its threads), s; null where /proc is missing. */
  cpu: number | null;
  exitCode: number | null;
}

/**
 * Whole-process time of `dacsmith tolerance FILE` (worst case with the engine's confirmation, then
 * the file's 10 000-sample Monte Carlo on the default threads) for each version 1.1 sample:
 * medians of 3 interleaved runs (bench-process.ts), wall and CPU.
 *
 * Syntax: networkToleranceCost(root)
 * Example: networkToleranceCost(process.cwd()).data[0].seconds   // s
 */
export function networkToleranceCost(root: string): { data: NetworkToleranceCost[]; section: BenchSection } {
  const timing = processStart(
    NETWORK_SAMPLES.map((c) => [join('bin', 'dacsmith.cjs'), 'tolerance', c.file, '--format', 'json']),
    { runs: 3, cwd: root },
  );
  const data = NETWORK_SAMPLES.map((c, i) => ({ ...c, seconds: timing.commands[i].median, cpu: timing.commands[i].cpu, exitCode: timing.commands[i].exitCode }));
  return {
    data,
    section: {
      title: 'Tolerance of version 1.1 circuits, whole process (dacsmith tolerance FILE, 10 000 samples, 3 runs each; medians)',
      columns: ['case', 'project', 'exit', 'wall (ms)', 'CPU (ms)'],
      rows: data.map((d) => [d.name, d.file, d.exitCode ?? 'n/a', d.seconds * 1e3, d.cpu === null ? 'n/a' : d.cpu * 1e3]),
      notes: ['each sample runs the general periodic engine (a few dozen periodic orbits); CPU counts every thread'],
    },
  };
}
