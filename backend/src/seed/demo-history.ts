// The demo build's invented receipt history (July to November 2026): shops, slips, how each line is assigned, and
// what the partner said; printed figures are worked out here with the shared money module, like a till would.
import type { LineKind } from '../../../shared/api/receipt-reading';
import { Decimal, multiply, roundHalfUp, sum, toWire } from '../../../shared/money';
import type { SlipLayout, SlipReceipt } from './receipt-slip';

/** Invented shops; any likeness to a real business is accidental. */
export const DEMO_SHOPS = {
  larkmoor: { vendor: 'Larkmoor Auto Parts', address: ['418 Millrace Road, Eastmere', 'Tel 555-0142'], layout: 'counter', taxRate: '0.0725' },
  hollybrook: { vendor: 'Hollybrook Salvage Yard', address: ['Route 9, Lot 14, Hollybrook', 'Tel 555-0167'], layout: 'counter', taxRate: '0.0725' },
  quillfeather: { vendor: 'Quillfeather Performance', address: ['Unit 3, Larkspur Trading Estate', 'orders@quillfeather.example'], layout: 'shelf', taxRate: '0.0725' },
  wrenfield: { vendor: 'Wrenfield Wire & Terminal', address: ['22 Spindle Street, Portbury', 'shop@wrenfield.example'], layout: 'shelf', taxRate: null },
  pennant: { vendor: 'Pennant Radiator Works', address: ['7 Foundry Lane, Eastmere', 'Tel 555-0119'], layout: 'counter', taxRate: '0.0725' },
  marrowbone: { vendor: 'Marrowbone Hardware', address: ['1200 Orchard Parkway', 'Store 0417'], layout: 'shelf', taxRate: '0.0725' },
  tansy: { vendor: 'Tansy Lane Speed Shop', address: ['90 Tansy Lane, Eastmere', 'Tel 555-0183'], layout: 'counter', taxRate: '0.0725' },
} as const satisfies Record<string, { vendor: string; address: readonly string[]; layout: SlipLayout; taxRate: string | null }>;
export type ShopKey = keyof typeof DEMO_SHOPS;

/** Where the person checking the receipt puts a line: a part (by part number), a system, a line it gives back, or nowhere (a fee). */
export type LineTarget = { part: string } | { system: string } | { returnOf: { receipt: string; line: number } } | { spread: true };

export interface HistoryLine {
  kind?: LineKind;
  description: string;
  partNumber?: string;
  quantity?: string;
  /** Positive as printed per unit; the amount takes the kind's sign. */
  unitPrice: string;
  /** Core deposits are not taxed by these shops. */
  taxable?: boolean;
  to: LineTarget;
}

export interface HistoryReceipt {
  key: string;
  shop: ShopKey;
  date: string;
  receiptNumber: string;
  by: 'builder' | 'crew';
  layout?: SlipLayout;
  lines: HistoryLine[];
  shipping?: string;
  /** Left read but unchecked, for the "to check" list. */
  toCheck?: boolean;
  review?: { verdict: 'approved' | 'questioned'; comment?: string; reply?: string; on: string };
}

const CONSUMABLES = { system: 'Tools and consumables' };
const approved = (on: string) => ({ verdict: 'approved' as const, on });

