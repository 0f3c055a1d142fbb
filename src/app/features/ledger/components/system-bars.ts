// Each system's budget against its net cost and forecast: a bar chart, and the same figures as a table whose money
// figures open the lines behind them.
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { LedgerDto, LedgerLineFigure, LedgerSystemDto } from '../../../../../shared/api/ledger';
import { toDecimal } from '../../../../../shared/money';
import { moneyText, MoneyPipe, wholeMoneyText } from '../../../ui/money';
import { FIGURE_LABELS, type LinesRequest } from '../models/ledger-words';
import { FIGURE_WORDS, compareWithBudget, type BudgetComparison } from '../../../../../shared/build-figures';
import { BarChart, type BarClick, type ChartMarker, type ChartSeries } from './bar-chart';
import { LEDGER_COLORS } from './ledger-colors';

const FIGURES_SHOWN = ['budget', 'spent', 'netCost', 'forecast', 'coreDepositsOutstanding', 'returnsAwaitingRefund'] as const;

export function hasFigures(system: LedgerSystemDto): boolean {
  return FIGURES_SHOWN.some((key) => !toDecimal(system[key]).isZero());
}

const LINKED: LedgerLineFigure[] = ['spent', 'netCost', 'coreDepositsOutstanding', 'returnsAwaitingRefund'];

