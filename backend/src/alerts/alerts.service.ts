// Mail alerts: which events are due on each build, who wants them (their preferences, else their role's defaults),
// and the send step that records each (person, kind, event) once so a mail never goes out twice.
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import { ALERT_KINDS, DEFAULT_ALERT_PREFERENCES, type AlertKind, type AlertPreferences } from '../../../shared/api/alerts';
import { percentOfBudget } from '../../../shared/build-figures';
import { Decimal, formatMoney, sum, toDecimal } from '../../../shared/money';
import { warrantyEnds } from '../../../shared/warranty';
import type { Build } from '../builds/build.entity';
import { Membership } from '../builds/membership.entity';
import type { AppConfig } from '../config';
import { LINE_TOTAL } from '../ledger/figure-lines';
import { buildLedger } from '../ledger/ledger.service';
import type { MailMessage, Mailer } from '../mail/mailer';
import { budgetAlertMail, coreDueMail, duplicateReceiptMail, returnWindowMail, reviewDigestMail, warrantyEndingMail } from '../mail/templates';
import { findDuplicates } from '../receipts/receipt-dto';
import { Receipt } from '../receipts/receipt.entity';
import { RETURNABLE_LINE, RETURNABLE_UNTIL } from '../receipts/returns.service';
import { AlertPreference } from './alert-preference.entity';
import { AlertSent } from './alert-sent.entity';

export interface AlertDeps {
  orm: MikroORM;
  mailer: Mailer;
  config: AppConfig;
}

/** A core deposit or a return window is announced this many days ahead (our choice, the same as the 7 for cores). */
export const DAYS_AHEAD = 7;
/** A warranty's end is announced this many days ahead: time to take a failing part back with its receipt (our choice). */
export const WARRANTY_DAYS_AHEAD = 30;
/** A receipt counts as a fresh duplicate for this long after upload; older ones are history, not news (our choice). */
export const DUPLICATE_FRESH_DAYS = 30;

// ---------------------------------------------------------------- preferences

export function effectivePreferences(membership: Membership, chosen: AlertPreference | null): AlertPreferences {
  if (!chosen) return { ...DEFAULT_ALERT_PREFERENCES[membership.role] };
  return Object.fromEntries(ALERT_KINDS.map((kind) => [kind, chosen[kind]])) as AlertPreferences;
}

export async function preferencesOf(em: EntityManager, membership: Membership): Promise<{ preferences: AlertPreferences; chosen: boolean }> {
  const chosen = await em.findOne(AlertPreference, { membership });
  return { preferences: effectivePreferences(membership, chosen), chosen: !!chosen };
}

export async function savePreferences(em: EntityManager, membership: Membership, input: AlertPreferences): Promise<AlertPreferences> {
  const values = Object.fromEntries(ALERT_KINDS.map((kind) => [kind, input[kind]])) as AlertPreferences;
  // An upsert, so two tabs saving at once both succeed and the last one stands.
  await em.upsert(AlertPreference, { id: randomUUID(), membership, ...values, updatedAt: new Date() }, { onConflictFields: ['membership'], onConflictAction: 'merge', onConflictMergeFields: [...ALERT_KINDS, 'updatedAt'] });
  return values;
}

// ---------------------------------------------------------------- dates

/** Alerts work in whole UTC days: the server's calendar, whatever time zone the person is in. */
function utcDay(moment: Date): string {
  return moment.toISOString().slice(0, 10);
}

function addDays(isoDate: string, days: number): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

function daysBetween(fromIso: string, toIso: string): number {
  return Math.round((Date.parse(`${toIso}T00:00:00Z`) - Date.parse(`${fromIso}T00:00:00Z`)) / 86_400_000);
}

function whenText(days: number): string {
  if (days === 0) return 'today';
  if (days > 0) return days === 1 ? 'tomorrow' : `in ${days} days`;
  return days === -1 ? 'yesterday' : `${-days} days ago`;
}

function formatDay(isoDate: string, locale: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(`${isoDate}T00:00:00Z`));
}

// ---------------------------------------------------------------- events

