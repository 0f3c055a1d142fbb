// Parts of the bill of materials: list, add, edit with a version check, remove, and bulk moves and status changes.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { PartDto, UpdatePartRequest } from '../../../shared/api/parts';
import type { PartStatus } from '../../../shared/enums';
import { type Decimal, fitsStoredAmount, minorUnits, multiply, storedToWire, toWire } from '../../../shared/money';
import type { Unit } from '../../../shared/units';
import type { Build } from '../builds/build.entity';
import { isoTimeSql } from '../db/iso-time-sql';
import { preparedRows } from '../db/prepared-rows';
import { NotFound, StaleVersion, ValidationFailed } from '../http/errors';
import { checkBudget, findSystem, partEstimate } from '../systems/systems.service';
import { warrantyEnds } from '../../../shared/warranty';
import { Part } from './part.entity';
import { changeWarranty, warrantyOf, type WarrantyChanges } from './part-warranty';

export interface PartInput {
  systemId: string;
  description: string;
  partNumber: string;
  quantity: Decimal;
  unit: Unit;
  estimatedUnitCost: Decimal;
  status: PartStatus;
  storageLocation: string;
  sourceUrl: string;
  notes: string;
  forSale: boolean;
  askingPrice: Decimal | null;
}

export type PartChanges = Partial<PartInput> & WarrantyChanges & { version: number };

export function partDto(part: Part, currency: string): PartDto {
  return {
    id: part.id,
    systemId: part.system.id,
    description: part.description,
    partNumber: part.partNumber,
    quantity: toWire(part.quantity),
    unit: part.unit,
    estimatedUnitCost: toWire(part.estimatedUnitCost),
    estimatedTotal: toWire(partEstimate(part, currency), minorUnits(currency)),
    status: part.status,
    storageLocation: part.storageLocation,
    sourceUrl: part.sourceUrl,
    notes: part.notes,
    forSale: part.forSale,
    askingPrice: part.askingPrice === null ? null : toWire(part.askingPrice, minorUnits(currency)),
    warranty: warrantyOf(part),
    warrantyStart: part.warrantyStart,
    warrantyEnds: warrantyEnds(warrantyOf(part), part.warrantyStart),
    warrantyReceiptId: part.warrantyReceipt?.id ?? null,
    version: part.version,
    updatedAt: part.updatedAt.toISOString(),
  };
}

/**
 * The list is read as plain rows and answered as they come, not made into entities or Decimals: an entity of every
 * part (identity map, references, change tracking) and a Decimal of every figure cost most of the route's time under
 * load, and a list only answers. The estimate is rounded as the ledger rounds it (numeric round, half away from
 * zero); storedToWire writes every figure exactly as partDto would.
 */
export async function listParts(em: EntityManager, build: Build, filter: { systemId?: string; status?: string }): Promise<PartDto[]> {
  const places = minorUnits(build.currency);
  const params: unknown[] = [places, build.id];
  let where = 'p.build_id = ?';
  if (filter.systemId) {
    where += ' and p.system_id = ?';
    params.push(filter.systemId);
  }
  if (filter.status) {
    where += ' and p.status = ?';
    params.push(filter.status);
  }
  type PartRow = Omit<PartDto, 'warranty' | 'warrantyEnds'> & { warrantyMonths: number | null; warrantyLifetime: boolean };
  const rows = await preparedRows<PartRow>(
    em,
    `select p.id, p.system_id as "systemId", p.description, p.part_number as "partNumber", p.quantity, p.unit,
            p.estimated_unit_cost as "estimatedUnitCost", round(p.quantity * p.estimated_unit_cost, ?) as "estimatedTotal",
            p.status, p.storage_location as "storageLocation", p.source_url as "sourceUrl", p.notes, p.for_sale as "forSale",
            p.asking_price as "askingPrice", p.warranty_months as "warrantyMonths", p.warranty_lifetime as "warrantyLifetime",
            p.warranty_start::text as "warrantyStart", p.warranty_receipt_id as "warrantyReceiptId", p.version,
            ${isoTimeSql('p.updated_at')} as "updatedAt"
       from part p join vehicle_system s on s.id = p.system_id
      where ${where}
      order by s.sort_order asc, p.created_at asc`,
    params,
  );
  // Each answer is written field by field: rest and spread of a row (`{ ...row, quantity }`) cost several times the
  // rest of the mapping together (`npm run bench`, list routes), and it keeps the answer to the DTO's own fields.
  return rows.map((row) => {
    const warranty = warrantyOf(row);
    return {
      id: row.id,
      systemId: row.systemId,
      description: row.description,
      partNumber: row.partNumber,
      quantity: storedToWire(row.quantity),
      unit: row.unit,
      estimatedUnitCost: storedToWire(row.estimatedUnitCost),
      estimatedTotal: storedToWire(row.estimatedTotal, places),
      status: row.status,
      storageLocation: row.storageLocation,
      sourceUrl: row.sourceUrl,
      notes: row.notes,
      forSale: row.forSale,
      askingPrice: row.askingPrice === null ? null : storedToWire(row.askingPrice, places),
      warranty,
      warrantyStart: row.warrantyStart,
      warrantyEnds: warrantyEnds(warranty, row.warrantyStart),
      warrantyReceiptId: row.warrantyReceiptId,
      version: row.version,
      updatedAt: row.updatedAt,
    };
  });
}

