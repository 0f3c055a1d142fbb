// Sign-in page: checks the fields, calls the API, shows the server's field errors, and goes on.
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { inputBinding } from '@angular/core';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { describedText } from '../../../../testing/described-text';
import { Session } from '../../../core/auth/session';
import { SignIn } from './sign-in';

@Component({ template: '' })
class Blank {}

const routes = [
  { path: 'builds', component: Blank },
  { path: 'builds/:buildId', component: Blank },
];

describe('SignIn', () => {
  it('says which field is missing and sends nothing', async () => {
    await render(SignIn, { providers: apiTestProviders(routes) });
    const user = userEvent.setup();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter an e-mail address.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('E-mail'))).toBe('Enter an e-mail address.');
    expect(describedText(screen.getByLabelText('Password'))).toBe('Enter your password.');
    TestBed.inject(HttpTestingController).verify();
  });

  it('posts the e-mail and password and shows the server’s field errors under the fields', async () => {
    await render(SignIn, { providers: apiTestProviders(routes) });
    const user = userEvent.setup();
    const http = TestBed.inject(HttpTestingController);

    await user.type(screen.getByLabelText('E-mail'), 'rosa@example.test');
    await user.type(screen.getByLabelText('Password'), 'not her password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'rosa@example.test', password: 'not her password' });
    request.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the highlighted fields.',
          fields: { email: 'No account uses this e-mail address.', password: 'That password is not right for this account.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );

    expect(await screen.findByText('No account uses this e-mail address.')).toBeTruthy();
    expect(describedText(screen.getByLabelText('E-mail'))).toBe('No account uses this e-mail address.');
    expect(describedText(screen.getByLabelText('Password'))).toBe('That password is not right for this account.');
    expect(TestBed.inject(Session).user()).toBeNull();
  });

  it('signs in, remembers the person and goes back to where they were going', async () => {
    await render(SignIn, {
      providers: apiTestProviders(routes),
      bindings: [inputBinding('returnTo', () => '/builds/b-7')],
    });
    const user = userEvent.setup();
    const http = TestBed.inject(HttpTestingController);

    await user.type(screen.getByLabelText('E-mail'), 'rosa@example.test');
    await user.type(screen.getByLabelText('Password'), 'her long password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    http.expectOne('/api/auth/sign-in').flush({ user: { id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' } });
    await new Promise((resolve) => setTimeout(resolve));

    expect(TestBed.inject(Session).user()).toEqual({ id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' });
    expect(TestBed.inject(Router).url).toBe('/builds/b-7');
  });

  it('never follows a returnTo that leaves the site', async () => {
    await render(SignIn, {
      providers: apiTestProviders(routes),
      bindings: [inputBinding('returnTo', () => '//evil.example/steal')],
    });
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('E-mail'), 'rosa@example.test');
    await user.type(screen.getByLabelText('Password'), 'her long password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    TestBed.inject(HttpTestingController)
      .expectOne('/api/auth/sign-in')
      .flush({ user: { id: 'u1', email: 'rosa@example.test', displayName: 'Rosa Quill' } });
    await new Promise((resolve) => setTimeout(resolve));

    expect(TestBed.inject(Router).url).toBe('/builds');
  });

  it('links to creating an account and to resetting the password', async () => {
    await render(SignIn, { providers: apiTestProviders(routes) });
    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe('/sign-up');
    expect(screen.getByRole('link', { name: 'Forgot your password?' }).getAttribute('href')).toBe('/reset-password');
  });
});
