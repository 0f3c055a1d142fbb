// Sign-up page: creates the account, and with an invite joins that build and goes to it.
import { Component, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testBuild } from '../../../../testing/build-fixtures';
import { Session } from '../../../core/auth/session';
import { SignUp } from './sign-up';

@Component({ template: '' })
class Blank {}

const routes = [
  { path: 'builds', component: Blank },
  { path: 'builds/:buildId', component: Blank },
];
const settle = () => new Promise((resolve) => setTimeout(resolve));

async function fillAndSubmit() {
  const user = userEvent.setup();
  await user.type(screen.getByLabelText('Your name'), 'Oskar Brandt');
  await user.type(screen.getByLabelText('E-mail'), 'oskar@example.test');
  await user.type(screen.getByLabelText('Password'), 'ten or more chars');
  await user.click(screen.getByRole('button', { name: 'Create account' }));
}

describe('SignUp', () => {
  it('asks for a longer password before sending anything', async () => {
    await render(SignUp, { providers: apiTestProviders(routes) });
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Your name'), 'Oskar Brandt');
    await user.type(screen.getByLabelText('E-mail'), 'oskar@example.test');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText('Use at least 10 characters for the password.')).toBeTruthy();
    TestBed.inject(HttpTestingController).verify();
  });

  it('creates the account and goes to the builds', async () => {
    await render(SignUp, { providers: apiTestProviders(routes) });
    await fillAndSubmit();

    const request = TestBed.inject(HttpTestingController).expectOne('/api/auth/sign-up');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ displayName: 'Oskar Brandt', email: 'oskar@example.test', password: 'ten or more chars' });
    request.flush({ user: { id: 'u9', email: 'oskar@example.test', displayName: 'Oskar Brandt' } }, { status: 201, statusText: 'Created' });
    await settle();

    expect(TestBed.inject(Session).user()?.id).toBe('u9');
    expect(TestBed.inject(Router).url).toBe('/builds');
  });

  it('passes the invite token and then opens the build just joined', async () => {
    await render(SignUp, { providers: apiTestProviders(routes), bindings: [inputBinding('invite', () => 'tok-77')] });
    await fillAndSubmit();
    const http = TestBed.inject(HttpTestingController);

    const request = http.expectOne('/api/auth/sign-up');
    expect(request.request.body.inviteToken).toBe('tok-77');
    request.flush({ user: { id: 'u9', email: 'oskar@example.test', displayName: 'Oskar Brandt' } }, { status: 201, statusText: 'Created' });
    // The answer names no build, so the new account's only build is the one joined.
    http.expectOne('/api/builds').flush({
      builds: [testBuild('crew', { id: 'b-5', name: 'Teal coupe swap', vehicle: '', version: 1, createdAt: '2026-01-01T00:00:00Z' })],
    });
    await settle();

    expect(TestBed.inject(Router).url).toBe('/builds/b-5');
  });
});
