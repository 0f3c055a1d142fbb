// The partner's review against the real PostgreSQL: approve, question with a comment (the uploader is mailed),
// the comment thread, the audit trail of money changes, and who may do what.
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { joinByInvite } from '../support/crew';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const join = (owner: ApiClient, buildId: string, role: 'crew' | 'reviewer') => joinByInvite(t, owner, buildId, role, `review-${role}`);

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
  const approvedNews = await t.mail.waitFor((m) => m.to.includes(crew.email) && m.subject.includes('approved'));
  expect(approvedNews.subject).toBe('Test review-reviewer approved Quayside Parts Counter of 2026-11-01');
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
    'receipt:answer:Test review-crew',
  ]);
  expect(trail[0].after).toMatchObject({ total: '80' });
  // The trail names what a line went to, as it is called now.
  expect(trail[1].names).toEqual({ [engine]: 'Engine' });
  // The crew's reply answered the question: the receipt is back in the queue, and the partner who asked is mailed it.
  expect((await partner.client.get(`/api/builds/${build.id}/review-queue`)).body.receipts.map((r: { id: string; reviewState: string }) => [r.id, r.reviewState])).toEqual([[second.id, 'answered']]);
  const answer = await t.mail.waitFor((m) => m.to.includes(partner.email) && m.subject.includes('answered'));
  expect(answer.subject).toBe('Test review-crew answered your question on Quayside Parts Counter of 2026-11-02');
  expect(answer.text).toContain('You asked: Is this gauge for the race car?\n\nAnswer: Yes: the oil pressure gauge.');
  expect(answer.text).toContain(`${t.url}/builds/${build.id}/review`);
  // Only the list filter's states are accepted, and the field is named.
  const answered = await owner.client.get(`/api/builds/${build.id}/receipts?review=answered`);
  expect(answered.body.receipts.map((r: { id: string }) => r.id)).toEqual([second.id]);
  expect((await owner.client.get(`/api/builds/${build.id}/receipts?review=approved`)).body.receipts.map((r: { id: string }) => r.id)).toEqual([first.id]);
  expect((await owner.client.get(`/api/builds/${build.id}/receipts?review=questioned`)).body.receipts).toEqual([]);
  const unknown = await owner.client.get(`/api/builds/${build.id}/receipts?review=maybe`);
  expect([unknown.status, unknown.body.error.fields]).toEqual([400, { review: 'Choose one of: none, approved, questioned, answered.' }]);
});

it('answers a question only by a builder: a follow-up by the asker keeps it questioned, and an asker who left is not mailed', async () => {
  const owner = await signedUpClient(t.app, 'review-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const partner = await join(owner.client, build.id, 'reviewer');
  const receipt = await filedReceipt(t, owner.client, build.id, { vendorName: 'Tidewater Tools', purchaseDate: '2026-11-04', total: '15.00' }, [{ kind: 'part', description: 'Feeler gauge', amount: '15.00', systemId: engine }]);
  const base = `/api/builds/${build.id}/receipts/${receipt.id}`;
  await partner.client.post(`${base}/review`, { verdict: 'questioned', comment: 'A tool for the build?', version: receipt.version });
  await partner.client.post(`${base}/comments`, { body: 'Or for the shop?' });
  expect((await owner.client.get(base)).body.reviewState).toBe('questioned');

  expect((await partner.client.delete(`/api/builds/${build.id}/members/${partner.userId}`)).status).toBe(204);
  expect((await owner.client.post(`${base}/comments`, { body: 'For the build: valve lash.' })).status).toBe(201);
  expect((await owner.client.get(base)).body.reviewState).toBe('answered');
  // The comment is mailed before the answer, so a mail would be here by now.
  expect(t.mail.messages.filter((m) => m.to.includes(partner.email) && m.subject.includes('answered'))).toEqual([]);
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
