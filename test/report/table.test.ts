import { describe, expect, it } from 'vitest';
import { table, visibleWidth } from '../../src/report/table.js';
import { colorWanted, palette, stripAnsi } from '../../src/report/color.js';

describe('table', () => {
  const rows = [
    ['1', '4.7 kΩ', '100 nF'],
    ['12', '470 Ω', '1 µF'],
    ['3', '1 MΩ', '2.2 nF'],
  ];
  const text = table(['stage', 'R', 'C'], rows);
  const lines = text.split('\n');

  it('puts a dashed rule as wide as each column under the header', () => {
    expect(lines[1].trim().split(/\s+/).map((d) => d.length)).toEqual([5, 6, 6]);
    expect(lines[1]).toMatch(/^ {2}-+( {2}-+)+$/);
  });

  it('right-aligns all but the first column, so right edges line up (common practice for numbers)', () => {
    // Every line ends at the same column, the last column being right-aligned.
    const ends = lines.map((l) => visibleWidth(l));
    expect(new Set(ends).size).toBe(1);
    // First column left-aligned: each row's first cell starts right after the indent.
    for (const l of lines.slice(2)) expect(l).toMatch(/^ {2}\S/);
    // Second column: its right edge is 2 (indent) + 5 (widest first cell) + 2 (gap) + 6 characters in.
    for (const l of lines.slice(2)) expect([...l][2 + 5 + 2 + 6 - 1]).not.toBe(' ');
  });

  it('measures cells without ANSI codes and trims trailing spaces', () => {
    const paint = palette(true);
    const coloured = table(['check', 'result'], [['ripple', paint.good('PASS')], ['droop', paint.bad('FAIL')]], {
      align: ['left', 'left'],
    });
    expect(stripAnsi(coloured)).toBe(table(['check', 'result'], [['ripple', 'PASS'], ['droop', 'FAIL']], { align: ['left', 'left'] }));
    for (const l of text.split('\n')) expect(l).toBe(l.trimEnd());
  });

  it('renders a key-value list without a header', () => {
    expect(table([], [['a:', 'x'], ['long key:', 'y']], { align: ['left', 'left'] })).toBe('  a:         x\n  long key:  y');
  });
});

describe('colour helper (NO_COLOR convention, no-color.org)', () => {
  it('is off when not on a terminal, or when NO_COLOR is set and not empty', () => {
    expect(colorWanted(undefined, {})).toBe(false);
    expect(colorWanted(false, {})).toBe(false);
    expect(colorWanted(true, { NO_COLOR: '1' })).toBe(false);
    expect(colorWanted(true, { NO_COLOR: '' })).toBe(true);
    expect(colorWanted(true, {})).toBe(true);
  });
  it('leaves text unchanged when disabled', () => {
    const p = palette(false);
    expect([p.bold('a'), p.good('b'), p.bad('c'), p.warn('d'), p.dim('e'), p.accent('f')]).toEqual(['a', 'b', 'c', 'd', 'e', 'f']);
    expect(palette(true).bad('x')).toBe('\x1b[31mx\x1b[39m');
  });
});
