// Settings: the build's details in words (currency and locale named), the owner's way to edit them, and the crew and
// mail alert pages one link away for everyone.
import { screen } from '@testing-library/angular/zoneless';
import { renderInBuild } from '../../../../../testing/render-in-build';
import { SettingsPage } from './settings-page';

const details = () =>
  Array.from(document.querySelectorAll('.details > div')).map((row) => [row.querySelector('dt')!.textContent!.trim(), row.querySelector('dd')!.textContent!.trim()]);

describe('SettingsPage', () => {
  it("shows the owner the build's details in words, with the way to edit them, crew and mail alerts", async () => {
    await renderInBuild(SettingsPage, { role: 'owner', build: { currency: 'EUR', locale: 'de-AT', status: 'active', returnWindowDays: 14 } });
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
    await renderInBuild(SettingsPage, { role: 'reviewer' });
    expect(screen.queryByRole('link', { name: "Edit the build's details" })).toBeNull();
    expect(screen.getByRole('link', { name: /^Crew/ }).textContent).toContain('Who works on the build, and their roles.');
  });
});
