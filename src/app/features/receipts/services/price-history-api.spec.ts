// PriceHistoryApi: the method and URL of each call, and a refusal reaching the caller.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ApiError, toApiError } from '../../../core/http/api-error';
import { PriceHistoryApi } from './price-history-api';

describe('PriceHistoryApi', () => {
  let api: PriceHistoryApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(PriceHistoryApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('reads the history with GET, asking for items filed once only when told', () => {
    api.priceHistory('b 1').subscribe();
    api.priceHistory('b-1', 1).subscribe();
    for (const url of ['/api/builds/b%201/price-history', '/api/builds/b-1/price-history?minReceipts=1']) {
      const request = http.expectOne(url);
      expect(request.request.method).toBe('GET');
      request.flush({ currency: 'USD', items: [] });
    }
  });

  it('passes a 404 on to the caller', () => {
    let failure: ApiError | undefined;
    api.priceHistory('gone').subscribe({ error: (error: unknown) => (failure = toApiError(error)) });
    http.expectOne('/api/builds/gone/price-history').flush({ error: { code: 'not_found', message: 'That build was not found.' } }, { status: 404, statusText: 'Not Found' });
    expect(failure?.status).toBe(404);
  });
});
