// Crew: members of a build, invites by e-mail with a role, role changes and removal; a build keeps an owner.
import { afterCommit } from '../http/request-transaction';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { InviteDto, InvitePreviewDto, MemberDto, MembersResponse } from '../../../shared/api/builds';
import type { BuildRole, InvitableRole } from '../../../shared/enums';
import { ROLE_LABELS } from '../../../shared/enums';
import { hashToken, newToken } from '../auth/passwords';
import type { User } from '../auth/user.entity';
import type { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import type { AppConfig } from '../config';
import { Conflict, NotFound } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { inviteMail } from '../mail/templates';
import { Invite } from './invite.entity';

const INVITE_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

function memberDto(m: Membership): MemberDto {
  return { userId: m.user.id, email: m.user.email, displayName: m.user.displayName, role: m.role, joinedAt: m.createdAt.toISOString() };
}

function inviteDto(i: Invite): InviteDto {
  return { id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() };
}

export async function listMembers(em: EntityManager, build: Build, callerRole: BuildRole): Promise<MembersResponse> {
  const members = await em.find(Membership, { build }, { populate: ['user'], orderBy: { createdAt: 'asc' } });
  const invites =
    callerRole === 'owner'
      ? await em.find(Invite, { build, acceptedAt: null, withdrawnAt: null, expiresAt: { $gt: new Date() } }, { orderBy: { createdAt: 'desc' } })
      : [];
  return { members: members.map(memberDto), invites: invites.map(inviteDto) };
}

export async function inviteMember(
  em: EntityManager,
  mailer: Mailer,
  config: AppConfig,
  input: { build: Build; inviter: User; email: string; role: InvitableRole },
): Promise<InviteDto> {
  const email = input.email.toLowerCase();
  const existing = await em.count(Membership, { build: input.build, user: { email } });
  if (existing) throw new Conflict('That person is already on this build.', { email: 'Already a member of this build.' });
  const { token, tokenHash } = newToken();
  const invite = em.create(Invite, {
    build: input.build,
    email,
    role: input.role,
    tokenHash,
    invitedBy: input.inviter,
    expiresAt: new Date(Date.now() + INVITE_LIFETIME_MS),
  });
  await em.flush();
  await afterCommit(em, () =>
    mailer.send(
      inviteMail({
        to: email,
        inviterName: input.inviter.displayName,
        buildName: input.build.name,
        role: ROLE_LABELS[input.role].toLowerCase(),
        link: `${config.appUrl}/invites/${token}`,
      }),
    ),
  );
  return inviteDto(invite);
}

async function openInvite(em: EntityManager, token: string): Promise<Invite> {
  const invite = await em.findOne(
    Invite,
    { tokenHash: hashToken(token), acceptedAt: null, withdrawnAt: null, expiresAt: { $gt: new Date() } },
    { populate: ['build', 'invitedBy'] },
  );
  if (!invite || invite.build.archivedAt) throw new NotFound('That invite');
  return invite;
}

export async function previewInvite(em: EntityManager, token: string): Promise<InvitePreviewDto> {
  const invite = await openInvite(em, token);
  return {
    buildName: invite.build.name,
    role: invite.role,
    email: invite.email,
    invitedBy: invite.invitedBy.displayName,
    expiresAt: invite.expiresAt.toISOString(),
  };
}

/** The invite is the capability: whoever holds the link joins with its role, once. */
export async function acceptInvite(em: EntityManager, user: User, token: string): Promise<Build> {
  const invite = await openInvite(em, token);
  const already = await em.findOne(Membership, { build: invite.build, user });
  if (!already) em.create(Membership, { build: invite.build, user, role: invite.role });
  invite.acceptedAt = new Date();
  invite.acceptedBy = user;
  await em.flush();
  return invite.build;
}

export async function withdrawInvite(em: EntityManager, build: Build, inviteId: string): Promise<void> {
  const invite = await em.findOne(Invite, { id: inviteId, build, acceptedAt: null, withdrawnAt: null });
  if (!invite) throw new NotFound('That invite');
  invite.withdrawnAt = new Date();
  await em.flush();
}

async function memberOf(em: EntityManager, build: Build, userId: string): Promise<Membership> {
  const member = await em.findOne(Membership, { build, user: userId }, { populate: ['user'] });
  if (!member) throw new NotFound('That member');
  return member;
}

async function ensureAnotherOwner(em: EntityManager, build: Build, member: Membership, message: string) {
  if (member.role !== 'owner') return;
  const owners = await em.count(Membership, { build, role: 'owner' });
  if (owners <= 1) throw new Conflict(message);
}

export async function changeRole(em: EntityManager, build: Build, userId: string, role: BuildRole): Promise<MemberDto> {
  const member = await memberOf(em, build, userId);
  if (role !== 'owner') await ensureAnotherOwner(em, build, member, 'A build needs an owner: make someone else owner first.');
  member.role = role;
  await em.flush();
  return memberDto(member);
}

export async function removeMember(em: EntityManager, build: Build, userId: string): Promise<void> {
  const member = await memberOf(em, build, userId);
  await ensureAnotherOwner(em, build, member, 'The last owner cannot leave or be removed: make someone else owner first.');
  await em.removeAndFlush(member);
}
