// /builds/:buildId/inventory: parts bought but not fitted, by where they are stored, and the spares offered for sale.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { forkJoin } from 'rxjs';
import type { PartDto, SystemDto, UpdatePartRequest } from '../../../../../shared/api/parts';
import { PART_STATUS_LABELS } from '../../../../../shared/enums';
import { UNIT_LABELS } from '../../../../../shared/units';
import { toApiError } from '../../../core/http/api-error';
import { EmptyState } from '../../../ui/empty-state';
import { MoneyPipe } from '../../../ui/money';
import { CurrentBuild } from '../../builds/services/current-build';
import { SaleDialog, SaleDialogData } from '../components/sale-dialog';
import { PartsApi } from '../services/parts-api';
import { SystemsApi } from '../services/systems-api';
import { WarrantyStatus } from '../components/warranty-status/warranty-status';
import { openWarrantyDialog } from '../components/warranty-dialog/warranty-dialog';

/** "Kit 2" before "Kit 10": numbers inside names sort as numbers. */
const byDescription = (a: PartDto, b: PartDto) => a.description.localeCompare(b.description, undefined, { numeric: true });

interface LocationGroup {
  location: string;
  label: string;
  parts: PartDto[];
}

@Component({
  selector: 'th-inventory-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, EmptyState, MoneyPipe, WarrantyStatus],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './inventory-page.html',
  styleUrl: './inventory-page.css',
})
export class InventoryPage {
  private readonly partsApi = inject(PartsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly current = inject(CurrentBuild);

  /** Route parameter (inherited from the build), bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly onHandLabel = PART_STATUS_LABELS.on_hand;
  protected readonly parts = signal<PartDto[]>([]);
  private readonly systems = signal<SystemDto[]>([]);
  protected readonly currency = signal('');
  protected readonly loading = signal(false);
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);

  protected readonly locale = computed(() => this.current.build()?.locale ?? 'en-US');
  protected readonly canEdit = computed(() => {
    const role = this.current.build()?.role;
    return role === 'owner' || role === 'crew';
  });

  private readonly onHand = computed(() => this.parts().filter((part) => part.status === 'on_hand'));
  protected readonly onHandCount = computed(() => this.onHand().length);
  /** Named locations in alphabetical order, "No location" last. */
  protected readonly locations = computed<LocationGroup[]>(() => {
    const byLocation = new Map<string, PartDto[]>();
    for (const part of this.onHand()) {
      const location = part.storageLocation.trim();
      byLocation.set(location, [...(byLocation.get(location) ?? []), part]);
    }
    return [...byLocation.entries()]
      .sort(([a], [b]) => (a === '' ? 1 : b === '' ? -1 : a.localeCompare(b, undefined, { numeric: true })))
      .map(([location, parts]) => ({ location, label: location || 'No location', parts: parts.sort(byDescription) }));
  });
  protected readonly forSale = computed(() => this.parts().filter((part) => part.forSale).sort(byDescription));

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.load(buildId));
    });
  }

  protected systemName(systemId: string): string {
    return this.systems().find((system) => system.id === systemId)?.name ?? '';
  }

  protected unitLabel(part: PartDto): string {
    return UNIT_LABELS[part.unit];
  }

  protected statusLabel(part: PartDto): string {
    return PART_STATUS_LABELS[part.status];
  }

  protected markFitted(part: PartDto): void {
    this.save(part, { status: 'installed' }, `${part.description} is marked fitted.`);
  }

  protected offerForSale(part: PartDto): void {
    this.dialog
      .open<SaleDialog, SaleDialogData, string>(SaleDialog, {
        data: { description: part.description, currency: this.currency(), askingPrice: part.askingPrice },
        width: '420px',
        maxWidth: '96vw',
      })
      .afterClosed()
      .subscribe((askingPrice) => {
        if (askingPrice === undefined) return;
        this.save(part, { forSale: true, askingPrice }, `${part.description} is offered for sale.`);
      });
  }

  protected openWarranty(part: PartDto): void {
    openWarrantyDialog(this.dialog, this.buildId(), part).subscribe((saved) => saved && this.replace(saved));
  }

  protected takeOffSale(part: PartDto): void {
    this.save(part, { forSale: false, askingPrice: null }, `${part.description} is no longer for sale.`);
  }

  private save(part: PartDto, changes: Omit<UpdatePartRequest, 'version'>, done: string): void {
    this.busy.set(true);
    this.partsApi.update(this.buildId(), part.id, { ...changes, version: part.version }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.replace(saved);
        this.snackBar.open(done, 'Dismiss', { duration: 5000 });
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const apiError = toApiError(error);
        const saved = apiError.current as PartDto | undefined;
        if (apiError.status === 409 && saved?.id === part.id) {
          this.replace(saved);
          this.snackBar.open(`Someone else changed "${part.description}" in the meantime; the list shows it as saved now. Try again if you still need to.`, 'Dismiss', {
            duration: 10000,
          });
        }
      },
    });
  }

  private replace(saved: PartDto): void {
    this.parts.update((parts) => parts.map((part) => (part.id === saved.id ? saved : part)));
  }

  private load(buildId: string): void {
    this.loading.set(true);
    forkJoin({ systems: this.systemsApi.list(buildId, true), parts: this.partsApi.list(buildId) }).subscribe({
      next: ({ systems, parts }) => {
        this.currency.set(systems.currency);
        this.systems.set(systems.systems);
        this.parts.set(parts);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: () => this.loading.set(false),
    });
  }
}
