// A receipt line's further actions (new part, link a return, split, delete), the same on the check table and the
// phone's line card; the page carries each one out.
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import type { ReceiptLineDto } from '../../../../../../shared/api/receipts';
import type { LineAction } from '../../models/line-form';

@Component({
  selector: 'th-line-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  templateUrl: './line-menu.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineMenu {
  readonly line = input.required<ReceiptLineDto>();
  readonly lineNumber = input.required<number>();
  readonly action = output<LineAction>();
}
