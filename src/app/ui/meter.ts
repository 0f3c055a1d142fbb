// A thin bar showing a share of a budget; decorative only, so the words beside it must say the same thing.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';

@Component({
  selector: 'th-meter',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { 'aria-hidden': 'true' },
  templateUrl: './meter.html',
  styleUrl: './meter.css',
})
export class Meter {
  /** 0 to 100 as text for a CSS width (display only, never money). */
  readonly fillPercent = input.required<string>();
  /** Past the budget: the colour only repeats what the words and icon beside the meter say. */
  readonly over = input(false);
}