/** One mail about one or more events: the mail is written from the keys whose record was new. */
export interface DueAlert {
  kind: AlertKind;
  /** The keys this mail is about; it is sent when at least one of them had not been sent to the person before. */
  keys: string[];
  /** Keys recorded as sent with this mail without being its subject (the 90 % mark when a system jumps past 100 %). */
  alsoRecords?: string[];
  /** Only members who joined before this moment get it (news from before they joined is not news to them). */
  notBefore?: Date;
  message(to: string, newKeys: string[]): MailMessage;
}

interface BuildContext {
  build: Build;
  config: AppConfig;
  today: string;
  money(amount: Decimal | string): string;
  settingsLink: string;
}

async function budgetAlerts(em: EntityManager, ctx: BuildContext): Promise<DueAlert[]> {
  const ledger = await buildLedger(em, ctx.build);
  const alerts: DueAlert[] = [];
  for (const system of ledger.systems) {
    const budget = toDecimal(system.budget);
    const netCost = toDecimal(system.netCost);
    if (!budget.greaterThan(0)) continue;
    // netCost / budget >= 90 %, compared without dividing: netCost × 100 >= budget × 90.
    const percentOf = (share: number) => netCost.times(100).greaterThanOrEqualTo(budget.times(share));
    const threshold = percentOf(100) ? 100 : percentOf(90) ? 90 : null;
    if (!threshold) continue;
    // Whole percent, rounded as on every screen (the threshold itself is compared exactly above).
    const percent = percentOfBudget(system.netCost, system.budget) ?? '0';
    alerts.push({
      kind: 'budget',
      keys: [`budget:${system.systemId}:${threshold}`],
      alsoRecords: threshold === 100 ? [`budget:${system.systemId}:90`] : [],
      message: (to) =>
        budgetAlertMail({
          to,
          buildName: ctx.build.name,
          systemName: system.name,
          threshold,
          netCost: ctx.money(netCost),
          budget: ctx.money(budget),
          percent,
          link: `${ctx.config.appUrl}/builds/${ctx.build.id}/ledger`,
          settingsLink: ctx.settingsLink,
        }),
    });
  }
  return alerts;
}

async function coreDueAlerts(em: EntityManager, ctx: BuildContext): Promise<DueAlert[]> {
  // Still owed (the old part not handed in) and due within the week, or already late; on filed receipts only.
  const rows = await em.getConnection().execute<{ id: string; due_date: string; description: string; amount: string; vendor_name: string | null }[]>(
    // The part the deposit is for names it better than the slip's line, which often just says "core charge".
    `select c.id, c.due_date, coalesce(p.description, l.description) as description, ${LINE_TOTAL} as amount, v.name as vendor_name
       from core c
       join receipt_line l on l.id = c.charge_line_id
       left join part p on p.id = l.part_id
       join receipt r on r.id = l.receipt_id and r.state = 'filed'
       left join vendor v on v.id = r.vendor_id
      where c.build_id = ? and c.state = 'owed' and c.due_date <= ?::date
      order by c.due_date, c.id`,
    [ctx.build.id, addDays(ctx.today, DAYS_AHEAD)],
  );
  return rows.map((row) => {
    const days = daysBetween(ctx.today, row.due_date);
    return {
      kind: 'coreDue' as const,
      keys: [`core-due:${row.id}`],
      message: (to: string) =>
        coreDueMail({
          to,
          buildName: ctx.build.name,
          description: row.description,
          deposit: ctx.money(row.amount),
          dueDate: formatDay(row.due_date, ctx.build.locale),
          when: whenText(days),
          vendorName: row.vendor_name,
          overdue: days < 0,
          link: `${ctx.config.appUrl}/builds/${ctx.build.id}/cores`,
          settingsLink: ctx.settingsLink,
        }),
    };
  });
}

/**
 * A part line of a filed receipt is returnable until purchase date + the build's return window, while its part is
 * not fitted, sent back or sold and no return line points at it (the rule the returns list shares). Announced in
 * the last week of the window.
 */
