// Sign-up page: says to check the mail once the link is sent; with an invite for its address, joins that build and goes to it.
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

  it('sends the details, then says to check the mail at the address, and can go back to change it', async () => {
    await render(SignUp, { providers: apiTestProviders(routes) });
    await fillAndSubmit();

    const request = TestBed.inject(HttpTestingController).expectOne('/api/auth/sign-up');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ displayName: 'Oskar Brandt', email: 'oskar@example.test', password: 'ten or more chars' });
    request.flush(
      { status: 'check-mail', message: 'We sent a message to oskar@example.test. Open the link in it to finish creating your account; it works for 24 hours.' },
      { status: 202, statusText: 'Accepted' },
    );

    expect(await screen.findByRole('heading', { name: 'Check your mail' })).toBeTruthy();
    expect(screen.getByRole('status').textContent).toContain('We sent a message to oskar@example.test. Open the link in it to finish creating your account; it works for 24 hours.');
    expect(screen.getByText('If this address already has an account, the message says so instead, with a link to sign in.')).toBeTruthy();
    // Nobody is signed in yet, and the page stays where it is.
    expect(TestBed.inject(Session).user()).toBeNull();
    expect(TestBed.inject(Router).url).toBe('/');

    await userEvent.setup().click(screen.getByRole('button', { name: 'Change the address' }));
    expect((screen.getByLabelText('E-mail') as HTMLInputElement).value).toBe('oskar@example.test');
    expect(screen.queryByRole('heading', { name: 'Check your mail' })).toBeNull();
  });

  it('shows a refusal beside the field it names', async () => {
    await render(SignUp, { providers: apiTestProviders(routes), bindings: [inputBinding('invite', () => 'tok-77')] });
    await fillAndSubmit();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/auth/sign-up')
      .flush(
        { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { email: 'This invite was sent to ines@example.test.' } } },
        { status: 400, statusText: 'Bad Request' },
      );

    expect(await screen.findByText('This invite was sent to ines@example.test.')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Create account' })).toBeTruthy();
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
