// Uploads in flight, kept outside any one page: the phone bar's camera button starts them and the receipts list shows them.
import { Injectable, inject, signal } from '@angular/core';
import { toApiError } from '../../../core/http/api-error';
import { ReceiptsApi } from './receipts-api';

export interface UploadRow {
  key: number;
  buildId: string;
  name: string;
  percent: number;
  status: 'sending' | 'done' | 'refused';
  message: string;
}

/** How one capture's sending ended: arrived, still to send later, or refused for good (with the reason). */
export type UploadOutcome = { kind: 'sent' } | { kind: 'waiting' } | { kind: 'refused'; message: string };

@Injectable({ providedIn: 'root' })
export class ReceiptUploads {
  private readonly receiptsApi = inject(ReceiptsApi);
  private readonly rowsSignal = signal<UploadRow[]>([]);
  private readonly finishedSignal = signal(0);
  private nextKey = 0;

  /** Every upload of this session, all builds: a page shows those of its own build. */
  readonly rows = this.rowsSignal.asReadonly();
  /** Goes up by one each time a file has been taken by the server, so a list knows to load again. */
  readonly finished = this.finishedSignal.asReadonly();

  /** Sends each file on its own, so each has its own progress bar and a refused file leaves the others alone. */
  send(buildId: string, files: readonly File[]): void {
    for (const file of files) void this.sendOne(buildId, file);
  }

  /**
   * Sends one queued capture under its Idempotency-Key. A failure that may pass (no signal, signed out, the server
   * busy) drops its progress row, since the capture queue shows it as waiting; a refusal stays, with its reason.
   */
  sendCapture(buildId: string, file: File, idempotencyKey: string): Promise<UploadOutcome> {
    return this.sendOne(buildId, file, idempotencyKey);
  }

  private sendOne(buildId: string, file: File, idempotencyKey?: string): Promise<UploadOutcome> {
    const key = ++this.nextKey;
    const patch = (change: Partial<UploadRow>) => this.rowsSignal.update((rows) => rows.map((row) => (row.key === key ? { ...row, ...change } : row)));
    this.rowsSignal.update((rows) => [...rows, { key, buildId, name: file.name, percent: 0, status: 'sending', message: '' }]);
    return new Promise((resolve) => {
      // Not tied to a page's lifetime: leaving the page must not cancel a photo on its way up.
      this.receiptsApi.upload(buildId, [file], idempotencyKey).subscribe({
        next: (progress) => {
          if (progress.kind === 'progress') {
            patch({ percent: progress.percent });
          } else {
            patch({ percent: 100, status: 'done' });
            this.finishedSignal.update((count) => count + 1);
            resolve({ kind: 'sent' });
          }
        },
        error: (error: unknown) => {
          const apiError = toApiError(error);
          if (idempotencyKey !== undefined && mayPassLater(apiError.status)) {
            this.rowsSignal.update((rows) => rows.filter((row) => row.key !== key));
            resolve({ kind: 'waiting' });
            return;
          }
          // One file per request, so its problem is under files.0 (or files when the whole upload was refused).
          const message = apiError.fields['files.0'] ?? apiError.fields['files'] ?? apiError.message;
          patch({ status: 'refused', message });
          resolve({ kind: 'refused', message });
        },
      });
    });
  }
}

/** No answer, signed out, a conflict, too many requests or a server fault: the same capture may pass when sent again. */
function mayPassLater(status: number): boolean {
  return status === 0 || status === 401 || status === 408 || status === 409 || status === 425 || status === 429 || status >= 500;
}
