// "Not a duplicate" against the real PostgreSQL: the pair is recorded once, the warning leaves both receipts, both
// trails carry the reason; a bad body, a pair that is no duplicate and another build's receipt are refused.
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { dumpBuild } from '../support/build-dump';
import { filedReceipt } from '../support/receipts';
import { joinByInvite } from '../support/crew';
import { startTestApp, type TestApp } from '../support/test-app';
import { Receipt } from '../../backend/src/receipts/receipt.entity';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const join = (owner: ApiClient, buildId: string, role: 'crew' | 'reviewer') => joinByInvite(t, owner, buildId, role, `dup-${role}`);

it('clears the warning on both receipts of a pair, once, with the reason in both trails', async () => {
  const owner = await signedUpClient(t.app, 'dup-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const partner = await join(owner.client, build.id, 'reviewer');
  const crew = await join(owner.client, build.id, 'crew');
  // The same slip uploaded three times: each receipt is a likely duplicate of the other two (same file).
  const header = { vendorName: 'Kestrel Auto Spares', purchaseDate: '2026-11-05', total: '24.00' };
  const lines = [{ kind: 'part', description: 'Fuse kit', amount: '24.00', systemId: engine }];
  const [a, b, c] = [await filedReceipt(t, crew.client, build.id, header, lines), await filedReceipt(t, crew.client, build.id, header, lines), await filedReceipt(t, crew.client, build.id, header, lines)];
  const url = (id: string) => `/api/builds/${build.id}/receipts/${id}`;
  expect((await owner.client.get(url(a.id))).body.duplicateOf.sort()).toEqual([b.id, c.id].sort());

  const before = await dumpBuild(t.orm, build.id);
  const refused = [
    [await crew.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: b.id, reason: 'Two kits.' }), 403, undefined],
    [await partner.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: b.id }), 400, { reason: 'Say why these are two purchases.' }],
    [await partner.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: b.id, reason: 'x'.repeat(501) }), 400, { reason: 'A reason is at most 500 characters.' }],
    [await partner.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: 'b', reason: 'Two kits.' }), 400, { otherReceiptId: 'Choose the other receipt of the pair.' }],
    [await partner.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: a.id, reason: 'Two kits.' }), 400, { otherReceiptId: 'That receipt is not a likely duplicate of this one.' }],
  ] as const;
  expect(refused.map(([res]) => res.status)).toEqual(refused.map(([, status]) => status));
  for (const [res, , fields] of refused) if (fields) expect(res.body.error.fields).toEqual(fields);
  expect(await dumpBuild(t.orm, build.id)).toBe(before);

  const marked = await partner.client.post(`${url(b.id)}/not-duplicate`, { otherReceiptId: a.id, reason: '  One kit for the fan circuit, one spare.  ' });
  expect([marked.status, marked.body.id, marked.body.duplicateOf]).toEqual([200, b.id, [c.id]]);
  // Crew uploaded both: told once, with the reason.
  const told = await t.mail.waitFor((m) => m.to.includes(crew.email) && m.subject.includes('not a duplicate'));
  expect(told.subject).toBe('Kestrel Auto Spares of 2026-11-05 is not a duplicate');
  expect(told.text).toContain('Reason: One kit for the fan circuit, one spare.');
  expect(t.mail.messages.filter((m) => m.to.includes(crew.email) && m.subject.includes('not a duplicate'))).toHaveLength(1);
  // Both receipts lose the warning for each other, whichever of the two it was marked from; c still warns of both.
  expect((await owner.client.get(url(a.id))).body.duplicateOf).toEqual([c.id]);
  expect((await owner.client.get(url(c.id))).body.duplicateOf.sort()).toEqual([a.id, b.id].sort());
  const listed = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { id: string; duplicateOf: string[] }[];
  expect(Object.fromEntries(listed.map((r) => [r.id, r.duplicateOf.length]))).toEqual({ [a.id]: 1, [b.id]: 1, [c.id]: 2 });

  for (const [self, other] of [[a.id, b.id], [b.id, a.id]]) {
    const trail = (await owner.client.get(`${url(self)}/audit`)).body.events as { action: string; who: string; after: unknown; names: unknown }[];
    expect(trail.at(-1)).toMatchObject({
      action: 'not_duplicate',
      who: 'Test dup-reviewer',
      after: { otherReceiptId: other, reason: 'One kit for the fan circuit, one spare.' },
      names: { [other]: 'Kestrel Auto Spares of 2026-11-05' },
    });
  }
  // The other way round is the same pair: no longer a likely duplicate, so refused.
  const again = await owner.client.post(`${url(a.id)}/not-duplicate`, { otherReceiptId: b.id, reason: 'Again.' });
  expect([again.status, again.body.error.fields]).toEqual([400, { otherReceiptId: 'That receipt is not a likely duplicate of this one.' }]);
  // The owner may mark too.
  expect((await owner.client.post(`${url(c.id)}/not-duplicate`, { otherReceiptId: a.id, reason: 'Reprint kept for the warranty.' })).body.duplicateOf).toEqual([b.id]);
});

