// A sign-up waiting for its e-mailed link: the account is made only when the link comes back, so the answer to
// sign-up never says whether the address already has one. Only the token's hash is kept; it expires after a day.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

export class PendingSignUp {
  [OptionalProps]?: 'createdAt';
  id: string = randomUUID();
  email!: string;
  displayName!: string;
  passwordHash!: string;
  tokenHash!: string;
  expiresAt!: Date;
  createdAt: Date = new Date();
}

export const PendingSignUpSchema = new EntitySchema<PendingSignUp>({
  class: PendingSignUp,
  indexes: [{ name: 'pending_sign_up_email_index', properties: ['email'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    email: { type: 'string', length: 254 },
    displayName: { type: 'string', length: 80 },
    passwordHash: { type: 'text', hidden: true },
    tokenHash: { type: 'string', length: 64, unique: true },
    expiresAt: { type: 'datetime' },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
