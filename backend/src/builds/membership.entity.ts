// A person's role on one build; the role decides what every route of that build lets them do.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { BUILD_ROLES, type BuildRole } from '../../../shared/enums';
import { User } from '../auth/user.entity';
import { Build } from './build.entity';

export class Membership {
  [OptionalProps]?: 'createdAt';
  id: string = randomUUID();
  build!: Build;
  user!: User;
  role!: BuildRole;
  createdAt: Date = new Date();
}

export const MembershipSchema = new EntitySchema<Membership>({
  class: Membership,
  uniques: [{ properties: ['build', 'user'] }],
  indexes: [{ name: 'membership_user_id_index', properties: ['user'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    user: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    role: { enum: true, items: () => [...BUILD_ROLES] },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
