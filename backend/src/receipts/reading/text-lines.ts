// The text of a document as lines of positioned words, whether it came from OCR or a PDF text layer.
import type { ReadBox, ReadPage, ReadWord } from '../../../../shared/api/receipt-reading';

export type TextWord = ReadWord;

export interface TextLine {
  words: TextWord[];
  box: ReadBox;
}

export interface TextPage extends ReadPage {
  lines: TextLine[];
}

export function lineText(line: TextLine): string {
  return line.words.map((word) => word.text).join(' ');
}

/** The smallest box around several boxes of one page (the first box's page). */
export function unionBox(boxes: ReadBox[]): ReadBox {
  const left = Math.min(...boxes.map((box) => box.x));
  const top = Math.min(...boxes.map((box) => box.y));
  const right = Math.max(...boxes.map((box) => box.x + box.w));
  const bottom = Math.max(...boxes.map((box) => box.y + box.h));
  return { page: boxes[0].page, x: left, y: top, w: right - left, h: bottom - top };
}

/** Builds a line from words (left to right), its box around them. */
export function makeLine(words: TextWord[]): TextLine {
  const sorted = [...words].sort((a, b) => a.box.x - b.box.x);
  return { words: sorted, box: unionBox(sorted.map((word) => word.box)) };
}
