// Crew against the real PostgreSQL: invites by e-mail through the fake SMTP server, roles, removal, the last owner.
import { Invite } from '../../backend/src/crew/invite.entity';
import { ApiClient, NEW_BUILD, TEST_PASSWORD, signedUpClient, uniqueEmail } from '../support/api-client';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

async function ownerWithBuild() {
  const owner = await signedUpClient(t.app, 'crew-owner');
  const build = (await owner.client.post('/api/builds', { ...NEW_BUILD, name: 'Crew build' })).body;
  return { ...owner, build };
}

async function inviteToken(email: string): Promise<string> {
  const mail = await t.mail.waitFor((m) => m.to.includes(email.toLowerCase()));
  const match = /\/invites\/([A-Za-z0-9_-]+)/.exec(mail.text);
  if (!match) throw new Error(`no invite link in ${mail.text}`);
  return match[1];
}

it('invites by e-mail; a signed-in person accepts and gets the role', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const guest = await signedUpClient(t.app, 'guest');
  const invited = await owner.post(`/api/builds/${build.id}/invites`, { email: guest.email.toUpperCase(), role: 'reviewer' });
  expect(invited.status).toBe(201);
  expect(invited.body).toMatchObject({ email: guest.email, role: 'reviewer' });

  const mail = await t.mail.waitFor((m) => m.to.includes(guest.email));
  expect(mail.subject).toBe('Join "Crew build" on Tallyhood');
  expect(mail.text).toContain('as reviewer');
  expect(mail.html).toContain('<a href=');
  const token = await inviteToken(guest.email);

  const preview = await new ApiClient(t.app).get(`/api/invites/${token}`);
  expect(preview.body).toMatchObject({ buildName: 'Crew build', role: 'reviewer', email: guest.email, invitedBy: 'Test crew-owner' });

  const accepted = await guest.client.post(`/api/invites/${token}/accept`);
  expect(accepted.body).toEqual({ buildId: build.id });
  expect((await guest.client.get(`/api/builds/${build.id}`)).body.role).toBe('reviewer');

  // Single use: a used link says so.
  const reused = await guest.client.post(`/api/invites/${token}/accept`);
  expect(reused.status).toBe(409);
  expect(reused.body.error.message).toBe('This invite link was already used. Ask the owner of the build for a new one.');
  expect((await new ApiClient(t.app).get(`/api/invites/${token}`)).status).toBe(409);
});

it('lets a new person create an account from the invite link', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const email = uniqueEmail('newcomer');
  await owner.post(`/api/builds/${build.id}/invites`, { email, role: 'crew' });
  const token = await inviteToken(email);
  const newcomer = await new ApiClient(t.app).init();
  const res = await newcomer.post('/api/auth/sign-up', { email, displayName: 'New Crew', password: TEST_PASSWORD, inviteToken: token });
  expect(res.status).toBe(201);
  expect((await newcomer.get(`/api/builds/${build.id}`)).body.role).toBe('crew');
  const members = (await owner.get(`/api/builds/${build.id}/members`)).body;
  expect(members.members.map((m: { email: string; role: string }) => [m.email, m.role])).toContainEqual([email, 'crew']);
  expect(members.invites).toEqual([]);
});

it('makes an account from an invite only for the invited address: another address gets 400 naming the field, and nothing changes', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const invited = uniqueEmail('invited-here');
  await owner.post(`/api/builds/${build.id}/invites`, { email: invited, role: 'crew' });
  const token = await inviteToken(invited);
  const elsewhere = uniqueEmail('other-address');
  const client = await new ApiClient(t.app).init();
  const res = await client.post('/api/auth/sign-up', { email: elsewhere, displayName: 'Other Box', password: TEST_PASSWORD, inviteToken: token });
  expect(res.status).toBe(400);
  expect(res.body.error.fields).toEqual({ email: `This invite was sent to ${invited}. Create the account with that address, or ask the build's owner to invite this one.` });
  expect((await client.post('/api/auth/sign-in', { email: elsewhere, password: TEST_PASSWORD })).status).toBe(401);
  // The invite is still open for the invited address.
  expect((await owner.get(`/api/builds/${build.id}/members`)).body.invites.map((i: { email: string }) => i.email)).toEqual([invited]);
});

it('tells the holder of an invite to an address that has an account to sign in, and leaves the account and the invite as they were', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const member = await signedUpClient(t.app, 'has-account');
  await owner.post(`/api/builds/${build.id}/invites`, { email: member.email, role: 'crew' });
  const token = await inviteToken(member.email);
  const res = await (await new ApiClient(t.app).init()).post('/api/auth/sign-up', { email: member.email, displayName: 'Twice', password: 'some-other-password', inviteToken: token });
  expect(res.status).toBe(409);
  expect(res.body.error.fields).toEqual({ email: 'An account with this e-mail already exists.' });
  expect((await (await new ApiClient(t.app).init()).post('/api/auth/sign-in', { email: member.email, password: TEST_PASSWORD })).status).toBe(200);
  expect((await member.client.post(`/api/invites/${token}/accept`)).body).toEqual({ buildId: build.id });
});

it('rolls back the new account when the invite token is not valid', async () => {
  const email = uniqueEmail('badtoken');
  const client = await new ApiClient(t.app).init();
  const res = await client.post('/api/auth/sign-up', { email, displayName: 'Nobody', password: TEST_PASSWORD, inviteToken: 'x'.repeat(43) });
  expect(res.status).toBe(404);
  expect((await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD })).status).toBe(401);
});

