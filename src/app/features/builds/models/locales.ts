// Languages and regions (BCP 47 tags) to choose a build's locale from: the person's own browser languages first, then
// a list of common ones, each named in its own language by the browser's Intl.DisplayNames. Dates and amounts follow it.

/** Common language-region pairs for receipts (our choice); the browser's own languages come before them. */
const COMMON_LOCALES = [
  'en-US', 'en-GB', 'en-CA', 'en-AU', 'en-NZ', 'en-IE', 'en-ZA', 'en-IN', 'en-SG', 'en-MY',
  'de-DE', 'de-AT', 'de-CH', 'fr-FR', 'fr-BE', 'fr-CA', 'fr-CH', 'es-ES', 'es-MX', 'es-AR',
  'it-IT', 'nl-NL', 'nl-BE', 'pt-PT', 'pt-BR', 'ms-MY', 'sv-SE', 'da-DK', 'nb-NO', 'fi-FI',
  'pl-PL', 'cs-CZ', 'ja-JP',
];

export interface LocaleOption {
  tag: string;
  /** The locale's name in its own language, e.g. "Deutsch (Österreich)"; the tag when the browser has no name. */
  name: string;
}

function canonical(tag: string): string | null {
  try {
    return Intl.getCanonicalLocales(tag)[0] ?? null;
  } catch {
    return null;
  }
}

export function localeName(tag: string): string {
  try {
    return new Intl.DisplayNames([tag], { type: 'language' }).of(tag) ?? tag;
  } catch {
    return tag;
  }
}

/** The options: `preferred` (the browser's languages) first, then the common list, each once, region tags only. */
export function localeOptions(preferred: readonly string[] = []): LocaleOption[] {
  const tags: string[] = [];
  for (const tag of [...preferred, ...COMMON_LOCALES]) {
    const known = canonical(tag);
    // A bare language ("en") says nothing about dates or the decimal mark: only language-region tags are offered.
    if (known && known.includes('-') && !tags.includes(known)) tags.push(known);
  }
  return tags.map((tag) => ({ tag, name: localeName(tag) }));
}

/** Matches a typed filter against the tag and the name ("en-g", "deutsch", "brasil"). */
export function filterLocales(options: readonly LocaleOption[], query: string): LocaleOption[] {
  const needle = query.trim().toLowerCase();
  if (!needle) return [...options];
  return options.filter((option) => option.tag.toLowerCase().startsWith(needle) || option.name.toLowerCase().includes(needle));
}
