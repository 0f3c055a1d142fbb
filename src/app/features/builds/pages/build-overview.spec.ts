// Build overview: money against the budget, what needs attention in the role's order, first steps on a new build, and
// the details with the owner's buttons.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, within } from '@testing-library/angular/zoneless';
import type { BuildDto } from '../../../../../shared/api/builds';
import type { LedgerDto, LedgerFigures, LedgerSystemDto } from '../../../../../shared/api/ledger';
import type { SystemDto, SystemsResponse } from '../../../../../shared/api/parts';
import type { CoreDto, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { BuildRole, ReceiptState, ReviewState } from '../../../../../shared/enums';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { CurrentBuild } from '../services/current-build';
import { BuildOverview } from './build-overview';
import { testBuild } from '../../../../testing/build-fixtures';

const build = (role: BuildRole): BuildDto =>
  testBuild(role, { vehicle: '1968 invented wagon, 2.3 L four', startedOn: '2026-03-01', version: 4 });

const zeroFigures: LedgerFigures = {
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
};

const ledgerSystem = (systemId: string, name: string, budget: string, netCost: string): LedgerSystemDto => ({
  ...zeroFigures,
  systemId,
  name,
  budget,
  netCost,
  // Nothing left to buy in these systems: the forecast is the net cost.
  forecast: netCost,
  safetyCaution: false,
});

// Budget 2,000.00 + 1,200.00 + 0.00 = 3,200.00; net cost 2,262.50 + 622.64 + 40.00 = 2,925.14, which is 91.41 % of the
// budget (91 % shown) with 274.86 left. Forecast 2,925.14 + 474.86 still to buy = 3,400.00, so 200.00 over budget.
// Engine is over its budget; Cooling has no budget, so it is not "over" one.
const ledger = (overrides: Partial<LedgerFigures> = {}, systems?: LedgerSystemDto[]): LedgerDto => ({
  currency: 'USD',
  systems: systems ?? [
    ledgerSystem('s-engine', 'Engine', '2000.00', '2262.50'),
    ledgerSystem('s-brakes', 'Brakes', '1200.00', '622.64'),
    ledgerSystem('s-cooling', 'Cooling', '0.00', '40.00'),
  ],
  total: {
    ...zeroFigures,
    budget: '3200.00',
    netCost: '2925.14',
    remainingEstimate: '474.86',
    forecast: '3400.00',
    forecastAdjusted: '3400.00',
    variance: '-200.00',
    ...overrides,
  },
  contingencyBudget: '150.00',
  budgetWithContingency: '3350.00',
  overrunFactor: '1',
  overrunSample: 2,
});

let receiptNumber = 0;
const receipt = (state: ReceiptState, extra: { reviewState?: ReviewState; duplicateOf?: string[] } = {}): ReceiptSummaryDto => ({
  id: `r-${++receiptNumber}`,
  vendorName: 'Harbour Row Supply',
  purchaseDate: '2026-04-20',
  receiptNumber: '',
  total: '10.00',
  state,
  readingProgress: 0,
  reviewState: extra.reviewState ?? 'none',
  originalFilename: 'slip.jpg',
  contentType: 'image/jpeg',
  lineCount: 1,
  duplicateOf: extra.duplicateOf ?? [],
  systemIds: [],
  uploadedBy: 'Rosa Quill',
  createdAt: '2026-04-20T10:00:00.000Z',
  version: 1,
});

const core = (id: string, state: CoreDto['state'], dueDate: string, amount: string): CoreDto => ({
  id,
  state,
  dueDate,
  amount,
  description: 'Alternator core',
  partNumber: '',
  receiptId: 'r-1',
  vendorName: 'Harbour Row Supply',
  purchaseDate: '2026-04-20',
  refundLineId: null,
  version: 1,
});

const systemsWith = (partCount: number): SystemsResponse => ({
  currency: 'USD',
  systems: [
    { id: 's-engine', name: 'Engine', budget: '0.00', estimate: '0.00', partCount, sortOrder: 0, archived: false, safetyCaution: false, version: 1 } satisfies SystemDto,
  ],
  contingencyBudget: '0.00',
  budgetWithContingency: '0.00',
  planned: '0.00',
  buildVersion: 4,
});

interface Answers {
  ledger: LedgerDto | 'fail';
  receipts: ReceiptSummaryDto[];
  reviewQueue: ReceiptSummaryDto[];
  cores: CoreDto[];
  systems: SystemsResponse;
}

/**
 * Two to check, one being read, one not read, three filed and unreviewed (two of them look alike), one approved, one
 * questioned and one answered.
 */
function busyBuild(): Answers {
  const filed = [receipt('filed', { duplicateOf: ['r-x'] }), receipt('filed', { duplicateOf: ['r-y'] }), receipt('filed')];
  const answered = receipt('filed', { reviewState: 'answered' });
  return {
    ledger: ledger(),
    receipts: [
      receipt('to_check'),
      receipt('to_check'),
      receipt('reading'),
      receipt('failed'),
      ...filed,
      receipt('filed', { reviewState: 'approved' }),
      receipt('filed', { reviewState: 'questioned' }),
      answered,
    ],
    reviewQueue: [...filed, answered],
    // Owed 30.00 + 40.00 = 70.00; the one handed in is no longer owed. 2020 is long past, 2099 far ahead.
    cores: [core('c-1', 'owed', '2099-03-01', '30.00'), core('c-2', 'owed', '2020-01-15', '40.00'), core('c-3', 'dropped_off', '2019-06-01', '25.00')],
    systems: systemsWith(4),
  };
}

/** Rendered on its own, not under /builds/b-1, so its relative links resolve from the root ("ledger" is /ledger here). */
async function renderAs(role: BuildRole, answers: Answers) {
  await render(BuildOverview, {
    providers: [
      ...apiTestProviders(),
      {
        provide: CurrentBuild,
        useFactory: () => {
          const current = new CurrentBuild();
          current.set(build(role));
          return current;
        },
      },
    ],
    bindings: [inputBinding('buildId', () => 'b-1')],
  });
  const http = TestBed.inject(HttpTestingController);
  expect(screen.getByRole('progressbar', { name: 'Loading the build at a glance' })).toBeTruthy();
  const ledgerRequest = http.expectOne('/api/builds/b-1/ledger');
  if (answers.ledger === 'fail') ledgerRequest.flush({ error: { code: 'internal', message: 'The ledger could not be computed.' } }, { status: 500, statusText: 'Server Error' });
  else ledgerRequest.flush(answers.ledger);
  http.expectOne('/api/builds/b-1/receipts').flush({ receipts: answers.receipts });
  http.expectOne('/api/builds/b-1/review-queue').flush({ receipts: answers.reviewQueue });
  http.expectOne('/api/builds/b-1/cores').flush({ cores: answers.cores });
  http.expectOne('/api/builds/b-1/systems?archived=true').flush(answers.systems);
  http.verify();
  await screen.findByRole('heading', { name: /Needs attention|First steps|Nothing here yet/ });
  expect(screen.queryByRole('progressbar')).toBeNull();
  return http;
}

/** Text as a person reads it: neighbouring elements apart by a space, icons by their ligature name (warning, check_circle). */
function text(element: Element): string {
  const walker = document.createTreeWalker(element, NodeFilter.SHOW_TEXT);
  const parts: string[] = [];
  for (let node = walker.nextNode(); node; node = walker.nextNode()) parts.push(node.textContent ?? '');
  return parts.join(' ').replace(/\s+/g, ' ').replace(/ ([,.:%])/g, '$1').trim();
}

function attentionLines(): { link: string; href: string | null; detail: string }[] {
  const list = within(screen.getByRole('region', { name: 'Needs attention' })).getByRole('list');
  return within(list)
    .getAllByRole('listitem')
    .map((item) => {
      const link = within(item).getByRole('link');
      return { link: text(link), href: link.getAttribute('href'), detail: text(item.querySelector('.detail')!) };
    });
}

describe('BuildOverview', () => {
  it('shows the owner net cost against the budget, the forecast and what needs attention, checking first', async () => {
    await renderAs('owner', busyBuild());

    const money = screen.getByRole('region', { name: 'Money' });
    // The same strip, names and words as the ledger (shared/build-figures.ts); each comparison says against what.
    expect(text(money)).toContain('Budget $3,200.00 Net cost $2,925.14 Forecast at completion $3,400.00');
    expect(text(money)).toContain('Forecast against budget warning forecast $200.00 over budget Forecast at completion $3,400.00 against a budget of $3,200.00.');
    expect(text(money)).toContain('Net cost is 91% of the budget: $274.86 of it not spent yet.');
    expect(within(money).getByRole('link', { name: 'Open the ledger' }).getAttribute('href')).toBe('/ledger');

    expect(attentionLines()).toEqual([
      // The receipts list reads its state filter from the query, so the count opens on the receipts it counted.
      { link: '2 receipts ready to check', href: '/receipts?state=to_check', detail: 'Read into lines; they count in the ledger once checked and filed.' },
      { link: '1 receipt being read', href: '/receipts', detail: 'Usually a few seconds each; they then wait to be checked.' },
      { link: '1 receipt could not be read', href: '/receipts?state=failed', detail: 'Try a sharper photo in good light, or add the lines by hand.' },
      { link: '1 question to answer', href: '/receipts?review=questioned', detail: 'The reviewer asked about a receipt: reply in a comment on each, and it goes back for review.' },
      { link: '3 receipts to review', href: '/review', detail: 'Filed, not yet approved or questioned.' },
      { link: '1 answer to read', href: '/review', detail: 'A builder replied to a question: approve the receipt, or ask again.' },
      {
        link: '2 core deposits owed, $70.00',
        href: '/cores',
        detail: '1 overdue: the earliest was due Jan 15, 2020. Hand the old parts back to get the deposits refunded.',
      },
      { link: '1 system forecast over budget', href: '/ledger', detail: 'Engine: net cost plus the parts still to buy passes the budget.' },
      { link: '2 receipts may be duplicates', href: '/receipts?duplicates=only', detail: 'Same shop, date and total as another receipt, or the same file.' },
    ]);
    expect(screen.queryByText(/Nothing needs attention/)).toBeNull();

    // The details and the owner's buttons stay.
    expect(screen.getByRole('heading', { name: 'Teal wagon swap', level: 1 })).toBeTruthy();
    expect(screen.getByText('1968 invented wagon, 2.3 L four')).toBeTruthy();
    expect(screen.getByText('Mar 1, 2026')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Edit build' }).getAttribute('href')).toBe('/edit');
    expect(screen.getByRole('button', { name: 'Archive build' })).toBeTruthy();
  });

  it('shows a reviewer only what they act on, reviewing first, says over budget in words, and shows no owner buttons', async () => {
    // Net cost 3,584.00 of 3,200.00 is 112 % used, 384.00 over; the forecast 3,700.00 is 500.00 over.
    const answers = { ...busyBuild(), ledger: ledger({ netCost: '3584.00', forecast: '3700.00', variance: '-500.00' }) };
    await renderAs('reviewer', answers);

    // Checking, cores and budgets are the builders' work: no task of the reviewer's.
    expect(attentionLines().map((line) => line.link)).toEqual(['3 receipts to review', '1 answer to read', '2 receipts may be duplicates']);
    const money = screen.getByRole('region', { name: 'Money' });
    expect(text(money)).toContain('Net cost is 112% of the budget: $384.00 over it so far.');
    expect(text(money)).toContain('warning forecast $500.00 over budget');
    expect(screen.queryByRole('link', { name: 'Edit build' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Archive build' })).toBeNull();
  });

  it('says in one calm line that nothing needs attention when every receipt is filed and reviewed and nothing is owed or over', async () => {
    await renderAs('crew', {
      // Net cost 1,600.00 of 3,200.00: 50 % used; the forecast 2,000.00 is 1,200.00 under budget.
      ledger: ledger({ netCost: '1600.00', forecast: '2000.00', variance: '1200.00', remainingEstimate: '400.00' }, [ledgerSystem('s-engine', 'Engine', '2000.00', '1600.00')]),
      receipts: [receipt('filed', { reviewState: 'approved' }), receipt('filed', { reviewState: 'approved' })],
      reviewQueue: [],
      cores: [core('c-1', 'refunded', '2020-01-15', '30.00'), core('c-2', 'forfeited', '2020-02-15', '20.00')],
      systems: systemsWith(3),
    });

    const attention = screen.getByRole('region', { name: 'Needs attention' });
    expect(within(attention).queryByRole('list')).toBeNull();
    expect(text(attention)).toBe(
      'Needs attention check_circle Nothing needs attention: every receipt is checked and reviewed, no core deposit is owed and no system is over its budget.',
    );
    expect(text(screen.getByRole('region', { name: 'Money' }))).toContain('Net cost is 50% of the budget: $1,600.00 of it not spent yet.');
    expect(text(screen.getByRole('region', { name: 'Money' }))).toContain('check_circle forecast $1,200.00 under budget');
  });

  it('gives a new build with no parts and no receipts first steps instead of figures, inviting a partner only for the owner', async () => {
    const empty: Answers = { ledger: ledger({ budget: '0.00', netCost: '0.00', forecast: '0.00', variance: '0.00' }), receipts: [], reviewQueue: [], cores: [], systems: systemsWith(0) };
    await renderAs('owner', empty);

    const steps = screen.getByRole('region', { name: 'First steps' });
    expect(within(steps).getAllByRole('link').map((link) => [text(link), link.getAttribute('href')])).toEqual([
      ['Add parts', '/parts'],
      ['set budgets', '/budgets'],
      ['Upload a receipt', '/receipts'],
      ['Invite a partner', '/crew'],
    ]);
    expect(screen.queryByRole('region', { name: 'Money' })).toBeNull();
    expect(screen.queryByRole('region', { name: 'Needs attention' })).toBeNull();
    expect(screen.queryByText(/\$0\.00/)).toBeNull();
  });

  it('leaves budgets and the invite out of a crew member\'s first steps', async () => {
    await renderAs('crew', { ledger: ledger({ budget: '0.00' }), receipts: [], reviewQueue: [], cores: [], systems: systemsWith(0) });

    const steps = screen.getByRole('region', { name: 'First steps' });
    expect(within(steps).getAllByRole('link').map(text)).toEqual(['Add parts', 'Upload a receipt']);
  });

  it('tells a reviewer of a new build that nothing is there yet, with no steps they could not take', async () => {
    await renderAs('reviewer', { ledger: ledger({ budget: '0.00' }), receipts: [], reviewQueue: [], cores: [], systems: systemsWith(0) });

    const empty = screen.getByRole('region', { name: 'Nothing here yet' });
    expect(within(empty).queryAllByRole('link')).toEqual([]);
    expect(text(empty)).toContain('Once parts and receipts are added, the money and the receipts waiting for your review show here.');
  });

  it('keeps what loaded when the ledger fails, and never claims nothing needs attention without it', async () => {
    const answers: Answers = { ...busyBuild(), ledger: 'fail', receipts: [receipt('to_check')], reviewQueue: [], cores: [] };
    await renderAs('owner', answers);

    expect(screen.queryByRole('region', { name: 'Money' })).toBeNull();
    expect(attentionLines().map((line) => line.link)).toEqual(['1 receipt ready to check']);
    expect(screen.getByRole('alert').textContent?.trim()).toBe('Part of this overview could not be loaded. Reload the page to try again.');
    expect(screen.queryByText(/Nothing needs attention/)).toBeNull();
    // The app's one interceptor tells the person what the server said.
    expect(await screen.findByText('The ledger could not be computed.')).toBeTruthy();
  });
});
