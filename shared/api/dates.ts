// Calendar dates on the wire (YYYY-MM-DD): the shape, and that the day exists (no 2026-02-30, no month 13).
import { z } from 'zod';

/** True when `value` is YYYY-MM-DD and names a day that exists in the Gregorian calendar. */
export function isCalendarDate(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const parsed = new Date(`${value}T00:00:00Z`);
  // Date rolls impossible days over (02-30 becomes 03-02), so the round trip must give the same text back.
  return !Number.isNaN(parsed.getTime()) && parsed.toISOString().startsWith(value);
}

export const calendarDate = z
  .string({ error: 'Use a date like 2026-11-14.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-11-14.')
  .refine(isCalendarDate, 'That date does not exist.');

const optionalQueryDate = z.preprocess((value) => (value === '' ? undefined : value), calendarDate.optional());

/** The `from`/`to` filters of lists and exports (query strings: an empty value means no filter). */
export const dateRangeQuery = z.object({ from: optionalQueryDate, to: optionalQueryDate });

/**
 * `months` calendar months after a YYYY-MM-DD day, clamped to the last day of the month reached when that month is
 * shorter (31 January + 1 month is 28 February, or 29 in a leap year), as date libraries define it.
 */
export function addMonths(isoDate: string, months: number): string {
  const [year, month, day] = isoDate.split('-').map(Number);
  const monthIndex = month - 1 + months;
  const targetYear = year + Math.floor(monthIndex / 12);
  const targetMonth = ((monthIndex % 12) + 12) % 12;
  // Day 0 of the next month is the last day of this one.
  const lastDay = new Date(Date.UTC(targetYear, targetMonth + 1, 0)).getUTCDate();
  const date = new Date(Date.UTC(targetYear, targetMonth, Math.min(day, lastDay)));
  date.setUTCFullYear(targetYear); // Date.UTC reads years 0-99 as 1900-1999.
  return date.toISOString().slice(0, 10);
}
