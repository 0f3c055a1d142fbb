// Accounts: sign-up and password reset by an e-mailed one-time link.
import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { ResetConfirmRequest, SignUpRequest, UserDto } from '../../../shared/api/auth';
import type { AppConfig } from '../config';
import { Conflict, ValidationFailed } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/templates';
import { hashPassword, hashToken, newToken } from './passwords';
import { PasswordReset } from './password-reset.entity';
import { User } from './user.entity';

const RESET_LIFETIME_MS = 60 * 60 * 1000;

export function userDto(user: User): UserDto {
  return { id: user.id, email: user.email, displayName: user.displayName };
}

const accountExists = () =>
  new Conflict('An account with this e-mail already exists. Sign in instead, or reset the password.', {
    email: 'An account with this e-mail already exists.',
  });

export async function createAccount(em: EntityManager, input: Omit<SignUpRequest, 'inviteToken'>): Promise<User> {
  const email = input.email.toLowerCase();
  // Hashed first, so a known address costs as long as a new one.
  const passwordHash = await hashPassword(input.password);
  if (await em.count(User, { email })) throw accountExists();
  const user = em.create(User, { email, displayName: input.displayName, passwordHash });
  try {
    await em.flush();
  } catch (error) {
    // Two sign-ups for one address at the same moment: the unique index decides, the loser hears the same answer.
    if (error instanceof UniqueConstraintViolationException) throw accountExists();
    throw error;
  }
  return user;
}

/** Sends a reset link when the account exists; runs after the answer, which says nothing either way. */
export async function requestPasswordReset(em: EntityManager, mailer: Mailer, config: AppConfig, email: string): Promise<void> {
  const { token, tokenHash } = newToken();
  const user = await em.findOne(User, { email: email.toLowerCase() });
  if (!user) return;
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
