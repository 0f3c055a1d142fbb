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
  templateUrl: './capture-status.html',
  styleUrl: './capture-status.css',
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
