// Requests fired at the same moment: each race must end as if the requests had come one after another.
import { Membership } from '../../backend/src/builds/membership.entity';
import { User } from '../../backend/src/auth/user.entity';
import { ApiClient, NEW_BUILD, TEST_PASSWORD, signedUpClient, uniqueEmail } from '../support/api-client';
import { signUpToken } from '../support/caught-mail';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function inviteToken(email: string): Promise<string> {
  const mail = await t.mail.waitFor((m) => m.to.includes(email.toLowerCase()));
  return /\/invites\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
}

it('lets exactly one of four accounts accepting one invite link at once join; the others get 409', async () => {
  const owner = await signedUpClient(t.app, 'race-owner');
  const build = (await owner.client.post('/api/builds', NEW_BUILD)).body;
  const invited = uniqueEmail('race-invited');
  await owner.client.post(`/api/builds/${build.id}/invites`, { email: invited, role: 'crew' });
  const token = await inviteToken(invited);
  const guests = await Promise.all([1, 2, 3, 4].map((n) => signedUpClient(t.app, `race-guest-${n}`)));

  const answers = await Promise.all(guests.map((g) => g.client.post(`/api/invites/${token}/accept`)));
  expect(answers.map((a) => a.status).sort()).toEqual([200, 409, 409, 409]);
  expect(answers.find((a) => a.status === 409)!.body.error.message).toBe('This invite link was already used. Ask the owner of the build for a new one.');
  expect(await t.orm.em.fork().count(Membership, { build: build.id })).toBe(2);
});

it('never leaves a build without an owner when two owners demote each other at once', async () => {
  for (let round = 0; round < 4; round += 1) {
    const first = await signedUpClient(t.app, 'race-first');
    const build = (await first.client.post('/api/builds', NEW_BUILD)).body;
    const second = await signedUpClient(t.app, 'race-second');
    await first.client.post(`/api/builds/${build.id}/invites`, { email: second.email, role: 'crew' });
    await second.client.post(`/api/invites/${await inviteToken(second.email)}/accept`);
    await first.client.patch(`/api/builds/${build.id}/members/${second.userId}`, { role: 'owner' });

    const answers = await Promise.all([
      first.client.patch(`/api/builds/${build.id}/members/${second.userId}`, { role: 'crew' }),
      second.client.patch(`/api/builds/${build.id}/members/${first.userId}`, { role: 'crew' }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 403]);
    expect(await t.orm.em.fork().count(Membership, { build: build.id, role: 'owner' })).toBe(1);
  }
});

it('answers simultaneous sign-ups of one address alike, and their links make one account: one 201, the rest 400', async () => {
  const email = uniqueEmail('race-signup');
  const clients = await Promise.all([1, 2, 3, 4].map(() => new ApiClient(t.app).init()));
  const answers = await Promise.all(clients.map((c) => c.post('/api/auth/sign-up', { email, displayName: 'Same Person', password: TEST_PASSWORD })));
  expect(answers.map((a) => a.status)).toEqual([202, 202, 202, 202]);
  expect(new Set(answers.map((a) => a.text)).size).toBe(1);

  // Each sign-up mailed its own link; all four opened at once.
  const links: string[] = [];
  while (links.length < clients.length) links.push(await signUpToken(t.mail, email));
  expect(new Set(links).size).toBe(4);
  const confirms = await Promise.all(links.map((token, index) => clients[index].post('/api/auth/sign-up/confirm', { token })));
  expect(confirms.map((a) => a.status).sort()).toEqual([201, 400, 400, 400]);
  for (const refused of confirms.filter((a) => a.status !== 201)) expect(Object.keys(refused.body.error.fields)).toEqual(['token']);
  expect(await t.orm.em.fork().count(User, { email })).toBe(1);
});

it('lets one of two people opening one sign-up link at once in; the other gets 400 naming the link', async () => {
  const email = uniqueEmail('race-link');
  await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email, displayName: 'One Link', password: TEST_PASSWORD });
  const token = await signUpToken(t.mail, email);
  const clients = await Promise.all([1, 2].map(() => new ApiClient(t.app).init()));
  const confirms = await Promise.all(clients.map((c) => c.post('/api/auth/sign-up/confirm', { token })));
  expect(confirms.map((a) => a.status).sort()).toEqual([201, 400]);
  expect(confirms.find((a) => a.status === 400)!.body.error.fields).toEqual({ token: 'This sign-up link has expired or was already used. Sign up again for a new one.' });
  expect(await t.orm.em.fork().count(User, { email })).toBe(1);
});
