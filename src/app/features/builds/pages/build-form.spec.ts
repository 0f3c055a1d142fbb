// Build form: names the field in its messages, sends calendar dates as YYYY-MM-DD, sends the version when editing.
import { Component, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { provideMomentDateAdapter } from '@angular/material-moment-adapter';
import { Router } from '@angular/router';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { describedText } from '../../../../testing/described-text';
import { testBuild } from '../../../../testing/build-fixtures';
import { BuildForm } from './build-form';

@Component({ template: '' })
class Blank {}

const providers = [...apiTestProviders([{ path: 'builds/:buildId', component: Blank }]), provideMomentDateAdapter()];

const saved = testBuild('owner', {
  id: 'b-42',
  name: 'Green wagon refresh',
  vehicle: '1986 Halden wagon, 2.0 L diesel',
  currency: 'EUR',
  locale: 'de-DE',
  startedOn: '2026-03-14',
  targetDate: '2026-11-02',
  version: 5,
  createdAt: '2026-03-14T08:00:00.000Z',
});

const settle = () => new Promise((resolve) => setTimeout(resolve));

describe('BuildForm', () => {
  it('puts the message on the field it is about and sends nothing', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();

    await user.click(screen.getByRole('button', { name: 'Create build' }));

    expect(await screen.findByText('Give the build a name.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('Build name'))).toBe('Give the build a name.');
    // The other fields hold valid defaults, so they carry only their hints.
    expect(describedText(screen.getByRole('combobox', { name: 'Currency' }))).toBe('US Dollar');
    TestBed.inject(HttpTestingController).verify();
  });

  it('rejects a currency that is not an ISO 4217 code, on the Currency field', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Build name'), 'Green wagon refresh');
    await user.clear(screen.getByRole('combobox', { name: 'Currency' }));
    await user.type(screen.getByRole('combobox', { name: 'Currency' }), 'ABC');
    await user.keyboard('{Escape}');
    await user.click(screen.getByRole('button', { name: 'Create build' }));

    expect(await screen.findByText('Choose an ISO 4217 currency code such as USD or EUR.')).toBeTruthy();
    expect(describedText(screen.getByRole('combobox', { name: 'Currency' }))).toBe('Choose an ISO 4217 currency code such as USD or EUR.');
    TestBed.inject(HttpTestingController).verify();
  });

  it('picks the language and region from a list named in each language, and says how amounts will look', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();
    const locale = screen.getByRole('combobox', { name: 'Language and region' });
    expect(describedText(locale)).toBe('American English: dates and amounts are shown this way');
    await user.clear(locale);
    await user.type(locale, 'brasil');
    await user.click(await screen.findByRole('option', { name: 'pt-BR · português (Brasil)' }));
    expect((locale as HTMLInputElement).value).toBe('pt-BR');
    expect(describedText(locale)).toBe('português (Brasil): dates and amounts are shown this way');
  });

  it('creates a build, sending the dates typed in as YYYY-MM-DD', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();
    const http = TestBed.inject(HttpTestingController);

    await user.type(screen.getByLabelText('Build name'), 'Green wagon refresh');
    await user.type(screen.getByLabelText('Vehicle'), '1986 Halden wagon, 2.0 L diesel');
    await user.type(screen.getByLabelText('Start date'), '3/14/2026');
    await user.type(screen.getByLabelText('Target date'), '11/2/2026');
    await user.click(screen.getByRole('button', { name: 'Create build' }));

    const request = http.expectOne('/api/builds');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      name: 'Green wagon refresh',
      vehicle: '1986 Halden wagon, 2.0 L diesel',
      currency: 'USD',
      locale: 'en-US',
      status: 'planning',
      startedOn: '2026-03-14',
      targetDate: '2026-11-02',
    });
    request.flush({ ...saved, currency: 'USD', locale: 'en-US', status: 'planning' }, { status: 201, statusText: 'Created' });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/builds/b-42');
  });

  it('says so on the Target date field when the target is before the start', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Build name'), 'Green wagon refresh');
    await user.type(screen.getByLabelText('Start date'), '3/14/2026');
    await user.type(screen.getByLabelText('Target date'), '3/1/2026');
    await user.click(screen.getByRole('button', { name: 'Create build' }));

    expect(await screen.findByText('The target date is before the start date.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('Target date'))).toBe('The target date is before the start date.');
    TestBed.inject(HttpTestingController).verify();
  });

  it('shows the server’s field errors on the fields', async () => {
    await render(BuildForm, { providers });
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Build name'), 'Green wagon refresh');
    await user.click(screen.getByRole('button', { name: 'Create build' }));
    TestBed.inject(HttpTestingController)
      .expectOne('/api/builds')
      .flush(
        { error: { code: 'validation_failed', message: 'Check the fields.', fields: { name: 'You already have a build with that name.' } } },
        { status: 400, statusText: 'Bad Request' },
      );

    expect(await screen.findByText('You already have a build with that name.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('Build name'))).toBe('You already have a build with that name.');
  });

  it('edits with the version last read, keeps the currency fixed, and reloads after a 409', async () => {
    await render(BuildForm, { providers, bindings: [inputBinding('buildId', () => 'b-42')] });
    const user = userEvent.setup();
    const http = TestBed.inject(HttpTestingController);

    http.expectOne('/api/builds/b-42').flush(saved);
    const nameField = (await screen.findByDisplayValue('Green wagon refresh')) as HTMLInputElement;
    expect((screen.getByRole('combobox', { name: 'Currency' }) as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByLabelText('Start date') as HTMLInputElement).value).toBe('3/14/2026');

    await user.clear(nameField);
    await user.type(nameField, 'Green wagon');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    const patch = http.expectOne((request) => request.method === 'PATCH');
    expect(patch.request.url).toBe('/api/builds/b-42');
    expect(patch.request.body).toEqual({
      name: 'Green wagon',
      vehicle: '1986 Halden wagon, 2.0 L diesel',
      locale: 'de-DE',
      status: 'active',
      startedOn: '2026-03-14',
      targetDate: '2026-11-02',
      returnWindowDays: 30,
      version: 5,
    });
    patch.flush({ error: { code: 'conflict', message: 'Changed by someone else.' } }, { status: 409, statusText: 'Conflict' });

    expect(await screen.findByText(/Someone else changed this build while you were editing/)).toBeTruthy();
    http.expectOne((request) => request.method === 'GET' && request.url === '/api/builds/b-42').flush({
      ...saved,
      name: 'Green wagon (Ines)',
      version: 6,
    });
    expect(await screen.findByDisplayValue('Green wagon (Ines)')).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    const second = http.expectOne((request) => request.method === 'PATCH');
    expect(second.request.body.version).toBe(6);
    second.flush({ ...saved, name: 'Green wagon (Ines)', version: 7 });
  });

  it('edits the return window in days and puts a bad value on that field', async () => {
    await render(BuildForm, { providers, bindings: [inputBinding('buildId', () => 'b-42')] });
    const user = userEvent.setup();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/builds/b-42').flush({ ...saved, returnWindowDays: 14 });
    const field = (await screen.findByLabelText('Return window (days)')) as HTMLInputElement;
    expect(field.value).toBe('14');

    await user.clear(field);
    await user.type(field, '-3');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('The return window cannot be negative.')).toBeTruthy();
    expect(describedText(field)).toBe('The return window cannot be negative.');
    http.expectNone((request) => request.method === 'PATCH');

    await user.clear(field);
    await user.type(field, '45');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    const patch = http.expectOne((request) => request.method === 'PATCH');
    expect(patch.request.body.returnWindowDays).toBe(45);
    patch.flush({ ...saved, returnWindowDays: 45, version: 6 });
  });

  it('has no return window field when creating a build', async () => {
    await render(BuildForm, { providers });
    expect(screen.queryByLabelText('Return window (days)')).toBeNull();
  });
});
