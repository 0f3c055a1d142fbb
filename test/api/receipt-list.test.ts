// The receipts list against the real PostgreSQL: each receipt's line count and the systems its lines are assigned to
// (each once, in id order), whatever the filter, and nothing from another build's receipts.
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

it('counts each receipt\'s lines and names its systems once each', async () => {
  const owner = await signedUpClient(t.app, 'list-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const other = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Another build' })).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string }[];
  const [engine, brakes] = [systems[0].id, systems[1].id];
  const header = { vendorName: 'Kestrel Auto Spares', purchaseDate: '2026-11-05', total: '40.00' };
  const line = (description: string, amount: string, systemId?: string) => ({ kind: 'part', description, amount, ...(systemId ? { systemId } : {}) });
  const mixed = await filedReceipt(t, owner.client, build.id, header, [
    line('Fuse kit', '10.00', engine),
    line('Relay', '10.00', engine),
    line('Brake pads', '10.00', brakes),
    line('Shop rag', '10.00'),
  ], { file: false });
  const empty = await filedReceipt(t, owner.client, build.id, { ...header, purchaseDate: '2026-11-04', total: null }, [], { file: false });
  const otherSystem = (await owner.client.get(`/api/builds/${other.id}/systems`)).body.systems[0].id;
  await filedReceipt(t, owner.client, other.id, header, [line('Fuse kit', '40.00', otherSystem)], { file: false });

  const summary = (receipts: { id: string; lineCount: number; systemIds: string[] }[]) =>
    receipts.map(({ id, lineCount, systemIds }) => ({ id, lineCount, systemIds }));
  const expected = [
    { id: mixed.id, lineCount: 4, systemIds: [engine, brakes].sort() },
    { id: empty.id, lineCount: 0, systemIds: [] },
  ];
  const all = await owner.client.get(`/api/builds/${build.id}/receipts`);
  expect([all.status, summary(all.body.receipts)]).toEqual([200, expected]);
  // Each time as the saved one's Date prints it (the list has PostgreSQL write it, to the millisecond, in UTC).
  const saved = await t.orm.em.fork().find(Receipt, { id: { $in: [mixed.id, empty.id] } }, { orderBy: { purchaseDate: 'desc' } });
  expect(all.body.receipts.map((receipt: { createdAt: string }) => receipt.createdAt)).toEqual(saved.map((receipt) => receipt.createdAt.toISOString()));
  // A filter narrows the receipts, never the lines counted on one it keeps.
  const braking = await owner.client.get(`/api/builds/${build.id}/receipts?systemId=${brakes}`);
  expect(summary(braking.body.receipts)).toEqual([expected[0]]);
  const toCheck = await owner.client.get(`/api/builds/${build.id}/receipts?state=to_check&vendor=kestrel`);
  expect(summary(toCheck.body.receipts)).toEqual(expected);
});
