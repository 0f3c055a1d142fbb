// A receipt's page images with zoom and the box of the line in focus drawn over them; used by the check and review screens.
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { BoxDto } from '../../../../../shared/api/receipts';
import { ReceiptsApi } from '../services/receipts-api';

@Component({
  selector: 'th-receipt-pages',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './receipt-pages.html',
  styleUrl: './receipt-pages.css',
})
export class ReceiptPages {
  private readonly receiptsApi = inject(ReceiptsApi);

  readonly buildId = input.required<string>();
  readonly receiptId = input.required<string>();
  readonly pages = input.required<readonly { index: number; width: number; height: number }[]>();
  /** The box of the line under the cursor or in focus, drawn over its page. */
  readonly activeBox = input<BoxDto | null>(null);
  /** Where the page is narrow (the review pane), start smaller so the slip fits before the person zooms in. */
  readonly baseWidth = input(480);

  /** Phones start smaller, so the slip fits the screen's width before the person zooms in. */
  protected readonly zoom = signal(globalThis.matchMedia?.('(max-width: 599.98px)').matches ? 0.7 : 1);
  protected readonly zoomPercent = computed(() => Math.round(this.zoom() * 100));
  protected readonly pageWidth = computed(() => Math.round(this.baseWidth() * this.zoom()));

  protected pageUrl(index: number): string {
    return this.receiptsApi.pageUrl(this.buildId(), this.receiptId(), index);
  }

  protected scaleOf(pageWidth: number): number {
    return pageWidth > 0 ? this.pageWidth() / pageWidth : 1;
  }

  protected zoomBy(step: number): void {
    this.zoom.update((zoom) => Math.min(3, Math.max(0.5, zoom + step)));
  }
}
