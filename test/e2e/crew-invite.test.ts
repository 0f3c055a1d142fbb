// In Debian's chromium: the owner signs in, creates a build and invites a reviewer by e-mail; the invite is read
// from the fake SMTP server and accepted in a second browser; the reviewer sees the build without edit controls.
import { signedUpClient, TEST_PASSWORD, uniqueEmail } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';

jest.setTimeout(120_000);

const e2e = useBrowserApp();

it('takes a reviewer from invite mail to a read-only view of the build', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-owner');
  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);
  await screenshot(page, 'builds-empty');
  expect(await accessibilityViolations(page)).toEqual([]);

  await page.getByRole('link', { name: 'New build' }).or(page.getByRole('button', { name: 'New build' })).first().click();
  await page.getByLabel('Build name').fill('Roadster restomod');
  await page.getByLabel('Vehicle').fill('1972 invented roadster, 1.8 L twin-cam swap');
  await page.getByRole('button', { name: 'Create build' }).click();
  await page.getByRole('heading', { name: 'Roadster restomod' }).waitFor();
  await screenshot(page, 'build-overview-owner');
  expect(await accessibilityViolations(page)).toEqual([]);
  await expect(page.getByRole('button', { name: 'Edit build' }).or(page.getByRole('link', { name: 'Edit build' })).count()).resolves.toBe(1);

  // Crew is under Settings, with the build's details and the mail alerts.
  await page.getByRole('link', { name: 'Settings' }).first().click();
  await page.getByRole('heading', { name: 'Settings', level: 1 }).waitFor();
  await screenshot(page, 'settings-owner');
  expect(await accessibilityViolations(page)).toEqual([]);
  await page.getByRole('link', { name: /^Crew/ }).click();
  const reviewerEmail = uniqueEmail('e2e-reviewer');
  await page.getByLabel('E-mail', { exact: true }).fill(reviewerEmail);
  await page.getByRole('combobox', { name: 'Role', exact: true }).click();
  await page.getByRole('option', { name: /Reviewer/ }).click();
  await page.getByRole('button', { name: 'Send invite' }).click();
  await page.getByText(reviewerEmail).first().waitFor();
  await screenshot(page, 'crew-owner');
  expect(await accessibilityViolations(page)).toEqual([]);

  const mail = await e2e.t.mail.waitFor((m) => m.to.includes(reviewerEmail));
  expect(mail.subject).toBe('Join "Roadster restomod" on Tallyhood');
  const link = /(http:\/\/127\.0\.0\.1:\d+\/invites\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];

  // A second, separate browser context: the reviewer has no account yet.
  const reviewer = await newPage(e2e.browser, { phone: true });
  await reviewer.goto(link);
  await reviewer.getByText(/Roadster restomod/).first().waitFor();
  await screenshot(reviewer, 'invite-phone');
  await reviewer.getByRole('link', { name: 'Create an account' }).or(reviewer.getByRole('button', { name: 'Create an account' })).first().click();
  await reviewer.getByLabel('Your name').fill('Pat Reviewer');
  await reviewer.getByLabel('E-mail').fill(reviewerEmail);
  await reviewer.getByLabel('Password').fill(TEST_PASSWORD);
  await reviewer.getByRole('button', { name: 'Create account' }).click();
  await reviewer.getByRole('heading', { name: 'Roadster restomod' }).waitFor();
  await screenshot(reviewer, 'build-overview-reviewer-phone');
  expect(await accessibilityViolations(reviewer)).toEqual([]);
  expect(await reviewer.getByRole('button', { name: 'Edit build' }).count()).toBe(0);
  expect(await reviewer.getByRole('link', { name: 'Edit build' }).count()).toBe(0);

  // On a phone Settings sits in the bottom bar's "More" menu, and Crew under it.
  await reviewer.getByRole('button', { name: 'More' }).click();
  await reviewer.getByRole('menuitem', { name: 'Settings' }).click();
  await reviewer.getByRole('link', { name: /^Crew/ }).click();
  await reviewer.getByText('Pat Reviewer').first().waitFor();
  expect(await reviewer.getByRole('button', { name: 'Send invite' }).count()).toBe(0);
  expect(await reviewer.getByRole('combobox', { name: /Role for/ }).count()).toBe(0);
  await screenshot(reviewer, 'crew-reviewer-phone');

  // The owner's crew page now lists the reviewer with the role.
  await page.reload();
  await page.getByText('Pat Reviewer').first().waitFor();
});
