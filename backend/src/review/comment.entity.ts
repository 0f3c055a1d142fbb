// A comment on a receipt, by any member: the thread where a reviewer's question gets its answer.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { Receipt } from '../receipts/receipt.entity';

export class Comment {
  [OptionalProps]?: 'createdAt';
  id: string = randomUUID();
  build!: Build;
  receipt!: Receipt;
  author!: User;
  body!: string;
  createdAt: Date = new Date();
}

export const CommentSchema = new EntitySchema<Comment>({
  class: Comment,
  indexes: [{ properties: ['receipt', 'createdAt'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    receipt: { kind: 'm:1', entity: () => Receipt, deleteRule: 'cascade' },
    author: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    body: { type: 'text' },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
