// Response types of the ledger: budget against money spent, per system and for the whole build; its spend over time,
// by vendor, and the query of the lines behind any figure.
import { z } from 'zod';
import type { SystemFigures } from '../build-figures';
import type { ReceiptLineKind } from '../enums';

/** The overrun factor is only trusted once this many bought parts have both an estimate and a cost (common practice, our choice). */
export const OVERRUN_MIN_SAMPLE = 5;

/** A system's or the whole build's figures: named and defined once in shared/build-figures.ts. */
export type LedgerFigures = SystemFigures;

export interface LedgerSystemDto extends LedgerFigures {
  systemId: string;
  name: string;
  safetyCaution: boolean;
}

export interface LedgerDto {
  currency: string;
  systems: LedgerSystemDto[];
  /** The same figures for the whole build: the systems add up to it to the cent. */
  total: LedgerFigures;
  /** Kept apart from the systems' budgets. */
  contingencyBudget: string;
  /** The systems' budget plus the contingency. */
  budgetWithContingency: string;
  /** Actual over estimate for parts already bought, as a decimal string; "1" until enough parts are bought. */
  overrunFactor: string;
  /** How many bought parts with an estimate the factor is based on. */
  overrunSample: number;
}


/** The ledger figures that are sums of receipt lines: each can list the lines behind it. */
export const LEDGER_LINE_FIGURES = ['netCost', 'spent', 'coreDepositsOutstanding', 'returnsAwaitingRefund'] as const;
export type LedgerLineFigure = (typeof LEDGER_LINE_FIGURES)[number];

export const SPEND_PERIODS = ['month', 'week'] as const;
export type SpendPeriod = (typeof SPEND_PERIODS)[number];

/** A month as 2026-07, an ISO 8601 week as 2026-W27. */
export const MONTH_PATTERN = /^\d{4}-(0[1-9]|1[0-2])$/;
export const WEEK_PATTERN = /^\d{4}-W(0[1-9]|[1-4]\d|5[0-3])$/;

const uuid = z.uuid({ error: 'Choose an existing item.' });

export const spendQuery = z.object({
  by: z.enum(SPEND_PERIODS, { error: 'Use month or week.' }).default('month'),
});

export const ledgerLinesQuery = z.object({
  figure: z.enum(LEDGER_LINE_FIGURES, { error: 'Use one of netCost, spent, coreDepositsOutstanding, returnsAwaitingRefund.' }),
  systemId: uuid.optional(),
  /** A vendor's id, or "none" for receipts with no shop named. */
  vendorId: z
    .string()
    .refine((value) => value === 'none' || z.uuid().safeParse(value).success, 'Choose an existing shop, or none.')
    .optional(),
  period: z
    .string()
    .refine((value) => MONTH_PATTERN.test(value) || WEEK_PATTERN.test(value), 'Use a month like 2026-07 or a week like 2026-W27.')
    .optional(),
});
export type LedgerLinesQuery = z.infer<typeof ledgerLinesQuery>;

/** Money of one period (a month 2026-07 or an ISO week 2026-W27), purchases counted by their receipt's date. */
export interface SpendPeriodDto {
  period: string;
  spent: string;
  netCost: string;
}

export interface SpendResponse {
  currency: string;
  by: SpendPeriod;
  /** In order; periods with nothing bought between the first and the last are included with zero figures. */
  periods: SpendPeriodDto[];
}

export interface VendorSpendDto {
  /** Null for receipts with no shop named. */
  vendorId: string | null;
  vendor: string | null;
  receipts: number;
  spent: string;
  netCost: string;
}

export interface VendorsResponse {
  currency: string;
  /** Largest net cost first. */
  vendors: VendorSpendDto[];
}

/** One receipt line counted in a figure, with its share of the receipt's charges. */
export interface LedgerLineDto {
  lineId: string;
  receiptId: string;
  purchaseDate: string;
  vendorId: string | null;
  vendor: string | null;
  description: string;
  kind: ReceiptLineKind;
  systemId: string;
  system: string;
  amount: string;
  allocatedTax: string;
  allocatedShipping: string;
  allocatedDiscount: string;
  /** Amount + tax + shipping - discount: what the line adds to the figure. */
  lineTotal: string;
}

export interface LedgerLinesResponse {
  currency: string;
  figure: LedgerLineFigure;
  lines: LedgerLineDto[];
  /** The sum of every line's total: equal to the figure it explains. */
  total: string;
}
