// Finds lines on a build's other receipts by description or part number: a return is linked to what it returns.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { LineSearchResultDto } from '../../../shared/api/receipts';
import { minorUnits, toWire } from '../../../shared/money';
import type { Build } from '../builds/build.entity';
import { ReceiptLine } from './receipt-line.entity';

export async function searchLines(em: EntityManager, build: Build, query: string, excludeReceiptId?: string): Promise<LineSearchResultDto[]> {
  const like = `%${query.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  const lines = await em.find(
    ReceiptLine,
    {
      build,
      kind: { $in: ['part', 'core_charge'] },
      $or: [{ description: { $ilike: like } }, { partNumber: { $ilike: like } }],
      ...(excludeReceiptId ? { receipt: { $ne: excludeReceiptId } } : {}),
    },
    { populate: ['receipt.vendor'], orderBy: { receipt: { purchaseDate: 'desc' } }, limit: 20 },
  );
  return lines.map((line) => ({
    lineId: line.id,
    receiptId: line.receipt.id,
    vendorName: line.receipt.vendor?.name ?? null,
    purchaseDate: line.receipt.purchaseDate ?? null,
    description: line.description,
    partNumber: line.partNumber,
    amount: toWire(line.amount, minorUnits(build.currency)),
    kind: line.kind,
  }));
}
