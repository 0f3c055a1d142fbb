// In Debian's chromium at phone size with touch: the builder photographs a five-line counter slip whose part numbers
// are on the bill of materials, accepts the suggestions and files it, in a counted handful of taps; then every route is
// visited by owner, crew and reviewer at 360, 390 and 414 px: nothing may widen the page, scroll sideways inside it or
// stand cut at the window's edge, and axe finds nothing; the same holds for every page a signed-out person sees.
import type { Locator, Page } from 'playwright-core';
import { renderSlip, type SlipReceipt } from '../../backend/src/seed/receipt-slip';
import { NEW_BUILD, signedUpClient, TEST_PASSWORD, uniqueEmail, type ApiClient } from '../support/api-client';
import { accessibilityViolations, cutAtEdge, newPage, screenshot, sidewaysScroll, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { filedReceipt } from '../support/receipts';

jest.setTimeout(300_000);

const e2e = useBrowserApp({ reading: true });

/** Invented counter purchases for the swap: part number, description, system, price. */
const PARTS = [
  ['WP-4410', 'ELECTRIC WATER PUMP', 'Cooling', '189.00'],
  ['RL-3002', 'RELAY 40A SEALED', 'Wiring harness', '12.40'],
  ['FF-0871', 'INLINE FUEL FILTER', 'Fuel', '24.95'],
  ['TS-1190', 'THERMOSTAT 180F', 'Cooling', '18.75'],
  ['CN-2206', 'CONNECTOR KIT 6-PIN', 'Wiring harness', '16.80'],
] as const;

/** The slip the builder photographs: five purchases, 6.25 % tax (invented shop). */
function counterSlip(): SlipReceipt {
  const subtotal = '261.90'; // 189.00 + 12.40 + 24.95 + 18.75 + 16.80
  return {
    id: 'phone-counter',
    layout: 'counter',
    locale: 'en-US',
    vendor: 'COPPERLINE AUTO SUPPLY',
    address: ['88 FOUNDRY ROW', 'MILLBANK'],
    date: '2026-11-20',
    printedDate: '11/20/2026',
    currency: 'USD',
    mark: '$',
    lines: PARTS.map(([partNumber, description, , price]) => ({ kind: 'part', description, partNumber, quantity: '1', unitPrice: price, amount: price })),
    subtotal,
    tax: '16.37', // 261.90 × 0.0625 = 16.36875 → 16.37
    taxLabel: 'TAX 6.25%',
    shipping: null,
    discount: null,
    total: '278.27',
    receiptNumber: 'C-50712',
  };
}

async function invite(owner: ApiClient, buildId: string, role: 'reviewer' | 'crew') {
  const person = await signedUpClient(e2e.t.app, `e2e-phone-${role}`);
  await owner.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
  const mail = await e2e.t.mail.waitFor((m) => m.to.includes(person.email));
  expect((await person.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`)).status).toBe(200);
  return person;
}

async function buildWithParts() {
  const owner = await signedUpClient(e2e.t.app, 'e2e-phone-owner');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Slate roadster swap', locale: 'en-US' })).body as { id: string };
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string; version: number }[];
  const systemId = (name: string) => systems.find((system) => system.name === name)!.id;
  const parts = new Map<string, string>();
  for (const [partNumber, description, system, price] of PARTS) {
    const created = await owner.client.post(`/api/builds/${build.id}/parts`, {
      systemId: systemId(system),
      description: description.toLowerCase().replace(/^\w/, (first) => first.toUpperCase()),
      partNumber,
      quantity: '1',
      unit: 'each',
      estimatedUnitCost: price,
    });
    expect(created.status).toBe(201);
    parts.set(partNumber, created.body.id);
  }
  const systemVersion = (name: string) => systems.find((system) => system.name === name)!.version;
  return { owner, build, systemId, systemVersion, parts };
}

it('files a five-line counter slip on a phone by touch in a handful of taps, with no typing', async () => {
  const { owner, build, parts } = await buildWithParts();
  const page = await newPage(e2e.browser, { phone: true, touch: true });
  await signIn(page, e2e.t.url, owner.email);
  await page.goto(`${e2e.t.url}/builds/${build.id}/receipts`);
  await page.getByRole('heading', { name: 'Receipts', exact: true, level: 1 }).waitFor();

  // Every tap and keystroke from here on is counted.
  let interactions = 0;
  const tap = async (target: Locator) => {
    interactions += 1;
    await target.tap();
  };
  // The bottom bar's camera: one tap opens it, one takes the photo.
  interactions += 2;
  await page.locator('#bar-receipt-camera').setInputFiles({ name: 'counter.png', mimeType: 'image/png', buffer: renderSlip(counterSlip()).png });
  const link = page.getByRole('link', { name: /COPPERLINE|counter\.png/ }).first();
  await link.waitFor();
  await tap(link);
  await page.getByText('Ready to check').waitFor({ timeout: 120_000 });
  await page.getByText('Adds up to the printed total of $278.27.').waitFor();
  // Cards, not a table, and nothing to swipe sideways.
  expect(await page.locator('th-line-card').count()).toBe(5);
  expect(await page.locator('table.line-table').count()).toBe(0);
  await expect(sidewaysScroll(page)).resolves.toEqual({ page: false, regions: [] });
  const acceptAll = page.getByRole('button', { name: 'Accept 5 suggestions' });
  await acceptAll.waitFor();
  await screenshot(page, 'counter-phone-check');
  expect(await accessibilityViolations(page)).toEqual([]);
  await tap(acceptAll);
  const file = page.getByRole('button', { name: 'File receipt' });
  await page.locator('.file-bar .cta:not([disabled])').waitFor();
  // The file button stays in view above the bottom bar while the cards scroll.
  expect(await file.isVisible()).toBe(true);
  await tap(file);
  await page.locator('p.filed').waitFor();
  await page.waitForLoadState('networkidle');
  await screenshot(page, 'counter-phone-filed');

  // Two for the camera, one to open the receipt, one to accept, one to file; nothing typed.
  expect(interactions).toBe(5);
  expect(interactions).toBeLessThanOrEqual(6);
  const receipts = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { id: string; state: string }[];
  expect(receipts.map((receipt) => receipt.state)).toEqual(['filed']);
  const filed = (await owner.client.get(`/api/builds/${build.id}/receipts/${receipts[0].id}`)).body as { lines: { partNumber: string; partId: string }[] };
  expect(filed.lines.map((line) => [line.partNumber, line.partId])).toEqual(PARTS.map(([partNumber]) => [partNumber, parts.get(partNumber)]));
});

/** Every screen of a build, with the heading it waits for. */
function routes(buildId: string, receiptId: string, role: 'owner' | 'crew' | 'reviewer'): [string, string | RegExp][] {
  const base = `/builds/${buildId}`;
  const all: [string, string | RegExp][] = [
    ['/builds', 'Your builds'],
    [base, 'Slate roadster swap'],
    [`${base}/parts`, 'Parts'],
    [`${base}/budgets`, 'Budgets'],
    [`${base}/inventory`, 'Inventory'],
    [`${base}/receipts`, 'Receipts'],
    [`${base}/receipts/${receiptId}`, /MERIDIAN|slip\.png/],
    [`${base}/cores`, 'Cores and returns'],
    [`${base}/ledger`, 'Ledger'],
    [`${base}/exports`, 'Exports'],
    [`${base}/exports/build-sheet`, 'Build sheet: Slate roadster swap'],
    [`${base}/crew`, 'Crew'],
    [`${base}/alerts`, 'Mail alerts'],
    [`${base}/settings`, 'Settings'],
  ];
  if (role === 'owner') all.push(['/builds/new', 'New build'], [`${base}/edit`, 'Edit build']);
  if (role === 'reviewer') all.push([`${base}/review`, 'Review']);
  return all;
}

async function visit(page: Page, url: string, heading: string | RegExp) {
  await page.goto(url);
  await page.getByRole('heading', { name: heading, level: 1 }).first().waitFor();
  await page.waitForLoadState('networkidle');
}

const PHONE_WIDTHS = [360, 390, 414] as const;

/** Lets the layout settle after the window changes width (two frames). */
async function settle(page: Page) {
  await page.evaluate('new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)))');
}

it('widens no page and scrolls no region sideways on any route for owner, crew and reviewer at 360, 390 and 414 px; axe finds nothing at 360 px', async () => {
  const started = Date.now();
  const { owner, build, systemId, systemVersion, parts } = await buildWithParts();
  const crew = await invite(owner.client, build.id, 'crew');
  const reviewer = await invite(owner.client, build.id, 'reviewer');
  // A budget on the systems with parts, so the figures compare with something (invented amounts).
  for (const [name, amount] of [['Cooling', '150.00'], ['Fuel', '400.00'], ['Wiring harness', '4670.00']] as const) {
    expect((await owner.client.patch(`/api/builds/${build.id}/systems/${systemId(name)}`, { budget: amount, version: systemVersion(name) })).status).toBe(200);
  }
  // Rows on every list: a fitted part (the build sheet), one on hand (inventory) and a core deposit (cores).
  const filed = await filedReceipt(e2e.t, owner.client, build.id, { vendorName: 'MERIDIAN COOLING WORKS', purchaseDate: '2026-11-02', total: '1207.75' }, [
    { kind: 'part', description: 'Electric water pump', partNumber: 'WP-4410', amount: '189.00', systemId: systemId('Cooling'), partId: parts.get('WP-4410') },
    { kind: 'part', description: 'Thermostat 180F', partNumber: 'TS-1190', amount: '18.75', systemId: systemId('Cooling'), partId: parts.get('TS-1190') },
    { kind: 'core_charge', description: 'Water pump core', amount: '1000.00', systemId: systemId('Cooling') },
  ]);
  const listed = (await owner.client.get(`/api/builds/${build.id}/parts`)).body.parts as { id: string; version: number }[];
  for (const [partNumber, status] of [['WP-4410', 'installed'], ['TS-1190', 'on_hand']] as const) {
    const part = listed.find((one) => one.id === parts.get(partNumber))!;
    expect((await owner.client.patch(`/api/builds/${build.id}/parts/${part.id}`, { status, version: part.version })).status).toBe(200);
  }

  const widened: string[] = [];
  const regions: string[] = [];
  const cut: string[] = [];
  const violations: string[] = [];
  const people = [
    ['owner', owner.email],
    ['crew', crew.email],
    ['reviewer', reviewer.email],
  ] as const;
  // One page per person, side by side (each waits mostly on the network going quiet); every route is loaded once at
  // the narrowest width, then the window widens to the others: below 600 px the same phone layout applies.
  await Promise.all(
    people.map(async ([role, email]) => {
      const page = await newPage(e2e.browser, { phone: true, width: PHONE_WIDTHS[0], touch: true });
      await signIn(page, e2e.t.url, email);
      for (const [path, heading] of routes(build.id, filed.id, role)) {
        await page.setViewportSize({ width: PHONE_WIDTHS[0], height: 844 });
        await visit(page, `${e2e.t.url}${path}`, heading);
        const screen = path === '/builds' ? '-builds' : path.replace(`/builds/${build.id}`, '').replace(filed.id, 'receipt').replace(/\//g, '-') || '-overview';
        for (const width of PHONE_WIDTHS) {
          if (width !== PHONE_WIDTHS[0]) {
            await page.setViewportSize({ width, height: 844 });
            await settle(page);
          }
          const where = `${role} ${width} px ${path.replace(build.id, ':build').replace(filed.id, ':receipt')}`;
          const scroll = await sidewaysScroll(page);
          if (scroll.page) widened.push(where);
          regions.push(...scroll.regions.map((region) => `${where}: ${region}`));
          cut.push(...(await cutAtEdge(page)).map((element) => `${where}: ${element}`));
          if (width !== 414) await screenshot(page, `phone-${width}-${role}${screen}`);
          // axe at one width per person: its rules read the page, not its width.
          if (width === PHONE_WIDTHS[0]) violations.push(...(await accessibilityViolations(page)).map((violation) => `${where}: ${violation}`));
        }
      }
      await page.context().close();
    }),
  );
  console.info(`Phone sweep: ${people.length} people × ${PHONE_WIDTHS.length} widths in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  if (widened.length + regions.length + cut.length + violations.length > 0) console.info([...widened, ...regions, ...cut, ...violations].join('\n'));
  expect(widened).toEqual([]);
  // No region to swipe inside either: on phones wide tables become stacked rows, so no figure is cut at the edge.
  expect(regions).toEqual([]);
  // Nor a label or figure half off the screen's edge (the bottom bar's last item, say).
  expect(cut).toEqual([]);
  expect(violations).toEqual([]);
  // Three people's passes side by side; on a loaded 2-core machine each route takes seconds, so more than the default.
}, 600_000);

/** The pages a signed-out person sees, with the heading each waits for; the made-up tokens show the refusal states. */
const SIGNED_OUT: [string, string | RegExp][] = [
  ['/sign-in', 'Sign in'],
  ['/sign-up', 'Create an account'],
  ['/sign-up/confirm/made-up-token-0000000000000000', "This link can't be used"],
  ['/reset-password', 'Reset your password'],
  ['/reset-password/made-up-token-0000000000000000', 'Set a new password'],
  ['/invites/made-up-token-0000000000000000', "This invite can't be used"],
  ['/no-such-page', 'Page not found'],
];

/** Sideways scrolling, regions, text cut at the edge at every phone width, and axe at the narrowest, on the page as it is. */
async function phoneProblems(page: Page, where: string): Promise<string[]> {
  const problems: string[] = [];
  for (const width of PHONE_WIDTHS) {
    await page.setViewportSize({ width, height: 844 });
    await settle(page);
    const at = `${where} at ${width} px`;
    const scroll = await sidewaysScroll(page);
    if (scroll.page) problems.push(`${at}: the page is wider than the window`);
    problems.push(...scroll.regions.map((region) => `${at}: scrolls sideways: ${region}`));
    problems.push(...(await cutAtEdge(page)).map((element) => `${at}: cut at the edge: ${element}`));
    if (width === PHONE_WIDTHS[0]) problems.push(...(await accessibilityViolations(page)).map((violation) => `${at}: ${violation}`));
  }
  return problems;
}

it('fits every signed-out page, and the sign-up that waits for its mail, at 360, 390 and 414 px; axe finds nothing', async () => {
  const page = await newPage(e2e.browser, { phone: true, width: PHONE_WIDTHS[0], touch: true });
  const problems: string[] = [];
  for (const [path, heading] of SIGNED_OUT) {
    await page.setViewportSize({ width: PHONE_WIDTHS[0], height: 844 });
    await visit(page, `${e2e.t.url}${path}`, heading);
    problems.push(...(await phoneProblems(page, path)));
    await screenshot(page, `phone-signed-out${path.replace(/\//g, '-').replace(/-made-up-token-0+/, '-made-up-token')}`);
  }
  // The form filled in and sent: the "check your mail" state is what a new builder reads on the phone.
  await page.setViewportSize({ width: PHONE_WIDTHS[0], height: 844 });
  await visit(page, `${e2e.t.url}/sign-up`, 'Create an account');
  await page.getByLabel('Your name').fill('Phone Sweep Builder');
  await page.getByLabel('E-mail').fill(uniqueEmail('phone-sweep'));
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('heading', { name: 'Check your mail', level: 1 }).waitFor();
  problems.push(...(await phoneProblems(page, '/sign-up (sent)')));
  await screenshot(page, 'phone-signed-out-sign-up-sent');
  await page.context().close();
  expect(problems).toEqual([]);
}, 300_000);
