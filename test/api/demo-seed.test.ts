// The demo seed npm start runs, into the test database: its history adds up in the real ledger, its cores, return,
// review queue, duplicate and unchecked receipt are there for the screens, and every document is in the store.
import { createHash } from 'node:crypto';
import Decimal from 'decimal.js';
import { Build } from '../../backend/src/builds/build.entity';
import { AuditEvent } from '../../backend/src/audit/audit-event.entity';
import { buildLedger } from '../../backend/src/ledger/ledger.service';
import { Part } from '../../backend/src/parts/part.entity';
import { Core } from '../../backend/src/receipts/core.entity';
import { ReceiptLine } from '../../backend/src/receipts/receipt-line.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { DEMO_HISTORY, DEMO_SHOPS } from '../../backend/src/seed/demo-history';
import { DEMO_BUDGETS, DEMO_BUILD, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_REFUSED_MAIL } from '../../backend/src/seed/demo-scenario';
import { MailRefusal } from '../../backend/src/inbox/mail-refusal.entity';
import { seedDemo } from '../../backend/src/seed/seed-demo';
import { ApiClient } from '../support/api-client';
import { expectOneValuePerFigure } from '../support/same-figures';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(180_000);
let t: TestApp;
let seeded: boolean;
let build: Build;

beforeAll(async () => {
  t = await startTestApp();
  // The test database holds other files' accounts, so the seed is asked to look only for its own.
  seeded = await seedDemo({ orm: t.orm, store: t.store }, { onlyIntoEmptyDatabase: false });
  build = await t.orm.em.fork().findOneOrFail(Build, { name: DEMO_BUILD.name });
});
afterAll(() => t.close());

/** The till's arithmetic, worked here apart from the seed: cents half up, tax on the taxable lines, then shipping. */
function printedTotal(history: (typeof DEMO_HISTORY)[number]): Decimal {
  const cents = (value: Decimal) => value.toDecimalPlaces(2, Decimal.ROUND_HALF_UP);
  let lines = new Decimal(0);
  let taxBase = new Decimal(0);
  for (const line of history.lines) {
    const sign = line.kind === 'return' || line.kind === 'core_refund' || line.kind === 'discount' ? -1 : 1;
    const amount = cents(new Decimal(line.unitPrice).times(line.quantity ?? '1')).times(sign);
    lines = lines.plus(amount);
    if (line.taxable !== false) taxBase = taxBase.plus(amount);
  }
  const rate = DEMO_SHOPS[history.shop].taxRate;
  const tax = rate === null ? new Decimal(0) : cents(taxBase.times(rate));
  return lines.plus(tax).plus(history.shipping ?? 0);
}

/** Core deposits and their refunds are money held, not cost; everything else a filed receipt printed is cost. */
function coreMoney(history: (typeof DEMO_HISTORY)[number]): Decimal {
  return history.lines
    .filter((line) => line.kind === 'core_charge' || line.kind === 'core_refund')
    .reduce((total, line) => total.plus(new Decimal(line.unitPrice).times(line.kind === 'core_refund' ? -1 : 1)), new Decimal(0));
}

it('seeds once, and a second run beside existing accounts leaves everything as it was', async () => {
  expect(seeded).toBe(true);
  const em = t.orm.em.fork();
  const receipts = await em.count(Receipt, { build });
  expect(receipts).toBe(DEMO_HISTORY.length);
  expect(receipts).toBeGreaterThanOrEqual(30);
  expect(receipts).toBeLessThanOrEqual(40);
  expect(await seedDemo({ orm: t.orm, store: t.store }, { onlyIntoEmptyDatabase: false })).toBe(false);
  // npm start's own rule: any account at all (here, other test files') means nothing is seeded.
  expect(await seedDemo({ orm: t.orm, store: t.store })).toBe(false);
  expect(await em.count(Receipt, { build })).toBe(receipts);
  // Its inbox: an address of its own, and the one mailing it turned away, kept for the owner.
  expect(build.inboxToken).toMatch(/^[0-9a-f]{32}$/);
  expect((await em.find(MailRefusal, { build })).map((refusal) => [refusal.fromAddress, refusal.reason])).toEqual([[DEMO_REFUSED_MAIL.fromAddress, 'not_a_member']]);
});

