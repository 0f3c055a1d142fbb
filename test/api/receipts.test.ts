// Receipts against the real PostgreSQL, the local S3 fake, the pg-boss queue and the real reader (tesseract.js):
// upload, reading, duplicates, line editing, filing with exact allocation, cores and returns.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { readQueuedReceipt } from '../../backend/src/jobs/read-receipt.job';
import { startReadingWorker } from '../../backend/src/jobs/worker';
import { readWithPageImages } from '../../backend/src/receipts/read-with-pages';
import { closeReaders } from '../../backend/src/receipts/reading/read-document';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { ReceiptLine } from '../../backend/src/receipts/receipt-line.entity';
import { Core } from '../../backend/src/receipts/core.entity';
import { AuditEvent } from '../../backend/src/audit/audit-event.entity';
import { NEW_BUILD, signedUpClient, uniqueEmail, type ApiClient } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';
import type { Agent } from 'supertest';

jest.setTimeout(120_000);

const FIXTURES = path.resolve(__dirname, '../fixtures/receipts/generated');
const fixture = (name: string) => readFileSync(path.join(FIXTURES, name));
const truth = (name: string) => JSON.parse(readFileSync(path.join(FIXTURES, name.replace(/\.\w+$/, '.json')), 'utf8'));

let t: TestApp;
let stopWorker: () => Promise<void>;
beforeAll(async () => {
  t = await startTestApp({ reading: true });
  stopWorker = await startReadingWorker(t.queue, { orm: t.orm, store: t.store, read: readWithPageImages });
});
afterAll(async () => {
  await stopWorker?.();
  await t?.close();
  await closeReaders();
});

function raw(client: ApiClient) {
  return client as unknown as { agent: Agent; csrf: string };
}

async function upload(client: ApiClient, buildId: string, files: { name: string; bytes: Buffer }[]) {
  let req = raw(client).agent.post(`/api/builds/${buildId}/receipts`).set('X-XSRF-TOKEN', raw(client).csrf);
  for (const file of files) req = req.attach('files', file.bytes, file.name);
  return req;
}

