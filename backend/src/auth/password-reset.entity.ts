// A one-time password reset: only the token's hash is kept; it expires and is used once.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from './user.entity';

export class PasswordReset {
  [OptionalProps]?: 'createdAt' | 'usedAt';
  id: string = randomUUID();
  user!: User;
  tokenHash!: string;
  expiresAt!: Date;
  usedAt: Date | null = null;
  createdAt: Date = new Date();
}

export const PasswordResetSchema = new EntitySchema<PasswordReset>({
  class: PasswordReset,
  properties: {
    id: { type: 'uuid', primary: true },
    user: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    tokenHash: { type: 'string', length: 64, unique: true },
    expiresAt: { type: 'datetime' },
    usedAt: { type: 'datetime', nullable: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
