// Tallyhood's mark: four tally strokes crossed by a brass fifth, on a petrol tile.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';

@Component({
  selector: 'th-logo-mark',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg viewBox="0 0 32 32" [attr.width]="size()" [attr.height]="size()" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="8" fill="#1d4c5d" />
      <g stroke="#f6f0e9" stroke-width="2.6" stroke-linecap="round">
        <line x1="9" y1="9" x2="9" y2="23" />
        <line x1="13.5" y1="9" x2="13.5" y2="23" />
        <line x1="18" y1="9" x2="18" y2="23" />
        <line x1="22.5" y1="9" x2="22.5" y2="23" />
      </g>
      <line x1="6" y1="21" x2="26" y2="11" stroke="#d5a345" stroke-width="3" stroke-linecap="round" />
    </svg>
  `,
  styles: `
    :host {
      display: inline-flex;
    }
  `,
})
export class LogoMark {
  readonly size = input(28);
}