async function waitForState(client: ApiClient, buildId: string, receiptId: string, states: string[]) {
  const deadline = Date.now() + 90_000;
  for (;;) {
    const res = await client.get(`/api/builds/${buildId}/receipts/${receiptId}`);
    if (states.includes(res.body.state)) return res.body;
    if (Date.now() > deadline) throw new Error(`receipt stayed ${res.body.state}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

async function newBuild() {
  const owner = await signedUpClient(t.app, 'receipts');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string }[];
  const system = (name: string) => systems.find((s) => s.name === name)!.id;
  return { ...owner, build, system };
}

async function addCrew(owner: ApiClient, buildId: string) {
  const crew = await signedUpClient(t.app, 'receipts-crew');
  await owner.post(`/api/builds/${buildId}/invites`, { email: crew.email, role: 'crew' });
  const mail = await t.mail.waitFor((m) => m.to.includes(crew.email));
  await crew.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
  return crew.client;
}

/** A receipt as a person has checked it: uploaded for real, then its lines replaced by hand through the API. */
async function checkedReceipt(client: ApiClient, buildId: string, header: object) {
  const res = await upload(client, buildId, [{ name: 'slip.png', bytes: fixture('counter-1.png') }]);
  const receipt = await waitForState(client, buildId, res.body.receipts[0].id, ['to_check', 'failed']);
  for (const line of receipt.lines) await client.delete(`/api/builds/${buildId}/receipts/${receipt.id}/lines/${line.id}`);
  const cleared = { subtotal: null, tax: null, shipping: null, discount: null };
  const updated = await client.patch(`/api/builds/${buildId}/receipts/${receipt.id}`, { ...cleared, ...header, version: receipt.version });
  expect(updated.status).toBe(200);
  return updated.body;
}

describe('upload and reading', () => {
  it('stores each document in S3, reads it in the worker, and fills the check screen', async () => {
    const { client, build } = await newBuild();
    const res = await upload(client, build.id, [
      { name: 'invoice.pdf', bytes: fixture('invoice-1.pdf') },
      { name: 'slip.png', bytes: fixture('core-1.png') },
    ]);
    expect(res.status).toBe(201);
    expect(res.body.receipts.map((r: { contentType: string }) => r.contentType)).toEqual(['application/pdf', 'image/png']);

    const stored = await t.orm.em.fork().findOneOrFail(Receipt, { id: res.body.receipts[1].id });
    expect(stored.sha256).toBe(createHash('sha256').update(fixture('core-1.png')).digest('hex'));
    expect((await t.store.get(stored.documentKey)).equals(fixture('core-1.png'))).toBe(true);

    for (const [index, name] of ['invoice-1.pdf', 'core-1.png'].entries()) {
      const read = await waitForState(client, build.id, res.body.receipts[index].id, ['to_check', 'failed']);
      const expected = truth(name);
      expect(read.state).toBe('to_check');
      expect(read.total).toBe(expected.total);
      expect(read.purchaseDate).toBe(expected.date);
      expect(read.lines.map((l: { amount: string }) => l.amount)).toEqual(expected.lines.map((l: { amount: string }) => l.amount));
      expect(read.pages.length).toBeGreaterThan(0);
      expect(read.lines[0].box).toMatchObject({ page: 0 });
      const page = await client.get(`/api/builds/${build.id}/receipts/${read.id}/pages/0`);
      expect(page.status).toBe(200);
      expect(page.headers['content-type']).toBe('image/png');
    }
    const document = await client.get(`/api/builds/${build.id}/receipts/${res.body.receipts[0].id}/document`);
    expect(document.headers['content-type']).toBe('application/pdf');
    // A PDF is downloaded, never shown as a page of the app, and sandboxed if a browser shows it anyway.
    expect(document.headers['content-disposition']).toBe('attachment; filename="invoice.pdf"');
    expect(document.headers['content-security-policy']).toBe('sandbox');
    const photo = await client.get(`/api/builds/${build.id}/receipts/${res.body.receipts[1].id}/document`);
    expect(photo.headers['content-disposition']).toBe('inline; filename="slip.png"');
  });

  it('refuses a file that is not a photo or a PDF, naming it, and saves nothing', async () => {
    const { client, build } = await newBuild();
    const res = await upload(client, build.id, [
      { name: 'slip.png', bytes: fixture('counter-1.png') },
      { name: 'notes.txt', bytes: Buffer.from('just some text, not a receipt') },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['files.1']).toMatch(/^notes\.txt: .*JPEG, PNG, WebP or HEIC.*PDF/);
    expect(await t.orm.em.fork().count(Receipt, { build: build.id })).toBe(0);
    const none = await upload(client, build.id, []);
    expect(none.body.error.fields).toEqual({ files: 'Attach at least one photo or PDF of a receipt.' });
  });

  it('warns of a likely duplicate: the same document twice', async () => {
    const { client, build } = await newBuild();
    const first = (await upload(client, build.id, [{ name: 'a.png', bytes: fixture('return-1.png') }])).body.receipts[0];
    const second = (await upload(client, build.id, [{ name: 'b.png', bytes: fixture('return-1.png') }])).body.receipts[0];
    expect(second.duplicateOf).toEqual([first.id]);
    const list = (await client.get(`/api/builds/${build.id}/receipts`)).body.receipts;
    expect(list.find((r: { id: string }) => r.id === first.id).duplicateOf).toEqual([second.id]);
  });

  it('marks a photo that cannot be decoded unreadable at once, with a note, instead of retrying it', async () => {
    const { client, build } = await newBuild();
    // A real PNG cut off after its first 2,000 bytes: the header reads, the picture does not.
    const uploaded = (await upload(client, build.id, [{ name: 'cut.png', bytes: fixture('counter-1.png').subarray(0, 2000) }])).body.receipts[0];
    const note = 'This photo could not be opened: it may be damaged, cut off or too large. Upload it again, or enter the lines by hand.';
    expect(await waitForState(client, build.id, uploaded.id, ['failed'])).toMatchObject({ state: 'failed', readingError: note });
    // Read again on a first attempt (not the last one pg-boss allows), it fails for good rather than throwing for a retry.
    await t.orm.em.fork().nativeUpdate(Receipt, { id: uploaded.id }, { state: 'reading', readingError: null });
    expect(await readQueuedReceipt({ orm: t.orm, store: t.store, read: readWithPageImages }, uploaded.id, false)).toBe('failed');
    expect((await t.orm.em.fork().findOneOrFail(Receipt, { id: uploaded.id })).readingError).toBe(note);
  });

  it('never doubles lines when a reading is retried after a crash', async () => {
    const { client, build } = await newBuild();
    const uploaded = (await upload(client, build.id, [{ name: 'slip.png', bytes: fixture('counter-2.png') }])).body.receipts[0];
    const read = await waitForState(client, build.id, uploaded.id, ['to_check']);
    // Simulate a worker killed after writing: the receipt is back to "reading" with a stray line left over.
    const em = t.orm.em.fork();
    await em.nativeUpdate(Receipt, { id: uploaded.id }, { state: 'reading' });
    await em.getConnection().execute(
      `insert into receipt_line (id, build_id, receipt_id, position, kind, description, amount) values (gen_random_uuid(), ?, ?, 99, 'part', 'stray', 1)`,
      [build.id, uploaded.id],
    );
    expect(await readQueuedReceipt({ orm: t.orm, store: t.store, read: readWithPageImages }, uploaded.id, false)).toBe('read');
    expect(await t.orm.em.fork().count(ReceiptLine, { receipt: uploaded.id })).toBe(read.lines.length);
    // A late duplicate job finds it read already and changes nothing.
    expect(await readQueuedReceipt({ orm: t.orm, store: t.store, read: readWithPageImages }, uploaded.id, false)).toBe('skipped');
    expect(await t.orm.em.fork().count(ReceiptLine, { receipt: uploaded.id })).toBe(read.lines.length);
  });
});

describe('the build tells the reader what a date can be', () => {
  it('passes the upload day and the earliest believable day (the build start less the years bought ahead) to the reader', async () => {
    const { client } = await signedUpClient(t.app, 'reading-limits');
    const build = (await client.post('/api/builds', { ...NEW_BUILD, startedOn: '2026-02-01' })).body;
    const uploaded = (await upload(client, build.id, [{ name: 'slip.png', bytes: fixture('counter-2.png') }])).body.receipts[0];
    await waitForState(client, build.id, uploaded.id, ['to_check']);
    await t.orm.em.fork().nativeUpdate(Receipt, { id: uploaded.id }, { state: 'reading' });
    const contexts: unknown[] = [];
    const spy: typeof readWithPageImages = (bytes, locale, context) => {
      contexts.push(context);
      return readWithPageImages(bytes, locale, context);
    };
    expect(await readQueuedReceipt({ orm: t.orm, store: t.store, read: spy }, uploaded.id, false)).toBe('read');
    const uploadDay = (await t.orm.em.fork().findOneOrFail(Receipt, { id: uploaded.id })).createdAt.toISOString().slice(0, 10);
    // 2026-02-01 less 5 years (YEARS_BOUGHT_AHEAD in receipt-date.ts).
    expect(contexts).toEqual([expect.objectContaining({ currency: 'USD', readOn: uploadDay, notBefore: '2021-02-01' })]);
  });
});

describe('checking and filing', () => {
  it('allocates tax to taxable lines and shipping to all, to the cent, and opens a core deposit (worked by hand)', async () => {
    const { client, build, system } = await newBuild();
    const receipt = await checkedReceipt(client, build.id, { vendorName: 'Quayside Parts Counter', purchaseDate: '2026-11-14', tax: '7.21', shipping: '9.99', total: '139.20' });
    const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
    const add = async (body: object) => {
      const res = await client.post(`${base}/lines`, body);
      expect(res.status).toBe(201);
      return res.body;
    };
    await add({ kind: 'part', description: 'Alternator, reman', quantity: '1', unitPrice: '60.00', amount: '60.00', systemId: system('Engine') });
    await add({ kind: 'core_charge', description: 'Alternator core', amount: '22.00', systemId: system('Engine') });
    await add({ kind: 'part', description: 'Coolant 1 gal', quantity: '2', unitPrice: '15.00', amount: '30.00', systemId: system('Cooling') });
    await add({ kind: 'fee', description: 'Bench test', amount: '10.00', taxable: false, systemId: system('Engine') });

    // 60 + 22 + 30 + 10 = 122.00 ; + 7.21 + 9.99 = 139.20: it reconciles.
    const before = (await client.get(base)).body;
    expect(before.reconciliation).toEqual({ linesTotal: '122.00', computedTotal: '139.20', printedTotal: '139.20', difference: '0.00', reconciles: true });

    const filed = await client.post(`${base}/file`, { version: before.version });
    expect(filed.status).toBe(200);
    expect(filed.body.state).toBe('filed');
    // Tax 721 cents over taxable 60 : 22 : 30 (total 112): quotas 386.25, 141.625, 193.125 -> floors 386 + 141 + 193 = 720,
    // one cent left to the largest remainder (.625, the core) -> 3.86, 1.42, 1.93, 0.00.
    expect(filed.body.lines.map((l: { allocatedTax: string }) => l.allocatedTax)).toEqual(['3.86', '1.42', '1.93', '0.00']);
    // Shipping follows the goods, not the refundable deposit: 999 cents over 60 : 30 : 10 (total 100): 599.4, 299.7, 99.9
    // -> floors 599 + 299 + 99 = 997, two cents left to .9 (fee) and .7 (coolant) -> 5.99, 0.00 (core), 3.00, 1.00.
    expect(filed.body.lines.map((l: { allocatedShipping: string }) => l.allocatedShipping)).toEqual(['5.99', '0.00', '3.00', '1.00']);

    // The deposit as paid, the way the ledger counts it: 22.00 + its tax 1.42 = 23.42.
    const cores = (await client.get(`/api/builds/${build.id}/cores`)).body.cores;
    expect(cores).toEqual([expect.objectContaining({ state: 'owed', amount: '23.42', dueDate: '2026-12-14', vendorName: 'Quayside Parts Counter' })]);
    const audit = await t.orm.em.fork().find(AuditEvent, { receiptId: receipt.id, action: 'file' });
    expect(audit).toHaveLength(1);
  });

  it('refuses to file a receipt that does not reconcile; only the owner accepts the difference, with a reason', async () => {
    const { client: owner, build, system } = await newBuild();
    const crew = await addCrew(owner, build.id);
    const receipt = await checkedReceipt(crew, build.id, { purchaseDate: '2026-11-02', total: '50.00' });
    const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
    await crew.post(`${base}/lines`, { kind: 'part', description: 'Relay', amount: '49.90', systemId: system('Wiring harness') });
    const version = (await crew.get(base)).body.version;
    const refused = await crew.post(`${base}/file`, { version });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.total).toBe('The lines and charges come to 49.90 but the receipt says 50.00. Correct a line, add the missing fee, or let the owner accept the difference.');
    expect((await crew.post(`${base}/file`, { version, acceptDifference: { reason: 'rounding at the till' } })).status).toBe(403);
    const accepted = await owner.post(`${base}/file`, { version, acceptDifference: { reason: 'rounding at the till' } });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'filed', differenceAccepted: true, differenceReason: 'rounding at the till' });

    // Filed: crew can no longer change it; the owner can reopen it.
    const lineId = accepted.body.lines[0].id;
    expect((await crew.patch(`${base}/lines/${lineId}`, { amount: '1.00', version: 1 })).status).toBe(403);
    expect((await owner.post(`${base}/reopen`)).body.state).toBe('to_check');
  });

  it('names unassigned lines and the missing date when filing', async () => {
    const { client, build } = await newBuild();
    const receipt = await checkedReceipt(client, build.id, { purchaseDate: null, total: '5.00' });
    const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
    await client.post(`${base}/lines`, { kind: 'part', description: 'Fuse assortment', amount: '5.00' });
    const res = await client.post(`${base}/file`, { version: (await client.get(base)).body.version });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'lines.0.systemId': 'Line 1 ("Fuse assortment") needs a part or a system.', purchaseDate: 'Enter the date of the receipt.' });
  });

  it('refuses bad line input naming the field, and keeps the receipt as it was', async () => {
    const { client, build, system } = await newBuild();
    const other = await newBuild();
    const receipt = await checkedReceipt(client, build.id, { purchaseDate: '2026-11-02', total: '5.00' });
    const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
    const cases: [object, string, string][] = [
      [{ kind: 'part', description: 'X', amount: '1.005' }, 'amount', 'USD amounts have at most 2 decimals.'],
      [{ kind: 'part', description: 'X', amount: '1e3' }, 'amount', 'Write the amount in full, without an exponent such as 1e3.'],
      [{ kind: 'return', description: 'X', amount: '12.00' }, 'amount', 'Money back (a return, a core refund or a discount) is a negative amount, such as -12.50.'],
      [{ kind: 'gift', description: 'X', amount: '1.00' }, 'kind', 'Choose a kind: part, return, core_charge, core_refund, fee, discount.'],
      [{ kind: 'part', description: 'X', amount: '1.00', systemId: other.system('Fuel') }, 'systemId', 'No such system on this build.'],
    ];
    for (const [body, field, message] of cases) {
      const res = await client.post(`${base}/lines`, body);
      expect(res.status).toBe(400);
      expect(res.body.error.fields[field]).toBe(message);
    }
    expect((await client.get(base)).body.lines).toEqual([]);
    expect(system('Fuel')).not.toBe(other.system('Fuel'));
  });

  it('splits a line across systems only when the shares add up exactly', async () => {
    const { client, build, system } = await newBuild();
    const receipt = await checkedReceipt(client, build.id, { purchaseDate: '2026-11-02', total: '100.00' });
    const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
    const line = (await client.post(`${base}/lines`, { kind: 'part', description: 'Hose and clamp kit', amount: '100.00' })).body;
    const wrong = await client.post(`${base}/lines/${line.id}/split`, { version: 1, shares: [{ amount: '60.00', systemId: system('Cooling') }, { amount: '39.99', systemId: system('Fuel') }] });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.shares).toBe("The shares add up to 99.99, not the line's 100.");
    const split = await client.post(`${base}/lines/${line.id}/split`, { version: 1, shares: [{ amount: '60.00', systemId: system('Cooling') }, { amount: '40.00', systemId: system('Fuel') }] });
    expect(split.body.lines.map((l: { amount: string; systemId: string }) => [l.amount, l.systemId])).toEqual([
      ['60.00', system('Cooling')],
      ['40.00', system('Fuel')],
    ]);
  });

  it('links a return to the line it returns, found across earlier receipts, and marks the part sent back', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { systemId: system('Fuel'), description: 'Fuel pressure regulator', quantity: '1', unit: 'each', estimatedUnitCost: '85.00' })).body;
    const first = await checkedReceipt(client, build.id, { vendorName: 'Brackenridge Auto Spares', purchaseDate: '2026-10-01', total: '85.00' });
    const bought = (await client.post(`/api/builds/${build.id}/receipts/${first.id}/lines`, { kind: 'part', description: 'Fuel pressure regulator', partNumber: 'FPR-3', amount: '85.00', partId: part.id })).body;
    expect(bought.systemId).toBe(system('Fuel'));
    await client.post(`/api/builds/${build.id}/receipts/${first.id}/file`, { version: (await client.get(`/api/builds/${build.id}/receipts/${first.id}`)).body.version });
    expect((await client.get(`/api/builds/${build.id}/parts`)).body.parts[0].status).toBe('on_hand');

    const slip = await checkedReceipt(client, build.id, { vendorName: 'Brackenridge Auto Spares', purchaseDate: '2026-10-09', total: '-85.00' });
    const found = (await client.get(`/api/builds/${build.id}/receipt-lines?q=FPR-3&excludeReceiptId=${slip.id}`)).body.lines;
    expect(found).toEqual([expect.objectContaining({ lineId: bought.id, receiptId: first.id, amount: '85.00', vendorName: expect.stringMatching(/^brackenridge auto spares$/i) })]);
    const returned = (await client.post(`/api/builds/${build.id}/receipts/${slip.id}/lines`, { kind: 'return', description: 'Return regulator', amount: '-85.00', returnOfLineId: bought.id })).body;
    expect(returned).toMatchObject({ returnOfLineId: bought.id, partId: part.id, systemId: system('Fuel') });
    const filed = await client.post(`/api/builds/${build.id}/receipts/${slip.id}/file`, { version: (await client.get(`/api/builds/${build.id}/receipts/${slip.id}`)).body.version });
    expect(filed.status).toBe(200);
    expect((await client.get(`/api/builds/${build.id}/parts`)).body.parts[0].status).toBe('returned');
  });

  it('refunds a core when a core refund line links to its charge, and changes a core in one click', async () => {
    const { client, build, system } = await newBuild();
    const first = await checkedReceipt(client, build.id, { purchaseDate: '2026-09-01', total: '160.00' });
    await client.post(`/api/builds/${build.id}/receipts/${first.id}/lines`, { kind: 'part', description: 'Starter', amount: '120.00', systemId: system('Engine') });
    const charge = (await client.post(`/api/builds/${build.id}/receipts/${first.id}/lines`, { kind: 'core_charge', description: 'Starter core', amount: '40.00', systemId: system('Engine') })).body;
    await client.post(`/api/builds/${build.id}/receipts/${first.id}/file`, { version: (await client.get(`/api/builds/${build.id}/receipts/${first.id}`)).body.version });
    const core = (await client.get(`/api/builds/${build.id}/cores`)).body.cores[0];
    const dropped = await client.patch(`/api/builds/${build.id}/cores/${core.id}`, { state: 'dropped_off', version: core.version });
    expect(dropped.body.state).toBe('dropped_off');

    const later = await checkedReceipt(client, build.id, { purchaseDate: '2026-09-20', total: '-40.00' });
    await client.post(`/api/builds/${build.id}/receipts/${later.id}/lines`, { kind: 'core_refund', description: 'Core returned', amount: '-40.00', returnOfLineId: charge.id });
    await client.post(`/api/builds/${build.id}/receipts/${later.id}/file`, { version: (await client.get(`/api/builds/${build.id}/receipts/${later.id}`)).body.version });
    const refunded = (await client.get(`/api/builds/${build.id}/cores`)).body.cores[0];
    expect(refunded).toMatchObject({ state: 'refunded', refundLineId: expect.any(String) });
    expect(await t.orm.em.fork().count(Core, { build: build.id })).toBe(1);
  });

  it('filters the list by state, shop, date range and system', async () => {
    const { client, build, system } = await newBuild();
    const a = await checkedReceipt(client, build.id, { vendorName: 'Hollowell Motor Supply', purchaseDate: '2026-03-10', total: '10.00' });
    await client.post(`/api/builds/${build.id}/receipts/${a.id}/lines`, { kind: 'part', description: 'Gasket', amount: '10.00', systemId: system('Exhaust') });
    await checkedReceipt(client, build.id, { vendorName: 'Tamarind Spare Parts', purchaseDate: '2026-05-10', total: '20.00' });
    const ids = async (query: string) => (await client.get(`/api/builds/${build.id}/receipts?${query}`)).body.receipts.map((r: { id: string }) => r.id);
    expect(await ids('vendor=hollowell')).toEqual([a.id]);
    expect(await ids('from=2026-03-01&to=2026-03-31')).toEqual([a.id]);
    expect(await ids(`systemId=${system('Exhaust')}`)).toEqual([a.id]);
    expect(await ids('state=filed')).toEqual([]);
    expect((await client.get(`/api/builds/${build.id}/receipts?from=March`)).body.error.fields).toEqual({ from: 'Use a date like 2026-11-14.' });
  });
});

it('keeps another build’s receipts out of reach (404)', async () => {
  const mine = await newBuild();
  const theirs = await newBuild();
  const receipt = await checkedReceipt(theirs.client, theirs.build.id, { purchaseDate: '2026-01-01', total: '1.00' });
  expect((await mine.client.get(`/api/builds/${mine.build.id}/receipts/${receipt.id}`)).status).toBe(404);
  expect((await mine.client.get(`/api/builds/${theirs.build.id}/receipts/${receipt.id}`)).status).toBe(404);
  expect(uniqueEmail('x')).not.toBe(uniqueEmail('x'));
});

