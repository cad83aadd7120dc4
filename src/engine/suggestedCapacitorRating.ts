/**
 * Standard capacitor voltage ratings, V (the usual catalogue steps for ceramic, film and
 * electrolytic parts; common practice, list from memory).
 */
export const STANDARD_CAPACITOR_RATINGS = [6.3, 10, 16, 25, 35, 50, 63, 100, 160, 200, 250, 400, 450, 630, 1000] as const;

/**
 * Voltage derating asked of a capacitor: its rating at least this multiple of its working
 * voltage. Common practice (derating guides keep capacitors at or below roughly 50 % to 70 % of
 * their rated voltage, i.e. a rating of 1.5x to 2x the working voltage; from memory, no single
 * standard); 1.5 is the lower end, and class-2 ceramics want more (their DC-bias loss grows with
 * the share of the rating in use).
 */
export const CAPACITOR_DERATING = 1.5;

/**
 * The next standard voltage rating at or above `factor` times the working voltage, V; null when
 * no listed rating is high enough (above 1 kV: a specialist part, outside this list).
 *
 * Syntax: suggestedCapacitorRating(working[, factor])
 * Example: suggestedCapacitorRating(3.3)   // 6.3  (3.3 V x 1.5 = 4.95 V)
 *          suggestedCapacitorRating(12)    // 25   (18 V)
 */
export function suggestedCapacitorRating(working: number, factor: number = CAPACITOR_DERATING): number | null {
  const needed = factor * Math.abs(working);
  // A tiny relative allowance so that 6.3 V / 1.5 = 4.2 V asks for 6.3 V, not 10 V, despite rounding.
  return STANDARD_CAPACITOR_RATINGS.find((r) => r >= needed * (1 - 1e-12)) ?? null;
}
