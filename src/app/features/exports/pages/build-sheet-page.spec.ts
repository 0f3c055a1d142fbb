// Printable build sheet: the parts grouped by system with cost and date, the summary and totals, the safety caution,
// the tax line, Print, and what an empty sheet says.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { BuildSheetDto } from '../../../../../shared/api/exports';
import { SAFETY_CAUTION } from '../../../../../shared/safety';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { BuildSheetPage } from './build-sheet-page';

const sheet: BuildSheetDto = {
  buildName: 'Teal wagon swap',
  vehicle: '1979 invented wagon, 3.1 L swap',
  currency: 'USD',
  locale: 'en-US',
  parts: [
    { systemId: 's-cool', system: 'Cooling', description: 'Aluminium radiator', partNumber: 'RAD-22', quantity: '1', unit: 'each', cost: '104.00', boughtOn: '2026-09-09' },
    { systemId: 's-fuel', system: 'Fuel', description: 'Fuel pump', partNumber: '', quantity: '1', unit: 'each', cost: '1104.50', boughtOn: '2026-09-09' },
    { systemId: 's-fuel', system: 'Fuel', description: 'Fuel line', partNumber: 'FL-8', quantity: '12.5', unit: 'ft', cost: null, boughtOn: null },
  ],
  systems: [
    { systemId: 's-cool', name: 'Cooling', fittedParts: 1, fittedCost: '104.00', netCost: '134.00', safetyCaution: false },
    { systemId: 's-fuel', name: 'Fuel', fittedParts: 2, fittedCost: '1104.50', netCost: '1104.50', safetyCaution: true },
  ],
  total: { fittedParts: 3, fittedCost: '1208.50', netCost: '1238.50' },
  safetyCaution: SAFETY_CAUTION,
  taxNote: 'These are records, not tax advice: ask a tax professional how they apply to you.',
};

async function renderSheet(shown: BuildSheetDto) {
  await render(BuildSheetPage, { providers: apiTestProviders(), bindings: [inputBinding('buildId', () => 'b-1')] });
  const http = TestBed.inject(HttpTestingController);
  const request = http.expectOne('/api/builds/b-1/exports/build-sheet');
  expect(request.request.method).toBe('GET');
  request.flush(shown);
  await screen.findByRole('heading', { name: `Build sheet: ${shown.buildName}` });
  return http;
}

const text = (element: Element) => (element.textContent ?? '').replace(/\s+/g, ' ').trim();
const rowsOf = (table: HTMLElement) => within(table).getAllByRole('row').slice(1).map((row) => Array.from(row.children).map(text));

describe('BuildSheetPage', () => {
  it('groups the fitted parts by system with cost and date, then the summary and totals', async () => {
    await renderSheet(sheet);
    expect(screen.getByText('1979 invented wagon, 3.1 L swap')).toBeTruthy();
    const cooling = screen.getByRole('region', { name: 'Cooling' });
    expect(rowsOf(within(cooling).getByRole('table'))).toEqual([['Aluminium radiator', 'RAD-22', '1 each', 'Sep 9, 2026', '$104.00']]);
    const fuel = screen.getByRole('region', { name: /^Fuel/ });
    expect(text(within(fuel).getByRole('heading'))).toBe('Fuel warning safety-critical');
    expect(rowsOf(within(fuel).getByRole('table'))).toEqual([
      ['Fuel pump', '—', '1 each', 'Sep 9, 2026', '$1,104.50'],
      ['Fuel line', 'FL-8', '12.5 ft', 'No receipt', 'No receipt'],
    ]);
    expect(rowsOf(within(screen.getByRole('region', { name: 'Summary by system' })).getByRole('table'))).toEqual([
      ['Cooling', '1', '$104.00', '$134.00'],
      ['Fuel', '2', '$1,104.50', '$1,104.50'],
      ['Total', '3', '$1,208.50', '$1,238.50'],
    ]);
  });

  it('carries the safety caution and the tax line, and prints', async () => {
    await renderSheet(sheet);
    const notes = screen.getAllByRole('note');
    // The caution comes first, above the parts, where nobody scrolls past it.
    expect(text(notes[0].querySelector('span')!)).toBe(`Safety: ${SAFETY_CAUTION}`);
    expect(text(notes[1])).toBe('These are records, not tax advice: ask a tax professional how they apply to you.');
    expect(notes).toHaveLength(2);
    const print = jest.spyOn(window, 'print').mockImplementation(() => undefined);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Print' }));
    expect(print).toHaveBeenCalledTimes(1);
    print.mockRestore();
  });

  it('says how to fill an empty sheet, still with the caution', async () => {
    await renderSheet({ ...sheet, parts: [], systems: [], total: { fittedParts: 0, fittedCost: '0.00', netCost: '0.00' } });
    expect(screen.getByRole('heading', { name: 'No fitted parts yet' })).toBeTruthy();
    expect(screen.getByText(/Mark parts as installed on the Parts screen/)).toBeTruthy();
    expect(screen.getByText(SAFETY_CAUTION)).toBeTruthy();
  });

  it('says when the sheet cannot be loaded', async () => {
    await render(BuildSheetPage, { providers: apiTestProviders(), bindings: [inputBinding('buildId', () => 'b-1')] });
    TestBed.inject(HttpTestingController)
      .expectOne('/api/builds/b-1/exports/build-sheet')
      .flush({ error: { code: 'not_found', message: 'That build was not found.' } }, { status: 404, statusText: 'Not Found' });
    expect(text(await screen.findByRole('alert'))).toBe('The build sheet could not be loaded. That build was not found.');
    expect((screen.getByRole('button', { name: 'Print' }) as HTMLButtonElement).disabled).toBe(true);
  });
});
