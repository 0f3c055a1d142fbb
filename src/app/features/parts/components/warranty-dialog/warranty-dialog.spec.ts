// Warranty dialog: the length and start sent as the part's warranty fields, the schema's and the server's messages on
// their fields, and removal.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { PartDto } from '../../../../../../shared/api/parts';
import { apiTestProviders } from '../../../../../testing/api-test-providers';
import { testPart } from '../../../../../testing/build-fixtures';
import { describedText } from '../../../../../testing/described-text';
import { WarrantyDialog } from './warranty-dialog';

async function renderDialog(part: PartDto) {
  const close = jest.fn();
  await render(WarrantyDialog, {
    providers: [...apiTestProviders(), { provide: MAT_DIALOG_DATA, useValue: { buildId: 'b-1', part } }, { provide: MatDialogRef, useValue: { close } }],
  });
  return { close, http: TestBed.inject(HttpTestingController), user: userEvent.setup() };
}

describe('WarrantyDialog', () => {
  it('sends 12 months starting on the receipt\'s date, and closes with the saved part', async () => {
    const { http, user, close } = await renderDialog(testPart('p-1', { version: 3 }));
    await user.click(screen.getByRole('combobox', { name: 'Warranty' }));
    await user.click(await screen.findByRole('option', { name: 'A number of months' }));
    await user.click(screen.getByRole('button', { name: 'Save warranty' }));

    const request = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ warranty: 12, warrantyStart: null, version: 3 });
    const saved = testPart('p-1', { warranty: 12, warrantyStart: '2026-03-14', warrantyEnds: '2027-03-14', version: 4 });
    request.flush(saved);
    expect(close).toHaveBeenCalledWith(saved);
  });

  it('puts the schema\'s message on the months, and the server\'s on the start', async () => {
    const { http, user, close } = await renderDialog(testPart('p-1', { warranty: 12, warrantyStart: '2026-03-14', warrantyEnds: '2027-03-14', version: 2 }));
    await user.clear(screen.getByLabelText('Months'));
    await user.type(screen.getByLabelText('Months'), '1.5');
    await user.click(screen.getByRole('button', { name: 'Save warranty' }));
    expect(describedText(screen.getByLabelText('Months'))).toBe('Enter the warranty as whole months, from 1 to 1200, or "lifetime"; null removes it.');
    http.verify();

    await user.clear(screen.getByLabelText('Months'));
    await user.type(screen.getByLabelText('Months'), '24');
    await user.clear(screen.getByLabelText('Starts on'));
    await user.click(screen.getByRole('button', { name: 'Save warranty' }));
    const request = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(request.request.body).toEqual({ warranty: 24, warrantyStart: null, version: 2 });
    const message = 'Enter the day the warranty starts, or choose the receipt it rests on (one with a date).';
    request.flush({ error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { warrantyStart: message } } }, { status: 400, statusText: 'Bad Request' });
    expect(await screen.findByText(message)).toBeTruthy();
    expect(close).not.toHaveBeenCalled();
  });

  it('removes the warranty', async () => {
    const { http, user } = await renderDialog(testPart('p-1', { warranty: 'lifetime', warrantyStart: '2026-03-14', version: 5 }));
    await user.click(screen.getByRole('combobox', { name: 'Warranty' }));
    await user.click(await screen.findByRole('option', { name: 'No warranty' }));
    await user.click(screen.getByRole('button', { name: 'Save warranty' }));
    expect(http.expectOne('/api/builds/b-1/parts/p-1').request.body).toEqual({ warranty: null, version: 5 });
  });
});
