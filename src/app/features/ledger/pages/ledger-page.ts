// /builds/:buildId/ledger: the build's money at a glance: totals, each system against its budget, spend over time
// and by shop; every money figure and bar opens the receipt lines behind it.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { forkJoin } from 'rxjs';
import { OVERRUN_MIN_SAMPLE, type LedgerDto, type LedgerLineFigure, type SpendPeriod, type SpendResponse, type VendorSpendDto, type VendorsResponse } from '../../../../../shared/api/ledger';
import type { FigureName } from '../../../../../shared/build-figures';
import { EmptyState } from '../../../ui/empty-state';
import { moneyText, wholeMoneyText } from '../../../ui/money';
import { FigureButton } from '../../../ui/figure-button/figure-button';
import { CurrentBuild } from '../../builds/services/current-build';
import { BarChart, type BarClick, type ChartSeries } from '../components/bar-chart';
import { LEDGER_COLORS } from '../components/ledger-colors';
import { LinesDialog, type LinesDialogData } from '../components/lines-dialog';
import { SystemBars, hasFigures } from '../components/system-bars';
import { MoneySummary } from '../../../ui/money-summary/money-summary';
import { FIGURE_LABELS, overrunExplanation, type LinesRequest } from '../models/ledger-words';
import { LedgerApi } from '../services/ledger-api';
import { SafetyNote } from '../../../ui/safety-note/safety-note';

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** "2026-07" as "Jul 2026" on the axis and "July 2026" in words; a week "2026-W27" as "Week 27, 2026". */
function periodWords(period: string, short: boolean): string {
  const week = /^(\d{4})-W(\d{2})$/.exec(period);
  if (week) return short ? `W${Number(week[2])} ${week[1]}` : `week ${Number(week[2])} of ${week[1]}`;
  const [year, month] = period.split('-');
  const name = MONTHS[Number(month) - 1] ?? month;
  return `${short ? name.slice(0, 3) : name} ${year}`;
}

@Component({
  selector: 'th-ledger-page',
  imports: [SafetyNote, MatButtonToggleModule, MatIconModule, MatProgressBarModule, RouterLink, BarChart, EmptyState, FigureButton, SystemBars, MoneySummary],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './ledger-page.html',
  styleUrls: ['../figure-table.css', './ledger-page.css'],
})
export class LedgerPage {
  protected readonly summaryFigures: readonly FigureName[] = [
    'budget',
    'netCost',
    'spent',
    'forecast',
    'forecastAdjusted',
    'variance',
    'coreDepositsOutstanding',
    'returnsAwaitingRefund',
  ];
  protected readonly summaryHints = computed(() => {
    const ledger = this.ledger();
    return ledger ? { forecastAdjusted: overrunExplanation(ledger.overrunFactor, ledger.overrunSample, OVERRUN_MIN_SAMPLE) } : {};
  });
  private readonly ledgerApi = inject(LedgerApi);
  private readonly dialog = inject(MatDialog);
  private readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly labels = FIGURE_LABELS;
  protected readonly periodFigures = ['spent', 'netCost'] as const;

  protected readonly ledger = signal<LedgerDto | null>(null);
  protected readonly spend = signal<SpendResponse | null>(null);
  protected readonly vendors = signal<VendorsResponse | null>(null);
  protected readonly by = signal<SpendPeriod>('month');
  protected readonly loading = signal(false);
  protected readonly problem = signal('');

  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly canAddReceipts = computed(() => this.current.build()?.role !== 'reviewer');
  /** Nothing filed yet: no period has any line (the spend series only spans filed purchases). */
  protected readonly nothingFiled = computed(() => this.spend()?.periods.length === 0);
  /** The caution names the systems the page shows (those with figures), not every system the build could have. */
  protected readonly hasCaution = computed(() => (this.ledger()?.systems ?? []).some((system) => system.safetyCaution && hasFigures(system)));
  protected readonly cautionSystems = computed(() =>
    (this.ledger()?.systems ?? [])
      .filter((system) => system.safetyCaution && hasFigures(system))
      .map((system) => system.name),
  );
  protected readonly format = computed(() => {
    const currency = this.ledger()?.currency ?? '';
    const locale = this.locale();
    return (amount: string) => moneyText(amount, currency, locale);
  });
  protected readonly axisFormat = computed(() => {
    const currency = this.ledger()?.currency ?? '';
    const locale = this.locale();
    return (value: number) => wholeMoneyText(value, currency, locale);
  });
  protected readonly periodLabels = computed(() => (this.spend()?.periods ?? []).map((row) => periodWords(row.period, true)));
  protected readonly spendSeries = computed<ChartSeries[]>(() => {
    const periods = this.spend()?.periods ?? [];
    // One series: spent and net cost differ only by deposits and refunds, so two bars per period mostly repeated each
    // other; the table under the chart keeps both figures.
    return [{ label: 'Net cost', values: periods.map((row) => row.netCost), color: LEDGER_COLORS.netCost }];
  });
  protected readonly vendorNames = computed(() => (this.vendors()?.vendors ?? []).map((vendor) => this.vendorName(vendor)));
  protected readonly vendorSeries = computed<ChartSeries[]>(() => [
    { label: 'Net cost', values: (this.vendors()?.vendors ?? []).map((vendor) => vendor.netCost), color: LEDGER_COLORS.netCost },
  ]);

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected periodName(period: string): string {
    return periodWords(period, false);
  }

  protected vendorName(vendor: VendorSpendDto): string {
    return vendor.vendor ?? 'Shop not named';
  }

  protected setPeriod(by: SpendPeriod): void {
    this.by.set(by);
    this.ledgerApi.spend(this.buildId(), by).subscribe({ next: (spend) => this.spend.set(spend) });
  }

  protected openTotal(figure: LedgerLineFigure): void {
    this.openLines({ figure, title: `${FIGURE_LABELS[figure]} of the whole build` });
  }

  protected openPeriod(period: string, figure: LedgerLineFigure): void {
    this.openLines({ figure, period, title: `${FIGURE_LABELS[figure]} in ${periodWords(period, false)}` });
  }

  protected openVendor(vendor: VendorSpendDto, figure: LedgerLineFigure): void {
    this.openLines({ figure, vendorId: vendor.vendorId ?? 'none', title: `${FIGURE_LABELS[figure]} at ${this.vendorName(vendor)}` });
  }

  protected periodClicked(click: BarClick): void {
    const row = this.spend()?.periods[click.index];
    if (row) this.openPeriod(row.period, 'netCost');
  }

  protected vendorClicked(click: BarClick): void {
    const vendor = this.vendors()?.vendors[click.index];
    if (vendor) this.openVendor(vendor, 'netCost');
  }

  protected openLines(request: LinesRequest): void {
    const ledger = this.ledger();
    if (!ledger) return;
    const data: LinesDialogData = { buildId: this.buildId(), currency: ledger.currency, locale: this.locale(), request };
    this.dialog.open(LinesDialog, { data, width: '640px', maxWidth: 'calc(100vw - 24px)', autoFocus: 'dialog' });
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.problem.set('');
    forkJoin([this.ledgerApi.ledger(buildId), this.ledgerApi.spend(buildId, this.by()), this.ledgerApi.vendors(buildId)]).subscribe({
      next: ([ledger, spend, vendors]) => {
        this.ledger.set(ledger);
        this.spend.set(spend);
        this.vendors.set(vendors);
        this.loading.set(false);
      },
      error: () => {
        this.problem.set('The ledger could not be loaded. Check your connection and reload the page.');
        this.loading.set(false);
      },
    });
  }
}
