// Lines of a receipt: add, edit, assign to a part or a system (or a new part), link a return, split, merge, delete.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { UpdateLineRequest } from '../../../shared/api/receipts';
import type { ReceiptLineKind } from '../../../shared/enums';
import { Decimal, fitsMinorUnits, fitsStoredAmount, minorUnits, multiply, roundToMinor, sum } from '../../../shared/money';
import type { User } from '../auth/user.entity';
import { recordAudit } from '../audit/audit';
import { NotFound, StaleVersion, ValidationFailed } from '../http/errors';
import { Part } from '../parts/part.entity';
import { createPart, type PartInput } from '../parts/parts.service';
import { findSystem } from '../systems/systems.service';
import { ReceiptLine } from './receipt-line.entity';
import type { Receipt } from './receipt.entity';
import { assertEditable } from './receipts.service';

/** Money back: these kinds are negative on a receipt; the others are money out. */
const NEGATIVE_KINDS: readonly ReceiptLineKind[] = ['return', 'core_refund', 'discount'];

export interface LineInput {
  kind: ReceiptLineKind;
  description: string;
  partNumber: string;
  quantity: Decimal;
  unitPrice: Decimal | null;
  amount: Decimal;
  taxable: boolean;
  partId: string | null;
  systemId: string | null;
  returnOfLineId: string | null;
}

function lineSnapshot(line: ReceiptLine) {
  return { kind: line.kind, description: line.description, quantity: line.quantity.toString(), unitPrice: line.unitPrice?.toString() ?? null, amount: line.amount.toString(), partId: line.part?.id ?? null, systemId: line.system?.id ?? null };
}

/** Quantity × unit price must be an amount a line can hold (numeric(19,4)); `field` is the one the person changed. */
function checkLineProduct(quantity: Decimal, unitPrice: Decimal | null, field: 'quantity' | 'unitPrice'): void {
  if (unitPrice && !fitsStoredAmount(multiply(quantity, unitPrice))) {
    throw new ValidationFailed({ [field]: 'Quantity × unit price is too large for one line: check both figures.' });
  }
}

function checkAmount(receipt: Receipt, kind: ReceiptLineKind, amount: Decimal): void {
  const currency = receipt.build.currency;
  if (!fitsMinorUnits(amount, currency)) {
    const places = minorUnits(currency);
    throw new ValidationFailed({ amount: `${currency} amounts have ${places === 0 ? 'no decimals' : `at most ${places} decimals`}.` });
  }
  if (NEGATIVE_KINDS.includes(kind) && amount.isPositive() && !amount.isZero()) {
    throw new ValidationFailed({ amount: 'Money back (a return, a core refund or a discount) is a negative amount, such as -12.50.' });
  }
  if (!NEGATIVE_KINDS.includes(kind) && amount.isNegative()) {
    throw new ValidationFailed({ amount: 'A purchase, core deposit or fee is a positive amount; choose the kind "Return" for money back.' });
  }
}

async function resolveLinks(em: EntityManager, receipt: Receipt, line: ReceiptLine, input: Partial<LineInput>): Promise<void> {
  const build = receipt.build;
  if (input.partId !== undefined) {
    if (input.partId === null) line.part = null;
    else {
      const part = await em.findOne(Part, { id: input.partId, build }, { populate: ['system'] });
      if (!part) throw new ValidationFailed({ partId: 'No such part on this build.' });
      line.part = part;
    }
  }
  if (input.systemId) line.system = await findSystem(em, build, input.systemId, 'systemId');
  // A line on a part counts toward that part's system unless another system was chosen.
  else if (line.part && (input.partId || input.systemId === null)) line.system = line.part.system;
  else if (input.systemId === null) line.system = null;
  if (input.returnOfLineId !== undefined) {
    if (input.returnOfLineId === null) line.returnOf = null;
    else {
      const original = await em.findOne(ReceiptLine, { id: input.returnOfLineId, build }, { populate: ['part', 'system'] });
      if (!original || original.id === line.id) throw new ValidationFailed({ returnOfLineId: 'No such line on this build to return.' });
      line.returnOf = original;
      line.part ??= original.part;
      line.system ??= original.system;
    }
  }
}

