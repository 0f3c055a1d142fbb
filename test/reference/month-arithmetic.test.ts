// addMonths (shared/api/dates.ts), which gives a warranty's end, checked against an outside reference: the moment
// package's add(n, 'months'), which clamps to the last day of a shorter month. moment is installed for the Material
// date adapter; date-fns is not installed here.
import moment from 'moment';
import { addMonths } from '../../shared/api/dates';

/** Reference: moment.utc(day).add(months, 'months'), the library's own month arithmetic. */
const momentAddMonths = (isoDate: string, months: number) => moment.utc(isoDate, 'YYYY-MM-DD', true).add(months, 'months').format('YYYY-MM-DD');

describe('warranty end dates, worked by hand', () => {
  it.each([
    { start: '2026-03-14', months: 12, ends: '2027-03-14', why: 'a 12-month warranty bought 14 March 2026' },
    { start: '2026-01-31', months: 1, ends: '2026-02-28', why: '31 January + 1 month: February 2026 has 28 days (2026 is a common year)' },
    { start: '2028-01-31', months: 1, ends: '2028-02-29', why: '31 January + 1 month in a leap year (2028 is divisible by 4, not by 100)' },
    { start: '2026-08-31', months: 1, ends: '2026-09-30', why: 'September has 30 days' },
    { start: '2028-02-29', months: 12, ends: '2029-02-28', why: 'a leap day + 12 months: 2029 is a common year' },
    { start: '2026-11-15', months: 3, ends: '2027-02-15', why: 'across a year end' },
    { start: '2026-05-01', months: 120, ends: '2036-05-01', why: 'ten years' },
  ])('$start + $months months → $ends ($why)', ({ start, months, ends }) => {
    expect(addMonths(start, months)).toBe(ends);
    // The same figures from the reference, so the hand-worked table and moment agree with each other too.
    expect(momentAddMonths(start, months)).toBe(ends);
  });
});

describe('against moment add(n, "months")', () => {
  it('agrees on every day of 2027 and 2028 (a common and a leap year) for 1 to 25 months', () => {
    const disagreements: string[] = [];
    for (let time = Date.UTC(2027, 0, 1); time < Date.UTC(2029, 0, 1); time += 86_400_000) {
      const start = new Date(time).toISOString().slice(0, 10);
      for (let months = 1; months <= 25; months += 1) {
        const ours = addMonths(start, months);
        const theirs = momentAddMonths(start, months);
        if (ours !== theirs) disagreements.push(`${start} + ${months}: ${ours}, moment ${theirs}`);
      }
    }
    expect(disagreements).toEqual([]);
  });

  it('agrees on month ends over a century turn and up to 100 years (1200 months)', () => {
    for (const start of ['1999-12-31', '2000-01-31', '2099-11-30', '2100-01-29']) {
      for (const months of [1, 2, 11, 12, 13, 25, 49, 1200]) expect(`${start} + ${months}: ${addMonths(start, months)}`).toBe(`${start} + ${months}: ${momentAddMonths(start, months)}`);
    }
  });
});
