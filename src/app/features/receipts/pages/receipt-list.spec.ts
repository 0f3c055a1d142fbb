// Receipts list: a refused upload shows the server's message beside the file, a likely duplicate is flagged in words, and the empty screen says what to do.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpEventType } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { BuildDto } from '../../../../../shared/api/builds';
import type { ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { CurrentBuild } from '../../builds/services/current-build';
import { ReceiptList } from './receipt-list';

const build = (role: BuildRole): BuildDto => ({
  id: 'b-1',
  name: 'Teal wagon swap',
  vehicle: '1979 invented wagon',
  currency: 'USD',
  locale: 'en-US',
  status: 'active',
  startedOn: null,
  targetDate: null,
  returnWindowDays: 30,
  archived: false,
  version: 2,
  role,
  createdAt: '2026-01-05T09:00:00.000Z',
});

const summary = (id: string, extra: Partial<ReceiptSummaryDto> = {}): ReceiptSummaryDto => ({
  id,
  vendorName: 'Ridgeback Parts',
  purchaseDate: '2026-02-14',
  receiptNumber: 'A-100',
  total: '41.50',
  state: 'to_check',
  readingProgress: 100,
  reviewState: 'none',
  originalFilename: 'slip.png',
  contentType: 'image/png',
  lineCount: 3,
  duplicateOf: [],
  systemIds: [],
  uploadedBy: 'u-1',
  createdAt: '2026-02-14T10:00:00.000Z',
  version: 1,
  ...extra,
});

async function renderAs(role: BuildRole, receipts: ReceiptSummaryDto[]) {
  await render(ReceiptList, {
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
  http.expectOne('/api/builds/b-1/receipts').flush({ receipts });
  http.expectOne('/api/builds/b-1/systems').flush({ currency: 'USD', systems: [], contingencyBudget: '0', totalBudget: '0', totalEstimate: '0', buildVersion: 2 });
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

  it('asks the server again when a filter changes', async () => {
    const http = await renderAs('owner', [summary('r-1')]);
    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: 'State' }));
    await user.click(await screen.findByRole('option', { name: 'Filed' }));
    http.expectOne('/api/builds/b-1/receipts?state=filed').flush({ receipts: [] });
    expect(await screen.findByText('No receipt matches these filters. Clear a filter to see more.')).toBeTruthy();
  });
});