it('answers 404 for a receipt of another build, on either side of the pair', async () => {
  const owner = await signedUpClient(t.app, 'dup-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const mine = await filedReceipt(t, owner.client, build.id, { total: '5.00' }, [{ kind: 'part', description: 'Clip', amount: '5.00', systemId: engine }], { file: false });
  const stranger = await signedUpClient(t.app, 'dup-stranger');
  const theirBuild = (await stranger.client.post('/api/builds', NEW_BUILD)).body;
  const theirEngine = (await stranger.client.get(`/api/builds/${theirBuild.id}/systems`)).body.systems[0].id;
  const theirs = await filedReceipt(t, stranger.client, theirBuild.id, { total: '5.00' }, [{ kind: 'part', description: 'Clip', amount: '5.00', systemId: theirEngine }], { file: false });

  const before = await dumpBuild(t.orm, build.id);
  const other = await owner.client.post(`/api/builds/${build.id}/receipts/${mine.id}/not-duplicate`, { otherReceiptId: theirs.id, reason: 'Not ours.' });
  const foreign = await owner.client.post(`/api/builds/${build.id}/receipts/${theirs.id}/not-duplicate`, { otherReceiptId: mine.id, reason: 'Not ours.' });
  expect([other.status, foreign.status]).toEqual([404, 404]);
  expect(await dumpBuild(t.orm, build.id)).toBe(before);
});

it('names the same likely duplicates on the list as on each receipt: one document twice, or one shop, date and total', async () => {
  const owner = await signedUpClient(t.app, 'dup-list');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const otherBuild = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const receipt = async (buildId: string, document: string, header: object) => {
    const made = await filedReceipt(t, owner.client, buildId, header, [], { file: false });
    // Every upload here is the same slip: each receipt is given a document of its own (a made-up digest).
    await t.orm.em.fork().nativeUpdate(Receipt, { id: made.id }, { sha256: document.repeat(64) });
    return made.id as string;
  };
  const paid = { vendorName: 'Kestrel Auto Spares', purchaseDate: '2026-11-05', total: '24.00' };
  const first = await receipt(build.id, 'a', paid);
  const sameShopDayTotal = await receipt(build.id, 'b', paid);
  const otherTotal = await receipt(build.id, 'c', { ...paid, total: '24.10' });
  const scan = await receipt(build.id, 'd', { ...paid, purchaseDate: '2026-11-06', total: '3.00' });
  const rescan = await receipt(build.id, 'd', { ...paid, purchaseDate: '2026-11-06', total: '30.00' });
  const noShop = await receipt(build.id, 'e', { total: '24.00', purchaseDate: '2026-11-05' });
  const noShopAgain = await receipt(build.id, 'f', { total: '24.00', purchaseDate: '2026-11-05' });
  // Another build's copy of the first, same document and figures: never a duplicate across builds.
  await receipt(otherBuild.id, 'a', paid);

  const expected = {
    [first]: [sameShopDayTotal],
    [sameShopDayTotal]: [first],
    [otherTotal]: [],
    [scan]: [rescan],
    [rescan]: [scan],
    // Without a shop, only the same document makes a likely duplicate.
    [noShop]: [],
    [noShopAgain]: [],
  };
  const listed = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { id: string; duplicateOf: string[] }[];
  expect(Object.fromEntries(listed.map((r) => [r.id, r.duplicateOf]))).toEqual(expected);
  for (const id of Object.keys(expected)) {
    expect([id, (await owner.client.get(`/api/builds/${build.id}/receipts/${id}`)).body.duplicateOf]).toEqual([id, expected[id]]);
  }
  // A receipt like two others lists both, oldest first, on the list and on the receipt.
  const third = await receipt(build.id, 'g', paid);
  const relisted = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { id: string; duplicateOf: string[] }[];
  expect(relisted.find((r) => r.id === third)!.duplicateOf).toEqual([first, sameShopDayTotal]);
  expect((await owner.client.get(`/api/builds/${build.id}/receipts/${third}`)).body.duplicateOf).toEqual([first, sameShopDayTotal]);
});
