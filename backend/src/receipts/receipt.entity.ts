// A receipt or invoice: the stored document, what reading found, the printed figures, filing and review.
import { EntitySchema, OptionalProps } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { RECEIPT_STATES, REVIEW_STATES, type ReceiptState, type ReviewState } from '../../../shared/enums';
import type { Decimal } from '../../../shared/money';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { DecimalType } from '../db/decimal-type';
import { Vendor } from './vendor.entity';

export interface StoredPage {
  key: string;
  width: number;
  height: number;
}

export class Receipt {
  [OptionalProps]?:
    | 'vendor' | 'purchaseDate' | 'receiptNumber' | 'pages' | 'pageImages' | 'state' | 'readingProgress' | 'readingError'
    | 'extractedText' | 'reading' | 'subtotal' | 'tax' | 'shipping' | 'discount' | 'total' | 'differenceAccepted'
    | 'differenceReason' | 'reviewState' | 'reviewComment' | 'reviewedBy' | 'reviewedAt' | 'filedAt' | 'filedBy' | 'version'
    | 'createdAt' | 'updatedAt';
  id: string = randomUUID();
  build!: Build;
  vendor: Vendor | null = null;
  purchaseDate: string | null = null;
  receiptNumber = '';
  originalFilename!: string;
  documentKey!: string;
  contentType!: string;
  sha256!: string;
  size!: number;
  pages = 1;
  /** Normalised page images the reading ran on; word boxes refer to their pixels. */
  pageImages: StoredPage[] = [];
  state: ReceiptState = 'queued';
  readingProgress = 0;
  readingError: string | null = null;
  extractedText = '';
  /** The whole reading result (fields, confidences, words), kept for the check screen. */
  reading: Record<string, unknown> | null = null;
  subtotal: Decimal | null = null;
  tax: Decimal | null = null;
  shipping: Decimal | null = null;
  discount: Decimal | null = null;
  total: Decimal | null = null;
  differenceAccepted = false;
  differenceReason = '';
  uploadedBy!: User;
  reviewState: ReviewState = 'none';
  reviewComment = '';
  reviewedBy: User | null = null;
  reviewedAt: Date | null = null;
  filedAt: Date | null = null;
  filedBy: User | null = null;
  version = 1;
  createdAt: Date = new Date();
  updatedAt: Date = new Date();
}

export const ReceiptSchema = new EntitySchema<Receipt>({
  class: Receipt,
  indexes: [
    { properties: ['build', 'state'] },
    { properties: ['build', 'sha256'] },
    { properties: ['build', 'purchaseDate'] },
  ],
  properties: {
    id: { type: 'uuid', primary: true },
    build: { kind: 'm:1', entity: () => Build, deleteRule: 'cascade' },
    vendor: { kind: 'm:1', entity: () => Vendor, nullable: true, deleteRule: 'set null' },
    purchaseDate: { type: 'date', nullable: true },
    receiptNumber: { type: 'string', length: 80, default: '' },
    originalFilename: { type: 'string', length: 255 },
    documentKey: { type: 'string', length: 400 },
    contentType: { type: 'string', length: 80 },
    sha256: { type: 'string', length: 64 },
    size: { type: 'integer' },
    pages: { type: 'integer', default: 1 },
    pageImages: { type: 'json', default: '[]' },
    state: { enum: true, items: () => [...RECEIPT_STATES], default: 'queued' },
    readingProgress: { type: 'integer', default: 0 },
    readingError: { type: 'text', nullable: true },
    extractedText: { type: 'text', default: '' },
    reading: { type: 'json', nullable: true, lazy: true },
    subtotal: { type: DecimalType, nullable: true },
    tax: { type: DecimalType, nullable: true },
    shipping: { type: DecimalType, nullable: true },
    discount: { type: DecimalType, nullable: true },
    total: { type: DecimalType, nullable: true },
    differenceAccepted: { type: 'boolean', default: false },
    differenceReason: { type: 'text', default: '' },
    uploadedBy: { kind: 'm:1', entity: () => User, deleteRule: 'restrict' },
    reviewState: { enum: true, items: () => [...REVIEW_STATES], default: 'none' },
    reviewComment: { type: 'text', default: '' },
    reviewedBy: { kind: 'm:1', entity: () => User, nullable: true, deleteRule: 'set null' },
    reviewedAt: { type: 'datetime', nullable: true },
    filedAt: { type: 'datetime', nullable: true },
    filedBy: { kind: 'm:1', entity: () => User, nullable: true, deleteRule: 'set null' },
    version: { type: 'integer', version: true },
    createdAt: { type: 'datetime', defaultRaw: 'now()' },
    updatedAt: { type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() },
  },
});
