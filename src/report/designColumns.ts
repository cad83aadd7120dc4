/**
 * How much a column of the design table matters when the terminal is too narrow for all of them
 * (table.ts drops columns below 1, lowest first): the IEC 60062 codes repeat the values beside
 * them, the PWM frequency follows from the bits, the pin current has its own limit in the margins.
 *
 * Syntax: designColumnPriority(header)
 * Example: designColumnPriority('codes (IEC 60062)')   // 0.1
 */
export function designColumnPriority(header: string): number {
  if (header.startsWith('codes')) return 0.1;
  if (header === 'PWM') return 0.3;
  if (header === 'pin current') return 0.5;
  return 1;
}
