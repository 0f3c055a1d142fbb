// One build, every place that shows its money: the ledger, the systems summary (Parts and Budgets), the lines behind a
// figure, the build sheet, the core list and the core-due mail must say the same figure, to the currency's minor
// unit. Run on a dollar build (2 decimals) and a yen build (0 decimals: ISO 4217 lists JPY with minor unit 0).
// The figures are worked by hand in the comments; the mail's amount is formatted by ECMA-402 Intl.NumberFormat.
import { Core } from '../../backend/src/receipts/core.entity';
import { sendDueAlerts, type AlertDeps } from '../../backend/src/alerts/alerts.service';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { filedReceipt } from '../support/receipts';
import { expectOneValuePerFigure } from '../support/same-figures';
import { alertDepsFor } from '../support/alert-deps';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);
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

interface Case {
  currency: string;
  /** Every amount the case types, and the figures worked from them by hand. */
  typed: { engineBudget: string; coolingBudget: string; contingency: string; pumpEstimate: string; part: string; core: string; coolant: string; tax: string; total: string };
  expected: { budgetWithContingency: string; planned: string; spent: string; engineNet: string; coolingNet: string; netCost: string; coreOutstanding: string; forecast: string };
  /** ISO 4217 minor unit: every figure on the wire is written to exactly this many decimals. */
  minorUnits: number;
}

const CASES: Case[] = [
  {
    // Tax 16.00 over the taxable 100 : 40 : 60 -> 8.00, 3.20, 4.80. Spent 216.00 (the printed total); the core deposit
    // 43.20 is still owed back, so it is not a cost: Engine net 108.00, Cooling 64.80, net cost 172.80. Budget
    // 200 + 50 + 25 = 275.00; planned 80.00 (the water pump, not bought); forecast 172.80 + 80.00 = 252.80.
    currency: 'USD',
    typed: { engineBudget: '200.00', coolingBudget: '50.00', contingency: '25.00', pumpEstimate: '80.00', part: '100.00', core: '40.00', coolant: '60.00', tax: '16.00', total: '216.00' },
    expected: { budgetWithContingency: '275.00', planned: '80.00', spent: '216.00', engineNet: '108.00', coolingNet: '64.80', netCost: '172.80', coreOutstanding: '43.20', forecast: '252.80' },
    minorUnits: 2,
  },
  {
    // Tax 2,000 over 10,000 : 4,000 : 6,000 -> 1,000, 400, 600. Spent 22,000; core outstanding 4,400; Engine net
    // 11,000, Cooling 6,600, net cost 17,600; budget 20,000 + 5,000 + 2,500 = 27,500; planned 8,000; forecast 25,600.
    currency: 'JPY',
    typed: { engineBudget: '20000', coolingBudget: '5000', contingency: '2500', pumpEstimate: '8000', part: '10000', core: '4000', coolant: '6000', tax: '2000', total: '22000' },
    expected: { budgetWithContingency: '27500', planned: '8000', spent: '22000', engineNet: '11000', coolingNet: '6600', netCost: '17600', coreOutstanding: '4400', forecast: '25600' },
    minorUnits: 0,
  },
];

describe.each(CASES)('the same figures everywhere, in $currency', ({ currency, typed, expected, minorUnits }) => {
  it('shows each figure once worked out, the same on every screen, export and mail', async () => {
    const { client, email } = await signedUpClient(t.app, `same-${currency.toLowerCase()}`);
    const build = (await client.post('/api/builds', { ...NEW_BUILD, currency })).body;
    const base = `/api/builds/${build.id}`;
    const systems = (await client.get(`${base}/systems`)).body.systems as { id: string; name: string; version: number }[];
    const engine = systems.find((s) => s.name === 'Engine')!;
    const cooling = systems.find((s) => s.name === 'Cooling')!;
    expect((await client.patch(`${base}/systems/${engine.id}`, { budget: typed.engineBudget, version: engine.version })).status).toBe(200);
    expect((await client.patch(`${base}/systems/${cooling.id}`, { budget: typed.coolingBudget, version: cooling.version })).status).toBe(200);
    const buildNow = (await client.get(base)).body;
    expect((await client.send('put', `${base}/contingency`, { contingencyBudget: typed.contingency, version: buildNow.version })).status).toBe(200);
    const pump = await client.post(`${base}/parts`, { systemId: engine.id, description: 'Electric water pump', quantity: '1', unit: 'each', estimatedUnitCost: typed.pumpEstimate });
    expect(pump.status).toBe(201);
    await filedReceipt(t, client, build.id, { vendorName: 'Larkspur Motor Spares', purchaseDate: '2026-11-20', tax: typed.tax, total: typed.total }, [
      { kind: 'part', description: 'Engine computer, reflashed', amount: typed.part, systemId: engine.id },
      { kind: 'core_charge', description: 'Engine computer core', amount: typed.core, systemId: engine.id },
      { kind: 'part', description: 'Coolant, 2 jugs', amount: typed.coolant, systemId: cooling.id },
    ]);

    const { ledger, cores, ledgerSystem } = await expectOneValuePerFigure(client, build.id, minorUnits);

    // The hand-worked figures, on the ledger.
    expect(ledger.currency).toBe(currency);
    expect(ledger.total.spent).toBe(expected.spent);
    expect(ledger.total.netCost).toBe(expected.netCost);
    expect(ledger.total.planned).toBe(expected.planned);
    expect(ledger.total.coreDepositsOutstanding).toBe(expected.coreOutstanding);
    expect(ledger.total.forecast).toBe(expected.forecast);
    expect(ledger.budgetWithContingency).toBe(expected.budgetWithContingency);
    expect(ledgerSystem(engine.id).netCost).toBe(expected.engineNet);
    expect(ledgerSystem(cooling.id).netCost).toBe(expected.coolingNet);
    // The core list shows the deposit as the ledger counts it: the line with its tax.
    expect(cores.map((core) => core.amount)).toEqual([expected.coreOutstanding]);

    // The core-due mail names the same amount, formatted as ECMA-402 formats the currency in the build's locale.
    await client.send('put', `${base}/alert-preferences`, { budget: false, coreDue: true, returnWindow: false, warrantyEnding: false, duplicate: false, reviewDigest: false });
    const core = await t.orm.em.fork().findOneOrFail(Core, { id: cores[0].id });
    await t.orm.em.fork().nativeUpdate(Core, { id: core.id }, { dueDate: '2031-03-17' });
    await sendDueAlerts(deps, new Date('2031-03-10T09:00:00Z'));
    const mail = await t.mail.waitFor((m) => m.to.includes(email.toLowerCase()) && m.subject.startsWith('Core'));
    const formatted = new Intl.NumberFormat(build.locale, { style: 'currency', currency }).format(Number(expected.coreOutstanding));
    expect(mail.subject).toContain(`Core deposit of ${formatted} due back`);
  });
});
