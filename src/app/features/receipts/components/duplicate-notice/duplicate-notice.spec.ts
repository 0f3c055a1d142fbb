// Duplicate notice: crew read the warning and who can clear it; the owner or reviewer marks a pair with a required
// reason (checked before sending and by the server) and gets the saved receipt back.
import { inputBinding, outputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ReceiptDto } from '../../../../../../shared/api/receipts';
import { apiTestProviders } from '../../../../../testing/api-test-providers';
import { testReceipt } from '../../../../../testing/build-fixtures';
import { DuplicateNotice } from './duplicate-notice';

const OTHER = '5b1e0c9e-8d0a-4c55-9a43-1f6f2d0c7a11';

async function renderNotice(canClear: boolean) {
  const cleared: ReceiptDto[] = [];
  await render(DuplicateNotice, {
    providers: [...apiTestProviders(), provideRouter([])],
    bindings: [
      inputBinding('buildId', () => 'b-1'),
      inputBinding('receipt', () => testReceipt('r-1', { state: 'filed', duplicateOf: [OTHER] })),
      inputBinding('canClear', () => canClear),
      outputBinding('cleared', (receipt: ReceiptDto) => cleared.push(receipt)),
    ],
  });
  return { http: TestBed.inject(HttpTestingController), cleared, user: userEvent.setup() };
}

describe('DuplicateNotice', () => {
  it('tells crew who can say the pair is two purchases, without the action', async () => {
    await renderNotice(false);
    expect(screen.getByRole('link', { name: 'another receipt' }).getAttribute('href')).toBe(`/${OTHER}`);
    expect(screen.getByText(/the owner or the reviewer can mark them "not a duplicate"/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Not a duplicate/ })).toBeNull();
  });

  it('asks for a reason, shows the server refusal beside it, then sends the pair and hands back the saved receipt', async () => {
    const { http, cleared, user } = await renderNotice(true);
    await user.click(screen.getByRole('button', { name: /Not a duplicate/ }));
    await user.click(await screen.findByRole('button', { name: 'Mark not a duplicate' }));
    expect(await screen.findByText('Say why these are two purchases.')).toBeTruthy();
    http.expectNone('/api/builds/b-1/receipts/r-1/not-duplicate');

    await user.type(screen.getByRole('textbox', { name: 'Why are these two purchases?' }), 'Two kits.');
    await user.click(screen.getByRole('button', { name: 'Mark not a duplicate' }));
    http
      .expectOne('/api/builds/b-1/receipts/r-1/not-duplicate')
      .flush({ error: { code: 'validation_failed', message: 'Check the reason.', fields: { reason: 'A reason is at most 500 characters.' } } }, { status: 400, statusText: 'Bad Request' });
    expect(await screen.findByText('A reason is at most 500 characters.')).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Mark not a duplicate' }));
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/not-duplicate');
    expect(request.request.body).toEqual({ otherReceiptId: OTHER, reason: 'Two kits.' });
    const saved = testReceipt('r-1', { state: 'filed', duplicateOf: [] });
    request.flush(saved);
    await waitFor(() => expect(cleared).toEqual([saved]));
    http.verify();
  });
});
