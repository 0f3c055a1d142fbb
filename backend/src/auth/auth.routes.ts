// Sign-up, sign-in, sign-out, who-am-I and password reset.
import { afterCommit } from '../http/request-transaction';
import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { resetConfirmRequest, resetRequest, signInRequest, signUpConfirmRequest, signUpRequest, type MeResponse, type SignUpMailedResponse } from '../../../shared/api/auth';
import type { AppConfig } from '../config';
import { em } from '../http/build-access';
import { issueCsrfToken } from '../http/csrf';
import { AppError, Unauthenticated } from '../http/errors';
import { validBody } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import type { AppPassport } from './passport';
import { confirmPasswordReset, confirmSignUp, createInvitedAccount, requestPasswordReset, startSignUp, userDto } from './auth.service';
import type { User } from './user.entity';

interface LimitRule {
  windowMs: number;
  limit: number;
  what: string;
  /** What is counted against: the client's address, the account's e-mail, or both together. */
  key: (req: Request) => string;
  /** Count only refused attempts, so a person signing in on several devices is never locked out. */
  failuresOnly?: boolean;
}

const byAddress = (req: Request) => ipKeyGenerator(req.ip ?? '');
const byAccount = (req: Request) => String(req.body?.email ?? '').trim().toLowerCase();
const byAddressAndAccount = (req: Request) => `${byAddress(req)}|${byAccount(req)}`;

function limiter(rule: LimitRule) {
  return rateLimit({
    windowMs: rule.windowMs,
    limit: rule.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: rule.key,
    skipSuccessfulRequests: rule.failuresOnly ?? false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', `Too many ${rule.what} attempts. Wait a few minutes, then try again.`)),
  });
}

function logIn(req: Request, user: User): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
}

export function authRoutes(passport: AppPassport, mailer: Mailer, config: AppConfig): Router {
  const router = Router();
  const fifteenMinutes = 15 * 60 * 1000;
  const hour = 60 * 60 * 1000;
  // Sign-in counts failures only, per address (one password sprayed over many accounts) and per account (many
  // addresses trying one account) separately. The numbers are DEVELOPERS.md's "Sign-in and reset limits".
  const signInLimits = [
    limiter({ windowMs: fifteenMinutes, limit: 30, what: 'sign-in', key: byAddress, failuresOnly: true }),
    limiter({ windowMs: fifteenMinutes, limit: 10, what: 'sign-in', key: byAccount, failuresOnly: true }),
  ];
  const signUpLimit = limiter({ windowMs: fifteenMinutes, limit: 10, what: 'sign-up', key: byAddressAndAccount });
  // Asking for links: per address and account, so one address cannot be flooded with mail.
  const resetRequestLimit = limiter({ windowMs: hour, limit: 5, what: 'reset', key: byAddressAndAccount });
  // Confirming: failures only, per address; a link is 256 random bits, so this only curbs load, and a few bad
  // links from one address never block a good one.
  const resetConfirmLimit = limiter({ windowMs: hour, limit: 50, what: 'reset', key: byAddress, failuresOnly: true });
  const signUpConfirmLimit = limiter({ windowMs: hour, limit: 50, what: 'sign-up', key: byAddress, failuresOnly: true });

  router.get('/me', (req, res) => {
    const body: MeResponse = { user: req.user ? userDto(req.user) : null };
    res.json(body);
  });

  router.post('/sign-up', signUpLimit, validBody(signUpRequest), async (req, res) => {
    const { inviteToken, ...account } = req.body;
    if (inviteToken) {
      const { user, buildId } = await createInvitedAccount(em(), account, inviteToken);
      await logIn(req, user);
      issueCsrfToken(res, config.secureCookies);
      return void res.status(201).json({ user: userDto(user), buildId });
    }
    // Word for word the same answer for a known and a new address; the mail that follows says which it was.
    await startSignUp(em(), mailer, config, account);
    const body: SignUpMailedResponse = {
      status: 'check-mail',
      message: `We sent a message to ${account.email.toLowerCase()}. Open the link in it to finish creating your account; it works for 24 hours.`,
    };
    res.status(202).json(body);
  });

  router.post('/sign-up/confirm', signUpConfirmLimit, validBody(signUpConfirmRequest), async (req, res) => {
    const user = await confirmSignUp(em(), req.body.token);
    await logIn(req, user);
    issueCsrfToken(res, config.secureCookies);
    res.status(201).json({ user: userDto(user) });
  });

  router.post('/sign-in', ...signInLimits, validBody(signInRequest), (req, res, next) => {
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

  router.post('/password-reset', resetRequestLimit, validBody(resetRequest), async (req, res) => {
    // The same answer at once for every address; the link is made and mailed after it, so neither the answer
    // nor its timing says whether the address has an account.
    const requestEm = em();
    await afterCommit(requestEm, () => requestPasswordReset(requestEm.fork(), mailer, config, req.body.email));
    res.status(202).json({ message: 'If an account exists for that address, a link is on its way.' });
  });

  router.post('/password-reset/confirm', resetConfirmLimit, validBody(resetConfirmRequest), async (req, res) => {
    await confirmPasswordReset(em(), req.body);
    res.status(204).end();
  });

  return router;
}
