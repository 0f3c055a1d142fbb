// Shows a calendar date (YYYY-MM-DD from the API) in the build's language and region.

export function formatCalendarDate(value: string | null, locale: string): string {
  if (!value) return 'Not set';
  const date = new Date(`${value}T00:00:00Z`);
  if (Number.isNaN(date.getTime())) return value;
  try {
    // UTC on both sides: a calendar date has no time zone, so it must not shift a day.
    return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone: 'UTC' }).format(date);
  } catch {
    return value;
  }
}
