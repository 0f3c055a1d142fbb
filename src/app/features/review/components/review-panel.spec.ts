// Review panel: the state in words, the comment thread with a checked comment box, and the audit trail in words with
// money through the money pipe.
import { inputBinding, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ReceiptDto } from '../../../../../shared/api/receipts';
import type { AuditEventDto, CommentDto } from '../../../../../shared/api/review';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testReceipt, testSystem } from '../../../../testing/build-fixtures';
import { ReviewPanel } from './review-panel';

const receipt = (extra: Partial<ReceiptDto> = {}): ReceiptDto =>
  testReceipt('r-1', { state: 'filed', reviewState: 'questioned', version: 5, reviewComment: 'Which car is the gauge for?', ...extra });

const comments: CommentDto[] = [
  { id: 'c-1', author: 'Ines Varga', body: 'Which car is the gauge for?', createdAt: '2026-02-15T12:00:00.000Z' },
  { id: 'c-2', author: 'Dario Fenn', body: 'The wagon: oil pressure.', createdAt: '2026-02-15T13:30:00.000Z' },
];

const events: AuditEventDto[] = [
  { id: 'e-1', who: 'Dario Fenn', at: '2026-02-14T10:05:00.000Z', entity: 'receipt', action: 'edit', before: { total: null, tax: null }, after: { total: '42', tax: '2' }, names: {} },
  { id: 'e-0', who: 'Dario Fenn', at: '2026-02-14T10:05:30.000Z', entity: 'receipt_line', action: 'add', before: null, after: { kind: 'fee', description: 'Hazmat fee', amount: '4.5', partId: null, systemId: 's-tools' }, names: {} },
  {
    id: 'e-2',
    who: 'Dario Fenn',
    at: '2026-02-14T10:06:00.000Z',
    entity: 'receipt_line',
    action: 'edit',
    before: { kind: 'part', description: 'Gauge', amount: '30', partId: null, systemId: 's-brakes' },
    after: { kind: 'part', description: 'Gauge', amount: '35.5', partId: 'p-gauge', systemId: 's-tools' },
    // The server names the part (and may name the system) as they are called now.
    names: { 'p-gauge': 'Oil pressure gauge', 's-tools': 'Tools and consumables' },
  },
  { id: 'e-4', who: 'Rosa Quill', at: '2026-02-14T10:07:00.000Z', entity: 'receipt_line', action: 'delete', before: { kind: 'part', description: 'Rags', amount: '3', systemId: null }, after: null, names: {} },
  { id: 'e-3', who: 'Ines Varga', at: '2026-02-15T12:00:00.000Z', entity: 'receipt', action: 'review', before: { reviewState: 'none' }, after: { reviewState: 'questioned' }, names: {} },
];

async function renderPanel(shown = signal(receipt())) {
  await render(ReviewPanel, {
    providers: apiTestProviders(),
    bindings: [inputBinding('buildId', () => 'b-1'), inputBinding('receipt', shown), inputBinding('systems', () => [testSystem('s-brakes', 'Brakes'), testSystem('s-tools', 'Tools and consumables')])],
  });
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/builds/b-1/receipts/r-1/comments').flush({ comments });
  http.expectOne('/api/builds/b-1/receipts/r-1/audit').flush({ events });
  await screen.findByText('The wagon: oil pressure.');
  return { http, shown };
}

const text = (element: Element) => (element.textContent ?? '').replace(/\s+/g, ' ').trim();
/** Each change of a trail entry as [what, before → after]. */
const changes = (item: Element) => Array.from(item.querySelectorAll('.changes > div')).map((row) => [text(row.querySelector('dt')!), text(row.querySelector('dd')!)]);

