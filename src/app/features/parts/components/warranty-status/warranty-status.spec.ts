// The warranty in words for each state, with the link to the receipt it rests on.
import { inputBinding } from '@angular/core';
import { provideRouter } from '@angular/router';
import { render, screen } from '@testing-library/angular/zoneless';
import type { PartDto } from '../../../../../../shared/api/parts';
import { testPart } from '../../../../../testing/build-fixtures';
import { WarrantyStatus } from './warranty-status';

async function renderFor(part: PartDto, today = '2027-03-14') {
  const { fixture } = await render(WarrantyStatus, {
    providers: [provideRouter([])],
    bindings: [inputBinding('part', () => part), inputBinding('buildId', () => 'b-7'), inputBinding('locale', () => 'en-US'), inputBinding('today', () => today)],
  });
  const element = fixture.nativeElement as HTMLElement;
  // The words alone (the icons' ligature names are text too), or '' when nothing is shown.
  return element.querySelector('.words')?.textContent?.trim() ?? element.textContent!.trim();
}

describe('WarrantyStatus', () => {
  it('says until when a part is under warranty, its last day included, and links its receipt', async () => {
    const text = await renderFor(testPart('p-1', { warranty: 12, warrantyStart: '2026-03-14', warrantyEnds: '2027-03-14', warrantyReceiptId: 'r-9' }));
    expect(text).toBe('Under warranty until Mar 14, 2027');
    const link = screen.getByRole('link', { name: 'Open the receipt for Ceramic brake pads, front axle' });
    expect(link.getAttribute('href')).toBe('/builds/b-7/receipts/r-9');
  });

  it('says when it ended, the day after its last day', async () => {
    const text = await renderFor(testPart('p-1', { warranty: 1, warrantyStart: '2026-01-31', warrantyEnds: '2026-02-28' }), '2026-03-01');
    expect(text).toBe('Warranty ended Feb 28, 2026');
    expect(screen.queryByRole('link')).toBeNull();
  });

  it('says lifetime for a lifetime warranty', async () => {
    expect(await renderFor(testPart('p-1', { warranty: 'lifetime', warrantyStart: '2026-03-14', warrantyReceiptId: 'r-9' }))).toBe('Lifetime warranty');
    expect(screen.getByRole('link', { name: 'Open the receipt for Ceramic brake pads, front axle' }).getAttribute('href')).toBe('/builds/b-7/receipts/r-9');
  });

  it('shows nothing for a part without a warranty', async () => {
    expect(await renderFor(testPart('p-1'))).toBe('');
  });
});
