// The HTTP chain: credentials, the CSRF header, readable errors, and sign-in again when a session ends.
import { HttpClient } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { apiTestProviders } from '../../../testing/api-test-providers';
import { Session } from '../auth/session';
import { ApiError } from './api-error';

@Component({ template: '' })
class Blank {}

describe('apiErrorInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;
  let snackBar: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: apiTestProviders([
        { path: 'sign-in', component: Blank },
        { path: 'builds', component: Blank },
      ]),
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
    snackBar = jest.spyOn(TestBed.inject(MatSnackBar), 'open');
  });

  afterEach(() => {
    http.verify();
    document.cookie = 'XSRF-TOKEN=; expires=Thu, 01 Jan 1970 00:00:00 GMT; path=/';
  });

  it('sends the XSRF-TOKEN cookie back as X-XSRF-TOKEN on a POST, not on a GET', () => {
    document.cookie = 'XSRF-TOKEN=csrf-abc123; path=/';
    client.post('/api/builds', {}).subscribe();
    client.get('/api/builds').subscribe();
    const [post, get] = http.match((request) => request.url === '/api/builds');
    expect(post.request.headers.get('X-XSRF-TOKEN')).toBe('csrf-abc123');
    expect(post.request.withCredentials).toBe(true);
    expect(get.request.headers.has('X-XSRF-TOKEN')).toBe(false);
    post.flush({});
    get.flush({});
  });

  it('explains a network failure in words and says what to do', () => {
    let failure: ApiError | undefined;
    client.get('/api/builds').subscribe({ error: (error: ApiError) => (failure = error) });
    http.expectOne('/api/builds').error(new ProgressEvent('error'), { status: 0, statusText: '' });
    expect(failure?.code).toBe('network');
    expect(failure?.message).toBe('Tallyhood could not be reached. Check your connection and try again.');
    expect(snackBar).toHaveBeenCalledWith('Tallyhood could not be reached. Check your connection and try again.', 'Dismiss', {
      duration: 8000,
    });
  });

  it('falls back to a plain message when a 500 has no error body', () => {
    let failure: ApiError | undefined;
    client.get('/api/builds').subscribe({ error: (error: ApiError) => (failure = error) });
    http.expectOne('/api/builds').flush('<html>oops</html>', { status: 502, statusText: 'Bad Gateway' });
    expect(failure?.status).toBe(502);
    expect(failure?.message).toBe(
      'Something went wrong on our side. Try again in a moment; if it keeps happening, let us know.',
    );
  });

  it('on a 401 outside /api/auth clears the session and sends the person to sign in and back', async () => {
    const router = TestBed.inject(Router);
    const session = TestBed.inject(Session);
    session.setUser({ id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' });
    await router.navigateByUrl('/builds');

    client.get('/api/builds').subscribe({ error: () => undefined });
    http
      .expectOne('/api/builds')
      .flush({ error: { code: 'unauthenticated', message: 'Sign in first.' } }, { status: 401, statusText: 'Unauthorized' });
    await TestBed.inject(Router).navigated;
    await new Promise((resolve) => setTimeout(resolve));

    expect(session.user()).toBeNull();
    expect(router.url).toBe('/sign-in?returnTo=%2Fbuilds');
    expect(snackBar).toHaveBeenCalledWith('Your session has ended. Sign in to carry on.', 'Dismiss', { duration: 8000 });
  });
});
