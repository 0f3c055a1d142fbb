// PartsApi: each call's method, URL and body, the multipart import, and the failure statuses a page handles.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { ImportPreviewDto, PartDto } from '../../../../../shared/api/parts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testPart } from '../../../../testing/build-fixtures';
import { ApiError } from '../../../core/http/api-error';
import { PartsApi } from './parts-api';

const pads = testPart('p-1');

describe('PartsApi', () => {
  let api: PartsApi;
  let http: HttpTestingController;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(PartsApi);
    http = TestBed.inject(HttpTestingController);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => http.verify());

  it('lists parts with GET /api/builds/:id/parts and answers the array', () => {
    let parts: PartDto[] | undefined;
    api.list('b-1').subscribe((answer) => (parts = answer));
    const request = http.expectOne((candidate) => candidate.url === '/api/builds/b-1/parts');
    expect(request.request.method).toBe('GET');
    expect(request.request.urlWithParams).toBe('/api/builds/b-1/parts');
    request.flush({ parts: [pads] });
    expect(parts).toEqual([pads]);
  });

  it('filters by system and status in the query', () => {
    api.list('b-1', { systemId: 's-brakes', status: 'on_hand' }).subscribe();
    const request = http.expectOne('/api/builds/b-1/parts?systemId=s-brakes&status=on_hand');
    expect(request.request.method).toBe('GET');
    request.flush({ parts: [] });
  });

  it('adds with POST /api/builds/:id/parts; field errors reach the form without a snack bar', () => {
    let failure: ApiError | undefined;
    const body = { systemId: 's-brakes', description: 'Ceramic brake pads, front axle', quantity: '2', unit: 'each' as const, estimatedUnitCost: '64.50' };
    api.create('b-1', body).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/parts');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual(body);
    request.flush(
      { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { systemId: 'No such system on this build.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(failure?.fields).toEqual({ systemId: 'No such system on this build.' });
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('edits with PATCH and the version; a stale edit (409) carries the saved part and shows no snack bar', () => {
    let failure: ApiError | undefined;
    api.update('b-1', 'p-1', { estimatedUnitCost: '26.00', version: 1 }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ estimatedUnitCost: '26.00', version: 1 });
    const saved = { ...pads, estimatedUnitCost: '24.99', estimatedTotal: '49.98', version: 2 };
    request.flush(
      { error: { code: 'stale_version', message: 'This part was changed by someone else since you opened it.', current: saved } },
      { status: 409, statusText: 'Conflict' },
    );
    expect(failure?.status).toBe(409);
    expect(failure?.code).toBe('stale_version');
    expect(failure?.current).toEqual(saved);
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('removes with DELETE /api/builds/:id/parts/:partId; a 404 is told in a snack bar', () => {
    let failure: ApiError | undefined;
    api.remove('b-1', 'p-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/parts/p-1');
    expect(request.request.method).toBe('DELETE');
    request.flush({ error: { code: 'not_found', message: 'That part was not found.' } }, { status: 404, statusText: 'Not Found' });
    expect(failure?.status).toBe(404);
    expect(snackBar).toHaveBeenCalledWith('That part was not found.', 'Dismiss', { duration: 8000 });
  });

  it('moves and sets status in bulk with POST /parts/bulk and answers the parts', () => {
    let moved: PartDto[] | undefined;
    api.bulk('b-1', { action: 'move', partIds: ['p-1', 'p-2'], systemId: 's-engine' }).subscribe((answer) => (moved = answer));
    const move = http.expectOne('/api/builds/b-1/parts/bulk');
    expect(move.request.method).toBe('POST');
    expect(move.request.body).toEqual({ action: 'move', partIds: ['p-1', 'p-2'], systemId: 's-engine' });
    move.flush({ parts: [{ ...pads, systemId: 's-engine' }] });
    expect(moved?.map((part) => part.systemId)).toEqual(['s-engine']);

    api.bulk('b-1', { action: 'status', partIds: ['p-1'], status: 'installed' }).subscribe();
    const status = http.expectOne('/api/builds/b-1/parts/bulk');
    expect(status.request.body).toEqual({ action: 'status', partIds: ['p-1'], status: 'installed' });
    status.flush({ parts: [] });
  });

  it('previews an import by sending the file as the multipart field "file", without commit', () => {
    const file = new File(['system,description\r\n'], 'parts.csv', { type: 'text/csv' });
    let preview: ImportPreviewDto | undefined;
    api.previewImport('b-1', file).subscribe((answer) => (preview = answer));
    const request = http.expectOne((candidate) => candidate.url === '/api/builds/b-1/parts/import');
    expect(request.request.method).toBe('POST');
    expect(request.request.urlWithParams).toBe('/api/builds/b-1/parts/import');
    const form = request.request.body as FormData;
    expect(form).toBeInstanceOf(FormData);
    expect((form.get('file') as File).name).toBe('parts.csv');
    request.flush({ rows: [], accepted: 0, rejected: 0 });
    expect(preview).toEqual({ rows: [], accepted: 0, rejected: 0 });
  });

  it('commits an import with ?commit=true, adding dropRejected=true only when asked', () => {
    const file = new File(['x'], 'parts.csv', { type: 'text/csv' });
    api.commitImport('b-1', file, false).subscribe();
    http.expectOne('/api/builds/b-1/parts/import?commit=true').flush({ imported: 3, dropped: 0 }, { status: 201, statusText: 'Created' });

    let failure: ApiError | undefined;
    api.commitImport('b-1', file, true).subscribe({ error: (error: ApiError) => (failure = error) });
    const dropping = http.expectOne('/api/builds/b-1/parts/import?commit=true&dropRejected=true');
    expect(dropping.request.method).toBe('POST');
    dropping.flush({ error: { code: 'forbidden', message: 'Reviewers cannot import parts.' } }, { status: 403, statusText: 'Forbidden' });
    expect(failure?.status).toBe(403);
    expect(snackBar).toHaveBeenCalledWith('Reviewers cannot import parts.', 'Dismiss', { duration: 8000 });
  });
});
