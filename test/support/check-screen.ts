// Steps on the receipt check screen shared by end-to-end tests.
import type { Page } from 'playwright-core';

/** Assigns a line to a system only: typing the system's name narrows the line's assign field to it. */
export async function assignSystem(page: Page, lineNumber: number, system: string): Promise<void> {
  const saved = page.waitForResponse((response) => response.request().method() === 'PATCH' && response.url().includes('/lines/'));
  const field = page.getByRole('combobox', { name: `Assign line ${lineNumber}: type a part, a part number or a system` });
  await field.click();
  await field.fill(system);
  await page.getByRole('group', { name: 'A system only' }).getByRole('option', { name: system, exact: true }).click();
  expect((await saved).status()).toBe(200);
}