@Component({
  selector: 'th-system-bars',
  imports: [MatIconModule, MoneyPipe, BarChart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <th-bar-chart
      [categories]="names()"
      [series]="series()"
      [marker]="budgetMarker()"
      [valuesOnBars]="true"
      [horizontal]="true"
      [height]="chartHeight()"
      [format]="format()"
      [axisFormat]="axisFormat()"
      [summary]="'Bar chart of the net cost and the forecast of each system, with its budget marked as a line; the table below lists the same figures.'"
      (barClick)="clicked($event)"
    />
    <p class="hint">Select a net cost or forecast bar, or a figure in the table, to see the receipt lines behind it.</p>
    <div class="table-box" role="region" aria-label="Figures by system" tabindex="0">
      <table class="systems stacks">
        <caption class="visually-hidden">Figures by system, in {{ ledger().currency }}</caption>
        <thead>
          <tr>
            <th scope="col">System</th>
            <th scope="col" class="number">Budget</th>
            @for (figure of linkedFirst; track figure) {
              <th scope="col" class="number">{{ columns[figure] }}</th>
            }
            <th scope="col" class="number">Forecast</th>
            <th scope="col" class="number">{{ varianceLabel }}</th>
            @for (figure of linkedLast; track figure) {
              <th scope="col" class="number">{{ columns[figure] }}</th>
            }
          </tr>
        </thead>
        <tbody>
          @for (system of shown(); track system.systemId) {
            @let variance = varianceOf(system);
            <tr>
              <th scope="row" class="name">
                {{ system.name }}
                @if (system.safetyCaution) {
                  <mat-icon class="caution-icon" inline aria-hidden="true">health_and_safety</mat-icon>
                  <span class="visually-hidden"> (safety caution applies)</span>
                }
              </th>
              <td class="number tabular" data-label="Budget">{{ system.budget | money: ledger().currency : locale() }}</td>
              @for (figure of linkedFirst; track figure) {
                <td class="number tabular" [attr.data-label]="columns[figure]">
                  @if (isZero(system[figure])) {
                    {{ system[figure] | money: ledger().currency : locale() }}
                  } @else {
                    <button type="button" class="figure-button" (click)="openFigure(system, figure)">
                      {{ system[figure] | money: ledger().currency : locale() }} <span class="visually-hidden">({{ labels[figure] }} of {{ system.name }}: show the lines)</span>
                    </button>
                  }
                </td>
              }
              <td class="number tabular" data-label="Forecast">{{ system.forecast | money: ledger().currency : locale() }}</td>
              <td class="number tabular" [attr.data-label]="varianceLabel" [class.over]="variance.over" [class.under]="!variance.over && !variance.noBudget">
                <span class="variance">
                  @if (variance.noBudget) {
                    No budget set
                  } @else {
                    <mat-icon inline aria-hidden="true">{{ variance.over ? 'warning' : 'check_circle' }}</mat-icon>
                    {{ variance.amount | money: ledger().currency : locale() }} {{ variance.over ? 'over' : 'under' }}
                  }
                </span>
              </td>
              @for (figure of linkedLast; track figure) {
                <td class="number tabular" [attr.data-label]="columns[figure]">
                  @if (isZero(system[figure])) {
                    {{ system[figure] | money: ledger().currency : locale() }}
                  } @else {
                    <button type="button" class="figure-button" (click)="openFigure(system, figure)">
                      {{ system[figure] | money: ledger().currency : locale() }} <span class="visually-hidden">({{ labels[figure] }} of {{ system.name }}: show the lines)</span>
                    </button>
                  }
                </td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
    @if (idle().length > 0) {
      <p class="hint">Nothing budgeted, planned or spent yet, so left out: {{ idle().join(', ') }}.</p>
    }
  `,
  styleUrl: '../figure-table.css',
  styles: `
    :host {
      display: block;
    }
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin: 8px 0;
    }
    th,
    td {
      white-space: nowrap;
    }
    .name {
      font-weight: 500;
      position: sticky;
      left: 0;
      background: var(--mat-sys-surface);
    }
    thead th:first-child {
      position: sticky;
      left: 0;
    }
    .caution-icon {
      color: var(--mat-sys-tertiary);
      vertical-align: -2px;
    }
    .over {
      color: var(--mat-sys-error);
    }
    .under mat-icon {
      color: var(--mat-sys-primary);
    }
    .variance {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
  `,
})
export class SystemBars {
  readonly ledger = input.required<LedgerDto>();
  readonly locale = input.required<string>();
  readonly open = output<LinesRequest>();

  protected readonly labels = FIGURE_LABELS;
  /** Column heads, short enough for the table; on phones each figure's label in its stacked row. */
  protected readonly columns: Record<LedgerLineFigure, string> = {
    spent: 'Spent',
    netCost: 'Net cost',
    coreDepositsOutstanding: 'Cores out',
    returnsAwaitingRefund: 'Returns due',
  };
  protected readonly linkedFirst: LedgerLineFigure[] = LINKED.slice(0, 2);
  protected readonly linkedLast: LedgerLineFigure[] = LINKED.slice(2);

  /** Systems with a figure to show; a dozen rows of zeros would hide the few that matter. */
  protected readonly shown = computed(() => this.ledger().systems.filter((system) => hasFigures(system)));
  protected readonly idle = computed(() => this.ledger().systems.filter((system) => !hasFigures(system)).map((system) => system.name));
  protected readonly names = computed(() => this.shown().map((system) => system.name));
  protected readonly chartHeight = computed(() => 64 + this.shown().length * 56);
  protected readonly series = computed<ChartSeries[]>(() => {
    const systems = this.shown();
    return [
      { label: FIGURE_WORDS.netCost.label, values: systems.map((s) => s.netCost), color: LEDGER_COLORS.netCost },
      { label: FIGURE_WORDS.forecast.label, values: systems.map((s) => s.forecast), color: LEDGER_COLORS.forecast },
    ];
  });
  /** One budget line per system, across its two bars. */
  protected readonly budgetMarker = computed<ChartMarker>(() => ({
    label: FIGURE_WORDS.budget.label,
    values: this.shown().map((s) => s.budget),
    color: LEDGER_COLORS.budget,
  }));
  protected readonly format = computed(() => {
    const currency = this.ledger().currency;
    const locale = this.locale();
    return (amount: string) => moneyText(amount, currency, locale);
  });
  protected readonly axisFormat = computed(() => {
    const currency = this.ledger().currency;
    const locale = this.locale();
    return (value: number) => wholeMoneyText(value, currency, locale);
  });

  protected readonly varianceLabel = FIGURE_WORDS.variance.label;

  /** The forecast against the budget, by the one rule every screen uses. */
  protected varianceOf(system: LedgerSystemDto): BudgetComparison {
    return compareWithBudget('forecast', system.forecast, system.budget);
  }

  protected isZero(amount: string): boolean {
    return toDecimal(amount).isZero();
  }

  protected openFigure(system: LedgerSystemDto, figure: LedgerLineFigure): void {
    this.open.emit({ figure, systemId: system.systemId, title: `${FIGURE_LABELS[figure]} of ${system.name}` });
  }

  /** Net cost and forecast bars open the net cost's lines (what is bought so far). */
  protected clicked(click: BarClick): void {
    const system = this.shown()[click.index];
    if (!system) return;
    this.openFigure(system, 'netCost');
  }
}
