import { readFileSync } from 'node:fs';
import { OcrPool } from './ocr';
import { normaliseImage } from './normalise';
import { lineText } from './text-lines';
(async () => {
  const pool = new OcrPool(1);
  for (const file of process.argv.slice(2)) {
    const image = await normaliseImage(readFileSync(file), file.endsWith('.png') ? 'png' : 'jpeg');
    const read = await pool.read(image.png, 0);
    console.log('==', file, read.rotateRadians);
    for (const line of read.lines) console.log('  ', lineText(line), '   [', line.words.map((w) => w.confidence).join(','), ']');
  }
  await pool.close();
})();
