// Line suggestions against the real PostgreSQL (pg_trgm): each source's first suggestion and reason, a correction
// remembered for the next receipt, "accept all" (threshold, assigned lines skipped, audited), and the refusals.
import { AuditEvent } from '../../backend/src/audit/audit-event.entity';
import { User } from '../../backend/src/auth/user.entity';
import { Build } from '../../backend/src/builds/build.entity';
import { Membership } from '../../backend/src/builds/membership.entity';
import { dumpBuild } from '../support/build-dump';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);

let t: TestApp;
let owner: ApiClient;
let crew: ApiClient;
let reviewer: ApiClient;
let outsider: ApiClient;
let buildId: string;
const systems: Record<string, string> = {};
const parts: Record<string, string> = {};
const SHOP = 'Brackenridge Motor Supply';

interface Line {
  id: string;
  description: string;
  partId: string | null;
  systemId: string | null;
  version: number;
}

beforeAll(async () => {
  t = await startTestApp();
  const people = await Promise.all(['sg-owner', 'sg-crew', 'sg-reviewer', 'sg-outsider'].map((label) => signedUpClient(t.app, label)));
  [owner, crew, reviewer, outsider] = people.map((person) => person.client);
  buildId = (await owner.post('/api/builds', NEW_BUILD)).body.id;
  const em = t.orm.em.fork();
  for (const [person, role] of [[people[1], 'crew'], [people[2], 'reviewer']] as const) {
    em.create(Membership, { build: em.getReference(Build, buildId), user: em.getReference(User, person.userId), role });
  }
  await em.flush();
  for (const system of (await owner.get(`/api/builds/${buildId}/systems`)).body.systems) systems[system.name] = system.id;
  const bill = [
    ['Cooling', 'Electric water pump, 12 V', '44-120'],
    ['Cooling', 'Radiator hose kit', 'RH-9'],
    ['Engine', 'Alternator, 90 A', 'ALT-90'],
  ];
  for (const [system, description, partNumber] of bill) {
    const res = await owner.post(`/api/builds/${buildId}/parts`, { systemId: systems[system], description, partNumber, quantity: '1', unit: 'each', estimatedUnitCost: '10.00' });
    parts[description] = res.body.id;
  }
});
afterAll(() => t.close());

const url = (receiptId: string, rest = '') => `/api/builds/${buildId}/receipts/${receiptId}${rest}`;

/** A read receipt from the shop, not filed; lines are parts unless a kind is given. */
async function receiptWith(date: string, lines: object[], options: { file?: boolean } = {}) {
  const total = lines.reduce((cents: number, line) => cents + Math.round(Number((line as { amount: string }).amount) * 100), 0);
  const body = await filedReceipt(t, owner, buildId, { vendorName: SHOP, purchaseDate: date, total: (total / 100).toFixed(2) }, lines.map((line) => ({ kind: 'part', ...line })), { file: options.file ?? false });
  return { id: body.id as string, lines: body.lines as Line[] };
}

async function suggestionsOf(receiptId: string, client = owner) {
  const res = await client.get(url(receiptId, '/suggestions'));
  expect(res.status).toBe(200);
  return res.body as { threshold: number; lines: { lineId: string; suggestions: { partId: string | null; systemName: string; score: number; source: string; reason: string }[] }[] };
}

