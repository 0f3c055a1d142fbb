// The build's inbox, with real mail: nodemailer sends RFC 5322 messages through the fake SMTP server, which hands
// mail for the receipts domain to receiveMail; receipts are read by the real reader. Sender checks, refusals kept for
// the owner, repeats made once, rotation, refused attachments answered by mail, and the webhook's secret.
import express from 'express';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import nodemailer from 'nodemailer';
import type Mail from 'nodemailer/lib/mailer';
import request from 'supertest';
import { Membership } from '../../backend/src/builds/membership.entity';
import { errorMiddleware } from '../../backend/src/http/errors';
import { inboundMailRoutes } from '../../backend/src/inbox/inbound-mail.routes';
import { MailRefusal } from '../../backend/src/inbox/mail-refusal.entity';
import { startReadingWorker } from '../../backend/src/jobs/worker';
import { readWithPageImages } from '../../backend/src/receipts/read-with-pages';
import { closeReaders } from '../../backend/src/receipts/reading/read-document';
import { REFUSED_TYPE_MESSAGE } from '../../backend/src/receipts/reading/sniff';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { loadConfig } from '../../backend/src/config';
import { NEW_BUILD, signedUpClient, type ApiClient } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

const INVOICE = readFileSync(path.resolve(__dirname, '../fixtures/receipts/generated/invoice-1.pdf'));
const INVOICE_TRUTH = JSON.parse(readFileSync(path.resolve(__dirname, '../fixtures/receipts/generated/invoice-1.json'), 'utf8'));

/** An invented shop's order confirmation as many arrive: HTML only, a logo embedded by cid, a tracking link. */
const CONFIRMATION_HTML = `<html><body><table width="100%"><tr><td>
  <img src="cid:logo@brasswing" alt="Brasswing logo">
  <h1>Brasswing Motor Supply</h1>
  <p>Thanks for your order! <a href="https://brasswing.example/track/BW-20417">Track your parcel</a></p>
  <p>Order BW-20417 placed March 14, 2026</p>
  <table>
    <tr><th>Item</th><th>Qty</th><th>Price</th><th>Total</th></tr>
    <tr><td>Front brake pad set</td><td>2</td><td>$38.50</td><td>$77.00</td></tr>
    <tr><td>Brake fluid DOT 4, 1 qt</td><td>1</td><td>$12.99</td><td>$12.99</td></tr>
  </table>
  <table>
    <tr><td>Subtotal</td><td>$89.99</td></tr>
    <tr><td>Shipping</td><td>$7.50</td></tr>
    <tr><td>Tax</td><td>$6.30</td></tr>
    <tr><td>Order total</td><td>$103.79</td></tr>
  </table>
</td></tr></table></body></html>`;
const LOGO = { filename: 'logo.png', cid: 'logo@brasswing', content: readFileSync(path.resolve(__dirname, '../fixtures/receipts/generated/counter-1.png')) };

let t: TestApp;
let stopWorker: () => Promise<void>;
let transport: ReturnType<typeof nodemailer.createTransport>;
let owner: Awaited<ReturnType<typeof signedUpClient>>;
let crew: Awaited<ReturnType<typeof signedUpClient>>;
let reviewer: Awaited<ReturnType<typeof signedUpClient>>;
let stranger: Awaited<ReturnType<typeof signedUpClient>>;

beforeAll(async () => {
  t = await startTestApp({ reading: true });
  stopWorker = await startReadingWorker(t.queue, { orm: t.orm, store: t.store, read: readWithPageImages });
  transport = nodemailer.createTransport({ host: '127.0.0.1', port: t.mail.smtpPort, secure: false, ignoreTLS: true });
  [owner, crew, reviewer, stranger] = await Promise.all(['inbox-owner', 'inbox-crew', 'inbox-reviewer', 'inbox-stranger'].map((label) => signedUpClient(t.app, label)));
});
afterAll(async () => {
  transport?.close();
  await stopWorker?.();
  await t?.close();
  await closeReaders();
});

/** A fresh build with the crew and reviewer on it (memberships made directly: invites are tested in crew). */
async function newBuild(): Promise<{ id: string; address: string }> {
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const em = t.orm.em.fork();
  em.create(Membership, { build: build.id, user: crew.userId, role: 'crew' });
  em.create(Membership, { build: build.id, user: reviewer.userId, role: 'reviewer' });
  await em.flush();
  return { id: build.id, address: (await owner.client.get(`/api/builds/${build.id}/inbox`)).body.address };
}

