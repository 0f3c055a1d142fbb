// Who changed money, when, and what it was before and after: an append-only trail per build.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';

export class AuditEvent {
  [OptionalProps]?: 'receiptId' | 'before' | 'after' | 'createdAt';
  id: string = randomUUID();
  build!: Build;
  user!: User;
  /** The receipt the change belongs to, so its trail shows on the receipt. */
  receiptId: string | null = null;
  entity!: string;
  entityId!: string;
  action!: string;
  before: Record<string, unknown> | null = null;
  after: Record<string, unknown> | null = null;
  createdAt: Date = new Date();
}

export const AuditEventSchema = new EntitySchema<AuditEvent>({
  class: AuditEvent,
  indexes: [{ properties: ['build', 'createdAt'] }, { properties: ['receiptId'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    user: { kind: 'm:1', entity: () => User, deleteRule: 'restrict' },
    receiptId: { type: 'uuid', nullable: true },
    entity: { type: 'string', length: 40 },
    entityId: { type: 'uuid' },
    action: { type: 'string', length: 40 },
    before: { type: 'json', nullable: true },
    after: { type: 'json', nullable: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
