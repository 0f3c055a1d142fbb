// Exports page: the filters travel as YYYY-MM-DD and a system id, a download shows its progress and is saved under
// the server's file name, the archive ignores filters, a reversed range and a failed download say what to do.
import { HttpEventType } from '@angular/common/http';
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { provideMomentDateAdapter } from '@angular/material-moment-adapter';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testSystem, testSystemsResponse } from '../../../../testing/build-fixtures';
import { ExportsPage } from './exports-page';

const saved: { href: string; download: string }[] = [];

beforeEach(() => {
  saved.length = 0;
  // jsdom has no object URLs and does not navigate: record what would be saved instead.
  URL.createObjectURL = jest.fn(() => 'blob:tallyhood/1');
  URL.revokeObjectURL = jest.fn();
  jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
    saved.push({ href: this.href, download: this.download });
  });
});
afterEach(() => jest.restoreAllMocks());

async function renderPage() {
  await render(ExportsPage, {
    providers: [...apiTestProviders(), provideMomentDateAdapter()],
    bindings: [inputBinding('buildId', () => 'b-1')],
  });
  const http = TestBed.inject(HttpTestingController);
  http
    .expectOne('/api/builds/b-1/systems')
    .flush(testSystemsResponse([testSystem('s-fuel', 'Fuel'), testSystem('s-tools', 'Tools and consumables')]));
  await screen.findByRole('heading', { name: 'Exports' });
  return http;
}

describe('ExportsPage', () => {
  it('downloads the tax ledger with the date range and system, showing progress, and saves it under its name', async () => {
    const http = await renderPage();
    const user = userEvent.setup();
    // The moment adapter's default locale reads M/D/YYYY.
    await user.type(screen.getByRole('textbox', { name: 'Bought from' }), '10/1/2026');
    await user.type(screen.getByRole('textbox', { name: 'Bought to' }), '10/31/2026');
    await user.click(screen.getByRole('combobox', { name: 'System' }));
    await user.click(await screen.findByRole('option', { name: 'Fuel' }));
    await user.click(screen.getByRole('button', { name: 'Download tax ledger' }));

    const request = http.expectOne((req) => req.url === '/api/builds/b-1/exports/tax-ledger.csv');
    expect(request.request.params.toString()).toBe('from=2026-10-01&to=2026-10-31&systemId=s-fuel');
    expect(request.request.responseType).toBe('blob');
    request.event({ type: HttpEventType.DownloadProgress, loaded: 2048, total: undefined });
    expect(await screen.findByText('Preparing and downloading… 2.0 kB received')).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: 'Downloading Tax ledger (CSV)' }).getAttribute('mode')).toBe('indeterminate');
    expect((screen.getByRole('button', { name: 'Download tax ledger' }) as HTMLButtonElement).disabled).toBe(true);

    request.flush(new Blob(['date,vendor\r\n'], { type: 'text/csv' }), { headers: { 'Content-Disposition': 'attachment; filename="teal-wagon-tax-ledger.csv"' } });
    expect(await screen.findByText(/Saved teal-wagon-tax-ledger\.csv \(13 bytes\)/)).toBeTruthy();
    expect(saved).toEqual([{ href: 'blob:tallyhood/1', download: 'teal-wagon-tax-ledger.csv' }]);
    expect(URL.createObjectURL).toHaveBeenCalledTimes(1);
  });

  it('sends the archive without filters and says what to do when it fails', async () => {
    const http = await renderPage();
    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: 'System' }));
    await user.click(await screen.findByRole('option', { name: 'Fuel' }));
    await user.click(screen.getByRole('button', { name: 'Download ZIP archive' }));
    const request = http.expectOne((req) => req.url === '/api/builds/b-1/exports/archive.zip');
    expect(request.request.params.keys()).toEqual([]);
    request.flush(new Blob(['oops']), { status: 500, statusText: 'Server Error' });
    expect((await screen.findByRole('alert')).textContent?.trim()).toBe('The ZIP archive could not be downloaded. Try again in a moment; if it keeps failing, let us know.');
    expect(saved).toEqual([]);
  });

  it('says when the system is unknown (404) on the build sheet', async () => {
    const http = await renderPage();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Download build sheet' }));
    const request = http.expectOne((req) => req.url === '/api/builds/b-1/exports/build-sheet.csv');
    expect(request.request.params.keys()).toEqual([]);
    request.flush(new Blob(['{}']), { status: 404, statusText: 'Not Found' });
    expect((await screen.findByRole('alert')).textContent?.trim()).toBe(
      'The build sheet could not be downloaded. The build or the chosen system was not found: choose "All systems" or reload the page.',
    );
  });

  it('refuses a range that ends before it starts, before sending anything', async () => {
    const http = await renderPage();
    const user = userEvent.setup();
    await user.type(screen.getByRole('textbox', { name: 'Bought from' }), '11/5/2026');
    await user.type(screen.getByRole('textbox', { name: 'Bought to' }), '11/1/2026');
    await user.tab();
    expect((await screen.findByRole('alert')).textContent?.trim()).toBe('The end date is before the start date: swap them.');
    expect((screen.getByRole('button', { name: 'Download tax ledger' }) as HTMLButtonElement).disabled).toBe(true);
    http.expectNone((req) => req.url.includes('/exports/'));
  });

  it('says what each file holds, that it is not tax advice, and links the printable build sheet', async () => {
    await renderPage();
    expect(screen.getByText('These files are your records, not tax advice: ask a tax professional how they apply to you.')).toBeTruthy();
    expect(screen.getByText('Both CSVs for the whole build and every receipt document as it was uploaded.')).toBeTruthy();
    expect(screen.getByRole('link', { name: /Printable build sheet/ }).getAttribute('href')).toBe('/build-sheet');
  });
});
