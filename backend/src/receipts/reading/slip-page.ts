// Test support: plain text rows laid out like monospace OCR output, for the parser's specs.
import type { TextPage, TextWord } from './text-lines';
import { makeLine } from './text-lines';

/** Pixels per character column and per row. */
export const CHAR = 10;
export const ROW = 30;

/** A page laid out like monospace OCR output: each word boxed at its column; `confidence` for every word. */
export function slipPage(rows: string[], confidence = 0.95, rowConfidence: Record<number, number> = {}): TextPage {
  const lines = rows
    .map((row, rowIndex) => {
      const words: TextWord[] = [];
      for (const match of row.matchAll(/\S+/g)) {
        words.push({ text: match[0], confidence: rowConfidence[rowIndex] ?? confidence, box: { page: 0, x: (match.index ?? 0) * CHAR, y: rowIndex * ROW, w: match[0].length * CHAR, h: 20 } });
      }
      return words;
    })
    .filter((words) => words.length > 0)
    .map(makeLine);
  return { width: 600, height: rows.length * ROW, source: 'ocr', lines };
}

