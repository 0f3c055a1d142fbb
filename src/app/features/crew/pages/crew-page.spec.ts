// Crew page: the owner manages members and invites; anyone else sees the list read-only and can leave.
import { Component, inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { MembersResponse } from '../../../../../shared/api/builds';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { Session } from '../../../core/auth/session';
import { CrewPage } from './crew-page';

@Component({ template: '' })
class Blank {}

const crew: MembersResponse = {
  members: [
    { userId: 'u-owner', email: 'rosa@example.test', displayName: 'Rosa Quill', role: 'owner', joinedAt: '2026-01-05T09:00:00Z' },
    { userId: 'u-crew', email: 'dario@example.test', displayName: 'Dario Fenn', role: 'crew', joinedAt: '2026-01-09T09:00:00Z' },
    { userId: 'u-review', email: 'ines@example.test', displayName: 'Ines Varga', role: 'reviewer', joinedAt: '2026-01-12T09:00:00Z' },
  ],
  invites: [{ id: 'i-1', email: 'mo@example.test', role: 'crew', expiresAt: '2026-02-01T00:00:00Z', createdAt: '2026-01-25T00:00:00Z' }],
};

async function renderAs(userId: string, members: MembersResponse) {
  await render(CrewPage, {
    providers: apiTestProviders([{ path: 'builds', component: Blank }]),
    bindings: [inputBinding('buildId', () => 'b-1')],
  });
  const member = members.members.find((candidate) => candidate.userId === userId)!;
  TestBed.inject(Session).setUser({ id: userId, email: member.email, displayName: member.displayName });
  const http = TestBed.inject(HttpTestingController);
  const request = http.expectOne('/api/builds/b-1/members');
  expect(request.request.method).toBe('GET');
  request.flush(members);
  await screen.findByRole('cell', { name: 'dario@example.test' });
  return http;
}

describe('CrewPage', () => {
  it('shows the owner the invite form, the pending invites and a role select and Remove for each other member', async () => {
    await renderAs('u-owner', crew);

    expect(screen.getByRole('heading', { name: 'Invite someone' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Send invite' })).toBeTruthy();
    expect(screen.getByRole('combobox', { name: 'Role for Dario Fenn' })).toBeTruthy();
    expect(screen.getByRole('combobox', { name: 'Role for Ines Varga' })).toBeTruthy();
    expect(screen.queryByRole('combobox', { name: 'Role for Rosa Quill' })).toBeNull();
    expect(screen.getAllByRole('button', { name: /^Remove / }).map((button) => button.getAttribute('aria-label'))).toEqual([
      'Remove Dario Fenn',
      'Remove Ines Varga',
    ]);
    expect(screen.getByRole('button', { name: 'Withdraw invite for mo@example.test' })).toBeTruthy();
    expect(screen.getByText(/Helps in the shop/)).toBeTruthy();
    expect(screen.getByText(/changes no money/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Leave build' })).toBeNull();
  });

  it('sends an invite with the chosen role and lists it as pending', async () => {
    const http = await renderAs('u-owner', crew);
    const user = userEvent.setup();

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'oskar@example.test');
    await user.click(screen.getByRole('combobox', { name: 'Role' }));
    await user.click(await screen.findByRole('option', { name: 'Reviewer' }));
    await user.click(screen.getByRole('button', { name: 'Send invite' }));

    const request = http.expectOne('/api/builds/b-1/invites');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'oskar@example.test', role: 'reviewer' });
    request.flush(
      { id: 'i-2', email: 'oskar@example.test', role: 'reviewer', expiresAt: '2026-02-08T00:00:00Z', createdAt: '2026-02-01T00:00:00Z' },
      { status: 201, statusText: 'Created' },
    );

    expect(await screen.findByRole('button', { name: 'Withdraw invite for oskar@example.test' })).toBeTruthy();
    expect((screen.getByRole('textbox', { name: 'E-mail' }) as HTMLInputElement).value).toBe('');
  });

  it('checks the invite e-mail before sending', async () => {
    const http = await renderAs('u-owner', crew);
    const user = userEvent.setup();
    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'not-an-address');
    await user.click(screen.getByRole('button', { name: 'Send invite' }));

    expect(await screen.findByText('Enter an e-mail address like name@example.com.')).toBeTruthy();
    http.verify();
  });

  it('shows a reviewer the members read-only, with no invite form, and a Leave build button', async () => {
    await renderAs('u-review', crew);

    const table = screen.getByRole('table');
    expect(within(table).getByText('Rosa Quill')).toBeTruthy();
    expect(within(table).getByText('Owner')).toBeTruthy();
    expect(within(table).getByText('Crew')).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Invite someone' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Send invite' })).toBeNull();
    expect(screen.queryByRole('combobox')).toBeNull();
    expect(screen.queryByRole('button', { name: /^Remove/ })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Withdraw/ })).toBeNull();
    expect(screen.getByRole('button', { name: 'Leave build' })).toBeTruthy();
  });
});