it('refuses an expired invite and a withdrawn one', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const late = uniqueEmail('late');
  await owner.post(`/api/builds/${build.id}/invites`, { email: late, role: 'crew' });
  const lateToken = await inviteToken(late);
  await t.orm.em.fork().nativeUpdate(Invite, { email: late }, { expiresAt: new Date(Date.now() - 1000) });
  expect((await new ApiClient(t.app).get(`/api/invites/${lateToken}`)).status).toBe(404);

  const withdrawn = uniqueEmail('withdrawn');
  const invite = (await owner.post(`/api/builds/${build.id}/invites`, { email: withdrawn, role: 'crew' })).body;
  const withdrawnToken = await inviteToken(withdrawn);
  expect((await owner.get(`/api/builds/${build.id}/members`)).body.invites.map((i: { id: string }) => i.id)).toEqual([invite.id]);
  expect((await owner.delete(`/api/builds/${build.id}/invites/${invite.id}`)).status).toBe(204);
  expect((await new ApiClient(t.app).get(`/api/invites/${withdrawnToken}`)).status).toBe(404);
});

it('names the field when an invite is malformed or for a member', async () => {
  const { client: owner, build, email } = await ownerWithBuild();
  const bad = await owner.post(`/api/builds/${build.id}/invites`, { email: 'nope', role: 'owner' });
  expect(bad.status).toBe(400);
  expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'role']);
  const self = await owner.post(`/api/builds/${build.id}/invites`, { email, role: 'crew' });
  expect(self.status).toBe(409);
  expect(self.body.error.fields).toEqual({ email: 'Already a member of this build.' });
});

it('changes roles, removes members, and always keeps an owner', async () => {
  const { client: owner, build, userId: ownerId } = await ownerWithBuild();
  const helper = await signedUpClient(t.app, 'helper');
  await owner.post(`/api/builds/${build.id}/invites`, { email: helper.email, role: 'crew' });
  await helper.client.post(`/api/invites/${await inviteToken(helper.email)}/accept`);

  const lastOwnerLeaves = await owner.delete(`/api/builds/${build.id}/members/${ownerId}`);
  expect(lastOwnerLeaves.status).toBe(409);
  expect(lastOwnerLeaves.body.error.message).toMatch(/last owner/);
  const lastOwnerDemoted = await owner.patch(`/api/builds/${build.id}/members/${ownerId}`, { role: 'crew' });
  expect(lastOwnerDemoted.status).toBe(409);

  const promoted = await owner.patch(`/api/builds/${build.id}/members/${helper.userId}`, { role: 'owner' });
  expect(promoted.body.role).toBe('owner');
  // With a second owner, the first may step down.
  expect((await owner.patch(`/api/builds/${build.id}/members/${ownerId}`, { role: 'reviewer' })).body.role).toBe('reviewer');
  expect((await owner.get(`/api/builds/${build.id}`)).body.role).toBe('reviewer');

  // The new owner removes the former one, who then sees nothing of the build.
  expect((await helper.client.delete(`/api/builds/${build.id}/members/${ownerId}`)).status).toBe(204);
  expect((await owner.get(`/api/builds/${build.id}`)).status).toBe(404);
});

it('lets a member leave, but not remove someone else', async () => {
  const { client: owner, build, userId: ownerId } = await ownerWithBuild();
  const helper = await signedUpClient(t.app, 'leaver');
  await owner.post(`/api/builds/${build.id}/invites`, { email: helper.email, role: 'crew' });
  await helper.client.post(`/api/invites/${await inviteToken(helper.email)}/accept`);
  expect((await helper.client.delete(`/api/builds/${build.id}/members/${ownerId}`)).status).toBe(403);
  expect((await helper.client.delete(`/api/builds/${build.id}/members/${helper.userId}`)).status).toBe(204);
  expect((await helper.client.get(`/api/builds/${build.id}`)).status).toBe(404);
});

it('answers each build route with the role in the build its URL names, whatever the case of the id', async () => {
  const { client: owner, build } = await ownerWithBuild();
  const member = await signedUpClient(t.app, 'two-builds');
  const own = (await member.client.post('/api/builds', { ...NEW_BUILD, name: 'Own build' })).body;
  await owner.post(`/api/builds/${build.id}/invites`, { email: member.email, role: 'reviewer' });
  await member.client.post(`/api/invites/${await inviteToken(member.email)}/accept`);

  // The user and the membership are read together from the URL's build id; the guard reads the same build.
  const upper = build.id.toUpperCase();
  expect((await member.client.get(`/api/builds/${upper}`)).body).toMatchObject({ id: build.id, role: 'reviewer' });
  expect((await member.client.get(`/api/builds/${own.id.toUpperCase()}`)).body).toMatchObject({ id: own.id, role: 'owner' });
  // Owning another build makes no one an owner here: a reviewer adds no part (refused before the body is read).
  const refused = await member.client.post(`/api/builds/${upper}/parts`, {});
  expect(refused.status).toBe(403);
  expect((await owner.get(`/api/builds/${build.id}/parts`)).body.parts).toEqual([]);
  const stranger = await signedUpClient(t.app, 'stranger');
  expect((await stranger.client.get(`/api/builds/${upper}/parts`)).status).toBe(404);
  expect((await stranger.client.get(`/api/builds/${own.id}/receipts`)).status).toBe(404);
});
