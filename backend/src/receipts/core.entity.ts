// A core deposit paid on a rebuildable part: owed until the old unit goes back, then refunded or forfeited.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { CORE_STATES, type CoreState } from '../../../shared/enums';
import { Build } from '../builds/build.entity';
import { ReceiptLine } from './receipt-line.entity';

export class Core {
  [OptionalProps]?: 'state' | 'refundLine' | 'version' | 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  build!: Build;
  chargeLine!: ReceiptLine;
  state: CoreState = 'owed';
  dueDate!: string;
  refundLine: ReceiptLine | null = null;
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const CoreSchema = new EntitySchema<Core>({
  class: Core,
  indexes: [{ properties: ['build', 'state'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    chargeLine: { kind: '1:1', entity: () => ReceiptLine, owner: true, deleteRule: 'cascade', unique: true },
    state: { enum: true, items: () => [...CORE_STATES], default: 'owed' },
    dueDate: { type: 'date' },
    refundLine: { kind: 'm:1', entity: () => ReceiptLine, nullable: true, deleteRule: 'set null' },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
