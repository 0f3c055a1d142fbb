// Every build route for each kind of caller: owner, crew, reviewer, a signed-in non-member, and signed out.
// A non-member must learn nothing of the build: 404, never 403.
import type { Express } from 'express';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { User } from '../../backend/src/auth/user.entity';
import { Build } from '../../backend/src/builds/build.entity';
import { Membership } from '../../backend/src/builds/membership.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { ApiClient, NEW_BUILD, signedUpClient, uniqueEmail } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

// The set-up signs up four people (argon2 on purpose slow) and starts the app: past jest's 5 s on a loaded machine.
jest.setTimeout(60_000);

type Actor = 'owner' | 'crew' | 'reviewer' | 'outsider' | 'anonymous';
const ACTORS: Actor[] = ['owner', 'crew', 'reviewer', 'outsider', 'anonymous'];

interface Fixture {
  buildId: string;
  systemId: string;
  partId: string;
  clients: Record<Actor, ApiClient>;
  userIds: Record<'owner' | 'crew' | 'reviewer', string>;
}

interface RouteCase {
  name: string;
  /** Builds a fresh request for each actor; may prepare data first. */
  call(f: Fixture, actor: Actor, app: Express): Promise<{ status: number }>;
  expected: Record<Actor, number>;
}

const readable = { owner: 200, crew: 200, reviewer: 200, outsider: 404, anonymous: 401 };
const ownerOnly = (ok: number) => ({ owner: ok, crew: 403, reviewer: 403, outsider: 404, anonymous: 401 });
const editors = (ok: number) => ({ owner: ok, crew: ok, reviewer: 403, outsider: 404, anonymous: 401 });
const PART = { description: 'Radiator hose', quantity: '2', unit: 'each', estimatedUnitCost: '18.40' };
const CSV = 'system,description,quantity,unit,estimated unit cost\nCooling,Hose clamp,4,each,1.25\n';
const SLIP = readFileSync(path.resolve(__dirname, '../fixtures/receipts/generated/counter-1.png'));

function upload(client: ApiClient, buildId: string) {
  const raw = client as unknown as { agent: import('supertest').Agent; csrf: string };
  return raw.agent.post(`/api/builds/${buildId}/receipts`).set('X-XSRF-TOKEN', raw.csrf).attach('files', SLIP, 'slip.png');
}

/** A receipt as if read (the reading itself is tested elsewhere): two lines, one a core deposit; optionally filed. */
async function receiptFor(f: Fixture, options: { filed?: boolean } = {}) {
  const owner = f.clients.owner;
  const id = (await upload(owner, f.buildId)).body.receipts[0].id as string;
  await t.orm.em.fork().nativeUpdate(Receipt, { id }, { state: 'to_check' });
  const base = `/api/builds/${f.buildId}/receipts/${id}`;
  const version = (await owner.get(base)).body.version;
  await owner.patch(base, { purchaseDate: '2026-11-14', subtotal: null, tax: null, shipping: null, discount: null, total: '62.00', version });
  const line = (await owner.post(`${base}/lines`, { kind: 'part', description: 'Alternator', amount: '40.00', systemId: f.systemId })).body;
  const core = (await owner.post(`${base}/lines`, { kind: 'core_charge', description: 'Alternator core', amount: '22.00', systemId: f.systemId })).body;
  if (options.filed) await owner.post(`${base}/file`, { version: (await owner.get(base)).body.version });
  return { id, base, line, core };
}

