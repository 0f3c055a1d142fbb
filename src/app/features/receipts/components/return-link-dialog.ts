// Finds the line a return gives back (on another receipt of the build) by its description or part number.
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Subject, debounceTime, switchMap } from 'rxjs';
import type { LineSearchResultDto } from '../../../../../shared/api/receipts';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { moneyText } from '../../../ui/money';
import { ReceiptsApi } from '../services/receipts-api';

export interface ReturnLinkData {
  buildId: string;
  receiptId: string;
  description: string;
  currency: string;
  locale: string;
}

@Component({
  selector: 'th-return-link-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './return-link-dialog.html',
  styleUrl: './return-link-dialog.css',
})
export class ReturnLinkDialog {
  protected readonly data = inject<ReturnLinkData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<ReturnLinkDialog, string>>(MatDialogRef);
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly query = new Subject<string>();
  protected readonly results = signal<LineSearchResultDto[]>([]);
  protected readonly status = signal('Type at least two characters of the description or part number.');

  constructor() {
    this.query
      .pipe(
        debounceTime(250),
        switchMap((text) => this.receiptsApi.searchLines(this.data.buildId, text, this.data.receiptId)),
        takeUntilDestroyed(),
      )
      .subscribe({
        next: (lines) => {
          this.results.set(lines);
          this.status.set(lines.length ? `${lines.length} matching ${lines.length === 1 ? 'line' : 'lines'}.` : 'No line matches. Try fewer words.');
        },
        error: (error: unknown) => this.status.set(toApiError(error).message),
      });
  }

  protected typed(text: string): void {
    const trimmed = text.trim();
    if (trimmed.length < 2) {
      this.results.set([]);
      return;
    }
    this.query.next(trimmed);
  }

  protected dateOf(result: LineSearchResultDto): string {
    return formatCalendarDate(result.purchaseDate, this.data.locale);
  }

  protected amountOf(result: LineSearchResultDto): string {
    return moneyText(result.amount, this.data.currency, this.data.locale);
  }

  protected choose(result: LineSearchResultDto): void {
    this.dialogRef.close(result.lineId);
  }
}
