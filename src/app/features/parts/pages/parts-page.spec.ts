// Parts table: grouped totals against budget in words, the reviewer's read-only view, and bulk moves sent with the chosen ids.
import { screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { PartDto, SystemDto, SystemsResponse } from '../../../../../shared/api/parts';
import type { BuildRole } from '../../../../../shared/enums';
import { testPart, testPriceItem, testPricePaid, testSystem } from '../../../../testing/build-fixtures';
import { renderInBuild } from '../../../../testing/render-in-build';
import { PartsPage } from './parts-page';

const system = (id: string, name: string, budget: string, sortOrder: number, safetyCaution = false): SystemDto =>
  testSystem(id, name, { budget, sortOrder, safetyCaution });

const overview: SystemsResponse = {
  currency: 'USD',
  systems: [system('s-engine', 'Engine', '100.00', 0), system('s-cooling', 'Cooling', '0.00', 2), system('s-brakes', 'Brakes', '500.00', 6, true)],
  contingencyBudget: '0.00',
  budgetWithContingency: '600.00',
  planned: '249.50',
  buildVersion: 2,
};

const part = (id: string, systemId: string, description: string, quantity: string, unitCost: string, total: string, extra: Partial<PartDto> = {}): PartDto =>
  testPart(id, { systemId, description, partNumber: '', quantity, estimatedUnitCost: unitCost, estimatedTotal: total, ...extra });

// Engine: 90.50 + 30.00 = 120.50 against 100.00, so 20.50 over. Brakes: 129.00 against 500.00, so 371.00 left.
const parts: PartDto[] = [
  part('p-clamps', 's-engine', 'Hose clamp pack', '2', '45.25', '90.50', { partNumber: 'HC-101' }),
  part('p-gasket', 's-engine', 'Valve cover gasket', '1', '30.00', '30.00', { status: 'on_hand', storageLocation: 'Bin 4' }),
  part('p-pads', 's-brakes', 'Ceramic brake pads', '2', '64.50', '129.00'),
];

async function renderAs(role: BuildRole) {
  const { http } = await renderInBuild(PartsPage, { role });
  http.expectOne('/api/builds/b-1/systems?archived=true').flush(overview);
  http.expectOne('/api/builds/b-1/parts').flush({ parts });
  await screen.findByText('Hose clamp pack');
  return http;
}

/** A row's cells as read, icons (ligature names) left out. */
function cellsOf(row: HTMLElement): string[] {
  return Array.from(row.querySelectorAll('td')).map((cell) => {
    const copy = cell.cloneNode(true) as HTMLElement;
    copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
  });
}

describe('PartsPage', () => {
  it('loads the price history once and shows the lowest and last price under a part bought on two receipts', async () => {
    const { http } = await renderInBuild(PartsPage, { role: 'reviewer' });
    http.expectOne('/api/builds/b-1/systems?archived=true').flush(overview);
    http.expectOne('/api/builds/b-1/parts').flush({ parts });
    const prices = [testPricePaid('r-1', 'Fernhill Auto Spares', '2026-03-03', '44.00'), testPricePaid('r-2', 'Fernhill Auto Spares', '2026-04-10', '47.50')];
    http.expectOne('/api/builds/b-1/price-history').flush({ currency: 'USD', items: [testPriceItem('number:hc101', 'Clamps', prices, 'HC 101')] });
    expect(await screen.findByText('Paid before: lowest $44.00, last $47.50')).toBeTruthy();
    // Only the clamps (HC-101) were bought twice.
    expect(screen.getAllByText(/Paid before/)).toHaveLength(1);
    http.expectNone('/api/builds/b-1/price-history');
  });

  it('shows a part\'s warranty under its description, with a link to the receipt it rests on', async () => {
    const { http } = await renderInBuild(PartsPage, { role: 'reviewer' });
    http.expectOne('/api/builds/b-1/systems?archived=true').flush(overview);
    const pump = part('p-pump', 's-cooling', 'Water pump', '1', '89.00', '89.00', { warranty: 12, warrantyStart: '2098-03-14', warrantyEnds: '2099-03-14', warrantyReceiptId: 'r-3' });
    http.expectOne('/api/builds/b-1/parts').flush({ parts: [pump, parts[0]] });
    await screen.findByText('Water pump');
    expect(screen.getByText('Under warranty until Mar 14, 2099')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open the receipt for Water pump' }).getAttribute('href')).toBe('/builds/b-1/receipts/r-3');
    // A part without a warranty says nothing about one.
    expect(document.querySelectorAll('th-warranty-status')).toHaveLength(1);
    // A reviewer reads it and changes nothing.
    expect(screen.queryByRole('button', { name: /^Warranty of/ })).toBeNull();
  });

  it('closes each system with a totals row: planned against budget, over budget in words with an icon', async () => {
    await renderAs('owner');

    const totals = Array.from(document.querySelectorAll<HTMLElement>('tr.total-row')).map(cellsOf);
    expect(totals).toEqual([
      ['Engine: planned against budget', '$120.50', 'of $100.00 budget planned $20.50 over budget'],
      ['Brakes: planned against budget', '$129.00', 'of $500.00 budget planned $371.00 under budget'],
    ]);
    const over = document.querySelector('tr.total-row .over')!;
    expect(over.querySelector('mat-icon')?.textContent).toBe('warning');
    // Group headings in system order, and the caution because Brakes is shown.
    expect(Array.from(document.querySelectorAll('tr.group-row .group-name')).map((cell) => cell.textContent)).toEqual(['Engine', 'Brakes']);
    expect(screen.getByText(/Tallyhood records costs only\./)).toBeTruthy();
    // Money right-aligned in the currency's minor units; a unit price keeps up to 4 decimals.
    const clamps = screen.getByText('Hose clamp pack').closest('tr')!;
    expect(cellsOf(clamps).slice(1, 6)).toEqual(['Hose clamp pack', 'HC-101', '2 each', '$45.25', '$90.50']);
  });

  it('hides the caution and the other systems when filtered to a system without safety work', async () => {
    await renderAs('owner');
    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: 'System' }));
    await user.click(await screen.findByRole('option', { name: 'Engine' }));

    expect(screen.queryByText('Ceramic brake pads')).toBeNull();
    expect(screen.queryByText(/Tallyhood records costs only\./)).toBeNull();
    expect(document.querySelectorAll('tr.total-row')).toHaveLength(1);
  });

  it('shows the reviewer statuses as text, with no status select, checkboxes, or add and import buttons', async () => {
    await renderAs('reviewer');

    expect(screen.queryAllByRole('combobox', { name: /^Status of/ })).toHaveLength(0);
    expect(screen.queryAllByRole('checkbox')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: 'Add part' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Import CSV' })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Edit / })).toBeNull();
    const gasket = screen.getByText('Valve cover gasket').closest('tr')!;
    expect(within(gasket).getByText('On the shelf')).toBeTruthy();
  });

  it('gives owner and crew a status select per part that saves with the version', async () => {
    const http = await renderAs('crew');
    const user = userEvent.setup();
    expect(screen.getAllByRole('combobox', { name: /^Status of/ })).toHaveLength(3);

    await user.click(screen.getByRole('combobox', { name: 'Status of Ceramic brake pads' }));
    await user.click(await screen.findByRole('option', { name: 'Ordered' }));
    const request = http.expectOne('/api/builds/b-1/parts/p-pads');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ status: 'ordered', version: 1 });
    request.flush({ ...parts[2], status: 'ordered', version: 2 });
  });

  it('moves the selected parts in bulk, sending exactly the chosen ids, and regroups them', async () => {
    const http = await renderAs('owner');
    const user = userEvent.setup();

    await user.click(screen.getByRole('checkbox', { name: 'Select Hose clamp pack' }));
    await user.click(screen.getByRole('checkbox', { name: 'Select Ceramic brake pads' }));
    expect(screen.getByText('2 selected')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Move to system' }));
    await user.click(await screen.findByRole('menuitem', { name: 'Cooling' }));

    const request = http.expectOne('/api/builds/b-1/parts/bulk');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ action: 'move', partIds: ['p-clamps', 'p-pads'], systemId: 's-cooling' });
    request.flush({ parts: [{ ...parts[0], systemId: 's-cooling' }, { ...parts[2], systemId: 's-cooling' }] });

    // Cooling has no budget: 90.50 + 129.00 = 219.50 with "No budget set"; Engine keeps the gasket's 30.00.
    await screen.findByText('Cooling: planned against budget');
    const totals = Array.from(document.querySelectorAll<HTMLElement>('tr.total-row')).map(cellsOf);
    expect(totals).toEqual([
      ['Engine: planned against budget', '$30.00', 'of $100.00 budget planned $70.00 under budget'],
      ['Cooling: planned against budget', '$219.50', 'No budget set'],
    ]);
    expect(screen.queryByText('2 selected')).toBeNull();
  });
});
