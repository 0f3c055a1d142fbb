// The ledger's breakdowns: spend over time, by vendor, and the lines behind a figure; every member may read them.
import { Router } from 'express';
import { ledgerLinesQuery, spendQuery } from '../../../shared/api/ledger';
import { ANY_MEMBER, buildRole, em, membershipOf } from '../http/build-access';
import { parseInput } from '../http/validate';
import { linesBehind, spendByVendor, spendOverTime } from './ledger-breakdown.service';

/** Mounted under /api/builds/:buildId, beside GET /ledger (in the exports routes). */
export function ledgerRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/ledger/spend', buildRole(...ANY_MEMBER), async (req, res) => {
    const { by } = parseInput(spendQuery, req.query);
    res.json(await spendOverTime(em(), membershipOf(res).build, by));
  });

  router.get('/ledger/vendors', buildRole(...ANY_MEMBER), async (_req, res) => {
    res.json(await spendByVendor(em(), membershipOf(res).build));
  });

  router.get('/ledger/lines', buildRole(...ANY_MEMBER), async (req, res) => {
    const query = parseInput(ledgerLinesQuery, req.query);
    res.json(await linesBehind(em(), membershipOf(res).build, query));
  });

  return router;
}
