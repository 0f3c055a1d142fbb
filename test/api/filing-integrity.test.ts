// Filing keeps the ledger equal to the printed receipts: a filed receipt is read-only until reopened, reopening undoes
// what filing derived (shares of the tax, core refunds), a PATCH changes only what it carries, and amounts too large
// for the columns are refused at input while any stored value still sums without error.
import fc from 'fast-check';
import { sum, toDecimal, toWire } from '../../shared/money';
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(180_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function newBuild(label: string) {
  const { client } = await signedUpClient(t.app, label);
  const buildId = (await client.post('/api/builds', NEW_BUILD)).body.id as string;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  return { client, buildId, systemId: systems.find((s) => s.name === 'Fuel')!.id };
}

const receiptOf = async (client: ApiClient, buildId: string, id: string) => (await client.get(`/api/builds/${buildId}/receipts/${id}`)).body;

describe('a filed receipt and the ledger', () => {
  it('stays equal to the printed totals over random edits, reopenings and filings (property)', async () => {
    const { client, buildId, systemId } = await newBuild('property');
    // Two receipts with a tax line to share out, so filing derives something that reopening must undo.
    const ids: string[] = [];
    for (const day of ['2026-05-04', '2026-05-05']) {
      const receipt = await filedReceipt(t, client, buildId, { purchaseDate: day, tax: '1.30', total: '31.30' }, [
        { kind: 'part', description: 'FUEL FILTER', amount: '10.00', systemId },
        { kind: 'part', description: 'PUMP RELAY', amount: '20.00', systemId },
      ]);
      ids.push(receipt.id);
    }
    const step = fc.record({ receipt: fc.integer({ min: 0, max: 1 }), action: fc.constantFrom('edit', 'reopen', 'file'), cents: fc.integer({ min: 1, max: 99_999 }) });

    await fc.assert(
      fc.asyncProperty(fc.array(step, { minLength: 1, maxLength: 6 }), async (steps) => {
        for (const { receipt: which, action, cents } of steps) {
          const base = `/api/builds/${buildId}/receipts/${ids[which]}`;
          const receipt = await receiptOf(client, buildId, ids[which]);
          const filed = receipt.state === 'filed';
          if (action === 'edit') {
            const amount = toWire(toDecimal(String(cents)).dividedBy(100), 2);
            const edit = await client.patch(`${base}/lines/${receipt.lines[0].id}`, { amount, version: receipt.lines[0].version });
            expect(edit.status).toBe(filed ? 409 : 200);
            if (!filed) {
              const lines = (await receiptOf(client, buildId, ids[which])).lines as { amount: string }[];
              const total = toWire(sum([...lines.map((l) => toDecimal(l.amount)), toDecimal('1.30')]), 2);
              const header = await receiptOf(client, buildId, ids[which]);
              expect((await client.patch(base, { total, version: header.version })).status).toBe(200);
            }
          } else if (action === 'reopen') {
            expect((await client.post(`${base}/reopen`)).status).toBe(filed ? 200 : 400);
          } else if (!filed) {
            expect((await client.post(`${base}/file`, { version: receipt.version })).status).toBe(200);
          }
          // The invariant: the ledger's spend is the sum of the printed totals of the filed receipts, to the cent.
          const receipts = await Promise.all(ids.map((id) => receiptOf(client, buildId, id)));
          const printed = sum(receipts.filter((r) => r.state === 'filed').map((r) => toDecimal(r.total)));
          const ledger = (await client.get(`/api/builds/${buildId}/ledger`)).body;
          expect(ledger.total.spent).toBe(toWire(printed, 2));
        }
      }),
      { numRuns: 6 },
    );
  });

  it('reopening a core refund puts the core back to dropped off; filing it again refunds it again', async () => {
    const { client, buildId, systemId } = await newBuild('core-refund');
    const charge = await filedReceipt(t, client, buildId, { purchaseDate: '2026-06-01', total: '122.00' }, [
      { kind: 'part', description: 'FUEL PUMP REMAN', amount: '100.00', systemId },
      { kind: 'core_charge', description: 'CORE DEPOSIT', amount: '22.00', systemId },
    ]);
    const refund = await filedReceipt(t, client, buildId, { purchaseDate: '2026-06-09', total: '-22.00' }, [
      { kind: 'core_refund', description: 'CORE RETURN', amount: '-22.00', returnOfLineId: charge.lines[1].id },
    ]);
    const coreNow = async () => (await client.get(`/api/builds/${buildId}/cores`)).body.cores[0] as { state: string; refundLineId: string | null };
    expect(await coreNow()).toMatchObject({ state: 'refunded', refundLineId: refund.lines[0].id });

    const refundBase = `/api/builds/${buildId}/receipts/${refund.id}`;
    expect((await client.post(`${refundBase}/reopen`)).status).toBe(200);
    expect(await coreNow()).toMatchObject({ state: 'dropped_off', refundLineId: null });
    const reopened = await receiptOf(client, buildId, refund.id);
    expect((await client.post(`${refundBase}/file`, { version: reopened.version })).status).toBe(200);
    expect(await coreNow()).toMatchObject({ state: 'refunded', refundLineId: refund.lines[0].id });
    expect((await client.post(`${refundBase}/reopen`)).status).toBe(200);
    // Deleting the refund line of the reopened receipt leaves the core owed back, not refunded.
    expect((await client.delete(`${refundBase}/lines/${refund.lines[0].id}`)).status).toBe(204);
    expect(await coreNow()).toMatchObject({ state: 'dropped_off', refundLineId: null });
    const ledger = (await client.get(`/api/builds/${buildId}/ledger`)).body;
    expect(ledger.total.coreDepositsOutstanding).toBe('22.00');
  });
});

describe('a PATCH changes only the fields it carries', () => {
  it('keeps a build status, a part, a system, a receipt header and a line as they were', async () => {
    const { client, buildId, systemId } = await newBuild('partial');
    const build = (await client.patch(`/api/builds/${buildId}`, { status: 'active', version: 1 })).body;
    expect(build.status).toBe('active');
    const renamed = await client.patch(`/api/builds/${buildId}`, { name: 'Renamed coupé', version: build.version });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'Renamed coupé', status: 'active', currency: 'USD', locale: 'en-US', vehicle: NEW_BUILD.vehicle });

    const part = (await client.post(`/api/builds/${buildId}/parts`, { systemId, description: 'Fuel pump', partNumber: 'FP-7', quantity: '2', unit: 'each', estimatedUnitCost: '80.00', status: 'ordered', notes: 'Ask for the 340 l/h one' })).body;
    const partPatched = (await client.patch(`/api/builds/${buildId}/parts/${part.id}`, { description: 'Fuel pump, in-tank', version: part.version })).body;
    expect(partPatched).toMatchObject({ description: 'Fuel pump, in-tank', partNumber: 'FP-7', quantity: '2', status: 'ordered', notes: 'Ask for the 340 l/h one', estimatedUnitCost: '80' });

    const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; version: number; budget: string }[];
    const fuel = systems.find((s) => s.id === systemId)!;
    const budgeted = (await client.patch(`/api/builds/${buildId}/systems/${systemId}`, { budget: '900.00', version: fuel.version })).body;
    const systemPatched = (await client.patch(`/api/builds/${buildId}/systems/${systemId}`, { name: 'Fuel system', version: budgeted.version })).body;
    expect(systemPatched).toMatchObject({ name: 'Fuel system', budget: '900.00', archived: false });

    const receipt = await filedReceipt(t, client, buildId, { purchaseDate: '2026-07-01', vendorName: 'Harbour Lane Motor Spares', total: '30.00' }, [
      { kind: 'part', description: 'FUEL HOSE', partNumber: 'FH-8', quantity: '3', unitPrice: '10.00', amount: '30.00', systemId },
    ], { file: false });
    const header = (await client.patch(`/api/builds/${buildId}/receipts/${receipt.id}`, { receiptNumber: 'A-1182', version: receipt.version })).body;
    expect(header).toMatchObject({ receiptNumber: 'A-1182', purchaseDate: '2026-07-01', vendorName: 'Harbour Lane Motor Spares', total: '30.00' });
    const line = (await client.patch(`/api/builds/${buildId}/receipts/${receipt.id}/lines/${receipt.lines[0].id}`, { description: 'FUEL HOSE 8MM', version: receipt.lines[0].version })).body;
    expect(line).toMatchObject({ description: 'FUEL HOSE 8MM', partNumber: 'FH-8', quantity: '3', unitPrice: '10', amount: '30.00', systemId });
  });
});

