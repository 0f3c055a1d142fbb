// AuthApi: each call's method, URL and body, and how failures reach the caller.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiTestProviders } from '../../../testing/api-test-providers';
import { ApiError } from '../http/api-error';
import { AuthApi } from './auth-api';

describe('AuthApi', () => {
  let api: AuthApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    api = TestBed.inject(AuthApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('asks who is signed in with GET /api/auth/me', () => {
    let answer: unknown;
    api.me().subscribe((response) => (answer = response));
    const request = http.expectOne('/api/auth/me');
    expect(request.request.method).toBe('GET');
    expect(request.request.withCredentials).toBe(true);
    request.flush({ user: null });
    expect(answer).toEqual({ user: null });
  });

  it('signs up with POST /api/auth/sign-up and the invite token', () => {
    let answer: unknown;
    api
      .signUp({ email: 'rosa@example.test', displayName: 'Rosa Quill', password: 'long enough pass', inviteToken: 'tok-1' })
      .subscribe((response) => (answer = response));
    const request = http.expectOne('/api/auth/sign-up');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      email: 'rosa@example.test',
      displayName: 'Rosa Quill',
      password: 'long enough pass',
      inviteToken: 'tok-1',
    });
    request.flush({ user: { id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' } }, { status: 201, statusText: 'Created' });
    expect(answer).toEqual({ user: { id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' } });
  });

  it('answers "check your mail" to a sign-up without an invite, and finishes it with POST /api/auth/sign-up/confirm', () => {
    let mailed: unknown;
    api.signUp({ email: 'rosa@example.test', displayName: 'Rosa Quill', password: 'long enough pass' }).subscribe((response) => (mailed = response));
    const message = 'We sent a message to rosa@example.test. Open the link in it to finish creating your account; it works for 24 hours.';
    http.expectOne('/api/auth/sign-up').flush({ status: 'check-mail', message }, { status: 202, statusText: 'Accepted' });
    expect(mailed).toEqual({ status: 'check-mail', message });

    let signedIn: unknown;
    const token = 't'.repeat(43);
    api.confirmSignUp({ token }).subscribe((response) => (signedIn = response));
    const request = http.expectOne('/api/auth/sign-up/confirm');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ token });
    request.flush({ user: { id: 'u2', email: 'rosa@example.test', displayName: 'Rosa Quill' } }, { status: 201, statusText: 'Created' });
    expect(signedIn).toEqual({ user: { id: 'u2', email: 'rosa@example.test', displayName: 'Rosa Quill' } });
  });

  it('signs in with POST /api/auth/sign-in, and a 401 arrives as an ApiError with the server message in a snack bar', () => {
    const snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
    let failure: unknown;
    api.signIn({ email: 'rosa@example.test', password: 'wrong' }).subscribe({ error: (error) => (failure = error) });
    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'rosa@example.test', password: 'wrong' });
    request.flush(
      { error: { code: 'unauthenticated', message: 'That e-mail and password do not match an account.' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    expect(failure).toBeInstanceOf(ApiError);
    expect((failure as ApiError).status).toBe(401);
    expect((failure as ApiError).code).toBe('unauthenticated');
    expect((failure as ApiError).message).toBe('That e-mail and password do not match an account.');
    expect(snackBar).toHaveBeenCalledWith('That e-mail and password do not match an account.', 'Dismiss', { duration: 8000 });
  });

  it('signs out with POST /api/auth/sign-out and no body', () => {
    let done = false;
    api.signOut().subscribe(() => (done = true));
    const request = http.expectOne('/api/auth/sign-out');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBeNull();
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(done).toBe(true);
  });

  it('requests a reset link with POST /api/auth/password-reset; a 429 reaches the caller', () => {
    let failure: ApiError | undefined;
    api.requestPasswordReset({ email: 'rosa@example.test' }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/auth/password-reset');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'rosa@example.test' });
    request.flush(
      { error: { code: 'rate_limited', message: 'Too many reset requests. Try again in 15 minutes.' } },
      { status: 429, statusText: 'Too Many Requests' },
    );
    expect(failure?.status).toBe(429);
    expect(failure?.code).toBe('rate_limited');
  });

  it('sets a new password with POST /api/auth/password-reset/confirm; field errors stay on the error', () => {
    const snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
    let failure: ApiError | undefined;
    const token = 'a'.repeat(32);
    api.confirmPasswordReset({ token, password: 'a new long password' }).subscribe({ error: (error: ApiError) => (failure = error) });
    const request = http.expectOne('/api/auth/password-reset/confirm');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ token, password: 'a new long password' });
    request.flush(
      { error: { code: 'validation_failed', message: 'Check the password.', fields: { password: 'Use at least 10 characters for the password.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(failure?.fields).toEqual({ password: 'Use at least 10 characters for the password.' });
    // Field errors belong beside their fields, not in a snack bar.
    expect(snackBar).not.toHaveBeenCalled();
  });
});
