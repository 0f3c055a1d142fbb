// Where a locale writes its currency's sign, from the browser's Intl (Unicode CLDR data): budgets are typed beside it.
import { currencySign } from './money';

describe('currencySign', () => {
  it.each([
    { currency: 'USD', locale: 'en-US', sign: '$', before: true },
    { currency: 'EUR', locale: 'de-DE', sign: '€', before: false },
    { currency: 'EUR', locale: 'nl-NL', sign: '€', before: true },
    { currency: 'MYR', locale: 'ms-MY', sign: 'RM', before: true },
  ])('$currency in $locale is "$sign", before the figure: $before', ({ currency, locale, sign, before }) => {
    expect(currencySign(currency, locale)).toEqual({ sign, before });
  });

  it('falls back on the code after the figure for a code Intl does not know', () => {
    expect(currencySign('??', 'en-US')).toEqual({ sign: '??', before: false });
  });
});
