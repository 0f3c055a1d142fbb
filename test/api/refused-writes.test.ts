// A refused request changes nothing: for every write route, a request the server refuses (400, 403, 404, 409)
// leaves every row of the build exactly as it was, compared as a dump of the rows before and after.
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { dumpBuild } from '../support/build-dump';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);

let t: TestApp;
let owner: ApiClient;
let buildId: string;
let otherBuildLineId: string;
let otherBuildPartId: string;
let otherBuildReceiptId: string;
let systemId: string;
let part: { id: string; version: number };
let open: { id: string; version: number; lines: { id: string; version: number }[] };
let filed: { id: string; version: number; lines: { id: string; version: number }[] };
let core: { id: string; version: number };
let ownerId: string;

const FIFTEEN_NINES = '999999999999999';

beforeAll(async () => {
  t = await startTestApp();
  const signedUp = await signedUpClient(t.app, 'refused');
  owner = signedUp.client;
  ownerId = signedUp.userId;
  buildId = (await owner.post('/api/builds', NEW_BUILD)).body.id;
  const systems = (await owner.get(`/api/builds/${buildId}/systems`)).body.systems as { id: string; name: string }[];
  systemId = systems.find((s) => s.name === 'Cooling')!.id;
  part = (await owner.post(`/api/builds/${buildId}/parts`, { systemId, description: 'Radiator', quantity: '1', unit: 'each', estimatedUnitCost: '210.00' })).body;
  open = await filedReceipt(t, owner, buildId, { total: '30.00' }, [
    { kind: 'part', description: 'HOSE CLAMP', amount: '10.00', systemId },
    { kind: 'part', description: 'COOLANT', amount: '20.00', systemId },
  ], { file: false });
  filed = await filedReceipt(t, owner, buildId, { purchaseDate: '2026-03-02', total: '122.00' }, [
    { kind: 'part', description: 'RADIATOR', amount: '100.00', partId: part.id },
    { kind: 'core_charge', description: 'CORE', amount: '22.00', systemId },
  ]);
  core = (await owner.get(`/api/builds/${buildId}/cores`)).body.cores[0];

  // Another build of another person: its line and part are not this build's to touch.
  const stranger = await signedUpClient(t.app, 'stranger');
  const otherBuild = (await stranger.client.post('/api/builds', NEW_BUILD)).body.id as string;
  const otherSystem = (await stranger.client.get(`/api/builds/${otherBuild}/systems`)).body.systems[0].id as string;
  otherBuildPartId = (await stranger.client.post(`/api/builds/${otherBuild}/parts`, { systemId: otherSystem, description: 'Pump', quantity: '1', unit: 'each', estimatedUnitCost: '5.00' })).body.id;
  const theirs = await filedReceipt(t, stranger.client, otherBuild, { total: '5.00' }, [{ kind: 'part', description: 'PUMP', amount: '5.00', systemId: otherSystem }], { file: false });
  otherBuildLineId = theirs.lines[0].id;
  otherBuildReceiptId = theirs.id;
});

afterAll(() => t.close());

type Refusal = [name: string, status: number, send: () => Promise<{ status: number; body: { error?: { fields?: Record<string, string> } } }>, field?: string];
// Rows are passed whole (a test function of four parameters would be given jest's `done` for a missing fourth).

