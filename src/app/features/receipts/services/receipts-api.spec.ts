// ReceiptsApi: each call's method, URL and body, upload progress, and the failure statuses the pages handle themselves.
import { TestBed } from '@angular/core/testing';
import { HttpEventType } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { CoreDto } from '../../../../../shared/api/receipts';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testCore } from '../../../../testing/build-fixtures';
import { ApiError } from '../../../core/http/api-error';
import { ReceiptsApi, UploadProgress } from './receipts-api';

describe('ReceiptsApi', () => {
  let api: ReceiptsApi;
  let http: HttpTestingController;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(ReceiptsApi);
    http = TestBed.inject(HttpTestingController);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => http.verify());

  it('uploads the files as the multipart field "files" and reports progress, then the receipts', () => {
    const file = new File(['png bytes'], 'slip.png', { type: 'image/png' });
    const seen: UploadProgress[] = [];
    api.upload('b-1', [file]).subscribe((progress) => seen.push(progress));
    const request = http.expectOne('/api/builds/b-1/receipts');
    expect(request.request.method).toBe('POST');
    expect(request.request.reportProgress).toBe(true);
    expect(((request.request.body as FormData).getAll('files') as File[]).map((sent) => sent.name)).toEqual(['slip.png']);
    request.event({ type: HttpEventType.UploadProgress, loaded: 300, total: 1200 });
    request.event({ type: HttpEventType.UploadProgress, loaded: 1200, total: 1200 });
    request.flush({ receipts: [] }, { status: 201, statusText: 'Created' });
    expect(seen).toEqual([
      { kind: 'progress', percent: 25 },
      { kind: 'progress', percent: 100 },
      { kind: 'done', receipts: [] },
    ]);
  });

  it('a refused file (400) reaches the page with its field and no snack bar', () => {
    let failure: ApiError | undefined;
    api.upload('b-1', [new File(['x'], 'notes.txt')]).subscribe({ error: (error: ApiError) => (failure = error) });
    http
      .expectOne('/api/builds/b-1/receipts')
      .flush(
        { error: { code: 'validation_failed', message: 'notes.txt: not accepted.', fields: { 'files.0': 'notes.txt: not accepted.' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(failure?.fields).toEqual({ 'files.0': 'notes.txt: not accepted.' });
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('lists with the filters in the query, leaving out blank ones', () => {
    api.list('b-1', { state: 'to_check', vendor: ' Ridge ', from: '2026-01-01', to: '', systemId: 's-1' }).subscribe();
    const request = http.expectOne('/api/builds/b-1/receipts?state=to_check&vendor=Ridge&from=2026-01-01&systemId=s-1');
    expect(request.request.method).toBe('GET');
    request.flush({ receipts: [] });
  });

  it('edits the header with PATCH and the version; a stale edit (409) shows no snack bar', () => {
    let failure: ApiError | undefined;
    api.update('b-1', 'r-1', { total: '41.50', version: 3 }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/receipts/r-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ total: '41.50', version: 3 });
    request.flush({ error: { code: 'stale_version', message: 'This receipt was changed.' } }, { status: 409, statusText: 'Conflict' });
    expect(failure?.status).toBe(409);
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('edits, splits, merges and deletes lines at their own URLs', () => {
    api.updateLine('b-1', 'r-1', 'l-1', { systemId: 's-2', version: 1 }).subscribe();
    const patch = http.expectOne('/api/builds/b-1/receipts/r-1/lines/l-1');
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toEqual({ systemId: 's-2', version: 1 });
    patch.flush({});

    const shares = [
      { amount: '10.00', systemId: 's-1', partId: null },
      { amount: '5.00', systemId: 's-2', partId: null },
    ];
    api.splitLine('b-1', 'r-1', 'l-1', { version: 2, shares }).subscribe();
    const split = http.expectOne('/api/builds/b-1/receipts/r-1/lines/l-1/split');
    expect(split.request.method).toBe('POST');
    expect(split.request.body).toEqual({ version: 2, shares });
    split.flush({});

    api.mergeLines('b-1', 'r-1', ['l-1', 'l-2']).subscribe();
    const merge = http.expectOne('/api/builds/b-1/receipts/r-1/lines/merge');
    expect(merge.request.body).toEqual({ lineIds: ['l-1', 'l-2'] });
    merge.flush({});

    api.removeLine('b-1', 'r-1', 'l-1').subscribe();
    const remove = http.expectOne('/api/builds/b-1/receipts/r-1/lines/l-1');
    expect(remove.request.method).toBe('DELETE');
    remove.flush(null, { status: 204, statusText: 'No Content' });
  });

  it('files with POST /file and the version; a total that does not reconcile (400) comes back as a field', () => {
    let failure: ApiError | undefined;
    api.file('b-1', 'r-1', { version: 4 }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/file');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ version: 4 });
    request.flush(
      { error: { code: 'validation_failed', message: 'Does not add up.', fields: { total: 'The lines add up to 40.00, not 41.50.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(failure?.fields).toEqual({ total: 'The lines add up to 40.00, not 41.50.' });
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('reopens with POST /reopen; a crew member gets 403 told in a snack bar', () => {
    let failure: ApiError | undefined;
    api.reopen('b-1', 'r-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/receipts/r-1/reopen');
    expect(request.request.method).toBe('POST');
    request.flush({ error: { code: 'forbidden', message: 'Only the owner can reopen a filed receipt.' } }, { status: 403, statusText: 'Forbidden' });
    expect(failure?.status).toBe(403);
    expect(snackBar).toHaveBeenCalledWith('Only the owner can reopen a filed receipt.', 'Dismiss', { duration: 8000 });
  });

  it('searches lines to link a return, leaving out the receipt being checked', () => {
    let found: unknown;
    api.searchLines('b-1', 'pump', 'r-1').subscribe((lines) => (found = lines));
    const request = http.expectOne('/api/builds/b-1/receipt-lines?q=pump&excludeReceiptId=r-1');
    expect(request.request.method).toBe('GET');
    request.flush({ lines: [] });
    expect(found).toEqual([]);
  });

  it('lists cores and changes one with PATCH /cores/:id and the version', () => {
    const core = testCore('c-1', { amount: '22.00' });
    let cores: CoreDto[] | undefined;
    api.cores('b-1').subscribe((answer) => (cores = answer));
    http.expectOne('/api/builds/b-1/cores').flush({ cores: [core] });
    expect(cores).toEqual([core]);

    api.updateCore('b-1', 'c-1', { state: 'dropped_off', version: 1 }).subscribe();
    const request = http.expectOne('/api/builds/b-1/cores/c-1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ state: 'dropped_off', version: 1 });
    request.flush({ ...core, state: 'dropped_off', version: 2 });
  });
});