/** The part's estimate (quantity × unit cost) is summed on every ledger: it must fit a stored amount. */
export function estimateProblem(quantity: Decimal, estimatedUnitCost: Decimal): string | undefined {
  if (fitsStoredAmount(multiply(quantity, estimatedUnitCost))) return undefined;
  return 'Quantity × unit cost is too large to be a part of a build: check both figures.';
}

function checkEstimate(quantity: Decimal, estimatedUnitCost: Decimal): void {
  const problem = estimateProblem(quantity, estimatedUnitCost);
  if (problem) throw new ValidationFailed({ estimatedUnitCost: problem });
}

export async function createPart(em: EntityManager, build: Build, input: PartInput): Promise<Part> {
  checkEstimate(input.quantity, input.estimatedUnitCost);
  const system = await findSystem(em, build, input.systemId, 'systemId');
  if (input.askingPrice) checkBudget(build, 'askingPrice', input.askingPrice);
  const { systemId: _systemId, ...fields } = input;
  const part = em.create(Part, { ...fields, build, system });
  await em.flush();
  return part;
}

async function findPart(em: EntityManager, build: Build, partId: string): Promise<Part> {
  const part = await em.findOne(Part, { id: partId, build });
  if (!part) throw new NotFound('That part');
  return part;
}

export async function updatePart(em: EntityManager, build: Build, partId: string, changes: PartChanges | UpdatePartRequest): Promise<Part> {
  const part = await findPart(em, build, partId);
  const { version, systemId, warranty, warrantyStart, warrantyReceiptId, ...fields } = changes as PartChanges;
  if (part.version !== version) throw new StaleVersion('This part', partDto(part, build.currency));
  if (fields.askingPrice) checkBudget(build, 'askingPrice', fields.askingPrice);
  checkEstimate(fields.quantity ?? part.quantity, fields.estimatedUnitCost ?? part.estimatedUnitCost);
  if (systemId !== undefined) part.system = await findSystem(em, build, systemId, 'systemId');
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) (part as unknown as Record<string, unknown>)[key] = value;
  await changeWarranty(em, build, part, { warranty, warrantyStart, warrantyReceiptId });
  await em.flush();
  return part;
}

export async function deletePart(em: EntityManager, build: Build, partId: string): Promise<void> {
  await em.removeAndFlush(await findPart(em, build, partId));
}

/** Moves parts to a system or sets their status, all or nothing; every id must be a part of this build. */
export async function bulkUpdateParts(
  em: EntityManager,
  build: Build,
  input: { partIds: string[]; action: 'move'; systemId: string } | { partIds: string[]; action: 'status'; status: PartStatus },
): Promise<Part[]> {
  const ids = [...new Set(input.partIds)];
  const parts = await em.find(Part, { id: { $in: ids }, build });
  if (parts.length !== ids.length) throw new NotFound('Some of those parts');
  if (input.action === 'move') {
    const system = await findSystem(em, build, input.systemId, 'systemId');
    for (const part of parts) part.system = system;
  } else {
    for (const part of parts) part.status = input.status;
  }
  await em.flush();
  return parts;
}
