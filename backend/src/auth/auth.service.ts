// Accounts: sign-up and password reset, each finished by an e-mailed one-time link.
import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { ResetConfirmRequest, SignUpRequest, UserDto } from '../../../shared/api/auth';
import type { AppConfig } from '../config';
import { Conflict, ValidationFailed } from '../http/errors';
import { acceptInvite, invitedAddress } from '../crew/crew.service';
import { afterCommit } from '../http/request-transaction';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail, signUpKnownAddressMail, signUpLinkMail } from '../mail/templates';
import { mayMailAccount } from './account-mail-cap';
import { hashPassword, hashToken, newToken } from './passwords';
import { PasswordReset } from './password-reset.entity';
import { PendingSignUp } from './pending-sign-up.entity';
import { User } from './user.entity';

const RESET_LIFETIME_MS = 60 * 60 * 1000;
const SIGN_UP_LIFETIME_MS = 24 * 60 * 60 * 1000;

type NewAccount = Omit<SignUpRequest, 'inviteToken'>;

export function userDto(user: User): UserDto {
  return { id: user.id, email: user.email, displayName: user.displayName };
}

const accountExists = () =>
  new Conflict('An account with this e-mail already exists. Sign in instead, or reset the password.', {
    email: 'An account with this e-mail already exists.',
  });

/**
 * Sign-up with an invite makes the account at once and joins the build, but only for the address the invite was mailed
 * to: whoever holds the invite reads that mailbox, so "this address has an account" (409) tells them nothing new.
 * Another address is refused, naming the field; it signs up without the invite.
 */
export async function createInvitedAccount(em: EntityManager, input: NewAccount, inviteToken: string): Promise<{ user: User; buildId: string }> {
  return em.transactional(async (tx) => {
    const email = input.email.toLowerCase();
    const invited = await invitedAddress(tx, inviteToken);
    if (invited !== email) {
      throw new ValidationFailed({ email: `This invite was sent to ${invited}. Create the account with that address, or ask the build's owner to invite this one.` });
    }
    const user = await insertAccount(tx, { email, displayName: input.displayName, passwordHash: await hashPassword(input.password) });
    return { user, buildId: (await acceptInvite(tx, user, inviteToken)).id };
  });
}

async function insertAccount(em: EntityManager, account: Pick<User, 'email' | 'displayName' | 'passwordHash'>): Promise<User> {
  if (await em.count(User, { email: account.email })) throw accountExists();
  const user = em.create(User, account);
  try {
    await em.flush();
  } catch (error) {
    // Two sign-ups for one address at the same moment: the unique index decides, the loser hears the same answer.
    if (error instanceof UniqueConstraintViolationException) throw accountExists();
    throw error;
  }
  return user;
}

/**
 * Sign-up without an invite. The password is hashed before the answer whatever the address, so the answer takes as
 * long for a known address as for a new one; the address is looked up only after the answer (as a reset request is):
 * a new one is kept pending and mailed its link, a known one is told that someone tried, and nothing changes.
 */
export async function startSignUp(em: EntityManager, mailer: Mailer, config: AppConfig, input: NewAccount): Promise<void> {
  const pending = { email: input.email.toLowerCase(), displayName: input.displayName, passwordHash: await hashPassword(input.password) };
  await afterCommit(em, () => mailSignUp(em.fork(), mailer, config, pending));
}

async function mailSignUp(em: EntityManager, mailer: Mailer, config: AppConfig, pending: Pick<PendingSignUp, 'email' | 'displayName' | 'passwordHash'>): Promise<void> {
  if (await em.count(User, { email: pending.email })) {
    if (!(await mayMailAccount(em, pending.email, 'sign-up-known-address'))) return;
    await mailer.send(signUpKnownAddressMail({ to: pending.email, signInLink: `${config.appUrl}/sign-in`, resetLink: `${config.appUrl}/reset-password` }));
    return;
  }
  if (!(await mayMailAccount(em, pending.email, 'sign-up-link'))) return;
  const { token, tokenHash } = newToken();
  // Expired sign-ups (everyone's) go here, and hourly when nobody signs up (auth/forget-expired.job.ts): unconfirmed
  // password hashes are not kept past their link's day.
  await em.nativeDelete(PendingSignUp, { expiresAt: { $lte: new Date() } });
  em.create(PendingSignUp, { ...pending, tokenHash, expiresAt: new Date(Date.now() + SIGN_UP_LIFETIME_MS) });
  await em.flush();
  await mailer.send(signUpLinkMail({ to: pending.email, displayName: pending.displayName, link: `${config.appUrl}/sign-up/confirm/${token}` }));
}

const signUpLinkRefused = () =>
  new ValidationFailed({ token: 'This sign-up link has expired or was already used. Sign up again for a new one.' }, 'This sign-up link has expired or was already used.');

/**
 * Makes the account of a pending sign-up, once; every pending sign-up of the address is deleted with it (their
 * password hashes too), so another link for the same address is then refused like a used one. All of the address's
 * pending rows are locked in one order first: links of one address opened at once run one after the other (locking
 * only the link's own row would let two of them deadlock, each waiting for the other's new account or rows).
 */
export async function confirmSignUp(em: EntityManager, token: string): Promise<User> {
  return em.transactional(async (tx) => {
    const found = await tx.findOne(PendingSignUp, { tokenHash: hashToken(token), expiresAt: { $gt: new Date() } });
    if (!found) throw signUpLinkRefused();
    const locked = await tx.execute<{ id: string }[]>('select id from pending_sign_up where email = ? order by id for update', [found.email]);
    if (!locked.some((row) => row.id === found.id)) throw signUpLinkRefused();
    const user = await insertAccount(tx, { email: found.email, displayName: found.displayName, passwordHash: found.passwordHash });
    await tx.nativeDelete(PendingSignUp, { email: found.email });
    return user;
  });
}

/** Sends a reset link when the account exists; runs after the answer, which says nothing either way. */
export async function requestPasswordReset(em: EntityManager, mailer: Mailer, config: AppConfig, email: string): Promise<void> {
  const { token, tokenHash } = newToken();
  const user = await em.findOne(User, { email: email.toLowerCase() });
  if (!user) return;
  if (!(await mayMailAccount(em, user.email, 'password-reset'))) return;
  em.create(PasswordReset, { user, tokenHash, expiresAt: new Date(Date.now() + RESET_LIFETIME_MS) });
  await em.flush();
  await mailer.send(passwordResetMail({ to: user.email, link: `${config.appUrl}/reset-password/${token}` }));
}

export async function confirmPasswordReset(em: EntityManager, input: ResetConfirmRequest): Promise<User> {
  return em.transactional(async (tx) => {
    const reset = await tx.findOne(
      PasswordReset,
      { tokenHash: hashToken(input.token), usedAt: null, expiresAt: { $gt: new Date() } },
      { populate: ['user'], lockMode: LockMode.PESSIMISTIC_WRITE },
    );
    if (!reset) throw new ValidationFailed({ token: 'This reset link has expired or was already used. Ask for a new one.' }, 'This reset link has expired or was already used.');
    reset.usedAt = new Date();
    reset.user.passwordHash = await hashPassword(input.password);
    await tx.flush();
    // Sign the account out everywhere: sessions opened with the old password end.
    await tx.execute(`delete from "session" where sess -> 'passport' ->> 'user' = ?`, [reset.user.id]);
    return reset.user;
  });
}
