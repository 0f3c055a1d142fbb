// Budgets page: live totals from what the owner types, saved per field with the version, refused amounts kept on the field.
import { screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { LedgerDto } from '../../../../../shared/api/ledger';
import type { SystemDto, SystemsResponse } from '../../../../../shared/api/parts';
import type { SystemFigures } from '../../../../../shared/build-figures';
import type { BuildRole } from '../../../../../shared/enums';
import { testSystem } from '../../../../testing/build-fixtures';
import { renderInBuild } from '../../../../testing/render-in-build';
import { BudgetsPage } from './budgets-page';

const system = (id: string, name: string, budget: string, estimate: string, extra: Partial<SystemDto> = {}): SystemDto =>
  testSystem(id, name, { budget, estimate, partCount: 1, version: 2, ...extra });

// Budgets 2,000.00 + 1,200.00 + contingency 150.00 = 3,350.00; estimates 2,262.50 + 622.64 + 40.00 (archived) = 2,925.14.
const overview: SystemsResponse = {
  currency: 'USD',
  systems: [
    system('s-engine', 'Engine', '2000.00', '2262.50'),
    system('s-brakes', 'Brakes', '1200.00', '622.64', { sortOrder: 6, safetyCaution: true }),
    system('s-paint', 'Paint and trim', '300.00', '40.00', { archived: true, sortOrder: 12 }),
  ],
  contingencyBudget: '150.00',
  budgetWithContingency: '3350.00',
  planned: '2925.14',
  buildVersion: 4,
};

const figures = (budget: string, planned: string, netCost: string, remaining: string, forecast: string, variance: string): SystemFigures => ({
  budget,
  planned,
  spent: netCost,
  netCost,
  coreDepositsOutstanding: '0.00',
  returnsAwaitingRefund: '0.00',
  remainingEstimate: remaining,
  forecast,
  forecastAdjusted: forecast,
  variance,
  planningGap: variance,
});

// The ledger of the same build: the archived system, with nothing spent, has left it. Engine 2,000.00 against 2,262.50
// planned (262.50 over); Brakes 1,200.00 against 622.64 (577.36 under); build 3,200.00 against 2,885.14 (314.86 under).
const ledger: LedgerDto = {
  currency: 'USD',
  systems: [
    { systemId: 's-engine', name: 'Engine', safetyCaution: false, ...figures('2000.00', '2262.50', '1800.00', '462.50', '2262.50', '-262.50') },
    { systemId: 's-brakes', name: 'Brakes', safetyCaution: true, ...figures('1200.00', '622.64', '0.00', '622.64', '622.64', '577.36') },
  ],
  total: figures('3200.00', '2885.14', '1800.00', '1085.14', '2885.14', '314.86'),
  contingencyBudget: '150.00',
  budgetWithContingency: '3350.00',
  overrunFactor: '1',
  overrunSample: 0,
};

async function renderAs(role: BuildRole) {
  // At version 4, as the systems answer's buildVersion says.
  const { http } = await renderInBuild(BudgetsPage, { role, build: { vehicle: '', version: 4 } });
  http.expectOne('/api/builds/b-1/ledger').flush(ledger);
  http.expectOne('/api/builds/b-1/systems?archived=true').flush(overview);
  await screen.findByText('Engine');
  return { http, user: userEvent.setup() };
}

function figure(term: string): string {
  const dt = screen.getAllByRole('term').find((candidate) => candidate.textContent?.trim() === term)!;
  return dt.nextElementSibling?.textContent?.trim() ?? '';
}

describe('BudgetsPage', () => {
  it('shows each system against its budget in words and the build totals, leaving archived budgets out', async () => {
    await renderAs('owner');
    // The ledger's figures under the ledger's names (shared/build-figures.ts), each comparison saying against what.
    expect(figure('Budget')).toBe('$3,200.00');
    expect(figure('Contingency')).toBe('$150.00');
    expect(figure('Budget with contingency')).toBe('$3,350.00');
    expect(figure('Planned')).toBe('$2,885.14');
    expect(figure('Planned against budget')).toBe('check_circle planned $314.86 under budget');
    expect(screen.getByText(/planned \$262\.50 over budget/)).toBeTruthy();
    expect(screen.getByText(/planned \$577\.36 under budget/)).toBeTruthy();
    expect(screen.getByText('Archived systems (1)')).toBeTruthy();
  });

  it('recomputes the totals as the owner types and saves the budget on Enter with the version', async () => {
    const { http, user } = await renderAs('owner');
    const field = screen.getByRole('textbox', { name: 'Budget for Engine' });
    await user.clear(field);
    await user.type(field, '2500');

    // 2,500.00 + 1,200.00 = 3,700.00, with the contingency 3,850.00, before anything is saved; Engine is now 237.50 under.
    expect(figure('Budget')).toBe('$3,700.00');
    expect(figure('Budget with contingency')).toBe('$3,850.00');
    expect(figure('Forecast against budget')).toBe('check_circle forecast $814.86 under budget');
    expect(screen.getByText(/planned \$237\.50 under budget/)).toBeTruthy();
    http.expectNone('/api/builds/b-1/systems/s-engine');

    await user.keyboard('{Enter}');
    const request = http.expectOne('/api/builds/b-1/systems/s-engine');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ budget: '2500.00', version: 2 });
    request.flush(system('s-engine', 'Engine', '2500.00', '2262.50', { version: 3 }));
    expect((field as HTMLInputElement).value).toBe('2500.00');
  });

  it('refuses an amount with more decimals than the currency has, on the field, and sends nothing', async () => {
    const { http, user } = await renderAs('owner');
    const field = screen.getByRole('textbox', { name: 'Budget for Brakes' });
    await user.clear(field);
    await user.type(field, '1200.005{Enter}');

    expect(await screen.findByText('Too many decimals: use at most 2 decimals.')).toBeTruthy();
    // The totals keep the saved figure while the typed one is not an amount.
    expect(figure('Budget with contingency')).toBe('$3,350.00');
    http.expectNone('/api/builds/b-1/systems/s-brakes');
  });

  it('saves the contingency with the build version', async () => {
    const { http, user } = await renderAs('owner');
    const field = screen.getByRole('textbox', { name: 'Contingency' });
    await user.clear(field);
    await user.type(field, '400{Enter}');
    const request = http.expectOne('/api/builds/b-1/contingency');
    expect(request.request.method).toBe('PUT');
    expect(request.request.body).toEqual({ contingencyBudget: '400.00', version: 4 });
    request.flush({ ...overview, contingencyBudget: '400.00', budgetWithContingency: '3600.00', buildVersion: 5 });
    expect(figure('Budget with contingency')).toBe('$3,600.00');
  });

  it('shows crew the figures without inputs or system actions', async () => {
    await renderAs('crew');
    expect(screen.queryAllByRole('textbox')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: /^Archive / })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add system' })).toBeNull();
    expect(figure('Budget with contingency')).toBe('$3,350.00');
  });
});
