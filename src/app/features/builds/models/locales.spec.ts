// Locale options: the browser's languages first, region tags only, each once, named by Intl in their own language.
import { filterLocales, localeName, localeOptions } from './locales';

describe('locale options', () => {
  it('puts the browser languages first, keeps region tags only, and lists each once', () => {
    const options = localeOptions(['en-NZ', 'fr', 'en-us']);
    expect(options.slice(0, 2).map((option) => option.tag)).toEqual(['en-NZ', 'en-US']);
    expect(options.some((option) => option.tag === 'fr')).toBe(false);
    expect(options.filter((option) => option.tag === 'en-US')).toHaveLength(1);
  });

  it('names each locale in its own language through Intl.DisplayNames (Unicode CLDR names)', () => {
    // CLDR's own-language names, as Node's full ICU gives them.
    expect(localeName('de-AT')).toBe('Österreichisches Deutsch');
    expect(localeName('pt-BR')).toBe('português (Brasil)');
  });

  it('filters by the start of the tag or any part of the name', () => {
    const options = localeOptions();
    expect(filterLocales(options, 'en-g').map((option) => option.tag)).toEqual(['en-GB']);
    expect(filterLocales(options, 'brasil').map((option) => option.tag)).toEqual(['pt-BR']);
    expect(filterLocales(options, '')).toHaveLength(options.length);
  });
});
