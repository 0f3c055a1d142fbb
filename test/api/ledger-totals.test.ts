// The ledger's running totals against the real PostgreSQL: after a seeded random walk of filings, reopenings, refunds,
// parts sent back and core deposits through the API, after two filings at once, and after a change made outside any
// request, the stored totals are exactly a fresh aggregate of the receipt lines, and the ledger shows them.
import { totalsBesideFreshAggregate } from '../../backend/src/ledger/ledger-totals';
import { roundHalfUp, sum, toDecimal, toWire } from '../../shared/money';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { walkLedger, WALK_ACTIONS } from '../support/ledger-walk';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(180_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

/** A build with parts in two systems, two filed receipts (tax, shipping, a core deposit, a fee on no system) and two open. */
async function buildWithHistory(label: string): Promise<{ client: ApiClient; buildId: string }> {
  const { client } = await signedUpClient(t.app, label);
  const buildId = (await client.post('/api/builds', NEW_BUILD)).body.id as string;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  const system = (name: string) => systems.find((s) => s.name === name)!.id;
  const part = async (systemName: string, description: string, estimatedUnitCost: string) =>
    (await client.post(`/api/builds/${buildId}/parts`, { systemId: system(systemName), description, quantity: '1', unit: 'each', estimatedUnitCost })).body.id as string;
  const pump = await part('Cooling', 'Water pump', '55.00');
  const hose = await part('Cooling', 'Radiator hose', '20.00');
  const caliper = await part('Brakes', 'Brake caliper', '80.00');
  const pads = await part('Brakes', 'Brake pads', '30.00');
  // 60.00 + 24.50 + 15.00 + 3.00 = 102.50; with tax 6.15 and shipping 7.35: 116.00.
  await filedReceipt(t, client, buildId, { purchaseDate: '2026-03-02', tax: '6.15', shipping: '7.35', total: '116.00' }, [
    { kind: 'part', description: 'WATER PUMP', amount: '60.00', partId: pump },
    { kind: 'part', description: 'RAD HOSE', amount: '24.50', partId: hose },
    { kind: 'core_charge', description: 'CORE DEP', amount: '15.00', systemId: system('Brakes') },
    { kind: 'fee', description: 'SHOP SUPPLIES', amount: '3.00' },
  ]);
  // 92.17 + 31.99 = 124.16; with tax 8.71 and a discount of 5.00: 127.87.
  await filedReceipt(t, client, buildId, { purchaseDate: '2026-03-09', tax: '8.71', discount: '5.00', total: '127.87' }, [
    { kind: 'part', description: 'CALIPER REMAN', amount: '92.17', partId: caliper },
    { kind: 'part', description: 'PADS CERAMIC', amount: '31.99', partId: pads },
  ]);
  for (const [date, amount] of [['2026-03-16', '18.45'], ['2026-03-23', '7.10']]) {
    await filedReceipt(t, client, buildId, { purchaseDate: date, total: amount }, [{ kind: 'part', description: 'HOSE CLAMPS', amount, partId: hose }], { file: false });
  }
  return { client, buildId };
}

async function staleMarks(buildId: string): Promise<number> {
  const [row] = await t.orm.em.fork().execute<{ count: string }[]>(`select count(*) from ledger_stale where build_id = ?`, [buildId]);
  return Number(row.count);
}

/** The stored totals equal a fresh aggregate, and no mark is left: each request brought its own changes up to date. */
async function expectTotalsExact(buildId: string) {
  const { stored, fresh } = await totalsBesideFreshAggregate(t.orm.em.fork(), buildId);
  expect(stored).toEqual(fresh);
  expect(await staleMarks(buildId)).toBe(0);
  return fresh;
}

/** The ledger's build totals of the four line figures, against the fresh aggregate's system rows added up and rounded. */
async function expectLedgerShows(client: ApiClient, buildId: string, fresh: string[]) {
  const columns = fresh.filter((row) => row.startsWith('system ')).map((row) => row.split(' ').slice(2));
  const added = (index: number) => toWire(roundHalfUp(sum(columns.map((values) => toDecimal(values[index]))), 2), 2);
  const ledger = (await client.get(`/api/builds/${buildId}/ledger`)).body;
  expect([ledger.total.spent, ledger.total.netCost, ledger.total.coreDepositsOutstanding, ledger.total.returnsAwaitingRefund]).toEqual([0, 1, 2, 3].map(added));
}

describe('ledger running totals', () => {
  it('equal a fresh aggregate after a seeded random walk of 60 changes through the API', async () => {
    const { client, buildId } = await buildWithHistory('totals-walk');
    const before = await expectTotalsExact(buildId);
    // Worked by hand from the receipts above: the first receipt's lines carry its tax and shipping, the second's its
    // tax less its discount; the fee on no system is spread over the others, so spent is the two printed totals.
    expect(before.filter((row) => row.startsWith('system '))).toHaveLength(2);
    expect(before.filter((row) => row.startsWith('part '))).toHaveLength(4);
    await expectLedgerShows(client, buildId, before);
    expect((await client.get(`/api/builds/${buildId}/ledger`)).body.total.spent).toBe('243.87');

    const walk = await walkLedger((method, url, body) => client.send(method, url, body), buildId, { steps: 60, seed: 20261203 });
    // Every kind of change was made at least once, so the comparison below covers them all.
    for (const action of WALK_ACTIONS) expect({ action, applied: walk.applied[action] > 0 }).toEqual({ action, applied: true });
    const after = await expectTotalsExact(buildId);
    expect(after).not.toEqual(before);
    await expectLedgerShows(client, buildId, after);
  });

  it('count both of two receipts filed at the same moment', async () => {
    const { client, buildId } = await buildWithHistory('totals-race');
    const open = (await client.get(`/api/builds/${buildId}/receipts?state=to_check`)).body.receipts as { id: string; version: number }[];
    expect(open).toHaveLength(2);
    const answers = await Promise.all(open.map((r) => client.post(`/api/builds/${buildId}/receipts/${r.id}/file`, { version: r.version })));
    expect(answers.map((res) => res.status)).toEqual([200, 200]);
    const fresh = await expectTotalsExact(buildId);
    await expectLedgerShows(client, buildId, fresh);
    expect((await client.get(`/api/builds/${buildId}/ledger`)).body.total.spent).toBe('269.42');
  });

  it('are brought up to date at the next ledger read after a change made outside any request', async () => {
    const { client, buildId } = await buildWithHistory('totals-outside');
    await expectTotalsExact(buildId);
    // A filed line changed by hand, as a job or an operator could: the trigger marks the build stale.
    await t.orm.em.fork().execute(`update receipt_line set amount = amount + 1 where build_id = ? and description = 'WATER PUMP'`, [buildId]);
    expect(await staleMarks(buildId)).toBe(1);
    const { stored, fresh } = await totalsBesideFreshAggregate(t.orm.em.fork(), buildId);
    expect(stored).not.toEqual(fresh);
    expect((await client.get(`/api/builds/${buildId}/ledger`)).body.total.spent).toBe('244.87');
    await expectTotalsExact(buildId);
  });
});
