// Receipts list: a refused upload shows the server's message beside the file, a likely duplicate is flagged in words, the empty screen says what to do,
// and the filters live in the URL.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpEventType } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { provideApiHttp } from '../../../core/http/provide-api-http';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { CurrentBuild } from '../../builds/services/current-build';
import { ReceiptList } from './receipt-list';
import { testBuild, testReceiptSummary } from '../../../../testing/build-fixtures';

/** Ready to check, 41.50, three lines: the list's usual row. */
const summary = (id: string, extra: Partial<ReceiptSummaryDto> = {}): ReceiptSummaryDto =>
  testReceiptSummary(id, { total: '41.50', lineCount: 3, uploadedBy: 'u-1', ...extra });

async function renderAs(role: BuildRole, receipts: ReceiptSummaryDto[]) {
  await render(ReceiptList, {
    providers: [
      ...apiTestProviders(),
      {
        provide: CurrentBuild,
        useFactory: () => {
          const current = new CurrentBuild();
          current.set(testBuild(role));
          return current;
        },
      },
    ],
    bindings: [inputBinding('buildId', () => 'b-1')],
  });
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/builds/b-1/receipts').flush({ receipts });
  http.expectOne('/api/builds/b-1/systems').flush({ currency: 'USD', systems: [], contingencyBudget: '0', budgetWithContingency: '0', planned: '0', buildVersion: 2 });
  await screen.findByRole('heading', { name: receipts.length ? 'Receipts' : 'No receipts yet' });
  await screen.findAllByText(receipts.length ? /Ridgeback Parts|Copperline/ : 'No receipts yet');
  return http;
}

describe('ReceiptList', () => {
  it('shows a refused file with the server message and the accepted one with its own progress, then done', async () => {
    const http = await renderAs('crew', [summary('r-1')]);
    const user = userEvent.setup();
    const picker = screen.getByLabelText(/Choose several files/);
    await user.upload(picker, [new File(['%PDF'], 'invoice.pdf', { type: 'application/pdf' }), new File(['hello'], 'notes.png', { type: 'image/png' })]);

    const [good, bad] = http.match('/api/builds/b-1/receipts').filter((request) => request.request.method === 'POST');
    expect(((good.request.body as FormData).get('files') as File).name).toBe('invoice.pdf');
    expect(((bad.request.body as FormData).get('files') as File).name).toBe('notes.png');

    bad.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'notes.png: this is not a photo or PDF we can read.',
          fields: { 'files.0': 'notes.png: this is not a photo or PDF we can read. Send JPEG, PNG, WebP or HEIC photos, or PDF invoices.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    const refusal = await screen.findByText(/notes\.png: this is not a photo or PDF we can read\. Send JPEG, PNG, WebP or HEIC photos, or PDF invoices\./);
    expect(refusal.getAttribute('role')).toBe('alert');

    good.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 100 });
    expect(await screen.findByText('40%')).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: 'Uploading invoice.pdf' }).getAttribute('aria-valuenow')).toBe('40');

    good.flush({ receipts: [] }, { status: 201, statusText: 'Created' });
    expect(await screen.findByText(/Uploaded, reading now/)).toBeTruthy();
    // The list is asked again so the new receipt appears.
    http.expectOne('/api/builds/b-1/receipts').flush({ receipts: [summary('r-1'), summary('r-2', { state: 'queued', vendorName: null, originalFilename: 'invoice.pdf', total: null })] });
    expect(await screen.findByText('Waiting to be read')).toBeTruthy();
  });

  it('flags a likely duplicate in words, and shows shop, date, total and state', async () => {
    await renderAs('owner', [summary('r-1', { duplicateOf: ['r-2'] }), summary('r-2', { vendorName: 'Copperline Supply', duplicateOf: [] })]);
    const first = (await screen.findAllByRole('link')).find((link) => link.textContent?.includes('Ridgeback Parts'))!;
    expect(first.textContent?.replace(/\s+/g, ' ')).toContain('Feb 14, 2026');
    expect(first.textContent).toContain('$41.50');
    expect(first.textContent).toContain('Ready to check');
    expect(first.textContent).toContain('Possible duplicate: another receipt has the same shop, date and total, or the same file.');
    const second = screen.getAllByRole('link').find((link) => link.textContent?.includes('Copperline Supply'))!;
    expect(second.textContent).not.toContain('Possible duplicate');
  });

  it('tells a reviewer with no receipts what happens here, without the add action', async () => {
    await renderAs('reviewer', []);
    expect(await screen.findByText('No receipts yet')).toBeTruthy();
    expect(screen.getByText(/The owner and crew add receipts here/)).toBeTruthy();
    expect(screen.queryByLabelText(/Add receipts/)).toBeNull();
  });

  it('asks the server again when a filter changes, through the URL', async () => {
    const http = await renderAs('owner', [summary('r-1')]);
    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: 'State' }));
    await user.click(await screen.findByRole('option', { name: 'Filed' }));
    (await nextRequest(http, '/api/builds/b-1/receipts?state=filed')).flush({ receipts: [] });
    expect(TestBed.inject(Router).url).toBe('/?state=filed');
    expect(await screen.findByText('No receipt matches these filters. Clear a filter to see more.')).toBeTruthy();
  });
});