describe('amounts too large for a build', () => {
  it('sums any stored numeric(19,4) value exactly on the ledger, the build sheet and its CSV', async () => {
    const { client, buildId, systemId } = await newBuild('huge');
    const part = (await client.post(`/api/builds/${buildId}/parts`, { systemId, description: 'Placeholder', quantity: '1', unit: 'each', estimatedUnitCost: '1.00' })).body;
    // Values stored before input was bounded: the largest numeric(19,4) holds, written past the API.
    await t.orm.em.fork().getConnection().execute(`update part set quantity = 999999999999999.9999, estimated_unit_cost = 999999999999999.9999 where id = ?`, [part.id]);
    // The reference product, worked with BigInt (ECMAScript's exact integers), then rounded to cents half up:
    // 9999999999999999999² = 99999999999999999980000000000000000001 at 8 decimals.
    const tenThousandths = 9999999999999999999n;
    const product = tenThousandths * tenThousandths; // scale 8
    const cents = (product + 500000n) / 1000000n; // half up to scale 2 (positive)
    const expected = `${cents / 100n}.${String(cents % 100n).padStart(2, '0')}`;
    const ledger = await client.get(`/api/builds/${buildId}/ledger`);
    expect(ledger.status).toBe(200);
    expect(ledger.body.total.planned).toBe(expected);
    expect((await client.get(`/api/builds/${buildId}/exports/build-sheet`)).status).toBe(200);
    const csv = await client.get(`/api/builds/${buildId}/exports/build-sheet.csv`);
    expect(csv.status).toBe(200);
  });
});
