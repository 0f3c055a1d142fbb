// Check screen: the reconciliation follows what is typed, arrows move through the lines, a reviewer gets no inputs, filing sends the version, and reading is polled.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { SystemDto } from '../../../../../shared/api/parts';
import type { PriceHistoryResponse } from '../../../../../shared/api/price-history';
import type { ReceiptDto } from '../../../../../shared/api/receipts';
import type { ReceiptSuggestionsDto } from '../../../../../shared/api/suggestions';
import type { BuildRole } from '../../../../../shared/enums';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { CurrentBuild } from '../../builds/services/current-build';
import { ReceiptCheck } from './receipt-check';
import { testBuild, testLine, testPriceItem, testPricePaid, testSystem } from '../../../../testing/build-fixtures';

// The first test pays the compilation of the check screen with its image and review panels, and the typing tests
// type many keys: on a busy 2-core machine they came near jest's 5 s default.
jest.setTimeout(15_000);

const system = (id: string, name: string, safetyCaution = false): SystemDto => testSystem(id, name, { safetyCaution });

const line = testLine;

// 30.00 + 10.00 + tax 2.00 = 42.00, the printed total.
const receipt = (extra: Partial<ReceiptDto> = {}): ReceiptDto => ({
  id: 'r-1',
  vendorName: 'Ridgeback Parts',
  purchaseDate: '2026-02-14',
  receiptNumber: 'A-100',
  total: '42.00',
  state: 'to_check',
  readingProgress: 100,
  reviewState: 'none',
  originalFilename: 'slip.png',
  contentType: 'image/png',
  lineCount: 2,
  duplicateOf: [],
  systemIds: [],
  uploadedBy: 'u-1',
  createdAt: '2026-02-14T10:00:00.000Z',
  version: 3,
  currency: 'USD',
  locale: 'en-US',
  subtotal: '40.00',
  tax: '2.00',
  shipping: null,
  discount: null,
  differenceAccepted: false,
  differenceReason: '',
  readingError: null,
  reviewComment: '',
  pages: [{ index: 0, width: 600, height: 900 }],
  fieldConfidence: { vendor: 0.95, date: 0.5, total: 0.99 },
  readingNotes: [],
  lines: [line('l-1', 0, 'Brake hose pair', '30.00', 's-brakes'), line('l-2', 1, 'Shop rags', '10.00', 's-tools')],
  reconciliation: { linesTotal: '40.00', computedTotal: '42.00', printedTotal: '42.00', difference: '0.00', reconciles: true },
  editable: true,
  ...extra,
});

async function renderAs(
  role: BuildRole,
  shown: ReceiptDto,
  suggestions: ReceiptSuggestionsDto = { threshold: 0.6, lines: [] },
  priceHistory: PriceHistoryResponse = { currency: 'USD', items: [] },
) {
  await render(ReceiptCheck, {
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
    bindings: [inputBinding('buildId', () => 'b-1'), inputBinding('receiptId', () => 'r-1')],
  });
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/builds/b-1/parts').flush({ parts: [] });
  http
    .expectOne('/api/builds/b-1/systems')
    .flush({ currency: 'USD', systems: [system('s-brakes', 'Brakes', true), system('s-tools', 'Tools and consumables')], contingencyBudget: '0', budgetWithContingency: '0', planned: '0', buildVersion: 2 });
  await new Promise((resolve) => setTimeout(resolve, 0));
  http.expectOne('/api/builds/b-1/receipts/r-1').flush(shown);
  await screen.findByRole('heading', { name: 'Ridgeback Parts' });
  // An editable receipt asks for the reader's suggestions once it shows.
  for (const request of http.match('/api/builds/b-1/receipts/r-1/suggestions')) request.flush(suggestions);
  for (const request of http.match('/api/builds/b-1/price-history?minReceipts=1')) request.flush(priceHistory);
  return http;
}

/** The reconciliation's paragraphs as read, one space between them. */
const reconciliationText = () =>
  Array.from(document.querySelectorAll('.reconciliation p'))
    .map((paragraph) => (paragraph.textContent ?? '').replace(/\s+/g, ' ').trim())
    .join(' ');

