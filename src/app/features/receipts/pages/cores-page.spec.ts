// Cores and returns: overdue deposits and closing return windows marked in words with an icon, one click moves a deposit
// or a part on with its version, a stale version reloads with a message, a reviewer gets no buttons.
import { screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { CoreDto, RefundedItemDto, ReturnableItemDto, ReturnsDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { testCore } from '../../../../testing/build-fixtures';
import { renderInBuild } from '../../../../testing/render-in-build';
import { CoresPage, daysBetween, todayIso, windowText } from './cores-page';

const core = (id: string, dueDate: string, extra: Partial<CoreDto> = {}): CoreDto => testCore(id, { dueDate, version: 2, ...extra });

const NO_RETURNS: ReturnsDto = { returnable: [], awaitingRefund: [], refunded: [] };

/** A calendar date `days` after today (local calendar, as the page counts). */
function fromToday(days: number): string {
  const date = new Date(`${todayIso()}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

const returnable = (lineId: string, until: string, extra: Partial<ReturnableItemDto> = {}): ReturnableItemDto => ({
  lineId,
  receiptId: 'r-2',
  vendorName: 'Copperline Supply',
  purchaseDate: '2026-01-31',
  description: 'Water pump',
  partNumber: 'WP-3',
  amountPaid: '61.20',
  partId: `p-${lineId}`,
  partVersion: 4,
  partStatus: 'on_hand',
  returnableUntil: until,
  windowClosed: until < todayIso(),
  ...extra,
});

const refunded = (): RefundedItemDto => ({
  ...returnable('l-back', '2026-03-02', { description: 'Fan shroud', partNumber: '', partStatus: 'returned' }),
  refundReceiptId: 'r-slip',
  refundDate: '2026-02-25',
  refundedAmount: '48.15',
});

async function renderAs(role: BuildRole, cores: CoreDto[], returns: ReturnsDto = NO_RETURNS) {
  const { http } = await renderInBuild(CoresPage, { role });
  http.expectOne('/api/builds/b-1/cores').flush({ cores });
  http.expectOne('/api/builds/b-1/returns').flush(returns);
  return http;
}

describe('CoresPage', () => {
  it('gives today in the local calendar as YYYY-MM-DD', () => {
    expect(todayIso(new Date(2026, 0, 5, 23, 30))).toBe('2026-01-05');
  });

  it('marks an owed deposit past its due date as Overdue, and not one still in time or already handed in', async () => {
    await renderAs('crew', [
      core('c-late', '2000-01-31'),
      core('c-fine', '2999-01-31', { description: 'Caliper core' }),
      core('c-in', '2000-01-31', { description: 'Starter core', state: 'dropped_off' }),
    ]);
    expect(await screen.findByText(/Overdue: was due Jan 31, 2000/)).toBeTruthy();
    expect(screen.getAllByText(/Overdue/)).toHaveLength(1);
    expect(screen.getByText('Due back by Jan 31, 2999')).toBeTruthy();
    expect(screen.getByText('Old part handed in')).toBeTruthy();
  });

  it('moves a deposit on with one click, sending its version', async () => {
    const http = await renderAs('owner', [core('c-1', '2999-01-31')]);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: /Handed in the old part/ }));
    const request = http.expectOne('/api/builds/b-1/cores/c-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ state: 'dropped_off', version: 2 });
    request.flush(core('c-1', '2999-01-31', { state: 'dropped_off', version: 3 }));
    expect(await screen.findByText('Old part handed in')).toBeTruthy();
    expect(screen.getByRole('button', { name: /Deposit came back/ })).toBeTruthy();
  });

  it('shows a reviewer the deposits without buttons', async () => {
    await renderAs('reviewer', [core('c-1', '2999-01-31')]);
    await screen.findByText('Alternator core · ALT-9');
    expect(screen.queryAllByRole('button')).toEqual([]);
  });

  it('counts whole calendar days and says how long a return window has left', () => {
    // 2026-02-27 to 2026-03-02: 2026 is not a leap year, so 1, 2 (Feb 28 -> Mar 1), 3 days.
    expect(daysBetween('2026-02-27', '2026-03-02')).toBe(3);
    expect(daysBetween('2026-03-02', '2026-02-27')).toBe(-3);
    expect(windowText(12)).toBe('12 days left');
    expect(windowText(1)).toBe('1 day left');
    expect(windowText(0)).toBe('Last day today');
    expect(windowText(-1)).toBe('Window closed yesterday');
    expect(windowText(-4)).toBe('Window closed 4 days ago');
  });

  it('shows the three groups of returns with counts, closing windows marked, the amount owed back, refunds folded away', async () => {
    await renderAs('crew', [], {
      returnable: [
        returnable('l-soon', fromToday(3), { description: 'Thermostat', partNumber: '' }),
        returnable('l-late', fromToday(20), { description: 'Brake hose', partNumber: 'BH-1' }),
        returnable('l-shut', fromToday(-2), { description: 'Radiator cap', partNumber: '' }),
      ],
      awaitingRefund: [returnable('l-away', '2026-03-02', { partStatus: 'returned' })],
      refunded: [refunded()],
    });
    expect(await screen.findByRole('heading', { name: 'Can still go back (2)' })).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Returns' })).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Sent back, refund not filed yet (1)' })).toBeTruthy();

    const soon = screen.getByRole('list', { name: 'Can still go back' }).children;
    expect(soon[0].textContent).toMatch(/Thermostat.*Closing soon: returnable until .* · 3 days left/);
    expect(soon[0].querySelector('mat-icon')?.textContent).toBe('hourglass_bottom');
    expect(soon[1].textContent).toContain('Brake hose · BH-1');
    expect(soon[1].textContent).toMatch(/Returnable until .* · 20 days left/);
    expect(soon[1].textContent).not.toContain('Closing soon');
    expect(soon).toHaveLength(2);
    // A closed window leaves "can still go back" for its own folded group.
    const closedFold = screen.getByText('Window closed (1)').closest('details')!;
    expect(closedFold.open).toBe(false);
    const closed = within(closedFold).getByRole('list', { name: 'Window closed', hidden: true }).children;
    expect(closed[0].textContent).toMatch(/Radiator cap.*Could go back until .* · Window closed 2 days ago/);

    const awaiting = screen.getByRole('list', { name: 'Sent back, refund not filed yet' }).children;
    expect(awaiting).toHaveLength(1);
    expect(awaiting[0].textContent).toContain('Water pump · WP-3');
    expect(awaiting[0].textContent).toContain('$61.20');
    expect(awaiting[0].textContent).toContain('Owed back');
    expect(screen.getByRole('link', { name: /Upload the return slip/ })).toBeTruthy();

    const fold = screen.getByText('Refunded (1)').closest('details')!;
    expect(fold.open).toBe(false);
    await userEvent.setup().click(screen.getByText('Refunded (1)'));
    expect(fold.open).toBe(true);
    expect(fold.textContent).toContain('Fan shroud');
    expect(fold.textContent).toContain('$48.15');
    expect(fold.textContent).toContain('Return slip of Feb 25, 2026');
  });

  it('says in one quiet line when a group is empty', async () => {
    await renderAs('owner', [core('c-1', '2999-01-31')]);
    expect(await screen.findByText('Nothing bought is within its return window now.')).toBeTruthy();
    expect(screen.getByText('Nothing sent back is waiting for its refund.')).toBeTruthy();
    expect(screen.getByText('No refunds filed yet.')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Can still go back (0)' })).toBeTruthy();
  });

  it('sends a part back in one click with its version, then lists it as awaiting its refund', async () => {
    const item = returnable('l-1', fromToday(10));
    const http = await renderAs('crew', [], { ...NO_RETURNS, returnable: [item] });
    await userEvent.setup().click(await screen.findByRole('button', { name: /Mark as sent back/ }));
    const request = http.expectOne('/api/builds/b-1/parts/p-l-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ status: 'returned', version: 4 });
    request.flush({ id: 'p-l-1', status: 'returned', version: 5 });
    http.expectOne('/api/builds/b-1/returns').flush({ ...NO_RETURNS, awaitingRefund: [{ ...item, partStatus: 'returned', partVersion: 5 }] });
    expect(await screen.findByRole('heading', { name: 'Sent back, refund not filed yet (1)' })).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Can still go back (0)' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Mark as sent back/ })).toBeNull();
    expect(screen.getByRole('button', { name: /Keep it after all/ })).toBeTruthy();
  });

  it('keeps a part after all: back on the shelf with its version', async () => {
    const item = returnable('l-2', '2026-03-02', { partStatus: 'returned', partVersion: 7 });
    const http = await renderAs('owner', [], { ...NO_RETURNS, awaitingRefund: [item] });
    await userEvent.setup().click(await screen.findByRole('button', { name: /Keep it after all/ }));
    const request = http.expectOne('/api/builds/b-1/parts/p-l-2');
    expect(request.request.body).toEqual({ status: 'on_hand', version: 7 });
    request.flush({ id: 'p-l-2', status: 'on_hand', version: 8 });
    http.expectOne('/api/builds/b-1/returns').flush(NO_RETURNS);
    expect(await screen.findByText('Nothing sent back is waiting for its refund.')).toBeTruthy();
  });

  it('reloads and says someone changed the part when the version is stale (409)', async () => {
    const item = returnable('l-3', fromToday(10));
    const http = await renderAs('crew', [], { ...NO_RETURNS, returnable: [item] });
    await userEvent.setup().click(await screen.findByRole('button', { name: /Mark as sent back/ }));
    http
      .expectOne('/api/builds/b-1/parts/p-l-3')
      .flush({ error: { code: 'stale_version', message: 'This part was changed by someone else.' } }, { status: 409, statusText: 'Conflict' });
    expect((await screen.findByRole('alert')).textContent).toContain('Someone else changed "Water pump" in the meantime. The list is reloaded: check it and try again.');
    http.expectOne('/api/builds/b-1/returns').flush({ ...NO_RETURNS, awaitingRefund: [{ ...item, partStatus: 'returned', partVersion: 5 }] });
    expect(await screen.findByRole('heading', { name: 'Sent back, refund not filed yet (1)' })).toBeTruthy();
    http.verify();
  });

  it('shows a reviewer the returns read-only: no buttons, no upload link', async () => {
    await renderAs('reviewer', [], {
      returnable: [returnable('l-4', fromToday(10))],
      awaitingRefund: [returnable('l-5', '2026-03-02', { description: 'Fuel pump', partStatus: 'returned' })],
      refunded: [refunded()],
    });
    expect(await screen.findByText('Fuel pump · WP-3')).toBeTruthy();
    expect(screen.getByText('The refund is recorded when its return slip is filed.')).toBeTruthy();
    expect(screen.queryAllByRole('button')).toEqual([]);
    expect(screen.queryByRole('link', { name: /Upload the return slip/ })).toBeNull();
  });
});
