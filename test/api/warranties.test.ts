// A part's warranty against the real PostgreSQL: set from the receipt's date, the end date, lifetime, removal, the
// field errors, a stale edit, another build's part and a reviewer refused; a refused edit changes nothing.
import { joinByInvite } from '../support/crew';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(90_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

interface PartSeen {
  id: string;
  version: number;
  warranty: number | 'lifetime' | null;
  warrantyStart: string | null;
  warrantyEnds: string | null;
  warrantyReceiptId: string | null;
}

async function buildWithPart(label: string) {
  const { client } = await signedUpClient(t.app, label);
  const buildId = (await client.post('/api/builds', NEW_BUILD)).body.id as string;
  const systems = (await client.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  const systemId = systems.find((system) => system.name === 'Cooling')!.id;
  const part = (await client.post(`/api/builds/${buildId}/parts`, { systemId, description: 'Water pump', quantity: '1', unit: 'each', estimatedUnitCost: '89.00' })).body as PartSeen;
  return { client, buildId, systemId, part, url: `/api/builds/${buildId}/parts/${part.id}` };
}

async function listed(client: ApiClient, buildId: string, partId: string): Promise<PartSeen> {
  return (await client.get(`/api/builds/${buildId}/parts`)).body.parts.find((part: PartSeen) => part.id === partId);
}

const warrantyOf = (part: PartSeen) => ({ warranty: part.warranty, warrantyStart: part.warrantyStart, warrantyEnds: part.warrantyEnds, warrantyReceiptId: part.warrantyReceiptId });
const NONE = { warranty: null, warrantyStart: null, warrantyEnds: null, warrantyReceiptId: null };

describe('a part\'s warranty', () => {
  it('starts on the date of the receipt whose line is on the part, and ends 12 months later', async () => {
    const { client, buildId, systemId, part, url } = await buildWithPart('warranty-set');
    expect(warrantyOf(part)).toEqual(NONE);
    // An older purchase of the same part, then the one the warranty rests on: the latest dated receipt is chosen.
    await filedReceipt(t, client, buildId, { vendorName: 'Ashgrove Motor Spares', purchaseDate: '2025-06-02', total: '80.00' }, [
      { kind: 'part', description: 'WATER PUMP', amount: '80.00', partId: part.id, systemId },
    ]);
    const receipt = await filedReceipt(t, client, buildId, { vendorName: 'Ashgrove Motor Spares', purchaseDate: '2026-03-14', total: '89.00' }, [
      { kind: 'part', description: 'WATER PUMP', amount: '89.00', partId: part.id, systemId },
    ]);
    const version = (await listed(client, buildId, part.id)).version;

    const res = await client.patch(url, { warranty: 12, version });
    expect(res.status).toBe(200);
    // 14 March 2026 + 12 months = 14 March 2027 (test/reference/month-arithmetic.test.ts checks the rule against moment).
    expect(warrantyOf(res.body)).toEqual({ warranty: 12, warrantyStart: '2026-03-14', warrantyEnds: '2027-03-14', warrantyReceiptId: receipt.id });
    expect(res.body.version).toBe(version + 1);
    // The list reads plain rows: the same fields.
    expect(warrantyOf(await listed(client, buildId, part.id))).toEqual(warrantyOf(res.body));
  });

  it('takes a start the person types, clamps the end to the month\'s end, holds lifetime, and is removed whole', async () => {
    const { client, buildId, part, url } = await buildWithPart('warranty-edit');
    // No receipt on the part: a length in months needs the start typed.
    const noStart = await client.patch(url, { warranty: 1, version: part.version });
    expect(noStart.status).toBe(400);
    expect(noStart.body.error.fields).toEqual({ warrantyStart: 'Enter the day the warranty starts, or choose the receipt it rests on (one with a date).' });

    const month = await client.patch(url, { warranty: 1, warrantyStart: '2026-01-31', version: part.version });
    expect(month.status).toBe(200);
    // 31 January 2026 + 1 month: February 2026 has 28 days.
    expect(warrantyOf(month.body)).toEqual({ warranty: 1, warrantyStart: '2026-01-31', warrantyEnds: '2026-02-28', warrantyReceiptId: null });

    const lifetime = await client.patch(url, { warranty: 'lifetime', version: month.body.version });
    expect(warrantyOf(lifetime.body)).toEqual({ warranty: 'lifetime', warrantyStart: '2026-01-31', warrantyEnds: null, warrantyReceiptId: null });
    expect(warrantyOf(await listed(client, buildId, part.id))).toEqual(warrantyOf(lifetime.body));

    // Only the start changes: the length stays.
    const moved = await client.patch(url, { warrantyStart: '2026-02-10', version: lifetime.body.version });
    expect(warrantyOf(moved.body)).toEqual({ warranty: 'lifetime', warrantyStart: '2026-02-10', warrantyEnds: null, warrantyReceiptId: null });

    const cleared = await client.patch(url, { warranty: null, version: moved.body.version });
    expect(cleared.status).toBe(200);
    expect(warrantyOf(cleared.body)).toEqual(NONE);
    expect(warrantyOf(await listed(client, buildId, part.id))).toEqual(NONE);
  });

  it('rests on a receipt the person names, of this build only, starting on its date', async () => {
    const { client, buildId, systemId, part, url } = await buildWithPart('warranty-receipt');
    const receipt = await filedReceipt(t, client, buildId, { vendorName: 'Ashgrove Motor Spares', purchaseDate: '2028-01-31', total: '12.00' }, [
      { kind: 'part', description: 'GASKET SET', amount: '12.00', systemId },
    ]);
    const named = await client.patch(url, { warranty: 1, warrantyReceiptId: receipt.id, version: part.version });
    // 31 January 2028 + 1 month: 2028 is a leap year, so 29 February.
    expect(warrantyOf(named.body)).toEqual({ warranty: 1, warrantyStart: '2028-01-31', warrantyEnds: '2028-02-29', warrantyReceiptId: receipt.id });

    const stranger = await buildWithPart('warranty-stranger');
    const theirs = await filedReceipt(t, stranger.client, stranger.buildId, { purchaseDate: '2026-05-05', total: '5.00' }, [
      { kind: 'part', description: 'CLIP', amount: '5.00', systemId: stranger.systemId },
    ]);
    const foreign = await client.patch(url, { warrantyReceiptId: theirs.id, version: named.body.version });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields).toEqual({ warrantyReceiptId: 'No such receipt on this build.' });
    expect(warrantyOf(await listed(client, buildId, part.id))).toEqual(warrantyOf(named.body));

    // Unlinked from its receipt, the warranty keeps its start and end.
    const unlinked = await client.patch(url, { warrantyReceiptId: null, version: named.body.version });
    expect(warrantyOf(unlinked.body)).toEqual({ warranty: 1, warrantyStart: '2028-01-31', warrantyEnds: '2028-02-29', warrantyReceiptId: null });
  });

  it.each([
    { body: { warranty: 0 }, field: 'warranty' },
    { body: { warranty: 1.5 }, field: 'warranty' },
    { body: { warranty: 1201 }, field: 'warranty' },
    { body: { warranty: 'forever' }, field: 'warranty' },
    { body: { warranty: '12' }, field: 'warranty' },
    { body: { warranty: 12, warrantyStart: '2026-02-30' }, field: 'warrantyStart' },
    { body: { warranty: 12, warrantyStart: '14/03/2026' }, field: 'warrantyStart' },
    { body: { warranty: 12, warrantyReceiptId: 'receipt-1' }, field: 'warrantyReceiptId' },
    { body: { warrantyStart: '2026-03-14' }, field: 'warranty' },
  ])('refuses $body naming $field, and changes nothing', async ({ body, field }) => {
    const { client, buildId, part, url } = await buildWithPart('warranty-invalid');
    const res = await client.patch(url, { ...body, version: part.version });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
    expect(res.body.error.fields[field]).toMatch(/\w+/);
    const after = await listed(client, buildId, part.id);
    expect(after.version).toBe(part.version);
    expect(warrantyOf(after)).toEqual(NONE);
  });

  it('words every wrong length the same plain way', async () => {
    const { client, part, url } = await buildWithPart('warranty-words');
    for (const warranty of [0, 1.5, 1201, 'forever', '12', true]) {
      const res = await client.patch(url, { warranty, version: part.version });
      expect(res.body.error.fields).toEqual({ warranty: 'Enter the warranty as whole months, from 1 to 1200, or "lifetime"; null removes it.' });
    }
  });

  it('answers 409 with the saved part to a stale edit, and keeps what was saved', async () => {
    const { client, buildId, part, url } = await buildWithPart('warranty-stale');
    const first = await client.patch(url, { warranty: 24, warrantyStart: '2026-03-14', version: part.version });
    expect(first.status).toBe(200);
    const stale = await client.patch(url, { warranty: 'lifetime', version: part.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(warrantyOf(stale.body.error.current)).toEqual({ warranty: 24, warrantyStart: '2026-03-14', warrantyEnds: '2028-03-14', warrantyReceiptId: null });
    expect(warrantyOf(await listed(client, buildId, part.id))).toEqual(warrantyOf(first.body));
  });

  it('lets crew set it; refuses a reviewer (403) and another build\'s member (404), changing nothing', async () => {
    const { client: owner, buildId, part, url } = await buildWithPart('warranty-roles');
    const crew = await joinByInvite(t, owner, buildId, 'crew', 'warranty-crew');
    const reviewer = await joinByInvite(t, owner, buildId, 'reviewer', 'warranty-reviewer');
    const byCrew = await crew.client.patch(url, { warranty: 6, warrantyStart: '2026-08-31', version: part.version });
    expect(byCrew.status).toBe(200);
    // 31 August + 6 months = 28 February 2027 (a common year).
    expect(byCrew.body.warrantyEnds).toBe('2027-02-28');

    const byReviewer = await reviewer.client.patch(url, { warranty: null, version: byCrew.body.version });
    expect(byReviewer.status).toBe(403);

    // The other build's owner, on this build's URL, and on their own build's URL with this part's id.
    const stranger = await buildWithPart('warranty-outsider');
    expect((await stranger.client.patch(url, { warranty: null, version: byCrew.body.version })).status).toBe(404);
    const crossed = await stranger.client.patch(`/api/builds/${stranger.buildId}/parts/${part.id}`, { warranty: null, version: byCrew.body.version });
    expect(crossed.status).toBe(404);
    expect(crossed.body.error.code).toBe('not_found');

    const after = await listed(owner, buildId, part.id);
    expect(after.version).toBe(byCrew.body.version);
    expect(warrantyOf(after)).toEqual({ warranty: 6, warrantyStart: '2026-08-31', warrantyEnds: '2027-02-28', warrantyReceiptId: null });
  });
});

describe('a warranty suggested by a receipt line', () => {
  it('shows on the lines being checked, and filing gives it to a part that has none, from the receipt\'s date', async () => {
    const { client, buildId, systemId, part: starter, url } = await buildWithPart('warranty-suggested');
    const add = async (description: string) =>
      (await client.post(`/api/builds/${buildId}/parts`, { systemId, description, quantity: '1', unit: 'each', estimatedUnitCost: '10.00' })).body as PartSeen;
    const fuelPump = await add('Fuel pump');
    const battery = await add('Battery');
    const hose = await add('Top hose');
    // The fuel pump already has a warranty a person set: it stands.
    const kept = await client.patch(`/api/builds/${buildId}/parts/${fuelPump.id}`, { warranty: 24, warrantyStart: '2026-01-05', version: fuelPump.version });
    expect(kept.status).toBe(200);

    const checking = await filedReceipt(t, client, buildId, { vendorName: 'Ashgrove Motor Spares', purchaseDate: '2026-03-14', total: '300.00' }, [
      { kind: 'part', description: 'STARTER MOTOR LIFETIME WARRANTY', amount: '120.00', partId: starter.id, systemId },
      { kind: 'part', description: 'FUEL PUMP 12 MONTH WARRANTY', amount: '90.00', partId: fuelPump.id, systemId },
      { kind: 'part', description: 'BATTERY 2 YR WARRANTY', amount: '80.00', partId: battery.id, systemId },
      { kind: 'part', description: 'TOP HOSE', amount: '8.00', partId: hose.id, systemId },
      { kind: 'fee', description: 'EXTENDED WARRANTY 12 MO', amount: '2.00' },
    ], { file: false });
    const suggestions = (await client.get(`/api/builds/${buildId}/receipts/${checking.id}`)).body.lines.map((line: { description: string; warrantySuggestion: unknown }) => [line.description, line.warrantySuggestion]);
    expect(suggestions).toEqual([
      ['STARTER MOTOR LIFETIME WARRANTY', 'lifetime'],
      ['FUEL PUMP 12 MONTH WARRANTY', 12],
      ['BATTERY 2 YR WARRANTY', 24],
      ['TOP HOSE', null],
      // A fee is not a part: nothing to put a warranty on.
      ['EXTENDED WARRANTY 12 MO', null],
    ]);
    // Checking alone changes no part.
    expect(warrantyOf(await listed(client, buildId, battery.id))).toEqual(NONE);

    const version = (await client.get(`/api/builds/${buildId}/receipts/${checking.id}`)).body.version;
    expect((await client.post(`/api/builds/${buildId}/receipts/${checking.id}/file`, { version })).status).toBe(200);
    expect(warrantyOf(await listed(client, buildId, starter.id))).toEqual({ warranty: 'lifetime', warrantyStart: '2026-03-14', warrantyEnds: null, warrantyReceiptId: checking.id });
    // 14 March 2026 + 24 months = 14 March 2028.
    expect(warrantyOf(await listed(client, buildId, battery.id))).toEqual({ warranty: 24, warrantyStart: '2026-03-14', warrantyEnds: '2028-03-14', warrantyReceiptId: checking.id });
    expect(warrantyOf(await listed(client, buildId, fuelPump.id))).toEqual({ warranty: 24, warrantyStart: '2026-01-05', warrantyEnds: '2028-01-05', warrantyReceiptId: null });
    expect(warrantyOf(await listed(client, buildId, hose.id))).toEqual(NONE);

    // The suggestion is the person's to change: the starter's becomes 36 months on the same receipt.
    const changed = await client.patch(url, { warranty: 36, version: (await listed(client, buildId, starter.id)).version });
    expect(warrantyOf(changed.body)).toEqual({ warranty: 36, warrantyStart: '2026-03-14', warrantyEnds: '2029-03-14', warrantyReceiptId: checking.id });
  });
});
