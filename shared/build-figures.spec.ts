// Unit tests for the one money model: each figure worked out by hand, the build's total as the systems' sum, the
// comparison words, and the one rounding of a percent.
import {
  FIGURE_NAMES,
  FIGURE_WORDS,
  addSystemFigures,
  budgetWithContingency,
  compareWithBudget,
  comparisonWords,
  isOverBudget,
  percentOfBudget,
  systemFigures,
  withBudget,
} from './build-figures';
import { Decimal } from './money';

const d = (text: string) => new Decimal(text);

// A fuel system: budget 900.00; parts planned 845.52, of which 310.00 not bought yet; net cost 581.14 (spent 604.56, a
// 23.42 core deposit with its tax still out). Forecast = 581.14 + 310.00 = 891.14; variance 900.00 - 891.14 = 8.86.
const fuel = systemFigures(
  {
    budget: d('900.00'),
    planned: d('845.52'),
    remainingEstimate: d('310.00'),
    spent: d('604.56'),
    netCost: d('581.14'),
    coreDepositsOutstanding: d('23.42'),
    returnsAwaitingRefund: d('0'),
  },
  new Decimal('1.1'),
  2,
);

describe('systemFigures', () => {
  it('works out the forecast, the variance and the planning gap from the sums', () => {
    expect(fuel).toEqual({
      budget: '900.00',
      planned: '845.52',
      spent: '604.56',
      netCost: '581.14',
      coreDepositsOutstanding: '23.42',
      returnsAwaitingRefund: '0.00',
      remainingEstimate: '310.00',
      forecast: '891.14',
      // 310.00 x 1.1 = 341.00; 581.14 + 341.00
      forecastAdjusted: '922.14',
      variance: '8.86',
      planningGap: '54.48',
    });
  });

  it('follows the variance at completion of earned value management: budget at completion less the estimate at completion, positive when under', () => {
    // PMI, A Guide to the Project Management Body of Knowledge: VAC = BAC - EAC (from memory). Worked example of our own:
    // BAC 12,800.00, EAC 12,845.48, so VAC -45.48 (over budget).
    const figures = systemFigures(
      { budget: d('12800.00'), planned: d('12000'), remainingEstimate: d('845.48'), spent: d('12000'), netCost: d('12000.00'), coreDepositsOutstanding: d('0'), returnsAwaitingRefund: d('0') },
      new Decimal(1),
      2,
    );
    expect(figures.forecast).toBe('12845.48');
    expect(figures.variance).toBe('-45.48');
    expect(isOverBudget(figures)).toBe(true);
  });

  it('keeps a currency with no minor unit whole (ISO 4217: JPY has 0 decimals)', () => {
    const yen = systemFigures(
      { budget: d('150000'), planned: d('98000'), remainingEstimate: d('12345'), spent: d('90000'), netCost: d('85655'), coreDepositsOutstanding: d('0'), returnsAwaitingRefund: d('0') },
      new Decimal('1.0437'),
      0,
    );
    // 12,345 x 1.0437 = 12,884.4765 -> 12,884; 85,655 + 12,884 = 98,539
    expect(yen).toMatchObject({ forecast: '98000', forecastAdjusted: '98539', variance: '52000', planningGap: '52000' });
  });
});

describe('addSystemFigures', () => {
  it('adds every figure exactly, so the build is the sum of its systems to the cent', () => {
    const cooling = systemFigures(
      { budget: d('0.10'), planned: d('0.20'), remainingEstimate: d('0'), spent: d('0.70'), netCost: d('0.70'), coreDepositsOutstanding: d('0'), returnsAwaitingRefund: d('0') },
      new Decimal(1),
      2,
    );
    const total = addSystemFigures([fuel, cooling], 2);
    // In binary floating point 0.1 + 0.2 is 0.30000000000000004; the money module keeps 900.10 and 845.72 exact.
    expect(total).toMatchObject({ budget: '900.10', planned: '845.72', netCost: '581.84', forecast: '891.84', variance: '8.26', planningGap: '54.38' });
  });
});

describe('comparisons with the budget', () => {
  it('says against what, and how far', () => {
    expect(comparisonWords(compareWithBudget('forecast', '12845.48', '12800.00'), '$45.48')).toBe('forecast $45.48 over budget');
    expect(comparisonWords(compareWithBudget('planned', '845.52', '900.00'), '$54.48')).toBe('planned $54.48 under budget');
    expect(comparisonWords(compareWithBudget('net cost', '900.00', '900.00'), '$0.00')).toBe('net cost at budget');
    expect(comparisonWords(compareWithBudget('forecast', '40.00', '0.00'), '$40.00')).toBe('no budget set');
  });

  it('never counts a system with no budget as over it', () => {
    expect(isOverBudget({ budget: '0.00', forecast: '40.00' })).toBe(false);
    expect(isOverBudget({ budget: '40.00', forecast: '40.00' })).toBe(false);
    expect(isOverBudget({ budget: '40.00', forecast: '40.01' })).toBe(true);
  });

  it('re-derives the budget comparisons when a budget is typed, and nothing else', () => {
    const typed = withBudget(fuel, d('800'), 2);
    expect(typed).toEqual({ ...fuel, budget: '800.00', variance: '-91.14', planningGap: '-45.52' });
  });

  it('adds the contingency to the systems’ budget in one place', () => {
    expect(budgetWithContingency('12800.00', '1000.00', 2)).toBe('13800.00');
    expect(budgetWithContingency('150000', '20000', 0)).toBe('170000');
  });
});

describe('percentOfBudget', () => {
  it('rounds half up like the ECMAScript Intl number format (roundingMode halfExpand, its default)', () => {
    // Reference: ECMA-402 NumberFormat, default rounding "halfExpand": 89.5 -> 90, 90.49 -> 90.
    const reference = (value: number) => new Intl.NumberFormat('en-US', { maximumFractionDigits: 0, useGrouping: false }).format(value);
    expect(percentOfBudget('895.00', '1000.00')).toBe(reference(89.5));
    expect(percentOfBudget('904.90', '1000.00')).toBe(reference(90.49));
    expect(percentOfBudget('2925.14', '3200.00')).toBe(reference(91.41));
    expect(percentOfBudget('12.00', '0.00')).toBeNull();
  });
});

describe('FIGURE_WORDS', () => {
  it('names and explains every figure, each name once', () => {
    const labels = FIGURE_NAMES.map((name) => FIGURE_WORDS[name].label);
    expect(new Set(labels).size).toBe(FIGURE_NAMES.length);
    expect(FIGURE_NAMES.every((name) => FIGURE_WORDS[name].meaning.length > 10)).toBe(true);
  });
});