async function returnWindowAlerts(em: EntityManager, ctx: BuildContext): Promise<DueAlert[]> {
  const rows = await em.getConnection().execute<
    { id: string; receipt_id: string; description: string; amount: string; purchase_date: string; returnable_until: string; vendor_name: string | null }[]
  >(
    `select l.id, l.receipt_id, l.description, ${LINE_TOTAL} as amount, r.purchase_date,
            ${RETURNABLE_UNTIL}::text as returnable_until, v.name as vendor_name
       from receipt_line l
       join receipt r on r.id = l.receipt_id
       join build b on b.id = l.build_id
       join part p on p.id = l.part_id
       left join vendor v on v.id = r.vendor_id
      where l.build_id = ? and ${RETURNABLE_LINE}
        and ${RETURNABLE_UNTIL} between ?::date and ?::date
      order by r.purchase_date, r.id, l.position, l.id`,
    [ctx.build.id, ctx.today, addDays(ctx.today, DAYS_AHEAD)],
  );
  // One mail per receipt, listing the lines not announced before.
  const byReceipt = new Map<string, typeof rows>();
  for (const row of rows) byReceipt.set(row.receipt_id, [...(byReceipt.get(row.receipt_id) ?? []), row]);
  return [...byReceipt.entries()].map(([receiptId, lines]) => ({
    kind: 'returnWindow' as const,
    keys: lines.map((line) => `return-window:${line.id}`),
    message: (to: string, newKeys: string[]) =>
      returnWindowMail({
        to,
        buildName: ctx.build.name,
        vendorName: lines[0].vendor_name,
        purchaseDate: formatDay(lines[0].purchase_date, ctx.build.locale),
        returnableUntil: formatDay(lines[0].returnable_until, ctx.build.locale),
        lines: lines.filter((line) => newKeys.includes(`return-window:${line.id}`)).map((line) => ({ description: line.description, amount: ctx.money(line.amount) })),
        link: `${ctx.config.appUrl}/builds/${ctx.build.id}/receipts/${receiptId}`,
        settingsLink: ctx.settingsLink,
      }),
  }));
}

/**
 * A warranty of whole months that ends within WARRANTY_DAYS_AHEAD, on a part still on the build (not sent back or
 * sold). The key holds the end day, so a warranty the person changes afterwards is news again; the same one is not.
 */
async function warrantyEndingAlerts(em: EntityManager, ctx: BuildContext): Promise<DueAlert[]> {
  const rows = await em.getConnection().execute<
    { id: string; description: string; months: number; start: string; receipt_id: string | null; purchase_date: string | null; vendor_name: string | null }[]
  >(
    `select p.id, p.description, p.warranty_months as months, p.warranty_start::text as start, r.id as receipt_id,
            r.purchase_date::text as purchase_date, v.name as vendor_name
       from part p
       left join receipt r on r.id = p.warranty_receipt_id
       left join vendor v on v.id = r.vendor_id
      where p.build_id = ? and p.warranty_months is not null and p.status not in ('returned', 'sold')
      order by p.warranty_start, p.id`,
    [ctx.build.id],
  );
  const last = addDays(ctx.today, WARRANTY_DAYS_AHEAD);
  return rows.flatMap((row) => {
    const ends = warrantyEnds(row.months, row.start)!;
    if (ends < ctx.today || ends > last) return [];
    const shop = row.vendor_name ?? 'an unknown shop';
    return [
      {
        kind: 'warrantyEnding' as const,
        keys: [`warranty-ends:${row.id}:${ends}`],
        message: (to: string) =>
          warrantyEndingMail({
            to,
            buildName: ctx.build.name,
            description: row.description,
            months: row.months,
            ends: formatDay(ends, ctx.build.locale),
            when: whenText(daysBetween(ctx.today, ends)),
            receiptLabel: row.receipt_id ? (row.purchase_date ? `${shop} of ${formatDay(row.purchase_date, ctx.build.locale)}` : shop) : null,
            link: row.receipt_id ? `${ctx.config.appUrl}/builds/${ctx.build.id}/receipts/${row.receipt_id}` : `${ctx.config.appUrl}/builds/${ctx.build.id}/parts`,
            settingsLink: ctx.settingsLink,
          }),
      },
    ];
  });
}

function receiptLabel(receipt: Receipt, ctx: BuildContext): string {
  const parts = [`The receipt from ${receipt.vendor?.name ?? 'an unknown shop'}`];
  if (receipt.purchaseDate) parts.push(`of ${formatDay(receipt.purchaseDate, ctx.build.locale)}`);
  if (receipt.total) parts.push(`(total ${ctx.money(receipt.total)})`);
  return parts.join(' ');
}

