// Dates on receipts: every printed form, the locale's day/month order, and ambiguity reported, never hidden.
import { findDate, findDates, isDayFirst, numericOrder } from './dates';

describe('isDayFirst', () => {
  it.each([
    ['en-US', false],
    ['en-GB', true],
    ['en-MY', true],
    ['de-DE', true],
    ['en-CA', false],
  ])('%s writes the day first: %s', (locale, expected) => {
    expect(isDayFirst(locale)).toBe(expected);
  });
});

describe('findDate', () => {
  it.each([
    ['DATE 11/14/2026', 'en-US', '2026-11-14'],
    ['DATE 11/14/2026', 'en-GB', '2026-11-14'],
    ['2026-11-14', 'en-GB', '2026-11-14'],
    ['2026/11/14', 'en-US', '2026-11-14'],
    ['Nov 14, 2026 3:42 PM', 'en-US', '2026-11-14'],
    ['November 14th 2026', 'en-US', '2026-11-14'],
    ['14 Nov 2026', 'en-US', '2026-11-14'],
    ['14-Nov-26', 'en-US', '2026-11-14'],
    ['Jul 10, 2026', 'en-US', '2026-07-10'],
    ['14-11-26', 'en-GB', '2026-11-14'],
    ['14-11-26', 'en-US', '2026-11-14'],
    ['14.11.2026', 'de-DE', '2026-11-14'],
    ['Invoice date: 3 Sept 2026', 'en-GB', '2026-09-03'],
  ])('reads "%s" in %s as %s', (text, locale, expected) => {
    expect(findDate(text, locale)?.value).toBe(expected);
  });

  it('reads an unambiguous date with high confidence and no note', () => {
    expect(findDate('DATE 11/14/2026', 'en-US')).toEqual({ value: '2026-11-14', confidence: 0.95, note: null, start: 5, end: 15 });
  });

  it('reads 03/04/2026 month-first in en-US, with a low confidence and a note naming both readings', () => {
    const date = findDate('03/04/2026', 'en-US');
    expect(date?.value).toBe('2026-03-04');
    expect(date?.confidence).toBe(0.5);
    expect(date?.note).toBe(
      "The date 03/04/2026 could be 4 March 2026 or 3 April 2026; read as 4 March 2026 because the build's locale (en-US) writes the month first. Check it against the receipt.",
    );
  });

  it('reads the same 03/04/2026 day-first in en-GB, also flagged', () => {
    const date = findDate('03/04/2026', 'en-GB');
    expect(date?.value).toBe('2026-04-03');
    expect(date?.confidence).toBe(0.5);
    expect(date?.note).toContain('read as 3 April 2026');
  });

  it('reads a two-digit-year date year-first where the locale writes it so (en-CA), and only there', () => {
    expect(numericOrder('en-CA')).toBe('ymd');
    expect(numericOrder('en-US')).toBe('mdy');
    expect(numericOrder('en-GB')).toBe('dmy');
    expect(findDate('26-01-05', 'en-CA')).toMatchObject({ value: '2026-01-05', note: expect.stringContaining('writes the year first') });
    expect(findDate('26-01-05', 'en-GB')).toMatchObject({ value: '2005-01-26', note: null });
  });

  it('needs no note when day and month are the same number', () => {
    expect(findDate('05/05/2026', 'en-US')).toMatchObject({ value: '2026-05-05', note: null });
  });

  it('corrects letters OCR put in the digits, a little less sure', () => {
    const date = findDate('DATE 1O/2S/2026', 'en-US');
    expect(date?.value).toBe('2026-10-25');
    expect(date?.confidence).toBeCloseTo(0.76, 6);
    expect(findDate('N0v 14, 2026', 'en-US')?.value).toBe('2026-11-14');
  });

  it('reads a date whose second separator OCR lost before a four-digit year, a little less sure (from memory: a faint slash)', () => {
    expect(findDate('Date: 22/122025 Cashier', 'en-GB')).toMatchObject({ value: '2025-12-22', note: null });
    expect(findDate('Date: 22/122025', 'en-GB')?.confidence).toBeCloseTo(0.76, 6);
    expect(findDate('06.042020', 'de-DE')?.value).toBe('2020-04-06');
    expect(findDate('12/252025', 'en-US')?.value).toBe('2025-12-25');
  });

  it.each(['02/30/2026', '13/13/2026', 'TEL 03-55012345', 'NO 12/342025', '2026-02-29', 'Feb 30, 2026', 'TEL 555-0198', '7.25%', 'INVOICE 30523'])('finds no date in "%s"', (text) => {
    expect(findDate(text, 'en-US')).toBeNull();
  });

  it('accepts 29 February in a leap year only', () => {
    expect(findDate('2028-02-29', 'en-US')?.value).toBe('2028-02-29');
    expect(findDate('2027-02-29', 'en-US')).toBeNull();
  });

  it('finds several dates in reading order', () => {
    expect(findDates('Ordered 2026-11-02 shipped Nov 5, 2026', 'en-US').map((date) => date.value)).toEqual(['2026-11-02', '2026-11-05']);
  });
});
