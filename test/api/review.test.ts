// The partner's review against the real PostgreSQL: approve, question with a comment (the uploader is mailed),
// the comment thread, the audit trail of money changes, and who may do what.
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function join(owner: ApiClient, buildId: string, role: 'crew' | 'reviewer') {
  const person = await signedUpClient(t.app, `review-${role}`);
  await owner.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
  const mail = await t.mail.waitFor((m) => m.to.includes(person.email));
  await person.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
  return person;
}

it('lets the reviewer approve one receipt and question another; the uploader is told; the trail shows every money change', async () => {
  const owner = await signedUpClient(t.app, 'review-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const crew = await join(owner.client, build.id, 'crew');
  const partner = await join(owner.client, build.id, 'reviewer');
  const first = await filedReceipt(t, crew.client, build.id, { vendorName: 'Quayside Parts Counter', purchaseDate: '2026-11-01', total: '12.00' }, [{ kind: 'part', description: 'Gasket', amount: '12.00', systemId: engine }]);
  const second = await filedReceipt(t, crew.client, build.id, { vendorName: 'Quayside Parts Counter', purchaseDate: '2026-11-02', total: '80.00' }, [{ kind: 'part', description: 'Gauge', amount: '80.00', systemId: engine }]);

  const queue = (await partner.client.get(`/api/builds/${build.id}/review-queue`)).body.receipts.map((r: { id: string }) => r.id).sort();
  expect(queue).toEqual([first.id, second.id].sort());

  expect((await crew.client.post(`/api/builds/${build.id}/receipts/${first.id}/review`, { verdict: 'approved', version: first.version })).status).toBe(403);
  const noReason = await partner.client.post(`/api/builds/${build.id}/receipts/${second.id}/review`, { verdict: 'questioned', version: second.version });
  expect(noReason.status).toBe(400);
  expect(noReason.body.error.fields).toEqual({ comment: 'Say what the question is.' });

  expect((await partner.client.post(`/api/builds/${build.id}/receipts/${first.id}/review`, { verdict: 'approved', version: first.version })).body.reviewState).toBe('approved');
  const questioned = await partner.client.post(`/api/builds/${build.id}/receipts/${second.id}/review`, { verdict: 'questioned', comment: 'Is this gauge for the race car?', version: second.version });
  expect(questioned.body.reviewState).toBe('questioned');
  const mail = await t.mail.waitFor((m) => m.to.includes(crew.email) && m.subject.includes('commented'));
  expect(mail.text).toContain('Is this gauge for the race car?');

  await crew.client.post(`/api/builds/${build.id}/receipts/${second.id}/comments`, { body: 'Yes: the oil pressure gauge.' });
  const thread = (await owner.client.get(`/api/builds/${build.id}/receipts/${second.id}/comments`)).body.comments;
  expect(thread.map((c: { author: string; body: string }) => [c.author, c.body])).toEqual([
    ['Test review-reviewer', 'Is this gauge for the race car?'],
    ['Test review-crew', 'Yes: the oil pressure gauge.'],
  ]);
  expect((await crew.client.post(`/api/builds/${build.id}/receipts/${second.id}/comments`, { body: '  ' })).body.error.fields).toEqual({ body: 'Write a comment.' });

  const trail = (await partner.client.get(`/api/builds/${build.id}/receipts/${second.id}/audit`)).body.events;
  expect(trail.map((e: { entity: string; action: string; who: string }) => `${e.entity}:${e.action}:${e.who}`)).toEqual([
    'receipt:edit:Test review-crew',
    'receipt_line:add:Test review-crew',
    'receipt:file:Test review-crew',
    'receipt:review:Test review-reviewer',
  ]);
  expect(trail[0].after).toMatchObject({ total: '80' });
  // The trail names what a line went to, as it is called now.
  expect(trail[1].names).toEqual({ [engine]: 'Engine' });
  expect((await partner.client.get(`/api/builds/${build.id}/review-queue`)).body.receipts).toEqual([]);
});

it('never mails a comment to an uploader who has left the build', async () => {
  const owner = await signedUpClient(t.app, 'review-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const crew = await join(owner.client, build.id, 'crew');
  const receipt = await filedReceipt(t, crew.client, build.id, { vendorName: 'Harbour Fasteners', purchaseDate: '2026-11-03', total: '9.00' }, [{ kind: 'part', description: 'Bolts', amount: '9.00', systemId: engine }]);
  expect((await crew.client.delete(`/api/builds/${build.id}/members/${crew.userId}`)).status).toBe(204);

  expect((await owner.client.post(`/api/builds/${build.id}/receipts/${receipt.id}/comments`, { body: 'Which bolts were these?' })).status).toBe(201);
  // The comment is mailed before the answer, so a mail would be here by now.
  expect(t.mail.messages.filter((m) => m.to.includes(crew.email) && m.subject.includes('commented'))).toEqual([]);
});
