// The lines behind a ledger figure: each with its receipt's date and shop, its shares of tax, shipping and discount,
// a link to the receipt, and their sum, which is the figure the person clicked.
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { LedgerLinesResponse } from '../../../../../shared/api/ledger';
import { RECEIPT_LINE_KIND_LABELS } from '../../../../../shared/enums';
import { toDecimal } from '../../../../../shared/money';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { MoneyPipe } from '../../../ui/money';
import type { LinesRequest } from '../models/ledger-words';
import { LedgerApi } from '../services/ledger-api';

export interface LinesDialogData {
  buildId: string;
  currency: string;
  locale: string;
  request: LinesRequest;
}

@Component({
  selector: 'th-lines-dialog',
  imports: [MatButtonModule, MatDialogModule, MatIconModule, MatProgressBarModule, RouterLink, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './lines-dialog.html',
  styleUrl: './lines-dialog.css',
})
export class LinesDialog {
  protected readonly data = inject<LinesDialogData>(MAT_DIALOG_DATA);
  private readonly ledgerApi = inject(LedgerApi);

  protected readonly kindLabels = RECEIPT_LINE_KIND_LABELS;
  protected readonly response = signal<LedgerLinesResponse | null>(null);
  protected readonly loading = signal(true);
  protected readonly problem = signal('');

  constructor() {
    const { buildId, request } = this.data;
    this.ledgerApi.lines(buildId, { figure: request.figure, systemId: request.systemId, vendorId: request.vendorId, period: request.period }).subscribe({
      next: (response) => {
        this.response.set(response);
        this.loading.set(false);
      },
      error: (error: unknown) => {
        this.problem.set(`${toApiError(error).message} Close this panel and try again.`);
        this.loading.set(false);
      },
    });
  }

  protected dateText(value: string): string {
    return formatCalendarDate(value, this.data.locale);
  }

  protected isZero(amount: string): boolean {
    return toDecimal(amount).isZero();
  }

  protected hasShares(line: { allocatedTax: string; allocatedShipping: string; allocatedDiscount: string }): boolean {
    return !this.isZero(line.allocatedTax) || !this.isZero(line.allocatedShipping) || !this.isZero(line.allocatedDiscount);
  }
}
