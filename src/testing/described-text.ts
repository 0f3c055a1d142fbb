// Test helper: what a screen reader hears after a field's label, its hint or error, read through aria-describedby.
export function describedText(input: HTMLElement): string {
  return (input.getAttribute('aria-describedby') ?? '')
    .split(' ')
    .map((id) => document.getElementById(id)?.textContent?.trim() ?? '')
    .join(' ')
    .trim();
}
