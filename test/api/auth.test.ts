// Accounts against the real PostgreSQL: sign-up by a mailed link, sign-in, sign-out, CSRF, rate limits and password reset.
import { ACCOUNT_MAILS_PER_HOUR, mayMailAccount } from '../../backend/src/auth/account-mail-cap';
import { PasswordReset } from '../../backend/src/auth/password-reset.entity';
import { PendingSignUp } from '../../backend/src/auth/pending-sign-up.entity';
import { User } from '../../backend/src/auth/user.entity';
import { ApiClient, TEST_PASSWORD, signedUpClient, uniqueEmail } from '../support/api-client';
import { SIGN_UP_LINK_SUBJECT, signUpToken } from '../support/caught-mail';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function userCount(email: string) {
  return t.orm.em.fork().count(User, { email: email.toLowerCase() });
}

/**
 * Holds the app's mail back while `ask` runs: the answer's status when it came without waiting for the mail, or
 * "waited for the mail" when it did not come within 2 s. The held mail goes out afterwards.
 */
async function withMailHeld(ask: () => Promise<{ status: number }>): Promise<number | 'waited for the mail'> {
  const send = t.mailer.send;
  let release!: () => void;
  const held = new Promise<void>((resolve) => (release = resolve));
  t.mailer.send = async (message) => {
    await held;
    return send.call(t.mailer, message);
  };
  try {
    const answer = await Promise.race([ask(), new Promise<'waited for the mail'>((resolve) => setTimeout(() => resolve('waited for the mail'), 2000))]);
    return answer === 'waited for the mail' ? answer : answer.status;
  } finally {
    t.mailer.send = send;
    release();
  }
}

