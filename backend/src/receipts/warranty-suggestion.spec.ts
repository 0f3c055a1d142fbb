// The warranty a line's description suggests: the trade's printed forms, and the lines that must suggest nothing.
import { suggestWarranty } from './warranty-suggestion';

describe('suggestWarranty', () => {
  it.each([
    { description: 'WATER PUMP LIFETIME WARRANTY', expected: 'lifetime' },
    { description: 'Alternator reman - Limited Lifetime Warranty', expected: 'lifetime' },
    { description: 'BRAKE CALIPER LIFETIME WTY', expected: 'lifetime' },
    { description: 'STARTER MOTOR WARRANTY 12 MO', expected: 12 },
    { description: 'Fuel pump, 12 month warranty', expected: 12 },
    { description: 'FUEL PUMP 12-MONTH WARRANTY', expected: 12 },
    { description: 'BATTERY 2 YR WARRANTY', expected: 24 },
    { description: 'Battery 3 years guarantee', expected: 36 },
    { description: 'IGN COIL WTY: 24 MOS', expected: 24 },
    { description: 'HEADLAMP WARR 6 MTHS', expected: 6 },
  ])('"$description" suggests $expected', ({ description, expected }) => {
    expect(suggestWarranty(description)).toBe(expected);
  });

  it.each([
    'WATER PUMP',
    'LIFETIME BRAKE PADS',
    '12 MONTH SUBSCRIPTION',
    'NO WARRANTY - SOLD AS IS',
    'Used gearbox, no warranty, 12 months old',
    'WARRANTY VOID IF OPENED',
    '90 DAY WARRANTY',
    'WARRANTY 12 MOTOR MOUNT',
    '0 MONTH WARRANTY',
    '200 YEAR WARRANTY',
  ])('"%s" suggests nothing', (description) => {
    expect(suggestWarranty(description)).toBeNull();
  });
});
