// A car system of one build (engine, cooling, fuel ...) with its budget; archived systems keep their history.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Decimal } from '../../../shared/money';
import { Build } from '../builds/build.entity';
import { DecimalType } from '../db/decimal-type';

export class VehicleSystem {
  [OptionalProps]?: 'budget' | 'sortOrder' | 'archivedAt' | 'version' | 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  build!: Build;
  name!: string;
  budget: Decimal = new Decimal(0);
  sortOrder = 0;
  archivedAt: Date | null = null;
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const VehicleSystemSchema = new EntitySchema<VehicleSystem>({
  class: VehicleSystem,
  indexes: [{ properties: ['build', 'sortOrder'] }],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    name: { type: 'string', length: 80 },
    budget: { type: DecimalType, default: '0' },
    sortOrder: { type: 'integer', default: 0 },
    archivedAt: { type: 'datetime', nullable: true },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
