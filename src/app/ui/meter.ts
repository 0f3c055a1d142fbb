// A thin bar showing a share of a budget; decorative only, so the words beside it must say the same thing.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';

@Component({
  selector: 'th-meter',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { 'aria-hidden': 'true' },
  template: `<span class="fill" [class.over]="over()" [style.width]="fillPercent() + '%'"></span>`,
  styles: `
    :host {
      display: block;
      height: 8px;
      border-radius: 4px;
      background: var(--mat-sys-surface-container-highest);
      overflow: hidden;
    }
    .fill {
      display: block;
      height: 100%;
      background: var(--mat-sys-primary);
    }
    .fill.over {
      background: var(--mat-sys-error);
    }
  `,
})
export class Meter {
  /** 0 to 100 as text for a CSS width (display only, never money). */
  readonly fillPercent = input.required<string>();
  /** Past the budget: the colour only repeats what the words and icon beside the meter say. */
  readonly over = input(false);
}
