// /builds/:buildId/exports: the tax ledger and build sheet as CSV, a ZIP of everything for an accountant, each
// downloaded with its progress shown, filtered by date range and system; and the way to the printable build sheet.
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { DateAdapter } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { Moment } from 'moment';
import type { Subscription } from 'rxjs';
import type { SystemDto } from '../../../../../shared/api/parts';
import { toApiError } from '../../../core/http/api-error';
import { SystemsApi } from '../../parts/services/systems-api';
import { ExportFile, ExportFilter, ExportsApi } from '../services/exports-api';

interface DownloadState {
  status: 'idle' | 'running' | 'done' | 'failed';
  loaded: number;
  total: number | null;
  message: string;
}

interface ExportCard {
  file: ExportFile;
  title: string;
  /** How a sentence names it: "The tax ledger could not be downloaded". */
  noun: string;
  icon: string;
  holds: string;
  filters: string;
  button: string;
}

const CARDS: readonly ExportCard[] = [
  {
    file: 'tax-ledger.csv',
    title: 'Tax ledger (CSV)',
    noun: 'tax ledger',
    icon: 'table_view',
    holds:
      'One row per money line of the filed receipts: date, shop, receipt number, description, part number, system, kind, quantity, unit price, amount, its share of tax, shipping and discount, net, currency and review state.',
    filters: 'Follows the date range and the system.',
    button: 'Download tax ledger',
  },
  {
    file: 'build-sheet.csv',
    title: 'Build sheet (CSV)',
    noun: 'build sheet',
    icon: 'build',
    holds: 'The parts fitted to the car, by system, with what each cost and when it was bought, then the net cost of each system and the safety caution.',
    filters: 'Follows the system; the date range does not apply.',
    button: 'Download build sheet',
  },
  {
    file: 'archive.zip',
    title: 'Everything for an accountant (ZIP)',
    noun: 'ZIP archive',
    icon: 'folder_zip',
    holds: 'Both CSVs for the whole build and every receipt document as it was uploaded.',
    filters: 'The whole build: filters do not apply.',
    button: 'Download ZIP archive',
  },
];

const IDLE: DownloadState = { status: 'idle', loaded: 0, total: null, message: '' };

@Component({
  selector: 'th-exports-page',
  imports: [ReactiveFormsModule, MatButtonModule, MatDatepickerModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './exports-page.html',
  styleUrl: './exports-page.css',
})
export class ExportsPage {
  private readonly exportsApi = inject(ExportsApi);
  private readonly systemsApi = inject(SystemsApi);
  private readonly dateAdapter = inject<DateAdapter<Moment>>(DateAdapter);
  private readonly document = inject(DOCUMENT);
  private readonly running = new Map<ExportFile, Subscription>();

  /** Route parameter, bound by the router. */
  readonly buildId = input.required<string>();

  protected readonly cards = CARDS;
  protected readonly systems = signal<SystemDto[]>([]);
  protected readonly downloads = signal<Record<ExportFile, DownloadState>>({ 'tax-ledger.csv': IDLE, 'build-sheet.csv': IDLE, 'archive.zip': IDLE });
  protected readonly filters = new FormGroup({
    from: new FormControl<Moment | null>(null),
    to: new FormControl<Moment | null>(null),
    systemId: new FormControl('', { nonNullable: true }),
  });
  private readonly filterValues = signal(this.filters.getRawValue());

  /** A typed date that does not parse, or a range that ends before it starts: said before anything is sent. */
  protected readonly filterProblem = computed(() => {
    const { from, to } = this.filterValues();
    if (this.filters.controls.from.invalid || this.filters.controls.to.invalid) return 'Enter the dates like 3/14/2026, or pick them from the calendar.';
    if (from && to && this.dateAdapter.isValid(from) && this.dateAdapter.isValid(to) && to.isBefore(from, 'day')) return 'The end date is before the start date: swap them.';
    return '';
  });

  constructor() {
    effect(() => {
      const buildId = this.buildId();
      untracked(() => this.systemsApi.list(buildId).subscribe({ next: (response) => this.systems.set(response.systems), error: () => this.systems.set([]) }));
    });
    this.filters.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.filterValues.set(this.filters.getRawValue()));
    inject(DestroyRef).onDestroy(() => this.running.forEach((subscription) => subscription.unsubscribe()));
  }

  protected sizeText(bytes: number): string {
    if (bytes < 1024) return `${bytes} bytes`;
    if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
    return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  }

  protected download(file: ExportFile): void {
    if (this.filterProblem()) return;
    const { from, to, systemId } = this.filters.getRawValue();
    const filterValues: ExportFilter = { from: this.isoDate(from), to: this.isoDate(to), systemId: systemId || null };
    this.setState(file, { status: 'running', loaded: 0, total: null, message: '' });
    const noun = CARDS.find((card) => card.file === file)!.noun;
    this.running.get(file)?.unsubscribe();
    this.running.set(
      file,
      this.exportsApi.download(this.buildId(), file, filterValues).subscribe({
        next: (progress) => {
          if (progress.kind === 'progress') this.setState(file, { status: 'running', loaded: progress.loaded, total: progress.total, message: '' });
          else {
            this.save(progress.blob, progress.fileName);
            this.setState(file, { status: 'done', loaded: progress.blob.size, total: progress.blob.size, message: progress.fileName });
          }
        },
        error: (error: unknown) => {
          const apiError = toApiError(error);
          const what =
            apiError.status === 404
              ? 'The build or the chosen system was not found: choose "All systems" or reload the page.'
              : apiError.status === 400
                ? 'Check the dates: use the calendar to pick them.'
                : apiError.status === 0
                  ? 'Tallyhood could not be reached: check your connection and try again.'
                  : 'Try again in a moment; if it keeps failing, let us know.';
          this.setState(file, { status: 'failed', loaded: 0, total: null, message: `The ${noun} could not be downloaded. ${what}` });
        },
      }),
    );
  }

  protected cancel(file: ExportFile): void {
    this.running.get(file)?.unsubscribe();
    this.running.delete(file);
    this.setState(file, IDLE);
  }

  private setState(file: ExportFile, state: DownloadState): void {
    this.downloads.update((downloads) => ({ ...downloads, [file]: state }));
  }

  /** Hands the file to the browser as a download of its own name; the object URL is released right after. */
  private save(blob: Blob, fileName: string): void {
    const url = URL.createObjectURL(blob);
    const link = this.document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.style.display = 'none';
    this.document.body.appendChild(link);
    link.click();
    link.remove();
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }

  /** Calendar dates travel as YYYY-MM-DD, in the person's own calendar (no time zone shift). */
  private isoDate(value: Moment | null): string | null {
    if (!value || !this.dateAdapter.isValid(value)) return null;
    return value.format('YYYY-MM-DD');
  }
}
