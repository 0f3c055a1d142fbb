// Import dialog: the preview lists rows with problems first, the import waits until they are left out, then commits.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { ImportPreviewDto } from '../../../../../shared/api/parts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ImportDialog } from './import-dialog';

const preview: ImportPreviewDto = {
  rows: [
    {
      line: 2,
      ok: true,
      errors: {},
      part: { systemName: 'Engine', description: 'Hose clamp pack', partNumber: 'HC-101', quantity: '2', unit: 'each', estimatedUnitCost: '45.25', estimatedTotal: '90.50' },
    },
    {
      line: 3,
      ok: false,
      errors: { system: 'No active system named "Cooling tower" on this build.', quantity: 'Enter an amount.' },
      part: { systemName: 'Cooling tower', description: 'Fan shroud', partNumber: '', quantity: '', unit: 'each', estimatedUnitCost: '10.00', estimatedTotal: null },
    },
    {
      line: 4,
      ok: true,
      errors: {},
      part: { systemName: 'Brakes', description: 'Brake line tubing', partNumber: 'BL-301', quantity: '3', unit: 'ft', estimatedUnitCost: '0.125', estimatedTotal: '0.38' },
    },
  ],
  accepted: 2,
  rejected: 1,
};

async function renderDialog() {
  const close = jest.fn();
  await render(ImportDialog, {
    providers: [
      ...apiTestProviders(),
      { provide: MAT_DIALOG_DATA, useValue: { buildId: 'b-1', currency: 'USD', locale: 'en-US' } },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  const http = TestBed.inject(HttpTestingController);
  const user = userEvent.setup();
  const file = new File(['system,description\r\n'], 'wagon-parts.csv', { type: 'text/csv' });
  await user.upload(screen.getByLabelText('CSV file'), file);
  return { http, user, close };
}

describe('ImportDialog', () => {
  it('previews the file, lists the rejected row first with its problems, and imports only once they are left out', async () => {
    const { http, user, close } = await renderDialog();
    const previewRequest = http.expectOne('/api/builds/b-1/parts/import');
    expect(((previewRequest.request.body as FormData).get('file') as File).name).toBe('wagon-parts.csv');
    previewRequest.flush(preview);

    expect((await screen.findByRole('status')).textContent?.replace(/\s+/g, ' ').trim()).toBe(
      '3 rows read: 2 ready, error 1 with problems. Rows with problems are listed first.',
    );
    const lines = Array.from(document.querySelectorAll('tr.mat-mdc-row')).map((row) => row.querySelector('td')?.textContent?.trim());
    expect(lines).toEqual(['3', '2', '4']);
    expect(document.querySelector('tr.rejected')?.textContent).toContain('System: No active system named "Cooling tower" on this build.');
    expect(document.querySelector('tr.rejected')?.textContent).toContain('Quantity: Enter an amount.');

    const importButton = screen.getByRole('button', { name: 'Import 2 parts' }) as HTMLButtonElement;
    expect(importButton.disabled).toBe(true);
    await user.click(screen.getByRole('checkbox', { name: 'Leave out the 1 row with problems' }));
    expect(importButton.disabled).toBe(false);
    await user.click(importButton);

    const commit = http.expectOne('/api/builds/b-1/parts/import?commit=true&dropRejected=true');
    expect(commit.request.method).toBe('POST');
    commit.flush({ imported: 2, dropped: 1 }, { status: 201, statusText: 'Created' });
    expect(close).toHaveBeenCalledWith({ imported: 2, dropped: 1 });
  });

  it('says what is wrong with a file the server cannot read, and offers no import', async () => {
    const { http } = await renderDialog();
    http.expectOne('/api/builds/b-1/parts/import').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fields: { file: 'The header row lacks: unit. Expected columns: system, description, part number, quantity, unit, estimated unit cost, status, storage location, source link, notes.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    expect((await screen.findByRole('alert')).textContent).toContain('The header row lacks: unit.');
    expect(screen.queryByRole('button', { name: /^Import \d/ })).toBeNull();
  });
});
