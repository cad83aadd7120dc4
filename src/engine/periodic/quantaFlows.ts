import { addFlows, doubleFlow, type Flow } from '../flow.js';

/**
 * Flows over whole numbers of a unit time, remembered: the unit's flow doubled (2^j units) and, in
 * two radix-R digits, the flows over k < R units and over multiples of R units, each formed once by
 * one sum from entries already there.
 */
export interface QuantaTable {
  readonly n: number;
  /** The radix R (a power of two). */
  readonly radix: number;
  /** Flow over 2^j units. */
  readonly powers: Flow[];
  /** Flow over k units, k < R (index k). */
  readonly low: Array<Flow | undefined>;
  /** Flow over j R units (index j). */
  readonly high: Array<Flow | undefined>;
}

/**
 * A table over the unit flow `unit` for counts up to `maxCount`.
 *
 * Syntax: quantaTable(unit, n, maxCount)
 * Example: quantaTable(flow(A, n, T / 512, true, scale), n, 1024)
 */
export function quantaTable(unit: Flow, n: number, maxCount: number): QuantaTable {
  const bits = Math.max(1, Math.ceil(Math.log2(Math.max(2, maxCount))));
  return { n, radix: 2 ** Math.ceil(bits / 2), powers: [unit], low: [], high: [] };
}

/**
 * The flow over k units (k >= 1 whole), with at most one sum per call once the table holds its two
 * digits.
 *
 * Method: k = h R + l; the flow over l units is the flow over l - 2^m units plus the flow over 2^m
 * units (2^m the largest power of two in l), the flow over h R units likewise from (h - 2^m) R
 * and 2^m R; each entry is formed once, always by the same sum, so a value never depends on the
 * order of the calls. Sums and doublings by the flow composition rules E(a + b) = E(a) E(b),
 * K(a + b) = K(a) + E(a) K(b), J(a + b) = J(a) + b K(a) + E(a) J(b) (doubleFlow, flow.ts): no
 * term is formed by cancellation, as in the squaring phase of scaling and squaring.
 *
 * Syntax: tableFlow(table, k)
 * Example: tableFlow(table, 300).E
 */
export function tableFlow(table: QuantaTable, k: number): Flow {
  const h = Math.floor(k / table.radix);
  const l = k - h * table.radix;
  if (h === 0) return lowFlow(table, l);
  if (l === 0) return highFlow(table, h);
  return addFlows(highFlow(table, h), lowFlow(table, l), table.n);
}

function power(table: QuantaTable, j: number): Flow {
  while (table.powers.length <= j) table.powers.push(doubleFlow(table.powers[table.powers.length - 1], table.n));
  return table.powers[j];
}

function lowFlow(table: QuantaTable, l: number): Flow {
  let f = table.low[l];
  if (f) return f;
  const m = Math.floor(Math.log2(l));
  const rest = l - 2 ** m;
  f = rest === 0 ? power(table, m) : addFlows(lowFlow(table, rest), power(table, m), table.n);
  table.low[l] = f;
  return f;
}

function highFlow(table: QuantaTable, h: number): Flow {
  let f = table.high[h];
  if (f) return f;
  const m = Math.floor(Math.log2(h));
  const rest = h - 2 ** m;
  const radixBits = Math.log2(table.radix);
  f = rest === 0 ? power(table, m + radixBits) : addFlows(highFlow(table, rest), power(table, m + radixBits), table.n);
  table.high[h] = f;
  return f;
}
