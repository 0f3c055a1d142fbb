// Verdict controls: Approve sends the version shown, Question needs words (checked before and by the server), a stale
// version is handed to the parent, and another receipt starts with the question closed.
import { inputBinding, outputBinding, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ReceiptDto } from '../../../../../../shared/api/receipts';
import { apiTestProviders } from '../../../../../testing/api-test-providers';
import { testReceipt } from '../../../../../testing/build-fixtures';
import { ReviewVerdict } from './review-verdict';

const receipt = (id: string, extra: Partial<ReceiptDto> = {}): ReceiptDto => testReceipt(id, { state: 'filed', reviewState: 'answered', version: 7, ...extra });

async function renderVerdict() {
  const shown = signal(receipt('r-1'));
  const decided: unknown[] = [];
  let stale = 0;
  await render(ReviewVerdict, {
    providers: apiTestProviders(),
    bindings: [
      inputBinding('buildId', () => 'b-1'),
      inputBinding('receipt', shown),
      outputBinding('decided', (value: unknown) => decided.push(value)),
      outputBinding('stale', () => (stale += 1)),
    ],
  });
  return { http: TestBed.inject(HttpTestingController), shown, decided, stale: () => stale, user: userEvent.setup() };
}

describe('ReviewVerdict', () => {
  it('approves with the version shown and tells the parent the new state', async () => {
    const { http, decided, user } = await renderVerdict();
    await user.click(screen.getByRole('button', { name: /Approve/ }));
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/review');
    expect(request.request.body).toEqual({ verdict: 'approved', comment: '', version: 7 });
    request.flush({ reviewState: 'approved', reviewComment: '', version: 8 });
    expect(decided).toEqual([{ verdict: 'approved', reviewState: 'approved', reviewComment: '', version: 8 }]);
    http.verify();
  });

  it('asks for the words of a question before sending, shows the server refusal beside the field, then sends it', async () => {
    const { http, decided, user } = await renderVerdict();
    await user.click(screen.getByRole('button', { name: /Question/ }));
    expect(screen.getByRole('button', { name: /Question/ }).getAttribute('aria-expanded')).toBe('true');
    await user.click(screen.getByRole('button', { name: 'Send question' }));
    expect(await screen.findByText('Say what the question is.')).toBeTruthy();
    http.expectNone('/api/builds/b-1/receipts/r-1/review');

    await user.type(screen.getByRole('textbox', { name: 'What is the question?' }), 'Which car?');
    await user.click(screen.getByRole('button', { name: 'Send question' }));
    http
      .expectOne('/api/builds/b-1/receipts/r-1/review')
      .flush({ error: { code: 'validation_failed', message: 'Check the comment.', fields: { comment: 'A comment is at most 2000 characters.' } } }, { status: 400, statusText: 'Bad Request' });
    expect(await screen.findByText('A comment is at most 2000 characters.')).toBeTruthy();
    expect(decided).toEqual([]);

    await user.click(screen.getByRole('button', { name: 'Send question' }));
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/review');
    expect(request.request.body).toEqual({ verdict: 'questioned', comment: 'Which car?', version: 7 });
    request.flush({ reviewState: 'questioned', reviewComment: 'Which car?', version: 8 });
    expect(decided).toEqual([{ verdict: 'questioned', reviewState: 'questioned', reviewComment: 'Which car?', version: 8 }]);
    await waitFor(() => expect(screen.queryByRole('textbox', { name: 'What is the question?' })).toBeNull());
    http.verify();
  });

  it('hands a stale version to the parent and closes an open question when another receipt is shown', async () => {
    const { http, shown, decided, stale, user } = await renderVerdict();
    await user.click(screen.getByRole('button', { name: /Approve/ }));
    http
      .expectOne('/api/builds/b-1/receipts/r-1/review')
      .flush({ error: { code: 'stale_version', message: 'Changed meanwhile.', fields: {} } }, { status: 409, statusText: 'Conflict' });
    expect([stale(), decided.length]).toEqual([1, 0]);

    await user.click(screen.getByRole('button', { name: /Question/ }));
    expect(screen.getByRole('textbox', { name: 'What is the question?' })).toBeTruthy();
    shown.set(receipt('r-2'));
    await waitFor(() => expect(screen.queryByRole('textbox', { name: 'What is the question?' })).toBeNull());
    http.verify();
  });
});
