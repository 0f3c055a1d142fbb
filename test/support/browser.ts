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
 * A desktop page, or a phone's (390 × 844 unless `width` says otherwise; `touch` for taps). The app's service worker
 * is kept out unless `serviceWorker` asks for it: installing it prefetches every chunk, which only the offline test needs.
 */
export async function newPage(browser: Browser, options: { phone?: boolean; width?: number; touch?: boolean; serviceWorker?: boolean } = {}): Promise<Page> {
  const context = await browser.newContext({
    serviceWorkers: options.serviceWorker ? 'allow' : 'block',
    reducedMotion: 'reduce',
    viewport: options.phone ? { width: options.width ?? 390, height: 844 } : { width: 1280, height: 860 },
    deviceScaleFactor: 1,
    hasTouch: options.touch ?? false,
    isMobile: options.touch ?? false,
  });
  return context.newPage();
}

/** An element named by tag, id and class, as page script. */
const NAME_ELEMENT = `(element) => element.tagName.toLowerCase() + (element.id ? '#' + element.id : '') + (element.className && typeof element.className === 'string' ? '.' + element.className.trim().split(/\\s+/).join('.') : '')`;

/**
 * What scrolls sideways: whether the document is wider than the window, and each element whose content is wider than
 * its box while it lets the person scroll it sideways (a region to swipe inside), named by tag, id and class.
 */
export async function sidewaysScroll(page: Page): Promise<{ page: boolean; regions: string[] }> {
  return page.evaluate(`(() => {
    const name = ${NAME_ELEMENT};
    const root = document.documentElement;
    const regions = [];
    for (const element of document.querySelectorAll('body *')) {
      const overflow = getComputedStyle(element).overflowX;
      if ((overflow === 'auto' || overflow === 'scroll') && element.scrollWidth > element.clientWidth + 1) {
        regions.push(name(element));
      }
    }
    return { page: root.scrollWidth > window.innerWidth, regions };
  })()`);
}

/**
 * Text the window cuts: each visible element with text of its own whose box reaches past the window's left or right
 * edge (a label or figure half off a phone's screen, which no scrolling shows), named as `sidewaysScroll` names them;
 * text clipped away for screen readers only is left out.
 */
export async function cutAtEdge(page: Page): Promise<string[]> {
  return page.evaluate(`(() => {
    const name = ${NAME_ELEMENT};
    const cut = [];
    for (const element of document.querySelectorAll('body *')) {
      const text = [...element.childNodes].some((node) => node.nodeType === Node.TEXT_NODE && node.textContent.trim() !== '');
      if (!text) continue;
      const box = element.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || getComputedStyle(element).visibility === 'hidden') continue;
      // Text for screen readers only (inside a box clipped to nothing) is not on the screen to be cut.
      let clipped = false;
      for (let box = element; box && !clipped; box = box.parentElement) {
        const style = getComputedStyle(box);
        clipped = (style.clip !== 'auto' && style.position === 'absolute') || style.clipPath.startsWith('inset(50%');
      }
      if (clipped) continue;
      if (box.right > window.innerWidth + 1 || box.left < -1) {
        cut.push(name(element) + ' "' + element.textContent.trim().slice(0, 30) + '"');
      }
    }
    return cut;
  })()`);
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
