// The shell's chip for captures the server does not have yet: how many wait to be sent, how many were refused, and
// in its menu each one with what can be done (send now, try again, discard).
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { CaptureQueue, type QueuedCapture } from '../services/capture-queue';

@Component({
  selector: 'th-capture-status',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (queue.captures().length > 0) {
      <button type="button" class="chip" [class.has-refused]="queue.refused().length > 0" [matMenuTriggerFor]="captureMenu">
        @if (queue.waiting().length > 0) {
          <mat-icon aria-hidden="true">cloud_upload</mat-icon><span>Waiting to send ({{ queue.waiting().length }})</span>
        }
        @if (queue.refused().length > 0) {
          <mat-icon aria-hidden="true">error</mat-icon><span>Not sent ({{ queue.refused().length }})</span>
        }
      </button>
      <mat-menu #captureMenu="matMenu" class="capture-menu">
        @if (queue.waiting().length > 0) {
          <p class="menu-note" role="note">{{ waitingNote() }}</p>
          <button mat-menu-item type="button" (click)="queue.sendWaiting()">
            <mat-icon aria-hidden="true">send</mat-icon><span>Send now</span>
          </button>
        }
        @for (capture of queue.refused(); track capture.id) {
          <p class="menu-note refused">{{ reason(capture) }}</p>
          <button mat-menu-item type="button" (click)="queue.retry(capture.id)">
            <mat-icon aria-hidden="true">refresh</mat-icon><span>Try {{ capture.name }} again</span>
          </button>
          <button mat-menu-item type="button" (click)="queue.discard(capture.id)">
            <mat-icon aria-hidden="true">delete</mat-icon><span>Discard {{ capture.name }}</span>
          </button>
        }
      </mat-menu>
    }
  `,
  styles: `
    .chip {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      min-height: 32px;
      padding: 4px 12px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 8px;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
      font: var(--mat-sys-label-large);
      cursor: pointer;
    }
    .chip mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .chip.has-refused {
      border-color: var(--mat-sys-error);
    }
    .chip:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .menu-note {
      margin: 8px 16px;
      max-width: 280px;
      font: var(--mat-sys-body-small);
    }
    .menu-note.refused {
      color: var(--mat-sys-error);
    }
  `,
})
export class CaptureStatus {
  protected readonly queue = inject(CaptureQueue);
  protected readonly waitingNote = computed(() => {
    const count = this.queue.waiting().length;
    const photos = count === 1 ? 'This photo is' : `These ${count} photos are`;
    return `${photos} saved on this device and will be sent when there is a connection.`;
  });

  /** The server's reason, naming the file (a refused file's reason already starts with its name). */
  protected reason(capture: QueuedCapture): string {
    return capture.problem!.startsWith(capture.name) ? capture.problem! : `${capture.name}: ${capture.problem}`;
  }
}
