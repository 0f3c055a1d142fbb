// The parts and receipts lists answered from memory (http/list-cache.ts), against the real PostgreSQL: an unchanged
// build's list is not read again, and after every kind of write (through the API, or straight to the database as a
// job or another server process writes) the answer equals a fresh read of the list.
import { ApiClient, NEW_BUILD, TEST_PASSWORD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';
import { Build } from '../../backend/src/builds/build.entity';
import { listCacheCounts } from '../../backend/src/http/list-cache';
import { listParts } from '../../backend/src/parts/parts.service';
import { listReceipts } from '../../backend/src/receipts/receipts.service';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const HOSE = { description: 'Lower coolant hose', partNumber: 'LC-118', quantity: '1', unit: 'each', estimatedUnitCost: '18.40' };

/** The list as the route would answer it if nothing were kept: a fresh read on a fresh entity manager. */
async function freshList(buildId: string, list: 'parts' | 'receipts', filter: { status?: string } = {}): Promise<unknown> {
  const em = t.orm.em.fork();
  const build = await em.findOneOrFail(Build, buildId);
  const rows = list === 'parts' ? await listParts(em, build, filter) : await listReceipts(em, build, {});
  return JSON.parse(JSON.stringify({ [list]: rows }));
}

/** Asks for the list and checks it against a fresh read; says whether it came from memory. */
async function listMatchesFresh(client: ApiClient, buildId: string, list: 'parts' | 'receipts', query = ''): Promise<{ body: any; fromMemory: boolean }> {
  const before = listCacheCounts();
  const res = await client.get(`/api/builds/${buildId}/${list}${query}`);
  const after = listCacheCounts();
  expect(res.status).toBe(200);
  expect(res.body).toEqual(await freshList(buildId, list, query ? { status: new URLSearchParams(query.slice(1)).get('status')! } : {}));
  return { body: res.body, fromMemory: after.fromMemory > before.fromMemory };
}

async function newBuild(label: string) {
  const owner = await signedUpClient(t.app, label);
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; version: number }[];
  return { owner, build, systems };
}

it('answers an unchanged parts list from memory, and every write through the API or straight to the database shows at once', async () => {
  const { owner, build, systems } = await newBuild('lists-parts');
  const client = owner.client;
  const url = `/api/builds/${build.id}/parts`;
  const hose = (await client.post(url, { ...HOSE, systemId: systems[1].id })).body;
  const fan = (await client.post(url, { ...HOSE, description: 'Fan relay', systemId: systems[0].id })).body;

  expect((await listMatchesFresh(client, build.id, 'parts')).fromMemory).toBe(false);
  const again = await listMatchesFresh(client, build.id, 'parts');
  expect(again.fromMemory).toBe(true);
  expect(again.body.parts.map((p: { id: string }) => p.id)).toEqual([fan.id, hose.id]);

  const writes: [string, () => Promise<unknown>][] = [
    ['a part added', () => client.post(url, { ...HOSE, description: 'Thermostat', systemId: systems[1].id })],
    ['a part edited', () => client.patch(`${url}/${hose.id}`, { quantity: '3', version: hose.version })],
    ['parts moved in bulk', () => client.post(`${url}/bulk`, { action: 'status', partIds: [fan.id], status: 'ordered' })],
    ['the systems reordered', () => client.patch(`/api/builds/${build.id}/systems/${systems[0].id}`, { sortOrder: 99, version: systems[0].version })],
    ['a part removed', () => client.delete(`${url}/${fan.id}`)],
    // Straight to the database: what a job, another server process or SQL by hand does, with no request of this app.
    ['a part changed by another process', () => t.orm.em.fork().execute(`update part set notes = 'Checked by hand' where id = ?`, [hose.id])],
    ['the currency changed by another process', () => t.orm.em.fork().execute(`update build set currency = 'JPY' where id = ?`, [build.id])],
  ];
  let previous = again.body;
  for (const [what, write] of writes) {
    await write();
    const after = await listMatchesFresh(client, build.id, 'parts');
    expect([what, after.fromMemory]).toEqual([what, false]);
    expect([what, after.body]).not.toEqual([what, previous]);
    expect([what, (await listMatchesFresh(client, build.id, 'parts')).fromMemory]).toEqual([what, true]);
    previous = after.body;
  }
  // Yen have no minor unit: the figures are whole (ISO 4217, the currency's minor unit is 0).
  expect(previous.parts.find((p: { id: string }) => p.id === hose.id).estimatedTotal).toBe('55');
});

it('keeps each filter apart, and a refused write leaves what is kept as it was', async () => {
  const { owner, build, systems } = await newBuild('lists-filter');
  const client = owner.client;
  const url = `/api/builds/${build.id}/parts`;
  const hose = (await client.post(url, { ...HOSE, systemId: systems[1].id })).body;
  await client.post(url, { ...HOSE, description: 'Radiator cap', status: 'ordered', systemId: systems[1].id });

  const ordered = await listMatchesFresh(client, build.id, 'parts', '?status=ordered');
  expect(ordered.body.parts.map((p: { description: string }) => p.description)).toEqual(['Radiator cap']);
  expect((await listMatchesFresh(client, build.id, 'parts')).body.parts).toHaveLength(2);
  expect((await listMatchesFresh(client, build.id, 'parts', '?status=ordered')).fromMemory).toBe(true);

  // Refused (stale version): rolled back, so no mark, and the kept list still answers.
  expect((await client.patch(`${url}/${hose.id}`, { quantity: '2', version: hose.version + 5 })).status).toBe(409);
  expect((await listMatchesFresh(client, build.id, 'parts')).fromMemory).toBe(true);
});

