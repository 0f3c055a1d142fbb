// Every build route for each kind of caller: owner, crew, reviewer, a signed-in non-member, and signed out.
// A non-member must learn nothing of the build: 404, never 403.
import type { Express } from 'express';
import { ApiClient, NEW_BUILD, signedUpClient, uniqueEmail } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

type Actor = 'owner' | 'crew' | 'reviewer' | 'outsider' | 'anonymous';
const ACTORS: Actor[] = ['owner', 'crew', 'reviewer', 'outsider', 'anonymous'];

interface Fixture {
  buildId: string;
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
];

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

/** A fresh build per case, so one case's changes (a removal, an archive) never leak into another. */
async function fixture(): Promise<Fixture> {
  const owner = await signedUpClient(t.app, 'm-owner');
  const crew = await signedUpClient(t.app, 'm-crew');
  const reviewer = await signedUpClient(t.app, 'm-reviewer');
  const outsider = await signedUpClient(t.app, 'm-outsider');
  const anonymous = await new ApiClient(t.app).init();
  const buildId = (await owner.client.post('/api/builds', NEW_BUILD)).body.id;
  for (const [person, role] of [[crew, 'crew'], [reviewer, 'reviewer']] as const) {
    await owner.client.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
    const mail = await t.mail.waitFor((m) => m.to.includes(person.email));
    const token = /\/invites\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    await person.client.post(`/api/invites/${token}/accept`);
  }
  return {
    buildId,
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
  expect(await list('reviewer')).toEqual([f.buildId]);
  expect(await list('outsider')).toEqual([]);
  expect((await f.clients.anonymous.get('/api/builds')).status).toBe(401);
});

it('shows pending invites to the owner only', async () => {
  const f = await fixture();
  await f.clients.owner.post(`/api/builds/${f.buildId}/invites`, { email: uniqueEmail('pending'), role: 'reviewer' });
  expect((await f.clients.owner.get(`/api/builds/${f.buildId}/members`)).body.invites).toHaveLength(1);
  expect((await f.clients.crew.get(`/api/builds/${f.buildId}/members`)).body.invites).toEqual([]);
});
