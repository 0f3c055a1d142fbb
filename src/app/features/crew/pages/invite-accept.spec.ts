// Invite page: what the invite offers, and the right next step for signed-in and signed-out people.
import { Component, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { InviteAccept } from './invite-accept';

@Component({ template: '' })
class Blank {}

const preview = { buildName: 'Teal coupe swap', role: 'reviewer', email: 'ines@example.test', invitedBy: 'Rosa Quill', expiresAt: '2026-12-20T00:00:00Z' };

async function renderInvite(signedInAs: object | null) {
  await render(InviteAccept, {
    providers: apiTestProviders([{ path: 'builds/:buildId', component: Blank }]),
    bindings: [inputBinding('token', () => 'tok-3')],
  });
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/auth/me').flush({ user: signedInAs });
  return http;
}

describe('InviteAccept', () => {
  it('offers a signed-out person to create an account or sign in, both carrying the invite', async () => {
    const http = await renderInvite(null);
    http.expectOne('/api/invites/tok-3').flush(preview);

    expect(await screen.findByRole('heading', { name: "You're invited to Teal coupe swap as Reviewer" })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe('/sign-up?invite=tok-3');
    expect(screen.getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe('/sign-in?returnTo=%2Finvites%2Ftok-3');
    expect(screen.queryByRole('button', { name: 'Join build' })).toBeNull();
    // The link is a one-use bearer link: the page says so.
    expect(screen.getByText('The link works once: whoever joins with it first takes the place, so do not pass it on.')).toBeTruthy();
  });

  it('lets a signed-in person join and opens the build', async () => {
    const http = await renderInvite({ id: 'u3', email: 'ines@example.test', displayName: 'Ines Varga' });
    http.expectOne('/api/invites/tok-3').flush(preview);
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Join build' }));
    const accept = http.expectOne('/api/invites/tok-3/accept');
    expect(accept.request.method).toBe('POST');
    accept.flush({ buildId: 'b-1' });
    await new Promise((resolve) => setTimeout(resolve));

    expect(TestBed.inject(Router).url).toBe('/builds/b-1');
  });

  it('explains a used or expired link', async () => {
    const http = await renderInvite(null);
    http.expectOne('/api/invites/tok-3').flush({ error: { code: 'not_found', message: 'No such invite.' } }, { status: 404, statusText: 'Not Found' });

    expect(await screen.findByText(/The link has expired, was withdrawn, or has already been used/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Join build' })).toBeNull();
  });
});
