import { describe, expect, it } from 'vitest';
import type { ReportDocument } from '../../src/report/document.js';
import { renderDocument } from '../../src/report/renderDocument.js';

// An invented document using every block kind.
const doc: ReportDocument = {
  title: 'Filter plan',
  sections: [
    {
      title: 'Checks',
      blocks: [
        { kind: 'table', header: ['', 'value', 'result'], rows: [['ripple', '1|2 mV', 'PASS'], ['settling', '3 ms', 'FAIL'], ['droop', 'x', 'droop MISSES by 2%']], align: ['left', 'right', 'left'] },
        { kind: 'pairs', pairs: [['Cutoff', '337 Hz']] },
        { kind: 'list', items: ['first note'] },
        { kind: 'text', text: 'a paragraph' },
        { kind: 'chart', title: 'Output', body: '  *\n *' },
      ],
    },
  ],
  verdict: { pass: false, text: 'FAIL: settling' },
};

// ECMA-48 SGR sequences: ESC [ n m (31 red, 32 green, 1 bold).
const SGR = /\x1b\[\d+m/;

describe('renderDocument', () => {
  it('markdown: GFM pipe tables whose rows all have the header cell count, pipes escaped', () => {
    // Source: GitHub Flavored Markdown spec 0.29, section 4.10 (tables extension): the delimiter
    // row matches the header cell count, ":---" / "---:" set alignment, "\|" is a literal pipe.
    const md = renderDocument(doc, 'markdown');
    expect(md.startsWith('# Filter plan\n')).toBe(true);
    expect(md).toContain('\n## Checks\n');
    const lines = md.split('\n');
    const head = lines.indexOf('|   | value | result |');
    expect(head).toBeGreaterThan(0);
    expect(lines[head + 1]).toBe('|:---|---:|:---|');
    expect(lines[head + 2]).toBe('| ripple | 1\\|2 mV | PASS |');
    const cellCount = (l: string) => l.replace(/\\\|/g, '').split('|').length - 2;
    for (let k = head; k <= head + 4; k++) expect(cellCount(lines[k])).toBe(3);
    expect(md).toContain('```text\n  *\n *\n```');
    expect(md.endsWith('**FAIL: settling**\n')).toBe(true);
    expect(md).not.toMatch(SGR);
  });

  it('text: no escape sequences without colour; PASS green, FAIL and misses red with colour', () => {
    // Source: ECMA-48 (5th ed., 1991), 8.3.117 SGR: 31 red, 32 green foreground, 39 default.
    const plain = renderDocument(doc, 'text');
    expect(plain).not.toMatch(SGR);
    expect(plain.split('\n')[0]).toBe('Filter plan');
    expect(plain).toMatch(/Cutoff:\s+337 Hz/);
    expect(plain).toContain('  - first note');
    const colored = renderDocument(doc, 'text', { color: true });
    expect(colored).toContain('\x1b[32mPASS\x1b[39m');
    expect(colored).toContain('\x1b[31mFAIL\x1b[39m');
    expect(colored).toContain('\x1b[31mdroop MISSES by 2%\x1b[39m');
    expect(colored.trimEnd().endsWith('\x1b[31mFAIL: settling\x1b[39m')).toBe(true);
    // Same words once the escapes are removed (table widths aside, every cell is present).
    for (const word of ['ripple', 'settling', 'droop MISSES by 2%', 'a paragraph', 'Output']) {
      expect(colored.replace(/\x1b\[\d+m/g, '')).toContain(word);
    }
  });
});
