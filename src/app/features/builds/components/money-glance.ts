// The build's money in a few lines on the Overview: the same summary strip as the ledger, how much of the budget the
// net cost has used, and the way to the ledger.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { LedgerDto } from '../../../../../shared/api/ledger';
import type { FigureName } from '../../../../../shared/build-figures';
import { Meter } from '../../../ui/meter';
import { MoneySummary } from '../../../ui/money-summary/money-summary';
import { MoneyPipe } from '../../../ui/money';
import { budgetUse } from '../models/at-a-glance';

@Component({
  selector: 'th-money-glance',
  imports: [MatButtonModule, MatIconModule, RouterLink, Meter, MoneyPipe, MoneySummary],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './money-glance.html',
  styleUrl: './money-glance.css',
})
export class MoneyGlance {
  readonly ledger = input.required<LedgerDto>();
  readonly locale = input.required<string>();
  readonly isOwner = input(false);

  protected readonly figures: readonly FigureName[] = ['budget', 'netCost', 'forecast', 'variance'];
  protected readonly use = computed(() => budgetUse(this.ledger()));
}
