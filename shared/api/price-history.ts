// The price history of a build: every price paid for an item seen on more than one filed receipt, by shop and date.
import { z } from 'zod';

/** One price paid: a purchase line of a filed receipt. Unit prices in the currency's minor units, as strings. */
export interface PricePaidDto {
  receiptId: string;
  vendor: string | null;
  /** YYYY-MM-DD, or null for a receipt without a date. */
  purchaseDate: string | null;
  unitPrice: string;
  quantity: string;
}

export type PricePointDto = Pick<PricePaidDto, 'receiptId' | 'vendor' | 'purchaseDate' | 'unitPrice'>;

export interface PriceHistoryItemDto {
  /** shared/price-history.ts `itemKey`: how lines are matched to one item. */
  key: string;
  /** As printed on the item's latest line. */
  partNumber: string;
  description: string;
  /** In date order, oldest first. */
  prices: PricePaidDto[];
  /** The lowest price (the earliest of equal ones). */
  lowest: PricePointDto;
  /** The latest price. */
  last: PricePointDto;
}

export interface PriceHistoryResponse {
  currency: string;
  items: PriceHistoryItemDto[];
}

/**
 * How many filed receipts an item must be seen on to be listed: 2 by default (a history), 1 for the check screen,
 * which compares a receipt not yet filed with every price paid before.
 */
export const priceHistoryQuery = z.object({
  minReceipts: z.enum(['1', '2'], { error: 'Use 1 or 2.' }).default('2').transform(Number),
});
export type PriceHistoryQuery = z.infer<typeof priceHistoryQuery>;
