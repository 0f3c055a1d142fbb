// The build's money in a few lines: net cost against the budget with a meter, the forecast, and the way to the ledger.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { LedgerDto } from '../../../../../shared/api/ledger';
import { toDecimal } from '../../../../../shared/money';
import { Meter } from '../../../ui/meter';
import { MoneyPipe } from '../../../ui/money';
import { absolute, varianceWords } from '../../ledger/models/ledger-words';
import { budgetUse } from '../models/at-a-glance';

@Component({
  selector: 'th-money-glance',
  imports: [MatButtonModule, MatIconModule, RouterLink, Meter, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let total = ledger().total;
    @let currency = ledger().currency;
    <h2 id="money-heading" class="card-heading">Money</h2>
    <p class="net">
      <span class="label">Net cost so far</span>
      <span class="amount tabular">{{ total.netCost | money: currency : locale() }}</span>
      @if (!use().noBudget) {
        <span class="of tabular">of {{ total.budget | money: currency : locale() }} budget</span>
      }
    </p>
    @if (use().noBudget) {
      <p class="quiet">
        No budget is set for the systems yet, so there is nothing to measure against.
        @if (isOwner()) {
          <a routerLink="budgets">Set budgets</a>
        }
      </p>
    } @else {
      <th-meter [fillPercent]="use().fillPercent" [over]="use().over" />
      <p class="standing tabular" [class.over]="use().over">
        <mat-icon aria-hidden="true" inline>{{ use().over ? 'warning' : 'check_circle' }}</mat-icon>
        @if (use().over) {
          <span><strong>Over budget:</strong> {{ use().usedPercent }}% used, {{ use().difference | money: currency : locale() }} over</span>
        } @else {
          <span><strong>Under budget:</strong> {{ use().usedPercent }}% used, {{ use().difference | money: currency : locale() }} left</span>
        }
      </p>
    }
    <p class="forecast">
      <span class="label">Forecast at completion</span>
      <span class="figure tabular">{{ total.forecast | money: currency : locale() }}</span>
      @if (!use().noBudget) {
        <span class="variance tabular" [class.over]="!variance().under">
          <mat-icon aria-hidden="true" inline>{{ variance().under ? 'check_circle' : 'warning' }}</mat-icon>
          {{ varianceAmount() | money: currency : locale() }} {{ variance().words }}
        </span>
      }
    </p>
    <p class="quiet">
      Net cost plus {{ total.remainingEstimate | money: currency : locale() }} of parts still to buy.
      @if (!isZero(ledger().contingencyBudget)) {
        Contingency of {{ ledger().contingencyBudget | money: currency : locale() }} kept aside.
      }
    </p>
    <a mat-stroked-button routerLink="ledger" class="open">
      <mat-icon aria-hidden="true">query_stats</mat-icon>
      Open the ledger
    </a>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    p {
      margin: 0;
    }
    .card-heading {
      font: var(--mat-sys-title-large);
      margin: 0 0 4px;
    }
    .net,
    .forecast {
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 4px 8px;
    }
    .forecast {
      margin-top: 8px;
    }
    .label {
      flex-basis: 100%;
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .amount {
      font: var(--mat-sys-headline-small);
    }
    .of {
      color: var(--mat-sys-on-surface-variant);
    }
    .forecast .figure {
      font: var(--mat-sys-title-medium);
    }
    .standing,
    .variance {
      display: inline-flex;
      gap: 6px;
      align-items: center;
    }
    .standing mat-icon,
    .variance mat-icon {
      color: var(--mat-sys-primary);
    }
    .over,
    .standing.over mat-icon,
    .variance.over mat-icon {
      color: var(--mat-sys-error);
    }
    .quiet {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .open {
      align-self: flex-start;
      margin-top: 8px;
    }
  `,
})
export class MoneyGlance {
  readonly ledger = input.required<LedgerDto>();
  readonly locale = input.required<string>();
  readonly isOwner = input(false);

  protected readonly use = computed(() => budgetUse(this.ledger()));
  protected readonly variance = computed(() => varianceWords(this.ledger().total.variance));
  protected readonly varianceAmount = computed(() => absolute(this.ledger().total.variance));

  protected isZero(amount: string): boolean {
    return toDecimal(amount).isZero();
  }
}
