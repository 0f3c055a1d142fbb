// Builds against the real PostgreSQL: create, list, view, edit with a version check, archive and restore.
import { Build } from '../../backend/src/builds/build.entity';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: ApiClient;
beforeAll(async () => {
  t = await startTestApp();
  owner = (await signedUpClient(t.app, 'builds-owner')).client;
});
afterAll(() => t.close());

async function create(body: object = NEW_BUILD) {
  const res = await owner.post('/api/builds', body);
  expect(res.status).toBe(201);
  return res.body;
}

it('creates a build with the creator as owner and lists it', async () => {
  const build = await create({ ...NEW_BUILD, name: 'Listed build', currency: 'jpy', startedOn: '2026-09-01', targetDate: '2027-01-31' });
  expect(build).toMatchObject({
    name: 'Listed build',
    currency: 'JPY',
    locale: 'en-US',
    status: 'planning',
    startedOn: '2026-09-01',
    targetDate: '2027-01-31',
    archived: false,
    version: 1,
    role: 'owner',
  });
  const list = await owner.get('/api/builds');
  expect(list.body.builds.map((b: { id: string }) => b.id)).toContain(build.id);
  expect((await owner.get(`/api/builds/${build.id}`)).body.name).toBe('Listed build');
});

it.each([
  [{ ...NEW_BUILD, currency: 'XYZ' }, 'currency', 'Choose an ISO 4217 currency code such as USD or EUR.'],
  [{ ...NEW_BUILD, name: '   ' }, 'name', 'Give the build a name.'],
  [{ ...NEW_BUILD, startedOn: '2026-02-30' }, 'startedOn', 'That date does not exist.'],
  [{ ...NEW_BUILD, startedOn: '14/11/2026' }, 'startedOn', 'Use a date like 2026-11-14.'],
  [{ ...NEW_BUILD, startedOn: '2026-10-01', targetDate: '2026-09-01' }, 'targetDate', 'The target date is before the start date.'],
  [{ ...NEW_BUILD, locale: 'not a tag!' }, 'locale', 'Use a language tag such as en-US or en-GB.'],
  [{ ...NEW_BUILD, status: 'scrapped' }, 'status', 'Choose one of: planning, active, finished, sold.'],
])('refuses %j naming the field and saves nothing', async (body, field, message) => {
  const before = await t.orm.em.fork().count(Build, {});
  const res = await owner.post('/api/builds', body);
  expect(res.status).toBe(400);
  expect(res.body.error.fields[field]).toBe(message);
  expect(await t.orm.em.fork().count(Build, {})).toBe(before);
});

it('edits with the version last seen and answers 409 to a stale edit without saving it', async () => {
  const build = await create();
  const first = await owner.patch(`/api/builds/${build.id}`, { name: 'Renamed', status: 'active', version: 1 });
  expect(first.status).toBe(200);
  expect(first.body).toMatchObject({ name: 'Renamed', status: 'active', version: 2 });

  const stale = await owner.patch(`/api/builds/${build.id}`, { name: 'Lost edit', version: 1 });
  expect(stale.status).toBe(409);
  expect(stale.body.error.code).toBe('stale_version');
  expect((await owner.get(`/api/builds/${build.id}`)).body.name).toBe('Renamed');
});

it('keeps the currency fixed after creation', async () => {
  const build = await create();
  const res = await owner.patch(`/api/builds/${build.id}`, { currency: 'EUR', version: 1 });
  expect(res.status).toBe(400);
  expect(res.body.error.fields).toEqual({ _: 'Unknown field: currency.' });
});

it('refuses a target date before the stored start date', async () => {
  const build = await create({ ...NEW_BUILD, startedOn: '2026-10-01' });
  const res = await owner.patch(`/api/builds/${build.id}`, { targetDate: '2026-01-01', version: 1 });
  expect(res.status).toBe(400);
  expect(res.body.error.fields.targetDate).toBe('The target date is before the start date.');
});

it('archives and restores a build; archived builds leave the default list', async () => {
  const build = await create({ ...NEW_BUILD, name: 'To archive' });
  expect((await owner.delete(`/api/builds/${build.id}`)).status).toBe(204);
  const active = (await owner.get('/api/builds')).body.builds.map((b: { id: string }) => b.id);
  const archived = (await owner.get('/api/builds?archived=true')).body.builds;
  expect(active).not.toContain(build.id);
  expect(archived.find((b: { id: string }) => b.id === build.id)).toMatchObject({ archived: true });
  const restored = await owner.post(`/api/builds/${build.id}/restore`);
  expect(restored.body.archived).toBe(false);
});

it('keeps an archived build read-only until it is restored: writes answer 409 and change nothing', async () => {
  const build = await create({ ...NEW_BUILD, name: 'Read-only' });
  expect((await owner.delete(`/api/builds/${build.id}`)).status).toBe(204);
  const message = 'This build is archived, so it is read-only. Its owner can restore it from the archived builds to change it again.';
  const renamed = await owner.patch(`/api/builds/${build.id}`, { name: 'Renamed', version: build.version });
  expect(renamed.status).toBe(409);
  expect(renamed.body.error.message).toBe(message);
  const systems = (await owner.get(`/api/builds/${build.id}/systems`)).body.systems;
  const part = await owner.post(`/api/builds/${build.id}/parts`, { systemId: systems[0].id, description: 'Thermostat', quantity: '1', estimatedUnitCost: '12.00' });
  expect(part.status).toBe(409);
  expect((await owner.post(`/api/builds/${build.id}/invites`, { email: 'someone@example.test', role: 'crew' })).status).toBe(409);
  // Reading still works, and nothing changed.
  expect((await owner.get(`/api/builds/${build.id}`)).body).toMatchObject({ name: 'Read-only', archived: true });
  expect((await owner.get(`/api/builds/${build.id}/parts`)).body.parts).toEqual([]);
  // Restored, it takes writes again.
  expect((await owner.post(`/api/builds/${build.id}/restore`)).status).toBe(200);
  expect((await owner.patch(`/api/builds/${build.id}`, { name: 'Renamed', version: (await owner.get(`/api/builds/${build.id}`)).body.version })).body.name).toBe('Renamed');
});

it('answers 404 for a build id that is not a uuid or does not exist', async () => {
  expect((await owner.get('/api/builds/not-a-uuid')).status).toBe(404);
  expect((await owner.get('/api/builds/00000000-0000-4000-8000-000000000000')).status).toBe(404);
});
