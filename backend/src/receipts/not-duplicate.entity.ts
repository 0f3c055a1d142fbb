// Two receipts someone has looked at and said are not the same purchase (a second identical order, a reprint kept on
// purpose): the pair is stored once, whichever way round it was marked, so the duplicate warning leaves both.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { Receipt } from './receipt.entity';

export class NotDuplicate {
  [OptionalProps]?: 'createdAt';
  id: string = randomUUID();
  build!: Build;
  /** The pair in id order (first < second), so (a, b) and (b, a) meet the same unique index. */
  first!: Receipt;
  second!: Receipt;
  markedBy!: User;
  reason!: string;
  createdAt: Date = new Date();
}

export const NotDuplicateSchema = new EntitySchema<NotDuplicate>({
  class: NotDuplicate,
  uniques: [{ properties: ['first', 'second'] }],
  checks: [{ name: 'not_duplicate_pair_in_order', expression: 'first_id < second_id' }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    first: { kind: 'm:1', entity: () => Receipt, deleteRule: 'cascade' },
    second: { kind: 'm:1', entity: () => Receipt, deleteRule: 'cascade', index: true },
    markedBy: { kind: 'm:1', entity: () => User, deleteRule: 'cascade' },
    reason: { type: 'text' },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
  },
});
