// Systems, budgets and parts against the real PostgreSQL: exact totals, field errors, stale edits, bulk changes.
import { Part } from '../../backend/src/parts/part.entity';
import { DEFAULT_SYSTEMS } from '../../shared/enums';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function newBuild(currency = 'USD') {
  const { client } = await signedUpClient(t.app, 'parts');
  const build = (await client.post('/api/builds', { ...NEW_BUILD, currency })).body;
  const overview = (await client.get(`/api/builds/${build.id}/systems`)).body;
  const system = (name: string) => overview.systems.find((s: { name: string }) => s.name === name);
  return { client, build, overview, system };
}

async function partCount(buildId: string) {
  return t.orm.em.fork().count(Part, { build: buildId });
}

const HOSE = { description: 'Upper radiator hose', partNumber: 'HX-2210', quantity: '1', unit: 'each', estimatedUnitCost: '24.99' };

describe('systems and budgets', () => {
  it('gives a new build the default systems in order, each with a zero budget', async () => {
    const { overview } = await newBuild();
    expect(overview.systems.map((s: { name: string }) => s.name)).toEqual([...DEFAULT_SYSTEMS]);
    expect(overview.systems.every((s: { budget: string }) => s.budget === '0.00')).toBe(true);
    expect(overview.budgetWithContingency).toBe('0.00');
  });

  it('marks fuel, brakes and the wiring harness with the safety caution, and not cooling (DESIGN §9)', async () => {
    const { system } = await newBuild();
    expect(['Fuel', 'Brakes', 'Wiring harness'].map((n) => system(n).safetyCaution)).toEqual([true, true, true]);
    expect(system('Cooling').safetyCaution).toBe(false);
  });

  it('sums system budgets and the contingency exactly into the build budget', async () => {
    const { client, build, system } = await newBuild();
    const cooling = system('Cooling');
    const fuel = system('Fuel');
    expect((await client.patch(`/api/builds/${build.id}/systems/${cooling.id}`, { budget: '1200.10', version: cooling.version })).status).toBe(200);
    expect((await client.patch(`/api/builds/${build.id}/systems/${fuel.id}`, { budget: '850.20', version: fuel.version })).status).toBe(200);
    const res = await client.send('put', `/api/builds/${build.id}/contingency`, { contingencyBudget: '0.30', version: build.version });
    expect(res.status).toBe(200);
    // 1200.10 + 850.20 + 0.30 = 2050.60 exactly (in binary floating point 1200.1 + 850.2 + 0.3 is 2050.6000000000004).
    expect(res.body.budgetWithContingency).toBe('2050.60');
    expect(res.body.contingencyBudget).toBe('0.30');
  });

  it('refuses a budget finer than the currency allows (ISO 4217: JPY has no minor unit)', async () => {
    const { client, build, system } = await newBuild('JPY');
    const engine = system('Engine');
    const res = await client.patch(`/api/builds/${build.id}/systems/${engine.id}`, { budget: '1500.5', version: engine.version });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ budget: 'JPY amounts have no decimals.' });
    expect((await client.get(`/api/builds/${build.id}/systems`)).body.systems[0].budget).toBe('0');
  });

  it('adds, renames, reorders and archives a system; an archived one leaves the budget total but keeps its parts', async () => {
    const { client, build } = await newBuild();
    const steering = (await client.post(`/api/builds/${build.id}/systems`, { name: 'Steering', budget: '300.00' })).body;
    expect(steering).toMatchObject({ name: 'Steering', budget: '300.00', sortOrder: DEFAULT_SYSTEMS.length, safetyCaution: true });
    await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, description: 'Rack boot', systemId: steering.id });
    const renamed = await client.patch(`/api/builds/${build.id}/systems/${steering.id}`, { name: 'Steering rack', sortOrder: 0, version: 1 });
    expect(renamed.body).toMatchObject({ name: 'Steering rack', sortOrder: 0, version: 2 });
    await client.patch(`/api/builds/${build.id}/systems/${steering.id}`, { archived: true, version: 2 });
    const active = (await client.get(`/api/builds/${build.id}/systems`)).body;
    expect(active.systems.map((s: { id: string }) => s.id)).not.toContain(steering.id);
    expect(active.budgetWithContingency).toBe('0.00');
    const all = (await client.get(`/api/builds/${build.id}/systems?archived=true`)).body;
    expect(all.systems.find((s: { id: string }) => s.id === steering.id)).toMatchObject({ archived: true, partCount: 1 });
  });

  it('answers 409 to a stale system edit', async () => {
    const { client, build, system } = await newBuild();
    const body = system('Body');
    await client.patch(`/api/builds/${build.id}/systems/${body.id}`, { budget: '10.00', version: body.version });
    const stale = await client.patch(`/api/builds/${build.id}/systems/${body.id}`, { budget: '20.00', version: body.version });
    expect(stale.status).toBe(409);
  });
});