/** In date order; the last few filed are not reviewed yet, so the partner's queue has work. */
export const DEMO_HISTORY: HistoryReceipt[] = [
  { key: 'degreaser', shop: 'marrowbone', date: '2026-07-06', receiptNumber: '40117', by: 'builder', review: approved('2026-07-12'), lines: [
    { description: 'Engine degreaser, 15 oz', partNumber: 'MB-DG15', quantity: '3', unitPrice: '6.79', to: CONSUMABLES },
    { description: 'Shop towels, 6 rolls', partNumber: 'MB-ST6', unitPrice: '11.49', to: CONSUMABLES },
  ] },
  { key: 'long-block', shop: 'hollybrook', date: '2026-07-11', receiptNumber: 'Y-2291', by: 'builder', review: approved('2026-07-12'), lines: [
    { description: 'Turbo 2.0 long block', partNumber: 'LB-20T-114', unitPrice: '2100.00', to: { part: 'LB-20T-114' } },
    { description: 'Hoist rental, 1 day', partNumber: 'RENT-H1', unitPrice: '45.00', to: CONSUMABLES },
  ] },
  { key: 'first-oil', shop: 'larkmoor', date: '2026-07-18', receiptNumber: '310442', by: 'crew', review: approved('2026-07-26'), lines: [
    { description: 'Oil 5W-30 synthetic qt', partNumber: 'OL-530', quantity: '6', unitPrice: '8.49', to: { part: 'OL-530' } },
    { description: 'Oil filter, long', partNumber: 'OF-118', unitPrice: '9.99', to: { part: 'OF-118' } },
  ] },
  { key: 'gearbox', shop: 'hollybrook', date: '2026-07-25', receiptNumber: 'Y-2364', by: 'builder', review: approved('2026-07-26'), lines: [
    { description: '5-speed gearbox, used', partNumber: 'GB-5S', unitPrice: '825.00', to: { part: 'GB-5S' } },
  ] },
  { key: 'gloves', shop: 'marrowbone', date: '2026-07-30', receiptNumber: '40388', by: 'crew', review: approved('2026-08-09'), lines: [
    { description: 'Nitrile gloves, box of 100', partNumber: 'MB-NG100', unitPrice: '12.99', to: CONSUMABLES },
    { description: 'Zip ties, 8 in, 100 pack', partNumber: 'MB-ZT8', unitPrice: '7.99', to: CONSUMABLES },
  ] },
  { key: 'harness', shop: 'quillfeather', date: '2026-08-05', receiptNumber: 'QF-18825', by: 'builder', shipping: '24.00', review: approved('2026-08-09'), lines: [
    { description: 'Standalone engine harness', partNumber: 'WH-200', unitPrice: '689.00', to: { part: 'WH-200' } },
    { description: 'Engine mount kit, swap', partNumber: 'KM-330', unitPrice: '189.00', to: { part: 'KM-330' } },
  ] },
  { key: 'alternator', shop: 'larkmoor', date: '2026-08-08', receiptNumber: '311907', by: 'builder', review: approved('2026-08-09'), lines: [
    { description: 'Alternator reman 90A', partNumber: 'ALT-90R', unitPrice: '165.00', to: { part: 'ALT-90R' } },
    { kind: 'core_charge', description: 'Core charge', partNumber: 'ALT-90R', unitPrice: '40.00', taxable: false, to: { part: 'ALT-90R' } },
  ] },
  { key: 'wire-order', shop: 'wrenfield', date: '2026-08-14', receiptNumber: 'WW-5530', by: 'builder', shipping: '9.50', review: approved('2026-08-23'), lines: [
    { description: '16 AWG XL wire red, ft', partNumber: 'W16-RD', quantity: '50', unitPrice: '0.2100', to: { part: 'W16-RD' } },
    { description: '16 AWG XL wire black, ft', partNumber: 'W16-BK', quantity: '50', unitPrice: '0.2100', to: { part: 'W16-BK' } },
    { description: 'Heat-shrink assortment', partNumber: 'HS-ASST', unitPrice: '19.95', to: { part: 'HS-ASST' } },
    { description: 'Open-barrel terminals 100', partNumber: 'TRM-OB100', unitPrice: '18.40', to: { part: 'TRM-OB100' } },
    { description: 'Open-barrel crimper', partNumber: 'CT-OB', unitPrice: '59.00', to: { part: 'CT-OB' } },
  ] },
  { key: 'fuel-order', shop: 'quillfeather', date: '2026-08-18', receiptNumber: 'QF-19102', by: 'builder', shipping: '14.00', review: approved('2026-08-23'), lines: [
    { description: 'In-tank fuel pump 255 L/h', partNumber: 'FP-255', unitPrice: '139.00', to: { part: 'FP-255' } },
    { description: 'Fuel pressure reg. -8 AN', partNumber: 'FPR-8AN', unitPrice: '89.00', to: { part: 'FPR-8AN' } },
    { description: 'Fuel filter, 10 micron', partNumber: 'FF-10', unitPrice: '34.00', to: { part: 'FF-10' } },
    { kind: 'fee', description: 'Hazmat handling fee', unitPrice: '6.00', to: { spread: true } },
  ] },
  { key: 'radiator', shop: 'pennant', date: '2026-08-22', receiptNumber: '7731', by: 'crew', review: approved('2026-08-23'), lines: [
    { description: 'Alloy radiator, 2-row', partNumber: 'RAD-2R', unitPrice: '265.00', to: { part: 'RAD-2R' } },
    { description: 'Hose clamp, stainless', partNumber: 'HC-32', quantity: '4', unitPrice: '2.49', to: { system: 'Cooling' } },
  ] },
  // The -8 AN regulator did not fit the -6 lines: sent back and refunded to the card.
  { key: 'regulator-return', shop: 'quillfeather', layout: 'return', date: '2026-08-29', receiptNumber: 'QF-R-0412', by: 'builder', review: approved('2026-09-06'), lines: [
    { kind: 'return', description: 'Fuel press. reg -8AN', partNumber: 'FPR-8AN', unitPrice: '89.00', to: { returnOf: { receipt: 'fuel-order', line: 1 } } },
  ] },
  // The old alternator went back: its deposit came off this purchase.
  { key: 'alternator-core-back', shop: 'larkmoor', date: '2026-08-31', receiptNumber: '312650', by: 'crew', review: approved('2026-09-06'), lines: [
    { description: 'Coolant 50/50, gal', partNumber: 'CL-5050', quantity: '2', unitPrice: '16.99', to: { part: 'CL-5050' } },
    { description: 'Brake fluid DOT 4, 1 L', partNumber: 'BF-D4', quantity: '2', unitPrice: '10.99', to: { part: 'BF-D4' } },
    { description: 'Front brake pads', partNumber: 'BP-F21', unitPrice: '61.99', to: { part: 'BP-F21' } },
    { kind: 'core_refund', description: 'Core refund', partNumber: 'ALT-90R', unitPrice: '40.00', taxable: false, to: { returnOf: { receipt: 'alternator', line: 1 } } },
  ] },
  { key: 'clutch', shop: 'larkmoor', date: '2026-09-02', receiptNumber: '312811', by: 'builder', review: approved('2026-09-06'), lines: [
    { description: 'Clutch kit, organic', partNumber: 'CK-228', unitPrice: '298.00', to: { part: 'CK-228' } },
    { description: 'Gear oil 75W-90 qt', partNumber: 'GO-7590', quantity: '3', unitPrice: '11.49', to: { part: 'GO-7590' } },
  ] },
  { key: 'regulator-6an', shop: 'quillfeather', date: '2026-09-06', receiptNumber: 'QF-19377', by: 'builder', shipping: '12.00', review: approved('2026-09-13'), lines: [
    { description: 'Fuel pressure reg. -6 AN', partNumber: 'FPR-6AN', unitPrice: '92.00', to: { part: 'FPR-6AN' } },
    { description: 'AN fittings assortment -6', partNumber: 'ANF-6', unitPrice: '42.00', to: { part: 'ANF-6' } },
    { description: 'Submersible fuel hose 3/8, ft', partNumber: 'FH-38S', quantity: '6', unitPrice: '6.49', to: { part: 'FH-38S' } },
  ] },
  { key: 'engine-computer', shop: 'quillfeather', date: '2026-09-14', receiptNumber: 'QF-19540', by: 'builder', review: approved('2026-09-20'), lines: [
    { description: 'Programmable ECU, 8 inj.', partNumber: 'EC-8X', unitPrice: '1149.00', to: { part: 'EC-8X' } },
  ] },
  { key: 'connectors', shop: 'wrenfield', date: '2026-09-19', receiptNumber: 'WW-5871', by: 'crew', shipping: '8.50', review: approved('2026-09-27'), lines: [
    { description: 'Weatherproof connector kit', partNumber: 'WPC-K', unitPrice: '54.00', to: { part: 'WPC-K' } },
    { description: 'Fuel pump relay + fuse kit', partNumber: 'FPR-K', unitPrice: '28.50', to: { part: 'FPR-K' } },
  ] },
  { key: 'shop-rags', shop: 'marrowbone', date: '2026-09-26', receiptNumber: '41902', by: 'crew', review: approved('2026-09-27'), lines: [
    { description: 'Brake parts cleaner', partNumber: 'MB-BC14', quantity: '4', unitPrice: '4.29', to: CONSUMABLES },
    { description: 'Dielectric grease, 3 oz', partNumber: 'MB-DE3', unitPrice: '6.49', to: { system: 'Wiring harness' } },
    { kind: 'discount', description: 'Loyalty discount', unitPrice: '2.00', to: { spread: true } },
  ] },
  { key: 'relay-box', shop: 'wrenfield', date: '2026-10-03', receiptNumber: 'WW-6104', by: 'builder', shipping: '9.50', review: approved('2026-10-11'), lines: [
    { description: 'Sealed relay/fuse box', partNumber: 'RB-6', unitPrice: '78.00', to: { part: 'RB-6' } },
    { description: '16 AWG XL wire red, ft', partNumber: 'W16-RD', quantity: '25', unitPrice: '0.2100', to: { part: 'W16-RD' } },
  ] },
  { key: 'gauges', shop: 'tansy', date: '2026-10-10', receiptNumber: '5520', by: 'builder', review: approved('2026-10-11'), lines: [
    { description: 'Boost gauge 52mm', partNumber: 'BG-52', unitPrice: '79.00', to: { part: 'BG-52' } },
    { description: 'Gauge pod 52mm', partNumber: 'GP-52', unitPrice: '38.00', to: { part: 'GP-52' } },
  ] },
  { key: 'timing-belt', shop: 'larkmoor', date: '2026-10-17', receiptNumber: '314077', by: 'crew', review: approved('2026-10-25'), lines: [
    { description: 'Timing belt kit', partNumber: 'TBK-20', unitPrice: '142.00', to: { part: 'TBK-20' } },
    { description: 'Turbo oil feed -4 AN', partNumber: 'TOF-4AN', unitPrice: '68.00', to: { part: 'TOF-4AN' } },
  ] },
  // Two slips, same shop, day and total: the list warns, and the partner asks.
  { key: 'fuse-kit-1', shop: 'larkmoor', date: '2026-10-24', receiptNumber: '314530', by: 'crew', review: approved('2026-10-25'), lines: [
    { description: 'Mini fuse & relay kit', partNumber: 'FRK-8', unitPrice: '24.99', to: { part: 'FRK-8' } },
  ] },
  { key: 'fuse-kit-2', shop: 'larkmoor', date: '2026-10-24', receiptNumber: '314541', by: 'crew', lines: [
    { description: 'Mini fuse & relay kit', partNumber: 'FRK-8', unitPrice: '24.99', to: { part: 'FRK-8' } },
  ], review: {
    verdict: 'questioned',
    on: '2026-10-25',
    comment: 'Two slips from Larkmoor on the same day for the same amount: bought twice, or one slip photographed twice?',
    reply: 'Bought twice: one kit is for the fan circuit, the other is the spare in the wire drawer.',
  } },
  { key: 'fan-harness', shop: 'wrenfield', date: '2026-10-28', receiptNumber: 'WW-6388', by: 'builder', shipping: '9.50', review: approved('2026-11-01'), lines: [
    { description: 'Fan sub-harness w/ relay', partNumber: 'FSH-2', unitPrice: '86.00', to: { part: 'FSH-2' } },
    { description: 'Open-barrel terminals 100', partNumber: 'TRM-OB100', unitPrice: '18.40', to: { part: 'TRM-OB100' } },
  ] },
  { key: 'brake-cleaner', shop: 'marrowbone', date: '2026-10-31', receiptNumber: '43015', by: 'crew', review: approved('2026-11-01'), lines: [
    { description: 'Brake parts cleaner', partNumber: 'MB-BC14', quantity: '2', unitPrice: '4.29', to: CONSUMABLES },
    { description: 'Nitrile gloves, box of 100', partNumber: 'MB-NG100', unitPrice: '12.99', to: CONSUMABLES },
  ] },
  // The old starter is still under the bench: its deposit is owed back within 30 days.
  { key: 'starter', shop: 'larkmoor', date: '2026-11-06', receiptNumber: '315262', by: 'builder', review: approved('2026-11-08'), lines: [
    { description: 'Starter motor reman', partNumber: 'STR-22R', unitPrice: '149.00', to: { part: 'STR-22R' } },
    { kind: 'core_charge', description: 'Core charge', partNumber: 'STR-22R', unitPrice: '30.00', taxable: false, to: { part: 'STR-22R' } },
  ] },
  { key: 'pressure-test', shop: 'pennant', date: '2026-11-07', receiptNumber: '8012', by: 'crew', lines: [
    { description: 'Pressure test, cooling', partNumber: 'SVC-PT', unitPrice: '35.00', to: { system: 'Cooling' } },
    { description: 'Radiator cap, 16 psi', partNumber: 'RC-16', unitPrice: '14.50', to: { system: 'Cooling' } },
  ], review: { verdict: 'questioned', on: '2026-11-08', comment: 'Was a pressure test needed? The radiator was new in August.' } },
  { key: 'extinguisher', shop: 'tansy', date: '2026-11-12', receiptNumber: '5791', by: 'builder', lines: [
    { description: 'Extinguisher 2.5 lb', partNumber: 'FE-25', unitPrice: '84.00', to: { part: 'FE-25' } },
  ] },
  { key: 'wideband', shop: 'quillfeather', date: '2026-11-14', receiptNumber: 'QF-20811', by: 'builder', shipping: '12.00', lines: [
    { description: 'Wideband O2 sensor kit', partNumber: 'WB-O2K', unitPrice: '199.00', to: { part: 'WB-O2K' } },
  ] },
  { key: 'ignition-harness', shop: 'wrenfield', date: '2026-11-18', receiptNumber: 'WW-6955', by: 'builder', shipping: '9.50', lines: [
    { description: 'Ignition sub-harness, COP', partNumber: 'IGH-4', unitPrice: '112.00', to: { part: 'IGH-4' } },
    { description: '16 AWG XL wire black, ft', partNumber: 'W16-BK', quantity: '25', unitPrice: '0.2100', to: { part: 'W16-BK' } },
  ] },
  { key: 'plugs', shop: 'larkmoor', date: '2026-11-21', receiptNumber: '316120', by: 'crew', lines: [
    { description: 'Spark plug, colder', partNumber: 'SP-C7', quantity: '4', unitPrice: '11.49', to: { part: 'SP-C7' } },
    { description: 'Oil 5W-30 synthetic qt', partNumber: 'OL-530', quantity: '5', unitPrice: '8.49', to: { part: 'OL-530' } },
  ] },
  { key: 'sealant', shop: 'marrowbone', date: '2026-11-25', receiptNumber: '44211', by: 'crew', lines: [
    { description: 'Thread sealant, 50 ml', partNumber: 'MB-TS50', unitPrice: '9.99', to: { system: 'Fuel' } },
    { description: 'Shop towels, 6 rolls', partNumber: 'MB-ST6', unitPrice: '11.49', to: CONSUMABLES },
  ] },
  // Read on the last Saturday and not checked yet.
  { key: 'brake-lines', shop: 'larkmoor', date: '2026-11-28', receiptNumber: '316588', by: 'crew', toCheck: true, lines: [
    { description: 'Brake line 3/16x60in', partNumber: 'BL-3160', quantity: '2', unitPrice: '9.79', to: { system: 'Brakes' } },
    { description: 'Flare nut assortment', partNumber: 'FN-316', unitPrice: '12.49', to: { system: 'Brakes' } },
  ] },
];

