import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';

export type Distribution = 'normal' | 'uniform';

/**
 * `count` rows of `width` independent deviates in [-1, 1], row-major, reproducible from `seed`:
 * `normal` is a normal of sigma = 1/3 truncated at +-1 (a tolerance read as +-3 sigma, common
 * practice), `uniform` is uniform on [-1, 1).
 *
 * Method: xoroshiro128+ (Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM TOMS 47(4), 2021) from pure-rand, 53-bit uniforms; normals by the Box-Muller transform
 * (Box & Muller, Ann. Math. Statist. 29(2), 1958), both values of each pair used in turn,
 * truncated by rejection (a draw beyond 3 sigma is discarded and drawn again, which leaves
 * exactly the normal law conditioned on the interval).
 *
 * Syntax: drawDeviates(count, width, seed, distribution)
 * Example: drawDeviates(10000, 4, 1, 'normal')  // Float64Array(40000)
 */
export function drawDeviates(count: number, width: number, seed: number, distribution: Distribution): Float64Array {
  const rng = xoroshiro128plus(seed | 0);
  const out = new Float64Array(count * width);
  if (distribution === 'uniform') {
    for (let i = 0; i < out.length; i++) out[i] = 2 * uniformFloat64(rng) - 1;
    return out;
  }
  let spare = Number.NaN;
  const standardNormal = (): number => {
    if (!Number.isNaN(spare)) {
      const z = spare;
      spare = Number.NaN;
      return z;
    }
    const u1 = 1 - uniformFloat64(rng); // (0, 1]: the logarithm stays finite
    const u2 = uniformFloat64(rng);
    const radius = Math.sqrt(-2 * Math.log(u1));
    spare = radius * Math.sin(2 * Math.PI * u2);
    return radius * Math.cos(2 * Math.PI * u2);
  };
  for (let i = 0; i < out.length; i++) {
    let z: number;
    do z = standardNormal() / 3;
    while (z < -1 || z > 1);
    out[i] = z;
  }
  return out;
}
