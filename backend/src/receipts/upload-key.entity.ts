// A client-made Idempotency-Key of one upload, per build and person: the content it came with and the receipts it made,
// so a repeat of the same capture answers those receipts instead of making new ones.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';

export class UploadKey {
  [OptionalProps]?: 'receiptIds' | 'createdAt';
  id: string = randomUUID();
  build!: Build;
  user!: User;
  /** The header's value as sent (a client-made id). */
  key!: string;
  /** sha-256 over the uploaded files' own sha-256 digests, in order: a repeat must carry the same bytes. */
  contentSha256!: string;
  receiptIds: string[] = [];
  createdAt: Date = new Date();
}

export const UploadKeySchema = new EntitySchema<UploadKey>({
  class: UploadKey,
  uniques: [{ name: 'upload_key_build_user_key_unique', properties: ['build', 'user', 'key'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    user: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    key: { type: 'string', length: 255 },
    contentSha256: { type: 'string', length: 64 },
    receiptIds: { type: 'json', default: '[]' },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
