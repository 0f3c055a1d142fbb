// Crew of a build (members, invites, roles) and the public side of an invite link.
import { Router } from 'express';
import { changeRoleRequest, inviteRequest } from '../../../shared/api/builds';
import type { AppConfig } from '../config';
import { ANY_MEMBER, buildRole, em, isUuid, membershipOf, signedIn } from '../http/build-access';
import { Forbidden, NotFound } from '../http/errors';
import { validBody } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import { acceptInvite, changeRole, inviteMember, listMembers, previewInvite, removeMember, withdrawInvite } from './crew.service';

/** Mounted under /api/builds/:buildId. */
export function crewRoutes(mailer: Mailer, config: AppConfig): Router {
  const router = Router({ mergeParams: true });

  router.get('/members', buildRole(...ANY_MEMBER), async (_req, res) => {
    const membership = membershipOf(res);
    res.json(await listMembers(em(), membership.build, membership.role));
  });

  router.post('/invites', buildRole('owner'), validBody(inviteRequest), async (req, res) => {
    const membership = membershipOf(res);
    const invite = await inviteMember(em(), mailer, config, { build: membership.build, inviter: req.user!, ...req.body });
    res.status(201).json(invite);
  });

  router.delete('/invites/:inviteId', buildRole('owner'), async (req, res) => {
    if (!isUuid(req.params.inviteId)) throw new NotFound('That invite');
    await withdrawInvite(em(), membershipOf(res).build, req.params.inviteId);
    res.status(204).end();
  });

  router.patch('/members/:userId', buildRole('owner'), validBody(changeRoleRequest), async (req, res) => {
    if (!isUuid(req.params.userId)) throw new NotFound('That member');
    res.json(await changeRole(em(), membershipOf(res).build, req.user!.id, req.params.userId, req.body.role));
  });

  // The owner removes anyone; any member may remove themself (leave the build).
  router.delete('/members/:userId', buildRole(...ANY_MEMBER), async (req, res) => {
    const membership = membershipOf(res);
    if (!isUuid(req.params.userId)) throw new NotFound('That member');
    if (membership.role !== 'owner' && req.params.userId !== req.user!.id) throw new Forbidden();
    await removeMember(em(), membership.build, req.user!.id, req.params.userId);
    res.status(204).end();
  });

  return router;
}

/** Mounted under /api/invites. */
export function inviteLinkRoutes(): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await previewInvite(em(), String(req.params.token)));
  });

  router.post('/:token/accept', signedIn, async (req, res) => {
    const build = await acceptInvite(em(), req.user!, String(req.params.token));
    res.json({ buildId: build.id });
  });

  return router;
}
