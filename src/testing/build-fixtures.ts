// Test fixtures: whole DTOs of one invented build, so a field added to a DTO is added here once, not in every spec.
import type { BuildDto } from '../../shared/api/builds';
import type { PartDto, SystemDto, SystemsResponse } from '../../shared/api/parts';
import type { CoreDto, ReceiptDto, ReceiptLineDto, ReceiptSummaryDto } from '../../shared/api/receipts';
import type { BuildRole } from '../../shared/enums';
import type { PriceHistoryItemDto, PricePaidDto } from '../../shared/api/price-history';
import { lowestOf } from '../../shared/price-history';

/** Build b-1 as its API answers it to a member with `role`. */
export function testBuild(role: BuildRole, overrides: Partial<BuildDto> = {}): BuildDto {
  return {
    id: 'b-1',
    name: 'Teal wagon swap',
    vehicle: '1979 invented wagon',
    currency: 'USD',
    locale: 'en-US',
    status: 'active',
    startedOn: null,
    targetDate: null,
    returnWindowDays: 30,
    archived: false,
    version: 2,
    role,
    createdAt: '2026-01-05T09:00:00.000Z',
    ...overrides,
  };
}

/** A system with no budget, no parts and no caution unless the overrides say so. */
export function testSystem(id: string, name: string, overrides: Partial<SystemDto> = {}): SystemDto {
  return { id, name, budget: '0.00', estimate: '0.00', partCount: 0, sortOrder: 0, archived: false, safetyCaution: false, version: 1, ...overrides };
}

/** GET /systems with these systems and, unless overridden, no budgets or estimates. */
export function testSystemsResponse(systems: SystemDto[], overrides: Partial<SystemsResponse> = {}): SystemsResponse {
  return { currency: 'USD', systems, contingencyBudget: '0', budgetWithContingency: '0', planned: '0', buildVersion: 2, ...overrides };
}

/** A planned part of the bill of materials: two brake pads at 64.50, 129.00 in all. */
export function testPart(id: string, overrides: Partial<PartDto> = {}): PartDto {
  return {
    id,
    systemId: 's-brakes',
    description: 'Ceramic brake pads, front axle',
    partNumber: 'BP-2231',
    quantity: '2',
    unit: 'each',
    estimatedUnitCost: '64.50',
    estimatedTotal: '129.00',
    status: 'planned',
    storageLocation: '',
    sourceUrl: '',
    notes: '',
    forSale: false,
    askingPrice: null,
    warranty: null,
    warrantyStart: null,
    warrantyEnds: null,
    warrantyReceiptId: null,
    version: 1,
    updatedAt: '2026-03-02T10:00:00.000Z',
    ...overrides,
  };
}

/** A purchase line of one piece at `amount`, read from a box near the top of page 0. */
export function testLine(id: string, position: number, description: string, amount: string, systemId: string | null, overrides: Partial<ReceiptLineDto> = {}): ReceiptLineDto {
  return {
    id,
    position,
    kind: 'part',
    description,
    partNumber: '',
    quantity: '1',
    unitPrice: amount,
    amount,
    taxable: true,
    allocatedTax: '0.00',
    allocatedShipping: '0.00',
    allocatedDiscount: '0.00',
    partId: null,
    partDescription: null,
    systemId,
    returnOfLineId: null,
    box: { page: 0, x: 10, y: 200, w: 300, h: 20 },
    confidence: {},
    warrantySuggestion: null,
    version: 1,
    ...overrides,
  };
}

/** A receipt as the list shows it: read, waiting to be checked. */
export function testReceiptSummary(id: string, overrides: Partial<ReceiptSummaryDto> = {}): ReceiptSummaryDto {
  return {
    id,
    vendorName: 'Ridgeback Parts',
    purchaseDate: '2026-02-14',
    receiptNumber: 'A-100',
    total: '42.00',
    state: 'to_check',
    readingProgress: 100,
    reviewState: 'none',
    originalFilename: 'slip.png',
    contentType: 'image/png',
    lineCount: 0,
    duplicateOf: [],
    systemIds: [],
    uploadedBy: 'Dario Fenn',
    createdAt: '2026-02-14T10:00:00.000Z',
    version: 1,
    ...overrides,
  };
}

/** A whole receipt whose figures reconcile: 40.00 of lines + 2.00 tax = the printed 42.00 (lines left to the spec). */
export function testReceipt(id: string, overrides: Partial<ReceiptDto> = {}): ReceiptDto {
  return {
    ...testReceiptSummary(id),
    currency: 'USD',
    locale: 'en-US',
    subtotal: null,
    tax: '2.00',
    shipping: null,
    discount: null,
    differenceAccepted: false,
    differenceReason: '',
    readingError: null,
    reviewComment: '',
    pages: [],
    fieldConfidence: {},
    readingNotes: [],
    lines: [],
    reconciliation: { linesTotal: '40.00', computedTotal: '42.00', printedTotal: '42.00', difference: '0.00', reconciles: true },
    editable: false,
    ...overrides,
  };
}

/** A core deposit still owed on an alternator. */
export function testCore(id: string, overrides: Partial<CoreDto> = {}): CoreDto {
  return {
    id,
    state: 'owed',
    dueDate: '2026-03-01',
    amount: '40.00',
    description: 'Alternator core',
    partNumber: 'ALT-9',
    receiptId: 'r-1',
    vendorName: 'Ridgeback Parts',
    purchaseDate: '2026-01-30',
    refundLineId: null,
    version: 1,
    ...overrides,
  };
}

/** A price paid on a receipt, one item unless the quantity says otherwise. */
export function testPricePaid(receiptId: string, vendor: string | null, purchaseDate: string, unitPrice: string, quantity = '1'): PricePaidDto {
  return { receiptId, vendor, purchaseDate, unitPrice, quantity };
}

/** An item of the price history with its prices (in date order); the lowest and the last worked out from them. */
export function testPriceItem(key: string, description: string, prices: PricePaidDto[], partNumber = ''): PriceHistoryItemDto {
  const point = ({ receiptId, vendor, purchaseDate, unitPrice }: PricePaidDto) => ({ receiptId, vendor, purchaseDate, unitPrice });
  return { key, partNumber, description, prices, lowest: point(lowestOf(prices)!), last: point(prices[prices.length - 1]) };
}
