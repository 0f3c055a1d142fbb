// Turns an audit event (entity, action, before and after snapshots) into words a partner reads: a label and the
// fields that changed, with money marked so the template formats it through the money pipe.
import type { AuditEventDto } from '../../../../../shared/api/review';
import { parseMoney } from '../../../../../shared/money';
import { CORE_STATE_LABELS, RECEIPT_LINE_KIND_LABELS, REVIEW_STATE_LABELS } from '../../../../../shared/enums';

const ACTION_LABELS: Record<string, string> = {
  'receipt:edit': 'Changed the receipt',
  'receipt:file': 'Filed the receipt',
  'receipt:reopen': 'Reopened the receipt to change it',
  'receipt:review': 'Reviewed the receipt',
  'receipt:answer': 'Answered the question',
  'receipt:not_duplicate': 'Marked not a duplicate',
  'receipt_line:add': 'Added a line',
  'receipt_line:edit': 'Changed a line',
  'receipt_line:delete': 'Deleted a line',
  'receipt_line:split': 'Split a line across systems',
  'receipt_line:merge': 'Merged lines',
  'core:edit': 'Changed a core charge',
};

const FIELD_LABELS: Record<string, string> = {
  kind: 'Kind',
  description: 'Description',
  quantity: 'Quantity',
  unitPrice: 'Unit price',
  amount: 'Amount',
  partId: 'Part',
  systemId: 'System',
  subtotal: 'Subtotal',
  tax: 'Tax',
  shipping: 'Shipping',
  discount: 'Discount',
  total: 'Total',
  differenceAccepted: 'Difference accepted',
  differenceReason: 'Reason for the difference',
  reviewState: 'Review',
  state: 'State',
  dueDate: 'Due',
  shares: 'Shares',
  lines: 'Lines',
  otherReceiptId: 'Of',
  reason: 'Reason',
};

/** Fields in the order a receipt is read: the line, where it went, then the figures from subtotal down to total. */
const FIELD_ORDER = [
  'kind',
  'description',
  'quantity',
  'unitPrice',
  'amount',
  'partId',
  'systemId',
  'subtotal',
  'tax',
  'shipping',
  'discount',
  'total',
  'differenceAccepted',
  'differenceReason',
  'reviewState',
  'state',
  'dueDate',
  'shares',
  'lines',
];

function fieldRank(field: string): number {
  const rank = FIELD_ORDER.indexOf(field);
  return rank === -1 ? FIELD_ORDER.length : rank;
}

const MONEY_FIELDS = new Set(['unitPrice', 'amount', 'subtotal', 'tax', 'shipping', 'discount', 'total']);

export interface AuditChange {
  field: string;
  /** "change": before → after; "set": a new record's value (nothing before it); "removed": a deleted record's value. */
  kind: 'change' | 'set' | 'removed';
  label: string;
  /** Money (a decimal string) goes through the money pipe; anything else is shown as it is. */
  money: boolean;
  before: string | null;
  after: string | null;
}

export interface AuditEntry {
  id: string;
  label: string;
  who: string;
  at: string;
  changes: AuditChange[];
}

function textOf(field: string, value: unknown, names: Record<string, string>, systemName: (id: string) => string): string | null {
  if (value === null || value === undefined || value === '') return null;
  if (Array.isArray(value)) return `${value.length} ${value.length === 1 ? 'line' : 'lines'}`;
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'object') return null;
  const text = String(value);
  if (field === 'systemId') return names[text] ?? systemName(text);
  if (field === 'partId') return names[text] ?? 'A part';
  if (field === 'otherReceiptId') return names[text] ?? 'Another receipt';
  if (field === 'kind') return RECEIPT_LINE_KIND_LABELS[text as keyof typeof RECEIPT_LINE_KIND_LABELS] ?? text;
  if (field === 'reviewState') return REVIEW_STATE_LABELS[text as keyof typeof REVIEW_STATE_LABELS] ?? text;
  if (field === 'state') return CORE_STATE_LABELS[text as keyof typeof CORE_STATE_LABELS] ?? text;
  return text;
}

export function auditEntry(event: AuditEventDto, systemName: (id: string) => string): AuditEntry {
  const before = event.before ?? {};
  const after = event.after ?? {};
  const kind: AuditChange['kind'] = event.before === null ? 'set' : event.after === null ? 'removed' : 'change';
  const fields = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort((a, b) => fieldRank(a) - fieldRank(b));
  const names = event.names ?? {};
  const changes: AuditChange[] = [];
  for (const field of fields) {
    const was = textOf(field, before[field], names, systemName);
    const now = textOf(field, after[field], names, systemName);
    // Money compares by value: "80" and "80.00" are the same amount.
    const same = MONEY_FIELDS.has(field) && was !== null && now !== null ? sameAmount(was, now) : was === now;
    if (same || (was === null && now === null)) continue;
    // A new record's "no" (no difference accepted) says nothing.
    if (kind === 'set' && after[field] === false) continue;
    changes.push({ field, kind, label: FIELD_LABELS[field] ?? field, money: MONEY_FIELDS.has(field), before: was, after: now });
  }
  return { id: event.id, label: ACTION_LABELS[`${event.entity}:${event.action}`] ?? `${event.entity} ${event.action}`, who: event.who, at: event.at, changes };
}

function sameAmount(left: string, right: string): boolean {
  const a = parseMoney(left);
  const b = parseMoney(right);
  return a.ok && b.ok ? a.value.equals(b.value) : left === right;
}
