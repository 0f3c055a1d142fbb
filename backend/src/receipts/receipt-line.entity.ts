// One line of a receipt, assigned to a part or a system, with its share of the receipt's tax, shipping and discount.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { RECEIPT_LINE_KINDS, type ReceiptLineKind } from '../../../shared/enums';
import { Decimal } from '../../../shared/money';
import { Build } from '../builds/build.entity';
import { DecimalType } from '../db/decimal-type';
import { Part } from '../parts/part.entity';
import { partNumberKeySql } from '../../../shared/part-number-key';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { Receipt } from './receipt.entity';

export interface LineBox {
  page: number;
  x: number;
  y: number;
  w: number;
  h: number;
}

export class ReceiptLine {
  [OptionalProps]?:
    | 'position' | 'partNumber' | 'quantity' | 'unitPrice' | 'taxable' | 'allocatedTax' | 'allocatedShipping' | 'allocatedDiscount'
    | 'part' | 'system' | 'returnOf' | 'box' | 'confidence' | 'version' | 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  build!: Build;
  receipt!: Receipt;
  position = 0;
  kind!: ReceiptLineKind;
  description!: string;
  partNumber = '';
  quantity: Decimal = new Decimal(1);
  unitPrice: Decimal | null = null;
  /** Signed: purchases and core deposits positive, returns, core refunds and discounts negative. */
  amount!: Decimal;
  taxable = true;
  allocatedTax: Decimal = new Decimal(0);
  allocatedShipping: Decimal = new Decimal(0);
  allocatedDiscount: Decimal = new Decimal(0);
  part: Part | null = null;
  system: VehicleSystem | null = null;
  returnOf: ReceiptLine | null = null;
  box: LineBox | null = null;
  /** Reading confidence per field (0 to 1); empty for lines a person typed. */
  confidence: Record<string, number> = {};
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const ReceiptLineSchema = new EntitySchema<ReceiptLine>({
  class: ReceiptLine,
  indexes: [
    { properties: ['receipt', 'position'] },
    { properties: ['build', 'system'] },
    { properties: ['build', 'part'] },
    // For line suggestions (backend/src/suggestions): earlier lines by description and by part number in compared form.
    { name: 'receipt_line_description_trgm', expression: 'create index "receipt_line_description_trgm" on "receipt_line" using gin ("description" gin_trgm_ops)' },
    { name: 'receipt_line_part_number_key', expression: `create index "receipt_line_part_number_key" on "receipt_line" ("build_id", (${partNumberKeySql('"part_number"')}))` },
  ],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    receipt: { kind: 'm:1', entity: () => Receipt, deleteRule: 'cascade' },
    position: { type: 'integer', default: 0 },
    kind: { enum: true, items: () => [...RECEIPT_LINE_KINDS] },
    description: { type: 'string', length: 300 },
    partNumber: { type: 'string', length: 80, default: '' },
    quantity: { type: DecimalType, default: '1' },
    unitPrice: { type: DecimalType, nullable: true },
    amount: { type: DecimalType },
    taxable: { type: 'boolean', default: true },
    allocatedTax: { type: DecimalType, default: '0' },
    allocatedShipping: { type: DecimalType, default: '0' },
    allocatedDiscount: { type: DecimalType, default: '0' },
    part: { kind: 'm:1', entity: () => Part, nullable: true, deleteRule: 'set null' },
    system: { kind: 'm:1', entity: () => VehicleSystem, nullable: true, deleteRule: 'set null' },
    returnOf: { kind: 'm:1', entity: () => ReceiptLine, nullable: true, deleteRule: 'set null' },
    box: { type: 'json', nullable: true },
    confidence: { type: 'json', default: '{}' },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
