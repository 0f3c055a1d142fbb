// What to do first on a build with no parts and no receipts, in place of figures that would all be zero.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { BuildRole } from '../../../../../shared/enums';

@Component({
  selector: 'th-first-steps',
  imports: [MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './first-steps.html',
  styleUrl: './first-steps.css',
})
export class FirstSteps {
  readonly role = input.required<BuildRole>();
}
