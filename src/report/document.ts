/**
 * A report as data: titled sections holding tables, key-value lists, paragraphs and charts.
 * The text and Markdown renderers draw the same document, so both always say the same thing.
 */
import type { Align } from './table.js';

export type Block =
  | {
      kind: 'table';
      header: string[];
      rows: string[][];
      align?: Align[];
      /** Per column; below 1: may be left out of a text table too wide for the terminal (table.ts). */
      priority?: number[];
    }
  | { kind: 'pairs'; pairs: Array<[string, string]> }
  | { kind: 'list'; items: string[] }
  | { kind: 'text'; text: string }
  | { kind: 'chart'; title: string; body: string };

export interface Section {
  title: string;
  blocks: Block[];
}

export interface ReportDocument {
  title: string;
  sections: Section[];
  /** One-line verdict. */
  verdict: { pass: boolean; text: string };
}

/** Width a text report fits when nothing else is said (columns; common terminal width). */
export const DEFAULT_WIDTH = 80;
