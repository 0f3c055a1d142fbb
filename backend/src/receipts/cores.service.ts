// Core deposits: the list with due dates, and their state changed in one click (owed, handed in, refunded, lost).
import type { EntityManager } from '@mikro-orm/postgresql';
import type { CoreDto } from '../../../shared/api/receipts';
import type { CoreState } from '../../../shared/enums';
import { minorUnits, toWire } from '../../../shared/money';
import { linePaid } from '../../../shared/receipt-math';
import type { User } from '../auth/user.entity';
import type { Build } from '../builds/build.entity';
import { recordAudit } from '../audit/audit';
import { NotFound, StaleVersion } from '../http/errors';
import { Core } from './core.entity';

export function coreDto(core: Core, currency: string): CoreDto {
  const line = core.chargeLine;
  return {
    id: core.id,
    state: core.state,
    dueDate: core.dueDate,
    // The deposit as paid, with its sales tax and share of shipping: the figure the ledger counts.
    amount: toWire(linePaid(line), minorUnits(currency)),
    // The part names the deposit better than the slip's line, which often just says "core charge".
    description: line.part?.description ?? line.description,
    partNumber: line.partNumber,
    receiptId: line.receipt.id,
    vendorName: line.receipt.vendor?.name ?? null,
    purchaseDate: line.receipt.purchaseDate ?? null,
    refundLineId: core.refundLine?.id ?? null,
    version: core.version,
  };
}

export async function listCores(em: EntityManager, build: Build): Promise<CoreDto[]> {
  const cores = await em.find(Core, { build }, { populate: ['chargeLine.receipt.vendor', 'chargeLine.part', 'refundLine'], orderBy: { dueDate: 'asc' } });
  return cores.map((core) => coreDto(core, build.currency));
}

export async function updateCore(em: EntityManager, build: Build, coreId: string, user: User, input: { state?: CoreState; dueDate?: string; version: number }): Promise<CoreDto> {
  const core = await em.findOne(Core, { id: coreId, build }, { populate: ['chargeLine.receipt.vendor', 'chargeLine.part', 'refundLine'] });
  if (!core) throw new NotFound('That core deposit');
  if (core.version !== input.version) throw new StaleVersion('This core deposit');
  const before = { state: core.state, dueDate: core.dueDate };
  if (input.state) core.state = input.state;
  if (input.dueDate) core.dueDate = input.dueDate;
  recordAudit(em, { build, user, entity: 'core', entityId: core.id, receiptId: core.chargeLine.receipt.id, action: 'edit', before, after: { state: core.state, dueDate: core.dueDate } });
  await em.flush();
  return coreDto(core, build.currency);
}
