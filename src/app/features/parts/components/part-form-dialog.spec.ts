// Part form dialog: the schema's and the server's messages on their fields, and a stale edit shown as yours beside saved.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { render, screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { PartDto } from '../../../../../shared/api/parts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { describedText } from '../../../../testing/described-text';
import { testPart, testSystem } from '../../../../testing/build-fixtures';
import { PartFormData, PartFormDialog } from './part-form-dialog';

const systems = [testSystem('11111111-1111-4111-8111-111111111111', 'Engine'), testSystem('22222222-2222-4222-8222-222222222222', 'Brakes')];

const pads = testPart('p-1', { systemId: systems[1].id, estimatedUnitCost: '24.99', estimatedTotal: '49.98' });

async function renderDialog(data: Partial<PartFormData> = {}) {
  const close = jest.fn();
  await render(PartFormDialog, {
    providers: [
      ...apiTestProviders(),
      { provide: MAT_DIALOG_DATA, useValue: { buildId: 'b-1', currency: 'USD', locale: 'en-US', systems, ...data } },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  return { close, http: TestBed.inject(HttpTestingController), user: userEvent.setup() };
}

describe('PartFormDialog', () => {
  it('checks the request with the shared schema first and puts each message on its field', async () => {
    const { http, user } = await renderDialog();
    await user.clear(screen.getByLabelText('Quantity'));
    await user.type(screen.getByLabelText('Quantity'), '0');
    await user.type(screen.getByLabelText('Estimated unit cost'), '12,50');
    await user.click(screen.getByRole('button', { name: 'Add part' }));

    expect(await screen.findByText('Describe the part.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('Description'))).toBe('Describe the part.');
    expect(describedText(screen.getByLabelText('Quantity'))).toBe('Enter an amount of at least 0.0001.');
    expect(describedText(screen.getByLabelText('Estimated unit cost'))).toBe('Use a dot for decimals and no thousands separators.');
    http.verify();
  });

  it('sends the amounts as typed strings and shows the server’s field error on its field', async () => {
    const { http, user } = await renderDialog({ systemId: systems[1].id });
    await user.type(screen.getByLabelText('Description'), 'Ceramic brake pads, front axle');
    await user.type(screen.getByLabelText('Part number'), 'BP-2231');
    await user.clear(screen.getByLabelText('Quantity'));
    await user.type(screen.getByLabelText('Quantity'), '2');
    await user.type(screen.getByLabelText('Estimated unit cost'), '64.5');
    // 2 × 64.5 = 129, shown in the currency's minor units before saving.
    expect(screen.getByText('$129.00')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Add part' }));

    const request = http.expectOne('/api/builds/b-1/parts');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      systemId: systems[1].id,
      description: 'Ceramic brake pads, front axle',
      partNumber: 'BP-2231',
      quantity: '2',
      unit: 'each',
      estimatedUnitCost: '64.5',
      status: 'planned',
      storageLocation: '',
      sourceUrl: '',
      notes: '',
      forSale: false,
      askingPrice: null,
    });
    request.flush(
      { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { systemId: 'No such system on this build.' } } },
      { status: 400, statusText: 'Bad Request' },
    );

    expect(await screen.findByText('No such system on this build.')).toBeTruthy();
    expect(describedText(screen.getByRole('combobox', { name: 'System' }))).toBe('No such system on this build.');
  });

  it('on a stale edit shows each differing field, yours beside saved, and keeps mine with the new version', async () => {
    const { http, user, close } = await renderDialog({ part: pads });
    const cost = screen.getByLabelText('Estimated unit cost');
    await user.clear(cost);
    await user.type(cost, '26');
    await user.click(screen.getByRole('button', { name: 'Save part' }));

    const stale = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(stale.request.method).toBe('PATCH');
    expect(stale.request.body).toMatchObject({ estimatedUnitCost: '26', version: 1 });
    const saved: PartDto = { ...pads, status: 'on_hand', storageLocation: 'Bin 4', estimatedUnitCost: '24.99', version: 2 };
    stale.flush(
      { error: { code: 'stale_version', message: 'This part was changed by someone else since you opened it.', current: saved } },
      { status: 409, statusText: 'Conflict' },
    );

    const conflict = await screen.findByRole('alert');
    expect(within(conflict).getByText('Someone else saved this part while you were editing')).toBeTruthy();
    const rows = within(conflict)
      .getAllByRole('row')
      .slice(1)
      .map((row) => Array.from(row.children).map((cell) => cell.textContent?.trim()));
    expect(rows).toEqual([
      ['Estimated unit cost', '$26.00', '$24.99'],
      ['Status', 'Planned', 'On the shelf'],
      ['Storage location', '(empty)', 'Bin 4'],
    ]);

    await user.click(within(conflict).getByRole('button', { name: 'Keep mine' }));
    const again = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(again.request.body).toMatchObject({ estimatedUnitCost: '26', status: 'planned', storageLocation: '', version: 2 });
    const mine = { ...pads, estimatedUnitCost: '26.00', estimatedTotal: '52.00', version: 3 };
    again.flush(mine);
    expect(close).toHaveBeenCalledWith({ saved: mine });
  });

  it('takes the saved part when asked, sending nothing more', async () => {
    const { http, user, close } = await renderDialog({ part: pads });
    await user.type(screen.getByLabelText('Notes'), 'Check the wear sensor');
    await user.click(screen.getByRole('button', { name: 'Save part' }));
    const saved: PartDto = { ...pads, notes: 'Bought two sets', version: 2 };
    http
      .expectOne('/api/builds/b-1/parts/p-1')
      .flush({ error: { code: 'stale_version', message: 'Changed by someone else.', current: saved } }, { status: 409, statusText: 'Conflict' });

    const conflict = await screen.findByRole('alert');
    const row = within(conflict).getByRole('rowheader', { name: 'Notes' }).closest('tr')!;
    expect(within(row).getAllByRole('cell').map((cell) => cell.textContent?.trim())).toEqual(['Check the wear sensor', 'Bought two sets']);
    await user.click(within(conflict).getByRole('button', { name: 'Take the saved one' }));
    expect(close).toHaveBeenCalledWith({ saved });
    http.verify();
  });
});
