// Returns against the real PostgreSQL: the returnable window worked by hand, sent back and awaiting with its
// allocated charges to the cent, refunded once the return slip is filed, the ledger agreeing, and who may look.
import { Build } from '../../backend/src/builds/build.entity';
import { listReturns, utcToday } from '../../backend/src/receipts/returns.service';
import { sum, toDecimal, toWire } from '../../shared/money';
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function newBuild(label = 'returns') {
  const owner = await signedUpClient(t.app, label);
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body as { id: string; returnWindowDays: number };
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string }[];
  const system = (name: string) => systems.find((s) => s.name === name)!.id;
  const addPart = async (systemName: string, description: string, partNumber = '') =>
    (await owner.client.post(`/api/builds/${build.id}/parts`, { systemId: system(systemName), description, partNumber, quantity: '1', unit: 'each', estimatedUnitCost: '10.00' })).body as { id: string };
  return { ...owner, build, system, addPart };
}

async function setStatus(client: ApiClient, buildId: string, partId: string, status: string) {
  const part = (await client.get(`/api/builds/${buildId}/parts`)).body.parts.find((p: { id: string }) => p.id === partId);
  const res = await client.patch(`/api/builds/${buildId}/parts/${partId}`, { status, version: part.version });
  expect(res.status).toBe(200);
}

/** The service at a fixed "today", so windows can be worked by hand whatever the date of the run. */
async function returnsOn(buildId: string, today: string) {
  const em = t.orm.em.fork();
  return listReturns(em, await em.findOneOrFail(Build, { id: buildId }), today);
}

function addDaysUtc(isoDate: string, days: number): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

