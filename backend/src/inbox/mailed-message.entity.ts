// A mailed message a build accepted, by its Message-ID and a hash of its content, with the receipts it made: the same
// message twice (sent again, or forwarded twice) makes its receipts once. The unique indexes are in the migration.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';

export class MailedMessage {
  [OptionalProps]?: 'messageId' | 'receiptIds' | 'receivedAt';
  id: string = randomUUID();
  build!: Build;
  sender!: User;
  /** Empty when the message carried none. */
  messageId = '';
  /** sha-256 of what was read: the attachments' digests in order, or the body's text. */
  contentSha256!: string;
  receiptIds: string[] = [];
  receivedAt: Date = new Date();
}

export const MailedMessageSchema = new EntitySchema<MailedMessage>({
  class: MailedMessage,
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    sender: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    messageId: { type: 'string', length: 998, default: '' },
    contentSha256: { type: 'string', length: 64 },
    receiptIds: { type: 'json', default: '[]' },
    receivedAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
