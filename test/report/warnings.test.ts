/** The Warnings section of the reports and the relative spread of a tolerance range. */
import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { markdownReport } from '../../src/report/markdown.js';
import { textReport } from '../../src/report/text.js';
import { spreadText } from '../../src/report/tolerance.js';
import { warningsSection } from '../../src/report/warnings.js';
import { oneStageProject } from './projectFixture.js';

describe('Warnings section', () => {
  it('is left out when there is nothing to warn about', () => {
    expect(warningsSection([])).toBeNull();
    const clean = oneStageProject();
    expect(textReport(clean, analyzeProject(clean))).not.toContain('Warnings');
  });

  it('comes before the cautions in text and Markdown, one item per warning as key: message', () => {
    // 10 kohm into 10 kohm: the divider passes about half the span (Ohm's law), below 90 %
    const p = oneStageProject({ r: 10e3, c: 1e-6, loadResistance: 10e3 });
    const a = analyzeProject(p);
    expect(a.warnings.map((w) => w.key)).toEqual(['load.resistance']);
    const md = markdownReport(p, a);
    expect(md.indexOf('## Warnings')).toBeGreaterThan(0);
    expect(md.indexOf('## Cautions')).toBeGreaterThan(md.indexOf('## Warnings'));
    expect(md).toContain('- load.resistance: the output spans');
    const text = textReport(p, a);
    expect(text.indexOf('\nCautions')).toBeGreaterThan(text.indexOf('\nWarnings'));
    expect(text).toMatch(/1 warning \(see Warnings\)\.\n$/);
  });
});

describe('spreadText', () => {
  it('writes a symmetric range as ±, an asymmetric one as -below / +above', () => {
    expect(spreadText({ nominal: 1000, min: 990, max: 1010 })).toBe('±1 %');
    expect(spreadText({ nominal: 25, min: 15, max: 40 })).toBe('-40 % / +60 %');
    expect(spreadText({ nominal: 10, min: 11, max: 12 })).toBe('+10 % / +20 %');
    expect(spreadText({ nominal: 0, min: 0, max: 1 })).toBe('');
  });
});