const ROUTES: RouteCase[] = [
  { name: 'GET /api/builds/:buildId', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}`), expected: readable },
  {
    name: 'PATCH /api/builds/:buildId',
    call: async (f, a) => {
      const version = (await f.clients.owner.get(`/api/builds/${f.buildId}`)).body.version;
      return f.clients[a].patch(`/api/builds/${f.buildId}`, { vehicle: `edited by ${a}`, version });
    },
    expected: ownerOnly(200),
  },
  { name: 'DELETE /api/builds/:buildId', call: (f, a) => f.clients[a].delete(`/api/builds/${f.buildId}`), expected: ownerOnly(204) },
  { name: 'POST /api/builds/:buildId/restore', call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/restore`), expected: ownerOnly(200) },
  { name: 'GET /api/builds/:buildId/members', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/members`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/invites',
    call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/invites`, { email: uniqueEmail('matrix'), role: 'crew' }),
    expected: ownerOnly(201),
  },
  {
    name: 'DELETE /api/builds/:buildId/invites/:inviteId',
    call: async (f, a) => {
      const invite = (await f.clients.owner.post(`/api/builds/${f.buildId}/invites`, { email: uniqueEmail('withdraw'), role: 'crew' })).body;
      return f.clients[a].delete(`/api/builds/${f.buildId}/invites/${invite.id}`);
    },
    expected: ownerOnly(204),
  },
  {
    name: 'PATCH /api/builds/:buildId/members/:userId',
    call: (f, a) => f.clients[a].patch(`/api/builds/${f.buildId}/members/${f.userIds.crew}`, { role: 'crew' }),
    expected: ownerOnly(200),
  },
  {
    // A member may remove themself (leave); here each caller tries to remove the crew member.
    name: 'DELETE /api/builds/:buildId/members/:userId (someone else)',
    call: (f, a) => f.clients[a].delete(`/api/builds/${f.buildId}/members/${f.userIds.crew}`),
    expected: { owner: 204, crew: 204, reviewer: 403, outsider: 404, anonymous: 401 },
  },
  { name: 'GET /api/builds/:buildId/systems', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/systems`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/systems',
    call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/systems`, { name: `Steering ${a}`, budget: '400.00' }),
    expected: ownerOnly(201),
  },
  {
    name: 'PATCH /api/builds/:buildId/systems/:systemId',
    call: (f, a) => f.clients[a].patch(`/api/builds/${f.buildId}/systems/${f.systemId}`, { budget: '950.00', version: 1 }),
    expected: ownerOnly(200),
  },
  {
    name: 'PUT /api/builds/:buildId/contingency',
    call: async (f, a) => {
      const version = (await f.clients.owner.get(`/api/builds/${f.buildId}`)).body.version;
      return f.clients[a].send('put', `/api/builds/${f.buildId}/contingency`, { contingencyBudget: '500.00', version });
    },
    expected: ownerOnly(200),
  },
  { name: 'GET /api/builds/:buildId/parts', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/parts`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/parts',
    call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/parts`, { ...PART, systemId: f.systemId }),
    expected: editors(201),
  },
  {
    name: 'PATCH /api/builds/:buildId/parts/:partId',
    call: (f, a) => f.clients[a].patch(`/api/builds/${f.buildId}/parts/${f.partId}`, { status: 'ordered', version: 1 }),
    expected: editors(200),
  },
  {
    // The warranty is set on the part like its other fields: the same roles, the same version check.
    name: 'PATCH /api/builds/:buildId/parts/:partId (warranty)',
    call: (f, a) => f.clients[a].patch(`/api/builds/${f.buildId}/parts/${f.partId}`, { warranty: 12, warrantyStart: '2026-03-14', version: 1 }),
    expected: editors(200),
  },
  { name: 'DELETE /api/builds/:buildId/parts/:partId', call: (f, a) => f.clients[a].delete(`/api/builds/${f.buildId}/parts/${f.partId}`), expected: editors(204) },
  {
    name: 'POST /api/builds/:buildId/parts/bulk',
    call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/parts/bulk`, { action: 'status', partIds: [f.partId], status: 'on_hand' }),
    expected: editors(200),
  },
  {
    name: 'POST /api/builds/:buildId/parts/import (preview)',
    call: (f, a) => f.clients[a].sendText('post', `/api/builds/${f.buildId}/parts/import`, CSV),
    expected: editors(200),
  },
  {
    name: 'POST /api/builds/:buildId/parts/import?commit=true',
    call: (f, a) => f.clients[a].sendText('post', `/api/builds/${f.buildId}/parts/import?commit=true`, CSV),
    expected: editors(201),
  },
  { name: 'GET /api/builds/:buildId/receipts', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/receipts`), expected: readable },
  { name: 'POST /api/builds/:buildId/receipts', call: (f, a) => upload(f.clients[a], f.buildId), expected: editors(201) },
  { name: 'GET /api/builds/:buildId/receipts/:receiptId', call: async (f, a) => f.clients[a].get((await receiptFor(f)).base), expected: readable },
  { name: 'GET /api/builds/:buildId/receipts/:receiptId/suggestions', call: async (f, a) => f.clients[a].get(`${(await receiptFor(f)).base}/suggestions`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/suggestions/accept',
    call: async (f, a) => f.clients[a].post(`${(await receiptFor(f)).base}/suggestions/accept`, {}),
    expected: editors(200),
  },
  { name: 'GET /api/builds/:buildId/receipts/:receiptId/document', call: async (f, a) => f.clients[a].get(`${(await receiptFor(f)).base}/document`), expected: readable },
  {
    name: 'PATCH /api/builds/:buildId/receipts/:receiptId',
    call: async (f, a) => {
      const { base } = await receiptFor(f);
      return f.clients[a].patch(base, { receiptNumber: 'R-1', version: (await f.clients.owner.get(base)).body.version });
    },
    expected: editors(200),
  },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/lines',
    call: async (f, a) => f.clients[a].post(`${(await receiptFor(f)).base}/lines`, { kind: 'fee', description: 'Handling', amount: '2.00' }),
    expected: editors(201),
  },
  {
    name: 'PATCH /api/builds/:buildId/receipts/:receiptId/lines/:lineId',
    call: async (f, a) => {
      const { base, line } = await receiptFor(f);
      return f.clients[a].patch(`${base}/lines/${line.id}`, { description: 'Alternator, reman', version: line.version });
    },
    expected: editors(200),
  },
  {
    name: 'DELETE /api/builds/:buildId/receipts/:receiptId/lines/:lineId',
    call: async (f, a) => {
      const { base, line } = await receiptFor(f);
      return f.clients[a].delete(`${base}/lines/${line.id}`);
    },
    expected: editors(204),
  },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/lines/:lineId/split',
    call: async (f, a) => {
      const { base, line } = await receiptFor(f);
      return f.clients[a].post(`${base}/lines/${line.id}/split`, { version: line.version, shares: [{ amount: '25.00', systemId: f.systemId }, { amount: '15.00', systemId: f.systemId }] });
    },
    expected: editors(200),
  },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/lines/merge',
    call: async (f, a) => {
      const { base, line } = await receiptFor(f);
      const other = (await f.clients.owner.post(`${base}/lines`, { kind: 'part', description: 'Pulley', amount: '1.00', systemId: f.systemId })).body;
      return f.clients[a].post(`${base}/lines/merge`, { lineIds: [line.id, other.id] });
    },
    expected: editors(200),
  },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/file',
    call: async (f, a) => {
      const { base } = await receiptFor(f);
      return f.clients[a].post(`${base}/file`, { version: (await f.clients.owner.get(base)).body.version });
    },
    expected: editors(200),
  },
  { name: 'POST /api/builds/:buildId/receipts/:receiptId/reopen', call: async (f, a) => f.clients[a].post(`${(await receiptFor(f, { filed: true })).base}/reopen`), expected: ownerOnly(200) },
  { name: 'GET /api/builds/:buildId/receipt-lines', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/receipt-lines?q=alt`), expected: readable },
  { name: 'GET /api/builds/:buildId/cores', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/cores`), expected: readable },
  {
    name: 'PATCH /api/builds/:buildId/cores/:coreId',
    call: async (f, a) => {
      await receiptFor(f, { filed: true });
      const core = (await f.clients.owner.get(`/api/builds/${f.buildId}/cores`)).body.cores[0];
      return f.clients[a].patch(`/api/builds/${f.buildId}/cores/${core.id}`, { state: 'dropped_off', version: core.version });
    },
    expected: editors(200),
  },
  { name: 'GET /api/builds/:buildId/returns', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/returns`), expected: readable },
  { name: 'GET /api/builds/:buildId/ledger', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/ledger`), expected: readable },
  { name: 'GET /api/builds/:buildId/ledger/spend', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/ledger/spend?by=week`), expected: readable },
  { name: 'GET /api/builds/:buildId/ledger/vendors', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/ledger/vendors`), expected: readable },
  { name: 'GET /api/builds/:buildId/price-history', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/price-history`), expected: readable },
  {
    name: 'GET /api/builds/:buildId/ledger/lines',
    call: async (f, a) => {
      await receiptFor(f, { filed: true });
      return f.clients[a].get(`/api/builds/${f.buildId}/ledger/lines?figure=netCost&systemId=${f.systemId}`);
    },
    expected: readable,
  },
  { name: 'GET /api/builds/:buildId/exports/tax-ledger.csv', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/exports/tax-ledger.csv`), expected: readable },
  { name: 'GET /api/builds/:buildId/exports/build-sheet.csv', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/exports/build-sheet.csv`), expected: readable },
  { name: 'GET /api/builds/:buildId/exports/build-sheet', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/exports/build-sheet`), expected: readable },
  { name: 'GET /api/builds/:buildId/exports/archive.zip', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/exports/archive.zip`), expected: readable },
  { name: 'GET /api/builds/:buildId/review-queue', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/review-queue`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/review',
    call: async (f, a) => {
      const { base } = await receiptFor(f, { filed: true });
      return f.clients[a].post(`${base}/review`, { verdict: 'approved', version: (await f.clients.owner.get(base)).body.version });
    },
    expected: { owner: 200, crew: 403, reviewer: 200, outsider: 404, anonymous: 401 },
  },
  { name: 'GET /api/builds/:buildId/receipts/:receiptId/comments', call: async (f, a) => f.clients[a].get(`${(await receiptFor(f)).base}/comments`), expected: readable },
  {
    name: 'POST /api/builds/:buildId/receipts/:receiptId/comments',
    call: async (f, a) => f.clients[a].post(`${(await receiptFor(f)).base}/comments`, { body: 'Which car is this for?' }),
    expected: { owner: 201, crew: 201, reviewer: 201, outsider: 404, anonymous: 401 },
  },
  {
    // Two uploads of the same slip are likely duplicates of each other.
    name: 'POST /api/builds/:buildId/receipts/:receiptId/not-duplicate',
    call: async (f, a) => {
      const [one, two] = [await receiptFor(f), await receiptFor(f)];
      return f.clients[a].post(`${one.base}/not-duplicate`, { otherReceiptId: two.id, reason: 'Two alternators: one for the spare engine.' });
    },
    expected: { owner: 200, crew: 403, reviewer: 200, outsider: 404, anonymous: 401 },
  },
  { name: 'GET /api/builds/:buildId/receipts/:receiptId/audit', call: async (f, a) => f.clients[a].get(`${(await receiptFor(f)).base}/audit`), expected: readable },
  { name: 'GET /api/builds/:buildId/alert-preferences', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/alert-preferences`), expected: readable },
  {
    name: 'PUT /api/builds/:buildId/alert-preferences',
    call: (f, a) =>
      f.clients[a].send('put', `/api/builds/${f.buildId}/alert-preferences`, { budget: true, coreDue: false, returnWindow: true, warrantyEnding: true, duplicate: false, reviewDigest: true }),
    expected: readable,
  },
  // The inbox address is for those who send receipts (owner and crew); a reviewer adds none. Refused mail is the owner's.
  { name: 'GET /api/builds/:buildId/inbox', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/inbox`), expected: editors(200) },
  { name: 'POST /api/builds/:buildId/inbox/rotate', call: (f, a) => f.clients[a].post(`/api/builds/${f.buildId}/inbox/rotate`), expected: editors(200) },
  { name: 'GET /api/builds/:buildId/inbox/refused', call: (f, a) => f.clients[a].get(`/api/builds/${f.buildId}/inbox/refused`), expected: ownerOnly(200) },
];

