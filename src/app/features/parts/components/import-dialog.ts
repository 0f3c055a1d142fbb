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
  templateUrl: './import-dialog.html',
  styleUrl: './import-dialog.css',
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