/** The later receipt of a likely-duplicate pair is the one announced; the detection is the receipts list's own. */
async function duplicateAlerts(em: EntityManager, ctx: BuildContext, now: Date): Promise<DueAlert[]> {
  const fresh = await em.find(
    Receipt,
    { build: ctx.build, state: { $in: ['to_check', 'filed'] }, createdAt: { $gte: new Date(now.getTime() - DUPLICATE_FRESH_DAYS * 86_400_000), $lte: now } },
    { populate: ['vendor', 'build'], orderBy: { createdAt: 'asc', id: 'asc' } },
  );
  if (fresh.length === 0) return [];
  const duplicates = await findDuplicates(em, fresh[0].build.id, fresh.map((receipt) => receipt.id));
  const otherIds = [...new Set([...duplicates.values()].flat())];
  const others = new Map((otherIds.length ? await em.find(Receipt, { id: { $in: otherIds } }) : []).map((r) => [r.id, r]));
  const isEarlier = (other: Receipt, receipt: Receipt) =>
    other.createdAt < receipt.createdAt || (other.createdAt.getTime() === receipt.createdAt.getTime() && other.id < receipt.id);
  const alerts: DueAlert[] = [];
  for (const receipt of fresh) {
    const earlier = (duplicates.get(receipt.id) ?? []).map((id) => others.get(id)).filter((other): other is Receipt => !!other && isEarlier(other, receipt));
    if (earlier.length === 0) continue;
    alerts.push({
      kind: 'duplicate',
      keys: [`duplicate:${receipt.id}`],
      notBefore: receipt.createdAt,
      message: (to) =>
        duplicateReceiptMail({
          to,
          buildName: ctx.build.name,
          receiptLabel: receiptLabel(receipt, ctx),
          sameDocument: earlier.some((other) => other.sha256 === receipt.sha256),
          otherCount: earlier.length,
          link: `${ctx.config.appUrl}/builds/${ctx.build.id}/receipts/${receipt.id}`,
          settingsLink: ctx.settingsLink,
        }),
    });
  }
  return alerts;
}

/**
 * At most one digest a UTC day per person and build: the receipts filed since their last digest (or since they
 * joined) up to now, with the count and the total per currency. None when nothing was filed.
 */