it('answers a browser that has the list already with 304, until the list changes', async () => {
  const { owner, build, systems } = await newBuild('lists-etag');
  const url = `/api/builds/${build.id}/parts`;
  await owner.client.post(url, { ...HOSE, systemId: systems[1].id });
  const first = await owner.client.get(url);
  const etag = first.headers.etag as string;
  expect(etag).toMatch(/^W\/"/);
  const agent = (owner.client as unknown as { agent: { get(url: string): { set(name: string, value: string): Promise<{ status: number; headers: Record<string, string> }> } } }).agent;
  expect((await agent.get(url).set('If-None-Match', etag)).status).toBe(304);
  await owner.client.post(url, { ...HOSE, description: 'Heater valve', systemId: systems[1].id });
  const changed = await agent.get(url).set('If-None-Match', etag);
  expect(changed.status).toBe(200);
  expect(changed.headers.etag).not.toBe(etag);
});

it('shows receipts, their lines, shops, duplicates and uploaders as soon as they change', async () => {
  const { owner, build, systems } = await newBuild('lists-receipts');
  const client = owner.client;
  const header = { vendorName: 'Marsh Lane Motor Factors', purchaseDate: '2026-10-14', total: '31.20' };
  const lines = [{ kind: 'part', description: 'Hose clips', amount: '31.20', systemId: systems[1].id }];
  const first = await filedReceipt(t, client, build.id, header, lines);
  expect((await listMatchesFresh(client, build.id, 'receipts')).fromMemory).toBe(false);
  expect((await listMatchesFresh(client, build.id, 'receipts')).fromMemory).toBe(true);

  let second: { id: string } | undefined;
  const writes: [string, () => Promise<unknown>][] = [
    ['a second receipt like the first (a likely duplicate)', async () => (second = await filedReceipt(t, client, build.id, header, lines))],
    ['marked not a duplicate', () => client.post(`/api/builds/${build.id}/receipts/${second!.id}/not-duplicate`, { otherReceiptId: first.id, reason: 'Two bags of clips.' })],
    ['reopened', async () => client.post(`/api/builds/${build.id}/receipts/${first.id}/reopen`, { version: (await client.get(`/api/builds/${build.id}/receipts/${first.id}`)).body.version })],
    ['a line added', () => client.post(`/api/builds/${build.id}/receipts/${first.id}/lines`, { kind: 'part', description: 'Fan switch', amount: '5.00', systemId: systems[0].id })],
    ['the shop renamed by another process', () => t.orm.em.fork().execute(`update vendor set name = 'Marsh Lane Motors' where build_id = ?`, [build.id])],
    ['the uploader renamed by another process', () => t.orm.em.fork().execute(`update app_user set display_name = 'Rook Hallam' where id = ?`, [owner.userId])],
    ['the reading moved on by a job', () => t.orm.em.fork().execute(`update receipt set reading_progress = 40 where id = ?`, [first.id])],
  ];
  let previous = (await listMatchesFresh(client, build.id, 'receipts')).body;
  for (const [what, write] of writes) {
    await write();
    const after = await listMatchesFresh(client, build.id, 'receipts');
    expect([what, after.fromMemory]).toEqual([what, false]);
    expect([what, after.body]).not.toEqual([what, previous]);
    previous = after.body;
  }
  expect(previous.receipts.map((r: { uploadedBy: string }) => r.uploadedBy)).toEqual(['Rook Hallam', 'Rook Hallam']);
});

it('answers readers asking at once after each edit with the edit, reading the list once or a few times, not once each', async () => {
  const { owner, build, systems } = await newBuild('lists-together');
  const url = `/api/builds/${build.id}/parts`;
  let part = (await owner.client.post(url, { ...HOSE, systemId: systems[1].id })).body;
  // Eight tabs of the owner's, signed in on their own.
  const readers = await Promise.all(
    Array.from({ length: 8 }, async () => {
      const reader = await new ApiClient(t.app).init();
      expect((await reader.post('/api/auth/sign-in', { email: owner.email, password: TEST_PASSWORD })).status).toBe(200);
      return reader;
    }),
  );
  const before = listCacheCounts();
  for (let edit = 1; edit <= 6; edit += 1) {
    part = (await owner.client.patch(`${url}/${part.id}`, { notes: `Checked ${edit} times`, version: part.version })).body;
    const answers = await Promise.all(readers.map((reader) => reader.get(url)));
    expect(answers.map((res) => [res.status, res.body.parts[0].notes])).toEqual(readers.map(() => [200, `Checked ${edit} times`]));
  }
  const after = listCacheCounts();
  expect(after.fromMemory + after.read - before.fromMemory - before.read).toBe(48);
  // Shared, about one read per edit (6 to 8 of 48 answers here); each reader reading for itself, 43 of 48.
  expect(after.read - before.read).toBeLessThanOrEqual(18);
});

it('never answers one build with another build’s list', async () => {
  const a = await newBuild('lists-a');
  const b = await newBuild('lists-b');
  await a.owner.client.post(`/api/builds/${a.build.id}/parts`, { ...HOSE, systemId: a.systems[0].id });
  expect((await listMatchesFresh(a.owner.client, a.build.id, 'parts')).body.parts).toHaveLength(1);
  expect((await listMatchesFresh(b.owner.client, b.build.id, 'parts')).body.parts).toHaveLength(0);
  expect((await b.owner.client.get(`/api/builds/${a.build.id}/parts`)).status).toBe(404);
});
