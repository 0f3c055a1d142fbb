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
import { FigureButton } from '../../../ui/figure-button/figure-button';

const FIGURES_SHOWN = ['budget', 'spent', 'netCost', 'forecast', 'coreDepositsOutstanding', 'returnsAwaitingRefund'] as const;

export function hasFigures(system: LedgerSystemDto): boolean {
  return FIGURES_SHOWN.some((key) => !toDecimal(system[key]).isZero());
}

const LINKED: LedgerLineFigure[] = ['spent', 'netCost', 'coreDepositsOutstanding', 'returnsAwaitingRefund'];

@Component({
  selector: 'th-system-bars',
  imports: [MatIconModule, MoneyPipe, BarChart, FigureButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './system-bars.html',
  styleUrls: ['../figure-table.css', './system-bars.css'],
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
