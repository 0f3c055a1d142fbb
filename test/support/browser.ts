// Debian's chromium driven by playwright-core (never a downloaded browser), with screenshots and an axe scan.
import AxeBuilder from '@axe-core/playwright';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Locator, type Page } from 'playwright-core';
import { TEST_PASSWORD } from './api-client';

export const SCREENSHOT_DIR = path.resolve(process.env.TEST_OUTPUT_DIR ?? 'test-results', 'screenshots');

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
}

/**
 * `serviceWorkers: true` lets the app's service worker install (the offline tests). Otherwise it is blocked: each fresh
 * context would download and hash every chunk for it, which slows the other tests on a busy machine and is not theirs.
 */
export async function newPage(browser: Browser, options: { phone?: boolean; serviceWorkers?: boolean } = {}): Promise<Page> {
  const context = await browser.newContext({
    serviceWorkers: options.serviceWorkers ? 'allow' : 'block',
    reducedMotion: 'reduce',
    viewport: options.phone ? { width: 390, height: 844 } : { width: 1280, height: 860 },
    deviceScaleFactor: 1,
  });
  return context.newPage();
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** WCAG 2.x A and AA rules of axe-core; returns the violations (id and the first target of each). */
export async function accessibilityViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  return result.violations.map((v) => `${v.id}: ${v.nodes[0]?.target.join(' ')} (${v.help})`);
}

/** Signs in through the real form and waits for the builds list. */
export async function signIn(page: Page, appUrl: string, email: string, password = TEST_PASSWORD): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Your builds' }).waitFor();
}

/** Whether the element has the keyboard focus (the test's tsconfig has no DOM library, hence the narrow type). */
export async function isFocused(locator: Locator): Promise<boolean> {
  return locator.evaluate((element) => element === (element as unknown as { ownerDocument: { activeElement: unknown } }).ownerDocument.activeElement);
}
