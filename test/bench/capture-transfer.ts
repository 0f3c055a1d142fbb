// What a phone pulls and pushes: the production build's initial JavaScript (gzip, as a server sends it) now that the
// service worker is in, and a 4000 × 3000 phone-like photo after the client's own downscaling, run in Debian's
// chromium on the very module the capture queue uses (src/app/features/receipts/services/photo-downscale.ts).
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { build } from 'esbuild';
import { launchBrowser } from '../support/browser';
import { PHONE_PHOTO_SIZE, phonePhoto } from '../support/phone-photo';
import { runSection, type Figures } from './print-figures';

const ROOT = path.resolve(__dirname, '../..');
const DIST = path.join(ROOT, 'dist/tallyhood/browser');
/** In kB as angular.json's budgets count them: 1 kB = 1024 bytes. */
const INITIAL_JS_GOAL_KB = 150;

const kB = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB (${bytes} bytes)`;
/** Level 6: zlib's default, and what common web servers use for on-the-fly gzip. */
const gzipped = (file: string) => gzipSync(readFileSync(path.join(DIST, file)), { level: 6 }).length;

function initialTransfer(): Figures {
  // The same up-to-date check as npm start and npm test: builds only when a source is newer than dist/.
  execFileSync(process.execPath, ['--input-type=module', '-e', "const m = await import('./scripts/setup.mjs'); if (!(await m.ensureClientBuild()).ok) process.exit(1);"], { cwd: ROOT, stdio: 'inherit' });
  const index = readFileSync(path.join(DIST, 'index.html'), 'utf8');
  // What the browser fetches before the first screen: the entry script and every chunk it imports statically, however
  // deep (index.html preloads only the first ten), and the styles. `import("./chunk…")` is a lazy route: not counted.
  const scripts = [...index.matchAll(/<script[^>]*\bsrc="([^"]+\.js)"/g)].map((match) => match[1]);
  for (let next = 0; next < scripts.length; next += 1) {
    const code = readFileSync(path.join(DIST, scripts[next]), 'utf8');
    for (const [, chunk] of code.matchAll(/(?:\bfrom|\bimport)\s*"\.\/([\w-]+\.js)"/g)) if (!scripts.includes(chunk)) scripts.push(chunk);
  }
  const styles = [...index.matchAll(/<link[^>]*rel="stylesheet"[^>]*href="([^"]+\.css)"/g)].map((match) => match[1]);
  const js = scripts.reduce((sum, file) => sum + gzipped(file), 0);
  const css = styles.reduce((sum, file) => sum + gzipped(file), 0);
  return {
    [`initial JS, gzip (${scripts.length} files; goal ≤ ${INITIAL_JS_GOAL_KB} kB)`]: `${kB(js)} ${js <= INITIAL_JS_GOAL_KB * 1024 ? 'met' : 'NOT MET'}`,
    'initial JS, brotli': kB(scripts.reduce((sum, file) => sum + brotliCompressSync(readFileSync(path.join(DIST, file))).length, 0)),
    'initial JS + CSS, gzip': kB(js + css),
    'service worker script (after first screen), gzip': kB(gzipped('ngsw-worker.js')),
  };
}

async function downscaledPhoto(): Promise<Figures> {
  const original = await phonePhoto();
  const bundled = await build({
    entryPoints: [path.join(ROOT, 'src/app/features/receipts/services/photo-downscale.ts')],
    bundle: true,
    write: false,
    format: 'iife',
    globalName: 'photoDownscale',
    target: 'es2022',
  });
  const browser = await launchBrowser();
  try {
    const page = await browser.newPage();
    await page.addScriptTag({ content: bundled.outputFiles[0].text });
    // Runs in the page: the photo arrives as base64, goes through the same function the camera button uses.
    const result = await page.evaluate(async (base64: string) => {
      const scope = globalThis as unknown as {
        atob(text: string): string;
        photoDownscale: { downscalePhoto(file: unknown): Promise<{ size: number; type: string }> };
        File: new (parts: unknown[], name: string, options: { type: string }) => unknown;
        createImageBitmap(file: unknown): Promise<{ width: number; height: number }>;
      };
      const binary = scope.atob(base64);
      const bytes = new Uint8Array(binary.length);
      for (let index = 0; index < binary.length; index += 1) bytes[index] = binary.charCodeAt(index);
      const started = performance.now();
      const smaller = await scope.photoDownscale.downscalePhoto(new scope.File([bytes], 'counter.jpg', { type: 'image/jpeg' }));
      const milliseconds = performance.now() - started;
      const bitmap = await scope.createImageBitmap(smaller);
      return { size: smaller.size, type: smaller.type, width: bitmap.width, height: bitmap.height, milliseconds };
    }, original.toString('base64'));
    return {
      [`phone photo as taken (${PHONE_PHOTO_SIZE.width} × ${PHONE_PHOTO_SIZE.height} JPEG)`]: kB(original.length),
      'phone photo as sent (downscaled in chromium)': `${kB(result.size)}, ${result.width} × ${result.height} ${result.type}`,
      'downscaling time in chromium': `${Math.round(result.milliseconds)} ms`,
    };
  } finally {
    await browser.close();
  }
}

export async function benchCaptureTransfer(): Promise<Figures> {
  return { ...initialTransfer(), ...(await downscaledPhoto()) };
}

if (require.main === module) runSection(benchCaptureTransfer);