export async function findLine(em: EntityManager, receipt: Receipt, lineId: string): Promise<ReceiptLine> {
  const line = await em.findOne(ReceiptLine, { id: lineId, receipt }, { populate: ['part', 'system', 'returnOf'] });
  if (!line) throw new NotFound('That line');
  return line;
}

export async function addLine(em: EntityManager, receipt: Receipt, user: User, role: string, input: LineInput): Promise<ReceiptLine> {
  assertEditable(receipt, role);
  checkAmount(receipt, input.kind, input.amount);
  checkLineProduct(input.quantity, input.unitPrice, 'unitPrice');
  const last = await em.findOne(ReceiptLine, { receipt }, { orderBy: { position: 'desc' } });
  const line = em.create(ReceiptLine, {
    build: receipt.build,
    receipt,
    position: (last?.position ?? -1) + 1,
    kind: input.kind,
    description: input.description,
    partNumber: input.partNumber,
    quantity: input.quantity,
    unitPrice: input.unitPrice,
    amount: input.amount,
    taxable: input.taxable,
  });
  await resolveLinks(em, receipt, line, input);
  recordAudit(em, { build: receipt.build, user, entity: 'receipt_line', entityId: line.id, receiptId: receipt.id, action: 'add', after: lineSnapshot(line) });
  await em.flush();
  return line;
}

type LineChanges = Partial<LineInput> & { version: number; newPart?: UpdateLineRequest['newPart'] };

export async function updateLine(em: EntityManager, receipt: Receipt, lineId: string, user: User, role: string, changes: LineChanges): Promise<ReceiptLine> {
  assertEditable(receipt, role);
  const line = await findLine(em, receipt, lineId);
  if (line.version !== changes.version) throw new StaleVersion('This line');
  const before = lineSnapshot(line);
  const { version: _version, newPart, partId, systemId, returnOfLineId, ...fields } = changes;
  checkLineProduct(fields.quantity ?? line.quantity, fields.unitPrice === undefined ? line.unitPrice : fields.unitPrice, fields.quantity !== undefined ? 'quantity' : 'unitPrice');
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) (line as unknown as Record<string, unknown>)[key] = value;
  // Quantity times unit price gives the amount when a person changes either and not the amount itself.
  if (fields.amount === undefined && (fields.quantity !== undefined || fields.unitPrice !== undefined) && line.unitPrice) {
    const sign = NEGATIVE_KINDS.includes(line.kind) ? -1 : 1;
    line.amount = roundToMinor(multiply(line.unitPrice.abs(), line.quantity), receipt.build.currency).times(sign);
  }
  checkAmount(receipt, line.kind, line.amount);
  if (newPart) {
    const targetSystem = systemId ?? newPart.systemId ?? line.system?.id;
    if (!targetSystem) throw new ValidationFailed({ systemId: 'Choose the system the new part belongs to.' });
    const part = await createPart(em, receipt.build, {
      systemId: targetSystem,
      description: (newPart.description as string | undefined) ?? line.description,
      partNumber: (newPart.partNumber as string | undefined) ?? line.partNumber,
      quantity: (newPart.quantity as unknown as Decimal | undefined) ?? line.quantity,
      unit: newPart.unit ?? 'each',
      estimatedUnitCost: (newPart.estimatedUnitCost as unknown as Decimal | undefined) ?? (line.unitPrice ?? line.amount).abs(),
      status: newPart.status ?? 'on_hand',
      storageLocation: newPart.storageLocation ?? '',
      sourceUrl: newPart.sourceUrl ?? '',
      notes: newPart.notes ?? '',
      forSale: false,
      askingPrice: null,
    } satisfies PartInput);
    await resolveLinks(em, receipt, line, { partId: part.id, systemId: targetSystem, returnOfLineId });
  } else {
    await resolveLinks(em, receipt, line, { partId, systemId, returnOfLineId });
  }
  const after = lineSnapshot(line);
  if (JSON.stringify(before) !== JSON.stringify(after)) {
    recordAudit(em, { build: receipt.build, user, entity: 'receipt_line', entityId: line.id, receiptId: receipt.id, action: 'edit', before, after });
  }
  await em.flush();
  return line;
}