describe('health', () => {
  it('reports the database as up', async () => {
    const res = await new ApiClient(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });
});

describe('sign-up and sign-in', () => {
  it('mails a link to a new address; opening it makes the account, signs it in, and signing out works', async () => {
    const client = await new ApiClient(t.app).init();
    const email = uniqueEmail('Mixed.Case');
    const asked = await client.post('/api/auth/sign-up', { email, displayName: 'Sam Ferrule', password: TEST_PASSWORD });
    expect(asked.status).toBe(202);
    expect(asked.body).toEqual({ status: 'check-mail', message: `We sent a message to ${email.toLowerCase()}. Open the link in it to finish creating your account; it works for 24 hours.` });
    expect(await userCount(email)).toBe(0);
    expect((await client.get('/api/auth/me')).body).toEqual({ user: null });

    const mail = await t.mail.waitFor((m) => m.to.includes(email.toLowerCase()));
    expect(mail.subject).toBe(SIGN_UP_LINK_SUBJECT);
    expect(mail.text).toContain('Welcome to Tallyhood, Sam Ferrule.');
    expect(mail.text).toContain('24 hours');
    const token = await signUpToken(t.mail, email);
    // Only the token's hash is kept, with the password's hash.
    const [pending] = await t.orm.em.fork().find(PendingSignUp, { email: email.toLowerCase() });
    expect(pending.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(pending.tokenHash).not.toBe(token);
    expect(pending.passwordHash).toMatch(/^\$argon2id\$/);

    const created = await client.post('/api/auth/sign-up/confirm', { token });
    expect(created.status).toBe(201);
    expect(created.body).toEqual({ user: { id: expect.any(String), email: email.toLowerCase(), displayName: 'Sam Ferrule' } });
    expect(([] as string[]).concat(created.headers['set-cookie'] ?? []).join(';')).toMatch(/tallyhood\.sid=.*HttpOnly.*SameSite=Lax/i);
    expect(await t.orm.em.fork().count(PendingSignUp, { email: email.toLowerCase() })).toBe(0);

    expect((await client.get('/api/auth/me')).body.user.email).toBe(email.toLowerCase());
    expect((await client.post('/api/auth/sign-out')).status).toBe(204);
    expect((await client.get('/api/auth/me')).body).toEqual({ user: null });

    // E-mail is case-insensitive at sign-in too.
    const again = await client.post('/api/auth/sign-in', { email: email.toUpperCase(), password: TEST_PASSWORD });
    expect(again.status).toBe(200);
    expect(again.body.user.displayName).toBe('Sam Ferrule');
  });

  it('stores an argon2id hash, never the password', async () => {
    const { email } = await signedUpClient(t.app, 'hash');
    const user = await t.orm.em.fork().findOneOrFail(User, { email });
    expect(user.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(user.passwordHash).not.toContain(TEST_PASSWORD);
  });

  it('answers 400 naming each bad field and saves nothing', async () => {
    const client = await new ApiClient(t.app).init();
    const email = 'not-an-address';
    const res = await client.post('/api/auth/sign-up', { email, displayName: '', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['displayName', 'email', 'password']);
    expect(res.body.error.fields.password).toBe('Use at least 10 characters for the password.');
    expect(await userCount(email)).toBe(0);
    expect(await t.orm.em.fork().count(PendingSignUp, { email })).toBe(0);
  });

  it('answers a known address byte for byte as a new one, mails its owner instead, and leaves the account as it was', async () => {
    const { email: known, userId } = await signedUpClient(t.app, 'known');
    const before = await t.orm.em.fork().findOneOrFail(User, { id: userId });
    const unknown = uniqueEmail('unknown');
    const ask = async (email: string) => (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email, displayName: 'Someone Else', password: 'another-password-1' });
    const [forKnown, forUnknown] = [await ask(known), await ask(unknown)];

    const shape = (res: Awaited<ReturnType<typeof ask>>, email: string) => ({
      status: res.status,
      body: res.text.replace(email, '<address>'),
      contentType: res.headers['content-type'],
      cookies: ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((cookie) => cookie.split('=')[0]),
    });
    expect(forKnown.status).toBe(202);
    expect(shape(forKnown, known)).toEqual(shape(forUnknown, unknown));

    const toKnown = await t.mail.waitFor((m) => m.to.includes(known));
    expect(toKnown.subject).toBe('You already have a Tallyhood account');
    expect(toKnown.text).toContain('Nothing was changed.');
    expect(toKnown.text).toContain(`Sign in: ${t.url}/sign-in`);
    expect(toKnown.text).toContain(`Choose a new password: ${t.url}/reset-password`);
    expect(toKnown.text).not.toMatch(/sign-up\/confirm/);
    expect((await t.mail.waitFor((m) => m.to.includes(unknown))).subject).toBe(SIGN_UP_LINK_SUBJECT);

    const after = await t.orm.em.fork().findOneOrFail(User, { id: userId });
    expect(after.passwordHash).toBe(before.passwordHash);
    expect(after.displayName).toBe(before.displayName);
    expect(await userCount(known)).toBe(1);
    expect(await t.orm.em.fork().count(PendingSignUp, { email: known })).toBe(0);
    expect((await (await new ApiClient(t.app).init()).post('/api/auth/sign-in', { email: known, password: TEST_PASSWORD })).status).toBe(200);
  });

  it('answers sign-up before the mail is sent, for a known and a new address', async () => {
    const { email: known } = await signedUpClient(t.app, 'signup-fast');
    const unknown = uniqueEmail('signup-fast-new');
    for (const email of [known, unknown]) {
      const answer = await withMailHeld(() => new ApiClient(t.app).init().then((c) => c.post('/api/auth/sign-up', { email, displayName: 'Quick', password: TEST_PASSWORD })));
      expect(answer).toBe(202);
    }
    expect((await t.mail.waitFor((m) => m.to.includes(unknown))).subject).toBe(SIGN_UP_LINK_SUBJECT);
  });

  it('refuses a used, an expired and a made-up sign-up link, naming the field, and makes no account', async () => {
    const email = uniqueEmail('link-once');
    const client = await new ApiClient(t.app).init();
    await client.post('/api/auth/sign-up', { email, displayName: 'Once Only', password: TEST_PASSWORD });
    const token = await signUpToken(t.mail, email);
    expect((await client.post('/api/auth/sign-up/confirm', { token })).status).toBe(201);
    const used = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token });
    expect(used.status).toBe(400);
    expect(used.body.error.fields).toEqual({ token: 'This sign-up link has expired or was already used. Sign up again for a new one.' });
    expect(await userCount(email)).toBe(1);

    const late = uniqueEmail('link-late');
    await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email: late, displayName: 'Too Late', password: TEST_PASSWORD });
    const lateToken = await signUpToken(t.mail, late);
    await t.orm.em.fork().nativeUpdate(PendingSignUp, { email: late }, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token: lateToken });
    expect(expired.status).toBe(400);
    expect(expired.body.error.fields).toEqual({ token: 'This sign-up link has expired or was already used. Sign up again for a new one.' });
    expect(await userCount(late)).toBe(0);
    // The next sign-up, of anyone, deletes the expired one with its password hash.
    const next = uniqueEmail('link-next');
    await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email: next, displayName: 'Next One', password: TEST_PASSWORD });
    await signUpToken(t.mail, next);
    expect(await t.orm.em.fork().count(PendingSignUp, { email: late })).toBe(0);

    const madeUp = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token: 'x'.repeat(43) });
    expect(madeUp.status).toBe(400);
    expect(Object.keys(madeUp.body.error.fields)).toEqual(['token']);
    const garbage = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token: 'short' });
    expect(garbage.status).toBe(400);
    expect(garbage.body.error.fields).toEqual({ token: 'The sign-up link is incomplete.' });
  });

  it('makes one account from two sign-ups of one address: the second link is refused once the first is used', async () => {
    const email = uniqueEmail('two-links');
    await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email, displayName: 'First Try', password: TEST_PASSWORD });
    const first = await signUpToken(t.mail, email);
    await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email, displayName: 'Second Try', password: 'second-password-2' });
    const second = await signUpToken(t.mail, email);
    expect(second).not.toBe(first);

    expect((await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token: second })).body.user.displayName).toBe('Second Try');
    const refused = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up/confirm', { token: first });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(['token']);
    expect(await userCount(email)).toBe(1);
    expect((await (await new ApiClient(t.app).init()).post('/api/auth/sign-in', { email, password: 'second-password-2' })).status).toBe(200);
  });

  it('answers 401 with one message for a wrong password and an unknown address', async () => {
    const { email } = await signedUpClient(t.app, 'wrong');
    const client = await new ApiClient(t.app).init();
    const wrong = await client.post('/api/auth/sign-in', { email, password: 'not-the-password' });
    const unknown = await client.post('/api/auth/sign-in', { email: uniqueEmail('nobody'), password: 'whatever-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('rate-limits sign-in attempts for one address', async () => {
    const { email } = await signedUpClient(t.app, 'limit');
    const client = await new ApiClient(t.app).init();
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) statuses.push((await client.post('/api/auth/sign-in', { email, password: 'wrong-password-x' })).status);
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses[10]).toBe(429);
  });

  it('limits one password sprayed over many accounts from one address: 30 failures, then 429', async () => {
    const sprayer = await new ApiClient(t.app, { clientAddress: '203.0.113.7' }).init();
    const statuses: number[] = [];
    for (let i = 0; i < 31; i += 1) statuses.push((await sprayer.post('/api/auth/sign-in', { email: uniqueEmail(`spray-${i}`), password: 'Summer2026!!' })).status);
    expect(statuses.slice(0, 30)).toEqual(Array(30).fill(401));
    expect(statuses[30]).toBe(429);
    // Another address is not affected.
    const { email } = await signedUpClient(t.app, 'after-spray');
    expect((await (await new ApiClient(t.app, { clientAddress: '203.0.113.8' }).init()).post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status).toBe(200);
  });

  it('limits failures on one account from many addresses: 10, then 429', async () => {
    const { email } = await signedUpClient(t.app, 'many-addresses');
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) {
      statuses.push((await (await new ApiClient(t.app, { clientAddress: `198.51.100.${i + 1}` }).init()).post('/api/auth/sign-in', { email, password: 'wrong-password-y' })).status);
    }
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses[10]).toBe(429);
  });

  it('never counts successful sign-ins: a dozen devices signing in to one account all get in', async () => {
    const { email } = await signedUpClient(t.app, 'devices');
    const statuses: number[] = [];
    for (let i = 0; i < 12; i += 1) statuses.push((await (await new ApiClient(t.app, { clientAddress: '192.0.2.44' }).init()).post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status);
    expect(statuses).toEqual(Array(12).fill(200));
  });

  it('refuses a password of spaces only, naming the field', async () => {
    const email = uniqueEmail('spaces');
    const res = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email, displayName: 'Space Bar', password: ' '.repeat(12) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ password: 'A password of spaces only is too easy to guess: use letters, digits or words too.' });
    expect(await userCount(email)).toBe(0);
  });
});