describe('parts', () => {
  it('adds a part with an exact estimate and lists it', async () => {
    const { client, build, system } = await newBuild();
    // 12.5 ft of wire at 0.125 per foot = 1.5625, rounded half up to cents = 1.56.
    const wire = await client.post(`/api/builds/${build.id}/parts`, {
      systemId: system('Wiring harness').id,
      description: '16 AWG wire, red',
      quantity: '12.5',
      unit: 'ft',
      estimatedUnitCost: '0.125',
      storageLocation: 'Shelf B2',
    });
    expect(wire.status).toBe(201);
    expect(wire.body).toMatchObject({ quantity: '12.5', unit: 'ft', estimatedUnitCost: '0.125', estimatedTotal: '1.56', status: 'planned', version: 1 });
    const list = (await client.get(`/api/builds/${build.id}/parts`)).body.parts;
    // The list writes its rows field by field from SQL: the same part, field for field, as the route that made it.
    expect(list).toEqual([wire.body]);
    const overview = (await client.get(`/api/builds/${build.id}/systems`)).body;
    expect(overview.systems.find((s: { name: string }) => s.name === 'Wiring harness').estimate).toBe('1.56');
  });

  it('rounds each estimate half up to cents, then sums (0.005 rounds to 0.01)', async () => {
    const { client, build, system } = await newBuild();
    const cooling = system('Cooling').id;
    await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: cooling, quantity: '1', estimatedUnitCost: '0.005' });
    await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: cooling, quantity: '3', estimatedUnitCost: '0.3333' });
    const overview = (await client.get(`/api/builds/${build.id}/systems`)).body;
    // 0.005 -> 0.01 ; 3 x 0.3333 = 0.9999 -> 1.00 ; total 1.01
    expect(overview.systems.find((s: { name: string }) => s.name === 'Cooling').estimate).toBe('1.01');
    expect(overview.planned).toBe('1.01');
  });

  it.each([
    [{ quantity: '-1' }, 'quantity', 'Enter an amount of zero or more.'],
    [{ quantity: '0' }, 'quantity', 'Enter an amount of at least 0.0001.'],
    [{ estimatedUnitCost: '1.23456' }, 'estimatedUnitCost', 'Too many decimals: use at most 4 decimals.'],
    [{ estimatedUnitCost: '1e3' }, 'estimatedUnitCost', 'Write the amount in full, without an exponent such as 1e3.'],
    [{ estimatedUnitCost: 12.5 }, 'estimatedUnitCost', 'Send the amount as text, such as "12.50".'],
    [{ unit: 'bucket' }, 'unit', 'Choose a unit: each, pair, set, ft, m, qt, L, gal.'],
    [{ sourceUrl: 'javascript:alert(1)' }, 'sourceUrl', 'Enter a full link starting with http:// or https://.'],
  ])('refuses %j naming the field and saves nothing', async (change, field, message) => {
    const { client, build, system } = await newBuild();
    const res = await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: system('Cooling').id, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBe(message);
    expect(await partCount(build.id)).toBe(0);
  });

  it("refuses a system of another build, naming the field, and saves nothing", async () => {
    const mine = await newBuild();
    const theirs = await newBuild();
    const res = await mine.client.post(`/api/builds/${mine.build.id}/parts`, { ...HOSE, systemId: theirs.system('Cooling').id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ systemId: 'No such system on this build.' });
    expect(await partCount(mine.build.id)).toBe(0);
  });

  it("answers 404 for another build's part and leaves it unchanged", async () => {
    const mine = await newBuild();
    const theirs = await newBuild();
    const part = (await theirs.client.post(`/api/builds/${theirs.build.id}/parts`, { ...HOSE, systemId: theirs.system('Cooling').id })).body;
    const res = await mine.client.patch(`/api/builds/${mine.build.id}/parts/${part.id}`, { description: 'hijacked', version: 1 });
    expect(res.status).toBe(404);
    expect((await theirs.client.get(`/api/builds/${theirs.build.id}/parts`)).body.parts[0].description).toBe(HOSE.description);
  });

  it('edits with the version last seen; a stale edit answers 409 with the saved part and changes nothing', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: system('Cooling').id })).body;
    const first = await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { status: 'on_hand', storageLocation: 'Bin 4', version: 1 });
    expect(first.body).toMatchObject({ status: 'on_hand', storageLocation: 'Bin 4', version: 2 });
    const stale = await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { estimatedUnitCost: '99.00', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(stale.body.error.current).toMatchObject({ status: 'on_hand', storageLocation: 'Bin 4', estimatedUnitCost: '24.99', version: 2 });
  });

  it('marks a spare for sale with an asking price in the currency’s minor units', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: system('Cooling').id, status: 'on_hand' })).body;
    const bad = await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { forSale: true, askingPrice: '15.555', version: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ askingPrice: 'USD amounts have at most 2 decimals.' });
    const ok = await client.patch(`/api/builds/${build.id}/parts/${part.id}`, { forSale: true, askingPrice: '15.5', version: 1 });
    expect(ok.body).toMatchObject({ forSale: true, askingPrice: '15.50' });
  });

  it('moves parts to another system and changes their status in bulk, all or nothing', async () => {
    const { client, build, system } = await newBuild();
    const cooling = system('Cooling').id;
    const ids = [];
    for (const d of ['Clamp', 'Hose', 'Thermostat']) ids.push((await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, description: d, systemId: cooling })).body.id);
    const moved = await client.post(`/api/builds/${build.id}/parts/bulk`, { action: 'move', partIds: ids.slice(0, 2), systemId: system('Engine').id });
    expect(moved.body.parts.map((p: { systemId: string }) => p.systemId)).toEqual([system('Engine').id, system('Engine').id]);
    const status = await client.post(`/api/builds/${build.id}/parts/bulk`, { action: 'status', partIds: ids, status: 'ordered' });
    expect(status.body.parts.every((p: { status: string }) => p.status === 'ordered')).toBe(true);

    const other = await newBuild();
    const foreign = (await other.client.post(`/api/builds/${other.build.id}/parts`, { ...HOSE, systemId: other.system('Cooling').id })).body.id;
    const mixed = await client.post(`/api/builds/${build.id}/parts/bulk`, { action: 'status', partIds: [ids[0], foreign], status: 'installed' });
    expect(mixed.status).toBe(404);
    const parts = (await client.get(`/api/builds/${build.id}/parts`)).body.parts;
    expect(parts.every((p: { status: string }) => p.status === 'ordered')).toBe(true);
  });

  it('deletes a part', async () => {
    const { client, build, system } = await newBuild();
    const part = (await client.post(`/api/builds/${build.id}/parts`, { ...HOSE, systemId: system('Cooling').id })).body;
    expect((await client.delete(`/api/builds/${build.id}/parts/${part.id}`)).status).toBe(204);
    expect(await partCount(build.id)).toBe(0);
  });
});

