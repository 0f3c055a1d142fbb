// In Debian's chromium: a build with two filed receipts; the ledger shows the API's totals formatted, a system's net
// cost opens the lines behind it with links to their receipts, a bar of the chart does too, and an empty build says
// what to do first. Screenshots at desktop and phone widths; axe finds no WCAG A/AA violation.
import { formatMoney, toDecimal } from '../../shared/money';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { filedReceipt } from '../support/receipts';

jest.setTimeout(180_000);

const e2e = useBrowserApp();

const usd = (amount: string) => formatMoney(toDecimal(amount), 'USD', 'en-US');

/** A build with budgets on three systems, two calipers still to buy and two filed receipts (invented shops). */
async function twoReceiptBuild(prefix: string) {
  const owner = await signedUpClient(e2e.t.app, prefix);
  const { client } = owner;
  const buildId = (await client.post('/api/builds', { ...NEW_BUILD, name: 'Teal wagon swap', locale: 'en-US' })).body.id as string;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string; version: number }[];
  const system = (name: string) => systems.find((s) => s.name === name)!;
  for (const [name, budget] of [['Engine', '400.00'], ['Cooling', '60.00'], ['Brakes', '900.00']] as const) {
    expect((await client.patch(`/api/builds/${buildId}/systems/${system(name).id}`, { budget, version: system(name).version })).status).toBe(200);
  }
  // Parts still to buy make the forecast differ from the net cost: Brakes 2 × 149.50 = 299.00.
  await client.post(`/api/builds/${buildId}/parts`, { systemId: system('Brakes').id, description: 'Front caliper, reman', quantity: '2', unit: 'each', estimatedUnitCost: '149.50' });

  // Receipt A (as in test/api/ledger-screen.test.ts): alternator 69.85, core 23.42 owed, coolant 34.93, fee 11.00.
  await filedReceipt(e2e.t, client, buildId, { vendorName: 'Quayside Parts', purchaseDate: '2026-07-03', tax: '7.21', shipping: '9.99', total: '139.20' }, [
    { kind: 'part', description: 'Alternator, reman', amount: '60.00', systemId: system('Engine').id },
    { kind: 'core_charge', description: 'Alternator core', amount: '22.00', systemId: system('Engine').id },
    { kind: 'part', description: 'Coolant', amount: '30.00', systemId: system('Cooling').id },
    { kind: 'fee', description: 'Bench test', amount: '10.00', taxable: false, systemId: system('Engine').id },
  ]);
  // Receipt B: discount 14.00 over 25 : 15 : 100 -> 2.50, 1.50, 10.00; thermostat 22.50, cap 13.50, starter 90.00.
  await filedReceipt(e2e.t, client, buildId, { vendorName: 'Harbour Row Supply', purchaseDate: '2026-08-20', discount: '14.00', total: '126.00' }, [
    { kind: 'part', description: 'Thermostat', amount: '25.00', systemId: system('Cooling').id },
    { kind: 'part', description: 'Radiator cap', amount: '15.00', systemId: system('Cooling').id },
    { kind: 'part', description: 'Starter', amount: '100.00', systemId: system('Engine').id },
  ]);
  return { owner, client, buildId };
}

