// A mailed message that did not become a receipt, kept with the reason (never silently dropped). A message to an
// address no build has keeps no build: only the server's operators see it.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { MAIL_REFUSAL_REASONS, type MailRefusalReason } from '../../../shared/api/inbox';
import { Build } from '../builds/build.entity';

export class MailRefusal {
  [OptionalProps]?: 'build' | 'messageId' | 'receivedAt';
  id: string = randomUUID();
  build: Build | null = null;
  fromAddress!: string;
  recipient!: string;
  subject!: string;
  messageId = '';
  reason!: MailRefusalReason;
  detail!: string;
  receivedAt: Date = new Date();
}

export const MailRefusalSchema = new EntitySchema<MailRefusal>({
  class: MailRefusal,
  indexes: [{ properties: ['build', 'receivedAt'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, nullable: true, deleteRule: 'cascade' },
    fromAddress: { type: 'string', length: 254 },
    recipient: { type: 'string', length: 254 },
    subject: { type: 'string', length: 300 },
    messageId: { type: 'string', length: 998, default: '' },
    reason: { enum: true, items: () => [...MAIL_REFUSAL_REASONS] },
    detail: { type: 'text' },
    receivedAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
