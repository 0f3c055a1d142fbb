// In Debian's chromium, the review loop end to end: the partner approves one receipt from its own page and questions
// another; the builder finds the question on the Overview and answers it in a comment; the partner sees it answered in
// the Review queue; the two uploads of the same slip are marked "not a duplicate" and the warning leaves both.
// Every step that tells someone arrives as mail through the fake SMTP server.
import type { Page } from 'playwright-core';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, sidewaysScroll, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { joinByInvite } from '../support/crew';
import { filedReceipt } from '../support/receipts';

jest.setTimeout(120_000);

const e2e = useBrowserApp();

it('closes the loop: approve and question on the receipt page, answer, the answer in the queue, not a duplicate', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-loop-owner');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Sage roadster', locale: 'en-US' })).body;
  const engine = (await owner.client.get(`/api/builds/${build.id}/systems`)).body.systems[0].id;
  const crew = await joinByInvite(e2e.t, owner.client, build.id, 'crew', 'e2e-loop-crew');
  const partner = await joinByInvite(e2e.t, owner.client, build.id, 'reviewer', 'e2e-loop-partner');
  // The same slip uploaded twice by the builder (invented shops and prices): a likely duplicate of each other.
  const harbor = await filedReceipt(e2e.t, crew.client, build.id, { vendorName: 'Harbor Gasket Works', purchaseDate: '2026-10-15', total: '18.00' }, [{ kind: 'part', description: 'Head gasket set', amount: '18.00', systemId: engine }]);
  const quayside = await filedReceipt(e2e.t, crew.client, build.id, { vendorName: 'Quayside Parts Counter', purchaseDate: '2026-11-01', total: '12.00' }, [{ kind: 'part', description: 'Thermostat', amount: '12.00', systemId: engine }]);
  const receiptUrl = (id: string) => `${e2e.t.url}/builds/${build.id}/receipts/${id}`;
  const mailTo = (email: string, subject: string) => e2e.t.mail.waitFor((m) => m.to.includes(email) && m.subject.includes(subject));
  const reviewState = (page: Page) => page.locator('.review-state .state-words');

  // The partner approves from the receipt's own page; the builder who uploaded it is told.
  const partnerPage = await newPage(e2e.browser);
  await signIn(partnerPage, e2e.t.url, partner.email);
  await partnerPage.goto(receiptUrl(harbor.id));
  await partnerPage.getByRole('heading', { name: 'Harbor Gasket Works', level: 1 }).waitFor();
  await partnerPage.getByRole('button', { name: 'Approve' }).click();
  await reviewState(partnerPage).filter({ hasText: /^Approved$/ }).waitFor();
  expect((await mailTo(crew.email, 'approved')).subject).toBe('Test e2e-loop-partner approved Harbor Gasket Works of 2026-10-15');

  // ... and questions the other; the builder is mailed the question.
  await partnerPage.goto(receiptUrl(quayside.id));
  await partnerPage.getByRole('heading', { name: 'Quayside Parts Counter', level: 1 }).waitFor();
  await partnerPage.getByRole('button', { name: 'Question' }).click();
  await partnerPage.getByRole('textbox', { name: 'What is the question?' }).fill('Is this thermostat the 82 °C one?');
  await partnerPage.getByRole('button', { name: 'Send question' }).click();
  await reviewState(partnerPage).filter({ hasText: 'Questioned: Is this thermostat the 82 °C one?' }).waitFor();
  expect((await mailTo(crew.email, 'commented')).text).toContain('Is this thermostat the 82 °C one?');

  // The builder, on a phone: the Overview lists the question as a task; it opens the receipts filtered to it (the review
  // state in an icon and a word, nothing scrolling sideways), and a comment answers it.
  const builderPage = await newPage(e2e.browser, { phone: true });
  await signIn(builderPage, e2e.t.url, crew.email);
  await builderPage.goto(`${e2e.t.url}/builds/${build.id}`);
  await builderPage.getByRole('link', { name: '1 question to answer' }).click();
  await builderPage.waitForURL(/\/receipts\?review=questioned$/);
  await builderPage.locator('.review').filter({ hasText: 'Questioned' }).waitFor();
  await expect(sidewaysScroll(builderPage)).resolves.toEqual({ page: false, regions: [] });
  await screenshot(builderPage, 'review-loop-questions-phone');
  await builderPage.getByRole('link', { name: /Quayside Parts Counter/ }).click();
  await builderPage.getByRole('textbox', { name: 'Add a comment' }).fill('Yes: the 82 °C one, for the stock radiator.');
  await builderPage.getByRole('button', { name: 'Post comment' }).click();
  await reviewState(builderPage).filter({ hasText: 'Answered, back for review' }).waitFor();
  const answer = await mailTo(partner.email, 'answered your question');
  expect(answer.text).toContain('Answer: Yes: the 82 °C one, for the stock radiator.');

  // The partner finds it back in the queue, marked answered.
  await partnerPage.goto(`${e2e.t.url}/builds/${build.id}/review`);
  await partnerPage.getByRole('heading', { name: 'Waiting for review (1)' }).waitFor();
  await partnerPage.getByRole('button', { name: /^Quayside Parts Counter\s*, Nov 1, 2026 · by .*, Answered\s*, \$12\.00$/ }).waitFor();

  // Not a duplicate: marked on one receipt with a reason, the warning leaves both; the uploader is told why.
  await partnerPage.goto(receiptUrl(harbor.id));
  await partnerPage.getByText(/Possible duplicate/).waitFor();
  await screenshot(partnerPage, 'review-loop-duplicate-desktop');
  expect(await accessibilityViolations(partnerPage)).toEqual([]);
  await partnerPage.getByRole('button', { name: 'Not a duplicate' }).click();
  await partnerPage.getByRole('textbox', { name: 'Why are these two purchases?' }).fill('Two slips from one printer roll: different shops and totals.');
  await partnerPage.getByRole('button', { name: 'Mark not a duplicate' }).click();
  await partnerPage.getByText(/Possible duplicate/).waitFor({ state: 'hidden' });
  expect((await mailTo(crew.email, 'not a duplicate')).text).toContain('Reason: Two slips from one printer roll: different shops and totals.');
  await partnerPage.goto(receiptUrl(quayside.id));
  await reviewState(partnerPage).filter({ hasText: 'Answered, back for review' }).waitFor();
  expect(await partnerPage.getByText(/Possible duplicate/).count()).toBe(0);
  await partnerPage.getByRole('list', { name: 'Changes to money' }).getByText('Marked not a duplicate').waitFor();
});