describe('ReviewPanel', () => {
  it('says the review state in words, lists the thread and the trail with before → after and money formatted', async () => {
    await renderPanel();
    expect(text(screen.getByRole('status').querySelector('.state-words')!)).toBe('Questioned: Which car is the gauge for?');
    expect(text(screen.getByRole('status').querySelector('mat-icon')!)).toBe('help');
    const thread = screen.getByRole('list', { name: 'Comments' });
    expect(within(thread).getAllByRole('listitem').map((item) => within(item).getByText(/./, { selector: '.comment-body' }).textContent)).toEqual([
      'Which car is the gauge for?',
      'The wagon: oil pressure.',
    ]);
    const trail = within(screen.getByRole('list', { name: 'Changes to money' })).getAllByRole('listitem');
    expect(trail.map((item) => text(item.querySelector('.trail-head')!).replace(/ · .*$/, ''))).toEqual(['Changed the receipt', 'Added a line', 'Changed a line', 'Deleted a line', 'Reviewed the receipt']);
    // Money is compared as amounts ("2" and "2.00" are one amount) and shown in the currency; unchanged fields are left
    // out; figures come in the order a receipt prints them (tax before total), whatever order the snapshot kept.
    expect(changes(trail[0])).toEqual([
      ['Tax', '— → $2.00'],
      ['Total', '— → $42.00'],
    ]);
    // A new line shows its values without an arrow; a deleted one what it was.
    expect(changes(trail[1])).toEqual([
      ['Kind', 'Fee'],
      ['Description', 'Hazmat fee'],
      ['Amount', '$4.50'],
      ['System', 'Tools and consumables'],
    ]);
    expect(changes(trail[2])).toEqual([
      ['Amount', '$30.00 → $35.50'],
      ['Part', '— → Oil pressure gauge'],
      ['System', 'Brakes → Tools and consumables'],
    ]);
    expect(changes(trail[3])).toEqual([
      ['Kind', 'Purchase (removed)'],
      ['Description', 'Rags (removed)'],
      ['Amount', '$3.00 (removed)'],
    ]);
    expect(changes(trail[4])).toEqual([['Review', 'Not reviewed → Questioned']]);
    expect(text(trail[4].querySelector('.trail-head')!)).toMatch(/^Reviewed the receipt · Ines Varga · Feb 15, 2026/);
  });

  it('refuses an empty comment without sending, then posts one and adds it to the thread', async () => {
    const { http } = await renderPanel();
    const user = userEvent.setup();
    await user.type(screen.getByRole('textbox', { name: 'Add a comment' }), '   ');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    expect(await screen.findByText('Write a comment.')).toBeTruthy();
    http.expectNone('/api/builds/b-1/receipts/r-1/comments');

    await user.type(screen.getByRole('textbox', { name: 'Add a comment' }), 'Thanks, approved next.');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    const post = http.expectOne('/api/builds/b-1/receipts/r-1/comments');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ body: 'Thanks, approved next.' });
    post.flush({ id: 'c-3', author: 'Ines Varga', body: 'Thanks, approved next.', createdAt: '2026-02-16T09:00:00.000Z' }, { status: 201, statusText: 'Created' });
    expect(await screen.findByText('Thanks, approved next.', { selector: '.comment-body' })).toBeTruthy();
    expect((screen.getByRole('textbox', { name: 'Add a comment' }) as HTMLTextAreaElement).value).toBe('');
  });

  it("shows the server's refusal of a comment beside the box", async () => {
    const { http } = await renderPanel();
    const user = userEvent.setup();
    await user.type(screen.getByRole('textbox', { name: 'Add a comment' }), 'x');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    http
      .expectOne('/api/builds/b-1/receipts/r-1/comments')
      .flush({ error: { code: 'validation_failed', message: 'Check the fields.', fields: { body: 'A comment is at most 2000 characters.' } } }, { status: 400, statusText: 'Bad Request' });
    expect(await screen.findByText('A comment is at most 2000 characters.')).toBeTruthy();
  });

  it('reloads the thread and trail when the receipt gets a new version, and says when nothing is there yet', async () => {
    const { http, shown } = await renderPanel();
    shown.set(receipt({ reviewState: 'approved', reviewComment: '', version: 6 }));
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/builds/b-1/receipts/r-1/comments').flush({ comments: [] });
    http.expectOne('/api/builds/b-1/receipts/r-1/audit').flush({ events: [] });
    expect(await screen.findByText(/No comments yet/)).toBeTruthy();
    expect(screen.getByText('No changes recorded yet.')).toBeTruthy();
    expect(text(screen.getByRole('status').querySelector('.state-words')!)).toBe('Approved');
    expect(text(screen.getByRole('status').querySelector('mat-icon')!)).toBe('verified');
  });
});
