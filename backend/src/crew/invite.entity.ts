// An invitation to join a build with a role; only the token's hash is stored.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { INVITABLE_ROLES, type InvitableRole } from '../../../shared/enums';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';

export class Invite {
  [OptionalProps]?: 'createdAt' | 'acceptedAt' | 'acceptedBy' | 'withdrawnAt';
  id: string = randomUUID();
  build!: Build;
  email!: string;
  role!: InvitableRole;
  tokenHash!: string;
  invitedBy!: User;
  expiresAt!: Date;
  acceptedAt: Date | null = null;
  acceptedBy: User | null = null;
  withdrawnAt: Date | null = null;
  createdAt: Date = new Date();
}

export const InviteSchema = new EntitySchema<Invite>({
  class: Invite,
  indexes: [{ name: 'invite_build_id_index', properties: ['build'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    email: { type: 'string', length: 254 },
    role: { enum: true, items: () => [...INVITABLE_ROLES] },
    tokenHash: { type: 'string', length: 64, unique: true },
    invitedBy: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    expiresAt: { type: 'datetime' },
    acceptedAt: { type: 'datetime', nullable: true },
    acceptedBy: { kind: 'm:1', entity: () => User, nullable: true, deleteRule: 'set null' },
    withdrawnAt: { type: 'datetime', nullable: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
