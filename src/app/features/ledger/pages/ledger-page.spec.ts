// Ledger page: the totals in words, the systems table whose figures open their lines, spend by month and week, the
// shops, and the empty state. jsdom has no canvas, so getContext answers null and the page stands on its tables.
import { screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { LedgerDto, LedgerLineDto, LedgerSystemDto, SpendResponse, VendorsResponse } from '../../../../../shared/api/ledger';
import { renderInBuild } from '../../../../testing/render-in-build';
import { LedgerPage } from './ledger-page';

const system = (systemId: string, name: string, figures: Partial<LedgerSystemDto>): LedgerSystemDto => ({
  systemId,
  name,
  safetyCaution: false,
  budget: '0.00',
  planned: '0.00',
  planningGap: '0.00',
  spent: '0.00',
  netCost: '0.00',
  coreDepositsOutstanding: '0.00',
  returnsAwaitingRefund: '0.00',
  remainingEstimate: '0.00',
  variance: '0.00',
  forecast: '0.00',
  forecastAdjusted: '0.00',
  ...figures,
});

// The API test's build (test/api/ledger-screen.test.ts) with budgets and estimates added:
// Engine forecast 210.85 + 150.00 = 360.85, 500.00 - 360.85 = 139.15 under; Cooling 50.00 - 57.43 = 7.43 over;
// Brakes 800.00 - 300.00 = 500.00 under. Build: 1,350.00 - 718.28 = 631.72 under.
const ledger: LedgerDto = {
  currency: 'USD',
  systems: [
    system('s-engine', 'Engine', { budget: '500.00', planned: '400.00', spent: '234.27', netCost: '210.85', coreDepositsOutstanding: '23.42', remainingEstimate: '150.00', forecast: '360.85', variance: '139.15', forecastAdjusted: '360.85' }),
    system('s-cooling', 'Cooling', { budget: '50.00', planned: '20.00', spent: '57.43', netCost: '57.43', returnsAwaitingRefund: '22.50', forecast: '57.43', variance: '-7.43', forecastAdjusted: '57.43' }),
    system('s-brakes', 'Brakes', { safetyCaution: true, budget: '800.00', planned: '300.00', remainingEstimate: '300.00', forecast: '300.00', variance: '500.00', forecastAdjusted: '300.00' }),
    // Nothing budgeted, planned or spent: left out of the chart and table, and out of the caution.
    system('s-fuel', 'Fuel', { safetyCaution: true }),
    system('s-interior', 'Interior', {}),
  ],
  total: {
    budget: '1350.00',
    planned: '720.00',
    spent: '291.70',
    netCost: '268.28',
    coreDepositsOutstanding: '23.42',
    returnsAwaitingRefund: '22.50',
    remainingEstimate: '450.00',
    variance: '631.72',
    planningGap: '630.00',
    forecast: '718.28',
    forecastAdjusted: '718.28',
  },
  contingencyBudget: '150.00',
  budgetWithContingency: '1500.00',
  overrunFactor: '1',
  overrunSample: 2,
};

const months: SpendResponse = {
  currency: 'USD',
  by: 'month',
  periods: [
    { period: '2026-07', spent: '305.20', netCost: '281.78' },
    { period: '2026-08', spent: '0.00', netCost: '0.00' },
    { period: '2026-09', spent: '-13.50', netCost: '-13.50' },
  ],
};

const vendors: VendorsResponse = {
  currency: 'USD',
  vendors: [
    { vendorId: 'v-harbour', vendor: 'Harbour Row Supply', receipts: 1, spent: '166.00', netCost: '166.00' },
    { vendorId: 'v-quayside', vendor: 'Quayside Parts', receipts: 2, spent: '125.70', netCost: '102.28' },
  ],
};

const line = (lineId: string, receiptId: string, description: string, figures: Partial<LedgerLineDto>): LedgerLineDto => ({
  lineId,
  receiptId,
  purchaseDate: '2026-07-03',
  vendorId: 'v-quayside',
  vendor: 'Quayside Parts',
  description,
  kind: 'part',
  systemId: 's-engine',
  system: 'Engine',
  amount: '0.00',
  allocatedTax: '0.00',
  allocatedShipping: '0.00',
  allocatedDiscount: '0.00',
  lineTotal: '0.00',
  ...figures,
});

async function renderPage(answers: { ledger?: LedgerDto; spend?: SpendResponse } = {}) {
  jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  // The person is a reviewer, which the empty state's words depend on.
  const { http } = await renderInBuild(LedgerPage, { role: 'reviewer', build: { vehicle: '', version: 4 } });
  http.expectOne('/api/builds/b-1/ledger').flush(answers.ledger ?? ledger);
  http.expectOne('/api/builds/b-1/ledger/spend?by=month').flush(answers.spend ?? months);
  http.expectOne('/api/builds/b-1/ledger/vendors').flush(vendors);
  return { http, user: userEvent.setup() };
}

function figure(term: string): string {
  const dt = screen.getAllByRole('term').find((candidate) => candidate.textContent?.trim() === term)!;
  return dt.nextElementSibling?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
}


describe('LedgerPage', () => {
  it('shows the whole build at a glance, the variance in words with an icon, and the factor explained', async () => {
    await renderPage();
    await screen.findByRole('heading', { name: 'By system' });
    expect(figure('Budget')).toBe('$1,350.00');
    expect(figure('Net cost')).toBe('$268.28 (show the lines behind the net cost)');
    expect(figure('Forecast at completion')).toBe('$718.28');
    expect(figure('Adjusted forecast')).toBe('$718.28');
    // Every comparison says against what (shared/build-figures.ts).
    expect(figure('Forecast against budget')).toBe('check_circle forecast $631.72 under budget');
    expect(figure('Core deposits outstanding')).toBe('$23.42 (show the lines behind the core deposits outstanding)');
    expect(figure('Returns awaiting refund')).toBe('$22.50 (show the lines behind the returns awaiting refund)');
    expect(screen.getByText('Same as the forecast until 5 bought parts have both an estimate and a cost (2 parts have so far).')).toBeTruthy();
    expect(screen.getByText('The systems’ budgets; the contingency of $150.00 is kept apart.')).toBeTruthy();
    // Brakes carry the safety caution, named.
    expect(screen.getByRole('complementary', { name: 'Safety caution' }).textContent).toContain("Brakes: Tallyhood records costs only. Fuel, brake, steering, wiring and lifting work can injure people: follow the manufacturer's instructions");
  });

  it('lists every system with its figures, over budget in words and not by colour alone', async () => {
    await renderPage();
    const table = await screen.findByRole('table', { name: 'Figures by system, in USD' });
    const rows = within(table)
      .getAllByRole('row')
      .map((row) => Array.from(row.children).map((cell) => cell.textContent!.replace(/\s+/g, ' ').trim()));
    expect(rows[0]).toEqual(['System', 'Budget', 'Spent', 'Net cost', 'Forecast', 'Forecast against budget', 'Cores out', 'Returns due']);
    // The hidden words of each figure button say what it opens; the icons' names are read from their ligatures here.
    expect(rows[1]).toEqual([
      'Engine',
      '$500.00',
      '$234.27 (Spent of Engine: show the lines)',
      '$210.85 (Net cost of Engine: show the lines)',
      '$360.85',
      'check_circle $139.15 under',
      '$23.42 (Core deposits outstanding of Engine: show the lines)',
      '$0.00',
    ]);
    expect(rows[2]).toEqual([
      'Cooling',
      '$50.00',
      '$57.43 (Spent of Cooling: show the lines)',
      '$57.43 (Net cost of Cooling: show the lines)',
      '$57.43',
      'warning $7.43 over',
      '$0.00',
      '$22.50 (Returns awaiting refund of Cooling: show the lines)',
    ]);
    expect(rows).toHaveLength(4);
    expect(screen.getByText('Nothing budgeted, planned or spent yet, so left out: Fuel, Interior.')).toBeTruthy();
    expect(rows[3]).toEqual(['Brakes health_and_safety (safety caution applies)', '$800.00', '$0.00', '$0.00', '$300.00', 'check_circle $500.00 under', '$0.00', '$0.00']);
  });

  it("opens the lines behind Engine's net cost with their sum and a link to each receipt", async () => {
    const { http, user } = await renderPage();
    await user.click(await screen.findByRole('button', { name: '$210.85 (Net cost of Engine: show the lines)' }));
    const request = http.expectOne('/api/builds/b-1/ledger/lines?figure=netCost&systemId=s-engine');
    expect(request.request.method).toBe('GET');
    request.flush({
      currency: 'USD',
      figure: 'netCost',
      total: '210.85',
      lines: [
        line('l-1', 'r-a', 'Alternator, reman', { amount: '60.00', allocatedTax: '3.86', allocatedShipping: '5.99', lineTotal: '69.85' }),
        line('l-2', 'r-a', 'Bench test', { kind: 'fee', amount: '10.00', allocatedShipping: '1.00', lineTotal: '11.00' }),
        line('l-3', 'r-b', 'Starter', { purchaseDate: '2026-07-20', vendor: 'Harbour Row Supply', amount: '100.00', allocatedDiscount: '10.00', lineTotal: '90.00' }),
        line('l-4', 'r-b', 'Starter core', { purchaseDate: '2026-07-20', vendor: null, vendorId: null, kind: 'core_charge', amount: '40.00', lineTotal: '40.00' }),
      ],
    });
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByRole('heading', { name: 'Net cost of Engine' })).toBeTruthy();
    expect((await within(dialog).findByRole('status')).textContent!.replace(/\s+/g, ' ').trim()).toBe('4 lines add up to $210.85');
    expect(within(dialog).getByRole('link', { name: 'Alternator, reman' }).getAttribute('href')).toBe('/builds/b-1/receipts/r-a');
    expect(within(dialog).getByRole('link', { name: 'Starter' }).getAttribute('href')).toBe('/builds/b-1/receipts/r-b');
    const items = within(dialog).getAllByRole('listitem').map((item) => item.textContent!.replace(/\s+/g, ' ').trim());
    expect(items[0]).toBe('Alternator, reman $69.85 Jul 3, 2026 · Quayside Parts · Purchase · Engine $60.00 on the receipt + tax $3.86 + shipping $5.99');
    expect(items[2]).toBe('Starter $90.00 Jul 20, 2026 · Harbour Row Supply · Purchase · Engine $100.00 on the receipt − discount $10.00');
    expect(items[3]).toBe('Starter core $40.00 Jul 20, 2026 · Shop not named · Core deposit · Engine');
  });

  it('opens the whole build\'s outstanding deposits, a month, and a shop', async () => {
    const { http, user } = await renderPage();
    await user.click(await screen.findByRole('button', { name: '$23.42 (show the lines behind the core deposits outstanding)' }));
    http.expectOne('/api/builds/b-1/ledger/lines?figure=coreDepositsOutstanding').flush({ currency: 'USD', figure: 'coreDepositsOutstanding', total: '0.00', lines: [] });
    expect(await screen.findByText('No filed receipt line is counted in this figure yet.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Close' }));

    await user.click(await screen.findByRole('button', { name: '-$13.50 (Net cost in September 2026: show the lines)' }));
    http.expectOne('/api/builds/b-1/ledger/lines?figure=netCost&period=2026-09').flush({ currency: 'USD', figure: 'netCost', total: '-13.50', lines: [] });
    expect(await screen.findByRole('heading', { name: 'Net cost in September 2026' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Close' }));

    await user.click(await screen.findByRole('button', { name: '$125.70 (Spent at Quayside Parts: show the lines)' }));
    http.expectOne('/api/builds/b-1/ledger/lines?figure=spent&vendorId=v-quayside').flush({ currency: 'USD', figure: 'spent', total: '0.00', lines: [] });
    expect(await screen.findByRole('heading', { name: 'Spent at Quayside Parts' })).toBeTruthy();
  });

  it('switches spend over time to weeks', async () => {
    const { http, user } = await renderPage();
    await user.click(await screen.findByRole('radio', { name: 'By week' }));
    http.expectOne('/api/builds/b-1/ledger/spend?by=week').flush({ currency: 'USD', by: 'week', periods: [{ period: '2026-W27', spent: '139.20', netCost: '115.78' }] });
    expect(await screen.findByRole('rowheader', { name: 'week 27 of 2026' })).toBeTruthy();
    expect(screen.getByText('Figures by week')).toBeTruthy();
  });

  it('explains a trusted overrun factor in words', async () => {
    await renderPage({ ledger: { ...ledger, overrunFactor: '1.12', overrunSample: 6 } });
    expect(
      await screen.findByText('The 6 parts bought so far cost 12% more than estimated, so the estimates of the parts still to buy are multiplied by 1.12.'),
    ).toBeTruthy();
  });

  it('says what to do first when nothing is filed yet', async () => {
    const empty: LedgerDto = { ...ledger, systems: [system('s-engine', 'Engine', { budget: '500.00' })] };
    await renderPage({ ledger: empty, spend: { currency: 'USD', by: 'month', periods: [] } });
    expect(await screen.findByRole('heading', { name: 'Upload a receipt to start the ledger' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to Receipts' }).getAttribute('href')).toBe('/receipts');
    // This build's person is a reviewer, who files nothing: the words say who does.
    expect(screen.getByText(/Once the owner or crew file a receipt, its money shows here\./)).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });
});
