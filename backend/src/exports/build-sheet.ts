// The build sheet for a buyer: the fitted parts by system with what they cost and when, then a summary per system.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Readable } from 'node:stream';
import { SAFETY_CAUTION } from '../../../shared/safety';
import type { Build } from '../builds/build.entity';
import { buildLedger } from '../ledger/ledger.service';
import { csvStringifier, neutralise } from './csv';
import { minorUnits, toDecimal, toWire } from '../../../shared/money';

export const BUILD_SHEET_COLUMNS = ['section', 'system', 'description', 'part number', 'quantity', 'unit', 'cost', 'date', 'currency'];

interface SheetRow {
  system: string;
  description: string;
  part_number: string;
  quantity: string;
  unit: string;
  cost: string | null;
  bought_on: string | null;
}

export async function buildSheetCsv(em: EntityManager, build: Build, filter: { systemId?: string }): Promise<Readable> {
  const places = minorUnits(build.currency);
  const rows = await em.getConnection().execute<SheetRow[]>(
    `select s.name as system, p.description, p.part_number, p.quantity, p.unit,
            sum(l.amount + l.allocated_tax + l.allocated_shipping - l.allocated_discount) as cost,
            to_char(max(r.purchase_date), 'YYYY-MM-DD') as bought_on
       from part p
       join vehicle_system s on s.id = p.system_id
       left join receipt_line l on l.part_id = p.id and l.kind = 'part'
       left join receipt r on r.id = l.receipt_id and r.state = 'filed'
      where p.build_id = ? and p.status = 'installed' ${filter.systemId ? 'and p.system_id = ?' : ''}
      group by s.sort_order, s.name, p.id
      order by s.sort_order, p.created_at`,
    filter.systemId ? [build.id, filter.systemId] : [build.id],
  );
  const ledger = await buildLedger(em, build);
  const csv = csvStringifier(BUILD_SHEET_COLUMNS);
  for (const row of rows) {
    csv.write([
      'part',
      neutralise(row.system),
      neutralise(row.description),
      neutralise(row.part_number),
      toWire(toDecimal(String(row.quantity))),
      row.unit,
      row.cost === null ? '' : toWire(toDecimal(String(row.cost)), places),
      row.bought_on ?? '',
      build.currency,
    ]);
  }
  for (const system of ledger.systems) {
    if (filter.systemId && system.systemId !== filter.systemId) continue;
    csv.write(['system total', neutralise(system.name), 'net cost of the system', '', '', '', system.netCost, '', build.currency]);
  }
  csv.write(['note', '', neutralise(SAFETY_CAUTION), '', '', '', '', '', '']);
  csv.write(['note', '', 'These are records, not tax advice: ask a tax professional how they apply to you.', '', '', '', '', '', '']);
  csv.end();
  return csv;
}
