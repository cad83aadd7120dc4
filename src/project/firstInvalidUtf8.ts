/**
 * Offset of the first byte that breaks UTF-8, or -1 when all of it is well-formed UTF-8.
 *
 * Method: a single pass over the byte ranges of well-formed sequences in RFC 3629, section 4
 * (no overlong forms, no surrogates D800-DFFF, nothing above U+10FFFF). The offset is that of the
 * lead byte when it cannot start a sequence or the text ends inside one, else that of the first
 * continuation byte out of range.
 *
 * Syntax: firstInvalidUtf8(bytes)
 * Example: firstInvalidUtf8(Buffer.from([0x61, 0xc3, 0xbc]))   // -1 ('aü')
 *          firstInvalidUtf8(Buffer.from([0x61, 0xfc, 0x72]))   // 1 (Latin-1 'ü')
 */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    let length: number;
    let low = 0x80;
    let high = 0xbf;
    if (b < 0x80) length = 1;
    else if (b >= 0xc2 && b <= 0xdf) length = 2;
    else if (b >= 0xe0 && b <= 0xef) {
      length = 3;
      if (b === 0xe0) low = 0xa0;
      if (b === 0xed) high = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      length = 4;
      if (b === 0xf0) low = 0x90;
      if (b === 0xf4) high = 0x8f;
    } else return i;
    for (let k = 1; k < length; k++) {
      const c = bytes[i + k];
      if (c === undefined) return i;
      const [lo, hi] = k === 1 ? [low, high] : [0x80, 0xbf];
      if (c < lo || c > hi) return i + k;
    }
    i += length;
  }
  return -1;
}
