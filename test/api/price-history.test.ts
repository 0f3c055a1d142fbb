// The price history against the real PostgreSQL: purchase lines of filed receipts of this build only, matched by the
// shared item key, every price by shop and date with the lowest and the last. Prices worked by hand in the comments.
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { joinByInvite } from '../support/crew';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

let t: TestApp;
let owner: ApiClient;
let buildId: string;
let otherBuildId: string;
let receipts: string[];

/**
 * Build in USD, every line on Brakes (or Body):
 * R1 Fernhill Auto Spares 2026-03-03: pads BP-4410 2 × 30.00 = 60.00; "Wiper blade" 12.00; "Oil filter" 9.00.
 * R2 Marrow Lane Motors 2026-04-10: pads "bp 4410", no unit price, 33.60 for 1 -> 33.60; "WIPER  Blade" 25.00 for 2 -> 12.50.
 * R3 Fernhill Auto Spares 2026-05-20: pads "BP.4410" 2 × 31.255 = 62.51 -> 31.26 (half up).
 * R4 Marrow Lane Motors 2026-06-01, not filed: pads BP-4410 20.00 and "Oil filter" 8.00: counted nowhere.
 * Another build of the same owner, filed: pads BP-4410 10.00: never in this build's history.
 * So: pads 30.00, 33.60, 31.26 (lowest 30.00 at Fernhill on R1, last 31.26 on R3); wiper 12.00, 12.50 (lowest R1,
 * last R2); the oil filter was filed once only, so it is listed only when one receipt is enough.
 */
