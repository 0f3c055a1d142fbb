// Puts the demo build's receipt history through the product's own steps: upload to the store, the reading job's
// write-out, checking and assigning lines, filing, the partner's review; then dates each step back to its day.
import type { MikroORM, EntityManager } from '@mikro-orm/postgresql';
import { AuditEvent } from '../audit/audit-event.entity';
import { User } from '../auth/user.entity';
import { Build } from '../builds/build.entity';
import { loadConfig, type AppConfig } from '../config';
import { readQueuedReceipt, type DocumentReading } from '../jobs/read-receipt.job';
import type { Mailer } from '../mail/mailer';
import { Decimal, toWire } from '../../../shared/money';
import type { ReadReceipt } from '../../../shared/api/receipt-reading';
import type { BuildRole } from '../../../shared/enums';
import { Part } from '../parts/part.entity';
import { fileReceipt } from '../receipts/receipt-filing';
import { updateLine } from '../receipts/receipt-lines.service';
import { ReceiptLine } from '../receipts/receipt-line.entity';
import { Receipt } from '../receipts/receipt.entity';
import { findReceipt, storeReceiptDocument, updateReceipt } from '../receipts/receipts.service';
import { checkUpload } from '../receipts/upload-check';
import { comment, review } from '../review/review.service';
import { Comment } from '../review/comment.entity';
import type { ObjectStore } from '../storage/object-store';
import { VehicleSystem } from '../systems/vehicle-system.entity';
import { DEMO_HISTORY, workReceipt, type HistoryReceipt, type WorkedReceipt } from './demo-history';
import { DEMO_PEOPLE } from './demo-scenario';
import { renderSlipAsync, type RenderedSlip } from './receipt-slip';

/** The deposit window the demo's shops give for cores, in days (common practice: 30 to 90). */
const CORE_DUE_DAYS = 30;

/** The history happened months ago: its comment notices were read then, so none goes out now. */
const PAST_MAIL: Mailer = { async send() {}, close() {} };

/** What the reader would have found on a clean slip: the printed figures, sure of each, with the boxes of its rows. */
function readingOf(worked: WorkedReceipt, rendered: RenderedSlip): DocumentReading {
  // A rendered slip is already upright, on white and between the reader's size limits: normalising it would change
  // nothing a person sees, and costs about a quarter second a slip on a small machine.
  const page = { png: rendered.png, width: rendered.width, height: rendered.height };
  const sure = <T>(value: T | null, confidence = 0.97) => ({ value, confidence });
  const money = (value: Decimal | null) => sure(value === null ? null : toWire(value, 2));
  // The unchecked receipt keeps a doubtful date, as a creased slip would.
  const dateConfidence = worked.history.toCheck ? 0.58 : 0.96;
  const reading: ReadReceipt = {
    vendor: sure(worked.slip.vendor, 0.93),
    date: sure(worked.history.date, dateConfidence),
    currency: sure('USD', 0.9),
    lines: worked.slip.lines.map((line, index) => ({
      ...line,
      confidence: 0.95,
      box: rendered.lineBoxes[index] ? { page: 0, ...rendered.lineBoxes[index]! } : null,
    })),
    subtotal: money(worked.subtotal),
    tax: money(worked.tax),
    shipping: money(worked.shipping),
    discount: sure(null, 0),
    total: money(worked.total),
    notes: worked.history.toCheck ? ['The date is hard to read: check it against the slip.'] : [],
    pages: [{ width: page.width, height: page.height, source: 'ocr' }],
    words: rendered.rows.map((row) => ({ text: row.text, confidence: 0.95, box: { page: 0, ...row.box } })),
  };
  return { reading, pageImages: [page] };
}

/** A timestamp on a day of the history, so lists and trails read as months of work, not one second. */
function at(day: string, time: string): Date {
  return new Date(`${day}T${time}Z`);
}

