// A build's frame: its sections as a side rail on wide screens and a bottom bar on phones.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { CurrentBuild } from '../services/current-build';
import { CaptureStatus } from '../../receipts/components/capture-status';
import { CaptureQueue } from '../../receipts/services/capture-queue';

export interface BuildSection {
  /** Relative to /builds/:buildId. */
  path: string;
  label: string;
  icon: string;
  /** False: on phones the section sits in the bottom bar's "More" menu, so the bar keeps four or five items. */
  phoneBar?: boolean;
  /** Put on the phone bar in place of Parts for a reviewer, whose work is reviewing, not the parts list. */
  reviewerPhoneBar?: boolean;
}

/**
 * The build's sections in order; later features add theirs here (Receipts, Ledger, Cores and returns, Review, Exports).
 * The phone bar holds four sections and "More": the rest set `phoneBar: false`.
 */
export const BUILD_SECTIONS: readonly BuildSection[] = [
  { path: '.', label: 'Overview', icon: 'directions_car' },
  { path: 'ledger', label: 'Ledger', icon: 'query_stats' },
  { path: 'receipts', label: 'Receipts', icon: 'receipt_long' },
  { path: 'parts', label: 'Parts', icon: 'list_alt', reviewerPhoneBar: false },
  { path: 'budgets', label: 'Budgets', icon: 'savings', phoneBar: false },
  { path: 'inventory', label: 'Inventory', icon: 'inventory', phoneBar: false },
  { path: 'cores', label: 'Cores and returns', icon: 'autorenew', phoneBar: false },
  { path: 'review', label: 'Review', icon: 'fact_check', phoneBar: false, reviewerPhoneBar: true },
  { path: 'exports', label: 'Exports', icon: 'file_download', phoneBar: false },
  // Crew, mail alerts and the build's details sit under Settings, so the rail keeps to the daily work.
  { path: 'settings', label: 'Settings', icon: 'settings', phoneBar: false },
];

@Component({
  selector: 'th-build-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatIconModule, MatMenuModule, MatProgressBarModule, CaptureStatus],
  providers: [CurrentBuild],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './build-shell.html',
  styleUrl: './build-shell.css',
})
export class BuildShell {
  protected readonly current = inject(CurrentBuild);
  protected readonly sections = BUILD_SECTIONS;
  protected readonly moreSections = computed(() => BUILD_SECTIONS.filter((section) => !this.onPhoneBar(section)));

  /** Four sections on the phone bar; a reviewer gets Review where the others have Parts. */
  protected onPhoneBar(section: BuildSection): boolean {
    if (this.current.build()?.role === 'reviewer' && section.reviewerPhoneBar !== undefined) return section.reviewerPhoneBar;
    return section.phoneBar !== false;
  }

  private readonly captures = inject(CaptureQueue);
  private readonly router = inject(Router);

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly canAddReceipts = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });

  /**
   * The photo is saved on the device first, then sent (at once with signal, later without); Receipts shows its
   * progress and then the receipt being read, the chip above what still waits.
   */
  protected photographed(event: Event): void {
    const input = event.target as HTMLInputElement;
    const files = Array.from(input.files ?? []);
    input.value = '';
    if (files.length === 0) return;
    void this.captures.capture(this.buildId(), files);
    void this.router.navigate(['/builds', this.buildId(), 'receipts']);
  }

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.current.load(buildId));
    });
  }
}
