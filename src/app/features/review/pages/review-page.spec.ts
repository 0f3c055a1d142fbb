// Review page: the queue beside the chosen receipt, Approve and Question (with its required comment) sending the
// version, the next receipt opening after a verdict, the 409 reload, crew without verdict buttons, the empty queue.
import { HttpTestingController } from '@angular/common/http/testing';
import { screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ReceiptDto, ReceiptLineDto, ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { testReceipt, testReceiptSummary, testSystem, testSystemsResponse } from '../../../../testing/build-fixtures';
import { renderInBuild } from '../../../../testing/render-in-build';
import { ReviewPage } from './review-page';

// The typing tests type a question key by key: on a busy 2-core machine they came near jest's 5 s default.
jest.setTimeout(15_000);

const summary = (id: string, vendorName: string, purchaseDate: string, total: string, extra: Partial<ReceiptSummaryDto> = {}): ReceiptSummaryDto =>
  testReceiptSummary(id, { vendorName, purchaseDate, receiptNumber: '', total, state: 'filed', lineCount: 1, version: 3, ...extra });

const line = (id: string, description: string, amount: string, tax: string, shipping: string, systemId: string | null, partDescription: string | null = null): ReceiptLineDto => ({
  id,
  position: 0,
  kind: 'part',
  description,
  partNumber: '',
  quantity: '1',
  unitPrice: null,
  amount,
  taxable: true,
  allocatedTax: tax,
  allocatedShipping: shipping,
  allocatedDiscount: '0.00',
  partId: partDescription ? 'p-1' : null,
  partDescription,
  systemId,
  returnOfLineId: null,
  box: null,
  confidence: {},
  warrantySuggestion: null,
  version: 1,
});

const detail = (from: ReceiptSummaryDto, lines: ReceiptLineDto[]): ReceiptDto =>
  testReceipt(from.id, {
    ...from,
    shipping: '5.00',
    pages: [{ index: 0, width: 600, height: 900 }],
    lines,
    reconciliation: { linesTotal: '40.00', computedTotal: '47.00', printedTotal: '47.00', difference: '0.00', reconciles: true },
  });

const ridgeback = summary('r-1', 'Ridgeback Parts', '2026-02-14', '47.00');
const quayside = summary('r-2', 'Quayside Counter', '2026-02-20', '80.00');
const ridgebackDetail = detail(ridgeback, [
  line('l-1', 'Brake hose pair', '30.00', '1.50', '3.75', 's-brakes', 'Front brake hoses'),
  line('l-2', 'Shop rags', '10.00', '0.50', '1.25', 's-tools'),
]);
const quaysideDetail = detail(quayside, [line('l-3', 'Oil pressure gauge', '80.00', '0.00', '0.00', 's-tools')]);

async function settle() {
  await new Promise((resolve) => setTimeout(resolve, 0));
}

/** The panel's own calls for a shown receipt. */
function flushPanel(http: HttpTestingController, receiptId: string) {
  http.expectOne(`/api/builds/b-1/receipts/${receiptId}/comments`).flush({ comments: [] });
  http.expectOne(`/api/builds/b-1/receipts/${receiptId}/audit`).flush({ events: [] });
}

async function renderAs(role: BuildRole, queue: ReceiptSummaryDto[]) {
  const { http } = await renderInBuild(ReviewPage, { role });
  http.expectOne('/api/builds/b-1/review-queue').flush({ receipts: queue });
  http.expectOne('/api/builds/b-1/systems').flush(testSystemsResponse([testSystem('s-brakes', 'Brakes'), testSystem('s-tools', 'Tools and consumables')]));
  if (queue.length > 0) {
    await settle();
    http.expectOne(`/api/builds/b-1/receipts/${queue[0].id}`).flush(queue[0].id === 'r-1' ? ridgebackDetail : quaysideDetail);
    await screen.findByRole('heading', { name: queue[0].vendorName! });
    await settle();
    flushPanel(http, queue[0].id);
  }
  return http;
}

const text = (element: Element) => (element.textContent ?? '').replace(/\s+/g, ' ').trim();
/** Matches an accessible name whatever space the name computation puts before the hidden commas. */
const named = (expected: string) => (name: string) => name.replace(/\s+,/g, ',') === expected;

describe('ReviewPage', () => {
  it('lists the queue and shows the first receipt with its lines, where they went and their share of tax and shipping', async () => {
    await renderAs('reviewer', [ridgeback, quayside]);
    const items = within(screen.getByRole('region', { name: /Waiting for review/ }).querySelector('ul')! as HTMLElement).getAllByRole('button');
    // The name a screen reader gives each button is its visible text, with hidden commas between the parts.
    expect(items).toEqual([
      screen.getByRole('button', { name: named('Ridgeback Parts, Feb 14, 2026 · by Dario Fenn, $47.00') }),
      screen.getByRole('button', { name: named('Quayside Counter, Feb 20, 2026 · by Dario Fenn, $80.00') }),
    ]);
    expect(Array.from(items[1].querySelectorAll('.item-shop, .item-meta, .item-total')).map(text)).toEqual(['Quayside Counter', 'Feb 20, 2026 · by Dario Fenn', '$80.00']);
    expect(items[0].getAttribute('aria-current')).toBe('true');
    const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
    // The first cell holds the description and, below it, the kind of line.
    const cells = (row: HTMLElement) => within(row).getAllByRole('cell').map((cell, index) => (index === 0 ? Array.from(cell.children).map(text).join(' / ') : text(cell)));
    expect(rows.map(cells)).toEqual([
      ['Brake hose pair / Purchase', 'Brakes · Front brake hoses', '$30.00', '$1.50', '$3.75', '$35.25'],
      ['Shop rags / Purchase', 'Tools and consumables', '$10.00', '$0.50', '$1.25', '$11.75'],
    ]);
    expect(screen.getByRole('img', { name: 'Page 1 of the receipt' }).getAttribute('src')).toBe('/api/builds/b-1/receipts/r-1/pages/0');
    expect(screen.getByRole('button', { name: 'Approve' })).toBeTruthy();
  });

  it('approves with the version it saw, then the receipt leaves the queue and the next one opens', async () => {
    const http = await renderAs('reviewer', [ridgeback, quayside]);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const post = http.expectOne('/api/builds/b-1/receipts/r-1/review');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ verdict: 'approved', comment: '', version: 3 });
    post.flush({ reviewState: 'approved', reviewComment: '', version: 4 });
    await settle();
    http.expectOne('/api/builds/b-1/receipts/r-2').flush(quaysideDetail);
    expect(await screen.findByRole('heading', { name: 'Quayside Counter' })).toBeTruthy();
    await settle();
    flushPanel(http, 'r-2');
    expect(screen.getByText('Approved: Ridgeback Parts of Feb 14, 2026.')).toBeTruthy();
    expect(screen.getByRole('heading', { name: /Waiting for review/ }).textContent).toContain('(1)');
    expect(screen.queryByRole('button', { name: /Ridgeback Parts/ })).toBeNull();
  });

  it('asks for the question before sending it, then sends it with the comment', async () => {
    const http = await renderAs('owner', [ridgeback, quayside]);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Question' }));
    await user.click(screen.getByRole('button', { name: 'Send question' }));
    expect(await screen.findByText('Say what the question is.')).toBeTruthy();
    http.expectNone('/api/builds/b-1/receipts/r-1/review');

    await user.type(screen.getByRole('textbox', { name: 'What is the question?' }), 'Which car are the hoses for?');
    await user.click(screen.getByRole('button', { name: 'Send question' }));
    const post = http.expectOne('/api/builds/b-1/receipts/r-1/review');
    expect(post.request.body).toEqual({ verdict: 'questioned', comment: 'Which car are the hoses for?', version: 3 });
    post.flush({ reviewState: 'questioned', reviewComment: 'Which car are the hoses for?', version: 4 });
    await settle();
    http.expectOne('/api/builds/b-1/receipts/r-2').flush(quaysideDetail);
    expect(await screen.findByText('Questioned: Ridgeback Parts of Feb 14, 2026.')).toBeTruthy();
  });

  it('on 409 says someone changed the receipt and reloads the queue and the receipt', async () => {
    const http = await renderAs('reviewer', [ridgeback, quayside]);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    http
      .expectOne('/api/builds/b-1/receipts/r-1/review')
      .flush({ error: { code: 'stale_version', message: 'This receipt was changed by someone else.' } }, { status: 409, statusText: 'Conflict' });
    expect(await screen.findByText('Someone changed this receipt meanwhile. It is shown as saved now: look at it again before you decide.')).toBeTruthy();
    http.expectOne('/api/builds/b-1/review-queue').flush({ receipts: [{ ...ridgeback, version: 5 }, quayside] });
    await settle();
    http.expectOne('/api/builds/b-1/receipts/r-1').flush({ ...ridgebackDetail, version: 5 });
    await settle();
    flushPanel(http, 'r-1');
    await user.click(await screen.findByRole('button', { name: 'Approve' }));
    expect(http.expectOne('/api/builds/b-1/receipts/r-1/review').request.body).toEqual({ verdict: 'approved', comment: '', version: 5 });
  });

  it('gives crew the queue without verdict buttons', async () => {
    await renderAs('crew', [ridgeback]);
    expect(screen.queryByRole('button', { name: 'Approve' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Question' })).toBeNull();
    expect(screen.getByText(/the owner or a reviewer approves or questions receipts/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Post comment' })).toBeTruthy();
  });

  it('says what fills an empty queue, and shows reviewed receipts with their state when asked', async () => {
    const http = await renderAs('reviewer', []);
    expect(await screen.findByRole('heading', { name: 'Nothing waiting for review' })).toBeTruthy();
    expect(screen.getByText(/Receipts come here once they are filed/)).toBeTruthy();
    expect(screen.getByRole('link', { name: /Go to Receipts/ }).getAttribute('href')).toBe('/receipts');

    const user = userEvent.setup();
    await user.click(screen.getByRole('switch', { name: 'Show approved and questioned too' }));
    const list = http.expectOne('/api/builds/b-1/receipts?state=filed');
    list.flush({ receipts: [{ ...ridgeback, reviewState: 'approved' }] });
    await settle();
    http.expectOne('/api/builds/b-1/receipts/r-1').flush({ ...ridgebackDetail, reviewState: 'approved' });
    expect(await screen.findByRole('heading', { name: /Filed receipts/ })).toBeTruthy();
    const item = screen.getByRole('button', { name: named('Ridgeback Parts, Feb 14, 2026 · by Dario Fenn, Approved, $47.00') });
    expect(text(item.querySelector('.item-state')!)).toBe('verified Approved');
  });
});
