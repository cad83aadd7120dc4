import { afterEach, describe, expect, it, vi } from 'vitest';
import { designStudy } from '../../src/api/designStudy.js';
import { designSearch } from '../../src/design/designSearch.js';
import { tradeoffCurves } from '../../src/design/tradeoffCurves.js';
import { loadProject } from '../../src/project/index.js';
import { designReport } from '../../src/report/design.js';

// The bench's wide two-stage E24 space (invented scenario, scripts/bench-projects/wide-e24.yaml).
const project = () => loadProject('scripts/bench-projects/wide-e24.yaml');

/** performance.now() replaced by a clock that moves 1 ms at every reading: cuts fall at the same place every run. */
function steppingClock(): () => number {
  let now = 0;
  vi.spyOn(performance, 'now').mockImplementation(() => (now += 1));
  return () => now;
}

describe('the trade-off curves and the time limit', () => {
  afterEach(() => vi.restoreAllMocks());

  it('tradeoffCurves gives up at the deadline with no curves, and draws them all without one', () => {
    const p = project();
    expect(tradeoffCurves(p, [1, 2], p.spec.ripple!, { deadline: performance.now() - 1 })).toEqual([]);
    const free = tradeoffCurves(p, [1, 2], p.spec.ripple!);
    expect(free.map((c) => c.stages)).toEqual([1, 2]);
    expect(tradeoffCurves(p, [1, 2], p.spec.ripple!, { deadline: performance.now() + 1e9 })).toStrictEqual(free);
    const json = JSON.parse(designReport(p, designSearch(p, { top: 3 }), 'json', { tradeoff: free }));
    expect(json.tradeoffOutOfTime).toBe(false);
    expect(json.tradeoff).toHaveLength(2);
  });

  it('a search that ends in time but leaves the curves unfinished says so (the curves used to run on past --max-time)', () => {
    // Clock readings of the search alone, then a deadline just after it: the curves' walk is cut.
    const clock = steppingClock();
    designSearch(project(), { top: 10, deadline: 1e300 });
    const searchReadings = clock();
    vi.restoreAllMocks();
    steppingClock();
    const study = designStudy(project(), { top: 10, deadline: searchReadings + 1.5 });
    expect(study.result.complete).toBe(true);
    expect(study.tradeoff).toBeUndefined();
    expect(study.tradeoffOutOfTime).toBe(true);
    vi.restoreAllMocks();
    const text = designReport(project(), study.result as Parameters<typeof designReport>[1], 'text', { tradeoffOutOfTime: true, width: 100 });
    expect(text).toMatch(/Trade-off: not drawn/);
    expect(text).toMatch(/the time limit \(--max-time\) came before the trade-off curves were\s+done/);
    // JSON says it too (the curves were asked for; an empty `tradeoff` alone would read as --no-charts).
    const json = JSON.parse(designReport(project(), study.result as Parameters<typeof designReport>[1], 'json', { tradeoffOutOfTime: true }));
    expect(json.tradeoffOutOfTime).toBe(true);
    expect(json.tradeoff).toEqual([]);
  });
});

describe('the trade-off curves and the effort limit (--curve-effort)', () => {
  it('a curve whose walk needs more fast evaluations than the limit is not drawn; the others are the same as without it', () => {
    // On this project the one-stage curve takes about 1 600 evaluations and the two-stage one about
    // 46 000 (paretoSearch stats): a limit of 10 000 lies between them.
    const p = project();
    const free = tradeoffCurves(p, [1, 2], p.spec.ripple!);
    const capped = tradeoffCurves(p, [1, 2], p.spec.ripple!, { effort: 10_000 });
    expect(capped.map((c) => [c.stages, c.effortExceeded ?? false, c.points.length])).toEqual([
      [1, false, 9],
      [2, true, 0],
    ]);
    expect(capped[0]).toStrictEqual(free[0]);
    // A limit above what each walk needs changes nothing.
    expect(tradeoffCurves(p, [1, 2], p.spec.ripple!, { effort: 200_000 })).toStrictEqual(free);
  });

  it('designStudy lists the curve not drawn, and every report says so', () => {
    const study = designStudy(project(), { top: 3, curveEffort: 10_000 });
    expect(study.tradeoff!.map((c) => c.stages)).toEqual([1]);
    expect(study.tradeoffNotDrawn).toEqual([2]);
    const options = { tradeoff: study.tradeoff!, tradeoffNotDrawn: study.tradeoffNotDrawn!, curveEffort: 10_000, width: 100 };
    const result = study.result as Parameters<typeof designReport>[1];
    expect(study.curveEffort).toBe(10_000);
    expect(designReport(project(), result, 'text', options)).toMatch(/Not drawn: 2 stages\. Proving that curve takes more fast-model evaluations\s+than\s+10000,\s+the\s+limit\s+of\s+--curve-effort/);
    expect(designReport(project(), result, 'markdown', options)).toContain('Not drawn: 2 stages.');
    // Without the figure the note still reads (a library caller that passes only the list).
    const unnamed = designReport(project(), result, 'text', { ...options, curveEffort: undefined, width: 200 });
    expect(unnamed).toContain('takes more fast-model evaluations than the limit of --curve-effort;');
    const json = JSON.parse(designReport(project(), result, 'json', options));
    expect(json.tradeoffNotDrawn).toEqual([2]);
    expect(json.tradeoff.map((c: { stages: number }) => c.stages)).toEqual([1]);
    // The default limit draws both curves of this project, and the JSON says none was left out.
    const full = designStudy(project(), { top: 3 });
    expect(full.tradeoff!.map((c) => c.stages)).toEqual([1, 2]);
    expect(full.tradeoffNotDrawn).toBeUndefined();
  });
});
