// The warranty a line's words suggest, on the check screen: filing gives it to the line's part if the part has none.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Warranty } from '../../../../../../shared/warranty';

@Component({
  selector: 'th-warranty-hint',
  imports: [MatIconModule],
  templateUrl: './warranty-hint.html',
  styleUrl: './warranty-hint.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WarrantyHint {
  readonly suggestion = input.required<Warranty>();

  protected readonly words = computed(() => {
    const suggestion = this.suggestion();
    if (suggestion === null) return '';
    const length = suggestion === 'lifetime' ? 'a lifetime' : `a ${suggestion}-month`;
    return `Says ${length} warranty: its part gets it when filed, unless it has one`;
  });
}
