// The likely-duplicate warning on a receipt, with "Not a duplicate" for the owner and the reviewer: a reason is
// required, goes into both receipts' audit trails, and the warning then leaves both.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import type { ReceiptDto } from '../../../../../../shared/api/receipts';
import { notDuplicateRequest } from '../../../../../../shared/api/review';
import { toApiError } from '../../../../core/http/api-error';
import { ReceiptsApi } from '../../services/receipts-api';

@Component({
  selector: 'th-duplicate-notice',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './duplicate-notice.html',
  styleUrl: './duplicate-notice.css',
})
export class DuplicateNotice {
  private readonly receiptsApi = inject(ReceiptsApi);

  readonly buildId = input.required<string>();
  readonly receipt = input.required<ReceiptDto>();
  /** The owner and the reviewer may say a pair is two purchases; crew see the warning only. */
  readonly canClear = input(false);
  /** The receipt as saved after the pair was marked. */
  readonly cleared = output<ReceiptDto>();

  /** The other receipt of the pair being marked, while its reason is asked for. */
  protected readonly marking = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly reasonError = signal('');
  protected readonly problem = signal('');
  protected readonly reason = new FormControl('', { nonNullable: true });

  /** Only a different receipt (not a new copy of the same one) resets the form. */
  private readonly receiptId = computed(() => this.receipt().id);

  constructor() {
    effect(() => {
      this.receiptId();
      this.cancel();
    });
  }

  protected mark(otherReceiptId: string): void {
    this.marking.set(otherReceiptId);
    this.problem.set('');
  }

  protected cancel(): void {
    this.marking.set(null);
    this.reason.reset();
    this.reasonError.set('');
  }

  protected send(event: Event): void {
    event.preventDefault();
    const otherReceiptId = this.marking();
    if (!otherReceiptId) return;
    const parsed = notDuplicateRequest.safeParse({ otherReceiptId, reason: this.reason.value });
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      if (issue?.path[0] === 'reason') this.showReasonError(issue.message);
      else this.problem.set(issue?.message ?? 'This pair cannot be marked.');
      return;
    }
    this.busy.set(true);
    this.receiptsApi.notDuplicate(this.buildId(), this.receipt().id, parsed.data).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.cancel();
        this.cleared.emit(saved);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const apiError = toApiError(error);
        if (apiError.fields['reason']) this.showReasonError(apiError.fields['reason']);
        else this.problem.set(Object.values(apiError.fields)[0] ?? apiError.message);
      },
    });
  }

  private showReasonError(message: string): void {
    this.reasonError.set(message);
    this.reason.setErrors({ message });
    this.reason.markAsTouched();
  }
}
