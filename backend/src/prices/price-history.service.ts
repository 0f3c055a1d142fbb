// Every price a build has paid for an item: purchase lines of its filed receipts, matched by the shared item key.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { PriceHistoryItemDto, PriceHistoryQuery, PriceHistoryResponse, PricePaidDto, PricePointDto } from '../../../shared/api/price-history';
import { minorUnits, storedToWire, toWire } from '../../../shared/money';
import { itemKey, lineUnitPrice, lowestOf } from '../../../shared/price-history';
import type { Build } from '../builds/build.entity';

interface PriceRow {
  receipt_id: string;
  vendor: string | null;
  purchase_date: string | null;
  part_number: string;
  description: string;
  quantity: string;
  unit_price: string | null;
  amount: string;
}

interface Gathered {
  partNumber: string;
  description: string;
  prices: PricePaidDto[];
  receipts: Set<string>;
}

function point(price: PricePaidDto): PricePointDto {
  return { receiptId: price.receiptId, vendor: price.vendor, purchaseDate: price.purchaseDate, unitPrice: price.unitPrice };
}

export async function priceHistory(em: EntityManager, build: Build, query: PriceHistoryQuery): Promise<PriceHistoryResponse> {
  const places = minorUnits(build.currency);
  // Keys are made in code with the rule the client uses, so the server and the check screen never match differently.
  const rows = await em.execute<PriceRow[]>(
    `select l.receipt_id, v.name as vendor, to_char(r.purchase_date, 'YYYY-MM-DD') as purchase_date,
            l.part_number, l.description, l.quantity, l.unit_price, l.amount
       from receipt_line l
       join receipt r on r.id = l.receipt_id and r.state = 'filed'
       left join vendor v on v.id = r.vendor_id
      where l.build_id = ? and l.kind = 'part'
      order by r.purchase_date nulls first, r.created_at, r.id, l.position`,
    [build.id],
  );
  const byKey = new Map<string, Gathered>();
  for (const row of rows) {
    const unitPrice = lineUnitPrice({ unitPrice: row.unit_price, amount: row.amount, quantity: row.quantity }, build.currency);
    if (unitPrice === null) continue;
    const key = itemKey(row.part_number, row.description);
    const gathered = byKey.get(key) ?? { partNumber: '', description: '', prices: [], receipts: new Set<string>() };
    gathered.partNumber = row.part_number;
    gathered.description = row.description;
    gathered.prices.push({
      receiptId: row.receipt_id,
      vendor: row.vendor,
      purchaseDate: row.purchase_date,
      unitPrice: toWire(unitPrice, places),
      quantity: storedToWire(row.quantity),
    });
    gathered.receipts.add(row.receipt_id);
    byKey.set(key, gathered);
  }
  const items: PriceHistoryItemDto[] = [];
  for (const [key, gathered] of byKey) {
    if (gathered.receipts.size < query.minReceipts) continue;
    const lowest = lowestOf(gathered.prices)!;
    const last = gathered.prices[gathered.prices.length - 1];
    items.push({ key, partNumber: gathered.partNumber, description: gathered.description, prices: gathered.prices, lowest: point(lowest), last: point(last) });
  }
  items.sort((a, b) => a.description.localeCompare(b.description) || a.key.localeCompare(b.key));
  return { currency: build.currency, items };
}
