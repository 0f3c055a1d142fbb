// Cores and returns: overdue deposits marked in words with an icon, one click moves a deposit on with its version, a reviewer gets no buttons.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { BuildDto } from '../../../../../shared/api/builds';
import type { CoreDto } from '../../../../../shared/api/receipts';
import type { BuildRole } from '../../../../../shared/enums';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { CurrentBuild } from '../../builds/services/current-build';
import { CoresPage, todayIso } from './cores-page';

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

const core = (id: string, dueDate: string, extra: Partial<CoreDto> = {}): CoreDto => ({
  id,
  state: 'owed',
  dueDate,
  amount: '40.00',
  description: 'Alternator core',
  partNumber: 'ALT-9',
  receiptId: 'r-1',
  vendorName: 'Ridgeback Parts',
  purchaseDate: '2026-01-30',
  refundLineId: null,
  version: 2,
  ...extra,
});

async function renderAs(role: BuildRole, cores: CoreDto[]) {
  await render(CoresPage, {
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
  http.expectOne('/api/builds/b-1/cores').flush({ cores });
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
});