const base = () => `/api/builds/${buildId}`;
// Each refusal sends the versions saved now, so it is refused for the reason it names, not as a stale edit.
const partVersion = async () => (await owner.get(`${base()}/parts`)).body.parts.find((p: { id: string }) => p.id === part.id).version as number;
const receiptNow = async (id: string) => (await owner.get(`${base()}/receipts/${id}`)).body as { version: number; lines: { id: string; version: number }[] };
const buildVersion = async () => (await owner.get(base())).body.version as number;
const systemVersion = async () => (await owner.get(`${base()}/systems`)).body.systems.find((s: { id: string }) => s.id === systemId).version as number;
const refusals: Refusal[] = [
  ['PATCH build with an empty name', 400, async () => owner.patch(base(), { name: '', version: await buildVersion() }), 'name'],
  ['POST system without a name', 400, async () => owner.post(`${base()}/systems`, { name: ' ' }), 'name'],
  ['PATCH system with a bad budget', 400, async () => owner.patch(`${base()}/systems/${systemId}`, { budget: '12,50', version: await systemVersion() }), 'budget'],
  ['PUT contingency that is not an amount', 400, async () => owner.send('put', `${base()}/contingency`, { contingencyBudget: 'lots', version: 1 }), 'contingencyBudget'],
  ['POST part whose quantity × unit cost overflows', 400, async () => owner.post(`${base()}/parts`, { systemId, description: 'Huge', quantity: FIFTEEN_NINES, unit: 'each', estimatedUnitCost: FIFTEEN_NINES }), 'estimatedUnitCost'],
  ['PATCH part whose quantity × unit cost overflows', 400, async () => owner.patch(`${base()}/parts/${part.id}`, { quantity: FIFTEEN_NINES, estimatedUnitCost: FIFTEEN_NINES, version: await partVersion() }), 'estimatedUnitCost'],
  ['PATCH part to a system of another build', 400, async () => owner.patch(`${base()}/parts/${part.id}`, { description: 'Renamed', systemId: otherBuildPartId, version: await partVersion() }), 'systemId'],
  ['PATCH part warranty of 0 months', 400, async () => owner.patch(`${base()}/parts/${part.id}`, { warranty: 0, version: await partVersion() }), 'warranty'],
  ['PATCH part warranty resting on a receipt of another build', 400, async () => owner.patch(`${base()}/parts/${part.id}`, { description: 'Renamed', warranty: 12, warrantyReceiptId: otherBuildReceiptId, version: await partVersion() }), 'warrantyReceiptId'],
  ['PATCH part warranty start without a length', 400, async () => owner.patch(`${base()}/parts/${part.id}`, { warrantyStart: '2026-03-02', version: await partVersion() }), 'warranty'],
  ['DELETE a part of another build', 404, async () => owner.delete(`${base()}/parts/${otherBuildPartId}`)],
  ['POST bulk status with a part of another build', 404, async () => owner.post(`${base()}/parts/bulk`, { action: 'status', partIds: [part.id, otherBuildPartId], status: 'ordered' })],
  ['POST line returning a line of another build', 400, async () => owner.post(`${base()}/receipts/${open.id}/lines`, { kind: 'return', description: 'BACK', amount: '-5.00', returnOfLineId: otherBuildLineId }), 'returnOfLineId'],
  ['PATCH line amount with a line of another build to return', 400, async () => owner.patch(`${base()}/receipts/${open.id}/lines/${open.lines[0].id}`, { amount: '11.00', returnOfLineId: otherBuildLineId, version: (await receiptNow(open.id)).lines[0].version }), 'returnOfLineId'],
  ['PATCH line with a new part and a line of another build to return', 400, async () => owner.patch(`${base()}/receipts/${open.id}/lines/${open.lines[0].id}`, { newPart: { systemId }, returnOfLineId: otherBuildLineId, version: (await receiptNow(open.id)).lines[0].version }), 'returnOfLineId'],
  ['PATCH line whose quantity × unit price overflows', 400, async () => owner.patch(`${base()}/receipts/${open.id}/lines/${open.lines[0].id}`, { quantity: FIFTEEN_NINES, unitPrice: FIFTEEN_NINES, version: (await receiptNow(open.id)).lines[0].version }), 'quantity'],
  ['POST line whose quantity × unit price overflows', 400, async () => owner.post(`${base()}/receipts/${open.id}/lines`, { kind: 'part', description: 'BIG', amount: '1.00', quantity: FIFTEEN_NINES, unitPrice: FIFTEEN_NINES }), 'unitPrice'],
  ['POST split whose shares do not add up', 400, async () => owner.post(`${base()}/receipts/${open.id}/lines/${open.lines[1].id}/split`, { version: (await receiptNow(open.id)).lines[1].version, shares: [{ amount: '5.00', systemId }, { amount: '5.00', systemId }] }), 'shares'],
  ['POST merge of lines of two receipts', 404, async () => owner.post(`${base()}/receipts/${open.id}/lines/merge`, { lineIds: [open.lines[0].id, filed.lines[0].id] })],
  ['PATCH receipt total with three decimals', 400, async () => owner.patch(`${base()}/receipts/${open.id}`, { total: '30.001', version: (await receiptNow(open.id)).version }), 'total'],
  ['POST file of a receipt without a date', 400, async () => owner.post(`${base()}/receipts/${open.id}/file`, { version: (await receiptNow(open.id)).version }), 'purchaseDate'],
  ['POST reopen of a receipt that is not filed', 400, async () => owner.post(`${base()}/receipts/${open.id}/reopen`, {}), 'state'],
  ['PATCH header of a filed receipt', 409, async () => owner.patch(`${base()}/receipts/${filed.id}`, { total: '1.00', version: (await receiptNow(filed.id)).version })],
  ['POST line on a filed receipt', 409, async () => owner.post(`${base()}/receipts/${filed.id}/lines`, { kind: 'fee', description: 'FEE', amount: '1.00' })],
  ['PATCH line of a filed receipt', 409, async () => owner.patch(`${base()}/receipts/${filed.id}/lines/${filed.lines[0].id}`, { amount: '1.00', version: filed.lines[0].version })],
  ['DELETE line of a filed receipt', 409, async () => owner.delete(`${base()}/receipts/${filed.id}/lines/${filed.lines[1].id}`)],
  ['POST split of a filed line', 409, async () => owner.post(`${base()}/receipts/${filed.id}/lines/${filed.lines[0].id}/split`, { version: filed.lines[0].version, shares: [{ amount: '50.00', systemId }, { amount: '50.00', systemId }] })],
  ['POST merge on a filed receipt', 409, async () => owner.post(`${base()}/receipts/${filed.id}/lines/merge`, { lineIds: filed.lines.map((l) => l.id) })],
  ['POST accept suggestions naming a line of another build', 404, async () => owner.post(`${base()}/receipts/${open.id}/suggestions/accept`, { lineIds: [open.lines[0].id, otherBuildLineId] })],
  ['POST accept suggestions naming something not a line', 400, async () => owner.post(`${base()}/receipts/${open.id}/suggestions/accept`, { lineIds: ['HOSE CLAMP'] }), 'lineIds.0'],
  ['POST accept suggestions on a filed receipt', 409, async () => owner.post(`${base()}/receipts/${filed.id}/suggestions/accept`, {})],
  ['PATCH core with a stale version', 409, async () => owner.patch(`${base()}/cores/${core.id}`, { state: 'dropped_off', version: core.version + 5 })],
  ['POST review of a receipt not filed', 400, async () => owner.post(`${base()}/receipts/${open.id}/review`, { decision: 'approved' })],
  ['POST empty comment', 400, async () => owner.post(`${base()}/receipts/${filed.id}/comments`, { body: '  ' }), 'body'],
  ['POST not-duplicate without a reason', 400, async () => owner.post(`${base()}/receipts/${open.id}/not-duplicate`, { otherReceiptId: filed.id, reason: ' ' }), 'reason'],
  ['POST not-duplicate of a receipt with itself', 400, async () => owner.post(`${base()}/receipts/${open.id}/not-duplicate`, { otherReceiptId: open.id, reason: 'Same.' }), 'otherReceiptId'],
  ['POST invite to a bad address', 400, async () => owner.post(`${base()}/invites`, { email: 'not an address', role: 'crew' }), 'email'],
  ['PATCH the only owner down to crew', 409, async () => owner.patch(`${base()}/members/${ownerId}`, { role: 'crew' })],
  ['PUT alert choices with an unknown kind', 400, async () => owner.send('put', `${base()}/alert-preferences`, { budget: true, nonsense: true })],
];

describe('a refused request leaves the build exactly as it was', () => {
  it.each(refusals.map((refusal) => ({ refusal })))('$refusal.0', async ({ refusal: [, status, send, field] }) => {
    const before = await dumpBuild(t.orm, buildId);
    const res = await send();
    expect(res.status).toBe(status);
    if (field) expect(res.body.error?.fields?.[field]).toEqual(expect.any(String));
    expect(await dumpBuild(t.orm, buildId)).toBe(before);
  });

  it('the dump does see a change that is accepted (the comparison can fail)', async () => {
    const before = await dumpBuild(t.orm, buildId);
    const res = await owner.post(`${base()}/receipts/${filed.id}/comments`, { body: 'Checked the core tag.' });
    expect(res.status).toBe(201);
    expect(await dumpBuild(t.orm, buildId)).not.toBe(before);
  });
});
