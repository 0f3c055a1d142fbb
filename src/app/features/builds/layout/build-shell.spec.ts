// The build shell: the phone bar's camera button is there for those who add receipts, saves the photo on the device,
// sends it at once and opens Receipts, where its progress shows; a chip counts captures still waiting; a reviewer, who adds none, does not get it.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { BuildRole } from '../../../../../shared/enums';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testBuild } from '../../../../testing/build-fixtures';
import { CAPTURE_DATABASE, CaptureQueue } from '../../receipts/services/capture-queue';
import { clear, createStore } from 'idb-keyval';
import { ReceiptUploads } from '../../receipts/services/receipt-uploads';
import { Session } from '../../../core/auth/session';
import { BuildShell } from './build-shell';

async function renderAs(role: BuildRole) {
  await render(BuildShell, { providers: [...apiTestProviders([{ path: '**', children: [] }])], bindings: [inputBinding('buildId', () => 'b-1')] });
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/builds/b-1').flush(testBuild(role));
  await screen.findByText('Teal wagon swap');
  return http;
}

describe('BuildShell', () => {
  beforeEach(() => clear(createStore(CAPTURE_DATABASE.name, CAPTURE_DATABASE.store)));

  it('saves a photo from the bar, sends it at once under its capture id and opens Receipts', async () => {
    const http = await renderAs('crew');
    TestBed.inject(Session).setUser({ id: 'u-1', email: 'sam@example.test', displayName: 'Sam Ortolan' });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate');
    await userEvent.setup().upload(screen.getByLabelText(/Add receipt/), new File(['png'], 'counter-slip.png', { type: 'image/png' }));
    const upload = await waitFor(() => http.expectOne({ method: 'POST', url: '/api/builds/b-1/receipts' }));
    expect((upload.request.body as FormData).getAll('files').map((file) => (file as File).name)).toEqual(['counter-slip.png']);
    const queued = TestBed.inject(CaptureQueue).waiting();
    expect(upload.request.headers.get('Idempotency-Key')).toBe(`"${queued[0].id}"`);
    expect(navigate).toHaveBeenCalledWith(['/builds', 'b-1', 'receipts']);
    const rows = TestBed.inject(ReceiptUploads).rows();
    expect(rows.map((row) => [row.buildId, row.name, row.status])).toEqual([['b-1', 'counter-slip.png', 'sending']]);
  });

  it('shows how many captures wait to be sent', async () => {
    await renderAs('crew');
    Object.defineProperty(navigator, 'onLine', { configurable: true, get: () => false });
    try {
      TestBed.inject(Session).setUser({ id: 'u-1', email: 'sam@example.test', displayName: 'Sam Ortolan' });
      await TestBed.inject(CaptureQueue).capture('b-1', [new File(['a'], 'a.jpg', { type: 'image/jpeg' }), new File(['b'], 'b.jpg', { type: 'image/jpeg' })]);
      expect(await screen.findByRole('button', { name: 'Waiting to send (2)' })).toBeTruthy();
    } finally {
      delete (navigator as { onLine?: boolean }).onLine;
    }
  });

  it('gives a reviewer no camera button', async () => {
    await renderAs('reviewer');
    expect(screen.queryByLabelText(/Add receipt/)).toBeNull();
    // On the phone bar Review takes the place of Parts, which moves to "More".
    const onBar = (name: string) => !screen.getByRole('link', { name }).closest('li')!.classList.contains('off-phone');
    expect(['Overview', 'Ledger', 'Receipts', 'Parts', 'Review'].map(onBar)).toEqual([true, true, true, false, true]);
  });

  it('keeps Parts on the phone bar for crew, and Review under "More"', async () => {
    await renderAs('crew');
    const onBar = (name: string) => !screen.getByRole('link', { name }).closest('li')!.classList.contains('off-phone');
    expect(['Overview', 'Ledger', 'Receipts', 'Parts', 'Review'].map(onBar)).toEqual([true, true, true, true, false]);
  });
});
