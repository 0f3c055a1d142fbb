// Request schemas and response types for receipts, their lines, filing and core deposits.
import { z } from 'zod';
import { CORE_STATES, CoreState, PartStatus, RECEIPT_LINE_KINDS, ReceiptLineKind, ReceiptState, ReviewState } from '../enums';
import { moneyString } from '../money';
import type { Warranty } from '../warranty';
import { calendarDate } from './dates';
import { createPartRequest } from './parts';

const uuid = z.uuid({ error: 'Choose an existing item.' });
const version = z.number({ error: 'Send the version you last saw.' }).int().min(1);
const signedMoney = moneyString({ maxDecimals: 4, allowNegative: true });
const nullableMoney = z.union([signedMoney, z.null()]);

export const ACCEPTED_UPLOAD_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'application/pdf'] as const;
export const ACCEPTED_UPLOAD_LABEL = 'JPEG, PNG, WebP or HEIC photos, or PDF invoices';
export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;
export const MAX_UPLOAD_FILES = 10;
export const MAX_PDF_PAGES = 20;
/** A photo's pixel count (width × height) at most: 40 megapixels is past any phone camera, and bounds the memory a decode takes. */
export const MAX_UPLOAD_MEGAPIXELS = 40;

export const updateReceiptRequest = z
  .object({
    vendorName: z.string().trim().max(120, 'A shop name is at most 120 characters.').optional(),
    purchaseDate: z.union([calendarDate, z.null()]).optional(),
    receiptNumber: z.string().trim().max(80, 'A receipt number is at most 80 characters.').optional(),
    subtotal: nullableMoney.optional(),
    tax: nullableMoney.optional(),
    shipping: nullableMoney.optional(),
    discount: nullableMoney.optional(),
    total: nullableMoney.optional(),
    version,
  })
  .strict();
export type UpdateReceiptRequest = z.input<typeof updateReceiptRequest>;

const lineFields = {
  kind: z.enum(RECEIPT_LINE_KINDS, { error: `Choose a kind: ${RECEIPT_LINE_KINDS.join(', ')}.` }),
  description: z.string({ error: 'Describe the line.' }).trim().min(1, 'Describe the line.').max(300, 'A description is at most 300 characters.'),
  partNumber: z.string().trim().max(80, 'A part number is at most 80 characters.'),
  quantity: moneyString({ maxDecimals: 4, min: '0.0001' }),
  unitPrice: nullableMoney,
  amount: signedMoney,
  taxable: z.boolean({ error: 'Taxable is true or false.' }),
  partId: z.union([uuid, z.null()]),
  systemId: z.union([uuid, z.null()]),
  returnOfLineId: z.union([uuid, z.null()]),
};

export const createLineRequest = z
  .object({
    ...lineFields,
    partNumber: lineFields.partNumber.default(''),
    quantity: lineFields.quantity.prefault('1'),
    unitPrice: nullableMoney.default(null),
    taxable: lineFields.taxable.default(true),
    partId: lineFields.partId.default(null),
    systemId: lineFields.systemId.default(null),
    returnOfLineId: lineFields.returnOfLineId.default(null),
  })
  .strict();
export type CreateLineRequest = z.input<typeof createLineRequest>;

export const updateLineRequest = z
  .object({
    kind: lineFields.kind.optional(),
    description: lineFields.description.optional(),
    partNumber: lineFields.partNumber.optional(),
    quantity: lineFields.quantity.optional(),
    unitPrice: lineFields.unitPrice.optional(),
    amount: lineFields.amount.optional(),
    taxable: lineFields.taxable.optional(),
    partId: lineFields.partId.optional(),
    systemId: lineFields.systemId.optional(),
    returnOfLineId: lineFields.returnOfLineId.optional(),
    /** Creates a part on the bill of materials from this line and assigns the line to it. */
    newPart: createPartRequest.partial({ description: true, partNumber: true, quantity: true, unit: true, estimatedUnitCost: true }).optional(),
    version,
  })
  .strict();
export type UpdateLineRequest = z.input<typeof updateLineRequest>;

export const splitLineRequest = z.object({
  version,
  shares: z
    .array(z.object({ amount: signedMoney, systemId: z.union([uuid, z.null()]), partId: z.union([uuid, z.null()]).default(null), description: lineFields.description.optional() }))
    .min(2, 'Split into at least two shares.')
    .max(20, 'Split into at most 20 shares.'),
});
export type SplitLineRequest = z.input<typeof splitLineRequest>;

export const mergeLinesRequest = z.object({ lineIds: z.array(uuid).min(2, 'Choose at least two lines to merge.').max(50) });
export type MergeLinesRequest = z.input<typeof mergeLinesRequest>;

export const fileReceiptRequest = z
  .object({
    version,
    /** The owner accepts a difference from the printed total, with a reason. */
    acceptDifference: z.object({ reason: z.string().trim().min(3, 'Say why the difference is accepted.').max(500) }).optional(),
    /** Days until a core deposit is due back; 30 by default (common practice, not a rule). */
    coreDueDays: z.number().int().min(1).max(365).default(30),
  })
  .strict();
