// Mail alerts against the real PostgreSQL and the fake SMTP server: each kind mails exactly once with exact figures,
// preferences and membership decide who gets what, and a second (or simultaneous) run sends nothing again.
import { Core } from '../../backend/src/receipts/core.entity';
import { Part } from '../../backend/src/parts/part.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { sendDueAlerts, type AlertDeps } from '../../backend/src/alerts/alerts.service';
import type { CaughtMail } from '../../backend/src/mail/fake-mail-server';
import { ApiClient, NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt, uploadSlip } from '../support/receipts';
import { alertDepsFor } from '../support/alert-deps';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(90_000);
let t: TestApp;
let deps: AlertDeps;
let closeMailer: () => void;

beforeAll(async () => {
  t = await startTestApp();
  ({ deps, close: closeMailer } = alertDepsFor(t));
});
afterAll(async () => {
  closeMailer();
  await t.close();
});

const ALL_OFF = { budget: false, coreDue: false, returnWindow: false, warrantyEnding: false, duplicate: false, reviewDigest: false };

function mailTo(email: string): CaughtMail[] {
  return t.mail.messages.filter((mail) => mail.to.includes(email.toLowerCase()));
}

async function join(owner: ApiClient, buildId: string, role: 'crew' | 'reviewer', label: string) {
  const person = await signedUpClient(t.app, label);
  await owner.post(`/api/builds/${buildId}/invites`, { email: person.email, role });
  const mail = await t.mail.waitFor((m) => m.to.includes(person.email) && m.subject.startsWith('Join'));
  await person.client.post(`/api/invites/${/\/invites\/([\w-]+)/.exec(mail.text)![1]}/accept`);
  return person;
}

async function newBuild(label: string) {
  const owner = await signedUpClient(t.app, label);
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const systems = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems as { id: string; name: string; version: number }[];
  return { owner, build, systems };
}

function put(client: ApiClient, buildId: string, body: object) {
  return client.send('put', `/api/builds/${buildId}/alert-preferences`, body);
}

/** A day in UTC as YYYY-MM-DD, n days after `from`. */
function day(from: Date, n: number): string {
  return new Date(from.getTime() + n * 86_400_000).toISOString().slice(0, 10);
}

