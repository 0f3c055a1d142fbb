// The ledger and the exports: every member of a build may read and export them.
import { Router, type Request } from 'express';
import { pipeline } from 'node:stream/promises';
import type { Build } from '../builds/build.entity';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound } from '../http/errors';
import { parseInput } from '../http/validate';
import { dateRangeQuery } from '../../../shared/api/dates';
import { buildLedger } from '../ledger/ledger.service';
import type { ObjectStore } from '../storage/object-store';
import { writeArchive } from './archive';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { buildSheetCsv, buildSheetJson } from './build-sheet';
import { taxLedgerCsv, type ExportFilter } from './tax-ledger';

/** A system of another build is as unknown as one that does not exist: 404, never an empty file. */
async function exportFilter(req: Request, build: Build): Promise<ExportFilter> {
  if (req.query.systemId !== undefined && !isUuid(req.query.systemId)) throw new NotFound('That system');
  const filter: ExportFilter = { ...parseInput(dateRangeQuery, { from: req.query.from, to: req.query.to }), systemId: req.query.systemId as string | undefined };
  if (filter.systemId && !(await em().count(VehicleSystem, { id: filter.systemId, build }))) throw new NotFound('That system');
  return filter;
}

function fileName(buildName: string, what: string): string {
  return `${buildName.replace(/[^\w-]+/g, '-').replace(/^-|-$/g, '').toLowerCase() || 'build'}-${what}`;
}

/** Mounted under /api/builds/:buildId. */
export function exportsRoutes(deps: { store: ObjectStore }): Router {
  const router = Router({ mergeParams: true });

  router.get('/ledger', buildRole(...ANY_MEMBER), async (_req, res) => {
    res.json(await buildLedger(em(), membershipOf(res).build));
  });

  router.get('/exports/tax-ledger.csv', buildRole(...ANY_MEMBER), async (req, res) => {
    const build = membershipOf(res).build;
    const filter = await exportFilter(req, build);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(build.name, 'tax-ledger.csv')}"`);
    await pipeline(taxLedgerCsv(em(), build, filter), res);
  });

  router.get('/exports/build-sheet.csv', buildRole(...ANY_MEMBER), async (req, res) => {
    const build = membershipOf(res).build;
    const filter = await exportFilter(req, build);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(build.name, 'build-sheet.csv')}"`);
    await pipeline(await buildSheetCsv(em(), build, filter), res);
  });

  router.get('/exports/build-sheet', buildRole(...ANY_MEMBER), async (req, res) => {
    const build = membershipOf(res).build;
    res.json(await buildSheetJson(em(), build, await exportFilter(req, build)));
  });

  router.get('/exports/archive.zip', buildRole(...ANY_MEMBER), async (_req, res) => {
    const build = membershipOf(res).build;
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(build.name, 'records.zip')}"`);
    await writeArchive(em(), deps.store, build, res);
  });

  return router;
}
