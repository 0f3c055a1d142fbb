// The one seam through which mail reaches a build's inbox: a raw RFC 5322 message in, receipts or a kept refusal out.
// The fake SMTP server (development and tests) and the inbound-mail webhook (production) both call receiveMail.
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import { createHash, randomUUID } from 'node:crypto';
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser';
import type { MailRefusalReason } from '../../../shared/api/inbox';
import { MAX_UPLOAD_FILES } from '../../../shared/api/receipts';
import { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import type { AppConfig } from '../config';
import type { JobQueue } from '../jobs/queue';
import type { Mailer } from '../mail/mailer';
import { mailedReceiptRefusedMail } from '../mail/templates';
import { MAIL_CONTENT_TYPE, mailBody } from '../receipts/reading/mail-text';
import { UnreadableDocumentError } from '../receipts/reading/sniff';
import { storeReceiptDocument, type UploadedDocument } from '../receipts/receipts.service';
import { checkUpload } from '../receipts/upload-check';
import { uploadContentSha256 } from '../receipts/upload-idempotency';
import type { ObjectStore } from '../storage/object-store';
import { tokenOfAddress } from './inbox-token';
import { MailRefusal } from './mail-refusal.entity';
import { RetiredInboxToken } from './retired-inbox-token.entity';

export interface InboxDeps {
  orm: MikroORM;
  store: ObjectStore;
  queue: JobQueue;
  mailer: Mailer;
  config: AppConfig;
}

export type MailOutcome =
  | { outcome: 'accepted'; buildId: string; receiptIds: string[] }
  /** The same message (Message-ID or content) reached the build before: its receipts, nothing new. */
  | { outcome: 'repeat'; buildId: string; receiptIds: string[] }
  | { outcome: 'refused'; buildId: string | null; reason: MailRefusalReason; detail: string };

/** Parts of a message's structure, never receipts: signatures and keys. */
const STRUCTURAL_TYPES = new Set(['application/pgp-signature', 'application/pkcs7-signature', 'application/x-pkcs7-signature', 'application/pgp-keys']);

function addressesOf(value: AddressObject | AddressObject[] | undefined): string[] {
  return (Array.isArray(value) ? value : value ? [value] : []).flatMap((group) => group.value.map((entry) => entry.address ?? '')).filter(Boolean);
}

/** Without an envelope (a webhook that sends none): the header recipients, and the ones delivering servers record. */
function headerRecipients(parsed: ParsedMail): string[] {
  const recorded = ['delivered-to', 'x-original-to'].flatMap((name) => parsed.headerLines.filter((line) => line.key === name).map((line) => line.line.slice(name.length + 1).trim()));
  return [...recorded, ...addressesOf(parsed.to), ...addressesOf(parsed.cc)];
}

function clip(text: string, length: number): string {
  return text.length > length ? `${text.slice(0, length - 1)}…` : text;
}

interface Incoming {
  raw: Buffer;
  parsed: ParsedMail;
  from: string;
  subject: string;
  messageId: string;
}

async function refuse(em: EntityManager, build: Build | null, mail: Incoming, recipient: string, reason: MailRefusalReason, detail: string): Promise<MailOutcome> {
  em.create(MailRefusal, {
    build,
    fromAddress: clip(mail.from || '(no sender)', 254),
    recipient: clip(recipient, 254),
    subject: clip(mail.subject, 300),
    messageId: clip(mail.messageId, 998),
    reason,
    detail,
  });
  await em.flush();
  console.log(`[inbox] refused mail from ${mail.from || '(no sender)'} to ${recipient}: ${reason}`);
  return { outcome: 'refused', buildId: build?.id ?? null, reason, detail };
}

/** A reply to a member about their own message; never to automatic mail or to a receipts address, so no mail loops. */
async function tellSender(deps: InboxDeps, build: Build, mail: Incoming, reasons: string[]): Promise<void> {
  const automatic = (mail.parsed.headers.get('auto-submitted')?.toString() ?? 'no').toLowerCase() !== 'no';
  if (automatic || mail.from.endsWith(`@${deps.config.inbox.domain}`)) return;
  try {
    await deps.mailer.send(
      mailedReceiptRefusedMail({ to: mail.from, buildName: build.name, subject: mail.subject, reasons, link: `${deps.config.appUrl}/builds/${build.id}/receipts` }),
    );
  } catch (error) {
    // The refusal is kept for the owner whether or not the reply went out.
    console.error('[inbox] the reply could not be sent:', error instanceof Error ? error.message : error);
  }
}

/** The attachments as upload documents, each through the upload's own checks; the refused ones in the upload's words. */
async function attachedDocuments(parsed: ParsedMail): Promise<{ documents: UploadedDocument[]; refused: string[] }> {
  // Pictures embedded in an HTML body (a shop's logo) belong to the body, not to the receipt.
  const attachments = parsed.attachments.filter((attachment) => !attachment.related && !STRUCTURAL_TYPES.has(attachment.contentType.toLowerCase()));
  if (attachments.length > MAX_UPLOAD_FILES) return { documents: [], refused: [`The message carries ${attachments.length} files; send at most ${MAX_UPLOAD_FILES} at once.`] };
  const documents: UploadedDocument[] = [];
  const refused: string[] = [];
  for (const [index, attachment] of attachments.entries()) {
    const name = attachment.filename || `attachment ${index + 1}`;
    try {
      documents.push({ originalFilename: name, bytes: attachment.content, sniffed: await checkUpload(attachment.content) });
    } catch (error) {
      if (!(error instanceof UnreadableDocumentError)) throw error;
      refused.push(`${name}: ${error.message}`);
    }
  }
  return { documents, refused };
}

/** Records the message once per build (by Message-ID and by content); a repeat answers the first one's receipts. */
async function makeReceipts(deps: InboxDeps, em: EntityManager, build: Build, membership: Membership, mail: Incoming, documents: UploadedDocument[], contentSha256: string): Promise<MailOutcome> {
  const made = await em.transactional(async (tx) => {
    const messageRowId = randomUUID();
    // Two deliveries of one message at once: the second waits on the unique index until the first commits.
    const inserted: unknown[] = await tx.execute(
      `insert into mailed_message (id, build_id, sender_id, message_id, content_sha256) values (?, ?, ?, ?, ?) on conflict do nothing returning id`,
      [messageRowId, build.id, membership.user.id, clip(mail.messageId, 998), contentSha256],
    );
    if (inserted.length === 0) {
      const [earlier]: { receipt_ids: string[] }[] = await tx.execute(
        `select receipt_ids from mailed_message where build_id = ? and (content_sha256 = ? or (message_id <> '' and message_id = ?)) order by received_at limit 1`,
        [build.id, contentSha256, clip(mail.messageId, 998)],
      );
      return { repeat: true, receiptIds: earlier?.receipt_ids ?? [] };
    }
    const receiptIds: string[] = [];
    for (const document of documents) receiptIds.push((await storeReceiptDocument(tx, deps.store, build, membership.user, document)).id);
    await tx.flush();
    await tx.execute('update mailed_message set receipt_ids = ?::jsonb where id = ?', [JSON.stringify(receiptIds), messageRowId]);
    return { repeat: false, receiptIds };
  });
  if (made.repeat) return { outcome: 'repeat', buildId: build.id, receiptIds: made.receiptIds };
  // Queued once committed, so the worker finds the receipts.
  for (const receiptId of made.receiptIds) await deps.queue.readReceipt(receiptId);
  console.log(`[inbox] ${made.receiptIds.length} receipt(s) from ${mail.from} for build ${build.id}`);
  return { outcome: 'accepted', buildId: build.id, receiptIds: made.receiptIds };
}

async function deliver(deps: InboxDeps, mail: Incoming, token: string, recipient: string): Promise<MailOutcome> {
  const em = deps.orm.em.fork();
  const build = await em.findOne(Build, { inboxToken: token });
  if (!build) {
    const retired = await em.findOne(RetiredInboxToken, { token }, { populate: ['build'] });
    if (retired) return refuse(em, retired.build, mail, recipient, 'old_address', 'This address was replaced by a new one. Send receipts to the address shown in Settings.');
    return refuse(em, null, mail, recipient, 'unknown_address', 'No build has this address.');
  }
  const membership = mail.from ? await em.findOne(Membership, { build, user: { email: mail.from } }, { populate: ['user'] }) : null;
  if (!membership) {
    return refuse(em, build, mail, recipient, 'not_a_member', `${mail.from || 'The sender'} is not the owner or crew of this build. Forward the receipt from the address you sign in with.`);
  }
  if (membership.role === 'reviewer') return refuse(em, build, mail, recipient, 'reviewer', `${mail.from} reviews this build; only the owner and crew add receipts.`);
  if (build.archivedAt) return refuse(em, build, mail, recipient, 'archived', 'The build is archived, so it takes no new receipts. Its owner can restore it.');

  const { documents, refused } = await attachedDocuments(mail.parsed);
  if (refused.length) {
    // All or nothing, as an upload: the sender never has to wonder which of their files made it.
    const outcome = await refuse(em, build, mail, recipient, 'refused_attachment', refused.join(' '));
    await tellSender(deps, build, mail, refused);
    return outcome;
  }
  if (documents.length) return makeReceipts(deps, em, build, membership, mail, documents, uploadContentSha256(documents.map((document) => document.bytes)));

  const body = mailBody(mail.parsed).text;
  if (!/[\p{L}\p{N}]/u.test(body)) {
    const reason = 'The message has no photo or PDF attached and no text to read.';
    const outcome = await refuse(em, build, mail, recipient, 'nothing_to_read', reason);
    await tellSender(deps, build, mail, [reason]);
    return outcome;
  }
  // The message itself is the receipt's document; its body is what is read.
  const filename = `${(mail.subject || 'Mailed receipt').replace(/[^\p{L}\p{N} ._-]+/gu, ' ').trim().slice(0, 200) || 'Mailed receipt'}.eml`;
  const message: UploadedDocument = { originalFilename: filename, bytes: mail.raw, sniffed: { mime: MAIL_CONTENT_TYPE, ext: 'eml', pages: 1 } };
  return makeReceipts(deps, em, build, membership, mail, [message], createHash('sha256').update(`body\n${body}`).digest('hex'));
}

/**
 * Takes one raw message. `recipients` is the SMTP envelope's (the fake server, or a webhook that passes it); without
 * it the headers name them. Each receipts address among them is delivered to on its own; mail for no build's address
 * is kept as refused too. Never throws for what a sender did: only for a broken database or store.
 */
export async function receiveMail(deps: InboxDeps, raw: Buffer | string, options: { recipients?: string[] } = {}): Promise<MailOutcome[]> {
  const bytes = typeof raw === 'string' ? Buffer.from(raw, 'utf8') : raw;
  const parsed = await simpleParser(bytes);
  const mail: Incoming = {
    raw: bytes,
    parsed,
    from: (addressesOf(parsed.from)[0] ?? '').toLowerCase(),
    subject: parsed.subject ?? '',
    messageId: parsed.messageId ?? '',
  };
  const recipients = options.recipients?.length ? options.recipients : headerRecipients(parsed);
  const byToken = new Map<string, string>();
  for (const recipient of recipients) {
    const token = tokenOfAddress(recipient, deps.config.inbox.domain);
    if (token && !byToken.has(token)) byToken.set(token, recipient.toLowerCase());
  }
  if (byToken.size === 0) return [await refuse(deps.orm.em.fork(), null, mail, recipients[0] ?? '', 'unknown_address', 'No build has this address.')];
  const outcomes: MailOutcome[] = [];
  for (const [token, recipient] of byToken) outcomes.push(await deliver(deps, mail, token, recipient));
  return outcomes;
}
