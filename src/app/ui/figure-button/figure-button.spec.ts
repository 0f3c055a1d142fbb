// FigureButton: a money figure that opens its lines, and a zero that stays plain text (it has no lines to show).
import { inputBinding, outputBinding } from '@angular/core';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { FigureButton } from './figure-button';

async function renderFigure(amount: string, opened: string[]) {
  return render(FigureButton, {
    bindings: [
      inputBinding('amount', () => amount),
      inputBinding('currency', () => 'EUR'),
      inputBinding('locale', () => 'de-DE'),
      inputBinding('what', () => 'Net cost of Cooling'),
      outputBinding('open', () => opened.push(amount)),
    ],
  });
}

describe('FigureButton', () => {
  it('is a button named with the figure and what it is, and says when it is pressed', async () => {
    const opened: string[] = [];
    await renderFigure('1234.50', opened);
    // German grouping and decimal comma, the euro sign after the figure behind a no-break space (CLDR, as
    // Intl.NumberFormat prints it).
    await userEvent.setup().click(screen.getByRole('button', { name: '1.234,50\u00a0€ (Net cost of Cooling: show the lines)' }));
    expect(opened).toEqual(['1234.50']);
  });

  it('leaves a zero as plain text, with no button', async () => {
    const { container } = await renderFigure('0.00', []);
    expect(screen.queryByRole('button')).toBeNull();
    expect(container.textContent?.trim()).toBe('0,00\u00a0€');
  });
});
