// The ledger screen's breakdowns against the real PostgreSQL: spend over time and by vendor, and the lines behind each
// figure, on a build with tax, shipping and a discount allocated, a core owed, a core forfeited, a return refunded and
// a return awaiting its refund. Figures worked by hand in the comments, to the cent.
import { Build } from '../../backend/src/builds/build.entity';
import { Membership } from '../../backend/src/builds/membership.entity';
import { User } from '../../backend/src/auth/user.entity';
import { Decimal, sum, toWire } from '../../shared/money';
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

interface Scenario {
  client: ApiClient;
  buildId: string;
  engine: string;
  cooling: string;
}

/**
 * Receipt A, Quayside Parts, 2026-07-03: tax 7.21, shipping 9.99, printed 139.20.
 *   Tax over the taxable 60 : 22 : 30 -> 3.86, 1.42, 1.93; shipping over 60 : 30 : 10 (not the deposit) -> 5.99, 3.00, 1.00.
 *   Alternator 69.85 (Engine), alternator core 23.42 (Engine, stays owed), coolant 34.93 (Cooling), bench test fee 11.00 (Engine).
 * Receipt B, Harbour Row Supply, 2026-07-20: discount 14.00 over the parts 25 : 15 : 100 -> 2.50, 1.50, 10.00, printed 166.00.
 *   Thermostat 22.50 (Cooling, later sent back: its refund not filed), radiator cap 13.50 (Cooling), starter 90.00 (Engine),
 *   starter core 40.00 (Engine, forfeited).
 * Receipt C, Quayside Parts, 2026-09-02: the radiator cap returned, -13.50.
 */
async function scenario(): Promise<Scenario> {
  const { client } = await signedUpClient(t.app, 'ledger-screen');
  const buildId = (await client.post('/api/builds', NEW_BUILD)).body.id as string;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  const engine = systems.find((s) => s.name === 'Engine')!.id;
  const cooling = systems.find((s) => s.name === 'Cooling')!.id;
  const thermostat = (
    await client.post(`/api/builds/${buildId}/parts`, { systemId: cooling, description: 'Thermostat', quantity: '1', unit: 'each', estimatedUnitCost: '20.00' })
  ).body;

  await filedReceipt(t, client, buildId, { vendorName: 'Quayside Parts', purchaseDate: '2026-07-03', tax: '7.21', shipping: '9.99', total: '139.20' }, [
    { kind: 'part', description: 'Alternator, reman', amount: '60.00', systemId: engine },
    { kind: 'core_charge', description: 'Alternator core', amount: '22.00', systemId: engine },
    { kind: 'part', description: 'Coolant', amount: '30.00', systemId: cooling },
    { kind: 'fee', description: 'Bench test', amount: '10.00', taxable: false, systemId: engine },
  ]);
  const b = await filedReceipt(t, client, buildId, { vendorName: 'Harbour Row Supply', purchaseDate: '2026-07-20', discount: '14.00', total: '166.00' }, [
    { kind: 'part', description: 'Thermostat', amount: '25.00', partId: thermostat.id },
    { kind: 'part', description: 'Radiator cap', amount: '15.00', systemId: cooling },
    { kind: 'part', description: 'Starter', amount: '100.00', systemId: engine },
    { kind: 'core_charge', description: 'Starter core', amount: '40.00', systemId: engine },
  ]);
  const cap = b.lines.find((l: { description: string }) => l.description === 'Radiator cap');
  await filedReceipt(t, client, buildId, { vendorName: 'Quayside Parts', purchaseDate: '2026-09-02', total: '-13.50' }, [
    { kind: 'return', description: 'Radiator cap back', amount: '-13.50', returnOfLineId: cap.id },
  ]);

  const cores = (await client.get(`/api/builds/${buildId}/cores`)).body.cores as { id: string; description: string; version: number }[];
  const starterCore = cores.find((c) => c.description === 'Starter core')!;
  expect((await client.patch(`/api/builds/${buildId}/cores/${starterCore.id}`, { state: 'forfeited', version: starterCore.version })).status).toBe(200);
  const part = (await client.get(`/api/builds/${buildId}/parts`)).body.parts.find((p: { id: string }) => p.id === thermostat.id);
  expect((await client.patch(`/api/builds/${buildId}/parts/${thermostat.id}`, { status: 'returned', version: part.version })).status).toBe(200);
  return { client, buildId, engine, cooling };
}

