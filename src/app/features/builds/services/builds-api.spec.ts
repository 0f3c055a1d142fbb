// BuildsApi: each call's method, URL and body, and the failure statuses a page handles.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { BuildDto } from '../../../../../shared/api/builds';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testBuild } from '../../../../testing/build-fixtures';
import { ApiError } from '../../../core/http/api-error';
import { BuildsApi } from './builds-api';

const coupe = testBuild('owner', {
  name: 'Teal coupe swap',
  vehicle: '1978 Marlow coupe, 2.3 L four',
  startedOn: '2026-02-01',
  version: 3,
  createdAt: '2026-02-01T10:00:00.000Z',
});

describe('BuildsApi', () => {
  let api: BuildsApi;
  let http: HttpTestingController;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(BuildsApi);
    http = TestBed.inject(HttpTestingController);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => http.verify());

  it('lists current builds with GET /api/builds and no archived parameter', () => {
    let builds: BuildDto[] | undefined;
    api.list().subscribe((answer) => (builds = answer));
    const request = http.expectOne((candidate) => candidate.url === '/api/builds');
    expect(request.request.method).toBe('GET');
    expect(request.request.urlWithParams).toBe('/api/builds');
    request.flush({ builds: [coupe] });
    expect(builds).toEqual([coupe]);
  });

  it('lists archived builds too with GET /api/builds?archived=true', () => {
    api.list(true).subscribe();
    const request = http.expectOne('/api/builds?archived=true');
    expect(request.request.method).toBe('GET');
    request.flush({ builds: [] });
  });

  it('creates with POST /api/builds and the request as body', () => {
    let created: BuildDto | undefined;
    const body = { name: 'Teal coupe swap', vehicle: '', currency: 'USD', locale: 'en-US', status: 'planning' as const, startedOn: '2026-02-01', targetDate: null };
    api.create(body).subscribe((answer) => (created = answer));
    const request = http.expectOne('/api/builds');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual(body);
    request.flush(coupe, { status: 201, statusText: 'Created' });
    expect(created).toEqual(coupe);
  });

  it('reads one build with GET /api/builds/:id; a 404 is left to the page (no snack bar)', () => {
    let failure: ApiError | undefined;
    api.get('b-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1');
    expect(request.request.method).toBe('GET');
    request.flush({ error: { code: 'not_found', message: 'No such build.' } }, { status: 404, statusText: 'Not Found' });
    expect(failure?.status).toBe(404);
    expect(failure?.code).toBe('not_found');
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('edits with PATCH /api/builds/:id sending the version; a 409 is left to the form', () => {
    let failure: ApiError | undefined;
    api.update('b-1', { name: 'Teal coupe', version: 3 }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ name: 'Teal coupe', version: 3 });
    request.flush(
      { error: { code: 'conflict', message: 'Someone else saved this build first.' } },
      { status: 409, statusText: 'Conflict' },
    );
    expect(failure?.status).toBe(409);
    expect(failure?.message).toBe('Someone else saved this build first.');
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('archives with DELETE /api/builds/:id; a 403 is told in a snack bar', () => {
    let failure: ApiError | undefined;
    api.archive('b-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1');
    expect(request.request.method).toBe('DELETE');
    request.flush(
      { error: { code: 'forbidden', message: 'Only the owner can archive a build.' } },
      { status: 403, statusText: 'Forbidden' },
    );
    expect(failure?.status).toBe(403);
    expect(snackBar).toHaveBeenCalledWith('Only the owner can archive a build.', 'Dismiss', { duration: 8000 });
  });

  it('restores with POST /api/builds/:id/restore', () => {
    let restored: BuildDto | undefined;
    api.restore('b-1').subscribe((answer) => (restored = answer));
    const request = http.expectOne('/api/builds/b-1/restore');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBeNull();
    request.flush(coupe);
    expect(restored).toEqual(coupe);
  });

  it('escapes the build id in the path', () => {
    api.get('a/b').subscribe();
    http.expectOne('/api/builds/a%2Fb').flush(coupe);
  });
});
