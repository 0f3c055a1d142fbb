// The inbox section: the address with copy and a confirmed rotation for owner and crew; the owner's list of mail not added.
import { Clipboard } from '@angular/cdk/clipboard';
import { inputBinding } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, waitFor, within } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import type { MailRefusalDto } from '../../../../../../shared/api/inbox';
import type { BuildRole } from '../../../../../../shared/enums';
import { apiTestProviders } from '../../../../../testing/api-test-providers';
import { BuildInbox } from './build-inbox';

const ADDRESS = '5f0c2a9e81b34d7aa0e6c1d2b3f4a5e6@receipts.localhost';
const NEW_ADDRESS = '0a1b2c3d4e5f60718293a4b5c6d7e8f9@receipts.localhost';
const REFUSED: MailRefusalDto = {
  id: 'r-1',
  receivedAt: '2026-11-28T09:30:00.000Z',
  from: 'offers@sprocket-and-gasket.example',
  subject: 'Gasket week',
  reason: 'not_a_member',
  detail: 'offers@sprocket-and-gasket.example is not the owner or crew of this build.',
};

async function renderAs(role: BuildRole, refused: MailRefusalDto[] = []) {
  await render(BuildInbox, { providers: apiTestProviders(), bindings: [inputBinding('buildId', () => 'b-3'), inputBinding('memberRole', () => role)] });
  const http = TestBed.inject(HttpTestingController);
  const inbox = http.expectOne('/api/builds/b-3/inbox');
  expect(inbox.request.method).toBe('GET');
  inbox.flush({ address: ADDRESS });
  if (role === 'owner') http.expectOne('/api/builds/b-3/inbox/refused').flush({ refused });
  else http.expectNone('/api/builds/b-3/inbox/refused');
  await screen.findByText(ADDRESS);
  return http;
}

describe('BuildInbox', () => {
  it('shows the owner the address and each mail not added with its reason', async () => {
    await renderAs('owner', [REFUSED]);
    expect(screen.getByRole('heading', { name: 'Mail not added' })).toBeTruthy();
    expect(screen.getByText('Gasket week')).toBeTruthy();
    expect(screen.getByText('From offers@sprocket-and-gasket.example')).toBeTruthy();
    expect(screen.getByText(/The sender is not on this build: offers@sprocket-and-gasket\.example is not the owner or crew/)).toBeTruthy();
  });

  it('tells the owner when nothing was turned away, and shows crew no such list', async () => {
    await renderAs('owner');
    expect(screen.getByText('Nothing so far. Mail the inbox did not add shows here, with why.')).toBeTruthy();
    TestBed.resetTestingModule();
    document.body.innerHTML = '';
    await renderAs('crew');
    expect(screen.queryByRole('heading', { name: 'Mail not added' })).toBeNull();
  });

  it('copies the address and says so', async () => {
    await renderAs('crew');
    const copy = jest.spyOn(TestBed.inject(Clipboard), 'copy').mockReturnValue(true);
    await userEvent.setup().click(screen.getByRole('button', { name: /Copy address/ }));
    expect(copy).toHaveBeenCalledWith(ADDRESS);
    expect(await screen.findByText('Address copied.')).toBeTruthy();
  });

  it('gets a new address only after the person confirms', async () => {
    const http = await renderAs('crew');
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: /Get a new address/ }));
    const dialog = await screen.findByRole('dialog');
    expect(dialog.textContent).toContain('Mail to the current address will no longer be added to this build.');
    http.expectNone('/api/builds/b-3/inbox/rotate');
    await user.click(within(dialog).getByRole('button', { name: 'Get a new address' }));
    // Sent once the dialog has closed.
    const rotate = await waitFor(() => http.expectOne('/api/builds/b-3/inbox/rotate'));
    expect(rotate.request.method).toBe('POST');
    rotate.flush({ address: NEW_ADDRESS });
    expect(await screen.findByText(NEW_ADDRESS)).toBeTruthy();
    expect(screen.queryByText(ADDRESS)).toBeNull();
    http.verify();
  });
});
