// What a hostile or careless client sends: impossible dates, over-long tags, broken uploads. Each answers 4xx in the
// one error shape, names the field, and changes nothing; none answers 5xx.
import zlib from 'node:zlib';
import { Build } from '../../backend/src/builds/build.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt, uploadSlip } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let client: ApiClient;
let buildId: string;
beforeAll(async () => {
  t = await startTestApp();
  client = (await signedUpClient(t.app, 'hostile')).client;
  buildId = (await client.post('/api/builds', NEW_BUILD)).body.id;
});
afterAll(() => t.close());

const IMPOSSIBLE_DATES = ['2026-02-30', '2026-13-45'];

describe('impossible calendar dates', () => {
  it('refuses them as a receipt date, naming the field, and keeps the saved date', async () => {
    const id = (await uploadSlip(client, buildId)).body.receipts[0].id as string;
    await t.orm.em.fork().nativeUpdate(Receipt, { id }, { state: 'to_check', purchaseDate: '2026-02-28' });
    for (const purchaseDate of IMPOSSIBLE_DATES) {
      const version = (await client.get(`/api/builds/${buildId}/receipts/${id}`)).body.version;
      const res = await client.patch(`/api/builds/${buildId}/receipts/${id}`, { purchaseDate, version });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ purchaseDate: 'That date does not exist.' });
    }
    expect((await client.get(`/api/builds/${buildId}/receipts/${id}`)).body.purchaseDate).toBe('2026-02-28');
  });

  it('refuses them as a core due date, naming the field', async () => {
    const engine = (await client.get(`/api/builds/${buildId}/systems`)).body.systems.find((s: { name: string }) => s.name === 'Engine').id;
    await filedReceipt(t, client, buildId, { purchaseDate: '2026-01-31', total: '40.00' }, [{ kind: 'core_charge', description: 'CORE CHARGE', amount: '40.00', systemId: engine }]);
    const core = (await client.get(`/api/builds/${buildId}/cores`)).body.cores[0];
    for (const dueDate of IMPOSSIBLE_DATES) {
      const res = await client.patch(`/api/builds/${buildId}/cores/${core.id}`, { dueDate, version: core.version });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ dueDate: 'That date does not exist.' });
    }
    expect((await client.get(`/api/builds/${buildId}/cores`)).body.cores[0].dueDate).toBe(core.dueDate);
  });

  it.each(['receipts', 'exports/tax-ledger.csv', 'exports/build-sheet.csv'])('refuses them in the from/to filters of %s', async (route) => {
    for (const date of IMPOSSIBLE_DATES) {
      for (const field of ['from', 'to']) {
        const res = await client.get(`/api/builds/${buildId}/${route}?${field}=${date}`);
        expect(res.status).toBe(400);
        expect(res.body.error.fields).toEqual({ [field]: 'That date does not exist.' });
      }
    }
    expect((await client.get(`/api/builds/${buildId}/${route}?from=2026-02-28&to=`)).status).toBe(200);
  });
});

it('refuses a valid language tag longer than the 35 characters stored, naming the field', async () => {
  // Well-formed by BCP 47 (RFC 5646), 45 characters.
  const locale = 'en-Latn-US-valencia-fonipa-u-ca-gregory-nu-la';
  expect(locale).toHaveLength(45);
  expect(Intl.getCanonicalLocales(locale)).toHaveLength(1);
  const version = (await client.get(`/api/builds/${buildId}`)).body.version;
  const res = await client.patch(`/api/builds/${buildId}`, { locale, version });
  expect(res.status).toBe(400);
  expect(res.body.error.fields).toEqual({ locale: 'A language tag is at most 35 characters, such as en-US or en-GB.' });
  const created = await client.post('/api/builds', { ...NEW_BUILD, locale });
  expect(created.status).toBe(400);
  expect((await t.orm.em.fork().findOneOrFail(Build, buildId)).locale).toBe('en-US');
});

describe('broken uploads', () => {
  const raw = () => client as unknown as { agent: import('supertest').Agent; csrf: string };
  const post = (path: string) => raw().agent.post(`/api/builds/${buildId}/${path}`).set('X-XSRF-TOKEN', raw().csrf);
  const ROUTES = [
    { path: 'receipts', field: 'files', maxBytes: 20 * 1024 * 1024, file: 'slip.png' },
    { path: 'parts/import', field: 'file', maxBytes: 2 * 1024 * 1024, file: 'parts.csv' },
  ];
  const malformed = { code: 'malformed_request', message: 'The upload was cut off or is not a well-formed multipart form. Send the file again.' };

  it.each(ROUTES)('answers 400 to a multipart form without a boundary on $path', async ({ path, field }) => {
    const res = await post(path).set('Content-Type', 'multipart/form-data').send('--x\r\nnothing here\r\n');
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({ ...malformed, fields: { [field]: malformed.message } });
  });

  it.each(ROUTES)('answers 400 to a cut-off multipart body on $path', async ({ path, field, file }) => {
    const body = `--XYZ\r\nContent-Disposition: form-data; name="${field}"; filename="${file}"\r\nContent-Type: application/octet-stream\r\n\r\nthe first bytes of`;
    const res = await post(path).set('Content-Type', 'multipart/form-data; boundary=XYZ').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_request');
  });

  it.each(ROUTES)('answers 400 naming the field when the file comes in another field on $path', async ({ path, field, file }) => {
    const res = await post(path).attach('photo', Buffer.from('a,b\n1,2\n'), file);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(new RegExp(`in the field "${field}"`));
  });

  it.each(ROUTES)('answers 413 to a file over the limit on $path', async ({ path, field, maxBytes, file }) => {
    const res = await post(path).attach(field, Buffer.alloc(maxBytes + 1, 0x41), file);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
  });

  it('refuses a PNG that declares 50,000 × 50,000 pixels, stating the limit, and stores nothing', async () => {
    // A PNG header (W3C PNG specification: signature, IHDR of width, height, depth 8, colour type 2) and no picture.
    const chunk = (type: string, data: Buffer) => {
      const length = Buffer.alloc(4);
      length.writeUInt32BE(data.length);
      const crc = Buffer.alloc(4);
      crc.writeUInt32BE(zlib.crc32(Buffer.concat([Buffer.from(type), data])));
      return Buffer.concat([length, Buffer.from(type), data, crc]);
    };
    const header = Buffer.alloc(13);
    header.writeUInt32BE(50_000, 0);
    header.writeUInt32BE(50_000, 4);
    header.set([8, 2, 0, 0, 0], 8);
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', header), chunk('IDAT', zlib.deflateSync(Buffer.alloc(64))), chunk('IEND', Buffer.alloc(0))]);
    const before = await t.orm.em.fork().count(Receipt, { build: buildId });
    const res = await post('receipts').attach('files', png, 'huge.png');
    expect(res.status).toBe(400);
    expect(res.body.error.fields['files.0']).toBe('huge.png: The photo is 50000 × 50000 pixels (2500 megapixels); at most 40 megapixels are read. Send a smaller photo.');
    expect(await t.orm.em.fork().count(Receipt, { build: buildId })).toBe(before);
  });
});