describe('each source, best first, with the reason', () => {
  let receipt: { id: string; lines: Line[] };
  let found: Awaited<ReturnType<typeof suggestionsOf>>;
  beforeAll(async () => {
    receipt = await receiptWith('2026-03-12', [
      { description: 'KQZ UNIT', partNumber: '44 120', amount: '180.00' },
      { description: 'Radiator hose kit', amount: '40.00' },
      { description: 'Thermostat 82C', amount: '12.00' },
      { description: 'Shop fee', kind: 'fee', amount: '3.00' },
    ]);
    found = await suggestionsOf(receipt.id);
  });

  it('lists every line that takes an assignment, not the fee, with the threshold', () => {
    expect(found.threshold).toBe(0.6);
    expect(found.lines.map((line) => line.lineId)).toEqual(receipt.lines.slice(0, 3).map((line) => line.id));
  });

  it('puts the part whose part number matches (spaces, dashes and case aside) first', () => {
    const [first] = found.lines[0].suggestions;
    expect(first).toMatchObject({ partId: parts['Electric water pump, 12 V'], systemName: 'Cooling', source: 'part-number', reason: 'part number 44-120 is on the bill of materials as Electric water pump, 12 V' });
    // No trigram in common with the part's name: the bottom of the part-number band (suggestion-scores.ts).
    expect(first.score).toBe(0.9);
  });

  it('finds a part by a similar description (pg_trgm)', () => {
    // Identical text: similarity and word similarity are both 1, so 0.30 + 0.40 × 1.
    expect(found.lines[1].suggestions[0]).toEqual({ partId: parts['Radiator hose kit'], partName: 'Radiator hose kit', systemId: systems.Cooling, systemName: 'Cooling', score: 0.7, source: 'similar-description', reason: 'description is close to Radiator hose kit' });
  });

  it('falls back on a trade word for a system only', () => {
    expect(found.lines[2].suggestions).toEqual([{ partId: null, partName: null, systemId: systems.Cooling, systemName: 'Cooling', score: 0.3, source: 'trade-word', reason: '‘thermostat’ is a cooling word' }]);
  });
});

it('remembers a correction: the same shop’s same part number next time suggests what the person chose', async () => {
  const first = await receiptWith('2026-03-12', [{ description: 'Thermo housing seal', partNumber: 'TS-5', amount: '6.00' }]);
  const line = first.lines[0];
  expect((await owner.patch(url(first.id, `/lines/${line.id}`), { systemId: systems.Engine, version: line.version })).status).toBe(200);
  const next = await receiptWith('2026-04-02', [{ description: 'Thermo housing seal', partNumber: 'ts5', amount: '6.00' }]);
  const [top] = (await suggestionsOf(next.id, crew)).lines[0].suggestions;
  // Same text, part number and shop: a remembered choice, 0.99 + 0.01 × 1 (suggestion-scores.ts).
  expect(top).toEqual({ partId: null, partName: null, systemId: systems.Engine, systemName: 'Engine', score: 1, source: 'history', reason: `went to Engine on the 12 Mar 2026 receipt from ${SHOP}` });
});

it('remembers a correction over the bill of materials: the part chosen instead of the one whose number matches comes first', async () => {
  // RH-9 is the radiator hose kit's number; this shop's RH-9 is in fact a heater hose the person put on Interior.
  const first = await receiptWith('2026-03-20', [{ description: 'Heater hose 5/8', partNumber: 'RH-9', amount: '14.00' }]);
  const line = first.lines[0];
  expect((await suggestionsOf(first.id)).lines[0].suggestions[0]).toMatchObject({ partId: parts['Radiator hose kit'], source: 'part-number' });
  expect((await owner.patch(url(first.id, `/lines/${line.id}`), { partId: null, systemId: systems.Interior, version: line.version })).status).toBe(200);
  const next = await receiptWith('2026-04-18', [{ description: 'Heater hose 5/8', partNumber: 'RH-9', amount: '14.00' }]);
  const [top, second] = (await suggestionsOf(next.id)).lines[0].suggestions;
  expect([top.systemName, top.source, top.score]).toEqual(['Interior', 'history', 1]);
  expect([second.partId, second.source]).toEqual([parts['Radiator hose kit'], 'part-number']);
  // "Accept all" takes the remembered choice.
  const accepted = await owner.post(url(next.id, '/suggestions/accept'), {});
  expect(accepted.body.lines.map((saved: Line) => [saved.partId, saved.systemId])).toEqual([[null, systems.Interior]]);
});

