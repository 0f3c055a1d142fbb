// InboxApi: each call's method and URL, and a refusal's status reaching the caller.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ApiError } from '../../../core/http/api-error';
import { InboxApi } from './inbox-api';

describe('InboxApi', () => {
  let api: InboxApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(InboxApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('reads the address with GET /api/builds/:id/inbox', () => {
    let answer: unknown;
    api.inbox('b 1').subscribe((response) => (answer = response));
    const request = http.expectOne('/api/builds/b%201/inbox');
    expect(request.request.method).toBe('GET');
    request.flush({ address: 'abc@receipts.localhost' });
    expect(answer).toEqual({ address: 'abc@receipts.localhost' });
  });

  it('rotates with POST /api/builds/:id/inbox/rotate and an empty body', () => {
    api.rotate('b-1').subscribe();
    const request = http.expectOne('/api/builds/b-1/inbox/rotate');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({});
    request.flush({ address: 'def@receipts.localhost' });
  });

  it('lists the refused mail with GET /api/builds/:id/inbox/refused; a crew member is refused with 403', () => {
    let failure: ApiError | undefined;
    api.refused('b-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/inbox/refused');
    expect(request.request.method).toBe('GET');
    request.flush({ error: { code: 'forbidden', message: 'Your role on this build does not allow that.' } }, { status: 403, statusText: 'Forbidden' });
    expect(failure?.status).toBe(403);
  });
});
