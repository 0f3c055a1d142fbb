// The safety caution where the work can hurt someone: shown to each person once per build, where a risky system's
// money first appears (ledger, parts, budgets, a receipt with such a line), until they say they have read it. After
// that, the small shield beside risky systems and parts carries the reminder; the build sheet always prints it.
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { SAFETY_CAUTION } from '../../../../shared/safety';
import { Session } from '../../core/auth/session';

const KEY_PREFIX = 'tallyhood.safety-note-read';

/** Per person and build, on this device: reading it on a phone does not hide it on a shared workshop computer's other account. */
function storageKey(userId: string, buildId: string): string {
  return `${KEY_PREFIX}.${userId}.${buildId}`;
}

@Component({
  selector: 'th-safety-note',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './safety-note.html',
  styleUrl: './safety-note.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SafetyNote {
  private readonly session = inject(Session);

  readonly buildId = input.required<string>();
  /** The risky systems in view, named before the caution ("Fuel, Wiring harness: …"); empty names none. */
  readonly systems = input<readonly string[]>([]);

  protected readonly caution = SAFETY_CAUTION;
  private readonly readNow = signal(false);

  private readonly key = computed(() => storageKey(this.session.user()?.id ?? 'anyone', this.buildId()));
  protected readonly shown = computed(() => !this.readNow() && localStorage.getItem(this.key()) === null);

  protected markRead(): void {
    localStorage.setItem(this.key(), new Date().toISOString());
    this.readNow.set(true);
  }
}
