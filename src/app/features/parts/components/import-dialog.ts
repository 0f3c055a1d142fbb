// The CSV import dialog: pick a file, check every row in a preview, then import the good rows (all, or leaving out the bad).
import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { IMPORT_COLUMNS, ImportPreviewDto, ImportResultDto, ImportRowDto } from '../../../../../shared/api/parts';
import { toApiError } from '../../../core/http/api-error';
import { MoneyPipe } from '../../../ui/money';
import { PartsApi } from '../services/parts-api';

export interface ImportDialogData {
  buildId: string;
  currency: string;
  locale: string;
}

/** The preview shows this many rows; the counts always cover the whole file. */
const PREVIEW_ROW_LIMIT = 500;

const FIELD_LABELS: Record<string, string> = {
  system: 'System',
  description: 'Description',
  partNumber: 'Part number',
  quantity: 'Quantity',
  unit: 'Unit',
  estimatedUnitCost: 'Unit cost',
  status: 'Status',
  storageLocation: 'Storage location',
  sourceUrl: 'Source link',
  notes: 'Notes',
};

@Component({
  selector: 'th-import-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatIconModule, MatProgressBarModule, MatTableModule, MoneyPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Import parts from CSV</h2>
    @if (working()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="working() === 'saving' ? 'Importing the parts' : 'Reading the file'" />
    }
    <mat-dialog-content>
      <p class="intro">
        One part per row, with a header row naming the columns: <span class="columns">{{ columns }}</span>. System,
        description, quantity, unit and estimated unit cost are required; the system must match one of the build's
        systems by name. Nothing is saved until you import.
      </p>
      <div class="pick">
        <input #fileInput type="file" accept=".csv,text/csv" class="visually-hidden" tabindex="-1" aria-label="CSV file" (change)="picked($event)" />
        <button mat-stroked-button type="button" (click)="fileInput.click()" [disabled]="!!working()">
          <mat-icon aria-hidden="true">upload_file</mat-icon>
          {{ file() ? 'Choose another file' : 'Choose a CSV file' }}
        </button>
        @if (file(); as chosen) {
          <span class="file-name">{{ chosen.name }}</span>
        }
      </div>

      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }

      @if (preview(); as result) {
        <p class="summary" role="status">
          {{ result.rows.length }} {{ result.rows.length === 1 ? 'row' : 'rows' }} read:
          <strong>{{ result.accepted }} ready</strong>,
          @if (result.rejected > 0) {
            <strong class="problem-count"><mat-icon aria-hidden="true" inline>error</mat-icon> {{ result.rejected }} with problems</strong>.
          } @else {
            none with problems.
          }
          @if (result.rejected > 0) {
            Rows with problems are listed first.
          }
        </p>
        @if (result.rejected > 0) {
          <mat-checkbox class="leave-out" [checked]="leaveOut()" (change)="leaveOut.set($event.checked)" [disabled]="!!working()">
            Leave out the {{ result.rejected }} {{ result.rejected === 1 ? 'row' : 'rows' }} with problems
          </mat-checkbox>
          @if (!leaveOut()) {
            <p class="quiet">Fix those rows in the file and choose it again, or leave them out to import the rest.</p>
          }
        }
        @if (result.rows.length > rowLimit) {
          <p class="quiet">The table shows the first {{ rowLimit }} rows; the counts cover the whole file.</p>
        }
        <div class="table-scroll" role="region" aria-label="Rows of the file" tabindex="0">
          <table mat-table [dataSource]="shownRows()" class="preview">
            <ng-container matColumnDef="line">
              <th mat-header-cell *matHeaderCellDef scope="col">Line</th>
              <td mat-cell *matCellDef="let row" class="tabular">{{ row.line }}</td>
            </ng-container>
            <ng-container matColumnDef="system">
              <th mat-header-cell *matHeaderCellDef scope="col">System</th>
              <td mat-cell *matCellDef="let row" [class.cell-error]="row.errors.system">{{ row.part.systemName }}</td>
            </ng-container>
            <ng-container matColumnDef="description">
              <th mat-header-cell *matHeaderCellDef scope="col">Description</th>
              <td mat-cell *matCellDef="let row" [class.cell-error]="row.errors.description">{{ row.part.description }}</td>
            </ng-container>
            <ng-container matColumnDef="quantity">
              <th mat-header-cell *matHeaderCellDef scope="col" class="number">Qty</th>
              <td mat-cell *matCellDef="let row" class="number tabular nowrap" [class.cell-error]="row.errors.quantity || row.errors.unit">
                {{ row.part.quantity }} {{ row.part.unit }}
              </td>
            </ng-container>
            <ng-container matColumnDef="unitCost">
              <th mat-header-cell *matHeaderCellDef scope="col" class="number">Unit cost</th>
              <td mat-cell *matCellDef="let row" class="number tabular" [class.cell-error]="row.errors.estimatedUnitCost">
                {{ row.part.estimatedUnitCost }}
              </td>
            </ng-container>
            <ng-container matColumnDef="total">
              <th mat-header-cell *matHeaderCellDef scope="col" class="number">Estimated total</th>
              <td mat-cell *matCellDef="let row" class="number tabular">{{ row.part.estimatedTotal | money: data.currency : data.locale }}</td>
            </ng-container>
            <ng-container matColumnDef="check">
              <th mat-header-cell *matHeaderCellDef scope="col">Check</th>
              <td mat-cell *matCellDef="let row">
                @if (row.ok) {
                  <span class="ok"><mat-icon aria-hidden="true" inline>check_circle</mat-icon> Ready</span>
                } @else {
                  <ul class="row-problems">
                    @for (message of problemsOf(row); track message) {
                      <li><mat-icon aria-hidden="true" inline>error</mat-icon> {{ message }}</li>
                    }
                  </ul>
                }
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="previewColumns"></tr>
            <tr mat-row *matRowDef="let row; columns: previewColumns" [class.rejected]="!row.ok"></tr>
          </table>
        </div>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="working() === 'saving'">Cancel</button>
      @if (preview()) {
        <button mat-flat-button class="cta" type="button" (click)="commit()" [disabled]="!canImport()">
          Import {{ importCount() }} {{ importCount() === 1 ? 'part' : 'parts' }}
        </button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    .intro {
      margin-top: 0;
    }
    .columns {
      font-style: italic;
    }
    .pick {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      margin-bottom: 16px;
    }
    .file-name {
      overflow-wrap: anywhere;
      font-weight: 500;
    }
    .summary {
      margin: 0 0 8px;
    }
    .problem-count {
      color: var(--mat-sys-error);
    }
    .table-scroll {
      overflow: auto;
      max-height: 50vh;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
    }
    .table-scroll:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
    }
    .preview {
      min-width: 720px;
    }
    .number {
      text-align: right;
    }
    .nowrap {
      white-space: nowrap;
    }
    tr.rejected td {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    td.cell-error {
      font-weight: 600;
      text-decoration: underline wavy;
    }
    .row-problems {
      list-style: none;
      margin: 0;
      padding: 4px 0;
    }
    .ok {
      white-space: nowrap;
    }
    .leave-out {
      display: block;
      margin: 0 0 8px;
    }
    .quiet {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ImportDialog {
  protected readonly data = inject<ImportDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<ImportDialog, ImportResultDto>>(MatDialogRef);
  private readonly partsApi = inject(PartsApi);
  private readonly fileInput = viewChild.required<ElementRef<HTMLInputElement>>('fileInput');

  protected readonly columns = IMPORT_COLUMNS.join(', ');
  protected readonly rowLimit = PREVIEW_ROW_LIMIT;
  protected readonly previewColumns = ['line', 'system', 'description', 'quantity', 'unitCost', 'total', 'check'];

  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<ImportPreviewDto | null>(null);
  protected readonly leaveOut = signal(false);
  protected readonly working = signal<'' | 'reading' | 'saving'>('');
  protected readonly problem = signal('');

  /** Rows with problems first (they need the person's attention), each part in file order. */
  protected readonly shownRows = computed(() => {
    const rows = this.preview()?.rows ?? [];
    return [...rows.filter((row) => !row.ok), ...rows.filter((row) => row.ok)].slice(0, PREVIEW_ROW_LIMIT);
  });
  protected readonly importCount = computed(() => this.preview()?.accepted ?? 0);
  protected readonly canImport = computed(() => {
    const preview = this.preview();
    if (!preview || this.working() || preview.accepted === 0) return false;
    return preview.rejected === 0 || this.leaveOut();
  });

  protected picked(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    if (!file) return;
    this.file.set(file);
    this.preview.set(null);
    this.leaveOut.set(false);
    this.problem.set('');
    this.working.set('reading');
    this.partsApi.previewImport(this.data.buildId, file).subscribe({
      next: (preview) => {
        this.working.set('');
        this.preview.set(preview);
        if (preview.rows.length === 0) this.problem.set('The file has a header row but no parts under it.');
      },
      error: (error: unknown) => {
        this.working.set('');
        const apiError = toApiError(error);
        this.problem.set(apiError.fields['file'] ?? apiError.message);
      },
    });
    // Choosing the same file again (after fixing it) must fire another change event.
    this.fileInput().nativeElement.value = '';
  }

  protected commit(): void {
    const file = this.file();
    if (!file || !this.canImport()) return;
    this.working.set('saving');
    this.problem.set('');
    this.partsApi.commitImport(this.data.buildId, file, this.leaveOut()).subscribe({
      next: (result) => {
        this.working.set('');
        this.dialogRef.close(result);
      },
      error: (error: unknown) => {
        this.working.set('');
        const apiError = toApiError(error);
        this.problem.set(apiError.fields['file'] ?? apiError.message);
      },
    });
  }

  protected problemsOf(row: ImportRowDto): string[] {
    return Object.entries(row.errors).map(([field, message]) => `${FIELD_LABELS[field] ?? field}: ${message}`);
  }
}
