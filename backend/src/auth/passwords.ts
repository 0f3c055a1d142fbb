// Password hashing with argon2id, and one-time tokens whose hash alone is stored.
import { hash, verify } from '@node-rs/argon2';
import { createHash, randomBytes } from 'node:crypto';

// OWASP Password Storage Cheat Sheet: argon2id, m=19 MiB, t=2, p=1 as the minimum configuration.
const options = { algorithm: 2 /* Algorithm.Argon2id, a const enum isolatedModules cannot read */, memoryCost: 19456, timeCost: 2, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** A hash computed once, so an unknown e-mail costs as long as a wrong password. */
let dummyHash: Promise<string> | undefined;
export function burnVerifyTime(password: string): Promise<boolean> {
  dummyHash ??= hashPassword('not-a-real-password-0000');
  return dummyHash.then((h) => verifyPassword(h, password));
}

export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
