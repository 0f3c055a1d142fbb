// A small pool of long-lived tesseract.js workers reading with the English model from the npm data package,
// never from the network.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { OEM, PSM, createWorker } from 'tesseract.js';
import type { Worker, Block } from 'tesseract.js';
import { TextLine, TextWord, makeLine } from './text-lines';

/** The LSTM-only integer model: small and fast (STACK-NOTES: 4.0.0_best_int). */
export function trainedDataFolder(): string {
  return path.join(path.dirname(require.resolve('@tesseract.js-data/eng/package.json')), '4.0.0_best_int');
}

/** Where Debian's tesseract-ocr-<lang> packages put their data (installed by the set-up, never fetched). */
const TESSDATA_FOLDERS = ['/usr/share/tesseract-ocr/5/tessdata', '/usr/share/tesseract-ocr/4.00/tessdata'];
/** The tesseract model of a locale's language (ISO 639-1 → tesseract's 639-2 names), for the languages set up. */
const MODEL_BY_LANGUAGE: Record<string, string> = { de: 'deu', fr: 'fra', es: 'spa', it: 'ita', nl: 'nld', pt: 'por', ms: 'msa' };

export interface OcrModel {
  language: string;
  langPath: string;
  gzip: boolean;
}

/** The model a locale reads with: its language's Debian data when installed, else the English model from npm. */
export function modelFor(locale: string): OcrModel {
  const language = MODEL_BY_LANGUAGE[new Intl.Locale(locale).language];
  const folder = language ? TESSDATA_FOLDERS.find((candidate) => existsSync(path.join(candidate, `${language}.traineddata`))) : undefined;
  return language && folder ? { language, langPath: folder, gzip: false } : { language: 'eng', langPath: trainedDataFolder(), gzip: true };
}

/** How tesseract lays out what it reads: one block of lines, one line, or sparse text in any order. */
export type OcrLayout = 'block' | 'line' | 'sparse';

export interface OcrPage {
  lines: TextLine[];
}

interface PoolEntry {
  worker: Worker;
  busy: boolean;
}

/** Workers start once (about 5 s) and then read one page at a time each. */
export class OcrPool {
  private readonly entries: PoolEntry[] = [];
  private starting: Promise<void> | undefined;
  private readonly waiting: Array<(entry: PoolEntry) => void> = [];
  /** Milliseconds the last start took, for the bench. */
  startMs = 0;

  constructor(
    private readonly size = 1,
    private readonly model: OcrModel = { language: 'eng', langPath: trainedDataFolder(), gzip: true },
  ) {}

  start(): Promise<void> {
    this.starting ??= (async () => {
      const began = Date.now();
      const workers = await Promise.all(
        Array.from({ length: this.size }, () =>
          createWorker(this.model.language, OEM.LSTM_ONLY, {
            langPath: this.model.langPath,
            gzip: this.model.gzip,
            // Without this tesseract.js writes the model into the working folder (or IndexedDB).
            cacheMethod: 'none',
          }),
        ),
      );
      for (const worker of workers) {
        // A single uniform block keeps receipt columns on one line; automatic layout scrambles them.
        await worker.setParameters({ tessedit_pageseg_mode: PSM.SINGLE_BLOCK, preserve_interword_spaces: '1', user_defined_dpi: '300' });
        this.entries.push({ worker, busy: false });
      }
      this.startMs = Date.now() - began;
    })();
    return this.starting;
  }

  /**
   * Reads one page (or a band of one) as a single block of text; `layout: 'line'` reads a crop of one printed line as
   * one line (tesseract's single-line mode), which holds a line's faint separators better than the block mode, and
   * `'sparse'` finds what text it can in any order (tesseract's sparse mode), which reads past a pen stroke or a rule.
   */
  async read(png: Buffer, page: number, layout: OcrLayout = 'block'): Promise<OcrPage> {
    await this.start();
    const entry = await this.acquire();
    try {
      if (layout !== 'block') await entry.worker.setParameters({ tessedit_pageseg_mode: layout === 'line' ? PSM.SINGLE_LINE : PSM.SPARSE_TEXT });
      // The page comes straightened by normaliseImage (paper.ts finds the slant): tesseract's own rotateAuto would
      // spend a whole layout pass, about a third of the reading time, finding it again.
      const result = await entry.worker.recognize(png, {}, { blocks: true, text: false });
      return { lines: linesFromBlocks(result.data.blocks ?? [], page) };
    } finally {
      if (layout !== 'block') await entry.worker.setParameters({ tessedit_pageseg_mode: PSM.SINGLE_BLOCK });
      this.release(entry);
    }
  }

  async close(): Promise<void> {
    if (!this.starting) return;
    await this.starting.catch(() => undefined);
    await Promise.all(this.entries.map((entry) => entry.worker.terminate()));
    this.entries.length = 0;
    this.starting = undefined;
  }

  private acquire(): Promise<PoolEntry> {
    const free = this.entries.find((entry) => !entry.busy);
    if (free) {
      free.busy = true;
      return Promise.resolve(free);
    }
    return new Promise((resolve) => this.waiting.push(resolve));
  }

  private release(entry: PoolEntry): void {
    const next = this.waiting.shift();
    if (next) next(entry);
    else entry.busy = false;
  }
}

function linesFromBlocks(blocks: Block[], page: number): TextLine[] {
  const lines: TextLine[] = [];
  for (const block of blocks) {
    for (const paragraph of block.paragraphs) {
      for (const line of paragraph.lines) {
        const words: TextWord[] = line.words
          .filter((word) => word.text.trim() !== '')
          .map((word) => ({
            text: word.text.trim(),
            confidence: Math.round(word.confidence) / 100,
            box: { page, x: word.bbox.x0, y: word.bbox.y0, w: word.bbox.x1 - word.bbox.x0, h: word.bbox.y1 - word.bbox.y0 },
          }));
        if (words.length > 0) lines.push(makeLine(words));
      }
    }
  }
  return lines;
}
