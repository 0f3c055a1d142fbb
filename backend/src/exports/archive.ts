// A ZIP for an accountant: the tax ledger, the build sheet and every receipt document, streamed as it is built.
import type { EntityManager } from '@mikro-orm/postgresql';
import archiver from 'archiver';
import type { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Build } from '../builds/build.entity';
import { Receipt } from '../receipts/receipt.entity';
import type { ObjectStore } from '../storage/object-store';
import { buildSheetCsv } from './build-sheet';
import { taxLedgerCsv } from './tax-ledger';

function safeName(text: string): string {
  return text.replace(/[^\w.-]+/g, '_').slice(0, 80) || 'receipt';
}

/**
 * Streams the ZIP to `out`. If `out` closes early (the person cancelled the download), the ZIP and every stream put in
 * it are destroyed, which gives back the database cursor's connection and the object store's sockets.
 */
export async function writeArchive(em: EntityManager, store: ObjectStore, build: Build, out: Writable): Promise<void> {
  const zip = archiver('zip', { zlib: { level: 6 } });
  const sources: Readable[] = [];
  const sent = pipeline(zip, out).finally(() => {
    zip.abort();
    for (const source of sources) source.destroy();
  });
  const add = (source: Readable, name: string) => {
    sources.push(source);
    zip.append(source, { name });
  };
  try {
    add(taxLedgerCsv(em.fork(), build, {}), 'tax-ledger.csv');
    add(await buildSheetCsv(em.fork(), build, {}), 'build-sheet.csv');
    const receipts = await em.find(Receipt, { build }, { populate: ['vendor'], orderBy: { purchaseDate: 'asc', createdAt: 'asc' } });
    for (const receipt of receipts) {
      if (zip.destroyed) break;
      const object = await store.stream(receipt.documentKey);
      const extension = receipt.documentKey.split('.').pop();
      add(object.body, `receipts/${receipt.purchaseDate ?? 'undated'}_${safeName(receipt.vendor?.name ?? 'unknown-shop')}_${receipt.id.slice(0, 8)}.${extension}`);
    }
    // finalize() rejects when the download was abandoned; `sent` says so already.
    zip.finalize().catch(() => undefined);
  } catch (error) {
    zip.destroy(error as Error);
  }
  await sent;
}
