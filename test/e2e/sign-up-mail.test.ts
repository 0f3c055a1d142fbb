// In Debian's chromium: sign-up answers "check your mail" alike for a new address and one that has an account; the
// link mailed to the new address (read from the fake SMTP server) makes the account and opens the builds.
import type { Page } from 'playwright-core';
import { signedUpClient, TEST_PASSWORD, uniqueEmail } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { SIGN_UP_LINK_SUBJECT } from '../support/caught-mail';

jest.setTimeout(120_000);

const e2e = useBrowserApp();

async function signUp(page: Page, email: string): Promise<string> {
  await page.goto(`${e2e.t.url}/sign-up`);
  await page.getByLabel('Your name').fill('Noor Halvorsen');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.getByRole('heading', { name: 'Check your mail' }).waitFor();
  return (await page.locator('.page-narrow').innerText()).replace(email, '<address>');
}

it('shows the same "check your mail" page for a new and a known address; the mailed link opens the builds', async () => {
  const known = await signedUpClient(e2e.t.app, 'e2e-known');
  const fresh = uniqueEmail('e2e-fresh');

  const page = await newPage(e2e.browser, { phone: true });
  const forFresh = await signUp(page, fresh);
  await screenshot(page, 'sign-up-check-mail-phone');
  expect(await accessibilityViolations(page)).toEqual([]);
  const other = await newPage(e2e.browser, { phone: true });
  expect(await signUp(other, known.email)).toBe(forFresh);
  expect(forFresh).toContain('We sent a message to <address>. Open the link in it to finish creating your account; it works for 24 hours.');

  expect((await e2e.t.mail.waitFor((m) => m.to.includes(known.email) && m.subject === 'You already have a Tallyhood account')).text).toContain('Nothing was changed.');
  const mail = await e2e.t.mail.waitFor((m) => m.to.includes(fresh) && m.subject === SIGN_UP_LINK_SUBJECT);
  const link = /(http:\/\/127\.0\.0\.1:\d+\/sign-up\/confirm\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];

  await page.goto(link);
  await page.getByRole('heading', { name: 'Your builds' }).waitFor();
  await screenshot(page, 'sign-up-confirmed-phone');
  expect(await accessibilityViolations(page)).toEqual([]);

  // The link works once: opened again, it says so and offers to sign in.
  const again = await newPage(e2e.browser);
  await again.goto(link);
  await again.getByRole('alert').filter({ hasText: 'This sign-up link has expired or was already used.' }).waitFor();
  await screenshot(again, 'sign-up-link-used');
  expect(await accessibilityViolations(again)).toEqual([]);
  await again.getByRole('link', { name: 'Sign in' }).click();
  await again.getByLabel('E-mail').fill(fresh);
  await again.getByLabel('Password').fill(TEST_PASSWORD);
  await again.getByRole('button', { name: 'Sign in' }).click();
  await again.getByRole('heading', { name: 'Your builds' }).waitFor();
});