export async function deleteLine(em: EntityManager, receipt: Receipt, lineId: string, user: User, role: string): Promise<void> {
  assertEditable(receipt, role);
  const line = await findLine(em, receipt, lineId);
  recordAudit(em, { build: receipt.build, user, entity: 'receipt_line', entityId: line.id, receiptId: receipt.id, action: 'delete', before: lineSnapshot(line) });
  em.remove(line);
  await em.flush();
}

/** Splits one line into shares (say, a kit used by two systems); the shares must add up to the line exactly. */
export async function splitLine(
  em: EntityManager,
  receipt: Receipt,
  lineId: string,
  user: User,
  role: string,
  input: { version: number; shares: { amount: Decimal; systemId: string | null; partId: string | null; description?: string }[] },
): Promise<ReceiptLine[]> {
  assertEditable(receipt, role);
  const line = await findLine(em, receipt, lineId);
  if (line.version !== input.version) throw new StaleVersion('This line');
  const total = sum(input.shares.map((share) => share.amount));
  if (!total.equals(line.amount)) {
    throw new ValidationFailed({ shares: `The shares add up to ${total.toString()}, not the line's ${line.amount.toString()}.` });
  }
  input.shares.forEach((share, index) => checkAmount(receipt, line.kind, share.amount) ?? index);
  const later = await em.find(ReceiptLine, { receipt, position: { $gt: line.position } });
  for (const other of later) other.position += input.shares.length - 1;
  const created: ReceiptLine[] = [];
  for (const [index, share] of input.shares.entries()) {
    const piece = em.create(ReceiptLine, {
      build: receipt.build,
      receipt,
      position: line.position + index,
      kind: line.kind,
      description: share.description ?? line.description,
      partNumber: line.partNumber,
      quantity: new Decimal(1),
      unitPrice: share.amount.abs(),
      amount: share.amount,
      taxable: line.taxable,
      box: line.box,
      confidence: line.confidence,
      returnOf: line.returnOf,
    });
    await resolveLinks(em, receipt, piece, { systemId: share.systemId, partId: share.partId });
    created.push(piece);
  }
  recordAudit(em, { build: receipt.build, user, entity: 'receipt_line', entityId: line.id, receiptId: receipt.id, action: 'split', before: lineSnapshot(line), after: { shares: created.map(lineSnapshot) } });
  em.remove(line);
  await em.flush();
  return created;
}

/** Merges lines of one kind into the first of them (an OCR split one printed line in two, say). */
export async function mergeLines(em: EntityManager, receipt: Receipt, lineIds: string[], user: User, role: string): Promise<ReceiptLine> {
  assertEditable(receipt, role);
  const lines = await em.find(ReceiptLine, { id: { $in: [...new Set(lineIds)] }, receipt }, { orderBy: { position: 'asc' } });
  if (lines.length !== new Set(lineIds).size) throw new NotFound('Some of those lines');
  if (new Set(lines.map((l) => l.kind)).size > 1) throw new ValidationFailed({ lineIds: 'Only lines of the same kind can be merged.' });
  const [first, ...rest] = lines;
  const merged = sum(lines.map((l) => l.amount));
  if (!fitsStoredAmount(merged)) throw new ValidationFailed({ lineIds: 'Those lines together are too large for one line.' });
  const before = lines.map(lineSnapshot);
  first.amount = merged;
  first.description = lines.map((l) => l.description).join(' ');
  first.quantity = new Decimal(1);
  first.unitPrice = first.amount.abs();
  for (const line of rest) em.remove(line);
  recordAudit(em, { build: receipt.build, user, entity: 'receipt_line', entityId: first.id, receiptId: receipt.id, action: 'merge', before: { lines: before }, after: lineSnapshot(first) });
  await em.flush();
  return first;
}