let s: Scenario;
beforeAll(async () => {
  s = await scenario();
});

type Figures = Record<string, string>;
const ledgerOf = async () => (await s.client.get(`/api/builds/${s.buildId}/ledger`)).body as { systems: (Figures & { systemId: string; name: string })[]; total: Figures };

describe('the ledger of the scenario (the figures the breakdowns must add up to)', () => {
  it('matches the hand-worked figures', async () => {
    const ledger = await ledgerOf();
    // Engine: 69.85 + 23.42 + 11.00 + 90.00 + 40.00 = 234.27 spent; net leaves out the owed deposit: 210.85.
    expect(ledger.systems.find((x) => x.name === 'Engine')).toMatchObject({ spent: '234.27', netCost: '210.85', coreDepositsOutstanding: '23.42', returnsAwaitingRefund: '0.00' });
    // Cooling: 34.93 + 22.50 + 13.50 - 13.50 = 57.43; the thermostat's 22.50 is owed back.
    expect(ledger.systems.find((x) => x.name === 'Cooling')).toMatchObject({ spent: '57.43', netCost: '57.43', coreDepositsOutstanding: '0.00', returnsAwaitingRefund: '22.50' });
    // 139.20 + 166.00 - 13.50 = 291.70, the printed totals; net 210.85 + 57.43 = 268.28.
    expect(ledger.total).toMatchObject({ spent: '291.70', netCost: '268.28', coreDepositsOutstanding: '23.42', returnsAwaitingRefund: '22.50' });
  });
});

describe('GET /ledger/spend', () => {
  it('sums by month in order, with the empty August between', async () => {
    const res = await s.client.get(`/api/builds/${s.buildId}/ledger/spend?by=month`);
    expect(res.status).toBe(200);
    // July: 139.20 + 166.00 = 305.20 spent; net 115.78 (A without its owed deposit) + 166.00 = 281.78. September: the return.
    expect(res.body).toEqual({
      currency: 'USD',
      by: 'month',
      periods: [
        { period: '2026-07', spent: '305.20', netCost: '281.78' },
        { period: '2026-08', spent: '0.00', netCost: '0.00' },
        { period: '2026-09', spent: '-13.50', netCost: '-13.50' },
      ],
    });
  });

  it('sums by ISO 8601 week, month by default', async () => {
    const res = await s.client.get(`/api/builds/${s.buildId}/ledger/spend?by=week`);
    // ISO 8601: week 1 of 2026 holds Thursday 1 January, so it starts Monday 2025-12-29. 2026-07-03 is a Friday of
    // week 27 (starting 06-29), 2026-07-20 the Monday of week 30, 2026-09-02 a Wednesday of week 36: ten weeks in all.
    const periods = res.body.periods as { period: string; spent: string; netCost: string }[];
    expect(periods.map((p) => p.period)).toEqual(['2026-W27', '2026-W28', '2026-W29', '2026-W30', '2026-W31', '2026-W32', '2026-W33', '2026-W34', '2026-W35', '2026-W36']);
    expect(periods[0]).toEqual({ period: '2026-W27', spent: '139.20', netCost: '115.78' });
    expect(periods[3]).toEqual({ period: '2026-W30', spent: '166.00', netCost: '166.00' });
    expect(periods[9]).toEqual({ period: '2026-W36', spent: '-13.50', netCost: '-13.50' });
    expect(periods[5]).toEqual({ period: '2026-W32', spent: '0.00', netCost: '0.00' });
    expect((await s.client.get(`/api/builds/${s.buildId}/ledger/spend`)).body.by).toBe('month');
  });

  it('names the field of a bad period, and answers an empty list for a build with nothing filed', async () => {
    const bad = await s.client.get(`/api/builds/${s.buildId}/ledger/spend?by=day`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ by: 'Use month or week.' });
    const empty = (await s.client.post('/api/builds', NEW_BUILD)).body.id;
    expect((await s.client.get(`/api/builds/${empty}/ledger/spend`)).body).toEqual({ currency: 'USD', by: 'month', periods: [] });
  });
});

