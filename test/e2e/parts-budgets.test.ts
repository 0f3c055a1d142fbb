// In Debian's chromium: the owner sets system budgets, adds parts through the dialog, imports a 50-row CSV (one bad
// row left out) and reads each system's estimate against its budget on the Parts screen; then works the inventory.
import type { Page } from 'playwright-core';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';

jest.setTimeout(180_000);

const e2e = useBrowserApp();

const HEADER = 'system,description,part number,quantity,unit,estimated unit cost,status,storage location,source link,notes';

/**
 * 50 invented parts with figures checked by hand:
 * - Engine, 25 rows: 2 each at 45.25 = 90.50 a row; 25 × 90.50 = 2,262.50.
 * - Brakes, 15 rows: 1 each at 19.99 = 19.99 a row; 15 × 19.99 = 299.85. On the shelf, in Bin 1, Bin 2 or no location.
 * - Brakes, 10 rows: 3 ft of tubing at 0.125 = 0.375, rounded half up to the cent = 0.38 a row; 10 × 0.38 = 3.80.
 * Plus one row naming a system the build does not have, which the import must refuse.
 */
function partsCsv(): string {
  const rows: string[] = [HEADER];
  for (let i = 1; i <= 25; i++) rows.push(`Engine,Hose clamp pack ${i},HC-${100 + i},2,each,45.25,planned,,,`);
  for (let i = 1; i <= 15; i++) {
    const location = i % 3 === 0 ? '' : `Bin ${i % 3}`;
    rows.push(`Brakes,Caliper bolt kit ${i},CB-${200 + i},1,each,19.99,on hand,${location},,`);
  }
  for (let i = 1; i <= 10; i++) rows.push(`brakes,"Brake line tubing, 3/16 in., run ${i}",BL-${300 + i},3,ft,0.125,planned,,,cut to length`);
  rows.push('Cooling tower,Imaginary fan shroud,XX-1,1,each,10.00,planned,,,');
  return rows.join('\r\n') + '\r\n';
}

/** The little of the DOM that readText uses (this tsconfig has no DOM library: the function runs in the browser). */
interface PageElement {
  tagName: string;
  children: ArrayLike<PageElement>;
  textContent: string | null;
  cloneNode(deep: boolean): PageElement;
  querySelectorAll(selector: string): ArrayLike<{ remove(): void }>;
}

/** Text as read out: icons (ligature names) left out, whitespace collapsed, a table row's cells joined by " | ". */
function readText(elements: unknown[]): string[] {
  const textOf = (element: PageElement) => {
    const copy = element.cloneNode(true);
    Array.from(copy.querySelectorAll('mat-icon')).forEach((icon) => icon.remove());
    return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
  };
  return (elements as PageElement[]).map((element) =>
    element.tagName === 'TR' ? Array.from(element.children).map(textOf).join(' | ') : textOf(element),
  );
}

/** The text of each system's totals row. */
async function totalsRows(page: Page): Promise<string[]> {
  return page.locator('tr.total-row').evaluateAll(readText);
}

async function setBudget(page: Page, system: string, amount: string) {
  const field = page.getByRole('textbox', { name: `Budget for ${system}` });
  await field.fill(amount);
  const saved = page.waitForResponse((response) => response.request().method() === 'PATCH' && response.url().includes('/systems/'));
  await field.press('Enter');
  expect((await saved).status()).toBe(200);
}

