// A member's own choice of mail alerts on a build: read it (role defaults until saved) and replace it.
import { Router } from 'express';
import { alertPreferencesRequest, type AlertPreferencesDto } from '../../../shared/api/alerts';
import { ANY_MEMBER, buildRole, em, membershipOf } from '../http/build-access';
import { validBody } from '../http/validate';
import { preferencesOf, savePreferences } from './alerts.service';

export function alertPreferencesRoutes(): Router {
  const router = Router({ mergeParams: true });

  router.get('/alert-preferences', buildRole(...ANY_MEMBER), async (_req, res) => {
    const { preferences, chosen } = await preferencesOf(em(), membershipOf(res));
    res.json({ ...preferences, chosen } satisfies AlertPreferencesDto);
  });

  router.put('/alert-preferences', buildRole(...ANY_MEMBER), validBody(alertPreferencesRequest), async (req, res) => {
    const preferences = await savePreferences(em(), membershipOf(res), req.body);
    res.json({ ...preferences, chosen: true } satisfies AlertPreferencesDto);
  });

  return router;
}