async function digestAlert(em: EntityManager, ctx: BuildContext, membership: Membership, now: Date): Promise<DueAlert | null> {
  const key = `digest:${ctx.build.id}:${ctx.today}`;
  if (await em.count(AlertSent, { user: membership.user, kind: 'reviewDigest', eventKey: key })) return null;
  const last = await em.findOne(AlertSent, { user: membership.user, build: ctx.build, kind: 'reviewDigest' }, { orderBy: { sentAt: 'desc' } });
  const since = last?.sentAt ?? membership.createdAt;
  const filed = await em.find(
    Receipt,
    { build: ctx.build, state: 'filed', filedAt: { $gt: since, $lte: now } },
    { populate: ['vendor'], orderBy: { filedAt: 'asc', id: 'asc' } },
  );
  if (filed.length === 0) return null;
  // Every amount of a build is in its currency, so the total per currency is one figure; kept per currency in the
  // mail's wording so a digest over several builds could be written the same way.
  const totals = [`${ctx.money(sum(filed.map((receipt) => receipt.total ?? new Decimal(0))))} (${ctx.build.currency})`];
  return {
    kind: 'reviewDigest',
    keys: [key],
    message: (to) =>
      reviewDigestMail({
        to,
        buildName: ctx.build.name,
        since: new Intl.DateTimeFormat(ctx.build.locale, { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' }).format(since) + ' UTC',
        receipts: filed.map((receipt) => ({
          label: `${receipt.purchaseDate ? formatDay(receipt.purchaseDate, ctx.build.locale) : 'No date'}, ${receipt.vendor?.name ?? 'unknown shop'}`,
          total: receipt.total ? ctx.money(receipt.total) : 'no printed total',
        })),
        totals,
        link: `${ctx.config.appUrl}/builds/${ctx.build.id}/review`,
        settingsLink: ctx.settingsLink,
      }),
  };
}

// ---------------------------------------------------------------- sending

/**
 * Records the alert for the person and mails it, in one transaction: the insert takes the unique key first
 * (ON CONFLICT DO NOTHING), so a second run, or a run at the same time (it waits on the key), finds it taken and
 * sends nothing. A mail that fails to send rolls the record back, so the next run tries again.
 */
async function sendOnce(deps: AlertDeps, membership: Membership, alert: DueAlert, now: Date): Promise<boolean> {
  return deps.orm.em.fork().transactional(async (tx) => {
    const connection = tx.getConnection();
    const record = async (key: string) => {
      const rows = await connection.execute<{ id: string }[]>(
        `insert into alert_sent (id, user_id, build_id, kind, event_key, sent_at) values (?, ?, ?, ?, ?, ?)
         on conflict (user_id, kind, event_key) do nothing returning id`,
        [randomUUID(), membership.user.id, membership.build.id, alert.kind, key, now],
        'all',
        tx.getTransactionContext(),
      );
      return rows.length > 0;
    };
    const newKeys: string[] = [];
    for (const key of alert.keys) if (await record(key)) newKeys.push(key);
    if (newKeys.length === 0) return false;
    for (const key of alert.alsoRecords ?? []) await record(key);
    await deps.mailer.send(alert.message(membership.user.email, newKeys));
    return true;
  });
}

export type AlertRunSummary = Record<AlertKind, number>;

const EVENTS_OF_BUILD: Record<Exclude<AlertKind, 'reviewDigest'>, (em: EntityManager, ctx: BuildContext, now: Date) => Promise<DueAlert[]>> = {
  budget: (em, ctx) => budgetAlerts(em, ctx),
  coreDue: (em, ctx) => coreDueAlerts(em, ctx),
  returnWindow: (em, ctx) => returnWindowAlerts(em, ctx),
  warrantyEnding: (em, ctx) => warrantyEndingAlerts(em, ctx),
  duplicate: duplicateAlerts,
};

/**
 * Finds every alert due at `now` on every current build and mails each member who wants it, once. Only current
 * members are asked, so a person removed from a build gets nothing more about it. Returns the mails sent per kind.
 */
export async function sendDueAlerts(deps: AlertDeps, now: Date): Promise<AlertRunSummary> {
  const em = deps.orm.em.fork();
  const summary = Object.fromEntries(ALERT_KINDS.map((kind) => [kind, 0])) as AlertRunSummary;
  const memberships = await em.find(Membership, { build: { archivedAt: null } }, { populate: ['build', 'user'], orderBy: { build: { id: 'asc' }, createdAt: 'asc' } });
  const chosen = new Map(
    (memberships.length ? await em.find(AlertPreference, { membership: { $in: memberships.map((m) => m.id) } }) : []).map((p) => [p.membership.id, p]),
  );
  const byBuild = new Map<string, { membership: Membership; wants: AlertPreferences }[]>();
  for (const membership of memberships) {
    const wants = effectivePreferences(membership, chosen.get(membership.id) ?? null);
    if (!ALERT_KINDS.some((kind) => wants[kind])) continue;
    byBuild.set(membership.build.id, [...(byBuild.get(membership.build.id) ?? []), { membership, wants }]);
  }

  for (const members of byBuild.values()) {
    const build = members[0].membership.build;
    const ctx: BuildContext = {
      build,
      config: deps.config,
      today: utcDay(now),
      money: (amount) => formatMoney(typeof amount === 'string' ? toDecimal(amount) : amount, build.currency, build.locale),
      settingsLink: `${deps.config.appUrl}/builds/${build.id}/alerts`,
    };
    for (const kind of Object.keys(EVENTS_OF_BUILD) as (keyof typeof EVENTS_OF_BUILD)[]) {
      const wanting = members.filter((member) => member.wants[kind]);
      if (wanting.length === 0) continue;
      const alerts = await EVENTS_OF_BUILD[kind](em, ctx, now);
      for (const alert of alerts) {
        for (const { membership } of wanting) {
          if (alert.notBefore && membership.createdAt > alert.notBefore) continue;
          if (await sendOnce(deps, membership, alert, now)) summary[kind] += 1;
        }
      }
    }
    for (const { membership, wants } of members) {
      if (!wants.reviewDigest) continue;
      const digest = await digestAlert(em, ctx, membership, now);
      if (digest && (await sendOnce(deps, membership, digest, now))) summary.reviewDigest += 1;
    }
  }
  return summary;
}
