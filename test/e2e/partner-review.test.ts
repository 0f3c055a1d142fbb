// In Debian's chromium: the partner (an invited reviewer) reads the build's totals on the Ledger and the receipts'
// totals on the Review page, questions one
// receipt with a comment (its uploader is mailed) and approves another, downloads the tax ledger and checks it with an
// independent CSV parser, then opens the printable build sheet with its safety caution.
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { SAFETY_CAUTION } from '../../shared/safety';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { filedReceipt } from '../support/receipts';

jest.setTimeout(240_000);

const e2e = useBrowserApp();

/** The little of the DOM that `spoken` uses (this tsconfig has no DOM library: the function runs in the browser). */
interface PageElement {
  textContent: string | null;
  cloneNode(deep: boolean): PageElement;
  querySelectorAll(selector: string): ArrayLike<{ remove(): void }>;
}

/** What a screen reader says for each element: its text without the parts hidden from assistive technology. */
function spoken(elements: unknown[]): string[] {
  return (elements as PageElement[]).map((element) => {
    const copy = element.cloneNode(true);
    Array.from(copy.querySelectorAll('[aria-hidden="true"]')).forEach((hidden) => hidden.remove());
    return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
  });
}

async function invite(owner: ApiClient, buildId: string, role: 'reviewer' | 'crew') {
  const person = await signedUpClient(e2e.t.app, `e2e-partner-${role}`);
  await owner.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
  const mail = await e2e.t.mail.waitFor((m) => m.to.includes(person.email));
  expect((await person.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`)).status).toBe(200);
  return person;
}

it('lets the partner review receipts, export the tax ledger and print the build sheet', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-partner-owner');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Teal wagon swap', vehicle: '1979 invented wagon, 3.1 L swap', locale: 'en-US' })).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string }[];
  const systemId = (name: string) => systems.find((s) => s.name === name)!.id;
  const partner = await invite(owner.client, build.id, 'reviewer');

  // Three filed receipts (invented shops and prices), uploaded by the owner.
  const pump = (await owner.client.post(`/api/builds/${build.id}/parts`, { systemId: systemId('Fuel'), description: 'Fuel pump, in-tank', quantity: '1', unit: 'each', estimatedUnitCost: '140.00' })).body;
  await filedReceipt(e2e.t, owner.client, build.id, { vendorName: 'Harbor Fuel Systems', purchaseDate: '2026-10-15', total: '150.00' }, [
    { kind: 'part', description: 'In-tank pump', amount: '150.00', partId: pump.id },
  ]);
  const partVersion = (await owner.client.get(`/api/builds/${build.id}/parts`)).body.parts[0].version;
  expect((await owner.client.patch(`/api/builds/${build.id}/parts/${pump.id}`, { status: 'installed', version: partVersion })).status).toBe(200);
  await filedReceipt(e2e.t, owner.client, build.id, { vendorName: 'Quayside Parts Counter', purchaseDate: '2026-11-01', tax: '0.96', total: '12.96' }, [
    { kind: 'part', description: 'Thermostat gasket', amount: '12.00', systemId: systemId('Cooling') },
  ]);
  // Tax 8.00 and shipping 10.00 over 80 : 20 (largest remainder, DESIGN §4): 6.40 + 1.60 and 8.00 + 2.00.
  await filedReceipt(e2e.t, owner.client, build.id, { vendorName: 'Ridgeback Auto Supply', purchaseDate: '2026-11-02', tax: '8.00', shipping: '10.00', total: '118.00' }, [
    { kind: 'part', description: 'Oil pressure gauge', amount: '80.00', systemId: systemId('Engine') },
    { kind: 'part', description: 'Gauge sender', amount: '20.00', systemId: systemId('Wiring harness') },
  ]);

  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, partner.email);
  // The totals first, on the Ledger: net cost 150.00 + 12.96 + 118.00 = 280.96 (each receipt's printed total, all
  // purchases); by system, Engine 94.40 and Wiring harness 23.60 as allocated above.
  await page.getByRole('link', { name: 'Teal wagon swap' }).click();
  await page.getByRole('link', { name: 'Ledger', exact: true }).click();
  await page.getByRole('heading', { name: 'Ledger', level: 1 }).waitFor();
  const netCost = page.locator('dt', { hasText: /^Net cost$/ }).locator('xpath=following-sibling::dd[1]');
  await expect(netCost.innerText()).resolves.toMatch(/^\$280\.96\b/);
  const ledger = (await partner.client.get(`/api/builds/${build.id}/ledger`)).body;
  expect(ledger.total.netCost).toBe('280.96');
  await page.getByRole('row', { name: /^Engine/ }).getByRole('button', { name: /^\$94\.40 / }).first().waitFor();
  await page.getByRole('row', { name: /^Wiring harness/ }).getByRole('button', { name: /^\$23\.60 / }).first().waitFor();

  await page.getByRole('link', { name: 'Review' }).click();
  await page.getByRole('heading', { name: 'Waiting for review (3)' }).waitFor();
  // The totals as the partner reads them: newest first.
  const queue = page.getByRole('region', { name: /Waiting for review/ }).getByRole('button');
  const uploader = 'Test e2e-partner-owner';
  // Each button's accessible name is its visible text with hidden commas between shop, date and uploader, and total.
  await expect(queue.evaluateAll(spoken)).resolves.toEqual([
    `Ridgeback Auto Supply, Nov 2, 2026 · by ${uploader}, $118.00`,
    `Quayside Parts Counter, Nov 1, 2026 · by ${uploader}, $12.96`,
    `Harbor Fuel Systems, Oct 15, 2026 · by ${uploader}, $150.00`,
  ]);
  await page.getByRole('heading', { name: 'Ridgeback Auto Supply' }).waitFor();
  await page.getByRole('cell', { name: '$94.40' }).waitFor();
  await screenshot(page, 'review-desktop');
  expect(await accessibilityViolations(page)).toEqual([]);

  // Question the first with a comment: the uploader is mailed; the next receipt opens.
  await page.getByRole('button', { name: 'Question' }).click();
  await page.getByRole('textbox', { name: 'What is the question?' }).fill('Is the gauge for the wagon or the race car?');
  await page.getByRole('button', { name: 'Send question' }).click();
  await page.getByText('Questioned: Ridgeback Auto Supply of Nov 2, 2026.').waitFor();
  await page.getByRole('heading', { name: 'Quayside Parts Counter' }).waitFor();
  const mail = await e2e.t.mail.waitFor((m) => m.to.includes(owner.email) && m.text.includes('Is the gauge for the wagon or the race car?'));
  expect(mail.subject).toContain('commented');

  await page.getByRole('button', { name: 'Approve' }).click();
  await page.getByText('Approved: Quayside Parts Counter of Nov 1, 2026.').waitFor();
  await page.getByRole('heading', { name: 'Waiting for review (1)' }).waitFor();
  await page.getByRole('heading', { name: 'Harbor Fuel Systems' }).waitFor();

  // The questioned receipt, among the reviewed, carries its state, the comment and the trail.
  await page.getByRole('switch', { name: 'Show approved and questioned too' }).click();
  await page.getByRole('button', { name: /^Ridgeback Auto Supply\s*, Nov 2, 2026 · by .*, Questioned\s*, \$118\.00$/ }).click();
  await page.getByRole('heading', { name: 'Ridgeback Auto Supply' }).waitFor();
  await page.locator('.state-words').filter({ hasText: 'Questioned: Is the gauge for the wagon or the race car?' }).waitFor();
  await page.getByRole('list', { name: 'Comments' }).getByText('Is the gauge for the wagon or the race car?').waitFor();
  await page.getByRole('list', { name: 'Changes to money' }).getByText('Reviewed the receipt').waitFor();
  await screenshot(page, 'review-reviewed-desktop');
  expect(await accessibilityViolations(page)).toEqual([]);

  // Exports: the tax ledger, downloaded as a file.
  await page.getByRole('link', { name: 'Exports' }).click();
  await page.getByRole('heading', { name: 'Exports' }).waitFor();
  await screenshot(page, 'exports-desktop');
  expect(await accessibilityViolations(page)).toEqual([]);
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download tax ledger' }).click()]);
  expect(download.suggestedFilename()).toBe('teal-wagon-swap-tax-ledger.csv');
  const csv = readFileSync((await download.path())!, 'utf8');
  await page.getByText('Saved teal-wagon-swap-tax-ledger.csv', { exact: false }).waitFor();
  // Read back with papaparse, an independent parser; RFC 4180 §2 records end with CRLF and the first is the header.
  const parsed = Papa.parse<Record<string, string>>(csv, { header: true, newline: '\r\n', skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  expect(parsed.data.map((row) => [row.date, row.vendor, row.description, row.system, row.amount, row['allocated tax'], row['allocated shipping'], row.net, row.currency, row['review state']])).toEqual([
    ['2026-10-15', 'Harbor Fuel Systems', 'In-tank pump', 'Fuel', '150.00', '0.00', '0.00', '150.00', 'USD', 'none'],
    ['2026-11-01', 'Quayside Parts Counter', 'Thermostat gasket', 'Cooling', '12.00', '0.96', '0.00', '12.96', 'USD', 'approved'],
    ['2026-11-02', 'Ridgeback Auto Supply', 'Oil pressure gauge', 'Engine', '80.00', '6.40', '8.00', '94.40', 'USD', 'questioned'],
    ['2026-11-02', 'Ridgeback Auto Supply', 'Gauge sender', 'Wiring harness', '20.00', '1.60', '2.00', '23.60', 'USD', 'questioned'],
  ]);
  // Each receipt's lines add up, with their tax and shipping, to the total printed on it (as the API reports it).
  const receipts = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { vendorName: string; total: string }[];
  for (const receipt of receipts) {
    const cents = parsed.data.filter((row) => row.vendor === receipt.vendorName).reduce((sum, row) => sum + BigInt(row.net.replace('.', '')), 0n);
    expect(cents).toBe(BigInt(receipt.total.replace('.', '')));
  }

  // The printable build sheet: the fitted pump with its cost, and the caution.
  await page.getByRole('link', { name: 'Printable build sheet' }).click();
  await page.getByRole('heading', { name: 'Build sheet: Teal wagon swap' }).waitFor();
  await page.getByText(SAFETY_CAUTION).waitFor();
  await page.getByRole('cell', { name: 'Fuel pump, in-tank' }).waitFor();
  await page.getByRole('region', { name: 'Summary by system' }).getByRole('row', { name: /^Total 1 \$150\.00 \$/ }).waitFor();
  await screenshot(page, 'build-sheet-desktop');
  expect(await accessibilityViolations(page)).toEqual([]);
  await page.emulateMedia({ media: 'print' });
  expect(await page.locator('th-top-bar').isVisible()).toBe(false);
  expect(await page.locator('nav[aria-label="Build sections"]').isVisible()).toBe(false);
  expect(await page.getByText(SAFETY_CAUTION).isVisible()).toBe(true);
  await screenshot(page, 'build-sheet-print');

  // The same screens on a 390 px phone.
  const phone = await newPage(e2e.browser, { phone: true });
  await signIn(phone, e2e.t.url, partner.email);
  for (const [path, heading, name] of [
    ['review', 'Waiting for review (1)', 'review-phone'],
    ['exports', 'Exports', 'exports-phone'],
    ['exports/build-sheet', 'Build sheet: Teal wagon swap', 'build-sheet-phone'],
  ] as const) {
    await phone.goto(`${e2e.t.url}/builds/${build.id}/${path}`);
    await phone.getByRole('heading', { name: heading }).waitFor();
    await phone.waitForLoadState('networkidle');
    await screenshot(phone, name);
    expect(await accessibilityViolations(phone)).toEqual([]);
  }
});