beforeAll(async () => {
  t = await startTestApp();
  owner = (await signedUpClient(t.app, 'price-history')).client;
  buildId = (await owner.post('/api/builds', NEW_BUILD)).body.id as string;
  const systems = (await owner.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  const systemId = systems[0].id;
  const pads = (fields: object) => ({ kind: 'part', description: 'Brake pads, front', systemId, ...fields });
  const r1 = await filedReceipt(t, owner, buildId, { vendorName: 'Fernhill Auto Spares', purchaseDate: '2026-03-03', total: '81.00' }, [
    pads({ partNumber: 'BP-4410', quantity: '2', unitPrice: '30.00', amount: '60.00' }),
    { kind: 'part', description: 'Wiper blade', amount: '12.00', systemId },
    { kind: 'part', description: 'Oil filter', amount: '9.00', systemId },
  ]);
  const r2 = await filedReceipt(t, owner, buildId, { vendorName: 'Marrow Lane Motors', purchaseDate: '2026-04-10', total: '58.60' }, [
    pads({ partNumber: 'bp 4410', amount: '33.60' }),
    { kind: 'part', description: 'WIPER  Blade', quantity: '2', amount: '25.00', systemId },
  ]);
  const r3 = await filedReceipt(t, owner, buildId, { vendorName: 'Fernhill Auto Spares', purchaseDate: '2026-05-20', total: '62.51' }, [
    pads({ partNumber: 'BP.4410', quantity: '2', unitPrice: '31.255', amount: '62.51' }),
  ]);
  await filedReceipt(
    t,
    owner,
    buildId,
    { vendorName: 'Marrow Lane Motors', purchaseDate: '2026-06-01', total: '28.00' },
    [pads({ partNumber: 'BP-4410', amount: '20.00' }), { kind: 'part', description: 'Oil filter', amount: '8.00', systemId }],
    { file: false },
  );
  receipts = [r1.id, r2.id, r3.id];

  otherBuildId = (await owner.post('/api/builds', { ...NEW_BUILD, name: 'Other coupé' })).body.id as string;
  const otherSystem = ((await owner.get(`/api/builds/${otherBuildId}/systems`)).body.systems as { id: string }[])[0].id;
  await filedReceipt(t, owner, otherBuildId, { vendorName: 'Fernhill Auto Spares', purchaseDate: '2026-02-01', total: '10.00' }, [
    { kind: 'part', description: 'Brake pads, front', partNumber: 'BP-4410', amount: '10.00', systemId: otherSystem },
  ]);
});
afterAll(() => t.close());

describe('GET /api/builds/:buildId/price-history', () => {
  it('lists every price of the items seen on two receipts or more, in date order, with the lowest and the last', async () => {
    const res = await owner.get(`/api/builds/${buildId}/price-history`);
    expect(res.status).toBe(200);
    const [r1, r2, r3] = receipts;
    expect(res.body).toEqual({
      currency: 'USD',
      items: [
        {
          key: 'number:bp4410',
          partNumber: 'BP.4410',
          description: 'Brake pads, front',
          prices: [
            { receiptId: r1, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-03-03', unitPrice: '30.00', quantity: '2' },
            { receiptId: r2, vendor: 'Marrow Lane Motors', purchaseDate: '2026-04-10', unitPrice: '33.60', quantity: '1' },
            { receiptId: r3, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-05-20', unitPrice: '31.26', quantity: '2' },
          ],
          lowest: { receiptId: r1, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-03-03', unitPrice: '30.00' },
          last: { receiptId: r3, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-05-20', unitPrice: '31.26' },
        },
        {
          key: 'description:wiper blade',
          partNumber: '',
          description: 'WIPER  Blade',
          prices: [
            { receiptId: r1, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-03-03', unitPrice: '12.00', quantity: '1' },
            { receiptId: r2, vendor: 'Marrow Lane Motors', purchaseDate: '2026-04-10', unitPrice: '12.50', quantity: '2' },
          ],
          lowest: { receiptId: r1, vendor: 'Fernhill Auto Spares', purchaseDate: '2026-03-03', unitPrice: '12.00' },
          last: { receiptId: r2, vendor: 'Marrow Lane Motors', purchaseDate: '2026-04-10', unitPrice: '12.50' },
        },
      ],
    });
  });

  it('lists items filed once when one receipt is enough, never a receipt not yet filed', async () => {
    const res = await owner.get(`/api/builds/${buildId}/price-history?minReceipts=1`);
    expect(res.status).toBe(200);
    const items = res.body.items as { key: string; prices: { unitPrice: string }[] }[];
    expect(items.map((item) => item.key)).toEqual(['number:bp4410', 'description:oil filter', 'description:wiper blade']);
    // The unfiled 8.00 oil filter and 20.00 pads are not there.
    expect(items[1].prices.map((price) => price.unitPrice)).toEqual(['9.00']);
    expect(items[0].prices.map((price) => price.unitPrice)).toEqual(['30.00', '33.60', '31.26']);
  });

  it('refuses a minimum other than 1 or 2', async () => {
    const res = await owner.get(`/api/builds/${buildId}/price-history?minReceipts=3`);
    expect(res.status).toBe(400);
  });

  it("keeps another build's prices to that build", async () => {
    const res = await owner.get(`/api/builds/${otherBuildId}/price-history?minReceipts=1`);
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0].prices).toEqual([
      expect.objectContaining({ vendor: 'Fernhill Auto Spares', purchaseDate: '2026-02-01', unitPrice: '10.00' }),
    ]);
    // …and its 10.00 never became this build's lowest (checked exactly in the first test).
  });

  it('answers a reviewer, 404 to an outsider and 401 signed out', async () => {
    const reviewer = await joinByInvite(t, owner, buildId, 'reviewer', 'price-reviewer');
    const reviewed = await reviewer.client.get(`/api/builds/${buildId}/price-history`);
    expect(reviewed.status).toBe(200);
    expect(reviewed.body.items).toHaveLength(2);

    const outsider = (await signedUpClient(t.app, 'price-outsider')).client;
    const refused = await outsider.get(`/api/builds/${buildId}/price-history`);
    expect(refused.status).toBe(404);
    expect(refused.body.items).toBeUndefined();

    const anonymous = await new ApiClient(t.app).init();
    expect((await anonymous.get(`/api/builds/${buildId}/price-history`)).status).toBe(401);
  });
});
