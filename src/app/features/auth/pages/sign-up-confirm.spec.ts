// Sign-up link page: sends the token at once, signs in and opens the builds; a refused link says why and what next.
import { Component, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { render, screen } from '@testing-library/angular/zoneless';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { Session } from '../../../core/auth/session';
import { SignUpConfirm } from './sign-up-confirm';

@Component({ template: '' })
class Blank {}

const token = 'k'.repeat(43);

async function renderLink(withToken: string) {
  await render(SignUpConfirm, {
    providers: apiTestProviders([{ path: 'builds', component: Blank }]),
    bindings: [inputBinding('token', () => withToken)],
  });
  return TestBed.inject(HttpTestingController);
}

describe('SignUpConfirm', () => {
  it('sends the link token, signs the new account in and opens the builds', async () => {
    const http = await renderLink(token);
    const request = http.expectOne('/api/auth/sign-up/confirm');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ token });
    request.flush({ user: { id: 'u4', email: 'oskar@example.test', displayName: 'Oskar Brandt' } }, { status: 201, statusText: 'Created' });
    await new Promise((resolve) => setTimeout(resolve));

    expect(TestBed.inject(Session).user()).toEqual({ id: 'u4', email: 'oskar@example.test', displayName: 'Oskar Brandt' });
    expect(TestBed.inject(Router).url).toBe('/builds');
  });

  it('says why a used or expired link is refused, and offers sign-in and signing up again', async () => {
    const http = await renderLink(token);
    http.expectOne('/api/auth/sign-up/confirm').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'This sign-up link has expired or was already used.',
          fields: { token: 'This sign-up link has expired or was already used. Sign up again for a new one.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );

    expect((await screen.findByRole('alert')).textContent).toContain('This sign-up link has expired or was already used. Sign up again for a new one.');
    expect(screen.getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe('/sign-in');
    expect(screen.getByRole('link', { name: 'Sign up again' }).getAttribute('href')).toBe('/sign-up');
    expect(TestBed.inject(Session).user()).toBeNull();
  });

  it('sends nothing for a cut-off link and says to copy the whole of it', async () => {
    const http = await renderLink('abc');
    expect((await screen.findByRole('alert')).textContent).toContain('This link is incomplete. Copy the whole link from the e-mail, or sign up again for a new one.');
    http.verify();
  });
});
