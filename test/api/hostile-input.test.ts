// What a hostile or careless client sends: impossible dates, over-long tags, broken uploads. Each answers 4xx in the
// one error shape, names the field, and changes nothing; none answers 5xx.
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