it('shows the ledger of two filed receipts and the lines behind a figure', async () => {
  const { owner, client, buildId } = await twoReceiptBuild('e2e-ledger');
  const ledger = (await client.get(`/api/builds/${buildId}/ledger`)).body;
  // Engine net 69.85 + 11.00 + 90.00 = 170.85; Cooling 34.93 + 22.50 + 13.50 = 70.93 (over its 60.00); build 241.78.
  expect(ledger.total.netCost).toBe('241.78');

  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);
  await page.goto(`${e2e.t.url}/builds/${buildId}/ledger`);
  await page.getByRole('heading', { name: 'Ledger', level: 1 }).waitFor();
  // The total on screen is the API's figure, formatted (its hidden words say what the button opens).
  const netCost = page.locator('dt', { hasText: /^Net cost$/ }).locator('xpath=following-sibling::dd[1]').getByRole('button');
  await expect(netCost.getAttribute('class')).resolves.toBe('figure-button');
  await expect(netCost.innerText()).resolves.toBe(`${usd(ledger.total.netCost)}\n(show the lines behind the net cost)`);
  expect(usd(ledger.total.netCost)).toBe('$241.78');
  const forecast = page.locator('dt', { hasText: /^Forecast at completion$/ }).locator('xpath=following-sibling::dd[1]');
  // 241.78 + 299.00 = 540.78, shown as the API's figure.
  await expect(forecast.innerText()).resolves.toBe('$540.78');
  await expect(forecast.getAttribute('data-value')).resolves.toBe(ledger.total.forecast);
  // Cooling: 60.00 - 70.93 = 10.93 over its budget, said in words.
  await page.getByRole('row', { name: /^Cooling/ }).getByRole('cell', { name: '$10.93 over' }).waitFor();
  await page.getByRole('complementary', { name: 'Safety caution' }).filter({ hasText: "manufacturer's instructions" }).waitFor();
  await screenshot(page, 'ledger-desktop');
  expect(await accessibilityViolations(page)).toEqual([]);

  // A system's net cost in the table opens its lines, which add up to it and link to their receipts.
  await page.getByRole('button', { name: '$170.85 (Net cost of Engine: show the lines)' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByRole('heading', { name: 'Net cost of Engine' }).waitFor();
  await dialog.getByText('3 lines add up to $170.85').waitFor();
  await dialog.getByText('$60.00 on the receipt + tax $3.86 + shipping $5.99').waitFor();
  await screenshot(page, 'ledger-lines');
  expect(await accessibilityViolations(page)).toEqual([]);
  await dialog.getByRole('link', { name: 'Starter' }).click();
  await page.waitForURL(/\/receipts\/[0-9a-f-]{36}$/);
  await page.goBack();

  // Spend by week, then a bar of the shops chart opens that shop's lines.
  await page.getByRole('heading', { name: 'Ledger', level: 1 }).waitFor();
  await page.getByRole('radio', { name: 'By week' }).click();
  await page.getByText('Figures by week').waitFor();
  const shopsChart = page.locator('th-bar-chart').nth(2);
  await shopsChart.scrollIntoViewIfNeeded();
  const box = (await shopsChart.boundingBox())!;
  // Largest first: Harbour Row Supply (126.00), then Quayside Parts (115.78); below the legend, the first bar is in the
  // upper half of the plot (the chart is 64 + 2 × 40 px high).
  await page.mouse.click(box.x + box.width * 0.3, box.y + 56);
  await page.getByRole('dialog').getByRole('heading', { name: 'Net cost at Harbour Row Supply' }).waitFor();
  await page.getByRole('dialog').getByText('3 lines add up to $126.00').waitFor();
  await page.getByRole('button', { name: 'Close' }).click();

  const phone = await newPage(e2e.browser, { phone: true });
  await signIn(phone, e2e.t.url, owner.email);
  await phone.goto(`${e2e.t.url}/builds/${buildId}`);
  await phone.getByRole('link', { name: 'Ledger', exact: true }).click();
  await phone.getByRole('heading', { name: 'By system' }).waitFor();
  // Nothing widens the page at 390 px: the wide table scrolls inside its own box.
  await expect(phone.evaluate('document.documentElement.scrollWidth')).resolves.toBe(390);
  await screenshot(phone, 'ledger-phone');
  expect(await accessibilityViolations(phone)).toEqual([]);
  await phone.getByRole('button', { name: '$70.93 (Net cost of Cooling: show the lines)' }).click();
  await phone.getByRole('dialog').getByText('3 lines add up to $70.93').waitFor();
  await screenshot(phone, 'ledger-lines-phone');
  expect(await accessibilityViolations(phone)).toEqual([]);

  // A build with nothing filed says what to do first.
  const empty = (await client.post('/api/builds', { ...NEW_BUILD, name: 'Empty shell' })).body.id as string;
  await page.goto(`${e2e.t.url}/builds/${empty}/ledger`);
  await page.getByRole('heading', { name: 'Upload a receipt to start the ledger' }).waitFor();
  await screenshot(page, 'ledger-empty');
  expect(await accessibilityViolations(page)).toEqual([]);
  await page.getByRole('link', { name: 'Go to Receipts' }).click();
  await page.getByRole('heading', { name: 'Receipts', level: 1 }).waitFor();
});

it('shows each named figure the same on the Overview, the Ledger and Budgets as the API gives it', async () => {
  const { owner, client, buildId } = await twoReceiptBuild('e2e-same-figures');
  const buildNow = (await client.get(`/api/builds/${buildId}`)).body as { version: number };
  expect((await client.send('put', `/api/builds/${buildId}/contingency`, { contingencyBudget: '150.00', version: buildNow.version })).status).toBe(200);
  // The figures come from the API here: each screen must show the API's value under the figure's name. The
  // independent check, with every figure worked out by hand, is test/api/same-figures.test.ts.
  const ledger = (await client.get(`/api/builds/${buildId}/ledger`)).body as {
    total: Record<string, string>;
    contingencyBudget: string;
    budgetWithContingency: string;
  };
  const apiValue = (name: string) =>
    name === 'contingency' ? ledger.contingencyBudget : name === 'budgetWithContingency' ? ledger.budgetWithContingency : ledger.total[name];

  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);
  const shown = new Map<string, Map<string, string>>();
  for (const [screen, path, heading] of [
    ['Overview', '', 'Teal wagon swap'],
    ['Ledger', '/ledger', 'Ledger'],
    ['Budgets', '/budgets', 'Budgets'],
  ] as const) {
    await page.goto(`${e2e.t.url}/builds/${buildId}${path}`);
    await page.getByRole('heading', { name: heading, level: 1 }).waitFor();
    await page.locator('[data-figure]').first().waitFor();
    const figures = await page.locator('[data-figure]').evaluateAll((elements) =>
      elements.map((element) => [element.getAttribute('data-figure') ?? '', element.getAttribute('data-value') ?? ''] as const),
    );
    expect(figures.length).toBeGreaterThan(0);
    shown.set(screen, new Map(figures));
  }
  const mismatches: string[] = [];
  for (const [screen, figures] of shown) {
    for (const [name, value] of figures) {
      if (apiValue(name) === undefined) mismatches.push(`${screen}: ${name} is not a figure of the ledger`);
      else if (value !== apiValue(name)) mismatches.push(`${screen}: ${name} ${value}, the API ${apiValue(name)}`);
      // Equal across screens too: a figure named on two screens has one value.
      for (const [other, otherFigures] of shown) {
        if (other !== screen && otherFigures.has(name) && otherFigures.get(name) !== value) mismatches.push(`${name}: ${screen} ${value}, ${other} ${otherFigures.get(name)}`);
      }
    }
  }
  expect(mismatches).toEqual([]);
  // The screens between them show the budget, the contingency, the net cost and the comparison with the forecast.
  const named = new Set([...shown.values()].flatMap((figures) => [...figures.keys()]));
  for (const name of ['budget', 'budgetWithContingency', 'netCost', 'forecast', 'variance']) expect(named).toContain(name);
  // The worked values of this build, so the check above compares real amounts: 400 + 60 + 900 budgeted, 150 held back.
  expect(ledger.total.budget).toBe('1360.00');
  expect(ledger.budgetWithContingency).toBe('1510.00');
  expect(ledger.total.netCost).toBe('241.78');
  await page.context().close();
});
