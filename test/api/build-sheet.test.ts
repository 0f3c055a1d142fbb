// The printable build sheet's data against the real PostgreSQL: fitted parts by system with cost and date, the
// per-system summary and totals (worked by hand to the cent), the system filter, and who may read it.
import Papa from 'papaparse';
import { SAFETY_CAUTION } from '../../shared/safety';
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function newBuild(label: string) {
  const owner = await signedUpClient(t.app, label);
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, vehicle: '1972 invented roadster, 2.0 L swap' })).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string }[];
  const system = (name: string) => systems.find((s) => s.name === name)!.id;
  return { ...owner, build, system };
}

async function installed(client: ApiClient, buildId: string, systemId: string, description: string, partNumber = '') {
  const part = (await client.post(`/api/builds/${buildId}/parts`, { systemId, description, partNumber, quantity: '1', unit: 'each', estimatedUnitCost: '90.00' })).body;
  return part as { id: string };
}

async function markInstalled(client: ApiClient, buildId: string, partId: string) {
  const part = (await client.get(`/api/builds/${buildId}/parts`)).body.parts.find((p: { id: string }) => p.id === partId);
  const res = await client.patch(`/api/builds/${buildId}/parts/${partId}`, { status: 'installed', version: part.version });
  expect(res.status).toBe(200);
}

describe('GET /api/builds/:buildId/exports/build-sheet', () => {
  it('lists the fitted parts by system with cost and date, a summary per system and the totals', async () => {
    const { client, build, system } = await newBuild('sheet');
    const radiator = await installed(client, build.id, system('Cooling'), 'Aluminium radiator', 'RAD-22');
    const pump = await installed(client, build.id, system('Fuel'), 'Fuel pump');
    const filter = await installed(client, build.id, system('Fuel'), 'Fuel filter');
    // A planned part is not on the sheet: only what is fitted to the car.
    await client.post(`/api/builds/${build.id}/parts`, { systemId: system('Interior'), description: 'Seat', quantity: '1', unit: 'each', estimatedUnitCost: '300.00' });
    // Tax 8.00 over two taxable lines of 100.00 each: 4.00 each, so each part cost 104.00.
    await filedReceipt(t, client, build.id, { purchaseDate: '2026-09-09', tax: '8.00', total: '208.00' }, [
      { kind: 'part', description: 'Radiator', amount: '100.00', partId: radiator.id },
      { kind: 'part', description: 'Pump', amount: '100.00', partId: pump.id },
    ]);
    // A fee on the cooling system adds to its net cost, but to no fitted part.
    await filedReceipt(t, client, build.id, { purchaseDate: '2026-10-02', total: '30.00' }, [
      { kind: 'fee', description: 'Pressure test', amount: '30.00', taxable: false, systemId: system('Cooling') },
    ]);
    for (const part of [radiator, pump, filter]) await markInstalled(client, build.id, part.id);

    const res = await client.get(`/api/builds/${build.id}/exports/build-sheet`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      buildName: 'Test coupé',
      vehicle: '1972 invented roadster, 2.0 L swap',
      currency: 'USD',
      locale: 'en-US',
      parts: [
        { systemId: system('Cooling'), system: 'Cooling', description: 'Aluminium radiator', partNumber: 'RAD-22', quantity: '1', unit: 'each', cost: '104.00', boughtOn: '2026-09-09' },
        { systemId: system('Fuel'), system: 'Fuel', description: 'Fuel pump', partNumber: '', quantity: '1', unit: 'each', cost: '104.00', boughtOn: '2026-09-09' },
        { systemId: system('Fuel'), system: 'Fuel', description: 'Fuel filter', partNumber: '', quantity: '1', unit: 'each', cost: null, boughtOn: null },
      ],
      systems: [
        { systemId: system('Cooling'), name: 'Cooling', fittedParts: 1, fittedCost: '104.00', netCost: '134.00', safetyCaution: false },
        { systemId: system('Fuel'), name: 'Fuel', fittedParts: 2, fittedCost: '104.00', netCost: '104.00', safetyCaution: true },
      ],
      total: { fittedParts: 3, fittedCost: '208.00', netCost: '238.00' },
      safetyCaution: SAFETY_CAUTION,
      taxNote: 'These are records, not tax advice: ask a tax professional how they apply to you.',
    });

    // The CSV comes from the same query: its rows carry the same figures (read back with papaparse).
    const csv = Papa.parse<string[]>((await client.get(`/api/builds/${build.id}/exports/build-sheet.csv`)).text, { newline: '\r\n', skipEmptyLines: true }).data;
    expect(csv.filter((row) => row[0] === 'part').map((row) => [row[2], row[6], row[7]])).toEqual([
      ['Aluminium radiator', '104.00', '2026-09-09'],
      ['Fuel pump', '104.00', '2026-09-09'],
      ['Fuel filter', '', ''],
    ]);
    expect(csv.filter((row) => row[0] === 'system total' && row[6] !== '0.00').map((row) => [row[1], row[6]])).toEqual([
      ['Cooling', '134.00'],
      ['Fuel', '104.00'],
    ]);

    const fuelOnly = (await client.get(`/api/builds/${build.id}/exports/build-sheet?systemId=${system('Fuel')}`)).body;
    expect(fuelOnly.parts.map((p: { description: string }) => p.description)).toEqual(['Fuel pump', 'Fuel filter']);
    expect(fuelOnly.systems.map((s: { name: string }) => s.name)).toEqual(['Fuel']);
    expect(fuelOnly.total).toEqual({ fittedParts: 2, fittedCost: '104.00', netCost: '104.00' });
  });

  it('answers 404 for a system of another build, a malformed system and a build the caller is not in; 401 signed out', async () => {
    const mine = await newBuild('sheet-mine');
    const theirs = await newBuild('sheet-theirs');
    const foreign = await mine.client.get(`/api/builds/${mine.build.id}/exports/build-sheet?systemId=${theirs.system('Fuel')}`);
    expect(foreign.status).toBe(404);
    expect((await mine.client.get(`/api/builds/${mine.build.id}/exports/build-sheet.csv?systemId=${theirs.system('Fuel')}`)).status).toBe(404);
    expect((await mine.client.get(`/api/builds/${mine.build.id}/exports/build-sheet?systemId=fuel`)).status).toBe(404);
    expect((await mine.client.get(`/api/builds/${theirs.build.id}/exports/build-sheet`)).status).toBe(404);
    const anonymous = await new ApiClient(t.app).init();
    expect((await anonymous.get(`/api/builds/${mine.build.id}/exports/build-sheet`)).status).toBe(401);

    // An empty build has an empty sheet with zero totals, still carrying the caution.
    const empty = (await mine.client.get(`/api/builds/${mine.build.id}/exports/build-sheet`)).body;
    expect(empty).toMatchObject({ parts: [], systems: [], total: { fittedParts: 0, fittedCost: '0.00', netCost: '0.00' }, safetyCaution: SAFETY_CAUTION });
  });

  it('lets a reviewer read it', async () => {
    const { client, build } = await newBuild('sheet-owner');
    const partner = await signedUpClient(t.app, 'sheet-partner');
    await client.post(`/api/builds/${build.id}/invites`, { email: partner.email, role: 'reviewer' });
    const mail = await t.mail.waitFor((m) => m.to.includes(partner.email));
    await partner.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
    expect((await partner.client.get(`/api/builds/${build.id}/exports/build-sheet`)).status).toBe(200);
  });
});
