import type { Duties, Network } from '../../circuit/network.js';

/**
 * The duties of both outputs at a fraction f of the code range (model.md 1.1): with a fine output
 * of b bits after a coarse output of B bits, code N = round(f 2^(B+b)) (at most 2^(B+b)), coarse duty
 * floor(N / 2^b) / 2^B and fine duty (N mod 2^b) / 2^b; otherwise the first output's duty is f.
 *
 * Syntax: networkDuties(network, fraction)
 * Example: networkDuties(fine8x8, 0.5)  // { first: 0.5, second: 0 }
 */
export function networkDuties(network: Network, fraction: number): Duties {
  const second = network.second;
  if (second?.role !== 'fine') return { first: fraction, second: null };
  const { coarse, fine } = codeParts(network, fraction);
  return { first: coarse / 2 ** second.coarseBits!, second: fine / 2 ** second.bits! };
}

/**
 * The code a fraction stands for, split into coarse and fine parts (fine outputs only).
 *
 * Syntax: codeParts(network, fraction)
 */
export function codeParts(network: Network, fraction: number): { code: number; coarse: number; fine: number } {
  const b = network.second!.bits!;
  const B = network.second!.coarseBits!;
  const code = Math.min(Math.max(Math.round(fraction * 2 ** (B + b)), 0), 2 ** (B + b));
  const fine = code % 2 ** b;
  return { code, coarse: (code - fine) / 2 ** b, fine };
}

/**
 * The fraction of the code range a code stands for (the identity without a fine output).
 *
 * Syntax: quantizedFraction(network, fraction)
 * Example: quantizedFraction(fine8x8, 0.50001)  // 0.5 (code 32768 of 65536)
 */
export function quantizedFraction(network: Network, fraction: number): number {
  const second = network.second;
  if (second?.role !== 'fine') return fraction;
  return codeParts(network, fraction).code / 2 ** (second.bits! + second.coarseBits!);
}

/** Ideal output at a fraction: low + q (high - low), q the quantized fraction (model.md). */
export function networkIdeal(network: Network, fraction: number): number {
  return network.pin.low + quantizedFraction(network, fraction) * (network.pin.high - network.pin.low);
}
