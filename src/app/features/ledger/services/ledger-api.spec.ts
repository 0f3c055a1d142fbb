// LedgerApi: each call's method, URL and query, and a refused query reaching the caller with its field.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ApiError, toApiError } from '../../../core/http/api-error';
import { LedgerApi } from './ledger-api';

describe('LedgerApi', () => {
  let api: LedgerApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(LedgerApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('reads the ledger, the spend by week and the shops with GET', () => {
    api.ledger('b 1').subscribe();
    api.spend('b-1', 'week').subscribe();
    api.vendors('b-1').subscribe();
    for (const url of ['/api/builds/b%201/ledger', '/api/builds/b-1/ledger/spend?by=week', '/api/builds/b-1/ledger/vendors']) {
      const request = http.expectOne(url);
      expect(request.request.method).toBe('GET');
      request.flush({});
    }
  });

  it('asks for the lines behind a figure with only the narrowing it was given', () => {
    api.lines('b-1', { figure: 'spent', vendorId: 'none', period: '2026-W27' }).subscribe();
    const request = http.expectOne('/api/builds/b-1/ledger/lines?figure=spent&vendorId=none&period=2026-W27');
    expect(request.request.method).toBe('GET');
    request.flush({ currency: 'USD', figure: 'spent', lines: [], total: '0.00' });
  });

  it('passes a refused query on with the field the server named', () => {
    let failure: ApiError | undefined;
    api.lines('b-1', { figure: 'netCost', period: '2026-13' }).subscribe({ error: (error: unknown) => (failure = toApiError(error)) });
    http
      .expectOne('/api/builds/b-1/ledger/lines?figure=netCost&period=2026-13')
      .flush(
        { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { period: 'Use a month like 2026-07 or a week like 2026-W27.' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(failure?.status).toBe(400);
    expect(failure?.fields).toEqual({ period: 'Use a month like 2026-07 or a week like 2026-W27.' });
  });
});