it('budgets two systems, adds and imports parts, and shows each system against its budget', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-parts');
  const created = await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Teal wagon swap', locale: 'en-US' });
  expect(created.status).toBe(201);
  const buildUrl = `${e2e.t.url}/builds/${created.body.id}`;

  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);

  // Budgets: two systems, and the live totals.
  await page.goto(`${buildUrl}/budgets`);
  await page.getByRole('heading', { name: 'Budgets', level: 1 }).waitFor();
  await setBudget(page, 'Engine', '2000');
  await setBudget(page, 'Brakes', '1200.00');
  await expect(page.getByRole('textbox', { name: 'Budget for Engine' }).inputValue()).resolves.toBe('2000.00');
  // Typing shows the new build budget before anything is saved: 2,000.00 + 1,200.00 + 0.00 contingency + 150.00 typed.
  await page.getByRole('textbox', { name: 'Contingency' }).fill('150');
  await page.getByText('$3,350.00').first().waitFor();
  const savedContingency = page.waitForResponse((response) => response.request().method() === 'PUT' && response.url().endsWith('/contingency'));
  await page.getByRole('textbox', { name: 'Contingency' }).press('Enter');
  expect((await savedContingency).status()).toBe(200);
  // A budget the currency cannot pay is refused on the field: USD has 2 decimals.
  await page.getByRole('textbox', { name: 'Budget for Fuel' }).fill('10.005');
  await page.getByRole('textbox', { name: 'Budget for Fuel' }).press('Enter');
  await page.getByText('Too many decimals: use at most 2 decimals.').waitFor();
  await page.getByRole('textbox', { name: 'Budget for Fuel' }).fill('0.00');
  await screenshot(page, 'budgets-owner');
  expect(await accessibilityViolations(page)).toEqual([]);

  // Parts: the empty screen, then two parts through the dialog.
  await page.getByRole('link', { name: 'Parts' }).first().click();
  await page.getByRole('heading', { name: 'No parts on the bill of materials yet' }).waitFor();
  await screenshot(page, 'parts-empty');
  expect(await accessibilityViolations(page)).toEqual([]);

  await page.getByRole('button', { name: 'Add part' }).first().click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Description').fill('Ceramic brake pads, front axle');
  await dialog.getByRole('combobox', { name: 'System' }).click();
  await page.getByRole('option', { name: 'Brakes' }).click();
  await dialog.getByLabel('Part number').fill('BP-2231');
  await dialog.getByLabel('Quantity').fill('2');
  await dialog.getByLabel('Estimated unit cost').fill('64.5');
  await dialog.getByText('$129.00').waitFor();
  await screenshot(page, 'part-form-dialog');
  expect(await accessibilityViolations(page)).toEqual([]);
  await dialog.getByRole('button', { name: 'Add part' }).click();
  await dialog.waitFor({ state: 'detached' });

  await page.getByRole('button', { name: 'Add part' }).first().click();
  await dialog.getByLabel('Description').fill('Stainless brake hose set');
  await dialog.getByRole('combobox', { name: 'System' }).click();
  await page.getByRole('option', { name: 'Brakes' }).click();
  await dialog.getByLabel('Quantity').fill('1');
  await dialog.getByRole('combobox', { name: 'Unit' }).click();
  await page.getByRole('option', { name: 'set' }).click();
  await dialog.getByLabel('Estimated unit cost').fill('189.99');
  await dialog.getByRole('button', { name: 'Add part' }).click();
  await dialog.waitFor({ state: 'detached' });
  // Brakes: 2 × 64.50 + 189.99 = 318.99 of 1,200.00.
  await expect(totalsRows(page)).resolves.toEqual(['Brakes: planned against budget | $318.99 | of $1,200.00 budget planned $881.01 under budget']);

  // Import: the preview flags the bad row; nothing imports until it is left out.
  await page.getByRole('button', { name: 'Import CSV' }).click();
  await dialog.locator('input[type=file]').setInputFiles({ name: 'wagon-parts.csv', mimeType: 'text/csv', buffer: Buffer.from(partsCsv()) });
  await dialog.getByText('51 rows read:').waitFor();
  await expect(dialog.getByRole('status').evaluateAll(readText)).resolves.toEqual(['51 rows read: 50 ready, 1 with problems. Rows with problems are listed first.']);
  await dialog.getByText('System: No active system named "Cooling tower" on this build.').waitFor();
  const importButton = dialog.getByRole('button', { name: 'Import 50 parts' });
  expect(await importButton.isDisabled()).toBe(true);
  await screenshot(page, 'import-preview');
  expect(await accessibilityViolations(page)).toEqual([]);
  await dialog.getByRole('checkbox', { name: 'Leave out the 1 row with problems' }).check();
  // The button is enabled once the form has taken the tick (fails on timeout if it never is).
  await dialog.getByRole('button', { name: 'Import 50 parts', disabled: false }).waitFor();
  await importButton.click();
  await dialog.waitFor({ state: 'detached' });
  await page.getByText('Imported 50 parts; 1 row left out.').waitFor();

  // Every part on one page: 52 parts.
  // Material lays a larger touch target over the page-size select; a person's click lands on it.
  await page.locator('.mat-mdc-paginator-touch-target').click();
  await page.getByRole('option', { name: '100' }).click();
  await expect(page.locator('tr.part-row').count()).resolves.toBe(52);
  // Engine: 2,262.50 against 2,000.00 is 262.50 over. Brakes: 318.99 + 299.85 + 3.80 = 622.64 against 1,200.00, 577.36 left.
  await expect(totalsRows(page)).resolves.toEqual([
    'Engine: planned against budget | $2,262.50 | of $2,000.00 budget planned $262.50 over budget',
    'Brakes: planned against budget | $622.64 | of $1,200.00 budget planned $577.36 under budget',
  ]);
  // Brakes are safety-critical: the caution shows.
  await page.getByText(/Tallyhood records costs only\./).waitFor();
  // A unit price of 0.125 shows in full, and the row total rounds half up to the cent.
  const tubingRow = page.locator('tr.part-row', { hasText: 'Brake line tubing, 3/16 in., run 1' }).first();
  await expect(tubingRow.innerText()).resolves.toMatch(/3 ft\s+\$0\.125\s+\$0\.38/);
  await screenshot(page, 'parts-owner');
  expect(await accessibilityViolations(page)).toEqual([]);

  // The filter narrows to matching parts and the totals stay the whole system's.
  await page.getByLabel('Filter parts').fill('BL-3');
  await expect(page.locator('tr.part-row').count()).resolves.toBe(10);
  await expect(totalsRows(page)).resolves.toEqual(['Brakes: planned against budget | $622.64 | of $1,200.00 budget planned $577.36 under budget']);
  await page.getByLabel('Filter parts').fill('');

  // The Budgets screen agrees with the Parts screen.
  await page.getByRole('link', { name: 'Budgets' }).first().click();
  await page.getByRole('textbox', { name: 'Budget for Engine' }).waitFor();
  await page.getByText('planned $262.50 over budget').first().waitFor();
  await page.getByText('planned $577.36 under budget').first().waitFor();
  // Budget with contingency 2,000.00 + 1,200.00 + 150.00 = 3,350.00; planned 2,262.50 + 622.64 = 2,885.14. Planned
  // against budget compares with the systems' budget, the contingency kept apart: 3,200.00 - 2,885.14 = 314.86 under.
  await expect(page.locator('[data-figure="budgetWithContingency"]').getAttribute('data-value')).resolves.toBe('3350.00');
  await expect(page.locator('[data-figure="planned"]').getAttribute('data-value')).resolves.toBe('2885.14');
  await expect(page.locator('[data-figure="planningGap"]').getAttribute('data-value')).resolves.toBe('314.86');
  await page.getByText('planned $314.86 under budget').first().waitFor();
  await screenshot(page, 'budgets-after-import');

  // Inventory: 15 caliper bolt kits on the shelf in Bin 1, Bin 2 and no location (last).
  await page.getByRole('link', { name: 'Inventory' }).first().click();
  await page.getByRole('heading', { name: 'On the shelf' }).waitFor();
  const locations = page.locator('section.location');
  await expect(locations.evaluateAll((sections) => sections.map((section) => section.getAttribute('aria-label')))).resolves.toEqual([
    'Bin 1',
    'Bin 2',
    'No location',
  ]);
  await expect(locations.nth(0).locator('li').count()).resolves.toBe(5);
  await expect(locations.nth(2).locator('li').count()).resolves.toBe(5);
  await page.getByRole('button', { name: 'Mark fitted: Caliper bolt kit 1', exact: true }).click();
  await page.getByText('Caliper bolt kit 1 is marked fitted.').waitFor();
  await expect(page.getByRole('button', { name: 'Mark fitted: Caliper bolt kit 1', exact: true }).count()).resolves.toBe(0);
  await page.getByRole('button', { name: 'Offer for sale: Caliper bolt kit 2', exact: true }).click();
  await page.getByRole('dialog').getByLabel('Asking price').fill('12.5');
  await page.getByRole('dialog').getByRole('button', { name: 'Offer for sale' }).click();
  await page.getByText('Caliper bolt kit 2 is offered for sale.').waitFor();
  const saleList = page.locator('.sale-list');
  await expect(saleList.innerText()).resolves.toMatch(/Caliper bolt kit 2[\s\S]*\$12\.50/);
  await screenshot(page, 'inventory-owner');
  expect(await accessibilityViolations(page)).toEqual([]);

  // The same screens on a phone, 390 px wide: no sideways scrolling of the page.
  const phone = await newPage(e2e.browser, { phone: true });
  await signIn(phone, e2e.t.url, owner.email);
  for (const section of ['parts', 'budgets', 'inventory']) {
    await phone.goto(`${buildUrl}/${section}`);
    await phone.getByRole('heading', { name: section[0].toUpperCase() + section.slice(1), level: 1 }).waitFor();
    await phone.waitForLoadState('networkidle');
    await screenshot(phone, `${section}-phone`);
    expect(await accessibilityViolations(phone)).toEqual([]);
    const overflow = await phone.evaluate<number>('document.documentElement.scrollWidth - document.documentElement.clientWidth');
    expect(overflow).toBe(0);
  }
  // On a phone, Inventory sits in the bottom bar's "More" menu.
  await phone.getByRole('button', { name: 'More' }).click();
  await phone.getByRole('menuitem', { name: 'Inventory' }).waitFor();
  await screenshot(phone, 'more-menu-phone');
});
