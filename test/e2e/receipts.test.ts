// In Debian's chromium: the owner photographs a receipt (a generated slip with a core charge), watches it being read,
// assigns its lines to systems on the check screen, files it, sees it Filed in the list, and records the core handed in.
import path from 'node:path';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { accessibilityViolations, isFocused, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { assignSystem } from '../support/check-screen';

jest.setTimeout(240_000);

const SLIP = path.resolve(__dirname, '../fixtures/receipts/generated/core-1.png');

const e2e = useBrowserApp({ reading: true });

it('reads an uploaded slip, checks and files it, and tracks its core deposit', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-receipts');
  const created = await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Teal wagon swap', locale: 'en-US' });
  expect(created.status).toBe(201);
  const buildUrl = `${e2e.t.url}/builds/${created.body.id}`;

  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);
  await page.goto(`${buildUrl}/receipts`);
  await page.getByRole('heading', { name: 'No receipts yet' }).waitFor();
  await screenshot(page, 'receipts-empty');
  expect(await accessibilityViolations(page)).toEqual([]);

  // A file that is not a receipt is refused with the server's words; the slip is accepted.
  await page.locator('#receipt-files').setInputFiles([{ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('not a receipt') }]);
  await page.getByRole('alert').filter({ hasText: 'notes.txt' }).waitFor();
  await page.locator('#receipt-files').setInputFiles(SLIP);
  await page.getByText('Uploaded, reading now').waitFor();
  await screenshot(page, 'receipts-uploaded');

  await page.getByRole('link', { name: /core-1\.png|BRACKENRIDGE/i }).first().click();
  // The check screen polls while the worker reads, then shows the fields.
  await page.getByText('Ready to check').waitFor({ timeout: 120_000 });
  await page.getByRole('textbox', { name: 'Description, line 1' }).waitFor();
  await expect(page.getByLabel('Total', { exact: true }).inputValue()).resolves.toBe('285.68');
  await expect(page.getByLabel('Date', { exact: true }).inputValue()).resolves.toBe('2026-04-20');
  const lineCount = await page.getByRole('textbox', { name: /^Description, line \d+$/ }).count();
  expect(lineCount).toBe(4);
  // 96.00 + 40.00 + 41.97 + 88.40 = 266.37; + 19.31 tax = 285.68, the printed total.
  await page.getByText('Adds up to the printed total of $285.68.').waitFor();
  await expect(page.getByRole('button', { name: /File receipt/ }).isDisabled()).resolves.toBe(true);
  await page.getByText('Assign 4 lines to a part or a system before filing.').waitFor();
  await screenshot(page, 'receipt-check-unassigned');
  expect(await accessibilityViolations(page)).toEqual([]);

  // Typing a wrong amount shows the difference live; putting it back reconciles again.
  const fluid = page.getByRole('textbox', { name: 'Amount, line 3' });
  await fluid.fill('41.79');
  await page.getByText('The printed total is $0.18 more than the lines, tax and shipping', { exact: false }).waitFor();
  await fluid.fill('41.97');
  await page.getByText('Adds up to the printed total of $285.68.').waitFor();
  // Arrow keys move through the lines table: down to the same column of the next line, and back up.
  await page.keyboard.press('ArrowDown');
  await expect(isFocused(page.getByRole('textbox', { name: 'Amount, line 4' }))).resolves.toBe(true);
  await screenshot(page, 'receipt-check-keyboard');
  await page.keyboard.press('ArrowUp');
  await expect(isFocused(fluid)).resolves.toBe(true);

  await assignSystem(page, 1, 'Drivetrain');
  await assignSystem(page, 2, 'Drivetrain');
  await assignSystem(page, 3, 'Brakes');
  await assignSystem(page, 4, 'Suspension');
  // Brakes carry the safety caution.
  await page.getByRole('complementary', { name: 'Safety caution' }).filter({ hasText: "manufacturer's instructions" }).waitFor();
  await screenshot(page, 'receipt-check-ready');
  expect(await accessibilityViolations(page)).toEqual([]);

  const filed = page.waitForResponse((response) => response.request().method() === 'POST' && response.url().endsWith('/file'));
  await page.getByRole('button', { name: /File receipt/ }).click();
  expect((await filed).status()).toBe(200);
  await page.locator('p.filed').filter({ hasText: 'Filed.' }).waitFor();
  await screenshot(page, 'receipt-filed');

  await page.getByRole('link', { name: 'All receipts' }).click();
  const row = page.getByRole('link', { name: /BRACKENRIDGE/i });
  await row.getByText('Filed').waitFor();
  await expect(row.textContent()).resolves.toContain('$285.68');
  await screenshot(page, 'receipts-list');
  expect(await accessibilityViolations(page)).toEqual([]);
  // The filters live in the URL: a link to the receipts ready to check shows none now, and says why.
  await page.goto(`${buildUrl}/receipts?state=to_check`);
  await page.getByText('No receipt matches these filters. Clear a filter to see more.').waitFor();
  await expect(page.getByRole('combobox', { name: 'State' }).textContent()).resolves.toContain('Ready to check');
  await page.goBack();
  await row.getByText('Filed').waitFor();

  // The core charge became a deposit owed; handing the old part in is one click.
  await page.getByRole('link', { name: 'Cores and returns' }).first().click();
  await page.getByText('Old part still here').waitFor();
  // The deposit as paid: 40.00 with its share of the 19.31 tax, as the ledger counts it (the API's figure).
  const [core] = (await owner.client.get(`/api/builds/${created.body.id}/cores`)).body.cores as { amount: string }[];
  const ledger = (await owner.client.get(`/api/builds/${created.body.id}/ledger`)).body;
  expect(core.amount).toBe(ledger.total.coreDepositsOutstanding);
  expect(Number(core.amount)).toBeGreaterThan(40);
  await page.getByText(`$${core.amount}`).waitFor();
  // Filed with the default 30 days from the purchase on 2026-04-20 (common practice, not a rule), so long past due.
  await page.getByText('Overdue: was due May 20, 2026').waitFor();
  await screenshot(page, 'cores');
  expect(await accessibilityViolations(page)).toEqual([]);
  await page.getByRole('button', { name: 'Handed in the old part' }).click();
  await page.getByText('Old part handed in').waitFor();

  // On a phone Receipts is in the bottom bar.
  const phone = await newPage(e2e.browser, { phone: true });
  await signIn(phone, e2e.t.url, owner.email);
  await phone.goto(buildUrl);
  await phone.getByRole('link', { name: 'Receipts', exact: true }).click();
  await phone.getByRole('link', { name: /BRACKENRIDGE/i }).waitFor();
  await screenshot(phone, 'receipts-phone');
  expect(await accessibilityViolations(phone)).toEqual([]);
  await phone.getByRole('link', { name: /BRACKENRIDGE/i }).click();
  await phone.getByText('Adds up to the printed total of $285.68.').waitFor();
  await screenshot(phone, 'receipt-check-phone');
  expect(await accessibilityViolations(phone)).toEqual([]);
});
