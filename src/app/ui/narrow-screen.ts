// Phones: below 600 px wide the pages show stacked cards and rows instead of wide tables (the shell's bottom bar
// appears at the same width).
import { BreakpointObserver } from '@angular/cdk/layout';
import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

export const NARROW_SCREEN_QUERY = '(max-width: 599.98px)';

/** True while the window is phone-wide; call in an injection context. */
export function injectNarrowScreen(): Signal<boolean> {
  return toSignal(
    inject(BreakpointObserver)
      .observe(NARROW_SCREEN_QUERY)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
}
