// Builds: list and create for a signed-in person; view for members; edit, archive and restore for the owner.
import { Router } from 'express';
import { createBuildRequest, updateBuildRequest } from '../../../shared/api/builds';
import { ANY_MEMBER, buildRole, buildRoleEvenArchived, em, membershipOf, signedIn } from '../http/build-access';
import { validBody } from '../http/validate';
import { buildDto, createBuild, listBuilds, setArchived, updateBuild } from './builds.service';

export function buildsRoutes(): Router {
  const router = Router();

  router.get('/', signedIn, async (req, res) => {
    res.json({ builds: await listBuilds(em(), req.user!, req.query.archived === 'true') });
  });

  router.post('/', signedIn, validBody(createBuildRequest), async (req, res) => {
    const build = await createBuild(em(), req.user!, req.body);
    res.status(201).json(buildDto(build, 'owner'));
  });

  router.get('/:buildId', buildRole(...ANY_MEMBER), (_req, res) => {
    const membership = membershipOf(res);
    res.json(buildDto(membership.build, membership.role));
  });

  router.patch('/:buildId', buildRole('owner'), validBody(updateBuildRequest), async (req, res) => {
    const build = await updateBuild(em(), membershipOf(res).build, req.body);
    res.json(buildDto(build, 'owner'));
  });

  router.delete('/:buildId', buildRoleEvenArchived('owner'), async (_req, res) => {
    await setArchived(em(), membershipOf(res).build, true);
    res.status(204).end();
  });

  router.post('/:buildId/restore', buildRoleEvenArchived('owner'), async (_req, res) => {
    const build = await setArchived(em(), membershipOf(res).build, false);
    res.json(buildDto(build, 'owner'));
  });

  return router;
}
