// Mail alert settings: one switch per kind with its explanation, each change saved at once, undone when refused.
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { AlertPreferencesDto } from '../../../../../shared/api/alerts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { AlertSettings } from './alert-settings';

const crewDefaults: AlertPreferencesDto = { budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: false, reviewDigest: false, chosen: false };

async function renderWith(preferences: AlertPreferencesDto) {
  await render(AlertSettings, { providers: apiTestProviders(), bindings: [inputBinding('buildId', () => 'b-7')] });
  const http = TestBed.inject(HttpTestingController);
  const request = http.expectOne('/api/builds/b-7/alert-preferences');
  expect(request.request.method).toBe('GET');
  request.flush(preferences);
  await screen.findByRole('switch', { name: 'Budget reached' });
  return http;
}

const checked = (name: string) => screen.getByRole('switch', { name }).getAttribute('aria-checked');

describe('AlertSettings', () => {
  it('shows one switch per kind, set as loaded, each with its one-line explanation', async () => {
    await renderWith(crewDefaults);

    expect(screen.getAllByRole('switch')).toHaveLength(6);
    expect(checked('Budget reached')).toBe('true');
    expect(checked('Core deposit due')).toBe('true');
    expect(checked('Return window closing')).toBe('true');
    expect(checked('Warranty ending')).toBe('true');
    expect(checked('Possible duplicate receipt')).toBe('false');
    expect(checked('Digest of filed receipts')).toBe('false');
    expect(screen.getByText('When a system has used 90 % and then 100 % of its budget.')).toBeTruthy();
    expect(screen.getByText('Once a day at most: the receipts filed since the last digest, with totals.')).toBeTruthy();
    expect(screen.getByText(/Until you change one, you get what your role usually needs\./)).toBeTruthy();
  });

  it('saves a change at once with every kind in the body and says so', async () => {
    const http = await renderWith(crewDefaults);
    const user = userEvent.setup();

    await user.click(screen.getByRole('switch', { name: 'Possible duplicate receipt' }));

    const request = http.expectOne('/api/builds/b-7/alert-preferences');
    expect(request.request.method).toBe('PUT');
    expect(request.request.body).toEqual({ budget: true, coreDue: true, returnWindow: true, warrantyEnding: true, duplicate: true, reviewDigest: false });
    request.flush({ ...request.request.body, chosen: true });

    expect(await screen.findByText('Possible duplicate receipt: you will get these mails.')).toBeTruthy();
    expect(checked('Possible duplicate receipt')).toBe('true');
    await waitFor(() => expect(screen.queryByText(/Until you change one/)).toBeNull());
    http.verify();
  });

  it('puts the switch back when the save is refused', async () => {
    const http = await renderWith({ ...crewDefaults, chosen: true });
    const user = userEvent.setup();

    await user.click(screen.getByRole('switch', { name: 'Budget reached' }));
    const request = http.expectOne('/api/builds/b-7/alert-preferences');
    expect(request.request.body.budget).toBe(false);
    request.flush({ error: { code: 'not_found', message: 'That build was not found.' } }, { status: 404, statusText: 'Not Found' });

    expect(await screen.findByText('That build was not found.')).toBeTruthy();
    await waitFor(() => expect(checked('Budget reached')).toBe('true'));
    expect(screen.queryByText(/you will get these mails|no more mails/)).toBeNull();
  });
});
