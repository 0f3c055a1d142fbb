// Asks the owner why a receipt is filed although its lines do not add up to the printed total.
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { fileReceiptRequest } from '../../../../../shared/api/receipts';
import { errorOf, validateWith } from '../../../core/forms/form-errors';

export interface AcceptDifferenceData {
  /** The difference as shown on the check screen, e.g. "$0.40 more than the lines". */
  differenceText: string;
}

@Component({
  selector: 'th-accept-difference-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './accept-difference-dialog.html',
})
export class AcceptDifferenceDialog {
  protected readonly data = inject<AcceptDifferenceData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<AcceptDifferenceDialog, string>>(MatDialogRef);
  protected readonly form = inject(NonNullableFormBuilder).group({ reason: '' });
  protected readonly errorOf = errorOf;

  protected submit(): void {
    // The shared schema's check on the reason, with version 1 as a stand-in: only the reason is asked here.
    const reasonSchema = fileReceiptRequest.shape.acceptDifference.unwrap();
    const valid = validateWith(this.form, reasonSchema, { reason: this.form.controls.reason.value });
    if (valid) this.dialogRef.close(valid.reason);
  }
}