it('prints the totals a till would, and the ledger nets them to the cent: less core deposits held or refunded', async () => {
  // One slip worked by hand as an anchor: 165.00 + 7.25 % tax (11.9625 → 11.96) + 40.00 untaxed core deposit.
  expect(printedTotal(DEMO_HISTORY.find((h) => h.key === 'alternator')!).toFixed(2)).toBe('216.96');
  // The return slip: -89.00 and its tax given back (-6.4525 → -6.45, half up away from zero).
  expect(printedTotal(DEMO_HISTORY.find((h) => h.key === 'regulator-return')!).toFixed(2)).toBe('-95.45');

  const em = t.orm.em.fork();
  const stored = await em.find(Receipt, { build }, { populate: ['vendor'] });
  const byNumber = new Map(stored.map((receipt) => [receipt.receiptNumber, receipt]));
  let expectedNetCost = new Decimal(0);
  for (const history of DEMO_HISTORY) {
    const receipt = byNumber.get(history.receiptNumber)!;
    expect([receipt.vendor!.name, receipt.purchaseDate, receipt.total!.toFixed(2)]).toEqual([DEMO_SHOPS[history.shop].vendor, history.date, printedTotal(history).toFixed(2)]);
    expect(receipt.state).toBe(history.toCheck ? 'to_check' : 'filed');
    if (!history.toCheck) expectedNetCost = expectedNetCost.plus(printedTotal(history)).minus(coreMoney(history));
  }

  const ledger = await buildLedger(em, build);
  expect(ledger.total.netCost).toBe(expectedNetCost.toFixed(2));
  expect(ledger.total.coreDepositsOutstanding).toBe('30.00');
  expect(ledger.total.returnsAwaitingRefund).toBe('0.00');
  const system = (name: string) => ledger.systems.find((s) => s.name === name)!;
  expect(system('Wiring harness').budget).toBe(DEMO_BUDGETS['Wiring harness']);
  expect(new Decimal(system('Wiring harness').netCost).greaterThan(DEMO_BUDGETS['Wiring harness'])).toBe(true);
  expect(new Decimal(system('Cooling').netCost).lessThan(new Decimal(DEMO_BUDGETS.Cooling).times('0.75'))).toBe(true);
  expect(new Decimal(system('Cooling').netCost).greaterThan(0)).toBe(true);
});

it('leaves one core deposit owed soon after 2 December, one refunded, and one return refunded', async () => {
  const em = t.orm.em.fork();
  const cores = await em.find(Core, { build }, { populate: ['chargeLine.part', 'refundLine'], orderBy: { dueDate: 'asc' } });
  expect(cores.map((core) => [core.state, core.dueDate, core.chargeLine.amount.toFixed(2), core.chargeLine.part?.partNumber, core.refundLine?.amount.toFixed(2) ?? null])).toEqual([
    ['refunded', '2026-09-07', '40.00', 'ALT-90R', '-40.00'],
    ['owed', '2026-12-06', '30.00', 'STR-22R', null],
  ]);

  const returns = await em.find(ReceiptLine, { build, kind: 'return' }, { populate: ['returnOf', 'part', 'receipt'] });
  expect(returns).toHaveLength(1);
  const [sentBack] = returns;
  expect([sentBack.receipt.state, sentBack.amount.toFixed(2), sentBack.part?.partNumber, sentBack.returnOf?.part?.id]).toEqual(['filed', '-89.00', 'FPR-8AN', sentBack.part?.id]);
  expect(sentBack.allocatedTax.toFixed(2)).toBe('-6.45');
  expect((await em.findOneOrFail(Part, { build, partNumber: 'FPR-8AN' })).status).toBe('returned');
});

