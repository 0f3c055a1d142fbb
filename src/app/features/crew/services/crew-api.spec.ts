// CrewApi: each call's method, URL and body, and its failure statuses.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { ApiError } from '../../../core/http/api-error';
import { CrewApi } from './crew-api';

describe('CrewApi', () => {
  let api: CrewApi;
  let http: HttpTestingController;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(CrewApi);
    http = TestBed.inject(HttpTestingController);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => http.verify());

  it('lists members with GET /api/builds/:id/members', () => {
    let answer: unknown;
    api.members('b-1').subscribe((response) => (answer = response));
    const request = http.expectOne('/api/builds/b-1/members');
    expect(request.request.method).toBe('GET');
    request.flush({ members: [], invites: [] });
    expect(answer).toEqual({ members: [], invites: [] });
  });

  it('invites with POST /api/builds/:id/invites; field errors reach the form without a snack bar', () => {
    let failure: ApiError | undefined;
    api.invite('b-1', { email: 'ines@example.test', role: 'reviewer' }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/invites');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'ines@example.test', role: 'reviewer' });
    request.flush(
      { error: { code: 'validation_failed', message: 'Check the invite.', fields: { email: 'That person is already on this build.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(failure?.fields).toEqual({ email: 'That person is already on this build.' });
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('withdraws with DELETE /api/builds/:id/invites/:inviteId', () => {
    let done = false;
    api.withdrawInvite('b-1', 'i-9').subscribe(() => (done = true));
    const request = http.expectOne('/api/builds/b-1/invites/i-9');
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(done).toBe(true);
  });

  it('changes a role with PATCH /api/builds/:id/members/:userId', () => {
    api.changeRole('b-1', 'u-2', { role: 'reviewer' }).subscribe();
    const request = http.expectOne('/api/builds/b-1/members/u-2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ role: 'reviewer' });
    request.flush({ userId: 'u-2', email: 'ines@example.test', displayName: 'Ines Varga', role: 'reviewer', joinedAt: '2026-02-02T00:00:00Z' });
  });

  it('removes with DELETE /api/builds/:id/members/:userId; the last owner leaving is a 409 told in a snack bar', () => {
    let failure: ApiError | undefined;
    api.removeMember('b-1', 'u-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/builds/b-1/members/u-1');
    expect(request.request.method).toBe('DELETE');
    request.flush(
      { error: { code: 'conflict', message: 'A build needs an owner. Make someone else owner before you leave.' } },
      { status: 409, statusText: 'Conflict' },
    );
    expect(failure?.status).toBe(409);
    expect(snackBar).toHaveBeenCalledWith('A build needs an owner. Make someone else owner before you leave.', 'Dismiss', { duration: 8000 });
  });

  it('previews an invite with GET /api/invites/:token; a 404 is left to the page', () => {
    let failure: ApiError | undefined;
    api.previewInvite('tok-1').subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/invites/tok-1');
    expect(request.request.method).toBe('GET');
    request.flush({ error: { code: 'not_found', message: 'No such invite.' } }, { status: 404, statusText: 'Not Found' });
    expect(failure?.status).toBe(404);
    expect(snackBar).not.toHaveBeenCalled();
  });

  it('accepts an invite with POST /api/invites/:token/accept and answers the build id', () => {
    let answer: unknown;
    api.acceptInvite('tok-1').subscribe((response) => (answer = response));
    const request = http.expectOne('/api/invites/tok-1/accept');
    expect(request.request.method).toBe('POST');
    request.flush({ buildId: 'b-1' });
    expect(answer).toEqual({ buildId: 'b-1' });
  });
});