describe('GET /ledger/vendors', () => {
  it('sums per shop, largest net cost first', async () => {
    const res = await s.client.get(`/api/builds/${s.buildId}/ledger/vendors`);
    expect(res.status).toBe(200);
    const vendors = res.body.vendors as { vendorId: string }[];
    expect(vendors.every((v) => typeof v.vendorId === 'string')).toBe(true);
    // Harbour Row: B alone, 166.00. Quayside: A 139.20 - C 13.50 = 125.70 spent; net 115.78 - 13.50 = 102.28.
    expect(vendors.map(({ vendorId: _id, ...rest }) => rest)).toEqual([
      { vendor: 'Harbour Row Supply', receipts: 1, spent: '166.00', netCost: '166.00' },
      { vendor: 'Quayside Parts', receipts: 2, spent: '125.70', netCost: '102.28' },
    ]);
  });
});

describe('GET /ledger/lines', () => {
  const lines = (query: string) => s.client.get(`/api/builds/${s.buildId}/ledger/lines?${query}`);

  it("lists the lines behind Engine's net cost with their shares of tax, shipping and discount", async () => {
    const res = await lines(`figure=netCost&systemId=${s.engine}`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe('210.85');
    expect(res.body.lines.map((l: Record<string, string>) => [l.description, l.kind, l.vendor, l.purchaseDate, l.amount, l.allocatedTax, l.allocatedShipping, l.allocatedDiscount, l.lineTotal])).toEqual([
      ['Alternator, reman', 'part', 'Quayside Parts', '2026-07-03', '60.00', '3.86', '5.99', '0.00', '69.85'],
      ['Bench test', 'fee', 'Quayside Parts', '2026-07-03', '10.00', '0.00', '1.00', '0.00', '11.00'],
      ['Starter', 'part', 'Harbour Row Supply', '2026-07-20', '100.00', '0.00', '0.00', '10.00', '90.00'],
      ['Starter core', 'core_charge', 'Harbour Row Supply', '2026-07-20', '40.00', '0.00', '0.00', '0.00', '40.00'],
    ]);
    expect(res.body.lines[0]).toMatchObject({ system: 'Engine', systemId: s.engine });
    expect(typeof res.body.lines[0].receiptId).toBe('string');
  });

  it('adds up, to the cent, to every line figure of every system and of the whole build', async () => {
    const ledger = await ledgerOf();
    for (const figure of ['netCost', 'spent', 'coreDepositsOutstanding', 'returnsAwaitingRefund']) {
      for (const system of ledger.systems) {
        const res = await lines(`figure=${figure}&systemId=${system.systemId}`);
        const added = toWire(sum(res.body.lines.map((l: { lineTotal: string }) => new Decimal(l.lineTotal))), 2);
        expect([system.name, figure, added, res.body.total]).toEqual([system.name, figure, system[figure], system[figure]]);
      }
      const whole = await lines(`figure=${figure}`);
      expect([figure, toWire(sum(whole.body.lines.map((l: { lineTotal: string }) => new Decimal(l.lineTotal))), 2)]).toEqual([figure, ledger.total[figure]]);
    }
  });

  it('selects exactly the owed deposit and the return awaiting its refund', async () => {
    const cores = (await lines('figure=coreDepositsOutstanding')).body;
    expect(cores.lines.map((l: { description: string; lineTotal: string }) => [l.description, l.lineTotal])).toEqual([['Alternator core', '23.42']]);
    const awaiting = (await lines('figure=returnsAwaitingRefund')).body;
    expect(awaiting.lines.map((l: { description: string; lineTotal: string }) => [l.description, l.lineTotal])).toEqual([['Thermostat', '22.50']]);
  });

  it('narrows to a period and a shop, adding up to the spend and vendor figures', async () => {
    // September's net cost is the return alone.
    const september = (await lines('figure=netCost&period=2026-09')).body;
    expect(september.lines.map((l: { description: string }) => l.description)).toEqual(['Radiator cap back']);
    expect(september.total).toBe('-13.50');
    // Week 27 is receipt A: its net cost leaves the owed deposit out (115.78).
    expect((await lines('figure=netCost&period=2026-W27')).body.total).toBe('115.78');
    expect((await lines('figure=spent&period=2026-W27')).body.lines).toHaveLength(4);
    expect((await lines('figure=spent&period=2026-08')).body).toMatchObject({ lines: [], total: '0.00' });

    const vendors = (await s.client.get(`/api/builds/${s.buildId}/ledger/vendors`)).body.vendors as { vendorId: string; vendor: string }[];
    const quayside = vendors.find((v) => v.vendor === 'Quayside Parts')!;
    expect((await lines(`figure=netCost&vendorId=${quayside.vendorId}`)).body.total).toBe('102.28');
    // Quayside's Cooling lines: coolant 34.93 and the cap's refund -13.50.
    expect((await lines(`figure=spent&vendorId=${quayside.vendorId}&systemId=${s.cooling}`)).body.total).toBe('21.43');
    expect((await lines('figure=spent&vendorId=none')).body.lines).toEqual([]);
  });

  it('names each bad query field, and answers 404 for a system or shop of another build', async () => {
    const missing = await lines('systemId=x');
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['figure', 'systemId']);
    expect(missing.body.error.fields.figure).toBe('Use one of netCost, spent, coreDepositsOutstanding, returnsAwaitingRefund.');
    expect((await lines('figure=budget')).body.error.fields).toEqual({ figure: 'Use one of netCost, spent, coreDepositsOutstanding, returnsAwaitingRefund.' });
    expect((await lines('figure=spent&period=2026-13')).body.error.fields).toEqual({ period: 'Use a month like 2026-07 or a week like 2026-W27.' });
    expect((await lines('figure=spent&period=2026-W54')).body.error.fields).toEqual({ period: 'Use a month like 2026-07 or a week like 2026-W27.' });
    expect((await lines('figure=spent&vendorId=shop')).body.error.fields).toEqual({ vendorId: 'Choose an existing shop, or none.' });

    const other = await scenarioSystems();
    const foreign = await lines(`figure=spent&systemId=${other.systemId}`);
    expect(foreign.status).toBe(404);
    expect(foreign.body.error.message).toMatch(/^That system was not found/);
    expect((await lines('figure=spent&systemId=00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await lines('figure=spent&vendorId=00000000-0000-4000-8000-000000000000')).body.error.message).toMatch(/^That shop was not found/);
  });
});

/** A system of someone else's build. */
async function scenarioSystems() {
  const { client } = await signedUpClient(t.app, 'ledger-other');
  const buildId = (await client.post('/api/builds', NEW_BUILD)).body.id;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string }[];
  return { systemId: systems[0].id };
}

describe('who may read the breakdowns', () => {
  it('lets owner, crew and reviewer read; an outsider learns nothing (404); anonymous must sign in (401)', async () => {
    const em = t.orm.em.fork();
    const people: Record<string, ApiClient> = { owner: s.client };
    for (const role of ['crew', 'reviewer'] as const) {
      const person = await signedUpClient(t.app, `ledger-${role}`);
      em.create(Membership, { build: em.getReference(Build, s.buildId), user: em.getReference(User, person.userId), role });
      people[role] = person.client;
    }
    await em.flush();
    people.outsider = (await signedUpClient(t.app, 'ledger-outsider')).client;
    people.anonymous = await new ApiClient(t.app).init();
    const expected = { owner: 200, crew: 200, reviewer: 200, outsider: 404, anonymous: 401 };
    for (const path of ['ledger/spend?by=week', 'ledger/vendors', 'ledger/lines?figure=spent']) {
      const statuses: Record<string, number> = {};
      for (const [who, client] of Object.entries(people)) statuses[who] = (await client.get(`/api/builds/${s.buildId}/${path}`)).status;
      expect([path, statuses]).toEqual([path, expected]);
    }
  });
});
