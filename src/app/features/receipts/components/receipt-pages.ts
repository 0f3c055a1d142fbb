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
  template: `
    @if (pages().length > 0) {
      <div class="zoom" role="group" aria-label="Zoom">
        <button mat-icon-button type="button" (click)="zoomBy(-0.25)" [disabled]="zoom() <= 0.5" aria-label="Zoom out">
          <mat-icon aria-hidden="true">zoom_out</mat-icon>
        </button>
        <span class="tabular">{{ zoomPercent() }}%</span>
        <button mat-icon-button type="button" (click)="zoomBy(0.25)" [disabled]="zoom() >= 3" aria-label="Zoom in">
          <mat-icon aria-hidden="true">zoom_in</mat-icon>
        </button>
      </div>
      <div class="page-scroll" tabindex="0" role="region" aria-label="Receipt pages, scroll to pan">
        @for (page of pages(); track page.index) {
          <div class="page-image" [style.width.px]="pageWidth()" [style.height.px]="page.height * scaleOf(page.width)">
            <img [src]="pageUrl(page.index)" [alt]="'Page ' + (page.index + 1) + ' of the receipt'" [width]="pageWidth()" />
            @if (activeBox(); as box) {
              @if (box.page === page.index) {
                <span
                  class="box"
                  aria-hidden="true"
                  [style.left.px]="box.x * scaleOf(page.width)"
                  [style.top.px]="box.y * scaleOf(page.width)"
                  [style.width.px]="box.w * scaleOf(page.width)"
                  [style.height.px]="box.h * scaleOf(page.width)"
                ></span>
              }
            }
          </div>
        }
      </div>
    } @else {
      <p class="muted"><mat-icon aria-hidden="true">description</mat-icon> No page image; open the original file to see it.</p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .zoom {
      display: flex;
      align-items: center;
      gap: 4px;
    }
    .page-scroll {
      max-height: 70vh;
      overflow: auto;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
      background: var(--mat-sys-surface-container);
    }
    .page-image {
      position: relative;
      margin: 0 auto 8px;
    }
    .page-image img {
      display: block;
      height: auto;
    }
    .box {
      position: absolute;
      outline: 3px solid var(--th-brass, #b8892b);
      background: color-mix(in srgb, var(--th-brass, #b8892b) 18%, transparent);
      border-radius: 2px;
      pointer-events: none;
    }
  `,
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
