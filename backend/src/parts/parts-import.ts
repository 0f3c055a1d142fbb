// Reads a parts list from CSV: every row is checked and previewed before anything is saved.
import { estimateProblem } from './parts.service';
import type { EntityManager } from '@mikro-orm/postgresql';
import { parse } from 'csv-parse/sync';
import { createPartRequest, IMPORT_COLUMNS, type ImportPreviewDto, type ImportRowDto } from '../../../shared/api/parts';
import { minorUnits, toWire } from '../../../shared/money';
import { Build } from '../builds/build.entity';
import { ValidationFailed, fieldsFromZod } from '../http/errors';
import { partEstimate } from '../systems/systems.service';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { Part } from './part.entity';
import type { PartInput } from './parts.service';

export const MAX_IMPORT_ROWS = 5000;

const rowSchema = createPartRequest.omit({ systemId: true });
type Column = (typeof IMPORT_COLUMNS)[number];

function columnKey(header: string): string {
  return header.trim().toLowerCase().replace(/[_\s]+/g, ' ');
}

const FIELD_OF: Record<Column, string> = {
  system: 'system',
  description: 'description',
  'part number': 'partNumber',
  quantity: 'quantity',
  unit: 'unit',
  'estimated unit cost': 'estimatedUnitCost',
  status: 'status',
  'storage location': 'storageLocation',
  'source link': 'sourceUrl',
  notes: 'notes',
};

interface ReadRow {
  dto: ImportRowDto;
  input?: PartInput;
}

function readCsv(text: string): { headers: string[]; records: string[][] } {
  let records: string[][];
  try {
    records = parse(text.replace(/^\uFEFF/, ''), { relax_column_count: true, skip_empty_lines: true, trim: true });
  } catch (error) {
    throw new ValidationFailed({ file: `The file is not readable CSV: ${(error as Error).message}` }, 'The file is not readable CSV.');
  }
  if (records.length === 0) throw new ValidationFailed({ file: 'The file is empty: put a header row first, then one part per row.' });
  const [headers, ...rows] = records;
  const keys = headers.map(columnKey);
  const missing = (['system', 'description', 'quantity', 'unit', 'estimated unit cost'] as Column[]).filter((c) => !keys.includes(c));
  if (missing.length) throw new ValidationFailed({ file: `The header row lacks: ${missing.join(', ')}. Expected columns: ${IMPORT_COLUMNS.join(', ')}.` });
  const unknown = keys.filter((k) => !(IMPORT_COLUMNS as readonly string[]).includes(k));
  if (unknown.length) throw new ValidationFailed({ file: `Unknown column(s): ${unknown.join(', ')}. Expected columns: ${IMPORT_COLUMNS.join(', ')}.` });
  if (rows.length > MAX_IMPORT_ROWS) throw new ValidationFailed({ file: `At most ${MAX_IMPORT_ROWS} rows per import; this file has ${rows.length}.` });
  return { headers: keys, records: rows };
}

export async function previewImport(em: EntityManager, build: Build, text: string): Promise<ReadRow[]> {
  const { headers, records } = readCsv(text);
  const systems = await em.find(VehicleSystem, { build, archivedAt: null });
  const systemByName = new Map(systems.map((s) => [s.name.trim().toLowerCase(), s]));
  const places = minorUnits(build.currency);

  return records.map((record, index) => {
    const raw: Record<string, string> = {};
    headers.forEach((header, column) => {
      const value = record[column] ?? '';
      if (value !== '') raw[FIELD_OF[header as Column]] = value;
    });
    const errors: Record<string, string> = {};
    const system = systemByName.get((raw.system ?? '').toLowerCase());
    if (!raw.system) errors.system = 'Name the system.';
    else if (!system) errors.system = `No active system named "${raw.system}" on this build.`;
    const { system: _system, ...fields } = raw;
    const parsed = rowSchema.safeParse({ ...fields, status: fields.status?.toLowerCase().replace(/\s+/g, '_') });
    if (!parsed.success) Object.assign(errors, fieldsFromZod(parsed.error));
    const tooLarge = parsed.success ? estimateProblem(parsed.data.quantity, parsed.data.estimatedUnitCost) : undefined;
    if (tooLarge) errors.estimatedUnitCost = tooLarge;
    const ok = Object.keys(errors).length === 0;
    const dto: ImportRowDto = {
      line: index + 2,
      ok,
      errors,
      part: {
        systemName: system?.name ?? raw.system ?? '',
        description: raw.description ?? '',
        partNumber: raw.partNumber ?? '',
        quantity: raw.quantity ?? '',
        unit: raw.unit ?? '',
        estimatedUnitCost: raw.estimatedUnitCost ?? '',
        estimatedTotal: parsed.success ? toWire(partEstimate(parsed.data, build.currency), places) : null,
      },
    };
    return { dto, input: ok && parsed.success ? { ...parsed.data, systemId: system!.id } : undefined };
  });
}

export function previewDto(rows: ReadRow[]): ImportPreviewDto {
  const accepted = rows.filter((r) => r.dto.ok).length;
  return { rows: rows.map((r) => r.dto), accepted, rejected: rows.length - accepted };
}

/** Saves the accepted rows in one transaction; refuses everything when a row is rejected, unless told to drop those. */
export async function commitImport(em: EntityManager, build: Build, text: string, dropRejected: boolean): Promise<{ imported: number; dropped: number }> {
  const rows = await previewImport(em, build, text);
  const rejected = rows.filter((r) => !r.dto.ok);
  if (rejected.length && !dropRejected) {
    const fields: Record<string, string> = {};
    for (const row of rejected) for (const [field, message] of Object.entries(row.dto.errors)) fields[`rows.${row.dto.line}.${field}`] = message;
    throw new ValidationFailed(fields, `${rejected.length} of ${rows.length} rows have problems: nothing was saved. Fix them, or drop those rows.`);
  }
  // Rows keep the file's order: each is stamped a millisecond after the one before.
  const start = Date.now();
  await em.transactional(async (tx) => {
    for (const [index, row] of rows.entries()) {
      if (!row.input) continue;
      const { systemId, ...fields } = row.input;
      const at = new Date(start + index);
      tx.create(Part, { ...fields, build: tx.getReference(Build, build.id), system: tx.getReference(VehicleSystem, systemId), createdAt: at, updatedAt: at });
    }
  });
  return { imported: rows.length - rejected.length, dropped: rejected.length };
}
