import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { firstInvalidUtf8 } from '../../src/project/firstInvalidUtf8.js';

describe('firstInvalidUtf8', () => {
  it('finds the examples of RFC 3629', () => {
    expect(firstInvalidUtf8(Buffer.from('Widerstand f\u00fcr R1 \u2126 \u{1f50c}'))).toBe(-1);
    expect(firstInvalidUtf8(Buffer.from([0x41, 0xc0, 0xaf]))).toBe(1); // overlong '/'
    expect(firstInvalidUtf8(Buffer.from([0x41, 0xed, 0xa0, 0x80]))).toBe(2); // surrogate D800
    expect(firstInvalidUtf8(Buffer.from([0xf4, 0x90, 0x80, 0x80]))).toBe(1); // above U+10FFFF
    expect(firstInvalidUtf8(Buffer.from([0x41, 0xe2, 0x82]))).toBe(1); // cut short
    expect(firstInvalidUtf8(Buffer.from([0x80]))).toBe(0); // lone continuation byte
  });

  it('agrees with the WHATWG Encoding Standard decoder (TextDecoder, fatal) on random bytes', () => {
    const decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
    const byte = fc.oneof(fc.integer({ min: 0, max: 0x7f }), fc.integer({ min: 0x80, max: 0xff }), fc.constantFrom(0xc2, 0xe0, 0xed, 0xf0, 0xf4, 0x80, 0xbf));
    fc.assert(
      fc.property(fc.array(byte, { maxLength: 16 }), (bytes) => {
        const buffer = Uint8Array.from(bytes);
        let valid = true;
        try {
          decoder.decode(buffer);
        } catch {
          valid = false;
        }
        expect(firstInvalidUtf8(buffer) === -1).toBe(valid);
      }),
      { numRuns: 3000 },
    );
  });
});