let t: TestApp;
let people: Record<'owner' | 'crew' | 'reviewer' | 'outsider', Awaited<ReturnType<typeof signedUpClient>>>;
let anonymous: ApiClient;
beforeAll(async () => {
  t = await startTestApp();
  // The accounts are made once: signing up hashes a password on purpose slowly, and only the build needs to be fresh.
  people = {
    owner: await signedUpClient(t.app, 'm-owner'),
    crew: await signedUpClient(t.app, 'm-crew'),
    reviewer: await signedUpClient(t.app, 'm-reviewer'),
    outsider: await signedUpClient(t.app, 'm-outsider'),
  };
  anonymous = await new ApiClient(t.app).init();
});
afterAll(() => t.close());

/**
 * A fresh build per case, so one case's changes (a removal, an archive) never leak into another. Crew and reviewer
 * join by a real invite for the first build; later builds add their memberships directly (the invite is tested in crew).
 */
let invitedOnce = false;
async function fixture(): Promise<Fixture> {
  const { owner, crew, reviewer, outsider } = people;
  const buildId = (await owner.client.post('/api/builds', NEW_BUILD)).body.id;
  if (!invitedOnce) {
    for (const [person, role] of [[crew, 'crew'], [reviewer, 'reviewer']] as const) {
      await owner.client.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
      const mail = await t.mail.waitFor((m) => m.to.includes(person.email));
      const token = /\/invites\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
      expect((await person.client.post(`/api/invites/${token}/accept`)).status).toBeLessThan(300);
    }
    invitedOnce = true;
  } else {
    const em = t.orm.em.fork();
    for (const [person, role] of [[crew, 'crew'], [reviewer, 'reviewer']] as const) {
      em.create(Membership, { build: em.getReference(Build, buildId), user: em.getReference(User, person.userId), role });
    }
    await em.flush();
  }
  const systems = (await owner.client.get(`/api/builds/${buildId}/systems`)).body.systems;
  const systemId = systems.find((x: { name: string }) => x.name === 'Cooling').id;
  const partId = (await owner.client.post(`/api/builds/${buildId}/parts`, { ...PART, systemId })).body.id;
  return {
    buildId,
    systemId,
    partId,
    clients: { owner: owner.client, crew: crew.client, reviewer: reviewer.client, outsider: outsider.client, anonymous },
    userIds: { owner: owner.userId, crew: crew.userId, reviewer: reviewer.userId },
  };
}