function dayAfter(day: string): string {
  const date = new Date(`${day}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString().slice(0, 10);
}

export async function seedHistory(deps: { orm: MikroORM; store: ObjectStore; config?: AppConfig }, buildId: string): Promise<void> {
  const config = deps.config ?? loadConfig();
  const em = deps.orm.em.fork();
  const parts = new Map((await em.find(Part, { build: buildId })).map((part) => [part.partNumber, part.id]));
  const systems = new Map((await em.find(VehicleSystem, { build: buildId })).map((system) => [system.name, system.id]));
  const context: HistoryContext = { ...deps, config, buildId, parts, systems, linesByReceipt: new Map() };
  // One lane per shop, each in date order: a return or a core credit always follows its purchase at the same shop,
  // and no two lanes ever make the same shop's vendor row at once. The lanes run side by side to keep start-up short.
  const lanes = new Map<string, HistoryReceipt[]>();
  for (const history of DEMO_HISTORY) lanes.set(history.shop, [...(lanes.get(history.shop) ?? []), history]);
  const outcomes = await Promise.allSettled(
    [...lanes.values()].map(async (lane) => {
      for (const history of lane) await seedReceipt(context, history);
    }),
  );
  const failed = outcomes.find((outcome) => outcome.status === 'rejected');
  if (failed) throw failed.reason;
}

interface HistoryContext {
  orm: MikroORM;
  store: ObjectStore;
  config: AppConfig;
  buildId: string;
  /** Part ids by part number and system ids by name, as the check screen's pickers offer them. */
  parts: Map<string, string>;
  systems: Map<string, string>;
  /** Line ids of each receipt read so far, for returns and core credits that point back at them. */
  linesByReceipt: Map<string, string[]>;
}

async function seedReceipt(context: HistoryContext, history: HistoryReceipt): Promise<void> {
  const worked = workReceipt(history);
  const rendered = await renderSlipAsync(worked.slip);
  const uploaderRole: BuildRole = history.by === 'builder' ? 'owner' : 'crew';
  const personOf = (role: BuildRole) => DEMO_PEOPLE.find((p) => p.role === role)!.email;

  // Upload: the same key scheme, hash and row as a person's upload.
  const uploadEm = context.orm.em.fork();
  const stored = await storeReceiptDocument(
    uploadEm,
    context.store,
    await uploadEm.findOneOrFail(Build, { id: context.buildId }),
    await uploadEm.findOneOrFail(User, { email: personOf(uploaderRole) }),
    { originalFilename: `${history.shop}-${history.date}.png`, bytes: rendered.png, sniffed: await checkUpload(rendered.png) },
  );
  await uploadEm.flush();

  // Reading: the worker's own step, with the slip's printed figures as what was read.
  const reading = readingOf(worked, rendered);
  const outcome = await readQueuedReceipt({ orm: context.orm, store: context.store, read: async () => reading }, stored.id, true);
  if (outcome !== 'read') throw new Error(`The demo receipt ${history.key} was not read (${outcome}).`);

  // Checking, in a fresh unit of work as a new request would be: the receipt number, then each line to its part or
  // system, as on the check screen.
  const em = context.orm.em.fork();
  const build = await em.findOneOrFail(Build, { id: context.buildId });
  const people = new Map((await em.find(User, { email: { $in: DEMO_PEOPLE.map((p) => p.email) } })).map((user) => [user.email, user]));
  const uploader = people.get(personOf(uploaderRole))!;
  const receipt = await findReceipt(em, build, stored.id);
  await updateReceipt(em, receipt, uploader, uploaderRole, { receiptNumber: history.receiptNumber, version: receipt.version });
  const lines = await em.find(ReceiptLine, { receipt }, { orderBy: { position: 'asc' } });
  context.linesByReceipt.set(history.key, lines.map((line) => line.id));
  const uploadedAt = at(history.date, '19:05:00');
  if (history.toCheck) return backdate(em, receipt.id, uploadedAt);
  for (const [index, line] of lines.entries()) {
    const target = worked.lines[index].to;
    const changes: Parameters<typeof updateLine>[5] = { version: line.version };
    if (!worked.lines[index].taxable) changes.taxable = false;
    if ('part' in target) changes.partId = context.parts.get(target.part)!;
    else if ('system' in target) changes.systemId = context.systems.get(target.system)!;
    else if ('returnOf' in target) changes.returnOfLineId = context.linesByReceipt.get(target.returnOf.receipt)![target.returnOf.line];
    else if (changes.taxable === undefined) continue;
    await updateLine(em, receipt, line.id, uploader, uploaderRole, changes);
  }

  // Filing: allocation, cores and the audit trail come from the filing code itself.
  await fileReceipt(em, receipt, uploader, uploaderRole, { version: receipt.version, coreDueDays: CORE_DUE_DAYS });
  await backdate(em, receipt.id, uploadedAt);

  if (!history.review) return;
  const reviewDeps = { mailer: PAST_MAIL, config: context.config };
  const partner = people.get(personOf('reviewer'))!;
  await review(em, reviewDeps, receipt, partner, { verdict: history.review.verdict, comment: history.review.comment ?? '', version: receipt.version });
  const reviewedAt = at(history.review.on, '08:40:00');
  await em.nativeUpdate(Receipt, { id: receipt.id }, { reviewedAt, updatedAt: reviewedAt });
  await em.nativeUpdate(AuditEvent, { receiptId: receipt.id, action: 'review' }, { createdAt: reviewedAt });
  await em.nativeUpdate(Comment, { receipt: receipt.id }, { createdAt: reviewedAt });
  if (history.review.reply) {
    // The uploader's reply answers the question, as it does in the app: the receipt is back in the partner's queue.
    await em.refresh(receipt); // the back-dating above moved its version on
    const reply = await comment(em, reviewDeps, receipt, uploader, uploaderRole, history.review.reply);
    const repliedAt = at(dayAfter(history.review.on), '18:15:00');
    await em.nativeUpdate(Comment, { id: reply.id }, { createdAt: repliedAt });
    await em.nativeUpdate(AuditEvent, { receiptId: receipt.id, action: 'answer' }, { createdAt: repliedAt });
  }
}

/** Moves a receipt's upload, checking and filing (and any core it opened) to the evening of its purchase, keeping their order. */
async function backdate(em: EntityManager, receiptId: string, uploadedAt: Date): Promise<void> {
  const connection = em.getConnection();
  const [{ started }] = await connection.execute<{ started: Date }[]>('select created_at as started from receipt where id = ?', [receiptId]);
  const shiftSeconds = (uploadedAt.getTime() - new Date(started).getTime()) / 1000;
  await connection.execute(
    `update receipt set created_at = created_at + make_interval(secs => ?), updated_at = updated_at + make_interval(secs => ?),
            filed_at = filed_at + make_interval(secs => ?) where id = ?`,
    [shiftSeconds, shiftSeconds, shiftSeconds, receiptId],
  );
  await connection.execute('update audit_event set created_at = created_at + make_interval(secs => ?) where receipt_id = ?', [shiftSeconds, receiptId]);
  return connection.execute(
    `update core set created_at = created_at + make_interval(secs => ?), updated_at = updated_at + make_interval(secs => ?)
      where charge_line_id in (select id from receipt_line where receipt_id = ?) or refund_line_id in (select id from receipt_line where receipt_id = ?)`,
    [shiftSeconds, shiftSeconds, receiptId, receiptId],
  ).then(() => undefined);
}
