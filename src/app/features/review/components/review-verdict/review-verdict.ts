// Approve or question a filed receipt: the one set of verdict controls, on the Review screen and on the receipt's own
// page, for the owner or a reviewer. A question needs words; the uploader is told by e-mail.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { ReceiptDto } from '../../../../../../shared/api/receipts';
import { reviewRequest } from '../../../../../../shared/api/review';
import { toApiError } from '../../../../core/http/api-error';
import { ReviewApi, type ReviewResult } from '../../services/review-api';

export type Verdict = 'approved' | 'questioned';

@Component({
  selector: 'th-review-verdict',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './review-verdict.html',
  styleUrl: './review-verdict.css',
})
export class ReviewVerdict {
  private readonly reviewApi = inject(ReviewApi);

  readonly buildId = input.required<string>();
  readonly receipt = input.required<ReceiptDto>();
  /** The verdict was saved: the new state and version. */
  readonly decided = output<ReviewResult & { verdict: Verdict }>();
  /** Someone changed the receipt meanwhile (409): the parent shows it as saved before anyone decides. */
  readonly stale = output<void>();

  protected readonly asking = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly questionError = signal('');
  protected readonly question = new FormControl('', { nonNullable: true });

  /** Only a different receipt (not a new copy of the same one) resets the form. */
  private readonly receiptId = computed(() => this.receipt().id);

  constructor() {
    // Another receipt starts with closed, empty controls.
    effect(() => {
      this.receiptId();
      this.asking.set(false);
      this.question.reset();
      this.questionError.set('');
      this.problem.set('');
    });
  }

  protected approve(): void {
    this.send('approved', '');
  }

  protected startQuestion(): void {
    this.asking.set(true);
  }

  protected sendQuestion(event: Event): void {
    event.preventDefault();
    const parsed = reviewRequest.safeParse({ verdict: 'questioned', comment: this.question.value, version: this.receipt().version });
    if (!parsed.success) {
      this.showQuestionError(parsed.error.issues[0]?.message ?? 'Say what the question is.');
      return;
    }
    this.send('questioned', parsed.data.comment);
  }

  private showQuestionError(message: string): void {
    this.questionError.set(message);
    this.question.setErrors({ message });
    this.question.markAsTouched();
  }

  private send(verdict: Verdict, comment: string): void {
    const receipt = this.receipt();
    this.busy.set(true);
    this.problem.set('');
    this.reviewApi.review(this.buildId(), receipt.id, { verdict, comment, version: receipt.version }).subscribe({
      next: (result) => {
        this.busy.set(false);
        this.asking.set(false);
        this.question.reset();
        this.questionError.set('');
        this.decided.emit({ ...result, verdict });
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const apiError = toApiError(error);
        if (apiError.status === 409) this.stale.emit();
        else if (apiError.status === 400 && apiError.fields['comment']) this.showQuestionError(apiError.fields['comment']);
        else this.problem.set(Object.values(apiError.fields)[0] ?? apiError.message);
      },
    });
  }
}
