// A ZIP for an accountant: the tax ledger, the build sheet and every receipt document, streamed as it is built.
import type { EntityManager } from '@mikro-orm/postgresql';
import archiver from 'archiver';
import type { Writable } from 'node:stream';
import type { Build } from '../builds/build.entity';
import { Receipt } from '../receipts/receipt.entity';
import type { ObjectStore } from '../storage/object-store';
import { buildSheetCsv } from './build-sheet';
import { taxLedgerCsv } from './tax-ledger';

function safeName(text: string): string {
  return text.replace(/[^\w.-]+/g, '_').slice(0, 80) || 'receipt';
}

export async function writeArchive(em: EntityManager, store: ObjectStore, build: Build, out: Writable): Promise<void> {
  const zip = archiver('zip', { zlib: { level: 6 } });
  const done = new Promise<void>((resolve, reject) => {
    out.on('finish', resolve);
    zip.on('error', reject);
  });
  zip.pipe(out);
  zip.append(taxLedgerCsv(em.fork(), build, {}), { name: 'tax-ledger.csv' });
  zip.append(await buildSheetCsv(em.fork(), build, {}), { name: 'build-sheet.csv' });
  const receipts = await em.find(Receipt, { build }, { populate: ['vendor'], orderBy: { purchaseDate: 'asc', createdAt: 'asc' } });
  for (const receipt of receipts) {
    const object = await store.stream(receipt.documentKey);
    const extension = receipt.documentKey.split('.').pop();
    const name = `receipts/${receipt.purchaseDate ?? 'undated'}_${safeName(receipt.vendor?.name ?? 'unknown-shop')}_${receipt.id.slice(0, 8)}.${extension}`;
    zip.append(object.body, { name });
  }
  await zip.finalize();
  await done;
}
