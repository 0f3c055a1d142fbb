// The build's inbox on the Settings page: the address to mail receipts to (copy, or replace it with a new one) for
// owner and crew, and for the owner the mail that was not added, with why.
import { Clipboard } from '@angular/cdk/clipboard';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MAIL_REFUSAL_LABELS, type MailRefusalDto } from '../../../../../../shared/api/inbox';
import type { BuildRole } from '../../../../../../shared/enums';
import { confirmAction } from '../../../../ui/confirm-dialog';
import { InboxApi } from '../../services/inbox-api';

@Component({
  selector: 'th-build-inbox',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  templateUrl: './build-inbox.html',
  styleUrl: './build-inbox.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BuildInbox {
  private readonly inboxApi = inject(InboxApi);
  private readonly clipboard = inject(Clipboard);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  readonly buildId = input.required<string>();
  /** Owner and crew only: a reviewer adds no receipts, so the page does not show them this. */
  readonly memberRole = input.required<BuildRole>();

  protected readonly address = signal<string | null>(null);
  protected readonly refused = signal<MailRefusalDto[] | null>(null);
  protected readonly rotating = signal(false);
  protected readonly isOwner = computed(() => this.memberRole() === 'owner');
  protected readonly reasonLabels = MAIL_REFUSAL_LABELS;

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      const owner = this.isOwner();
      untracked(() => this.load(buildId, owner));
    });
  }

  protected copy(address: string): void {
    const copied = this.clipboard.copy(address);
    this.snackBar.open(copied ? 'Address copied.' : 'The address could not be copied: select it and copy it by hand.', 'Dismiss', { duration: 4000 });
  }

  protected rotate(): void {
    confirmAction(this.dialog, {
      title: 'Get a new address?',
      message: 'Mail to the current address will no longer be added to this build. Anyone who sends receipts to it, and any forwarding rule you set up, needs the new one.',
      confirmLabel: 'Get a new address',
    }).subscribe((confirmed) => {
      if (!confirmed) return;
      this.rotating.set(true);
      this.inboxApi.rotate(this.buildId()).subscribe({
        next: ({ address }) => {
          this.address.set(address);
          this.rotating.set(false);
          this.snackBar.open('New address ready. The old one no longer adds receipts.', 'Dismiss', { duration: 5000 });
        },
        // The error itself is shown by the API error interceptor; the address stays as it was.
        error: () => this.rotating.set(false),
      });
    });
  }

  private load(buildId: string, owner: boolean): void {
    this.inboxApi.inbox(buildId).subscribe(({ address }) => this.address.set(address));
    if (owner) this.inboxApi.refused(buildId).subscribe(({ refused }) => this.refused.set(refused));
  }
}