async function send(message: Mail.Options) {
  await transport.sendMail(message);
}

async function receiptsOf(buildId: string) {
  return (await owner.client.get(`/api/builds/${buildId}/receipts`)).body.receipts as { id: string; contentType: string; originalFilename: string; state: string }[];
}

async function refusedOf(buildId: string) {
  const res = await owner.client.get(`/api/builds/${buildId}/inbox/refused`);
  expect(res.status).toBe(200);
  return res.body.refused as { from: string; subject: string; reason: string; detail: string }[];
}

async function read(client: ApiClient, buildId: string, receiptId: string) {
  const deadline = Date.now() + 90_000;
  for (;;) {
    const res = await client.get(`/api/builds/${buildId}/receipts/${receiptId}`);
    if (['to_check', 'failed'].includes(res.body.state)) return res.body;
    if (Date.now() > deadline) throw new Error(`receipt stayed ${res.body.state}`);
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
}

const lineFigures = (receipt: { lines: { description: string; quantity: string; unitPrice: string | null; amount: string }[] }) =>
  receipt.lines.map((line) => [line.description, line.quantity, line.unitPrice, line.amount]);

describe('the address', () => {
  it('is private to each build, the same for owner and crew, in the receipts domain', async () => {
    const first = await newBuild();
    const second = await newBuild();
    expect(first.address).toMatch(/^[0-9a-f]{32}@receipts\.localhost$/);
    expect(second.address).not.toBe(first.address);
    expect((await crew.client.get(`/api/builds/${first.id}/inbox`)).body).toEqual({ address: first.address });
    expect((await reviewer.client.get(`/api/builds/${first.id}/inbox`)).status).toBe(403);
    expect((await stranger.client.get(`/api/builds/${first.id}/inbox`)).status).toBe(404);
    expect((await crew.client.get(`/api/builds/${first.id}/inbox/refused`)).status).toBe(403);
  });

  it('rotated, stops accepting the old token and shows the owner what still came to it', async () => {
    const build = await newBuild();
    const rotated = await crew.client.post(`/api/builds/${build.id}/inbox/rotate`);
    expect(rotated.status).toBe(200);
    expect(rotated.body.address).toMatch(/^[0-9a-f]{32}@receipts\.localhost$/);
    expect(rotated.body.address).not.toBe(build.address);
    expect((await owner.client.get(`/api/builds/${build.id}/inbox`)).body).toEqual(rotated.body);

    await send({ from: crew.email, to: build.address, subject: 'Invoice to the old address', attachments: [{ filename: 'invoice.pdf', content: INVOICE }] });
    expect(await receiptsOf(build.id)).toEqual([]);
    expect(await refusedOf(build.id)).toEqual([
      { id: expect.any(String), receivedAt: expect.any(String), from: crew.email, subject: 'Invoice to the old address', reason: 'old_address', detail: 'This address was replaced by a new one. Send receipts to the address shown in Settings.' },
    ]);

    await send({ from: crew.email, to: rotated.body.address, subject: 'Invoice to the new address', attachments: [{ filename: 'invoice.pdf', content: INVOICE }] });
    expect((await receiptsOf(build.id)).map((receipt) => receipt.originalFilename)).toEqual(['invoice.pdf']);
  });
});

describe('mail from a member', () => {
  it('makes a PDF invoice attachment a receipt, uploaded by the sender and read', async () => {
    const build = await newBuild();
    await send({ from: `"Crew Person" <${crew.email.toUpperCase()}>`, to: build.address, subject: 'Fwd: your invoice', text: 'Invoice attached.', attachments: [{ filename: 'kestrel-invoice.pdf', content: INVOICE }] });
    const [listed] = await receiptsOf(build.id);
    expect(listed).toMatchObject({ contentType: 'application/pdf', originalFilename: 'kestrel-invoice.pdf' });
    const receipt = await read(crew.client, build.id, listed.id);
    expect(receipt).toMatchObject({ state: 'to_check', vendorName: INVOICE_TRUTH.vendor, purchaseDate: INVOICE_TRUTH.date, total: INVOICE_TRUTH.total, uploadedBy: 'Test inbox-crew' });
    expect(receipt.lines.map((line: { partNumber: string; amount: string }) => [line.partNumber, line.amount])).toEqual(
      INVOICE_TRUTH.lines.map((line: { partNumber: string; amount: string }) => [line.partNumber, line.amount]),
    );
  });

  it('reads an HTML-only confirmation from its body, links and images dropped, and keeps the message as the document', async () => {
    const build = await newBuild();
    const messageId = '<bw-20417.confirmation@brasswing.example>';
    await send({ from: owner.email, to: build.address, subject: 'Your Brasswing order BW-20417', messageId, html: CONFIRMATION_HTML, attachments: [LOGO] });
    const [listed] = await receiptsOf(build.id);
    expect(listed).toMatchObject({ contentType: 'message/rfc822', originalFilename: 'Your Brasswing order BW-20417.eml' });
    const receipt = await read(owner.client, build.id, listed.id);
    expect(receipt).toMatchObject({ state: 'to_check', vendorName: 'Brasswing Motor Supply', purchaseDate: '2026-03-14', subtotal: '89.99', shipping: '7.50', tax: '6.30', total: '103.79' });
    expect(lineFigures(receipt)).toEqual([
      // Unit prices travel with the decimals they have (up to 4): 38.50 is "38.5".
      ['Front brake pad set', '2', '38.5', '77.00'],
      ['Brake fluid DOT 4, 1 qt', '1', '12.99', '12.99'],
    ]);
    expect(receipt.pages).toEqual([]);
    const document = await owner.client.get(`/api/builds/${build.id}/receipts/${listed.id}/document`);
    expect(document.headers['content-type']).toBe('message/rfc822');
    expect(document.headers['content-disposition']).toBe('attachment; filename="Your_Brasswing_order_BW-20417.eml"');
    expect(document.text ?? document.body.toString()).toContain(`Message-ID: ${messageId}`);
  });

  it('reads a forwarded confirmation from the quoted original, not the forwarding note', async () => {
    const build = await newBuild();
    const forwarded = [
      'Here is the hose order, total was a bit more than planned.',
      '',
      '---------- Forwarded message ---------',
      'From: Tidewater Hose & Fitting <orders@tidewater-hose.example>',
      'Date: Mon, 6 Apr 2026 09:12',
      'Subject: Order TW-8812 confirmed',
      'To: <' + crew.email + '>',
      '',
      '> Order TW-8812, April 6, 2026',
      '>',
      '> Heater hose 5/8 in, per foot     6    2.25    13.50',
      '> Hose clamp, stainless           4    1.10     4.40',
      '>',
      '> Subtotal     17.90',
      '> Tax           1.25',
      '> Total        19.15',
    ].join('\n');
    await send({ from: crew.email, to: build.address, subject: 'Fwd: Order TW-8812 confirmed', text: forwarded });
    const [listed] = await receiptsOf(build.id);
    const receipt = await read(crew.client, build.id, listed.id);
    expect(receipt).toMatchObject({ vendorName: 'Tidewater Hose & Fitting', purchaseDate: '2026-04-06', subtotal: '17.90', tax: '1.25', total: '19.15' });
    expect(lineFigures(receipt)).toEqual([
      ['Heater hose 5/8 in, per foot', '6', '2.25', '13.50'],
      ['Hose clamp, stainless', '4', '1.1', '4.40'],
    ]);
  });

  it('makes the same message one receipt: sent twice, or forwarded again under a new Message-ID', async () => {
    const build = await newBuild();
    const message = { from: owner.email, to: build.address, subject: 'Invoice', messageId: '<twice@kestrel.example>', attachments: [{ filename: 'invoice.pdf', content: INVOICE }] };
    await send(message);
    await send(message);
    await send({ ...message, messageId: '<forwarded-again@kestrel.example>', subject: 'Fwd: Invoice' });
    expect(await receiptsOf(build.id)).toHaveLength(1);
    expect(await refusedOf(build.id)).toEqual([]);
  });
});

describe('mail that is not accepted', () => {
  it('from a stranger or a reviewer is kept for the owner with the reason, and creates nothing', async () => {
    const build = await newBuild();
    await send({ from: stranger.email, to: build.address, subject: 'Spare parts for sale', attachments: [{ filename: 'invoice.pdf', content: INVOICE }] });
    await send({ from: reviewer.email, to: build.address, subject: 'A receipt I found', html: CONFIRMATION_HTML });
    expect(await receiptsOf(build.id)).toEqual([]);
    const refused = await refusedOf(build.id);
    expect(refused.map(({ from, subject, reason }) => ({ from, subject, reason }))).toEqual([
      { from: reviewer.email, subject: 'A receipt I found', reason: 'reviewer' },
      { from: stranger.email, subject: 'Spare parts for sale', reason: 'not_a_member' },
    ]);
    expect(refused[1].detail).toBe(`${stranger.email} is not the owner or crew of this build. Forward the receipt from the address you sign in with.`);
    // Nobody outside the build is written to: no mail back to a stranger.
    expect(t.mail.messages.filter((mail) => mail.to.includes(stranger.email))).toEqual([]);
  });

  it('to an address no build has is kept without a build', async () => {
    const subject = `Nobody home ${randomUUID()}`;
    await send({ from: owner.email, to: `${'0'.repeat(32)}@receipts.localhost`, subject });
    const kept = await t.orm.em.fork().find(MailRefusal, { subject });
    expect(kept.map((refusal) => [refusal.build, refusal.reason, refusal.recipient])).toEqual([[null, 'unknown_address', `${'0'.repeat(32)}@receipts.localhost`]]);
  });

  it('with an attachment the upload refuses is refused the same way, and the sender is told why by mail', async () => {
    const build = await newBuild();
    await send({
      from: crew.email,
      to: build.address,
      subject: 'Two invoices',
      attachments: [
        { filename: 'invoice.pdf', content: INVOICE },
        { filename: 'order.zip', content: Buffer.from('504b030414000000080000000000', 'hex') },
      ],
    });
    expect(await receiptsOf(build.id)).toEqual([]);
    expect(await t.orm.em.fork().count(Receipt, { build: build.id })).toBe(0);
    const why = `order.zip: ${REFUSED_TYPE_MESSAGE} This one is application/zip.`;
    expect((await refusedOf(build.id)).map(({ reason, detail }) => ({ reason, detail }))).toEqual([{ reason: 'refused_attachment', detail: why }]);
    const reply = await t.mail.waitFor((mail) => mail.to.includes(crew.email) && mail.subject === 'Not added to "Test coupé": Two invoices');
    expect(reply.text).toContain(why);
    expect(reply.text).toContain(`${t.url}/builds/${build.id}/receipts`);
  });
});

describe('the inbound-mail webhook', () => {
  const secret = 'a-webhook-secret-for-this-test-only-4471';
  const hook = () => {
    const config = { ...loadConfig({ ...process.env, PGDATABASE: process.env.PGDATABASE ?? 'tallyhood_test' }), appUrl: t.url };
    const app = express();
    app.use('/api', inboundMailRoutes({ orm: t.orm, store: t.store, queue: t.queue, mailer: t.mailer, config: { ...config, inbox: { ...config.inbox, webhookSecret: secret } } }));
    app.use(errorMiddleware);
    return app;
  };

  it('refuses a wrong secret, and hands a message with the right one to the same seam', async () => {
    const build = await newBuild();
    const raw = `From: ${owner.email}\r\nTo: ${build.address}\r\nSubject: Hook test\r\nMessage-ID: <hook@test.example>\r\nContent-Type: text/plain\r\n\r\nCounter sale\r\nShop rag pack  1  6.00  6.00\r\nTotal 6.00\r\n`;
    const app = hook();
    const wrong = await request(app).post('/api/inbound-mail').set('Authorization', 'Bearer not-the-secret').set('Content-Type', 'message/rfc822').send(raw);
    expect(wrong.status).toBe(401);
    expect(await receiptsOf(build.id)).toEqual([]);
    const right = await request(app).post('/api/inbound-mail').set('Authorization', `Bearer ${secret}`).set('Content-Type', 'message/rfc822').send(raw);
    expect(right.status).toBe(200);
    const receipts = await receiptsOf(build.id);
    expect(right.body).toEqual({ outcomes: [{ outcome: 'accepted', buildId: build.id, receiptIds: [receipts[0].id] }] });
  });

  it('is off without a secret', async () => {
    const app = express();
    app.use('/api', inboundMailRoutes({ orm: t.orm, store: t.store, queue: t.queue, mailer: t.mailer, config: loadConfig({}) }));
    app.use(errorMiddleware);
    expect((await request(app).post('/api/inbound-mail').set('Authorization', 'Bearer x').send('x')).status).toBe(404);
  });
});
