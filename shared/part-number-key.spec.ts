import { partNumberKey, partNumberKeySql } from './part-number-key';

describe('partNumberKey', () => {
  it.each([
    { printed: '44-120', key: '44120' },
    { printed: '44 120', key: '44120' },
    { printed: '44.120', key: '44120' },
    { printed: ' fpr-8an ', key: 'fpr8an' },
    { printed: 'FPR 8 AN', key: 'fpr8an' },
    { printed: 'W16/RD', key: 'w16rd' },
    { printed: '--', key: '' },
    { printed: '', key: '' },
  ])('compares "$printed" as "$key"', ({ printed, key }) => {
    expect(partNumberKey(printed)).toBe(key);
  });

  it('keeps letters and digits apart from one another: a different number stays different', () => {
    expect(partNumberKey('44-120')).not.toBe(partNumberKey('44-12'));
    expect(partNumberKey('LB-20T-114')).toBe('lb20t114');
  });

  it('writes the same rule for SQL', () => {
    expect(partNumberKeySql('p.part_number')).toBe(`regexp_replace(lower(p.part_number), '[^a-z0-9]+', '', 'g')`);
  });
});