it('gives the partner a review queue, questions to answer, a likely duplicate and a receipt to check, over the API', async () => {
  const partner = await new ApiClient(t.app).init();
  const email = DEMO_PEOPLE.find((person) => person.role === 'reviewer')!.email;
  expect((await partner.post('/api/auth/sign-in', { email, password: DEMO_PASSWORD })).status).toBe(200);
  const queue = (await partner.get(`/api/builds/${build.id}/review-queue`)).body.receipts as { receiptNumber: string }[];
  // Waiting: the receipts never reviewed, and the question its uploader has answered.
  const unreviewed = [...DEMO_HISTORY.filter((h) => !h.toCheck && !h.review).map((h) => h.receiptNumber), '314541'];
  expect(queue.map((r) => r.receiptNumber).sort()).toEqual(unreviewed.sort());
  expect(queue.length).toBeGreaterThanOrEqual(4);
  expect(queue.length).toBeLessThanOrEqual(7);

  const list = (await partner.get(`/api/builds/${build.id}/receipts`)).body.receipts as { id: string; receiptNumber: string; state: string; reviewState: string; duplicateOf: string[] }[];
  expect(list.filter((r) => r.reviewState === 'questioned').map((r) => r.receiptNumber)).toEqual(['8012']);
  expect(list.filter((r) => r.reviewState === 'answered').map((r) => r.receiptNumber)).toEqual(['314541']);
  const duplicates = list.filter((r) => r.duplicateOf.length > 0);
  expect(duplicates.map((r) => r.receiptNumber).sort()).toEqual(['314530', '314541']);
  expect(list.filter((r) => r.state === 'to_check').map((r) => r.receiptNumber)).toEqual(['316588']);

  const questioned = list.find((r) => r.receiptNumber === '314541')!; // questioned, then answered
  const thread = (await partner.get(`/api/builds/${build.id}/receipts/${questioned.id}/comments`)).body.comments as { author: string; body: string; createdAt: string }[];
  expect(thread.map((c) => [c.author, c.createdAt.slice(0, 10)])).toEqual([
    ['Ines Marchetti', '2026-10-25'],
    ['Tam Okonkwo-Reyes', '2026-10-26'],
  ]);
  const trail = (await partner.get(`/api/builds/${build.id}/receipts/${questioned.id}/audit`)).body.events as { entity: string; action: string; at: string }[];
  expect(trail.map((e) => `${e.entity}:${e.action}`)).toEqual(['receipt_line:edit', 'receipt:file', 'receipt:review', 'receipt:answer']);
  expect(trail.map((e) => e.at.slice(0, 10))).toEqual(['2026-10-24', '2026-10-24', '2026-10-25', '2026-10-26']);
});

it('stores every receipt document and page image the way an upload does, and files each through the filing code', async () => {
  const em = t.orm.em.fork();
  const receipts = await em.find(Receipt, { build });
  for (const receipt of receipts) {
    expect(receipt.documentKey).toBe(`builds/${build.id}/receipts/${receipt.id}/original.png`);
    const document = await t.store.get(receipt.documentKey);
    expect([createHash('sha256').update(document).digest('hex'), document.length, receipt.contentType]).toEqual([receipt.sha256, receipt.size, 'image/png']);
    expect(receipt.pageImages.map((page) => page.key)).toEqual([`builds/${build.id}/receipts/${receipt.id}/page-1.png`]);
    expect((await t.store.get(receipt.pageImages[0].key)).subarray(1, 4).toString('latin1')).toBe('PNG');
  }
  const filed = receipts.filter((receipt) => receipt.state === 'filed');
  const fileEvents = await em.count(AuditEvent, { build, entity: 'receipt', action: 'file' });
  expect(fileEvents).toBe(filed.length);
  await expect(t.store.get(`builds/${build.id}/receipts/no-such-receipt/original.png`)).rejects.toThrow();
});

it('says each named figure of the demo build the same on the ledger, Parts and Budgets, the build sheet, the lines and the core list', async () => {
  const owner = DEMO_PEOPLE.find((person) => person.role === 'owner')!;
  const client = await new ApiClient(t.app).init();
  expect((await client.post('/api/auth/sign-in', { email: owner.email, password: DEMO_PASSWORD })).status).toBe(200);
  const { ledger, cores } = await expectOneValuePerFigure(client, build.id, 2);
  // The demo has money in every figure the agreement is checked on, so no check passes on zeros.
  for (const figure of ['spent', 'netCost', 'planned', 'coreDepositsOutstanding'] as const) expect([figure, ledger.total[figure]]).not.toEqual([figure, '0.00']);
  expect(cores.length).toBeGreaterThan(0);
});
