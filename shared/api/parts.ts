// Request schemas and response types for systems, budgets, parts and the parts import.
import { z } from 'zod';
import { PART_STATUSES, PartStatus } from '../enums';
import { moneyString } from '../money';
import { UNITS, Unit } from '../units';
import { MAX_WARRANTY_MONTHS, type Warranty } from '../warranty';
import { calendarDate } from './dates';

const uuid = z.uuid({ error: 'Choose an existing item.' });
const version = z.number({ error: 'Send the version you last saw.' }).int().min(1);
/** Budgets are amounts a person pays: whole minor units are checked against the build's currency by the server. */
const budget = moneyString({ maxDecimals: 4 });

export const createSystemRequest = z.object({
  name: z.string({ error: 'Name the system.' }).trim().min(1, 'Name the system.').max(80, 'A system name is at most 80 characters.'),
  budget: budget.optional(),
});
export type CreateSystemRequest = z.input<typeof createSystemRequest>;

export const updateSystemRequest = z
  .object({
    name: createSystemRequest.shape.name.optional(),
    budget: budget.optional(),
    sortOrder: z.number({ error: 'The position is a whole number.' }).int().min(0).max(10_000).optional(),
    archived: z.boolean({ error: 'Archived is true or false.' }).optional(),
    version,
  })
  .strict();
export type UpdateSystemRequest = z.input<typeof updateSystemRequest>;

export const updateContingencyRequest = z.object({ contingencyBudget: budget, version }).strict();
export type UpdateContingencyRequest = z.input<typeof updateContingencyRequest>;

export interface SystemDto {
  id: string;
  name: string;
  budget: string;
  /** Sum of the estimated totals of the system's parts. */
  estimate: string;
  partCount: number;
  sortOrder: number;
  archived: boolean;
  safetyCaution: boolean;
  version: number;
}

export interface SystemsResponse {
  currency: string;
  systems: SystemDto[];
  contingencyBudget: string;
  /** The ledger's figures of the same names (shared/build-figures.ts): the systems' budgets plus the contingency. */
  budgetWithContingency: string;
  /** Every part on the bill of materials at its estimate, as the ledger counts it. */
  planned: string;
  buildVersion: number;
}

const quantity = moneyString({ maxDecimals: 4, min: '0.0001' });
const optionalText = (max: number, label: string) => z.string().trim().max(max, `${label} is at most ${max} characters.`);

const partFields = {
  systemId: uuid,
  description: z.string({ error: 'Describe the part.' }).trim().min(1, 'Describe the part.').max(200, 'A description is at most 200 characters.'),
  partNumber: optionalText(80, 'A part number').default(''),
  quantity: quantity,
  unit: z.enum(UNITS, { error: `Choose a unit: ${UNITS.join(', ')}.` }),
  estimatedUnitCost: moneyString({ maxDecimals: 4 }),
  status: z.enum(PART_STATUSES, { error: `Choose a status: ${PART_STATUSES.join(', ')}.` }).default('planned'),
  storageLocation: optionalText(120, 'A storage location').default(''),
  sourceUrl: z.union([z.literal(''), z.url({ error: 'Enter a full link starting with http:// or https://.', protocol: /^https?$/ })]).default(''),
  notes: optionalText(2000, 'Notes').default(''),
  forSale: z.boolean({ error: 'For sale is true or false.' }).default(false),
  askingPrice: z.union([moneyString({ maxDecimals: 4 }), z.null()]).default(null),
};

export const createPartRequest = z.object(partFields).strict();
export type CreatePartRequest = z.input<typeof createPartRequest>;

const warrantyLength = `Enter the warranty as whole months, from 1 to ${MAX_WARRANTY_MONTHS}, or "lifetime"; null removes it.`;
/** Set on an existing part: null for the length removes the warranty with its start and receipt. */
const warrantyFields = {
  warranty: z
    .union([z.literal('lifetime'), z.number({ error: warrantyLength }).int(warrantyLength).min(1, warrantyLength).max(MAX_WARRANTY_MONTHS, warrantyLength), z.null()], {
      error: warrantyLength,
    })
    .optional(),
  warrantyStart: z.union([calendarDate, z.null()], { error: 'Use a date like 2026-11-14, or null to start on the receipt\'s date.' }).optional(),
  warrantyReceiptId: z.union([uuid, z.null()], { error: 'Choose a receipt of this build, or null for none.' }).optional(),
};

export const updatePartRequest = z
  .object({
    systemId: partFields.systemId.optional(),
    description: partFields.description.optional(),
    partNumber: optionalText(80, 'A part number').optional(),
    quantity: quantity.optional(),
    unit: partFields.unit.optional(),
    estimatedUnitCost: partFields.estimatedUnitCost.optional(),
    status: z.enum(PART_STATUSES, { error: `Choose a status: ${PART_STATUSES.join(', ')}.` }).optional(),
    storageLocation: optionalText(120, 'A storage location').optional(),
    sourceUrl: partFields.sourceUrl.optional(),
    notes: optionalText(2000, 'Notes').optional(),
    forSale: z.boolean({ error: 'For sale is true or false.' }).optional(),
    askingPrice: z.union([moneyString({ maxDecimals: 4 }), z.null()]).optional(),
    ...warrantyFields,
    version,
  })
  .strict();
export type UpdatePartRequest = z.input<typeof updatePartRequest>;

export const bulkPartsRequest = z.discriminatedUnion(
  'action',
  [
    z.object({ action: z.literal('move'), partIds: z.array(uuid).min(1, 'Choose at least one part.').max(1000), systemId: uuid }),
    z.object({
      action: z.literal('status'),
      partIds: z.array(uuid).min(1, 'Choose at least one part.').max(1000),
      status: z.enum(PART_STATUSES, { error: `Choose a status: ${PART_STATUSES.join(', ')}.` }),
    }),
  ],
  { error: 'Choose an action: move or status.' },
);
export type BulkPartsRequest = z.input<typeof bulkPartsRequest>;

export interface PartDto {
  id: string;
  systemId: string;
  description: string;
  partNumber: string;
  quantity: string;
  unit: Unit;
  estimatedUnitCost: string;
  /** Quantity times unit cost, rounded half up to the currency's minor units. */
  estimatedTotal: string;
  status: PartStatus;
  storageLocation: string;
  sourceUrl: string;
  notes: string;
  forSale: boolean;
  askingPrice: string | null;
  /** Whole months, 'lifetime', or null for none. */
  warranty: Warranty;
  warrantyStart: string | null;
  /** The last day under warranty (start + months, month ends clamped); null for lifetime or none. */
  warrantyEnds: string | null;
  /** The receipt the warranty rests on, to show at the counter. */
  warrantyReceiptId: string | null;
  version: number;
  updatedAt: string;
}

export interface PartsResponse {
  parts: PartDto[];
}

/** One CSV row as the import read it: the part it would create, or why it cannot. */
export interface ImportRowDto {
  /** 1-based line number in the file, counting the header as line 1. */
  line: number;
  ok: boolean;
  errors: Record<string, string>;
  part: { systemName: string; description: string; partNumber: string; quantity: string; unit: string; estimatedUnitCost: string; estimatedTotal: string | null };
}

export interface ImportPreviewDto {
  rows: ImportRowDto[];
  accepted: number;
  rejected: number;
}

export interface ImportResultDto {
  imported: number;
  dropped: number;
}

/** The CSV columns the import reads; headers match case-insensitively, spaces or underscores alike. */
export const IMPORT_COLUMNS = ['system', 'description', 'part number', 'quantity', 'unit', 'estimated unit cost', 'status', 'storage location', 'source link', 'notes'] as const;
