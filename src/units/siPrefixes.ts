/**
 * SI prefixes and their decimal exponents, from the SI Brochure (BIPM, 9th edition 2019, with
 * the 2022 additions ronna/quetta/ronto/quecto). `u` stands in for the micro sign where only
 * ASCII is at hand (common practice); `K` is accepted for kilo in shorthand (common practice).
 */

/** Prefix symbol written on output, by exponent (multiples of 3). */
export const PREFIX_BY_EXPONENT: Readonly<Record<number, string>> = {
  [-30]: 'q', [-27]: 'r', [-24]: 'y', [-21]: 'z', [-18]: 'a', [-15]: 'f', [-12]: 'p', [-9]: 'n',
  [-6]: '\u00b5', [-3]: 'm', 0: '', 3: 'k', 6: 'M', 9: 'G', 12: 'T', 15: 'P', 18: 'E', 21: 'Z',
  24: 'Y', 27: 'R', 30: 'Q',
};

/** Prefix letters accepted in shorthand (`10k`, `100n`) and letter-and-digit codes, by exponent. */
export const SHORTHAND_PREFIX_EXPONENT: Readonly<Record<string, number>> = {
  p: -12, n: -9, u: -6, '\u00b5': -6, '\u03bc': -6, m: -3, k: 3, K: 3, M: 6, G: 9, T: 12,
};
