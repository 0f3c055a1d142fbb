// The set-up every end-to-end file shares: the test app serving the built client, Debian's chromium, and with
// `reading` a worker that reads uploaded receipts; all started before the file's tests and closed after them.
import type { Browser } from 'playwright-core';
import { startReadingWorker } from '../../backend/src/jobs/worker';
import { readWithPageImages } from '../../backend/src/receipts/read-with-pages';
import { closeReaders } from '../../backend/src/receipts/reading/read-document';
import { launchBrowser } from './browser';
import { startTestApp, type TestApp } from './test-app';

export interface BrowserApp {
  /** The app (set before the first test runs). */
  t: TestApp;
  browser: Browser;
}

/** Registers the file's beforeAll and afterAll; the returned object is filled in before the first test. */
export function useBrowserApp(options: { reading?: boolean } = {}): BrowserApp {
  const e2e = {} as BrowserApp;
  let stopWorker: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    e2e.t = await startTestApp({ serveClient: true, reading: options.reading });
    if (options.reading) stopWorker = await startReadingWorker(e2e.t.queue, { orm: e2e.t.orm, store: e2e.t.store, read: readWithPageImages });
    e2e.browser = await launchBrowser();
  });
  afterAll(async () => {
    await e2e.browser?.close();
    await stopWorker?.();
    await e2e.t?.close();
    if (options.reading) await closeReaders();
  });
  return e2e;
}
