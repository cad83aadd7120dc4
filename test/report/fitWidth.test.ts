import fc from 'fast-check';
import stringWidth from 'string-width';
import { describe, expect, it } from 'vitest';
import { table } from '../../src/report/table.js';
import { textWidth, wrapChunks, wrappedLineCount, wrapText } from '../../src/report/wrapText.js';

// Terminal widths are measured with string-width (an outside library), not with our own counter.
const widest = (text: string) => Math.max(...text.split('\n').map((l) => stringWidth(l)));

describe('wrapText', () => {
  it('keeps a number with its unit, "@" with what follows and a joining "/" with what it follows', () => {
    expect(wrapChunks('ripple 0.46 LSB @ 6 bit at duty 5.0 %')).toEqual(['ripple', '0.46 LSB', '@ 6 bit', 'at', 'duty', '5.0 %']);
    expect(wrapChunks('1.2 kΩ / 6.8 nF')).toEqual(['1.2 kΩ /', '6.8 nF']);
  });

  it('wraps greedily within the width and splits only a word longer than the line', () => {
    expect(wrapText('settling 7.35 ms, ripple 0.25 LSB', 16)).toEqual(['settling', '7.35 ms, ripple', '0.25 LSB']);
    expect(wrapText('sample-configs/greenhouse.yaml', 10)).toEqual(['sample-con', 'figs/green', 'house.yaml']);
    expect(wrapText('fits as is', 10)).toEqual(['fits as is']);
  });

  it('wrappedLineCount gives wrapText\'s line count from the chunk widths (fast-check over texts and widths)', () => {
    const count = (text: string, width: number) => wrappedLineCount(wrapChunks(text).map(textWidth), textWidth(text), width);
    expect(count('settling 7.35 ms, ripple 0.25 LSB', 16)).toBe(3);
    expect(count('sample-configs/greenhouse.yaml', 10)).toBe(3);
    expect(count('', 5)).toBe(1);
    const word = fc.constantFrom('ripple', '0.46', 'LSB', '@', '6', 'bit', '/', '+', 'kΩ', 'sample-configs/greenhouse.yaml', '\x1b[1mPASS\x1b[0m', 'µF', 'to', 'x');
    fc.assert(
      fc.property(fc.array(word, { maxLength: 14 }), fc.integer({ min: 0, max: 40 }), (words, width) => {
        const text = words.join(' ');
        return count(text, width) === wrapText(text, width).length;
      }),
      { numRuns: 500, seed: 23 },
    );
  });
});

describe('table with maxWidth', () => {
  const header = ['#', 'R1 / C1', 'codes (IEC 60062)', 'settling', 'worst ripple', 'margin to each limit'];
  const rows = [
    ['1', '1 kΩ / 680 nF', '1k0-680n', '7.352 ms', '0.249 LSB', 'ripple 0.2%, droop 3.9%, settling 99.3%, pin current 35.6%'],
    ['2', '1.1 kΩ / 620 nF', '1k1-620n', '7.356 ms', '0.249 LSB', 'ripple 0.2%, droop 5.6%, settling 99.3%, pin current 41.3%'],
  ];

  it('is unchanged when it fits', () => {
    expect(table(header, rows, { maxWidth: 500 })).toBe(table(header, rows));
  });

  it('wraps cells to fit, keeping every value whole', () => {
    for (const width of [100, 80, 60]) {
      const text = table(header, rows, { maxWidth: width });
      expect(widest(text)).toBeLessThanOrEqual(width);
      expect(text).toContain('7.352 ms');
      expect(text).toContain('0.249 LSB');
    }
  });

  it('leaves out a low-priority column before splitting words, and says so', () => {
    const text = table(header, rows, { maxWidth: 60, priority: [1, 1, 0.1, 1, 1, 1] });
    expect(widest(text)).toBeLessThanOrEqual(60);
    expect(text).not.toContain('1k0-680n');
    expect(text).toMatch(/not shown at this width: codes \(IEC 60062\)/);
    expect(table(header, rows, { maxWidth: 200, priority: [1, 1, 0.1, 1, 1, 1] })).toContain('1k0-680n');
  });

  it('draws one record per row, every value whole, when no column layout fits', () => {
    const text = table(header, rows, { maxWidth: 40 });
    expect(widest(text)).toBeLessThanOrEqual(40);
    expect(text).toMatch(/^ {2}1\n {4}R1 \/ C1: 1 kΩ \/ 680 nF\n {4}codes \(IEC 60062\): 1k0-680n\n {4}settling: 7\.352 ms/);
  });
});
