// The build's totals as one strip, the same on every screen that shows them: each figure under its one name from the
// shared money model, and every comparison with the budget saying against what.
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { LEDGER_LINE_FIGURES, type LedgerDto, type LedgerLineFigure } from '../../../../shared/api/ledger';
import { FIGURE_WORDS, compareWithBudget, comparisonParts, type BudgetComparison, type FigureName } from '../../../../shared/build-figures';
import { toDecimal } from '../../../../shared/money';
import { moneyText } from '../money';

export interface SummaryFigure {
  name: FigureName;
  label: string;
  /** The figure as the API sent it (a decimal string). */
  value: string;
  /** The figure as shown. */
  text: string;
  /** What it counts, or for a comparison, both sides of it. */
  hint: string;
  /** Set for the comparisons with the budget, whose words stand small around the amount: "forecast", "under budget". */
  comparison?: BudgetComparison;
  before?: string;
  after?: string;
  /** A sum of receipt lines that can list them (and is not zero). */
  openable: boolean;
}

@Component({
  selector: 'th-money-summary',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './money-summary.html',
  styleUrl: './money-summary.css',
})
export class MoneySummary {
  readonly ledger = input.required<LedgerDto>();
  readonly locale = input.required<string>();
  /** Which figures, in this order. */
  readonly figures = input.required<readonly FigureName[]>();
  /** Whether the sums of receipt lines open the lines behind them. */
  readonly linesOpen = input(false);
  /** Leave out what each figure counts (a compact strip, as on the Overview); a comparison still says against what. */
  readonly compact = input(false);
  /** A screen's own explanation of a figure, in place of its meaning (the adjusted forecast's factor, say). */
  readonly hints = input<Partial<Record<FigureName, string>>>({});
  readonly open = output<LedgerLineFigure>();

  protected readonly shown = computed<SummaryFigure[]>(() => {
    const ledger = this.ledger();
    const money = (value: string) => moneyText(value, ledger.currency, this.locale());
    const total = ledger.total;
    return this.figures().map((name) => {
      const value = name === 'contingency' ? ledger.contingencyBudget : name === 'budgetWithContingency' ? ledger.budgetWithContingency : total[name];
      const figure: SummaryFigure = {
        name,
        label: FIGURE_WORDS[name].label,
        value,
        text: money(value),
        hint: this.hints()[name] ?? FIGURE_WORDS[name].meaning,
        openable: this.linesOpen() && (LEDGER_LINE_FIGURES as readonly string[]).includes(name) && !toDecimal(value).isZero(),
      };
      if (name === 'budget' && !toDecimal(ledger.contingencyBudget).isZero()) {
        figure.hint = `The systems’ budgets; the contingency of ${money(ledger.contingencyBudget)} is kept apart.`;
      }
      if (name === 'variance' || name === 'planningGap') {
        const basis = name === 'variance' ? 'forecast' : 'planned';
        const compared = name === 'variance' ? total.forecast : total.planned;
        const comparison = compareWithBudget(basis, compared, total.budget);
        figure.comparison = comparison;
        const { before, amount, after } = comparisonParts(comparison, money(comparison.amount));
        if (amount) Object.assign(figure, { before, text: amount, after });
        else figure.text = before;
        figure.hint = comparison.noBudget
          ? 'Set the systems’ budgets to compare.'
          : `${FIGURE_WORDS[name === 'variance' ? 'forecast' : 'planned'].label} ${money(compared)} against a budget of ${money(total.budget)}.`;
      }
      return figure;
    });
  });

  protected openFigure(name: FigureName): void {
    this.open.emit(name as LedgerLineFigure);
  }
}
