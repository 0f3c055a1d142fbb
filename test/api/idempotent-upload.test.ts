// Uploads with an Idempotency-Key (IETF HTTPAPI draft "The Idempotency-Key HTTP Header Field"): a repeat answers the
// receipt already made, other files under the same key are refused and store nothing, two at once make one receipt,
// and keys are per build and person.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Agent } from 'supertest';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { UploadKey } from '../../backend/src/receipts/upload-key.entity';
import { KEY_LIFETIME_HOURS } from '../../backend/src/receipts/upload-idempotency';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

// Starting the app (PostgreSQL, the S3 fake, the queue) takes longer than jest's 5 s when the machine is busy.
jest.setTimeout(60_000);

const FIXTURES = path.resolve(__dirname, '../fixtures/receipts/generated');
const SLIP = readFileSync(path.join(FIXTURES, 'counter-1.png'));
const OTHER_SLIP = readFileSync(path.join(FIXTURES, 'core-1.png'));

let t: TestApp;
let stored: jest.SpyInstance;
beforeAll(async () => {
  t = await startTestApp();
  // Counts what reaches the object store, so a refused or repeated upload is seen to store no document.
  stored = jest.spyOn(t.store, 'put');
});
afterAll(() => t?.close());
beforeEach(() => stored.mockClear());

function upload(client: ApiClient, buildId: string, key: string | undefined, bytes = SLIP) {
  const raw = client as unknown as { agent: Agent; csrf: string };
  let request = raw.agent.post(`/api/builds/${buildId}/receipts`).set('X-XSRF-TOKEN', raw.csrf);
  if (key !== undefined) request = request.set('Idempotency-Key', key);
  return request.attach('files', bytes, 'slip.png');
}

async function ownerWithBuild(label: string) {
  const owner = await signedUpClient(t.app, label);
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body as { id: string };
  return { ...owner, buildId: build.id };
}

const receiptsOf = (buildId: string) => t.orm.em.fork().count(Receipt, { build: buildId });
const keysOf = (buildId: string) => t.orm.em.fork().count(UploadKey, { build: buildId });

it('answers a repeat of the same key and file with the receipt it made, 201 both times, and stores it once', async () => {
  const { client, buildId } = await ownerWithBuild('key-repeat');
  const first = await upload(client, buildId, '"0b7c6c1e-4c55-4f7e-9d55-2f4a1e0c9a01"');
  const again = await upload(client, buildId, '"0b7c6c1e-4c55-4f7e-9d55-2f4a1e0c9a01"');
  expect([first.status, again.status]).toEqual([201, 201]);
  expect(again.body.receipts.map((r: { id: string }) => r.id)).toEqual([first.body.receipts[0].id]);
  expect(again.body.receipts[0].originalFilename).toBe('slip.png');
  expect(await receiptsOf(buildId)).toBe(1);
  expect(stored).toHaveBeenCalledTimes(1);
  // The bare form of the same key is the same key.
  expect((await upload(client, buildId, '0b7c6c1e-4c55-4f7e-9d55-2f4a1e0c9a01')).body.receipts[0].id).toBe(first.body.receipts[0].id);
  expect(await receiptsOf(buildId)).toBe(1);
  // Without a key every upload is new, as before.
  expect((await upload(client, buildId, undefined)).status).toBe(201);
  expect(await receiptsOf(buildId)).toBe(2);
});

it('refuses the same key with another file (422 naming the header) and stores neither row nor document', async () => {
  const { client, buildId } = await ownerWithBuild('key-other-file');
  await upload(client, buildId, 'capture-7');
  stored.mockClear();
  const refused = await upload(client, buildId, 'capture-7', OTHER_SLIP);
  expect(refused.status).toBe(422);
  expect(refused.body.error.code).toBe('idempotency_key_reused');
  expect(refused.body.error.fields).toEqual({ 'Idempotency-Key': 'This Idempotency-Key was already used for other files. Send a new capture with a new key.' });
  expect(await receiptsOf(buildId)).toBe(1);
  expect(await keysOf(buildId)).toBe(1);
  expect(stored).not.toHaveBeenCalled();
});

