// /builds/:buildId/exports/build-sheet: the build sheet laid out for paper (A4 or Letter): fitted parts by system with
// cost and date, a summary per system, totals, the safety caution and the "records, not tax advice" line.
import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { BuildSheetDto, BuildSheetPartDto } from '../../../../../shared/api/exports';
import { toApiError } from '../../../core/http/api-error';
import { formatCalendarDate } from '../../../ui/dates';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { ExportsApi } from '../services/exports-api';

@Component({
  selector: 'th-build-sheet-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, EmptyState, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // Unencapsulated: the print rules must reach the app's frame (top bar, section rail) to hide it on paper.
  encapsulation: ViewEncapsulation.None,
  templateUrl: './build-sheet-page.html',
  styleUrl: './build-sheet-page.css',
})
export class BuildSheetPage {
  private readonly exportsApi = inject(ExportsApi);

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly sheet = signal<BuildSheetDto | null>(null);
  protected readonly loading = signal(false);
  protected readonly problem = signal('');

  /** The parts in their systems, in the order the server gives (the build's system order). */
  protected readonly groups = computed(() => {
    const sheet = this.sheet();
    if (!sheet) return [];
    const groups: { systemId: string; name: string; safetyCaution: boolean; parts: BuildSheetPartDto[] }[] = [];
    for (const part of sheet.parts) {
      let group = groups.find((candidate) => candidate.systemId === part.systemId);
      if (!group) {
        group = { systemId: part.systemId, name: part.system, safetyCaution: sheet.systems.find((system) => system.systemId === part.systemId)?.safetyCaution ?? false, parts: [] };
        groups.push(group);
      }
      group.parts.push(part);
    }
    return groups;
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected today(): string {
    const now = new Date();
    const iso = `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
    return formatCalendarDate(iso, this.sheet()?.locale ?? 'en-US');
  }

  protected dateText(date: string): string {
    return formatCalendarDate(date, this.sheet()?.locale ?? 'en-US');
  }

  protected print(): void {
    window.print();
  }

  private load(buildId: string): void {
    this.loading.set(true);
    this.exportsApi.buildSheet(buildId).subscribe({
      next: (sheet) => {
        this.sheet.set(sheet);
        this.loading.set(false);
      },
      error: (error: unknown) => {
        this.loading.set(false);
        this.problem.set(`The build sheet could not be loaded. ${toApiError(error).message}`);
      },
    });
  }
}