describe('ReceiptCheck', () => {
  it('loads every price filed before once and hints under a line more than 10 % above the lowest', async () => {
    // Brake hose pair at 30.00 against 26.00 paid on another receipt: 15.38 %, shown as 15 %. Shop rags at 10.00 against 9.10: 9.89 %, no hint.
    const http = await renderAs('owner', receipt(), undefined, {
      currency: 'USD',
      items: [
        testPriceItem('description:brake hose pair', 'Brake hose pair', [testPricePaid('r-0', 'Fernhill Auto Spares', '2026-01-09', '26.00')]),
        testPriceItem('description:shop rags', 'Shop rags', [testPricePaid('r-0', 'Fernhill Auto Spares', '2026-01-09', '9.10')]),
      ],
    });
    expect(await screen.findByText('15 % above the lowest this build paid: $26.00 at Fernhill Auto Spares, Jan 9, 2026')).toBeTruthy();
    expect(screen.getAllByText(/above the lowest/)).toHaveLength(1);
    http.expectNone('/api/builds/b-1/price-history?minReceipts=1');
  });

  it('recomputes the reconciliation live as an amount is typed, with the difference in words', async () => {
    await renderAs('crew', receipt());
    expect(reconciliationText()).toBe('Lines $40.00 + tax $2.00 + shipping $0.00 − discount $0.00 = $42.00 check_circle Adds up to the printed total of $42.00.');

    const user = userEvent.setup();
    const amount = screen.getByRole('textbox', { name: 'Amount, line 2' });
    await user.clear(amount);
    await user.type(amount, '10.40');
    expect(reconciliationText()).toBe(
      'Lines $40.40 + tax $2.00 + shipping $0.00 − discount $0.00 = $42.40 error The printed total is $0.40 less than the lines, tax and shipping. ' +
        'Fix an amount, add a fee line, or ask the owner to accept the difference.',
    );
    // A crew member cannot file it while it does not add up, and is told why.
    expect((screen.getByRole('button', { name: /File receipt/ }) as HTMLButtonElement).disabled).toBe(true);
    expect(screen.getByText('The lines do not add up to the printed total; fix them, or ask the owner to accept the difference.')).toBeTruthy();

    await user.clear(amount);
    await user.type(amount, 'ten');
    expect(reconciliationText()).toBe('error Fix the line amounts marked in the table to see the total.');
  });

  it('marks low-confidence fields, highlights the box of the line in focus and shows the safety caution for brakes', async () => {
    await renderAs('owner', receipt());
    expect(screen.getByText('Check this: read with low confidence')).toBeTruthy();
    expect(screen.getByRole('complementary', { name: 'Safety caution' }).textContent).toContain("manufacturer's instructions");
    expect(document.querySelector('.box')).toBeNull();
    screen.getByRole('textbox', { name: 'Description, line 1' }).focus();
    await screen.findByRole('textbox', { name: 'Description, line 1' });
    const box = await waitForBox();
    // 480 px shown for a 600 px page: 0.8 scale.
    expect([box.style.left, box.style.top, box.style.width, box.style.height]).toEqual(['8px', '160px', '240px', '16px']);
  });

  it('moves to the next field on Enter and saves the field left, with its version', async () => {
    const http = await renderAs('crew', receipt());
    const user = userEvent.setup();
    const shop = screen.getByRole('textbox', { name: 'Shop' });
    await user.clear(shop);
    await user.type(shop, 'Ridgeback Parts & Paint{Enter}');
    expect(document.activeElement).toBe(screen.getByLabelText('Date', { exact: true }));
    const save = await nextRequest(http, '/api/builds/b-1/receipts/r-1');
    expect(save.request.method).toBe('PATCH');
    expect(save.request.body).toEqual({ vendorName: 'Ridgeback Parts & Paint', version: 3 });
    save.flush(receipt({ vendorName: 'Ridgeback Parts & Paint', version: 4 }));
  });

  it('gives a reviewer the figures without any input or filing button', async () => {
    await renderAs('reviewer', receipt({ editable: false }));
    expect(screen.queryAllByRole('textbox')).toEqual([]);
    expect(screen.queryAllByRole('combobox')).toEqual([]);
    expect(screen.queryByRole('button', { name: /File receipt/ })).toBeNull();
    expect(screen.getByText('Brake hose pair')).toBeTruthy();
    expect(screen.getByText('Feb 14, 2026')).toBeTruthy();
    expect(screen.getByText('You can read this receipt; the owner and crew change it.')).toBeTruthy();
  });

  it('shows the review panel (state, comments, changes) under a filed receipt, and none before filing', async () => {
    const http = await renderAs('reviewer', receipt({ state: 'filed', editable: false, reviewState: 'approved' }));
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/builds/b-1/receipts/r-1/comments').flush({ comments: [{ id: 'c-1', author: 'Ines Varga', body: 'Matches the slip.', createdAt: '2026-02-15T12:00:00.000Z' }] });
    http.expectOne('/api/builds/b-1/receipts/r-1/audit').flush({ events: [] });
    expect(await screen.findByText('Matches the slip.')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Review' })).toBeTruthy();
    expect(screen.getByText('Approved', { selector: 'strong' })).toBeTruthy();
  });

  it('shows no review panel on a receipt still being checked', async () => {
    const http = await renderAs('crew', receipt());
    http.expectNone('/api/builds/b-1/receipts/r-1/comments');
    expect(screen.queryByRole('heading', { name: 'Review' })).toBeNull();
  });

  it('files with the version it last saw, and says which line blocks it when the server refuses', async () => {
    const http = await renderAs('crew', receipt());
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: /File receipt/ }));
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/file');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ version: 3 });
    request.flush(
      { error: { code: 'validation_failed', message: 'Assign every line.', fields: { 'lines.1.systemId': 'Assign this line to a system.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(await screen.findByText('Line 2: Assign this line to a system.')).toBeTruthy();

    await user.click(screen.getByRole('button', { name: /File receipt/ }));
    http.expectOne('/api/builds/b-1/receipts/r-1/file').flush(receipt({ state: 'filed', version: 4, editable: false }));
    expect(await screen.findByText(/Filed\./)).toBeTruthy();
  });

  it("lets the owner accept a difference with a reason, sent with the filing", async () => {
    // Printed 42.40 against 42.00 worked out: the printed total is 0.40 more.
    const http = await renderAs('owner', receipt({ total: '42.40' }));
    const user = userEvent.setup();
    expect(screen.queryByRole('button', { name: /^File receipt/ })).toBeNull();
    await user.click(screen.getByRole('button', { name: /Accept the difference and file/ }));
    expect(await screen.findByText(/The printed total is \$0\.40 more than the lines, tax and shipping\. Say why/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Accept and file' }));
    expect(await screen.findByText('Say why the difference is accepted.')).toBeTruthy();
    http.expectNone('/api/builds/b-1/receipts/r-1/file');
    await user.type(screen.getByRole('textbox', { name: 'Reason' }), 'Card surcharge not itemised');
    await user.click(screen.getByRole('button', { name: 'Accept and file' }));
    // Sent once the dialog has closed.
    const request = await nextRequest(http, '/api/builds/b-1/receipts/r-1/file');
    expect(request.request.body).toEqual({ version: 3, acceptDifference: { reason: 'Card surcharge not itemised' } });
    request.flush(receipt({ total: '42.40', state: 'filed', version: 4, differenceAccepted: true, differenceReason: 'Card surcharge not itemised' }));
    expect(await screen.findByText(/Difference accepted: Card surcharge not itemised/)).toBeTruthy();
  });

  it("offers each line the reader's suggestions with reasons, and accepts every sure one in one request", async () => {
    const unassigned = receipt({ lines: [line('l-1', 0, 'Brake hose pair', '30.00', null), line('l-2', 1, 'Shop rags', '10.00', null)] });
    const http = await renderAs('crew', unassigned, {
      threshold: 0.6,
      lines: [
        { lineId: 'l-1', suggestions: [{ partId: null, partName: null, systemId: 's-brakes', systemName: 'Brakes', score: 0.9, source: 'history', reason: 'went to Brakes on an earlier receipt from this shop' }] },
        { lineId: 'l-2', suggestions: [{ partId: null, partName: null, systemId: 's-tools', systemName: 'Tools and consumables', score: 0.3, source: 'trade-word', reason: '“rags” is a word for tools and consumables' }] },
      ],
    });
    // Only the first line's suggestion is sure enough for the one button.
    const acceptAll = await screen.findByRole('button', { name: /Accept the suggestion/ });
    const user = userEvent.setup();
    // The assign field lists the suggestion first, with its reason.
    await user.click(screen.getByRole('combobox', { name: /Assign line 1/ }));
    const suggested = await screen.findByRole('group', { name: 'Suggested' });
    expect(suggested.textContent?.replace(/\s+/g, ' ')).toContain('Brakes (system only), went to Brakes on an earlier receipt from this shop');
    await user.keyboard('{Escape}');
    await user.click(acceptAll);
    const accept = await nextRequest(http, '/api/builds/b-1/receipts/r-1/suggestions/accept');
    expect(accept.request.method).toBe('POST');
    expect(accept.request.body).toEqual({});
    accept.flush(receipt({ version: 4, lines: [line('l-1', 0, 'Brake hose pair', '30.00', 's-brakes'), line('l-2', 1, 'Shop rags', '10.00', null)] }));
    await screen.findByText('Assign the last line to a part or a system before filing.');
  });

  it('assigns a line from a suggestion in its field, sending the part with its system', async () => {
    const http = await renderAs('crew', receipt({ lines: [line('l-1', 0, 'Brake hose pair', '30.00', null), line('l-2', 1, 'Shop rags', '10.00', 's-tools')] }), {
      threshold: 0.6,
      lines: [{ lineId: 'l-1', suggestions: [{ partId: 'p-hose', partName: 'Braided brake hoses', systemId: 's-brakes', systemName: 'Brakes', score: 0.95, source: 'part-number', reason: 'part number BH-2 is on the bill of materials' }] }],
    });
    const user = userEvent.setup();
    await user.click(screen.getByRole('combobox', { name: /Assign line 1/ }));
    await user.click(await screen.findByRole('option', { name: /Braided brake hoses/ }));
    const patch = await nextRequest(http, '/api/builds/b-1/receipts/r-1/lines/l-1');
    expect(patch.request.body).toEqual({ partId: 'p-hose', systemId: 's-brakes', version: 1 });
  });

  it('keeps filing disabled with the reason while a line is unassigned', async () => {
    await renderAs('owner', receipt({ lines: [line('l-1', 0, 'Brake hose pair', '30.00', 's-brakes'), line('l-2', 1, 'Shop rags', '10.00', null)] }));
    expect((screen.getByRole('button', { name: /File receipt/ }) as HTMLButtonElement).disabled).toBe(true);
    expect(screen.getByText('Assign the last line to a part or a system before filing.')).toBeTruthy();
  });

  it('polls every second while reading, showing the progress, and stops once it is ready', async () => {
    jest.useFakeTimers({ doNotFake: ['nextTick', 'setImmediate'] });
    try {
      await render(ReceiptCheck, {
        providers: [
          ...apiTestProviders(),
          {
            provide: CurrentBuild,
            useFactory: () => {
              const current = new CurrentBuild();
              current.set(testBuild('crew'));
              return current;
            },
          },
        ],
        bindings: [inputBinding('buildId', () => 'b-1'), inputBinding('receiptId', () => 'r-1')],
      });
      const http = TestBed.inject(HttpTestingController);
      http.match('/api/builds/b-1/parts');
      http.match('/api/builds/b-1/systems');
      await jest.advanceTimersByTimeAsync(0);
      http.expectOne('/api/builds/b-1/receipts/r-1').flush(receipt({ state: 'reading', readingProgress: 40, lines: [] }));
      await jest.advanceTimersByTimeAsync(0);
      expect(screen.getByText('Reading the receipt: 40%')).toBeTruthy();
      await jest.advanceTimersByTimeAsync(1000);
      http.expectOne('/api/builds/b-1/receipts/r-1').flush(receipt());
      await jest.advanceTimersByTimeAsync(3000);
      http.expectNone('/api/builds/b-1/receipts/r-1');
      expect(screen.queryByText(/Reading the receipt/)).toBeNull();
      expect(screen.getByRole('textbox', { name: 'Description, line 1' })).toBeTruthy();
    } finally {
      jest.useRealTimers();
    }
  });
});

describe('ReceiptCheck lines by keyboard', () => {
  const field = (name: string) => screen.getByRole('textbox', { name }) as HTMLInputElement;
  const focused = () => document.activeElement;
  // Material's select and autocomplete read the legacy keyCode, which a browser sets and user-event 14 leaves at 0; fill
  // it in from the key before anything else sees the event, so they act as in a browser (values from the keyCode table
  // of the W3C UI Events KeyboardEvent key and code notes).
  const legacyKeyCodes: Record<string, number> = { Enter: 13, Shift: 16, Escape: 27, ' ': 32, ArrowLeft: 37, ArrowUp: 38, ArrowRight: 39, ArrowDown: 40 };
  const addKeyCode = (event: KeyboardEvent) => {
    const keyCode = legacyKeyCodes[event.key];
    if (keyCode !== undefined && event.keyCode === 0) Object.defineProperty(event, 'keyCode', { value: keyCode });
  };
  beforeEach(() => window.addEventListener('keydown', addKeyCode, true));
  afterEach(() => window.removeEventListener('keydown', addKeyCode, true));

  it('moves up and down the same column with the arrows, stops at the first and last line, and saves the figure left', async () => {
    const http = await renderAs('crew', receipt());
    const user = userEvent.setup();
    await user.click(field('Amount, line 1'));
    await user.keyboard('{ArrowDown}');
    expect(focused()).toBe(field('Amount, line 2'));
    // The figure arrived at is selected, as Tab would, so typing replaces it.
    expect([field('Amount, line 2').selectionStart, field('Amount, line 2').selectionEnd]).toEqual([0, 5]);
    await user.keyboard('{ArrowDown}');
    expect(focused()).toBe(field('Amount, line 2'));

    await user.keyboard('12.50{ArrowUp}');
    expect(focused()).toBe(field('Amount, line 1'));
    const save = await nextRequest(http, '/api/builds/b-1/receipts/r-1/lines/l-2');
    expect(save.request.method).toBe('PATCH');
    expect(save.request.body).toEqual({ amount: '12.50', version: 1 });
    save.flush({ ...line('l-2', 1, 'Shop rags', '12.50', 's-tools'), version: 2 });
    await user.keyboard('{ArrowUp}');
    expect(focused()).toBe(field('Amount, line 1'));
    http.expectNone('/api/builds/b-1/receipts/r-1/lines/l-1');
  });

  it('sends a figure saved by Enter once, when leaving the field fires "change" again with the same value', async () => {
    const http = await renderAs('crew', receipt());
    const user = userEvent.setup();
    await user.clear(field('Amount, line 2'));
    await user.type(field('Amount, line 2'), '12.5{Enter}');
    const save = await nextRequest(http, '/api/builds/b-1/receipts/r-1/lines/l-2');
    expect(save.request.body).toEqual({ amount: '12.5', version: 1 });
    save.flush({ ...line('l-2', 1, 'Shop rags', '12.50', 's-tools'), version: 2 });
    // What a browser does on blur after a scripted "change": a second one, the value unchanged ("12.5" is 12.50).
    field('Amount, line 2').dispatchEvent(new Event('change', { bubbles: true }));
    await new Promise((resolve) => setTimeout(resolve, 50));
    http.expectNone('/api/builds/b-1/receipts/r-1/lines/l-2');
  });

  it('moves sideways only from the edge of the text, and leaves the caret moving mid-text', async () => {
    await renderAs('crew', receipt());
    const user = userEvent.setup();
    const description = field('Description, line 1');
    // "Brake hose pair": the caret after "Brake".
    description.focus();
    description.setSelectionRange(5, 5);
    await user.keyboard('{ArrowRight}');
    expect(focused()).toBe(description);
    expect(description.selectionStart).toBe(6);
    // Selecting with Shift is the field's own business too.
    description.setSelectionRange(15, 15);
    await user.keyboard('{Shift>}{ArrowRight}{/Shift}');
    expect(focused()).toBe(description);

    await user.keyboard('{ArrowRight}');
    expect(focused()).toBe(field('Part number, line 1'));
    // An empty field is at both edges at once.
    await user.keyboard('{ArrowRight}');
    expect(focused()).toBe(field('Quantity, line 1'));
    expect(field('Quantity, line 1').selectionStart).toBe(0);
    await user.keyboard('{ArrowLeft}');
    expect(focused()).toBe(field('Part number, line 1'));
    await user.keyboard('{ArrowLeft}');
    expect(focused()).toBe(description);
    // Arriving from the right puts the caret at the end, so the next Left moves inside the text.
    expect(description.selectionStart).toBe(15);
    await user.keyboard('{ArrowLeft}');
    expect(focused()).toBe(description);
    expect(description.selectionStart).toBe(14);
  });

  it('takes the arrows from a closed list without changing it, and leaves an open list and the part suggestions theirs', async () => {
    const http = await renderAs('crew', receipt());
    const user = userEvent.setup();
    const description = field('Description, line 1');
    description.focus();
    description.setSelectionRange(0, 0);
    await user.keyboard('{ArrowLeft}');
    const kind1 = screen.getByRole('combobox', { name: 'Kind of line 1' });
    expect(focused()).toBe(kind1);
    // A closed select would take Down as "next kind" and save it; in the table it goes to the line below instead.
    await user.keyboard('{ArrowDown}');
    const kind2 = screen.getByRole('combobox', { name: 'Kind of line 2' });
    expect(focused()).toBe(kind2);
    expect(kind2.textContent?.trim()).toBe('Purchase');
    await user.keyboard('{ArrowLeft}');
    expect(focused()).toBe(kind2);
    expect(kind2.textContent?.trim()).toBe('Purchase');
    await new Promise((resolve) => setTimeout(resolve, 20));
    http.expectNone((request) => request.method === 'PATCH');

    // Opened, the select walks its own options.
    await user.keyboard('{Enter}');
    await screen.findByRole('listbox');
    await waitFor(() => expect(kind2.getAttribute('aria-expanded')).toBe('true'));
    await user.keyboard('{ArrowDown}');
    expect(focused()).toBe(kind2);
    await waitFor(() => expect(document.getElementById(kind2.getAttribute('aria-activedescendant') ?? '')?.textContent?.trim()).toBe('Return'));
    await user.keyboard('{Escape}');
    await waitFor(() => expect(kind2.getAttribute('aria-expanded')).toBe('false'));
    expect(kind2.textContent?.trim()).toBe('Purchase');
    await user.keyboard('{ArrowRight}');
    expect(focused()).toBe(field('Description, line 2'));

    // The part box keeps Up and Down for its suggestions, and gives Left back at the start of its text.
    const amount = field('Amount, line 2');
    amount.focus();
    amount.setSelectionRange(5, 5);
    await user.keyboard('{ArrowRight}');
    const part = screen.getByRole('combobox', { name: 'Assign line 2: type a part, a part number or a system' }) as HTMLInputElement;
    expect(focused()).toBe(part);
    await user.keyboard('{ArrowDown}');
    expect(focused()).toBe(part);
    await waitFor(() => expect(part.getAttribute('aria-expanded')).toBe('true'));
    await user.keyboard('{ArrowLeft}');
    expect(focused()).toBe(amount);
    await waitFor(() => expect(part.getAttribute('aria-expanded')).toBe('false'));
    // The assign field is the last of its line: Right at the end of its text goes nowhere.
    part.focus();
    part.setSelectionRange(part.value.length, part.value.length);
    await user.keyboard('{ArrowRight}');
    expect(focused()).toBe(part);
  });

  it('tells the keys beside the lines, and describes the table with them', async () => {
    await renderAs('crew', receipt());
    const hint = document.getElementById('lines-keys')!;
    expect(hint.textContent?.replace(/\s+/g, ' ').trim()).toBe(
      'keyboard Arrow keys move between fields: up and down to the same field on the line above or below, left and right once the cursor is at the start or end of the text. Enter saves and moves on; Space opens a list.',
    );
    expect(document.querySelector('.line-table')!.getAttribute('aria-describedby')).toBe('lines-keys');
  });
});

/** Waits for a request that is sent after an animation or a queued save. */
async function nextRequest(http: HttpTestingController, url: string) {
  for (let attempt = 0; attempt < 50; attempt++) {
    const [request] = http.match(url);
    if (request) return request;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  return http.expectOne(url);
}

async function waitForBox(): Promise<HTMLElement> {
  for (let attempt = 0; attempt < 20; attempt++) {
    const box = document.querySelector<HTMLElement>('.box');
    if (box) return box;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error('No highlighted box');
}