describe('alert preferences', () => {
  it('gives each role its defaults, saves a member\'s own choice, names a bad field, and hides the build from outsiders', async () => {
    const { owner, build } = await newBuild('prefs-owner');
    const crew = await join(owner.client, build.id, 'crew', 'prefs-crew');
    const reviewer = await join(owner.client, build.id, 'reviewer', 'prefs-reviewer');
    const url = `/api/builds/${build.id}/alert-preferences`;

    // Defaults written in shared/api/alerts.ts: all on for the owner, money and deadlines for crew, the digest for reviewers.
    expect((await owner.client.get(url)).body).toEqual({ budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: true, reviewDigest: true, chosen: false });
    expect((await crew.client.get(url)).body).toEqual({ budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: false, reviewDigest: false, chosen: false });
    expect((await reviewer.client.get(url)).body).toEqual({ budget: false, coreDue: false, returnWindow: false, warrantyEnding: false, duplicate: false, reviewDigest: true, chosen: false });

    const saved = await put(reviewer.client, build.id, { ...ALL_OFF, budget: true });
    expect(saved.status).toBe(200);
    expect(saved.body).toEqual({ ...ALL_OFF, budget: true, chosen: true });
    expect((await reviewer.client.get(url)).body).toEqual({ ...ALL_OFF, budget: true, chosen: true });
    // Saved again: the one row is replaced, not added to.
    expect((await put(reviewer.client, build.id, { ...ALL_OFF, coreDue: true })).body).toEqual({ ...ALL_OFF, coreDue: true, chosen: true });
    // Each person's own: the owner's stay at the defaults.
    expect((await owner.client.get(url)).body.chosen).toBe(false);

    const wrongType = await put(crew.client, build.id, { ...ALL_OFF, budget: 'yes' });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.error.fields).toEqual({ budget: 'Choose on or off for "Budget reached".' });
    const { reviewDigest: _left, ...missing } = ALL_OFF;
    expect((await put(crew.client, build.id, missing)).body.error.fields).toEqual({ reviewDigest: 'Choose on or off for "Digest of filed receipts".' });
    expect((await put(crew.client, build.id, { ...ALL_OFF, sms: true })).body.error.fields).toEqual({ _: 'Unknown field: sms.' });

    const outsider = await signedUpClient(t.app, 'prefs-outsider');
    expect((await outsider.client.get(url)).status).toBe(404);
    expect((await put(outsider.client, build.id, ALL_OFF)).status).toBe(404);
    const anonymous = await new ApiClient(t.app).init();
    expect((await anonymous.get(url)).status).toBe(401);
    expect((await put(anonymous, build.id, ALL_OFF)).status).toBe(401);
  });

  it('keeps the return window on the build: 30 days by default, changed by the owner, checked', async () => {
    const { owner, build } = await newBuild('window-owner');
    expect(build.returnWindowDays).toBe(30);
    const changed = await owner.client.patch(`/api/builds/${build.id}`, { returnWindowDays: 14, version: build.version });
    expect(changed.status).toBe(200);
    expect(changed.body.returnWindowDays).toBe(14);
    expect((await owner.client.get(`/api/builds/${build.id}`)).body.returnWindowDays).toBe(14);
    const negative = await owner.client.patch(`/api/builds/${build.id}`, { returnWindowDays: -1, version: changed.body.version });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields).toEqual({ returnWindowDays: 'The return window cannot be negative.' });
    expect((await owner.client.patch(`/api/builds/${build.id}`, { returnWindowDays: 2.5, version: changed.body.version })).body.error.fields).toEqual({
      returnWindowDays: 'Enter the return window as a whole number of days.',
    });
  });
});

