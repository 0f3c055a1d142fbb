// The build's price history; every member may read it.
import { Router } from 'express';
import { priceHistoryQuery } from '../../../shared/api/price-history';
import { ANY_MEMBER, buildRole, em, membershipOf } from '../http/build-access';
import { parseInput } from '../http/validate';
import { priceHistory } from './price-history.service';

/** Mounted under /api/builds/:buildId. */
export function priceHistoryRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/price-history', buildRole(...ANY_MEMBER), async (req, res) => {
    const query = parseInput(priceHistoryQuery, req.query);
    res.json(await priceHistory(em(), membershipOf(res).build, query));
  });

  return router;
}