it('makes one receipt of two requests with one key sent at once; both answer it', async () => {
  const { client, buildId } = await ownerWithBuild('key-race');
  for (const round of [1, 2, 3]) {
    const answers = await Promise.all([upload(client, buildId, `race-${round}`), upload(client, buildId, `race-${round}`)]);
    expect(answers.map((a) => a.status)).toEqual([201, 201]);
    expect(answers[1].body.receipts[0].id).toBe(answers[0].body.receipts[0].id);
    expect(await receiptsOf(buildId)).toBe(round);
  }
  expect(stored).toHaveBeenCalledTimes(3);
});

it('keeps keys apart per person and per build', async () => {
  const owner = await ownerWithBuild('key-owner');
  const crew = await signedUpClient(t.app, 'key-crew');
  await owner.client.post(`/api/builds/${owner.buildId}/invites`, { email: crew.email, role: 'crew' });
  const mail = await t.mail.waitFor((m) => m.to.includes(crew.email));
  await crew.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
  const otherBuild = (await owner.client.post('/api/builds', NEW_BUILD)).body.id as string;

  const byOwner = await upload(owner.client, owner.buildId, 'shared-key');
  const byCrew = await upload(crew.client, owner.buildId, 'shared-key');
  const elsewhere = await upload(owner.client, otherBuild, 'shared-key');
  expect([byOwner.status, byCrew.status, elsewhere.status]).toEqual([201, 201, 201]);
  expect(new Set([byOwner.body.receipts[0].id, byCrew.body.receipts[0].id, elsewhere.body.receipts[0].id]).size).toBe(3);
  expect(await receiptsOf(owner.buildId)).toBe(2);
  expect(await receiptsOf(otherBuild)).toBe(1);
});

it.each([
  { case: 'empty', key: '' },
  { case: 'longer than 255 characters', key: 'k'.repeat(256) },
  { case: 'a tab inside', key: 'capture\tone' },
  { case: 'empty quotes', key: '""' },
])('refuses a key that is $case with 400 naming the header, and stores nothing', async ({ key }) => {
  const { client, buildId } = await ownerWithBuild('key-bad');
  const refused = await upload(client, buildId, key);
  expect(refused.status).toBe(400);
  expect(Object.keys(refused.body.error.fields)).toEqual(['Idempotency-Key']);
  expect(await receiptsOf(buildId)).toBe(0);
  expect(await keysOf(buildId)).toBe(0);
  expect(stored).not.toHaveBeenCalled();
});

it('forgets a key after its lifetime: the same key then starts afresh, even with another file', async () => {
  const { client, buildId } = await ownerWithBuild('key-expiry');
  const first = await upload(client, buildId, 'capture-expiry-1');
  expect(first.status).toBe(201);
  // Made older than the lifetime (KEY_LIFETIME_HOURS) by moving its creation back.
  await t.orm.em.fork().getConnection().execute(`update upload_key set created_at = now() - make_interval(hours => ?) where build_id = ?`, [KEY_LIFETIME_HOURS + 1, buildId]);
  const later = await upload(client, buildId, 'capture-expiry-1', OTHER_SLIP);
  expect(later.status).toBe(201);
  expect(later.body.receipts[0].id).not.toBe(first.body.receipts[0].id);
  expect(await receiptsOf(buildId)).toBe(2);
  expect(await keysOf(buildId)).toBe(1);
});

it('takes a key of exactly 255 printable characters', async () => {
  const { client, buildId } = await ownerWithBuild('key-longest');
  expect((await upload(client, buildId, `~ ${'k'.repeat(253)}`)).status).toBe(201);
  expect(await keysOf(buildId)).toBe(1);
});
