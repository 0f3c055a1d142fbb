// Settings: the build's details in words (currency and locale named), the owner's way to edit them, and the crew and
// mail alert pages one link away for everyone; the inbox address for owner and crew.
import { screen } from '@testing-library/angular/zoneless';
import { renderInBuild } from '../../../../../testing/render-in-build';
import { SettingsPage } from './settings-page';

const details = () =>
  Array.from(document.querySelectorAll('.details > div')).map((row) => [row.querySelector('dt')!.textContent!.trim(), row.querySelector('dd')!.textContent!.trim()]);

describe('SettingsPage', () => {
  it("shows the owner the build's details in words, with the way to edit them, crew and mail alerts", async () => {
    const { http } = await renderInBuild(SettingsPage, { role: 'owner', build: { currency: 'EUR', locale: 'de-AT', status: 'active', returnWindowDays: 14 } });
    http.expectOne('/api/builds/b-1/inbox').flush({ address: 'c0ffee00c0ffee00c0ffee00c0ffee00@receipts.localhost' });
    http.expectOne('/api/builds/b-1/inbox/refused').flush({ refused: [] });
    expect(await screen.findByRole('region', { name: 'Receipts by mail' })).toBeTruthy();
    expect(await screen.findByText('c0ffee00c0ffee00c0ffee00c0ffee00@receipts.localhost')).toBeTruthy();
    expect(details()).toEqual([
      ['Name', 'Teal wagon swap'],
      ['Vehicle', '1979 invented wagon'],
      ['Currency', 'EUR · Euro'],
      ['Language and region', 'de-AT · Österreichisches Deutsch'],
      ['Status', 'Underway'],
      ['Return window', '14 days after purchase'],
    ]);
    expect(screen.getByRole('link', { name: "Edit the build's details" })).toBeTruthy();
    expect(screen.getByRole('link', { name: /^Crew/ }).textContent).toContain('invite someone');
    expect(screen.getByRole('link', { name: /^Mail alerts/ })).toBeTruthy();
  });

  it('gives a reviewer the details and the links, without editing', async () => {
    const { http } = await renderInBuild(SettingsPage, { role: 'reviewer' });
    // A reviewer adds no receipts: no inbox address for them.
    http.expectNone('/api/builds/b-1/inbox');
    expect(screen.queryByRole('region', { name: 'Receipts by mail' })).toBeNull();
    expect(screen.queryByRole('link', { name: "Edit the build's details" })).toBeNull();
    expect(screen.getByRole('link', { name: /^Crew/ }).textContent).toContain('Who works on the build, and their roles.');
  });
});