export type FileReceiptRequest = z.input<typeof fileReceiptRequest>;

export const updateCoreRequest = z.object({ state: z.enum(CORE_STATES, { error: `Choose: ${CORE_STATES.join(', ')}.` }).optional(), dueDate: calendarDate.optional(), version }).strict();
export type UpdateCoreRequest = z.input<typeof updateCoreRequest>;

export interface BoxDto {
  page: number;
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface ReceiptLineDto {
  id: string;
  position: number;
  kind: ReceiptLineKind;
  description: string;
  partNumber: string;
  quantity: string;
  unitPrice: string | null;
  amount: string;
  taxable: boolean;
  allocatedTax: string;
  allocatedShipping: string;
  allocatedDiscount: string;
  partId: string | null;
  partDescription: string | null;
  systemId: string | null;
  returnOfLineId: string | null;
  box: BoxDto | null;
  confidence: Record<string, number>;
  /** The warranty a purchase line's words name ("12 month warranty", "lifetime warranty"), or null. */
  warrantySuggestion: Warranty;
  version: number;
}

export interface ReconciliationDto {
  linesTotal: string;
  computedTotal: string;
  printedTotal: string | null;
  difference: string | null;
  reconciles: boolean;
}

export interface ReceiptSummaryDto {
  id: string;
  vendorName: string | null;
  purchaseDate: string | null;
  receiptNumber: string;
  total: string | null;
  state: ReceiptState;
  readingProgress: number;
  reviewState: ReviewState;
  originalFilename: string;
  contentType: string;
  lineCount: number;
  /** Other receipts of the build that look like this one (same document, or same shop, date and total). */
  duplicateOf: string[];
  systemIds: string[];
  uploadedBy: string;
  createdAt: string;
  version: number;
}

export interface ReceiptDto extends ReceiptSummaryDto {
  currency: string;
  locale: string;
  subtotal: string | null;
  tax: string | null;
  shipping: string | null;
  discount: string | null;
  differenceAccepted: boolean;
  differenceReason: string;
  readingError: string | null;
  reviewComment: string;
  pages: { index: number; width: number; height: number }[];
  /** Per field (vendor, date, total, tax ...) reading confidence from 0 to 1, and notes such as an ambiguous date. */
  fieldConfidence: Record<string, number>;
  readingNotes: string[];
  lines: ReceiptLineDto[];
  reconciliation: ReconciliationDto;
  /** True when the caller may still edit it (crew lose that once it is filed). */
  editable: boolean;
}

export interface CoreDto {
  id: string;
  state: CoreState;
  dueDate: string;
  /** The deposit as paid: the line with its share of tax and shipping, as the ledger counts it. */
  amount: string;
  /** The part the deposit is for when the line is assigned to one (the slip often just says "core charge"), else the line's text. */
  description: string;
  partNumber: string;
  receiptId: string;
  vendorName: string | null;
  purchaseDate: string | null;
  refundLineId: string | null;
  version: number;
}

export interface LineSearchResultDto {
  lineId: string;
  receiptId: string;
  vendorName: string | null;
  purchaseDate: string | null;
  description: string;
  partNumber: string;
  amount: string;
  kind: ReceiptLineKind;
}


/** A part line bought on a filed receipt, as the returns lists show it. */
export interface ReturnLineDto {
  lineId: string;
  receiptId: string;
  vendorName: string | null;
  purchaseDate: string;
  /** The part's description when the line is assigned to a part, else the line's. */
  description: string;
  partNumber: string;
  /** What the line cost: its amount with its share of tax and shipping, less its share of the discount. */
  amountPaid: string;
}

/** The part behind a line, with the version its status change must send. */
export interface ReturnPartDto {
  partId: string;
  partVersion: number;
  partStatus: PartStatus;
}

/**
 * Still on the shelf (or on order) with no return line yet. Listed until 14 days after the window closed, with
 * `windowClosed`, so a return that went back late is still in sight.
 */
export interface ReturnableItemDto extends ReturnLineDto, ReturnPartDto {
  /** The last day it can go back: purchase date + the build's return window (ISO date). */
  returnableUntil: string;
  windowClosed: boolean;
}

/** Sent back, with no filed return slip yet: `amountPaid` is owed back. */
export type AwaitingRefundItemDto = ReturnLineDto & ReturnPartDto;

/** A line with a filed return slip; the part may since have been removed from the bill of materials. */
export interface RefundedItemDto extends ReturnLineDto {
  partId: string | null;
  partVersion: number | null;
  partStatus: PartStatus | null;
  /** The latest return slip for it (several are added up in `refundedAmount`, a positive figure). */
  refundReceiptId: string;
  refundDate: string | null;
  refundedAmount: string;
}

export interface ReturnsDto {
  returnable: ReturnableItemDto[];
  awaitingRefund: AwaitingRefundItemDto[];
  refunded: RefundedItemDto[];
}
