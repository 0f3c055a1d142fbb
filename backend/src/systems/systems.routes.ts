// Systems and budgets of a build: every member reads; only the owner adds, renames, reorders, archives or budgets.
import { Router } from 'express';
import { createSystemRequest, updateContingencyRequest, updateSystemRequest } from '../../../shared/api/parts';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf } from '../http/build-access';
import { NotFound } from '../http/errors';
import { validBody } from '../http/validate';
import { createSystem, systemsOverview, updateContingency, updateSystem } from './systems.service';

/** Mounted under /api/builds/:buildId. */
export function systemsRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/systems', buildRole(...ANY_MEMBER), async (req, res) => {
    res.json(await systemsOverview(em(), membershipOf(res).build, req.query.archived === 'true'));
  });

  router.post('/systems', buildRole('owner'), validBody(createSystemRequest), async (req, res) => {
    const build = membershipOf(res).build;
    const system = await createSystem(em(), build, req.body);
    const overview = await systemsOverview(em(), build, true);
    res.status(201).json(overview.systems.find((s) => s.id === system.id));
  });

  router.patch('/systems/:systemId', buildRole('owner'), validBody(updateSystemRequest), async (req, res) => {
    if (!isUuid(req.params.systemId)) throw new NotFound('That system');
    const build = membershipOf(res).build;
    const system = await updateSystem(em(), build, String(req.params.systemId), req.body);
    const overview = await systemsOverview(em(), build, true);
    res.json(overview.systems.find((s) => s.id === system.id));
  });

  router.put('/contingency', buildRole('owner'), validBody(updateContingencyRequest), async (req, res) => {
    const build = membershipOf(res).build;
    await updateContingency(em(), build, req.body.contingencyBudget, req.body.version);
    res.json(await systemsOverview(em(), build, false));
  });

  return router;
}
