// Reading printed amounts: OCR confusions, currency marks, thousands separators and the ways receipts print negatives.
import { currencyMark, readAmount, readQuantity } from './amounts';

describe('readAmount', () => {
  it.each([
    ['12.50', '12.50', null],
    ['$12.50', '12.50', '$'],
    ['US$12.50', '12.50', 'USD'],
    ['RM12.40', '12.40', 'MYR'],
    ['EUR12.40', '12.40', 'EUR'],
    ['12.40EUR', '12.40', 'EUR'],
    ['€9.80', '9.80', 'EUR'],
    ['£3.05', '3.05', 'GBP'],
    ['0.125', '0.125', null],
    ['6.00', '6.00', null],
  ])('reads %s as %s with mark %s', (token, value, mark) => {
    expect(readAmount(token)).toEqual({ value, mark, confidence: 1 });
  });

  it.each([
    ['51..75', '51.75'],
    ['12,,50', '12.50'],
    ['$9..80', '9.80'],
  ])('reads a doubled decimal point in %s as one, a little less sure', (token, value) => {
    expect(readAmount(token)).toEqual(expect.objectContaining({ value, confidence: 0.8 }));
  });

  it.each([
    ['1,234.56', '1234.56'],
    ['$1,234,567.89', '1234567.89'],
    ['1.234,56', '1234.56'],
    ["1'234.56", '1234.56'],
    ['1 234,56', '1234.56'],
  ])('strips thousands separators in %s', (token, value) => {
    expect(readAmount(token)?.value).toBe(value);
  });

  it.each([
    ['-38.49', '-38.49'],
    ['(38.49)', '-38.49'],
    ['($38.49)', '-38.49'],
    ['38.49-', '-38.49'],
    ['$201.47-', '-201.47'],
    ['-$5.00', '-5.00'],
    ['$-5.00', '-5.00'],
    ['−5.00', '-5.00'],
    ['12.00CR', '-12.00'],
    ['3.12~', '-3.12'],
  ])('reads the negative %s as %s', (token, value) => {
    expect(readAmount(token)?.value).toBe(value);
  });

  it('reads "-0.00" as zero, not negative zero', () => {
    expect(readAmount('-0.00')?.value).toBe('0.00');
  });

  it.each([
    ['1O.50', '10.50'],
    ['1O.S0', '10.50'],
    ['l2.99', '12.99'],
    ['2I.95', '21.95'],
    ['4B.00', '48.00'],
  ])('corrects the OCR confusion in %s to %s with a lower confidence', (token, value) => {
    expect(readAmount(token)).toEqual({ value, mark: null, confidence: 0.7 });
  });

  it('takes a comma before two digits for the decimal point, a little less sure', () => {
    expect(readAmount('6,49')).toEqual({ value: '6.49', mark: null, confidence: 0.85 });
    expect(readAmount('$12,50')).toEqual({ value: '12.50', mark: '$', confidence: 0.85 });
  });

  it('reads a leading S before an amount with cents as a dollar sign', () => {
    expect(readAmount('S23.58')).toEqual({ value: '23.58', mark: '$', confidence: 0.8 });
  });

  it.each([
    ['7.25%', 'a percentage'],
    ['10/07/2026', 'a date'],
    ['2:47', 'a time'],
    ['555-0198', 'a phone number'],
    ['30523', 'a whole number (a quantity or receipt number)'],
    ['1,234', 'a comma before three digits (thousands, no cents)'],
    ['SOIL', 'a word made mostly of look-alike letters'],
    ['FILTER', 'a word'],
    ['12.5', 'one decimal'],
    ['12.', 'a trailing dot'],
    ['1,23,4.00', 'uneven thousands groups'],
    ['', 'nothing'],
  ])('refuses %s (%s)', (token) => {
    expect(readAmount(token)).toBeNull();
  });

  it('accepts whole numbers only when asked', () => {
    expect(readAmount('4275', { requireDecimals: false })?.value).toBe('4275');
    expect(readAmount('1,234', { requireDecimals: false })?.value).toBe('1234');
    expect(readAmount('4275')).toBeNull();
  });
});

describe('currencyMark', () => {
  it('names marks printed apart from the number', () => {
    expect(currencyMark('RM')).toBe('MYR');
    expect(currencyMark('eur')).toBe('EUR');
    expect(currencyMark('$')).toBe('$');
    expect(currencyMark('TOTAL')).toBeNull();
  });
});

describe('readQuantity', () => {
  it.each([
    ['2', '2'],
    ['12.5', '12.5'],
    ['1O', '10'],
    ['x3', '3'],
    ['3x', '3'],
  ])('reads %s as %s', (token, value) => {
    expect(readQuantity(token)).toBe(value);
  });

  it.each(['0', 'AB', '12345', '2.50.1'])('refuses %s', (token) => {
    expect(readQuantity(token)).toBeNull();
  });
});
