import { describe, expect, it } from 'vitest';
import { designStudy, designStudyInParallel } from '../../src/api/designStudy.js';
import { loadProject } from '../../src/project/index.js';

// The worker runs the TypeScript source through tsx (the bundle's dist/design-worker.js in use).
const source = new URL('../../src/api/tradeoffWorker.ts', import.meta.url);
/** A study without its wall-time figures, which differ from run to run. */
const timeless = (s: object) => JSON.parse(JSON.stringify(s, (k, v) => (k === 'elapsed' ? 0 : v)));

describe('designStudyInParallel', () => {
  it('gives the study designStudy gives, curves of the largest stage count drawn in a worker', async () => {
    const project = loadProject('sample-configs/greenhouse-heater.yaml');
    let progressed = 0;
    let drawnIn = '';
    const parallel = await designStudyInParallel(
      project,
      { onProgress: (f) => (progressed = Math.max(progressed, f)) },
      { force: true, workerUrl: source, onCurves: (where) => (drawnIn = where) },
    );
    expect(drawnIn).toBe('worker');
    const alone = designStudy(project);
    expect(parallel.tradeoff?.map((c) => c.stages)).toEqual([1, 2]);
    expect(timeless(parallel)).toEqual(timeless(alone));
    expect(progressed).toBeGreaterThan(0.5);
  }, 60_000);

  it('robust mode: the same robust designs and curves', async () => {
    const project = loadProject('sample-configs/greenhouse-heater.yaml');
    let drawnIn = '';
    const parallel = await designStudyInParallel(project, { robust: 'worst-case', top: 3 }, { force: true, workerUrl: source, onCurves: (where) => (drawnIn = where) });
    expect(drawnIn).toBe('worker');
    expect(timeless(parallel)).toEqual(timeless(designStudy(project, { robust: 'worst-case', top: 3 })));
  }, 60_000);

  it('draws the curves itself when the worker cannot start or fails', async () => {
    const project = loadProject('sample-configs/greenhouse-heater.yaml');
    const drawnIn: string[] = [];
    const onCurves = (where: string) => drawnIn.push(where);
    const missing = await designStudyInParallel(project, {}, { force: true, workerUrl: new URL('file:///nonexistent/design-worker.js'), onCurves });
    const broken = await designStudyInParallel(project, {}, { force: true, workerUrl: new URL('data:text/javascript,throw new Error("broken worker")'), onCurves });
    // No script: no worker at all (designStudy); a failing one: this thread draws its curves.
    expect(drawnIn).toEqual(['this thread']);
    const alone = timeless(designStudy(project));
    expect(timeless(missing)).toEqual(alone);
    expect(timeless(broken)).toEqual(alone);
  }, 60_000);
});
