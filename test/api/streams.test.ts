// Downloads that end early: a client that goes away mid-download, an object store that fails mid-stream. Each must
// end the response and give back the database connection and the store's stream.
import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import type { Agent } from 'supertest';
import { Build } from '../../backend/src/builds/build.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { ReceiptLine } from '../../backend/src/receipts/receipt-line.entity';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);
let t: TestApp;
let client: ApiClient;
let buildId: string;
let receiptId: string;
let bigBuildId: string;

async function buildWithReceipt(): Promise<{ buildId: string; receiptId: string }> {
  const id = (await client.post('/api/builds', NEW_BUILD)).body.id;
  const engine = (await client.get(`/api/builds/${id}/systems`)).body.systems[0].id;
  const receipt = await filedReceipt(t, client, id, { purchaseDate: '2026-05-02', total: '5.00' }, [{ kind: 'part', description: 'Hose clamp', amount: '5.00', systemId: engine }]);
  return { buildId: id, receiptId: receipt.id };
}

beforeAll(async () => {
  t = await startTestApp();
  client = (await signedUpClient(t.app, 'streams')).client;
  ({ buildId, receiptId } = await buildWithReceipt());
  const big = await buildWithReceipt();
  bigBuildId = big.buildId;
  // Archived (downloads still work) so that the alert runs of other test files, which visit every active build and
  // compute its ledger, never meet this one while it exists; its lines go again at the end.
  await t.orm.em.fork().nativeUpdate(Build, { id: bigBuildId }, { archivedAt: new Date() });
  // 8,000 more lines on one filed receipt of another build: a tax ledger (about 800 kB) larger than the socket's buffers.
  await t.orm.em.fork().getConnection().execute(
    `insert into receipt_line (id, build_id, receipt_id, position, kind, description, amount, system_id)
     select gen_random_uuid(), build_id, receipt_id, position + n, kind, description, amount, system_id
       from receipt_line, generate_series(1, 8000) as n where receipt_id = ?`,
    [big.receiptId],
  );
});
afterAll(async () => {
  await t.orm.em.fork().nativeDelete(ReceiptLine, { build: bigBuildId });
  await t.close();
});

const agent = () => (client as unknown as { agent: Agent }).agent;
const pool = () => (t.orm.em.getConnection().getKnex().client as { pool: { numUsed(): number } }).pool;

/** Starts a download, takes at least `bytes` of it, and hangs up. */
function downloadAndHangUp(build: string, path: string, bytes = 1): Promise<number> {
  return new Promise((resolve) => {
    let received = 0;
    const request = agent()
      .get(`/api/builds/${build}/${path}`)
      .buffer(true)
      .parse((response, done) => {
        // In Node the response handed to a parser is the incoming message itself.
        const res = response as unknown as import('node:http').IncomingMessage;
        res.on('data', (chunk: Buffer) => {
          received += chunk.length;
          if (received < bytes || res.destroyed) return;
          res.destroy();
          done(null, null);
        });
      });
    request.then(
      () => resolve(received),
      () => resolve(received),
    );
  });
}

async function poolDrains(): Promise<number> {
  const deadline = Date.now() + 15_000;
  while (pool().numUsed() > 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
  return pool().numUsed();
}

it('gives the database connection back when a tax-ledger download is abandoned, however often', async () => {
  for (let i = 0; i < 12; i += 1) expect(await downloadAndHangUp(bigBuildId, 'exports/tax-ledger.csv')).toBeGreaterThan(0);
  expect(await poolDrains()).toBe(0);
  expect((await client.get(`/api/builds/${bigBuildId}/parts`)).status).toBe(200);
});

it('ends an abandoned ZIP download: the store streams are closed and the connection given back', async () => {
  const stream = t.store.stream;
  const opened: Readable[] = [];
  // A document that never ends, as a very large one would look from here (random bytes: the ZIP cannot shrink them).
  t.store.stream = async () => {
    const endless = new Readable({ read() { setTimeout(() => this.push(randomBytes(64 * 1024)), 5); } });
    opened.push(endless);
    return { body: endless };
  };
  try {
    expect(await downloadAndHangUp(buildId, 'exports/archive.zip', 512 * 1024)).toBeGreaterThanOrEqual(512 * 1024);
    const deadline = Date.now() + 5000;
    while (!opened.every((s) => s.destroyed) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
    expect(opened.length).toBeGreaterThan(0);
    expect(opened.map((s) => s.destroyed)).toEqual(opened.map(() => true));
  } finally {
    t.store.stream = stream;
  }
  expect(await poolDrains()).toBe(0);
  expect((await client.get(`/api/builds/${buildId}/ledger`)).status).toBe(200);
});

it('ends the response when the object store fails mid-document, instead of leaving it open', async () => {
  const stream = t.store.stream;
  t.store.stream = async () => {
    let sent = false;
    const failing = new Readable({
      read() {
        if (sent) this.destroy(new Error('the store went away'));
        else this.push(Buffer.from('%PDF-1.4 the first bytes'));
        sent = true;
      },
    });
    return { body: failing };
  };
  const consoleError = jest.spyOn(console, 'error').mockImplementation(() => undefined);
  try {
    const outcome = await Promise.race([
      agent().get(`/api/builds/${buildId}/receipts/${receiptId}/document`).then(() => 'completed', (error: Error) => `ended: ${error.message}`),
      new Promise<string>((resolve) => setTimeout(() => resolve('still open after 3 s'), 3000)),
    ]);
    // The body was cut short, so the response is ended abruptly: never a complete, truncated file, never left open.
    expect(outcome).toMatch(/^ended: /);
  } finally {
    t.store.stream = stream;
    consoleError.mockRestore();
  }
  expect(await poolDrains()).toBe(0);
  expect((await t.orm.em.fork().findOneOrFail(Receipt, receiptId)).state).toBe('filed');
});
