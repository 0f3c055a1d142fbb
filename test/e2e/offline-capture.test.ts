// In Debian's chromium on a phone-sized page: two receipts photographed without signal wait on the device (through a
// reload), show as "Waiting to send (2)", and once the connection returns arrive once each and are read. The large
// photo travels downscaled; the small one untouched.
import path from 'node:path';
import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { phonePhoto } from '../support/phone-photo';

jest.setTimeout(240_000);

const SMALL_SLIP = path.resolve(__dirname, '../fixtures/receipts/generated/core-1.png');

const e2e = useBrowserApp({ reading: true });

const receiptsOf = (buildId: string) => e2e.t.orm.em.fork().find(Receipt, { build: buildId }, { orderBy: { createdAt: 'asc' } });

async function waitUntil<T>(what: () => Promise<T>, done: (value: T) => boolean, timeout = 120_000): Promise<T> {
  const until = Date.now() + timeout;
  for (;;) {
    const value = await what();
    if (done(value) || Date.now() > until) return value;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}

/** The worker installed (shell prefetched) and in control of the page, so a reload without signal still loads. */
async function controlledByServiceWorker(page: Page): Promise<boolean> {
  return page.evaluate(async () => {
    const nav = (globalThis as unknown as { navigator: { serviceWorker: { ready: Promise<unknown>; controller: unknown } } }).navigator;
    await nav.serviceWorker.ready;
    return nav.serviceWorker.controller !== null;
  });
}

it('keeps two photos taken without signal through a reload and sends each once when the signal returns', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-offline');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Sage roadster', locale: 'en-US' })).body as { id: string };
  const receiptsUrl = `${e2e.t.url}/builds/${build.id}/receipts`;
  const bigPhoto = await phonePhoto();

  const page = await newPage(e2e.browser, { phone: true, serviceWorker: true });
  await signIn(page, e2e.t.url, owner.email);
  await page.goto(receiptsUrl);
  await page.getByRole('heading', { name: 'No receipts yet' }).waitFor();
  // Once the worker is installed, a visit with signal leaves the build's reads in its cache.
  await page.evaluate(() => (globalThis as unknown as { navigator: { serviceWorker: { ready: Promise<unknown> } } }).navigator.serviceWorker.ready);
  await page.reload();
  await page.getByRole('heading', { name: 'No receipts yet' }).waitFor();
  expect(await controlledByServiceWorker(page)).toBe(true);

  await page.context().setOffline(true);
  const camera = page.locator('#bar-receipt-camera');
  await camera.setInputFiles({ name: 'counter-photo.jpg', mimeType: 'image/jpeg', buffer: bigPhoto });
  await page.getByRole('button', { name: 'Waiting to send (1)' }).waitFor();
  await camera.setInputFiles(SMALL_SLIP);
  await page.getByRole('button', { name: 'Waiting to send (2)' }).waitFor();

  await page.reload();
  await page.getByRole('button', { name: 'Waiting to send (2)' }).waitFor();
  await screenshot(page, 'offline-capture-waiting');
  expect(await receiptsOf(build.id)).toHaveLength(0);

  await page.context().setOffline(false);
  await page.getByRole('button', { name: /Waiting to send/ }).waitFor({ state: 'detached', timeout: 60_000 });
  const receipts = await waitUntil(() => receiptsOf(build.id), (found) => found.length === 2 && found.every((r) => r.state === 'to_check'));
  expect(receipts.map((r) => [r.originalFilename, r.state])).toEqual([
    ['counter-photo.jpg', 'to_check'],
    ['core-1.png', 'to_check'],
  ]);
  // The phone photo was brought to a 2000 px long edge before it was queued; the small slip went as it was.
  const sentPhoto = await e2e.t.store.get(receipts[0].documentKey);
  const { width, height } = await sharp(sentPhoto).metadata();
  expect([width, height]).toEqual([2000, 1500]);
  expect(sentPhoto.length).toBeLessThan(bigPhoto.length / 3);
  expect((await e2e.t.store.get(receipts[1].documentKey)).equals(readFileSync(SMALL_SLIP))).toBe(true);

  // Nothing is sent twice: after another start the list holds the two and no chip is left.
  await page.reload();
  // Both slips are from the same invented shop, whose name the reading found on each.
  await page.getByRole('link', { name: /BRACKENRIDGE/i }).nth(1).waitFor();
  expect(await page.getByRole('button', { name: /Waiting to send/ }).count()).toBe(0);
  expect(await receiptsOf(build.id)).toHaveLength(2);
  await page.context().close();
});
