// The whole build at a glance: budget, net cost, both forecasts, what is owed back, and the variance in words.
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { OVERRUN_MIN_SAMPLE, type LedgerDto, type LedgerLineFigure } from '../../../../../shared/api/ledger';
import { toDecimal } from '../../../../../shared/money';
import { MoneyPipe } from '../../../ui/money';
import { absolute, overrunExplanation, varianceWords } from '../models/ledger-words';

@Component({
  selector: 'th-totals-strip',
  imports: [MatIconModule, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let total = ledger().total;
    @let currency = ledger().currency;
    <dl class="figures">
      <div class="figure">
        <dt>Budget</dt>
        <dd class="amount tabular">{{ total.budget | money: currency : locale() }}</dd>
        <dd class="quiet">Systems; contingency {{ ledger().contingencyBudget | money: currency : locale() }} kept aside</dd>
      </div>
      <div class="figure">
        <dt>Net cost</dt>
        <dd class="amount tabular">
          <button type="button" class="figure-button" (click)="open.emit('netCost')">
            {{ total.netCost | money: currency : locale() }} <span class="visually-hidden">(show the lines behind the net cost)</span>
          </button>
        </dd>
        <dd class="quiet">Spent {{ total.spent | money: currency : locale() }} in all, deposits included</dd>
      </div>
      <div class="figure">
        <dt>Forecast</dt>
        <dd class="amount tabular">{{ total.forecast | money: currency : locale() }}</dd>
        <dd class="quiet">Net cost + {{ total.remainingEstimate | money: currency : locale() }} of parts still to buy</dd>
      </div>
      <div class="figure">
        <dt>Adjusted forecast</dt>
        <dd class="amount tabular">{{ total.forecastAdjusted | money: currency : locale() }}</dd>
        <dd class="quiet">{{ explanation() }}</dd>
      </div>
      <div class="figure">
        <dt>Variance</dt>
        <dd class="amount tabular" [class.over]="!variance().under" [class.under]="variance().under">
          <mat-icon aria-hidden="true" inline>{{ variance().under ? 'check_circle' : 'warning' }}</mat-icon>
          {{ varianceAmount() | money: currency : locale() }} {{ variance().words }}
        </dd>
        <dd class="quiet">Budget against the forecast</dd>
      </div>
      <div class="figure">
        <dt>Core deposits outstanding</dt>
        <dd class="amount tabular">
          @if (isZero(total.coreDepositsOutstanding)) {
            {{ total.coreDepositsOutstanding | money: currency : locale() }}
          } @else {
            <button type="button" class="figure-button" (click)="open.emit('coreDepositsOutstanding')">
              {{ total.coreDepositsOutstanding | money: currency : locale() }} <span class="visually-hidden">(show the lines behind the core deposits outstanding)</span>
            </button>
          }
        </dd>
        <dd class="quiet">Paid on old parts not yet handed back</dd>
      </div>
      <div class="figure">
        <dt>Returns awaiting refund</dt>
        <dd class="amount tabular">
          @if (isZero(total.returnsAwaitingRefund)) {
            {{ total.returnsAwaitingRefund | money: currency : locale() }}
          } @else {
            <button type="button" class="figure-button" (click)="open.emit('returnsAwaitingRefund')">
              {{ total.returnsAwaitingRefund | money: currency : locale() }} <span class="visually-hidden">(show the lines behind the returns awaiting refund)</span>
            </button>
          }
        </dd>
        <dd class="quiet">Parts sent back, refund not filed yet</dd>
      </div>
    </dl>
  `,
  styles: `
    .figures {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(140px, 1fr));
      gap: 16px 24px;
      margin: 0;
      padding: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      background: var(--mat-sys-surface-container-low);
    }
    dt {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 4px 0 0;
    }
    .amount {
      font: var(--mat-sys-title-large);
    }
    .quiet {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .over {
      color: var(--mat-sys-error);
    }
    .under mat-icon {
      color: var(--mat-sys-primary);
    }
  `,
})
export class TotalsStrip {
  readonly ledger = input.required<LedgerDto>();
  readonly locale = input.required<string>();
  readonly open = output<LedgerLineFigure>();

  protected readonly variance = computed(() => varianceWords(this.ledger().total.variance));
  protected readonly varianceAmount = computed(() => absolute(this.ledger().total.variance));
  protected readonly explanation = computed(() => overrunExplanation(this.ledger().overrunFactor, this.ledger().overrunSample, OVERRUN_MIN_SAMPLE));

  protected isZero(amount: string): boolean {
    return toDecimal(amount).isZero();
  }
}