describe('ReceiptList filters in the URL', () => {
  /** Opens the list as the app routes it: under the build, its id bound from the path, the filters in the query. */
  async function openAt(url: string) {
    TestBed.configureTestingModule({
      providers: [
        provideApiHttp(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'builds/:buildId/receipts', component: ReceiptList }], withComponentInputBinding()),
        {
          provide: CurrentBuild,
          useFactory: () => {
            const current = new CurrentBuild();
            current.set(testBuild('owner'));
            return current;
          },
        },
      ],
    });
    await RouterTestingHarness.create(url);
    return TestBed.inject(HttpTestingController);
  }
  const systems = { currency: 'USD', systems: [], contingencyBudget: '0', budgetWithContingency: '0', planned: '0', buildVersion: 2 };
  const stateShown = () => screen.getByRole('combobox', { name: 'State' }).textContent?.trim();

  it('asks the server for the filters of the URL it opens at, and shows them chosen', async () => {
    const http = await openAt('/builds/b-1/receipts?state=filed&vendor=ridge&from=2026-01-01&to=2026-03-31');
    http.expectOne('/api/builds/b-1/receipts?state=filed&vendor=ridge&from=2026-01-01&to=2026-03-31').flush({ receipts: [summary('r-1', { state: 'filed' })] });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    await waitFor(() => expect(stateShown()).toBe('Filed'));
    expect((screen.getByRole('textbox', { name: 'Shop' }) as HTMLInputElement).value).toBe('ridge');
    expect((screen.getByLabelText('Bought from') as HTMLInputElement).value).toBe('2026-01-01');
    expect((screen.getByLabelText('Bought to') as HTMLInputElement).value).toBe('2026-03-31');
    http.verify();
  });

  it('leaves out a state or a date from the URL that the server would refuse', async () => {
    const http = await openAt('/builds/b-1/receipts?state=lost&from=last-week');
    http.expectOne('/api/builds/b-1/receipts').flush({ receipts: [summary('r-1')] });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    await waitFor(() => expect(stateShown()).toBe('Any state'));
    http.verify();
  });

  it('shows the review state of each filed receipt as an icon and a word, and filters by it through the URL', async () => {
    const http = await openAt('/builds/b-1/receipts?review=answered');
    http.expectOne('/api/builds/b-1/receipts?review=answered').flush({
      receipts: [summary('r-1', { state: 'filed', reviewState: 'answered' }), summary('r-2', { state: 'filed', reviewState: 'questioned', vendorName: 'Copperline Supply' }), summary('r-3', { state: 'to_check' })],
    });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    const reviewShown = () => screen.getByRole('combobox', { name: 'Review' }).textContent?.trim();
    await waitFor(() => expect(reviewShown()).toBe('Answered'));
    const rows = Array.from((await screen.findByRole('list', { name: 'Receipts' })).querySelectorAll('li'));
    // The icon and the word, never a colour alone; a receipt not filed yet has no review to show.
    const review = (row: Element) => row.querySelector('.review');
    expect(rows.map((row) => review(row)?.querySelector('mat-icon')?.textContent?.trim() ?? null)).toEqual(['forum', 'help', null]);
    expect(rows.map((row) => review(row)?.textContent?.replace(review(row)!.querySelector('mat-icon')!.textContent!, '').trim() ?? null)).toEqual(['Review: Answered', 'Review: Questioned', null]);

    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: 'Review' }));
    await user.click(await screen.findByRole('option', { name: 'Questioned' }));
    (await nextRequest(http, '/api/builds/b-1/receipts?review=questioned')).flush({ receipts: [] });
    expect(TestBed.inject(Router).url).toBe('/builds/b-1/receipts?review=questioned');
    http.verify();
  });

  it('leaves out a review state from the URL that the server would refuse', async () => {
    const http = await openAt('/builds/b-1/receipts?review=maybe');
    http.expectOne('/api/builds/b-1/receipts').flush({ receipts: [summary('r-1')] });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Review' }).textContent?.trim()).toBe('Any review'));
    http.verify();
  });

  it('narrows the list to likely duplicates from the URL without asking the server again, and widens it again', async () => {
    const http = await openAt('/builds/b-1/receipts?duplicates=only');
    // The server is asked for every receipt: it flags duplicates on each, and the list keeps the flagged ones.
    http.expectOne('/api/builds/b-1/receipts').flush({
      receipts: [summary('r-1', { duplicateOf: ['r-2'] }), summary('r-2', { duplicateOf: ['r-1'] }), summary('r-3', { vendorName: 'Copperline Supply' })],
    });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    const shops = async () => (await screen.findByRole('list', { name: 'Receipts' })).querySelectorAll('li').length;
    await waitFor(async () => expect(await shops()).toBe(2));
    expect(screen.queryByText('Copperline Supply')).toBeNull();
    const only = screen.getByRole('checkbox', { name: 'Possible duplicates only' }) as HTMLInputElement;
    expect(only.checked).toBe(true);

    await userEvent.setup().click(only);
    await waitFor(async () => expect(await shops()).toBe(3));
    expect(TestBed.inject(Router).url).toBe('/builds/b-1/receipts');
    http.verify();
  });

  it('writes a changed filter into the URL in place of the current entry, and asks the server for it', async () => {
    const http = await openAt('/builds/b-1/receipts?state=filed');
    http.expectOne('/api/builds/b-1/receipts?state=filed').flush({ receipts: [summary('r-1', { state: 'filed' })] });
    http.expectOne('/api/builds/b-1/systems').flush(systems);
    const router = TestBed.inject(Router);
    const user = userEvent.setup();

    await user.click(await screen.findByRole('combobox', { name: 'State' }));
    await user.click(await screen.findByRole('option', { name: 'Ready to check' }));
    (await nextRequest(http, '/api/builds/b-1/receipts?state=to_check')).flush({ receipts: [summary('r-1')] });
    expect(router.url).toBe('/builds/b-1/receipts?state=to_check');
    // Back then leaves the list instead of stepping through each choice.
    expect(router.lastSuccessfulNavigation()?.extras.replaceUrl).toBe(true);

    await user.type(screen.getByRole('textbox', { name: 'Shop' }), 'ridge');
    (await nextRequest(http, '/api/builds/b-1/receipts?state=to_check&vendor=ridge')).flush({ receipts: [summary('r-1')] });
    expect(router.url).toBe('/builds/b-1/receipts?state=to_check&vendor=ridge');

    // "Any state" takes the state out of the URL.
    await user.click(screen.getByRole('combobox', { name: 'State' }));
    await user.click(await screen.findByRole('option', { name: 'Any state' }));
    (await nextRequest(http, '/api/builds/b-1/receipts?vendor=ridge')).flush({ receipts: [summary('r-1')] });
    expect(router.url).toBe('/builds/b-1/receipts?vendor=ridge');
    http.verify();
  });
});

/** Waits for a request sent once a navigation or a typing pause has settled. */
async function nextRequest(http: HttpTestingController, url: string) {
  for (let attempt = 0; attempt < 100; attempt++) {
    const [request] = http.match(url);
    if (request) return request;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  return http.expectOne(url);
}
