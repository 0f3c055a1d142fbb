// Sets, changes or removes a part's warranty: a length in months or lifetime, and the day it starts (empty: the
// receipt's date). Saves the part itself, so the server's field messages land on the fields.
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { type PartDto, type UpdatePartRequest, updatePartRequest } from '../../../../../../shared/api/parts';
import { applyFieldErrors, errorOf, validateWith } from '../../../../core/forms/form-errors';
import { toApiError } from '../../../../core/http/api-error';
import type { Observable } from 'rxjs';
import { PartsApi } from '../../services/parts-api';

export interface WarrantyDialogData {
  buildId: string;
  part: PartDto;
}

type Length = 'none' | 'months' | 'lifetime';

/** Opens the dialog for a part; emits the part as saved, or undefined when the person cancels. */
export function openWarrantyDialog(dialog: MatDialog, buildId: string, part: PartDto): Observable<PartDto | undefined> {
  return dialog.open<WarrantyDialog, WarrantyDialogData, PartDto>(WarrantyDialog, { data: { buildId, part }, width: '420px', maxWidth: '96vw' }).afterClosed();
}

@Component({
  selector: 'th-warranty-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './warranty-dialog.html',
  styleUrl: './warranty-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WarrantyDialog {
  protected readonly data = inject<WarrantyDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<WarrantyDialog, PartDto>>(MatDialogRef);
  private readonly partsApi = inject(PartsApi);
  protected readonly errorOf = errorOf;

  protected readonly saving = signal(false);
  protected readonly problem = signal('');
  private version = this.data.part.version;

  protected readonly form = inject(NonNullableFormBuilder).group({
    length: this.lengthOf(this.data.part),
    warranty: typeof this.data.part.warranty === 'number' ? String(this.data.part.warranty) : '12',
    warrantyStart: this.data.part.warrantyStart ?? '',
  });
  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly length = computed(() => this.values().length ?? 'none');

  protected submit(): void {
    if (this.saving()) return;
    this.problem.set('');
    const request = this.request();
    if (!validateWith(this.form, updatePartRequest, request)) return;
    this.saving.set(true);
    this.partsApi.update(this.data.buildId, this.data.part.id, request).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.dialogRef.close(saved);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const apiError = toApiError(error);
        // A stale edit: the next save goes over the version saved now, as the message asks.
        const current = apiError.current as PartDto | undefined;
        if (apiError.status === 409 && current?.version) this.version = current.version;
        const unmatched = applyFieldErrors(this.form, apiError.fields);
        this.problem.set(unmatched.length ? unmatched.join(' ') : apiError.status === 409 ? apiError.message : '');
      },
    });
  }

  private request(): UpdatePartRequest {
    const { length, warranty, warrantyStart } = this.form.getRawValue();
    if (length === 'none') return { warranty: null, version: this.version };
    const months = /^\s*\d+\s*$/.test(warranty) ? Number(warranty) : warranty;
    return {
      // A length that is not a whole number goes as typed, so the shared schema words the problem.
      warranty: length === 'lifetime' ? 'lifetime' : (months as number),
      warrantyStart: warrantyStart.trim() || null,
      version: this.version,
    };
  }

  private lengthOf(part: PartDto): Length {
    if (part.warranty === 'lifetime') return 'lifetime';
    return part.warranty === null ? 'none' : 'months';
  }
}
