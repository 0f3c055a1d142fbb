// Crew: members of a build, invites by e-mail with a role, role changes and removal; a build keeps an owner.
import { LockMode } from '@mikro-orm/core';
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
import { Conflict, Forbidden, NotFound } from '../http/errors';
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

/** With `lock`, the invite's row is held until the transaction ends, so two people cannot both use it. */
async function openInvite(em: EntityManager, token: string, lock = false): Promise<Invite> {
  const invite = await em.findOne(
    Invite,
    { tokenHash: hashToken(token), withdrawnAt: null, expiresAt: { $gt: new Date() } },
    { populate: ['build', 'invitedBy'], ...(lock ? { lockMode: LockMode.PESSIMISTIC_WRITE, lockTableAliases: ['i0'], refresh: true } : {}) },
  );
  if (!invite || invite.build.archivedAt) throw new NotFound('That invite');
  if (invite.acceptedAt) throw new Conflict('This invite link was already used. Ask the owner of the build for a new one.');
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

/** The address an open invite was mailed to (404 or 409 as the preview answers for a bad or used link). */
export async function invitedAddress(em: EntityManager, token: string): Promise<string> {
  return (await openInvite(em, token)).email;
}

/** The invite is the capability: whoever holds the link joins with its role, once (the row lock makes it once). */
export async function acceptInvite(em: EntityManager, user: User, token: string): Promise<Build> {
  return em.transactional(async (tx) => {
    const invite = await openInvite(tx, token, true);
    const already = await tx.findOne(Membership, { build: invite.build, user });
    if (!already) tx.create(Membership, { build: invite.build, user, role: invite.role });
    invite.acceptedAt = new Date();
    invite.acceptedBy = user;
    await tx.flush();
    return invite.build;
  });
}

export async function withdrawInvite(em: EntityManager, build: Build, inviteId: string): Promise<void> {
  const invite = await em.findOne(Invite, { id: inviteId, build, acceptedAt: null, withdrawnAt: null });
  if (!invite) throw new NotFound('That invite');
  invite.withdrawnAt = new Date();
  await em.flush();
}

async function memberOf(em: EntityManager, build: Build, userId: string): Promise<Membership> {
  const member = await em.findOne(Membership, { build, user: userId }, { populate: ['user'], refresh: true });
  if (!member) throw new NotFound('That member');
  return member;
}

/**
 * Role changes and removals of one build run one at a time: the build's row is locked, then the caller's role is
 * read again, so two owners demoting each other at once cannot leave the build without one.
 */
async function lockedForCrewChange<T>(em: EntityManager, build: Build, callerId: string, change: (tx: EntityManager, callerRole: BuildRole) => Promise<T>): Promise<T> {
  return em.transactional(async (tx) => {
    await tx.execute('select id from build where id = ? for update', [build.id]);
    const [caller] = await tx.execute<{ role: BuildRole }[]>('select role from membership where build_id = ? and user_id = ?', [build.id, callerId]);
    if (!caller) throw new NotFound('That build');
    return change(tx, caller.role);
  });
}

async function ensureAnotherOwner(em: EntityManager, build: Build, member: Membership, message: string) {
  if (member.role !== 'owner') return;
  const owners = await em.count(Membership, { build, role: 'owner' });
  if (owners <= 1) throw new Conflict(message);
}

export async function changeRole(em: EntityManager, build: Build, callerId: string, userId: string, role: BuildRole): Promise<MemberDto> {
  return lockedForCrewChange(em, build, callerId, async (tx, callerRole) => {
    if (callerRole !== 'owner') throw new Forbidden();
    const member = await memberOf(tx, build, userId);
    if (role !== 'owner') await ensureAnotherOwner(tx, build, member, 'A build needs an owner: make someone else owner first.');
    member.role = role;
    await tx.flush();
    return memberDto(member);
  });
}

/** The owner removes anyone; any member may remove themself (leave the build). */
export async function removeMember(em: EntityManager, build: Build, callerId: string, userId: string): Promise<void> {
  await lockedForCrewChange(em, build, callerId, async (tx, callerRole) => {
    if (userId !== callerId && callerRole !== 'owner') throw new Forbidden();
    const member = await memberOf(tx, build, userId);
    await ensureAnotherOwner(tx, build, member, 'The last owner cannot leave or be removed: make someone else owner first.');
    await tx.removeAndFlush(member);
  });
}
