// A bill-of-materials line: a part a system needs, its estimate, and where it is from planned to fitted.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { PART_STATUSES, type PartStatus } from '../../../shared/enums';
import type { Decimal } from '../../../shared/money';
import { UNITS, type Unit } from '../../../shared/units';
import { Build } from '../builds/build.entity';
import { DecimalType } from '../db/decimal-type';
import { Receipt } from '../receipts/receipt.entity';
import { partNumberKeySql } from '../../../shared/part-number-key';
import { VehicleSystem } from '../systems/vehicle-system.entity';

export class Part {
  [OptionalProps]?: 'partNumber' | 'status' | 'storageLocation' | 'sourceUrl' | 'notes' | 'forSale' | 'askingPrice' | 'warrantyMonths' | 'warrantyLifetime' | 'warrantyStart' | 'warrantyReceipt' | 'version' | 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  build!: Build;
  system!: VehicleSystem;
  description!: string;
  partNumber = '';
  quantity!: Decimal;
  unit!: Unit;
  estimatedUnitCost!: Decimal;
  status: PartStatus = 'planned';
  storageLocation = '';
  sourceUrl = '';
  notes = '';
  forSale = false;
  askingPrice: Decimal | null = null;
  /** A warranty is a length in whole months or lifetime, never both (check constraints in the migration). */
  warrantyMonths: number | null = null;
  warrantyLifetime = false;
  warrantyStart: string | null = null;
  warrantyReceipt: Receipt | null = null;
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const PartSchema = new EntitySchema<Part>({
  class: Part,
  indexes: [
    { properties: ['build', 'system'] },
    { properties: ['build', 'status'] },
    // For line suggestions (backend/src/suggestions): a name like a line's description, a part number in compared form.
    { name: 'part_description_trgm', expression: 'create index "part_description_trgm" on "part" using gin ("description" gin_trgm_ops)' },
    { name: 'part_part_number_key', expression: `create index "part_part_number_key" on "part" ("build_id", (${partNumberKeySql('"part_number"')}))` },
  ],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    system: { kind: 'm:1', entity: () => VehicleSystem, deleteRule: 'restrict' },
    description: { type: 'string', length: 200 },
    partNumber: { type: 'string', length: 80, default: '' },
    quantity: { type: DecimalType },
    unit: { enum: true, items: () => [...UNITS] },
    estimatedUnitCost: { type: DecimalType },
    status: { enum: true, items: () => [...PART_STATUSES], default: 'planned' },
    storageLocation: { type: 'string', length: 120, default: '' },
    sourceUrl: { type: 'string', length: 2000, default: '' },
    notes: { type: 'text', default: '' },
    forSale: { type: 'boolean', default: false },
    askingPrice: { type: DecimalType, nullable: true },
    warrantyMonths: { type: 'integer', nullable: true },
    warrantyLifetime: { type: 'boolean', default: false },
    warrantyStart: { type: 'date', nullable: true },
    warrantyReceipt: { kind: 'm:1', entity: () => Receipt, nullable: true, deleteRule: 'set null' },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