describe('CSRF (double-submit cookie, OWASP CSRF Prevention Cheat Sheet)', () => {
  it('rejects a state-changing request without the header, and one whose header does not match the cookie', async () => {
    const { client } = await signedUpClient(t.app, 'csrf');
    const agent = (client as unknown as { agent: import('supertest').Agent }).agent;
    const missing = await agent.post('/api/builds').send({ name: 'No token', currency: 'USD' });
    expect(missing.status).toBe(403);
    expect(missing.body.error.code).toBe('csrf_failed');
    const forged = await agent.post('/api/builds').set('X-XSRF-TOKEN', 'forged').send({ name: 'Forged', currency: 'USD' });
    expect(forged.status).toBe(403);
    expect((await client.get('/api/builds')).body.builds).toEqual([]);
  });

  it('sets a readable XSRF-TOKEN cookie on GET /api/auth/me', async () => {
    const res = await new ApiClient(t.app).get('/api/auth/me');
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='));
    expect(cookie).toBeDefined();
    expect(cookie).not.toMatch(/HttpOnly/i);
  });
});

describe('password reset', () => {
  function tokenFrom(text: string): string {
    const match = /reset-password\/([A-Za-z0-9_-]+)/.exec(text);
    if (!match) throw new Error(`no reset link in: ${text}`);
    return match[1];
  }

  it('mails a one-time link that sets a new password and signs out other sessions', async () => {
    const { client: oldSession, email } = await signedUpClient(t.app, 'reset');
    const client = await new ApiClient(t.app).init();
    const asked = await client.post('/api/auth/password-reset', { email });
    expect(asked.status).toBe(202);
    const mail = await t.mail.waitFor((m) => m.to.includes(email) && m.subject === 'Reset your Tallyhood password');
    expect(mail.text).toContain('one hour');
    const token = tokenFrom(mail.text);

    // Only the hash is stored.
    const stored = await t.orm.em.fork().find(PasswordReset, { user: { email } });
    expect(stored).toHaveLength(1);
    expect(stored[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored[0].tokenHash).not.toBe(token);

    const newPassword = 'a-brand-new-password';
    expect((await client.post('/api/auth/password-reset/confirm', { token, password: newPassword })).status).toBe(204);
    expect((await oldSession.get('/api/auth/me')).body.user).toBeNull();
    expect((await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status).toBe(401);
    expect((await client.post('/api/auth/sign-in', { email, password: newPassword })).status).toBe(200);

    const reused = await client.post('/api/auth/password-reset/confirm', { token, password: 'yet-another-password' });
    expect(reused.status).toBe(400);
    expect(reused.body.error.fields.token).toMatch(/expired or was already used/);
  });

  it('refuses an expired link', async () => {
    const { email } = await signedUpClient(t.app, 'expired');
    const client = await new ApiClient(t.app).init();
    await client.post('/api/auth/password-reset', { email });
    const token = tokenFrom((await t.mail.waitFor((m) => m.to.includes(email))).text);
    await t.orm.em.fork().nativeUpdate(PasswordReset, { user: { email } }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await client.post('/api/auth/password-reset/confirm', { token, password: 'another-new-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('token');
  });

  it('answers before the mail is sent, so a known address does not answer slower than an unknown one', async () => {
    const { email } = await signedUpClient(t.app, 'reset-fast');
    const answer = await withMailHeld(() => new ApiClient(t.app).init().then((c) => c.post('/api/auth/password-reset', { email })));
    expect(answer).toBe(202);
    expect((await t.mail.waitFor((m) => m.to.includes(email))).subject).toBe('Reset your Tallyhood password');
  });

  it('lets a good link through after five bad ones from the same address', async () => {
    const { email } = await signedUpClient(t.app, 'reset-after-bogus');
    const client = await new ApiClient(t.app, { clientAddress: '192.0.2.99' }).init();
    for (let i = 0; i < 5; i += 1) {
      expect((await client.post('/api/auth/password-reset/confirm', { token: `bogus-token-${i}-`.padEnd(43, 'x'), password: 'another-new-password' })).status).toBe(400);
    }
    await client.post('/api/auth/password-reset', { email });
    const token = tokenFrom((await t.mail.waitFor((m) => m.to.includes(email))).text);
    expect((await client.post('/api/auth/password-reset/confirm', { token, password: 'another-new-password' })).status).toBe(204);
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const email = uniqueEmail('ghost');
    const res = await (await new ApiClient(t.app).init()).post('/api/auth/password-reset', { email });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 200));
    expect(t.mail.messages.filter((m) => m.to.includes(email))).toHaveLength(0);
  });
});

describe('account mail to one address', () => {
  it('counts at most five an hour per address, even asked for all at once; older ones and other addresses do not count', async () => {
    const email = uniqueEmail('cap-unit');
    const em = t.orm.em.fork();
    const allowed = await Promise.all(Array.from({ length: 7 }, () => mayMailAccount(t.orm.em.fork(), email, 'password-reset')));
    expect(allowed.filter(Boolean)).toHaveLength(ACCOUNT_MAILS_PER_HOUR);
    expect(await mayMailAccount(em, uniqueEmail('cap-other'), 'password-reset')).toBe(true);
    // Upper and lower case name one mailbox.
    expect(await mayMailAccount(em, email.toUpperCase(), 'sign-up-link')).toBe(false);
    // An hour later the address may be mailed again.
    await em.execute(`update account_mail_sent set sent_at = now() - interval '61 minutes' where email = ?`, [email.toLowerCase()]);
    expect(await mayMailAccount(em, email, 'sign-up-known-address')).toBe(true);
  });

  it('sends one address five account mails an hour however many client addresses ask, and answers every ask alike', async () => {
    // Its sign-up link was the address's first account mail.
    const { email } = await signedUpClient(t.app, 'cap-http');
    // Each ask from a client address of its own, so no request limit applies: resets and sign-ups of the known address.
    const asks = ['reset', 'sign-up', 'reset', 'sign-up', 'reset', 'sign-up', 'reset', 'sign-up'];
    const answers = [];
    for (const [i, ask] of asks.entries()) {
      const client = await new ApiClient(t.app, { clientAddress: `198.51.100.${120 + i}` }).init();
      answers.push(
        ask === 'reset'
          ? await client.post('/api/auth/password-reset', { email })
          : await client.post('/api/auth/sign-up', { email, displayName: 'Someone Else', password: TEST_PASSWORD }),
      );
    }
    expect(answers.map((answer) => answer.status)).toEqual(Array(asks.length).fill(202));
    for (const kind of ['reset', 'sign-up']) {
      expect(new Set(answers.filter((_, i) => asks[i] === kind).map((answer) => JSON.stringify(answer.body))).size).toBe(1);
    }
    const address = email.toLowerCase();
    const toAddress = () => t.mail.messages.filter((m) => m.to.includes(address));
    await t.mail.waitFor(() => toAddress().length >= ACCOUNT_MAILS_PER_HOUR - 1);
    // The other asks ran after their answers too: given time, they still send nothing.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(toAddress()).toHaveLength(ACCOUNT_MAILS_PER_HOUR - 1);
    expect(new Set(toAddress().map((m) => m.subject))).toEqual(new Set(['Reset your Tallyhood password', 'You already have a Tallyhood account']));
    const [{ count }] = await t.orm.em.fork().execute(`select count(*)::int as count from account_mail_sent where email = ?`, [address]);
    expect(count).toBe(ACCOUNT_MAILS_PER_HOUR);
  });
});
