import type { DesignProgress } from '../design/types.js';
import { formatEng } from '../units/index.js';

/**
 * One progress line of the design search for a terminal (no newline): a bar, the share done, and
 * what is being searched (stage count, resolution and PWM frequency, best settling time so far),
 * or that an empty result is being explained. Cut to `width` columns.
 *
 * Syntax: designProgressLine(fraction, detail, width)
 * Example: designProgressLine(0.42, { phase: 'search', stages: 2, bits: 9, frequency: 31250, best: 1.2e-3 }, 80)
 *          // 'searching [########............]  42 %  2 stages, 9 bits (31.3 kHz), best 1.2 ms'
 */
export function designProgressLine(fraction: number, detail: DesignProgress | undefined, width: number): string {
  const f = Math.min(1, Math.max(0, fraction));
  if (detail?.phase === 'explain') return cut('no design meets every limit; searching for the nearest change that works ...', width);
  const cells = 20;
  const bar = `[${'#'.repeat(Math.round(f * cells))}${'.'.repeat(cells - Math.round(f * cells))}] ${String(Math.round(100 * f)).padStart(3)} %`;
  if (detail?.phase === 'curves') return cut(`trade-off curves ${bar}`, width);
  const parts: string[] = [];
  if (detail?.stages !== undefined) parts.push(`${detail.stages} stage${detail.stages === 1 ? '' : 's'}`);
  if (detail?.bits != null) parts.push(`${detail.bits} bits${detail.frequency !== undefined ? ` (${formatEng(detail.frequency, 'Hz')})` : ''}`);
  parts.push(detail?.best != null ? `best ${formatEng(detail.best, 's')}` : 'no design yet');
  const line = `searching ${bar}  ${parts.join(', ')}`;
  return cut(line, width);
}

function cut(line: string, width: number): string {
  return line.length > width - 1 ? line.slice(0, Math.max(0, width - 1)) : line;
}
