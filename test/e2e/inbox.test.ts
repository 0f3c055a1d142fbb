// The build's inbox in chromium: the builder copies the address from Settings, an order confirmation (HTML only, as
// many shops send them) is mailed to it through the fake SMTP server, and it shows up in the receipts list with its
// lines read from the body; the builder assigns and files it.
import nodemailer from 'nodemailer';
import { NEW_BUILD, signedUpClient } from '../support/api-client';
import { accessibilityViolations, newPage, screenshot, signIn } from '../support/browser';
import { useBrowserApp } from '../support/browser-app';
import { assignSystem } from '../support/check-screen';

jest.setTimeout(240_000);

/** An invented shop's confirmation: a heading, a tracking link, an item table and the summary (77.00 + 12.99 = 89.99; + 7.50 + 6.30 = 103.79). */
const CONFIRMATION_HTML = `<html><body>
  <h1>Copperfield Garage Goods</h1>
  <p>Your order CG-5521 is on its way. <a href="https://copperfield.example/track/CG-5521">Track it</a></p>
  <p>Ordered November 3, 2026</p>
  <table>
    <tr><th>Item</th><th>Qty</th><th>Price</th><th>Total</th></tr>
    <tr><td>Fuel pump relay</td><td>2</td><td>$38.50</td><td>$77.00</td></tr>
    <tr><td>Inline fuel filter</td><td>1</td><td>$12.99</td><td>$12.99</td></tr>
  </table>
  <table>
    <tr><td>Subtotal</td><td>$89.99</td></tr>
    <tr><td>Shipping</td><td>$7.50</td></tr>
    <tr><td>Tax</td><td>$6.30</td></tr>
    <tr><td>Order total</td><td>$103.79</td></tr>
  </table>
</body></html>`;

const e2e = useBrowserApp({ reading: true });

it('turns a mailed order confirmation into a receipt the builder checks and files', async () => {
  const owner = await signedUpClient(e2e.t.app, 'e2e-inbox');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Copper coupe swap', locale: 'en-US' })).body;
  const buildUrl = `${e2e.t.url}/builds/${build.id}`;
  const page = await newPage(e2e.browser);
  await signIn(page, e2e.t.url, owner.email);

  // Settings shows the build's own address; copying it says so.
  await page.goto(`${buildUrl}/settings`);
  await page.getByRole('heading', { name: 'Receipts by mail' }).waitFor();
  const address = (await page.getByTestId('inbox-address').innerText()).trim();
  expect(address).toBe((await owner.client.get(`/api/builds/${build.id}/inbox`)).body.address);
  await page.getByRole('button', { name: 'Copy address' }).click();
  await page.getByText('Address copied.').waitFor();
  await screenshot(page, 'settings-inbox');
  expect(await accessibilityViolations(page)).toEqual([]);

  // The builder's shop mails the confirmation there (from the builder's own address, as a forward would).
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port: e2e.t.mail.smtpPort, secure: false, ignoreTLS: true });
  await transport.sendMail({ from: owner.email, to: address, subject: 'Your Copperfield order CG-5521', html: CONFIRMATION_HTML });
  transport.close();

  // It arrives in the receipts list and is read from the body.
  await page.goto(`${buildUrl}/receipts`);
  const row = page.getByRole('link', { name: /Copperfield/i }).first();
  for (let tries = 0; !(await row.isVisible()) && tries < 60; tries += 1) {
    await page.waitForTimeout(1000);
    await page.reload();
  }
  await row.click();
  await page.getByText('Ready to check').waitFor({ timeout: 120_000 });
  await expect(page.getByLabel('Total', { exact: true }).inputValue()).resolves.toBe('103.79');
  await expect(page.getByRole('textbox', { name: 'Description, line 1' }).inputValue()).resolves.toMatch(/Fuel pump relay/);
  await expect(page.getByRole('textbox', { name: 'Description, line 2' }).inputValue()).resolves.toMatch(/Inline fuel filter/);
  await page.getByText('Adds up to the printed total of $103.79.').waitFor();

  await assignSystem(page, 1, 'Fuel');
  await assignSystem(page, 2, 'Fuel');
  // Fuel work carries the safety caution.
  await page.getByRole('complementary', { name: 'Safety caution' }).filter({ hasText: "manufacturer's instructions" }).waitFor();
  await screenshot(page, 'inbox-receipt-check');
  const filed = page.waitForResponse((response) => response.request().method() === 'POST' && response.url().endsWith('/file'));
  await page.getByRole('button', { name: /File receipt/ }).click();
  expect((await filed).status()).toBe(200);
  await page.locator('p.filed').filter({ hasText: 'Filed.' }).waitFor();

  const receipts = (await owner.client.get(`/api/builds/${build.id}/receipts`)).body.receipts as { state: string; total: string }[];
  expect(receipts.map((receipt) => [receipt.state, receipt.total])).toEqual([['filed', '103.79']]);
});
