// POST /api/inbound-mail: where an inbound-mail service (or the fake SMTP server under npm start) hands over a raw
// RFC 5322 message, behind a shared secret. Off (404) unless INBOUND_MAIL_SECRET is set. The envelope's recipients
// may come in X-Envelope-To (comma-separated); without it the message's own headers name them.
import express, { Router } from 'express';
import { createHash, timingSafeEqual } from 'node:crypto';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_FILES } from '../../../shared/api/receipts';
import { AppError, NotFound, Unauthenticated, ValidationFailed } from '../http/errors';
import { receiveMail, type InboxDeps } from './receive-mail';

/** Compared as digests, in constant time, so the answer's timing tells nothing of the secret. */
function sameSecret(given: string, secret: string): boolean {
  const digest = (text: string) => createHash('sha256').update(text).digest();
  return timingSafeEqual(digest(given), digest(secret));
}

export function inboundMailRoutes(deps: InboxDeps): Router {
  const router = Router();
  // Every file the upload takes, in base64 (4/3), with room for the message around them.
  const limit = Math.ceil((MAX_UPLOAD_BYTES * MAX_UPLOAD_FILES * 4) / 3) + 1024 * 1024;
  router.post('/inbound-mail', (req, _res, next) => {
    const secret = deps.config.inbox.webhookSecret;
    if (!secret) throw new NotFound('That API route');
    const given = /^Bearer (.+)$/.exec(req.get('authorization') ?? '')?.[1] ?? '';
    if (!given || !sameSecret(given, secret)) throw new Unauthenticated('Send the inbound-mail secret as a Bearer token.');
    next();
  }, express.raw({ type: () => true, limit }), async (req, res) => {
    if (!Buffer.isBuffer(req.body) || req.body.length === 0) throw new ValidationFailed({ body: 'Send the raw message (RFC 5322) as the body.' });
    const recipients = (req.get('x-envelope-to') ?? '').split(',').map((address) => address.trim()).filter(Boolean);
    const outcomes = await receiveMail(deps, req.body as Buffer, { recipients });
    res.json({ outcomes });
  });
  router.use('/inbound-mail', (error: unknown, _req: express.Request, _res: express.Response, next: express.NextFunction) => {
    // body-parser's own refusals (too large, cut off) in the one error shape.
    const status = (error as { status?: number }).status;
    if (status === 413) return next(new AppError(413, 'too_large', 'The message is larger than the inbox takes.'));
    next(error);
  });
  return router;
}