describe('sending alerts', () => {
  it('mails 90 % and then 100 % of a system budget once each, to the members who want it and are still members', async () => {
    const { owner, build, systems } = await newBuild('budget-owner');
    const cooling = systems.find((system) => system.name === 'Cooling')!;
    await owner.client.patch(`/api/builds/${build.id}/systems/${cooling.id}`, { budget: '1000.00', version: cooling.version });
    const crew = await join(owner.client, build.id, 'crew', 'budget-crew');
    const quietCrew = await join(owner.client, build.id, 'crew', 'budget-quiet');
    const reviewer = await join(owner.client, build.id, 'reviewer', 'budget-reviewer');
    await put(owner.client, build.id, { ...ALL_OFF, budget: true });
    await put(quietCrew.client, build.id, { budget: false, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: false, reviewDigest: false });
    const budgetMail = (email: string) => mailTo(email).filter((mail) => mail.subject.startsWith('Cooling'));

    // 899.90 of 1000.00 is 89.99 %: below the 90 % mark, nothing is sent.
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Brightwater Radiator Works', purchaseDate: '2026-11-03', total: '899.90' }, [
      { kind: 'part', description: 'Aluminium radiator', amount: '899.90', systemId: cooling.id },
    ]);
    await sendDueAlerts(deps, new Date());
    expect(budgetMail(owner.email)).toEqual([]);

    // 899.90 + 0.10 = 900.00, exactly 90 % of 1000.00: the 90 % mail, to the owner and the crew member who kept it on.
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Brightwater Radiator Works', purchaseDate: '2026-11-04', total: '0.10' }, [
      { kind: 'part', description: 'Hose clamp', amount: '0.10', systemId: cooling.id },
    ]);
    await sendDueAlerts(deps, new Date());
    for (const person of [owner, crew]) {
      const mails = budgetMail(person.email);
      expect(mails.map((mail) => mail.subject)).toEqual(['Cooling has used 90 % of its budget on "Test coupé"']);
      expect(mails[0].text).toContain('Cooling on "Test coupé" has cost $900.00 so far, against a budget of $1,000.00 (90 %).');
      expect(mails[0].text).toContain(`Open the ledger: ${t.url}/builds/${build.id}/ledger`);
      expect(mails[0].text).toContain(`Choose which alerts you get: ${t.url}/builds/${build.id}/alerts`);
      expect(mails[0].html).toContain('has cost $900.00 so far');
    }
    expect(budgetMail(quietCrew.email)).toEqual([]);
    expect(budgetMail(reviewer.email)).toEqual([]);

    // The same state again: nothing new.
    await sendDueAlerts(deps, new Date());
    expect(budgetMail(owner.email)).toHaveLength(1);
    expect(budgetMail(crew.email)).toHaveLength(1);

    // The crew member leaves; then 900.00 + 100.01 = 1000.01, past 100 % (100.001 %, shown rounded down as 100 %).
    expect((await crew.client.delete(`/api/builds/${build.id}/members/${crew.userId}`)).status).toBe(204);
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Brightwater Radiator Works', purchaseDate: '2026-11-05', total: '100.01' }, [
      { kind: 'part', description: 'Fan shroud', amount: '100.01', systemId: cooling.id },
    ]);
    await sendDueAlerts(deps, new Date());
    await sendDueAlerts(deps, new Date());
    const ownerMails = budgetMail(owner.email);
    expect(ownerMails.map((mail) => mail.subject)).toEqual([
      'Cooling has used 90 % of its budget on "Test coupé"',
      'Cooling has used all of its budget on "Test coupé"',
    ]);
    expect(ownerMails[1].text).toContain('Cooling on "Test coupé" has cost $1,000.01 so far, against a budget of $1,000.00 (100 %).');
    expect(budgetMail(crew.email)).toHaveLength(1);
  });

  it('jumps straight past 100 %: one mail, the 100 % one; a system with no budget sends nothing', async () => {
    const { owner, build, systems } = await newBuild('jump-owner');
    const [engine, wiring] = systems;
    await owner.client.patch(`/api/builds/${build.id}/systems/${engine.id}`, { budget: '50.00', version: engine.version });
    await put(owner.client, build.id, { ...ALL_OFF, budget: true });
    // Engine: 75.00 of 50.00 is 150 %. Wiring has budget 0: skipped, however much it costs.
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-03', total: '100.00' }, [
      { kind: 'part', description: 'Timing belt kit', amount: '75.00', systemId: engine.id },
      { kind: 'part', description: 'Relay', amount: '25.00', systemId: wiring.id },
    ]);
    await sendDueAlerts(deps, new Date());
    await sendDueAlerts(deps, new Date());
    const mails = mailTo(owner.email).filter((mail) => mail.subject.includes('budget'));
    expect(mails.map((mail) => mail.subject)).toEqual([`${engine.name} has used all of its budget on "Test coupé"`]);
    expect(mails[0].text).toContain(`${engine.name} on "Test coupé" has cost $75.00 so far, against a budget of $50.00 (150 %).`);
  });

  it('mails a core deposit due in 7 days, not in 8, once even when two runs go at the same time', async () => {
    const { owner, build, systems } = await newBuild('core-owner');
    await put(owner.client, build.id, { ...ALL_OFF, coreDue: true });
    const receipt = await filedReceipt(t, owner.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-20', total: '165.00' }, [
      { kind: 'part', description: 'Rebuilt alternator', amount: '120.00', systemId: systems[1].id },
      { kind: 'core_charge', description: 'Alternator core', amount: '45.00', systemId: systems[1].id },
    ]);
    const em = t.orm.em.fork();
    const core = await em.findOneOrFail(Core, { chargeLine: { receipt: receipt.id } });
    const now = new Date('2031-03-10T09:00:00Z');

    await em.nativeUpdate(Core, { id: core.id }, { dueDate: '2031-03-18' }); // 8 days after 2031-03-10
    await sendDueAlerts(deps, now);
    expect(mailTo(owner.email).filter((mail) => mail.subject.startsWith('Core'))).toEqual([]);

    await em.nativeUpdate(Core, { id: core.id }, { dueDate: '2031-03-17' }); // 7 days after
    await Promise.all([sendDueAlerts(deps, now), sendDueAlerts(deps, now)]);
    await sendDueAlerts(deps, now);
    const mails = mailTo(owner.email).filter((mail) => mail.subject.startsWith('Core'));
    expect(mails.map((mail) => mail.subject)).toEqual(['Core deposit of $45.00 due back by Mar 17, 2031: Alternator core']);
    expect(mails[0].text).toContain('The old part for "Alternator core" on "Test coupé" is due back to Harrow Lane Autoparts by Mar 17, 2031 (in 7 days).');
    expect(mails[0].text).toContain('Hand it in to get the core deposit of $45.00 refunded');
    expect(mails[0].html).toContain('core deposit of $45.00');

    // Handed in: no longer owed, so a later run has nothing to say even about a new due date.
    await em.nativeUpdate(Core, { id: core.id }, { state: 'dropped_off', dueDate: '2031-03-12' });
    await sendDueAlerts(deps, now);
    expect(mailTo(owner.email).filter((mail) => mail.subject.startsWith('Core'))).toHaveLength(1);
  });

  it('mails the parts whose return window closes within 7 days, one mail per receipt, skipping fitted parts', async () => {
    const { owner, build, systems } = await newBuild('return-owner');
    await put(owner.client, build.id, { ...ALL_OFF, returnWindow: true });
    const fuel = systems.find((system) => system.name === 'Fuel')!;
    const part = async (description: string) =>
      (await owner.client.post(`/api/builds/${build.id}/parts`, { systemId: fuel.id, description, quantity: '1', unit: 'each', estimatedUnitCost: '10.00' })).body.id as string;
    const pump = await part('In-tank fuel pump');
    const filter = await part('Fuel filter');
    const sender = await part('Fuel level sender');
    const regulator = await part('Pressure regulator');
    // Window of 30 days (the default). Today is 2031-03-10: 2031-02-15 + 30 days = 2031-03-17, 7 days away.
    const closing = await filedReceipt(t, owner.client, build.id, { vendorName: 'Kestrel Fuel Systems', purchaseDate: '2031-02-15', total: '150.50' }, [
      { kind: 'part', description: 'In-tank fuel pump', amount: '129.00', systemId: fuel.id, partId: pump },
      { kind: 'part', description: 'Fuel filter', amount: '21.50', systemId: fuel.id, partId: filter },
    ]);
    // 2031-02-16 + 30 = 2031-03-18, 8 days away: not yet.
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Kestrel Fuel Systems', purchaseDate: '2031-02-16', total: '44.00' }, [
      { kind: 'part', description: 'Fuel level sender', amount: '44.00', systemId: fuel.id, partId: sender },
    ]);
    // Closing too, but the regulator is fitted: nothing to return.
    await filedReceipt(t, owner.client, build.id, { vendorName: 'Kestrel Fuel Systems', purchaseDate: '2031-02-14', total: '60.00' }, [
      { kind: 'part', description: 'Pressure regulator', amount: '60.00', systemId: fuel.id, partId: regulator },
    ]);
    await t.orm.em.fork().nativeUpdate(Part, { id: regulator }, { status: 'installed' });

    const now = new Date('2031-03-10T09:00:00Z');
    await sendDueAlerts(deps, now);
    await sendDueAlerts(deps, now);
    const mails = mailTo(owner.email).filter((mail) => mail.subject.startsWith('Return window'));
    expect(mails.map((mail) => mail.subject)).toEqual(['Return window closes Mar 17, 2031: 2 parts from Kestrel Fuel Systems']);
    expect(mails[0].text).toContain('bought from Kestrel Fuel Systems on Feb 15, 2031, are not fitted yet and can be returned until Mar 17, 2031:');
    expect(mails[0].text).toContain('In-tank fuel pump: $129.00\n\nFuel filter: $21.50');
    expect(mails[0].text).not.toContain('Pressure regulator');
    expect(mails[0].text).toContain(`${t.url}/builds/${build.id}/receipts/${closing.id}`);

    // A day later the sender's window is 7 days away; the pump and filter were already announced.
    await sendDueAlerts(deps, new Date('2031-03-11T09:00:00Z'));
    const later = mailTo(owner.email).filter((mail) => mail.subject.startsWith('Return window'));
    expect(later.map((mail) => mail.subject)).toEqual([
      'Return window closes Mar 17, 2031: 2 parts from Kestrel Fuel Systems',
      'Return window closes Mar 18, 2031: 1 part from Kestrel Fuel Systems',
    ]);
    expect(later[1].text).toContain('Fuel level sender: $44.00');
  });

  it('mails a warranty ending within 30 days once per part, to owner and crew by default, even from two runs at once', async () => {
    const { owner, build, systems } = await newBuild('warranty-owner');
    const crew = await join(owner.client, build.id, 'crew', 'warranty-crew');
    const quietCrew = await join(owner.client, build.id, 'crew', 'warranty-quiet');
    const reviewer = await join(owner.client, build.id, 'reviewer', 'warranty-reviewer');
    await put(quietCrew.client, build.id, { ...ALL_OFF, budget: true });
    const cooling = systems.find((system) => system.name === 'Cooling')!;
    const part = async (description: string) =>
      (await owner.client.post(`/api/builds/${build.id}/parts`, { systemId: cooling.id, description, quantity: '1', unit: 'each', estimatedUnitCost: '10.00' })).body as { id: string; version: number };
    const pump = await part('Water pump');
    const fan = await part('Electric fan');
    const cap = await part('Radiator cap');
    const thermostat = await part('Thermostat');
    const sold = await part('Spare pump');
    const receipt = await filedReceipt(t, owner.client, build.id, { vendorName: 'Ashgrove Motor Spares', purchaseDate: '2030-03-14', total: '89.00' }, [
      { kind: 'part', description: 'WATER PUMP', amount: '89.00', systemId: cooling.id, partId: pump.id },
    ]);
    const warranty = async (of: { id: string }, body: object) => {
      const version = (await owner.client.get(`/api/builds/${build.id}/parts`)).body.parts.find((p: { id: string }) => p.id === of.id).version;
      const res = await owner.client.patch(`/api/builds/${build.id}/parts/${of.id}`, { ...body, version });
      expect(res.status).toBe(200);
      return res.body;
    };
    // 14 March 2030 + 12 months = 14 March 2031, from the receipt's date.
    expect((await warranty(pump, { warranty: 12 })).warrantyEnds).toBe('2031-03-14');
    // 31 January 2031 + 1 month = 28 February 2031; no receipt linked.
    expect((await warranty(fan, { warranty: 1, warrantyStart: '2031-01-31' })).warrantyEnds).toBe('2031-02-28');
    await warranty(cap, { warranty: 'lifetime', warrantyStart: '2030-01-01' });
    // Ended before the run: 2030-01-10 + 12 months = 2031-01-10.
    await warranty(thermostat, { warranty: 12, warrantyStart: '2030-01-10' });
    await warranty(sold, { warranty: 12, warrantyStart: '2030-03-01', status: 'sold' });
    const warrantyMails = (email: string) => mailTo(email).filter((mail) => mail.subject.startsWith('Warranty ends'));

    // 2031-02-11 + 30 days = 2031-03-13: the pump's end (14 March) is 31 days away, the fan's 17.
    await sendDueAlerts(deps, new Date('2031-02-11T09:00:00Z'));
    expect(warrantyMails(owner.email).map((mail) => mail.subject)).toEqual(['Warranty ends Feb 28, 2031: Electric fan']);
    expect(warrantyMails(owner.email)[0].text).toContain('The 1-month warranty on "Electric fan" on "Test coupé" ends on Feb 28, 2031 (in 17 days).');
    expect(warrantyMails(owner.email)[0].text).toContain('No receipt is linked to it');
    expect(warrantyMails(owner.email)[0].text).toContain(`Open the parts: ${t.url}/builds/${build.id}/parts`);

    // 2031-02-12 + 30 days = 2031-03-14: the pump's last day is now within the window. Two runs at once, then a third.
    const now = new Date('2031-02-12T09:00:00Z');
    await Promise.all([sendDueAlerts(deps, now), sendDueAlerts(deps, now)]);
    await sendDueAlerts(deps, now);
    for (const person of [owner, crew]) {
      const mails = warrantyMails(person.email);
      expect(mails.map((mail) => mail.subject)).toEqual(['Warranty ends Feb 28, 2031: Electric fan', 'Warranty ends Mar 14, 2031: Water pump']);
      expect(mails[1].text).toContain('The 12-month warranty on "Water pump" on "Test coupé" ends on Mar 14, 2031 (in 30 days).');
      expect(mails[1].text).toContain('It rests on the receipt from Ashgrove Motor Spares of Mar 14, 2030.');
      expect(mails[1].text).toContain(`Open the receipt: ${t.url}/builds/${build.id}/receipts/${receipt.id}`);
    }
    expect(warrantyMails(quietCrew.email)).toEqual([]);
    expect(warrantyMails(reviewer.email)).toEqual([]);

    // Later runs, up to the end day itself: nothing new; lifetime, ended and sold parts never mail.
    await sendDueAlerts(deps, new Date('2031-03-14T09:00:00Z'));
    expect(warrantyMails(owner.email)).toHaveLength(2);
    expect(t.mail.messages.filter((mail) => /Radiator cap|Thermostat|Spare pump/.test(mail.subject))).toEqual([]);
  });

  it('mails a likely duplicate receipt once: the same document, or the same shop, date and total', async () => {
    const { owner, build, systems } = await newBuild('dup-owner');
    await put(owner.client, build.id, { ...ALL_OFF, duplicate: true });
    const crew = await join(owner.client, build.id, 'crew', 'dup-crew');
    await put(crew.client, build.id, { ...ALL_OFF, duplicate: true });
    const first = await filedReceipt(t, owner.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-07', total: '38.40' }, [
      { kind: 'part', description: 'Brake fluid', amount: '38.40', systemId: systems[0].id },
    ]);
    const duplicateMails = (email: string) => mailTo(email).filter((mail) => mail.subject.startsWith('Possible duplicate'));
    await sendDueAlerts(deps, new Date());
    expect(duplicateMails(owner.email)).toEqual([]);

    // The same photo uploaded again (the same sha256), read and waiting to be checked.
    const again = (await uploadSlip(owner.client, build.id)).body.receipts[0].id as string;
    await t.orm.em.fork().nativeUpdate(Receipt, { id: again }, { state: 'to_check' });
    await sendDueAlerts(deps, new Date());
    await sendDueAlerts(deps, new Date());
    expect(duplicateMails(owner.email).map((mail) => mail.subject)).toEqual(['Possible duplicate receipt on "Test coupé": The receipt from an unknown shop']);
    expect(duplicateMails(owner.email)[0].text).toContain('The receipt from an unknown shop has the same document as another receipt on "Test coupé".');
    expect(duplicateMails(owner.email)[0].text).toContain(`${t.url}/builds/${build.id}/receipts/${again}`);
    expect(duplicateMails(crew.email)).toHaveLength(1);

    // A different photo of the same purchase: same shop, date and total as the first.
    const retyped = await filedReceipt(t, owner.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-07', total: '38.40' }, [
      { kind: 'part', description: 'Brake fluid', amount: '38.40', systemId: systems[0].id },
    ], { file: false });
    await t.orm.em.fork().nativeUpdate(Receipt, { id: retyped.id }, { sha256: 'f'.repeat(64) });
    await sendDueAlerts(deps, new Date());
    expect(duplicateMails(owner.email).map((mail) => mail.subject)).toEqual([
      'Possible duplicate receipt on "Test coupé": The receipt from an unknown shop',
      'Possible duplicate receipt on "Test coupé": The receipt from Harrow Lane Autoparts of Nov 7, 2026 (total $38.40)',
    ]);
    expect(duplicateMails(owner.email)[1].text).toContain('has the same shop, date and total as another receipt on "Test coupé".');
    expect(first.id).not.toBe(retyped.id);
  });

  it('sends a reviewer digest of exactly the receipts filed since the last one, and none when nothing was filed', async () => {
    const { owner, build, systems } = await newBuild('digest-owner');
    await put(owner.client, build.id, ALL_OFF);
    const crew = await join(owner.client, build.id, 'crew', 'digest-crew');
    const reviewer = await join(owner.client, build.id, 'reviewer', 'digest-reviewer');
    const digests = (email: string) => mailTo(email).filter((mail) => mail.subject.startsWith('Digest'));

    await sendDueAlerts(deps, new Date());
    expect(digests(reviewer.email)).toEqual([]);

    await filedReceipt(t, crew.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-07', total: '12.00' }, [
      { kind: 'part', description: 'Gasket', amount: '12.00', systemId: systems[0].id },
    ]);
    await filedReceipt(t, crew.client, build.id, { vendorName: 'Kestrel Fuel Systems', purchaseDate: '2026-11-08', total: '80.25' }, [
      { kind: 'part', description: 'Gauge', amount: '80.25', systemId: systems[0].id },
    ]);
    // Not filed: not in a digest.
    await filedReceipt(t, crew.client, build.id, { vendorName: 'Harrow Lane Autoparts', purchaseDate: '2026-11-09', total: '5.00' }, [
      { kind: 'part', description: 'Fuse', amount: '5.00', systemId: systems[0].id },
    ], { file: false });

    const firstRun = new Date();
    await Promise.all([sendDueAlerts(deps, firstRun), sendDueAlerts(deps, firstRun)]);
    await sendDueAlerts(deps, firstRun);
    expect(digests(reviewer.email).map((mail) => mail.subject)).toEqual(['Digest: 2 receipts filed on "Test coupé"']);
    const first = digests(reviewer.email)[0].text;
    // 12.00 + 80.25 = 92.25
    expect(first).toContain('Nov 7, 2026, Harrow Lane Autoparts: $12.00\n\nNov 8, 2026, Kestrel Fuel Systems: $80.25\n\nTotal: $92.25 (USD)');
    expect(first).not.toContain('$5.00');
    expect(digests(crew.email)).toEqual([]);
    expect(digests(owner.email)).toEqual([]);
    expect(first).toContain(`Open the review queue: ${t.url}/builds/${build.id}/review`);

    await filedReceipt(t, crew.client, build.id, { vendorName: 'Kestrel Fuel Systems', purchaseDate: '2026-11-10', total: '7.35' }, [
      { kind: 'part', description: 'Hose', amount: '7.35', systemId: systems[0].id },
    ]);
    const nextDay = new Date(firstRun.getTime() + 86_400_000);
    await sendDueAlerts(deps, nextDay);
    expect(digests(reviewer.email).map((mail) => mail.subject)).toEqual(['Digest: 2 receipts filed on "Test coupé"', 'Digest: 1 receipt filed on "Test coupé"']);
    const second = digests(reviewer.email)[1].text;
    expect(second).toContain('Nov 10, 2026, Kestrel Fuel Systems: $7.35\n\nTotal: $7.35 (USD)');
    expect(second).not.toContain('Gasket');
    expect(second).not.toContain('$12.00');

    // The day after: nothing filed since, so no digest.
    await sendDueAlerts(deps, new Date(firstRun.getTime() + 2 * 86_400_000));
    expect(digests(reviewer.email)).toHaveLength(2);
    expect(day(firstRun, 1)).toBe(nextDay.toISOString().slice(0, 10));
  });
});
