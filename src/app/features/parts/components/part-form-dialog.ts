// The add / edit part dialog: the shared schema's checks and the server's on the fields, and a stale edit shown field by field.
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { filter, switchMap } from 'rxjs';
import { PartDto, SystemDto, createPartRequest, updatePartRequest } from '../../../../../shared/api/parts';
import { PART_STATUSES, PART_STATUS_LABELS, PartStatus } from '../../../../../shared/enums';
import { minorUnits, multiply, parseMoney, roundToMinor, tooManyDecimalsMessage } from '../../../../../shared/money';
import { UNITS, UNIT_LABELS, Unit } from '../../../../../shared/units';
import { applyFieldErrors, errorOf, validateWith } from '../../../core/forms/form-errors';
import { toApiError } from '../../../core/http/api-error';
import { confirmAction } from '../../../ui/confirm-dialog';
import { moneyText } from '../../../ui/money';
import { PartsApi } from '../services/parts-api';

export interface PartFormData {
  buildId: string;
  currency: string;
  locale: string;
  /** Systems a part may be put in (the active ones, plus the part's own). */
  systems: SystemDto[];
  /** The part to edit; absent when adding. */
  part?: PartDto;
  /** The system to preselect when adding. */
  systemId?: string;
}

export type PartFormResult = { saved: PartDto } | { deleted: string };

type FieldName =
  | 'systemId'
  | 'description'
  | 'partNumber'
  | 'quantity'
  | 'unit'
  | 'estimatedUnitCost'
  | 'status'
  | 'storageLocation'
  | 'sourceUrl'
  | 'notes'
  | 'forSale'
  | 'askingPrice';

const FIELD_LABELS: Record<FieldName, string> = {
  systemId: 'System',
  description: 'Description',
  partNumber: 'Part number',
  quantity: 'Quantity',
  unit: 'Unit',
  estimatedUnitCost: 'Estimated unit cost',
  status: 'Status',
  storageLocation: 'Storage location',
  sourceUrl: 'Source link',
  notes: 'Notes',
  forSale: 'For sale',
  askingPrice: 'Asking price',
};

const AMOUNT_FIELDS: readonly FieldName[] = ['quantity', 'estimatedUnitCost', 'askingPrice'];

/** A part's editable fields as the form holds them (all text, booleans as they are). */
interface PartFields {
  systemId: string;
  description: string;
  partNumber: string;
  quantity: string;
  unit: Unit;
  estimatedUnitCost: string;
  status: PartStatus;
  storageLocation: string;
  sourceUrl: string;
  notes: string;
  forSale: boolean;
  askingPrice: string;
}

export interface FieldDifference {
  field: FieldName;
  label: string;
  yours: string;
  saved: string;
}

function fieldsOf(part: PartDto): PartFields {
  return {
    systemId: part.systemId,
    description: part.description,
    partNumber: part.partNumber,
    quantity: part.quantity,
    unit: part.unit,
    estimatedUnitCost: part.estimatedUnitCost,
    status: part.status,
    storageLocation: part.storageLocation,
    sourceUrl: part.sourceUrl,
    notes: part.notes,
    forSale: part.forSale,
    askingPrice: part.askingPrice ?? '',
  };
}

/** Same value, where amounts compare as numbers ("24.9" equals "24.90") and text as typed, ignoring outer spaces. */
function sameValue(field: FieldName, left: string | boolean, right: string | boolean): boolean {
  if (typeof left === 'boolean' || typeof right === 'boolean') return left === right;
  if (AMOUNT_FIELDS.includes(field)) {
    const a = parseMoney(left);
    const b = parseMoney(right);
    if (a.ok && b.ok) return a.value.equals(b.value);
  }
  return left.trim() === right.trim();
}