describe('CSV import', () => {
  const header = 'System,Description,Part number,Quantity,Unit,Estimated unit cost,Status,Storage location,Source link,Notes';

  it('previews every row with its errors and saves nothing', async () => {
    const { client, build } = await newBuild();
    const csv = [
      header,
      'Cooling,Radiator cap,RC-16,1,each,12.50,planned,,,',
      'Fuel,"Fuel hose, 3/8 in",FH-38,6,ft,3.1,ordered,Shelf A,https://example.test/fh,"cut to ""length"""',
      'Cooling,Coolant,,-2,qt,abc,,,,',
      'Teleport,Flux capacitor,,1,bucket,1e3,,,,',
    ].join('\r\n');
    const res = await client.sendText('post', `/api/builds/${build.id}/parts/import`, csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ accepted: 2, rejected: 2 });
    expect(res.body.rows[1]).toMatchObject({ line: 3, ok: true, part: { description: 'Fuel hose, 3/8 in', estimatedTotal: '18.60' } });
    expect(res.body.rows[2]).toMatchObject({ line: 4, ok: false });
    expect(Object.keys(res.body.rows[2].errors).sort()).toEqual(['estimatedUnitCost', 'quantity']);
    expect(res.body.rows[3].errors).toMatchObject({
      system: 'No active system named "Teleport" on this build.',
      unit: 'Choose a unit: each, pair, set, ft, m, qt, L, gal.',
      estimatedUnitCost: 'Write the amount in full, without an exponent such as 1e3.',
    });
    expect(await partCount(build.id)).toBe(0);

    const refused = await client.sendText('post', `/api/builds/${build.id}/parts/import?commit=true`, csv);
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields['rows.5.system']).toBe('No active system named "Teleport" on this build.');
    expect(await partCount(build.id)).toBe(0);

    const dropped = await client.sendText('post', `/api/builds/${build.id}/parts/import?commit=true&dropRejected=true`, csv);
    expect(dropped.status).toBe(201);
    expect(dropped.body).toEqual({ imported: 2, dropped: 2 });
    const parts = (await client.get(`/api/builds/${build.id}/parts`)).body.parts;
    expect(parts.find((p: { partNumber: string }) => p.partNumber === 'FH-38')).toMatchObject({ status: 'ordered', storageLocation: 'Shelf A', notes: 'cut to "length"' });
  });

  it('takes a multipart upload of 50 rows', async () => {
    const { client, build } = await newBuild();
    const rows = Array.from({ length: 50 }, (_, i) => `Engine,Gasket ${i + 1},G-${i + 1},1,each,${(i + 1).toString()}.10`);
    const csv = ['system,description,part number,quantity,unit,estimated unit cost', ...rows].join('\n');
    const agent = (client as unknown as { agent: import('supertest').Agent; csrf: string });
    const res = await agent.agent
      .post(`/api/builds/${build.id}/parts/import?commit=true`)
      .set('X-XSRF-TOKEN', agent.csrf)
      .attach('file', Buffer.from(csv), { filename: 'parts.csv', contentType: 'text/csv' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ imported: 50, dropped: 0 });
    const overview = (await client.get(`/api/builds/${build.id}/systems`)).body;
    const listed = (await client.get(`/api/builds/${build.id}/parts`)).body.parts.map((p: { description: string }) => p.description);
    expect(listed).toEqual(Array.from({ length: 50 }, (_, i) => `Gasket ${i + 1}`));
    // Sum of (k + 0.10) for k = 1..50 = 1275 + 5.00 = 1280.00
    expect(overview.systems.find((s: { name: string }) => s.name === 'Engine').estimate).toBe('1280.00');
  });

  it('names the problem with the file itself', async () => {
    const { client, build } = await newBuild();
    const missing = await client.sendText('post', `/api/builds/${build.id}/parts/import`, 'description,quantity\nX,1');
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.file).toMatch(/^The header row lacks: system, unit, estimated unit cost\./);
    const empty = await client.sendText('post', `/api/builds/${build.id}/parts/import`, '');
    expect(empty.body.error.fields.file).toMatch(/Attach a CSV file/);
  });
});
