// Photos from the camera button wait in IndexedDB until the server has them. Taken without signal, or with the tab
// closed half-way, they are sent when the connection returns or the app starts again, each under its own client-made
// Idempotency-Key, so sending one again never makes a second receipt.
import { DestroyRef, Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { createStore, del, entries, set } from 'idb-keyval';
import { Session } from '../../../core/auth/session';
import { downscalePhoto } from './photo-downscale';
import { ReceiptUploads } from './receipt-uploads';

/** Where captures wait: an IndexedDB database and its one object store, keyed by the capture's id. */
export const CAPTURE_DATABASE = { name: 'tallyhood-captures', store: 'captures' } as const;

export interface QueuedCapture {
  /** Made on the phone; sent as the Idempotency-Key. */
  id: string;
  /** Whose capture it is: only they send it, so a shared phone never files a photo under another person's name. */
  userId: string;
  buildId: string;
  name: string;
  type: string;
  /** The (downscaled) photo or PDF; bytes rather than a Blob, which some browsers' IndexedDB stored unreliably. */
  bytes: ArrayBuffer;
  capturedAt: string;
  /** Why the server refused it for good; null while it waits to be sent. */
  problem: string | null;
}

@Injectable({ providedIn: 'root' })
export class CaptureQueue {
  private readonly session = inject(Session);
  private readonly uploads = inject(ReceiptUploads);
  private readonly store = createStore(CAPTURE_DATABASE.name, CAPTURE_DATABASE.store);
  private readonly capturesSignal = signal<QueuedCapture[]>([]);
  private readonly inFlight = new Set<string>();

  /** The signed-in person's captures the server does not have yet, oldest first. */
  readonly captures = this.capturesSignal.asReadonly();
  readonly waiting = computed(() => this.captures().filter((capture) => capture.problem === null));
  readonly refused = computed(() => this.captures().filter((capture) => capture.problem !== null));

  constructor() {
    // At start, and whenever someone signs in: that person's captures from earlier visits are shown and sent.
    effect(() => {
      const userId = this.session.user()?.id ?? null;
      untracked(() => void this.restore(userId));
    });
    const online = () => void this.sendWaiting();
    window.addEventListener('online', online);
    inject(DestroyRef).onDestroy(() => window.removeEventListener('online', online));
  }

  /** Saves each photo (downscaled) before anything is sent, then sends it; from the save on, nothing is lost. */
  async capture(buildId: string, files: readonly File[]): Promise<void> {
    const userId = this.session.user()?.id;
    if (!userId) {
      // Nobody known to keep them for (the session just ended): sent at once, so the refusal shows rather than a loss.
      this.uploads.send(buildId, files);
      return;
    }
    for (const file of files) {
      const photo = await downscalePhoto(file);
      const capture: QueuedCapture = {
        id: crypto.randomUUID(),
        userId,
        buildId,
        name: photo.name,
        type: photo.type,
        bytes: await photo.arrayBuffer(),
        capturedAt: new Date().toISOString(),
        problem: null,
      };
      await set(capture.id, capture, this.store);
      this.capturesSignal.update((captures) => [...captures, capture]);
      void this.sendOne(capture);
    }
  }

  /** One at a time: a weak signal carries one photo at a time better than several at once. */
  async sendWaiting(): Promise<void> {
    for (const capture of this.waiting()) await this.sendOne(capture);
  }

  /** A refused capture tried once more (after the person fixed what the reason said, such as their role). */
  async retry(id: string): Promise<void> {
    const capture = this.captures().find((candidate) => candidate.id === id);
    if (!capture) return;
    await this.keep({ ...capture, problem: null });
    await this.sendOne({ ...capture, problem: null });
  }

  /** Only ever by the person's own choice: a capture is never dropped silently. */
  async discard(id: string): Promise<void> {
    await del(id, this.store);
    this.capturesSignal.update((captures) => captures.filter((capture) => capture.id !== id));
  }

  private async sendOne(capture: QueuedCapture): Promise<void> {
    // Without signal the request could only fail; the `online` event sends it.
    if (this.inFlight.has(capture.id) || !navigator.onLine) return;
    this.inFlight.add(capture.id);
    try {
      const file = new File([capture.bytes], capture.name, { type: capture.type });
      const outcome = await this.uploads.sendCapture(capture.buildId, file, capture.id);
      if (outcome.kind === 'sent') await this.discard(capture.id);
      if (outcome.kind === 'refused') await this.keep({ ...capture, problem: outcome.message });
    } finally {
      this.inFlight.delete(capture.id);
    }
  }

  private async keep(capture: QueuedCapture): Promise<void> {
    await set(capture.id, capture, this.store);
    this.capturesSignal.update((captures) => captures.map((candidate) => (candidate.id === capture.id ? capture : candidate)));
  }

  private async restore(userId: string | null): Promise<void> {
    if (!userId) {
      this.capturesSignal.set([]);
      return;
    }
    const saved = (await entries<string, QueuedCapture>(this.store)).map(([, capture]) => capture).filter((capture) => capture.userId === userId);
    // Captures made while the store was being read are already listed: keep them once.
    this.capturesSignal.update((listed) => {
      const mine = listed.filter((capture) => capture.userId === userId);
      const known = new Set(mine.map((capture) => capture.id));
      return [...mine, ...saved.filter((capture) => !known.has(capture.id))].sort((a, b) => a.capturedAt.localeCompare(b.capturedAt));
    });
    await this.sendWaiting();
  }
}