@Component({
  selector: 'th-part-form-dialog',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ data.part ? 'Edit part' : 'Add part' }}</h2>
    @if (saving()) {
      <mat-progress-bar mode="indeterminate" aria-label="Saving the part" />
    }
    <mat-dialog-content>
      @if (conflict(); as saved) {
        <section class="conflict" role="alert" aria-labelledby="conflict-heading">
          <h3 id="conflict-heading" class="conflict-heading">
            <mat-icon aria-hidden="true">sync_problem</mat-icon>
            Someone else saved this part while you were editing
          </h3>
          @if (differences().length > 0) {
            <p>These fields differ between your version and the saved one:</p>
            <table class="differences">
              <thead>
                <tr>
                  <th scope="col">Field</th>
                  <th scope="col">Yours</th>
                  <th scope="col">Saved</th>
                </tr>
              </thead>
              <tbody>
                @for (difference of differences(); track difference.field) {
                  <tr>
                    <th scope="row">{{ difference.label }}</th>
                    <td>{{ difference.yours || '(empty)' }}</td>
                    <td>{{ difference.saved || '(empty)' }}</td>
                  </tr>
                }
              </tbody>
            </table>
          } @else {
            <p>The saved version matches yours, field for field.</p>
          }
          <div class="form-actions">
            <button mat-flat-button type="button" (click)="keepMine()" [disabled]="saving()">Keep mine</button>
            <button mat-stroked-button type="button" (click)="takeSaved(saved)" [disabled]="saving()">Take the saved one</button>
          </div>
        </section>
      }
      @if (problem()) {
        <p class="notice notice-error" role="alert">{{ problem() }}</p>
      }
      <form id="part-form" [formGroup]="form" (ngSubmit)="submit()" novalidate class="part-form">
        <mat-form-field class="wide" subscriptSizing="dynamic">
          <mat-label>Description</mat-label>
          <input matInput formControlName="description" autocomplete="off" />
          <mat-error>{{ errorOf(form.controls.description) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>System</mat-label>
          <mat-select formControlName="systemId">
            @for (system of data.systems; track system.id) {
              <mat-option [value]="system.id">{{ system.name }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ errorOf(form.controls.systemId) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Part number</mat-label>
          <input matInput formControlName="partNumber" autocomplete="off" />
          <mat-error>{{ errorOf(form.controls.partNumber) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Quantity</mat-label>
          <input matInput formControlName="quantity" inputmode="decimal" autocomplete="off" class="tabular" />
          <mat-error>{{ errorOf(form.controls.quantity) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Unit</mat-label>
          <mat-select formControlName="unit">
            @for (unit of units; track unit) {
              <mat-option [value]="unit">{{ unitLabels[unit] }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ errorOf(form.controls.unit) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Estimated unit cost</mat-label>
          <input matInput formControlName="estimatedUnitCost" inputmode="decimal" autocomplete="off" class="tabular" />
          <span matTextSuffix>{{ data.currency }}</span>
          <mat-hint>Up to 4 decimals, such as 0.125</mat-hint>
          <mat-error>{{ errorOf(form.controls.estimatedUnitCost) }}</mat-error>
        </mat-form-field>

        <p class="estimate" aria-live="polite">
          Estimated total: <strong class="tabular">{{ estimatedTotal() || '—' }}</strong>
        </p>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Status</mat-label>
          <mat-select formControlName="status">
            @for (status of statuses; track status) {
              <mat-option [value]="status">{{ statusLabels[status] }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ errorOf(form.controls.status) }}</mat-error>
        </mat-form-field>

        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Storage location</mat-label>
          <input matInput formControlName="storageLocation" autocomplete="off" />
          <mat-hint>Shelf, bin or box, such as "Bin 4"</mat-hint>
          <mat-error>{{ errorOf(form.controls.storageLocation) }}</mat-error>
        </mat-form-field>

        <mat-form-field class="wide" subscriptSizing="dynamic">
          <mat-label>Source link</mat-label>
          <input matInput type="url" formControlName="sourceUrl" autocomplete="off" />
          <mat-hint>Optional: where you found it, starting with https://</mat-hint>
          <mat-error>{{ errorOf(form.controls.sourceUrl) }}</mat-error>
        </mat-form-field>

        <mat-form-field class="wide" subscriptSizing="dynamic">
          <mat-label>Notes</mat-label>
          <textarea matInput formControlName="notes" rows="2"></textarea>
          <mat-error>{{ errorOf(form.controls.notes) }}</mat-error>
        </mat-form-field>

        <mat-checkbox formControlName="forSale" class="for-sale">Spare for sale</mat-checkbox>
        @if (forSale()) {
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Asking price</mat-label>
            <input matInput formControlName="askingPrice" inputmode="decimal" autocomplete="off" class="tabular" />
            <span matTextSuffix>{{ data.currency }}</span>
            <mat-error>{{ errorOf(form.controls.askingPrice) }}</mat-error>
          </mat-form-field>
        }
      </form>
    </mat-dialog-content>
    <mat-dialog-actions>
      @if (data.part) {
        <button mat-button type="button" class="delete" (click)="remove()" [disabled]="saving()">
          <mat-icon aria-hidden="true">delete</mat-icon>
          Delete part
        </button>
      }
      <span class="spacer"></span>
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button class="cta" type="submit" form="part-form" [disabled]="saving()">
        {{ data.part ? 'Save part' : 'Add part' }}
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .part-form {
      display: grid;
      grid-template-columns: 1fr;
      gap: 12px 16px;
      padding-top: 8px;
    }
    @media (min-width: 600px) {
      .part-form {
        grid-template-columns: 1fr 1fr;
      }
      .wide {
        grid-column: 1 / -1;
      }
    }
    .estimate {
      margin: 0;
      align-self: center;
    }
    .for-sale {
      align-self: center;
    }
    .spacer {
      flex: 1;
    }
    .delete {
      color: var(--mat-sys-error);
    }
    .conflict {
      border: 1px solid var(--mat-sys-error);
      border-radius: 12px;
      padding: 12px 16px;
      margin-bottom: 16px;
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .conflict-heading {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    .differences {
      border-collapse: collapse;
      width: 100%;
      margin-bottom: 8px;
    }
    .differences th,
    .differences td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      overflow-wrap: anywhere;
    }
  `,
})
export class PartFormDialog {
  protected readonly data = inject<PartFormData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<PartFormDialog, PartFormResult>>(MatDialogRef);
  private readonly dialog = inject(MatDialog);
  private readonly partsApi = inject(PartsApi);

  protected readonly errorOf = errorOf;
  protected readonly units = UNITS;
  protected readonly unitLabels = UNIT_LABELS;
  protected readonly statuses = PART_STATUSES;
  protected readonly statusLabels = PART_STATUS_LABELS;

  protected readonly saving = signal(false);
  protected readonly problem = signal('');
  /** The part as saved by someone else, after a stale edit. */
  protected readonly conflict = signal<PartDto | null>(null);
  private version = this.data.part?.version ?? 0;

  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly form = this.formBuilder.group({
    systemId: this.data.systemId ?? this.data.systems[0]?.id ?? '',
    description: '',
    partNumber: '',
    quantity: '1',
    unit: this.formBuilder.control<Unit>('each'),
    estimatedUnitCost: '',
    status: this.formBuilder.control<PartStatus>('planned'),
    storageLocation: '',
    sourceUrl: '',
    notes: '',
    forSale: false,
    askingPrice: '',
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly forSale = computed(() => this.values().forSale === true);
  /** Quantity × unit cost as the server will round it, or '' while either is not a valid amount. */
  protected readonly estimatedTotal = computed(() => {
    const quantity = parseMoney(this.values().quantity ?? '');
    const cost = parseMoney(this.values().estimatedUnitCost ?? '');
    if (!quantity.ok || !cost.ok) return '';
    return moneyText(roundToMinor(multiply(cost.value, quantity.value), this.data.currency), this.data.currency, this.data.locale);
  });
  protected readonly differences = computed<FieldDifference[]>(() => {
    const saved = this.conflict();
    if (!saved) return [];
    this.values();
    const mine = this.form.getRawValue();
    const theirs = fieldsOf(saved);
    return (Object.keys(FIELD_LABELS) as FieldName[])
      .filter((field) => !sameValue(field, mine[field], theirs[field]))
      .map((field) => ({ field, label: FIELD_LABELS[field], yours: this.display(field, mine[field]), saved: this.display(field, theirs[field]) }));
  });

  constructor() {
    if (this.data.part) this.form.reset(fieldsOf(this.data.part));
  }

  protected submit(): void {
    if (this.saving()) return;
    this.problem.set('');
    const raw = this.form.getRawValue();
    const request = {
      ...raw,
      description: raw.description.trim(),
      partNumber: raw.partNumber.trim(),
      quantity: raw.quantity.trim(),
      estimatedUnitCost: raw.estimatedUnitCost.trim(),
      storageLocation: raw.storageLocation.trim(),
      sourceUrl: raw.sourceUrl.trim(),
      notes: raw.notes.trim(),
      askingPrice: raw.forSale && raw.askingPrice.trim() !== '' ? raw.askingPrice.trim() : null,
    };
    const partId = this.data.part?.id;
    const valid = partId
      ? validateWith(this.form, updatePartRequest, { ...request, version: this.version })
      : validateWith(this.form, createPartRequest, request);
    if (!valid || !this.askingPriceFits(request.askingPrice)) return;

    this.saving.set(true);
    // The raw strings go to the API: the schema's output holds Decimals, which are for computing, not sending.
    const call = partId
      ? this.partsApi.update(this.data.buildId, partId, { ...request, version: this.version })
      : this.partsApi.create(this.data.buildId, request);
    call.subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.dialogRef.close({ saved });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const apiError = toApiError(error);
        if (apiError.status === 409 && isPart(apiError.current)) {
          this.conflict.set(apiError.current);
          return;
        }
        const unmatched = applyFieldErrors(this.form, apiError.fields);
        if (unmatched.length) this.problem.set(unmatched.join(' '));
        else if (apiError.status === 409) this.problem.set(apiError.message);
      },
    });
  }

  /** Keep mine: send the form again over the version just saved by the other person. */
  protected keepMine(): void {
    const saved = this.conflict();
    if (!saved) return;
    this.version = saved.version;
    this.conflict.set(null);
    this.submit();
  }

  protected takeSaved(saved: PartDto): void {
    this.dialogRef.close({ saved });
  }

  protected remove(): void {
    const part = this.data.part;
    if (!part) return;
    confirmAction(this.dialog, {
      title: `Delete "${part.description}"?`,
      message: 'It leaves the bill of materials and its estimate leaves the totals. This cannot be undone.',
      confirmLabel: 'Delete part',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => {
          this.saving.set(true);
          return this.partsApi.remove(this.data.buildId, part.id);
        }),
      )
      .subscribe({
        next: () => {
          this.saving.set(false);
          this.dialogRef.close({ deleted: part.id });
        },
        error: () => this.saving.set(false),
      });
  }

  /** The asking price is money a person pays, so it must fit the currency's minor units (the server checks it too). */
  private askingPriceFits(askingPrice: string | null): boolean {
    if (askingPrice === null) return true;
    const places = minorUnits(this.data.currency);
    const parsed = parseMoney(askingPrice, { maxDecimals: places });
    if (parsed.ok) return true;
    this.form.controls.askingPrice.setErrors({ message: parsed.message.startsWith('Too many') ? tooManyDecimalsMessage(places) : parsed.message });
    this.form.controls.askingPrice.markAsTouched();
    return false;
  }

  private display(field: FieldName, value: string | boolean): string {
    if (typeof value === 'boolean') return value ? 'Yes' : 'No';
    if (field === 'systemId') return this.data.systems.find((system) => system.id === value)?.name ?? 'Another system';
    if (field === 'status') return PART_STATUS_LABELS[value as PartStatus] ?? value;
    if (field === 'unit') return UNIT_LABELS[value as Unit] ?? value;
    if (field === 'estimatedUnitCost' || field === 'askingPrice') {
      return moneyText(value, this.data.currency, this.data.locale, field === 'estimatedUnitCost' ? 4 : undefined) || value;
    }
    return value;
  }
}

function isPart(value: unknown): value is PartDto {
  return !!value && typeof value === 'object' && typeof (value as PartDto).id === 'string' && typeof (value as PartDto).version === 'number';
}
