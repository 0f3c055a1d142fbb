// Sign-up, sign-in, sign-out, who-am-I and password reset.
import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { resetConfirmRequest, resetRequest, signInRequest, signUpRequest, type MeResponse } from '../../../shared/api/auth';
import type { AppConfig } from '../config';
import { acceptInvite } from '../crew/crew.service';
import { em } from '../http/build-access';
import { issueCsrfToken } from '../http/csrf';
import { AppError, Unauthenticated } from '../http/errors';
import { validBody } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import type { AppPassport } from './passport';
import { confirmPasswordReset, createAccount, requestPasswordReset, userDto } from './auth.service';
import type { User } from './user.entity';

function limiter(windowMs: number, limit: number, what: string) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Per address and account, so one noisy client does not lock everyone out.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', `Too many ${what} attempts. Wait a few minutes, then try again.`)),
  });
}

function logIn(req: Request, user: User): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
}

export function authRoutes(passport: AppPassport, mailer: Mailer, config: AppConfig): Router {
  const router = Router();
  const signInLimit = limiter(15 * 60 * 1000, 10, 'sign-in');
  const signUpLimit = limiter(15 * 60 * 1000, 10, 'sign-up');
  const resetLimit = limiter(60 * 60 * 1000, 5, 'reset');

  router.get('/me', (req, res) => {
    const body: MeResponse = { user: req.user ? userDto(req.user) : null };
    res.json(body);
  });

  router.post('/sign-up', signUpLimit, validBody(signUpRequest), async (req, res) => {
    const { inviteToken, ...account } = req.body;
    const { user, buildId } = await em().transactional(async (tx) => {
      const created = await createAccount(tx, account);
      const joined = inviteToken ? await acceptInvite(tx, created, inviteToken) : null;
      return { user: created, buildId: joined?.id };
    });
    await logIn(req, user);
    issueCsrfToken(res, config.secureCookies);
    res.status(201).json(buildId ? { user: userDto(user), buildId } : { user: userDto(user) });
  });

  router.post('/sign-in', signInLimit, validBody(signInRequest), (req, res, next) => {
    passport.authenticate('local', async (error: unknown, user: User | false) => {
      try {
        if (error) throw error;
        if (!user) throw new Unauthenticated('That e-mail and password do not match an account. Check both, or reset the password.');
        await logIn(req, user);
        issueCsrfToken(res, config.secureCookies);
        res.json({ user: userDto(user) });
      } catch (failure) {
        next(failure);
      }
    })(req, res, next);
  });

  router.post('/sign-out', (req, res, next) => {
    req.logout((error) => {
      if (error) return next(error);
      req.session.destroy((destroyError) => {
        if (destroyError) return next(destroyError);
        res.clearCookie('tallyhood.sid');
        res.status(204).end();
      });
    });
  });

  router.post('/password-reset', resetLimit, validBody(resetRequest), async (req, res) => {
    await requestPasswordReset(em(), mailer, config, req.body.email);
    res.status(202).json({ message: 'If an account exists for that address, a link is on its way.' });
  });

  router.post('/password-reset/confirm', resetLimit, validBody(resetConfirmRequest), async (req, res) => {
    await confirmPasswordReset(em(), req.body);
    res.status(204).end();
  });

  return router;
}
