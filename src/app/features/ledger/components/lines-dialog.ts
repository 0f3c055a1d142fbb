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
  template: `
    <h2 mat-dialog-title>{{ data.request.title }}</h2>
    <mat-dialog-content>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the lines" />
      }
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }
      @if (response(); as answer) {
        @if (answer.lines.length === 0) {
          <p>No filed receipt line is counted in this figure yet.</p>
        } @else {
          <p class="sum" role="status">
            {{ answer.lines.length }} {{ answer.lines.length === 1 ? 'line adds' : 'lines add' }} up to
            <strong class="tabular">{{ answer.total | money: data.currency : data.locale }}</strong>
          </p>
          <ul class="lines" aria-label="Lines">
            @for (line of answer.lines; track line.lineId) {
              <li class="line">
                <div class="line-head">
                  <a class="line-link" [routerLink]="['/builds', data.buildId, 'receipts', line.receiptId]" mat-dialog-close>
                    {{ line.description }}
                  </a>
                  <span class="line-total tabular">{{ line.lineTotal | money: data.currency : data.locale }}</span>
                </div>
                <div class="line-meta">
                  {{ dateText(line.purchaseDate) }} · {{ line.vendor ?? 'Shop not named' }} · {{ kindLabels[line.kind] }} · {{ line.system }}
                </div>
                @if (hasShares(line)) {
                  <div class="line-shares tabular">
                    {{ line.amount | money: data.currency : data.locale }} on the receipt
                    @if (!isZero(line.allocatedTax)) {
                      + tax {{ line.allocatedTax | money: data.currency : data.locale }}
                    }
                    @if (!isZero(line.allocatedShipping)) {
                      + shipping {{ line.allocatedShipping | money: data.currency : data.locale }}
                    }
                    @if (!isZero(line.allocatedDiscount)) {
                      − discount {{ line.allocatedDiscount | money: data.currency : data.locale }}
                    }
                  </div>
                }
              </li>
            }
          </ul>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close type="button">Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    .sum {
      margin: 0 0 12px;
    }
    .lines {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .line {
      padding: 10px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .line-head {
      display: flex;
      justify-content: space-between;
      gap: 12px;
      align-items: baseline;
    }
    .line-link {
      font: var(--mat-sys-title-small);
      min-height: 24px;
      display: inline-flex;
      align-items: center;
    }
    .line-total {
      white-space: nowrap;
      text-align: right;
      font-weight: 600;
    }
    .line-meta,
    .line-shares {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin-top: 2px;
    }
  `,
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
