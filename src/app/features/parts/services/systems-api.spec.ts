// SystemsApi: each call's method, URL and body, and the failure statuses a page handles.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { SystemDto, SystemsResponse } from '../../../../../shared/api/parts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ApiError } from '../../../core/http/api-error';
import { SystemsApi } from './systems-api';

const brakes: SystemDto = {
  id: 's-brakes',
  name: 'Brakes',
  budget: '1200.00',
  estimate: '318.99',
  partCount: 2,
  sortOrder: 6,
  archived: false,
  safetyCaution: true,
  version: 3,
};

const overview: SystemsResponse = {
  currency: 'USD',
  systems: [brakes],
  contingencyBudget: '150.00',
  budgetWithContingency: '1350.00',
  planned: '318.99',
  buildVersion: 4,
};

describe('SystemsApi', () => {
  let api: SystemsApi;
  let http: HttpTestingController;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(SystemsApi);
    http = TestBed.inject(HttpTestingController);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => http.verify());

  it('lists active systems with GET /api/builds/:id/systems and no archived parameter', () => {
    let answer: SystemsResponse | undefined;
    api.list('b-1').subscribe((response) => (answer = response));
    const request = http.expectOne((candidate) => candidate.url === '/api/builds/b-1/systems');
    expect(request.request.method).toBe('GET');
    expect(request.request.urlWithParams).toBe('/api/builds/b-1/systems');
    request.flush(overview);
    expect(answer).toEqual(overview);
  });

  it('lists archived systems too with ?archived=true', () => {
    api.list('b-1', true).subscribe();
    const request = http.expectOne('/api/builds/b-1/systems?archived=true');
    expect(request.request.method).toBe('GET');
    request.flush(overview);
  });

  it('adds a system with POST /api/builds/:id/systems; a 403 is told in a snack bar', () => {
    let failure: ApiError | undefined;
    api.create('b-1', { name: 'Paint and trim', budget: '800.00' }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/systems');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ name: 'Paint and trim', budget: '800.00' });
    request.flush({ error: { code: 'forbidden', message: 'Only the owner sets budgets.' } }, { status: 403, statusText: 'Forbidden' });
    expect(failure?.status).toBe(403);
    expect(snackBar).toHaveBeenCalledWith('Only the owner sets budgets.', 'Dismiss', { duration: 8000 });
  });

  it('edits with PATCH /api/builds/:id/systems/:systemId and the version; a 409 is left to the page', () => {
    let failure: ApiError | undefined;
    api.update('b-1', 's-brakes', { budget: '1300.00', version: 3 }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/systems/s-brakes');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ budget: '1300.00', version: 3 });
    request.flush(
      { error: { code: 'stale_version', message: 'This system was changed by someone else since you opened it.' } },
      { status: 409, statusText: 'Conflict' },
    );
    expect(failure?.status).toBe(409);
    expect(failure?.code).toBe('stale_version');
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('keeps a budget field error for the field, without a snack bar', () => {
    let failure: ApiError | undefined;
    api.update('b-1', 's-brakes', { budget: '10.005', version: 3 }).subscribe({ error: (error: ApiError) => (failure = error) });
    http
      .expectOne('/api/builds/b-1/systems/s-brakes')
      .flush(
        { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { budget: 'USD amounts have at most 2 decimals.' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(failure?.fields).toEqual({ budget: 'USD amounts have at most 2 decimals.' });
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('sets the contingency with PUT /api/builds/:id/contingency and the build version', () => {
    let answer: SystemsResponse | undefined;
    api.updateContingency('b-1', { contingencyBudget: '150.00', version: 4 }).subscribe((response) => (answer = response));
    const request = http.expectOne('/api/builds/b-1/contingency');
    expect(request.request.method).toBe('PUT');
    expect(request.request.body).toEqual({ contingencyBudget: '150.00', version: 4 });
    request.flush({ ...overview, buildVersion: 5 });
    expect(answer?.buildVersion).toBe(5);
  });

  it('escapes ids in the path', () => {
    api.update('a/b', 's?1', { archived: true, version: 1 }).subscribe();
    http.expectOne('/api/builds/a%2Fb/systems/s%3F1').flush(brakes);
  });
});
