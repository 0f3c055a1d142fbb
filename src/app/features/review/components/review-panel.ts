// A filed receipt's review in one panel: its state in words and icon, the comment thread, and the audit trail of
// every money change (who, when, before → after); used on the Review screen and on the check screen.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { SystemDto } from '../../../../../shared/api/parts';
import type { ReceiptDto } from '../../../../../shared/api/receipts';
import { commentRequest, type AuditEventDto, type CommentDto } from '../../../../../shared/api/review';
import type { ReviewState } from '../../../../../shared/enums';
import { toApiError } from '../../../core/http/api-error';
import { MoneyPipe } from '../../../ui/money';
import { auditEntry } from '../models/audit-text';
import { REVIEW_STATE_ICONS } from '../models/review-state';
import { ReviewApi } from '../services/review-api';

const STATE_TEXT: Record<ReviewState, string> = {
  none: 'Not reviewed yet',
  approved: 'Approved',
  questioned: 'Questioned',
  answered: 'Answered, back for review',
};

/** When something happened, in the reader's own time zone and language. */
export function momentText(iso: string, locale: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  try {
    return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(date);
  } catch {
    return iso;
  }
}

@Component({
  selector: 'th-review-panel',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './review-panel.html',
  styleUrl: './review-panel.css',
})
export class ReviewPanel {
  private readonly reviewApi = inject(ReviewApi);

  readonly buildId = input.required<string>();
  readonly receipt = input.required<ReceiptDto>();
  /** The build's systems, to name a line's system in the trail. */
  readonly systems = input<readonly SystemDto[]>([]);
  /** A comment was posted: it may have answered a question, so the receipt's review state may have moved. */
  readonly commented = output<void>();

  protected readonly comments = signal<CommentDto[]>([]);
  protected readonly events = signal<AuditEventDto[]>([]);
  protected readonly problem = signal('');
  protected readonly draftError = signal('');
  protected readonly sending = signal(false);
  protected readonly draft = new FormControl('', { nonNullable: true });

  protected readonly currency = computed(() => this.receipt().currency);
  protected readonly locale = computed(() => this.receipt().locale || 'en-US');
  protected readonly stateText = computed(() => ({ icon: REVIEW_STATE_ICONS[this.receipt().reviewState], text: STATE_TEXT[this.receipt().reviewState] }));
  /** Changes only with the receipt, its version or its verdict: a string, so an equal one does not reload. */
  private readonly loadKey = computed(() => {
    const receipt = this.receipt();
    return `${receipt.id}:${receipt.version}:${receipt.reviewState}`;
  });
  protected readonly trail = computed(() => {
    const systems = this.systems();
    const systemName = (id: string) => systems.find((system) => system.id === id)?.name ?? 'A system';
    return this.events().map((event) => auditEntry(event, systemName));
  });

  constructor() {
    // A new receipt, or a new version of it (a verdict, a change), reloads the thread and the trail.
    effect(() => {
      const buildId = this.buildId();
      this.loadKey();
      const receiptId = untracked(() => this.receipt().id);
      untracked(() => this.load(buildId, receiptId));
    });
  }

  protected when(iso: string): string {
    return momentText(iso, this.locale());
  }

  protected send(event: Event): void {
    event.preventDefault();
    const parsed = commentRequest.safeParse({ body: this.draft.value });
    if (!parsed.success) {
      this.draftError.set(parsed.error.issues[0]?.message ?? 'Write a comment.');
      this.draft.setErrors({ message: this.draftError() });
      this.draft.markAsTouched();
      return;
    }
    this.draftError.set('');
    this.sending.set(true);
    this.reviewApi.addComment(this.buildId(), this.receipt().id, parsed.data.body).subscribe({
      next: (comment) => {
        this.comments.update((comments) => [...comments, comment]);
        this.draft.reset();
        this.sending.set(false);
        this.commented.emit();
      },
      error: (error: unknown) => {
        const apiError = toApiError(error);
        this.draftError.set(apiError.fields['body'] ?? apiError.message);
        this.draft.setErrors({ message: this.draftError() });
        this.draft.markAsTouched();
        this.sending.set(false);
      },
    });
  }

  private load(buildId: string, receiptId: string): void {
    this.problem.set('');
    this.reviewApi.comments(buildId, receiptId).subscribe({
      next: (comments) => this.comments.set(comments),
      error: (error: unknown) => this.problem.set(`The comments could not be loaded: ${toApiError(error).message}`),
    });
    this.reviewApi.audit(buildId, receiptId).subscribe({
      next: (events) => this.events.set(events),
      error: (error: unknown) => this.problem.set(`The changes could not be loaded: ${toApiError(error).message}`),
    });
  }
}