const NEGATIVE_KINDS: readonly LineKind[] = ['return', 'core_refund', 'discount'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

export interface WorkedLine extends HistoryLine {
  kind: LineKind;
  quantity: string;
  amount: Decimal;
  taxable: boolean;
}

export interface WorkedReceipt {
  history: HistoryReceipt;
  lines: WorkedLine[];
  subtotal: Decimal;
  tax: Decimal | null;
  shipping: Decimal | null;
  total: Decimal;
  slip: SlipReceipt;
}

/** What the till prints: amounts, tax on the taxable lines at the shop's rate (half up, to the cent), the total. */
export function workReceipt(history: HistoryReceipt): WorkedReceipt {
  const shop = DEMO_SHOPS[history.shop];
  const lines: WorkedLine[] = history.lines.map((line) => {
    const kind = line.kind ?? 'part';
    const quantity = line.quantity ?? '1';
    const magnitude = roundHalfUp(multiply(new Decimal(line.unitPrice), new Decimal(quantity)), 2);
    const taxable = line.taxable ?? true;
    return { ...line, kind, quantity, taxable, amount: NEGATIVE_KINDS.includes(kind) ? magnitude.negated() : magnitude };
  });
  const subtotal = sum(lines.map((line) => line.amount));
  const tax = shop.taxRate === null ? null : roundHalfUp(sum(lines.filter((line) => line.taxable).map((line) => line.amount)).times(shop.taxRate), 2);
  const shipping = history.shipping === undefined ? null : new Decimal(history.shipping);
  const total = sum([subtotal, tax ?? new Decimal(0), shipping ?? new Decimal(0)]);
  const layout = history.layout ?? (lines.some((line) => line.kind === 'core_charge' || line.kind === 'core_refund') ? 'core' : shop.layout);
  // A counter slip prints 22 characters of a description; what it prints is what the reader finds.
  const cut = lines.find((line) => layout !== 'shelf' && line.description.length > 22);
  if (cut) throw new Error(`"${cut.description}" does not fit on a counter slip (22 characters).`);
  const [year, month, day] = history.date.split('-');
  const slip: SlipReceipt = {
    id: history.key,
    layout,
    locale: 'en-US',
    vendor: shop.vendor,
    address: shop.address,
    date: history.date,
    printedDate: shop.layout === 'shelf' ? `${MONTHS[Number(month) - 1]} ${Number(day)}, ${year}` : `${month}/${day}/${year}`,
    currency: 'USD',
    mark: '$',
    lines: lines.map((line) => ({
      kind: line.kind,
      description: line.description,
      partNumber: line.partNumber ?? null,
      quantity: line.quantity,
      unitPrice: NEGATIVE_KINDS.includes(line.kind) ? `-${line.unitPrice}` : line.unitPrice,
      amount: toWire(line.amount, 2),
    })),
    subtotal: toWire(subtotal, 2),
    tax: tax === null ? null : toWire(tax, 2),
    taxLabel: shop.layout === 'shelf' ? 'Sales Tax 7.25%' : 'SALES TAX 7.25%',
    shipping: shipping === null ? null : toWire(shipping, 2),
    discount: null,
    total: toWire(total, 2),
    receiptNumber: history.receiptNumber,
  };
  return { history, lines, subtotal, tax, shipping, total, slip };
}
