// Tallyhood's mark: four tally strokes crossed by a brass fifth, on a petrol tile.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';

@Component({
  selector: 'th-logo-mark',
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './logo-mark.html',
  styleUrl: './logo-mark.css',
})
export class LogoMark {
  readonly size = input(28);
}
