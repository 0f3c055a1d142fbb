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
  template: `
    <section class="review-panel" aria-labelledby="review-heading">
      <h2 id="review-heading" class="panel-heading">Review</h2>
      @let state = stateText();
      <p class="review-state" [class]="'review-state state-' + receipt().reviewState" role="status">
        <mat-icon aria-hidden="true">{{ state.icon }}</mat-icon>
        @if ((receipt().reviewState === 'questioned' || receipt().reviewState === 'answered') && receipt().reviewComment) {
          <span class="state-words"><strong>{{ state.text }}:</strong> {{ receipt().reviewComment }}</span>
        } @else {
          <span class="state-words"><strong>{{ state.text }}</strong></span>
        }
      </p>

      <h3 class="sub-heading">Comments</h3>
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }
      @if (comments().length === 0) {
        <p class="muted">No comments yet. Ask about a line or explain one below; whoever uploaded the receipt is told by e-mail, and a reply to a question sends it back for review.</p>
      } @else {
        <ol class="thread" aria-label="Comments">
          @for (comment of comments(); track comment.id) {
            <li>
              <p class="comment-meta"><strong>{{ comment.author }}</strong> · <span>{{ when(comment.createdAt) }}</span></p>
              <p class="comment-body">{{ comment.body }}</p>
            </li>
          }
        </ol>
      }
      <form class="comment-form" (submit)="send($event)" novalidate>
        <mat-form-field subscriptSizing="dynamic" class="comment-field">
          <mat-label>Add a comment</mat-label>
          <textarea matInput [formControl]="draft" rows="2"></textarea>
          @if (draftError()) {
            <mat-error>{{ draftError() }}</mat-error>
          }
        </mat-form-field>
        <button mat-stroked-button type="submit" [disabled]="sending()">
          <mat-icon aria-hidden="true">send</mat-icon> Post comment
        </button>
      </form>

      <h3 class="sub-heading">Changes to money</h3>
      @if (trail().length === 0) {
        <p class="muted">No changes recorded yet.</p>
      } @else {
        <ol class="trail" aria-label="Changes to money">
          @for (entry of trail(); track entry.id) {
            <li>
              <p class="trail-head"><strong>{{ entry.label }}</strong> · {{ entry.who }} · {{ when(entry.at) }}</p>
              @if (entry.changes.length > 0) {
                <dl class="changes">
                  @for (change of entry.changes; track change.field) {
                    <div>
                      <dt>{{ change.label }}</dt>
                      <dd>
                        @if (change.kind !== 'set') {
                          <span [class.tabular]="change.money">{{ change.before === null ? '—' : change.money ? (change.before | money: currency() : locale() : 4) : change.before }}</span>
                        }
                        @if (change.kind === 'change') {
                          <span class="arrow"> → </span>
                        }
                        @if (change.kind !== 'removed') {
                          <span [class.tabular]="change.money">{{ change.after === null ? '—' : change.money ? (change.after | money: currency() : locale() : 4) : change.after }}</span>
                        } @else {
                          <span class="arrow"> (removed)</span>
                        }
                      </dd>
                    </div>
                  }
                </dl>
              }
            </li>
          }
        </ol>
      }
    </section>
  `,
  styles: `
    :host {
      display: block;
    }
    .review-panel {
      margin-top: 24px;
      padding: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    .panel-heading {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    .sub-heading {
      font: var(--mat-sys-title-medium);
      margin: 20px 0 8px;
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .review-state {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin: 0;
      padding: 8px 12px;
      border-radius: 8px;
      background: var(--mat-sys-surface-container);
    }
    .state-approved mat-icon {
      color: var(--mat-sys-primary);
    }
    .state-questioned mat-icon {
      color: var(--mat-sys-error);
    }
    .thread,
    .trail {
      list-style: none;
      padding: 0;
      margin: 0;
      display: flex;
      flex-direction: column;
      gap: 10px;
    }
    .thread li {
      padding: 8px 12px;
      border-radius: 8px;
      background: var(--mat-sys-surface-container-low);
    }
    .comment-meta,
    .trail-head {
      margin: 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .comment-meta strong,
    .trail-head strong {
      color: var(--mat-sys-on-surface);
    }
    .comment-body {
      margin: 4px 0 0;
      white-space: pre-wrap;
    }
    .comment-form {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      align-items: flex-start;
      margin-top: 12px;
    }
    .comment-field {
      flex: 1 1 260px;
    }
    .changes {
      margin: 4px 0 0;
      display: grid;
      gap: 2px;
    }
    .changes div {
      display: flex;
      flex-wrap: wrap;
      gap: 0 8px;
    }
    .changes dt {
      min-width: 9em;
      color: var(--mat-sys-on-surface-variant);
    }
    .changes dd {
      margin: 0;
    }
    .arrow {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
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
