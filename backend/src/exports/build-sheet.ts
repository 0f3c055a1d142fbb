// The build sheet for a buyer: the fitted parts by system with what they cost and when, then a summary per system;
// one query feeds both the CSV and the printable page.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Readable } from 'node:stream';
import type { BuildSheetDto } from '../../../shared/api/exports';
import type { LedgerSystemDto } from '../../../shared/api/ledger';
import { SAFETY_CAUTION } from '../../../shared/safety';
import type { Build } from '../builds/build.entity';
import { buildLedger } from '../ledger/ledger.service';
import { csvDocument, neutralise } from './csv';
import { Decimal, minorUnits, storedToWire, sum, toDecimal, toWire } from '../../../shared/money';

export const BUILD_SHEET_COLUMNS = ['section', 'system', 'description', 'part number', 'quantity', 'unit', 'cost', 'date', 'currency'];

export const TAX_NOTE = 'These are records, not tax advice: ask a tax professional how they apply to you.';

interface SheetRow {
  system_id: string;
  system: string;
  description: string;
  part_number: string;
  quantity: string;
  unit: string;
  cost: string | null;
  bought_on: string | null;
}

export interface BuildSheetData {
  rows: SheetRow[];
  /** The ledger's systems, narrowed to the filter's system when there is one. */
  systems: LedgerSystemDto[];
}

/** The fitted parts and the ledger's system figures: what both the CSV and the JSON build sheet show. */
export async function buildSheetData(em: EntityManager, build: Build, filter: { systemId?: string }): Promise<BuildSheetData> {
  const rows = await em.execute<SheetRow[]>(
    `select s.id as system_id, s.name as system, p.description, p.part_number, p.quantity, p.unit,
            sum(l.amount + l.allocated_tax + l.allocated_shipping - l.allocated_discount) as cost,
            to_char(max(r.purchase_date), 'YYYY-MM-DD') as bought_on
       from part p
       join vehicle_system s on s.id = p.system_id
       left join receipt_line l on l.part_id = p.id and l.kind = 'part'
       left join receipt r on r.id = l.receipt_id and r.state = 'filed'
      where p.build_id = ? and p.status = 'installed' ${filter.systemId ? 'and p.system_id = ?' : ''}
      group by s.sort_order, s.id, s.name, p.id
      order by s.sort_order, p.created_at`,
    filter.systemId ? [build.id, filter.systemId] : [build.id],
  );
  const ledger = await buildLedger(em, build);
  return { rows, systems: ledger.systems.filter((system) => !filter.systemId || system.systemId === filter.systemId) };
}

export async function buildSheetCsv(em: EntityManager, build: Build, filter: { systemId?: string }): Promise<Readable> {
  const places = minorUnits(build.currency);
  const { rows, systems } = await buildSheetData(em, build, filter);
  const records = rows.map((row) => [
    'part',
    neutralise(row.system),
    neutralise(row.description),
    neutralise(row.part_number),
    storedToWire(String(row.quantity)),
    row.unit,
    row.cost === null ? '' : storedToWire(String(row.cost), places),
    row.bought_on ?? '',
    build.currency,
  ]);
  for (const system of systems) {
    records.push(['system total', neutralise(system.name), 'net cost of the system', '', '', '', system.netCost, '', build.currency]);
  }
  records.push(['note', '', neutralise(SAFETY_CAUTION), '', '', '', '', '', '']);
  records.push(['note', '', TAX_NOTE, '', '', '', '', '', '']);
  return csvDocument(BUILD_SHEET_COLUMNS, records);
}

/** The same sheet for the printable page: systems with nothing fitted and nothing spent are left out. */
export async function buildSheetJson(em: EntityManager, build: Build, filter: { systemId?: string }): Promise<BuildSheetDto> {
  const places = minorUnits(build.currency);
  const { rows, systems } = await buildSheetData(em, build, filter);
  const parts = rows.map((row) => ({
    systemId: row.system_id,
    system: row.system,
    description: row.description,
    partNumber: row.part_number,
    quantity: toWire(toDecimal(String(row.quantity))),
    unit: row.unit,
    cost: row.cost === null ? null : toWire(toDecimal(String(row.cost)), places),
    boughtOn: row.bought_on,
  }));
  const costOf = (list: typeof parts): Decimal => sum(list.filter((part) => part.cost !== null).map((part) => toDecimal(part.cost!)));
  const summary = systems
    .map((system) => {
      const fitted = parts.filter((part) => part.systemId === system.systemId);
      return {
        systemId: system.systemId,
        name: system.name,
        fittedParts: fitted.length,
        fittedCost: toWire(costOf(fitted), places),
        netCost: system.netCost,
        safetyCaution: system.safetyCaution,
      };
    })
    .filter((system) => system.fittedParts > 0 || !toDecimal(system.netCost).isZero());
  return {
    buildName: build.name,
    vehicle: build.vehicle,
    currency: build.currency,
    locale: build.locale,
    parts,
    systems: summary,
    total: {
      fittedParts: parts.length,
      fittedCost: toWire(costOf(parts), places),
      netCost: toWire(sum(systems.map((system) => toDecimal(system.netCost))), places),
    },
    safetyCaution: SAFETY_CAUTION,
    taxNote: TAX_NOTE,
  };
}
