// Records a money change in the audit trail: who, when, what it was before and after.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { User } from '../auth/user.entity';
import type { Build } from '../builds/build.entity';
import { AuditEvent } from './audit-event.entity';

export function recordAudit(
  em: EntityManager,
  input: { build: Build; user: User; entity: string; entityId: string; action: string; receiptId?: string | null; before?: object | null; after?: object | null },
): void {
  em.create(AuditEvent, {
    build: input.build,
    user: input.user,
    entity: input.entity,
    entityId: input.entityId,
    action: input.action,
    receiptId: input.receiptId ?? null,
    before: (input.before ?? null) as Record<string, unknown> | null,
    after: (input.after ?? null) as Record<string, unknown> | null,
  });
}
