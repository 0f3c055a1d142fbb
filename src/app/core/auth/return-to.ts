// Keeps the "returnTo" of a sign-in link inside this site.

/** Answers the path when it is a local one ("/builds/1"), else the fallback: no "//host" or "https:" jumps. */
export function safeReturnTo(value: string | null | undefined, fallback = '/builds'): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  return value;
}
