// The Idempotency-Key request header of an upload (IETF HTTPAPI draft "The Idempotency-Key HTTP Header Field"):
// a phone that sends a capture again (no answer came, the tab was closed, the signal dropped) gets the receipts the
// first request made, never a second copy. Keys are scoped to the build and the person who sends them.
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import { createHash, randomUUID } from 'node:crypto';
import type { User } from '../auth/user.entity';
import type { Build } from '../builds/build.entity';
import { AppError, ValidationFailed } from '../http/errors';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const MAX_KEY_LENGTH = 255;
/**
 * A key is kept this long (the draft leaves the expiry to the server and suggests a day or so): long enough for a
 * phone to come back into signal after a day at a junkyard, short enough that the table stays small. After it, the
 * same key starts afresh.
 */
export const KEY_LIFETIME_HOURS = 72;

/**
 * The key of the request, or undefined when it has none (an upload without a key works as before). The draft sends
 * the key as a structured-field string (`"..."`); a bare value is taken as it is.
 */
export function idempotencyKeyOf(req: Request): string | undefined {
  const raw = req.get(IDEMPOTENCY_HEADER);
  if (raw === undefined) return undefined;
  let key = raw.trim();
  if (key.length >= 2 && key.startsWith('"') && key.endsWith('"')) key = key.slice(1, -1).replace(/\\(["\\])/g, '$1');
  if (key.length === 0 || key.length > MAX_KEY_LENGTH || !/^[\x20-\x7e]+$/.test(key)) {
    const message = `Send an ${IDEMPOTENCY_HEADER} of 1 to ${MAX_KEY_LENGTH} printable characters (letters, digits, punctuation), such as a UUID.`;
    throw new ValidationFailed({ [IDEMPOTENCY_HEADER]: message }, message);
  }
  return key;
}

/** One digest for the files of a request, in order; a repeat of a capture must carry the same bytes. */
export function uploadContentSha256(files: readonly Buffer[]): string {
  const whole = createHash('sha256');
  for (const bytes of files) whole.update(createHash('sha256').update(bytes).digest('hex')).update('\n');
  return whole.digest('hex');
}

export type UploadClaim = { claimed: true; keyId: string } | { claimed: false; receiptIds: string[] };

/**
 * Claims the key inside the request's transaction. The unique index on (build, person, key) makes a second request
 * with the same key wait here until the first commits or rolls back; it then finds the first one's row (a repeat)
 * or, after a rollback, claims the key itself. The same key with other content answers 422 and stores nothing.
 */
export async function claimUploadKey(em: EntityManager, build: Build, user: User, key: string, contentSha256: string): Promise<UploadClaim> {
  const keyId = randomUUID();
  // The person's expired keys go first (their own rows only, so two people never wait on each other here).
  await em.execute(`delete from upload_key where user_id = ? and created_at < now() - make_interval(hours => ?)`, [user.id, KEY_LIFETIME_HOURS]);
  const inserted: unknown[] = await em.execute(
    `insert into upload_key (id, build_id, user_id, key, content_sha256) values (?, ?, ?, ?, ?)
     on conflict (build_id, user_id, key) do nothing returning id`,
    [keyId, build.id, user.id, key, contentSha256],
  );
  if (inserted.length === 1) return { claimed: true, keyId };
  const [earlier]: { content_sha256: string; receipt_ids: string[] }[] = await em.execute(
    'select content_sha256, receipt_ids from upload_key where build_id = ? and user_id = ? and key = ?',
    [build.id, user.id, key],
  );
  if (earlier.content_sha256 !== contentSha256) {
    const message = `This ${IDEMPOTENCY_HEADER} was already used for other files. Send a new capture with a new key.`;
    throw new AppError(422, 'idempotency_key_reused', message, { [IDEMPOTENCY_HEADER]: message });
  }
  return { claimed: false, receiptIds: earlier.receipt_ids };
}

export async function recordUploadReceipts(em: EntityManager, keyId: string, receiptIds: string[]): Promise<void> {
  await em.execute('update upload_key set receipt_ids = ?::jsonb where id = ?', [JSON.stringify(receiptIds), keyId]);
}
