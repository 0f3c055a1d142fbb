// The receipt in a mailed message's body (an order confirmation with no attachment): the original's text when the
// message forwards one, HTML turned into text by html-to-text (links and images dropped, tables kept in columns), laid
// out as positioned lines so the parser reads it as it reads a PDF's text layer.
import { convert, type HtmlToTextOptions } from 'html-to-text';
import { simpleParser, type ParsedMail } from 'mailparser';
import type { TextLine, TextPage } from './text-lines';

/** How a mailed message is stored as a receipt's document. */
export const MAIL_CONTENT_TYPE = 'message/rfc822';

const HTML_TO_TEXT: HtmlToTextOptions = {
  wordwrap: false,
  selectors: [
    { selector: 'a', options: { ignoreHref: true } },
    { selector: 'img', format: 'skip' },
    // Order confirmations lay their items out in tables: kept as columns, so a line's amount stays on its line.
    { selector: 'table', format: 'dataTable', options: { uppercaseHeaderCells: false, maxColumnWidth: 120 } },
    ...['h1', 'h2', 'h3', 'h4', 'h5', 'h6'].map((selector) => ({ selector, options: { uppercase: false } })),
  ],
};

/** The lines that open a forwarded original in the common mail programs' forwards. */
const FORWARD_MARKER = /^\s*(-{2,}\s*(forwarded message|original message)\s*-{2,}|begin forwarded message:?)\s*$/i;
const HEADER_LINE = /^\s*(from|to|cc|date|sent|subject|reply-to)\s*:/i;
const FROM_LINE = /^\s*from\s*:\s*(.*)$/i;
const QUOTE = /^(\s*>)+\s?/;

export interface MailBody {
  text: string;
  /** The forwarded original's sender as written ("Redline Parts <orders@...>"), when there is one. */
  originalFrom: string | null;
}

/** Where a forwarded original's header block starts: after the last marker, else the last From: with a Subject: or Date: close below. */
function originalHeaderStart(lines: string[]): number {
  for (let index = lines.length - 1; index >= 0; index -= 1) if (FORWARD_MARKER.test(lines[index])) return index + 1;
  for (let index = lines.length - 1; index >= 0; index -= 1) {
    if (FROM_LINE.test(lines[index]) && lines.slice(index + 1, index + 7).some((line) => /^\s*(subject|date|sent)\s*:/i.test(line))) return index;
  }
  return -1;
}

/** The text to read: the forwarded original when the message forwards one, else the whole body; quoting removed. */
export function originalText(body: string): MailBody {
  const lines = body.replace(/\r\n?/g, '\n').split('\n').map((line) => line.replace(QUOTE, ''));
  let start = originalHeaderStart(lines);
  if (start < 0) return { text: lines.join('\n').trim(), originalFrom: null };
  let originalFrom: string | null = null;
  while (start < lines.length && (HEADER_LINE.test(lines[start]) || lines[start].trim() === '')) {
    const from = FROM_LINE.exec(lines[start]);
    if (from) originalFrom = from[1].trim() || null;
    start += 1;
  }
  return { text: lines.slice(start).join('\n').trim(), originalFrom };
}

export function mailBody(parsed: ParsedMail): MailBody {
  const html = typeof parsed.html === 'string' ? parsed.html : '';
  return originalText(html ? convert(html, HTML_TO_TEXT) : (parsed.text ?? ''));
}

/** The shop's name from an original's From ("Redline Parts <orders@redline.test>" → "Redline Parts"). */
function senderName(from: string | null): string | null {
  const name = from?.replace(/<[^>]*>/g, '').replace(/\[mailto:[^\]]*\]/gi, '').replace(/["']/g, '').trim();
  return name && !name.includes('@') ? name : null;
}

/** Character cell of the text laid out as a page: the columns of a text table stay columns for the parser. */
const CHAR_WIDTH = 10;
const LINE_HEIGHT = 24;
const FONT_HEIGHT = 20;

export function textPage(text: string): TextPage {
  const rows = text.split('\n');
  const lines: TextLine[] = [];
  rows.forEach((row, index) => {
    const y = index * LINE_HEIGHT;
    const words = [...row.matchAll(/\S+/g)].map((match) => ({
      text: match[0],
      confidence: 1,
      box: { page: 0, x: (match.index ?? 0) * CHAR_WIDTH, y, w: match[0].length * CHAR_WIDTH, h: FONT_HEIGHT },
    }));
    if (words.length === 0) return;
    const last = words[words.length - 1].box;
    lines.push({ words, box: { page: 0, x: words[0].box.x, y, w: last.x + last.w - words[0].box.x, h: FONT_HEIGHT } });
  });
  const width = Math.max(1, ...rows.map((row) => row.length)) * CHAR_WIDTH;
  return { width, height: Math.max(1, rows.length) * LINE_HEIGHT, source: 'text', lines };
}

/** The page the parser reads from a stored message: the forwarded original's sender (the shop) first, then its text. */
export async function mailTextPage(raw: Buffer): Promise<TextPage> {
  const body = mailBody(await simpleParser(raw));
  const shop = senderName(body.originalFrom);
  return textPage(shop ? `${shop}\n${body.text}` : body.text);
}
