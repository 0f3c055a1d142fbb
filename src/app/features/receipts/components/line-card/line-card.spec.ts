// Line card (phones): the figures at a glance, the best suggestion one tap away with its reason, one assign field,
// the read figures behind "Correct what was read", and nothing to change for a reader without the right.
import { inputBinding, outputBinding } from '@angular/core';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { PriceHistoryResponse } from '../../../../../../shared/api/price-history';
import type { LineSuggestionDto } from '../../../../../../shared/api/suggestions';
import { testLine, testPart, testPriceItem, testPricePaid, testSystem } from '../../../../../testing/build-fixtures';
import { lineGroup, type LineAction, type LineField } from '../../models/line-form';
import type { Assignment } from '../assign-picker/assign-picker';
import { LineCard } from './line-card';

const systems = [testSystem('s-cooling', 'Cooling'), testSystem('s-brakes', 'Brakes')];
const parts = [testPart('p-pump', { systemId: 's-cooling', description: 'Electric water pump', partNumber: 'WP-880' })];
const pumpSuggestion: LineSuggestionDto = {
  partId: 'p-pump',
  partName: 'Electric water pump',
  systemId: 's-cooling',
  systemName: 'Cooling',
  score: 0.95,
  source: 'part-number',
  reason: 'part number WP-880 is on the bill of materials',
};

async function renderCard(options: {
  editable: boolean;
  systemId?: string | null;
  partId?: string | null;
  warrantySuggestion?: 12 | 'lifetime' | null;
  priceHistory?: PriceHistoryResponse | null;
}) {
  const line = testLine('l-1', 0, 'Water pump, electric 12V', '178.00', options.systemId ?? null, {
    quantity: '2',
    unitPrice: '89.00',
    partNumber: 'WP-880',
    partId: options.partId ?? null,
    partDescription: options.partId ? 'Electric water pump' : null,
    warrantySuggestion: options.warrantySuggestion ?? null,
  });
  const assigned: Assignment[] = [];
  const saved: LineField[] = [];
  const actions: LineAction[] = [];
  const group = lineGroup(line);
  await render(LineCard, {
    bindings: [
      inputBinding('line', () => line),
      inputBinding('lineNumber', () => 1),
      inputBinding('group', () => group),
      inputBinding('editable', () => options.editable),
      inputBinding('currency', () => 'USD'),
      inputBinding('locale', () => 'en-US'),
      inputBinding('parts', () => parts),
      inputBinding('systems', () => systems),
      inputBinding('suggestions', () => [pumpSuggestion]),
      inputBinding('receiptId', () => 'r-checking'),
      inputBinding('priceHistory', () => options.priceHistory ?? null),
      outputBinding<Assignment>('assign', (value) => assigned.push(value)),
      outputBinding<LineField>('save', (value) => saved.push(value)),
      outputBinding<LineAction>('action', (value) => actions.push(value)),
    ],
  });
  return { assigned, saved, actions, group };
}

describe('LineCard', () => {
  it('shows the description, the amount, and quantity × unit price in the build currency', async () => {
    await renderCard({ editable: true });
    expect(screen.getByRole('heading', { level: 3 }).textContent?.replace(/\s+/g, ' ').trim()).toBe('Line 1: Water pump, electric 12V');
    expect(screen.getByText('$178.00')).toBeTruthy();
    expect(screen.getByText('2 × $89.00')).toBeTruthy();
    expect(screen.getByText('Part no. WP-880')).toBeTruthy();
    expect(screen.queryByText(/warranty/)).toBeNull();
  });

  it('says how far the unit price is above the lowest the build paid on another receipt', async () => {
    // 89.00 against 79.00 is 12.66 %: 13 %.
    await renderCard({
      editable: true,
      priceHistory: { currency: 'USD', items: [testPriceItem('number:wp880', 'Water pump', [testPricePaid('r-old', 'Fernhill Auto Spares', '2026-03-03', '79.00')], 'WP 880')] },
    });
    expect(screen.getByText('13 % above the lowest this build paid: $79.00 at Fernhill Auto Spares, Mar 3, 2026')).toBeTruthy();
  });

  it('shows no price hint without a history', async () => {
    await renderCard({ editable: true });
    expect(screen.queryByText(/above the lowest/)).toBeNull();
  });

  it('says the warranty the line\'s words suggest for its part', async () => {
    await renderCard({ editable: true, systemId: 's-cooling', partId: 'p-pump', warrantySuggestion: 12 });
    expect(screen.getByText('Says a 12-month warranty: its part gets it when filed, unless it has one')).toBeTruthy();
  });

  it('offers the best suggestion with its reason, and one tap assigns the part with its system', async () => {
    const { assigned } = await renderCard({ editable: true });
    const offer = screen.getByRole('button', { name: /Use Electric water pump/ });
    expect(offer.textContent).toContain('part number WP-880 is on the bill of materials');
    await userEvent.setup().click(offer);
    expect(assigned).toEqual([{ partId: 'p-pump', systemId: 's-cooling' }]);
  });

  it('offers nothing once the line is assigned, and names the system of the part as text', async () => {
    await renderCard({ editable: true, systemId: 's-cooling', partId: 'p-pump' });
    expect(screen.queryByRole('button', { name: /Use / })).toBeNull();
    expect((screen.getByRole('combobox', { name: /Assign line 1/ }) as HTMLInputElement).value).toBe('Electric water pump');
    expect(screen.getByText('System: Cooling')).toBeTruthy();
    // One assign field: no second list for the system.
    expect(screen.getAllByRole('combobox')).toHaveLength(1);
  });

  it('keeps the read figures folded, and saves a corrected amount when it is left', async () => {
    const { saved, group } = await renderCard({ editable: true });
    expect(screen.queryByRole('textbox', { name: 'Amount' })).toBeNull();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: /Correct what was read/ }));
    const amount = screen.getByRole('textbox', { name: 'Amount' });
    await user.clear(amount);
    await user.type(amount, '170.00');
    await user.tab();
    expect(group.controls.amount.value).toBe('170.00');
    expect(saved).toEqual(['amount']);
  });

  it('gives a reader without the right to change it the figures and the assignment, with no control', async () => {
    await renderCard({ editable: false, systemId: 's-cooling', partId: 'p-pump' });
    expect(screen.queryAllByRole('button')).toEqual([]);
    expect(screen.queryAllByRole('combobox')).toEqual([]);
    expect(screen.getByText('Assigned to Electric water pump · Cooling')).toBeTruthy();
  });
});
