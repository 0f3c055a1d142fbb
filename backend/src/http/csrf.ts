// CSRF protection by the double-submit cookie pattern (OWASP CSRF Prevention Cheat Sheet), in Angular's
// naming: a readable XSRF-TOKEN cookie that the client echoes in the X-XSRF-TOKEN header.
import type { RequestHandler, Response } from 'express';
import { randomBytes, timingSafeEqual } from 'node:crypto';
import { AppError } from './errors';

export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function issueCsrfToken(res: Response, secure: boolean): string {
  const token = randomBytes(32).toString('base64url');
  res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'lax', secure, path: '/' });
  return token;
}

function sameToken(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/** Gives every visitor a token and rejects state-changing requests whose header does not match it. */
export function csrfProtection(secure: boolean): RequestHandler {
  return (req, res, next) => {
    const cookie: string | undefined = req.cookies?.[CSRF_COOKIE];
    if (SAFE_METHODS.has(req.method)) {
      if (!cookie) issueCsrfToken(res, secure);
      next();
      return;
    }
    const header = req.get(CSRF_HEADER);
    if (!cookie || !header || !sameToken(cookie, header)) {
      next(new AppError(403, 'csrf_failed', 'Your session check failed. Reload the page and try again.'));
      return;
    }
    next();
  };
}