describe('returns', () => {
  it('lists a returnable line until purchase date + 30 days, then 14 days more marked closed', async () => {
    const { client, build, addPart } = await newBuild();
    expect(build.returnWindowDays).toBe(30);
    const thermostat = await addPart('Cooling', 'Thermostat 82 °C', 'TS-82');
    const pump = await addPart('Cooling', 'Water pump');
    const receipt = await filedReceipt(t, client, build.id, { purchaseDate: '2026-01-31', tax: '1.60', total: '81.60' }, [
      { kind: 'part', description: 'THERMO 82C', amount: '20.00', partId: thermostat.id },
      { kind: 'part', description: 'WTR PUMP', amount: '60.00', partId: pump.id },
    ]);

    // 2026-01-31 + 30 days: 28 days to 2026-02-28 (2026 is not a leap year), 2 more to 2026-03-02 (worked by hand).
    // Tax 1.60 over 20.00 : 60.00 is 0.40 and 1.20, so the lines cost 20.40 and 61.20.
    const open = await returnsOn(build.id, '2026-02-20');
    expect(open.returnable).toEqual([
      {
        lineId: receipt.lines[0].id,
        receiptId: receipt.id,
        vendorName: null,
        purchaseDate: '2026-01-31',
        description: 'Thermostat 82 °C',
        partNumber: 'TS-82',
        amountPaid: '20.40',
        partId: thermostat.id,
        partVersion: expect.any(Number),
        partStatus: 'on_hand',
        returnableUntil: '2026-03-02',
        windowClosed: false,
      },
      expect.objectContaining({ description: 'Water pump', partNumber: '', amountPaid: '61.20', returnableUntil: '2026-03-02', windowClosed: false }),
    ]);
    expect(open.awaitingRefund).toEqual([]);
    expect(open.refunded).toEqual([]);

    // The last day itself is still open; the day after it is closed; 14 days after that it is still listed, then gone.
    expect((await returnsOn(build.id, '2026-03-02')).returnable.map((item) => item.windowClosed)).toEqual([false, false]);
    expect((await returnsOn(build.id, '2026-03-03')).returnable.map((item) => item.windowClosed)).toEqual([true, true]);
    expect((await returnsOn(build.id, '2026-03-16')).returnable).toHaveLength(2);
    expect((await returnsOn(build.id, '2026-03-17')).returnable).toEqual([]);

    // A fitted part is no longer returnable.
    await setStatus(client, build.id, thermostat.id, 'installed');
    expect((await returnsOn(build.id, '2026-02-20')).returnable.map((item) => item.description)).toEqual(['Water pump']);
  });

  it('shows a recent purchase through the API with its window counted from today', async () => {
    const { client, build, addPart } = await newBuild();
    const hose = await addPart('Brakes', 'Braided brake hose');
    const bought = addDaysUtc(utcToday(), -5);
    await filedReceipt(t, client, build.id, { purchaseDate: bought, total: '24.00' }, [{ kind: 'part', description: 'HOSE', amount: '24.00', partId: hose.id }]);
    const res = await client.get(`/api/builds/${build.id}/returns`);
    expect(res.status).toBe(200);
    expect(res.body.returnable).toHaveLength(1);
    expect(res.body.returnable[0]).toMatchObject({ description: 'Braided brake hose', amountPaid: '24.00', returnableUntil: addDaysUtc(utcToday(), 25), windowClosed: false });
  });

  it('moves a part sent back to awaiting with its allocated charges, then to refunded once the return slip is filed', async () => {
    const { client, build, addPart, system } = await newBuild();
    const pump = await addPart('Cooling', 'Water pump');
    const hose = await addPart('Brakes', 'Braided brake hose');
    const first = await filedReceipt(t, client, build.id, { purchaseDate: '2026-01-31', tax: '1.60', total: '81.60' }, [
      { kind: 'part', description: 'THERMO 82C', amount: '20.00', systemId: system('Cooling') },
      { kind: 'part', description: 'WTR PUMP', amount: '60.00', partId: pump.id },
    ]);
    // Tax 2.75 over 33.33 : 10.00 is 2.1153.. and 0.6346..; cents 2.11 + 0.63 = 2.74, the last cent to the larger
    // remainder (the hose): 2.12. Shipping 4.99 the same way: 3.8383.. and 1.1516.. -> 3.83 + 1.15, the hose gets 3.84.
    // The hose cost 33.33 + 2.12 + 3.84 = 39.29 (worked by hand).
    const second = await filedReceipt(t, client, build.id, { purchaseDate: '2026-02-10', tax: '2.75', shipping: '4.99', total: '51.07' }, [
      { kind: 'part', description: 'BRAIDED HOSE', amount: '33.33', partId: hose.id },
      { kind: 'part', description: 'Hose clamps', amount: '10.00', systemId: system('Brakes') },
    ]);
    expect(second.lines[0]).toMatchObject({ allocatedTax: '2.12', allocatedShipping: '3.84' });

    await setStatus(client, build.id, pump.id, 'returned');
    await setStatus(client, build.id, hose.id, 'returned');
    let returns = (await client.get(`/api/builds/${build.id}/returns`)).body;
    expect(returns.awaitingRefund).toEqual([
      expect.objectContaining({ lineId: first.lines[1].id, description: 'Water pump', amountPaid: '61.20', partId: pump.id, partStatus: 'returned' }),
      expect.objectContaining({ lineId: second.lines[0].id, receiptId: second.id, description: 'Braided brake hose', amountPaid: '39.29', partStatus: 'returned' }),
    ]);
    expect(returns.returnable).toEqual([]);
    let ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    const awaitingSum = (list: { amountPaid: string }[]) => toWire(sum(list.map((item) => toDecimal(item.amountPaid))), 2);
    expect(ledger.total.returnsAwaitingRefund).toBe('100.49');
    expect(awaitingSum(returns.awaitingRefund)).toBe(ledger.total.returnsAwaitingRefund);

    // The pump's refund comes back on a return slip, its tax with it.
    const slip = await filedReceipt(t, client, build.id, { purchaseDate: '2026-02-25', tax: '-1.20', total: '-61.20' }, [
      { kind: 'return', description: 'Water pump back', amount: '-60.00', returnOfLineId: first.lines[1].id },
    ]);
    returns = (await client.get(`/api/builds/${build.id}/returns`)).body;
    expect(returns.awaitingRefund.map((item: { description: string }) => item.description)).toEqual(['Braided brake hose']);
    expect(returns.refunded).toEqual([
      {
        lineId: first.lines[1].id,
        receiptId: first.id,
        vendorName: null,
        purchaseDate: '2026-01-31',
        description: 'Water pump',
        partNumber: '',
        amountPaid: '61.20',
        partId: pump.id,
        partVersion: expect.any(Number),
        partStatus: 'returned',
        refundReceiptId: slip.id,
        refundDate: '2026-02-25',
        refundedAmount: '61.20',
      },
    ]);
    ledger = (await client.get(`/api/builds/${build.id}/ledger`)).body;
    expect(ledger.total.returnsAwaitingRefund).toBe('39.29');
    expect(awaitingSum(returns.awaitingRefund)).toBe(ledger.total.returnsAwaitingRefund);

    // Kept after all: the hose goes back on the shelf and is returnable again (bought 2026-02-10, until 2026-03-12).
    await setStatus(client, build.id, hose.id, 'on_hand');
    const kept = await returnsOn(build.id, '2026-03-01');
    expect(kept.awaitingRefund).toEqual([]);
    expect(kept.returnable).toEqual([expect.objectContaining({ description: 'Braided brake hose', returnableUntil: '2026-03-12', partStatus: 'on_hand' })]);
  });

  it("names a core deposit by its part's description when its line is assigned to one", async () => {
    const { client, build, addPart } = await newBuild();
    const alternator = await addPart('Engine', 'Alternator 90 A, rebuilt', 'ALT-90');
    await filedReceipt(t, client, build.id, { purchaseDate: '2026-01-31', total: '40.00' }, [{ kind: 'core_charge', description: 'CORE CHARGE', partNumber: 'ALT-90', amount: '40.00', partId: alternator.id }]);
    const cores = (await client.get(`/api/builds/${build.id}/cores`)).body.cores;
    expect(cores.map((core: { description: string; partNumber: string }) => [core.description, core.partNumber])).toEqual([['Alternator 90 A, rebuilt', 'ALT-90']]);
  });

  it("answers 404 for another build's returns and 401 signed out", async () => {
    const mine = await newBuild('returns-mine');
    const theirs = await newBuild('returns-theirs');
    const hose = await theirs.addPart('Brakes', 'Their hose');
    await filedReceipt(t, theirs.client, theirs.build.id, { purchaseDate: utcToday(), total: '24.00' }, [{ kind: 'part', description: 'HOSE', amount: '24.00', partId: hose.id }]);
    const outsider = await mine.client.get(`/api/builds/${theirs.build.id}/returns`);
    expect(outsider.status).toBe(404);
    expect(JSON.stringify(outsider.body)).not.toContain('Their hose');
    expect((await mine.client.get(`/api/builds/${mine.build.id}/returns`)).body).toEqual({ returnable: [], awaitingRefund: [], refunded: [] });
    const anonymous = await new ApiClient(t.app).init();
    expect((await anonymous.get(`/api/builds/${theirs.build.id}/returns`)).status).toBe(401);
  });
});
