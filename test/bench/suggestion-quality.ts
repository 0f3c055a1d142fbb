// How well the line suggestions guess, on the demo build: every line of its filed receipts that went to a part or a
// system is suggested for as if it were new (leave one out: everything else the build holds counts, the line's own
// assignment does not), and top-1 and top-3 hits of the part and of the system are counted. A second pass hides the
// printed part numbers too, to show what the descriptions alone give.
import type { EntityManager } from '@mikro-orm/postgresql';
import { ReceiptLine } from '../../backend/src/receipts/receipt-line.entity';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import { suggestForLines, takesAssignment, type LineToSuggest } from '../../backend/src/suggestions/suggestions.service';
import type { Build } from '../../backend/src/builds/build.entity';
import { percentile } from './percentile';
import { runSection, type Figures } from './print-figures';
import { withSeededDemo } from './seeded-demo';

const QUALITY_DB = 'tallyhood_bench_suggestions';

interface Tally {
  lines: number;
  partLines: number;
  systemTop1: number;
  systemTop3: number;
  partTop1: number;
  partTop3: number;
  bySource: Map<string, number>;
  misses: string[];
}

const percent = (hits: number, of: number) => (of === 0 ? 'n/a' : `${((100 * hits) / of).toFixed(1)} % (${hits}/${of})`);

async function tally(em: EntityManager, build: Build, receipts: Receipt[], hidePartNumbers: boolean, timings: number[]): Promise<Tally> {
  const result: Tally = { lines: 0, partLines: 0, systemTop1: 0, systemTop3: 0, partTop1: 0, partTop3: 0, bySource: new Map(), misses: [] };
  for (const receipt of receipts) {
    const lines = (await em.find(ReceiptLine, { receipt, system: { $ne: null } }, { orderBy: { position: 'asc' } })).filter(takesAssignment);
    const asRead: LineToSuggest[] = lines.map((line) => ({ id: line.id, description: line.description, partNumber: hidePartNumbers ? '' : line.partNumber }));
    const started = performance.now();
    const suggestions = await suggestForLines(em, build, receipt.vendor?.id ?? null, asRead);
    timings.push(performance.now() - started);
    for (const line of lines) {
      const found = suggestions.get(line.id) ?? [];
      const systemRank = found.findIndex((suggestion) => suggestion.systemId === line.system!.id);
      result.lines += 1;
      if (systemRank === 0) result.systemTop1 += 1;
      if (systemRank >= 0 && systemRank < 3) result.systemTop3 += 1;
      if (line.part) {
        const partRank = found.findIndex((suggestion) => suggestion.partId === line.part!.id);
        result.partLines += 1;
        if (partRank === 0) result.partTop1 += 1;
        if (partRank >= 0 && partRank < 3) result.partTop3 += 1;
      }
      const top = found[0];
      if (top && (line.part ? top.partId === line.part.id : top.systemId === line.system!.id && !top.partId)) {
        result.bySource.set(top.source, (result.bySource.get(top.source) ?? 0) + 1);
      } else {
        result.misses.push(`"${line.description}" → ${top ? `${top.partName ?? top.systemName} (${top.source})` : 'nothing'}`);
      }
    }
  }
  return result;
}

/**
 * A build of years, not months: every demo part and receipt copied this many times, each copy's text and number a
 * little changed. Every copied line is then a close description of a demo line, the worst case for the history query.
 */
const SCALE_COPIES = 300;

const INFLATE = [
  `insert into part (id, build_id, system_id, description, part_number, quantity, unit, estimated_unit_cost)
   select gen_random_uuid(), p.build_id, p.system_id, p.description || ' mk' || n, p.part_number || '-' || n, p.quantity, p.unit, p.estimated_unit_cost
     from part p, generate_series(1, ?) n where p.build_id = ?`,
  `insert into receipt (id, build_id, vendor_id, purchase_date, original_filename, document_key, content_type, sha256, size, state, uploaded_by_id)
   select md5(r.id::text || n)::uuid, r.build_id, r.vendor_id, r.purchase_date - n, r.original_filename, r.document_key, r.content_type,
          md5(r.sha256 || n), r.size, 'filed', r.uploaded_by_id
     from receipt r, generate_series(1, ?) n where r.build_id = ?`,
  `insert into receipt_line (id, build_id, receipt_id, position, kind, description, part_number, amount, part_id, system_id)
   select gen_random_uuid(), l.build_id, md5(l.receipt_id::text || n)::uuid, l.position, l.kind, l.description || ' ' || n,
          l.part_number || '/' || n, l.amount, l.part_id, l.system_id
     from receipt_line l, generate_series(1, ?) n where l.build_id = ?`,
];

/** The time to suggest for each demo receipt again, once the build holds SCALE_COPIES times as much. */
async function timeAtScale(em: EntityManager, build: Build, receipts: Receipt[]): Promise<Figures> {
  for (const statement of INFLATE) await em.execute(statement, [SCALE_COPIES, build.id]);
  await em.execute('analyze');
  const [{ parts, lines }] = await em.execute<{ parts: string; lines: string }[]>(
    'select (select count(*) from part where build_id = ?) as parts, (select count(*) from receipt_line where build_id = ?) as lines',
    [build.id, build.id],
  );
  const timings: number[] = [];
  for (const receipt of receipts) {
    const lines = (await em.find(ReceiptLine, { receipt }, { orderBy: { position: 'asc' } })).filter(takesAssignment);
    const started = performance.now();
    await suggestForLines(em, build, receipt.vendor?.id ?? null, lines);
    timings.push(performance.now() - started);
  }
  return {
    'suggest at scale: parts, lines': `${parts}, ${lines}`,
    'suggest at scale: one receipt, p50 / max ms': `${percentile(timings, 50).toFixed(1)} / ${Math.max(...timings).toFixed(1)}`,
  };
}

export async function benchSuggestionQuality(): Promise<Figures> {
  return withSeededDemo(QUALITY_DB, async ({ orm, build }) => {
    const em = orm.em.fork();
    const receipts = await em.find(Receipt, { build, state: 'filed' }, { populate: ['vendor'], orderBy: { purchaseDate: 'asc' } });
    const figures: Figures = {};
    const timings: number[] = [];
    for (const [label, hide] of [['', false], ['descriptions only: ', true]] as const) {
      const result = await tally(em, build, receipts, hide, timings);
      if (!hide) figures['suggest: filed receipts, assigned lines, on parts'] = `${receipts.length}, ${result.lines}, ${result.partLines}`;
      figures[`suggest ${label}system top-1${hide ? '' : ' (goal ≥ 90 %)'}`] = percent(result.systemTop1, result.lines);
      figures[`suggest ${label}system top-3`] = percent(result.systemTop3, result.lines);
      figures[`suggest ${label}part top-1${hide ? '' : ' (goal ≥ 80 %)'}`] = percent(result.partTop1, result.partLines);
      figures[`suggest ${label}part top-3`] = percent(result.partTop3, result.partLines);
      figures[`suggest ${label}right first, by source`] = [...result.bySource].map(([source, hits]) => `${source} ${hits}`).join(', ');
      figures[`suggest ${label}wrong or nothing first`] = result.misses.length ? result.misses.join('; ') : 'none';
    }
    figures['suggest: one receipt, p50 / max ms'] = `${percentile(timings, 50).toFixed(1)} / ${Math.max(...timings).toFixed(1)}`;
    Object.assign(figures, await timeAtScale(em, build, receipts));
    return figures;
  });
}

if (require.main === module) runSection(benchSuggestionQuality);
