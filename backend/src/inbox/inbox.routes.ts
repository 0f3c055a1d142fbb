// A build's inbox: owner and crew read and rotate its address; the owner sees the mail it did not accept.
import { Router } from 'express';
import type { AppConfig } from '../config';
import { buildRole, em, membershipOf } from '../http/build-access';
import { inboxDto, listRefusals, rotateInbox } from './inbox.service';

/** Mounted under /api/builds/:buildId. */
export function inboxRoutes(config: AppConfig): Router {
  const router = Router({ mergeParams: true });

  router.get('/inbox', buildRole('owner', 'crew'), (_req, res) => {
    res.json(inboxDto(membershipOf(res).build, config.inbox.domain));
  });

  router.post('/inbox/rotate', buildRole('owner', 'crew'), async (_req, res) => {
    const build = membershipOf(res).build;
    await rotateInbox(em(), build);
    res.json(inboxDto(build, config.inbox.domain));
  });

  router.get('/inbox/refused', buildRole('owner'), async (_req, res) => {
    res.json({ refused: await listRefusals(em(), membershipOf(res).build) });
  });

  return router;
}