describe.each(ROUTES)('$name', (route) => {
  it.each(ACTORS)('answers as expected for %s', async (actor) => {
    const f = await fixture();
    const res = await route.call(f, actor, t.app);
    expect(res.status).toBe(route.expected[actor]);
  });
});

it('lists only the builds a person belongs to', async () => {
  const f = await fixture();
  const list = async (actor: Actor) => (await f.clients[actor].get('/api/builds')).body.builds?.map((b: { id: string }) => b.id);
  // The accounts are shared by every case, so the reviewer belongs to many builds; one they were never added to stays out.
  const notTheirs = (await f.clients.owner.post('/api/builds', NEW_BUILD)).body.id;
  expect(await list('reviewer')).toContain(f.buildId);
  expect(await list('reviewer')).not.toContain(notTheirs);
  expect(await list('owner')).toContain(notTheirs);
  expect(await list('outsider')).toEqual([]);
  expect((await f.clients.anonymous.get('/api/builds')).status).toBe(401);
});

it('shows pending invites to the owner only', async () => {
  const f = await fixture();
  await f.clients.owner.post(`/api/builds/${f.buildId}/invites`, { email: uniqueEmail('pending'), role: 'reviewer' });
  expect((await f.clients.owner.get(`/api/builds/${f.buildId}/members`)).body.invites).toHaveLength(1);
  expect((await f.clients.crew.get(`/api/builds/${f.buildId}/members`)).body.invites).toEqual([]);
});