describe('accept all', () => {
  it('takes each unassigned line’s top suggestion at or above the threshold, skips assigned lines, and audits each change', async () => {
    const receipt = await receiptWith('2026-05-20', [
      { description: 'Pump, electric', partNumber: '44.120', amount: '180.00' },
      { description: 'Thermostat 82C', amount: '12.00' },
      { description: 'Alternator reman', partNumber: 'ALT-90', amount: '150.00', systemId: systems.Body },
    ]);
    const res = await crew.post(url(receipt.id, '/suggestions/accept'), {});
    expect(res.status).toBe(200);
    expect(res.body.lines.map((line: Line) => [line.partId, line.systemId])).toEqual([
      [parts['Electric water pump, 12 V'], systems.Cooling],
      // A trade word (0.30) is below the threshold: left for a person.
      [null, null],
      // Assigned already (by hand, to Body): left alone, though its part number is on the bill of materials.
      [null, systems.Body],
    ]);
    const audits = await t.orm.em.fork().find(AuditEvent, { receiptId: receipt.id, entity: 'receipt_line', action: 'edit' });
    expect(audits.map((event) => [event.entityId, event.after?.partId])).toEqual([[receipt.lines[0].id, parts['Electric water pump, 12 V']]]);

    // Named, an assigned line moves to its top suggestion too.
    const named = await owner.post(url(receipt.id, '/suggestions/accept'), { lineIds: [receipt.lines[2].id] });
    expect(named.status).toBe(200);
    expect(named.body.lines[2]).toMatchObject({ partId: parts['Alternator, 90 A'], systemId: systems.Engine });
  });

  it('refuses a reviewer, a bad body, a line of another receipt, and a filed receipt, changing nothing', async () => {
    const other = await receiptWith('2026-05-21', [{ description: 'Pump, electric', partNumber: '44-120', amount: '180.00' }]);
    const open = await receiptWith('2026-05-22', [{ description: 'Pump, electric', partNumber: '44-120', amount: '180.00' }]);
    const filed = await receiptWith('2026-05-23', [{ description: 'Pump, electric', partNumber: '44-120', amount: '180.00', systemId: systems.Body }], { file: true });
    const before = await dumpBuild(t.orm, buildId);
    expect((await reviewer.post(url(open.id, '/suggestions/accept'), {})).status).toBe(403);
    const bad = await owner.post(url(open.id, '/suggestions/accept'), { lineIds: ['not-a-line'] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['lineIds.0']);
    expect((await owner.post(url(open.id, '/suggestions/accept'), { lineIds: [open.lines[0].id, other.lines[0].id] })).status).toBe(404);
    expect((await owner.post(url(filed.id, '/suggestions/accept'), { lineIds: [filed.lines[0].id] })).status).toBe(409);
    expect((await crew.post(url(filed.id, '/suggestions/accept'), {})).status).toBe(403);
    expect(await dumpBuild(t.orm, buildId)).toEqual(before);
  });
});

it('answers 404 to a non-member and for another build’s receipt', async () => {
  const receipt = await receiptWith('2026-06-01', [{ description: 'Radiator hose kit', amount: '40.00' }]);
  expect((await outsider.get(url(receipt.id, '/suggestions'))).status).toBe(404);
  expect((await outsider.post(url(receipt.id, '/suggestions/accept'), {})).status).toBe(404);
  const elsewhere = (await outsider.post('/api/builds', NEW_BUILD)).body.id;
  expect((await outsider.get(`/api/builds/${elsewhere}/receipts/${receipt.id}/suggestions`)).status).toBe(404);
  expect((await outsider.post(`/api/builds/${elsewhere}/receipts/${receipt.id}/suggestions/accept`, {})).status).toBe(404);
  expect((await reviewer.get(url(receipt.id, '/suggestions'))).status).toBe(200);
});
