// The warranty a line suggests, in words; nothing when it suggests none.
import { inputBinding } from '@angular/core';
import { render } from '@testing-library/angular/zoneless';
import type { Warranty } from '../../../../../../shared/warranty';
import { WarrantyHint } from './warranty-hint';

async function wordsFor(suggestion: Warranty): Promise<string> {
  const { fixture } = await render(WarrantyHint, { bindings: [inputBinding('suggestion', () => suggestion)] });
  return (fixture.nativeElement as HTMLElement).querySelector('.words')?.textContent?.trim() ?? '';
}

describe('WarrantyHint', () => {
  it.each([
    { suggestion: 24, words: 'Says a 24-month warranty: its part gets it when filed, unless it has one' },
    { suggestion: 'lifetime', words: 'Says a lifetime warranty: its part gets it when filed, unless it has one' },
    { suggestion: null, words: '' },
  ] as { suggestion: Warranty; words: string }[])('words $suggestion as "$words"', async ({ suggestion, words }) => {
    expect(await wordsFor(suggestion)).toBe(words);
  });
});
